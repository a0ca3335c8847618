// Queue benchmark (issue 5): `npx tsx tests/bench/queue.bench.ts` (or `npm run bench queue`).
// Runs against a fresh database of its own (sparwise_bench_queue) on the project's MariaDB.
// Prints:
//  - baseline: a bare `SELECT 1` round trip and a one-row INSERT, so the queue figures can be read
//    as multiples of what the database costs anyway on this machine;
//  - enqueue → claim latency with an idle worker (median, p95), measured on the database clock
//    (queued_at → started_at): for a separate worker process (it finds work by polling every
//    SPARWISE_POLL_MS, 250 ms by default) and for the runner inside the enqueuing process (woken
//    at once by the enqueue);
//  - sweeps per second for trivial problems with 1 and with 2 worker processes (each running
//    one sweep at a time), from the first queued_at to the last finished_at.
import { freshBenchDatabase } from "./bench-setup";

process.env.SPARWISE_MAX_QUEUED_PER_USER = "100000";
const DB_NAME = freshBenchDatabase("sparwise_bench_queue");

const { db, closeDb } = await import("~/lib/db.server");
const { enqueueSweep } = await import("~/workers/queue.server");
const { SweepRunner } = await import("~/workers/runner.server");
const { searchProblemSchema } = await import("~/optimizer");
const { startWorker, stopWorker, waitFor } = await import("../integration/queue-helpers");

const TRIVIAL = {
  moment: { sagging: 10, hogging: 0 },
  allowable: { tension: 165, compression: 165 },
  depth: { min: 100, max: 200, step: 50 },
  width: { min: 50, max: 100, step: 50 },
  thicknesses: [6, 8],
  families: ["rectangle", "i"],
};
const TRIVIAL_JSON = JSON.stringify(searchProblemSchema.parse(TRIVIAL));

function stats(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  const q = (p: number) => s[Math.min(s.length - 1, Math.floor(p * (s.length - 1) + 0.5))];
  return { median: q(0.5), p95: q(0.95), n: s.length };
}
const ms = (x: number) => `${x.toFixed(2)} ms`;

const owner = await db("users").where({ email: "engineer@tallowfield.example" }).first("id");
const team = await db("teams").where({ slug: "tallowfield" }).first("id");
const u = { ownerId: owner.id as number, teamId: team.id as number };

console.log(`queue benchmark, node ${process.version}, ${new Date().toISOString()}, database ${DB_NAME}`);

// ---- baseline
const selectTimes: number[] = [];
for (let i = 0; i < 300; i++) {
  const t0 = performance.now();
  await db.raw("SELECT 1");
  selectTimes.push(performance.now() - t0);
}
const insertTimes: number[] = [];
for (let i = 0; i < 200; i++) {
  const t0 = performance.now();
  await db("notifications").insert({ user_id: u.ownerId, title: "bench" });
  insertTimes.push(performance.now() - t0);
}
await db("notifications").where({ title: "bench" }).delete();
const sel = stats(selectTimes),
  ins = stats(insertTimes);
console.log(`\nbaseline`);
console.log(`  SELECT 1 round trip: median ${ms(sel.median)}, p95 ${ms(sel.p95)}`);
console.log(`  one-row INSERT:      median ${ms(ins.median)}, p95 ${ms(ins.p95)}`);

async function latencies(label: string, n: number) {
  const lat: number[] = [];
  for (let i = 0; i < n; i++) {
    const { id } = await enqueueSweep({ ...u, problem: TRIVIAL });
    await waitFor(`sweep ${id}`, async () => (await db("sweeps").where({ id }).first("status")).status === "succeeded", 30_000, 5);
    const r = await db("sweeps").where({ id }).first(db.raw("TIMESTAMPDIFF(MICROSECOND, queued_at, started_at) / 1000 AS ms"));
    lat.push(Number(r.ms));
    await new Promise((res) => setTimeout(res, Math.random() * 300)); // arrive at a random point of the poll cycle
  }
  const s = stats(lat);
  console.log(`  ${label}: median ${ms(s.median)}, p95 ${ms(s.p95)} (n = ${s.n}); median = ${(s.median / sel.median).toFixed(0)}× a SELECT 1`);
  return s;
}

// ---- enqueue → claim latency, idle worker
console.log(`\nenqueue → claim latency, idle worker (database clock, queued_at → started_at)`);
{
  const w = startWorker("bench-idle", { SPARWISE_WORKER_CONCURRENCY: "1", DB_NAME });
  await waitFor("worker ready", async () => /started/.test(w.output()), 30_000);
  await new Promise((r) => setTimeout(r, 500));
  await latencies(`worker process (polls every ${process.env.SPARWISE_POLL_MS ?? 250} ms)`, 40);
  await stopWorker(w);
}
{
  const runner = new SweepRunner({ workerId: "bench-inproc", concurrency: 1, log: () => {} }).start();
  await latencies("in-process runner (woken by the enqueue)", 40);
  await runner.stop();
}

// ---- throughput
console.log(`\nthroughput, trivial problems (${JSON.stringify(TRIVIAL.families)}, a ${2 * 3 * 2 * 2 + 3 * 2}-shape grid or so), one sweep at a time per process`);
const N = 300;
let single = 0;
for (const k of [1, 2]) {
  const ws = Array.from({ length: k }, (_, i) => startWorker(`bench-tp-${k}-${i}`, { SPARWISE_WORKER_CONCURRENCY: "1", SPARWISE_POLL_MS: "250", DB_NAME }));
  await waitFor("workers ready", async () => ws.every((w) => /started/.test(w.output())), 30_000);
  await new Promise((r) => setTimeout(r, 500));
  const rows = Array.from({ length: N }, () => ({ team_id: u.teamId, owner_id: u.ownerId, problem: TRIVIAL_JSON, status: "queued" }));
  const first = await db("sweeps").max({ m: "id" }).first();
  for (let i = 0; i < rows.length; i += 100) await db("sweeps").insert(rows.slice(i, i + 100));
  const ids = await db("sweeps").where("id", ">", first?.m ?? 0).pluck("id");
  await waitFor(`${N} sweeps`, async () => Number((await db("sweeps").whereIn("id", ids).where({ status: "succeeded" }).count({ n: "*" }).first())!.n) === N, 300_000, 100);
  const span = await db("sweeps").whereIn("id", ids).first(db.raw("TIMESTAMPDIFF(MICROSECOND, MIN(queued_at), MAX(finished_at)) / 1000 AS ms"));
  const perSec = (N * 1000) / Number(span.ms);
  if (k === 1) single = perSec;
  const perSweep = Number(span.ms) / N;
  console.log(
    `  ${k} worker process${k > 1 ? "es" : ""}: ${N} sweeps in ${(Number(span.ms) / 1000).toFixed(2)} s = ${perSec.toFixed(1)} sweeps/s (${ms(perSweep)} per sweep = ${(perSweep / sel.median).toFixed(0)}× a SELECT 1, ${(perSweep / ins.median).toFixed(0)}× an INSERT)${k > 1 ? `; ${(perSec / single).toFixed(2)}× one process` : ""}`,
  );
  for (const w of ws) await stopWorker(w);
}
const os = await import("node:os");
console.log(`\n(the machine: ${os.availableParallelism()} cores; load average now ${os.loadavg().map((x) => x.toFixed(1)).join(", ")}; the throughput figures depend on what else runs on the cores)`);
await closeDb();

// Load benchmark (issue 9, items 4 and 8): `npx tsx tests/bench/load.bench.ts` (or `npm run bench load`).
// Starts the production build (building it first when app/ is newer) with `npm run start` on a
// free loopback port against a fresh database of its own (sparwise_bench_load), then prints:
//  - baseline: /healthz (one database round trip) one request at a time;
//  - item 4: POST /api/v1/properties for the costliest sections the caps accept, one at a time,
//    then /healthz latency while four clients send the worst of them back to back, as a ratio
//    to the idle /healthz (the engine works on its own thread; the event loop stays free);
//  - item 8: the sweep page of a 2,000-candidate sweep: its document size (target < 200 kB),
//    and its p95 at 20 concurrent clients against /healthz's p95 at 20 concurrent clients in the
//    same run (target ≤ 5×), plus /healthz while the 20 page clients run.
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const DB_NAME = process.env.BENCH_DB_NAME ?? "sparwise_bench_load";
process.env.DB_NAME = DB_NAME;
execFileSync("bash", ["db/start.sh"], { cwd: ROOT, stdio: "ignore" });
execFileSync("bash", ["db/create-database.sh", DB_NAME, "--fresh"], { cwd: ROOT, stdio: "inherit" });
execFileSync("npx", ["tsx", "db/migrate.ts", "--seed"], { cwd: ROOT, stdio: "ignore", env: { ...process.env, DB_NAME } });

// ---- the build: rebuilt when any file under app/ is newer than it
function newest(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newest(p) : statSync(p).mtimeMs);
  }
  return t;
}
const built = path.join(ROOT, "build/server/index.js");
if (!existsSync(built) || statSync(built).mtimeMs < newest(path.join(ROOT, "app"))) {
  console.log("building (app/ is newer than build/) …");
  execFileSync("npm", ["run", "build"], { cwd: ROOT, stdio: "ignore" });
}

const { db, closeDb } = await import("~/lib/db.server");
const { sessionCookieFor } = await import("~/lib/session.server");
const { getUser } = await import("~/lib/auth.server");
const { createApiToken } = await import("~/lib/api-tokens.server");
const { insertBigSweep } = await import("../integration/big-sweep");
const { MAX_SECTION_POINTS, MAX_SECTION_POLYGONS, findInputViolation } = await import("~/optimizer/validate");

const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
const port = await freePort();
const base = `http://127.0.0.1:${port}`;

// ---- fixtures: the engineer's session, the viewer's API token, a 2,000-candidate sweep
const userRow = async (email: string) =>
  db("users").join("memberships", "memberships.user_id", "users.id").where("users.email", email).first("users.id", "users.session_version", "memberships.team_id");
const eng = await userRow("engineer@tallowfield.example");
const cookie = (await sessionCookieFor(eng.id, eng.session_version)).split(";")[0]!;
const viewer = await userRow("viewer@tallowfield.example");
const viewerCookie = (await sessionCookieFor(viewer.id, viewer.session_version)).split(";")[0]!;
const viewerUser = (await getUser(new Request(`${base}/`, { headers: { Cookie: viewerCookie } })))!;
const { token } = await createApiToken(viewerUser, "load bench");
const sweepId = await insertBigSweep(db, { teamId: eng.team_id, ownerId: eng.id, candidates: 2_000 });

// ---- the server
let server: ChildProcess | undefined = spawn("npm", ["run", "start"], {
  cwd: ROOT,
  env: {
    ...process.env,
    DB_NAME,
    PORT: String(port),
    NODE_ENV: "production",
    VITEST: "",
    APP_URL: base,
    SPARWISE_INPROCESS_WORKERS: "0",
    // the bench is one user sending thousands of requests: not what the per-user limit is for
    SPARWISE_API_POINTS_PER_MINUTE: "100000000",
  },
  stdio: ["ignore", "ignore", "inherit"],
  detached: true,
});
const stopServer = () => {
  if (server?.pid)
    try {
      process.kill(-server.pid, "SIGTERM");
    } catch {
      // already gone
    }
  server = undefined;
};
process.on("exit", stopServer);
process.on("uncaughtException", (e) => {
  stopServer();
  console.error(e);
  process.exit(1);
});
process.on("unhandledRejection", (e) => {
  stopServer();
  console.error(e);
  process.exit(1);
});
for (const deadline = Date.now() + 60_000; ; ) {
  try {
    if ((await fetch(`${base}/healthz`)).ok) break;
  } catch {
    // not up yet
  }
  if (Date.now() > deadline) throw new Error("the app server did not start");
  await new Promise((r) => setTimeout(r, 250));
}

function stats(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  const q = (p: number) => s[Math.min(s.length - 1, Math.floor(p * (s.length - 1) + 0.5))]!;
  return { median: q(0.5), p95: q(0.95), max: s[s.length - 1]!, n: s.length };
}
const ms = (x: number) => `${x.toFixed(1)} ms`;
const fmt = (s: ReturnType<typeof stats>) => `median ${ms(s.median)}, p95 ${ms(s.p95)}, max ${ms(s.max)} (n = ${s.n})`;

async function timed(url: string, init?: RequestInit): Promise<{ ms: number; status: number; bytes: number }> {
  const t0 = performance.now();
  const res = await fetch(url, init);
  const body = await res.arrayBuffer();
  return { ms: performance.now() - t0, status: res.status, bytes: body.byteLength };
}
const healthz = () => timed(`${base}/healthz`);
const page = () => timed(`${base}/sweeps/${sweepId}`, { headers: { Cookie: cookie } });
const properties = (body: string) =>
  timed(`${base}/api/v1/properties`, { method: "POST", body, headers: { "Content-Type": "application/json", Authorization: `Bearer ${token}` } });

/** `clients` loops of `f` until `until` resolves or each made `perClient` calls; every latency. */
async function concurrent(clients: number, perClient: number, f: () => Promise<{ ms: number; status: number }>, stop?: () => boolean) {
  const lat: number[] = [];
  const bad = new Map<number, number>();
  await Promise.all(
    Array.from({ length: clients }, async () => {
      for (let i = 0; i < perClient && !stop?.(); i++) {
        const r = await f();
        lat.push(r.ms);
        if (r.status !== 200) bad.set(r.status, (bad.get(r.status) ?? 0) + 1);
      }
    }),
  );
  if (bad.size) console.log(`    (non-200 answers: ${[...bad].map(([s, n]) => `${n} × ${s}`).join(", ")})`);
  return stats(lat);
}

console.log(`load benchmark, node ${process.version}, ${new Date().toISOString()}, database ${DB_NAME}, server ${base} (npm run start)`);

// warm-up: the first requests compile the route modules and start the engine thread
for (let i = 0; i < 20; i++) await healthz();
for (let i = 0; i < 10; i++) await page();

// ---- baseline
const idleTimes: number[] = [];
for (let i = 0; i < 300; i++) idleTimes.push((await healthz()).ms);
const idle = stats(idleTimes);
console.log(`\nbaseline: /healthz one at a time: ${fmt(idle)}`);

// ---- item 4
const round = (x: number) => Math.round(x * 100) / 100;
/** A star of long thin spikes whose inner ends crowd a small circle: every edge's box meets every other's near the middle (the sweeps' worst case). */
const fan = (n: number) =>
  Array.from({ length: n }, (_, k) => {
    const th = (2 * Math.PI * k) / n;
    const r = k % 2 ? 1000 : 1 + (k % 7) * 0.01;
    // full precision: rounded to 0.01 mm the crowded inner ends would touch
    return [r * Math.cos(th), r * Math.sin(th)];
  });
const circle = (n: number, cz: number, r = 100) => Array.from({ length: n }, (_, k) => [round(cz + r * Math.cos((2 * Math.PI * k) / n)), round(r * Math.sin((2 * Math.PI * k) / n))]);
const perPolygon = Math.floor(MAX_SECTION_POINTS / MAX_SECTION_POLYGONS);
const cases: [string, unknown][] = [
  [`one fan of ${MAX_SECTION_POINTS} points (spikes crowding one point)`, { polygons: [{ points: fan(MAX_SECTION_POINTS) }] }],
  [`two discs of ${MAX_SECTION_POINTS / 2} points`, { polygons: [{ points: circle(MAX_SECTION_POINTS / 2, 0) }, { points: circle(MAX_SECTION_POINTS / 2, 300) }] }],
  [
    `${MAX_SECTION_POLYGONS} polygons of ${perPolygon} points (every pair tested)`,
    { polygons: Array.from({ length: MAX_SECTION_POLYGONS }, (_, i) => ({ points: circle(perPolygon, i * 25, 10) })) },
  ],
  ["a plate girder by family (the everyday request)", { family: "i", d: 600, b: 250, tf: 20, tw: 10 }],
];
console.log(`\nitem 4: POST /api/v1/properties at the caps (${MAX_SECTION_POINTS} points, ${MAX_SECTION_POLYGONS} polygons per section), one at a time`);
let worst: { label: string; body: string; median: number } | null = null;
for (const [label, section] of cases) {
  const body = JSON.stringify(section);
  const v = findInputViolation(section);
  if (v) throw new Error(`${label}: the bench's own section is refused: ${v.message}`);
  const first = await properties(body);
  if (first.status !== 200) throw new Error(`${label}: expected 200, got ${first.status}`);
  const xs: number[] = [];
  for (let i = 0; i < 15; i++) xs.push((await properties(body)).ms);
  const s = stats(xs);
  console.log(`  ${label} (${(body.length / 1024).toFixed(0)} kB): ${fmt(s)}`);
  if (!worst || s.median > worst.median) worst = { label, body, median: s.median };
}
{
  let done = false;
  const load = concurrent(4, 1_000_000, () => properties(worst!.body), () => done);
  await new Promise((r) => setTimeout(r, 300));
  const probe: number[] = [];
  const t0 = performance.now();
  while (performance.now() - t0 < 6_000) {
    probe.push((await healthz()).ms);
    await new Promise((r) => setTimeout(r, 20));
  }
  done = true;
  const worstUnderLoad = await load;
  const h = stats(probe);
  console.log(`  while 4 clients send the worst (${worst!.label}) back to back:`);
  console.log(`    the requests: ${fmt(worstUnderLoad)}`);
  console.log(`    /healthz:     ${fmt(h)}`);
  console.log(`    /healthz p95 under that load = ${(h.p95 / idle.p95).toFixed(1)}× its idle p95, ${(h.p95 / worst!.median).toFixed(2)}× the worst request alone (target: the event loop is never held by the engine, /healthz p95 well under the ~50 ms an engine call may take)`);
}

// ---- item 8
const doc = await page();
console.log(`\nitem 8: the sweep page of a 2,000-candidate sweep`);
console.log(`  document: ${(doc.bytes / 1024).toFixed(1)} kB (target < 200 kB)${doc.bytes < 200 * 1024 ? "" : "  ← OVER TARGET"}`);
const CLIENTS = 20,
  EACH = 15;
const hz = await concurrent(CLIENTS, EACH * 4, healthz);
console.log(`  /healthz, ${CLIENTS} concurrent clients:       ${fmt(hz)}`);
let pageDone = false;
const probe: number[] = [];
const prober = (async () => {
  while (!pageDone) {
    probe.push((await healthz()).ms);
    await new Promise((r) => setTimeout(r, 50));
  }
})();
const pg = await concurrent(CLIENTS, EACH, page);
pageDone = true;
await prober;
console.log(`  sweep page, ${CLIENTS} concurrent clients:     ${fmt(pg)}`);
const ratio = pg.p95 / hz.p95;
console.log(`  sweep page p95 = ${ratio.toFixed(1)}× /healthz p95 at the same concurrency (target ≤ 5×)${ratio <= 5 ? "" : "  ← OVER TARGET"}`);
console.log(`  /healthz while the ${CLIENTS} page clients run: ${fmt(stats(probe))}`);

console.log(`\n(the machine: ${os.availableParallelism()} cores; load average now ${os.loadavg().map((x) => x.toFixed(1)).join(", ")}; the figures depend on what else runs on the cores)`);
stopServer();
await closeDb();

// The queue with real worker PROCESSES (`app/workers/worker-process.ts` under tsx) competing for
// one MariaDB database: exactly once under competition, a SIGKILLed worker, a SIGSTOPped one.
// Short leases through the environment keep each test to seconds.
import { afterAll, afterEach, beforeEach, describe, expect, test } from "vitest";
import { db, closeDb } from "~/lib/db.server";
import { enqueueSweep } from "~/workers/queue.server";
import { startWorker, stopWorker, storedCandidateCount, sweepRow, teamAndUser, tinyProblem, waitFor, type WorkerProc } from "./queue-helpers";

let workers: WorkerProc[] = [];
afterEach(async () => {
  for (const w of workers) {
    if (w.child.signalCode === null && w.child.exitCode === null) w.child.kill("SIGCONT");
    await stopWorker(w, "SIGKILL");
  }
  workers = [];
});
afterAll(() => closeDb());
beforeEach(async () => {
  await db("candidates").delete();
  await db("sweeps").delete();
});

const fast = { SPARWISE_POLL_MS: "50", SPARWISE_CONTROL_MS: "100" };

describe("worker processes", () => {
  test("exactly once: 200 sweeps, 3 competing worker processes; every sweep succeeds once, no candidate duplicated or lost", async () => {
    process.env.SPARWISE_MAX_QUEUED_PER_USER = "1000";
    const u = await teamAndUser();
    const ids: number[] = [];
    try {
      for (let i = 0; i < 200; i++) ids.push((await enqueueSweep({ ...u, problem: tinyProblem(i) })).id);
    } finally {
      delete process.env.SPARWISE_MAX_QUEUED_PER_USER;
    }
    const notesBefore = Number((await db("notifications").count({ n: "*" }).first())!.n);
    const env = { ...fast, SPARWISE_LEASE_MS: "5000", SPARWISE_WORKER_CONCURRENCY: "1" };
    workers = ["w1", "w2", "w3"].map((id) => startWorker(id, env));
    await waitFor(
      "200 sweeps to succeed",
      async () => Number((await db("sweeps").whereIn("id", ids).where({ status: "succeeded" }).count({ n: "*" }).first())!.n) === 200,
      150_000,
      250,
    );
    const rows = await db("sweeps").whereIn("id", ids).select("id", "status", "attempts", "finished_attempt", "finished_by", "problem");
    expect(rows.every((r) => r.status === "succeeded" && r.finished_attempt === r.attempts)).toBe(true);
    // They competed: more than one process finished sweeps.
    expect(new Set(rows.map((r) => r.finished_by)).size).toBeGreaterThanOrEqual(2);

    // Candidates: exactly what the engine's answer stores, once each, from the finishing attempt.
    const expectedCount = new Map<number, number>();
    ids.forEach((id, i) => expectedCount.set(id, storedCandidateCount(i)));
    const counts = await db("candidates").whereIn("sweep_id", ids).groupBy("sweep_id").select("sweep_id", db.raw("COUNT(*) AS n"), db.raw("COUNT(DISTINCT family, dimensions) AS d"));
    expect(counts).toHaveLength(200);
    for (const c of counts) {
      expect(Number(c.n)).toBe(expectedCount.get(c.sweep_id));
      expect(Number(c.d)).toBe(Number(c.n));
    }
    const wrongAttempt = await db("candidates").join("sweeps", "sweeps.id", "candidates.sweep_id").whereIn("sweeps.id", ids).whereRaw("candidates.attempt <> sweeps.finished_attempt").count({ n: "*" }).first();
    expect(Number(wrongAttempt!.n)).toBe(0);
    // One notice per sweep.
    expect(Number((await db("notifications").count({ n: "*" }).first())!.n) - notesBefore).toBe(200);
    for (const w of workers) await stopWorker(w, "SIGTERM");
    expect(workers.map((w) => w.child.exitCode)).toEqual([0, 0, 0]);
  }, 200_000);

  test("crash: a worker SIGKILLed mid-sweep; after its lease expires another finishes it; attempts = 2", async () => {
    const u = await teamAndUser();
    const lease = { ...fast, SPARWISE_LEASE_MS: "1500", SPARWISE_HEARTBEAT_MS: "300" };
    // Test-only delay hook (runner.server.ts): keeps the first attempt mid-sweep for 60 s.
    const a = startWorker("crash-a", { ...lease, SPARWISE_TEST_SWEEP_DELAY_MS: "60000" });
    workers.push(a);
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(3) });
    await waitFor("worker A to run the sweep", async () => {
      const r = await sweepRow(id);
      return r.status === "running" && r.lease_owner === "crash-a";
    });
    a.child.kill("SIGKILL");
    await a.exited;
    const b = startWorker("crash-b", lease);
    workers.push(b);
    const done = await waitFor("the sweep to succeed", async () => {
      const r = await sweepRow(id);
      return r.status === "succeeded" ? r : null;
    });
    expect(done).toMatchObject({ attempts: 2, finished_attempt: 2, finished_by: "crash-b" });
    const cands = await db("candidates").where({ sweep_id: id }).select("attempt");
    expect(cands.length).toBe(storedCandidateCount(3));
    expect(new Set(cands.map((c) => c.attempt))).toEqual(new Set([2]));
    expect(await db("notifications").where({ link: `/sweeps/${id}` }).count({ n: "*" }).first()).toEqual({ n: 1 });
  }, 60_000);

  test("stall: a SIGSTOPped worker past its lease is replaced; after SIGCONT it writes nothing", async () => {
    const u = await teamAndUser();
    const lease = { ...fast, SPARWISE_LEASE_MS: "1500", SPARWISE_HEARTBEAT_MS: "300" };
    const a = startWorker("stall-a", { ...lease, SPARWISE_TEST_SWEEP_DELAY_MS: "2500" });
    workers.push(a);
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(5) });
    await waitFor("worker A to run the sweep", async () => {
      const r = await sweepRow(id);
      return r.status === "running" && r.lease_owner === "stall-a";
    });
    a.child.kill("SIGSTOP");
    const b = startWorker("stall-b", lease);
    workers.push(b);
    const done = await waitFor("worker B to finish the sweep", async () => {
      const r = await sweepRow(id);
      return r.status === "succeeded" ? r : null;
    });
    expect(done).toMatchObject({ attempts: 2, finished_attempt: 2, finished_by: "stall-b" });
    const before = await db("candidates").where({ sweep_id: id }).orderBy("id").select("id", "rank", "attempt", "dimensions");
    // B is done; stop it so only A could touch the row from here on.
    await stopWorker(b, "SIGTERM");
    a.child.kill("SIGCONT");
    // A wakes with its delay over: it either sees the lost lease at its next control read or
    // tries to finish and is fenced off. Either way it says so in its log.
    await waitFor("worker A to notice it lost the lease", async () => /lease lost/.test(a.output()), 15_000);
    await new Promise((r) => setTimeout(r, 1_000));
    const after = await sweepRow(id);
    expect(after).toEqual(done);
    expect(await db("candidates").where({ sweep_id: id }).orderBy("id").select("id", "rank", "attempt", "dimensions")).toEqual(before);
    expect(new Set(before.map((c) => c.attempt))).toEqual(new Set([2]));
    expect(await db("notifications").where({ link: `/sweeps/${id}` }).count({ n: "*" }).first()).toEqual({ n: 1 });
  }, 60_000);

  test("cancel while running in another process: its worker aborts the running search and records cancelled", async () => {
    const u = await teamAndUser();
    // Default control poll (SPARWISE_CONTROL_MS 250): the worker only sees the row flag.
    const a = startWorker("cancel-a", { SPARWISE_POLL_MS: "50", SPARWISE_TEST_SWEEP_DELAY_MS: "60000" });
    workers.push(a);
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(9) });
    await waitFor("worker A to run the sweep", async () => (await sweepRow(id)).lease_owner === "cancel-a");
    const { cancelSweep } = await import("~/workers/queue.server");
    // The order is the proof, not a clock: the request lands on a running sweep as a row flag,
    // then the same worker ends it as cancelled, which it can only do by aborting the minute-long
    // stand-in search (the wait gives up long before that search could end on its own).
    expect(await cancelSweep(id, { id: u.ownerId, teamId: u.teamId, role: "engineer" })).toMatchObject({ status: "running", cancelRequested: true });
    expect(await sweepRow(id)).toMatchObject({ status: "running", cancel_requested: 1, lease_owner: "cancel-a" });
    await waitFor("cancelled", async () => (await sweepRow(id)).status === "cancelled", 5_000, 20);
    expect(await sweepRow(id)).toMatchObject({ finished_by: "cancel-a", attempts: 1, cancel_requested: 1 });
    expect(await db("candidates").where({ sweep_id: id }).count({ n: "*" }).first()).toEqual({ n: 0 });
  }, 60_000);

  test("SIGTERM releases a running sweep to the queue without counting the attempt; another worker runs it", async () => {
    const u = await teamAndUser();
    const a = startWorker("term-a", { ...fast, SPARWISE_TEST_SWEEP_DELAY_MS: "60000", SPARWISE_SHUTDOWN_GRACE_MS: "200" });
    workers.push(a);
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(8) });
    await waitFor("worker A to run the sweep", async () => (await sweepRow(id)).lease_owner === "term-a");
    await stopWorker(a, "SIGTERM");
    expect(a.child.exitCode).toBe(0);
    expect(await db("sweeps").where({ id }).first("status", "attempts", "lease_token")).toEqual({ status: "queued", attempts: 0, lease_token: null });
    workers.push(startWorker("term-b", fast));
    const done = await waitFor("the sweep to succeed", async () => {
      const r = await sweepRow(id);
      return r.status === "succeeded" ? r : null;
    });
    expect(done).toMatchObject({ attempts: 1, finished_by: "term-b" });
  }, 60_000);
});

// The runner's wake-ups (runner.server.ts): an enqueue in this process wakes an idle runner at
// once, and one that lands while the runner is inside a claim (its query already past the new row)
// is not lost either: the runner claims again instead of sleeping a whole poll. The poll here is an
// hour, so a lost wake leaves the sweep queued for the rest of the test, whatever the machine's speed.
import { afterAll, beforeEach, expect, test, vi } from "vitest";
import { db, closeDb } from "~/lib/db.server";
import { enqueueSweep } from "~/workers/queue.server";
import { SweepRunner } from "~/workers/runner.server";
import { teamAndUser, tinyProblem, waitFor } from "./queue-helpers";

// claimNextSweeps as the runner calls it, with a hook run after a claim that found nothing (before
// the runner sees its answer) and an optional failure first, as a database that is briefly away.
const hook = vi.hoisted(() => ({ failFirst: false, calls: 0, afterEmptyClaim: null as null | (() => Promise<void>) }));
vi.mock("~/workers/queue.server", async (importOriginal) => {
  const orig = await importOriginal<typeof import("~/workers/queue.server")>();
  return {
    ...orig,
    claimNextSweeps: async (workerId: string, limit: number) => {
      hook.calls++;
      if (hook.failFirst && hook.calls === 1) throw new Error("test: the database is unreachable");
      const claims = await orig.claimNextSweeps(workerId, limit);
      const after = hook.afterEmptyClaim;
      if (claims.length === 0 && after) {
        hook.afterEmptyClaim = null;
        await after();
      }
      return claims;
    },
  };
});

afterAll(() => closeDb());
beforeEach(async () => {
  await db("candidates").delete();
  await db("sweeps").delete();
  Object.assign(hook, { failFirst: false, calls: 0, afterEmptyClaim: null });
});

const HOUR = 3_600_000;

async function enqueuedWhileClaiming(failFirst: boolean) {
  const u = await teamAndUser();
  let id = 0;
  hook.failFirst = failFirst;
  hook.afterEmptyClaim = async () => {
    ({ id } = await enqueueSweep({ ...u, problem: tinyProblem(4) }));
  };
  const runner = new SweepRunner({ workerId: "test-wake", concurrency: 1, pollMs: HOUR, log: () => {} }).start();
  try {
    await waitFor("the enqueue hook", async () => id > 0);
    // claimed and run without waiting for the hour's poll
    await waitFor(`sweep ${id} to succeed`, async () => (await db("sweeps").where({ id }).first("status"))?.status === "succeeded", 30_000);
  } finally {
    await runner.stop();
  }
  expect(runner.stats.succeeded).toBe(1);
}

test("an enqueue that lands while the runner's claim is running is claimed without waiting for the next poll", async () => {
  await enqueuedWhileClaiming(false);
});

test("… also after a wait that ended by its timer (a claim that failed and backed off), whose wake must not take the next one", async () => {
  await enqueuedWhileClaiming(true);
  expect(hook.calls).toBeGreaterThanOrEqual(3);
});

test("an idle runner is woken by an enqueue at once", async () => {
  const u = await teamAndUser();
  const runner = new SweepRunner({ workerId: "test-wake-idle", concurrency: 1, pollMs: HOUR, log: () => {} }).start();
  try {
    await waitFor("the runner's first claim", async () => hook.calls >= 1);
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(5) });
    await waitFor(`sweep ${id} to succeed`, async () => (await db("sweeps").where({ id }).first("status"))?.status === "succeeded", 30_000);
  } finally {
    await runner.stop();
  }
});

// The queue module against the real MariaDB, with a runner inside the test process:
// enqueue/claim/finish, idempotency, the per-user limit, fencing, release, cancel (queued and
// running), notification.
import { afterAll, beforeEach, describe, expect, test } from "vitest";
import { db, closeDb } from "~/lib/db.server";
import { depthBests, searchProblemSchema, searchSections } from "~/optimizer";
import {
  cancelSweep,
  candidatesToStore,
  claimNextSweeps,
  enqueueSweep,
  finishSweep,
  getSweep,
  heartbeat,
  listCandidates,
  releaseSweep,
} from "~/workers/queue.server";
import { SweepRunner } from "~/workers/runner.server";
import { teamAndUser, tinyProblem, waitFor } from "./queue-helpers";
import { SWEEP_SEARCH_OPTIONS } from "~/workers/sweep-search.server";

afterAll(() => closeDb());

// Each test starts from an empty queue; no runner from another test is left running.
beforeEach(async () => {
  await db("candidates").delete();
  await db("sweeps").delete();
});

async function expectResponse(p: Promise<unknown>, status: number, text: RegExp) {
  const thrown = await p.then(
    () => null,
    (e) => e,
  );
  expect(thrown).toBeInstanceOf(Response);
  expect((thrown as Response).status).toBe(status);
  expect(JSON.stringify(await (thrown as Response).json())).toMatch(text);
}

describe("enqueue", () => {
  test("validates the problem with the engine's schema, naming the field; writes nothing", async () => {
    const u = await teamAndUser();
    await expectResponse(enqueueSweep({ ...u, problem: { ...tinyProblem(), depth: { min: 300, max: 100, step: 10 } } }), 400, /problem\.depth\.max/);
    await expectResponse(enqueueSweep({ ...u, problem: "nope" }), 400, /problem/);
    expect(await db("sweeps").count({ n: "*" }).first()).toEqual({ n: 0 });
  });

  test("an idempotency key returns the same sweep; reused with another problem is a 409", async () => {
    const u = await teamAndUser();
    const a = await enqueueSweep({ ...u, problem: tinyProblem(1), idempotencyKey: "k-1" });
    const b = await enqueueSweep({ ...u, problem: tinyProblem(1), idempotencyKey: "k-1" });
    expect(a.created).toBe(true);
    expect(b).toEqual({ id: a.id, created: false, status: "queued" });
    await expectResponse(enqueueSweep({ ...u, problem: tinyProblem(2), idempotencyKey: "k-1" }), 409, /different request/);
    // Keys are per owner: another user's same key is a new sweep.
    const other = await teamAndUser("engineer2@tallowfield.example");
    const c = await enqueueSweep({ ...other, problem: tinyProblem(1), idempotencyKey: "k-1" });
    expect(c.created).toBe(true);
    expect(await db("sweeps").count({ n: "*" }).first()).toEqual({ n: 2 });
  });

  test("simultaneous requests with one key insert one sweep", async () => {
    const u = await teamAndUser();
    const got = await Promise.all(Array.from({ length: 8 }, () => enqueueSweep({ ...u, problem: tinyProblem(3), idempotencyKey: "same" })));
    expect(new Set(got.map((g) => g.id)).size).toBe(1);
    expect(got.filter((g) => g.created)).toHaveLength(1);
  });

  test("the per-user limit on queued sweeps answers 429 with a clear message", async () => {
    process.env.SPARWISE_MAX_QUEUED_PER_USER = "3";
    try {
      const u = await teamAndUser();
      for (let i = 0; i < 3; i++) await enqueueSweep({ ...u, problem: tinyProblem(i) });
      await expectResponse(enqueueSweep({ ...u, problem: tinyProblem(9) }), 429, /3 sweeps waiting.*limit is 3/);
      // Even when asked at the same moment, the limit holds (the owner row is locked).
      await db("sweeps").delete();
      const settled = await Promise.allSettled(Array.from({ length: 6 }, (_, i) => enqueueSweep({ ...u, problem: tinyProblem(i) })));
      expect(settled.filter((s) => s.status === "fulfilled")).toHaveLength(3);
      // Another user is not affected.
      const other = await teamAndUser("engineer2@tallowfield.example");
      await expect(enqueueSweep({ ...other, problem: tinyProblem(0) })).resolves.toMatchObject({ created: true });
    } finally {
      delete process.env.SPARWISE_MAX_QUEUED_PER_USER;
    }
  });
});

describe("claim, fencing, finish", () => {
  test("two claimers never get the same sweep; each claim has its own token", async () => {
    const u = await teamAndUser();
    for (let i = 0; i < 6; i++) await enqueueSweep({ ...u, problem: tinyProblem(i) });
    const [a, b] = await Promise.all([claimNextSweeps("A", 4), claimNextSweeps("B", 4)]);
    const ids = [...a, ...b].map((c) => c.id);
    expect(ids).toHaveLength(6);
    expect(new Set(ids).size).toBe(6);
    expect(new Set([...a, ...b].map((c) => c.token)).size).toBe(6);
    const rows = await db("sweeps").select("status", "attempts");
    expect(rows.every((r) => r.status === "running" && r.attempts === 1)).toBe(true);
  });

  test("an expired lease is claimed again with a new token; the old token can no longer write", async () => {
    process.env.SPARWISE_LEASE_MS = "300";
    try {
      const u = await teamAndUser();
      const { id } = await enqueueSweep({ ...u, problem: tinyProblem(4) });
      const [first] = await claimNextSweeps("A", 1);
      expect(await heartbeat(first)).toBe(true);
      await new Promise((r) => setTimeout(r, 400));
      const [second] = await claimNextSweeps("B", 1);
      expect(second.id).toBe(id);
      expect(second.attempt).toBe(2);
      expect(second.token).not.toBe(first.token);
      // The stalled first claim: heartbeat, finish and release all match nothing.
      expect(await heartbeat(first, { done: 1, total: 3 })).toBe(false);
      const result = searchSections(first.problem);
      expect(await finishSweep(first, result)).toBe(false);
      expect(await releaseSweep(first)).toBe(false);
      expect(await db("candidates").where({ sweep_id: id }).count({ n: "*" }).first()).toEqual({ n: 0 });
      // The current claim finishes; results carry its attempt number.
      expect(await finishSweep(second, result)).toBe(true);
      const s = await getSweep(id);
      expect(s).toMatchObject({ status: "succeeded", attempts: 2 });
      const attempts = await db("candidates").where({ sweep_id: id }).distinct("attempt").pluck("attempt");
      expect(attempts).toEqual([2]);
      // Finishing twice (a retried final write) changes nothing and duplicates nothing.
      expect(await finishSweep(second, result)).toBe(false);
      expect(Number((await db("candidates").where({ sweep_id: id }).count({ n: "*" }).first())!.n)).toBe(candidatesToStore(result, "mass").length);
    } finally {
      delete process.env.SPARWISE_LEASE_MS;
    }
  });

  test("past max_attempts an expired sweep fails with the error shown; the owner is told", async () => {
    process.env.SPARWISE_LEASE_MS = "200";
    process.env.SPARWISE_MAX_ATTEMPTS = "2";
    try {
      const u = await teamAndUser();
      const { id } = await enqueueSweep({ ...u, problem: tinyProblem(5) });
      const outboxBefore = Number((await db("outbox").count({ n: "*" }).first())!.n);
      await claimNextSweeps("A", 1);
      await new Promise((r) => setTimeout(r, 250));
      await claimNextSweeps("B", 1);
      await new Promise((r) => setTimeout(r, 250));
      expect(await claimNextSweeps("C", 1)).toEqual([]);
      const s = await getSweep(id);
      expect(s?.status).toBe("failed");
      expect(s?.error).toMatch(/stopped responding 2 time\(s\).*gave up after 2 attempts/);
      expect(Number((await db("outbox").count({ n: "*" }).first())!.n)).toBe(outboxBefore + 1);
      expect(await db("notifications").where({ user_id: u.ownerId, link: `/sweeps/${id}` }).count({ n: "*" }).first()).toEqual({ n: 1 });
    } finally {
      delete process.env.SPARWISE_LEASE_MS;
      delete process.env.SPARWISE_MAX_ATTEMPTS;
    }
  });

  test("a stored problem the schema now refuses fails that sweep alone; the queue keeps moving", async () => {
    const u = await teamAndUser();
    const [bad] = await db("sweeps").insert({ team_id: u.teamId, owner_id: u.ownerId, status: "queued", problem: JSON.stringify({ moment: { sagging: 10 } }) });
    const { id: good } = await enqueueSweep({ ...u, problem: tinyProblem(1) });
    const claims = await claimNextSweeps("A", 2);
    expect(claims.map((c) => c.id)).toEqual([good]);
    const row = await db("sweeps").where({ id: bad }).first("status", "error");
    expect(row.status).toBe("failed");
    expect(row.error).toMatch(/no longer valid: depth/);
  });

  test("queue health: counts by status, the oldest wait, live workers, expired leases", async () => {
    // No sleeps against a short lease or a margin on the wait: the times are set in the database
    // (whose clock the figures use), so the test gives the same answer however slow the machine.
    const u = await teamAndUser();
    const ids: number[] = [];
    for (let i = 0; i < 3; i++) ids.push((await enqueueSweep({ ...u, problem: tinyProblem(i) })).id);
    const [claim] = await claimNextSweeps("W1", 1);
    const { queueHealth } = await import("~/workers/queue.server");
    // the oldest still waiting queued a minute ago: the wait is that minute plus the time this
    // update took to reach the health query, which the test measures around them
    const waiting = ids.filter((id) => id !== claim.id);
    const t0 = Date.now();
    await db("sweeps").where({ id: waiting[0] }).update({ queued_at: db.raw("NOW(3) - INTERVAL 60 SECOND") });
    const h = await queueHealth(u.teamId);
    const elapsed = Date.now() - t0;
    expect(h.byStatus).toMatchObject({ queued: 2, running: 1 });
    expect(h.oldestQueuedMs).toBeGreaterThanOrEqual(60_000);
    expect(h.oldestQueuedMs).toBeLessThanOrEqual(60_000 + elapsed + 1); // + 1: the clocks' millisecond rounding
    expect(h.activeWorkers).toBe(1); // the default lease (30 s) is far from over
    expect(h.expiredLeases).toBe(0);
    // the worker died: its lease ran out a second ago
    await db("sweeps").where({ id: claim.id }).update({ lease_expires_at: db.raw("NOW(3) - INTERVAL 1 SECOND") });
    expect(await queueHealth(u.teamId)).toMatchObject({ activeWorkers: 0, expiredLeases: 1 });
  });

  test("release hands the sweep back without counting the attempt", async () => {
    const u = await teamAndUser();
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(6) });
    const [c] = await claimNextSweeps("A", 1);
    expect(await releaseSweep(c)).toBe(true);
    expect(await db("sweeps").where({ id }).first("status", "attempts", "lease_token")).toEqual({ status: "queued", attempts: 0, lease_token: null });
    const [again] = await claimNextSweeps("B", 1);
    expect(again.attempt).toBe(1);
  });
});

describe("runner", () => {
  test("runs queued sweeps to the engine's answer, stores front and family bests, notifies the owner once", async () => {
    const u = await teamAndUser();
    const ids: number[] = [];
    for (let i = 0; i < 5; i++) ids.push((await enqueueSweep({ ...u, problem: tinyProblem(i * 7) })).id);
    const runner = new SweepRunner({ workerId: "test-runner", concurrency: 2, log: () => {} }).start();
    try {
      await waitFor("all sweeps to succeed", async () => (await db("sweeps").whereIn("id", ids).where({ status: "succeeded" }).count({ n: "*" }).first())!.n === ids.length);
    } finally {
      await runner.stop();
    }
    for (const [i, id] of ids.entries()) {
      const expected = searchSections(tinyProblem(i * 7), SWEEP_SEARCH_OPTIONS);
      const s = (await getSweep(id))!;
      expect(s.best?.dimensions).toEqual(expected.best?.dimensions);
      // with the front's full size (the page says when the stored front was cut)
      expect(s.counts).toEqual({ ...expected.counts, front: expected.front.length });
      const all = await listCandidates(id, { pageSize: 500 });
      // with each family's lightest at every depth (issue 11, item 9)
      const problem = searchProblemSchema.parse(tinyProblem(i * 7));
      expect(all.total).toBe(candidatesToStore({ ...expected, depthBests: depthBests(problem).points }, "mass", problem).length);
      expect(all.items.filter((c) => c.depthBest).length).toBe(depthBests(problem).points.length);
      // and that they were kept for every depth, for the sweep page's depth control
      expect(s.depthBests).toEqual({ state: "complete", depths: 16, reason: null });
      expect(all.items[0].dimensions).toEqual(expected.best!.dimensions);
      expect(all.items.filter((c) => c.onFront)).toHaveLength(expected.front.length);
      const fam = await listCandidates(id, { family: "tee", pageSize: 500 });
      expect(fam.items.every((c) => c.family === "tee")).toBe(true);
      const sorted = await listCandidates(id, { sort: "-utilisation", pageSize: 500 });
      for (let k = 1; k < sorted.items.length; k++) expect(sorted.items[k - 1].utilisation).toBeGreaterThanOrEqual(sorted.items[k].utilisation);
      const page2 = await listCandidates(id, { page: 2, pageSize: 2 });
      expect(page2.items.map((c) => c.rank)).toEqual([3, 4].filter((r) => r <= all.total));
      expect(await db("notifications").where({ user_id: u.ownerId, link: `/sweeps/${id}` }).count({ n: "*" }).first()).toEqual({ n: 1 });
      expect(await db("outbox").where("subject", `Sweep ${id} finished`).count({ n: "*" }).first()).toEqual({ n: 1 });
    }
  });

  test("the owner's e-mail and notice name a project's sweep by its number there and the project, an API sweep by its id", async () => {
    const u = await teamAndUser();
    const [projectId] = await db("projects").insert({ team_id: u.teamId, name: "Numbering yard (queue test)", created_by: u.ownerId });
    try {
      // the API sweep first, so the project's first sweep has an id other than its number 1
      const outside = await enqueueSweep({ ...u, problem: tinyProblem(3) });
      const { id } = await enqueueSweep({ ...u, projectId: Number(projectId), problem: tinyProblem(4) });
      expect(id).toBeGreaterThan(1);
      const runner = new SweepRunner({ workerId: "test-runner", concurrency: 1, log: () => {} }).start();
      try {
        await waitFor("both sweeps to finish", async () => (await getSweep(id))?.status === "succeeded" && (await getSweep(outside.id))?.status === "succeeded", 15_000, 50);
      } finally {
        await runner.stop();
      }
      const subjects = await db("outbox").whereIn("subject", ["Sweep 1 in Numbering yard (queue test) finished", `Sweep ${outside.id} finished`]).pluck("subject");
      expect(subjects.sort()).toEqual(["Sweep 1 in Numbering yard (queue test) finished", `Sweep ${outside.id} finished`].sort());
      expect(await db("notifications").where({ user_id: u.ownerId, link: `/sweeps/${id}` }).pluck("title")).toEqual(["Sweep 1 in Numbering yard (queue test) finished"]);
    } finally {
      await db("candidates").whereIn("sweep_id", db("sweeps").where({ project_id: projectId }).select("id")).delete();
      await db("sweeps").where({ project_id: projectId }).delete();
      await db("projects").where({ id: projectId }).delete();
    }
  });

  test("progress reaches the row while the search runs (for the sweep page's bar)", async () => {
    const u = await teamAndUser();
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(4) });
    // A stand-in search that reports progress slowly, then gives the engine's answer.
    const runner = new SweepRunner({
      workerId: "progress-runner",
      concurrency: 1,
      log: () => {},
      search: async (problem, { onProgress }) => {
        // Five steps of 700 ms outlast three of the runner's once-a-second progress writes, so two
        // distinct values reach the row even when a write lands just after a step (three steps raced).
        for (let i = 0; i < 5; i++) {
          onProgress(i, 5);
          await new Promise((r) => setTimeout(r, 700));
        }
        onProgress(5, 5);
        return searchSections(problem);
      },
    }).start();
    try {
      const seen = new Set<string>();
      await waitFor("the sweep to finish", async () => {
        const s = await getSweep(id);
        if (s?.status === "running") seen.add(`${s.progress.done}/${s.progress.total}`);
        return s?.status === "succeeded";
      }, 15_000, 50);
      expect([...seen].filter((x) => x !== "0/0").length).toBeGreaterThanOrEqual(2);
      expect((await getSweep(id))?.progress.fraction).toBe(1);
    } finally {
      await runner.stop();
    }
  });

  test("cancel while queued ends it at once; the runner never runs it", async () => {
    const u = await teamAndUser();
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(1) });
    expect(await cancelSweep(id, { id: u.ownerId, teamId: u.teamId, role: "engineer" })).toMatchObject({ status: "cancelled" });
    const runner = new SweepRunner({ workerId: "test-runner", concurrency: 1, log: () => {} }).start();
    await new Promise((r) => setTimeout(r, 400));
    await runner.stop();
    expect(runner.stats.claimed).toBe(0);
    expect((await getSweep(id))?.status).toBe("cancelled");
  });

  test("cancel while running aborts the running search through its signal and records cancelled", async () => {
    const u = await teamAndUser();
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(2) });
    // A search that never ends by itself: it can only stop through the abort signal, so the
    // order of events shows the cancel reached it (no clock in the assertion).
    const events: string[] = [];
    const runner = new SweepRunner({
      workerId: "test-runner",
      concurrency: 1,
      log: () => {},
      search: (_problem, { signal }) =>
        new Promise((_resolve, reject) => {
          events.push("search started");
          signal?.addEventListener("abort", () => {
            events.push(`search aborted: ${String(signal.reason)}`);
            reject(signal.reason);
          });
        }),
    }).start();
    try {
      await waitFor("the search to start", async () => events.includes("search started"));
      expect((await getSweep(id))?.status).toBe("running");
      events.push("cancel asked");
      expect(await cancelSweep(id, { id: u.ownerId, teamId: u.teamId, role: "engineer" })).toMatchObject({ status: "running", cancelRequested: true });
      await waitFor("cancelled", async () => (await getSweep(id))?.status === "cancelled", 5_000, 20);
      expect(events).toEqual(["search started", "cancel asked", "search aborted: cancel"]);
      // The runner counts the cancel just after its write lands: wait for the count, don't race it.
      await waitFor("the runner to count the cancel", async () => runner.stats.cancelled === 1, 2_000, 20);
      expect(runner.stats).toMatchObject({ claimed: 1, cancelled: 1, succeeded: 0, failed: 0 });
      expect(await db("candidates").where({ sweep_id: id }).count({ n: "*" }).first()).toEqual({ n: 0 });
    } finally {
      await runner.stop();
    }
  });

  test("cancel of a running sweep whose worker is gone (lease expired) ends it at once", async () => {
    process.env.SPARWISE_LEASE_MS = "200";
    try {
      const u = await teamAndUser();
      const { id } = await enqueueSweep({ ...u, problem: tinyProblem(2) });
      const [c] = await claimNextSweeps("gone", 1);
      await new Promise((r) => setTimeout(r, 250));
      expect(await cancelSweep(id, { id: u.ownerId, teamId: u.teamId, role: "engineer" })).toMatchObject({ status: "cancelled" });
      expect(await finishSweep(c, searchSections(tinyProblem(2)))).toBe(false);
      expect((await getSweep(id))?.status).toBe("cancelled");
    } finally {
      delete process.env.SPARWISE_LEASE_MS;
    }
  });

  test("cancel rights: another engineer may not, a viewer may not, the team admin may", async () => {
    const u = await teamAndUser();
    const other = await teamAndUser("engineer2@tallowfield.example");
    const viewer = await teamAndUser("viewer@tallowfield.example");
    const admin = await teamAndUser("admin@tallowfield.example");
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(1) });
    await expectResponse(cancelSweep(id, { id: other.ownerId, teamId: other.teamId, role: "engineer" }), 403, /owner/);
    await expectResponse(cancelSweep(id, { id: viewer.ownerId, teamId: viewer.teamId, role: "viewer" }), 403, /owner/);
    await expectResponse(cancelSweep(id, { id: admin.ownerId, teamId: admin.teamId + 999, role: "admin" }), 404, /not found/);
    expect(await cancelSweep(id, { id: admin.ownerId, teamId: admin.teamId, role: "admin" })).toMatchObject({ status: "cancelled" });
  });
});

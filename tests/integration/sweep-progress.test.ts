// Issue 11, item 6: a running sweep's progress names what it counts (shapes of the grid settled,
// families searched, candidates evaluated) and carries an estimate only when there is one.
import { afterAll, describe, expect, test } from "vitest";
import { db, closeDb } from "~/lib/db.server";
import { claimNextSweeps, enqueueSweep, finishSweep, getSweep, heartbeat } from "~/workers/queue.server";
import { runSweepSearch, type SweepProgress } from "~/workers/sweep-search.server";
import { teamAndUser, tinyProblem } from "./queue-helpers";
import { loader as listSweeps } from "~/routes/api.v1.sweeps";
import { requestAs } from "./fixtures";

afterAll(() => closeDb());

describe("progress in words", () => {
  test("families searched and candidates evaluated reach the row and the API; no estimate at the start", async () => {
    const u = await teamAndUser();
    const { id } = await enqueueSweep({ ...u, problem: tinyProblem(7) });
    await db("sweeps").whereNot({ id }).whereIn("status", ["queued"]).update({ status: "cancelled", finished_at: db.fn.now() });
    const [claim] = await claimNextSweeps("progress-words", 1);
    expect(claim.id).toBe(id);
    // before the search reports: no total, no estimate
    let s = (await getSweep(id))!;
    expect(s.progress).toMatchObject({ total: 0, families: null, evaluated: null });
    expect(s.etaMs).toBeNull();

    const reports: SweepProgress[] = [];
    const result = await runSweepSearch(claim.problem, { signal: new AbortController().signal, onProgress: (done, total, unit, detail) => void reports.push({ done, total, unit, detail }) });
    const mid = reports.find((r) => r.detail && r.detail.familiesDone < r.detail.familiesTotal)!;
    expect(mid).toBeDefined();
    expect(await heartbeat(claim, mid)).toBe(true);
    s = (await getSweep(id))!;
    expect(s.progress.families).toEqual({ done: mid.detail!.familiesDone, total: mid.detail!.familiesTotal });
    expect(s.progress.evaluated).toBe(mid.detail!.evaluated);
    expect(s.progress.counts).toMatch(/^shapes settled/);
    // a moment after the start there is nothing to estimate from yet
    expect(s.etaMs).toBeNull();

    expect(await finishSweep(claim, result, 0, reports.at(-1))).toBe(true);
    s = (await getSweep(id))!;
    expect(s.progress.families).toEqual({ done: mid.detail!.familiesTotal, total: mid.detail!.familiesTotal });
    expect(s.progress.evaluated).toBe(result.counts.evaluated);

    // the API's list says what its progress counts too
    const res = await listSweeps({ request: await requestAs("engineer", "/api/v1/sweeps") });
    const item = ((await res.json()) as { items: { id: number; progress: { counts: string | null } }[] }).items.find((x) => x.id === id)!;
    expect(item.progress.counts).toMatch(/^shapes settled/);
  });
});

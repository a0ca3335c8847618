// Issue 11, item 9: the sweep page's "Lightest at each depth" control, answered by the page's
// loader from the rows the sweep stored (no new search): each family's lightest at the chosen
// depth as the engine's depthBests says, the family filter, an honest empty state, refusals that
// name their field; a shape two families found stored once under the family listed first; and
// large grids (over 10^6 shapes, searched on worker threads) keeping them too.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { CONTRACT_EXAMPLE_PROBLEM, depthBests, geometryKey, rawGridSize, searchProblemSchema, type SearchProblemInput } from "~/optimizer";
import * as page from "~/routes/sweeps.$sweepId";
import * as cands from "~/routes/api.v1.sweeps.$id.candidates";
import { candidatesToStore, depthBestsInfo, enqueueSweep, getSweep } from "~/workers/queue.server";
import { SweepRunner } from "~/workers/runner.server";
import { IN_THREAD_MAX_GRID, SWEEP_SEARCH_OPTIONS } from "~/workers/sweep-search.server";
import { searchSections } from "~/optimizer";
import type { DepthView } from "~/components/DepthBests";
import { MAX_DEPTH_BEST_DEPTHS } from "~/lib/depth-bests";
import { callRoute, demoUser, requestAs } from "./fixtures";
import { teamAndUser, waitFor } from "./queue-helpers";

afterAll(() => closeDb());

// The contract's example brief at 20 mm depth steps: at 100 and 120 mm no section passes (worked
// out by the engine's own depthBests below, not assumed), deeper ones do; and the lightest
// mono-symmetric I at each depth has equal flanges, i.e. is the I.
const PROBLEM: SearchProblemInput = { ...CONTRACT_EXAMPLE_PROBLEM, depth: { min: 100, max: 400, step: 20 }, width: { min: 50, max: 300, step: 25 }, families: ["i", "mono-i", "channel"] };

async function sweepOf(problem: SearchProblemInput) {
  const eng = await demoUser("engineer");
  return recordFinishedSweep(db, { teamId: eng.teamId, ownerId: eng.id, problem });
}

async function view(sweepId: number, query: string, as: "viewer" | "engineer" = "viewer") {
  const res = await callRoute(page.loader, await requestAs(as, `/sweeps/${sweepId}${query}`), { sweepId: String(sweepId) });
  expect(res.status).toBe(200);
  return (res.data as { depth: DepthView }).depth;
}

describe("the sweep page's depth control", () => {
  test("each family's lightest at the chosen depth, as the engine's depthBests, with a family filter", async () => {
    const problem = searchProblemSchema.parse(PROBLEM);
    const sweepId = await sweepOf(problem);
    const expected = depthBests(problem).points;
    const none = await view(sweepId, "");
    expect(none.info).toEqual({ state: "complete", depths: 16, reason: null });
    expect(none.grid).toEqual({ min: 100, step: 20, count: 16 });
    expect(none.rows).toBeNull();
    for (const d of [140, 300, 400]) {
      const v = await view(sweepId, `?depth=${d}&family=`);
      expect(v.errors).toBeNull();
      expect(v.complete).toBe(true);
      for (const f of problem.families) {
        const want = expected.find((p) => p.family === f && p.dimensions.d === d)!;
        const row = v.rows!.find((r) => r.depthBestFor.includes(f));
        expect(row, `${f} at ${d}`).toBeDefined();
        expect(geometryKey(row!.family, row!.dimensions)).toBe(geometryKey(want.family, want.dimensions));
        expect(row!.massPerMetre).toBeCloseTo(want.massPerMetre, 9);
      }
    }
    const fam = await view(sweepId, "?depth=300&family=channel");
    expect(fam.rows).toHaveLength(1);
    expect(fam.rows![0]).toMatchObject({ family: "channel", dimensions: expected.find((p) => p.family === "channel" && p.dimensions.d === 300)!.dimensions });
  });

  test("a depth with no feasible section says so; bad or foreign queries are refused naming the field, never thrown", async () => {
    const problem = searchProblemSchema.parse(PROBLEM);
    const sweepId = await sweepOf(problem);
    // the engine says nothing passes at 100 mm (checked here, so the empty state is a real one)
    expect(depthBests(problem).points.filter((p) => p.dimensions.d === 100)).toEqual([]);
    const empty = await view(sweepId, "?depth=100");
    expect(empty.rows).toEqual([]);
    expect(empty.complete).toBe(true);
    const text = await view(sweepId, "?depth=deep");
    expect(text.errors?.depth).toMatch(/depth must be a number of mm/);
    expect(text.rows).toBeNull();
    const off = await view(sweepId, "?depth=305");
    expect(off.errors?.depth).toMatch(/305 mm is not on this sweep's depth grid \(100 to 400 mm by 20 mm\)/);
    const notSearched = await view(sweepId, "?depth=300&family=box");
    expect(notSearched.errors?.family).toMatch(/^family: this sweep did not search “Box” \(it searched “I \(equal flanges\)”, “Mono-symmetric I”, “Channel”\)$/);
    const unknown = await view(sweepId, "?depth=300&family=girder");
    expect(unknown.errors?.family).toMatch(/family must be one of/);
    // a sweep of another team is still a 404 whatever the query
    const other = await db("teams").insert({ name: "Elsewhere depth", slug: `depth-elsewhere-${Date.now()}` });
    const eng = await demoUser("engineer");
    const foreign = await recordFinishedSweep(db, { teamId: Number(other[0]), ownerId: eng.id, problem });
    const res = await callRoute(page.loader, await requestAs("viewer", `/sweeps/${foreign}?depth=300`), { sweepId: String(foreign) });
    expect(res.status).toBe(404);
  });

  test("a sweep stored before per-depth bests were kept says so instead of an empty answer", async () => {
    const sweepId = await sweepOf(PROBLEM);
    await db("sweeps").where({ id: sweepId }).update({ depth_bests: null });
    await db("candidates").where({ sweep_id: sweepId }).update({ depth_best: false, depth_best_for: null });
    const v = await view(sweepId, "?depth=300");
    expect(v.info.state).toBe("unknown");
    expect(v.info.reason).toMatch(/stored before each family's lightest at every depth was kept/);
    expect(v.grid).toBeNull();
    expect(v.rows).toBeNull();
    // nor does it offer a list of more depths than a sweep keeps, whatever the sweep stored
    const wide = await sweepOf({ ...PROBLEM, depth: { min: 100, max: 100 + MAX_DEPTH_BEST_DEPTHS, step: 1 }, families: ["rectangle"], width: { min: 50, max: 60, step: 10 } });
    await db("sweeps").where({ id: wide }).update({ depth_bests: null });
    await db("candidates").where({ sweep_id: wide }).limit(1).update({ depth_best: true });
    const w = await view(wide, "?depth=300");
    expect(w.grid).toBeNull();
    expect(w.info.reason).toMatch(/2,001 depths/);
  });
});

describe("one section, one row, in stored results", () => {
  // Fails without the de-duplication in candidatesToStore: the mono-symmetric I's lightest at each
  // depth here has equal flanges, the same plates as the I's, and would be stored a second time.
  test("a mono-symmetric I with equal flanges found beside the I is stored once, under the I, and still found by the mono-I filter", async () => {
    const problem = searchProblemSchema.parse(PROBLEM);
    const monoSameAsI = depthBests(problem).points.filter((p) => p.family === "mono-i" && p.dimensions.bt === p.dimensions.bb && p.dimensions.tft === p.dimensions.tfb);
    expect(monoSameAsI.length).toBeGreaterThan(5);
    const sweepId = await sweepOf(problem);
    const rows = await db("candidates").where({ sweep_id: sweepId }).select("family", "dimensions", "depth_best", "depth_best_for");
    const keys = rows.map((r) => geometryKey(r.family, parseJson<Record<string, number>>(r.dimensions)));
    expect(new Set(keys).size).toBe(rows.length);
    for (const p of monoSameAsI) {
      const k = geometryKey(p.family, p.dimensions);
      const stored = rows.filter((r) => geometryKey(r.family, parseJson<Record<string, number>>(r.dimensions)) === k);
      expect(stored).toHaveLength(1);
      expect(stored[0]).toMatchObject({ family: "i", depth_best_for: "i,mono-i" });
    }
    // listed the other way round, the same section is stored under the mono-symmetric I
    const swapped = await sweepOf({ ...PROBLEM, families: ["mono-i", "i", "channel"] });
    const at300 = await view(swapped, "?depth=300");
    const row = at300.rows!.find((r) => r.depthBestFor.includes("i"))!;
    expect(row).toMatchObject({ family: "mono-i", depthBestFor: ["mono-i", "i"] });
    // and the filter by the family listed second still finds it
    const v = await view(sweepId, "?depth=300&family=mono-i");
    expect(v.rows).toHaveLength(1);
    expect(v.rows![0]).toMatchObject({ family: "i", depthBestFor: ["i", "mono-i"] });
    // and so does the candidates API's filter for each family's lightest at each depth
    const api = await callRoute(cands.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}/candidates?family=mono-i&depthBest=true&pageSize=500`), { id: String(sweepId) });
    const items = (api.data as { items: { family: string; dimensions: Record<string, number> }[] }).items;
    expect(items.map((x) => x.dimensions.d).sort((a, b) => a - b)).toEqual(depthBests(problem).points.filter((p) => p.family === "mono-i").map((p) => p.dimensions.d));
    expect(items.filter((x) => x.family === "i").length).toBe(monoSameAsI.length);
  });
});

describe("large grids", () => {
  // Over IN_THREAD_MAX_GRID shapes a sweep's search runs on worker threads (search-threads.ts);
  // its context points (each family's lightest at every depth, proven in the same pass as the
  // front) come back from the threads combined, and the sweep keeps them like any other.
  test("a sweep of more than 10^6 shapes, run by the queue, keeps each family's lightest at every depth", async () => {
    const input: SearchProblemInput = { ...CONTRACT_EXAMPLE_PROBLEM, depth: { min: 200, max: 499, step: 1 }, width: { min: 100, max: 395, step: 5 }, families: ["i", "channel"] };
    const problem = searchProblemSchema.parse(input);
    expect(rawGridSize(problem)).toBeGreaterThan(IN_THREAD_MAX_GRID);
    const u = await teamAndUser();
    const { id } = await enqueueSweep({ ...u, problem: input });
    const runner = new SweepRunner({ workerId: "depth-runner", concurrency: 1, log: () => {} }).start();
    try {
      await waitFor("the large sweep to succeed", async () => (await db("sweeps").where({ id }).first("status"))?.status === "succeeded", 180_000, 200);
    } finally {
      await runner.stop();
    }
    const s = (await getSweep(id))!;
    expect(s.depthBests).toEqual({ state: "complete", depths: 300, reason: null });
    // the reference: one exact search per depth, in this thread
    const want = depthBests(problem);
    const stored = await db("candidates").where({ sweep_id: id, depth_best: true }).select("family", "dimensions", "depth_best_for");
    const key = (f: string, d: Record<string, number>) => `${f} ${JSON.stringify(d)}`;
    const flat = stored.flatMap((r) => String(r.depth_best_for).split(",").map((f) => key(f, parseJson<Record<string, number>>(r.dimensions))));
    expect(flat.sort()).toEqual(want.points.map((p) => key(p.family, p.dimensions)).sort());
    // and the page's control reads them
    const v = await view(id, "?depth=350&family=channel", "engineer");
    expect(v.rows).toHaveLength(1);
    expect(v.rows![0].dimensions).toEqual(want.points.find((p) => p.family === "channel" && p.dimensions.d === 350)!.dimensions);
  }, 240_000);

  test("not kept, and saying why: a search stopped at its time budget, a grid of more depths than a sweep keeps", () => {
    const problem = searchProblemSchema.parse(PROBLEM);
    const stopped = depthBestsInfo(problem, { ...searchSections(problem, { front: "grid", stopWhen: () => true }), stoppedEarly: true });
    expect(stopped).toMatchObject({ state: "none", depths: 16 });
    expect(stopped.reason).toMatch(/stopped at the sweep's time budget/);
    expect(candidatesToStore({ ...searchSections(problem, SWEEP_SEARCH_OPTIONS), stoppedEarly: true }, "mass", problem).some((r) => r.depth_best)).toBe(false);
    const wideProblem = searchProblemSchema.parse({ ...PROBLEM, depth: { min: 100, max: 100 + MAX_DEPTH_BEST_DEPTHS, step: 1 }, families: ["rectangle"], width: { min: 50, max: 60, step: 10 } });
    const wide = depthBestsInfo(wideProblem, searchSections(wideProblem, SWEEP_SEARCH_OPTIONS));
    expect(wide).toMatchObject({ state: "none", depths: MAX_DEPTH_BEST_DEPTHS + 1 });
    expect(wide.reason).toMatch(/grid has 2,001 depths; .* up to 2,000 depths/);
    expect(candidatesToStore(searchSections(wideProblem, SWEEP_SEARCH_OPTIONS), "mass", wideProblem).some((r) => r.depth_best)).toBe(false);
  }, 60_000);
});

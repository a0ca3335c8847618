// Issue 11, item 9: a finished sweep stores each family's lightest feasible section at every depth,
// so the candidates API (and the page reading it) filters by depth and family with no rerun.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { bruteForceSearch, depthBests, gridValues, searchProblemSchema } from "~/optimizer";
import * as cands from "~/routes/api.v1.sweeps.$id.candidates";
import { callRoute, demoUser, requestAs } from "./fixtures";
import { CHANNEL_PROBLEM } from "./workflow-fixtures";

afterAll(() => closeDb());

describe("depth bests stored with a sweep", () => {
  test("?depth= gives each family's lightest at that depth, as the engine's depthBests says", async () => {
    const eng = await demoUser("engineer");
    const problem = searchProblemSchema.parse({ ...CHANNEL_PROBLEM, families: ["channel", "i"] });
    const sweepId = await recordFinishedSweep(db, { teamId: eng.teamId, ownerId: eng.id, problem });
    const expected = depthBests(problem).points;
    expect(await db("candidates").where({ sweep_id: sweepId, depth_best: true }).count({ n: "*" }).first()).toEqual({ n: expected.length });
    const depths = gridValues(problem.depth);
    const d = depths[Math.floor(depths.length / 2)];
    const res = await callRoute(cands.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}/candidates?depth=${d}&pageSize=500`), { id: String(sweepId) });
    expect(res.status).toBe(200);
    const items = (res.data as { items: { family: string; dimensions: Record<string, number>; area: number; depthBest: boolean }[] }).items;
    expect(items.every((x) => Math.abs(x.dimensions.d - d) < 1e-6)).toBe(true);
    for (const p of expected.filter((x) => Math.abs(x.dimensions.d - d) < 1e-6)) {
      const row = items.find((x) => x.depthBest && x.family === p.family);
      expect(row, p.family).toBeDefined();
      expect(row!.area).toBeCloseTo(p.area, 6);
    }
    // and a family filter with it
    const fam = await callRoute(cands.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}/candidates?depth=${d}&family=i`), { id: String(sweepId) });
    expect((fam.data as { items: { family: string }[] }).items.every((x) => x.family === "i")).toBe(true);
    const bad = await callRoute(cands.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}/candidates?depth=deep`), { id: String(sweepId) });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.data)).toMatch(/depth must be a number of mm/);

    // The chart's filter (issue 15): ?depthBest=true with a depth range gives exactly the engine's
    // lightest per depth in that range, lightest first; here for family i
    const lo = depths[2],
      hi = depths[depths.length - 3];
    const ctx = await callRoute(cands.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}/candidates?depthBest=true&family=i&depthMin=${lo}&depthMax=${hi}&pageSize=500`), { id: String(sweepId) });
    expect(ctx.status).toBe(200);
    const got = (ctx.data as { items: { family: string; dimensions: Record<string, number>; area: number; depthBest: boolean }[] }).items;
    const want = expected.filter((p) => p.family === "i" && p.dimensions.d >= lo - 1e-6 && p.dimensions.d <= hi + 1e-6);
    expect(want.length).toBeGreaterThan(2);
    expect(got.map((x) => JSON.stringify(x.dimensions)).sort()).toEqual(want.map((p) => JSON.stringify(p.dimensions)).sort());
    expect(got.every((x) => x.depthBest)).toBe(true);
    for (let i = 1; i < got.length; i++) expect(got[i].area).toBeGreaterThanOrEqual(got[i - 1].area - 1e-9);
    for (const q of ["depthBest=maybe", "depthMin=-1", "depthMax=wide"]) {
      const r = await callRoute(cands.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}/candidates?${q}`), { id: String(sweepId) });
      expect(r.status, q).toBe(400);
      expect(JSON.stringify(r.data), q).toMatch(new RegExp(q.split("=")[0]));
    }
  });

  test("the stored lightest per depth are the grid-front search's context points, as brute force finds them", async () => {
    const eng = await demoUser("engineer");
    const problem = searchProblemSchema.parse({ ...CHANNEL_PROBLEM, families: ["channel", "i"] });
    const sweepId = await recordFinishedSweep(db, { teamId: eng.teamId, ownerId: eng.id, problem });
    const stored = await db("candidates").where({ sweep_id: sweepId, depth_best: true }).select("family", "dimensions");
    const brute = bruteForceSearch(problem).context!;
    const key = (f: string, d: unknown) => `${f} ${typeof d === "string" ? JSON.stringify(JSON.parse(d)) : JSON.stringify(d)}`;
    expect(stored.map((r) => key(r.family, r.dimensions)).sort()).toEqual(brute.map((p) => key(p.family, p.dimensions)).sort());
  });
});

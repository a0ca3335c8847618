// Issue 11, items 2–4 through the routes and modules: a recheck that only cuts the depth limit
// says the deeper option now breaks depth max; an option saved from a recheck names that recheck
// and its own problem; the recheck form keeps member length and count; the brief keeps its
// material and E.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { compareRecheck } from "~/lib/recheck.server";
import { getBrief } from "~/lib/projects.server";
import { getOption } from "~/lib/options.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { callRoute, FixtureContext, formPost, loadRouteModule, requestAs } from "./fixtures";
import { CHANNEL_PROBLEM, workflowFixture } from "./workflow-fixtures";

afterAll(() => closeDb());
const ctx = new FixtureContext();

const BRIEF_FIELDS: Record<string, string | string[]> = {
  name: "Material brief",
  units: "si",
  material: "s355",
  "moment.sagging": "120",
  shear: "80",
  "allowable.tension": "213",
  "allowable.compression": "213",
  "allowable.shear": "142",
  "depth.min": "100",
  "depth.max": "400",
  "depth.step": "20",
  "width.min": "50",
  "width.max": "300",
  "width.step": "25",
  thicknesses: "6, 8, 10, 12",
  families: ["channel"],
  "deflection.E": "210000",
  memberLength: "5.4",
  memberCount: "4",
};

describe("recheck comparison re-tests every limit (item 2)", () => {
  test("cutting only depth max below the option's depth says which limit it breaks", async () => {
    const f = await workflowFixture(ctx);
    const team = await ctx.teamId();
    const option = await getOption(team, f.optionId);
    const d = option.candidate.dimensions.d;
    const reviewer = await ctx.user("reviewer");
    const recheckId = await recordFinishedSweep(db, {
      teamId: team,
      ownerId: reviewer.id,
      projectId: f.projectId,
      briefId: f.briefId,
      recheckOf: f.sweepId,
      problem: { ...CHANNEL_PROBLEM, depth: { min: 100, max: d - 20, step: 20 } },
    });
    const c = await compareRecheck(team, recheckId);
    expect(c.changes).toEqual([{ path: "depth.max", before: 400, after: d - 20 }]);
    const o = c.options.find((x) => x.id === f.optionId)!;
    // The checks alone still pass (same loads, same allowables): before, this read "still passes".
    expect(o.utilisation).toBeLessThanOrEqual(1);
    expect(o.feasible).toBe(false);
    expect(o.breaches).toEqual([{ kind: "above", limit: "depth.max", dim: "d", value: d, bound: d - 20 }]);
    // The page says it in words, naming the limit by its label.
    const mod = await loadRouteModule("routes/sweeps.$sweepId.comparison.tsx");
    const page = await callRoute(mod.loader, await requestAs("viewer", `/sweeps/${recheckId}/comparison`), { sweepId: String(recheckId) });
    expect(page.status).toBe(200);
  });
});

describe("provenance (item 3)", () => {
  test("an option saved from a recheck names the recheck and the sweep it rechecked, and keeps the recheck's problem", async () => {
    const f = await workflowFixture(ctx);
    const sweepMod = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const saved = await callRoute(sweepMod.action, await formPost("engineer", `/sweeps/${f.recheckId}`, { intent: "saveOption", rank: "1" }), { sweepId: String(f.recheckId) });
    expect(saved.status).toBe(302);
    const id = Number(saved.location!.split("/").pop());
    const o = await getOption(await ctx.teamId(), id);
    expect(o.sweepId).toBe(f.recheckId);
    expect(o.recheckOf).toBe(f.sweepId);
    // The recheck's limits (140 MPa), not the brief's (165 MPa).
    expect(o.problem.allowable?.tension).toBe(140);
    const brief = await getBrief(await ctx.teamId(), f.briefId);
    expect(brief.problem.allowable?.tension).toBe(165);
  });
});

describe("lost fields (item 4)", () => {
  test("the brief keeps its material preset and E; a run's sweep keeps the member; the recheck form starts from them", async () => {
    const f = await workflowFixture(ctx);
    const newMod = await loadRouteModule("routes/projects.$projectId.briefs.new.tsx");
    const res = await callRoute(newMod.action, await formPost("engineer", `/projects/${f.projectId}/briefs/new`, { ...BRIEF_FIELDS, intent: "run" }), { projectId: String(f.projectId) });
    expect(res.status).toBe(302);
    const sweepId = Number(res.location!.split("/").pop());
    const sweep = await db("sweeps").where({ id: sweepId }).first();
    expect(sweep.member_length_m).toBe(5.4);
    expect(sweep.member_count).toBe(4);
    // E alone is the material's: no deflection check was asked for.
    expect(parseJson<{ deflection?: unknown }>(sweep.problem).deflection).toBeUndefined();
    const brief = await getBrief(await ctx.teamId(), sweep.brief_id);
    expect(brief.material).toBe("s355");
    expect(brief.elasticModulus).toBe(210000);

    // The edit page reopens on the preset with E filled.
    const briefMod = await loadRouteModule("routes/briefs.$briefId.tsx");
    const edit = await callRoute(briefMod.loader, await requestAs("engineer", `/briefs/${brief.id}`), { briefId: String(brief.id) });
    const defaults = (edit.data as { defaults: Record<string, any> }).defaults;
    expect(defaults.material).toBe("s355");
    expect(defaults.deflection.E).toBe(210000);

    // The recheck form carries member length and count, and the material.
    const recheckMod = await loadRouteModule("routes/sweeps.$sweepId.recheck.tsx");
    const form = await callRoute(recheckMod.loader, await requestAs("reviewer", `/sweeps/${sweepId}/recheck`), { sweepId: String(sweepId) });
    const rd = (form.data as { defaults: Record<string, any> }).defaults;
    expect(rd.memberLength).toBe(5.4);
    expect(rd.memberCount).toBe(4);
    expect(rd.material).toBe("s355");
    expect(rd.deflection.E).toBe(210000);

    // A recheck run with an altered member keeps it on its own sweep; the brief is untouched.
    const run = await callRoute(recheckMod.action, await formPost("reviewer", `/sweeps/${sweepId}/recheck`, { ...BRIEF_FIELDS, memberLength: "6", memberCount: "2" }), { sweepId: String(sweepId) });
    expect(run.status).toBe(302);
    const recheck = await db("sweeps").where({ id: Number(run.location!.split("/").pop()) }).first();
    expect([recheck.member_length_m, recheck.member_count]).toEqual([6, 2]);
    expect((await getBrief(await ctx.teamId(), brief.id)).memberLengthM).toBe(5.4);
    await db("sweeps").whereIn("id", [recheck.id, sweepId]).delete();
  });

  test("a save that changes only the name keeps problem_changed_at; a changed limit moves it", async () => {
    const f = await workflowFixture(ctx);
    const newMod = await loadRouteModule("routes/projects.$projectId.briefs.new.tsx");
    const res = await callRoute(newMod.action, await formPost("engineer", `/projects/${f.projectId}/briefs/new`, { ...BRIEF_FIELDS, intent: "save" }), { projectId: String(f.projectId) });
    const briefId = Number(new URL(res.location!, "http://x").pathname.split("/").pop());
    const first = (await getBrief(await ctx.teamId(), briefId)).problemChangedAt;
    expect(first).not.toBeNull();
    await new Promise((r) => setTimeout(r, 20));
    const editMod = await loadRouteModule("routes/briefs.$briefId.tsx");
    await callRoute(editMod.action, await formPost("engineer", `/briefs/${briefId}`, { ...BRIEF_FIELDS, name: "Renamed", intent: "save" }), { briefId: String(briefId) });
    expect((await getBrief(await ctx.teamId(), briefId)).problemChangedAt).toBe(first);
    await callRoute(editMod.action, await formPost("engineer", `/briefs/${briefId}`, { ...BRIEF_FIELDS, "depth.max": "380", intent: "save" }), { briefId: String(briefId) });
    expect((await getBrief(await ctx.teamId(), briefId)).problemChangedAt! > first!).toBe(true);
  });
});

describe("no feasible section (item 7)", () => {
  test("the sweep keeps the engine's nearest misses and relaxations, and the page reads them", async () => {
    const f = await workflowFixture(ctx);
    const team = await ctx.teamId();
    const engineer = await ctx.user("engineer");
    // 120 kN·m at 165 MPa needs a deeper section than 100–160 mm with these plates.
    const id = await recordFinishedSweep(db, {
      teamId: team,
      ownerId: engineer.id,
      projectId: f.projectId,
      briefId: f.briefId,
      problem: { ...CHANNEL_PROBLEM, depth: { min: 100, max: 160, step: 20 }, thicknesses: [6, 8] },
    });
    const mod = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const page = await callRoute(mod.loader, await requestAs("viewer", `/sweeps/${id}`), { sweepId: String(id) });
    const sweep = (page.data as { sweep: { best: unknown; advice: any } }).sweep;
    expect(sweep.best).toBeNull();
    expect(sweep.advice.nearestMisses.map((m: { family: string }) => m.family).sort()).toEqual(["channel", "i"]);
    for (const m of sweep.advice.nearestMisses) expect(m.utilisation).toBeGreaterThan(1);
    const depth = sweep.advice.relaxations.find((r: { limit: string }) => r.limit === "depth.max");
    expect(depth.from).toBe(160);
    expect(depth.to).toBeGreaterThan(160);
    // the relaxed problem's best is feasible there (the engine's own search agrees)
    const { searchSections, searchProblemSchema } = await import("~/optimizer");
    const eased = searchProblemSchema.parse({ ...CHANNEL_PROBLEM, depth: { min: 100, max: depth.to, step: 20 }, thicknesses: [6, 8] });
    expect(searchSections(eased, { front: "evaluated" }).best?.massPerMetre).toBeCloseTo(depth.best.massPerMetre, 9);
  });
});

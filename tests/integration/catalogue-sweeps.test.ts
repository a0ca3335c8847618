// A brief that searches a catalogue beside the plate families, end to end against MariaDB: the
// brief editor's submit copies the chosen catalogue's sections and the team's costs into the
// problem; a finished sweep stores rolled candidates after the welded ones with their cost parts
// and the side-by-side summary; the sweep page shows both; a rolled candidate saves as an option
// whose page and calculation record check it by the rolled rules.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import type { CatalogueSummary } from "~/lib/catalogue-sweep";
import { getTeamCosts } from "~/lib/team-costs.server";
import type { SearchProblem, SearchProblemInput } from "~/optimizer";
import { STARTER_CATALOGUE_NAME } from "../../db/seeds/03_starter_catalogue";
import { callRoute, demoUser, formPost, loadRouteModule, requestAs, tableCounts } from "./fixtures";

afterAll(() => closeDb());

async function starter() {
  const admin = await demoUser("admin");
  const c = await db("catalogues").where({ team_id: admin.teamId, name: STARTER_CATALOGUE_NAME }).first("id");
  const rows = await db("catalogue_sections").where({ catalogue_id: c.id }).orderBy("line");
  return { id: c.id as number, teamId: admin.teamId, sections: rows.map((r) => ({ designation: r.designation, shape: r.shape, dims: parseJson<Record<string, number>>(r.dims) })) };
}

async function project() {
  const engineer = await demoUser("engineer");
  const [id] = await db("projects").insert({ team_id: engineer.teamId, name: `Rolled or welded ${Date.now()}`, created_by: engineer.id });
  await db("project_members").insert({ project_id: id, user_id: engineer.id });
  return { id: Number(id), engineer };
}

const BRIEF_FIELDS: Record<string, string | string[]> = {
  name: "Lightest channel, rolled or welded",
  units: "si",
  basis: "allowable",
  "moment.sagging": "45",
  shear: "40",
  "allowable.tension": "165",
  "allowable.compression": "165",
  "allowable.shear": "100",
  "depth.min": "100",
  "depth.max": "300",
  "depth.step": "10",
  "width.min": "50",
  "width.max": "150",
  "width.step": "10",
  thicknesses: "6, 8, 10, 12, 15, 20, 25",
  families: "channel",
};

describe("the brief editor's submit takes catalogues and the team's costs", () => {
  test("the chosen catalogue's sections (only the chosen shapes) are copied into the brief's problem", async () => {
    const s = await starter();
    const p = await project();
    const mod = await loadRouteModule("routes/projects.$projectId.briefs.new.tsx");
    const res = await callRoute(mod.action, await formPost("engineer", `/projects/${p.id}/briefs/new`, { ...BRIEF_FIELDS, catalogueChoice: "1", catalogueIds: String(s.id), catalogueShapes: "channel", intent: "save" }), { projectId: String(p.id) });
    expect(res.status, JSON.stringify(res.data)).toBe(302);
    const brief = await db("briefs").where({ project_id: p.id }).first("problem");
    const problem = parseJson<SearchProblem>(brief.problem);
    expect(problem.catalogues).toHaveLength(1);
    expect(problem.catalogues![0]!.name).toBe(STARTER_CATALOGUE_NAME);
    expect(problem.catalogues![0]!.shapes).toEqual(["channel"]);
    expect(problem.catalogues![0]!.sections.length).toBe(s.sections.length);
  });

  test("the cost objective takes the team's rolled price and weld costs beside the form's plate prices", async () => {
    const s = await starter();
    const p = await project();
    const costs = await getTeamCosts(s.teamId);
    const mod = await loadRouteModule("routes/projects.$projectId.briefs.new.tsx");
    const res = await callRoute(mod.action, await formPost("engineer", `/projects/${p.id}/briefs/new`, { ...BRIEF_FIELDS, objective: "cost", prices: JSON.stringify([6, 8, 10, 12, 15, 20, 25].map((thickness) => ({ thickness, pricePerKg: 1.1 }))), catalogueChoice: "1", catalogueIds: String(s.id), intent: "save" }), { projectId: String(p.id) });
    if (costs.rolledPricePerKg === null) {
      // another test changed the team's costs: then the brief is refused naming the missing price
      expect(res.status).toBe(400);
      return;
    }
    expect(res.status, JSON.stringify(res.data)).toBe(302);
    const problem = parseJson<SearchProblem>((await db("briefs").where({ project_id: p.id }).first("problem")).problem);
    expect(problem.costs).toEqual({ rolledPricePerKg: costs.rolledPricePerKg, weld: costs.weld });
  });

  test("a catalogue of another team (or none) is refused naming catalogueIds, nothing written", async () => {
    const p = await project();
    const [otherTeam] = await db("teams").insert({ name: "Elsewhere Rolling (test)", slug: `elsewhere-rolling-${Date.now()}` });
    const [theirs] = await db("catalogues").insert({ team_id: otherTeam, name: "Theirs", section_count: 0 });
    const before = await tableCounts();
    const mod = await loadRouteModule("routes/projects.$projectId.briefs.new.tsx");
    for (const id of [String(theirs), "999999", "abc"]) {
      const res = await callRoute(mod.action, await formPost("engineer", `/projects/${p.id}/briefs/new`, { ...BRIEF_FIELDS, catalogueChoice: "1", catalogueIds: id, intent: "save" }), { projectId: String(p.id) });
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.data)).toMatch(/catalogueIds/);
    }
    expect(await tableCounts()).toEqual(before);
  });
});

describe("a finished sweep over catalogue and plates", () => {
  async function sweep(objective: "mass" | "cost") {
    const s = await starter();
    const p = await project();
    const costs = await getTeamCosts(s.teamId);
    const problem: SearchProblemInput = {
      moment: { sagging: 45 },
      shear: 40,
      allowable: { tension: 165, compression: 165, shear: 100 },
      depth: { min: 100, max: 300, step: 10 },
      width: { min: 50, max: 150, step: 10 },
      thicknesses: [6, 8, 10, 12, 15, 20, 25],
      families: ["channel"],
      catalogues: [{ name: STARTER_CATALOGUE_NAME, shapes: ["channel"], sections: s.sections as never }],
      ...(objective === "cost"
        ? { objective, prices: [6, 8, 10, 12, 15, 20, 25].map((thickness) => ({ thickness, pricePerKg: 1.1 })), costs: { rolledPricePerKg: 1.02, weld: [{ throat: 3, perMetre: 4.2 }] } }
        : {}),
    };
    void costs;
    const sweepId = await recordFinishedSweep(db, { teamId: s.teamId, ownerId: p.engineer.id, projectId: p.id, problem });
    return { sweepId, projectId: p.id };
  }

  test("stores rolled candidates after the welded ones, and the side-by-side summary", async () => {
    const { sweepId } = await sweep("mass");
    const rows = await db("candidates").where({ sweep_id: sweepId }).orderBy("rank");
    const welded = rows.filter((r) => r.source === "plate"),
      rolled = rows.filter((r) => r.source === "rolled");
    expect(welded.length).toBeGreaterThan(0);
    expect(rolled.length).toBeGreaterThan(0);
    expect(Math.min(...rolled.map((r) => r.rank))).toBeGreaterThan(Math.max(...welded.map((r) => r.rank)));
    expect(rolled.every((r) => /^UPE /.test(r.designation) && r.catalogue === STARTER_CATALOGUE_NAME && r.family === "channel")).toBe(true);
    const summary = parseJson<CatalogueSummary>((await db("sweeps").where({ id: sweepId }).first("catalogue_result")).catalogue_result);
    expect(summary.sideBySide.welded.lightest?.source).toBe("plate");
    expect(summary.sideBySide.rolled.lightest?.designation).toBe(rolled.sort((a, b) => a.area - b.area)[0].designation);
    expect(summary.counts.sections).toBe((await starter()).sections.length);
  });

  test("with the cost objective every costed row carries its material and fabrication parts", async () => {
    const { sweepId } = await sweep("cost");
    const rows = await db("candidates").where({ sweep_id: sweepId });
    for (const r of rows) {
      expect(r.cost_material + r.cost_fabrication).toBeCloseTo(r.cost, 9);
      expect(r.cost_fabrication).toBe(r.source === "rolled" ? 0 : 4 * 4.2);
    }
    const summary = parseJson<CatalogueSummary>((await db("sweeps").where({ id: sweepId }).first("catalogue_result")).catalogue_result);
    expect(summary.sideBySide.welded.cheapest?.costParts?.fabrication).toBe(16.8);
    expect(summary.sideBySide.rolled.cheapest?.costParts?.fabrication).toBe(0);
    expect(summary.sideBySide.welded.lightest).not.toBeNull();
  });

  test("the sweep page shows both; a rolled candidate saves as an option checked by the rolled rules on its page and record", async () => {
    const { sweepId } = await sweep("cost");
    const page = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const res = await callRoute(page.loader, await requestAs("engineer", `/sweeps/${sweepId}`), { sweepId: String(sweepId) });
    type Row = { rank: number; source?: string; designation?: string | null; costMaterial?: number | null; onFront: boolean };
    const data = res.data as { sweep: { catalogueResult: CatalogueSummary | null }; chart: { pointsJson: string }; table: { itemsJson: string; total: number } };
    expect(data.sweep.catalogueResult?.sideBySide.rolled.cheapest).toBeTruthy();
    // the chart draws both sides, each with its own front
    // the page sends the chart's points as one JSON text, parsed in the browser
    const points = JSON.parse(data.chart.pointsJson) as Row[];
    expect(points.some((c) => c.source === "rolled" && c.onFront)).toBe(true);
    expect(points.some((c) => c.source !== "rolled" && c.onFront)).toBe(true);
    const rolled = points.find((c) => c.source === "rolled")!;
    expect(rolled.designation).toMatch(/^UPE /);
    expect(rolled.costMaterial).toBeGreaterThan(0);
    // the table's pages come from the API: rolled rows rank after the welded ones, so the last page by rank starts with them
    const api = await import("~/routes/api.v1.sweeps.$id.candidates");
    const last = await callRoute(api.loader, await requestAs("engineer", `/api/v1/sweeps/${sweepId}/candidates?sort=-rank&pageSize=5`), { id: String(sweepId) });
    const items = (last.data as { items: (Row & { design: unknown })[] }).items;
    expect(items[0]!.source).toBe("rolled");
    expect(items[0]!.designation).toMatch(/^UPE /);

    const save = await callRoute(page.action, await formPost("engineer", `/sweeps/${sweepId}`, { intent: "saveOption", rank: String(rolled.rank), note: "rolled" }), { sweepId: String(sweepId) });
    expect(save.status).toBe(302);
    const optionId = Number(save.location!.split("/").pop());
    const opt = await db("options").where({ id: optionId }).first("candidate");
    expect(parseJson<{ source: string; designation: string; shape: string }>(opt.candidate)).toMatchObject({ source: "rolled", designation: rolled.designation, shape: "channel" });

    const optionPage = await loadRouteModule("routes/options.$optionId.tsx");
    const op = await callRoute(optionPage.loader, await requestAs("engineer", `/options/${optionId}`), { optionId: String(optionId) });
    expect(op.status).toBe(200);
    const record = await loadRouteModule("routes/options.$optionId.record.tsx");
    const rec = await callRoute(record.loader, await requestAs("engineer", `/options/${optionId}/record`), { optionId: String(optionId) });
    expect(rec.status).toBe(200);

    // the member schedule names it by its designation and the plate cutting list leaves it out (bought rolled, not cut)
    const { projectSchedule } = await import("~/lib/schedule.server");
    const { cuttingList } = await import("~/lib/cutting-list");
    const projectId = (await db("options").where({ id: optionId }).first("project_id")).project_id as number;
    const sched = await projectSchedule(projectId);
    const row = sched.find((r) => r.optionId === optionId)!;
    expect(row.section).toBe(`${rolled.designation} (rolled channel)`);
    expect(row.weldThroat).toBeNull();
    const list = cuttingList(sched.filter((r) => r.optionId === optionId).map((r) => ({ ...r, lengthM: 6, count: 2 })));
    expect(list.groups).toHaveLength(0);
    expect(list.skipped).toBe(1);
  });
});

describe("a recheck carries the catalogue choice", () => {
  const PRICES = JSON.stringify([6, 8, 10, 12, 15, 20, 25].map((thickness) => ({ thickness, pricePerKg: 1.1 })));
  const COST_FIELDS = { ...BRIEF_FIELDS, objective: "cost", prices: PRICES };

  async function costSweepWithRolledOption() {
    const s = await starter();
    const p = await project();
    const problem: SearchProblemInput = {
      moment: { sagging: 45 },
      shear: 40,
      allowable: { tension: 165, compression: 165, shear: 100 },
      depth: { min: 100, max: 300, step: 10 },
      width: { min: 50, max: 150, step: 10 },
      thicknesses: [6, 8, 10, 12, 15, 20, 25],
      families: ["channel"],
      catalogues: [{ name: STARTER_CATALOGUE_NAME, shapes: ["channel"], sections: s.sections as never }],
      objective: "cost",
      prices: [6, 8, 10, 12, 15, 20, 25].map((thickness) => ({ thickness, pricePerKg: 1.1 })),
      // not the team's figures, so a recheck that took the team's would show
      costs: { rolledPricePerKg: 1.37, weld: [{ throat: 3, perMetre: 5.5 }] },
    };
    const sweepId = await recordFinishedSweep(db, { teamId: s.teamId, ownerId: p.engineer.id, projectId: p.id, problem });
    const rolled = await db("candidates").where({ sweep_id: sweepId, source: "rolled" }).orderBy("rank").first("rank", "designation");
    const page = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const save = await callRoute(page.action, await formPost("engineer", `/sweeps/${sweepId}`, { intent: "saveOption", rank: String(rolled.rank) }), { sweepId: String(sweepId) });
    expect(save.status).toBe(302);
    const original = parseJson<SearchProblem>((await db("sweeps").where({ id: sweepId }).first("problem")).problem);
    return { sweepId, original, designation: rolled.designation as string, teamId: s.teamId };
  }

  async function recheck(sweepId: number, fields: Record<string, string | string[]>) {
    const mod = await loadRouteModule("routes/sweeps.$sweepId.recheck.tsx");
    const res = await callRoute(mod.action, await formPost("reviewer", `/sweeps/${sweepId}/recheck`, fields), { sweepId: String(sweepId) });
    if (res.status !== 302) return { res, id: null, problem: null };
    const id = Number(res.location!.split("/").pop());
    return { res, id, problem: parseJson<SearchProblem>((await db("sweeps").where({ id }).first("problem")).problem) };
  }

  const made: number[] = [];
  afterAll(async () => {
    // the queued rechecks are not run here; no worker should find them later
    if (made.length) await db("sweeps").whereIn("id", made).update({ status: "cancelled", finished_at: db.fn.now() });
  });

  test("the recheck page offers the original's catalogues as searched, ticked", async () => {
    const { sweepId, original } = await costSweepWithRolledOption();
    const mod = await loadRouteModule("routes/sweeps.$sweepId.recheck.tsx");
    const res = await callRoute(mod.loader, await requestAs("reviewer", `/sweeps/${sweepId}/recheck`), { sweepId: String(sweepId) });
    const data = res.data as { catalogues: { kept: { name: string; sections: number }[]; shapes?: string[] } };
    expect(data.catalogues.kept).toEqual([{ name: STARTER_CATALOGUE_NAME, sections: original.catalogues![0]!.sections.length }]);
    expect(data.catalogues.shapes).toEqual(["channel"]);
  });

  test("kept: the same copied sections and the original's costs; the rolled option still fits", async () => {
    const { sweepId, original, designation, teamId } = await costSweepWithRolledOption();
    const { res, id, problem } = await recheck(sweepId, { ...COST_FIELDS, "allowable.shear": "95", catalogueChoice: "1", catalogueKeep: "0", catalogueShapes: "channel" });
    expect(res.status, JSON.stringify(res.data)).toBe(302);
    made.push(id!);
    expect(problem!.catalogues).toEqual(original.catalogues);
    expect(problem!.costs).toEqual({ rolledPricePerKg: 1.37, weld: [{ throat: 3, perMetre: 5.5 }] });
    const { compareRecheck } = await import("~/lib/recheck.server");
    const cmp = await compareRecheck(teamId, id!);
    const o = cmp.options.find((x) => x.candidate.designation === designation)!;
    expect(o.feasible).toBe(true);
    expect(o.breaches).toEqual([]);
    expect(o.utilisation).toBeGreaterThan(0);
  });

  test("a recheck form without the choice (as the API posts it) keeps the original's catalogues whole", async () => {
    const { sweepId, original } = await costSweepWithRolledOption();
    const { res, id, problem } = await recheck(sweepId, COST_FIELDS);
    expect(res.status, JSON.stringify(res.data)).toBe(302);
    made.push(id!);
    expect(problem!.catalogues).toEqual(original.catalogues);
  });

  test("unticked: no catalogue, and the rolled option is named as no longer among the sections; a heavier moment breaks its checks by the rolled rules", async () => {
    const { sweepId, designation, teamId } = await costSweepWithRolledOption();
    const { compareRecheck } = await import("~/lib/recheck.server");
    const { describeBreach } = await import("~/lib/labels");
    const none = await recheck(sweepId, { ...BRIEF_FIELDS, catalogueChoice: "1" });
    expect(none.res.status, JSON.stringify(none.res.data)).toBe(302);
    made.push(none.id!);
    expect(none.problem!.catalogues).toBeUndefined();
    const dropped = (await compareRecheck(teamId, none.id!)).options.find((x) => x.candidate.designation === designation)!;
    expect(dropped.feasible).toBe(false);
    expect(dropped.breaches).toEqual([{ kind: "catalogue", limit: "catalogues", designation, catalogue: STARTER_CATALOGUE_NAME }]);
    expect(describeBreach(dropped.breaches[0]!, "si")).toBe(`${designation} is no longer among the catalogue sections searched (${STARTER_CATALOGUE_NAME})`);

    const heavy = await recheck(sweepId, { ...COST_FIELDS, "moment.sagging": "450", catalogueChoice: "1", catalogueKeep: "0" });
    expect(heavy.res.status, JSON.stringify(heavy.res.data)).toBe(302);
    made.push(heavy.id!);
    const broken = (await compareRecheck(teamId, heavy.id!)).options.find((x) => x.candidate.designation === designation)!;
    expect(broken.feasible).toBe(false);
    expect(broken.breaches.every((b) => b.kind === "check")).toBe(true);
    expect(broken.breaches.map((b) => (b as { check: string }).check)).toContain("bending-compression");
  });

  test("a catalogue number the original did not search is refused naming catalogueKeep, nothing written", async () => {
    const { sweepId } = await costSweepWithRolledOption();
    const before = await tableCounts();
    for (const keep of ["1", "-1", "x"]) {
      const { res } = await recheck(sweepId, { ...COST_FIELDS, catalogueChoice: "1", catalogueKeep: keep });
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.data)).toMatch(/catalogueKeep/);
    }
    expect(await tableCounts()).toEqual(before);
  });
});

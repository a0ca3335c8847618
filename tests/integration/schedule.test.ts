// The member schedule: quantities and totals against a hand calculation, the CSV's columns and
// units, and the download through its route (team-scoped).
import { afterAll, describe, expect, test } from "vitest";
import Papa from "papaparse";
import { closeDb, db } from "~/lib/db.server";
import { projectSchedule, scheduleCsv, SCHEDULE_CSV_FIELDS } from "~/lib/schedule.server";
import { CHANNEL_PROBLEM } from "./workflow-fixtures";
import { candidateChecks, parseSearchProblem } from "~/optimizer/index";
import { callRoute, FixtureContext, loadRouteModule, requestAs } from "./fixtures";

afterAll(() => closeDb());
const ctx = new FixtureContext();

async function scheduleFixture() {
  const teamId = await ctx.teamId();
  const engineer = await ctx.user("engineer");
  const [projectId] = await db("projects").insert({ team_id: teamId, name: "Schedule fixture shed", created_by: engineer.id });
  const [briefId] = await db("briefs").insert({ project_id: projectId, name: "B1 roof beam", problem: JSON.stringify(CHANNEL_PROBLEM), units: "si", member_length_m: 6, member_count: 4, created_by: engineer.id });
  const cand = (massPerMetre: number) => JSON.stringify({ family: "channel", dimensions: { d: 300, b: 100, tf: 10, tw: 8 }, area: 1, massPerMetre, utilisation: 0.5, governing: "shear", rank: 1 });
  const [a] = await db("options").insert({ project_id: projectId, brief_id: briefId, candidate: cand(42.5), problem: JSON.stringify(CHANNEL_PROBLEM), review_state: "approved", created_by: engineer.id });
  const [b] = await db("options").insert({ project_id: projectId, candidate: cand(30), problem: JSON.stringify(CHANNEL_PROBLEM), created_by: engineer.id });
  return { projectId: Number(projectId), a: Number(a), b: Number(b) };
}

describe("member schedule", () => {
  test("mark, quantity and total mass by hand; an option without a brief has no total", async () => {
    const f = await scheduleFixture();
    const rows = await projectSchedule(f.projectId);
    expect(rows.map((r) => r.optionId)).toEqual([f.a, f.b]);
    const [ra, rb] = rows;
    expect(ra.mark).toBe("B1 roof beam");
    expect(ra.section).toBe("Channel d 300 × b 100 × tf 10 × tw 8 mm");
    // total = 42.5 kg/m × 6 m × 4 = 1020 kg (hand calculation)
    expect(ra.totalMass).toBeCloseTo(1020, 9);
    expect(ra.reviewState).toBe("approved");
    expect(rb.mark).toBe(`Option ${f.b}`);
    expect(rb.totalMass).toBeNull();

    const parsed = Papa.parse<string[]>(scheduleCsv(rows).trim());
    expect(parsed.data[0]).toEqual([...SCHEDULE_CSV_FIELDS]);
    // every quantity column names its unit
    for (const h of ["mass_kg_per_m", "length_m", "total_mass_kg", "weld_throat_mm"]) expect(parsed.data[0]).toContain(h);
    const row = Object.fromEntries(parsed.data[0].map((h, i) => [h, parsed.data[1][i]]));
    expect(Number(row.total_mass_kg)).toBeCloseTo(1020, 9);
    expect(row.length_m).toBe("6");
    expect(row.count).toBe("4");
    expect(row.revision).toBe("A");
    expect(parsed.data[2][parsed.data[0].indexOf("total_mass_kg")]).toBe("");
  });

  test("the weld column of each basis: EN 1993 the throat a, AISC 360 the fillet leg w, both the engine's; allowable neither", async () => {
    const teamId = await ctx.teamId();
    const engineer = await ctx.user("engineer");
    const [projectId] = await db("projects").insert({ team_id: teamId, name: "Schedule weld fixture", created_by: engineer.id });
    const dims = { d: 300, b: 100, tf: 10, tw: 8 };
    const base = { ...CHANNEL_PROBLEM, allowable: undefined, moment: { sagging: 60, hogging: 0 }, shear: 120 };
    const en = parseSearchProblem({ ...base, basis: "en1993", steel: { grade: "S355" } });
    const us = parseSearchProblem({ ...base, basis: "aisc360", method: "LRFD", aisc: { grade: "A572 Gr 50" } });
    const cand = JSON.stringify({ family: "channel", dimensions: dims, area: 1, massPerMetre: 30, utilisation: 0.5, governing: "weld", rank: 1 });
    const ids: number[] = [];
    for (const problem of [en, us, CHANNEL_PROBLEM]) {
      const [id] = await db("options").insert({ project_id: projectId, candidate: cand, problem: JSON.stringify(problem), created_by: engineer.id });
      ids.push(Number(id));
    }
    const rows = await projectSchedule(Number(projectId));
    const [rEn, rUs, rAllow] = ids.map((id) => rows.find((r) => r.optionId === id)!);
    expect(rEn.weldThroat).toBe(candidateChecks("channel", dims, en).design!.weld!.a);
    expect(rEn.weldLeg).toBeNull();
    expect(rUs.weldLeg).toBe(candidateChecks("channel", dims, us).aisc!.weld!.w);
    expect(rUs.weldLeg).toBeGreaterThanOrEqual(5); // AISC 360-16 Table J2.4: the thinner part 8 mm (over 6 to 13 mm) takes at least a 5 mm leg (mem.)
    expect(rUs.weldThroat).toBeNull();
    expect(rAllow.weldThroat).toBeNull();
    expect(rAllow.weldLeg).toBeNull();
    const parsed = Papa.parse<string[]>(scheduleCsv([rEn, rUs]).trim());
    const col = (h: string) => parsed.data[0].indexOf(h);
    expect(parsed.data[1][col("weld_throat_mm")]).toBe(String(rEn.weldThroat));
    expect(parsed.data[1][col("weld_leg_mm")]).toBe("");
    expect(parsed.data[2][col("weld_leg_mm")]).toBe(String(rUs.weldLeg));
    expect(parsed.data[2][col("weld_throat_mm")]).toBe("");
  });

  test("the CSV route answers the viewer with the same rows, and another team gets 404", async () => {
    const f = await scheduleFixture();
    const mod = await loadRouteModule("routes/projects.$projectId.schedule[.]csv.ts");
    const res = await callRoute(mod.loader, await requestAs("viewer", `/projects/${f.projectId}/schedule.csv`), { projectId: String(f.projectId) });
    expect(res.status).toBe(200);
    const { otherTeam } = { otherTeam: await ctx.otherTeam() };
    const [foreign] = await db("projects").insert({ team_id: otherTeam.teamId, name: "Foreign", created_by: otherTeam.adminId });
    const res2 = await callRoute(mod.loader, await requestAs("viewer", `/projects/${foreign}/schedule.csv`), { projectId: String(foreign) });
    expect(res2.status).toBe(404);
  });
});

describe("plate cutting list", () => {
  test("a channel's three plates per member, grouped by thickness, masses by hand", async () => {
    const { cuttingList, cuttingListCsv, orderCuttingList, CUTTING_CSV_FIELDS } = await import("~/lib/cutting-list");
    const f = await scheduleFixture();
    const list = cuttingList(await projectSchedule(f.projectId));
    // channel d 300, b 100, tf 10, tw 8 as the engine lays it out: a full-depth web 8 × 300 and two
    // flange outstands 10 × (100 − 8) = 10 × 92; 6 m, 4 members; ρ = 7850 kg/m³
    expect(list.skipped).toBe(1);
    expect(list.groups.map((g) => g.thickness)).toEqual([8, 10]);
    const flange = list.groups[1].plates[0];
    expect([flange.width, flange.count]).toEqual([92, 8]);
    // flanges: 0.010 × 0.092 × 6 × 7850 × 8 = 346.656 kg; web: 0.008 × 0.300 × 6 × 7850 × 4 = 452.16 kg
    expect(list.groups[1].mass).toBeCloseTo(346.656, 6);
    expect(list.groups[0].plates[0].width).toBe(300);
    expect(list.totalMass).toBeCloseTo(346.656 + 452.16, 6);
    const csv = Papa.parse<string[]>(cuttingListCsv(orderCuttingList(list, [], [])).trim()).data;
    expect(csv[0]).toEqual([...CUTTING_CSV_FIELDS]);
    expect(csv).toHaveLength(3);
  });
});

describe("printable cutting list", () => {
  test("widths ordered from the team's stock list, priced, through the page and the CSV; another team's list is 404", async () => {
    const f = await scheduleFixture();
    const teamId = await ctx.teamId();
    const engineer = await ctx.user("engineer");
    const [stockId] = await db("stock_lists").insert({ team_id: teamId, name: "Cutting fixture stock", created_by: engineer.id });
    await db("stock_list_items").insert([
      { stock_list_id: stockId, thickness_mm: 10, width_mm: 190, price_per_kg: 1.5 },
      { stock_list_id: stockId, thickness_mm: 8, width_mm: 1000, price_per_kg: 1.2 },
    ]);
    const page = await loadRouteModule("routes/projects.$projectId.cutting-list.tsx");
    const params = { projectId: String(f.projectId) };
    const res = await callRoute(page.loader, await requestAs("viewer", `/projects/${f.projectId}/cutting-list?stock=${stockId}`), params);
    expect(res.status).toBe(200);
    const { list } = res.data as { list: { totalOrderMass: number; totalCost: number | null } };
    // flanges: 4 plates 10 × 190 × 6 m = 357.96 kg at 1.5; web: 2 plates 8 × 1000 × 6 m = 753.6 kg at 1.2 (hand calculation, tests/unit/cutting-order.test.ts)
    expect(list.totalOrderMass).toBeCloseTo(357.96 + 753.6, 6);
    expect(list.totalCost).toBeCloseTo(357.96 * 1.5 + 753.6 * 1.2, 6);

    const csvMod = await loadRouteModule("routes/projects.$projectId.cutting-list[.]csv.ts");
    const csv = await callRoute(csvMod.loader, await requestAs("viewer", `/projects/${f.projectId}/cutting-list.csv?stock=${stockId}`), params);
    const rows = Papa.parse<string[]>(String(csv.data).trim()).data;
    const web = Object.fromEntries(rows[0]!.map((h, i) => [h, rows[1]![i]]));
    expect([web.thickness_mm, web.order_width_mm, web.order_count, web.price_per_kg]).toEqual(["8", "1000", "2", "1.2"]);
    expect(Number(web.cost)).toBeCloseTo(904.32, 6);

    const { teamId: otherTeam, adminId } = await ctx.otherTeam();
    const [foreignStock] = await db("stock_lists").insert({ team_id: otherTeam, name: "Foreign stock", created_by: adminId });
    expect((await callRoute(page.loader, await requestAs("viewer", `/projects/${f.projectId}/cutting-list?stock=${foreignStock}`), params)).status).toBe(404);
    expect((await callRoute(csvMod.loader, await requestAs("viewer", `/projects/${f.projectId}/cutting-list.csv?stock=${foreignStock}`), params)).status).toBe(404);
    expect((await callRoute(page.loader, await requestAs("viewer", `/projects/${f.projectId}/cutting-list?stock=abc`), params)).status).toBe(400);
  });
});

// AISC 360-16 results through the routes (issue 14's gaps): a sweep on the AISC basis stores each
// candidate's figures in AISC terms (Chapter F section, Mn and its available strength Mn/Ωb or
// φb·Mn, the LTB zone with Lp, Lr and Cb, Vn, the weld leg, the governing limit state with its
// equation), the sweep page and the candidates API serve them, the CSV names each column with its
// unit and the method's symbol, and the sweep stores a restraint study over Lb, L/2 … L/6.
// Every figure is compared with the engine's own verdict (candidateChecks), not computed again.
import { afterAll, describe, expect, test } from "vitest";
import Papa from "papaparse";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { candidateChecks, searchProblemSchema, type SearchProblem, type SearchProblemInput } from "~/optimizer";
import type { Family } from "~/optimizer/geometry";
import { governingFlexure, type AiscRow } from "~/lib/design-summary";
import type { RestraintStudy } from "~/lib/restraint-study";
import { callRoute, FixtureContext, loadRouteModule, requestAs } from "./fixtures";
import { workflowFixture } from "./workflow-fixtures";

afterAll(() => closeDb());
const ctx = new FixtureContext();

// A mezzanine beam in US practice, given in SI as the engine takes it: 60 kip·ft = 81.35 kN·m,
// 25 kips = 111.2 kN, Lb = 20 ft = 6.096 m, Cb = 1.136 (F1-1, uniform load on a simple span),
// A572 Gr 50 plate; a coarse grid so the sweep and its study stay quick.
const beam = (method: "ASD" | "LRFD"): SearchProblemInput => ({
  basis: "aisc360",
  method,
  aisc: { grade: "A572 Gr 50" },
  restraint: { length: 6.096, Cb: 1.136 },
  moment: { sagging: 81.35 },
  shear: 111.2,
  depth: { min: 250, max: 450, step: 25 },
  width: { min: 100, max: 250, step: 25 },
  thicknesses: [8, 10, 12, 16, 20],
  families: ["i", "channel"],
});

async function aiscSweep(method: "ASD" | "LRFD"): Promise<{ sweepId: number; problem: SearchProblem }> {
  return ctx.once(`aisc-${method}`, async () => {
    const f = await workflowFixture(ctx);
    const engineer = await ctx.user("engineer");
    const problem = searchProblemSchema.parse(beam(method));
    const sweepId = await recordFinishedSweep(db, { teamId: await ctx.teamId(), ownerId: engineer.id, projectId: f.projectId, problem });
    return { sweepId, problem };
  });
}

/** The row the engine's verdict gives, figure by figure (SI: kN·m, kN, mm). */
function expectRowMatchesEngine(row: AiscRow, family: string, dims: Record<string, number>, problem: SearchProblem) {
  const v = candidateChecks(family as Family, dims, problem);
  const d = v.aisc!;
  const f = governingFlexure(d)!;
  expect(row.method).toBe(problem.method);
  expect(row.section).toBe(f.section);
  expect(row.Mn).toBeCloseTo(Math.min(f.MnLocal, f.ltb?.Mn ?? Infinity), 9);
  expect(row.MnAvailable).toBeCloseTo(Math.min(f.availableLocal, f.ltb?.available ?? Infinity), 9);
  // ASD: Mn/Ωb with Ωb = 1.67; LRFD: φb·Mn with φb = 0.90 (AISC 360-16 §F1)
  expect(row.MnAvailable! / row.Mn!).toBeCloseTo(problem.method === "ASD" ? 1 / 1.67 : 0.9, 9);
  expect(row.zone).toBe(f.ltb!.zone);
  expect(row.Lp).toBeCloseTo(f.ltb!.Lp!, 6);
  expect(row.Lr).toBeCloseTo(f.ltb!.Lr!, 6);
  expect(row.Cb).toBe(1.136);
  expect(row.Vn).toBeCloseTo(d.shear!.Vn, 9);
  expect(row.VnAvailable).toBeCloseTo(d.shear!.available, 9);
  expect(row.weldLeg).toBe(d.weld!.w);
  expect(v.governing).toBeDefined();
  return v;
}

describe("AISC 360 sweep: results in AISC terms", () => {
  test("stored rows, the sweep page's table and summary, and the candidates API carry the AISC figures", async () => {
    const { sweepId, problem } = await aiscSweep("ASD");
    const stored = await db("candidates").where({ sweep_id: sweepId }).orderBy("rank").select("rank", "family", "dimensions", "governing", "design");
    expect(stored.length).toBeGreaterThan(1);
    // every stored row has its figures with the results: no page view re-runs the checks
    for (const r of stored) expect(parseJson<AiscRow>(r.design).basis).toBe("aisc360");

    const page = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const res = await callRoute(page.loader, await requestAs("viewer", `/sweeps/${sweepId}`), { sweepId: String(sweepId) });
    expect(res.status).toBe(200);
    const loaded = res.data as { bestDesign: AiscRow | null; table: { itemsJson: string }; sweep: { best: { notes: string[] | null }; restraintStudy: RestraintStudy | null } };
    // the table's first page travels as one JSON text (sweep-page.server.ts, PageTable)
    const data = { ...loaded, table: { items: JSON.parse(loaded.table.itemsJson) as { rank: number; family: string; dimensions: Record<string, number>; governing: string; design: AiscRow | null }[] } };
    const best = data.table.items[0];
    expect(best.rank).toBe(1);
    expect(data.bestDesign).toEqual(best.design);
    const v = expectRowMatchesEngine(best.design!, best.family, best.dimensions, problem);
    // the engine's stated simplifications reach the page under this basis too
    expect(data.sweep.best.notes).toEqual(v.aisc!.notes);
    // the governing limit state carries its section or equation number and the clause names it
    for (const c of data.table.items) {
      const d = c.design!;
      expect(d.limitState.length).toBeGreaterThan(3);
      if (c.governing === "ltb") {
        expect(d.limitState).toBe("lateral-torsional buckling");
        // F2-2 in the inelastic zone, F2-3 (with F2-4) in the elastic one, and their F3 … F11 kin
        expect(d.equation).toMatch(/^F\d+-\d+/);
        expect(d.governingClause).toBe(`AISC 360-16 §${d.section}, Eq. ${d.equation}`);
      }
      if (c.governing === "bending-resistance") expect(d.equation).toMatch(/^F\d+-\d+/);
      if (c.governing === "shear-resistance" || c.governing === "shear-buckling") expect(d.equation).toMatch(/^G[234]-1/);
    }
    // a row with LTB governing in the inelastic zone reads F2-2 for the I (Lp < Lb ≤ Lr)
    const inelasticI = data.table.items.find((c) => c.family === "i" && c.governing === "ltb" && c.design!.zone === "inelastic" && c.design!.section === "F2");
    if (inelasticI) expect(inelasticI.design!.equation).toBe("F2-2");

    const api = await loadRouteModule("routes/api.v1.sweeps.$id.candidates.ts");
    const a = await callRoute(api.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}/candidates?page=1&pageSize=5`), { id: String(sweepId) });
    expect(a.status).toBe(200);
    const items = (a.data as { items: { rank: number; design: AiscRow | null }[] }).items;
    // the API rounds to 12 significant digits (plain numbers); the words are the page's
    const d0 = items[0].design!;
    expect({ ...d0, Mn: 0, MnAvailable: 0, Lp: 0, Lr: 0, Vn: 0, VnAvailable: 0 }).toEqual({ ...best.design!, Mn: 0, MnAvailable: 0, Lp: 0, Lr: 0, Vn: 0, VnAvailable: 0 });
    expect(d0.Mn).toBeCloseTo(best.design!.Mn!, 6);
    expect(d0.Lp).toBeCloseTo(best.design!.Lp!, 6);
  });

  test("CSV: AISC columns named with their units and the method's symbol, one cell per column, figures equal to the page's", async () => {
    for (const method of ["ASD", "LRFD"] as const) {
      const { sweepId, problem } = await aiscSweep(method);
      const csv = await loadRouteModule("routes/sweeps.$sweepId.candidates[.]csv.ts");
      const res = await callRoute(csv.loader, await requestAs("viewer", `/sweeps/${sweepId}/candidates.csv`), { sweepId: String(sweepId) });
      expect(res.status).toBe(200);
      const parsed = Papa.parse<Record<string, string>>(String(res.data).trim(), { header: true });
      const fields = parsed.meta.fields!;
      const avail = method === "ASD" ? ["Mn_over_Omega_b_kNm", "Vn_over_Omega_v_kN"] : ["phi_b_Mn_kNm", "phi_v_Vn_kN"];
      const design = ["method", "chapter_F_section", "Mn_kNm", avail[0], "ltb_zone", "Lp_m", "Lr_m", "Cb", "Vn_kN", avail[1], "weld_leg_mm", "governing_limit_state", "governing_equation", "governing_clause"];
      expect(fields.slice(-design.length)).toEqual(design);
      // no EN 1993 column and no allowable-basis column under this basis
      for (const en of ["class", "Mcr_kNm", "chiLT", "McRd_kNm", "MbRd_kNm", "VRd_kN", "weld_throat_mm", "basis"]) expect(fields).not.toContain(en);
      // every numeric column says its unit in its name (kN·m, kN, m, mm), Cb being a plain ratio
      for (const h of design.filter((x) => /Mn|Vn|L[pr]|weld/.test(x))) expect(h).toMatch(/_(kNm|kN|m|mm)$/);
      expect(parsed.errors).toEqual([]);
      const rows = parsed.data;
      expect(rows.length).toBeGreaterThan(1);
      for (const r of rows) expect(Object.keys(r)).toHaveLength(fields.length);
      const first = rows[0];
      const dims = Object.fromEntries(fields.filter((x) => x.endsWith("_mm") && x !== "weld_leg_mm").map((x) => [x.replace(/_mm$/, ""), Number(first[x])]).filter(([, x]) => Number.isFinite(x)));
      const v = candidateChecks(first.family as Family, dims, problem);
      const f = governingFlexure(v.aisc!)!;
      expect(first.method).toBe(method);
      expect(first.chapter_F_section).toBe(f.section);
      expect(Number(first.Mn_kNm)).toBeCloseTo(Math.min(f.MnLocal, f.ltb?.Mn ?? Infinity), 6);
      expect(Number(first[avail[0]])).toBeCloseTo(Math.min(f.availableLocal, f.ltb?.available ?? Infinity), 6);
      // Lp and Lr in metres: the engine's mm ÷ 1000
      expect(Number(first.Lp_m)).toBeCloseTo(f.ltb!.Lp! / 1000, 9);
      expect(Number(first.Lr_m)).toBeCloseTo(f.ltb!.Lr! / 1000, 9);
      expect(first.ltb_zone).toBe(f.ltb!.zone);
      expect(Number(first.Cb)).toBe(1.136);
      expect(Number(first.Vn_kN)).toBeCloseTo(v.aisc!.shear!.Vn, 6);
      expect(Number(first.weld_leg_mm)).toBe(v.aisc!.weld!.w);
      expect(first.governing_clause).toMatch(/^AISC 360-16/);
    }
  });

  test("the sweep stores a restraint study over Lb = L … L/6: Cb from the brief at L, 1.0 between braces; L is the sweep's own answer", async () => {
    const { sweepId } = await aiscSweep("ASD");
    const page = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const res = await callRoute(page.loader, await requestAs("viewer", `/sweeps/${sweepId}`), { sweepId: String(sweepId) });
    const { sweep } = res.data as { sweep: { best: { massPerMetre: number }; restraintStudy: RestraintStudy | null } };
    const study = sweep.restraintStudy!;
    expect(study.error).toBeUndefined();
    expect(study.points.map((p) => p.restraints)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(study.points.map((p) => p.lengthM)).toEqual([6.096, 3.048, 2.032, 1.524, 1.2192, 1.016]);
    expect(study.points.map((p) => p.Cb)).toEqual([1.136, 1, 1, 1, 1, 1]);
    expect(study.points.every((p) => p.C1 === undefined)).toBe(true);
    expect(study.points[0].best!.massPerMetre).toBeCloseTo(sweep.best.massPerMetre, 9);
    expect(study.points[5].best!.massPerMetre).toBeLessThan(study.points[0].best!.massPerMetre);
  });
});

// The sweep's stored candidates as CSV (SI units, named in the header), for spreadsheets, with
// the design figures of the brief's basis (EN 1993 or AISC 360 terms) where it has any.
import Papa from "papaparse";
import type { Route } from "./+types/sweeps.$sweepId.candidates[.]csv";
import { requirePermission } from "~/lib/auth.server";
import { notFound } from "~/lib/projects.server";
import { sweepCandidates } from "~/lib/sweep-page.server";
import { getTeamSweep } from "~/workers/queue.server";
import { idParam } from "~/lib/route-params";
import { plainNumbers } from "~/lib/plain-numbers";
import { isAiscRow, isEnRow, type AiscRow, type DesignRow, type En1993Row } from "~/lib/design-summary";
import type { SearchProblem } from "~/optimizer";

type Cell = string | number;
const blank = (x: number | null | undefined): Cell => (x == null ? "" : x);
const mToFile = (mm: number | null | undefined): Cell => (mm == null ? "" : mm / 1000);

/**
 * The design columns of a basis: each header (its unit in the name, SI as the file says) beside
 * the cell it fills, so the two cannot drift apart. EN 1993: member-checks.md §3. AISC 360-16
 * (issue 14): the Chapter F section, Mn and its available strength (Mn/Ωb under ASD, φb·Mn under
 * LRFD: the header says which), the LTB zone with Lp, Lr (m) and Cb, Vn and its available
 * strength, the weld leg, and the governing limit state with its equation.
 */
function csvDesignColumns(problem: Pick<SearchProblem, "basis" | "method">): [string, (d: DesignRow | null) => Cell][] {
  if (problem.basis === "en1993") {
    const en = (f: (d: En1993Row) => Cell) => (d: DesignRow | null) => (isEnRow(d) ? f(d) : "");
    return [
      ["class", en((d) => d.sectionClass)],
      ["Mcr_kNm", en((d) => blank(d.Mcr))],
      ["chiLT", en((d) => blank(d.chiLT))],
      ["McRd_kNm", en((d) => blank(d.McRd))],
      ["MbRd_kNm", en((d) => blank(d.MbRd))],
      ["VRd_kN", en((d) => blank(d.VRd))],
      ["weld_throat_mm", en((d) => blank(d.weldThroat))],
      ["governing_clause", en((d) => d.governingClause)],
    ];
  }
  if (problem.basis === "aisc360") {
    const asd = problem.method === "ASD";
    const us = (f: (d: AiscRow) => Cell) => (d: DesignRow | null) => (isAiscRow(d) ? f(d) : "");
    return [
      ["method", us((d) => d.method)],
      ["chapter_F_section", us((d) => d.section ?? "")],
      ["Mn_kNm", us((d) => blank(d.Mn))],
      [asd ? "Mn_over_Omega_b_kNm" : "phi_b_Mn_kNm", us((d) => blank(d.MnAvailable))],
      ["ltb_zone", us((d) => d.zone ?? (d.section ? "braced" : ""))],
      ["Lp_m", us((d) => mToFile(d.Lp))],
      ["Lr_m", us((d) => mToFile(d.Lr))],
      ["Cb", us((d) => blank(d.Cb))],
      ["Vn_kN", us((d) => blank(d.Vn))],
      [asd ? "Vn_over_Omega_v_kN" : "phi_v_Vn_kN", us((d) => blank(d.VnAvailable))],
      ["weld_leg_mm", us((d) => blank(d.weldLeg))],
      ["governing_limit_state", us((d) => d.limitState)],
      ["governing_equation", us((d) => d.equation)],
      ["governing_clause", us((d) => d.governingClause)],
    ];
  }
  return [["basis", () => "allowable stresses (stresses only: no stability checks)"]];
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const id = idParam(params.sweepId);
  const sweep = await getTeamSweep(id, user);
  if (!sweep) throw notFound("No such sweep in your team.");
  const rows = await sweepCandidates(sweep.id, sweep.problem);
  const dims = [...new Set(rows.flatMap((r) => Object.keys(r.dimensions)))];
  // Code bases add the engine's design figures, each column named with its unit; allowable ones say in a column that no stability was checked.
  const designColumns = csvDesignColumns(sweep.problem);
  const designFields = designColumns.map(([name]) => name);
  // a sweep that searched catalogues says which rows are rolled sections, and which
  const cat = sweep.catalogueResult != null;
  const csv = Papa.unparse({
    fields: ["rank", "family", ...(cat ? ["source", "designation", "catalogue"] : []), ...dims.map((d) => `${d}_mm`), "mass_kg_per_m", "utilisation", "governing", "on_front", "lightest_at_its_depth", ...designFields],
    // plain numbers: no float noise (13.624999999999998) in a spreadsheet's cells
    data: plainNumbers(rows.map((r) => [
      r.rank,
      r.family,
      ...(cat ? [r.source === "rolled" ? "rolled" : "welded", r.designation ?? "", r.catalogue ?? ""] : []),
      ...dims.map((d) => r.dimensions[d] ?? ""),
      r.massPerMetre,
      r.utilisation,
      r.governing,
      r.onFront ? "yes" : "no",
      // its family's lightest at its depth (issue 11, item 9), so a spreadsheet filters by depth too
      r.depthBest ? "yes" : "no",
      ...designColumns.map(([, cell]) => cell(r.design ?? null)),
    ])),
  });
  return new Response(csv + "\n", {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="sweep-${sweep.id}-candidates.csv"`, "Cache-Control": "no-store" },
  });
}

// The sweep's stored candidates as CSV (SI units, named in the header), for spreadsheets.
import Papa from "papaparse";
import type { Route } from "./+types/sweeps.$sweepId.candidates[.]csv";
import { requirePermission } from "~/lib/auth.server";
import { notFound } from "~/lib/projects.server";
import { sweepCandidates } from "~/lib/sweep-page.server";
import { getTeamSweep } from "~/workers/queue.server";
import { idParam } from "~/lib/route-params";
import { plainNumbers } from "~/lib/plain-numbers";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const id = idParam(params.sweepId);
  const sweep = await getTeamSweep(id, user);
  if (!sweep) throw notFound("No such sweep in your team.");
  const rows = await sweepCandidates(sweep.id, sweep.problem);
  const dims = [...new Set(rows.flatMap((r) => Object.keys(r.dimensions)))];
  // EN 1993 sweeps add the engine's design figures; allowable ones say in a column that no stability was checked.
  const en = sweep.problem.basis === "en1993";
  const designFields = en ? ["class", "Mcr_kNm", "chiLT", "McRd_kNm", "MbRd_kNm", "VRd_kN", "weld_throat_mm", "governing_clause"] : ["basis"];
  const blank = (x: number | null | undefined) => (x == null ? "" : x);
  // a sweep that searched catalogues says which rows are rolled sections, and which
  const cat = sweep.catalogueResult != null;
  const csv = Papa.unparse({
    fields: ["rank", "family", ...(cat ? ["source", "designation", "catalogue"] : []), ...dims.map((d) => `${d}_mm`), "mass_kg_per_m", "utilisation", "governing", "on_front", ...designFields],
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
      ...(en
        ? [r.design?.sectionClass ?? "", blank(r.design?.Mcr), blank(r.design?.chiLT), blank(r.design?.McRd), blank(r.design?.MbRd), blank(r.design?.VRd), blank(r.design?.weldThroat), r.design?.governingClause ?? ""]
        : ["allowable stresses (stresses only: no stability checks)"]),
    ])),
  });
  return new Response(csv + "\n", {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="sweep-${sweep.id}-candidates.csv"`, "Cache-Control": "no-store" },
  });
}

// The sweep's stored candidates as CSV (SI units, named in the header), for spreadsheets.
import Papa from "papaparse";
import type { Route } from "./+types/sweeps.$sweepId.candidates[.]csv";
import { requirePermission } from "~/lib/auth.server";
import { notFound } from "~/lib/projects.server";
import { sweepCandidates } from "~/lib/sweep-page.server";
import { getTeamSweep } from "~/workers/queue.server";
import { idParam } from "~/lib/route-params";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const id = idParam(params.sweepId);
  const sweep = await getTeamSweep(id, user);
  if (!sweep) throw notFound("No such sweep in your team.");
  const rows = await sweepCandidates(sweep.id);
  const dims = [...new Set(rows.flatMap((r) => Object.keys(r.dimensions)))];
  const csv = Papa.unparse({
    fields: ["rank", "family", ...dims.map((d) => `${d}_mm`), "mass_kg_per_m", "utilisation", "governing", "on_front"],
    data: rows.map((r) => [r.rank, r.family, ...dims.map((d) => r.dimensions[d] ?? ""), r.massPerMetre, r.utilisation, r.governing, r.onFront ? "yes" : "no"]),
  });
  return new Response(csv + "\n", {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="sweep-${sweep.id}-candidates.csv"`, "Cache-Control": "no-store" },
  });
}

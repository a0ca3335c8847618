import { Link } from "react-router";
import type { Route } from "./+types/projects.$projectId.schedule";
import { requirePermission } from "~/lib/auth.server";
import { getProject } from "~/lib/projects.server";
import { idParam } from "~/lib/route-params";
import { projectSchedule } from "~/lib/schedule.server";
import { formatNumber } from "~/lib/format";
import { ReviewBadge } from "~/components/ReviewBadge";
import { TableScroll } from "~/components/DataTable";

export function meta({ data }: Route.MetaArgs) {
  return [{ title: `Member schedule · ${data?.project.name ?? ""} · Sparwise` }];
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const project = await getProject(user.teamId, idParam(params.projectId));
  return { project: { id: project.id, name: project.name }, rows: await projectSchedule(project.id) };
}

export default function Schedule({ loaderData }: Route.ComponentProps) {
  const { project, rows } = loaderData;
  const total = rows.reduce((a, r) => a + (r.totalMass ?? 0), 0);
  const f = (x: number | null, sig = 4) => (x == null ? "—" : formatNumber(x, sig));
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-2xl font-bold">Member schedule — {project.name}</h1>
        <div className="no-print flex gap-3 text-sm">
          <Link to={`/projects/${project.id}`} className="text-accent underline">
            Back to the project
          </Link>
          <a href={`/projects/${project.id}/schedule.csv`} download className="text-accent underline">
            Download CSV
          </a>
          <Link to={`/projects/${project.id}/cutting-list`} className="text-accent underline">
            Plate cutting list
          </Link>
          <a href={`/projects/${project.id}/cutting-list.csv`} download className="text-accent underline">
            Plate cutting list (CSV)
          </a>
        </div>
      </div>
      {rows.length === 0 ? (
        <p className="text-sm">No options are saved in this project yet.</p>
      ) : (
        <TableScroll>
        <table className="w-full border-collapse text-sm" data-testid="schedule">
          <thead>
            <tr className="border-b border-ink/40 text-left">
              <th className="py-1 pr-2">Mark</th>
              <th className="pr-2">Option</th>
              <th className="pr-2">Section</th>
              <th className="pr-2 text-right">Mass (kg/m)</th>
              <th className="pr-2 text-right">Length (m) × count</th>
              <th className="pr-2 text-right">Total mass (kg)</th>
              <th className="pr-2 text-right">Weld throat a (mm)</th>
              <th className="pr-2 text-right">Fillet leg w (mm)</th>
              <th className="pr-2">Review</th>
              <th>Revision</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.optionId} className="border-b border-ink/15">
                <td className="py-1 pr-2">{r.mark}</td>
                <td className="pr-2">
                  <Link to={`/options/${r.optionId}`} className="text-accent underline">
                    {r.optionId}
                  </Link>
                </td>
                <td className="pr-2">{r.section}</td>
                <td className="pr-2 text-right">{f(r.massPerMetre)}</td>
                <td className="pr-2 text-right">
                  {f(r.lengthM)} × {r.count ?? "—"}
                </td>
                <td className="pr-2 text-right">{f(r.totalMass)}</td>
                <td className="pr-2 text-right">{f(r.weldThroat, 3)}</td>
                <td className="pr-2 text-right">{f(r.weldLeg, 3)}</td>
                <td className="pr-2">
                  <ReviewBadge state={r.reviewState} />
                </td>
                <td>
                  <Link to={`/options/${r.optionId}/record`} className="text-accent underline">
                    {r.revision}
                  </Link>
                </td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="font-semibold">
              <td colSpan={5} className="py-1 pr-2 text-right">
                Total (members with a length and count)
              </td>
              <td className="pr-2 text-right" data-testid="schedule-total">
                {formatNumber(total, 5)}
              </td>
              <td colSpan={3} />
            </tr>
          </tfoot>
        </table>
        </TableScroll>
      )}
    </div>
  );
}

// The project's member schedule as CSV (SI units named in the header).
import type { Route } from "./+types/projects.$projectId.schedule[.]csv";
import { requirePermission } from "~/lib/auth.server";
import { getProject } from "~/lib/projects.server";
import { idParam } from "~/lib/route-params";
import { projectSchedule, scheduleCsv } from "~/lib/schedule.server";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const project = await getProject(user.teamId, idParam(params.projectId));
  const csv = scheduleCsv(await projectSchedule(project.id));
  return new Response(csv, {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="project-${project.id}-schedule.csv"`, "Cache-Control": "no-store" },
  });
}

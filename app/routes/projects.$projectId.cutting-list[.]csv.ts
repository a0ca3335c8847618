// The project's plate cutting list as CSV (units in the header), from the member schedule.
import type { Route } from "./+types/projects.$projectId.cutting-list[.]csv";
import { requirePermission } from "~/lib/auth.server";
import { getProject } from "~/lib/projects.server";
import { idParam } from "~/lib/route-params";
import { projectSchedule } from "~/lib/schedule.server";
import { cuttingList, cuttingListCsv } from "~/lib/cutting-list";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const project = await getProject(user.teamId, idParam(params.projectId));
  const csv = cuttingListCsv(cuttingList(await projectSchedule(project.id)));
  return new Response(csv, {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="project-${project.id}-cutting-list.csv"`, "Cache-Control": "no-store" },
  });
}

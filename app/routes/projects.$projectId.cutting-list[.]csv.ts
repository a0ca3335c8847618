// The project's plate cutting list as CSV (units in the header), from the member schedule, with
// the widths ordered and cost as the printable page shows them (?stock=ID chooses the stock list).
import type { Route } from "./+types/projects.$projectId.cutting-list[.]csv";
import { requirePermission } from "~/lib/auth.server";
import { idParam } from "~/lib/route-params";
import { projectCuttingList } from "~/lib/cutting-list.server";
import { cuttingListCsv, cuttingListQuery } from "~/lib/cutting-list";

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const q = cuttingListQuery.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!q.success) throw new Response(q.error.issues[0]!.message, { status: 400, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  const { project, list, currency } = await projectCuttingList(user.teamId, idParam(params.projectId), q.data.stock);
  return new Response(cuttingListCsv(list, currency), {
    headers: { "Content-Type": "text/csv; charset=utf-8", "Content-Disposition": `attachment; filename="project-${project.id}-cutting-list.csv"`, "Cache-Control": "no-store" },
  });
}

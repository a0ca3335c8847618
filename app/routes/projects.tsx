import { Link } from "react-router";
import type { Route } from "./+types/projects";
import { requirePermission } from "~/lib/auth.server";
import { listProjects } from "~/lib/projects.server";
import { can } from "~/lib/roles";
import { TableScroll } from "~/components/DataTable";

export function meta() {
  return [{ title: "Projects · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const archived = new URL(request.url).searchParams.get("archived") === "1";
  return { projects: await listProjects(user.teamId, { archived }), archived, canCreate: can(user.role, "createProject") };
}

export default function Projects({ loaderData }: Route.ComponentProps) {
  const { projects, archived, canCreate } = loaderData;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">{archived ? "Archived projects" : "Projects"}</h1>
        <div className="flex gap-3 text-sm">
          <Link className="text-accent underline" to={archived ? "/projects" : "/projects?archived=1"}>
            {archived ? "Current projects" : "Archived projects"}
          </Link>
          <Link className="text-accent underline" to="/stock-lists">
            Stock lists
          </Link>
          {canCreate ? (
            <Link to="/projects/new" className="rounded-md bg-accent px-3 py-1.5 font-semibold text-white">
              New project
            </Link>
          ) : null}
        </div>
      </div>
      {projects.length === 0 ? (
        <p className="text-ink/70">No {archived ? "archived " : ""}projects yet.</p>
      ) : (
        <TableScroll>
        <table className="w-full border-collapse bg-white text-sm">
          <thead>
            <tr className="border-b border-ink/30 text-left">
              <th className="p-2">Project</th>
              <th className="p-2">Client</th>
              <th className="p-2 text-right">Briefs</th>
              <th className="p-2 text-right">Options</th>
              <th className="p-2 text-right">Waiting for review</th>
            </tr>
          </thead>
          <tbody>
            {projects.map((p) => (
              <tr key={p.id} className="border-b border-ink/10">
                <td className="p-2">
                  <Link className="font-semibold text-accent underline" to={`/projects/${p.id}`}>
                    {p.name}
                  </Link>
                </td>
                <td className="p-2">{p.client ?? "—"}</td>
                <td className="p-2 text-right tabular-nums">{p.briefs}</td>
                <td className="p-2 text-right tabular-nums">{p.options}</td>
                <td className="p-2 text-right tabular-nums">{p.inReview}</td>
              </tr>
            ))}
          </tbody>
        </table>
        </TableScroll>
      )}
    </div>
  );
}

import { Link } from "react-router";
import type { Route } from "./+types/projects.$projectId.briefs.new";
import { requirePermission } from "~/lib/auth.server";
import { getProject } from "~/lib/projects.server";
import { newBriefFormDefaults } from "~/lib/brief-form";
import { listStockLists } from "~/lib/stock-lists.server";
import { listMaterials } from "~/lib/materials.server";
import { submitBrief } from "~/lib/brief-actions.server";
import { BriefEditor } from "~/components/BriefEditor";
import { idParam } from "~/lib/route-params";
import { listCatalogueChoices } from "~/lib/brief-catalogues.server";

export function meta() {
  return [{ title: "New brief · Sparwise" }];
}


export async function loader({ request, params }: Route.LoaderArgs) {
  // Another team's project is a 404 whatever the role, so look it up before the permission.
  const user = await requirePermission(request, "read");
  const project = await getProject(user.teamId, idParam(params.projectId));
  await requirePermission(request, "editBrief");
  const units = new URL(request.url).searchParams.get("units") === "us" ? "us" : "si";
  return {
    project: { id: project.id, name: project.name },
    defaults: newBriefFormDefaults(units),
    stockLists: await listStockLists(user.teamId),
    teamMaterials: await listMaterials(user.teamId),
    catalogues: await listCatalogueChoices(user.teamId),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requirePermission(request, "editBrief");
  const project = await getProject(user.teamId, idParam(params.projectId));
  return submitBrief(request, user, { projectId: project.id });
}

export default function NewBrief({ loaderData, actionData }: Route.ComponentProps) {
  const { project, defaults, stockLists, teamMaterials, catalogues } = loaderData;
  return (
    <div className="space-y-4">
      <p className="text-sm">
        <Link to={`/projects/${project.id}`} className="text-accent underline">
          {project.name}
        </Link>
      </p>
      <h1 className="text-2xl font-bold">New brief</h1>
      <BriefEditor defaultValue={defaults} lastResult={actionData?.result} stockLists={stockLists} teamMaterials={teamMaterials} catalogues={{ options: catalogues, chosen: [] }} />
    </div>
  );
}

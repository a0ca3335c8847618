import { Link } from "react-router";
import { sweepNo } from "~/lib/numbering";
import { projectNumbers } from "~/lib/numbering.server";
import type { Route } from "./+types/briefs.$briefId";
import { requirePermission } from "~/lib/auth.server";
import { getBrief, getProject } from "~/lib/projects.server";
import { problemToFormDefaults } from "~/lib/brief-form";
import { listStockLists } from "~/lib/stock-lists.server";
import { listMaterials } from "~/lib/materials.server";
import { submitBrief } from "~/lib/brief-actions.server";
import { db } from "~/lib/db.server";
import { can } from "~/lib/roles";
import { BriefEditor } from "~/components/BriefEditor";
import { listCatalogueChoices } from "~/lib/brief-catalogues.server";
import { Notice } from "~/components/ui";
import { BriefSummary } from "~/components/BriefSummary";
import { idParam } from "~/lib/route-params";

export function meta({ data }: Route.MetaArgs) {
  return [{ title: `${data?.brief.name ?? "Brief"} · Sparwise` }];
}


export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const brief = await getBrief(user.teamId, idParam(params.briefId));
  const project = await getProject(user.teamId, brief.projectId);
  const sweeps = await db("sweeps").where({ brief_id: brief.id }).orderBy("id", "desc").limit(20).select("id", "status", "recheck_of", "created_at");
  return {
    brief: { id: brief.id, name: brief.name, units: brief.units },
    problem: brief.problem,
    project: { id: project.id, name: project.name },
    defaults: problemToFormDefaults(brief.problem, {
      units: brief.units,
      name: brief.name,
      memberLengthM: brief.memberLengthM ?? undefined,
      memberCount: brief.memberCount ?? undefined,
      material: brief.material ?? undefined,
      elasticModulus: brief.elasticModulus ?? undefined,
    }),
    stockLists: await listStockLists(user.teamId),
    teamMaterials: await listMaterials(user.teamId),
    catalogues: await listCatalogueChoices(user.teamId),
    sweeps: sweeps.map((s) => ({ id: s.id as number, status: s.status as string, recheckOf: s.recheck_of as number | null, at: new Date(s.created_at).toISOString() })),
    numbers: await projectNumbers({ sweeps: sweeps.flatMap((s) => [s.id as number, s.recheck_of as number | null]) }),
    mayEdit: can(user.role, "editBrief"),
    saved: new URL(request.url).searchParams.get("saved") === "1",
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requirePermission(request, "editBrief");
  const brief = await getBrief(user.teamId, idParam(params.briefId));
  return submitBrief(request, user, { projectId: brief.projectId, briefId: brief.id });
}

export default function BriefPage({ loaderData, actionData }: Route.ComponentProps) {
  const { brief, problem, project, defaults, stockLists, teamMaterials, sweeps, mayEdit, saved, numbers, catalogues } = loaderData;
  return (
    <div className="space-y-4">
      <p className="text-sm">
        <Link to={`/projects/${project.id}`} className="text-accent underline">
          {project.name}
        </Link>
      </p>
      <h1 className="text-2xl font-bold">Brief: {brief.name}</h1>
      {saved ? <Notice message="Brief saved." /> : null}
      {sweeps.length ? (
        <p className="text-sm">
          Sweeps of this brief:{" "}
          {sweeps.map((s, i) => (
            <span key={s.id}>
              {i ? ", " : ""}
              <Link to={`/sweeps/${s.id}`} className="text-accent underline">
                {sweepNo(numbers, s.id)}
              </Link>{" "}
              ({s.status}
              {s.recheckOf ? `, recheck of ${sweepNo(numbers, s.recheckOf)}` : ""})
            </span>
          ))}
        </p>
      ) : null}
      {mayEdit ? (
        <BriefEditor
          defaultValue={defaults}
          lastResult={actionData?.result}
          stockLists={stockLists}
          teamMaterials={teamMaterials}
          catalogues={{ options: catalogues, chosen: (problem.catalogues ?? []).map((c) => c.name), shapes: problem.catalogues?.[0]?.shapes }}
        />
      ) : (
        <div className="max-w-2xl space-y-2">
          <p className="text-sm text-ink/70">Your role may read this brief but not edit it. Open one of its sweeps to recheck it.</p>
          <BriefSummary problem={problem} units={brief.units} />
        </div>
      )}
    </div>
  );
}

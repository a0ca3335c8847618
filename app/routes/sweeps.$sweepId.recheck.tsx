import { Link, redirect } from "react-router";
import { projectNumbers } from "~/lib/numbering.server";
import { sweepNo } from "~/lib/numbering";
import { parseWithZod } from "@conform-to/zod/v4";
import type { Route } from "./+types/sweeps.$sweepId.recheck";
import { requirePermission } from "~/lib/auth.server";
import { readForm } from "~/lib/forms.server";
import { briefFormSchema, problemToFormDefaults } from "~/lib/brief-form";
import { notFound } from "~/lib/projects.server";
import { listStockLists } from "~/lib/stock-lists.server";
import { listMaterials } from "~/lib/materials.server";
import { startRecheck } from "~/lib/recheck.server";
import { queueErrorMessage } from "~/lib/brief-actions.server";
import { db } from "~/lib/db.server";
import { getTeamSweep } from "~/workers/queue.server";
import { BriefEditor } from "~/components/BriefEditor";
import { formFailure } from "~/lib/form-reply.server";
import type { UnitSystem } from "~/optimizer/units";
import { idParam } from "~/lib/route-params";
import { listCatalogueChoices, withBriefCatalogues } from "~/lib/brief-catalogues.server";

export function meta() {
  return [{ title: "Recheck · Sparwise" }];
}


export async function loader({ request, params }: Route.LoaderArgs) {
  // Another team's sweep is a 404 whatever the role, so look it up before the permission.
  const user = await requirePermission(request, "read");
  const sweep = await getTeamSweep(idParam(params.sweepId), user);
  if (!sweep) throw notFound("No such sweep in your team.");
  await requirePermission(request, "recheck");
  const brief = sweep.briefId ? await db("briefs").where({ id: sweep.briefId }).first("name", "units", "member_length_m", "member_count", "material", "elastic_modulus_mpa") : null;
  const units: UnitSystem = brief?.units === "us" ? "us" : "si";
  const no = sweepNo(await projectNumbers({ sweeps: [sweep.id] }), sweep.id);
  const name = `Recheck of sweep ${no}${brief ? ` (${brief.name})` : ""}`.slice(0, 160);
  // The member and material as the original sweep ran (older sweeps kept no member: the brief's).
  const defaults = problemToFormDefaults(sweep.problem, {
    units,
    name,
    memberLengthM: sweep.member.lengthM ?? brief?.member_length_m ?? undefined,
    memberCount: sweep.member.count ?? brief?.member_count ?? undefined,
    material: brief?.material ?? undefined,
    elasticModulus: brief?.elastic_modulus_mpa ?? undefined,
  });
  // the catalogues the original searched, offered as it searched them (brief-catalogues.server.ts)
  const catalogues = {
    options: await listCatalogueChoices(user.teamId),
    chosen: [] as string[],
    shapes: sweep.problem.catalogues?.[0]?.shapes,
    kept: (sweep.problem.catalogues ?? []).map((c) => ({ name: c.name, sections: c.sections.length })),
  };
  return { sweepId: sweep.id, sweepNo: no, defaults, original: defaults, stockLists: await listStockLists(user.teamId), teamMaterials: await listMaterials(user.teamId), catalogues };
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requirePermission(request, "recheck");
  const original = await getTeamSweep(idParam(params.sweepId), user);
  if (!original) throw notFound("No such sweep in your team.");
  const form = await readForm(request);
  const submission = parseWithZod(form, { schema: briefFormSchema });
  if (submission.status !== "success") return formFailure(submission);
  // the original's catalogues (as searched) and costs carry over unless the form changes them
  const extended = await withBriefCatalogues(form, user.teamId, submission.value.problem, original.problem);
  if (!extended.ok) return formFailure(submission, 400, [extended.message]);
  try {
    const { meta } = submission.value;
    const id = await startRecheck(user, original.id, extended.problem, { lengthM: meta.memberLengthM, count: meta.memberCount });
    throw redirect(`/sweeps/${id}`);
  } catch (e) {
    const msg = await queueErrorMessage(e);
    if (msg) return formFailure(submission, (e as Response).status, [`The recheck did not start: ${msg}`]);
    throw e;
  }
}

export default function Recheck({ loaderData, actionData }: Route.ComponentProps) {
  const { sweepId, sweepNo: no, defaults, original, stockLists, teamMaterials, catalogues } = loaderData;
  return (
    <div className="space-y-4">
      <p className="text-sm">
        <Link to={`/sweeps/${sweepId}`} className="text-accent underline">
          Sweep {no}
        </Link>
      </p>
      <h1 className="text-2xl font-bold">Recheck sweep {no}</h1>
      <p className="max-w-3xl text-sm">
        Every value of the original brief is below and editable. Running it starts a new sweep linked to sweep {no}; the original and its brief stay as they were. When it finishes, its
        page links to the comparison.
      </p>
      <BriefEditor defaultValue={defaults} original={original} lastResult={actionData?.result} stockLists={stockLists} teamMaterials={teamMaterials} allowSave={false} runLabel="Run recheck" catalogues={catalogues} />
    </div>
  );
}

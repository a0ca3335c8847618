import { Form, Link, data } from "react-router";
import { StaleApproval } from "~/components/ReviewBadge";
import { optionNo, sweepNo } from "~/lib/numbering";
import { projectNumbers } from "~/lib/numbering.server";
import { familyLabel } from "~/lib/labels";
import { parseWithZod } from "@conform-to/zod/v4";
import { z } from "zod";
import type { Route } from "./+types/projects.$projectId";
import { requirePermission } from "~/lib/auth.server";
import { readForm } from "~/lib/forms.server";
import { addMember, getProject, listBriefs, projectActivity, projectMembers, removeMember, setArchived, teamMembersOutside, updateProject } from "~/lib/projects.server";
import { projectFormSchema } from "~/lib/project-form";
import { ACTIVITY_WORDS, SUBJECT_WORDS, subjectHref } from "~/lib/activity-words";
import { listProjectOptions } from "~/lib/options.server";
import { can } from "~/lib/roles";
import { ProjectFields } from "~/components/ProjectFields";
import { formFailure } from "~/lib/form-reply.server";
import { ReviewBadge } from "~/components/ReviewBadge";
import { formatQuantity } from "~/components/PropertyTable";
import { listSavedSections } from "~/lib/saved-sections.server";
import { benchHref } from "~/lib/bench-state";
import { idParam } from "~/lib/route-params";
import { parseRationaliseQuery, rationaliseProject, RATIONALISE_CANDIDATES_PER_BRIEF } from "~/lib/rationalise.server";
import { RationalisePanel } from "~/components/RationalisePanel";
import { TableScroll } from "~/components/DataTable";

export function meta({ data }: Route.MetaArgs) {
  return [{ title: `${data?.project.name ?? "Project"} · Sparwise` }];
}

const dateOnly = (at: string) => {
  const d = new Date(at);
  return Number.isNaN(d.getTime()) ? at : d.toISOString().slice(0, 10);
};


export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const project = await getProject(user.teamId, idParam(params.projectId));
  const [briefs, options, savedSections, members, outside, activity] = await Promise.all([
    listBriefs(project.id),
    listProjectOptions(project.id),
    listSavedSections(project.id),
    projectMembers(project.id),
    can(user.role, "createProject") ? teamMembersOutside(user.teamId, project.id) : Promise.resolve([]),
    projectActivity(project.id),
  ]);
  // Rationalisation runs only when asked (?k=…): it is a read-only integer program, in the URL so a
  // result can be shared; a bad k or m answers 400 with the field's message and the page still renders.
  const sp = new URL(request.url).searchParams;
  const asked = sp.has("k") || sp.has("m");
  const q = asked ? parseRationaliseQuery(sp) : null;
  const rationalisation = {
    form: { k: sp.get("k")?.slice(0, 20) ?? "3", m: sp.get("m")?.slice(0, 20) ?? "" },
    errors: q && !q.ok ? q.errors : null,
    result: q?.ok ? await rationaliseProject(project.id, q.query) : null,
    perBrief: RATIONALISE_CANDIDATES_PER_BRIEF,
  };
  const numbers = await projectNumbers({ sweeps: briefs.map((b) => b.lastSweepId), options: options.map((o) => o.id) });
  return data({
    project: { id: project.id, name: project.name, client: project.client, jobNumber: project.job_number, description: project.description, archived: project.archived_at != null },
    briefs,
    options,
    numbers,
    savedSections: savedSections.map((x) => ({ id: x.id, name: x.name, by: x.createdByName, on: dateOnly(x.createdAt), href: benchHref(x.section, x.units) })),
    members,
    outside,
    activity,
    may: { edit: can(user.role, "createProject"), brief: can(user.role, "editBrief") },
    rationalisation,
  }, { status: q && !q.ok ? 400 : 200 });
}

const memberSchema = z.object({ userId: z.coerce.number({ error: "userId must be a number" }).int().positive("userId: choose a member") });

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requirePermission(request, "createProject");
  const id = idParam(params.projectId);
  await getProject(user.teamId, id);
  const form = await readForm(request);
  const intent = String(form.get("intent") ?? "");
  if (intent === "edit") {
    const submission = parseWithZod(form, { schema: projectFormSchema });
    if (submission.status !== "success") return formFailure(submission);
    await updateProject(user.teamId, user.id, id, submission.value);
    return { result: submission.reply(), error: null };
  }
  if (intent === "archive" || intent === "restore") {
    await setArchived(user.teamId, user.id, id, intent === "archive");
    return { result: null, error: null };
  }
  if (intent === "addMember" || intent === "removeMember") {
    const m = memberSchema.safeParse({ userId: form.get("userId") ?? undefined });
    if (!m.success) return data({ result: null, error: m.error.issues[0].message }, { status: 400 });
    if (intent === "removeMember") await removeMember(user.teamId, user.id, id, m.data.userId);
    else {
      const err = await addMember(user.teamId, user.id, id, m.data.userId);
      if (err) return data({ result: null, error: err }, { status: 400 });
    }
    return { result: null, error: null };
  }
  return data({ result: null, error: `intent: unknown action "${intent.slice(0, 30)}"` }, { status: 400 });
}

export default function ProjectPage({ loaderData, actionData }: Route.ComponentProps) {
  const { project, briefs, options, savedSections, members, outside, activity, may, rationalisation, numbers } = loaderData;
  return (
    <div className="space-y-8">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-sm">
            <Link to="/projects" className="text-accent underline">
              Projects
            </Link>
          </p>
          <h1 className="text-2xl font-bold">
            {project.name} {project.archived ? <span className="text-base font-normal text-ink/70">(archived)</span> : null}
          </h1>
          {project.client ? <p className="text-ink/80">Client: {project.client}</p> : null}
          {project.jobNumber ? <p className="text-ink/80">Job number: {project.jobNumber}</p> : null}
          {project.description ? <p className="mt-1 max-w-2xl text-sm">{project.description}</p> : null}
          <p className="mt-1 text-sm">
            <Link to={`/projects/${project.id}/schedule`} className="text-accent underline">
              Member schedule
            </Link>
            {" · "}
            <Link to={`/projects/${project.id}/cutting-list`} className="text-accent underline">
              Plate cutting list
            </Link>
          </p>
        </div>
        {may.brief && !project.archived ? (
          <Link to={`/projects/${project.id}/briefs/new`} className="rounded-md bg-accent px-4 py-2 text-sm font-semibold text-white">
            New brief
          </Link>
        ) : null}
      </div>
      {actionData && "error" in actionData && actionData.error ? (
        <p role="alert" className="rounded-md border border-red-800 bg-red-50 px-3 py-2 text-sm font-semibold text-red-900">
          {actionData.error}
        </p>
      ) : null}

      <section aria-labelledby="briefs-h">
        <h2 id="briefs-h" className="text-lg font-bold">
          Briefs
        </h2>
        {briefs.length === 0 ? (
          <p className="text-ink/70">No briefs yet.</p>
        ) : (
          <ul className="mt-2 divide-y divide-ink/10 rounded-lg border border-ink/15 bg-white">
            {briefs.map((b) => (
              <li key={b.id} className="flex flex-wrap items-center justify-between gap-2 p-3">
                <Link to={`/briefs/${b.id}`} className="font-semibold text-accent underline">
                  {b.name}
                </Link>
                <span className="text-sm text-ink/70">
                  {b.author ?? "—"} · {b.units === "us" ? "US customary" : "SI"}
                  {b.lastSweepId ? (
                    <>
                      {" · "}
                      <Link to={`/sweeps/${b.lastSweepId}`} className="text-accent underline">
                        sweep {sweepNo(numbers, b.lastSweepId)} ({b.lastSweepStatus})
                      </Link>
                    </>
                  ) : null}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="options-h">
        <h2 id="options-h" className="text-lg font-bold">
          Options
        </h2>
        {options.length === 0 ? (
          <p className="text-ink/70">No options saved yet. Save one from a sweep's results.</p>
        ) : (
          <TableScroll>
          <table className="mt-2 w-full border-collapse bg-white text-sm">
            <thead>
              <tr className="border-b border-ink/30 text-left">
                <th className="p-2">Option</th>
                <th className="p-2">Brief and member</th>
                <th className="p-2">Section (mm)</th>
                <th className="p-2 text-right">Mass</th>
                <th className="p-2 text-right">Utilisation</th>
                <th className="p-2">Review</th>
              </tr>
            </thead>
            <tbody>
              {options.map((o) => (
                <tr key={o.id} className="border-b border-ink/10">
                  <td className="p-2">
                    <Link to={`/options/${o.id}`} className="font-semibold text-accent underline">
                      Option {optionNo(numbers, o.id)}
                    </Link>
                    {o.note ? <span className="block text-xs text-ink/70">{o.note}</span> : null}
                  </td>
                  <td className="p-2">
                    {o.briefId ? (
                      <Link to={`/briefs/${o.briefId}`} className="text-accent underline">
                        {o.briefName}
                      </Link>
                    ) : (
                      "—"
                    )}
                    <span className="block text-xs text-ink/70">
                      {o.memberLengthM ? `${o.memberCount ?? 1} × ${formatQuantity("span", o.memberLengthM, "si")}` : "member length not given"}
                    </span>
                  </td>
                  <td className="p-2">
                    {familyLabel(o.family)}{" "}
                    {Object.entries(o.dimensions)
                      .map(([k, v]) => `${k} ${v}`)
                      .join(", ")}
                  </td>
                  <td className="p-2 text-right tabular-nums">{formatQuantity("massPerLength", o.massPerMetre, "si")}</td>
                  <td className="p-2 text-right tabular-nums">{o.utilisation.toFixed(3)}</td>
                  <td className="p-2">
                    <ReviewBadge state={o.reviewState} />
                    {o.approvalStale ? <StaleApproval /> : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          </TableScroll>
        )}
      </section>

      <section aria-labelledby="saved-h">
        <h2 id="saved-h" className="text-lg font-bold">
          Saved sections
        </h2>
        {savedSections.length === 0 ? (
          <p className="text-ink/70">No sections saved from the section bench yet.</p>
        ) : (
          <ul className="mt-2 space-y-1">
            {savedSections.map((x) => (
              <li key={x.id}>
                <Link to={x.href} className="font-semibold text-accent underline">
                  {x.name}
                </Link>{" "}
                <span className="text-sm text-ink/70">
                  saved by {x.by ?? "a former member"} on {x.on}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>

      <RationalisePanel {...rationalisation} />

      <div className="grid gap-8 md:grid-cols-2">
        <section aria-labelledby="members-h">
          <h2 id="members-h" className="text-lg font-bold">
            Members
          </h2>
          <ul className="mt-2 space-y-1 text-sm">
            {members.map((m: { id: number; name: string; role: string | null }) => (
              <li key={m.id} className="flex items-center justify-between gap-2">
                <span>
                  {m.name} <span className="text-ink/70">({m.role ?? "former member"})</span>
                </span>
                {may.edit ? (
                  <Form method="post">
                    <input type="hidden" name="intent" value="removeMember" />
                    <input type="hidden" name="userId" value={m.id} />
                    <button className="text-xs text-red-800 underline">Remove</button>
                  </Form>
                ) : null}
              </li>
            ))}
          </ul>
          {may.edit && outside.length ? (
            <Form method="post" className="mt-3 flex items-end gap-2">
              <input type="hidden" name="intent" value="addMember" />
              <div>
                <label htmlFor="add-member" className="block text-sm font-semibold">
                  Add a team member
                </label>
                <select id="add-member" name="userId" className="rounded-md border border-ink/30 bg-white px-2 py-1 text-sm">
                  {outside.map((m: { id: number; name: string; role: string }) => (
                    <option key={m.id} value={m.id}>
                      {m.name} ({m.role})
                    </option>
                  ))}
                </select>
              </div>
              <button className="rounded-md border border-ink/30 bg-white px-3 py-1 text-sm font-semibold">Add</button>
            </Form>
          ) : null}
        </section>
        <section aria-labelledby="activity-h">
          <h2 id="activity-h" className="text-lg font-bold">
            Activity
          </h2>
          <ol className="mt-2 space-y-1 text-sm">
            {activity.map((a) => (
              <li key={a.id}>
                <time dateTime={a.at} className="text-ink/60 tabular-nums">
                  {a.at.slice(0, 16).replace("T", " ")}
                </time>{" "}
                {a.who} {ACTIVITY_WORDS[a.action] ?? a.action.replaceAll("_", " ")}
                {a.subjectType && a.subjectId ? (
                  <span className="text-ink/70">
                    {" "}
                    ({SUBJECT_WORDS[a.subjectType] ?? a.subjectType.replaceAll("_", " ")}{" "}
                    {subjectHref(a.subjectType, a.subjectId) ? (
                      <Link to={subjectHref(a.subjectType, a.subjectId)!} className="text-accent underline">
                        {a.subjectId}
                      </Link>
                    ) : (
                      a.subjectId
                    )}
                    )
                  </span>
                ) : null}
              </li>
            ))}
          </ol>
        </section>
      </div>

      {may.edit ? (
        <section aria-labelledby="edit-h" className="space-y-3">
          <h2 id="edit-h" className="text-lg font-bold">
            Edit project
          </h2>
          <ProjectFields lastResult={actionData?.result} defaultValue={{ name: project.name, client: project.client, jobNumber: project.jobNumber, description: project.description }} submitLabel="Save changes" />
          <Form method="post">
            <input type="hidden" name="intent" value={project.archived ? "restore" : "archive"} />
            <button className="rounded-md border border-ink/30 bg-white px-3 py-1.5 text-sm font-semibold">{project.archived ? "Restore project" : "Archive project"}</button>
          </Form>
        </section>
      ) : null}
    </div>
  );
}

// The brief editor's submit, shared by the new-brief and edit-brief routes: parse with the form
// schema (Conform), save the brief, and on "run" enqueue a sweep and go to it.
import { redirect } from "react-router";
import { parseWithZod } from "@conform-to/zod/v4";
import { briefFormSchema } from "~/lib/brief-form";
import { readForm } from "~/lib/forms.server";
import { saveBrief } from "~/lib/projects.server";
import { logActivity } from "~/lib/activity.server";
import type { SessionUser } from "~/lib/auth.server";
import { can } from "~/lib/roles";
import { db } from "~/lib/db.server";
import { enqueueSweep } from "~/workers/queue.server";
import { formFailure } from "~/lib/form-reply.server";
import { withBriefCatalogues } from "~/lib/brief-catalogues.server";

/** A queue error Response (JSON { error }) as a plain message for the form. */
export async function queueErrorMessage(e: unknown): Promise<string | null> {
  if (!(e instanceof Response) || e.status < 400 || e.status === 404) return null;
  try {
    const body = (await e.clone().json()) as { error?: string };
    return body.error ?? `the queue refused the sweep (${e.status})`;
  } catch {
    return `the queue refused the sweep (${e.status})`;
  }
}

export async function submitBrief(request: Request, user: SessionUser, target: { projectId: number; briefId?: number }) {
  const form = await readForm(request);
  const intent = form.get("intent") === "run" ? "run" : "save";
  const submission = parseWithZod(form, { schema: briefFormSchema });
  if (submission.status !== "success") return formFailure(submission);
  if (intent === "run" && !can(user.role, "runSweep"))
    return formFailure(submission, 403, [`Your role (${user.role}) may save briefs but not run sweeps.`]);
  const { meta } = submission.value;
  // the chosen catalogues' sections and the team's costs (brief-catalogues.server.ts)
  const extended = await withBriefCatalogues(form, user.teamId, submission.value.problem);
  if (!extended.ok) return formFailure(submission, 400, [extended.message]);
  const problem = extended.problem;
  if (meta.stockListId) {
    const ok = await db("stock_lists").where({ id: meta.stockListId, team_id: user.teamId }).first("id");
    if (!ok) return formFailure(submission, 400, ["stockListId: no such stock list in your team"]);
  }
  const briefId = await saveBrief(user.teamId, user.id, target, meta, problem);
  if (intent === "save") throw redirect(`/briefs/${briefId}?saved=1`);
  try {
    const { id } = await enqueueSweep({
      teamId: user.teamId,
      ownerId: user.id,
      projectId: target.projectId,
      briefId,
      problem,
      member: { lengthM: meta.memberLengthM, count: meta.memberCount },
    });
    await logActivity({ teamId: user.teamId, projectId: target.projectId, userId: user.id, action: "sweep_started", subjectType: "sweep", subjectId: id, detail: { briefId } });
    throw redirect(`/sweeps/${id}`);
  } catch (e) {
    const msg = await queueErrorMessage(e);
    if (msg) return formFailure(submission, (e as Response).status, [`The brief was saved, but the sweep did not start: ${msg}`]);
    throw e;
  }
}

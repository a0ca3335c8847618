// Options (a candidate saved to its project with a note) and their reviews. State machine:
// draft → in_review (request) → approved | returned (a reviewer's decision); a returned option
// may be sent for review again. Each change writes the option, a reviews row and the activity
// log in one transaction, so no half-recorded decision is possible.
import { z } from "zod";
import { db, parseJson } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import { sendEmail } from "~/lib/email.server";
import { notify } from "~/lib/notifications.server";
import { optionNo } from "~/lib/numbering";
import { projectNumbers } from "~/lib/numbering.server";
import { notFound } from "~/lib/projects.server";
import type { SessionUser } from "~/lib/auth.server";
import { reviewRefusal, type ReviewTies } from "~/lib/roles";
import { candidateChecks, type CandidateVerdict } from "~/optimizer/checks";
import { SHAPE_FAMILY, rolledSectionOf, type CatalogueSection, type CatalogueShape } from "~/optimizer/catalogue";
import { catalogueCandidateChecks } from "~/optimizer/catalogue-search";
import type { Family } from "~/optimizer/geometry";
import type { SearchProblem } from "~/optimizer/search-schema";

export type ReviewState = "draft" | "in_review" | "approved" | "returned";

/** What an option keeps of its candidate: enough to redraw and recheck it without the sweep. */
export interface SavedCandidate {
  family: Family;
  dimensions: Record<string, number>;
  area: number;
  massPerMetre: number;
  utilisation: number;
  governing: string;
  rank: number;
  /** a catalogue section (issue 13): its designation, catalogue and shape; absent for welded plate sections */
  source?: "rolled";
  designation?: string;
  catalogue?: string;
  shape?: CatalogueShape;
}

export interface OptionRecord {
  id: number;
  projectId: number;
  projectName: string;
  teamId: number;
  briefId: number | null;
  briefName: string | null;
  sweepId: number | null;
  /** the sweep that sweep rechecked, when the option was saved from a recheck */
  recheckOf: number | null;
  /** its last approval is older than its brief's last change of problem: the approval may no longer hold */
  approvalStale: boolean;
  candidate: SavedCandidate;
  problem: SearchProblem;
  note: string | null;
  reviewState: ReviewState;
  createdBy: string | null;
  createdById: number | null;
  createdAt: string;
  units: "si" | "us";
  /** from the brief, for quantities (m; count) */
  memberLengthM: number | null;
  memberCount: number | null;
  /** the record's current revision (1 = A); problem and member above are this revision's */
  revision: number;
}

export const saveOptionSchema = z.object({
  rank: z.coerce.number({ error: "rank must be a whole number" }).int("rank must be a whole number").min(1, "rank must be ≥ 1"),
  note: z.string().trim().max(2000, "note: at most 2000 characters").optional(),
});

export const decisionSchema = z
  .object({
    decision: z.enum(["approved", "returned"], { error: 'decision must be "approved" or "returned"' }),
    comment: z.string().trim().max(4000, "Comment: at most 4000 characters").optional(),
  })
  .refine((d) => d.decision === "approved" || (d.comment ?? "").length > 0, { path: ["comment"], message: "Comment: say why you return the option; the engineer reads it" });

export class WorkflowError extends Error {
  constructor(
    readonly field: string,
    message: string,
    /** 409 for a state that does not allow it; 403 when this person may not (four-eyes). */
    readonly status = 409,
  ) {
    super(message);
  }
}

export async function saveOption(user: SessionUser, sweepId: number, rank: number, note: string | undefined): Promise<number> {
  const sweep = await db("sweeps").where({ id: sweepId, team_id: user.teamId }).first("id", "project_id", "brief_id", "problem", "status");
  if (!sweep) throw notFound("No such sweep in your team.");
  if (!sweep.project_id) throw new WorkflowError("rank", "this sweep belongs to no project, so its candidates cannot be saved as options");
  const c = await db("candidates").where({ sweep_id: sweepId, rank }).first();
  if (!c) throw new WorkflowError("rank", `the sweep has no candidate ranked ${rank}`);
  const candidate: SavedCandidate = {
    family: c.family,
    dimensions: parseJson(c.dimensions),
    area: c.area,
    massPerMetre: c.mass_per_metre,
    utilisation: c.utilisation,
    governing: c.governing,
    rank: c.rank,
    ...(c.source === "rolled" ? rolledFields(c.designation, c.catalogue, c.family, sweep.problem) : {}),
  };
  return db.transaction(async (trx) => {
    const [id] = await trx("options").insert({
      project_id: sweep.project_id,
      brief_id: sweep.brief_id,
      sweep_id: sweepId,
      candidate: JSON.stringify(candidate),
      problem: typeof sweep.problem === "string" ? sweep.problem : JSON.stringify(sweep.problem),
      note: note || null,
      review_state: "draft",
      created_by: user.id,
    });
    await trx("projects").where({ id: sweep.project_id }).update({ updated_at: trx.fn.now() });
    await logActivity({ teamId: user.teamId, projectId: sweep.project_id, userId: user.id, action: "option_saved", subjectType: "option", subjectId: Number(id), detail: { sweepId, rank } }, trx);
    return Number(id);
  });
}

export async function getOption(teamId: number, id: number): Promise<OptionRecord> {
  const row = Number.isSafeInteger(id)
    ? await db("options as o")
        .join("projects as p", "p.id", "o.project_id")
        .leftJoin("briefs as b", "b.id", "o.brief_id")
        .leftJoin("users as u", "u.id", "o.created_by")
        .leftJoin("sweeps as s", "s.id", "o.sweep_id")
        .leftJoin("record_revisions as r", function () {
          this.on("r.option_id", "o.id").andOn("r.number", "o.revision");
        })
        .where({ "o.id": id, "p.team_id": teamId })
        .first(
          "o.*",
          "p.team_id",
          "p.name as project_name",
          "r.problem as rev_problem",
          "r.member_length_m as rev_member_length_m",
          "r.member_count as rev_member_count",
          "b.name as brief_name",
          "b.units as brief_units",
          "b.member_length_m",
          "b.member_count",
          "s.recheck_of as sweep_recheck_of",
          "s.member_length_m as sweep_member_length_m",
          "s.member_count as sweep_member_count",
          "b.problem_changed_at",
          db.raw("(select max(r.created_at) from reviews r where r.option_id = o.id and r.decision = 'approved') as approved_at"),
          "u.name as author",
        )
    : undefined;
  if (!row) throw notFound("No such option in your team.");
  // A later revision carries its own basis (revisions.server.ts); revision A is the option's own.
  const revised = row.rev_problem != null;
  return {
    id: row.id,
    projectId: row.project_id,
    projectName: row.project_name,
    teamId: row.team_id,
    briefId: row.brief_id,
    briefName: row.brief_name,
    sweepId: row.sweep_id,
    recheckOf: row.sweep_recheck_of ?? null,
    approvalStale: isStale(row.approved_at, row.problem_changed_at),
    candidate: parseJson(row.candidate),
    problem: parseJson(revised ? row.rev_problem : row.problem),
    note: row.note,
    reviewState: row.review_state,
    createdBy: row.author,
    createdById: row.created_by,
    createdAt: new Date(row.created_at).toISOString(),
    units: row.brief_units ?? "si",
    // The member the sweep ran for (a recheck may alter it); sweeps older than that column: the brief's.
    memberLengthM: revised ? (row.rev_member_length_m ?? null) : (row.sweep_member_length_m ?? row.member_length_m ?? null),
    memberCount: revised ? (row.rev_member_count ?? null) : (row.sweep_member_count ?? row.member_count ?? null),
    revision: row.revision ?? 1,
  };
}

/** The engine's own checks of the saved section under a problem (its own, or a recheck's); a rolled one by the catalogue rules. */
export function optionVerdict(option: Pick<OptionRecord, "candidate">, problem: SearchProblem): CandidateVerdict {
  const c = option.candidate;
  const rolled = savedRolledSection(c);
  if (rolled) return catalogueCandidateChecks(rolled, problem);
  return candidateChecks(c.family, c.dimensions, problem);
}

/** A saved rolled candidate as the catalogue section it was (catalogue.ts rolledSectionOf). */
export function savedRolledSection(c: SavedCandidate): CatalogueSection | null {
  return c.source === "rolled" && c.shape ? rolledSectionOf(c) : null;
}

function rolledFields(designation: string | null, catalogue: string | null, family: string, problem: unknown): Partial<SavedCandidate> {
  const p = parseJson<SearchProblem>(problem);
  const section = p.catalogues?.find((k) => k.name === catalogue)?.sections.find((s) => s.designation === designation);
  const shape = section?.shape ?? (Object.entries(SHAPE_FAMILY).find(([, f]) => f === family)?.[0] as CatalogueShape | undefined);
  return { source: "rolled", designation: designation ?? undefined, catalogue: catalogue ?? undefined, shape };
}

export async function listReviews(optionId: number) {
  const rows = await db("reviews as r").leftJoin("users as u", "u.id", "r.user_id").where("r.option_id", optionId).orderBy("r.id").select("r.*", "u.name as user_name");
  return rows.map((r: Record<string, unknown>) => ({
    id: r.id as number,
    decision: r.decision as string,
    revision: (r.revision as number | undefined) ?? 1,
    comment: r.comment as string | null,
    who: (r.user_name as string | null) ?? "someone",
    at: new Date(r.created_at as string).toISOString(),
  }));
}

/**
 * An approval goes stale when its brief's problem changes after it (a rename does not count:
 * briefs.problem_changed_at moves only with the problem). Compared in the database's clock.
 */
// The option's state is not consulted: a brief edit revises an approved option back to draft
// (revisions.server.ts), and its last approval, given on the earlier revision, is exactly the one
// the flag warns about until a reviewer approves again.
function isStale(approvedAt: unknown, changedAt: unknown): boolean {
  if (!approvedAt || !changedAt) return false;
  return new Date(changedAt as string).getTime() > new Date(approvedAt as string).getTime();
}

export async function listProjectOptions(projectId: number) {
  const rows = await db("options as o")
    .leftJoin("users as u", "u.id", "o.created_by")
    .leftJoin("briefs as b", "b.id", "o.brief_id")
    .leftJoin("sweeps as s", "s.id", "o.sweep_id")
    .where("o.project_id", projectId)
    .orderBy("o.id", "desc")
    .select(
      "o.*",
      "u.name as author",
      "b.name as brief_name",
      "b.problem_changed_at",
      db.raw("coalesce(s.member_length_m, b.member_length_m) as member_length_m"),
      db.raw("coalesce(s.member_count, b.member_count) as member_count"),
      db.raw("(select max(r.created_at) from reviews r where r.option_id = o.id and r.decision = 'approved') as approved_at"),
    );
  return rows.map((r: Record<string, unknown>) => {
    const c = parseJson<SavedCandidate>(r.candidate);
    return {
      id: r.id as number,
      briefId: (r.brief_id as number | null) ?? null,
      briefName: (r.brief_name as string | null) ?? null,
      /** the member the option's sweep was run for (m, count) */
      memberLengthM: (r.member_length_m as number | null) ?? null,
      memberCount: (r.member_count as number | null) ?? null,
      approvalStale: isStale(r.approved_at, r.problem_changed_at),
      family: c.family,
      dimensions: c.dimensions,
      massPerMetre: c.massPerMetre,
      utilisation: c.utilisation,
      note: r.note as string | null,
      reviewState: r.review_state as ReviewState,
      author: r.author as string | null,
      sweepId: r.sweep_id as number | null,
    };
  });
}

/** Team members who review: reviewers, or the admins when the team has no reviewer. */
async function reviewersOf(teamId: number): Promise<{ id: number; email: string; name: string }[]> {
  const q = (role: string) =>
    db("memberships as m").join("users as u", "u.id", "m.user_id").where({ "m.team_id": teamId, "m.role": role }).whereNull("u.disabled_at").select("u.id", "u.email", "u.name");
  const reviewers = await q("reviewer");
  return reviewers.length ? reviewers : q("admin");
}

/** What ties `userId` to the option (saved it, asked for its review): the four-eyes rule's facts. */
export async function reviewTies(option: Pick<OptionRecord, "id" | "createdById">, userId: number): Promise<ReviewTies> {
  const asked = await db("reviews").where({ option_id: option.id, user_id: userId, decision: "requested" }).first("id");
  return { saved: option.createdById === userId, requested: Boolean(asked) };
}

/** Returns how many people were asked (0: nobody else in the team may review it). */
export async function requestReview(user: SessionUser, optionId: number, comment: string | undefined, link: (path: string) => string): Promise<number> {
  const option = await getOption(user.teamId, optionId);
  if (option.reviewState === "in_review") throw new WorkflowError("form", "this option is already waiting for review");
  if (option.reviewState === "approved") throw new WorkflowError("form", "this option is already approved");
  // Nobody tied to the option may decide it (four-eyes), so they are not asked to.
  const reviewers = (await reviewersOf(user.teamId)).filter((r) => r.id !== user.id && r.id !== option.createdById);
  // named as its pages name it: its number within the project, not its id
  const no = optionNo(await projectNumbers({ options: [optionId] }), optionId);
  const c = option.candidate;
  const what = `${c.family} ${Object.entries(c.dimensions)
    .map(([k, v]) => `${k} ${v}`)
    .join(", ")} mm (${c.massPerMetre.toFixed(1)} kg/m)`;
  await db.transaction(async (trx) => {
    // Conditional on the revision read above: a brief edit in between made a revision nobody asked about.
    const n = await trx("options").where({ id: optionId, revision: option.revision }).whereIn("review_state", ["draft", "returned"]).update({ review_state: "in_review", updated_at: trx.fn.now() });
    if (!n) throw new WorkflowError("form", "the option changed meanwhile (a new revision or another request); reload and try again");
    await trx("reviews").insert({ option_id: optionId, user_id: user.id, decision: "requested", revision: option.revision, comment: comment || null });
    await logActivity({ teamId: user.teamId, projectId: option.projectId, userId: user.id, action: "review_requested", subjectType: "option", subjectId: optionId }, trx);
    for (const r of reviewers) {
      await sendEmail(
        {
          teamId: user.teamId,
          to: r.email,
          subject: `Review requested: option ${no} in ${option.projectName}`,
          text: `${user.name} asks you to review option ${no} (${what}) in project "${option.projectName}".\n\n${comment ? `Note: ${comment}\n\n` : ""}Open it: ${link(`/options/${optionId}`)}\n`,
        },
        trx,
      );
      await notify(r.id, { title: `Review requested: option ${no} in ${option.projectName}`, body: `${user.name}: ${what}`, link: `/options/${optionId}` }, trx);
    }
  });
  return reviewers.length;
}

export async function decideReview(user: SessionUser, optionId: number, decision: "approved" | "returned", comment: string | undefined, link: (path: string) => string): Promise<void> {
  const option = await getOption(user.teamId, optionId);
  if (option.reviewState !== "in_review") throw new WorkflowError("decision", `only an option waiting for review can be ${decision}; this one is ${option.reviewState.replace("_", " ")}`);
  const refusal = reviewRefusal(user.role, await reviewTies(option, user.id));
  if (refusal) throw new WorkflowError("decision", refusal, 403);
  await db.transaction(async (trx) => {
    // Conditional update: two reviewers deciding at once cannot both win, and a decision never
    // lands on a revision made after this request read the option.
    const n = await trx("options").where({ id: optionId, review_state: "in_review", revision: option.revision }).update({ review_state: decision, updated_at: trx.fn.now() });
    if (!n) throw new WorkflowError("decision", "someone else decided this review first, or the option has a new revision");
    await trx("reviews").insert({ option_id: optionId, user_id: user.id, decision, revision: option.revision, comment: comment || null });
    await logActivity({ teamId: user.teamId, projectId: option.projectId, userId: user.id, action: decision === "approved" ? "option_approved" : "option_returned", subjectType: "option", subjectId: optionId, detail: comment ? { comment } : undefined }, trx);
    if (option.createdById && option.createdById !== user.id) {
      const author = await trx("users").where({ id: option.createdById }).first("email");
      const no = optionNo(await projectNumbers({ options: [optionId] }, trx), optionId);
      const title = `Option ${no} in ${option.projectName} ${decision} by ${user.name}`;
      if (author)
        await sendEmail({ teamId: user.teamId, to: author.email, subject: title, text: `${title}.\n\n${comment ? `Comment: ${comment}\n\n` : ""}${link(`/options/${optionId}`)}\n` }, trx);
      await notify(option.createdById, { title, body: comment ?? undefined, link: `/options/${optionId}` }, trx);
    }
  });
}

/** Options waiting for review in the team (the reviewer's dashboard list). */
export async function optionsAwaitingReview(teamId: number, limit = 20) {
  return db("options as o")
    .join("projects as p", "p.id", "o.project_id")
    .leftJoin("users as u", "u.id", "o.created_by")
    .where({ "p.team_id": teamId, "o.review_state": "in_review" })
    .orderBy("o.updated_at")
    .limit(limit)
    .select("o.id", "p.name as project", "u.name as author", "o.updated_at");
}

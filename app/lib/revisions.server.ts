// Revisions of an option's calculation record. Revision A is the option as saved (its own
// problem column, never changed). Each change of the basis of an option that has been put to
// review makes a new revision (a record_revisions row holding the problem and member it was
// checked against) and sends the option back to draft: an approval belongs to the revision it
// was given on (reviews.revision), so a later revision needs its own, and the earlier ones
// stay readable with their approvals.
//
// Choices (the spec is silent):
// - What makes a revision: saving the brief with a changed problem, member length or count. A
//   recheck is a reviewer's what-if compared beside the option, not a change of its basis, so it
//   makes none; re-running an unchanged brief changes nothing the record shows.
// - Which options: those of the brief that have left draft (in review, returned or approved).
//   A draft option was never put to anyone, so its record stays the one of the sweep it was
//   saved from, as before revisions existed; the engineer saves a new option from a new sweep.
// - A pending review request belonged to the old revision: the option goes back to draft.
import type { Knex } from "knex";
import { db, parseJson } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import { notFound } from "~/lib/projects.server";
import { revisionLetter, type RecordRevision } from "~/lib/revisions";
export type { RecordRevision, RevisionSignature } from "~/lib/revisions";
import type { OptionRecord } from "~/lib/options.server";
import type { SearchProblem } from "~/optimizer/search-schema";

/** Every revision of the option, A first; the option must already be the caller's team's. */
export async function listRevisions(option: OptionRecord): Promise<RecordRevision[]> {
  const rows = await db("record_revisions as r").leftJoin("users as u", "u.id", "r.created_by").where("r.option_id", option.id).orderBy("r.number").select("r.*", "u.name as author");
  const reviews = await db("reviews as v").leftJoin("users as u", "u.id", "v.user_id").where("v.option_id", option.id).orderBy("v.id").select("v.revision", "v.decision", "v.comment", "v.created_at", "u.name as who");
  const base = await db("options as o")
    .leftJoin("sweeps as s", "s.id", "o.sweep_id")
    .leftJoin("briefs as b", "b.id", "o.brief_id")
    .where("o.id", option.id)
    .first("o.problem", "s.member_length_m as s_len", "s.member_count as s_count", "b.member_length_m as b_len", "b.member_count as b_count");
  const list: Omit<RecordRevision, "approved" | "state" | "current">[] = [
    {
      number: 1,
      letter: "A",
      problem: parseJson<SearchProblem>(base.problem),
      memberLengthM: base.s_len ?? base.b_len ?? null,
      memberCount: base.s_count ?? base.b_count ?? null,
      reason: option.recheckOf ? "saved from a recheck" : "saved from a sweep",
      prepared: { who: option.createdBy ?? "someone", at: option.createdAt, comment: null },
    },
    ...rows.map((r: Record<string, unknown>) => ({
      number: r.number as number,
      letter: revisionLetter(r.number as number),
      problem: parseJson<SearchProblem>(r.problem),
      memberLengthM: (r.member_length_m as number | null) ?? null,
      memberCount: (r.member_count as number | null) ?? null,
      reason: r.reason as string,
      prepared: { who: (r.author as string | null) ?? "someone", at: new Date(r.created_at as string).toISOString(), comment: null },
    })),
  ];
  return list.map((rev) => {
    const mine = reviews.filter((v: Record<string, unknown>) => v.revision === rev.number);
    const last = mine.at(-1) as Record<string, unknown> | undefined;
    const state: RecordRevision["state"] = !last ? "draft" : last.decision === "requested" ? "in_review" : last.decision === "approved" ? "approved" : last.decision === "returned" ? "returned" : "draft";
    return {
      ...rev,
      state,
      approved: state === "approved" ? { who: (last!.who as string | null) ?? "someone", at: new Date(last!.created_at as string).toISOString(), comment: (last!.comment as string | null) ?? null } : null,
      current: rev.number === option.revision,
    };
  });
}

/** The option as its record stood at one revision (its problem and member), with every revision. */
export async function optionAtRevision(option: OptionRecord, number?: number): Promise<{ option: OptionRecord; revision: RecordRevision; revisions: RecordRevision[] }> {
  const revisions = await listRevisions(option);
  const revision = revisions.find((r) => r.number === (number ?? option.revision));
  if (!revision) throw notFound("This option has no such revision.");
  return {
    option: { ...option, problem: revision.problem, memberLengthM: revision.memberLengthM, memberCount: revision.memberCount },
    revision,
    revisions,
  };
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/**
 * Inside saveBrief's transaction, after the brief's basis changed: a new revision of every option
 * of the brief that has left draft, each sent back to draft. Returns the options revised.
 */
export async function reviseOptionsOfBrief(
  trx: Knex.Transaction,
  args: { teamId: number; userId: number; projectId: number; briefId: number; briefName: string; problem: SearchProblem; memberLengthM: number | null; memberCount: number | null },
): Promise<number[]> {
  const options = await trx("options as o")
    .leftJoin("record_revisions as r", function () {
      this.on("r.option_id", "o.id").andOn("r.number", "o.revision");
    })
    .leftJoin("sweeps as s", "s.id", "o.sweep_id")
    .where({ "o.brief_id": args.briefId, "o.project_id": args.projectId })
    .whereNot("o.review_state", "draft")
    .forUpdate()
    .select("o.id", "o.revision", "o.problem", "r.problem as rev_problem", "r.member_length_m as rev_len", "r.member_count as rev_count", "s.member_length_m as s_len", "s.member_count as s_count");
  const revised: number[] = [];
  for (const o of options) {
    const current = parseJson(o.rev_problem ?? o.problem);
    const len = o.rev_problem ? o.rev_len : o.s_len;
    const count = o.rev_problem ? o.rev_count : o.s_count;
    if (same(current, args.problem) && (len ?? null) === args.memberLengthM && (count ?? null) === args.memberCount) continue;
    const number = (o.revision as number) + 1;
    await trx("record_revisions").insert({
      option_id: o.id,
      number,
      problem: JSON.stringify(args.problem),
      member_length_m: args.memberLengthM,
      member_count: args.memberCount,
      reason: `brief “${args.briefName.slice(0, 120)}” edited`,
      created_by: args.userId,
    });
    await trx("options").where({ id: o.id }).update({ revision: number, review_state: "draft", updated_at: trx.fn.now() });
    await logActivity({ teamId: args.teamId, projectId: args.projectId, userId: args.userId, action: "option_revised", subjectType: "option", subjectId: o.id, detail: { revision: revisionLetter(number) } }, trx);
    revised.push(o.id);
  }
  return revised;
}

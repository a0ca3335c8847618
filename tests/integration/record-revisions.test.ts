// Record revisions (issue 12, item 2): approve → edit the brief → revision B, unapproved, while A
// stays readable, unchanged and approved; B needs its own approval; a draft is not revised; and
// no revision of another team's option can be reached.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { getOption, requestReview, decideReview, saveOption } from "~/lib/options.server";
import { saveBrief } from "~/lib/projects.server";
import { listRevisions } from "~/lib/revisions.server";
import { revisionLetter, revisionNumber } from "~/lib/revisions";
import { searchProblemSchema, type SearchProblem } from "~/optimizer/search-schema";
import { callRoute, FixtureContext, loadRouteModule, requestAs } from "./fixtures";
import { CHANNEL_PROBLEM } from "./workflow-fixtures";
import type { SessionUser } from "~/lib/auth.server";

afterAll(() => closeDb());
const ctx = new FixtureContext();
const link = (p: string) => `http://sparwise.test${p}`;

async function as(role: "engineer" | "reviewer" | "admin"): Promise<SessionUser> {
  const u = await ctx.user(role);
  return { id: u.id, teamId: await ctx.teamId(), role, name: role, email: `${role}@tallowfield.example`, teamName: "Tallowfield", teams: [] } as SessionUser;
}

async function approvedOption() {
  const teamId = await ctx.teamId();
  const engineer = await as("engineer");
  const [projectId] = await db("projects").insert({ team_id: teamId, name: "Revision fixture depot", job_number: "J-4471", created_by: engineer.id });
  const [briefId] = await db("briefs").insert({ project_id: projectId, name: "RB-12 crane girder", problem: JSON.stringify(searchProblemSchema.parse(CHANNEL_PROBLEM)), units: "si", member_length_m: 6, member_count: 2, created_by: engineer.id });
  const sweepId = await recordFinishedSweep(db, { teamId, ownerId: engineer.id, projectId: Number(projectId), briefId: Number(briefId), problem: CHANNEL_PROBLEM });
  const optionId = await saveOption(engineer, sweepId, 1, "lightest");
  const draftId = await saveOption(engineer, sweepId, 2, "kept as a draft");
  await requestReview(engineer, optionId, undefined, link);
  await decideReview(await as("reviewer"), optionId, "approved", "checked by hand", link);
  return { teamId, projectId: Number(projectId), briefId: Number(briefId), sweepId, optionId, draftId, engineer };
}

async function editBrief(f: Awaited<ReturnType<typeof approvedOption>>, change: (p: SearchProblem) => SearchProblem, meta: { memberLengthM?: number; memberCount?: number } = { memberLengthM: 6, memberCount: 2 }) {
  const row = await db("briefs").where({ id: f.briefId }).first("problem");
  const problem = change(parseJson<SearchProblem>(row.problem));
  await saveBrief(f.teamId, f.engineer.id, { projectId: f.projectId, briefId: f.briefId }, { name: "RB-12 crane girder", units: "si", ...meta }, problem);
  return problem;
}

describe("revision letters", () => {
  test("A…Z, then AA, and back", () => {
    expect([1, 2, 26, 27, 28, 52, 53, 702, 703].map(revisionLetter)).toEqual(["A", "B", "Z", "AA", "AB", "AZ", "BA", "ZZ", "AAA"]);
    for (const n of [1, 2, 26, 27, 52, 703]) expect(revisionNumber(revisionLetter(n))).toBe(n);
    expect(revisionNumber("b")).toBe(2);
    expect(revisionNumber("1")).toBeNaN();
    expect(revisionNumber("ABCD")).toBeNaN();
  });
});

describe("record revisions", () => {
  test("approve → edit the brief → revision B unapproved; A still readable, unchanged and approved", async () => {
    const f = await approvedOption();
    const before = await getOption(f.teamId, f.optionId);
    expect([before.revision, before.reviewState]).toEqual([1, "approved"]);
    const edited = await editBrief(f, (p) => ({ ...p, allowable: { ...p.allowable!, tension: 140, compression: 140 } }));

    const after = await getOption(f.teamId, f.optionId);
    expect(after.revision).toBe(2);
    expect(after.reviewState).toBe("draft");
    expect(after.problem.allowable).toEqual(edited.allowable);
    const revs = await listRevisions(after);
    expect(revs.map((r) => [r.letter, r.state, r.current])).toEqual([
      ["A", "approved", false],
      ["B", "draft", true],
    ]);
    expect(revs[0]!.approved?.comment).toBe("checked by hand");
    expect(revs[0]!.problem).toEqual(before.problem);
    expect(revs[1]!.approved).toBeNull();
    expect(revs[1]!.reason).toMatch(/brief .*edited/);
    // the draft option was never put to review, so its record is still the one it was saved with
    expect((await getOption(f.teamId, f.draftId)).revision).toBe(1);
    const actions = (await db("activity_log").where({ subject_type: "option", subject_id: f.optionId }).orderBy("id")).map((a) => a.action);
    expect(actions.at(-1)).toBe("option_revised");

    // The record route: the current revision by default, any earlier one by letter.
    const mod = await loadRouteModule("routes/options.$optionId.record.tsx");
    const params = { optionId: String(f.optionId) };
    const cur = await callRoute(mod.loader, await requestAs("viewer", `/options/${f.optionId}/record`), params);
    expect(cur.status).toBe(200);
    const b = cur.data as { revision: { letter: string }; signatures: { checked: unknown; approved: unknown; prepared: { who: string } }; jobNumber: string; mark: string; option: { problem: SearchProblem } };
    expect([b.revision.letter, b.jobNumber, b.mark]).toEqual(["B", "J-4471", "RB-12 crane girder"]);
    expect(b.signatures.checked).toBeNull();
    expect(b.signatures.approved).toBeNull();
    expect(b.option.problem.allowable!.tension).toBe(140);
    const old = await callRoute(mod.loader, await requestAs("viewer", `/options/${f.optionId}/record?rev=A`), params);
    const a = old.data as typeof b & { signatures: { approved: { who: string } } };
    expect(a.revision.letter).toBe("A");
    expect(a.signatures.approved.who).toBe((await db("users").where({ id: (await ctx.user("reviewer")).id }).first("name")).name);
    expect(a.option.problem).toEqual(before.problem);
    expect((await callRoute(mod.loader, await requestAs("viewer", `/options/${f.optionId}/record?rev=C`), params)).status).toBe(404);
    const bad = await callRoute(mod.loader, await requestAs("viewer", `/options/${f.optionId}/record?rev=1`), params);
    expect(bad.status).toBe(400);

    // B gets its own approval; A's stays as it was.
    await requestReview(f.engineer, f.optionId, undefined, link);
    await decideReview(await as("reviewer"), f.optionId, "approved", undefined, link);
    const revs2 = await listRevisions(await getOption(f.teamId, f.optionId));
    expect(revs2.map((r) => r.state)).toEqual(["approved", "approved"]);
    expect(revs2[0]!.approved?.comment).toBe("checked by hand");
    const reviewRevisions = (await db("reviews").where({ option_id: f.optionId }).orderBy("id")).map((r) => `${r.decision}@${r.revision}`);
    expect(reviewRevisions).toEqual(["requested@1", "approved@1", "requested@2", "approved@2"]);
  });

  test("saving the brief unchanged (a new name only) makes no revision; a new member count does", async () => {
    const f = await approvedOption();
    await editBrief(f, (p) => p);
    expect((await getOption(f.teamId, f.optionId)).revision).toBe(1);
    await editBrief(f, (p) => p, { memberLengthM: 6, memberCount: 3 });
    const o = await getOption(f.teamId, f.optionId);
    expect([o.revision, o.memberCount, o.reviewState]).toEqual([2, 3, "draft"]);
  });

  test("a decision read before a new revision cannot land on it", async () => {
    const f = await approvedOption();
    await editBrief(f, (p) => ({ ...p, allowable: { ...p.allowable!, shear: 90 } }));
    await requestReview(f.engineer, f.optionId, undefined, link);
    // the review request was for B; the brief changes again: C is a draft nobody was asked about
    await editBrief(f, (p) => ({ ...p, allowable: { ...p.allowable!, shear: 80 } }));
    await expect(decideReview(await as("reviewer"), f.optionId, "approved", undefined, link)).rejects.toThrow(/waiting for review/);
    const revs = await listRevisions(await getOption(f.teamId, f.optionId));
    expect(revs.map((r) => [r.letter, r.state])).toEqual([
      ["A", "approved"],
      ["B", "in_review"],
      ["C", "draft"],
    ]);
  });

  test("another team reaches no revision of our option, by id or by letter", async () => {
    const f = await approvedOption();
    const other = await ctx.otherTeam();
    await expect(getOption(other.teamId, f.optionId)).rejects.toMatchObject({ status: 404 });
    const { recordDocument } = await import("~/lib/record-document.server");
    await expect(recordDocument(other.teamId, f.optionId, 1)).rejects.toMatchObject({ status: 404 });
    const ours = await recordDocument(f.teamId, f.optionId, 1);
    expect(ours.revision.letter).toBe("A");
  });
});

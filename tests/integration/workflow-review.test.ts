// Options, reviews and rechecks through the routes: state changes in order, e-mails in the
// outbox, refusals for the wrong role or state, and a recheck linked to its original whose
// comparison reruns the engine's checks on the saved option under the new limits.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { optionNo } from "~/lib/numbering";
import { projectNumbers } from "~/lib/numbering.server";
import { compareRecheck } from "~/lib/recheck.server";
import { candidateChecks } from "~/optimizer/checks";
import { searchProblemSchema } from "~/optimizer/search-schema";
import { callRoute, FixtureContext, formPost, loadRouteModule } from "./fixtures";
import { CHANNEL_PROBLEM, workflowFixture } from "./workflow-fixtures";

afterAll(() => closeDb());
const ctx = new FixtureContext();

const optionState = async (id: number) => (await db("options").where({ id }).first("review_state")).review_state as string;

describe("review state", () => {
  test("engineer saves an option, requests review (reviewers e-mailed), reviewer returns then approves", async () => {
    const f = await workflowFixture(ctx);
    const sweepMod = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const saved = await callRoute(sweepMod.action, await formPost("engineer", `/sweeps/${f.sweepId}`, { intent: "saveOption", rank: "2", note: "second lightest" }), { sweepId: String(f.sweepId) });
    expect(saved.status).toBe(302);
    const optionId = Number(saved.location!.split("/").pop());
    expect(await optionState(optionId)).toBe("draft");
    const option = await db("options").where({ id: optionId }).first();
    expect(option.sweep_id).toBe(f.sweepId);
    expect(option.note).toBe("second lightest");

    const mod = await loadRouteModule("routes/options.$optionId.tsx");
    const params = { optionId: String(optionId) };
    // A reviewer cannot approve a draft; a viewer cannot request review.
    expect((await callRoute(mod.action, await formPost("reviewer", `/options/${optionId}`, { intent: "decide", decision: "approved" }), params)).status).toBe(409);
    expect((await callRoute(mod.action, await formPost("viewer", `/options/${optionId}`, { intent: "requestReview" }), params)).status).toBe(403);

    const outboxBefore = Number((await db("outbox").count({ n: "*" }).first())!.n);
    const req = await callRoute(mod.action, await formPost("engineer", `/options/${optionId}`, { intent: "requestReview", comment: "please" }), params);
    expect(req.status).toBe(200);
    expect(await optionState(optionId)).toBe("in_review");
    const mails = await db("outbox").orderBy("id", "desc").limit(5);
    expect(Number((await db("outbox").count({ n: "*" }).first())!.n)).toBeGreaterThan(outboxBefore);
    // Named as its pages name it: its number in the project, not its database id.
    const no = optionNo(await projectNumbers({ options: [optionId] }), optionId);
    expect(mails.some((m) => m.to_address === "reviewer@tallowfield.example" && m.subject.includes(`option ${no} in `))).toBe(true);
    // Asking twice is refused.
    expect((await callRoute(mod.action, await formPost("engineer", `/options/${optionId}`, { intent: "requestReview" }), params)).status).toBe(409);
    // An engineer may not decide; returning needs a comment.
    expect((await callRoute(mod.action, await formPost("engineer", `/options/${optionId}`, { intent: "decide", decision: "approved" }), params)).status).toBe(403);
    const noComment = await callRoute(mod.action, await formPost("reviewer", `/options/${optionId}`, { intent: "decide", decision: "returned" }), params);
    expect(noComment.status).toBe(400);
    expect(await optionState(optionId)).toBe("in_review");

    expect((await callRoute(mod.action, await formPost("reviewer", `/options/${optionId}`, { intent: "decide", decision: "returned", comment: "web too slender for our shop" }), params)).status).toBe(200);
    expect(await optionState(optionId)).toBe("returned");
    expect((await callRoute(mod.action, await formPost("engineer", `/options/${optionId}`, { intent: "requestReview" }), params)).status).toBe(200);
    expect((await callRoute(mod.action, await formPost("reviewer", `/options/${optionId}`, { intent: "decide", decision: "approved" }), params)).status).toBe(200);
    expect(await optionState(optionId)).toBe("approved");

    const decisions = (await db("reviews").where({ option_id: optionId }).orderBy("id")).map((r) => r.decision);
    expect(decisions).toEqual(["requested", "returned", "requested", "approved"]);
    const actions = (await db("activity_log").where({ subject_type: "option", subject_id: optionId }).orderBy("id")).map((a) => a.action);
    expect(actions).toEqual(["option_saved", "review_requested", "option_returned", "review_requested", "option_approved"]);
  });
});

describe("recheck", () => {
  test("a recheck is a new sweep linked to the original; the brief and the original stay as they were", async () => {
    const f = await workflowFixture(ctx);
    const mod = await loadRouteModule("routes/sweeps.$sweepId.recheck.tsx");
    const before = await db("sweeps").where({ id: f.sweepId }).first();
    const briefBefore = await db("briefs").where({ id: f.briefId }).first("problem", "updated_at");
    const fields: Record<string, string | string[]> = {
      name: "Recheck",
      units: "si",
      "moment.sagging": "120",
      shear: "80",
      "allowable.tension": "150",
      "allowable.compression": "150",
      "allowable.shear": "100",
      "depth.min": "100",
      "depth.max": "360",
      "depth.step": "20",
      "width.min": "50",
      "width.max": "300",
      "width.step": "25",
      thicknesses: "6, 8, 10, 12, 15, 20, 25",
      families: ["channel", "i"],
      "slenderness.outstand": "15",
      "slenderness.web": "120",
    };
    const res = await callRoute(mod.action, await formPost("reviewer", `/sweeps/${f.sweepId}/recheck`, fields), { sweepId: String(f.sweepId) });
    expect(res.status).toBe(302);
    const id = Number(res.location!.split("/").pop());
    const row = await db("sweeps").where({ id }).first();
    expect(row.recheck_of).toBe(f.sweepId);
    expect(row.brief_id).toBe(f.briefId);
    expect(row.project_id).toBe(f.projectId);
    expect(row.status).toBe("queued");
    expect(parseJson<{ allowable: { tension: number } }>(row.problem).allowable.tension).toBe(150);
    expect((await db("sweeps").where({ id: f.sweepId }).first()).problem).toEqual(before.problem);
    expect(await db("briefs").where({ id: f.briefId }).first("problem", "updated_at")).toEqual(briefBefore);
    // A viewer may not recheck.
    const viewer = await callRoute(mod.action, await formPost("viewer", `/sweeps/${f.sweepId}/recheck`, fields), { sweepId: String(f.sweepId) });
    expect(viewer.status).toBe(403);
    await db("sweeps").where({ id }).delete();
  });

  test("the comparison names the changed limits and rechecks the saved option with the engine's checks", async () => {
    const f = await workflowFixture(ctx);
    const team = await ctx.teamId();
    const c = await compareRecheck(team, f.recheckId);
    expect(c.original.id).toBe(f.sweepId);
    expect(c.changes.map((x) => x.path)).toEqual(["allowable.compression", "allowable.tension"]);
    expect(c.changes[0]).toMatchObject({ before: 165, after: 140 });
    // The fixture option is the original's best at 165 MPa; the same section under 140 MPa:
    const opt = c.options.find((o) => o.id === f.optionId)!;
    const newProblem = searchProblemSchema.parse({ ...CHANNEL_PROBLEM, allowable: { tension: 140, compression: 140, shear: 100 } });
    const expected = candidateChecks(opt.candidate.family, opt.candidate.dimensions, newProblem);
    expect(opt.utilisation).toBeCloseTo(expected.utilisation, 12);
    expect(opt.feasible).toBe(expected.feasible);
    // Bending stress does not depend on the allowable: the bending utilisation scales by 165/140 exactly.
    const bendBefore = candidateChecks(opt.candidate.family, opt.candidate.dimensions, searchProblemSchema.parse(CHANNEL_PROBLEM)).checks.find((x) => x.name === "bending-compression")!;
    const bendAfter = expected.checks.find((x) => x.name === "bending-compression")!;
    expect(bendAfter.utilisation).toBeCloseTo((bendBefore.utilisation * 165) / 140, 12);
    // The lighter best cannot survive a lower allowable unchanged: the recheck's best is at least as heavy.
    expect(c.massDifference!).toBeGreaterThanOrEqual(0);
    // Another team cannot read it.
    const other = await ctx.otherTeam();
    await expect(compareRecheck(other.teamId, f.recheckId)).rejects.toMatchObject({ status: 404 });
  });
});

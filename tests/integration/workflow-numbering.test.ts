// Issue 11, item 12: sweeps and options numbered within their project; the project's options list
// names brief and member; an approval is flagged stale once its brief's problem changes after it.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { projectNumbers } from "~/lib/numbering.server";
import { getOption, listProjectOptions } from "~/lib/options.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { callRoute, FixtureContext, formPost, loadRouteModule, requestAs } from "./fixtures";
import { CHANNEL_PROBLEM } from "./workflow-fixtures";

afterAll(() => closeDb());
const ctx = new FixtureContext();

async function project(name: string) {
  const teamId = await ctx.teamId();
  const engineer = await ctx.user("engineer");
  const [projectId] = await db("projects").insert({ team_id: teamId, name, created_by: engineer.id });
  const [briefId] = await db("briefs").insert({
    project_id: projectId,
    name: `${name} beam`,
    problem: JSON.stringify(CHANNEL_PROBLEM),
    units: "si",
    member_length_m: 6,
    member_count: 3,
    created_by: engineer.id,
    problem_changed_at: db.raw("NOW(3) - INTERVAL 1 HOUR"),
  });
  const sweep = () => recordFinishedSweep(db, { teamId, ownerId: engineer.id, projectId: Number(projectId), briefId: Number(briefId), problem: CHANNEL_PROBLEM });
  return { projectId: Number(projectId), briefId: Number(briefId), sweep };
}

describe("numbering within the project", () => {
  test("each project counts its own sweeps and options from 1", async () => {
    const a = await project("Numbering A");
    const b = await project("Numbering B");
    const a1 = await a.sweep();
    const b1 = await b.sweep();
    const a2 = await a.sweep();
    const n = await projectNumbers({ sweeps: [a1, a2, b1] });
    expect([n.sweep[a1], n.sweep[a2], n.sweep[b1]]).toEqual([1, 2, 1]);
    const mod = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const save = async (sweepId: number) => Number((await callRoute(mod.action, await formPost("engineer", `/sweeps/${sweepId}`, { intent: "saveOption", rank: "1" }), { sweepId: String(sweepId) })).location!.split("/").pop());
    const oB = await save(b1);
    const oA1 = await save(a2);
    const oA2 = await save(a1);
    const o = await projectNumbers({ options: [oA1, oA2, oB] });
    expect([o.option[oA1], o.option[oA2], o.option[oB]]).toEqual([1, 2, 1]);
    // The sweep page reads its numbers with the rows it lists (one query for itself, its original and
    // its rechecks): the same numbers as projectNumbers.
    const a3 = await a.sweep();
    await db("sweeps").where({ id: a3 }).update({ recheck_of: a2 });
    const pageOf = async (id: number) =>
      (await callRoute(mod.loader, await requestAs("viewer", `/sweeps/${id}`), { sweepId: String(id) })).data as {
        numbers: { sweep: Record<number, number>; option: Record<number, number> };
        rechecks: { id: number; status: string }[];
        options: { id: number; reviewState: string; rank: number }[];
        brief: { id: number; name: string } | null;
        project: { id: number; name: string } | null;
        units: string;
      };
    // the brief's units as the page shows them (the same read brings the brief's name and units)
    await db("briefs").where({ id: a.briefId }).update({ units: "us" });
    const p2 = await pageOf(a2);
    expect(p2.brief).toEqual({ id: a.briefId, name: "Numbering A beam" });
    expect(p2.project).toEqual({ id: a.projectId, name: "Numbering A" });
    expect(p2.units).toBe("us");
    expect(p2.rechecks).toEqual([{ id: a3, status: "succeeded" }]);
    expect(p2.options).toEqual([{ id: oA1, reviewState: "draft", rank: 1 }]);
    expect(p2.rechecks.map((r) => r.id)).toEqual([a3]);
    expect(p2.options.map((x) => x.id)).toEqual([oA1]);
    expect(p2.numbers).toEqual({ sweep: { [a2]: 2, [a3]: 3 }, option: { [oA1]: 1 } });
    expect((await pageOf(a3)).numbers).toEqual({ sweep: { [a3]: 3, [a2]: 2 }, option: {} });
    // an API sweep outside any project keeps its id
    const teamId = await ctx.teamId();
    const loose = await recordFinishedSweep(db, { teamId, ownerId: (await ctx.user("engineer")).id, problem: CHANNEL_PROBLEM });
    expect((await projectNumbers({ sweeps: [loose] })).sweep[loose]).toBeUndefined();
  });
});

describe("options list and stale approvals", () => {
  test("the list names brief and member; an approval goes stale when the brief's problem changes after it", async () => {
    const p = await project("Stale approval");
    const sweepId = await p.sweep();
    const mod = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const saved = await callRoute(mod.action, await formPost("engineer", `/sweeps/${sweepId}`, { intent: "saveOption", rank: "1" }), { sweepId: String(sweepId) });
    const optionId = Number(saved.location!.split("/").pop());
    const reviewer = await ctx.user("reviewer");
    await db("options").where({ id: optionId }).update({ review_state: "approved" });
    await db("reviews").insert({ option_id: optionId, user_id: reviewer.id, decision: "approved", created_at: db.raw("NOW() - INTERVAL 10 MINUTE") });
    const team = await ctx.teamId();
    let [row] = await listProjectOptions(p.projectId);
    expect(row).toMatchObject({ briefId: p.briefId, briefName: "Stale approval beam", memberLengthM: 6, memberCount: 3, approvalStale: false });
    expect((await getOption(team, optionId)).approvalStale).toBe(false);
    // The brief's limits change after the approval (through the editor's own save).
    const edit = await loadRouteModule("routes/briefs.$briefId.tsx");
    const fields: Record<string, string | string[]> = {
      name: "Stale approval beam",
      units: "si",
      basis: "allowable",
      "moment.sagging": "120",
      shear: "80",
      "allowable.tension": "150",
      "allowable.compression": "150",
      "allowable.shear": "100",
      "depth.min": "100",
      "depth.max": "400",
      "depth.step": "20",
      "width.min": "50",
      "width.max": "300",
      "width.step": "25",
      thicknesses: "6, 8, 10, 12, 15, 20, 25",
      families: ["channel", "i"],
      intent: "save",
    };
    const r = await callRoute(edit.action, await formPost("engineer", `/briefs/${p.briefId}`, fields), { briefId: String(p.briefId) });
    expect(r.status).toBe(302);
    [row] = await listProjectOptions(p.projectId);
    expect(row.approvalStale).toBe(true);
    expect((await getOption(team, optionId)).approvalStale).toBe(true);
  });
});

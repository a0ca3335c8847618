// Projects and briefs through the routes: create, edit, archive, members, the activity log;
// a brief saved in US customary is stored in SI; "run" enqueues a sweep linked to the brief;
// the candidates CSV carries the stored candidates with SI units in its header.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { problemToFormDefaults, DEFAULT_PROBLEM } from "~/lib/brief-form";
import type { SearchProblem } from "~/optimizer/search-schema";
import { callRoute, FixtureContext, formPost, loadRouteModule, requestAs } from "./fixtures";
import { workflowFixture } from "./workflow-fixtures";
import { formFields } from "../unit/form-data";

afterAll(() => closeDb());
const ctx = new FixtureContext();

/** A brief form's fields (flattened names) from form defaults. */
const briefFields = (values: Record<string, unknown>) => formFields(values);

describe("projects", () => {
  test("create, edit, add a member, archive and restore; each step in the activity log", async () => {
    const create = await loadRouteModule("routes/projects.new.tsx");
    const res = await callRoute(create.action, await formPost("engineer", "/projects/new", { name: "Dock canopy", client: "Invented client" }));
    expect(res.status).toBe(302);
    const id = Number(res.location!.split("/").pop());
    const mod = await loadRouteModule("routes/projects.$projectId.tsx");
    const params = { projectId: String(id) };
    expect((await callRoute(mod.action, await formPost("engineer", `/projects/${id}`, { intent: "edit", name: "Dock canopy, phase 2" }), params)).status).toBe(200);
    const viewer = await ctx.user("viewer");
    expect((await callRoute(mod.action, await formPost("engineer", `/projects/${id}`, { intent: "addMember", userId: String(viewer.id) }), params)).status).toBe(200);
    // Someone outside the team cannot be added.
    const other = await ctx.otherTeam();
    const outsider = await callRoute(mod.action, await formPost("engineer", `/projects/${id}`, { intent: "addMember", userId: String(other.adminId) }), params);
    expect(outsider.status).toBe(400);
    expect((await callRoute(mod.action, await formPost("engineer", `/projects/${id}`, { intent: "archive" }), params)).status).toBe(200);
    expect((await db("projects").where({ id }).first()).archived_at).not.toBeNull();
    expect((await callRoute(mod.action, await formPost("engineer", `/projects/${id}`, { intent: "restore" }), params)).status).toBe(200);
    const row = await db("projects").where({ id }).first();
    expect(row.name).toBe("Dock canopy, phase 2");
    expect(row.archived_at).toBeNull();
    const members = (await db("project_members").where({ project_id: id })).map((m) => m.user_id).sort();
    expect(members).toEqual([(await ctx.user("engineer")).id, viewer.id].sort());
    const actions = (await db("activity_log").where({ project_id: id }).orderBy("id")).map((a) => a.action);
    expect(actions).toEqual(["project_created", "project_edited", "member_added", "project_archived", "project_restored"]);
  });
});

describe("briefs", () => {
  test("a brief saved in US customary is stored in SI; run enqueues a sweep of it", async () => {
    const f = await workflowFixture(ctx);
    const mod = await loadRouteModule("routes/projects.$projectId.briefs.new.tsx");
    const values = problemToFormDefaults(DEFAULT_PROBLEM, { units: "us", name: "US brief" }) as Record<string, any>;
    values.depth = { ...values.depth, max: 12 }; // 12 in = 304.8 mm exactly (1 in = 25.4 mm, NIST SP 811)
    const saved = await callRoute(mod.action, await formPost("engineer", `/projects/${f.projectId}/briefs/new`, { ...briefFields(values), intent: "save" }), { projectId: String(f.projectId) });
    expect(saved.status).toBe(302);
    expect(saved.location).toMatch(/^\/briefs\/\d+\?saved=1$/);
    const briefId = Number(saved.location!.match(/\/briefs\/(\d+)/)![1]);
    const brief = await db("briefs").where({ id: briefId }).first();
    expect(brief.units).toBe("us");
    const problem = parseJson<SearchProblem>(brief.problem);
    expect(problem.depth.max).toBeCloseTo(304.8, 9);
    expect(problem.allowable!.tension).toBe(165); // untouched: exactly the SI value it opened with
    expect(await db("sweeps").where({ brief_id: briefId }).count({ n: "*" }).first()).toMatchObject({ n: 0 });

    const edit = await loadRouteModule("routes/briefs.$briefId.tsx");
    const run = await callRoute(edit.action, await formPost("engineer", `/briefs/${briefId}`, { ...briefFields(values), intent: "run" }), { briefId: String(briefId) });
    expect(run.status).toBe(302);
    const sweepId = Number(run.location!.match(/^\/sweeps\/(\d+)$/)![1]);
    const sweep = await db("sweeps").where({ id: sweepId }).first();
    expect(sweep).toMatchObject({ brief_id: briefId, project_id: f.projectId, status: "queued", recheck_of: null });
    expect(parseJson(sweep.problem)).toEqual(problem);
    await db("sweeps").where({ id: sweepId }).delete();
  });

  test("a reviewer may not save or run a brief", async () => {
    const f = await workflowFixture(ctx);
    const edit = await loadRouteModule("routes/briefs.$briefId.tsx");
    const values = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "x" });
    const res = await callRoute(edit.action, await formPost("reviewer", `/briefs/${f.briefId}`, { ...briefFields(values), intent: "run" }), { briefId: String(f.briefId) });
    expect(res.status).toBe(403);
  });
});

describe("candidates CSV", () => {
  test("lists the stored candidates with SI units in the header", async () => {
    const f = await workflowFixture(ctx);
    const mod = await loadRouteModule("routes/sweeps.$sweepId.candidates[.]csv.ts");
    const res = await callRoute(mod.loader, await requestAs("viewer", `/sweeps/${f.sweepId}/candidates.csv`), { sweepId: String(f.sweepId) });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/text\/csv/);
    const lines = String(res.data).trim().split(/\r?\n/);
    expect(lines[0]).toBe("rank,family,d_mm,b_mm,tf_mm,tw_mm,mass_kg_per_m,utilisation,governing,on_front,lightest_at_its_depth,basis");
    const stored = await db("candidates").where({ sweep_id: f.sweepId }).count({ n: "*" }).first();
    expect(lines.length - 1).toBe(Number(stored!.n));
    // each family's lightest at every depth marked, one row each
    const depthBests = await db("candidates").where({ sweep_id: f.sweepId, depth_best: true }).count({ n: "*" }).first();
    expect(Number(depthBests!.n)).toBeGreaterThan(0);
    expect(lines.slice(1).filter((l) => l.split(",")[10] === "yes")).toHaveLength(Number(depthBests!.n));
    expect(lines[1].startsWith("1,")).toBe(true);
  });
});

// Every route of app/routes.ts × every role (and signed out) → the status the server answers.
// Roles are enforced on the server (product.md), so this calls the loaders and actions directly.
//
// TO ADD A ROUTE: add one row to ROWS below (in your block), keyed by the path exactly as
// routes.ts builds it ("/projects/:projectId"). Give `params` a function that returns fixture ids
// for parametric paths (use ctx.once so every role sees the same fixture), `get` for the loader,
// `post` for the action (posted with an EMPTY body — allowed roles should then answer 400, which
// proves the guard let them through and nothing ran), `api: true` for JSON routes (empty body is
// "{}"), and `foreign` for params that point at another team's row (every role must get 404).
// The test fails when a route is missing here, or a row names a route that no longer exists.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { hashToken } from "~/lib/auth.server";
import { can, PERMISSIONS, reviewRefusal, ROLES, type Role } from "~/lib/roles";
import { attachmentFixture, foreignFixture, workflowFixture, type WorkflowFixture } from "./workflow-fixtures";
import { callRoute, FixtureContext, fillPath, flattenRoutes, loadRouteModule, requestAs, type DemoRole } from "./fixtures";

afterAll(() => closeDb());

type Who = Role | "signedOut";
const WHO: Who[] = [...ROLES, "signedOut"];
type Expect = Record<Who, number>;

export interface MatrixRow {
  get?: Expect;
  post?: Expect;
  api?: boolean;
  params?: (ctx: FixtureContext) => Promise<Record<string, string>>;
  foreign?: (ctx: FixtureContext) => Promise<Record<string, string>>;
}

/** A signed-in page: given roles' statuses (others 403); signed out is redirected to sign-in. */
const page = (ok: Partial<Record<Role, number>>, otherwise = 403): Expect => ({
  admin: ok.admin ?? otherwise,
  engineer: ok.engineer ?? otherwise,
  reviewer: ok.reviewer ?? otherwise,
  viewer: ok.viewer ?? otherwise,
  signedOut: 302,
});
/** Every member gets `status`; signed out → sign-in. */
const members = (status: number): Expect => page({ admin: status, engineer: status, reviewer: status, viewer: status });
/** The roles holding a permission get `status`, the rest 403 (one source of truth: roles.ts). */
const permitted = (permission: (typeof PERMISSIONS)[number], status: number, signedOut = 302): Expect => ({
  ...Object.fromEntries(ROLES.map((r) => [r, can(r, permission) ? status : 403])),
  signedOut,
}) as Expect;
/** Same status for everyone, signed in or not. */
const anyone = (status: number): Expect => ({ admin: status, engineer: status, reviewer: status, viewer: status, signedOut: status });
/** API: like `permitted`, but signed out is a JSON 401, not a redirect. */
const apiPermitted = (permission: (typeof PERMISSIONS)[number], status: number): Expect => permitted(permission, status, 401);

// Fixture tokens for the e-mailed links, so their pages render as a newcomer would see them.
async function inviteToken(ctx: FixtureContext): Promise<Record<string, string>> {
  return ctx.once("inviteToken", async () => {
    const token = "matrix-invitation-token";
    await db("invitations").insert({ team_id: await ctx.teamId(), email: "matrix-invitee@example.org", role: "viewer", token_hash: hashToken(token), expires_at: new Date(Date.now() + 3600_000) });
    return { token };
  });
}
async function resetToken(ctx: FixtureContext): Promise<Record<string, string>> {
  return ctx.once("resetToken", async () => {
    const token = "matrix-reset-token";
    await db("password_resets").insert({ user_id: (await ctx.user("viewer")).id, token_hash: hashToken(token), expires_at: new Date(Date.now() + 3600_000) });
    return { token };
  });
}

// Workflow fixtures: one project/brief/sweep/recheck/option per run (workflow-fixtures.ts).
const wf = (key: keyof WorkflowFixture, param: string = key) => async (ctx: FixtureContext) => ({ [param]: String((await workflowFixture(ctx))[key]) });
const wfForeign = (key: keyof WorkflowFixture, param: string = key) => async (ctx: FixtureContext) => ({ [param]: String((await foreignFixture(ctx))[key]) });
const attachment = async (ctx: FixtureContext) => ({ attachmentId: String(await attachmentFixture(ctx)) });
const foreignAttachment = async (ctx: FixtureContext) => ({ attachmentId: String(await attachmentFixture(ctx, true)) });

export const ROWS: Record<string, MatrixRow> = {
  // ---- Sign-in and team
  "/sign-in": { get: { ...anyone(302), signedOut: 200 }, post: anyone(400) },
  "/sign-out": { get: { ...members(200) } }, // its POST signs the demo user out everywhere: covered in auth.test.ts
  "/invite/:token": { params: inviteToken, get: anyone(200), post: anyone(400) },
  "/forgot-password": { get: anyone(200), post: anyone(400) },
  "/reset-password/:token": { params: resetToken, get: anyone(200), post: anyone(400) },
  "/healthz": { get: anyone(200) },
  "(layout) routes/app-layout.tsx": { get: members(200) },
  "/": { get: members(200) },
  "/account": { get: members(200), post: members(400) },
  "/messages": { get: members(200) },
  "/admin": { get: permitted("manageTeam", 200), post: permitted("manageTeam", 400) },
  "/admin/outbox": { get: permitted("manageTeam", 200) },
  // reading the team's materials is admin-only like /admin; an empty post names the missing intent
  "/admin/materials": { get: permitted("manageTeam", 200), post: permitted("manageTeam", 400) },
  // section catalogues: admin only; an empty post names the missing intent
  "/admin/catalogues": { get: permitted("manageCatalogues", 200), post: permitted("manageCatalogues", 400) },
  // cost settings: admin only like materials; an empty post names the missing intent
  "/admin/costs": { get: permitted("manageTeam", 200), post: permitted("manageTeam", 400) },

  // ---- Section bench (add rows here)
  // the bench is for every member; saving to a project needs editBrief (an empty post is a 400)
  "/bench": { get: members(200), post: permitted("editBrief", 400) },
  // GET is 405 for anyone (no data); POST "{}" passes the guard and fails validation
  "/api/v1/properties": { get: anyone(405), post: apiPermitted("read", 400), api: true },

  // ---- Sweep queue (add rows here)
  // every member reads and marks their own notices; an empty post names the missing intent
  "/notices": { get: members(200), post: members(400) },
  // POST "{}": roles that may run sweeps (or rechecks) pass the guard and fail validation (400).
  "/api/v1/sweeps": { get: apiPermitted("read", 200), post: { admin: 400, engineer: 400, reviewer: 400, viewer: 403, signedOut: 401 }, api: true },
  "/api/v1/sweeps/:id": { params: wf("sweepId", "id"), foreign: wfForeign("sweepId", "id"), get: apiPermitted("read", 200) },
  "/api/v1/sweeps/:id/candidates": { params: wf("sweepId", "id"), foreign: wfForeign("sweepId", "id"), get: apiPermitted("read", 200) },
  // The fixture sweep is the engineer's and finished: its owner and the admin get through to a
  // 409 (nothing to cancel, nothing changed); the reviewer and the viewer may not cancel it.
  "/api/v1/sweeps/:id/cancel": { params: wf("sweepId", "id"), foreign: wfForeign("sweepId", "id"), post: { admin: 409, engineer: 409, reviewer: 403, viewer: 403, signedOut: 401 }, api: true },

  // ---- Workflow (add rows here)
  "/projects": { get: members(200) },
  "/projects/new": { get: permitted("createProject", 200), post: permitted("createProject", 400) },
  "/projects/:projectId": { params: wf("projectId"), foreign: wfForeign("projectId"), get: members(200), post: permitted("createProject", 400) },
  "/projects/:projectId/schedule": { params: wf("projectId"), foreign: wfForeign("projectId"), get: members(200) },
  "/projects/:projectId/schedule.csv": { params: wf("projectId"), foreign: wfForeign("projectId"), get: members(200) },
  "/projects/:projectId/cutting-list.csv": { params: wf("projectId"), foreign: wfForeign("projectId"), get: members(200) },
  "/projects/:projectId/briefs/new": { params: wf("projectId"), foreign: wfForeign("projectId"), get: permitted("editBrief", 200), post: permitted("editBrief", 400) },
  "/briefs/:briefId": { params: wf("briefId"), foreign: wfForeign("briefId"), get: members(200), post: permitted("editBrief", 400) },
  "/sweeps/:sweepId": { params: wf("sweepId"), foreign: wfForeign("sweepId"), get: members(200), post: members(400) },
  "/sweeps/:sweepId/recheck": { params: wf("sweepId"), foreign: wfForeign("sweepId"), get: permitted("recheck", 200), post: permitted("recheck", 400) },
  "/sweeps/:sweepId/comparison": { params: wf("recheckId", "sweepId"), foreign: wfForeign("recheckId", "sweepId"), get: members(200) },
  "/sweeps/:sweepId/candidates.csv": { params: wf("sweepId"), foreign: wfForeign("sweepId"), get: members(200) },
  "/options/:optionId": { params: wf("optionId"), foreign: wfForeign("optionId"), get: members(200), post: members(400) },
  "/options/:optionId/record": { params: wf("optionId"), foreign: wfForeign("optionId"), get: members(200) },
  "/options/:optionId/section.svg": { params: wf("optionId"), foreign: wfForeign("optionId"), get: members(200) },
  // the list lives on the option page (redirect); an empty post: the roles that attach get 400
  "/options/:optionId/attachments": { params: wf("optionId"), foreign: wfForeign("optionId"), get: members(302), post: permitted("attach", 400) },
  "/attachments/:attachmentId": { params: attachment, foreign: foreignAttachment, get: members(200) },
  "/projects/:projectId/cutting-list": { params: wf("projectId"), foreign: wfForeign("projectId"), get: members(200) },
  "/stock-lists": { get: members(200), post: permitted("editBrief", 400) },

  // ---- Layout: unknown addresses (add rows here)
  // inside the frame: a 404 for every member (drawn by the layout's error boundary); signed out → sign-in
  "/*": { get: members(404) },
  // under /api/: a JSON 404 for anyone, any method
  "/api/*": { get: anyone(404), post: anyone(404), api: true },
  // a build file that does not exist: a plain 404 for anyone
  "/assets/*": { get: anyone(404) },
};

const flat = flattenRoutes();

describe("the matrix covers app/routes.ts", () => {
  test("every route in app/routes.ts has a row", () => {
    const missing = flat.map((r) => r.key).filter((k) => !(k in ROWS));
    expect(missing, `add these routes to ROWS in tests/integration/role-matrix.test.ts`).toEqual([]);
  });
  test("every row is a route in app/routes.ts", () => {
    const known = new Set(flat.map((r) => r.key));
    expect(Object.keys(ROWS).filter((k) => !known.has(k)), "rows for routes that no longer exist").toEqual([]);
  });
  test("every action has a post row and every loader a get row", async () => {
    const gaps: string[] = [];
    for (const r of flat) {
      const row = ROWS[r.key];
      if (!row) continue;
      const mod = await loadRouteModule(r.file);
      if (mod.loader && !row.get) gaps.push(`${r.key}: loader without get`);
      if (!mod.loader && row.get) gaps.push(`${r.key}: get row but no loader`);
      if (!mod.action && row.post) gaps.push(`${r.key}: post row but no action`);
      if (mod.action && !row.post && r.key !== "/sign-out") gaps.push(`${r.key}: action without post`);
    }
    expect(gaps).toEqual([]);
  });
});

const ctx = new FixtureContext();
const as = (who: Who): DemoRole | null => (who === "signedOut" ? null : who);

for (const r of flat) {
  const row = ROWS[r.key];
  if (!row) continue;
  const routePath = r.key.startsWith("(layout)") ? "/" : r.key;
  describe(r.key, () => {
    for (const [method, expected] of [["GET", row.get], ["POST", row.post]] as const) {
      if (!expected) continue;
      for (const who of WHO) {
        test(`${method} as ${who} → ${expected[who]}`, async () => {
          const mod = await loadRouteModule(r.file);
          const params = row.params ? await row.params(ctx) : {};
          const url = fillPath(routePath, params);
          const init: RequestInit =
            method === "GET"
              ? {}
              : row.api
                ? { method, body: "{}", headers: { "Content-Type": "application/json" } }
                : { method, body: new URLSearchParams(), headers: { "Content-Type": "application/x-www-form-urlencoded" } };
          const res = await callRoute(method === "GET" ? mod.loader : mod.action, await requestAs(as(who), url, init), params);
          if (res.error) throw res.error;
          expect(res.status, JSON.stringify(res.data)?.slice(0, 300)).toBe(expected[who]);
          if (who === "signedOut" && res.status === 302) expect(res.location).toMatch(/^\/sign-in/);
        });
      }
    }
    if (row.foreign) {
      for (const who of ROLES) {
        test(`another team's row as ${who} → 404`, async () => {
          const mod = await loadRouteModule(r.file);
          const params = await row.foreign!(ctx);
          const res = await callRoute(mod.loader ?? mod.action, await requestAs(who, fillPath(routePath, params)), params);
          if (res.error) throw res.error;
          expect(res.status).toBe(404);
        });
      }
    }
  });
}

describe("roles.ts grants (product.md, People and roles)", () => {
  test.each([
    ["admin", PERMISSIONS],
    ["engineer", ["read", "createProject", "editBrief", "runSweep", "saveOption", "requestReview", "recheck", "attach"]],
    ["reviewer", ["read", "recheck", "review", "attach"]],
    ["viewer", ["read"]],
  ] as const)("%s may exactly %j", (role, allowed) => {
    expect(PERMISSIONS.filter((p) => can(role, p))).toEqual([...allowed]);
  });
});

// Four-eyes review (roles.ts reviewRefusal): role × how the person is tied to the option → may they
// approve it? Each case posts a real decision on a fresh option waiting for review.
describe("four-eyes review: nobody decides an option they saved or whose review they asked for", () => {
  type Tie = "saved it" | "asked for its review" | "neither";
  const TIES: Tie[] = ["saved it", "asked for its review", "neither"];
  const MAY_APPROVE: Record<Role, Record<Tie, boolean>> = {
    admin: { "saved it": false, "asked for its review": false, neither: true },
    engineer: { "saved it": false, "asked for its review": false, neither: false },
    reviewer: { "saved it": false, "asked for its review": false, neither: true },
    viewer: { "saved it": false, "asked for its review": false, neither: false },
  };

  async function optionInReview(savedBy: number, requestedBy: number): Promise<number> {
    const f = await workflowFixture(ctx);
    const base = await db("options").where({ id: f.optionId }).first("project_id", "brief_id", "sweep_id", "candidate", "problem");
    const [id] = await db("options").insert({ ...base, candidate: JSON.stringify(parseJson(base.candidate)), problem: JSON.stringify(parseJson(base.problem)), review_state: "in_review", created_by: savedBy });
    await db("reviews").insert({ option_id: id, user_id: requestedBy, decision: "requested" });
    return Number(id);
  }

  for (const role of ROLES) {
    for (const tie of TIES) {
      const allowed = MAY_APPROVE[role][tie];
      test(`${role} who ${tie === "neither" ? "neither saved it nor asked" : tie} → ${allowed ? "approves" : "403"}`, async () => {
        const me = (await ctx.user(role)).id;
        const other = (await ctx.user(role === "engineer" ? "engineer2" : "engineer")).id;
        const id = await optionInReview(tie === "saved it" ? me : other, tie === "asked for its review" ? me : other);
        expect(reviewRefusal(role, { saved: tie === "saved it", requested: tie === "asked for its review" }) === null).toBe(allowed);
        const mod = await loadRouteModule("routes/options.$optionId.tsx");
        const body = new URLSearchParams({ intent: "decide", decision: "approved" });
        const res = await callRoute(mod.action, await requestAs(role, `/options/${id}`, { method: "POST", body, headers: { "Content-Type": "application/x-www-form-urlencoded" } }), { optionId: String(id) });
        if (res.error) throw res.error;
        expect(res.status, JSON.stringify(res.data)).toBe(allowed ? 200 : 403);
        expect((await db("options").where({ id }).first("review_state")).review_state).toBe(allowed ? "approved" : "in_review");
      });
    }
  }
});

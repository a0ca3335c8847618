// Bad input to every action: an empty post, a 1 MB post, a malformed body and a wrong value must
// each get a 4xx whose message names the field (or the body), never a 500, and write nothing.
//
// TO ADD AN ACTION: add one row to ROWS (in your block), keyed by the path as routes.ts builds it.
// `as` is a role allowed to post there (so the guard passes and validation is what answers),
// `field` the field an empty post must name, `malformed` a body with a wrong value and
// `malformedField` the field its answer must name. `api: true` posts JSON instead of a form.
// The test fails when a route with an action has no row (list body-less actions in NO_BODY).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { hashToken } from "~/lib/auth.server";
import { workflowFixture, type WorkflowFixture } from "./workflow-fixtures";
import { callRoute, FixtureContext, fillPath, flattenRoutes, loadRouteModule, messageOf, requestAs, tableCounts, type As } from "./fixtures";

afterAll(() => closeDb());

export interface BadInputRow {
  as: As;
  field: string;
  malformed?: Record<string, string> | unknown;
  malformedField?: string;
  api?: boolean;
  params?: (ctx: FixtureContext) => Promise<Record<string, string>>;
}

/** Actions that take no input at all. */
// (Sweep queue: cancel reads no body; its bad ids are covered in queue-api.test.ts)
// (/api/* is the JSON 404 for addresses no endpoint answers: it reads nothing; layout.test.ts covers it)
const NO_BODY = new Set(["/sign-out", "/api/v1/sweeps/:id/cancel", "/api/*"]);

const inviteToken = (ctx: FixtureContext) =>
  ctx.once("badInviteToken", async () => {
    const token = "bad-input-invitation-token";
    await db("invitations").insert({ team_id: await ctx.teamId(), email: "bad-input-invitee@example.org", role: "viewer", token_hash: hashToken(token), expires_at: new Date(Date.now() + 3600_000) });
    return { token };
  });
const resetToken = (ctx: FixtureContext) =>
  ctx.once("badResetToken", async () => {
    const token = "bad-input-reset-token";
    await db("password_resets").insert({ user_id: (await ctx.user("viewer")).id, token_hash: hashToken(token), expires_at: new Date(Date.now() + 3600_000) });
    return { token };
  });

// Workflow: fixtures and a complete, valid brief form to break one field of.
const wf = (key: keyof WorkflowFixture) => async (ctx: FixtureContext) => ({ [key]: String((await workflowFixture(ctx))[key]) });
const briefFields: Record<string, string> = {
  name: "Bad-input brief",
  units: "si",
  "moment.sagging": "120",
  "allowable.tension": "165",
  "allowable.compression": "165",
  "depth.min": "100",
  "depth.max": "400",
  "depth.step": "10",
  "width.min": "50",
  "width.max": "300",
  "width.step": "10",
  thicknesses: "6, 8, 10",
  families: "channel",
};

export const ROWS: Record<string, BadInputRow> = {
  // ---- Sign-in and team
  "/sign-in": { as: null, field: "email", malformed: { email: "not-an-address", password: "x" } },
  "/invite/:token": { as: null, params: inviteToken, field: "name", malformed: { name: "Ada", password: "short", confirm: "short" }, malformedField: "password" },
  "/forgot-password": { as: null, field: "email", malformed: { email: "@@" } },
  "/reset-password/:token": { as: null, params: resetToken, field: "password", malformed: { password: "long enough pass", confirm: "another thing" }, malformedField: "confirm" },
  "/account": { as: "engineer", field: "intent", malformed: { intent: "revokeToken", tokenId: "twelve" }, malformedField: "tokenId" },
  "/admin": { as: "admin", field: "intent", malformed: { intent: "invite", email: "new@example.org", role: "overlord" }, malformedField: "role" },
  // density typed in t/m³ (7.85) instead of kg/m³ is refused by the material's range
  "/admin/materials": { as: "admin", field: "intent", malformed: { intent: "create", name: "Unit slip", E: "210000", fy: "355", density: "7.85" }, malformedField: "density" },
  // a catalogue whose one line has text where a dimension is due: malformed, nothing kept
  // a weld price typed as one number per line instead of "throat, cost per metre"
  "/admin/costs": { as: "admin", field: "intent", malformed: { intent: "save", rolledPricePerKg: "1.2", weld: "4\n5, 7.5" }, malformedField: "weld" },
  "/admin/catalogues": { as: "admin", field: "intent", malformed: { intent: "create", name: "Bad catalogue", file: "designation,shape,d_mm\nX,I,abc\n" }, malformedField: "file" },

  // ---- Section bench (add rows here)
  "/bench": { as: "engineer", field: "projectId", malformed: { projectId: "1", name: "trial", state: "{not a bench" }, malformedField: "state" },
  "/api/v1/properties": {
    as: "engineer",
    api: true,
    field: "plates",
    malformed: { plates: [{ b: 200, h: 20, z: 0, y: 0 }, { b: 10, h: 300, z: 95, y: 10 }] },
    malformedField: "plates",
  },

  // ---- Sweep queue (add rows here)
  "/notices": { as: "viewer", field: "intent", malformed: { intent: "read", id: "third" }, malformedField: "id" },
  "/api/v1/sweeps": {
    as: "engineer",
    api: true,
    field: "briefId",
    malformed: { problem: { moment: { sagging: 100 }, allowable: { tension: 165, compression: 165 }, depth: { min: 300, max: 100, step: 10 }, width: { min: 50, max: 200, step: 10 }, thicknesses: [6, 8], families: ["i"] } },
    malformedField: "depth.max",
  },

  // ---- Workflow (add rows here)
  "/projects/new": { as: "engineer", field: "name", malformed: { name: "x".repeat(200) }, malformedField: "name" },
  "/projects/:projectId": { as: "engineer", params: wf("projectId"), field: "intent", malformed: { intent: "addMember", userId: "someone" }, malformedField: "userId" },
  "/projects/:projectId/briefs/new": { as: "engineer", params: wf("projectId"), field: "name", malformed: { ...briefFields, "depth.max": "50" }, malformedField: "depth.max" },
  "/briefs/:briefId": { as: "engineer", params: wf("briefId"), field: "name", malformed: { ...briefFields, "moment.sagging": "lots" }, malformedField: "moment.sagging" },
  "/sweeps/:sweepId": { as: "engineer", params: wf("sweepId"), field: "intent", malformed: { intent: "saveOption", rank: "first" }, malformedField: "rank" },
  "/sweeps/:sweepId/recheck": { as: "reviewer", params: wf("sweepId"), field: "name", malformed: { ...briefFields, thicknesses: "6, eight" }, malformedField: "thicknesses" },
  "/options/:optionId": { as: "reviewer", params: wf("optionId"), field: "intent", malformed: { intent: "decide", decision: "maybe" }, malformedField: "decision" },
  "/options/:optionId/attachments": { as: "engineer", params: wf("optionId"), field: "intent", malformed: { intent: "delete", attachmentId: "twelve" }, malformedField: "attachmentId" },
  "/stock-lists": { as: "engineer", field: "intent", malformed: { intent: "save", file: "thickness_mm\n6\nabc\n", name: "Bad" }, malformedField: "file" },
};

const ONE_MB = 1024 * 1024;
const ctx = new FixtureContext();
const flat = flattenRoutes();
let withAction: { key: string; file: string }[] = [];

beforeAll(async () => {
  withAction = [];
  for (const r of flat) if ((await loadRouteModule(r.file)).action) withAction.push(r);
});

test("every action has a bad-input row", () => {
  const missing = withAction.map((r) => r.key).filter((k) => !(k in ROWS) && !NO_BODY.has(k));
  expect(missing, "add these actions to ROWS in tests/integration/bad-input.test.ts").toEqual([]);
});

function body(row: BadInputRow, value: Record<string, string> | unknown): RequestInit {
  if (row.api) return { method: "POST", body: JSON.stringify(value), headers: { "Content-Type": "application/json" } };
  return { method: "POST", body: new URLSearchParams(value as Record<string, string>), headers: { "Content-Type": "application/x-www-form-urlencoded" } };
}

for (const r of flat) {
  const row = ROWS[r.key];
  if (!row) continue;
  describe(`POST ${r.key}`, () => {
    const cases: [string, () => RequestInit, RegExp][] = [
      ["an empty body", () => (row.api ? body(row, {}) : body(row, {})), new RegExp(`\\b${row.field}\\b`, "i")],
      [
        "a 1 MB body",
        () => body(row, { [row.field]: "x".repeat(ONE_MB) }),
        row.api ? /body|too large|over/i : new RegExp(`\\b${row.field}\\b.*too large|too large`, "i"),
      ],
      [
        "a malformed body",
        () =>
          row.api
            ? { method: "POST", body: '{"unterminated": ', headers: { "Content-Type": "application/json" } }
            : { method: "POST", body: "--nope\r\ngarbage without parts", headers: { "Content-Type": "multipart/form-data; boundary=abc" } },
        /body|form|json/i,
      ],
    ];
    if (row.malformed !== undefined) {
      cases.push(["a wrong value", () => body(row, row.malformed), new RegExp(`\\b${row.malformedField ?? row.field}\\b`, "i")]);
    }
    for (const [label, init, names] of cases) {
      test(`${label} → 4xx naming it, nothing written`, async () => {
        const mod = await loadRouteModule(r.file);
        const params = row.params ? await row.params(ctx) : {};
        const before = await tableCounts();
        const res = await callRoute(mod.action, await requestAs(row.as, fillPath(r.key, params), init()), params);
        if (res.error) throw res.error;
        expect(res.status, messageOf(res)).toBeGreaterThanOrEqual(400);
        expect(res.status, messageOf(res)).toBeLessThan(500);
        expect(messageOf(res)).toMatch(names);
        expect(await tableCounts()).toEqual(before);
      });
    }
  });
}

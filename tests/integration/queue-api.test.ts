// The /api/v1/sweeps routes, called as the framework calls them (loaders and actions with real
// Requests): the happy paths and every kind of bad input (malformed JSON, wrong types, unknown
// fields, oversized bodies, bad ids, another team's sweep) → 4xx with a message, nothing written.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import * as create from "~/routes/api.v1.sweeps";
import * as one from "~/routes/api.v1.sweeps.$id";
import * as cands from "~/routes/api.v1.sweeps.$id.candidates";
import * as cancel from "~/routes/api.v1.sweeps.$id.cancel";
import { callRoute, FixtureContext, messageOf, requestAs, tableCounts, type As } from "./fixtures";
import { foreignFixture, workflowFixture, type WorkflowFixture } from "./workflow-fixtures";
import { tinyProblem } from "./queue-helpers";

afterAll(() => closeDb());
const ctx = new FixtureContext();
let fx: WorkflowFixture;
let foreign: WorkflowFixture;
beforeAll(async () => {
  fx = await workflowFixture(ctx);
  foreign = await foreignFixture(ctx);
});

async function post(as: As, body: unknown, headers: Record<string, string> = {}) {
  const init: RequestInit = { method: "POST", body: typeof body === "string" ? body : JSON.stringify(body), headers: { "Content-Type": "application/json", ...headers } };
  return callRoute(create.action, await requestAs(as, "/api/v1/sweeps", init));
}
async function get(as: As, id: string, query = "") {
  return callRoute(one.loader, await requestAs(as, `/api/v1/sweeps/${id}${query}`), { id });
}
async function getCands(as: As, id: string, query = "") {
  return callRoute(cands.loader, await requestAs(as, `/api/v1/sweeps/${id}/candidates${query}`), { id });
}
async function doCancel(as: As, id: string) {
  return callRoute(cancel.action, await requestAs(as, `/api/v1/sweeps/${id}/cancel`, { method: "POST", headers: { "Content-Type": "application/json" } }), { id });
}
/** A bad request: 4xx, a message matching `names`, no row written anywhere. */
async function rejects(run: () => Promise<{ status: number; data: unknown; error?: unknown }>, status: number, names: RegExp) {
  const before = await tableCounts();
  const res = await run();
  if (res.error) throw res.error;
  expect(res.status, JSON.stringify(res.data)).toBe(status);
  expect(messageOf(res as Parameters<typeof messageOf>[0])).toMatch(names);
  expect(await tableCounts()).toEqual(before);
}

describe("POST /api/v1/sweeps", () => {
  test("a full problem → 202 with id and URLs; GET shows it queued", async () => {
    const res = await post("engineer", { problem: tinyProblem(1), projectId: fx.projectId });
    expect(res.status).toBe(202);
    const data = res.data as { id: number; url: string; page: string; created: boolean };
    expect(data).toMatchObject({ created: true, status: "queued", url: `/api/v1/sweeps/${data.id}`, page: `/sweeps/${data.id}` });
    expect(res.headers.get("location")).toBe(data.url);
    const s = await get("viewer", String(data.id));
    expect(s.status).toBe(200);
    expect(s.data).toMatchObject({ id: data.id, status: "queued", projectId: fx.projectId, progress: { done: 0, total: 0, fraction: 0 }, best: null });
    // Results read through the API carry the pages' caution (product.md, "Safety").
    expect((s.data as { caution: string }).caution).toMatch(/licensed engineer before fabrication/);
  });

  test("a brief id → the brief's problem and project", async () => {
    const res = await post("engineer", { briefId: fx.briefId });
    expect(res.status).toBe(202);
    const row = await db("sweeps").where({ id: (res.data as { id: number }).id }).first("project_id", "brief_id", "problem");
    expect(row).toMatchObject({ project_id: fx.projectId, brief_id: fx.briefId });
    const log = await db("activity_log").where({ subject_type: "sweep", subject_id: (res.data as { id: number }).id }).first("action", "project_id");
    expect(log).toEqual({ action: "sweep_started", project_id: fx.projectId });
  });

  test("Idempotency-Key: the same request twice is one sweep; the key with another body is a 409", async () => {
    const h = { "Idempotency-Key": "api-test-key-1" };
    const a = await post("engineer", { problem: tinyProblem(2) }, h);
    const b = await post("engineer", { problem: tinyProblem(2) }, h);
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect((b.data as { id: number }).id).toBe((a.data as { id: number }).id);
    expect((b.data as { created: boolean }).created).toBe(false);
    // Issue 11, item 13: a replay after the sweep ran answers with its status now, not "queued",
    // and with the HTTP status the first answer had.
    const id = (a.data as { id: number }).id;
    await db("sweeps").where({ id }).update({ status: "succeeded", started_at: db.fn.now(), finished_at: db.fn.now() });
    const c = await post("engineer", { problem: tinyProblem(2) }, h);
    expect(c.status).toBe(202);
    expect(c.data).toMatchObject({ id, created: false, status: "succeeded", url: `/api/v1/sweeps/${id}` });
    await rejects(() => post("engineer", { problem: tinyProblem(3) }, h), 409, /Idempotency-Key.*different request/);
    await rejects(() => post("engineer", { problem: tinyProblem(3) }, { "Idempotency-Key": "x".repeat(101) }), 400, /Idempotency-Key.*100/);
  });

  test("the per-user queued limit → 429 with a clear message", async () => {
    process.env.SPARWISE_MAX_QUEUED_PER_USER = "1";
    try {
      await db("sweeps").where({ status: "queued" }).update({ status: "cancelled" });
      expect((await post("engineer2", { problem: tinyProblem(4) })).status).toBe(202);
      await rejects(() => post("engineer2", { problem: tinyProblem(5) }), 429, /sweeps waiting in the queue \(the limit is 1\)/);
    } finally {
      delete process.env.SPARWISE_MAX_QUEUED_PER_USER;
    }
  });

  test("roles: a viewer may not; a reviewer only as a recheck", async () => {
    await rejects(() => post("viewer", { problem: tinyProblem(1) }), 403, /viewer may not run sweeps/);
    await rejects(() => post("reviewer", { problem: tinyProblem(1) }), 403, /only rechecks/);
    const res = await post("reviewer", { problem: tinyProblem(6), recheckOf: fx.sweepId });
    expect(res.status).toBe(202);
    const row = await db("sweeps").where({ id: (res.data as { id: number }).id }).first("recheck_of", "project_id");
    expect(row).toEqual({ recheck_of: fx.sweepId, project_id: fx.projectId });
    await rejects(() => post(null, { problem: tinyProblem(1) }), 401, /sign in/);
  });

  test("bad bodies → 4xx naming the problem, nothing written", async () => {
    await rejects(() => post("engineer", '{"problem": '), 400, /not valid JSON/);
    await rejects(() => post("engineer", ""), 400, /empty/);
    await rejects(() => post("engineer", "[1,2]"), 400, /object/);
    await rejects(() => post("engineer", { problem: tinyProblem(1), colour: "red" }), 400, /colour/);
    await rejects(() => post("engineer", { briefId: "seven" }), 400, /briefId/);
    await rejects(() => post("engineer", { briefId: 1.5 }), 400, /briefId.*whole/);
    await rejects(() => post("engineer", { briefId: fx.briefId, problem: tinyProblem(1) }), 400, /exactly one/);
    await rejects(() => post("engineer", { problem: "big" }), 400, /problem must be an object/);
    await rejects(() => post("engineer", { problem: { ...tinyProblem(1), thicknesses: [6, "eight"] } }), 400, /problem\.thicknesses/);
    await rejects(() => post("engineer", { problem: { ...tinyProblem(1), families: ["zed"] } }), 400, /unknown family "zed"/);
    await rejects(() => post("engineer", { problem: { ...tinyProblem(1), depth: { min: 1, max: 1e9, step: 1e-3 } } }), 400, /depth/);
    await rejects(() => post("engineer", { problem: tinyProblem(1), pad: "x".repeat(70 * 1024) }), 413, /body over 64 kB/);
  });

  test("another team's brief, project or sweep → 404, nothing written", async () => {
    await rejects(() => post("engineer", { briefId: foreign.briefId }), 404, /brief not found/);
    await rejects(() => post("engineer", { problem: tinyProblem(1), projectId: foreign.projectId }), 404, /project not found/);
    await rejects(() => post("engineer", { problem: tinyProblem(1), recheckOf: foreign.sweepId }), 404, /recheckOf sweep not found/);
    await rejects(() => post("engineer", { briefId: 2 ** 31 - 1 }), 404, /brief not found/);
  });
});

describe("GET /api/v1/sweeps/:id and /candidates", () => {
  test("status, counts and best of a finished sweep", async () => {
    const s = await get("viewer", String(fx.sweepId));
    expect(s.status).toBe(200);
    const d = s.data as { status: string; counts: { grid: number }; best: { family: string }; progress: { fraction: number } };
    expect(d.status).toBe("succeeded");
    expect(d.counts.grid).toBeGreaterThan(0);
    expect(d.best.family).toMatch(/channel|i/);
    expect(d.progress.fraction).toBe(1);
  });

  test("candidates: paging, sorting, family filter, front only", async () => {
    const all = await getCands("viewer", String(fx.sweepId), "?pageSize=500");
    expect(all.status).toBe(200);
    const items = (all.data as { items: { rank: number; family: string; onFront: boolean; utilisation: number }[]; total: number }).items;
    expect(items[0].rank).toBe(1);
    const fam = await getCands("viewer", String(fx.sweepId), "?family=channel&pageSize=500");
    expect((fam.data as { items: { family: string }[] }).items.every((c) => c.family === "channel")).toBe(true);
    const front = await getCands("viewer", String(fx.sweepId), "?frontOnly=true&pageSize=500");
    expect((front.data as { total: number }).total).toBe(items.filter((c) => c.onFront).length);
    const byU = await getCands("viewer", String(fx.sweepId), "?sort=-utilisation&pageSize=500");
    const us = (byU.data as { items: { utilisation: number }[] }).items.map((c) => c.utilisation);
    expect(us).toEqual([...us].sort((a, b) => b - a));
    const p = await getCands("viewer", String(fx.sweepId), "?page=2&pageSize=1");
    expect((p.data as { items: { rank: number }[] }).items.map((c) => c.rank)).toEqual(items.length >= 2 ? [2] : []);
  });

  test("bad ids, bad queries and another team's sweep → 4xx with a message", async () => {
    for (const id of ["abc", "0", "-1", "1e3", "99999999999", String(2 ** 31 - 1)]) await rejects(() => get("engineer", id), 404, /sweep not found/);
    await rejects(() => get("admin", String(foreign.sweepId)), 404, /sweep not found/);
    await rejects(() => getCands("admin", String(foreign.sweepId)), 404, /sweep not found/);
    await rejects(() => getCands("viewer", String(fx.sweepId), "?page=0"), 400, /page/);
    await rejects(() => getCands("viewer", String(fx.sweepId), "?pageSize=5000"), 400, /pageSize/);
    await rejects(() => getCands("viewer", String(fx.sweepId), "?sort=weight"), 400, /sort must be one of/);
    await rejects(() => getCands("viewer", String(fx.sweepId), "?family=zed"), 400, /family/);
    await rejects(() => getCands("viewer", String(fx.sweepId), "?frontOnly=yes"), 400, /frontOnly/);
    await rejects(() => getCands("viewer", String(fx.sweepId), "?colour=red"), 400, /colour/);
    await rejects(() => get(null, String(fx.sweepId)), 401, /sign in/);
  });
});

describe("POST /api/v1/sweeps/:id/cancel", () => {
  test("owner cancels a queued sweep; others may not; finished → 409; another team's → 404", async () => {
    const made = await post("engineer", { problem: tinyProblem(7) });
    const id = String((made.data as { id: number }).id);
    await rejects(() => doCancel("viewer", id), 403, /owner/);
    await rejects(() => doCancel("engineer2", id), 403, /owner/);
    await rejects(() => doCancel("reviewer", id), 403, /owner/);
    const res = await doCancel("engineer", id);
    expect(res.status).toBe(200);
    expect(res.data).toMatchObject({ status: "cancelled", cancelRequested: true });
    expect((await get("viewer", id)).data).toMatchObject({ status: "cancelled" });
    // Again: a no-op answer, not an error.
    expect((await doCancel("engineer", id)).status).toBe(200);
    await rejects(() => doCancel("admin", String(fx.sweepId)), 409, /already succeeded/);
    await rejects(() => doCancel("admin", String(foreign.sweepId)), 404, /sweep not found/);
    await rejects(() => doCancel("admin", "nope"), 404, /sweep not found/);
    await rejects(() => doCancel(null, id), 401, /sign in/);
  });

  test("an admin cancels anyone's sweep in the team", async () => {
    const made = await post("engineer2", { problem: tinyProblem(8) });
    const id = String((made.data as { id: number }).id);
    expect((await doCancel("admin", id)).data).toMatchObject({ status: "cancelled" });
  });
});

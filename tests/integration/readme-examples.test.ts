// Issue 11, item 13: the README's API examples run as written. Every `-d '…'` body of the README's
// curl commands is sent through the route it names, with the headers the command gives, and the
// figures the README states are checked against the answers.
import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { getUser } from "~/lib/auth.server";
import { createApiToken } from "~/lib/api-tokens.server";
import * as properties from "~/routes/api.v1.properties";
import * as sweeps from "~/routes/api.v1.sweeps";
import { BASE, callRoute, requestAs } from "./fixtures";
import { ROOT } from "./queue-helpers";

afterAll(() => closeDb());

const README = readFileSync(path.join(ROOT, "README.md"), "utf8");
/** Each curl POST in the README: its path, headers (-H) and body (-d). */
const commands = [...README.matchAll(/curl -s -X POST http:\/\/localhost:3000(\/api\/v1\/[a-z]+) \\\n((?:\s+-H "[^"]+"(?: \\\n)?)+)\s+-d '([^']+)'/g)].map((m) => ({
  path: m[1],
  headers: Object.fromEntries([...m[2].matchAll(/-H "([^:]+): ([^"]+)"/g)].map((h) => [h[1], h[2]])),
  body: m[3],
}));

let token = "";
beforeAll(async () => {
  const engineer = (await getUser(await requestAs("engineer", "/")))!;
  token = (await createApiToken(engineer, "readme examples")).token;
});

function send(c: (typeof commands)[number]) {
  const headers = { ...c.headers, Authorization: `Bearer ${token}` };
  const req = new Request(new URL(c.path, BASE), { method: "POST", body: c.body, headers });
  return callRoute(c.path.endsWith("properties") ? properties.action : sweeps.action, req);
}

describe("README examples", () => {
  test("the README has the plates and family forms of the properties body and a sweeps body", () => {
    expect(commands.filter((c) => c.path === "/api/v1/properties").map((c) => Object.keys(JSON.parse(c.body)))).toEqual([["plates"], ["family", "d", "b", "tf", "tw"]]);
    expect(commands.filter((c) => c.path === "/api/v1/sweeps")).toHaveLength(1);
  });

  test("both properties bodies give the Iz the README works out by hand, under massPerLength", async () => {
    for (const c of commands.filter((x) => x.path === "/api/v1/properties")) {
      const r = await callRoute(properties.action, new Request(new URL(c.path, BASE), { method: "POST", body: c.body, headers: { ...c.headers, Authorization: `Bearer ${token}` } }));
      expect(r.status).toBe(200);
      const p = (r.data as { properties: { Iz: number; massPerLength: number } }).properties;
      expect(p.Iz).toBe(277596160);
      expect(p.massPerLength).toBe(79.128);
    }
    // the inline US example: a 4 × 10 in bar, 40 in², Iz 333.333333333 in⁴
    const inline = README.match(/\(`(\{"units":"us","family":"rectangle"[^`]+)`\)/)![1];
    const r = await callRoute(properties.action, new Request(new URL("/api/v1/properties", BASE), { method: "POST", body: inline, headers: { "Content-Type": "application/json", Authorization: `Bearer ${token}` } }));
    expect((r.data as { properties: { area: number; Iz: number } }).properties).toMatchObject({ area: 40, Iz: 333.333333333 });
  });

  test("the sweeps body is queued; the same command again answers the same sweep with its status now", async () => {
    const c = commands.find((x) => x.path === "/api/v1/sweeps")!;
    const first = await send(c);
    expect(first.status).toBe(202);
    const id = (first.data as { id: number }).id;
    expect(first.data).toMatchObject({ created: true, status: "queued", url: `/api/v1/sweeps/${id}`, page: `/sweeps/${id}` });
    await db("sweeps").where({ id }).update({ status: "succeeded", started_at: db.fn.now(), finished_at: db.fn.now() });
    const again = await send(c);
    expect(again.status).toBe(202);
    expect(again.data).toMatchObject({ id, created: false, status: "succeeded" });
  });
});

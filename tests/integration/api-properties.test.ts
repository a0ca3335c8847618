// POST /api/v1/properties and the section bench's save action, against the real test
// database, calling the route modules as the framework would (fixtures.callRoute).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { getUser } from "~/lib/auth.server";
import { createApiToken } from "~/lib/api-tokens.server";
import { encodeBenchState, defaultBenchState } from "~/lib/bench-state";
import * as api from "~/routes/api.v1.properties";
import * as bench from "~/routes/bench";
import * as projectPage from "~/routes/projects.$projectId";
import { BASE, callRoute, demoUser, formPost, requestAs } from "./fixtures";

afterAll(() => closeDb());

const post = (body: string, headers: Record<string, string> = {}) =>
  new Request(new URL("/api/v1/properties", BASE), { method: "POST", body, headers: { "Content-Type": "application/json", ...headers } });

let token = "";
let projectId = 0;
let otherTeamProjectId = 0;
beforeAll(async () => {
  const engineer = (await getUser(await requestAs("engineer", "/")))!;
  token = (await createApiToken(engineer, "properties api test")).token;
  [projectId] = await db("projects").insert({ team_id: engineer.teamId, name: "Bench save test", created_by: engineer.id });
  const [otherTeam] = await db("teams").insert({ name: "Another fabricator", slug: `other-${Date.now()}` });
  [otherTeamProjectId] = await db("projects").insert({ team_id: otherTeam, name: "Not yours" });
});

const bearer = () => ({ Authorization: `Bearer ${token}` });

// IPE 300 (h 300, b 150, tw 7.1, tf 10.7, r 15): A = 53.8 cm², Iy = 8356 cm⁴, Wel,y = 557.1 cm³,
// Wpl,y = 628.4 cm³ — EN 10365:2017 section table, FROM MEMORY
// (the same values tests/optimizer/rolled-sections.test.ts checks the engine against).
const IPE300 = { family: "i", d: 300, b: 150, tf: 10.7, tw: 7.1, r: 15 };

describe("POST /api/v1/properties", () => {
  test("a published rolled section with a bearer token: its table values come back (within the table's rounding)", async () => {
    const r = await callRoute(api.action, post(JSON.stringify(IPE300), bearer()));
    expect(r.status).toBe(200);
    const { properties: p, units } = r.data as { properties: Record<string, number> & { Sz: { top: number } }; units: { system: string; fields: Record<string, string> } };
    expect(units.system).toBe("si");
    expect(units.fields.Iz).toBe("mm⁴");
    expect(Math.abs(p.area / 100 - 53.8)).toBeLessThan(0.05 + 0.02);
    expect(Math.abs(p.Iz / 1e4 - 8356)).toBeLessThan(0.5 + 3);
    expect(Math.abs(p.Sz.top / 1e3 - 557.1)).toBeLessThan(0.05 + 0.2);
    expect(Math.abs((p.Zz as number) / 1e3 - 628.4)).toBeLessThan(0.05 + 0.2);
  });

  test("stability properties (member-checks.md §1) with their units: the mono-i check value, null for plates", async () => {
    const mono = { family: "mono-i", d: 440, bt: 170, tft: 10, bb: 130, tfb: 6, tw: 6 };
    const r = await callRoute(api.action, post(JSON.stringify(mono), bearer()));
    expect(r.status).toBe(200);
    const { properties: p, units } = r.data as { properties: { stability: { betaX: number; Cw: number; shearCentre: { y: number } } }; units: { fields: Record<string, string> } };
    expect(p.stability.betaX).toBeCloseTo(224.58, 2);
    expect(p.stability.shearCentre.y).toBeCloseTo(343.61, 2);
    expect(units.fields).toMatchObject({ "stability.h0": "mm", "stability.Cw": "mm⁶", "stability.betaX": "mm", "stability.J": "mm⁴", "stability.shearCentre.y": "mm" });
    const us = await callRoute(api.action, post(JSON.stringify({ ...mono, units: "us", d: 440 / 25.4, bt: 170 / 25.4, tft: 10 / 25.4, bb: 130 / 25.4, tfb: 6 / 25.4, tw: 6 / 25.4 }), bearer()));
    const u = us.data as { properties: { stability: { betaX: number; Cw: number } }; units: { fields: Record<string, string> } };
    expect(u.units.fields["stability.Cw"]).toBe("in⁶");
    expect(u.properties.stability.betaX).toBeCloseTo(p.stability.betaX / 25.4, 6);
    expect(u.properties.stability.Cw).toBeCloseTo((p.stability.Cw as number) / 25.4 ** 6, 6);
    const plates = await callRoute(api.action, post(JSON.stringify({ plates: [{ b: 10, h: 100, z: 0, y: 0 }], units: "us" }), bearer()));
    expect((plates.data as { properties: { stability: unknown } }).properties.stability).toBeNull();
  });

  test('units "us": inches in, in-based units out (a 4 in × 10 in rectangle: A = 40 in², Iz = b·d³/12, Zz = b·d²/4)', async () => {
    const r = await callRoute(api.action, post(JSON.stringify({ units: "us", family: "rectangle", b: 4, d: 10 }), bearer()));
    expect(r.status).toBe(200);
    const { properties: p, units } = r.data as { properties: Record<string, number> & { Sz: { top: number }; centroid: { y: number } }; units: { system: string; fields: Record<string, string>; quantities: Record<string, string> } };
    expect(units.system).toBe("us");
    // Issue 11, item 13: a field name that carries a unit says so; mass per length is lb/ft here, not "per metre"
    expect(units.fields).toMatchObject({ area: "in²", Iz: "in⁴", "Sz.top": "in³", massPerLength: "lb/ft", "centroid.y": "in" });
    expect(units.fields).not.toHaveProperty("massPerMetre");
    expect(p).not.toHaveProperty("massPerMetre");
    // and plain numbers: 40 in² is 40, not 40.00000000000001 after the round trip through mm
    expect(p.area).toBe(40);
    expect(p.centroid.y).toBe(5);
    expect(JSON.stringify(r.data)).not.toMatch(/\d\.\d*(?:0{7,}|9{7,})[1-9]/);
    expect(p.area).toBeCloseTo(40, 9);
    expect(p.Iz).toBeCloseTo((4 * 10 ** 3) / 12, 9);
    expect(p.Sz.top).toBeCloseTo((4 * 10 ** 2) / 6, 9);
    expect(p.Zz).toBeCloseTo((4 * 10 ** 2) / 4, 9);
    expect(p.centroid.y).toBeCloseTo(5, 12);
    // 40 in² of steel at 7850 kg/m³ (= 490.06 lb/ft³) weighs 40/144 ft² × 490.06 = 136.1 lb/ft
    expect(p.massPerLength).toBeCloseTo((40 / 144) * (7850 / 16.01846337396), 6);
  });

  test("400 names the field: overlapping plates, a bad dimension, a bad units value, not JSON", async () => {
    const overlap = await callRoute(
      api.action,
      post(JSON.stringify({ plates: [{ b: 200, h: 20, z: 0, y: 0 }, { b: 10, h: 300, z: 95, y: 10 }] }), bearer()),
    );
    expect(overlap.status).toBe(400);
    expect(overlap.data).toMatchObject({ issues: [{ path: ["plates", 1], field: "plates[1]", message: "plates[1] overlaps plates[0]" }] });

    const dim = await callRoute(api.action, post(JSON.stringify({ family: "tee", d: 100, b: 80, tf: 12, tw: "thick" }), bearer()));
    expect(dim.status).toBe(400);
    expect((dim.data as { issues: { field: string }[] }).issues[0]!.field).toBe("tw");

    const negative = await callRoute(api.action, post(JSON.stringify({ plates: [{ b: -1, h: 1, z: 0, y: 0 }] }), bearer()));
    expect(negative.status).toBe(400);
    expect((negative.data as { issues: { field: string }[] }).issues[0]!.field).toBe("plates[0].b");

    const units = await callRoute(api.action, post(JSON.stringify({ units: "imperial", family: "rectangle", b: 1, d: 1 }), bearer()));
    expect(units.status).toBe(400);
    expect((units.data as { issues: { field: string }[] }).issues[0]!.field).toBe("units");

    for (const body of ["{not json", "[]", "42", ""]) {
      const r = await callRoute(api.action, post(body, bearer()));
      expect(r.status, body).toBe(400);
      expect(r.error).toBeUndefined();
    }
    // sizes double precision cannot square: a 400 from the engine, not a 500
    const huge = await callRoute(api.action, post(JSON.stringify({ family: "rectangle", b: 1e300, d: 1e300 }), bearer()));
    expect(huge.status).toBe(400);
  });

  test("401 without a session or token, and with a wrong token", async () => {
    expect((await callRoute(api.action, post(JSON.stringify(IPE300)))).status).toBe(401);
    expect((await callRoute(api.action, post(JSON.stringify(IPE300), { Authorization: "Bearer spw_nope" }))).status).toBe(401);
  });

  test("a session cookie works too, for every role (reading properties needs only read)", async () => {
    const r = await callRoute(api.action, await requestAs("viewer", "/api/v1/properties", { method: "POST", body: JSON.stringify(IPE300), headers: { "Content-Type": "application/json" } }));
    expect(r.status).toBe(200);
  });

  test("413 for a body over 256 kB, before it is parsed", async () => {
    const points = Array.from({ length: 30_000 }, (_, i) => [i, (i * 7919) % 1000]);
    const body = JSON.stringify({ polygons: [{ points }] });
    expect(body.length).toBeGreaterThan(256 * 1024);
    const r = await callRoute(api.action, post(body, bearer()));
    expect(r.status).toBe(413);
  });

  test("GET answers 405, not a page", async () => {
    const r = await callRoute(api.loader, await requestAs(null, "/api/v1/properties"));
    expect(r.status).toBe(405);
  });
});

describe("/bench", () => {
  test("signed out, the page redirects to sign-in", async () => {
    const r = await callRoute(bench.loader, await requestAs(null, "/bench?s=%7B%7D"));
    expect(r.status).toBe(302);
    expect(r.location).toMatch(/^\/sign-in\?next=%2Fbench/);
  });

  test("an engineer sees the team's projects to save to; a viewer can use the bench but not save", async () => {
    const eng = await callRoute(bench.loader, await requestAs("engineer", "/bench"));
    expect(eng.data).toMatchObject({ canSave: true, projects: expect.arrayContaining([{ id: projectId, name: "Bench save test" }]) });
    const viewer = await callRoute(bench.loader, await requestAs("viewer", "/bench"));
    expect(viewer.data).toEqual({ canSave: false, projects: [] });
  });

  test("an engineer saves a section to a project: an SI SectionInput row and an activity entry", async () => {
    const state = { ...defaultBenchState(), units: "us" as const, mode: "plates" as const };
    state.plates = [{ id: "a", b: "10", h: "1", z: "0", y: "0" }, { id: "b", b: "0.5", h: "12", z: "4.75", y: "1" }];
    const r = await callRoute(bench.action, await formPost("engineer", "/bench", { projectId: String(projectId), name: "Trial tee", state: encodeBenchState(state) }));
    expect(r.status).toBe(200);
    const id = (r.data as { id: number }).id;
    const row = await db("saved_sections").where({ id }).first();
    expect(row).toMatchObject({ project_id: projectId, name: "Trial tee", units: "us", created_by: (await demoUser("engineer")).id });
    // inches × 25.4 (NIST SP 811), compared to 1e-9 mm: the product carries float rounding
    const saved = parseJson<{ plates: Record<string, number>[] }>(row.section).plates;
    const want = [{ b: 254, h: 25.4, z: 0, y: 0 }, { b: 12.7, h: 304.8, z: 120.65, y: 25.4 }];
    expect(saved).toHaveLength(2);
    want.forEach((w, i) => Object.entries(w).forEach(([k, v]) => expect(saved[i]![k]).toBeCloseTo(v, 9)));
    expect(await db("activity_log").where({ action: "section_saved", subject_id: id }).first()).toBeTruthy();
    // Nothing saved is lost from sight: the project page lists it with a link that reopens it on the bench.
    const page = await callRoute(projectPage.loader, await requestAs("viewer", `/projects/${projectId}`), { projectId: String(projectId) });
    const listed = (page.data as { savedSections: { id: number; name: string; href: string }[] }).savedSections.find((x) => x.id === id);
    expect(listed?.name).toBe("Trial tee");
    expect(listed?.href).toMatch(/^\/bench\?s=/);
  });

  test("saving refuses: a viewer (403), another team's project (404), an invalid section (400 naming the field), no name", async () => {
    const good = encodeBenchState(defaultBenchState());
    const viewer = await callRoute(bench.action, await formPost("viewer", "/bench", { projectId: String(projectId), name: "x", state: good }));
    expect(viewer.status).toBe(403);
    const other = await callRoute(bench.action, await formPost("engineer", "/bench", { projectId: String(otherTeamProjectId), name: "x", state: good }));
    expect(other.status).toBe(404);
    const badState = { ...defaultBenchState(), dims: { ...defaultBenchState().dims, d: "20" } };
    const invalid = await callRoute(bench.action, await formPost("engineer", "/bench", { projectId: String(projectId), name: "x", state: encodeBenchState(badState) }));
    expect(invalid.status).toBe(400);
    expect(JSON.stringify(invalid.data)).toContain("d must exceed 2·tf");
    const noName = await callRoute(bench.action, await formPost("engineer", "/bench", { projectId: String(projectId), name: "", state: good }));
    expect(noName.status).toBe(400);
    const junk = await callRoute(bench.action, await formPost("engineer", "/bench", { projectId: String(projectId), name: "x", state: "{oops" }));
    expect(junk.status).toBe(400);
    expect(await db("saved_sections").where({ name: "x" }).count({ n: "*" }).first()).toEqual({ n: 0 });
  });
});

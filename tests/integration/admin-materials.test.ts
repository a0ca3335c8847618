// The team's materials through the /admin/materials route: an admin adds, edits and deletes them
// (each logged); a duplicate name or a value out of range is a 400 naming the field; other roles
// get 403 and write nothing; another team's material is a 404. The brief editor's pages list them.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { callRoute, FixtureContext, formPost, loadRouteModule, messageOf, requestAs, tableCounts, type As } from "./fixtures";
import { workflowFixture } from "./workflow-fixtures";

afterAll(() => closeDb());

const ROUTE = "routes/admin.materials.tsx";
const ctx = new FixtureContext();

async function post(as: As, fields: Record<string, string>) {
  const mod = await loadRouteModule(ROUTE);
  return callRoute(mod.action, await formPost(as, "/admin/materials", fields));
}
async function get(as: As, query = "") {
  const mod = await loadRouteModule(ROUTE);
  return callRoute(mod.loader, await requestAs(as, `/admin/materials${query}`));
}
const errorsOf = (res: { data: unknown }) => ((res.data as { errors?: Record<string, string> }).errors ?? {}) as Record<string, string>;

// An aluminium alloy: E ≈ 69 GPa, fy ≈ 240 MPa, ρ ≈ 2700 kg/m³ (6061-T6 handbook figures; from memory).
const ALUMINIUM = { name: "Aluminium 6061-T6", E: "69000", fy: "240", density: "2700" };

describe("an admin manages the team's materials", () => {
  let id = 0;

  test("adds one: stored in MPa and kg/m³, logged, listed on the page", async () => {
    const teamId = await ctx.teamId();
    const res = await post("admin", { intent: "create", ...ALUMINIUM });
    expect(res.status, messageOf(res)).toBe(200);
    id = (res.data as { added: number }).added;
    const row = await db("materials").where({ id }).first();
    expect(row).toMatchObject({ team_id: teamId, name: ALUMINIUM.name, e_mpa: 69000, fy_mpa: 240, density: 2700 });
    const log = await db("activity_log").where({ subject_type: "material", subject_id: id, action: "material_added" }).first();
    expect(log?.team_id).toBe(teamId);

    const page = await get("admin");
    expect(page.status).toBe(200);
    expect((page.data as { materials: { id: number; name: string }[] }).materials.map((m) => m.name)).toContain(ALUMINIUM.name);
  });

  test("edits it: new values stored, the change logged with before and after", async () => {
    const res = await post("admin", { intent: "update", id: String(id), name: "Aluminium 6082-T6", E: "70000", fy: "260", density: "2710" });
    expect(res.status, messageOf(res)).toBe(302);
    expect(res.location).toBe(`/admin/materials?saved=${id}`);
    expect(await db("materials").where({ id }).first()).toMatchObject({ name: "Aluminium 6082-T6", e_mpa: 70000, fy_mpa: 260, density: 2710 });
    const log = await db("activity_log").where({ subject_type: "material", subject_id: id, action: "material_changed" }).first();
    const detail = typeof log.detail === "string" ? JSON.parse(log.detail) : log.detail;
    expect(detail.before.name).toBe(ALUMINIUM.name);
    expect(detail.after.name).toBe("Aluminium 6082-T6");
  });

  test("the edit page opens with the material's values", async () => {
    const page = await get("admin", `?edit=${id}`);
    expect((page.data as { editing: { id: number; E: number } | null }).editing).toMatchObject({ id, E: 70000 });
  });

  test("the brief editor's pages list the team's materials", async () => {
    const { projectId } = await workflowFixture(ctx);
    const mod = await loadRouteModule("routes/projects.$projectId.briefs.new.tsx");
    const res = await callRoute(mod.loader, await requestAs("engineer", `/projects/${projectId}/briefs/new`), { projectId: String(projectId) });
    expect(res.status).toBe(200);
    expect((res.data as { teamMaterials: { id: number; name: string }[] }).teamMaterials).toContainEqual(expect.objectContaining({ id, name: "Aluminium 6082-T6", E: 70000, fy: 260, density: 2710 }));
  });

  test("a duplicate name (any case) → 400 naming name, nothing written", async () => {
    const before = await tableCounts();
    const res = await post("admin", { intent: "create", name: "ALUMINIUM 6082-t6", E: "70000", fy: "260", density: "2710" });
    expect(res.status).toBe(400);
    expect(errorsOf(res).name).toMatch(/^Name: .*already has a material called/);
    expect(await tableCounts()).toEqual(before);
  });

  test("renaming onto another material's name → 400 naming name, the row unchanged", async () => {
    const other = await post("admin", { intent: "create", name: "Timber C24", E: "11000", fy: "24", density: "420" });
    expect(other.status, messageOf(other)).toBe(200);
    const before = await tableCounts();
    const res = await post("admin", { intent: "update", id: String(id), name: "Timber C24", E: "70000", fy: "260", density: "2710" });
    expect(res.status).toBe(400);
    expect(errorsOf(res).name).toMatch(/Name/);
    expect((await db("materials").where({ id }).first()).name).toBe("Aluminium 6082-T6");
    expect(await tableCounts()).toEqual(before);
  });

  test("a built-in preset's name → 400 naming name", async () => {
    const res = await post("admin", { intent: "create", name: "s355", E: "210000", fy: "355", density: "7850" });
    expect(res.status).toBe(400);
    expect(errorsOf(res).name).toMatch(/built-in preset/);
  });

  const outOfRange: [string, Record<string, string>, string, RegExp][] = [
    ["E in GPa (210)", { E: "210" }, "E", /^E: must be between 1 000 and 1 000 000 MPa/],
    ["E in psi (29 000 000)", { E: "29000000" }, "E", /^E: must be between/],
    ["E not a number", { E: "stiff" }, "E", /^E: must be a number in MPa/],
    ["fy of zero", { fy: "0" }, "fy", /^Fy: must be between 1 and 5 000 MPa/],
    ["density in t/m³ (7.85)", { density: "7.85" }, "density", /^Density: must be between 100 and 30 000 kg\/m³/],
    ["density infinite", { density: "1e400" }, "density", /^Density: must be a number/],
    ["E left blank", { E: "" }, "E", /^E is required/],
    ["a name over 80 characters", { name: "x".repeat(81) }, "name", /^Name: must be at most 80 characters/],
    ["a blank name", { name: "   " }, "name", /^Name is required/],
  ];
  for (const [label, change, field, message] of outOfRange) {
    test(`${label} → 400 naming ${field}, nothing written`, async () => {
      const before = await tableCounts();
      const res = await post("admin", { intent: "create", ...ALUMINIUM, name: "Range probe", ...change });
      expect(res.status).toBe(400);
      expect(errorsOf(res)[field]).toMatch(message);
      expect(await tableCounts()).toEqual(before);
    });
  }

  test("an out-of-range edit leaves the row as it was", async () => {
    const res = await post("admin", { intent: "update", id: String(id), name: "Aluminium 6082-T6", E: "70", fy: "260", density: "2710" });
    expect(res.status).toBe(400);
    expect(errorsOf(res).E).toMatch(/E: must be between/);
    expect((await db("materials").where({ id }).first()).e_mpa).toBe(70000);
  });

  test("engineer, reviewer and viewer → 403 on every intent, nothing written", async () => {
    for (const role of ["engineer", "reviewer", "viewer"] as const) {
      const attempts: Record<string, string>[] = [
        { intent: "create", ...ALUMINIUM, name: `By ${role}` },
        { intent: "update", id: String(id), ...ALUMINIUM, name: `By ${role}` },
        { intent: "delete", id: String(id) },
      ];
      for (const fields of attempts) {
        const before = await tableCounts();
        const res = await post(role, fields);
        expect(res.status, `${role} ${fields.intent}`).toBe(403);
        expect(await tableCounts()).toEqual(before);
      }
      expect((await get(role)).status).toBe(403);
    }
    expect((await db("materials").where({ id }).first()).name).toBe("Aluminium 6082-T6");
  });

  test("another team's material → 404 for update and delete, untouched", async () => {
    const other = await ctx.otherTeam();
    const [foreignId] = await db("materials").insert({ team_id: other.teamId, name: "Their steel", e_mpa: 205000, fy_mpa: 460, density: 7850 });
    const before = await tableCounts();
    const upd = await post("admin", { intent: "update", id: String(foreignId), name: "Taken over", E: "200000", fy: "300", density: "7850" });
    expect(upd.status).toBe(404);
    expect(errorsOf(upd).id).toMatch(/No such material in your team/);
    const del = await post("admin", { intent: "delete", id: String(foreignId) });
    expect(del.status).toBe(404);
    expect(await db("materials").where({ id: foreignId }).first()).toMatchObject({ name: "Their steel", team_id: other.teamId });
    expect(await tableCounts()).toEqual(before);
    // Nor does the page show it, even asked for by id.
    const page = await get("admin", `?edit=${foreignId}`);
    expect((page.data as { editing: unknown }).editing).toBeNull();
    expect((page.data as { materials: { name: string }[] }).materials.map((m) => m.name)).not.toContain("Their steel");
  });

  test("a malformed id → 400 naming id", async () => {
    const res = await post("admin", { intent: "delete", id: "third" });
    expect(res.status).toBe(400);
    expect(errorsOf(res).id).toMatch(/^Id: /);
  });

  test("deletes it: the row goes, the deletion is logged", async () => {
    const res = await post("admin", { intent: "delete", id: String(id) });
    expect(res.status, messageOf(res)).toBe(200);
    expect((res.data as { done: string }).done).toMatch(/Aluminium 6082-T6/);
    expect(await db("materials").where({ id }).first()).toBeUndefined();
    expect(await db("activity_log").where({ subject_type: "material", subject_id: id, action: "material_deleted" }).first()).toBeTruthy();
    // A second delete finds nothing.
    expect((await post("admin", { intent: "delete", id: String(id) })).status).toBe(404);
  });
});

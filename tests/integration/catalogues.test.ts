// Catalogue upload through the route (admin only): a good file is kept; a typo in one printed
// value keeps that row out and lists it with its line; malformed files and files over the limits
// write nothing; replace and delete touch only the team's own catalogues. The demo seed's starter
// catalogue is there and passed the same check.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { CATALOGUE_CSV_MAX_BYTES, CATALOGUE_CSV_MAX_ROWS } from "~/lib/catalogue-csv";
import { STARTER_CATALOGUE_NAME } from "../../db/seeds/03_starter_catalogue";
import { callRoute, demoUser, formPost, loadRouteModule, requestAs, tableCounts, type As } from "./fixtures";

afterAll(() => closeDb());

const HEADER = "designation,shape,d_mm,b_mm,tw_mm,tf_mm,t_mm,r_mm,ro_mm,ri_mm,A_cm2,Iz_cm4,Iy_cm4,Sz_cm3,Zz_cm3,mass_kg_m";
const GOOD = [
  HEADER,
  "IPE 300,I,300,150,7.1,10.7,,15,,,53.8,8356,603.8,557.1,628.4,42.2",
  "HE 300 B,I,300,300,11,19,,27,,,149.1,25170,8563,1678,1869,117",
  "RHS 200x100x10,rhs,200,100,,,10,,15,10,54.9,,,,,43.1",
].join("\n");

type Result = {
  errors: Record<string, string> | null;
  lines?: { line: number; message: string }[];
  report?: { rows: number; kept: number; rejectedRows: number; rejected: { line: number; designation: string; field: string; printed?: string; computed?: number }[] };
  done?: string;
};

async function post(fields: Record<string, string>, csv?: string | Uint8Array, as: As = "admin") {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.set(k, v);
  if (csv !== undefined) fd.set("file", new Blob([csv as BlobPart], { type: "text/csv" }), "catalogue.csv");
  const mod = await loadRouteModule("routes/admin.catalogues.tsx");
  const res = await callRoute(mod.action, await requestAs(as, "/admin/catalogues", { method: "POST", body: fd }));
  if (res.error) throw res.error;
  return { status: res.status, data: res.data as Result };
}

async function catalogueNamed(name: string) {
  const admin = await demoUser("admin");
  return db("catalogues").where({ team_id: admin.teamId, name }).first();
}

describe("catalogue upload", () => {
  test("a good file is kept with every section, its dimensions and printed values", async () => {
    const res = await post({ intent: "create", name: "Good sections" }, GOOD);
    expect(res.status).toBe(200);
    expect(res.data.report).toMatchObject({ rows: 3, kept: 3, rejectedRows: 0 });
    const c = await catalogueNamed("Good sections");
    expect(c.section_count).toBe(3);
    const rows = await db("catalogue_sections").where({ catalogue_id: c.id }).orderBy("line");
    expect(rows.map((r) => [r.line, r.designation, r.shape])).toEqual([
      [2, "IPE 300", "I"],
      [3, "HE 300 B", "I"],
      [4, "RHS 200x100x10", "rhs"],
    ]);
    const dims = typeof rows[2].dims === "string" ? JSON.parse(rows[2].dims) : rows[2].dims;
    expect(dims).toEqual({ d: 200, b: 100, t: 10, ro: 15, ri: 10 });
    expect(rows[0].mass_kg_m).toBeCloseTo(42.24, 2);
    const log = await db("activity_log").where({ action: "catalogue_added", subject_id: c.id }).first();
    expect(log).toBeTruthy();
  });

  test("a typo in one printed value keeps that row out, listed with its line, field, printed and computed values", async () => {
    const res = await post({ intent: "create", name: "With a typo" }, GOOD.replace("149.1,25170,", "149.1,25710,"));
    expect(res.status).toBe(200);
    expect(res.data.report).toMatchObject({ rows: 3, kept: 2, rejectedRows: 1 });
    expect(res.data.report!.rejected).toEqual([
      expect.objectContaining({ line: 3, designation: "HE 300 B", field: "Iz_cm4", printed: "25710", computed: expect.closeTo(25170, -1) }),
    ]);
    const c = await catalogueNamed("With a typo");
    const kept = await db("catalogue_sections").where({ catalogue_id: c.id }).pluck("designation");
    expect(kept.sort()).toEqual(["IPE 300", "RHS 200x100x10"]);
    // the report is kept with the catalogue until a corrected file replaces it
    const report = typeof c.last_report === "string" ? JSON.parse(c.last_report) : c.last_report;
    expect(report.rejected[0]).toMatchObject({ line: 3, field: "Iz_cm4" });

    const fixed = await post({ intent: "replace", id: String(c.id) }, GOOD);
    expect(fixed.status).toBe(200);
    expect(fixed.data.done).toMatch(/Replaced the sections of “With a typo”: 3 now/);
    expect(await db("catalogue_sections").where({ catalogue_id: c.id }).count({ n: "*" }).first()).toEqual({ n: 3 });
  });

  test("check only reports and writes nothing", async () => {
    const before = await tableCounts();
    const res = await post({ intent: "check" }, GOOD.replace("53.8,8356", "53.8,8536"));
    expect(res.status).toBe(200);
    expect(res.data.report!.rejected.map((r) => [r.line, r.field])).toEqual([[2, "Iz_cm4"]]);
    expect(await tableCounts()).toEqual(before);
  });

  const malformed: [string, string | Uint8Array, number, RegExp][] = [
    ["an unknown column", "designation,shape,d_mm,grade\nX,I,300,S355\n", 400, /line 1: unknown column "grade"/],
    ["a line with too few values", `${GOOD}\nIPE 400,I,400\n`, 400, /line 5: expected 16 values, found 3/],
    ["text in a printed value", GOOD.replace("42.2", "forty-two"), 400, /line 2: mass_kg_m "forty-two" is not a number/],
    ["an empty file", "", 400, /file is empty/],
    ["too many sections", `designation,shape,d_mm,t_mm\n${Array.from({ length: CATALOGUE_CSV_MAX_ROWS + 1 }, (_, i) => `S${i},chs,100,5`).join("\n")}`, 400, /sections; at most 2000 per file/],
    ["a file just over the size limit", new Uint8Array(CATALOGUE_CSV_MAX_BYTES + 1024).fill(0x36), 400, /file is 513 kB; the limit is 512 kB/],
    ["a 2 MB file (refused while it is still arriving)", new Uint8Array(2 * 1024 * 1024).fill(0x36), 413, /too large: over the 512 kB limit; nothing was kept/],
  ];
  for (const [label, csv, status, message] of malformed) {
    test(`${label} → ${status}, the problem with its line, nothing written`, async () => {
      const before = await tableCounts();
      const res = await post({ intent: "create", name: `Malformed: ${label}` }, csv);
      expect(res.status).toBe(status);
      expect(res.data.errors?.file).toMatch(message);
      expect(await tableCounts()).toEqual(before);
    });
  }

  test("a replace with a malformed file leaves the catalogue as it was", async () => {
    const c = await catalogueNamed("Good sections");
    const before = await db("catalogue_sections").where({ catalogue_id: c.id }).select("designation", "dims");
    const res = await post({ intent: "replace", id: String(c.id) }, `${GOOD}\nIPE 400,I,400\n`);
    expect(res.status).toBe(400);
    expect(await db("catalogue_sections").where({ catalogue_id: c.id }).select("designation", "dims")).toEqual(before);
  });

  test("a file where no row passes keeps nothing", async () => {
    const before = await tableCounts();
    const res = await post({ intent: "create", name: "All wrong" }, `${HEADER}\nIPE 300,I,300,150,7.1,10.7,,15,,,99.9,,,,,`);
    expect(res.status).toBe(400);
    expect(res.data.errors?.file).toMatch(/no row passed the check/);
    expect(res.data.report?.rejectedRows).toBe(1);
    expect(await tableCounts()).toEqual(before);
  });

  test("a name the team already uses is refused naming the field", async () => {
    const before = await tableCounts();
    const res = await post({ intent: "create", name: "good SECTIONS" }, GOOD);
    expect(res.status).toBe(400);
    expect(res.data.errors?.name).toMatch(/already has a catalogue called/);
    expect(await tableCounts()).toEqual(before);
  });

  test("another team's catalogue cannot be replaced or deleted (404), and nothing changes", async () => {
    const admin = await demoUser("admin");
    const [otherTeam] = await db("teams").insert({ name: "Elsewhere Steel (test)", slug: `elsewhere-${Date.now()}` });
    const [otherId] = await db("catalogues").insert({ team_id: otherTeam, name: "Theirs", section_count: 0 });
    expect(admin.teamId).not.toBe(otherTeam);
    const before = await tableCounts();
    expect((await post({ intent: "replace", id: String(otherId) }, GOOD)).status).toBe(404);
    expect((await post({ intent: "delete", id: String(otherId) })).status).toBe(404);
    expect(await tableCounts()).toEqual(before);
  });

  test.each(["engineer", "reviewer", "viewer"] as const)("a %s may not upload (403)", async (role) => {
    const before = await tableCounts();
    const mod = await loadRouteModule("routes/admin.catalogues.tsx");
    const res = await callRoute(mod.action, await formPost(role, "/admin/catalogues", { intent: "check" }));
    expect(res.status).toBe(403);
    expect(await tableCounts()).toEqual(before);
  });

  test("delete removes the catalogue and its sections", async () => {
    const c = await catalogueNamed("With a typo");
    const res = await post({ intent: "delete", id: String(c.id) });
    expect(res.status).toBe(200);
    expect(await db("catalogues").where({ id: c.id }).first()).toBeUndefined();
    expect(await db("catalogue_sections").where({ catalogue_id: c.id }).first()).toBeUndefined();
  });

  test("the page lists the catalogues and shows one's sections", async () => {
    const mod = await loadRouteModule("routes/admin.catalogues.tsx");
    const c = await catalogueNamed("Good sections");
    const res = await callRoute(mod.loader, await requestAs("admin", `/admin/catalogues?view=${c.id}`));
    const data = res.data as { catalogues: { name: string }[]; viewing: { sectionRows: { designation: string }[] } };
    expect(data.catalogues.map((x) => x.name)).toContain("Good sections");
    expect(data.viewing.sectionRows.map((s) => s.designation)).toEqual(["IPE 300", "RHS 200x100x10", "HE 300 B"]);
  });
});

describe("the demo seed's starter catalogue", () => {
  test("is kept for the demo team, every row having passed the upload check", async () => {
    const c = await catalogueNamed(STARTER_CATALOGUE_NAME);
    expect(c).toBeTruthy();
    expect(c.section_count).toBeGreaterThanOrEqual(36);
    const report = typeof c.last_report === "string" ? JSON.parse(c.last_report) : c.last_report;
    expect(report.rejectedRows).toBe(0);
    const shapes = await db("catalogue_sections").where({ catalogue_id: c.id }).distinct("shape").pluck("shape");
    expect(shapes.sort()).toEqual(["I", "channel"]);
  });
});

import type { Knex } from "knex";
import { readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { parseCatalogueCsv } from "../../app/lib/catalogue-csv";
import { createCatalogue } from "../../app/lib/catalogues.server";
import { saveTeamCosts } from "../../app/lib/team-costs.server";
import { recordFinishedSweep } from "../../app/lib/finished-sweep.server";
import type { SearchProblemInput } from "../../app/optimizer";

// The demo team's starter catalogue: European parallel-flange I, H and channel sizes from
// starter-catalogue.csv (dimensions as recalled from EN 10365; the file says so), put through the
// same check an upload gets; and the team's cost settings (invented prices), so the demo can rank
// rolled against welded by cost. Idempotent: each part is skipped when the team already has it.
export const STARTER_CATALOGUE_NAME = "European rolled sections (starter; dimensions as recalled from EN 10365)";
export const STARTER_CATALOGUE_FILE = path.join(path.dirname(fileURLToPath(import.meta.url)), "starter-catalogue.csv");

/** Invented demo prices: rolled sections a little cheaper per kg than plate, welds by throat. */
export const DEMO_COSTS = {
  currency: "EUR",
  rolledPricePerKg: 1.02,
  platePrices: [6, 8, 10, 12, 15, 20, 25].map((thickness, i) => ({ thickness, pricePerKg: [1.18, 1.15, 1.12, 1.1, 1.1, 1.08, 1.08][i]! })),
  weld: [
    { throat: 3, perMetre: 4.2 },
    { throat: 4, perMetre: 5.1 },
    { throat: 5, perMetre: 6.3 },
    { throat: 6, perMetre: 7.8 },
    { throat: 8, perMetre: 11.5 },
    { throat: 10, perMetre: 16.0 },
  ],
};

export async function seed(knex: Knex): Promise<void> {
  const team = await knex("teams").where({ slug: "tallowfield" }).first("id");
  if (!team) return;
  const admin = await knex("users").where({ email: "admin@tallowfield.example" }).first("id");
  if (!(await knex("catalogues").where({ team_id: team.id, name: STARTER_CATALOGUE_NAME }).first("id"))) {
    const parsed = parseCatalogueCsv(readFileSync(STARTER_CATALOGUE_FILE, "utf8"));
    if (!parsed.ok) throw new Error(`starter catalogue is malformed: ${parsed.errors.map((e) => `line ${e.line}: ${e.message}`).join("; ")}`);
    await createCatalogue({ teamId: team.id, userId: admin?.id ?? null, name: STARTER_CATALOGUE_NAME, parsed }, knex);
  }
  if (!(await knex("team_costs").where({ team_id: team.id }).first("team_id"))) await saveTeamCosts(team.id, admin?.id ?? null, DEMO_COSTS, knex);
  await seedRolledOrWeldedBrief(knex, team.id);
}

export const ROLLED_OR_WELDED_BRIEF = "Edge channel: rolled or welded";

/**
 * A brief in the mezzanine project (02_demo_projects.ts) that searches the starter catalogue's
 * channels beside welded channels by cost, and its finished sweep: the demo's rolled and welded
 * answers on one chart. Invented loads.
 */
async function seedRolledOrWeldedBrief(knex: Knex, teamId: number): Promise<void> {
  const project = await knex("projects").where({ team_id: teamId, name: "Harbour Street cold store: mezzanine" }).first("id");
  const engineer = await knex("users").where({ email: "engineer@tallowfield.example" }).first("id");
  if (!project || !engineer) return;
  if (await knex("briefs").where({ project_id: project.id, name: ROLLED_OR_WELDED_BRIEF }).first("id")) return;
  const catalogue = await knex("catalogues").where({ team_id: teamId, name: STARTER_CATALOGUE_NAME }).first("id");
  if (!catalogue) return;
  const rows = await knex("catalogue_sections").where({ catalogue_id: catalogue.id, shape: "channel" }).orderBy("line");
  const sections = rows.map((r) => ({ designation: r.designation, shape: r.shape, dims: typeof r.dims === "string" ? JSON.parse(r.dims) : r.dims }));
  const problem: SearchProblemInput = {
    moment: { sagging: 45, hogging: 0 },
    shear: 40,
    allowable: { tension: 165, compression: 165, shear: 100 },
    depth: { min: 100, max: 300, step: 10 },
    width: { min: 50, max: 150, step: 10 },
    thicknesses: DEMO_COSTS.platePrices.map((p) => p.thickness),
    families: ["channel"],
    slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 },
    objective: "cost",
    prices: DEMO_COSTS.platePrices,
    costs: { rolledPricePerKg: DEMO_COSTS.rolledPricePerKg, weld: DEMO_COSTS.weld },
    catalogues: [{ name: STARTER_CATALOGUE_NAME, shapes: ["channel"], sections }],
  };
  const [briefId] = await knex("briefs").insert({ project_id: project.id, name: ROLLED_OR_WELDED_BRIEF, problem: JSON.stringify(problem), units: "si", member_length_m: 4.8, member_count: 14, created_by: engineer.id });
  await knex("activity_log").insert({ team_id: teamId, project_id: project.id, user_id: engineer.id, action: "brief_created", subject_type: "brief", subject_id: briefId });
  const sweepId = await recordFinishedSweep(knex, { teamId, ownerId: engineer.id, projectId: project.id, briefId: Number(briefId), problem });
  await knex("activity_log").insert({ team_id: teamId, project_id: project.id, user_id: engineer.id, action: "sweep_started", subject_type: "sweep", subject_id: sweepId });
}

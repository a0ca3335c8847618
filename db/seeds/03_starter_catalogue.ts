import type { Knex } from "knex";
import { readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { parseCatalogueCsv } from "../../app/lib/catalogue-csv";
import { createCatalogue } from "../../app/lib/catalogues.server";
import { saveTeamCosts } from "../../app/lib/team-costs.server";

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
}

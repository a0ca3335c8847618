import type { Knex } from "knex";
import { readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { parseCatalogueCsv } from "../../app/lib/catalogue-csv";
import { createCatalogue } from "../../app/lib/catalogues.server";

// The demo team's starter catalogue: European parallel-flange I, H and channel sizes from
// starter-catalogue.csv (dimensions as recalled from EN 10365; the file says so), put through the
// same check an upload gets. Idempotent: skipped when the team already has it.
export const STARTER_CATALOGUE_NAME = "European rolled sections (starter; dimensions as recalled from EN 10365)";
export const STARTER_CATALOGUE_FILE = path.join(path.dirname(fileURLToPath(import.meta.url)), "starter-catalogue.csv");

export async function seed(knex: Knex): Promise<void> {
  const team = await knex("teams").where({ slug: "tallowfield" }).first("id");
  if (!team) return;
  if (await knex("catalogues").where({ team_id: team.id, name: STARTER_CATALOGUE_NAME }).first("id")) return;
  const admin = await knex("users").where({ email: "admin@tallowfield.example" }).first("id");
  const parsed = parseCatalogueCsv(readFileSync(STARTER_CATALOGUE_FILE, "utf8"));
  if (!parsed.ok) throw new Error(`starter catalogue is malformed: ${parsed.errors.map((e) => `line ${e.line}: ${e.message}`).join("; ")}`);
  await createCatalogue({ teamId: team.id, userId: admin?.id ?? null, name: STARTER_CATALOGUE_NAME, parsed }, knex);
}

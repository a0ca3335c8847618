import type { Knex } from "knex";

// One row of cost settings per team (app/lib/team-costs.ts): price per kg of rolled sections, of
// plate by thickness (JSON [{ thickness, pricePerKg }]) and the fabrication cost per metre of
// fillet weld by throat size (JSON [{ throat, perMetre }]). Briefs copy what they use, so editing
// these changes no saved brief or sweep.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("team_costs", (t) => {
    t.integer("team_id").unsigned().primary().references("teams.id").onDelete("CASCADE");
    t.string("currency", 8).notNullable().defaultTo("");
    t.double("rolled_price_per_kg").nullable();
    t.json("plate_prices").notNullable();
    t.json("weld_costs").notNullable();
    t.integer("updated_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamps(true, true);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("team_costs");
}

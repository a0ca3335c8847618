import type { Knex } from "knex";

// Team catalogues of rolled and hollow sections (app/lib/catalogue-csv.ts reads the upload).
// A catalogue keeps only the rows that passed the upload's check; `last_report` keeps what the
// last upload kept out (line, field, printed and computed values) so the admin can fix the file.
// `dims` holds the shape's dimensions in mm, `printed` the printed values as text (the text keeps
// the printed rounding the check used).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("catalogues", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.string("name", 120).notNullable();
    t.integer("section_count").unsigned().notNullable().defaultTo(0);
    t.json("last_report").nullable();
    t.integer("uploaded_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamps(true, true);
    t.unique(["team_id", "name"]);
  });
  await knex.schema.createTable("catalogue_sections", (t) => {
    t.increments("id");
    t.integer("catalogue_id").unsigned().notNullable().references("catalogues.id").onDelete("CASCADE");
    t.integer("line").unsigned().notNullable();
    t.string("designation", 60).notNullable();
    t.string("shape", 16).notNullable();
    t.json("dims").notNullable();
    t.json("printed").notNullable();
    t.double("area_mm2").notNullable();
    t.double("mass_kg_m").notNullable();
    t.unique(["catalogue_id", "designation"]);
    t.index(["catalogue_id", "mass_kg_m"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("catalogue_sections");
  await knex.schema.dropTableIfExists("catalogues");
}

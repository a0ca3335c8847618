import type { Knex } from "knex";

// Sections kept from the section bench, filed under a project. `section` is the engine's
// SectionInput in SI (mm), validated before insert, so any page can draw it or reopen it in
// the bench without converting; `units` is the system it was typed in, for reopening.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("saved_sections", (t) => {
    t.increments("id");
    t.integer("project_id").unsigned().notNullable().references("projects.id").onDelete("CASCADE");
    t.string("name", 160).notNullable();
    t.json("section").notNullable();
    t.enu("units", ["si", "us"]).notNullable().defaultTo("si");
    t.integer("created_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamps(true, true);
    t.index(["project_id", "created_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("saved_sections");
}

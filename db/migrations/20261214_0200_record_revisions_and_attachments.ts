import type { Knex } from "knex";

// Issue 12: the calculation record as a signed document.
// - projects.job_number: the job number the title block and running header print.
// - options.revision: the option's current record revision (1 = A). Revision A is the option as
//   saved (its own problem and candidate columns, never changed); each later revision is a row of
//   record_revisions holding the basis it was checked against, so earlier ones stay readable.
// - reviews.revision: the revision a request or decision was given on (old rows: A), so an
//   approval belongs to one revision and a later revision needs its own.
// - attachments: files kept on disk under the data folder (random names), their metadata here.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("projects", (t) => {
    t.string("job_number", 40).nullable();
  });
  await knex.schema.alterTable("options", (t) => {
    t.integer("revision").unsigned().notNullable().defaultTo(1);
  });
  await knex.schema.alterTable("reviews", (t) => {
    t.integer("revision").unsigned().notNullable().defaultTo(1);
  });
  await knex.schema.createTable("record_revisions", (t) => {
    t.increments("id");
    t.integer("option_id").unsigned().notNullable().references("options.id").onDelete("CASCADE");
    t.integer("number").unsigned().notNullable();
    t.json("problem").notNullable();
    t.double("member_length_m").nullable();
    t.integer("member_count").unsigned().nullable();
    t.string("reason", 200).notNullable();
    t.integer("created_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.datetime("created_at", { precision: 3 }).notNullable().defaultTo(knex.raw("CURRENT_TIMESTAMP(3)"));
    t.unique(["option_id", "number"]);
  });
  await knex.schema.createTable("attachments", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("project_id").unsigned().notNullable().references("projects.id").onDelete("CASCADE");
    t.integer("option_id").unsigned().notNullable().references("options.id").onDelete("CASCADE");
    // 32 random hex characters: the only name the file has on disk
    t.string("stored_name", 40).notNullable().unique();
    t.string("file_name", 120).notNullable();
    t.string("content_type", 40).notNullable();
    t.integer("size_bytes").unsigned().notNullable();
    t.string("sha256", 64).notNullable();
    t.integer("created_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.datetime("created_at", { precision: 3 }).notNullable().defaultTo(knex.raw("CURRENT_TIMESTAMP(3)"));
    t.index(["option_id"]);
    t.index(["team_id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("attachments");
  await knex.schema.dropTableIfExists("record_revisions");
  await knex.schema.alterTable("reviews", (t) => t.dropColumn("revision"));
  await knex.schema.alterTable("options", (t) => t.dropColumn("revision"));
  await knex.schema.alterTable("projects", (t) => t.dropColumn("job_number"));
}

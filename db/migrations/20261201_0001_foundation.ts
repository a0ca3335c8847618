import type { Knex } from "knex";

// Users, teams and everything sign-in needs. InnoDB + utf8mb4 throughout (set on the server and per table).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("teams", (t) => {
    t.increments("id");
    t.string("name", 120).notNullable();
    t.string("slug", 80).notNullable().unique();
    t.timestamps(true, true);
  });
  await knex.schema.createTable("users", (t) => {
    t.increments("id");
    t.string("email", 254).notNullable().unique();
    t.string("name", 120).notNullable();
    t.string("password_hash", 100).nullable();
    t.integer("session_version").unsigned().notNullable().defaultTo(1);
    t.timestamp("disabled_at").nullable();
    t.timestamps(true, true);
  });
  await knex.schema.createTable("memberships", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("user_id").unsigned().notNullable().references("users.id").onDelete("CASCADE");
    t.enu("role", ["admin", "engineer", "reviewer", "viewer"]).notNullable();
    t.timestamps(true, true);
    t.unique(["team_id", "user_id"]);
  });
  await knex.schema.createTable("invitations", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.string("email", 254).notNullable();
    t.enu("role", ["admin", "engineer", "reviewer", "viewer"]).notNullable();
    t.string("token_hash", 64).notNullable().unique();
    t.integer("invited_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.dateTime("expires_at").notNullable();
    t.dateTime("accepted_at").nullable();
    t.timestamps(true, true);
  });
  await knex.schema.createTable("password_resets", (t) => {
    t.increments("id");
    t.integer("user_id").unsigned().notNullable().references("users.id").onDelete("CASCADE");
    t.string("token_hash", 64).notNullable().unique();
    t.dateTime("expires_at").notNullable();
    t.dateTime("used_at").nullable();
    t.timestamps(true, true);
  });
  await knex.schema.createTable("api_tokens", (t) => {
    t.increments("id");
    t.integer("user_id").unsigned().notNullable().references("users.id").onDelete("CASCADE");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.string("name", 80).notNullable();
    t.string("token_hash", 64).notNullable().unique();
    t.dateTime("last_used_at").nullable();
    t.dateTime("revoked_at").nullable();
    t.timestamps(true, true);
  });
  await knex.schema.createTable("outbox", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().nullable().references("teams.id").onDelete("SET NULL");
    t.string("to_address", 254).notNullable();
    t.string("subject", 200).notNullable();
    t.text("text_body").notNullable();
    t.text("html_body").nullable();
    t.string("transport", 20).notNullable().defaultTo("capture");
    t.timestamp("created_at").notNullable().defaultTo(knex.fn.now());
    t.index(["to_address"]);
  });
  await knex.schema.createTable("notifications", (t) => {
    t.increments("id");
    t.integer("user_id").unsigned().notNullable().references("users.id").onDelete("CASCADE");
    t.string("title", 200).notNullable();
    t.text("body").nullable();
    t.string("link", 300).nullable();
    t.dateTime("read_at").nullable();
    t.timestamp("created_at").notNullable().defaultTo(knex.fn.now());
    t.index(["user_id", "read_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ["notifications", "outbox", "api_tokens", "password_resets", "invitations", "memberships", "users", "teams"]) {
    await knex.schema.dropTableIfExists(table);
  }
}

import type { Knex } from "knex";

// The product's own objects (product.md, "Words the product uses"). JSON columns hold
// engine inputs and outputs exactly as the engine contract shapes them.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("projects", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.string("name", 160).notNullable();
    t.string("client", 160).nullable();
    t.text("description").nullable();
    t.integer("created_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.dateTime("archived_at").nullable();
    t.timestamps(true, true);
    t.index(["team_id", "archived_at"]);
  });
  await knex.schema.createTable("project_members", (t) => {
    t.increments("id");
    t.integer("project_id").unsigned().notNullable().references("projects.id").onDelete("CASCADE");
    t.integer("user_id").unsigned().notNullable().references("users.id").onDelete("CASCADE");
    t.timestamps(true, true);
    t.unique(["project_id", "user_id"]);
  });
  await knex.schema.createTable("activity_log", (t) => {
    t.bigIncrements("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("project_id").unsigned().nullable().references("projects.id").onDelete("CASCADE");
    t.integer("user_id").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.string("action", 60).notNullable();
    t.string("subject_type", 40).nullable();
    t.integer("subject_id").unsigned().nullable();
    t.json("detail").nullable();
    t.timestamp("created_at").notNullable().defaultTo(knex.fn.now());
    t.index(["team_id", "created_at"]);
    t.index(["project_id", "created_at"]);
  });
  await knex.schema.createTable("materials", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.string("name", 80).notNullable();
    t.double("e_mpa").notNullable();
    t.double("fy_mpa").notNullable();
    t.double("density").notNullable();
    t.timestamps(true, true);
    t.unique(["team_id", "name"]);
  });
  await knex.schema.createTable("stock_lists", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.string("name", 120).notNullable();
    t.integer("created_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamps(true, true);
  });
  await knex.schema.createTable("stock_list_items", (t) => {
    t.increments("id");
    t.integer("stock_list_id").unsigned().notNullable().references("stock_lists.id").onDelete("CASCADE");
    t.double("thickness_mm").notNullable();
    t.double("width_mm").nullable();
    t.double("price_per_kg").nullable();
  });
  await knex.schema.createTable("briefs", (t) => {
    t.increments("id");
    t.integer("project_id").unsigned().notNullable().references("projects.id").onDelete("CASCADE");
    t.string("name", 160).notNullable();
    t.json("problem").notNullable();
    t.enu("units", ["si", "us"]).notNullable().defaultTo("si");
    t.double("member_length_m").nullable();
    t.integer("member_count").unsigned().nullable();
    t.integer("created_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamps(true, true);
  });
  await knex.schema.createTable("sweeps", (t) => {
    t.increments("id");
    t.integer("team_id").unsigned().notNullable().references("teams.id").onDelete("CASCADE");
    t.integer("project_id").unsigned().nullable().references("projects.id").onDelete("SET NULL");
    t.integer("brief_id").unsigned().nullable().references("briefs.id").onDelete("SET NULL");
    t.integer("recheck_of").unsigned().nullable().references("sweeps.id").onDelete("SET NULL");
    t.integer("owner_id").unsigned().notNullable().references("users.id").onDelete("CASCADE");
    t.json("problem").notNullable();
    t.enu("status", ["queued", "running", "succeeded", "failed", "cancelled"]).notNullable().defaultTo("queued");
    t.bigInteger("progress_done").notNullable().defaultTo(0);
    t.bigInteger("progress_total").notNullable().defaultTo(0);
    t.json("counts").nullable();
    t.json("best").nullable();
    t.text("reason").nullable();
    t.integer("attempts").unsigned().notNullable().defaultTo(0);
    t.integer("max_attempts").unsigned().notNullable().defaultTo(3);
    t.string("lease_owner", 100).nullable();
    t.string("lease_token", 64).nullable();
    t.dateTime("lease_expires_at", { precision: 3 }).nullable();
    t.dateTime("heartbeat_at", { precision: 3 }).nullable();
    t.text("error").nullable();
    t.boolean("cancel_requested").notNullable().defaultTo(false);
    t.string("idempotency_key", 100).nullable();
    t.dateTime("queued_at", { precision: 3 }).notNullable().defaultTo(knex.raw("CURRENT_TIMESTAMP(3)"));
    t.dateTime("started_at", { precision: 3 }).nullable();
    t.dateTime("finished_at", { precision: 3 }).nullable();
    t.timestamps(true, true);
    t.unique(["owner_id", "idempotency_key"]);
    t.index(["status", "lease_expires_at"]);
    t.index(["team_id", "created_at"]);
  });
  await knex.schema.createTable("candidates", (t) => {
    t.bigIncrements("id");
    t.integer("sweep_id").unsigned().notNullable().references("sweeps.id").onDelete("CASCADE");
    t.integer("rank").unsigned().notNullable();
    t.string("family", 20).notNullable();
    t.json("dimensions").notNullable();
    t.double("area").notNullable();
    t.double("mass_per_metre").notNullable();
    t.double("utilisation").notNullable();
    t.string("governing", 30).notNullable();
    t.boolean("on_front").notNullable().defaultTo(false);
    t.unique(["sweep_id", "rank"]);
    t.index(["sweep_id", "family", "area"]);
    t.index(["sweep_id", "area"]);
    t.index(["sweep_id", "on_front"]);
  });
  await knex.schema.createTable("options", (t) => {
    t.increments("id");
    t.integer("project_id").unsigned().notNullable().references("projects.id").onDelete("CASCADE");
    t.integer("brief_id").unsigned().nullable().references("briefs.id").onDelete("SET NULL");
    t.integer("sweep_id").unsigned().nullable().references("sweeps.id").onDelete("SET NULL");
    // The candidate is copied, so an option survives even if its sweep's rows are pruned.
    t.json("candidate").notNullable();
    t.json("problem").notNullable();
    t.text("note").nullable();
    t.enu("review_state", ["draft", "in_review", "approved", "returned"]).notNullable().defaultTo("draft");
    t.integer("created_by").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.timestamps(true, true);
    t.index(["project_id", "review_state"]);
  });
  await knex.schema.createTable("reviews", (t) => {
    t.increments("id");
    t.integer("option_id").unsigned().notNullable().references("options.id").onDelete("CASCADE");
    t.integer("user_id").unsigned().nullable().references("users.id").onDelete("SET NULL");
    t.enu("decision", ["requested", "approved", "returned", "comment"]).notNullable();
    t.text("comment").nullable();
    t.timestamp("created_at").notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ["reviews", "options", "candidates", "sweeps", "briefs", "stock_list_items", "stock_lists", "materials", "activity_log", "project_members", "projects"]) {
    await knex.schema.dropTableIfExists(table);
  }
}

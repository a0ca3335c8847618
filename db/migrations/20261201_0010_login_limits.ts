import type { Knex } from "knex";

// rate-limiter-flexible's MySQL store (RateLimiterMySQL, tableCreated: true) uses exactly these
// columns; created here so the app user needs no CREATE rights at run time.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("login_limits", (t) => {
    t.string("key", 255).notNullable().primary();
    t.integer("points").notNullable().defaultTo(0);
    t.bigInteger("expire").unsigned().nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("login_limits");
}

import type { Knex } from "knex";

// Sign-in throttling (app/lib/rate-limit.server.ts): one row per account+address pair and one
// per address, keyed by a sha256 so no address or e-mail is stored in clear. Times are the
// database clock in ms, so every app process agrees on them.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("signin_throttle", (t) => {
    t.string("key", 80).primary();
    // Attempts counted in the current memory window (a success refunds its own).
    t.integer("failures").unsigned().notNullable().defaultTo(0);
    // No attempt is let through before this instant.
    t.bigInteger("held_until").unsigned().notNullable().defaultTo(0);
    // After this instant of quiet the count starts again from nothing.
    t.bigInteger("forget_at").unsigned().notNullable().defaultTo(0);
    t.index(["forget_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("signin_throttle");
}

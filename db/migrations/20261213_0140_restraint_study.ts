import type { Knex } from "knex";

// sweeps.restraint_study: the restraint study of an EN 1993 sweep (the lightest section at the
// restraint spacings L … L/6, lib/restraint-study.ts), written in the same transaction as the
// sweep's results; null for sweeps that have none (allowable basis, no restraint length, older sweeps).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.json("restraint_study").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.dropColumn("restraint_study");
  });
}

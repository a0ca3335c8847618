import type { Knex } from "knex";

// candidates.design: an EN 1993 candidate's design figures as the search computed them (class,
// Mcr, χLT, λLT, Mc,Rd, Mb,Rd, VRd, weld throat, the governing clause: lib/design-summary.ts),
// written with the sweep's results so the sweep page, the CSV and the API read them without
// re-running the checks on every view; null under the allowable basis and for older rows.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.json("design").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.dropColumn("design");
  });
}

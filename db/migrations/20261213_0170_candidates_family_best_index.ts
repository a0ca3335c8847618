import type { Knex } from "knex";

// The sweep page's chart always draws each family's best (app/lib/sweep-page.server.ts,
// chartSample): this index finds those few rows of a sweep without reading the rest.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.index(["sweep_id", "family_best"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.dropIndex(["sweep_id", "family_best"]);
  });
}

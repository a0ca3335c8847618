import type { Knex } from "knex";

// sweeps.advice: for a sweep that found no feasible section, what the engine's whatItWouldTake
// worked out (each family's nearest miss, the smallest relaxation of each limit), so the page
// can say what it would take without searching again (issue 11, item 7).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.json("advice").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.dropColumn("advice");
  });
}

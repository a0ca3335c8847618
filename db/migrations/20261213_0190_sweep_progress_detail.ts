import type { Knex } from "knex";

// What a running sweep's progress says beside the shapes settled (issue 11, item 6): the families
// searched to the end (of how many) and the candidates evaluated so far, as the engine's last
// report gave them. Null until the search reports them (older sweeps, brute force).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.integer("progress_families_done").unsigned().nullable();
    t.integer("progress_families_total").unsigned().nullable();
    t.bigInteger("progress_evaluated").unsigned().nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.dropColumn("progress_families_done");
    t.dropColumn("progress_families_total");
    t.dropColumn("progress_evaluated");
  });
}

import type { Knex } from "knex";

// candidates.depth_best: the row is its family's lightest feasible section at its depth (issue 11,
// item 9). A sweep stores one per family and depth beside the front and the family bests, so its
// results filter by depth or family without searching again.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.boolean("depth_best").notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.dropColumn("depth_best");
  });
}

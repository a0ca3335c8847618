import type { Knex } from "knex";

// Catalogue sections searched beside the plate families (issue 13): a stored candidate says where
// it came from (`source` "plate" or "rolled"; a rolled one its designation and catalogue), and,
// under the cost objective, its material and fabrication parts. `catalogue_result` on the sweep
// keeps the side-by-side answer (lightest and cheapest welded and rolled), the catalogue's counts
// and the sections its basis left out.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.string("source", 8).notNullable().defaultTo("plate");
    t.string("designation", 60).nullable();
    t.string("catalogue", 120).nullable();
    t.double("cost_material").nullable();
    t.double("cost_fabrication").nullable();
  });
  await knex.schema.alterTable("sweeps", (t) => {
    t.json("catalogue_result").nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => t.dropColumn("catalogue_result"));
  await knex.schema.alterTable("candidates", (t) => {
    t.dropColumn("source");
    t.dropColumn("designation");
    t.dropColumn("catalogue");
    t.dropColumn("cost_material");
    t.dropColumn("cost_fabrication");
  });
}

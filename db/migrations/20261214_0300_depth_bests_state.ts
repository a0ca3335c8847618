import type { Knex } from "knex";

// Issue 11, item 9. sweeps.depth_bests: whether each family's lightest at every depth was stored
// (lib/depth-bests.ts DepthBestsInfo: for all depths, or none and why), so the sweep page tells
// "no feasible section at this depth" from "not kept for this sweep"; null for sweeps stored before it. candidates.depth_best_for: the families (in the
// problem's order, comma-separated) whose lightest at the row's depth is this section; more than
// one when two families found the same section (a mono-symmetric I with equal flanges and the I),
// which is stored once, under the family listed first.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.json("depth_bests").nullable();
  });
  await knex.schema.alterTable("candidates", (t) => {
    t.string("depth_best_for", 100).nullable();
    // the depth control and the chart's filter read a sweep's depth bests alone
    t.index(["sweep_id", "depth_best"], "candidates_sweep_depth_best");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.dropIndex(["sweep_id", "depth_best"], "candidates_sweep_depth_best");
    t.dropColumn("depth_best_for");
  });
  await knex.schema.alterTable("sweeps", (t) => {
    t.dropColumn("depth_bests");
  });
}

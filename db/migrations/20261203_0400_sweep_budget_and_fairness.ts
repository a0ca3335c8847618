import type { Knex } from "knex";

// Issue 9, item 6 (one sweep could hold every worker):
// - status 'timed_out': a sweep that reached its time budget (SWEEP_TIME_BUDGET_S) and ended with
//   the best candidate found so far, which is not proven lightest.
// - claimed_at: when a worker last claimed the sweep. Claims go round-robin by team, then by owner,
//   to whoever was served least recently: MAX(claimed_at) per team / owner, read through the two
//   indexes below.
// - progress_unit: what progress_done / progress_total count (the engine's PROGRESS_UNIT, "shapes"),
//   so the page and the API can say it.
const WITH = "'queued','running','succeeded','failed','cancelled','timed_out'";
const WITHOUT = "'queued','running','succeeded','failed','cancelled'";

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`ALTER TABLE sweeps MODIFY status ENUM(${WITH}) NOT NULL DEFAULT 'queued'`);
  await knex.schema.alterTable("sweeps", (t) => {
    t.specificType("claimed_at", "DATETIME(3)").nullable();
    t.string("progress_unit", 20).nullable();
    t.index(["team_id", "claimed_at"]);
    t.index(["owner_id", "claimed_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.dropIndex(["team_id", "claimed_at"]);
    t.dropIndex(["owner_id", "claimed_at"]);
    t.dropColumn("claimed_at");
    t.dropColumn("progress_unit");
  });
  // the older schema has no word for it: a stopped sweep becomes a failed one, its reason kept
  await knex("sweeps").where({ status: "timed_out" }).update({ status: "failed", error: knex.raw("COALESCE(error, reason)") });
  await knex.raw(`ALTER TABLE sweeps MODIFY status ENUM(${WITHOUT}) NOT NULL DEFAULT 'queued'`);
}

import type { Knex } from "knex";

// Queue bookkeeping the first sweeps/candidates migration did not carry.
// - candidates.attempt: which claim of the sweep wrote the row, so a test (and an operator) can see
//   that a sweep's stored results come from exactly one attempt (the one that finished it).
// - candidates.cost: objective "cost" results keep their cost per metre beside the area.
// - candidates.family_best: the row is its family's best (SearchResult.bestByFamily).
// - sweeps.finished_by / finished_attempt: the lease owner and attempt whose transaction wrote the
//   final status, kept after the lease columns are cleared.
// - sweeps (status, owner_id): the per-user queued-sweep limit counts by this.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("candidates", (t) => {
    t.integer("attempt").unsigned().nullable();
    t.double("cost").nullable();
    t.boolean("family_best").notNullable().defaultTo(false);
  });
  await knex.schema.alterTable("sweeps", (t) => {
    t.string("finished_by", 100).nullable();
    t.integer("finished_attempt").unsigned().nullable();
    t.index(["owner_id", "status"]);
    // The claim reads queued sweeps oldest first with FOR UPDATE SKIP LOCKED; walking this index in
    // id order locks only the rows it returns, so competing workers skip each other's and move on.
    t.index(["status", "id"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.dropIndex(["owner_id", "status"]);
    t.dropIndex(["status", "id"]);
    t.dropColumn("finished_by");
    t.dropColumn("finished_attempt");
  });
  await knex.schema.alterTable("candidates", (t) => {
    t.dropColumn("attempt");
    t.dropColumn("cost");
    t.dropColumn("family_best");
  });
}

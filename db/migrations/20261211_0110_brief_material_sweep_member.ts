import type { Knex } from "knex";

// What a brief and a sweep lost before (issue 11, items 4 and 12):
// - briefs.material: the preset the engineer chose ("s355", "team:7"), so the editor reopens on it.
// - briefs.elastic_modulus_mpa: the material's E, kept even when no deflection is checked (the
//   problem only carries E inside its deflection block).
// - briefs.problem_changed_at: when the brief's problem last changed (a save that changes only its
//   name does not count), so an approval given before it can be flagged stale.
// - sweeps.member_length_m / member_count: the member the sweep was run for (a recheck may alter
//   them), so an option's quantities come from the sweep it was saved from.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("briefs", (t) => {
    t.string("material", 80).nullable();
    t.double("elastic_modulus_mpa").nullable();
    t.datetime("problem_changed_at", { precision: 3 }).nullable();
  });
  await knex.schema.alterTable("sweeps", (t) => {
    t.double("member_length_m").nullable();
    t.integer("member_count").unsigned().nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("sweeps", (t) => {
    t.dropColumn("member_length_m");
    t.dropColumn("member_count");
  });
  await knex.schema.alterTable("briefs", (t) => {
    t.dropColumn("material");
    t.dropColumn("elastic_modulus_mpa");
    t.dropColumn("problem_changed_at");
  });
}

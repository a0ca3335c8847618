// The team's cost settings, one row per team, written with an activity entry in one transaction.
import type { Knex } from "knex";
import { db, parseJson } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import { EMPTY_COSTS, type TeamCosts } from "~/lib/team-costs";

export async function getTeamCosts(teamId: number, knex: Knex = db): Promise<TeamCosts> {
  const r = await knex("team_costs").where({ team_id: teamId }).first();
  if (!r) return EMPTY_COSTS;
  return {
    currency: r.currency ?? "",
    rolledPricePerKg: r.rolled_price_per_kg ?? null,
    platePrices: parseJson<TeamCosts["platePrices"]>(r.plate_prices) ?? [],
    weld: parseJson<TeamCosts["weld"]>(r.weld_costs) ?? [],
  };
}

export async function saveTeamCosts(teamId: number, userId: number | null, costs: TeamCosts, knex: Knex = db): Promise<void> {
  await knex.transaction(async (trx) => {
    const row = {
      currency: costs.currency,
      rolled_price_per_kg: costs.rolledPricePerKg,
      plate_prices: JSON.stringify(costs.platePrices),
      weld_costs: JSON.stringify(costs.weld),
      updated_by: userId,
    };
    // one statement, so two admins saving the first settings at once cannot collide on the key
    await trx("team_costs").insert({ team_id: teamId, ...row }).onConflict("team_id").merge({ ...row, updated_at: trx.fn.now() });
    await logActivity({ teamId, userId, action: "costs_saved", subjectType: "team", subjectId: teamId, detail: { rolled: costs.rolledPricePerKg, plates: costs.platePrices.length, welds: costs.weld.length } }, trx);
  });
}

// A finished sweep with thousands of stored candidates (the queue's front cap), written straight to
// the database: the sweep page's size and speed are about how much is stored, not how it was found.
// Used by security-load.test.ts and tests/bench/load.bench.ts.
import type { Knex } from "knex";
import { CONTRACT_EXAMPLE_PROBLEM, searchProblemSchema, searchSections } from "~/optimizer";
import { SWEEP_SEARCH_OPTIONS } from "~/workers/sweep-search.server";

export async function insertBigSweep(knex: Knex, input: { teamId: number; ownerId: number; projectId?: number | null; candidates?: number }): Promise<number> {
  const n = input.candidates ?? 2_000;
  const problem = searchProblemSchema.parse(CONTRACT_EXAMPLE_PROBLEM);
  const real = searchSections(problem, SWEEP_SEARCH_OPTIONS);
  const best = real.best!;
  const [id] = await knex("sweeps").insert({
    team_id: input.teamId,
    owner_id: input.ownerId,
    project_id: input.projectId ?? null,
    problem: JSON.stringify(problem),
    status: "succeeded",
    progress_done: 1,
    progress_total: 1,
    counts: JSON.stringify({ grid: 2_500_000, evaluated: 400_000, feasible: 90_000 }),
    best: JSON.stringify(best),
    attempts: 1,
    started_at: knex.raw("NOW(3) - INTERVAL 3 SECOND"),
    finished_at: knex.raw("NOW(3)"),
    finished_by: "fixture",
    finished_attempt: 1,
  });
  // A front: mass grows with rank while utilisation falls; a few rows off the front (family bests).
  const families = ["i", "channel", "box", "tee"] as const;
  const rows = Array.from({ length: n }, (_, i) => {
    const family = i === 0 ? best.family : families[i % families.length];
    const dims = i === 0 ? best.dimensions : { d: 200 + (i % 200), b: 100 + (i % 97), tf: 8 + (i % 5), tw: 6 + (i % 4) };
    const area = best.area * (1 + i / n);
    return {
      sweep_id: id,
      rank: i + 1,
      family,
      dimensions: JSON.stringify(dims),
      area,
      mass_per_metre: area * 7850e-6,
      utilisation: i === 0 ? best.utilisation : Math.max(0.3, 0.999 - (0.6 * i) / n),
      governing: i % 3 ? "bending-compression" : "shear",
      on_front: i < n - 8,
      family_best: i === 0 || i >= n - 8,
      attempt: 1,
    };
  });
  for (let i = 0; i < rows.length; i += 500) await knex("candidates").insert(rows.slice(i, i + 500));
  return Number(id);
}

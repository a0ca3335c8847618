// A sweep run to the end here and now, written exactly as the queue writes a finished one
// (candidatesToStore, the same columns): for the demo seed and test fixtures, which need real
// results without waiting for a worker.
import type { Knex } from "knex";
import { searchProblemSchema, searchSections, type SearchProblemInput } from "~/optimizer";
import { candidatesToStore, depthBestsInfo } from "~/workers/queue.server";
import { catalogueSummary, withRolledRows } from "~/lib/catalogue-sweep";
import { SWEEP_SEARCH_OPTIONS, sweepCatalogues, sweepRestraintStudy, withAdvice } from "~/workers/sweep-search.server";
import { studyApplies } from "~/lib/restraint-study";

export interface FinishedSweepInput {
  teamId: number;
  ownerId: number;
  projectId?: number | null;
  briefId?: number | null;
  recheckOf?: number | null;
  problem: SearchProblemInput;
}

export async function recordFinishedSweep(knex: Knex, input: FinishedSweepInput): Promise<number> {
  const problem = searchProblemSchema.parse(input.problem);
  const t0 = Date.now();
  // The queue's search options, so fixtures store the same candidates (front included) a real sweep does.
  const result = await withAdvice(problem, await sweepCatalogues(problem, await searchSections(problem, SWEEP_SEARCH_OPTIONS)));
  // and the restraint study a queued EN 1993 sweep stores with its results
  const study = studyApplies(problem) ? await sweepRestraintStudy(problem) : null;
  // (each family's lightest at every depth come with it: the grid front's context points)
  const ms = Date.now() - t0;
  const rows = withRolledRows(candidatesToStore(result, problem.objective, problem), result, problem);
  const catalogue = catalogueSummary(result, problem);
  return knex.transaction(async (trx) => {
    const [id] = await trx("sweeps").insert({
      team_id: input.teamId,
      owner_id: input.ownerId,
      project_id: input.projectId ?? null,
      brief_id: input.briefId ?? null,
      recheck_of: input.recheckOf ?? null,
      problem: JSON.stringify(problem),
      status: "succeeded",
      progress_done: 1,
      progress_total: 1,
      counts: JSON.stringify({ ...result.counts, front: result.front.length }),
      best: result.best ? JSON.stringify(result.best) : null,
      reason: result.reason ?? null,
      restraint_study: study ? JSON.stringify(study) : null,
      depth_bests: JSON.stringify(depthBestsInfo(problem, result)),
      advice: result.advice ? JSON.stringify(result.advice) : null,
      catalogue_result: catalogue ? JSON.stringify(catalogue) : null,
      attempts: 1,
      started_at: trx.raw("NOW(3) - INTERVAL ? MICROSECOND", [ms * 1000]),
      finished_at: trx.raw("NOW(3)"),
      finished_by: "seed",
      finished_attempt: 1,
    });
    for (let i = 0; i < rows.length; i += 500) await trx("candidates").insert(rows.slice(i, i + 500).map((r) => ({ ...r, sweep_id: id, attempt: 1 })));
    return Number(id);
  });
}

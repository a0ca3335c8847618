// What the sweep page reads: the sweep (queue's view), its stored candidates for the chart and
// table, the brief and project it belongs to, its rechecks and the options saved from it.
import { db, parseJson } from "~/lib/db.server";
import { notFound } from "~/lib/projects.server";
import { listCandidates, getTeamSweep, type SweepView } from "~/workers/queue.server";
import type { ChartCandidate } from "~/components/TradeoffChart";
import type { UnitSystem } from "~/optimizer/units";
import { candidateChecks, type Family, type SearchProblem } from "~/optimizer";
import { designRow } from "~/lib/design-summary";

/** The chart shows every stored candidate; the queue stores at most its front cap plus family bests. */
const MAX_CHART_CANDIDATES = 2_500;

/**
 * The stored candidates; under the EN 1993 basis each with the engine's design figures (class,
 * Mcr, χLT, resistances, weld throat), taken from candidateChecks, the one evaluation the search
 * itself ran (the rows store only the summary columns). About 2 500 evaluations at most.
 */
export async function sweepCandidates(sweepId: number, problem?: SearchProblem): Promise<ChartCandidate[]> {
  const out: ChartCandidate[] = [];
  const en = problem?.basis === "en1993";
  for (let page = 1; out.length < MAX_CHART_CANDIDATES; page++) {
    const r = await listCandidates(sweepId, { page, pageSize: 500, sort: "rank" });
    for (const c of r.items)
      out.push({
        rank: c.rank,
        family: c.family,
        dimensions: c.dimensions,
        massPerMetre: c.massPerMetre,
        utilisation: c.utilisation,
        governing: c.governing,
        onFront: c.onFront,
        cost: c.cost,
        design: en ? designOf(c.family, c.dimensions, problem!) : null,
      });
    if (r.items.length < 500) break;
  }
  return out;
}

function designOf(family: string, dimensions: Record<string, number>, problem: SearchProblem) {
  try {
    return designRow(candidateChecks(family as Family, dimensions, problem));
  } catch {
    // A row the current engine cannot evaluate (stored by an older version) shows no figures rather than failing the page.
    return null;
  }
}

export async function loadSweepPage(teamId: number, id: number) {
  const sweep = await getTeamSweep(id, { teamId });
  if (!sweep) throw notFound("No such sweep in your team.");
  const [brief, project, rechecks, options] = await Promise.all([
    sweep.briefId ? db("briefs").where({ id: sweep.briefId }).first("id", "name", "units") : null,
    sweep.projectId ? db("projects").where({ id: sweep.projectId }).first("id", "name") : null,
    db("sweeps").where({ recheck_of: sweep.id, team_id: teamId }).orderBy("id", "desc").select("id", "status"),
    db("options").where({ sweep_id: sweep.id }).orderBy("id").select("id", "review_state", "candidate"),
  ]);
  const done = sweep.status === "succeeded";
  return {
    sweep: publicSweep(sweep),
    candidates: done ? await sweepCandidates(sweep.id, sweep.problem) : [],
    brief: brief ? { id: brief.id as number, name: brief.name as string } : null,
    project: project ? { id: project.id as number, name: project.name as string } : null,
    units: ((brief?.units as UnitSystem | undefined) ?? "si") as UnitSystem,
    rechecks: rechecks.map((r) => ({ id: r.id as number, status: r.status as string })),
    options: options.map((o) => ({ id: o.id as number, reviewState: o.review_state as string, rank: parseJson<{ rank: number }>(o.candidate).rank })),
  };
}

/** Drops queue internals (lease, attempts) the page has no use for. */
function publicSweep(s: SweepView) {
  return {
    id: s.id,
    status: s.status,
    recheckOf: s.recheckOf,
    ownerId: s.ownerId,
    cancelRequested: s.cancelRequested,
    progress: s.progress,
    counts: s.counts,
    best: s.best
      ? {
          family: s.best.family,
          dimensions: s.best.dimensions,
          massPerMetre: s.best.massPerMetre,
          utilisation: s.best.utilisation,
          governing: s.best.governing,
          cost: s.best.cost ?? null,
          // the engine's stated simplifications for the section it found (EN 1993 basis)
          notes: s.best.design?.notes ?? null,
        }
      : null,
    restraintStudy: s.restraintStudy,
    reason: s.reason,
    advice: s.advice,
    error: s.error,
    queuedAt: s.queuedAt,
    finishedAt: s.finishedAt,
    elapsedMs: s.elapsedMs,
    etaMs: s.etaMs,
    problem: s.problem,
  };
}

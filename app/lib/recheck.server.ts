// Rechecks: a sweep's problem rerun with altered limits, linked by recheck_of, and the comparison
// a reviewer reads: which limits changed, the two bests, the mass difference, and whether each
// option saved from the original still fits the new problem: on its grid (families, ranges,
// steps, thicknesses) and through every check (the engine's sectionLimits).
import { db, parseJson } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import { changedLimits } from "~/lib/brief-form";
import { notFound } from "~/lib/projects.server";
import { savedRolledSection, type SavedCandidate } from "~/lib/options.server";
import { rolledSectionLimits, sectionLimits, type LimitBreach } from "~/optimizer";
import type { SessionUser } from "~/lib/auth.server";
import { enqueueSweep, getTeamSweep, type SweepView } from "~/workers/queue.server";
import type { SearchProblem } from "~/optimizer/search-schema";

export async function startRecheck(user: SessionUser, originalId: number, problem: SearchProblem, member: { lengthM?: number; count?: number } = {}): Promise<number> {
  const original = await getTeamSweep(originalId, user);
  if (!original) throw notFound("No such sweep in your team.");
  const { id } = await enqueueSweep({
    teamId: user.teamId,
    ownerId: user.id,
    projectId: original.projectId,
    briefId: original.briefId,
    recheckOf: original.id,
    problem,
    member,
  });
  await logActivity({ teamId: user.teamId, projectId: original.projectId, userId: user.id, action: "recheck_started", subjectType: "sweep", subjectId: id, detail: { recheckOf: original.id } });
  return id;
}

export interface RecheckComparison {
  original: SweepView;
  recheck: SweepView;
  changes: { path: string; before: unknown; after: unknown }[];
  /** recheck best − original best, kg/m; null unless both found one */
  massDifference: number | null;
  options: {
    id: number;
    candidate: SavedCandidate;
    reviewState: string;
    /** on the new grid and passing every check */
    feasible: boolean;
    /** every limit of the new brief the option breaks (engine's sectionLimits) */
    breaches: LimitBreach[];
    /** under the new brief's checks; null when its geometry cannot be checked */
    utilisation: number | null;
    governing: string | null;
    utilisationBefore: number;
  }[];
}

/** Compares a recheck with the sweep it rechecks (both must be in the caller's team). */
export async function compareRecheck(teamId: number, recheckId: number): Promise<RecheckComparison> {
  const recheck = await getTeamSweep(recheckId, { teamId });
  if (!recheck || !recheck.recheckOf) throw notFound("No such recheck in your team.");
  const original = await getTeamSweep(recheck.recheckOf, { teamId });
  if (!original) throw notFound("The sweep this recheck compares with is gone.");
  const rows = await db("options").where({ sweep_id: original.id }).select("id", "candidate", "review_state");
  const options = rows.map((r: Record<string, unknown>) => {
    const candidate = parseJson<SavedCandidate>(r.candidate);
    // Every limit, not only the checks: a recheck that only cut depth.max must fail a deeper option.
    // a rolled option by the catalogue rules: still among the searched sections, and its checks
    const rolled = savedRolledSection(candidate);
    const after = rolled ? rolledSectionLimits(rolled, candidate.catalogue ?? null, recheck.problem) : sectionLimits(candidate.family, candidate.dimensions, recheck.problem);
    return {
      id: r.id as number,
      candidate,
      reviewState: r.review_state as string,
      feasible: after.breaches.length === 0,
      breaches: after.breaches,
      utilisation: after.verdict?.utilisation ?? null,
      governing: after.verdict?.governing ?? null,
      utilisationBefore: candidate.utilisation,
    };
  });
  const massDifference = original.best && recheck.best ? recheck.best.massPerMetre - original.best.massPerMetre : null;
  return { original, recheck, changes: changedLimits(original.problem, recheck.problem), massDifference, options };
}

/** Rechecks of a sweep, newest first (linked from the sweep page). */
export async function rechecksOf(sweepId: number) {
  return db("sweeps").where({ recheck_of: sweepId }).orderBy("id", "desc").select("id", "status", "created_at");
}

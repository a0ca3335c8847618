// The restraint study (member-checks.md §3): the brief's lightest section (overall and per
// family) at lateral-torsional restraint spacings L, L/2 … L/divisions, L = restraint.length,
// so an engineer can weigh bracing against steel. Each spacing is the exact search (search.ts,
// best mode) of the brief with only restraint.length changed.
//
// Why the spacings run from the coarsest: a shorter segment only raises Mcr (Mcr grows with
// P = π²E·Iy/L² and U = π²E·Cw/L² + G·J, search.ts (E2), and both fall as L grows), hence
// Mb,Rd (χLT does not rise with λLT), and no other check depends on L; so every candidate
// feasible at L/k is feasible at L/(k + 1), and each spacing's bests are handed to the next
// search as known feasible candidates (searchWithKnown): an incumbent from the start, the same
// exact answer.
import { EngineInputError } from "./errors";
import type { Family } from "./geometry";
import type { SearchCandidate, SearchOptions, SearchPoint } from "./grid";
import { searchWithKnown } from "./search";
import { searchProblemSchema, type SearchProblemInput } from "./search-schema";

/** At most this many segments (five intermediate restraints), as the product offers. */
export const MAX_STUDY_DIVISIONS = 6;

export interface RestraintStudyPoint {
  /** segments the restraint length is divided into: 1 (restrained at its ends only) … divisions */
  segments: number;
  /** intermediate lateral-torsional restraints: segments − 1 */
  intermediateRestraints: number;
  /** the restraint spacing, m: restraint.length ÷ segments */
  spacing: number;
  /** the lightest (objective "cost": cheapest) feasible section at this spacing, or null */
  best: SearchCandidate | null;
  bestByFamily: Partial<Record<Family, SearchCandidate | null>>;
  /** why nothing passed, in the search's words (best null) */
  reason?: string;
  counts: { grid: number; evaluated: number; feasible: number };
}

export interface RestraintStudyResult {
  /** the brief's restraint length L, m */
  length: number;
  /** one per spacing, coarsest first (segments 1, 2, …) */
  points: RestraintStudyPoint[];
}

export interface RestraintStudyOptions {
  /** spacings L/1 … L/divisions; an integer 1 … 6, default 6 */
  divisions?: number;
  signal?: AbortSignal;
  /** shapes settled over all the spacings' searches (each searches the same grid) */
  onProgress?: SearchOptions["onProgress"];
}

/** The study. Throws a ZodError (fields named) on a bad brief, an EngineInputError naming the field when the brief has nothing to study. */
export function restraintStudy(input: SearchProblemInput, options: RestraintStudyOptions = {}): RestraintStudyResult {
  const divisions = options.divisions ?? MAX_STUDY_DIVISIONS;
  if (!(Number.isInteger(divisions) && divisions >= 1 && divisions <= MAX_STUDY_DIVISIONS))
    throw new EngineInputError("divisions", `divisions must be a whole number from 1 to ${MAX_STUDY_DIVISIONS} (the spacings L, L/2 … L/divisions)`);
  const problem = searchProblemSchema.parse(input);
  if (problem.basis !== "en1993")
    throw new EngineInputError("basis", 'basis: the restraint study needs the "en1993" basis (the allowable-stress basis checks no lateral-torsional buckling)');
  if (!problem.restraint)
    throw new EngineInputError("restraint", "restraint: the restraint study needs restraint.length (without it the compression flange is restrained throughout)");
  const L = problem.restraint.length;
  const points: RestraintStudyPoint[] = [];
  let known: SearchPoint[] = [];
  for (let k = 1; k <= divisions; k++) {
    const r = searchWithKnown(
      { ...problem, restraint: { ...problem.restraint, length: L / k } },
      {
        front: "evaluated",
        signal: options.signal,
        onProgress: options.onProgress ? (done, total) => options.onProgress!((k - 1) * total + done, divisions * total) : undefined,
      },
      known,
    );
    const point: RestraintStudyPoint = { segments: k, intermediateRestraints: k - 1, spacing: L / k, best: r.best, bestByFamily: r.bestByFamily, counts: r.counts };
    if (!r.best && r.reason) point.reason = r.reason;
    points.push(point);
    known = Object.values(r.bestByFamily).filter((c): c is SearchCandidate => !!c);
  }
  return { length: L, points };
}

// The restraint study (member-checks.md §3): the brief's lightest section (overall and per
// family) at lateral-torsional restraint spacings L, L/2 … L/divisions, L = restraint.length,
// so an engineer can weigh bracing against steel. Each spacing is the exact search (search.ts,
// best mode) of the brief with restraint.length changed, and the moment factor (C1, or Cb) of
// the segments between intermediate restraints (below).
//
// Why the spacings run from the coarsest: with the moment factor held, a shorter segment only
// raises Mcr (Mcr grows with P = π²E·Iy/L² and U = π²E·Cw/L² + G·J, search.ts (E2), and both
// fall as L grows), hence Mb,Rd (χLT does not rise with λLT), and no other check depends on L;
// so every candidate feasible at L/k is feasible at L/(k + 1) for k ≥ 2, and mostly from L to
// L/2 too (where the factor may drop, below). Each spacing's bests are handed to the next
// search as known candidates (searchWithKnown, which evaluates them again, so the answer stays
// exact where that monotony does not hold): an incumbent from the start, the same answer.
//
// Under EN 1993 (as for Cb under AISC 360, below) C1 belongs to the moment diagram over
// the segment between restraints (EN 1993-1-1 §6.3.2.2 leaves Mcr to the designer; the C1
// tables of ENV 1993-1-1:1992 Annex F are per segment, mem.), and the brief's C1 (1.13 for a
// uniform load on a simple span, more for steeper diagrams) is the whole of L's. A segment
// between intermediate restraints near mid-span carries nearly uniform moment, C1 ≈ 1.0, so
// keeping the brief's C1 there over-estimates Mcr: unconservative. So L keeps the brief's C1
// (the sweep's own answer), and L/2 … L/divisions take C1 = 1.0, the uniform-moment value
// (ENV 1993-1-1:1992 Annex F, Table F.1.1, ψ = +1, k = 1: C1 = 1.000, mem.) and the usual value
// for a segment whose own diagram is not worked out (common practice); a brief's C1 below 1.0
// is kept (min(C1, 1.0)), since the engineer chose it lower. C2 and C3 stay as the brief gives
// them: C2 weighs where the load acts (zg) and C3 the section's asymmetry (zj), neither of
// which the restraints change; the study lowers C1 alone, the factor that carries the
// diagram's shape, which puts the segments on the conservative side (common practice). Each
// point reports the C1 it used.
//
// Under AISC 360-16 (issue 14) L is the unbraced length Lb, and Chapter F's LTB strength does
// not fall as Lb shortens (Lp, Lr do not depend on Lb; F2-2, F2-3 and their F4, F5, F7, F9, F11
// counterparts fall with Lb). Cb is the one input that does not carry over: the brief's Cb
// (F1-1) belongs to the moment diagram over the whole of L, and the segments between
// intermediate braces have diagrams of their own (a uniform load's middle segments are nearly
// uniform moment, Cb ≈ 1). The study has no diagram to work theirs from, so a choice: L keeps
// the brief's Cb (the sweep's own answer), and L/2 … L/divisions take Cb = 1.0, which §F1
// permits as a conservative value for any segment (mem.). Each point reports the Cb it used.
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
  /** AISC 360 only: the Cb this spacing was searched with (the brief's at L, 1.0 at L/2 … ) */
  Cb?: number;
  /** EN 1993 only: the C1 this spacing was searched with (the brief's at L, min(C1, 1.0) at L/2 … ); C2, C3 the brief's */
  C1?: number;
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
  if (problem.basis !== "en1993" && problem.basis !== "aisc360")
    throw new EngineInputError("basis", 'basis: the restraint study needs the "en1993" or "aisc360" basis (the allowable-stress basis checks no lateral-torsional buckling)');
  const aisc = problem.basis === "aisc360";
  if (!problem.restraint)
    throw new EngineInputError("restraint", "restraint: the restraint study needs restraint.length (without it the compression flange is restrained throughout)");
  const L = problem.restraint.length;
  const points: RestraintStudyPoint[] = [];
  let known: SearchPoint[] = [];
  for (let k = 1; k <= divisions; k++) {
    // AISC: Cb = 1.0 between intermediate braces (the header says why)
    const Cb = aisc ? (k === 1 ? (problem.restraint.Cb ?? 1) : 1) : undefined;
    // EN 1993: C1 = 1.0 between intermediate restraints, C2 and C3 kept (the header says why)
    const C1 = aisc ? undefined : k === 1 ? problem.restraint.C1 : Math.min(problem.restraint.C1, 1);
    const r = searchWithKnown(
      { ...problem, restraint: { ...problem.restraint, length: L / k, ...(Cb !== undefined ? { Cb } : {}), ...(C1 !== undefined ? { C1 } : {}) } },
      {
        front: "evaluated",
        signal: options.signal,
        onProgress: options.onProgress ? (done, total) => options.onProgress!((k - 1) * total + done, divisions * total) : undefined,
      },
      known,
    );
    const point: RestraintStudyPoint = { segments: k, intermediateRestraints: k - 1, spacing: L / k, best: r.best, bestByFamily: r.bestByFamily, counts: r.counts, ...(Cb !== undefined ? { Cb } : {}), ...(C1 !== undefined ? { C1 } : {}) };
    if (!r.best && r.reason) point.reason = r.reason;
    points.push(point);
    known = Object.values(r.bestByFamily).filter((c): c is SearchCandidate => !!c);
  }
  return { length: L, points };
}

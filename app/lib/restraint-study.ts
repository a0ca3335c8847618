// The restraint study (member-checks.md §3): the same brief searched with the compression flange
// restrained at L, L/2 … L/6, so the engineer can weigh bracing against steel. What a sweep
// stores (sweeps.restraint_study, written with its results) and the sweep page charts.
import type { SearchProblem } from "~/optimizer/search-schema";
import type { SearchPoint, SearchResult } from "~/optimizer/grid";

/** Segments between restraints: 1 (restrained at the ends only) to 6 (five intermediate restraints). */
export const STUDY_SEGMENTS = [1, 2, 3, 4, 5, 6] as const;

export interface StudyPoint {
  /** intermediate lateral restraints (segments − 1) */
  restraints: number;
  /** restraint spacing, m */
  lengthM: number;
  /** AISC 360 only: the Cb searched with at this spacing (the brief's at L, 1.0 at L/2 … L/6; engine restraint-study.ts says why) */
  Cb?: number;
  /** EN 1993 only: the C1 searched with at this spacing (the brief's at L, 1.0 at L/2 … L/6, or the brief's if lower; C2, C3 the brief's; engine restraint-study.ts says why). Studies stored before it carry none: they kept the brief's C1 throughout. */
  C1?: number;
  /** the lightest (or cheapest, objective "cost") section at that spacing; null when none passes */
  best: { family: string; dimensions: Record<string, number>; massPerMetre: number; utilisation: number; governing: string; cost?: number } | null;
  /** why nothing passed, in the engine's words */
  reason?: string;
}

export interface RestraintStudy {
  /** the brief's restraint length L, m */
  lengthM: number;
  points: StudyPoint[];
  /** wall-clock time of the six searches, ms */
  elapsedMs: number;
  /** set when the study could not run (the sweep's own results still stand) */
  error?: string;
}

/** A study is run for EN 1993 and AISC 360 briefs with a restraint length (an allowable brief checks no buckling; "restrained throughout" has no length to divide). */
export function studyApplies(problem: Pick<SearchProblem, "basis" | "restraint">): boolean {
  return (problem.basis === "en1993" || problem.basis === "aisc360") && problem.restraint !== undefined;
}

/** A sweep's run: the search's result and, for code-basis briefs with a restraint length, the study. */
export type SweepResult = SearchResult & {
  restraintStudy?: RestraintStudy;
  /** each family's lightest feasible section at every depth (engine's depthBests), stored with the candidates */
  depthBests?: SearchPoint[];
};

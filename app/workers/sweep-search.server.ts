// How a runner executes one sweep's search.
//
// Small grids run in the runner's own thread: searchSections is synchronous, so the runner's
// timers wait while it runs, but such searches take milliseconds, and starting worker threads
// (tens to hundreds of ms each, more under tsx) would cost far more than the search. Larger grids
// run on worker threads (app/workers/search-threads.ts), which leaves
// the runner's event loop free for heartbeats and the cancel poll, and aborts by terminating the
// threads at once.
//
// Where the line is: a raw grid (rawGridSize, the product of the axes) of IN_THREAD_MAX_GRID
// shapes. The exact search's time does not follow the grid size closely (it bounds whole rows),
// but below 1e6 shapes even brute force would be quick, so nothing can hold the loop for long.
// Threads per sweep: the cores divided among the sweeps this process runs at once (at least 1),
// so a runner at full concurrency does not oversubscribe the machine.
import os from "node:os";
import { PROGRESS_UNIT, lightestWeldedProblem, rawGridSize, searchSections, whatItWouldTakeSteps, withCatalogues, type ProgressDetail, type SearchProblem, type SearchResult, type WhatItWouldTake } from "~/optimizer";
import { searchInThreads } from "./search-threads";
import { runRestraintStudy } from "./study-thread";
import { studyApplies, type SweepResult } from "~/lib/restraint-study";

export const IN_THREAD_MAX_GRID = 1e6;

// A sweep's chart shows the grid's exact front (front "grid": every feasible shape on the grid
// that no other beats on both mass, or cost, and utilisation, proven by the search's dominance
// bound, search.ts (D)) in the same pass as the exact best. It replaced `explore: 0.25` (rows
// within 25 % of each family's best, a front over what happened to be evaluated), which was both
// inexact and slower: tests/bench/search.bench.ts (6) times the two side by side. A sweep stopped
// at its time budget still returns the front over what it evaluated (frontScope "evaluated").
export const SWEEP_SEARCH_OPTIONS = { front: "grid" } as const;

/** Sweeps one runner runs at once: SPARWISE_WORKER_CONCURRENCY, else one core left for the web server. */
export function defaultConcurrency(): number {
  const v = Number(process.env.SPARWISE_WORKER_CONCURRENCY);
  return Number.isInteger(v) && v >= 1 ? v : Math.max(1, os.availableParallelism() - 1);
}

/** Threads per sweep: the cores divided among the sweeps the process runs at once, at least 1. */
export function sweepThreads(concurrency = defaultConcurrency()): number {
  return Math.max(1, Math.floor(os.availableParallelism() / Math.max(1, concurrency)));
}

export interface SweepSearchOptions {
  signal: AbortSignal;
  onProgress: (done: number, total: number, unit?: ProgressUnit, detail?: ProgressDetail) => void;
  concurrency?: number;
  /** Date.now() at which the search stops and returns its best so far (SearchResult.stoppedEarly) */
  deadline?: number;
}

/** What a sweep's progress counts (the engine's PROGRESS_UNIT; the page and the API say it in words). */
export type ProgressUnit = typeof PROGRESS_UNIT;

/** A running sweep's progress as the runner keeps it and the queue writes it. */
export interface SweepProgress {
  done: number;
  total: number;
  unit?: ProgressUnit;
  /** families searched to the end and candidates evaluated, when the search reports them */
  detail?: ProgressDetail;
}

export async function runSweepSearch(problem: SearchProblem, opts: SweepSearchOptions): Promise<AdvisedResult> {
  // Let pending timers (a cancel that arrived while the sweep waited for a slot) run first.
  await new Promise((r) => setImmediate(r));
  opts.signal.throwIfAborted();
  const deadline = opts.deadline;
  // the threads' shapes add up to the grid's, so the unit is the same either way
  const onProgress = (d: number, t: number, detail?: ProgressDetail) => opts.onProgress(d, t, PROGRESS_UNIT, detail);
  let result: SweepResult;
  const threads = sweepThreads(opts.concurrency ?? 1);
  if (rawGridSize(problem) <= IN_THREAD_MAX_GRID)
    result = searchSections(problem, { ...SWEEP_SEARCH_OPTIONS, signal: opts.signal, onProgress, stopWhen: deadline === undefined ? undefined : () => Date.now() >= deadline });
  else result = await searchInThreads(problem, { ...SWEEP_SEARCH_OPTIONS, threads, signal: opts.signal, deadline, onProgress });
  result = await sweepCatalogues(problem, result, { signal: opts.signal, threads, deadline });
  // Each family's lightest at every depth (stored so the results filter by depth with no rerun) are
  // the grid-front search's context points, proven in the same pass, on every grid size
  // (queue.server.ts storedDepthBests): no search per depth any more.
  if (studyApplies(problem))
    // the study belongs to the sweep's time budget too: none once the search used it up
    result.restraintStudy = result.stoppedEarly
      ? { lengthM: problem.restraint?.length ?? 0, points: [], elapsedMs: 0, error: "not run: the sweep stopped at its time budget" }
      : await sweepRestraintStudy(problem, opts.signal, deadline);
  // a sweep stopped at its budget gets the advice that narrows the grid (sweep-budget.ts), not more searches
  return result.stoppedEarly ? result : withAdvice(problem, result, opts.signal, deadline);
}

/**
 * The brief's catalogues searched beside the plates (the engine's withCatalogues). The catalogue
 * is enumerated in this thread (about 1–2 ms a section; at most MAX_CATALOGUE_SECTIONS, so
 * seconds at worst, well inside the lease). With the cost objective the lightest welded section
 * takes one more plate search, best only, where the sweep's own ran.
 *
 * Under a time budget (choice, the spec is silent): the catalogue is still enumerated after a plate
 * search that stopped at its budget (bounded as above, and its rolled answers are exact), but the
 * extra plate search for the lightest welded section is not started then, and one that itself
 * stops at the deadline is dropped: the side-by-side then leaves the lightest welded section out
 * rather than show one not proven lightest.
 */
export async function sweepCatalogues<R extends SearchResult>(problem: SearchProblem, result: R, opts: { signal?: AbortSignal; threads?: number; deadline?: number } = {}) {
  if (!problem.catalogues?.length) return result;
  const massProblem = result.stoppedEarly ? null : lightestWeldedProblem(problem);
  const { deadline } = opts;
  let byMass: SearchResult | null = null;
  if (massProblem)
    byMass =
      rawGridSize(massProblem) <= IN_THREAD_MAX_GRID
        ? searchSections(massProblem, { front: "evaluated", signal: opts.signal, stopWhen: deadline === undefined ? undefined : () => Date.now() >= deadline })
        : await searchInThreads(massProblem, { front: "evaluated", threads: opts.threads ?? 1, signal: opts.signal, deadline });
  if (byMass?.stoppedEarly) byMass = null;
  await new Promise((r) => setImmediate(r));
  opts.signal?.throwIfAborted();
  return withCatalogues(problem, result, byMass, { signal: opts.signal });
}

/**
 * The restraint study for a sweep (study-thread.ts: why it runs here, on a thread). A study that
 * fails is stored as its error and the sweep still succeeds: its own results do not depend on it.
 * A cancel aborts it like the search.
 */
export async function sweepRestraintStudy(problem: SearchProblem, signal?: AbortSignal, deadline?: number): Promise<SweepResult["restraintStudy"]> {
  // past the sweep's deadline the study stops like a cancel, but is stored as its error, not thrown
  const budget = deadline === undefined ? undefined : AbortSignal.timeout(Math.max(1, deadline - Date.now()));
  const both = budget && signal ? AbortSignal.any([signal, budget]) : (budget ?? signal);
  try {
    return await runRestraintStudy(problem, { signal: both });
  } catch (e) {
    if (signal?.aborted) throw e;
    const error = budget?.aborted ? "stopped at the sweep's time budget" : e instanceof Error ? e.message : String(e);
    return { lengthM: problem.restraint?.length ?? 0, points: [], elapsedMs: 0, error };
  }
}

/** A sweep's run, with what it would take when nothing was feasible (finishSweep stores it). */
export type AdvisedResult<R extends SearchResult = SweepResult> = R & { advice?: WhatItWouldTake | null };

/**
 * Grids larger than this get no advice: each of its up to DEFAULT_SEARCHES searches would take
 * as long as the sweep itself. The page says so instead.
 */
export const ADVICE_MAX_GRID = IN_THREAD_MAX_GRID;

/**
 * No feasible section: the engine's whatItWouldTake, driven one search at a time with the event
 * loop let through in between, so the runner's heartbeats and cancel polls keep running.
 */
export async function withAdvice<R extends SearchResult>(problem: SearchProblem, result: R, signal?: AbortSignal, deadline?: number): Promise<AdvisedResult<R>> {
  if (result.best) return result;
  if (rawGridSize(problem) > ADVICE_MAX_GRID) return { ...result, advice: null };
  const steps = whatItWouldTakeSteps(problem, { signal });
  for (;;) {
    await new Promise((r) => setImmediate(r));
    signal?.throwIfAborted();
    // the advice's searches count against the sweep's time budget too: past it, no advice
    if (deadline !== undefined && Date.now() >= deadline) return { ...result, advice: null };
    const n = steps.next();
    if (n.done) return { ...result, advice: n.value };
  }
}

// What it would take (issue 11, item 7): when a problem has no feasible section, the engine says
// how near each family came and, for each limit the designer sets, the smallest change along that
// limit's own grid that makes some section feasible ("depth max 450 → 480 mm gives an I at
// 52 kg/m"). Pure: every answer comes from re-running searchSections (search.ts, not changed
// here) on a copy of the problem with one thing altered.
//
// Nearest misses. A family's least-utilised candidate is the one the feasible set reaches first
// as every limit is eased together by one factor s: under the allowable basis every capacity
// (allowable stresses, slenderness limits, the deflection limit L/ratio) is multiplied by s, so a
// candidate of utilisation u is feasible exactly when u ≤ s; under EN 1993 the actions (moments,
// shear, service load) are divided by s instead, which scales the load-proportional checks the
// same way (bending, LTB, shear, deflection; the bending–shear interaction and the class only
// approximately: stated on the page). Bisection on s brackets the least utilisation u*; the
// search at the upper end returns that family's lightest candidate with u ≤ s, i.e. a least-
// utilised one to within the bracket (MISS_REL). Its checks under the unaltered problem
// (candidateChecks) say what fails.
//
// Relaxations. Easing one limit only adds grid points or feasible candidates, so feasibility is
// monotone in the step count k along that limit's grid: first the bound is tried (k = K), then
// bisection finds the least k. Limits and their grids:
//   depth.max up and depth.min down by depth.step; width.max up and width.min down by width.step
//   (min never below one step); thicknesses: the next standard plate above the thickest listed
//   (PLATE_SERIES, common practice preferred thicknesses), one more each step; slenderness limits
//   up by 5 % of the limit per step; deflection limitRatio down by 5 % per step; restraint length
//   down by 5 % per step; fabrication minThickness down through the listed plates, minBoxClear
//   down by 10 mm per step, flangeAtLeastWeb off. Bound: MAX_STEPS steps. Loads and material
//   strengths are not limits the designer sets here and are left alone.
import { candidateChecks, type CheckResult } from "./checks";
import type { Family } from "./geometry";
import type { SearchPoint } from "./grid";
import { searchProblemSchema, type SearchProblem } from "./search-schema";
import { searchSections } from "./search";

/** Searches one whatItWouldTake may run (each a full searchSections). */
export const DEFAULT_SEARCHES = 200;
/** Steps tried along one limit's grid at most. */
export const MAX_STEPS = 40;
/** Nearest misses are least-utilised to within this relative bracket. */
export const MISS_REL = 1e-3;
/** Preferred plate thicknesses, mm (common practice; no standard named). */
export const PLATE_SERIES = [3, 4, 5, 6, 8, 10, 12, 15, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 80, 90, 100] as const;

export interface NearestMiss {
  family: Family;
  dimensions: Record<string, number>;
  massPerMetre: number;
  /** under the unaltered problem */
  utilisation: number;
  governing: string;
  /** the checks it fails under the unaltered problem, worst first */
  failing: CheckResult[];
}

export interface Relaxation {
  /** the problem path eased (e.g. "depth.max"; "thicknesses" adds plates) */
  limit: string;
  /** value before and after (numbers in the problem's units; thicknesses: the plates added) */
  from: number | number[] | boolean;
  to: number | number[] | boolean;
  /** steps along the limit's grid */
  steps: number;
  /** the lightest section the eased problem finds */
  best: SearchPoint;
}

export interface Unreachable {
  limit: string;
  from: number | number[] | boolean;
  /** the furthest value tried */
  bound: number | number[] | boolean;
}

export interface WhatItWouldTake {
  nearestMisses: NearestMiss[];
  relaxations: Relaxation[];
  /** limits that found nothing even at their bound */
  unreachable: Unreachable[];
  /** true when the search budget ran out before every limit was tried */
  partial: boolean;
}

export interface RelaxOptions {
  signal?: AbortSignal;
  /** searches allowed in all (each is one searchSections run); default 400 */
  maxSearches?: number;
  maxSteps?: number;
}

class Budget {
  used = 0;
  constructor(
    readonly max: number,
    readonly signal?: AbortSignal,
  ) {}
  /**
   * The lightest feasible section of the problem, or null; undefined when the budget is spent or
   * the problem invalid. Yields once before each search, so a caller can drive the whole job a
   * search at a time (whatItWouldTakeSteps) and keep its own event loop turning.
   */
  *best(problem: unknown): Generator<void, SearchPoint | null | undefined> {
    this.signal?.throwIfAborted();
    if (this.used >= this.max) return undefined;
    yield;
    const parsed = searchProblemSchema.safeParse(problem);
    if (!parsed.success) return undefined;
    this.used++;
    const r = searchSections(parsed.data, { front: "evaluated", signal: this.signal });
    return r.best ? slim(r.best) : null;
  }
}

function slim(c: SearchPoint): SearchPoint {
  const out: SearchPoint = { family: c.family, dimensions: c.dimensions, area: c.area, massPerMetre: c.massPerMetre, utilisation: c.utilisation, governing: c.governing };
  if (c.cost !== undefined) out.cost = c.cost;
  return out;
}

const clone = (p: SearchProblem): SearchProblem => structuredClone(p);

/** Every limit eased by the factor s ≥ 1 (see the header). */
export function easedProblem(p: SearchProblem, s: number): SearchProblem {
  const q = clone(p);
  if (q.basis === "en1993") {
    q.moment = { sagging: q.moment.sagging / s, hogging: q.moment.hogging / s };
    if (q.shear !== undefined) q.shear /= s;
    if (q.deflection) q.deflection.serviceLoad /= s;
    return q;
  }
  if (q.allowable) q.allowable = { ...q.allowable, tension: q.allowable.tension * s, compression: q.allowable.compression * s, ...(q.allowable.shear !== undefined ? { shear: q.allowable.shear * s } : {}) };
  if (q.slenderness) for (const k of Object.keys(q.slenderness) as (keyof NonNullable<SearchProblem["slenderness"]>)[]) if (q.slenderness[k] !== undefined) q.slenderness[k] = q.slenderness[k]! * s;
  if (q.deflection) q.deflection.limitRatio /= s;
  return q;
}

/** Each family's least-utilised candidate (to within MISS_REL) and what it fails under `problem`. */
export function nearestMisses(problem: SearchProblem, opts: RelaxOptions = {}): NearestMiss[] {
  const budget = new Budget(opts.maxSearches ?? DEFAULT_SEARCHES, opts.signal);
  return drain(missesWith(problem, budget));
}

/** Runs a step generator to its end (the synchronous entries). */
function drain<T>(g: Generator<void, T>): T {
  for (;;) {
    const r = g.next();
    if (r.done) return r.value;
  }
}

function* missesWith(problem: SearchProblem, budget: Budget): Generator<void, NearestMiss[]> {
  const out: NearestMiss[] = [];
  for (const family of problem.families) {
    const one = { ...clone(problem), families: [family] };
    // Bracket: lo infeasible (s = 1, the problem itself), hi feasible.
    let lo = 1,
      hi = 2,
      found: SearchPoint | null | undefined = null;
    for (let i = 0; i < 40; i++) {
      found = yield* budget.best(easedProblem(one, hi));
      if (found !== null) break;
      lo = hi;
      hi *= 2;
    }
    if (!found) continue;
    while (hi - lo > MISS_REL * hi) {
      const mid = (lo + hi) / 2;
      const r = yield* budget.best(easedProblem(one, mid));
      if (r === undefined) break;
      if (r) {
        hi = mid;
        found = r;
      } else lo = mid;
    }
    const v = candidateChecks(found.family, found.dimensions, problem);
    out.push({
      family: found.family,
      dimensions: found.dimensions,
      massPerMetre: found.massPerMetre,
      utilisation: v.utilisation,
      governing: v.governing,
      failing: v.checks.filter((c) => c.demand > c.capacity).sort((a, b) => b.utilisation - a.utilisation),
    });
  }
  return out;
}

interface LimitGrid {
  limit: string;
  from: number | number[] | boolean;
  /** the problem eased by k ≥ 1 steps, and the value it then has; null past the limit's own end */
  at(k: number): { problem: SearchProblem; value: number | number[] | boolean } | null;
  steps: number;
}

function limitGrids(p: SearchProblem, maxSteps: number): LimitGrid[] {
  const grids: LimitGrid[] = [];
  const axis = (name: "depth" | "width", end: "max" | "min") => {
    const a = p[name];
    const sign = end === "max" ? 1 : -1;
    // min stays at least one step above zero; max is put on the grid (min + n·step) first
    const base = end === "max" ? a.min + Math.floor((a.max - a.min) / a.step + 1e-9) * a.step : a.min;
    const steps = end === "max" ? maxSteps : Math.min(maxSteps, Math.floor((a.min - a.step) / a.step + 1e-9));
    if (steps < 1) return;
    grids.push({
      limit: `${name}.${end}`,
      from: a[end],
      steps,
      at: (k) => {
        const q = clone(p);
        const value = base + sign * k * a.step;
        q[name] = { ...a, [end]: value };
        return { problem: q, value };
      },
    });
  };
  axis("depth", "max");
  axis("depth", "min");
  axis("width", "max");
  axis("width", "min");
  const thickest = Math.max(...p.thicknesses);
  const more = PLATE_SERIES.filter((t) => t > thickest * (1 + 1e-9)).slice(0, maxSteps);
  if (more.length && p.objective !== "cost")
    grids.push({
      limit: "thicknesses",
      from: [...p.thicknesses],
      steps: more.length,
      at: (k) => {
        const q = clone(p);
        const added = more.slice(0, k);
        q.thicknesses = [...p.thicknesses, ...added];
        return { problem: q, value: added };
      },
    });
  const scaled = (limit: string, from: number, factor: (k: number) => number, set: (q: SearchProblem, v: number) => void) =>
    grids.push({
      limit,
      from,
      steps: maxSteps,
      at: (k) => {
        const q = clone(p);
        // twelve figures: 3 × 0.7 is 2.1, not 2.0999999999999996
        const value = Number((from * factor(k)).toPrecision(12));
        set(q, value);
        return { problem: q, value };
      },
    });
  if (p.basis !== "en1993" && p.slenderness)
    for (const key of ["outstand", "internal", "web", "stem"] as const) {
      const v = p.slenderness[key];
      if (v !== undefined) scaled(`slenderness.${key}`, v, (k) => 1 + 0.05 * k, (q, x) => (q.slenderness![key] = x));
    }
  if (p.deflection) scaled("deflection.limitRatio", p.deflection.limitRatio, (k) => Math.max(0.05, 1 - 0.05 * k) , (q, x) => (q.deflection!.limitRatio = x));
  if (p.basis === "en1993" && p.restraint) scaled("restraint.length", p.restraint.length, (k) => Math.max(0.05, 1 - 0.05 * k), (q, x) => (q.restraint!.length = x));
  const fab = p.fabrication;
  if (fab?.minThickness !== undefined) {
    const below = [...new Set(p.thicknesses)].filter((t) => t < fab.minThickness! * (1 - 1e-12)).sort((a, b) => b - a);
    if (below.length)
      grids.push({
        limit: "fabrication.minThickness",
        from: fab.minThickness,
        steps: below.length,
        at: (k) => {
          const q = clone(p);
          q.fabrication = { ...fab, minThickness: below[k - 1] };
          return { problem: q, value: below[k - 1] };
        },
      });
  }
  if (fab?.minBoxClear !== undefined && p.families.includes("box")) {
    const n = Math.min(maxSteps, Math.floor(fab.minBoxClear / 10));
    if (n >= 1)
      grids.push({
        limit: "fabrication.minBoxClear",
        from: fab.minBoxClear,
        steps: n,
        at: (k) => {
          const q = clone(p);
          const value = fab.minBoxClear! - 10 * k;
          q.fabrication = { ...fab, minBoxClear: value > 0 ? value : undefined };
          return { problem: q, value: Math.max(0, value) };
        },
      });
  }
  if (fab?.flangeAtLeastWeb)
    grids.push({
      limit: "fabrication.flangeAtLeastWeb",
      from: true,
      steps: 1,
      at: () => {
        const q = clone(p);
        q.fabrication = { ...fab, flangeAtLeastWeb: undefined };
        return { problem: q, value: false };
      },
    });
  return grids;
}

/** For each limit, the least number of steps along its grid that makes some section feasible. */
export function relaxLimits(problem: SearchProblem, opts: RelaxOptions = {}): { relaxations: Relaxation[]; unreachable: Unreachable[]; partial: boolean } {
  const budget = new Budget(opts.maxSearches ?? DEFAULT_SEARCHES, opts.signal);
  return drain(relaxWith(problem, budget, opts.maxSteps ?? MAX_STEPS));
}

function* relaxWith(problem: SearchProblem, budget: Budget, maxSteps: number): Generator<void, { relaxations: Relaxation[]; unreachable: Unreachable[]; partial: boolean }> {
  const relaxations: Relaxation[] = [];
  const unreachable: Unreachable[] = [];
  let partial = false;
  for (const g of limitGrids(problem, maxSteps)) {
    // The furthest step whose problem is still valid (an eased axis may exceed the schema's caps).
    let K = g.steps;
    let top = g.at(K);
    while (K > 0 && (!top || !searchProblemSchema.safeParse(top.problem).success)) top = g.at(--K);
    if (!top || K < 1) continue;
    const atBound = yield* budget.best(top.problem);
    if (atBound === undefined) {
      partial = true;
      break;
    }
    if (atBound === null) {
      unreachable.push({ limit: g.limit, from: g.from, bound: top.value });
      continue;
    }
    // Least k in [1, K] with a feasible section (monotone in k).
    let lo = 0,
      hi = K,
      best = atBound;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      const r = yield* budget.best(g.at(mid)!.problem);
      if (r === undefined) {
        partial = true;
        break;
      }
      if (r) {
        hi = mid;
        best = r;
      } else lo = mid;
    }
    relaxations.push({ limit: g.limit, from: g.from, to: g.at(hi)!.value, steps: hi, best });
  }
  // Smallest change first, then the lightest result.
  relaxations.sort((a, b) => a.steps - b.steps || a.best.massPerMetre - b.best.massPerMetre);
  return { relaxations, unreachable, partial };
}

/**
 * Nearest misses and relaxations of an infeasible problem (see the header), within one search
 * budget, as steps: the generator yields before each search and returns the answer. A queue
 * worker drives it a search at a time so its heartbeats keep running.
 */
export function* whatItWouldTakeSteps(problem: SearchProblem, opts: RelaxOptions = {}): Generator<void, WhatItWouldTake> {
  const budget = new Budget(opts.maxSearches ?? DEFAULT_SEARCHES, opts.signal);
  const nearest = yield* missesWith(problem, budget);
  const r = yield* relaxWith(problem, budget, opts.maxSteps ?? MAX_STEPS);
  return { nearestMisses: nearest, ...r, partial: r.partial || budget.used >= budget.max };
}

/** whatItWouldTakeSteps run to its end in one call. */
export function whatItWouldTake(problem: SearchProblem, opts: RelaxOptions = {}): WhatItWouldTake {
  return drain(whatItWouldTakeSteps(problem, opts));
}

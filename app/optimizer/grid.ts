// What the brute-force reference and the fast search share: the grid a problem defines
// (engine contract, SearchProblem "The grid"), the options, and how raw candidates become
// the contract's SearchResult.
import { candidateChecks, makeCheckContext, type CheckContext, type CheckResult } from "./checks";
import { FAMILY_KERNELS, N_CHECKS, dimsObject, type FamilyKernel } from "./family-kernel";
import { Front, Staircase, compareAcross, compareInFamily, type RawCandidate } from "./front";
import type { Family } from "./geometry";
import type { AiscDesign, DesignBlock } from "./design-types";
import { sectionProperties, type SectionProperties } from "./properties";
import { CHECK_NAMES, gridValues, type CheckName, type SearchProblem } from "./search-schema";

/**
 * What onProgress counts: shapes of the grid (valid geometry, as counts.grid) settled so far,
 * i.e. evaluated or proven unable to change the answer; total is the grid. Brute force counts the
 * raw product of the axes instead (it meets invalid shapes one by one).
 */
export const PROGRESS_UNIT = "shapes";

/** What else a progress report can say: the families searched to the end and the candidates evaluated so far. */
export interface ProgressDetail {
  familiesDone: number;
  familiesTotal: number;
  evaluated: number;
}

export interface SearchOptions {
  /** done, total in PROGRESS_UNIT; total stays fixed through one search. The detail is optional to callers. */
  onProgress?: (done: number, total: number, detail?: ProgressDetail) => void;
  /** Checked every few thousand evaluations; an aborted search throws the signal's reason (an AbortError DOMException by default). */
  signal?: AbortSignal;
  /**
   * Fast search only: evaluate the whole grid (the brute-force reference), so `front` and
   * `counts.feasible` are over every feasible candidate. `best` is the same either way.
   */
  exhaustive?: boolean;
  /**
   * What `front` means. "grid" (the default): the exact front of every feasible candidate on the
   * grid, proven by the same branch-and-bound (search.ts, (D)), and `context` with it.
   * "evaluated": only `best` and `bestByFamily` are proven; `front` is the front of the candidates
   * the search happened to evaluate (the fastest search, for callers that want the best alone).
   */
  front?: "grid" | "evaluated";
  /**
   * A labelled approximation, front "evaluated" only (given alone it selects it): also evaluate
   * rows whose lightest point is within this fraction of the family's best objective (0.2 = 20%),
   * so the evaluated front widens near the optimum. `best` is exact either way; the front is not
   * the grid's. Kept to measure the exact front against (tests/bench/search.bench.ts).
   */
  explore?: number;
  /** Search only depth-grid indices in [from, to) (used to split a search across threads). */
  depthIndexRange?: [number, number];
  /**
   * Search only depth-grid indices i with i mod stride = offset, [offset, stride] (after
   * depthIndexRange): the threads' split. Interleaved parts each hold depths from the whole range,
   * so each part's front is near the whole grid's and its dominance bound (search.ts (D)) as strong.
   */
  depthInterleave?: [number, number];
  /**
   * Grid front only: a channel to the other parts of the same grid searched at the same time
   * (search-threads.ts). The search publishes each candidate that joins its front and takes the
   * other parts' in: they are feasible candidates of the grid too, so they bound dominance ((D))
   * as its own do, and a part no longer proves off the front what another part's members beat.
   * The parts' fronts still combine to the grid's (a grid front member is beaten by nothing, so
   * no part drops it).
   */
  frontShare?: FrontShare;
  /**
   * Fast search only: asked every few thousand heap steps and before each family; once it answers
   * true the search stops and returns what it has, marked `stoppedEarly` (the caller decides when:
   * a time budget passes a clock check here, so the engine itself reads no clock).
   */
  stopWhen?: () => boolean;
}

/** See SearchOptions.frontShare. */
export interface FrontShare {
  publish(objective: number, utilisation: number): void;
  /** hands over the pairs published by the other parts since the last poll */
  poll(take: (objective: number, utilisation: number) => void): void;
}

/** A candidate as the front and the context points carry it (no check table, no properties). */
export interface SearchPoint {
  family: Family;
  dimensions: Record<string, number>;
  area: number;
  massPerMetre: number;
  /** per metre, in the stock list's currency; present when objective is "cost" */
  cost?: number;
  utilisation: number;
  governing: CheckName;
}

export interface SearchCandidate extends SearchPoint {
  checks: CheckResult[];
  properties: SectionProperties;
  /** basis "en1993" only: class, resistances, Mcr, χLT, weld throat … (design-types.ts) */
  design?: DesignBlock;
  /** basis "aisc360" only: Table B4.1b, Chapter F zone, Lp, Lr, Mn, G2 shear … (design-types.ts) */
  aisc?: AiscDesign;
  /** with a deflection check: vertical, sideways and total service deflection, mm (checks.ts) */
  deflection?: { vertical: number; sideways: number; total: number };
}

export interface SearchResult {
  best: SearchCandidate | null;
  reason?: string;
  bestByFamily: Partial<Record<Family, SearchCandidate | null>>;
  /**
   * Candidates no other feasible candidate beats on both objective and utilisation, sorted by
   * objective, then utilisation, then the contract's order. Over the whole grid when frontScope
   * is "grid"; over the candidates the search evaluated when it is "evaluated".
   */
  front: SearchPoint[];
  frontScope: "grid" | "evaluated";
  /**
   * frontScope "grid" only: each family's lightest feasible candidate at each grid depth (the
   * chart's context points), by family in problem order, then depth.
   */
  context?: SearchPoint[];
  counts: { grid: number; evaluated: number; feasible: number };
  /**
   * Present (true) when `stopWhen` ended the search before it finished: `best` and
   * `bestByFamily` are then the lightest found so far, NOT proven lightest, families not reached
   * are null, `front` is over what was evaluated (frontScope "evaluated", no context), and
   * `counts.grid` covers only the part of the grid the search reached.
   */
  stoppedEarly?: true;
}

export interface PreparedFamily {
  fi: number;
  fk: FamilyKernel;
  /** grid values for each dimension, table order */
  axes: Float64Array[];
}

export interface Prepared {
  problem: SearchProblem;
  ctx: CheckContext;
  depths: Float64Array;
  widths: Float64Array;
  /** stock thicknesses, ascending, duplicates dropped (a duplicate would count shapes twice) */
  thicknesses: Float64Array;
  families: PreparedFamily[];
}

/**
 * Fabrication rules (member-checks.md §2, `fabrication`) are grid exclusions, not checks: the
 * shapes they drop are not in the grid at all (counts.grid leaves them out), under either basis.
 * - minThickness: stock plates thinner are dropped from the thickness axis; a solid rectangle's
 *   sides (its plate) must reach it too.
 * - flangeAtLeastWeb: tf ≥ tw for each flange (a rule on the row's fixed dimensions).
 * - minBoxClear: boxes with b − 2·tw ≥ minBoxClear (a least free width).
 * Each is folded into the family kernel's own rules (groupValid, freeMin, secondMin), which both
 * the fast search and brute force obey, so they stay exactly equal. "≥" is taken with a 1e-12
 * relative allowance so a grid value meant to land on a limit is not lost to rounding.
 */
const AT_LEAST = 1 - 1e-12;
export function fabricationKernel(fk: FamilyKernel, fab: SearchProblem["fabrication"]): FamilyKernel {
  if (!fab) return fk;
  const { minThickness: mt, flangeAtLeastWeb, minBoxClear } = fab;
  const pairs: [number, number][] = [];
  if (flangeAtLeastWeb) {
    // [flange thickness index, web thickness index] in FAMILY_DIMENSIONS order
    if (fk.family === "i" || fk.family === "channel" || fk.family === "tee" || fk.family === "box") pairs.push([2, 3]);
    else if (fk.family === "mono-i") pairs.push([2, 5], [4, 5]);
    else if (fk.family === "channel-down") pairs.push([3, 2]);
  }
  const rectMin = fk.family === "rectangle" && mt !== undefined ? mt * AT_LEAST : 0;
  const boxClear = fk.family === "box" && minBoxClear !== undefined ? minBoxClear : undefined;
  if (pairs.length === 0 && rectMin === 0 && boxClear === undefined) return fk;
  const { groupValid, freeMin } = fk;
  return {
    ...fk,
    groupValid: (v) => {
      if (!groupValid(v)) return false;
      for (const [f, w] of pairs) if (!(v[f] >= v[w] * AT_LEAST)) return false;
      // rectangle [b, d]: d is the row's fixed side
      return !(rectMin > 0 && !(v[1] >= rectMin));
    },
    // the free width must be strictly above freeMin: just below the least allowed value
    freeMin: (v) => {
      let m = freeMin(v);
      if (rectMin > 0 && rectMin * AT_LEAST > m) m = rectMin * AT_LEAST;
      if (boxClear !== undefined) {
        const need = (boxClear + 2 * v[3]) * AT_LEAST;
        if (need > m) m = need;
      }
      return m;
    },
  };
}

export function prepare(problem: SearchProblem, depthIndexRange?: [number, number], depthInterleave?: [number, number]): Prepared {
  let depths = gridValues(problem.depth);
  if (depthIndexRange) depths = depths.slice(Math.max(0, depthIndexRange[0]), Math.min(depths.length, depthIndexRange[1]));
  if (depthInterleave && depthInterleave[1] > 1) {
    const [offset, stride] = depthInterleave;
    depths = depths.filter((_, i) => i % stride === offset);
  }
  const widths = gridValues(problem.width);
  const mt = problem.fabrication?.minThickness;
  const stock = [...new Set(problem.thicknesses)].filter((t) => mt === undefined || t >= mt * AT_LEAST);
  const thicknesses = Float64Array.from(stock.sort((a, b) => a - b));
  const families = problem.families.map((f, fi) => {
    const fk = fabricationKernel(FAMILY_KERNELS[f], problem.fabrication);
    return { fi, fk, axes: fk.roles.map((r) => (r === "depth" ? depths : r === "width" ? widths : thicknesses)) };
  });
  return { problem, ctx: makeCheckContext(problem), depths, widths, thicknesses, families };
}

export function copyCandidate(c: RawCandidate): RawCandidate {
  return { ...c, v: Float64Array.from(c.v) };
}

/** Bookkeeping both searches fill in the same way. */
export class Tally {
  evaluated = 0;
  feasible = 0;
  grid = 0;
  /** candidates ruled out, by the check that ruled them out (for `reason`) */
  ruledOut = new Float64Array(N_CHECKS);
  bestByFamily: (RawCandidate | null)[];
  front = new Front();
  /** other parts' front members (SearchOptions.frontShare), for the dominance bound only */
  ext = new Staircase();
  share: FrontShare | null = null;
  /** lightest feasible per (family, depth index): family·nDepths + depth index; empty when not tracked */
  ctxBest: (RawCandidate | null)[];
  /** their objectives (Infinity while none), read in the search's hot loop */
  ctxObj: Float64Array;
  /** set once stopWhen answered true */
  stopped = false;
  constructor(
    nFamilies: number,
    readonly nDepths = 0,
    readonly stopWhen?: () => boolean,
  ) {
    this.bestByFamily = new Array(nFamilies).fill(null);
    this.ctxBest = new Array(nFamilies * nDepths).fill(null);
    this.ctxObj = new Float64Array(nFamilies * nDepths).fill(Infinity);
  }
  /** Asks stopWhen (once it said stop, the answer stays stop). */
  shouldStop(): boolean {
    if (!this.stopped && this.stopWhen?.()) this.stopped = true;
    return this.stopped;
  }
}

function toPoint(p: Prepared, c: RawCandidate): SearchPoint {
  const out: SearchPoint = {
    family: c.fk.family,
    dimensions: dimsObject(c.fk, c.v),
    area: c.area,
    massPerMetre: c.area * p.problem.density * 1e-6,
    utilisation: c.utilisation,
    governing: CHECK_NAMES[c.governing],
  };
  if (p.ctx.cost) out.cost = c.objective;
  return out;
}

function toOutput(p: Prepared, c: RawCandidate): SearchCandidate {
  const family = c.fk.family;
  const dimensions = dimsObject(c.fk, c.v);
  const verdict = candidateChecks(family, dimensions, p.problem);
  const properties = sectionProperties({ family, ...dimensions, density: p.problem.density } as Parameters<typeof sectionProperties>[0]);
  const out: SearchCandidate = {
    family,
    dimensions,
    area: c.area,
    massPerMetre: c.area * p.problem.density * 1e-6,
    utilisation: c.utilisation,
    governing: CHECK_NAMES[c.governing],
    checks: verdict.checks,
    properties,
  };
  if (verdict.design) out.design = verdict.design;
  if (verdict.aisc) out.aisc = verdict.aisc;
  if (verdict.deflection) out.deflection = verdict.deflection;
  if (p.ctx.cost) out.cost = c.objective;
  return out;
}

const CHECK_WORDS: Record<CheckName, string> = {
  "bending-compression": "the compressive bending stress exceeds allowable.compression",
  "bending-tension": "the tensile bending stress exceeds allowable.tension",
  shear: "the shear stress exceeds allowable.shear",
  "slenderness-outstand": "a flange outstand (or angle leg) is more slender than slenderness.outstand",
  "slenderness-internal": "an internal plate is more slender than slenderness.internal",
  "slenderness-web": "the web is more slender than slenderness.web",
  "slenderness-stem": "the stem (or leg) is more slender than slenderness.stem",
  deflection: "the deflection exceeds span / deflection.limitRatio",
  "class-4": "a plate is too slender for class 3 (class 4 sections are outside this version)",
  "bending-resistance": "the design moment exceeds the bending resistance Mc,Rd",
  ltb: "the design moment exceeds the lateral-torsional buckling resistance Mb,Rd over the restraint length",
  "shear-resistance": "the design shear exceeds the plastic shear resistance Vpl,Rd",
  "shear-buckling": "the design shear exceeds the web's shear buckling resistance Vb,Rd",
  "bending-shear": "the design moment exceeds the bending resistance reduced for shear MV,Rd",
  weld: "the flange-to-web weld needs a throat larger than 0.7 × the thinner plate",
  bearing: "the reaction exceeds the unstiffened web's patch-loading resistance at the support",
};

const CHECK_HINTS: Record<CheckName, string> = {
  "bending-compression": "allow deeper or wider sections, thicker plates, or a higher allowable stress",
  "bending-tension": "allow deeper or wider sections, thicker plates, or a higher allowable stress",
  shear: "allow thicker webs, deeper sections, or a higher allowable shear stress",
  "slenderness-outstand": "allow thicker flanges or narrower widths, or relax the outstand limit",
  "slenderness-internal": "allow thicker plates or narrower widths, or relax the internal limit",
  "slenderness-web": "allow thicker webs or shallower depths, or relax the web limit",
  "slenderness-stem": "allow thicker stems or shallower depths, or relax the stem limit",
  deflection: "allow deeper sections or relax the deflection limit",
  "class-4": "allow thicker plates or narrower widths",
  "bending-resistance": "allow deeper or wider sections or thicker plates",
  ltb: "add lateral restraints (a shorter restraint length), or allow wider, stockier flanges",
  "shear-resistance": "allow thicker webs or deeper sections",
  "shear-buckling": "allow thicker webs, or shallower webs",
  "bending-shear": "allow thicker webs or deeper sections",
  weld: "allow thicker webs (the weld throat is limited by the thinner plate)",
  bearing: "provide bearing stiffeners (supports.stiffened), a longer bearing, or thicker webs",
};

function reasonText(p: Prepared, t: Tally): string {
  if (t.grid === 0)
    return "No shape in the grid has valid geometry: every combination of depth, width and thickness leaves a plate with no clear length (e.g. depth not above twice the flange thickness). Widen the depth or width range or list thinner plates.";
  let g = 0;
  for (let c = 1; c < N_CHECKS; c++) if (t.ruledOut[c] > t.ruledOut[g]) g = c;
  const name = CHECK_NAMES[g];
  // The fast search rules shapes out in blocks by bounds (a block can be counted under more than
  // one bound), so the tally names the limit, not an exact share.
  return `No candidate passes every check. Of the ${t.grid.toLocaleString("en")} shapes in the grid, the ${name} limit rules out the most: ${CHECK_WORDS[name]}. To find a section, ${CHECK_HINTS[name]}.`;
}

/** frontScope: "grid" when every grid candidate was evaluated or proven not on the front (then with context). */
export function buildResult(p: Prepared, t: Tally, scope: "grid" | "evaluated"): SearchResult {
  // a stopped search evaluated only part of the grid: its front is over what it evaluated
  const frontScope = t.stopped ? "evaluated" : scope;
  let best: RawCandidate | null = null;
  for (const c of t.bestByFamily) if (c && (!best || compareAcross(c, best) < 0)) best = c;
  const bestByFamily: Partial<Record<Family, SearchCandidate | null>> = {};
  p.families.forEach((pf, i) => {
    const c = t.bestByFamily[i];
    bestByFamily[pf.fk.family] = c ? toOutput(p, c) : null;
  });
  const front = [...t.front.items]
    .sort((a, b) => a.objective - b.objective || a.utilisation - b.utilisation || compareAcross(a, b))
    .map((c) => toPoint(p, c));
  const res: SearchResult = {
    best: best ? bestByFamily[best.fk.family]! : null,
    bestByFamily,
    front,
    frontScope,
    counts: { grid: t.grid, evaluated: t.evaluated, feasible: t.feasible },
  };
  if (frontScope === "grid") res.context = t.ctxBest.filter((c): c is RawCandidate => c !== null).map((c) => toPoint(p, c));
  if (t.stopped) res.stoppedEarly = true;
  if (!best)
    res.reason = t.stopped
      ? "The search was stopped before it found a candidate that passes every check; it did not search the whole grid."
      : reasonText(p, t);
  return res;
}

/**
 * Offers a feasible candidate to the family best, the front and (depth index di ≥ 0, when the
 * tally tracks them) the context points. Copies only what it keeps.
 */
export function offerFeasible(t: Tally, c: RawCandidate, di = -1): void {
  t.feasible++;
  const cur = t.bestByFamily[c.fi];
  if (!cur || compareAcross(c, cur) < 0) t.bestByFamily[c.fi] = copyCandidate(c);
  if (t.front.offer(c, copyCandidate) && t.share) t.share.publish(c.objective, c.utilisation);
  if (di >= 0 && t.nDepths > 0) {
    const j = c.fi * t.nDepths + di;
    const cc = t.ctxBest[j];
    if (!cc || compareInFamily(c, cc) < 0) {
      t.ctxBest[j] = copyCandidate(c);
      t.ctxObj[j] = c.objective;
    }
  }
}

export const ABORT_EVERY = 4096;

export function checkAbort(signal: AbortSignal | undefined): void {
  if (signal?.aborted) signal.throwIfAborted();
}

// One section against every limit of a problem (issue 11, item 2): is it a shape the problem's
// grid can produce (its family listed; each dimension on its axis, within min … max and on the
// step; each plate thickness in the list; valid geometry), and does it pass every check
// (candidateChecks, the engine's own evaluation)? A recheck uses this to say of each saved option
// which limit of the new brief it now breaks. Structured results; the words are the caller's
// (app/lib/labels.ts), so the engine stays free of presentation.
//
// Grid membership follows the contract's grid ("every depth min + k·step, k = 0, 1, 2, … that
// does not exceed max"): a value is on the axis when some whole k ≥ 0 gives it, within a relative
// 1e-9 of the step (the same tolerance gridValues uses for max), so 0.1 + 2·0.1 counts as 0.3.
import { candidateChecks, type CandidateVerdict, type CheckUnit } from "./checks";
import { FAMILIES, FAMILY_DIMENSIONS, familyRuleViolation, type Family } from "./geometry";
import { FAMILY_KERNELS } from "./family-kernel";
import { fabricationKernel } from "./grid";
import { axisCount, dimRole, type CheckName, type GridAxis, type SearchProblem } from "./search-schema";

/** The problem field each check compares against. */
export const CHECK_LIMIT: Record<CheckName, string> = {
  "bending-compression": "allowable.compression",
  "bending-tension": "allowable.tension",
  shear: "allowable.shear",
  "slenderness-outstand": "slenderness.outstand",
  "slenderness-internal": "slenderness.internal",
  "slenderness-web": "slenderness.web",
  "slenderness-stem": "slenderness.stem",
  deflection: "deflection.limitRatio",
  // EN 1993 basis: the resistances follow from the steel (fy bands, partial factors).
  "class-4": "steel",
  "bending-resistance": "steel",
  ltb: "restraint.length",
  "shear-resistance": "steel",
  "shear-buckling": "steel",
  "bending-shear": "steel",
  weld: "steel",
  bearing: "supports.bearingLength",
};

export type LimitBreach =
  | { kind: "family"; limit: "families"; family: string }
  | { kind: "below"; limit: "depth.min" | "width.min"; dim: string; value: number; bound: number }
  | { kind: "above"; limit: "depth.max" | "width.max"; dim: string; value: number; bound: number }
  /** on the axis's range but between two grid values (nearest below and above) */
  | { kind: "off-grid"; limit: "depth.step" | "width.step"; dim: string; value: number; below: number; above: number }
  | { kind: "thickness"; limit: "thicknesses"; dim: string; value: number }
  | { kind: "geometry"; limit: "geometry"; dim: string; rule: string }
  /** fabrication rules (member-checks.md, `fabrication`): the section is off the problem's grid */
  | { kind: "fabrication"; limit: "fabrication.minThickness" | "fabrication.flangeAtLeastWeb" | "fabrication.minBoxClear"; dim: string; value: number; bound: number }
  | { kind: "check"; limit: string; check: CheckName; demand: number; capacity: number; utilisation: number; unit: CheckUnit }
  /** a rolled section (catalogue-search.ts rolledSectionLimits): no longer among the problem's catalogue sections */
  | { kind: "catalogue"; limit: "catalogues"; designation: string; catalogue: string | null }
  /** a rolled section whose shape the problem's basis does not check (catalogueShapeRefusal's reason) */
  | { kind: "basis"; limit: "basis"; reason: string };

export interface SectionLimits {
  /** every limit broken, grid first, then checks (empty: the section is on the grid and feasible) */
  breaches: LimitBreach[];
  /** the engine's checks under the problem; null when the family or its dimensions are unusable */
  verdict: CandidateVerdict | null;
}

const REL = 1e-9;

function axisBreaches(axis: GridAxis, name: "depth" | "width", dim: string, x: number): LimitBreach[] {
  const tol = REL * axis.step;
  if (x < axis.min - tol) return [{ kind: "below", limit: `${name}.min`, dim, value: x, bound: axis.min }];
  if (x > axis.max + tol) return [{ kind: "above", limit: `${name}.max`, dim, value: x, bound: axis.max }];
  const k = Math.round((x - axis.min) / axis.step);
  const n = axisCount(axis);
  if (k >= 0 && k < n && Math.abs(axis.min + k * axis.step - x) <= tol + REL * Math.abs(x)) return [];
  const lo = Math.min(n - 1, Math.max(0, Math.floor((x - axis.min) / axis.step)));
  return [{ kind: "off-grid", limit: `${name}.step`, dim, value: x, below: axis.min + lo * axis.step, above: axis.min + Math.min(n - 1, lo + 1) * axis.step }];
}

/**
 * The fabrication rules (member-checks.md, `fabrication`), decided by the engine's own grid
 * exclusions (grid.ts: the stock filter for minThickness, fabricationKernel for the rest), one
 * rule at a time so the words can name it: plates thinner than minThickness are off the grid;
 * flangeAtLeastWeb keeps only tf ≥ tw (each flange); minBoxClear keeps only boxes with
 * b − 2·tw ≥ it.
 */
const AT_LEAST = 1 - 1e-12;
function fabricationBreaches(f: Family, dims: Record<string, number>, problem: SearchProblem): LimitBreach[] {
  const rules = problem.fabrication;
  if (!rules) return [];
  const out: LimitBreach[] = [];
  const base = FAMILY_KERNELS[f];
  const v = Float64Array.from(base.dims, (n) => dims[n]);
  const baseOk = base.groupValid(v) && v[base.free] > base.freeMin(v);
  // Off the grid under this one rule (and on it without): the engine's kernel decides.
  const excludes = (rule: NonNullable<SearchProblem["fabrication"]>) => {
    const k = fabricationKernel(base, rule);
    return baseOk && !(k.groupValid(v) && v[k.free] > k.freeMin(v));
  };
  const names = base.dims;
  const mt = rules.minThickness;
  if (mt !== undefined) {
    for (const dim of names)
      if (dimRole(f, dim) === "thickness" && !(dims[dim] >= mt * AT_LEAST)) out.push({ kind: "fabrication", limit: "fabrication.minThickness", dim, value: dims[dim], bound: mt });
    // the solid rectangle: its sides are its plate
    if (f === "rectangle" && excludes({ minThickness: mt })) out.push({ kind: "fabrication", limit: "fabrication.minThickness", dim: "b", value: Math.min(dims.b, dims.d), bound: mt });
  }
  if (rules.flangeAtLeastWeb && excludes({ flangeAtLeastWeb: true })) {
    // Every family names its web plate tw (channel-down: the top plate; its legs are tf).
    for (const flange of ["tf", "tft", "tfb"])
      if (names.includes(flange) && !(dims[flange] >= dims.tw * AT_LEAST)) out.push({ kind: "fabrication", limit: "fabrication.flangeAtLeastWeb", dim: flange, value: dims[flange], bound: dims.tw });
  }
  if (rules.minBoxClear !== undefined && excludes({ minBoxClear: rules.minBoxClear }))
    out.push({ kind: "fabrication", limit: "fabrication.minBoxClear", dim: "b", value: dims.b - 2 * dims.tw, bound: rules.minBoxClear });
  return out;
}

/** Every limit of `problem` the section breaks (see the header). */
export function sectionLimits(family: string, dims: Record<string, number>, problem: SearchProblem): SectionLimits {
  const breaches: LimitBreach[] = [];
  if (!(FAMILIES as readonly string[]).includes(family)) return { breaches: [{ kind: "family", limit: "families", family }], verdict: null };
  const f = family as Family;
  if (!problem.families.includes(f)) breaches.push({ kind: "family", limit: "families", family });
  const names = FAMILY_DIMENSIONS[f] as readonly string[];
  for (const dim of names) {
    const x = dims[dim];
    if (typeof x !== "number" || !Number.isFinite(x)) return { breaches: [...breaches, { kind: "geometry", limit: "geometry", dim, rule: `${dim} is missing` }], verdict: null };
    const role = dimRole(f, dim);
    if (role === "thickness") {
      if (!problem.thicknesses.some((t) => Math.abs(t - x) <= REL * Math.max(t, x))) breaches.push({ kind: "thickness", limit: "thicknesses", dim, value: x });
    } else breaches.push(...axisBreaches(role === "depth" ? problem.depth : problem.width, role, dim, x));
  }
  const rule = familyRuleViolation(f, dims);
  if (!rule) breaches.push(...fabricationBreaches(f, dims, problem));
  if (rule) return { breaches: [...breaches, { kind: "geometry", limit: "geometry", dim: rule.field, rule: rule.message }], verdict: null };
  const verdict = candidateChecks(f, dims, problem);
  // A check fails when demand > capacity (checks.ts compares them directly, not the rounded ratio).
  for (const c of verdict.checks)
    if (c.demand > c.capacity)
      breaches.push({ kind: "check", limit: CHECK_LIMIT[c.name], check: c.name, demand: c.demand, capacity: c.capacity, utilisation: c.utilisation, unit: c.unit });
  return { breaches, verdict };
}

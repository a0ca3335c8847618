// Catalogue sections searched beside the plate families (issue 13): every section of the brief's
// catalogues is checked under the brief's basis by the engine's own evaluation (checks.ts), through
// the kernel of the plate family it is shaped like, with its exact properties (root fillets,
// rounded corners) in place of the plates' and, under EN 1993, the rolled rules where they differ
// from welded ones (basis/en1993.ts: classification widths from the fillets or between the
// corner radii, rolled shear areas, LTB curve b/c for rolled I, no flange-to-web weld). A catalogue is a short list, so it is simply enumerated;
// the plate search (search.ts) is untouched and the two results are put side by side here.
import { BASIS_MODULES, CHECK_UNITS, Scratch, attachDesign, checkClause, deflectionWorking, evaluateCandidate, shearWorking, slendernessWorking, makeCheckContext, type CandidateVerdict, type CheckResult } from "./checks";
import type { RolledSection } from "./basis/core";
import { SHAPE_FAMILY, catalogueSectionInput, type CatalogueSection, type CatalogueShape } from "./catalogue";
import { MIN_WELD_THROAT, WELD_RUNS, weldCostPerMetre, type CostParts } from "./cost";
import type { AiscDesign, DesignBlock } from "./design-types";
import { EngineInputError } from "./errors";
import { FAMILY_KERNELS } from "./family-kernel";
import type { Family } from "./geometry";
import type { SearchCandidate, SearchOptions, SearchPoint, SearchResult } from "./grid";
import type { SectionFamily } from "./hollow";
import { sectionProperties, type SectionProperties } from "./properties";
import { CHECK_NAMES, type CheckName, type SearchProblem } from "./search-schema";
import { CHECK_LIMIT, type LimitBreach, type SectionLimits } from "./limits";
import { sectionStresses, type ShearSample } from "./stress";

/**
 * The plate family whose kernel (geometry frame, slenderness elements, stress path) each shape is
 * evaluated through, and its dimension vector: an rhs as a box with both walls t, a chs as the
 * square it fills (its own properties replace the square's; the square contributes only the
 * frame and the extreme fibres, d/2 from the centroid either way).
 */
const KERNEL: Record<CatalogueShape, { family: Family; dims: (d: CatalogueSection["dims"]) => Record<string, number> }> = {
  I: { family: "i", dims: (d) => ({ d: d.d!, b: d.b!, tf: d.tf!, tw: d.tw! }) },
  channel: { family: "channel", dims: (d) => ({ d: d.d!, b: d.b!, tf: d.tf!, tw: d.tw! }) },
  tee: { family: "tee", dims: (d) => ({ d: d.d!, b: d.b!, tf: d.tf!, tw: d.tw! }) },
  angle: { family: "angle", dims: (d) => ({ d: d.d!, b: d.b!, t: d.t! }) },
  rhs: { family: "box", dims: (d) => ({ d: d.d!, b: d.b!, tf: d.t!, tw: d.t! }) },
  chs: { family: "rectangle", dims: (d) => ({ b: d.d!, d: d.d! }) },
};

/**
 * Shapes the EN 1993 basis checks as catalogue sections: those whose engine family the basis
 * defines checks for (member-checks.md §2: i, channel, tee, box), with the rolled rules of
 * EN 1993-1-1 where they differ from welded ones (basis/en1993.ts): the rolled I and H, the
 * rolled channel, the rolled tee (widths from the root fillet, §6.2.6(3)(c) shear area) and the
 * rectangular hollow section (checked as the box: flat widths between the corner radii,
 * §6.2.6(3)(f) shear area, its own torsion constant). Angles and circular hollow sections are
 * left out with the reason (EN1993_REFUSALS); the allowable-stress basis checks every shape.
 */
export const EN1993_CATALOGUE_SHAPES: readonly CatalogueShape[] = ["I", "channel", "tee", "rhs"];

/** Why the EN 1993 basis leaves a shape out (the basis defines no checks for it). */
const EN1993_REFUSALS: Partial<Record<CatalogueShape, string>> = {
  // member-checks.md §2: angle is "not covered by the EN 1993 basis" (a problem error for the plate family)
  angle:
    "angle: catalogue angles are not checked under the EN 1993 basis (the basis does not cover angles: they bend about inclined principal axes, which its checks do not treat); use the allowable-stress basis",
  // member-checks.md defines no classification, shear area or LTB rule for a circular tube
  // (EN 1993-1-1 Table 5.2 sheet 3 and §6.2.6(3)(g) would give them; the basis has not adopted them)
  chs: "chs: catalogue circular hollow sections are not checked under the EN 1993 basis (the basis defines no classification or shear area for a circular tube); use the allowable-stress basis",
};
/**
 * Shapes the AISC 360 basis checks as catalogue sections: rolled I (W), channel and tee (WT), whose
 * rolled rules (Table B4.1b case 10, G2.1(a), h less the fillets, k = tf + r in J10) aisc360.ts
 * applies; angles and hollow sections are left out with a reason.
 */
export const AISC360_CATALOGUE_SHAPES: readonly CatalogueShape[] = ["I", "channel", "tee"];

export interface RolledCandidate {
  source: "rolled";
  catalogue: string;
  designation: string;
  shape: CatalogueShape;
  /** the engine family it is drawn and computed as */
  family: SectionFamily;
  /** that family's dimensions (with r, rt, ro, ri as given), mm */
  dimensions: Record<string, number>;
  area: number;
  massPerMetre: number;
  /** objective "cost": per metre, material only (a rolled section has no welds) */
  cost?: number;
  costParts?: CostParts;
  utilisation: number;
  governing: CheckName;
  checks: CheckResult[];
  properties: SectionProperties;
  design?: DesignBlock;
  /** basis "aisc360": Table B4.1b, Chapter F, G, J worked out */
  aisc?: AiscDesign;
}

export interface SkippedSection {
  catalogue: string;
  designation: string;
  reason: string;
}

export interface CatalogueResult {
  /** by the problem's objective (least area, or least cost) */
  best: RolledCandidate | null;
  lightest: RolledCandidate | null;
  /** objective "cost" only */
  cheapest: RolledCandidate | null;
  /** every feasible section, by objective, then area, then utilisation, then catalogue order */
  feasible: RolledCandidate[];
  counts: { sections: number; evaluated: number; feasible: number };
  /** sections the basis does not cover, whose shape the catalogue entry filtered out, or outside the brief's depth and width limits, with why (at most MAX_SKIPPED listed) */
  skipped: SkippedSection[];
}

const MAX_SKIPPED = 50;

/** The engine input of a catalogue section at the problem's density. */
export function rolledSectionInput(section: Pick<CatalogueSection, "shape" | "dims">, density: number) {
  return catalogueSectionInput(section.shape, section.dims, density);
}

interface Prepared {
  fkFamily: Family;
  v: Float64Array;
  rolled: RolledSection;
  properties: SectionProperties;
  dimensions: Record<string, number>;
}

function prepare(section: CatalogueSection, density: number): Prepared {
  const k = KERNEL[section.shape];
  const fk = FAMILY_KERNELS[k.family];
  const kd = k.dims(section.dims);
  const input = rolledSectionInput(section, density);
  const properties = sectionProperties(input);
  // τ = V·Q(y)/(Iz·b(y)) at its largest over the depth. Shapes symmetric about the horizontal
  // axis whose cut width never narrows away from it (I, channel, tubes) have it at the neutral
  // axis, Q there the largest and b the web or walls; tees and angles are sampled on the exact
  // outline (stress.ts: the neutral axis, every break in the outline and 60 heights between).
  const atAxis = section.shape === "I" || section.shape === "channel" || section.shape === "rhs" || section.shape === "chs";
  // the sample of largest |τ| (first of equals, as StressResult.maxShear takes it), kept with where it is for the record
  let peak: ShearSample | null = null;
  if (!atAxis) for (const x of sectionStresses(input, { V: 1 }).shear) if (Math.abs(x.tau) > Math.abs(peak?.tau ?? 0)) peak = x;
  const tau = atAxis ? (1e3 * properties.Qz) / (properties.Iz * properties.widthAtNeutralAxis) : (peak?.tau ?? 0);
  const shearAt = atAxis || !peak ? { y: properties.centroid.y, Q: atAxis ? properties.Qz : 0, b: atAxis ? properties.widthAtNeutralAxis : 0 } : { y: peak.y, Q: Math.abs(peak.Q), b: peak.width };
  const rolled: RolledSection = {
    shape: section.shape,
    r: section.dims.r ?? 0,
    ro: section.shape === "rhs" ? (section.dims.ro ?? 0) : 0,
    J: properties.J,
    A: properties.area,
    Iz: properties.Iz,
    Iy: properties.Iy,
    Iyz: properties.Iyz,
    cz: properties.centroid.z,
    cy: properties.centroid.y,
    Zz: properties.Zz,
    shearFactor: Math.abs(tau) / 1e3,
    shearAt,
  };
  const { family: _f, density: _d, ...dimensions } = input as unknown as Record<string, number>;
  void _f;
  void _d;
  return { fkFamily: k.family, v: Float64Array.from(fk.dims, (n) => kd[n]!), rolled, properties, dimensions };
}

/** Why the problem's basis does not check this shape, or null when it does. */
export function catalogueShapeRefusal(shape: CatalogueShape, problem: Pick<SearchProblem, "basis">): string | null {
  if (problem.basis === "en1993" && !EN1993_CATALOGUE_SHAPES.includes(shape)) return EN1993_REFUSALS[shape] ?? `${shape}: not checked under the EN 1993 basis; use the allowable-stress basis`;
  return null;
}

/**
 * The brief's depth and width limits a catalogue section breaks: d against depth.min and
 * depth.max, the overall width (b; a circular tube's diameter) against width.max. An engineer's
 * headroom or a wall's thickness bounds a section bought rolled as much as one welded from
 * plate. Choice (the contract defines the axes for the plate grid only): width.min is not applied,
 * since its role in a brief is the plate grid's narrowest plate, which says nothing against a
 * narrow rolled section; the steps do not apply either (a catalogue has its own sizes). The same
 * relative tolerance as the plate grid's (limits.ts), so a printed 300 counts as within 300.
 */
export function catalogueLimitBreaches(section: Pick<CatalogueSection, "shape" | "dims">, problem: Pick<SearchProblem, "depth" | "width">): LimitBreach[] {
  const out: LimitBreach[] = [];
  const d = section.dims.d;
  const b = section.shape === "chs" ? section.dims.d : section.dims.b;
  const tol = (step: number) => 1e-9 * step;
  if (d !== undefined) {
    if (d < problem.depth.min - tol(problem.depth.step)) out.push({ kind: "below", limit: "depth.min", dim: "d", value: d, bound: problem.depth.min });
    if (d > problem.depth.max + tol(problem.depth.step)) out.push({ kind: "above", limit: "depth.max", dim: "d", value: d, bound: problem.depth.max });
  }
  if (b !== undefined && b > problem.width.max + tol(problem.width.step)) out.push({ kind: "above", limit: "width.max", dim: section.shape === "chs" ? "d" : "b", value: b, bound: problem.width.max });
  return out;
}

/** The skipped-section reason for one depth or width breach (the engine's own words, as the basis refusals). */
function limitReason(b: LimitBreach): string {
  if (b.kind !== "below" && b.kind !== "above") return b.limit;
  const what = b.limit.startsWith("depth") ? "depth" : b.dim === "d" ? "diameter" : "width";
  return `${what} ${b.value} mm is ${b.kind} the brief's ${b.limit} of ${b.bound} mm`;
}

/** Every applicable check of one catalogue section under the problem (results, records, tests). Throws on a shape the basis refuses. */
export function catalogueCandidateChecks(section: CatalogueSection, problem: SearchProblem): CandidateVerdict & { properties: SectionProperties; dimensions: Record<string, number> } {
  const refusal = catalogueShapeRefusal(section.shape, problem);
  if (refusal) throw new EngineInputError("catalogues", refusal);
  const ctx = makeCheckContext(problem);
  const pr = prepare(section, problem.density);
  const fk = FAMILY_KERNELS[pr.fkFamily];
  const s = new Scratch();
  s.rolled = pr.rolled;
  const feasible = evaluateCandidate(fk, pr.v, ctx, s, true);
  const checks: CheckResult[] = [];
  for (const c of ctx.precedence) {
    const d = s.demand[c];
    if (d !== d) continue;
    const name = CHECK_NAMES[c];
    checks.push({ name, demand: d, capacity: s.capacity[c], utilisation: d / s.capacity[c], unit: CHECK_UNITS[name], clause: checkClause(problem.basis, name) });
  }
  const out: CandidateVerdict & { properties: SectionProperties; dimensions: Record<string, number> } = {
    checks,
    utilisation: s.utilisation,
    governing: CHECK_NAMES[s.governing],
    feasible,
    area: pr.rolled.A,
    properties: pr.properties,
    dimensions: pr.dimensions,
  };
  const dw = deflectionWorking(problem, ctx, s);
  if (dw) out.deflectionWorking = dw;
  const sw = shearWorking(problem, fk, s);
  if (sw) out.shearWorking = sw;
  const lw = slendernessWorking(fk, pr.v, ctx, s);
  if (lw) out.slendernessWorking = lw;
  attachDesign(out, BASIS_MODULES[ctx.basis].design(fk, pr.v, ctx, s, problem));
  return out;
}

/**
 * A rolled section (a saved option) against every limit of a problem, as sectionLimits does for a
 * welded one: is it still among the problem's catalogue sections (same catalogue name, same
 * designation and dimensions, its shape taken), does the basis check its shape, and does it pass
 * every check by the rolled rules. The brief's depth and width limits apply
 * (catalogueLimitBreaches); the rest of the plate grid (steps, thicknesses, families) does not
 * apply to a section bought rolled.
 */
export function rolledSectionLimits(section: CatalogueSection, catalogue: string | null, problem: SearchProblem): SectionLimits {
  const breaches: LimitBreach[] = [];
  const same = (x: CatalogueSection) => x.designation === section.designation && x.shape === section.shape && Object.entries(section.dims).every(([k, v]) => (x.dims as Record<string, number | undefined>)[k] === v);
  const listed = (problem.catalogues ?? []).some((c) => c.name === catalogue && (!c.shapes || c.shapes.includes(section.shape)) && c.sections.some(same));
  if (!listed) breaches.push({ kind: "catalogue", limit: "catalogues", designation: section.designation, catalogue });
  breaches.push(...catalogueLimitBreaches(section, problem));
  const refusal = catalogueShapeRefusal(section.shape, problem);
  if (refusal) return { breaches: [...breaches, { kind: "basis", limit: "basis", reason: refusal }], verdict: null };
  const verdict = catalogueCandidateChecks(section, problem);
  // as sectionLimits: a check fails when demand > capacity
  for (const c of verdict.checks)
    if (c.demand > c.capacity) breaches.push({ kind: "check", limit: CHECK_LIMIT[c.name], check: c.name, demand: c.demand, capacity: c.capacity, utilisation: c.utilisation, unit: c.unit });
  return { breaches, verdict };
}

const compareRolled = (objective: (c: RolledCandidate) => number) => (a: RolledCandidate, b: RolledCandidate) =>
  objective(a) - objective(b) || a.area - b.area || a.utilisation - b.utilisation;

/** Enumerates the problem's catalogue sections. Throws the signal's reason when aborted. */
export function searchCatalogues(problem: SearchProblem, options: Pick<SearchOptions, "signal"> = {}): CatalogueResult {
  const cost = problem.objective === "cost";
  const price = problem.costs?.rolledPricePerKg;
  const ctx = makeCheckContext(problem);
  const s = new Scratch();
  const feasible: RolledCandidate[] = [];
  const skipped: SkippedSection[] = [];
  let sections = 0,
    evaluated = 0;
  for (const cat of problem.catalogues ?? []) {
    for (const section of cat.sections) {
      sections++;
      if (sections % 256 === 0) options.signal?.throwIfAborted();
      const skip = (reason: string) => {
        if (skipped.length < MAX_SKIPPED) skipped.push({ catalogue: cat.name, designation: section.designation, reason });
      };
      if (cat.shapes && !cat.shapes.includes(section.shape)) {
        skip(`${section.shape}: not among the shapes this brief takes from the catalogue`);
        continue;
      }
      const refusal = catalogueShapeRefusal(section.shape, problem);
      if (refusal) {
        skip(refusal);
        continue;
      }
      const outside = catalogueLimitBreaches(section, problem);
      if (outside.length) {
        skip(outside.map(limitReason).join("; "));
        continue;
      }
      const pr = prepare(section, problem.density);
      const fk = FAMILY_KERNELS[pr.fkFamily];
      s.rolled = pr.rolled;
      evaluated++;
      const ok = evaluateCandidate(fk, pr.v, ctx, s, false);
      if (!ok) continue;
      const massPerMetre = pr.rolled.A * problem.density * 1e-6;
      const c: RolledCandidate = {
        source: "rolled",
        catalogue: cat.name,
        designation: section.designation,
        shape: section.shape,
        family: SHAPE_FAMILY[section.shape],
        dimensions: pr.dimensions,
        area: pr.rolled.A,
        massPerMetre,
        utilisation: s.utilisation,
        governing: CHECK_NAMES[s.governing],
        checks: [],
        properties: pr.properties,
      };
      if (cost && price !== undefined) {
        c.cost = massPerMetre * price;
        c.costParts = { material: c.cost, fabrication: 0, total: c.cost };
      }
      feasible.push(c);
    }
  }
  s.rolled = null;
  const byArea = compareRolled((c) => c.area);
  const byCost = compareRolled((c) => c.cost ?? Infinity);
  feasible.sort(cost ? byCost : byArea);
  // the full check table and design block only for the ones a page shows first
  const detail = (c: RolledCandidate | null) => {
    if (!c || c.checks.length) return c;
    const section = problem.catalogues!.find((k) => k.name === c.catalogue)!.sections.find((x) => x.designation === c.designation)!;
    const v = catalogueCandidateChecks(section, problem);
    c.checks = v.checks;
    if (v.design) c.design = v.design;
    if (v.aisc) c.aisc = v.aisc;
    return c;
  };
  const lightest = feasible.length ? feasible.reduce((m, c) => (byArea(c, m) < 0 ? c : m)) : null;
  const cheapest = cost && feasible.length ? feasible.reduce((m, c) => (byCost(c, m) < 0 ? c : m)) : null;
  detail(lightest);
  detail(cheapest);
  return {
    best: feasible[0] ?? null,
    lightest,
    cheapest,
    feasible,
    counts: { sections, evaluated, feasible: feasible.length },
    skipped,
  };
}

/** Material and fabrication parts of a plate candidate's cost (cost objective): welds priced as the objective prices them. */
export function weldedCostParts(c: Pick<SearchPoint, "family" | "cost">, problem: SearchProblem): CostParts | undefined {
  if (c.cost === undefined) return undefined;
  const runs = WELD_RUNS[c.family];
  const fabrication = runs * weldCostPerMetre(MIN_WELD_THROAT, problem.costs?.weld);
  const out: CostParts = { material: c.cost - fabrication, fabrication, total: c.cost };
  if (runs > 0 && fabrication > 0) {
    out.weldRuns = runs;
    out.weldThroat = MIN_WELD_THROAT;
  }
  return out;
}

export interface SideBySide {
  welded: { lightest: SearchCandidate | null; cheapest: SearchCandidate | null };
  rolled: { lightest: RolledCandidate | null; cheapest: RolledCandidate | null };
  /** the problem's objective over both: which side wins (a tie goes to welded, listed first) */
  winner: "welded" | "rolled" | null;
}

/**
 * Puts the plate search's result and the catalogue's side by side. `plateByMass` is the plate
 * search's result under objective "mass" when the problem's objective is "cost" (the lightest
 * welded section then needs its own search); otherwise the plate result itself.
 */
export function sideBySide(problem: SearchProblem, plate: SearchResult, rolled: CatalogueResult, plateByMass: SearchResult = plate): SideBySide {
  const cost = problem.objective === "cost";
  const welded = { lightest: plateByMass.best, cheapest: cost ? plate.best : null };
  const objective = (c: { area: number; cost?: number } | null) => (c === null ? Infinity : cost ? (c.cost ?? Infinity) : c.area);
  const w = objective(plate.best),
    r = objective(rolled.best);
  const winner = w === Infinity && r === Infinity ? null : w <= r ? "welded" : "rolled";
  return { welded, rolled: { lightest: rolled.lightest, cheapest: rolled.cheapest }, winner };
}

/** A sweep's result: the plate search's, and with catalogues the catalogue's beside it. */
export type CatalogueSweepResult = SearchResult & { catalogue?: CatalogueResult; sideBySide?: SideBySide };

/**
 * Adds the catalogue search to a finished plate search (the queue, the seed's finished sweeps and
 * the bench all go through here). With the cost objective the lightest welded section needs the
 * plate search again under objective "mass" (its best only): `plateByMass`, which the caller runs
 * where it runs searches (in its thread or on worker threads); without it the lightest welded
 * section is left out.
 */
export function withCatalogues<R extends SearchResult>(problem: SearchProblem, plate: R, plateByMass?: SearchResult | null, options: Pick<SearchOptions, "signal"> = {}): R & { catalogue?: CatalogueResult; sideBySide?: SideBySide } {
  if (!problem.catalogues?.length) return plate;
  const catalogue = searchCatalogues(problem, options);
  const byMass = problem.objective === "cost" ? (plateByMass ?? { ...plate, best: null }) : plate;
  return { ...plate, catalogue, sideBySide: sideBySide(problem, plate, catalogue, byMass) };
}

/** The plate problem whose best is the lightest welded section (objective "mass"), or null when the problem's own best already is. */
export function lightestWeldedProblem(problem: SearchProblem): SearchProblem | null {
  return problem.catalogues?.length && problem.objective === "cost" ? { ...problem, objective: "mass" } : null;
}

// What every design basis shares: the check context built once per problem, the reusable
// scratch of one evaluating thread, and how a verdict is settled (utilisation, governing
// check, objective). checks.ts holds the one evaluation that calls a basis; the basis
// modules (allowable.ts, en1993.ts) hold their own checks.
import * as composite from "../composite";
import type { AiscDesign, DesignBlock } from "../design-types";
import type { FamilyKernel } from "../family-kernel";
import * as fkm from "../family-kernel";
import type { CheckName, SearchProblem } from "../search-schema";
import type { En1993Context, En1993Scratch } from "./en1993";
import type { AiscContext, AiscScratch } from "./aisc360";
import { WELD_RUNS } from "../cost";

// Local copies of imported bindings (module transforms make each imported-name access a getter call).
const { KERNEL_OUT, PLATE_STRIDE, plateNeutralAxis } = composite;
const { N_CHECKS } = fkm;

export interface CheckContext {
  /** 0 = "allowable", 1 = "en1993" (member-checks.md §2), 2 = "aisc360" (issue 14): index into BASIS_MODULES. */
  basis: 0 | 1 | 2;
  /** Check indices in precedence order: ties in governing go to the earlier (member-checks.md §2's numbering). */
  precedence: Int8Array;
  /** Design moments, N·mm (kN·m × 10⁶). */
  Ms: number;
  Mh: number;
  /** Shear force, N (kN × 10³); 0 when no shear check. */
  V: number;
  hasShear: boolean;
  /** Allowable stresses, MPa; Infinity under "en1993" and "aisc360", which keeps the stress bounds of search.ts vacuous. */
  aT: number;
  aC: number;
  aS: number;
  /** Slenderness limit per check index; NaN when that limit is not given. */
  slenderLimit: Float64Array;
  hasDeflection: boolean;
  /** 5·w·L⁴/(384·E): the deflection is this ÷ I (mm). */
  deflNumerator: number;
  /** L / limitRatio, mm. */
  deflLimit: number;
  /** The span L, mm (the one m → mm of the deflection check; 0 without it). */
  deflSpan: number;
  density: number;
  cost: boolean;
  /** Price per kg by plate thickness (cost objective). */
  prices: Map<number, number>;
  /**
   * Cost objective: fabrication cost of one metre of fillet weld at the throat welds are priced
   * at (cost.ts, MIN_WELD_THROAT), 0 when the brief prices no welds. Per family it adds a
   * constant (× WELD_RUNS), so every bound search.ts draws from plateObjective stays sound.
   */
  weldPerMetre: number;
  /** basis "en1993": steel, factors, restraint, supports. */
  en: En1993Context | null;
  /** basis "aisc360": method, steel, unbraced length, supports. */
  us: AiscContext | null;
}

/**
 * A rolled or hollow catalogue section evaluated through a plate family's kernel
 * (catalogue-search.ts): its exact properties (root fillets, rounded corners) replace the plate
 * kernel's, and each basis applies the rules where EN 1993 treats rolled sections differently
 * from welded ones. null for every plate-search candidate.
 */
export interface RolledSection {
  /** the catalogue shape: "I", "channel", "tee" and "rhs" have rolled rules under EN 1993 */
  shape: string;
  /** root radius, mm (0 when none) */
  r: number;
  /** rhs: the outer corner radius, mm (0 for every other shape) */
  ro: number;
  /** the section's own torsion constant (an rhs: with its rounded corners), mm⁴ */
  J: number;
  A: number;
  Iz: number;
  Iy: number;
  Iyz: number;
  /** centroid in the plate frame (bounding box's bottom-left corner at 0, 0), mm */
  cz: number;
  cy: number;
  /** plastic modulus about the horizontal equal-area axis, mm³ */
  Zz: number;
  /** the largest Q(y)/(Iz·b(y)) over the depth, 1/mm² (× V in N gives MPa) */
  shearFactor: number;
  /** where that largest value is: height y (plate frame), |Q| and b there (the calculation record) */
  shearAt: { y: number; Q: number; b: number };
}

/** Reusable buffers for one evaluating thread. */
export class Scratch {
  plates = new Float64Array(8 * PLATE_STRIDE);
  k = new Float64Array(KERNEL_OUT);
  demand = new Float64Array(N_CHECKS);
  capacity = new Float64Array(N_CHECKS);
  ratios = new Float64Array(8);
  utilisation = 0;
  governing = -1;
  area = 0;
  objective = 0;
  /** the second moment the deflection check divided by, mm⁴ (Iz, or the inclined-axis equivalent of an unsymmetric section) */
  deflI = NaN;
  /** basis "en1993": its intermediate results (filled by en1993.ts, read back for the design block) */
  en: En1993Scratch | null = null;
  /** basis "aisc360": its intermediate results (filled by aisc360.ts) */
  us: AiscScratch | null = null;
  /** set by catalogue-search.ts for a catalogue section; null for plate candidates */
  rolled: RolledSection | null = null;
}

/**
 * Objective of the plates in s.plates: area (mm², objective "mass") or cost per metre
 * (Σ plate area × density × 10⁻⁶ × price of the plate's thickness, plus the family's weld runs ×
 * the cost of a metre of weld at the priced throat).
 */
export function plateObjective(fk: FamilyKernel, v: Float64Array, plates: Float64Array, ctx: CheckContext): number {
  let a = 0;
  for (let i = 0; i < fk.nPlates; i++) {
    const ar = plates[i * PLATE_STRIDE] * plates[i * PLATE_STRIDE + 1];
    a += ctx.cost ? ar * (ctx.prices.get(v[fk.plateThickness[i]]) ?? NaN) : ar;
  }
  return ctx.cost ? a * ctx.density * 1e-6 + (ctx.weldPerMetre > 0 ? ctx.weldPerMetre * WELD_RUNS[fk.family] : 0) : a;
}

/**
 * Settles the verdict: the largest utilisation among the checks filled in, the earliest in
 * ctx.precedence on a tie; and, when feasible, the objective.
 */
export function finish(s: Scratch, ok: boolean, ctx: CheckContext, fk?: FamilyKernel, v?: Float64Array): boolean {
  let u = -Infinity,
    g = -1;
  const order = ctx.precedence;
  for (let i = 0; i < order.length; i++) {
    const c = order[i];
    const d = s.demand[c];
    if (d !== d) continue;
    const r = d / s.capacity[c];
    if (r > u) {
      u = r;
      g = c;
    }
  }
  s.utilisation = u;
  s.governing = g;
  if (ok && fk && v) s.objective = ctx.cost ? plateObjective(fk, v, s.plates, ctx) : s.area;
  return ok;
}

/** One line of a calculation record: what was checked, under which clause, with which numbers. */
export interface RecordLine {
  clause: string;
  text: string;
}

/** What a design basis module exposes (style.md: one module per basis, chosen by the brief's basis). */
export interface DesignBasisModule {
  id: SearchProblem["basis"];
  /** check indices in precedence order (ties in governing go to the earlier) */
  precedence: Int8Array;
  /**
   * The basis's checks for one candidate whose plates are already in s.plates and whose
   * composite kernel is in s.k (checks.ts has run the shared slenderness checks; ok says
   * whether they passed). all = false may stop at the first failure.
   */
  evaluate(fk: FamilyKernel, v: Float64Array, ctx: CheckContext, s: Scratch, all: boolean, ok: boolean): boolean;
  /** After evaluate(all = true): the design block for results and records (undefined under "allowable"). */
  design(fk: FamilyKernel, v: Float64Array, ctx: CheckContext, s: Scratch, problem: SearchProblem): DesignBlock | AiscDesign | undefined;
  /** The record's lines for a verdict under this basis (each naming its clause). */
  recordLines(verdict: { checks: { name: CheckName; demand: number; capacity: number; utilisation: number }[]; design?: DesignBlock; aisc?: AiscDesign }): RecordLine[];
  /** The clause shown beside a check where this basis's differs from CHECK_CLAUSES (checks.ts). */
  clauses?: Partial<Record<CheckName, string>>;
}

/**
 * The flange and web terms of a plate family's dimension vector (FAMILY_DIMENSIONS order) that
 * every code basis reads: depth d, top flange bt × tft, bottom flange bb × tfb (0 for the tee),
 * web thickness tw and number of webs nw (0 for the tee stem and the bar), the clear depth
 * between the flanges hw, and the thickest plate tMax (the rectangle: its smaller side, the one
 * that sets its steel's strength band, member-checks.md's pinned reading). Each basis's scratch
 * carries these fields.
 */
export interface PlateTerms {
  d: number;
  bt: number;
  tft: number;
  bb: number;
  tfb: number;
  tw: number;
  nw: number;
  hw: number;
  tMax: number;
}

export function readPlateTerms(family: string, v: Float64Array, x: PlateTerms): void {
  switch (family) {
    case "mono-i":
      x.d = v[0];
      x.bt = v[1];
      x.tft = v[2];
      x.bb = v[3];
      x.tfb = v[4];
      x.tw = v[5];
      x.nw = 1;
      x.hw = x.d - x.tft - x.tfb;
      x.tMax = Math.max(x.tft, x.tfb, x.tw);
      return;
    case "rectangle":
      x.bt = x.bb = v[0];
      x.d = v[1];
      x.tft = x.tfb = x.tw = 0;
      x.nw = 0;
      x.hw = 0;
      x.tMax = Math.min(v[0], v[1]);
      return;
    case "tee":
      x.d = v[0];
      x.bt = v[1];
      x.tft = v[2];
      x.bb = 0;
      x.tfb = 0;
      x.tw = v[3];
      x.nw = 0;
      x.hw = x.d - x.tft;
      x.tMax = Math.max(x.tft, x.tw);
      return;
    default:
      // i, channel, box: [d, b, tf, tw]
      x.d = v[0];
      x.bt = x.bb = v[1];
      x.tft = x.tfb = v[2];
      x.tw = v[3];
      x.nw = family === "box" ? 2 : 1;
      x.hw = x.d - 2 * x.tft;
      x.tMax = Math.max(x.tft, x.tw);
  }
}

/** Families whose plates are symmetric about mid-depth (so hogging works out exactly as sagging). */
export function symmetricAboutMidDepth(family: string): boolean {
  return family === "i" || family === "channel" || family === "box" || family === "rectangle";
}

/**
 * The plastic neutral axis's height above the bottom fibre, mm: mid-depth exactly for the
 * families symmetric about it, otherwise the equal-area axis of the plates.
 */
export function plasticAxis(family: string, plates: Float64Array, nPlates: number, A: number, cy: number, d: number): number {
  return symmetricAboutMidDepth(family) ? 0.5 * d : plateNeutralAxis(plates, nPlates, A, cy);
}

/** Where the flange-to-web weld sizing of a basis keeps its longitudinal shear. */
export interface FlangeShearFlow {
  /** first moment of the flange about the elastic neutral axis, mm³ */
  Qf: number;
  /** longitudinal shear per unit length at that flange's junction, N/mm */
  q: number;
}

/**
 * The longitudinal shear a flange-to-web junction carries, q = V·Qf/Iz (the shear flow of a
 * built-up beam, Jourawski's formula; any mechanics of materials text, e.g. Gere & Goodno,
 * Mechanics of Materials, the section on built-up beams and shear flow; mem.), Qf of the flange
 * with the larger first moment about the elastic neutral axis (a channel's flange measured clear
 * of the web). Both code bases size their welds on it (EN 1993-1-8 §4.5.3.3, AISC 360-16 §J2.4);
 * each keeps its own weld strength. Returns whether the top flange governs.
 */
export function flangeShearFlow(family: string, x: PlateTerms, V: number, cy: number, Iz: number, out: FlangeShearFlow): boolean {
  const bT = family === "channel" ? x.bt - x.tw : x.bt;
  const bB = family === "channel" ? x.bb - x.tw : x.bb;
  const qTop = bT * x.tft * (x.d - x.tft / 2 - cy);
  const qBot = x.tfb > 0 ? bB * x.tfb * (cy - x.tfb / 2) : -Infinity;
  const top = qTop >= qBot;
  out.Qf = top ? qTop : qBot;
  out.q = (V * out.Qf) / Iz;
  return top;
}

/**
 * A weld size (throat or leg) as built: the size needed rounded up to a whole mm, and at least
 * the basis's minimum. The 1e-9 keeps a size that is whole but for rounding noise from going up
 * a millimetre (a stated choice, common practice to the nearest mm).
 */
export function weldSizeBuilt(exact: number, least: number): number {
  const r = Math.ceil(exact - 1e-9);
  return r > least ? r : least;
}

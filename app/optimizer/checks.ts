// The feasibility checks of the engine contract (SearchProblem, "Feasible when every check
// passes") and the issue's deflection check, written once: the brute-force reference, the fast
// search and the calculation record all call evaluateCandidate, so their verdicts cannot drift.
// Each check is demand vs capacity; utilisation = demand/capacity; a check passes when
// demand ≤ capacity (compared directly, not through the rounded ratio).
import * as composite from "./composite";
import type { Family } from "./geometry";
import * as fkm from "./family-kernel";
import type { FamilyKernel } from "./family-kernel";
import type { DesignBlock } from "./design-types";
import { CHECK_NAMES, type CheckName, type SearchProblem } from "./search-schema";

// Local copies of imported bindings (module transforms make each imported-name access a getter call).
const { compositeKernel, maxShearFactor, KERNEL_OUT, K_AREA, K_CY, K_CZ, K_IY, K_IYZ, K_IZ, K_MAXY, K_MINY, PLATE_STRIDE } = composite;
const { C_COMP, C_DEFL, C_SHEAR, C_TENS, FAMILY_KERNELS, N_CHECKS } = fkm;

export interface CheckContext {
  /** 0 = "allowable", 1 = "en1993" (member-checks.md §2). */
  basis: 0 | 1;
  /** Design moments, N·mm (kN·m × 10⁶). */
  Ms: number;
  Mh: number;
  /** Shear force, N (kN × 10³); 0 when no shear check. */
  V: number;
  hasShear: boolean;
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
  density: number;
  cost: boolean;
  /** Price per kg by plate thickness (cost objective). */
  prices: Map<number, number>;
}

export function makeCheckContext(p: SearchProblem): CheckContext {
  const slenderLimit = new Float64Array(N_CHECKS).fill(NaN);
  const s = p.slenderness;
  if (s) {
    if (s.outstand !== undefined) slenderLimit[3] = s.outstand;
    if (s.internal !== undefined) slenderLimit[4] = s.internal;
    if (s.web !== undefined) slenderLimit[5] = s.web;
    if (s.stem !== undefined) slenderLimit[6] = s.stem;
  }
  const en = p.basis === "en1993";
  const hasShear = p.shear !== undefined && (en || p.allowable?.shear !== undefined);
  let deflNumerator = 0,
    deflLimit = Infinity;
  if (p.deflection) {
    // Simply supported, uniform load: δ = 5·w·L⁴ / (384·E·I) (any beam table, e.g. the
    // AISC Manual's beam diagrams, case 1). w kN/m = N/mm; L m → mm.
    const L = p.deflection.span * 1000;
    deflNumerator = (5 * p.deflection.serviceLoad * L ** 4) / (384 * p.deflection.E);
    deflLimit = L / p.deflection.limitRatio;
  }
  // Under "en1993" the allowable stresses are absent: Infinity keeps every stress-based bound
  // of search.ts vacuous (and so sound) without touching it.
  return {
    basis: en ? 1 : 0,
    Ms: p.moment.sagging * 1e6,
    Mh: p.moment.hogging * 1e6,
    V: hasShear ? p.shear! * 1000 : 0,
    hasShear,
    aT: en ? Infinity : p.allowable!.tension,
    aC: en ? Infinity : p.allowable!.compression,
    aS: en ? Infinity : (p.allowable!.shear ?? Infinity),
    slenderLimit,
    hasDeflection: p.deflection !== undefined,
    deflNumerator,
    deflLimit,
    density: p.density,
    cost: p.objective === "cost",
    prices: new Map((p.prices ?? []).map((q) => [q.thickness, q.pricePerKg])),
  };
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
}

/**
 * Objective of the plates in s.plates: area (mm², objective "mass") or cost per metre
 * (Σ plate area × density × 10⁻⁶ × price of the plate's thickness).
 */
export function plateObjective(fk: FamilyKernel, v: Float64Array, plates: Float64Array, ctx: CheckContext): number {
  let a = 0;
  for (let i = 0; i < fk.nPlates; i++) {
    const ar = plates[i * PLATE_STRIDE] * plates[i * PLATE_STRIDE + 1];
    a += ctx.cost ? ar * (ctx.prices.get(v[fk.plateThickness[i]]) ?? NaN) : ar;
  }
  return ctx.cost ? a * ctx.density * 1e-6 : a;
}

/**
 * Evaluates one candidate (dimension vector v in table order; geometry must be valid).
 * all = false stops at the first failed check (the search only needs the utilisation of
 * feasible candidates, and those run every check anyway); all = true fills every applicable
 * check into s.demand / s.capacity (NaN demand = not applicable). Returns feasibility.
 */
export function evaluateCandidate(fk: FamilyKernel, v: Float64Array, ctx: CheckContext, s: Scratch, all: boolean): boolean {
  const dem = s.demand,
    cap = s.capacity;
  dem.fill(NaN);
  let ok = true;
  // Slenderness first: no section properties needed.
  const kinds = fk.slenderKinds;
  if (kinds.length) {
    fk.slender(v, s.ratios);
    for (let i = 0; i < kinds.length; i++) {
      const c = kinds[i];
      const lim = ctx.slenderLimit[c];
      if (lim !== lim) continue; // no limit given
      const r = s.ratios[i];
      if (!(dem[c] >= r)) {
        dem[c] = r;
        cap[c] = lim;
      }
    }
    for (let i = 0; i < kinds.length; i++) {
      const c = kinds[i];
      if (dem[c] > cap[c]) ok = false;
    }
    if (!ok && !all) return finish(s, false);
  }
  const p = s.plates,
    k = s.k;
  fk.fill(v, p);
  compositeKernel(p, fk.nPlates, k);
  s.area = k[K_AREA];
  const Iz = k[K_IZ];
  if (ctx.basis === 1) {
    // EN 1993 basis: its families are all symmetric about the vertical axis.
    if (ctx.hasDeflection) {
      dem[C_DEFL] = ctx.deflNumerator / Iz;
      cap[C_DEFL] = ctx.deflLimit;
      if (dem[C_DEFL] > ctx.deflLimit) ok = false;
    }
    return finish(s, ok, ctx, fk, v);
  }
  // Bending about the horizontal axis (engine contract). Sagging compresses the top fibre.
  let comp: number, tens: number, Ibend: number;
  if (!fk.unsymmetric) {
    const cTop = k[K_MAXY] - k[K_CY],
      cBot = k[K_CY] - k[K_MINY];
    // σ = M·c / Iz (elementary flexure formula; Iyz = 0 for shapes symmetric about an axis).
    comp = Math.max(ctx.Ms * cTop, ctx.Mh * cBot) / Iz;
    tens = Math.max(ctx.Ms * cBot, ctx.Mh * cTop) / Iz;
    Ibend = Iz;
  } else {
    // General (unsymmetric) bending with My = 0: σ = M·(Iyz·z − Iy·y)/(Iz·Iy − Iyz²), z and y
    // centroidal, M > 0 sagging (e.g. Boresi & Schmidt, Advanced Mechanics of Materials, ch. 7;
    // formula as written in the engine contract). Linear in (z, y), so its extremes over the
    // section are at convex-hull vertices, all of which are plate corners.
    const Iy = k[K_IY],
      Iyz = k[K_IYZ],
      cz = k[K_CZ],
      cy = k[K_CY];
    const den = Iz * Iy - Iyz * Iyz;
    let vmax = -Infinity,
      vmin = Infinity;
    for (let i = 0; i < fk.nPlates; i++) {
      const o = i * PLATE_STRIDE;
      const z0 = p[o + 2] - cz,
        y0 = p[o + 3] - cy,
        z1 = z0 + p[o],
        y1 = y0 + p[o + 1];
      const a = (Iyz * z0 - Iy * y0) / den,
        b = (Iyz * z1 - Iy * y0) / den,
        c = (Iyz * z0 - Iy * y1) / den,
        d = (Iyz * z1 - Iy * y1) / den;
      vmax = Math.max(vmax, a, b, c, d);
      vmin = Math.min(vmin, a, b, c, d);
    }
    // sagging: σ = Ms·v; hogging: σ = −Mh·v (tension positive)
    comp = Math.max(-ctx.Ms * vmin, ctx.Mh * vmax, 0);
    tens = Math.max(ctx.Ms * vmax, -ctx.Mh * vmin, 0);
    // Vertical deflection of an unsymmetric section under a vertical load uses the
    // curvature M·Iy/(Iz·Iy − Iyz²), i.e. an effective I = Iz − Iyz²/Iy (same general theory).
    Ibend = den / Iy;
  }
  dem[C_COMP] = comp;
  cap[C_COMP] = ctx.aC;
  dem[C_TENS] = tens;
  cap[C_TENS] = ctx.aT;
  if (comp > ctx.aC || tens > ctx.aT) {
    ok = false;
    if (!all) return finish(s, false);
  }
  if (ctx.hasDeflection) {
    dem[C_DEFL] = ctx.deflNumerator / Ibend;
    cap[C_DEFL] = ctx.deflLimit;
    if (dem[C_DEFL] > ctx.deflLimit) {
      ok = false;
      if (!all) return finish(s, false);
    }
  }
  if (ctx.hasShear) {
    // max over y of V·Q(y)/(Iz·b(y)) (engine contract, shear check), from the section kernel.
    dem[C_SHEAR] = ctx.V * maxShearFactor(p, fk.nPlates, k[K_CY], Iz);
    cap[C_SHEAR] = ctx.aS;
    if (dem[C_SHEAR] > ctx.aS) ok = false;
  }
  return finish(s, ok, ctx, fk, v);
}

function finish(s: Scratch, ok: boolean, ctx?: CheckContext, fk?: FamilyKernel, v?: Float64Array): boolean {
  let u = -Infinity,
    g = -1;
  for (let c = 0; c < N_CHECKS; c++) {
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
  if (ok && ctx && fk && v) s.objective = ctx.cost ? plateObjective(fk, v, s.plates, ctx) : s.area;
  return ok;
}

export type CheckUnit = "MPa" | "mm" | "ratio" | "kN·m" | "kN";

export interface CheckResult {
  name: CheckName;
  /** In `unit`: MPa for stresses, mm for deflection and weld throat, kN·m for moments, kN for forces, a plain ratio for slenderness and class 4. */
  demand: number;
  capacity: number;
  utilisation: number;
  unit: CheckUnit;
  /** where the check comes from (standard and clause, or the engine contract) */
  clause: string;
}

export interface CandidateVerdict {
  checks: CheckResult[];
  utilisation: number;
  governing: CheckName;
  feasible: boolean;
  area: number;
  /** basis "en1993" only: what the limit-state checks worked out */
  design?: DesignBlock;
}

/** Unit of each check's demand and capacity. */
export const CHECK_UNITS: Record<CheckName, CheckUnit> = {
  "bending-compression": "MPa",
  "bending-tension": "MPa",
  shear: "MPa",
  "slenderness-outstand": "ratio",
  "slenderness-internal": "ratio",
  "slenderness-web": "ratio",
  "slenderness-stem": "ratio",
  deflection: "mm",
  "class-4": "ratio",
  "bending-resistance": "kN·m",
  ltb: "kN·m",
  "shear-resistance": "kN",
  "shear-buckling": "kN",
  "bending-shear": "kN·m",
  weld: "mm",
  bearing: "kN",
};

/** The clause (or contract rule) each check implements, shown beside its numbers. */
export const CHECK_CLAUSES: Record<CheckName, string> = {
  "bending-compression": "engine contract: σ = M·c/Iz (general formula for the angle) ≤ allowable.compression",
  "bending-tension": "engine contract: σ = M·c/Iz (general formula for the angle) ≤ allowable.tension",
  shear: "engine contract: τ = V·Q/(Iz·b), maximum over the depth ≤ allowable.shear",
  "slenderness-outstand": "the brief's limit slenderness.outstand",
  "slenderness-internal": "the brief's limit slenderness.internal",
  "slenderness-web": "the brief's limit slenderness.web",
  "slenderness-stem": "the brief's limit slenderness.stem",
  deflection: "5·w·L⁴/(384·E·I) ≤ L/limitRatio (simply supported, uniform service load)",
  "class-4": "EN 1993-1-1 §5.5.2, Table 5.2 (class 4 outside this version)",
  "bending-resistance": "EN 1993-1-1 §6.2.5",
  ltb: "EN 1993-1-1 §6.3.2.2",
  "shear-resistance": "EN 1993-1-1 §6.2.6",
  "shear-buckling": "EN 1993-1-5 §5.2, §5.3",
  "bending-shear": "EN 1993-1-1 §6.2.8",
  weld: "EN 1993-1-8 §4.5.3.3",
  bearing: "EN 1993-1-5 §6",
};

/** Every applicable check of one family section (for results, records and tests). */
export function candidateChecks(family: Family, dims: Record<string, number>, problem: SearchProblem): CandidateVerdict {
  const fk = FAMILY_KERNELS[family];
  const v = Float64Array.from(fk.dims, (n) => dims[n]);
  const s = new Scratch();
  const feasible = evaluateCandidate(fk, v, makeCheckContext(problem), s, true);
  const checks: CheckResult[] = [];
  for (let c = 0; c < N_CHECKS; c++) {
    const d = s.demand[c];
    if (d !== d) continue;
    const name = CHECK_NAMES[c];
    checks.push({ name, demand: d, capacity: s.capacity[c], utilisation: d / s.capacity[c], unit: CHECK_UNITS[name], clause: CHECK_CLAUSES[name] });
  }
  return { checks, utilisation: s.utilisation, governing: CHECK_NAMES[s.governing], feasible, area: s.area };
}

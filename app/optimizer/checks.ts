// The feasibility checks of the engine contract (SearchProblem, "Feasible when every check
// passes"), written once: the brute-force reference, the fast search and the calculation
// record all call evaluateCandidate, so their verdicts cannot drift. The brief's `basis`
// chooses the design-basis module (basis/allowable.ts, basis/en1993.ts) that runs after the
// checks every basis shares (the brief's slenderness limits, the section kernel).
// Each check is demand vs capacity; utilisation = demand/capacity; a check passes when
// demand ≤ capacity (compared directly, not through the rounded ratio).
import * as composite from "./composite";
import type { Family } from "./geometry";
import * as fkm from "./family-kernel";
import type { FamilyKernel } from "./family-kernel";
import { CHECK_NAMES, type CheckName, type SearchProblem } from "./search-schema";
import type { AiscDesign, DesignBlock } from "./design-types";
import { allowableBasis } from "./basis/allowable";
import { Scratch, finish, plateObjective, type CheckContext, type DesignBasisModule, type RecordLine } from "./basis/core";
import { en1993Basis, makeEn1993Context } from "./basis/en1993";
import { aisc360Basis, makeAiscContext } from "./basis/aisc360";
import { EngineInputError } from "./errors";
import { MIN_WELD_THROAT, weldCostPerMetre } from "./cost";

export { Scratch, plateObjective, type CheckContext, type DesignBasisModule, type RecordLine };

// Local copies of imported bindings (module transforms make each imported-name access a getter call).
const { compositeKernel, K_AREA, K_CY, K_CZ, K_IY, K_IYZ, K_IZ } = composite;
const { FAMILY_KERNELS, N_CHECKS } = fkm;

/** The design-basis modules, indexed by CheckContext.basis. */
export const BASIS_MODULES: readonly DesignBasisModule[] = [allowableBasis, en1993Basis, aisc360Basis];
const evalAllowable = allowableBasis.evaluate,
  evalEn1993 = en1993Basis.evaluate,
  evalAisc = aisc360Basis.evaluate;

/** CheckContext.basis of a brief's basis. */
export function basisIndex(basis: SearchProblem["basis"]): 0 | 1 | 2 {
  return basis === "en1993" ? 1 : basis === "aisc360" ? 2 : 0;
}

/** The module of a brief's basis (record lines, caution wording). */
export function designBasis(basis: SearchProblem["basis"]): DesignBasisModule {
  return BASIS_MODULES[basisIndex(basis)];
}

/** The clause shown beside a check under the brief's basis. */
export function checkClause(basis: SearchProblem["basis"], name: CheckName): string {
  return designBasis(basis).clauses?.[name] ?? CHECK_CLAUSES[name];
}

/** Files a basis module's design block where CandidateVerdict and SearchCandidate keep it. */
export function attachDesign(out: { design?: DesignBlock; aisc?: AiscDesign }, d: DesignBlock | AiscDesign | undefined): void {
  if (!d) return;
  if (d.basis === "aisc360") out.aisc = d;
  else out.design = d;
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
  const us = p.basis === "aisc360";
  const limit = en || us;
  const hasShear = p.shear !== undefined && (limit || p.allowable?.shear !== undefined);
  let deflNumerator = 0,
    deflLimit = Infinity,
    deflSpan = 0;
  if (p.deflection) {
    // Simply supported, uniform load: δ = 5·w·L⁴ / (384·E·I) (any beam table, e.g. the
    // AISC Steel Construction Manual's beam diagrams, case 1; mem.). w kN/m = N/mm; L m → mm.
    const L = (deflSpan = p.deflection.span * 1000);
    deflNumerator = (5 * p.deflection.serviceLoad * L ** 4) / (384 * p.deflection.E);
    deflLimit = L / p.deflection.limitRatio;
  }
  // Under "en1993" the allowable stresses are absent: Infinity keeps every stress-based bound
  // of search.ts vacuous (and so sound) without touching it.
  const basis = basisIndex(p.basis);
  return {
    basis,
    precedence: BASIS_MODULES[basis].precedence,
    Ms: p.moment.sagging * 1e6,
    Mh: p.moment.hogging * 1e6,
    V: hasShear ? p.shear! * 1000 : 0,
    hasShear,
    aT: limit ? Infinity : p.allowable!.tension,
    aC: limit ? Infinity : p.allowable!.compression,
    aS: limit ? Infinity : (p.allowable!.shear ?? Infinity),
    slenderLimit,
    hasDeflection: p.deflection !== undefined,
    deflNumerator,
    deflLimit,
    deflSpan,
    density: p.density,
    cost: p.objective === "cost",
    prices: new Map((p.prices ?? []).map((q) => [q.thickness, q.pricePerKg])),
    weldPerMetre: p.objective === "cost" ? weldCostPerMetre(MIN_WELD_THROAT, p.costs?.weld) : 0,
    en: en ? makeEn1993Context(p) : null,
    us: us ? makeAiscContext(p) : null,
  };
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
    if (!ok && !all) return finish(s, false, ctx);
  }
  fk.fill(v, s.plates);
  compositeKernel(s.plates, fk.nPlates, s.k);
  const r = s.rolled;
  if (r !== null) {
    // a catalogue section: its exact properties in place of the plate kernel's (same frame)
    const k = s.k;
    k[K_AREA] = r.A;
    k[K_IZ] = r.Iz;
    k[K_IY] = r.Iy;
    k[K_IYZ] = r.Iyz;
    k[K_CZ] = r.cz;
    k[K_CY] = r.cy;
  }
  s.area = s.k[K_AREA];
  return ctx.basis === 0 ? evalAllowable(fk, v, ctx, s, all, ok) : ctx.basis === 1 ? evalEn1993(fk, v, ctx, s, all, ok) : evalAisc(fk, v, ctx, s, all, ok);
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
  /** basis "aisc360" only: Table B4.1b, Chapter F, G, J2, J10 worked out */
  aisc?: AiscDesign;
  /**
   * With a deflection check: the service deflection's components, mm. An unsymmetric section
   * (the angle) bends about an inclined axis and moves sideways too; the check is on the total.
   */
  deflection?: { vertical: number; sideways: number; total: number };
  /** With a deflection check: the numbers it was worked with, for the calculation record. */
  deflectionWorking?: DeflectionWorking;
  /** With the allowable basis's shear check: where τ = V·Q/(Iz·b) is largest and its terms, for the calculation record. */
  shearWorking?: ShearWorking;
  /** With the brief's slenderness limits: each limited element's b and t, for the calculation record. */
  slendernessWorking?: SlendernessWorking[];
}

/** One element under one of the brief's slenderness limits, as the check measured it (records only). */
export interface SlendernessWorking {
  /** the check it belongs to (slenderness-outstand …) */
  name: CheckName;
  element: string;
  /** the width and thickness in the family's symbols, e.g. "(b − tw)/2" and "tf" */
  widthSymbols: string;
  thicknessSymbols: string;
  /** mm */
  b: number;
  t: number;
  /** b/t, as the check evaluated it */
  ratio: number;
  /** the brief's limit */
  limit: number;
  /** this element's ratio is the check's demand (the largest of its kind) */
  governs: boolean;
}

/** After evaluateCandidate(all = true): every element a slenderness limit applies to, with its b and t. */
export function slendernessWorking(fk: FamilyKernel, v: Float64Array, ctx: CheckContext, s: Scratch): SlendernessWorking[] | undefined {
  const kinds = fk.slenderKinds;
  const out: SlendernessWorking[] = [];
  const bt = new Float64Array(2 * kinds.length);
  fk.slenderParts(v, bt);
  fk.slender(v, s.ratios);
  const taken = new Set<number>();
  for (let i = 0; i < kinds.length; i++) {
    const c = kinds[i];
    const limit = ctx.slenderLimit[c];
    if (limit !== limit) continue;
    const ratio = s.ratios[i];
    // the first element holding the largest ratio is the one evaluateCandidate kept as the demand
    const governs = !taken.has(c) && ratio === s.demand[c];
    if (governs) taken.add(c);
    const w = fk.slenderWords[i];
    out.push({ name: CHECK_NAMES[c], element: w.element, widthSymbols: w.width, thicknessSymbols: w.thickness, b: bt[2 * i], t: bt[2 * i + 1], ratio, limit, governs });
  }
  return out.length ? out : undefined;
}

/** The allowable-stress shear check as evaluated (records only; not stored with candidates). */
export interface ShearWorking {
  /** kN */
  V: number;
  /** height of the largest τ above the section's bottom edge, mm */
  y: number;
  /** first moment of the area above y about the centroidal axis, mm³ */
  Q: number;
  /** width cut at y, mm */
  b: number;
  /** mm⁴ */
  Iz: number;
  /** the check's demand, MPa */
  tau: number;
}

/** After evaluateCandidate(all = true): the allowable shear check's terms, or undefined when it did not run. */
export function shearWorking(problem: SearchProblem, fk: FamilyKernel, s: Scratch): ShearWorking | undefined {
  const tau = s.demand[fkm.C_SHEAR];
  if (tau !== tau || problem.shear === undefined) return undefined;
  // the point the check's own scan found (basis/allowable.ts: maxShearFactor, or the catalogue section's)
  const at = s.rolled !== null ? s.rolled.shearAt : composite.maxShearPoint(s.plates, fk.nPlates, s.k[K_CY]);
  return { V: problem.shear, y: at.y, Q: at.Q, b: at.b, Iz: s.rolled !== null ? s.rolled.Iz : s.k[K_IZ], tau };
}

/** δ = 5·w·L⁴/(384·E·I) ≤ L/limitRatio as the deflection check evaluated it (records only; not stored with candidates). */
export interface DeflectionWorking {
  /** service load, kN/m (= N/mm) */
  w: number;
  /** span, mm */
  L: number;
  /** MPa */
  E: number;
  /** the second moment divided by, mm⁴: Iz, or for an unsymmetric section (Iz·Iy − Iyz²)/√(Iy² + Iyz²) */
  I: number;
  /** the deflection, mm (the check's demand) */
  delta: number;
  limitRatio: number;
  /** L/limitRatio, mm (the check's capacity) */
  limit: number;
}

/** After evaluateCandidate(all = true): the deflection check's numbers, or undefined when it did not run. */
export function deflectionWorking(problem: SearchProblem, ctx: CheckContext, s: Scratch): DeflectionWorking | undefined {
  const d = problem.deflection;
  const delta = s.demand[fkm.C_DEFL];
  if (!d || !ctx.hasDeflection || delta !== delta) return undefined;
  return { w: d.serviceLoad, L: ctx.deflSpan, E: d.E, I: s.deflI, delta, limitRatio: d.limitRatio, limit: ctx.deflLimit };
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

/** The clause or textbook source each check implements, shown beside its numbers (chapter numbers from memory). */
export const CHECK_CLAUSES: Record<CheckName, string> = {
  "bending-compression": "flexure formula σ = M·c/Iz, general formula for the angle (Gere & Goodno, Mechanics of Materials, 7th ed., ch. 5; Boresi & Schmidt, Advanced Mechanics of Materials, 6th ed., ch. 7) ≤ allowable.compression",
  "bending-tension": "flexure formula σ = M·c/Iz, general formula for the angle (Gere & Goodno, Mechanics of Materials, 7th ed., ch. 5; Boresi & Schmidt, Advanced Mechanics of Materials, 6th ed., ch. 7) ≤ allowable.tension",
  shear: "shear formula τ = V·Q/(Iz·b), maximum over the depth (Gere & Goodno, Mechanics of Materials, 7th ed., ch. 5) ≤ allowable.shear",
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
  const ctx = makeCheckContext(problem);
  if (ctx.en && family === "rectangle" && !(Math.min(dims.b, dims.d) <= ctx.en.bandT[ctx.en.bandT.length - 1]))
    throw new EngineInputError("rectangle", `rectangle: its smaller side ${Math.min(dims.b, dims.d)} mm is beyond the last fy band (steel.fy)`);
  const feasible = evaluateCandidate(fk, v, ctx, s, true);
  const checks: CheckResult[] = [];
  // listed in the basis's order (member-checks.md's numbering under en1993)
  for (const c of ctx.precedence) {
    const d = s.demand[c];
    if (d !== d) continue;
    const name = CHECK_NAMES[c];
    checks.push({ name, demand: d, capacity: s.capacity[c], utilisation: d / s.capacity[c], unit: CHECK_UNITS[name], clause: checkClause(problem.basis, name) });
  }
  const out: CandidateVerdict = { checks, utilisation: s.utilisation, governing: CHECK_NAMES[s.governing], feasible, area: s.area };
  if (ctx.hasDeflection) {
    // curvatures of the general (unsymmetric) theory, M·Iy/den vertical and M·Iyz/den sideways
    // (basis/allowable.ts); Iyz = 0 for every family symmetric about an axis
    const Iz = s.k[K_IZ],
      Iy = s.k[K_IY],
      Iyz = fk.unsymmetric ? s.k[K_IYZ] : 0;
    const den = Iz * Iy - Iyz * Iyz;
    const vertical = (ctx.deflNumerator * Iy) / den,
      sideways = (ctx.deflNumerator * Math.abs(Iyz)) / den;
    out.deflection = { vertical, sideways, total: fk.unsymmetric ? Math.hypot(vertical, sideways) : vertical };
  }
  const dw = deflectionWorking(problem, ctx, s);
  if (dw) out.deflectionWorking = dw;
  const sw = shearWorking(problem, fk, s);
  if (sw) out.shearWorking = sw;
  const lw = slendernessWorking(fk, v, ctx, s);
  if (lw) out.slendernessWorking = lw;
  attachDesign(out, BASIS_MODULES[ctx.basis].design(fk, v, ctx, s, problem));
  return out;
}

/** The calculation record's lines for a verdict under the brief's basis (each naming its clause). */
export function recordLines(problem: SearchProblem, verdict: CandidateVerdict): RecordLine[] {
  return designBasis(problem.basis).recordLines(verdict);
}

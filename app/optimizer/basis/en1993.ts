// The EN 1993 limit-state basis (member-checks.md §2). Every check names its clause beside
// its code; the numbers are the spec's, read as its "Readings pinned" section says. One
// evaluation serves the search's hot loop (all = false, stops at the first failure) and the
// results and record (all = true, then design() reads the same intermediates back), so the
// numbers a reviewer reads are the numbers that decided the search.
//
// Units inside: N, mm, MPa (N/mm²), N·mm. Demands and capacities are written out in the
// brief's units (kN·m, kN, mm) so the check table reads like the brief.
//
// Checks in member-checks.md §2's numbering (ties in governing go to the first):
//  1. class-4            EN 1993-1-1 §5.5, Table 5.2
//  2. bending-resistance EN 1993-1-1 §6.2.5
//  3. ltb                EN 1993-1-1 §6.3.2.2 (general case), Mcr by the three-factor formula
//  4. shear-resistance   EN 1993-1-1 §6.2.6 / shear-buckling EN 1993-1-5 §5.2, §5.3
//  5. bending-shear      EN 1993-1-1 §6.2.8
//  6. weld               EN 1993-1-8 §4.5.3.3 (simplified method)
//  7. bearing            EN 1993-1-5 §6 (patch loading, type (c)), only with unstiffened supports
//  8. deflection and the brief's slenderness limits (shared with the allowable basis)
import * as composite from "../composite";
import type { BearingDesign, ClassifiedElement, DesignBlock, LtbDesign, MomentSign, SectionClass, ShearDesign, WeldDesign } from "../design-types";
import type { FamilyKernel } from "../family-kernel";
import * as fkm from "../family-kernel";
import type { SearchProblem } from "../search-schema";
import * as st from "../stability";
import type { CheckContext, DesignBasisModule, RecordLine, Scratch } from "./core";
import { finish, flangeShearFlow, plasticAxis, readPlateTerms, weldSizeBuilt } from "./core";
import type { FlangeShearFlow, PlateTerms } from "./core";

// Local copies of imported bindings (module transforms make each imported-name access a getter call).
const { plateModulusAbout, K_AREA, K_CY, K_IY, K_IZ, K_MAXY } = composite;
const { C_BEARING, C_BEND, C_CLASS4, C_DEFL, C_INTERNAL, C_LTB, C_MV, C_OUTSTAND, C_STEM, C_VB, C_VPL, C_WEB, C_WELD } = fkm;
const { stabilityKernel, ST_BETA, ST_CW, ST_J, ST_SCY } = st;

const SQRT3 = Math.sqrt(3);
const PI2 = Math.PI * Math.PI;

export interface En1993Context {
  grade?: string;
  /** fy bands: thickness limits (ascending) and their fy */
  bandT: Float64Array;
  bandFy: Float64Array;
  fu: number;
  E: number;
  G: number;
  gM0: number;
  gM1: number;
  gM2: number;
  eta: number;
  betaW: number;
  restraint: boolean;
  /** restraint length, mm */
  L: number;
  C1: number;
  C2: number;
  C3: number;
  /** 0 top, 1 shear centre, 2 bottom */
  loadAt: 0 | 1 | 2;
  stiffened: boolean;
  /** stiff bearing length, mm */
  ss: number;
}

export function makeEn1993Context(p: SearchProblem): En1993Context {
  const s = p.steel!;
  const r = p.restraint;
  return {
    grade: s.grade,
    bandT: Float64Array.from(s.fy, (b) => b.maxThickness),
    bandFy: Float64Array.from(s.fy, (b) => b.fy),
    fu: s.fu,
    E: s.E,
    G: s.G,
    gM0: s.gammaM0,
    gM1: s.gammaM1,
    gM2: s.gammaM2,
    eta: s.eta,
    betaW: s.betaW,
    restraint: r !== undefined,
    L: r ? r.length * 1000 : 0,
    C1: r?.C1 ?? 1,
    C2: r?.C2 ?? 0,
    C3: r?.C3 ?? 1,
    loadAt: r?.loadAt === "top" ? 0 : r?.loadAt === "bottom" ? 2 : 1,
    stiffened: p.supports.stiffened,
    ss: p.supports.bearingLength ?? 0,
  };
}

/** EN 1993-1-1 §6.3.2.2 (6.56): ΦLT = 0.5·[1 + αLT·(λLT − 0.2) + λLT²]. */
export function phiLT(lam: number, alphaLT: number): number {
  return 0.5 * (1 + alphaLT * (lam - 0.2) + lam * lam);
}

/** EN 1993-1-1 §6.3.2.2 (6.56): χLT = 1/(ΦLT + √(ΦLT² − λLT²)) ≤ 1. */
export function chiLT(lam: number, alphaLT: number): number {
  const phi = phiLT(lam, alphaLT);
  return Math.min(1, 1 / (phi + Math.sqrt(phi * phi - lam * lam)));
}

/**
 * Mcr by the three-factor formula (member-checks.md §2 item 3; mem.), t = C2·zg − C3·zj:
 * Mcr = C1·(π²·E·Iy/L²)·[√(Cw/Iy + L²·G·J/(π²·E·Iy) + t²) − t].
 * One function for the check below and the search's bounds (search.ts (E2) calls it with
 * bounding values of Iy, Cw, J and t).
 */
export function criticalMoment(e: En1993Context, Iy: number, Cw: number, J: number, t: number): number {
  const L = e.L;
  const Pcr = (PI2 * e.E * Iy) / (L * L);
  const base = Cw / Iy + (L * L * e.G * J) / (PI2 * e.E * Iy);
  return e.C1 * Pcr * (Math.sqrt(base + t * t) - t);
}

/** zg: the load point's height above the shear centre (positive up), either moment sign; d the depth, ysc the shear centre's height. */
export function loadHeight(e: En1993Context, d: number, ysc: number): number {
  return e.loadAt === 0 ? d - ysc : e.loadAt === 2 ? -ysc : 0;
}

/** LTB curve (member-checks.md): welded I and mono-I: c when d/b ≤ 2 (b the narrower flange), otherwise d. */
export function ltbCurveC(family: string, d: number, bNarrow: number): boolean {
  return (family === "i" || family === "mono-i") && d / bNarrow <= 2;
}

/** The least fillet-weld throat any junction gets, mm (member-checks.md §2 item 6). */
export const MIN_WELD_THROAT = 3;

/** EN 1993-1-1 Table 6.3: imperfection factors αLT of curves c and d. */
export const ALPHA_LT_C = 0.49,
  ALPHA_LT_D = 0.76;

/** fy of the first band whose maxThickness ≥ t (member-checks.md §2), NaN beyond the last (the schema refuses those). */
export function fyFor(e: En1993Context, t: number): number {
  for (let i = 0; i < e.bandT.length; i++) if (t <= e.bandT[i]) return e.bandFy[i];
  return NaN;
}

const PART_OUTSTAND = 0,
  PART_INTERNAL = 1,
  PART_WEB = 2,
  PART_STEM = 3;
const PART_NAMES = ["outstand", "internal", "web", "stem"] as const;
/** Element names in En1993Scratch.elName (the search reads which element was class 4). */
export const EL_TOP = 0,
  EL_BOTTOM = 1,
  EL_WEB = 2,
  EL_STEM = 3;
const EL_NAMES = ["top flange", "bottom flange", "web", "stem"];
const MAX_EL = 6;

/** The EN 1993 intermediates of the last evaluation (allocation-free; read back by design()). */
export class En1993Scratch implements PlateTerms, FlangeShearFlow {
  st = new Float64Array(st.ST_OUT);
  // geometry read from the dimension vector
  d = 0;
  bt = 0;
  tft = 0;
  bb = 0;
  tfb = 0;
  tw = 0;
  /** webs: 0 (tee, rectangle), 1, 2 (box) */
  nw = 0;
  hw = 0;
  tMax = 0;
  fy = 0;
  eps = 0;
  cls = 1;
  nEl = 0;
  elPart = new Int8Array(MAX_EL);
  elName = new Int8Array(MAX_EL);
  /** bit 1 sagging, bit 2 hogging */
  elUnder = new Int8Array(MAX_EL);
  elClass = new Int8Array(MAX_EL);
  elC = new Float64Array(MAX_EL);
  elT = new Float64Array(MAX_EL);
  elL1 = new Float64Array(MAX_EL);
  elL2 = new Float64Array(MAX_EL);
  elL3 = new Float64Array(MAX_EL);
  elAlpha = new Float64Array(MAX_EL);
  elPsi = new Float64Array(MAX_EL);
  c4Ratio = 0;
  c4Limit = 1;
  Zz = 0;
  W = 0;
  /** N·mm */
  McRd = 0;
  /** per sign (0 sagging, 1 hogging): LTB results; ltbOn bit per sign */
  ltbOn = 0;
  ltbM = new Float64Array(2);
  zg = new Float64Array(2);
  zj = new Float64Array(2);
  Mcr = new Float64Array(2);
  lamLT = new Float64Array(2);
  phiLT = new Float64Array(2);
  chiLT = new Float64Array(2);
  MbRd = new Float64Array(2);
  /** per sign: C2·zg − C3·zj, mm */
  zt = new Float64Array(2);
  /** the constants Mcr was worked with: minor-axis Iy (EN's Iz), Cw (Iw), J (It) */
  ltbIz = 0;
  ltbIw = 0;
  ltbIt = 0;
  /** I and mono-I: depth over the narrower flange, the ratio that chose the curve; NaN otherwise */
  hb = NaN;
  curveC = false;
  /** rolled I with d/b ≤ 2: curve b */
  curveB = false;
  /** taken off each end of a classified width (Table 5.2), mm: a rolled section's root radius r;
   *  an rhs the outer corner radius less the wall (ro − t), so c is the flat between the corners */
  rootR = 0;
  /** a rolled catalogue section (no flange-to-web weld, rolled shear area and LTB curve) */
  rolled = false;
  /** the catalogue shape of a rolled section ("" for plate candidates) */
  rolledShape = "";
  shearOn = false;
  Av = 0;
  Vpl = 0;
  vLimit = NaN;
  buckling = false;
  lamW = 0;
  chiW = 0;
  Vb = 0;
  VRd = 0;
  mvOn = false;
  rho = 0;
  MV = 0;
  weldOn = false;
  Qf = 0;
  q = 0;
  fvwd = 0;
  aExact = 0;
  a = 0;
  aMax = 0;
  bearOn = false;
  kF = 0;
  m1 = 0;
  m2 = 0;
  ly = 0;
  Fcr = 0;
  lamF = 0;
  chiF = 0;
  Leff = 0;
  FRd = 0;
}

function addElement(x: En1993Scratch, name: number, part: number, under: number, c: number, t: number, l1: number, l2: number, l3: number, alpha: number, psi: number): void {
  const i = x.nEl++;
  const r = c / t;
  const cls = r <= l1 ? 1 : r <= l2 ? 2 : r <= l3 ? 3 : 4;
  x.elName[i] = name;
  x.elPart[i] = part;
  x.elUnder[i] = under;
  x.elC[i] = c;
  x.elT[i] = t;
  x.elL1[i] = l1;
  x.elL2[i] = l2;
  x.elL3[i] = l3;
  x.elAlpha[i] = alpha;
  x.elPsi[i] = psi;
  x.elClass[i] = cls;
  if (cls > x.cls) x.cls = cls;
  // class 4: utilisation = c/t over the class-3 limit, the worst element's
  if (cls === 4 && r / l3 > x.c4Ratio / x.c4Limit) {
    x.c4Ratio = r;
    x.c4Limit = l3;
  }
}

/**
 * EN 1993-1-1 Table 5.2, part subject to bending and compression (webs). α: fraction of c in
 * compression at the plastic neutral axis; ψ: elastic stress at the other end ÷ at the
 * compressed end (tension negative). Classes 1 and 2 from α (α > 0.5: 396ε/(13α − 1),
 * 456ε/(13α − 1); α ≤ 0.5: 36ε/α, 41.5ε/α; α ≤ 0: no compression, class 1); class 3 from ψ
 * (ψ > −1: 42ε/(0.67 + 0.33ψ); ψ ≤ −1: 62ε·(1 − ψ)·√(−ψ)); no elastic compression: no limit.
 */
function addWeb(x: En1993Scratch, under: number, alpha: number, psi: number, compressed: boolean): void {
  const e = x.eps;
  let l1: number, l2: number, l3: number;
  if (!(alpha > 0)) l1 = l2 = Infinity;
  else if (alpha > 0.5) {
    l1 = (396 * e) / (13 * alpha - 1);
    l2 = (456 * e) / (13 * alpha - 1);
  } else {
    l1 = (36 * e) / alpha;
    l2 = (41.5 * e) / alpha;
  }
  if (!compressed) l3 = Infinity;
  else if (psi > -1) l3 = (42 * e) / (0.67 + 0.33 * psi);
  else l3 = 62 * e * (1 - psi) * Math.sqrt(-psi);
  // rolled sections: c = d − 2·tf − 2·r (Table 5.2, sheet 1)
  addElement(x, EL_WEB, PART_WEB, under, x.hw - 2 * x.rootR, x.tw, l1, l2, l3, alpha, psi);
}

/** 1. Classification, EN 1993-1-1 Table 5.2 (bending only); member-checks.md §2 item 1. */
function classify(family: string, x: En1993Scratch, sag: boolean, hog: boolean, yp: number, cy: number): void {
  const e = x.eps;
  x.cls = 1;
  x.nEl = 0;
  x.c4Ratio = 0;
  x.c4Limit = 1;
  if (family === "rectangle") return; // member-checks.md: class 1
  // Flanges: outstand c/tf ≤ 9ε, 10ε, 14ε (Table 5.2 sheet 2); box internal c/tf ≤ 33ε, 38ε, 42ε (sheet 1)
  if (family === "box") {
    // a rolled rhs: the flat between the corner radii, b − 2·ro (Table 5.2 sheet 1 measures c on
    // the flat; with ro = 1.5·t it is the b − 3·t often quoted for hot-finished tubes, mem.)
    const c = x.bt - 2 * x.tw - 2 * x.rootR;
    if (sag) addElement(x, EL_TOP, PART_INTERNAL, 1, c, x.tft, 33 * e, 38 * e, 42 * e, NaN, NaN);
    if (hog) addElement(x, EL_BOTTOM, PART_INTERNAL, 2, c, x.tfb, 33 * e, 38 * e, 42 * e, NaN, NaN);
  } else {
    // rolled sections measure the outstand from the root fillet's end (Table 5.2, sheet 2):
    // I c = (b − tw − 2r)/2, channel c = b − tw − r
    const r = x.rootR;
    const cTop = family === "channel" ? x.bt - x.tw - r : (x.bt - x.tw - 2 * r) / 2;
    const cBot = family === "channel" ? x.bb - x.tw - r : (x.bb - x.tw - 2 * r) / 2;
    if (sag) addElement(x, EL_TOP, PART_OUTSTAND, 1, cTop, x.tft, 9 * e, 10 * e, 14 * e, NaN, NaN);
    // the tee has no bottom flange: its flange is classified only when compressed (sagging)
    if (hog && family !== "tee") addElement(x, EL_BOTTOM, PART_OUTSTAND, 2, cBot, x.tfb, 9 * e, 10 * e, 14 * e, NaN, NaN);
  }
  if (family === "tee") {
    // member-checks.md: the stem always, as an outstand c = d − tf whatever its stress gradient
    // (a conservative simplification, stated in the record). A rolled tee measures it from the
    // root fillet's end, c = d − tf − r, as Table 5.2 sheet 2 measures a rolled outstand (our
    // reading for the stem, which the basis classifies as an outstand).
    addElement(x, EL_STEM, PART_STEM, (sag ? 1 : 0) | (hog ? 2 : 0), x.d - x.tft - x.rootR, x.tw, 9 * e, 10 * e, 14 * e, NaN, NaN);
    return;
  }
  // Webs: c = clear depth between flanges, t = tw
  if (family !== "mono-i") {
    // symmetric about mid-depth: α = 0.5 and ψ = −1 exactly (readings pinned)
    addWeb(x, (sag ? 1 : 0) | (hog ? 2 : 0), 0.5, -1, true);
    return;
  }
  const yT = x.d - x.tft,
    yB = x.tfb;
  let aS = NaN,
    pS = NaN,
    cS = false,
    aH = NaN,
    pH = NaN,
    cH = false;
  if (sag) {
    // compression above both neutral axes
    aS = Math.min(1, Math.max(0, (yT - yp) / x.hw));
    cS = yT - cy > 0;
    pS = (yB - cy) / (yT - cy);
  }
  if (hog) {
    aH = Math.min(1, Math.max(0, (yp - yB) / x.hw));
    cH = cy - yB > 0;
    pH = (cy - yT) / (cy - yB);
  }
  if (sag && hog && aS === aH && pS === pH) addWeb(x, 3, aS, pS, cS);
  else {
    if (sag) addWeb(x, 1, aS, pS, cS);
    if (hog) addWeb(x, 2, aH, pH, cH);
  }
}

function evaluate(fk: FamilyKernel, v: Float64Array, ctx: CheckContext, s: Scratch, all: boolean, ok: boolean): boolean {
  const e = ctx.en!;
  const x = s.en ?? (s.en = new En1993Scratch());
  const dem = s.demand,
    cap = s.capacity,
    k = s.k,
    p = s.plates;
  const family = fk.family;
  readPlateTerms(family, v, x);
  const rolled = s.rolled;
  x.rolled = rolled !== null;
  x.rolledShape = rolled !== null ? rolled.shape : "";
  x.rootR = rolled === null ? 0 : rolled.shape === "rhs" ? Math.max(0, rolled.ro - x.tw) : rolled.r;
  const fy = fyFor(e, x.tMax);
  x.fy = fy;
  x.eps = Math.sqrt(235 / fy);
  x.ltbOn = 0;
  x.shearOn = x.mvOn = x.weldOn = x.bearOn = false;
  const Ms = ctx.Ms,
    Mh = ctx.Mh,
    sag = Ms > 0,
    hog = Mh > 0;
  const A = k[K_AREA],
    cy = k[K_CY], // the family frame starts at y = 0, so this is the height above the bottom
    Iz = k[K_IZ],
    Iy = k[K_IY],
    d = k[K_MAXY];
  const yp = plasticAxis(family, p, fk.nPlates, A, cy, d);

  // 1. Classification (EN 1993-1-1 §5.5, Table 5.2)
  classify(family, x, sag, hog, yp, cy);
  if (x.cls === 4) {
    // member-checks.md: a class-4 candidate fails with governing class-4 and is not checked further
    dem.fill(NaN);
    dem[C_CLASS4] = x.c4Ratio;
    cap[C_CLASS4] = x.c4Limit;
    return finish(s, false, ctx);
  }

  // 2. Bending resistance, EN 1993-1-1 §6.2.5 (6.13, 6.14): Mc,Rd = W·fy/γM0, W = Wpl (classes
  // 1, 2) or Wel,min (class 3); one W for every check of the section (readings pinned).
  x.Zz = rolled !== null ? rolled.Zz : plateModulusAbout(p, fk.nPlates, yp);
  x.W = x.cls <= 2 ? x.Zz : Math.min(Iz / (d - cy), Iz / cy);
  const W = x.W;
  x.McRd = (W * fy) / e.gM0;
  const MEd = Ms > Mh ? Ms : Mh;
  dem[C_BEND] = MEd * 1e-6;
  cap[C_BEND] = x.McRd * 1e-6;
  if (MEd > x.McRd) {
    ok = false;
    if (!all) return finish(s, false, ctx);
  }

  stabilityKernel(family, v, x.st);

  // 3. Lateral-torsional buckling, EN 1993-1-1 §6.3.2.2 (general case) with
  // Mcr = C1·(π²·E·Iy/L²)·[√(Cw/Iy + L²·G·J/(π²·E·Iy) + (C2·zg − C3·zj)²) − (C2·zg − C3·zj)]
  // (the three-factor formula, member-checks.md §2 item 3; mem.).
  if (e.restraint) {
    const Cw = x.st[ST_CW],
      // an rhs takes its own It (rounded corners, hollow.ts); other rolled shapes keep the plates'
      // J without the fillets (slightly conservative, stated in the record)
      J = rolled !== null && rolled.shape === "rhs" ? rolled.J : x.st[ST_J],
      beta = x.st[ST_BETA],
      ysc = x.st[ST_SCY];
    const zg = loadHeight(e, d, ysc);
    const bNarrow = x.bt < x.bb ? x.bt : x.bb;
    // rolled I (catalogue sections): curve b when d/b ≤ 2, c otherwise, the rolled rows of EN 1993-1-1
    // Table 6.5 (mem.), used in the general case's expression above: one curve more cautious than
    // Table 6.4's a/b for rolled I, a stated choice; a rolled channel stays on curve d
    x.curveB = rolled !== null && family === "i" && d / bNarrow <= 2;
    x.curveC = rolled !== null ? family === "i" && !x.curveB : ltbCurveC(family, d, bNarrow);
    const aLT = x.curveB ? 0.34 : x.curveC ? ALPHA_LT_C : ALPHA_LT_D;
    x.hb = family === "i" || family === "mono-i" ? d / bNarrow : NaN;
    x.ltbIz = Iy;
    x.ltbIw = Cw;
    x.ltbIt = J;
    const WfY = W * fy;
    let worst = -1,
      wr = -Infinity;
    for (let sgn = 0; sgn < 2; sgn++) {
      const M = sgn === 0 ? Ms : Mh;
      if (!(M > 0)) continue;
      // zj = βc/2, βc = betaX sagging (top flange compressed), −betaX hogging
      const zj = sgn === 0 ? beta / 2 : -beta / 2;
      const t = e.C2 * zg - e.C3 * zj;
      const Mcr = criticalMoment(e, Iy, Cw, J, t);
      const lam = Math.sqrt(WfY / Mcr);
      const phi = phiLT(lam, aLT);
      // evaluated even when λLT ≤ 0.2 (readings pinned): χLT = 1 there by the min
      const chi = chiLT(lam, aLT);
      const Mb = (chi * WfY) / e.gM1;
      x.ltbOn |= 1 << sgn;
      x.ltbM[sgn] = M;
      x.zg[sgn] = zg;
      x.zj[sgn] = zj;
      x.zt[sgn] = t;
      x.Mcr[sgn] = Mcr;
      x.lamLT[sgn] = lam;
      x.phiLT[sgn] = phi;
      x.chiLT[sgn] = chi;
      x.MbRd[sgn] = Mb;
      if (M / Mb > wr) {
        wr = M / Mb;
        worst = sgn;
      }
    }
    if (worst >= 0) {
      dem[C_LTB] = x.ltbM[worst] * 1e-6;
      cap[C_LTB] = x.MbRd[worst] * 1e-6;
      if (x.ltbM[worst] > x.MbRd[worst]) {
        ok = false;
        if (!all) return finish(s, false, ctx);
      }
    }
  }

  // 4. Shear, EN 1993-1-1 §6.2.6: Vpl,Rd = Av·fy/(√3·γM0) (6.18); Av = η·hw·tw for welded I,
  // mono-I and channel (6.2.6(3)(d)), η·Σhw·tw for the box (two webs), tw·(d − tf/2) for the
  // tee and b·d for the rectangle (member-checks.md; mem.).
  // Shear buckling, EN 1993-1-5 §5.1(2), §5.2, §5.3 (Table 5.1, non-rigid end post): checked
  // when hw/tw > 72ε/η; λw = hw/(86.4·tw·ε) (5.5, transverse stiffeners at supports only);
  // χw = η for λw < 0.83/η, else 0.83/λw; Vb,Rd = χw·fy·hw·tw/(√3·γM1) per web (the flanges'
  // share Vbf,Rd ignored), resistance min(Vpl,Rd, Vb,Rd).
  const V = ctx.V;
  if (V > 0) {
    x.shearOn = true;
    const eta = e.eta;
    const hw = x.hw,
      tw = x.tw;
    if (family === "rectangle") x.Av = x.bt * d;
    // rolled T, load parallel to the web: Av = A − b·tf + (tw + 2r)·tf/2 (EN 1993-1-1 §6.2.6(3)(c)
    // as corrected, mem.); the welded tee keeps tw·(d − tf/2), the same clause's welded line
    else if (rolled !== null && family === "tee") x.Av = A - x.bt * x.tft + ((tw + 2 * rolled.r) * x.tft) / 2;
    else if (family === "tee") x.Av = tw * (d - x.tft / 2);
    // rolled rectangular hollow section of uniform thickness, load parallel to the depth:
    // Av = A·h/(b + h) (EN 1993-1-1 §6.2.6(3)(f), mem.)
    else if (rolled !== null && family === "box") x.Av = (A * d) / (x.bt + d);
    // rolled I and H, load parallel to the web: Av = A − 2·b·tf + (tw + 2r)·tf, not less than
    // η·hw·tw (EN 1993-1-1 §6.2.6(3)(a)); rolled channel: A − 2·b·tf + (tw + r)·tf (§6.2.6(3)(b))
    else if (rolled !== null && family === "i") x.Av = Math.max(A - 2 * x.bt * x.tft + (tw + 2 * rolled.r) * x.tft, eta * hw * tw);
    else if (rolled !== null && family === "channel") x.Av = A - 2 * x.bt * x.tft + (tw + rolled.r) * x.tft;
    else x.Av = eta * x.nw * hw * tw;
    x.Vpl = (x.Av * fy) / (SQRT3 * e.gM0);
    x.vLimit = x.nw > 0 ? (72 * x.eps) / eta : NaN;
    x.buckling = x.nw > 0 && hw / tw > x.vLimit;
    let c = C_VPL;
    x.VRd = x.Vpl;
    if (x.buckling) {
      x.lamW = hw / (86.4 * tw * x.eps);
      x.chiW = x.lamW < 0.83 / eta ? eta : 0.83 / x.lamW;
      x.Vb = (x.nw * x.chiW * fy * hw * tw) / (SQRT3 * e.gM1);
      if (x.Vb < x.VRd) x.VRd = x.Vb;
      c = C_VB;
    }
    dem[c] = V * 1e-3;
    cap[c] = x.VRd * 1e-3;
    if (V > x.VRd) {
      ok = false;
      if (!all) return finish(s, false, ctx);
    }

    // 5. Bending and shear, EN 1993-1-1 §6.2.8, when 0.5·VRd < VEd ≤ VRd (VRd the resistance
    // of check 4): ρ = (2·VEd/VRd − 1)² (6.29); with webs MV,Rd = (W − ρ·Σhw²·tw/4)·fy/γM0
    // (the 6.2.8(5) expression, used for class 3 and mono-symmetric sections too: a stated
    // simplification); tee and rectangle MV,Rd = (1 − ρ)·Mc,Rd.
    if (V > 0.5 * x.VRd && V <= x.VRd) {
      x.mvOn = true;
      const r = 2 * (V / x.VRd) - 1;
      x.rho = r * r;
      x.MV = x.nw > 0 ? ((W - (x.rho * x.nw * hw * hw * tw) / 4) * fy) / e.gM0 : (1 - x.rho) * x.McRd;
      // a negative reduced modulus (class 3 with slight flanges) means no resistance at all
      if (x.MV < 0) x.MV = 0;
      dem[C_MV] = MEd * 1e-6;
      cap[C_MV] = x.MV * 1e-6;
      if (MEd > x.MV) {
        ok = false;
        if (!all) return finish(s, false, ctx);
      }
    }
  }

  // 6. Flange-to-web welds, EN 1993-1-8 §4.5.3.3 (simplified method): fvw,d = fu/(√3·βw·γM2)
  // (4.4); q = VEd·Qf/Iz per junction line, Qf of the flange with the larger first moment about
  // the elastic neutral axis; two fillet welds share it (box: the whole flange's q on its two
  // welds, one per web), so a = q/(2·fvw,d), rounded up to a whole mm, at least 3 mm; it fails
  // above 0.7 × the thinner joined plate (member-checks.md §2 item 6).
  // a rolled section has no flange-to-web weld
  if (family !== "rectangle" && rolled === null) {
    x.weldOn = true;
    const top = flangeShearFlow(family, x, V, cy, Iz, x);
    x.fvwd = e.fu / (SQRT3 * e.betaW * e.gM2);
    x.aExact = x.q / (2 * x.fvwd);
    x.a = weldSizeBuilt(x.aExact, MIN_WELD_THROAT);
    const tf = top ? x.tft : x.tfb;
    x.aMax = 0.7 * (tf < x.tw ? tf : x.tw);
    dem[C_WELD] = x.a;
    cap[C_WELD] = x.aMax;
    if (x.a > x.aMax) {
      ok = false;
      if (!all) return finish(s, false, ctx);
    }
  }

  // 7. Patch loading at an end support without bearing stiffeners, EN 1993-1-5 §6 (mem.),
  // type (c) (load through one flange at an unstiffened end, c = 0: the bearing at the
  // member's end), the reaction taken as VEd, the loaded flange the bottom one:
  //   kF = 2 + 6·(ss + c)/hw ≤ 6 (Fig. 6.1); Fcr = 0.9·kF·E·tw³/hw (6.5);
  //   m1 = fyf·bf/(fyw·tw) (6.8, one fy: bf/tw); m2 = 0.02·(hw/tf)² when λF > 0.5, else 0 (6.9);
  //   le = kF·E·tw²/(2·fyw·hw) ≤ ss + c (6.13);
  //   ly = min(le + tf·√(m1/2 + (le/tf)² + m2), le + tf·√(m1 + m2)) (6.11, 6.12);
  //   λF = √(ly·tw·fyw/Fcr) (6.4); χF = 0.5/λF ≤ 1 (6.3); Leff = χF·ly; FRd = fyw·Leff·tw/γM1 (6.1).
  // m2 is first taken with λF > 0.5 and recomputed with m2 = 0 if λF comes out ≤ 0.5. Box: each
  // web with half the flange (bf = b/2), the two webs summed. Tee and rectangle: not a web
  // between flanges, outside §6 (the record says so).
  if (!e.stiffened && V > 0 && x.nw > 0) {
    x.bearOn = true;
    const hw = x.hw,
      tw = x.tw,
      tf = x.tfb,
      ss = e.ss;
    const bf = family === "box" ? x.bb / 2 : x.bb;
    let kF = 2 + (6 * ss) / hw;
    if (kF > 6) kF = 6;
    const Fcr = (0.9 * kF * e.E * tw * tw * tw) / hw;
    const m1 = bf / tw;
    let le = (kF * e.E * tw * tw) / (2 * fy * hw);
    if (le > ss) le = ss;
    let m2 = 0.02 * (hw / tf) * (hw / tf);
    const lyOf = (m: number) => Math.min(le + tf * Math.sqrt(m1 / 2 + (le / tf) * (le / tf) + m), le + tf * Math.sqrt(m1 + m));
    let ly = lyOf(m2);
    let lamF = Math.sqrt((ly * tw * fy) / Fcr);
    if (lamF <= 0.5) {
      m2 = 0;
      ly = lyOf(0);
      lamF = Math.sqrt((ly * tw * fy) / Fcr);
    }
    const chiF = Math.min(1, 0.5 / lamF);
    const Leff = chiF * ly;
    x.kF = kF;
    x.Fcr = Fcr;
    x.m1 = m1;
    x.m2 = m2;
    x.ly = ly;
    x.lamF = lamF;
    x.chiF = chiF;
    x.Leff = Leff;
    x.FRd = (x.nw * fy * Leff * tw) / e.gM1;
    dem[C_BEARING] = V * 1e-3;
    cap[C_BEARING] = x.FRd * 1e-3;
    if (V > x.FRd) {
      ok = false;
      if (!all) return finish(s, false, ctx);
    }
  }

  // 8. Deflection (service load, as under the allowable basis): every EN 1993 family is
  // symmetric about the vertical axis, so the vertical deflection uses Iz.
  if (ctx.hasDeflection) {
    s.deflI = Iz;
    dem[C_DEFL] = ctx.deflNumerator / Iz;
    cap[C_DEFL] = ctx.deflLimit;
    if (dem[C_DEFL] > ctx.deflLimit) ok = false;
  }
  return finish(s, ok, ctx, fk, v);
}

// ------------------------------------------------------------------ the design block

const signs = (mask: number): MomentSign[] => [...(mask & 1 ? (["sagging"] as const) : []), ...(mask & 2 ? (["hogging"] as const) : [])];
const LOAD_WORDS = ["on the top flange", "at the shear centre", "on the bottom flange"];

function design(fk: FamilyKernel, _v: Float64Array, ctx: CheckContext, s: Scratch, problem: SearchProblem): DesignBlock {
  const e = ctx.en!,
    x = s.en!;
  const family = fk.family;
  const elements: ClassifiedElement[] = [];
  for (let i = 0; i < x.nEl; i++) {
    const el: ClassifiedElement = {
      element: EL_NAMES[x.elName[i]],
      part: PART_NAMES[x.elPart[i]],
      under: signs(x.elUnder[i]),
      c: x.elC[i],
      t: x.elT[i],
      ratio: x.elC[i] / x.elT[i],
      limits: [x.elL1[i], x.elL2[i], x.elL3[i]],
      class: x.elClass[i] as SectionClass,
    };
    if (x.elPart[i] === PART_WEB) {
      el.alpha = x.elAlpha[i];
      el.psi = x.elPsi[i];
    }
    elements.push(el);
  }
  const notes: string[] = [
    "Design values: the brief's moments and shear are factored actions (ultimate limit state); the deflection uses the service load.",
    `fy = ${x.fy} MPa from the band holding the thickest plate (${x.tMax} mm); ε = √(235/fy) = ${x.eps.toFixed(3)}.`,
  ];
  const c4 = x.cls === 4;
  if (family === "tee") notes.push("Tee stem classified as an outstand (9ε, 10ε, 14ε) whatever its stress gradient: a conservative simplification.");
  if (family === "rectangle")
    notes.push("Solid rectangle: class 1; shear area b·d (mem.); torsion constant by the solid-rectangle approximation (mem.); fy from the band of its smaller side.");
  if (c4) notes.push("Class 4 (effective sections) is outside this version: the section is excluded and not checked further.");
  if (!e.restraint) notes.push("No restraint length given: the compression flange is taken as restrained throughout its length, so lateral-torsional buckling is not checked.");
  else
    notes.push(
      `Lateral-torsional buckling over ${e.L / 1000} m between restraints, C1 = ${e.C1}, C2 = ${e.C2}, C3 = ${e.C3}, load ${LOAD_WORDS[e.loadAt]}; general case of §6.3.2.2, curve ${x.curveB ? "b" : x.curveC ? "c" : "d"}${x.rolled ? " (rolled section)" : ""}.`,
    );
  if (e.stiffened) notes.push("Bearing stiffeners are required at the supports (assumed present, not designed here); web crippling is therefore not checked.");
  else if (x.nw > 0) notes.push(`No bearing stiffeners: patch loading checked at an end support (EN 1993-1-5 §6, type (c), bearing at the member end, ss = ${e.ss} mm, reaction = design shear).`);
  else notes.push("No bearing stiffeners: patch loading of EN 1993-1-5 §6 covers webs between flanges, not this section; the bearing at the supports is not checked.");
  if (x.shearOn && x.buckling) notes.push("Shear buckling: non-rigid end posts; the flanges' contribution to the resistance ignored.");
  if (x.mvOn && x.nw > 0 && (x.cls === 3 || family === "mono-i"))
    notes.push("Bending and shear: the §6.2.8(5) expression for I-sections is used for this class 3 or mono-symmetric section, a stated simplification.");
  if (x.rolled && x.rolledShape === "rhs")
    notes.push(
      `Rolled rectangular hollow section: properties and torsion constant include the rounded corners; classification widths are the flats between the corner radii (b − 2·ro, d − 2·ro; Table 5.2); shear area A·h/(b + h) (§6.2.6(3)(f)); checked as the box otherwise (patch loading on both walls, the §6.2.8(5) expression for bending and shear); no welds.`,
    );
  else if (x.rolled)
    notes.push(
      `Rolled section: properties include the root fillets (r = ${x.rootR} mm); classification widths measured from the fillets (Table 5.2${family === "tee" ? "; the stem from the flange's fillet, c = d − tf − r" : ""}); rolled shear area (§6.2.6(3)); no flange-to-web weld; torsion and warping constants from the plates without the fillets (slightly conservative).`,
    );
  if (x.weldOn) notes.push("Flange-to-web welds: two fillet welds per junction (box: one per web per flange), simplified method, throat rounded up to a whole mm and at least 3 mm.");
  const ltb: LtbDesign[] = [];
  for (let sgn = 0; sgn < 2; sgn++)
    if (x.ltbOn & (1 << sgn))
      ltb.push({
        moment: sgn === 0 ? "sagging" : "hogging",
        MEd: x.ltbM[sgn] * 1e-6,
        zg: x.zg[sgn],
        zj: x.zj[sgn],
        L: e.L,
        Iz: x.ltbIz,
        Iw: x.ltbIw,
        It: x.ltbIt,
        zTerm: x.zt[sgn],
        Mcr: x.Mcr[sgn] * 1e-6,
        lambdaLT: x.lamLT[sgn],
        curve: x.curveB ? "b" : x.curveC ? "c" : "d",
        alphaLT: x.curveB ? 0.34 : x.curveC ? 0.49 : 0.76,
        phiLT: x.phiLT[sgn],
        chiLT: x.chiLT[sgn],
        MbRd: x.MbRd[sgn] * 1e-6,
        utilisation: x.ltbM[sgn] / x.MbRd[sgn],
        hOverB: Number.isNaN(x.hb) ? null : x.hb,
      });
  let shear: ShearDesign | null = null;
  if (!c4 && x.shearOn) {
    shear = {
      hw: x.hw,
      tw: x.tw,
      Av: x.Av,
      VplRd: x.Vpl * 1e-3,
      bucklingLimit: x.nw > 0 ? x.vLimit : null,
      hwOverTw: x.nw > 0 ? x.hw / x.tw : null,
      buckling: x.buckling,
      VRd: x.VRd * 1e-3,
      governing: x.buckling ? "shear-buckling" : "shear-resistance",
    };
    if (x.buckling) {
      shear.lambdaW = x.lamW;
      shear.chiW = x.chiW;
      shear.VbRd = x.Vb * 1e-3;
    }
  }
  const weld: WeldDesign | null = !c4 && x.weldOn ? { Qf: x.Qf, q: x.q, welds: 2, fvwd: x.fvwd, aExact: x.aExact, a: x.a, aMax: x.aMax } : null;
  const bearing: BearingDesign | null =
    !c4 && x.bearOn
      ? { ss: e.ss, kF: x.kF, m1: x.m1, m2: x.m2, ly: x.ly, Fcr: x.Fcr * 1e-3, lambdaF: x.lamF, chiF: x.chiF, Leff: x.Leff, FRd: x.FRd * 1e-3 }
      : null;
  const out: DesignBlock = {
    basis: "en1993",
    fy: x.fy,
    fyPlate: x.tMax,
    epsilon: x.eps,
    sectionClass: x.cls as SectionClass,
    elements,
    W: c4 ? null : x.W,
    Wkind: x.cls <= 2 ? "plastic" : "elastic",
    McRd: c4 ? null : x.McRd * 1e-6,
    ltb: c4 || !e.restraint ? null : ltb,
    shear,
    bendingShear: !c4 && x.mvOn ? { rho: x.rho, MVRd: x.MV * 1e-6 } : null,
    weld,
    bearing,
    notes,
  };
  if (e.grade !== undefined) out.grade = e.grade;
  void problem;
  return out;
}

// ------------------------------------------------------------------ record lines

const f3 = (x: number) => (Math.abs(x) >= 1000 ? x.toFixed(0) : Math.abs(x) >= 10 ? x.toFixed(1) : x.toFixed(3));

function recordLines(verdict: Parameters<DesignBasisModule["recordLines"]>[0]): RecordLine[] {
  const d = verdict.design;
  if (!d) return [];
  const L: RecordLine[] = [];
  const add = (clause: string, text: string) => L.push({ clause, text });
  add("EN 1993-1-1 §3.2, EN 10025-2", `fy = ${d.fy} MPa (thickest plate ${d.fyPlate} mm), ε = ${d.epsilon.toFixed(3)}`);
  for (const el of d.elements) {
    const extra = el.alpha !== undefined ? `, α = ${f3(el.alpha)}, ψ = ${f3(el.psi!)}` : "";
    add("EN 1993-1-1 Table 5.2", `${el.element} (${el.part}${el.under.length ? ", " + el.under.join(" and ") : ""}): c/t = ${f3(el.c)}/${f3(el.t)} = ${f3(el.ratio)}; limits ${el.limits.map((l) => (Number.isFinite(l) ? f3(l) : "none")).join(" / ")}${extra} → class ${el.class}`);
  }
  add("EN 1993-1-1 §5.5.2", `section class ${d.sectionClass}${d.sectionClass === 4 ? " (outside this version: not checked further)" : ""}`);
  if (d.McRd !== null && d.W !== null) add("EN 1993-1-1 §6.2.5", `W = ${d.Wkind === "plastic" ? "Wpl" : "Wel,min"} = ${f3(d.W)} mm³; Mc,Rd = W·fy/γM0 = ${f3(d.McRd)} kN·m`);
  if (d.ltb)
    for (const l of d.ltb)
      add(
        "EN 1993-1-1 §6.3.2.2",
        `${l.moment}: zg = ${f3(l.zg)} mm, zj = ${f3(l.zj)} mm, Mcr = ${f3(l.Mcr)} kN·m, λLT = ${f3(l.lambdaLT)}, curve ${l.curve} (αLT = ${l.alphaLT}), ΦLT = ${f3(l.phiLT)}, χLT = ${f3(l.chiLT)}, Mb,Rd = ${f3(l.MbRd)} kN·m against MEd = ${f3(l.MEd)} kN·m`,
      );
  if (d.shear) {
    const s = d.shear;
    add("EN 1993-1-1 §6.2.6", `Av = ${f3(s.Av)} mm², Vpl,Rd = ${f3(s.VplRd)} kN`);
    if (s.buckling) add("EN 1993-1-5 §5.2, §5.3", `hw/tw = ${f3(s.hw / s.tw)} > 72ε/η = ${f3(s.bucklingLimit!)}: λw = ${f3(s.lambdaW!)}, χw = ${f3(s.chiW!)}, Vb,Rd = ${f3(s.VbRd!)} kN`);
    add("EN 1993-1-1 §6.2.6", `VRd = ${f3(s.VRd)} kN (${s.governing})`);
  }
  if (d.bendingShear) add("EN 1993-1-1 §6.2.8", `VEd > 0.5·VRd: ρ = ${f3(d.bendingShear.rho)}, MV,Rd = ${f3(d.bendingShear.MVRd)} kN·m`);
  if (d.weld) add("EN 1993-1-8 §4.5.3.3", `q = VEd·Qf/Iz = ${f3(d.weld.q)} N/mm (Qf = ${f3(d.weld.Qf)} mm³), fvw,d = ${f3(d.weld.fvwd)} MPa, a = q/(2·fvw,d) = ${f3(d.weld.aExact)} → ${d.weld.a} mm (at most ${f3(d.weld.aMax)} mm)`);
  if (d.bearing) {
    const b = d.bearing;
    add("EN 1993-1-5 §6", `type (c), ss = ${b.ss} mm: kF = ${f3(b.kF)}, m1 = ${f3(b.m1)}, m2 = ${f3(b.m2)}, ly = ${f3(b.ly)} mm, λF = ${f3(b.lambdaF)}, χF = ${f3(b.chiF)}, Leff = ${f3(b.Leff)} mm, FRd = ${f3(b.FRd)} kN`);
  }
  for (const n of d.notes) add("assumption", n);
  return L;
}

export const en1993Basis: DesignBasisModule = {
  id: "en1993",
  // member-checks.md §2's numbering; then deflection and the brief's slenderness limits (item 8)
  precedence: Int8Array.from([C_CLASS4, C_BEND, C_LTB, C_VPL, C_VB, C_MV, C_WELD, C_BEARING, C_DEFL, C_OUTSTAND, C_INTERNAL, C_WEB, C_STEM]),
  evaluate,
  design,
  recordLines,
};

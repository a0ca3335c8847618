// The AISC 360-16 basis (issue 14), ASD or LRFD, behind the same DesignBasisModule interface as
// basis/en1993.ts. Every check names its section and equation beside its code; "(mem.)" marks an
// equation or constant recalled from memory rather than read from the standard in hand. Equations
// confirmed against published worked examples of AISC 360-16 (see tests/optimizer/aisc360.test.ts):
// F1-1, F2-5, F2-6, F3-1 (as applied in the F2 example), F7-2, F9-2, F9-4, F9-14, F5-1 to F5-6,
// Table J2.4. The rest are marked (mem.).
//
// Units inside: N, mm, MPa. Demands and capacities are written out in the brief's units (kN·m,
// kN, mm), as under EN 1993. One evaluation serves the search (all = false) and the record
// (all = true, then design() reads the intermediates back), so the numbers a reviewer reads are
// those that decided the search.
//
// Checks, in precedence order (ties in governing go to the first):
//  class-4            an element or proportion outside this version (Table B4.1b, §F13.2)
//  bending-resistance Chapter F limit states other than LTB (yielding, FLB, WLB via Rpc/Rpg, TFY, tee stem)
//  ltb                Chapter F lateral-torsional buckling over Lb with Cb (when restraint is given)
//  shear-resistance   G2.1 / G3 / G4 with Cv = 1 ("shear-buckling" when Cv < 1)
//  weld               J2.4 fillet weld (0.60·FEXX on the throat), Table J2.4 minimum size
//  bearing            J10.2 web local yielding and J10.3 web crippling at an unstiffened end support
//  deflection and the brief's slenderness limits (shared)
import * as composite from "../composite";
import type { FamilyKernel } from "../family-kernel";
import * as fkm from "../family-kernel";
import type { SearchProblem } from "../search-schema";
import * as st from "../stability";
import type { CheckContext, DesignBasisModule, RecordLine, Scratch } from "./core";
import { finish, flangeShearFlow, plasticAxis, readPlateTerms, symmetricAboutMidDepth, weldSizeBuilt } from "./core";
import type { FlangeShearFlow, PlateTerms } from "./core";
import type { AiscDesign, AiscElement, AiscFlexure, AiscLimitState, MomentSign } from "../design-types";
import { fromSI } from "../units";

const { plateModulusAbout, K_AREA, K_CY, K_IY, K_IZ, K_MAXY } = composite;
const { C_BEARING, C_BEND, C_CLASS4, C_DEFL, C_INTERNAL, C_LTB, C_OUTSTAND, C_STEM, C_VB, C_VPL, C_WEB, C_WELD } = fkm;
const { stabilityKernel, ST_CW, ST_H0, ST_J } = st;

const PI2 = Math.PI * Math.PI;

/**
 * Resistance factors φ (LRFD) and safety factors Ω (ASD): AISC 360-16 §F1 (flexure 0.90 / 1.67),
 * §G1 and G2.1(a) (shear 0.90 / 1.67; rolled I webs with h/tw ≤ 2.24√(E/Fy) 1.00 / 1.50), Table
 * J2.5 (fillet weld shear 0.75 / 2.00), §J10.2 (web local yielding 1.00 / 1.50), §J10.3 (web
 * crippling 0.75 / 2.00).
 */
export const AISC_FACTORS = {
  flexure: { phi: 0.9, omega: 1.67 },
  shear: { phi: 0.9, omega: 1.67 },
  shearRolled: { phi: 1.0, omega: 1.5 },
  weld: { phi: 0.75, omega: 2.0 },
  yielding: { phi: 1.0, omega: 1.5 },
  crippling: { phi: 0.75, omega: 2.0 },
} as const;

export interface AiscContext {
  method: "ASD" | "LRFD";
  lrfd: boolean;
  grade?: string;
  Fy: number;
  Fu: number;
  E: number;
  G: number;
  FEXX: number;
  rolledGrade: string;
  rolledFy: number;
  restraint: boolean;
  /** unbraced length Lb, mm */
  Lb: number;
  Cb: number;
  stiffened: boolean;
  /** bearing length lb at an end support, mm */
  lb: number;
}

export function makeAiscContext(p: SearchProblem): AiscContext {
  const a = p.aisc!;
  const r = p.restraint;
  return {
    method: p.method ?? "LRFD",
    lrfd: p.method !== "ASD",
    grade: a.grade,
    Fy: a.Fy,
    Fu: a.Fu,
    E: a.E,
    G: a.G,
    FEXX: a.FEXX,
    rolledGrade: a.rolledGrade,
    rolledFy: a.rolledFy,
    restraint: r !== undefined,
    Lb: r ? r.length * 1000 : 0,
    Cb: r?.Cb ?? 1,
    stiffened: p.supports.stiffened,
    lb: p.supports.bearingLength ?? 0,
  };
}

/** The available strength: φ·Rn (LRFD, §B3.1) or Rn/Ω (ASD, §B3.2). */
export function available(e: { lrfd: boolean }, Rn: number, f: { phi: number; omega: number }): number {
  return e.lrfd ? f.phi * Rn : Rn / f.omega;
}

/**
 * The factor on the required moment in the bound Zx ≥ M·γ/Fy that search.ts uses: every Chapter F
 * nominal strength is at most Mp = Fy·Zx (proof in search.ts's header, (U1)), so M ≤ φ·Mn needs
 * Zx ≥ M/(φ·Fy) and M ≤ Mn/Ω needs Zx ≥ M·Ω/Fy.
 */
export function flexureGamma(e: { lrfd: boolean }): number {
  return e.lrfd ? 1 / AISC_FACTORS.flexure.phi : AISC_FACTORS.flexure.omega;
}

/**
 * Cb from the moment diagram, AISC 360-16 §F1, Eq. F1-1: Cb = 12.5·Mmax/(2.5·Mmax + 3·MA + 4·MB +
 * 3·MC), absolute values: Mmax the largest in the unbraced segment, MA, MB, MC at its quarter,
 * centre and three-quarter points.
 */
export function cbFromMoments(Mmax: number, MA: number, MB: number, MC: number): number {
  const m = Math.abs(Mmax);
  return (12.5 * m) / (2.5 * m + 3 * Math.abs(MA) + 4 * Math.abs(MB) + 3 * Math.abs(MC));
}

/** Table J2.4 (AISC 360-16): minimum fillet weld leg by the thinner part joined, mm (SI column). */
export function minFilletLeg(tThinner: number): number {
  return tThinner <= 6 ? 3 : tThinner <= 13 ? 5 : tThinner <= 19 ? 6 : 8;
}

/** Chapter F sections and zone codes. */
export const SECTIONS = ["F2", "F3", "F4", "F5", "F7", "F9", "F11"] as const;
export type ChapterFSection = (typeof SECTIONS)[number];
const S_F2 = 0,
  S_F3 = 1,
  S_F4 = 2,
  S_F5 = 3,
  S_F7 = 4,
  S_F9 = 5,
  S_F11 = 6;
/** LTB zone: Lb ≤ Lp (plastic: LTB does not apply), Lp < Lb ≤ Lr (inelastic), Lb > Lr (elastic). */
export const ZONES = ["plastic", "inelastic", "elastic"] as const;

const CLS = ["compact", "noncompact", "slender"] as const;
const cls = (lam: number, lp: number, lr: number) => (lam <= lp ? 0 : lam <= lr ? 1 : 2);

/** One element's Table B4.1b working: λ, λp, λr, its class (0 compact, 1 noncompact, 2 slender) and the table's case. */
export class ElementWork {
  lam = NaN;
  lp = NaN;
  lr = NaN;
  cls = 0;
  case = "";
  set(lam: number, lp: number, lr: number, tableCase: string): void {
    this.lam = lam;
    this.lp = lp;
    this.lr = lr;
    this.cls = cls(lam, lp, lr);
    this.case = tableCase;
  }
  clear(): void {
    this.lam = this.lp = this.lr = NaN;
    this.cls = 0;
    this.case = "";
  }
}

/** One moment sign's Chapter F working (allocation-free; read back by design()). */
export class FlexWork {
  on = false;
  sec = 0;
  /** compression flange; kc (welded I flanges, F3-2, F4-14, F5-9) */
  flange = new ElementWork();
  kc = NaN;
  /** web (or tee stem) */
  web = new ElementWork();
  /** the compression flange's class, read by search.ts's (U3) */
  get fCls(): number {
    return this.flange.cls;
  }
  Mp = NaN;
  My = NaN;
  Sxc = NaN;
  Sxt = NaN;
  Rpc = NaN;
  Rpt = NaN;
  Rpg = NaN;
  FL = NaN;
  /** nominal strengths of the limit states, N·mm; NaN where the limit state does not apply */
  yld = NaN;
  flb = NaN;
  wlb = NaN;
  tfy = NaN;
  stem = NaN;
  ltb = NaN;
  /** LTB working: rts or rt (mm), Lp, Lr (mm), zone (−1 not checked), Fcr (MPa) or Mcr (N·mm), B (F9) */
  r = NaN;
  Lp = NaN;
  Lr = NaN;
  /** F2, F3 (for the record): ry of Lp (F2-5), J·c/(Sx·h0) of Lr and Fcr (F2-6, F2-4), Mr = 0.7·Fy·Sx of F2-2 and F3-1 (N·mm); NaN elsewhere */
  ry = NaN;
  jc = NaN;
  Mr = NaN;
  zone = -1;
  Fcr = NaN;
  Mcr = NaN;
  B = NaN;
  /** the lesser of the local limit states, N·mm */
  MnLocal = NaN;
  /** outside this version: the ratio and its limit (class-4 check); 0 when none */
  outRatio = 0;
  outLimit = 1;
  outWhat = "";
  copy(o: FlexWork): void {
    // the elements are this FlexWork's own (allocation-free), so they are copied into, not shared
    const flange = this.flange,
      web = this.web;
    Object.assign(this, o);
    this.flange = Object.assign(flange, o.flange);
    this.web = Object.assign(web, o.web);
  }
}

/** The AISC intermediates of the last evaluation. */
export class AiscScratch implements PlateTerms, FlangeShearFlow {
  st = new Float64Array(st.ST_OUT);
  f = [new FlexWork(), new FlexWork()];
  d = 0;
  bt = 0;
  tft = 0;
  bb = 0;
  tfb = 0;
  tw = 0;
  nw = 0;
  /** clear distance between the flanges, mm */
  hw = 0;
  tMax = 0;
  Fy = 0;
  rolled = false;
  r = 0;
  Zx = 0;
  // shear
  shearOn = false;
  shearClause = "";
  Aw = 0;
  hv = 0;
  kv = 0;
  Cv = 1;
  Vn = 0;
  Va = 0;
  vRolledA = false;
  /** G2.1: the h/tw Cv1 is judged against, 2.24√(E/Fy) (G2.1(a)) or 1.10√(kv·E/Fy) (G2-3, G2-4); NaN elsewhere */
  htLimit = NaN;
  // weld
  weldOn = false;
  Qf = 0;
  q = 0;
  /** available strength of the weld per mm of leg, N/mm per mm: φ·Fnw·0.707 (LRFD) or Fnw·0.707/Ω (ASD) */
  perLeg = 0;
  wExact = 0;
  w = 0;
  wMin = 0;
  wMax = 0;
  // bearing
  bearOn = false;
  kDist = 0;
  Rn2 = 0;
  Rn3 = 0;
  Ra = 0;
  bearEq = "";
}

/** LTB zone and strength of the F2/F4/F7 pattern: Cb[Mmax − (Mmax − Mr)(Lb − Lp)/(Lr − Lp)] ≤ Mmax, elastic given. */
function inelastic(Cb: number, Mmax: number, Mr: number, Lb: number, Lp: number, Lr: number): number {
  const m = Cb * (Mmax - (Mmax - Mr) * ((Lb - Lp) / (Lr - Lp)));
  return m < Mmax ? m : Mmax;
}

/**
 * I-shaped members (F2–F5) and channels (F2, F3 by analogy) for one moment sign: compression flange
 * bc × tc, tension flange bt × tt, the elastic centroid ȳc above the compression flange's outer
 * face measured along the depth (distances from the compression fibre).
 */
function flexI(
  w: FlexWork,
  family: string,
  e: AiscContext,
  x: AiscScratch,
  Fy: number,
  bc: number,
  tc: number,
  bt: number,
  tt: number,
  /** distance from the compression fibre to the elastic and plastic neutral axes, mm */
  yc: number,
  ypc: number,
  A: number,
  Iz: number,
  Iy: number,
  J: number,
  Cw: number,
  h0: number,
): void {
  const E = e.E,
    re = Math.sqrt(E / Fy),
    d = x.d,
    tw = x.tw,
    rolled = x.rolled;
  // h: clear distance between flanges (welded); rolled shapes less the fillet at each flange (B4.1b(b))
  const h = rolled ? x.hw - 2 * x.r : x.hw;
  const Sxc = Iz / yc,
    Sxt = Iz / (d - yc);
  w.Sxc = Sxc;
  w.Sxt = Sxt;
  const Mp = Fy * x.Zx;
  w.Mp = Mp;
  const My = Fy * (Sxc < Sxt ? Sxc : Sxt);
  w.My = My;
  w.outRatio = 0;
  const doubly = family !== "mono-i";
  // Table B4.1b: kc = 4/√(h/tw), 0.35 ≤ kc ≤ 0.76 (note [a]); FL by F4-6a/b
  let kc = 4 / Math.sqrt(h / tw);
  kc = kc < 0.35 ? 0.35 : kc > 0.76 ? 0.76 : kc;
  w.kc = kc;
  const FL = Sxt / Sxc >= 0.7 ? 0.7 * Fy : Math.max((Fy * Sxt) / Sxc, 0.5 * Fy);
  w.FL = FL;
  // compression flange: I b = bf/2 (B4.1b cases 10, 11); channel b = the full flange width (case 10)
  const lamF = family === "channel" ? bc / tc : bc / (2 * tc);
  const lpf = 0.38 * re;
  // case 10 (rolled I, channels): λr = 1.0√(E/Fy); case 11 (built-up I): 0.95√(kc·E/FL)
  const lrf = rolled || family === "channel" ? 1.0 * re : 0.95 * Math.sqrt((kc * E) / FL);
  w.flange.set(lamF, lpf, lrf, rolled || family === "channel" ? "Table B4.1b case 10" : "Table B4.1b case 11");
  // web: hc = twice the distance from the elastic neutral axis to the compression flange's inside face,
  // hp the same from the plastic neutral axis (B4.1b(b)); doubly symmetric hc = hp = h
  const hc = doubly ? h : Math.max(0, 2 * (yc - tc));
  const hp = doubly ? h : Math.max(0, 2 * (ypc - tc));
  const lamW = hc / tw;
  const lrw = 5.7 * re;
  let lpw: number;
  if (doubly) lpw = 3.76 * re; // case 15
  else {
    // case 16: λp = (hc/hp)·√(E/Fy)/(0.54·Mp/My − 0.09)² ≤ λr
    const den = 0.54 * (Mp / My) - 0.09;
    lpw = hp > 0 ? ((hc / hp) * re) / (den * den) : lrw;
    if (lpw > lrw) lpw = lrw;
  }
  w.web.set(lamW, lpw, lrw, doubly ? "Table B4.1b case 15" : "Table B4.1b case 16");
  // §F13.2 (mem.): unstiffened webs h/tw ≤ 260
  if (h / tw > 260) {
    w.outRatio = h / tw;
    w.outLimit = 260;
    w.outWhat = "web h/tw over 260 without stiffeners (§F13.2, mem.)";
  }
  w.yld = w.flb = w.wlb = w.tfy = w.stem = w.ltb = NaN;
  w.Rpc = w.Rpt = w.Rpg = NaN;
  w.zone = -1;
  w.Lp = w.Lr = w.r = w.Fcr = w.Mcr = w.B = NaN;
  const Lb = e.Lb,
    Cb = e.Cb,
    ltbOn = e.restraint;
  if (family === "channel" && w.web.cls > 0) {
    // F2 covers channels with compact webs only; F4 and F5 are for I-shaped members
    if (lamW / lpw > w.outRatio / w.outLimit) {
      w.outRatio = lamW;
      w.outLimit = lpw;
      w.outWhat = "channel web not compact (Chapter F covers channels by F2 only)";
    }
  }
  if (doubly && w.web.cls === 0) {
    // F2 (compact flanges) or F3 (noncompact or slender flanges); channels take F3's FLB by analogy
    w.sec = w.flange.cls === 0 ? S_F2 : S_F3;
    w.yld = Mp; // F2-1
    const Mr = (w.Mr = 0.7 * Fy * Sxc);
    if (w.flange.cls === 1) w.flb = Mp - (Mp - Mr) * ((lamF - lpf) / (lrf - lpf)); // F3-1
    else if (w.flange.cls === 2) w.flb = (0.9 * E * kc * Sxc) / (lamF * lamF); // F3-2
    if (ltbOn) {
      // F2-5, F2-7, F2-8a/b, F2-6, F2-2, F2-3, F2-4
      const ry = Math.sqrt(Iy / A);
      const Lp = 1.76 * ry * re;
      const rts = Math.sqrt(Math.sqrt(Iy * Cw) / Sxc);
      const c = family === "channel" ? (h0 / 2) * Math.sqrt(Iy / Cw) : 1;
      const jc = (J * c) / (Sxc * h0);
      const k = (0.7 * Fy) / E;
      const Lr = 1.95 * rts * (E / (0.7 * Fy)) * Math.sqrt(jc + Math.sqrt(jc * jc + 6.76 * k * k));
      w.r = rts;
      w.Lp = Lp;
      w.Lr = Lr;
      w.ry = ry;
      w.jc = jc;
      if (Lb <= Lp) w.zone = 0;
      else if (Lb <= Lr) {
        w.zone = 1;
        w.ltb = inelastic(Cb, Mp, Mr, Lb, Lp, Lr);
      } else {
        w.zone = 2;
        const s = Lb / rts;
        w.Fcr = ((Cb * PI2 * E) / (s * s)) * Math.sqrt(1 + 0.078 * jc * s * s);
        const m = w.Fcr * Sxc;
        w.ltb = m < Mp ? m : Mp;
      }
    }
  } else if (w.web.cls <= 1) {
    // F4: compact or noncompact webs (doubly symmetric with noncompact web; singly symmetric)
    w.sec = S_F4;
    const Iyc = (tc * bc * bc * bc) / 12;
    const Myc = Fy * Sxc,
      Myt = Fy * Sxt;
    // F4-9a/b, F4-10: Rpc; F4-16a/b, F4-17: Rpt, with Mp = Fy·Zx ≤ 1.6·Fy·Sxc (Sxt for Rpt) (mem.)
    const MpC = Math.min(Mp, 1.6 * Myc),
      MpT = Math.min(Mp, 1.6 * Myt);
    const big = Iyc / Iy > 0.23;
    w.Rpc = rpOf(big, lamW, lpw, lrw, MpC, Myc);
    const RM = w.Rpc * Myc;
    w.yld = RM; // F4-1 (compression flange yielding)
    // F4.3 FLB: F4-13 (noncompact), F4-14 (slender)
    if (w.flange.cls === 1) w.flb = RM - (RM - FL * Sxc) * ((lamF - lpf) / (lrf - lpf));
    else if (w.flange.cls === 2) w.flb = (0.9 * E * kc * Sxc) / (lamF * lamF);
    // F4.4 tension flange yielding when Sxt < Sxc: F4-15
    if (Sxt < Sxc) {
      w.Rpt = rpOf(big, lamW, lpw, lrw, MpT, Myt);
      w.tfy = w.Rpt * Myt;
    }
    if (ltbOn) {
      const rt = rtOf(bc, tc, hc, tw, h, h0, d);
      const Lp = 1.1 * rt * re; // F4-7
      const Jeff = big ? J : 0; // F4-5 user note: J = 0 when Iyc/Iy ≤ 0.23
      const jr = Jeff / (Sxc * h0);
      const k = FL / E;
      const Lr = 1.95 * rt * (E / FL) * Math.sqrt(jr + Math.sqrt(jr * jr + 6.76 * k * k)); // F4-8
      w.r = rt;
      w.Lp = Lp;
      w.Lr = Lr;
      if (Lb <= Lp) w.zone = 0;
      else if (Lb <= Lr) {
        w.zone = 1;
        w.ltb = inelastic(Cb, RM, FL * Sxc, Lb, Lp, Lr); // F4-2
      } else {
        w.zone = 2;
        const s = Lb / rt;
        w.Fcr = ((Cb * PI2 * E) / (s * s)) * Math.sqrt(1 + 0.078 * jr * s * s); // F4-5
        const m = w.Fcr * Sxc; // F4-3
        w.ltb = m < RM ? m : RM;
      }
    }
  } else {
    // F5: slender webs
    w.sec = S_F5;
    let aw = (hc * tw) / (bc * tc); // F4-12
    if (aw > 10) aw = 10;
    let Rpg = 1 - (aw / (1200 + 300 * aw)) * (hc / tw - 5.7 * re); // F5-6
    if (Rpg > 1) Rpg = 1;
    w.Rpg = Rpg;
    w.yld = Rpg * Fy * Sxc; // F5-1
    if (w.flange.cls === 1) w.flb = Rpg * (Fy - 0.3 * Fy * ((lamF - lpf) / (lrf - lpf))) * Sxc; // F5-7, F5-8
    else if (w.flange.cls === 2) w.flb = Rpg * ((0.9 * E * kc) / (lamF * lamF)) * Sxc; // F5-7, F5-9
    if (Sxt < Sxc) w.tfy = Fy * Sxt; // F5-10
    if (ltbOn) {
      const rt = rtOf(bc, tc, hc, tw, h, h0, d);
      const Lp = 1.1 * rt * re; // F4-7
      const Lr = Math.PI * rt * Math.sqrt(E / (0.7 * Fy)); // F5-5
      w.r = rt;
      w.Lp = Lp;
      w.Lr = Lr;
      if (Lb <= Lp) w.zone = 0;
      else {
        let Fcr: number;
        if (Lb <= Lr) {
          w.zone = 1;
          Fcr = Cb * (Fy - 0.3 * Fy * ((Lb - Lp) / (Lr - Lp))); // F5-3
        } else {
          w.zone = 2;
          const s = Lb / rt;
          Fcr = (Cb * PI2 * E) / (s * s); // F5-4
        }
        if (Fcr > Fy) Fcr = Fy;
        w.Fcr = Fcr;
        w.ltb = Rpg * Fcr * Sxc; // F5-2
      }
    }
  }
}

/** F4-9a/b, F4-10 (Rpc) and F4-16a/b, F4-17 (Rpt): 1 when Iyc/Iy ≤ 0.23; else Mp/My, falling linearly to 1 at λrw. */
function rpOf(big: boolean, lam: number, lpw: number, lrw: number, mp: number, my: number): number {
  if (!big) return 1;
  if (lam <= lpw) return mp / my;
  const r = mp / my - (mp / my - 1) * ((lam - lpw) / (lrw - lpw));
  return r < mp / my ? r : mp / my;
}

/** F4-11: rt = bfc/√(12·(h0/d + aw·h²/(6·h0·d))), aw = hc·tw/(bfc·tfc) (F4-12). */
export function rtOf(bc: number, tc: number, hc: number, tw: number, h: number, h0: number, d: number): number {
  const aw = (hc * tw) / (bc * tc);
  return bc / Math.sqrt(12 * (h0 / d + (aw * h * h) / (6 * h0 * d)));
}

/**
 * search.ts (U2): an upper bound on the lateral-torsional buckling strength Mn of every welded
 * doubly symmetric I (family i) of one row: d, tf, tw fixed, b between lo[6] and hi[6], with
 * lo/hi = [A, Iz, Iy, J, Cw, Zx, b] at the two ends. Each of these grows with b, as do Sx = 2Iz/d,
 * √(Iy·Cw), rt (F4-11: b² over a denominator falling in b) and Rpg (F5-6: aw falls in b); h/tw, h0
 * and so the web's class and Chapter F section are fixed along the row. Returns Infinity when
 * some point may have Lb ≤ Lp (no LTB check there). Otherwise every point is inelastic or elastic
 * and its Mn is at most the larger of:
 *  inelastic (possible when Lb ≤ Lr's upper bound): Cb·[Mmax·(1 − r) + Mr·r] falls as r rises
 *    (Mmax ≥ Mr) and rises with Mmax, Mr; r = (Lb − Lp)/(Lr − Lp) falls as Lp or Lr rises while
 *    Lp < Lb ≤ Lr (∂r/∂Lp = (Lb − Lr)/(Lr − Lp)², ∂r/∂Lr = −(Lb − Lp)/(Lr − Lp)²), so r ≥ r at
 *    (Lp, Lr) upper bounds, and Mmax, Mr at theirs;
 *  elastic (possible when Lb > Lr's lower bound): F2-3/F2-4 is Cb·π²E/Lb²·√(P² + 0.078·J·Lb²·P/h0),
 *    P = √(Iy·Cw) (rts² = P/Sx, c = 1); F4-3/F4-5 the same with P = Sx·rt²; F5-4 Cb·π²E·rt²/Lb²
 *    (≤ Fy) times Rpg·Sx: each rising in P, J, rt, Rpg, Sx;
 * and at most the zone's cap (Mp, Rpc·Myc, Rpg·Fy·Sx) at its upper bound. Lr rises with rts (rt)
 * and J/(Sx·h0) (F2-6, F4-8), F5-5 with rt: interval ends give its bounds.
 */
/**
 * search.ts (U4): an upper bound on the "bending-resistance" strength (every Chapter F limit state
 * but LTB) of every welded i of one row, with lo/hi as ltbUpperI's. The web's section is fixed
 * along the row. Yielding: F2-1 Mp = Fy·Zx; F4-1 Rpc·Myc ≤ Mp·(1 − t) + Myc·t (t fixed by h/tw,
 * F4-9b, and ≥ Myc for F4-10's Rpc = 1); F5-1 Rpg·Fy·Sx: each rises with b, so at hi. Flange local
 * buckling, by the classes λ = b/(2tf) (rising in b, against fixed λp, λr) takes in the range:
 * compact none; noncompact F3-1 / F4-13 / F5-8: Mmax − (Mmax − Mr)·(λ − λp)/(λr − λp) ≤ Mmax at hi
 * − min over the ends of (Mmax − Mr) (affine in b, or for F4 a least of affine terms, concave: its
 * least is at an end) × (λ at lo, not below λp, − λp)/(λr − λp); slender F3-2 / F4-14 / F5-9
 * 0.9·E·kc·Sx/λ² ≤ that with Sx at hi and λ = max(λ at lo, λr). The least of the yielding and
 * FLB bounds bounds the least of the limit states.
 */
/** Rpc·Myc of F4-9b for a doubly symmetric I: min(Fy·Zx, 1.6·My)·(1 − t) + My·t (≥ My, as Zx ≥ Sx). */
function rpcMyc(Fy: number, t: number, Zx: number, Sx: number): number {
  const my = Fy * Sx,
    mp = Math.min(Fy * Zx, 1.6 * my);
  return mp * (1 - t) + my * t;
}

export function bendUpperI(e: AiscContext, d: number, tf: number, tw: number, lo: Float64Array, hi: Float64Array): number {
  const E = e.E,
    Fy = e.Fy,
    re = Math.sqrt(E / Fy);
  const h = d - 2 * tf;
  const lamW = h / tw;
  const SxLo = (2 * lo[1]) / d,
    SxHi = (2 * hi[1]) / d;
  let kc = 4 / Math.sqrt(h / tw);
  kc = kc < 0.35 ? 0.35 : kc > 0.76 ? 0.76 : kc;
  const FL = 0.7 * Fy;
  const lp = 0.38 * re,
    lr = 0.95 * Math.sqrt((kc * E) / FL);
  const lamLo = lo[6] / (2 * tf),
    lamHi = hi[6] / (2 * tf);
  // yielding (MaxHi) and the FLB expression's Mmax − Mr at each end
  let yHi: number, dLo: number, dHi: number, scale: number;
  let f5 = false;
  if (lamW <= 3.76 * re) {
    yHi = Fy * hi[5];
    dLo = Fy * lo[5] - 0.7 * Fy * SxLo;
    dHi = Fy * hi[5] - 0.7 * Fy * SxHi;
    scale = 1;
  } else if (lamW <= 5.7 * re) {
    const t = (lamW - 3.76 * re) / (5.7 * re - 3.76 * re);
    yHi = Math.max(Fy * hi[5] * (1 - t) + Fy * SxHi * t, Fy * SxHi);
    dLo = rpcMyc(Fy, t, lo[5], SxLo) - FL * SxLo;
    dHi = rpcMyc(Fy, t, hi[5], SxHi) - FL * SxHi;
    scale = 1;
  } else {
    f5 = true;
    let aw = (h * tw) / (hi[6] * tf);
    if (aw > 10) aw = 10;
    let Rpg = 1 - (aw / (1200 + 300 * aw)) * (h / tw - 5.7 * re);
    if (Rpg > 1) Rpg = 1;
    scale = Rpg * SxHi;
    yHi = scale * Fy;
    dLo = dHi = 0;
  }
  if (lamHi <= lp) return yHi;
  let flb = -Infinity;
  if (lamLo <= lr) {
    const lam = lamLo > lp ? lamLo : lp;
    const frac = (lam - lp) / (lr - lp);
    flb = f5 ? scale * (Fy - 0.3 * Fy * frac) : yHi - Math.min(dLo, dHi) * frac;
  }
  if (lamHi > lr) {
    const lam = lamLo > lr ? lamLo : lr;
    const sl = f5 ? scale * ((0.9 * E * kc) / (lam * lam)) : (0.9 * E * kc * SxHi) / (lam * lam);
    if (sl > flb) flb = sl;
  }
  if (lamLo <= lp) return yHi; // some point of the range is compact: no FLB there
  return flb < yHi ? flb : yHi;
}

/** F2-3/F2-4 (F4-3/F4-5) as Cb·π²E/Lb²·√(P² + 0.078·J·Lb²·P/h0), rising in P and J. */
function elasticUb(E: number, Lb: number, Cb: number, h0: number, P: number, J: number): number {
  return ((Cb * PI2 * E) / (Lb * Lb)) * Math.sqrt(P * P + (0.078 * J * Lb * Lb * P) / h0);
}

/** F2-6 / F4-8 with r = rts or rt, j = J·c/(Sx·h0), FL = 0.7·Fy or F4-6's. */
function lrOf(E: number, r: number, j: number, FL: number): number {
  const k = FL / E;
  return 1.95 * r * (E / FL) * Math.sqrt(j + Math.sqrt(j * j + 6.76 * k * k));
}

/** The larger of the zones' bounds that some point of the range may be in, at most Mmax (ltbUpperI). */
function combine(Lb: number, Cb: number, Mmax: number, Mr: number, LpHi: number, LrLo: number, LrHi: number, el: number): number {
  if (Lb <= LpHi) return Infinity;
  let ub = -Infinity;
  if (Lb <= LrHi) {
    const r = (Lb - LpHi) / (LrHi - LpHi);
    ub = Cb * (Mmax * (1 - r) + Mr * r);
  }
  if (Lb > LrLo && el > ub) ub = el;
  return ub < Mmax ? ub : Mmax;
}

export function ltbUpperI(e: AiscContext, d: number, tf: number, tw: number, lo: Float64Array, hi: Float64Array): number {
  const E = e.E,
    Fy = e.Fy,
    re = Math.sqrt(E / Fy),
    Lb = e.Lb,
    Cb = e.Cb;
  const h = d - 2 * tf,
    h0 = d - tf;
  const lamW = h / tw;
  const SxLo = (2 * lo[1]) / d,
    SxHi = (2 * hi[1]) / d;
  const JLo = lo[3],
    JHi = hi[3];
  if (lamW <= 3.76 * re) {
    // F2 (and F3: the same LTB)
    const MpHi = Fy * hi[5];
    const LpHi = 1.76 * Math.sqrt(hi[2] / lo[0]) * re;
    const PLo = Math.sqrt(lo[2] * lo[4]),
      PHi = Math.sqrt(hi[2] * hi[4]);
    const rtsLo = Math.sqrt(PLo / SxHi),
      rtsHi = Math.sqrt(PHi / SxLo);
    const LrLo = lrOf(E, rtsLo, JLo / (SxHi * h0), 0.7 * Fy),
      LrHi = lrOf(E, rtsHi, JHi / (SxLo * h0), 0.7 * Fy);
    return combine(Lb, Cb, MpHi, 0.7 * Fy * SxHi, LpHi, LrLo, LrHi, elasticUb(E, Lb, Cb, h0, PHi, JHi));
  }
  const rtLo = rtOf(lo[6], tf, h, tw, h, h0, d),
    rtHi = rtOf(hi[6], tf, h, tw, h, h0, d);
  const LpHi = 1.1 * rtHi * re;
  if (lamW <= 5.7 * re) {
    // F4: Rpc·Myc = Mp(1 − t) + Myc·t with t fixed by the web (F4-9b), rising in Mp and Myc
    const lpw = 3.76 * re,
      lrw = 5.7 * re;
    const t = (lamW - lpw) / (lrw - lpw);
    const MycHi = Fy * SxHi;
    const MpHi = Math.min(Fy * hi[5], 1.6 * MycHi);
    const RM = Math.max(MpHi * (1 - t) + MycHi * t, MycHi);
    const FL = 0.7 * Fy;
    const LrLo = lrOf(E, rtLo, JLo / (SxHi * h0), FL),
      LrHi = lrOf(E, rtHi, JHi / (SxLo * h0), FL);
    return combine(Lb, Cb, RM, FL * SxHi, LpHi, LrLo, LrHi, elasticUb(E, Lb, Cb, h0, SxHi * rtHi * rtHi, JHi));
  }
  // F5: Mn = Rpg·Fcr·Sx with Fcr ≤ Fy
  let aw = (h * tw) / (hi[6] * tf);
  if (aw > 10) aw = 10;
  let Rpg = 1 - (aw / (1200 + 300 * aw)) * (h / tw - 5.7 * re);
  if (Rpg > 1) Rpg = 1;
  const LrLo = Math.PI * rtLo * Math.sqrt(E / (0.7 * Fy)),
    LrHi = Math.PI * rtHi * Math.sqrt(E / (0.7 * Fy));
  if (Lb <= LpHi) return Infinity;
  let F = -Infinity;
  if (Lb <= LrHi) F = Cb * (Fy - 0.3 * Fy * ((Lb - LpHi) / (LrHi - LpHi)));
  if (Lb > LrLo) {
    const el = (Cb * PI2 * E * rtHi * rtHi) / (Lb * Lb);
    if (el > F) F = el;
  }
  if (F > Fy) F = Fy;
  return Rpg * F * SxHi;
}

function setLocal(w: FlexWork): void {
  let m = w.yld;
  if (w.flb < m) m = w.flb;
  if (w.wlb < m) m = w.wlb;
  if (w.tfy < m) m = w.tfy;
  if (w.stem < m) m = w.stem;
  w.MnLocal = m;
}

function evaluate(fk: FamilyKernel, v: Float64Array, ctx: CheckContext, s: Scratch, all: boolean, ok: boolean): boolean {
  const e = ctx.us!;
  const x = s.us ?? (s.us = new AiscScratch());
  const dem = s.demand,
    cap = s.capacity,
    k = s.k,
    p = s.plates;
  const family = fk.family;
  readPlateTerms(family, v, x);
  const rolled = s.rolled;
  x.rolled = rolled !== null;
  x.r = rolled !== null ? rolled.r : 0;
  const Fy = rolled !== null ? e.rolledFy : e.Fy;
  x.Fy = Fy;
  const E = e.E;
  const re = Math.sqrt(E / Fy);
  const Ms = ctx.Ms,
    Mh = ctx.Mh;
  const A = k[K_AREA],
    cy = k[K_CY],
    Iz = k[K_IZ],
    Iy = k[K_IY],
    d = k[K_MAXY];
  const symmetric = symmetricAboutMidDepth(family);
  const yp = plasticAxis(family, p, fk.nPlates, A, cy, d);
  x.Zx = rolled !== null ? rolled.Zz : plateModulusAbout(p, fk.nPlates, yp);
  stabilityKernel(family, v, x.st);
  const J = x.st[ST_J],
    Cw = x.st[ST_CW],
    h0 = x.st[ST_H0];
  const f0 = x.f[0],
    f1 = x.f[1];
  f0.on = Ms > 0;
  f1.on = Mh > 0;
  const Lb = e.Lb,
    Cb = e.Cb;

  for (let sgn = 0; sgn < 2; sgn++) {
    const w = x.f[sgn];
    if (!w.on) continue;
    if (symmetric && sgn === 1 && f0.on) {
      // symmetric about the horizontal axis: hogging works out exactly as sagging
      w.copy(f0);
      w.on = true;
      break;
    }
    w.outRatio = 0;
    w.outLimit = 1;
    w.outWhat = "";
    w.ry = w.jc = w.Mr = NaN;
    if (family === "i" || family === "channel" || family === "mono-i") {
      // sagging compresses the top flange
      const top = sgn === 0;
      const bc = top ? x.bt : x.bb,
        tc = top ? x.tft : x.tfb,
        bt = top ? x.bb : x.bt,
        tt = top ? x.tfb : x.tft;
      const yc = top ? d - cy : cy,
        ypc = top ? d - yp : yp;
      flexI(w, family, e, x, Fy, bc, tc, bt, tt, yc, ypc, A, Iz, Iy, J, Cw, h0);
    } else if (family === "box") flexBox(w, e, x, Fy, re, A, Iz, Iy, J, cy, d, p, fk.nPlates);
    else if (family === "tee") flexTee(w, e, x, Fy, re, sgn === 0, A, Iz, Iy, J, cy, d);
    else flexBar(w, e, x, Fy, Iz);
    setLocal(w);
  }

  // class-4: an element or proportion outside this version (not checked further)
  let outR = 0,
    outL = 1;
  for (let sgn = 0; sgn < 2; sgn++) {
    const w = x.f[sgn];
    if (w.on && w.outRatio > 0 && w.outRatio / w.outLimit > outR / outL) {
      outR = w.outRatio;
      outL = w.outLimit;
    }
  }
  x.shearOn = x.weldOn = x.bearOn = false;
  if (outR > 0) {
    dem.fill(NaN);
    dem[C_CLASS4] = outR;
    cap[C_CLASS4] = outL;
    return finish(s, false, ctx);
  }

  // Chapter F: bending-resistance (every limit state but LTB) and ltb, the worse moment sign of each
  const fx = AISC_FACTORS.flexure;
  let rB = -Infinity,
    dB = 0,
    cB = 0,
    rL = -Infinity,
    dL = NaN,
    cL = 0;
  for (let sgn = 0; sgn < 2; sgn++) {
    const w = x.f[sgn];
    if (!w.on) continue;
    const M = sgn === 0 ? Ms : Mh;
    const ca = available(e, w.MnLocal, fx);
    if (M / ca > rB) {
      rB = M / ca;
      dB = M;
      cB = ca;
    }
    if (w.ltb === w.ltb) {
      const la = available(e, w.ltb, fx);
      if (M / la > rL) {
        rL = M / la;
        dL = M;
        cL = la;
      }
    }
  }
  dem[C_BEND] = dB * 1e-6;
  cap[C_BEND] = cB * 1e-6;
  if (dB > cB) {
    ok = false;
    if (!all) return finish(s, false, ctx);
  }
  if (dL === dL) {
    dem[C_LTB] = dL * 1e-6;
    cap[C_LTB] = cL * 1e-6;
    if (dL > cL) {
      ok = false;
      if (!all) return finish(s, false, ctx);
    }
  }

  // Shear: G2.1 (I, mono-I, channel), G3 (tee), G4 (box); the bar by G2.1's expression on b·d
  const V = ctx.V;
  if (V > 0) {
    x.shearOn = true;
    let Vn: number, f: { phi: number; omega: number };
    x.vRolledA = false;
    x.htLimit = NaN;
    if (family === "tee") {
      // G3 (mem.): Vn = 0.6·Fy·b·t·Cv2 (G3-1), b = d, t = tw, kv = 1.2, Cv2 by G2.2 with h/tw = d/tw
      x.shearClause = "G3";
      x.hv = d;
      x.Aw = d * x.tw;
      x.kv = 1.2;
      x.Cv = cv2(d / x.tw, x.kv, E, Fy);
      f = AISC_FACTORS.shear;
    } else if (family === "box") {
      // G4 (mem.): Vn = 0.6·Fy·Aw·Cv2 (G4-1), Aw = 2·h·t, kv = 5, Cv2 by G2.2
      x.shearClause = "G4";
      x.hv = x.hw;
      x.Aw = 2 * x.hw * x.tw;
      x.kv = 5;
      x.Cv = cv2(x.hw / x.tw, x.kv, E, Fy);
      f = AISC_FACTORS.shear;
    } else if (family === "rectangle") {
      // no Chapter G section for solid bars: G2-1's 0.6·Fy·Aw with Aw = b·d and Cv = 1 (a stated choice)
      x.shearClause = "bar";
      x.hv = d;
      x.Aw = x.bt * d;
      x.kv = NaN;
      x.Cv = 1;
      f = AISC_FACTORS.shear;
    } else {
      // G2.1: Vn = 0.6·Fy·Aw·Cv1 (G2-1), Aw = d·tw; kv = 5.34 (no transverse stiffeners, G2-5 mem.)
      x.shearClause = "G2.1";
      const h = rolled !== null ? x.hw - 2 * x.r : x.hw;
      x.hv = h;
      x.Aw = d * x.tw;
      x.kv = 5.34;
      const ht = h / x.tw;
      if (rolled !== null && family === "i" && ht <= 2.24 * re) {
        // G2.1(a): rolled I webs with h/tw ≤ 2.24√(E/Fy): Cv1 = 1.0, φv = 1.00, Ωv = 1.50
        x.vRolledA = true;
        x.htLimit = 2.24 * re;
        x.Cv = 1;
        f = AISC_FACTORS.shearRolled;
      } else {
        // G2.1(b): h/tw ≤ 1.10√(kv·E/Fy): Cv1 = 1.0 (G2-3); else Cv1 = 1.10√(kv·E/Fy)/(h/tw) (G2-4)
        const lim = (x.htLimit = 1.1 * Math.sqrt((x.kv * E) / Fy));
        x.Cv = ht <= lim ? 1 : lim / ht;
        f = AISC_FACTORS.shear;
      }
    }
    Vn = 0.6 * Fy * x.Aw * x.Cv;
    x.Vn = Vn;
    x.Va = available(e, Vn, f);
    const c = x.Cv < 1 ? C_VB : C_VPL;
    dem[c] = V * 1e-3;
    cap[c] = x.Va * 1e-3;
    if (V > x.Va) {
      ok = false;
      if (!all) return finish(s, false, ctx);
    }
  }

  // J2: flange-to-web fillet welds, two per junction (box: one per web per flange). Longitudinal
  // shear q = V·Qf/Iz (Qf of the flange with the larger first moment); each weld's available
  // strength per mm is φ·0.60·FEXX·0.707·w (LRFD) or 0.60·FEXX·0.707·w/Ω (ASD) (J2-3, J2-4,
  // Table J2.5: Fnw = 0.60·FEXX; throat 0.707·w of an equal-leg fillet), so the leg needed is
  // w = q/(2·that per mm of leg); rounded up to a whole mm and at least Table J2.4's minimum for the
  // thinner part joined. It fails when larger than the thinner part joined (a stated choice).
  if (family !== "rectangle" && rolled === null) {
    x.weldOn = true;
    const top = flangeShearFlow(family, x, V, cy, Iz, x);
    const perLeg = (x.perLeg = available(e, fnw(e.FEXX) * 0.707, AISC_FACTORS.weld));
    x.wExact = x.q / (2 * perLeg);
    const tf = top ? x.tft : x.tfb;
    const thin = tf < x.tw ? tf : x.tw;
    x.wMin = minFilletLeg(thin);
    x.w = weldSizeBuilt(x.wExact, x.wMin);
    x.wMax = thin;
    dem[C_WELD] = x.w;
    cap[C_WELD] = x.wMax;
    if (x.w > x.wMax) {
      ok = false;
      if (!all) return finish(s, false, ctx);
    }
  }

  // J10.2 and J10.3 at an unstiffened end support (reaction = the design shear, bearing length lb,
  // the loaded flange the bottom one), per web, summed over the webs (box: two):
  //   J10.2 (within d of the end, J10-3): Rn = Fy·tw·(2.5·k + lb), k = tf (welded: no fillet;
  //   the weld leg is left out, conservative) or tf + r (rolled);
  //   J10.3 (within d/2 of the end): lb/d ≤ 0.2: Rn = 0.40·tw²·[1 + 3(lb/d)(tw/tf)^1.5]·√(E·Fy·tf/tw)·Qf (J10-5a);
  //   lb/d > 0.2: Rn = 0.40·tw²·[1 + (4lb/d − 0.2)(tw/tf)^1.5]·√(E·Fy·tf/tw)·Qf (J10-5b); Qf = 1.0.
  // Tee and bar: no web between flanges; not covered (the record says so).
  if (!e.stiffened && V > 0 && x.nw > 0) {
    x.bearOn = true;
    const tw = x.tw,
      tf = x.tfb,
      lb = e.lb;
    x.kDist = tf + x.r;
    x.Rn2 = x.nw * Fy * tw * (2.5 * x.kDist + lb);
    const rr = lb / d;
    const g = Math.pow(tw / tf, 1.5);
    x.bearEq = rr <= 0.2 ? "J10-5a" : "J10-5b";
    x.Rn3 = x.nw * 0.4 * tw * tw * (1 + (rr <= 0.2 ? 3 * rr : 4 * rr - 0.2) * g) * Math.sqrt((E * Fy * tf) / tw);
    const a2 = available(e, x.Rn2, AISC_FACTORS.yielding),
      a3 = available(e, x.Rn3, AISC_FACTORS.crippling);
    x.Ra = a2 < a3 ? a2 : a3;
    dem[C_BEARING] = V * 1e-3;
    cap[C_BEARING] = x.Ra * 1e-3;
    if (V > x.Ra) {
      ok = false;
      if (!all) return finish(s, false, ctx);
    }
  }

  // Deflection (service load): every family here is symmetric about the vertical axis
  if (ctx.hasDeflection) {
    s.deflI = Iz;
    dem[C_DEFL] = ctx.deflNumerator / Iz;
    cap[C_DEFL] = ctx.deflLimit;
    if (dem[C_DEFL] > ctx.deflLimit) ok = false;
  }
  void Lb;
  void Cb;
  return finish(s, ok, ctx, fk, v);
}

/** G2.2 (mem.): Cv2 = 1 (G2-9), 1.10√(kv·E/Fy)/(h/tw) (G2-10), 1.51·kv·E/((h/tw)²·Fy) (G2-11). */
export function cv2(ht: number, kv: number, E: number, Fy: number): number {
  const r = Math.sqrt((kv * E) / Fy);
  if (ht <= 1.1 * r) return 1;
  if (ht <= 1.37 * r) return (1.1 * r) / ht;
  return (1.51 * kv * E) / (ht * ht * Fy);
}

/** F7: box sections (doubly symmetric), flange b = clear width between the webs, web h = clear depth. */
function flexBox(w: FlexWork, e: AiscContext, x: AiscScratch, Fy: number, re: number, A: number, Iz: number, Iy: number, J: number, cy: number, d: number, p: Float64Array, n: number): void {
  const E = e.E;
  const S = Iz / Math.max(d - cy, cy);
  const Mp = Fy * x.Zx;
  w.sec = S_F7;
  w.Mp = Mp;
  w.My = Fy * S;
  w.Sxc = w.Sxt = S;
  w.kc = w.Rpc = w.Rpt = w.Rpg = w.FL = NaN;
  w.yld = Mp; // F7-1
  w.flb = w.wlb = w.tfy = w.stem = w.ltb = NaN;
  w.zone = -1;
  w.Lp = w.Lr = w.r = w.Fcr = w.Mcr = w.B = NaN;
  const b = x.bt - 2 * x.tw,
    tf = x.tft;
  // Table B4.1b case 21 (box flanges; mem.): λp = 1.12√(E/Fy), λr = 1.49√(E/Fy)
  const lamF = b / tf;
  w.flange.set(lamF, 1.12 * re, 1.49 * re, "Table B4.1b case 21 (mem.)");
  // case 19 (webs of box sections): λp = 2.42√(E/Fy), λr = 5.70√(E/Fy)
  const lamW = x.hw / x.tw;
  w.web.set(lamW, 2.42 * re, 5.7 * re, "Table B4.1b case 19");
  if (w.flange.cls === 1) {
    const m = Mp - (Mp - Fy * S) * (3.57 * lamF * Math.sqrt(Fy / E) - 4.0); // F7-2
    w.flb = m < Mp ? m : Mp;
  } else if (w.flange.cls === 2) {
    // F7-3: Mn = Fy·Se, Se with the compression flange's effective width be = 1.92·tf·√(E/Fy)·[1 −
    // 0.34/(b/tf)·√(E/Fy)] ≤ b (F7-5, box sections; mem.): the clear part reduced to be, the
    // section's least elastic modulus after the loss
    let be = 1.92 * tf * re * (1 - (0.34 / lamF) * re);
    if (be > b) be = b;
    const dA = (b - be) * tf;
    const yf = d - tf / 2;
    const A2 = A - dA;
    const c2 = (A * cy - dA * yf) / A2;
    const I2 = Iz + A * (cy - c2) * (cy - c2) - (dA * tf * tf) / 12 - dA * (yf - c2) * (yf - c2);
    const Se = I2 / Math.max(d - c2, c2);
    w.flb = Fy * Se;
  }
  if (w.web.cls === 1) {
    const m = Mp - (Mp - Fy * S) * (0.305 * lamW * Math.sqrt(Fy / E) - 0.738); // F7-6
    w.wlb = m < Mp ? m : Mp;
  } else if (w.web.cls === 2) {
    w.outRatio = lamW;
    w.outLimit = w.web.lr;
    w.outWhat = "box web slender (F7.3(b) is outside this version)";
  }
  if (e.restraint) {
    // F7.4 (mem.): Lp = 0.13·E·ry·√(J·A)/Mp (F7-12), Lr = 2·E·ry·√(J·A)/(0.7·Fy·Sx) (F7-13);
    // Lp < Lb ≤ Lr: F7-10; Lb > Lr: Mn = 2·E·Cb·√(J·A)/(Lb/ry) ≤ Mp (F7-11)
    const ry = Math.sqrt(Iy / A);
    const rJA = Math.sqrt(J * A);
    w.r = ry;
    w.Lp = (0.13 * E * ry * rJA) / Mp;
    w.Lr = (2 * E * ry * rJA) / (0.7 * Fy * S);
    const Lb = e.Lb;
    if (Lb <= w.Lp) w.zone = 0;
    else if (Lb <= w.Lr) {
      w.zone = 1;
      w.ltb = inelastic(e.Cb, Mp, 0.7 * Fy * S, Lb, w.Lp, w.Lr);
    } else {
      w.zone = 2;
      const m = (2 * E * e.Cb * rJA) / (Lb / ry);
      w.ltb = m < Mp ? m : Mp;
    }
  }
  void p;
  void n;
}

/** F9: tees, flange on top; sagging puts the stem in tension, hogging in compression. */
function flexTee(w: FlexWork, e: AiscContext, x: AiscScratch, Fy: number, re: number, stemTension: boolean, A: number, Iz: number, Iy: number, J: number, cy: number, d: number): void {
  const E = e.E;
  const Stip = Iz / cy; // to the stem's tip (the farther fibre)
  const Sfl = Iz / (d - cy); // to the flange's outer face
  const Sx = Stip < Sfl ? Stip : Sfl;
  const My = Fy * Sx; // F9-3
  w.sec = S_F9;
  w.My = My;
  w.Sxc = stemTension ? Sfl : Stip;
  w.Sxt = stemTension ? Stip : Sfl;
  w.kc = w.Rpc = w.Rpt = w.Rpg = w.FL = NaN;
  w.flb = w.wlb = w.tfy = w.stem = w.ltb = NaN;
  w.zone = -1;
  w.Lp = w.Lr = w.r = w.Fcr = w.Mcr = w.B = NaN;
  // flange: Table B4.1b case 10, λ = bf/2tf; stem: case 14, λ = d/tw (λp 0.84, λr 1.52 √(E/Fy))
  const lamF = x.bt / (2 * x.tft);
  w.flange.set(lamF, 0.38 * re, 1.0 * re, "Table B4.1b case 10");
  const lamS = d / x.tw;
  w.web.set(lamS, 0.84 * re, 1.52 * re, "Table B4.1b case 14");
  // F9.1 yielding: stem in tension Mp = Fy·Zx ≤ 1.6·My (F9-2); stem in compression Mp = My (F9-4)
  const Mp = stemTension ? Math.min(Fy * x.Zx, 1.6 * My) : My;
  w.Mp = Mp;
  w.yld = Mp;
  if (stemTension) {
    // F9.3 FLB (flange in compression): F9-14 (noncompact, ≤ 1.6·My), F9-15 (slender)
    if (w.flange.cls === 1) w.flb = Math.min(Mp - (Mp - 0.7 * Fy * w.Sxc) * ((lamF - w.flange.lp) / (w.flange.lr - w.flange.lp)), 1.6 * My);
    else if (w.flange.cls === 2) w.flb = (0.7 * E * w.Sxc) / (lamF * lamF);
  } else {
    // F9.4 local buckling of the stem in compression (mem.): Mn = Fcr·Sx (F9-16) with Sx to the stem
    // tip; Fcr = Fy (F9-17), (1.43 − 0.515(d/tw)√(Fy/E))·Fy (F9-18), 1.52·E/(d/tw)² (F9-19)
    const Fcr = w.web.cls === 0 ? Fy : w.web.cls === 1 ? (1.43 - 0.515 * lamS * Math.sqrt(Fy / E)) * Fy : (1.52 * E) / (lamS * lamS);
    w.stem = Fcr * Stip;
  }
  if (e.restraint) {
    // F9.2 LTB (mem.): Mcr = (1.95·E/Lb)·√(Iy·J)·(B + √(1 + B²)) (F9-10), B = ±2.3·(d/Lb)·√(Iy/J)
    // (F9-11 stem in tension, F9-13 stem in compression). Stem in tension: Lp = 1.76·ry·√(E/Fy)
    // (F9-8), Lr = 1.95·(E/Fy)·(√(Iy·J)/Sx)·√(2.36·(Fy/E)·(d·Sx/J) + 1) (F9-9); Lp < Lb ≤ Lr:
    // Mn = Mp − (Mp − My)(Lb − Lp)/(Lr − Lp) (F9-6); Lb > Lr: Mn = Mcr (F9-7). Stem in compression:
    // Mn = Mcr ≤ My (F9-12) at any Lb. F9 has no Cb.
    const Lb = e.Lb;
    const B = (stemTension ? 2.3 : -2.3) * (d / Lb) * Math.sqrt(Iy / J);
    const Mcr = ((1.95 * E) / Lb) * Math.sqrt(Iy * J) * (B + Math.sqrt(1 + B * B));
    w.B = B;
    w.Mcr = Mcr;
    if (stemTension) {
      const ry = Math.sqrt(Iy / A);
      w.r = ry;
      w.Lp = 1.76 * ry * re;
      w.Lr = 1.95 * (E / Fy) * (Math.sqrt(Iy * J) / Sx) * Math.sqrt(2.36 * (Fy / E) * ((d * Sx) / J) + 1);
      if (Lb <= w.Lp) w.zone = 0;
      else if (Lb <= w.Lr) {
        w.zone = 1;
        w.ltb = Math.min(Mp - (Mp - My) * ((Lb - w.Lp) / (w.Lr - w.Lp)), Mp);
      } else {
        w.zone = 2;
        w.ltb = Math.min(Mcr, Mp);
      }
    } else {
      w.zone = 2;
      w.ltb = Mcr < My ? Mcr : My;
    }
  }
}

/** F11: rectangular bar, depth d, width t (= b), bent about the horizontal axis. */
function flexBar(w: FlexWork, e: AiscContext, x: AiscScratch, Fy: number, Iz: number): void {
  const E = e.E,
    d = x.d,
    t = x.bt;
  const Sx = Iz / (d / 2);
  const My = Fy * Sx;
  const Mp = Math.min(Fy * x.Zx, 1.6 * My); // F11-1
  w.sec = S_F11;
  w.Mp = Mp;
  w.My = My;
  w.Sxc = w.Sxt = Sx;
  w.kc = w.Rpc = w.Rpt = w.Rpg = w.FL = NaN;
  w.flange.clear();
  w.web.clear();
  w.yld = Mp;
  w.flb = w.wlb = w.tfy = w.stem = w.ltb = NaN;
  w.zone = -1;
  w.Lp = w.Lr = w.r = w.Fcr = w.Mcr = w.B = NaN;
  // F11.2 LTB (major axis only, d > t; mem.): Lb·d/t² ≤ 0.08E/Fy: none; ≤ 1.9E/Fy:
  // Mn = Cb·[1.52 − 0.274(Lb·d/t²)(Fy/E)]·My ≤ Mp (F11-2); beyond: Fcr = 1.9·E·Cb/(Lb·d/t²) (F11-4),
  // Mn = Fcr·Sx ≤ Mp (F11-3). Lp and Lr here are the Lb at those two limits.
  if (e.restraint && d > t) {
    const Lb = e.Lb;
    const q = (Lb * d) / (t * t);
    w.Lp = ((0.08 * E) / Fy) * ((t * t) / d);
    w.Lr = ((1.9 * E) / Fy) * ((t * t) / d);
    if (q <= (0.08 * E) / Fy) w.zone = 0;
    else if (q <= (1.9 * E) / Fy) {
      w.zone = 1;
      w.ltb = Math.min(e.Cb * (1.52 - 0.274 * q * (Fy / E)) * My, Mp);
    } else {
      w.zone = 2;
      w.Fcr = (1.9 * E * e.Cb) / q;
      w.ltb = Math.min(w.Fcr * Sx, Mp);
    }
  }
}

// ------------------------------------------------------------------ the design block

const LIMIT_NAMES: Record<string, [string, string]> = {
  // section: [yielding label, its equation]
  F2: ["yielding", "F2-1"],
  F3: ["yielding", "F2-1"],
  F4: ["compression flange yielding", "F4-1"],
  F5: ["compression flange yielding", "F5-1"],
  F7: ["yielding", "F7-1"],
  F9: ["yielding", "F9-2"],
  F11: ["yielding", "F11-1"],
};

function limitStates(w: FlexWork, section: ChapterFSection, stemTension: boolean): AiscLimitState[] {
  const out: AiscLimitState[] = [];
  const [yn, ye] = LIMIT_NAMES[section];
  out.push({ name: yn, equation: section === "F9" && !stemTension ? "F9-4" : ye, Mn: w.yld * 1e-6 });
  if (w.flb === w.flb) {
    const eq =
      section === "F3" ? (w.flange.cls === 1 ? "F3-1" : "F3-2") : section === "F4" ? (w.flange.cls === 1 ? "F4-13" : "F4-14") : section === "F5" ? (w.flange.cls === 1 ? "F5-7, F5-8" : "F5-7, F5-9") : section === "F7" ? (w.flange.cls === 1 ? "F7-2" : "F7-3, F7-5") : w.flange.cls === 1 ? "F9-14" : "F9-15";
    out.push({ name: "flange local buckling", equation: eq, Mn: w.flb * 1e-6 });
  }
  if (w.wlb === w.wlb) out.push({ name: "web local buckling", equation: "F7-6", Mn: w.wlb * 1e-6 });
  if (w.tfy === w.tfy) out.push({ name: "tension flange yielding", equation: section === "F5" ? "F5-10" : "F4-15", Mn: w.tfy * 1e-6 });
  if (w.stem === w.stem) out.push({ name: "local buckling of the tee stem", equation: w.web.cls === 0 ? "F9-16, F9-17" : w.web.cls === 1 ? "F9-16, F9-18" : "F9-16, F9-19", Mn: w.stem * 1e-6 });
  return out;
}

function ltbEquation(section: ChapterFSection, zone: number, stemTension: boolean): string {
  if (zone === 0) return "Lb ≤ Lp: does not apply";
  switch (section) {
    case "F2":
    case "F3":
      return zone === 1 ? "F2-2" : "F2-3, F2-4";
    case "F4":
      return zone === 1 ? "F4-2" : "F4-3, F4-5";
    case "F5":
      return zone === 1 ? "F5-2, F5-3" : "F5-2, F5-4";
    case "F7":
      return zone === 1 ? "F7-10" : "F7-11";
    case "F9":
      return !stemTension ? "F9-12, F9-10, F9-13" : zone === 1 ? "F9-6" : "F9-7, F9-10, F9-11";
    default:
      return zone === 1 ? "F11-2" : "F11-3, F11-4";
  }
}

function design(fk: FamilyKernel, _v: Float64Array, ctx: CheckContext, s: Scratch, problem: SearchProblem): AiscDesign {
  const e = ctx.us!,
    x = s.us!;
  const family = fk.family;
  const fx = AISC_FACTORS.flexure;
  const elements: AiscElement[] = [];
  const flexure: AiscFlexure[] = [];
  const symmetric = symmetricAboutMidDepth(family);
  for (let sgn = 0; sgn < 2; sgn++) {
    const w = x.f[sgn];
    if (!w.on) continue;
    const moment: MomentSign = sgn === 0 ? "sagging" : "hogging";
    const section = SECTIONS[w.sec];
    const stemTension = sgn === 0;
    if (!(symmetric && sgn === 1 && x.f[0].on) && family !== "rectangle") {
      const flangeName = family === "tee" ? "flange" : sgn === 0 ? "top flange" : "bottom flange";
      if (!(family === "tee" && !stemTension))
        elements.push({ element: flangeName, under: [moment], case: w.flange.case, ratio: w.flange.lam, lambdaP: w.flange.lp, lambdaR: w.flange.lr, class: CLS[w.flange.cls], ...(w.kc === w.kc && w.flange.case.endsWith("11") ? { kc: w.kc } : {}) });
      elements.push({ element: family === "tee" ? "stem" : "web", under: [moment], case: w.web.case, ratio: w.web.lam, lambdaP: w.web.lp, lambdaR: w.web.lr, class: CLS[w.web.cls] });
    } else if (symmetric && sgn === 1) for (const el of elements) el.under.push("hogging");
    const M = (sgn === 0 ? ctx.Ms : ctx.Mh) * 1e-6;
    const out: AiscFlexure = {
      moment,
      M,
      section,
      limitStates: limitStates(w, section, stemTension),
      MnLocal: w.MnLocal * 1e-6,
      availableLocal: available(e, w.MnLocal, fx) * 1e-6,
      phi: fx.phi,
      omega: fx.omega,
      Zx: x.Zx,
      Mp: w.Mp * 1e-6,
      My: w.My * 1e-6,
      Sxc: w.Sxc,
      Sxt: w.Sxt,
      ltb: null,
    };
    if (w.Mr === w.Mr) out.Mr = w.Mr * 1e-6;
    if (w.Rpc === w.Rpc) out.Rpc = w.Rpc;
    if (w.Rpt === w.Rpt) out.Rpt = w.Rpt;
    if (w.Rpg === w.Rpg) out.Rpg = w.Rpg;
    if (w.FL === w.FL && (section === "F4" || section === "F5")) out.FL = w.FL;
    if (e.restraint && w.zone >= 0) {
      out.ltb = {
        Lb: e.Lb,
        Cb: section === "F9" ? 1 : e.Cb,
        zone: ZONES[w.zone],
        Lp: w.Lp === w.Lp ? w.Lp : null,
        Lr: w.Lr === w.Lr ? w.Lr : null,
        radius: w.r === w.r ? w.r : null,
        radiusName: section === "F2" || section === "F3" ? "rts" : section === "F4" || section === "F5" ? "rt" : "ry",
        equation: ltbEquation(section, w.zone, stemTension),
        Mn: w.ltb === w.ltb ? w.ltb * 1e-6 : null,
        available: w.ltb === w.ltb ? available(e, w.ltb, fx) * 1e-6 : null,
      };
      if (w.Fcr === w.Fcr) out.ltb.Fcr = w.Fcr;
      if (w.ry === w.ry) out.ltb.ry = w.ry;
      if (w.jc === w.jc) out.ltb.jc = w.jc;
      if (w.Mcr === w.Mcr) out.ltb.Mcr = w.Mcr * 1e-6;
      if (w.B === w.B) out.ltb.B = w.B;
    }
    flexure.push(out);
  }
  const outside = x.f.some((w) => w.on && w.outRatio > 0);
  const notes: string[] = [
    `${e.method === "LRFD" ? "LRFD: the brief's moments and shear are factored (required strengths Mu, Vu); available strength φ·Rn" : "ASD: the brief's moments and shear are ASD load combinations (required strengths Ma, Va); available strength Rn/Ω"} (AISC 360-16 §B3.1, §B3.2). The deflection uses the service load.`,
    `Fy = ${fmtStress(x.Fy)}${x.rolled ? ` (${e.rolledGrade}, rolled section)` : e.grade ? ` (${e.grade})` : ""}, E = ${fmtStress(e.E)}.`,
  ];
  for (const w of x.f) if (w.on && w.outRatio > 0) notes.push(`Outside this version: ${w.outWhat}; the section is excluded and not checked further.`);
  if (!e.restraint) notes.push("No unbraced length given: the compression flange is taken as braced throughout, so lateral-torsional buckling is not checked.");
  else notes.push(`Lateral-torsional buckling over Lb = ${fmtLen(e.Lb)} with Cb = ${e.Cb}${family === "tee" ? " (F9 takes no Cb)" : ""}.`);
  if (family === "channel") notes.push("Channel: F2 for the compact web; a noncompact or slender flange takes F3's flange local buckling expressions by analogy (a stated choice); loads taken through the shear centre (no torsion).");
  if (family === "mono-i") notes.push("Singly symmetric I: F4 (compact or noncompact web) or F5 (slender web) for each moment sign with its compression flange; Mp ≤ 1.6·Fy·Sxc in Rpc (1.6·Fy·Sxt in Rpt).");
  if (family === "rectangle") notes.push("Solid bar: shear by G2-1's 0.6·Fy·Aw with Aw = b·d and Cv = 1 (Chapter G has no section for bars; a stated choice).");
  if (e.stiffened) notes.push("Bearing stiffeners are required at the supports (assumed present, not designed here); J10.2 and J10.3 are therefore not checked.");
  else if (x.nw > 0) notes.push(`No bearing stiffeners: J10.2 web local yielding and J10.3 web crippling at an end support, lb = ${fmtMm(e.lb)}, reaction = the design shear, k = tf${x.rolled ? " + r" : " (the weld leg left out)"}, Qf = 1.0.`);
  else notes.push("No bearing stiffeners: J10.2 and J10.3 cover webs between flanges, not this section; the bearing at the supports is not checked.");
  if (x.weldOn) notes.push("Flange-to-web welds: two equal-leg fillet welds per junction (box: one per web per flange), E70 unless the brief types FEXX; leg rounded up to a whole mm, at least the Table J2.4 minimum, at most the thinner part joined (a stated choice).");
  if (x.shearOn && x.shearClause !== "bar") notes.push("Shear without tension field action (no intermediate stiffeners): kv = 5.34 for I webs and channels (G2.1), 5 for box webs (G4), 1.2 for tee stems (G3).");
  const out: AiscDesign = {
    basis: "aisc360",
    method: e.method,
    Fy: x.Fy,
    Fu: e.Fu,
    E: e.E,
    elements,
    flexure: outside ? [] : flexure,
    shear: null,
    weld: null,
    bearing: null,
    notes,
  };
  const g = x.rolled ? e.rolledGrade : e.grade;
  if (g !== undefined) out.grade = g;
  if (!outside && x.shearOn) {
    const f = x.shearClause === "G2.1" && x.vRolledA ? AISC_FACTORS.shearRolled : AISC_FACTORS.shear;
    const twv = x.shearClause === "bar" ? x.bt : x.tw;
    out.shear = {
      clause: x.shearClause as "G2.1" | "G3" | "G4" | "bar",
      h: x.hv,
      tw: twv,
      hOverTw: x.hv / twv,
      Aw: x.Aw,
      kv: x.kv === x.kv ? x.kv : null,
      Cv: x.Cv,
      Vn: x.Vn * 1e-3,
      phi: f.phi,
      omega: f.omega,
      available: x.Va * 1e-3,
      rolledA: x.vRolledA,
      htLimit: x.htLimit === x.htLimit ? x.htLimit : null,
    };
  }
  if (!outside && x.weldOn) out.weld = { Qf: x.Qf, q: x.q, FEXX: e.FEXX, Fnw: fnw(e.FEXX), phi: AISC_FACTORS.weld.phi, omega: AISC_FACTORS.weld.omega, perLeg: x.perLeg, wExact: x.wExact, w: x.w, wMin: x.wMin, wMax: x.wMax };
  if (!outside && x.bearOn)
    out.bearing = { lb: e.lb, k: x.kDist, RnYielding: x.Rn2 * 1e-3, RnCrippling: x.Rn3 * 1e-3, cripplingEquation: x.bearEq as "J10-5a" | "J10-5b", available: x.Ra * 1e-3 };
  void problem;
  return out;
}

const fmtStress = (mpa: number) => `${mpa.toFixed(1)} MPa (${fromSI("stress", mpa, "us").toFixed(1)} ksi)`;
/** Table J2.5: nominal stress of a fillet weld's throat, Fnw = 0.60·FEXX (one place: the check and the record). */
function fnw(FEXX: number): number {
  return 0.6 * FEXX;
}

// a bearing length is stated in mm (the brief's unit for it), a restraint length in m
const fmtMm = (mm: number) => `${mm.toFixed(1)} mm (${fromSI("length", mm, "us").toFixed(2)} in)`;
const fmtLen = (mm: number) => `${(mm / 1000).toFixed(3)} m (${fromSI("span", mm / 1000, "us").toFixed(2)} ft)`;
const f3 = (x: number) => (Math.abs(x) >= 1000 ? x.toFixed(0) : Math.abs(x) >= 10 ? x.toFixed(1) : x.toFixed(3));

function recordLines(verdict: Parameters<DesignBasisModule["recordLines"]>[0]): RecordLine[] {
  const d = verdict.aisc;
  if (!d) return [];
  const L: RecordLine[] = [];
  const add = (clause: string, text: string) => L.push({ clause, text });
  const asd = d.method === "ASD";
  const fx = AISC_FACTORS.flexure;
  add("AISC 360-16 §B3", `${d.method}: ${asd ? `available strength Rn/Ω (Ωb = ${fx.omega})` : `available strength φRn (φb = ${fx.phi})`}; Fy = ${d.Fy.toFixed(1)} MPa${d.grade ? ` (${d.grade})` : ""}`);
  for (const el of d.elements)
    add(`AISC 360-16 ${el.case}`, `${el.element} (${el.under.join(" and ")}): λ = ${f3(el.ratio)}; λp = ${f3(el.lambdaP)}, λr = ${f3(el.lambdaR)}${el.kc !== undefined ? ` (kc = ${f3(el.kc)})` : ""} → ${el.class}`);
  for (const f of d.flexure) {
    const avail = asd ? "Mn/Ω" : "φMn";
    add(`AISC 360-16 §${f.section}`, `${f.moment}: Chapter F section ${f.section}; Mp = ${f3(f.Mp)} kN·m, My = ${f3(f.My)} kN·m${f.Rpc !== undefined ? `, Rpc = ${f3(f.Rpc)}` : ""}${f.Rpt !== undefined ? `, Rpt = ${f3(f.Rpt)}` : ""}${f.Rpg !== undefined ? `, Rpg = ${f3(f.Rpg)}` : ""}`);
    for (const ls of f.limitStates) add(`AISC 360-16 Eq. ${ls.equation}`, `${f.moment}: ${ls.name}: Mn = ${f3(ls.Mn)} kN·m`);
    add(`AISC 360-16 §F1`, `${f.moment}: Mn = ${f3(f.MnLocal)} kN·m (least of the above), ${avail} = ${f3(f.availableLocal)} kN·m against ${f3(f.M)} kN·m`);
    if (f.ltb) {
      const l = f.ltb;
      const r = l.radius !== null ? `${l.radiusName} = ${f3(l.radius)} mm, ` : "";
      const lims = `${l.Lp !== null ? `Lp = ${f3(l.Lp)} mm` : ""}${l.Lr !== null ? `, Lr = ${f3(l.Lr)} mm` : ""}`;
      add(
        `AISC 360-16 Eq. ${l.equation}`,
        `${f.moment}: lateral-torsional buckling, Lb = ${f3(l.Lb)} mm, Cb = ${l.Cb}: ${r}${lims}; zone: ${l.zone}${l.Fcr !== undefined ? `, Fcr = ${f3(l.Fcr)} MPa` : ""}${l.Mcr !== undefined ? `, Mcr = ${f3(l.Mcr)} kN·m` : ""}${l.Mn !== null ? `; Mn = ${f3(l.Mn)} kN·m, ${avail} = ${f3(l.available!)} kN·m against ${f3(f.M)} kN·m` : ""}`,
      );
    }
  }
  if (d.shear) {
    const s = d.shear;
    const avail = asd ? `Vn/Ω (Ωv = ${s.omega})` : `φVn (φv = ${s.phi})`;
    const clause = s.clause === "bar" ? "AISC 360-16 Eq. G2-1 (by analogy)" : s.clause === "G2.1" ? (s.rolledA ? "AISC 360-16 §G2.1(a), Eq. G2-1" : `AISC 360-16 §G2.1(b), Eq. G2-1, ${s.Cv < 1 ? "G2-4" : "G2-3"}`) : `AISC 360-16 §${s.clause}, G2.2`;
    add(clause, `Aw = ${f3(s.Aw)} mm², h/tw = ${f3(s.hOverTw)}${s.kv !== null ? `, kv = ${s.kv}` : ""}, Cv = ${f3(s.Cv)}; Vn = 0.6·Fy·Aw·Cv = ${f3(s.Vn)} kN, ${avail} = ${f3(s.available)} kN`);
  }
  if (d.weld) {
    const w = d.weld;
    add("AISC 360-16 §J2.4, Table J2.5, Table J2.4", `q = V·Qf/Iz = ${f3(w.q)} N/mm (Qf = ${f3(w.Qf)} mm³), Fnw = 0.60·FEXX = ${f3(w.Fnw)} MPa on the throat 0.707·w: two welds need w = ${f3(w.wExact)} mm → ${w.w} mm (Table J2.4 minimum ${w.wMin} mm, at most ${f3(w.wMax)} mm)`);
  }
  if (d.bearing) {
    const b = d.bearing;
    add("AISC 360-16 §J10.2, §J10.3", `lb = ${f3(b.lb)} mm, k = ${f3(b.k)} mm: web local yielding Rn = ${f3(b.RnYielding)} kN (J10-3); web crippling Rn = ${f3(b.RnCrippling)} kN (${b.cripplingEquation}); available ${f3(b.available)} kN`);
  }
  for (const n of d.notes) add("assumption", n);
  return L;
}

/** Clause of each check under this basis (candidateChecks shows it beside the numbers). */
export const AISC_CLAUSES = {
  "class-4": "AISC 360-16 Table B4.1b, §F13.2: outside this version",
  "bending-resistance": "AISC 360-16 Chapter F (F2–F5, F7, F9, F11): yielding and local buckling",
  ltb: "AISC 360-16 Chapter F: lateral-torsional buckling over Lb",
  "shear-resistance": "AISC 360-16 §G2.1, G3, G4 (Cv = 1)",
  "shear-buckling": "AISC 360-16 §G2.1, G3, G4 (Cv < 1)",
  weld: "AISC 360-16 §J2.4, Table J2.4",
  bearing: "AISC 360-16 §J10.2, §J10.3",
} as const;

export const aisc360Basis: DesignBasisModule = {
  id: "aisc360",
  precedence: Int8Array.from([C_CLASS4, C_BEND, C_LTB, C_VPL, C_VB, C_WELD, C_BEARING, C_DEFL, C_OUTSTAND, C_INTERNAL, C_WEB, C_STEM]),
  evaluate,
  design,
  recordLines,
  clauses: AISC_CLAUSES,
};

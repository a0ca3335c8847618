// Result types of the design bases (member-checks.md): the stability properties of a section
// and the EN 1993 design block a candidate carries. Kept apart from the code that fills them so
// the UI, the record and the API read one definition. Units follow the brief: moments kN·m,
// forces kN, stresses MPa, lengths mm (section constants in mm powers).

/** member-checks.md §1: thin-walled midline model; `null` on SectionProperties where not defined. */
export interface StabilityProperties {
  /** distance between the flanges' mid-thickness lines, mm */
  h0: number;
  /** shear centre, in the same coordinates as `centroid`, mm */
  shearCentre: { z: number; y: number };
  /** warping constant, mm⁶ */
  Cw: number;
  /** mono-symmetry (Wagner) coefficient, mm; > 0 when the top flange is the larger, 0 when symmetric about z */
  betaX: number;
  /** torsion constant the LTB check uses, mm⁴ (the section's J; the solid rectangle's own formula) */
  J: number;
}

export type SectionClass = 1 | 2 | 3 | 4;
export type MomentSign = "sagging" | "hogging";

/** One compressed element of EN 1993-1-1 Table 5.2. */
export interface ClassifiedElement {
  /** "top flange", "bottom flange", "flange", "web", "stem" */
  element: string;
  /** Table 5.2 part: outstand flange, internal compression part (box flange), web in bending, tee stem (as an outstand) */
  part: "outstand" | "internal" | "web" | "stem";
  /** the moment signs that compress it (webs: both) */
  under: MomentSign[];
  /** mm */
  c: number;
  /** mm */
  t: number;
  /** c / t */
  ratio: number;
  /** c/t limits of classes 1, 2, 3 as applied (ε, α, ψ included) */
  limits: [number, number, number];
  class: SectionClass;
  /** webs: fraction of c in compression at the plastic neutral axis (worst moment sign) */
  alpha?: number;
  /** webs: elastic stress ratio, other end ÷ compressed end, tension negative (worst moment sign) */
  psi?: number;
}

/** EN 1993-1-1 §6.3.2.2 with Mcr by the three-factor formula, one per non-zero moment sign. */
export interface LtbDesign {
  moment: MomentSign;
  /** design moment of that sign, kN·m */
  MEd: number;
  /** load point above the shear centre, mm (positive up) */
  zg: number;
  /** βc/2 (βc = betaX sagging, −betaX hogging), mm */
  zj: number;
  /** the segment length between restraints Mcr was worked with, mm */
  L: number;
  /** the section constants Mcr was worked with, in EN 1993's names: Iz the minor-axis second
   *  moment (properties.Iy), mm⁴; Iw the warping constant, mm⁶; It the torsion constant, mm⁴ */
  Iz: number;
  Iw: number;
  It: number;
  /** C2·zg − C3·zj, mm */
  zTerm: number;
  /** MEd / Mb,Rd of this moment sign */
  utilisation: number;
  /** I and mono-I: depth over the narrower flange, the ratio that chose the curve; null for the other families */
  hOverB: number | null;
  /** elastic critical moment, kN·m */
  Mcr: number;
  lambdaLT: number;
  curve: "b" | "c" | "d";
  alphaLT: number;
  phiLT: number;
  chiLT: number;
  /** kN·m */
  MbRd: number;
}

/** EN 1993-1-1 §6.2.6 and EN 1993-1-5 §5. */
export interface ShearDesign {
  /** clear web depth, mm (0 for the rectangle) */
  hw: number;
  /** web thickness, mm (per web) */
  tw: number;
  /** shear area, mm² */
  Av: number;
  /** kN */
  VplRd: number;
  /** 72ε/η, the web slenderness above which shear buckling is checked (families with webs) */
  bucklingLimit: number | null;
  /** hw/tw, compared with bucklingLimit (families with webs) */
  hwOverTw: number | null;
  /** hw/tw > 72ε/η */
  buckling: boolean;
  lambdaW?: number;
  chiW?: number;
  /** kN, summed over the webs */
  VbRd?: number;
  /** the governing shear resistance, kN: min(Vpl,Rd, Vb,Rd) when buckling applies, else Vpl,Rd */
  VRd: number;
  governing: "shear-resistance" | "shear-buckling";
}

/** EN 1993-1-1 §6.2.8, present only when 0.5·VRd < VEd ≤ VRd. */
export interface BendingShearDesign {
  rho: number;
  /** kN·m */
  MVRd: number;
}

/** EN 1993-1-8 §4.5.3.3 (simplified method) on each flange-to-web junction. */
export interface WeldDesign {
  /** first moment of the flange about the elastic neutral axis, mm³ (the larger flange) */
  Qf: number;
  /** longitudinal shear per junction line, N/mm (box: per flange, shared by its two welds) */
  q: number;
  /** fillet welds sharing q */
  welds: number;
  /** design shear strength of the weld, MPa */
  fvwd: number;
  /** q / (welds · fvw,d), mm, before rounding */
  aExact: number;
  /** required throat, mm: aExact rounded up to a whole mm, at least 3 */
  a: number;
  /** 0.7 × the thinner joined plate, mm */
  aMax: number;
}

/** EN 1993-1-5 §6, type (c) (load at an end, unstiffened web); only when supports.stiffened is false. */
export interface BearingDesign {
  /** stiff bearing length, mm */
  ss: number;
  kF: number;
  m1: number;
  m2: number;
  /** effective loaded length, mm */
  ly: number;
  /** per web, kN */
  Fcr: number;
  lambdaF: number;
  chiF: number;
  /** mm */
  Leff: number;
  /** summed over the webs (box: two), kN */
  FRd: number;
}

/** Everything the EN 1993 basis worked out for one candidate. */
export interface DesignBlock {
  basis: "en1993";
  grade?: string;
  /** MPa, from the band holding the thickest plate */
  fy: number;
  /** the thickness that chose the band, mm (rectangle: its smaller side) */
  fyPlate: number;
  /** √(235/fy) */
  epsilon: number;
  sectionClass: SectionClass;
  elements: ClassifiedElement[];
  /** the modulus every check of the section uses, mm³; null for class 4 */
  W: number | null;
  Wkind: "plastic" | "elastic";
  /** kN·m; null for class 4 (not checked further) */
  McRd: number | null;
  /** null when the brief gives no restraint (compression flange restrained throughout) or class 4 */
  ltb: LtbDesign[] | null;
  /** null when there is no shear, or class 4 */
  shear: ShearDesign | null;
  /** null unless 0.5·VRd < VEd ≤ VRd */
  bendingShear: BendingShearDesign | null;
  /** null for the rectangle (no welds) and class 4 */
  weld: WeldDesign | null;
  /** null unless supports.stiffened is false (and not for class 4) */
  bearing: BearingDesign | null;
  /** stated simplifications and assumptions, in words, for the record */
  notes: string[];
}

// ------------------------------------------------------------------ AISC 360-16 (issue 14)

/** One element of AISC 360-16 Table B4.1b (flexure). */
export interface AiscElement {
  /** "top flange", "bottom flange", "flange", "web", "stem" */
  element: string;
  under: MomentSign[];
  /** the Table B4.1b case applied */
  case: string;
  /** width-to-thickness ratio λ */
  ratio: number;
  lambdaP: number;
  lambdaR: number;
  class: "compact" | "noncompact" | "slender";
  /** welded I flanges (case 11): kc = 4/√(h/tw), 0.35 … 0.76 */
  kc?: number;
}

/** One Chapter F limit state other than lateral-torsional buckling. */
export interface AiscLimitState {
  name: string;
  /** the equation number(s), e.g. "F2-1" */
  equation: string;
  /** nominal strength, kN·m */
  Mn: number;
}

/** Chapter F for one moment sign. */
export interface AiscFlexure {
  moment: MomentSign;
  /** required strength of that sign, kN·m */
  M: number;
  section: "F2" | "F3" | "F4" | "F5" | "F7" | "F9" | "F11";
  limitStates: AiscLimitState[];
  /** the least of limitStates, kN·m, and its available strength (φMn or Mn/Ω) */
  MnLocal: number;
  availableLocal: number;
  /** resistance and safety factors of Chapter F (§F1) */
  phi: number;
  omega: number;
  /** plastic modulus Mp is worked from (Mp = Fy·Zx), mm³ */
  Zx: number;
  /** kN·m */
  Mp: number;
  My: number;
  /** elastic moduli to the compression and tension fibres, mm³ */
  Sxc: number;
  Sxt: number;
  /** F2, F3: Mr = 0.7·Fy·Sx of F2-2 and F3-1, kN·m */
  Mr?: number;
  Rpc?: number;
  Rpt?: number;
  Rpg?: number;
  /** MPa (F4, F5) */
  FL?: number;
  /** null when the brief gives no unbraced length (compression flange braced throughout) */
  ltb: {
    /** mm */
    Lb: number;
    Cb: number;
    /** Lb ≤ Lp, Lp < Lb ≤ Lr, Lb > Lr (F9 with the stem in compression: always "elastic", Mcr) */
    zone: "plastic" | "inelastic" | "elastic";
    /** mm; null where the section has none (tee stem in compression) */
    Lp: number | null;
    Lr: number | null;
    /** rts (F2, F3), rt (F4, F5) or ry (F7, F9), mm */
    radius: number | null;
    radiusName: "rts" | "rt" | "ry";
    equation: string;
    /** MPa */
    Fcr?: number;
    /** F2, F3: ry of Lp (F2-5), mm; J·c/(Sx·h0) of Lr (F2-6) and Fcr (F2-4) */
    ry?: number;
    jc?: number;
    /** kN·m */
    Mcr?: number;
    /** F9-11 / F9-13 */
    B?: number;
    /** kN·m; null when LTB does not apply (Lb ≤ Lp) */
    Mn: number | null;
    available: number | null;
  } | null;
}

/** G2.1 (I, channel), G3 (tee), G4 (box) or G2-1 by analogy (bar). */
export interface AiscShear {
  clause: "G2.1" | "G3" | "G4" | "bar";
  /** web depth used in h/tw, mm */
  h: number;
  tw: number;
  /** h/tw, the web slenderness Cv is worked from */
  hOverTw: number;
  /** mm² */
  Aw: number;
  kv: number | null;
  /** Cv1 (G2.1) or Cv2 (G2.2) */
  Cv: number;
  /** kN */
  Vn: number;
  phi: number;
  omega: number;
  /** kN */
  available: number;
  /** G2.1(a): rolled I web with h/tw ≤ 2.24√(E/Fy) */
  rolledA: boolean;
  /** G2.1: the h/tw limit Cv1 = 1 holds to, 2.24√(E/Fy) (G2.1(a)) or 1.10√(kv·E/Fy) (G2-3); null elsewhere */
  htLimit: number | null;
}

/** J2 flange-to-web fillet welds. */
export interface AiscWeld {
  Qf: number;
  /** N/mm */
  q: number;
  /** MPa */
  FEXX: number;
  /** nominal weld stress 0.60·FEXX (Table J2.5), MPa */
  Fnw: number;
  /** §J2.4 factors (Table J2.5) */
  phi: number;
  omega: number;
  /** available strength per mm of leg of one weld, N/mm per mm: φ·Fnw·0.707 or Fnw·0.707/Ω */
  perLeg: number;
  /** leg size needed, mm, before rounding */
  wExact: number;
  /** leg size, mm */
  w: number;
  /** Table J2.4 minimum, mm */
  wMin: number;
  /** the thinner part joined, mm */
  wMax: number;
}

/** J10.2 and J10.3 at an unstiffened end support. */
export interface AiscBearing {
  lb: number;
  k: number;
  /** kN, summed over the webs */
  RnYielding: number;
  RnCrippling: number;
  cripplingEquation: "J10-5a" | "J10-5b";
  /** the lesser available strength, kN */
  available: number;
}

/** Everything the AISC 360 basis worked out for one candidate. */
export interface AiscDesign {
  basis: "aisc360";
  method: "ASD" | "LRFD";
  grade?: string;
  /** MPa */
  Fy: number;
  Fu: number;
  E: number;
  elements: AiscElement[];
  /** one per non-zero moment sign; empty when the section is outside this version */
  flexure: AiscFlexure[];
  shear: AiscShear | null;
  weld: AiscWeld | null;
  bearing: AiscBearing | null;
  notes: string[];
}

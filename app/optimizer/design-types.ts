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

// Moment-diagram presets for the lateral-torsional buckling factors C1, C2, C3 of the brief's
// restraint panel. The engine takes C1, C2, C3 as numbers (member-checks.md §2, `restraint`)
// and owns no table of them, so the table lives here, once; the brief editor fills the three
// fields from it and the record names the preset the values match.
//
// Source: ENV 1993-1-1:1992 Annex F, Table F.1.1 (end moments, no transverse load) and Table
// F.1.2 (transverse loads), the effective-length factor k = 1 rows (ends free to rotate about
// the minor axis, not restrained against warping). Every value is recalled from memory (mem.):
// check them against the table before relying on a preset; every field stays editable.
// With end moments only there is no transverse load, so C2 (which multiplies the load's
// height zg) is 0 and the load position does not matter.

import { cbFromMoments } from "~/optimizer/index";

export interface MomentDiagram {
  id: string;
  /** plain words for the select */
  label: string;
  C1: number;
  C2: number;
  C3: number;
  /** false: no transverse load, the load position does not enter Mcr (C2 = 0) */
  transverseLoad: boolean;
  /**
   * The diagram's moments (÷ the largest) at the quarter, centre and three-quarter points of the
   * unbraced segment, for AISC 360-16 Eq. F1-1 (Cb); worked out from the diagram's own shape.
   */
  quarter: [number, number, number];
}

/** Cb of a preset by AISC 360-16 §F1, Eq. F1-1 (the engine's cbFromMoments), to three decimals. */
export function cbOf(d: MomentDiagram): number {
  return Math.round(cbFromMoments(1, d.quarter[0], d.quarter[1], d.quarter[2]) * 1000) / 1000;
}

export const MOMENT_DIAGRAM_SOURCE = "ENV 1993-1-1:1992 Annex F, Tables F.1.1 and F.1.2, k = 1 (mem.)";

// ψ = ratio of the smaller end moment to the larger, negative in double curvature.
// M(x)/M1 = 1 + (ψ − 1)·x along the segment: at the quarter points 1 + (ψ − 1)/4, (1 + ψ)/2, (1 + 3ψ)/4.
const endMoments = (psi: string, C1: number, C3: number): MomentDiagram => {
  const r = psi.includes("/") ? Number(psi.split("/")[0]) / Number(psi.split("/")[1]) : Number(psi);
  return {
    id: `end-moments-${psi}`,
    label: psi === "1" ? "Uniform moment (equal end moments, ψ = 1)" : `End moments, ψ = ${psi.replace("-", "−")}`,
    C1,
    C2: 0,
    C3,
    transverseLoad: false,
    quarter: [Math.abs(1 + (r - 1) / 4), Math.abs((1 + r) / 2), Math.abs((1 + 3 * r) / 4)],
  };
};

export const MOMENT_DIAGRAMS: readonly MomentDiagram[] = [
  // Table F.1.1, k = 1 (mem.)
  endMoments("1", 1.0, 1.0),
  endMoments("3/4", 1.141, 0.998),
  endMoments("1/2", 1.323, 0.992),
  endMoments("1/4", 1.563, 0.977),
  endMoments("0", 1.879, 0.939),
  endMoments("-1/4", 2.281, 0.855),
  endMoments("-1/2", 2.704, 0.676),
  endMoments("-3/4", 2.927, 0.366),
  endMoments("-1", 2.752, 0.0),
  // Table F.1.2, k = 1 (mem.). Quarter-point moments ÷ the largest: uniform load on a simple span
  // 4x(1 − x) → 0.75, 1, 0.75; central point load 2x → 0.5, 1, 0.5; point loads at the quarter
  // points: constant between them → 1, 1, 1; both ends fixed, uniform load (6x − 6x² − 1)/12 ÷ 1/12
  // → 0.125, 0.5, 0.125 (the ends are the largest); central point load (4x − 1)/8 ÷ 1/8 → 0, 1, 0.
  { id: "udl-simple", label: "Simply supported, uniform load", C1: 1.132, C2: 0.459, C3: 0.525, transverseLoad: true, quarter: [0.75, 1, 0.75] },
  { id: "point-simple", label: "Simply supported, central point load", C1: 1.365, C2: 0.553, C3: 1.73, transverseLoad: true, quarter: [0.5, 1, 0.5] },
  { id: "quarter-points-simple", label: "Simply supported, two equal point loads at the quarter points", C1: 1.046, C2: 0.43, C3: 1.12, transverseLoad: true, quarter: [1, 1, 1] },
  { id: "udl-fixed", label: "Both ends fixed, uniform load", C1: 1.285, C2: 1.562, C3: 0.753, transverseLoad: true, quarter: [0.125, 0.5, 0.125] },
  { id: "point-fixed", label: "Both ends fixed, central point load", C1: 1.07, C2: 0.432, C3: 3.05, transverseLoad: true, quarter: [0, 1, 0] },
];

export function momentDiagram(id: string): MomentDiagram | undefined {
  return MOMENT_DIAGRAMS.find((d) => d.id === id);
}

/** The preset whose three factors these are (to name it in the record and reselect it in the editor), if any. */
export function matchMomentDiagram(C1: number, C2: number, C3: number): MomentDiagram | undefined {
  const near = (a: number, b: number) => Math.abs(a - b) <= 5e-4;
  return MOMENT_DIAGRAMS.find((d) => near(d.C1, C1) && near(d.C2, C2) && near(d.C3, C3));
}

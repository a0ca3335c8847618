// What the results pages show of a candidate's EN 1993 design block (member-checks.md §3:
// class, Mcr, χLT, resistances, the weld throat, the governing check with its clause). Every
// number is picked from the engine's own output (candidateChecks → CandidateVerdict.design,
// CheckResult.clause); nothing is computed here.
import type { CandidateVerdict } from "~/optimizer/checks";
import type { DesignBlock, LtbDesign } from "~/optimizer/design-types";

/** One candidate's design figures for a table row (SI: kN·m, kN, mm); null where the check does not apply. */
export interface DesignRow {
  sectionClass: 1 | 2 | 3 | 4;
  /** the LTB case with the largest MEd/Mb,Rd (both moment signs may be checked) */
  Mcr: number | null;
  chiLT: number | null;
  lambdaLT: number | null;
  McRd: number | null;
  MbRd: number | null;
  VRd: number | null;
  /** required flange-to-web weld throat, mm */
  weldThroat: number | null;
  /** the governing check's clause, as the engine names it */
  governingClause: string;
}

/** The LTB case that governs among the moment signs checked (largest MEd ÷ Mb,Rd). */
export function governingLtb(d: DesignBlock): LtbDesign | null {
  if (!d.ltb?.length) return null;
  return d.ltb.reduce((a, b) => (b.MEd / b.MbRd > a.MEd / a.MbRd ? b : a));
}

/** From a verdict (candidateChecks) or a search candidate, which carry the same design block and checks. */
export function designRow(v: Pick<CandidateVerdict, "design" | "checks" | "governing">): DesignRow | null {
  const d = v.design;
  if (!d) return null;
  const l = governingLtb(d);
  return {
    sectionClass: d.sectionClass,
    Mcr: l?.Mcr ?? null,
    chiLT: l?.chiLT ?? null,
    lambdaLT: l?.lambdaLT ?? null,
    McRd: d.McRd,
    MbRd: l?.MbRd ?? null,
    VRd: d.shear?.VRd ?? null,
    weldThroat: d.weld?.a ?? null,
    governingClause: v.checks.find((c) => c.name === v.governing)?.clause ?? "",
  };
}

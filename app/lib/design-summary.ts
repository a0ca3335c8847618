// What the results pages show of a candidate's design block, under the brief's basis: EN 1993
// (member-checks.md §3: class, Mcr, χLT, resistances, the weld throat, the governing check with
// its clause) or AISC 360-16 (issue 14: the Chapter F section, Mn and its available strength,
// the LTB zone with Lp, Lr and Cb, Vn, the weld leg, the governing limit state with its
// equation). Every number is picked from the engine's own output (candidateChecks →
// CandidateVerdict.design / .aisc, CheckResult.clause); nothing is computed here but the
// choice of the governing moment sign and limit state, which compares the engine's figures.
import type { CandidateVerdict } from "~/optimizer/checks";
import type { AiscDesign, AiscFlexure, DesignBlock, LtbDesign } from "~/optimizer/design-types";

/** One candidate's EN 1993 figures for a table row (SI: kN·m, kN, mm); null where the check does not apply. */
export interface En1993Row {
  /** absent on rows stored before the AISC rows existed: those are all EN 1993 */
  basis?: "en1993";
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

/**
 * One candidate's AISC 360-16 figures for a table row (SI: kN·m, kN, mm), from the moment sign
 * whose Chapter F utilisation is the larger; null where the check does not apply.
 */
export interface AiscRow {
  basis: "aisc360";
  method: "ASD" | "LRFD";
  /** Chapter F section applied, e.g. "F2"; null when the section is outside this version */
  section: string | null;
  /** nominal flexural strength Mn: the least of the section's limit states, LTB included, kN·m */
  Mn: number | null;
  /** its available strength: Mn/Ωb (ASD) or φb·Mn (LRFD), kN·m */
  MnAvailable: number | null;
  /** null when no unbraced length is given (braced throughout) */
  zone: "plastic" | "inelastic" | "elastic" | null;
  /** mm; null where the section has none (a tee's stem in compression) or LTB is not checked */
  Lp: number | null;
  Lr: number | null;
  Cb: number | null;
  /** nominal shear strength, kN, and its available strength Vn/Ωv or φv·Vn */
  Vn: number | null;
  VnAvailable: number | null;
  /** flange-to-web fillet weld leg, mm */
  weldLeg: number | null;
  /** the governing limit state in words, e.g. "lateral-torsional buckling" */
  limitState: string;
  /** its equation or section number, e.g. "F2-2", "G2-1", "J10-3"; "" where the check has none (deflection) */
  equation: string;
  /** the clause beside the governing check, e.g. "AISC 360-16 Eq. F2-2" */
  governingClause: string;
}

export type DesignRow = En1993Row | AiscRow;

/** A code basis: its candidates carry design rows (the allowable basis, and a stored problem without a basis, have none). */
export const isCodeBasis = (basis: string | undefined): basis is "en1993" | "aisc360" => basis === "en1993" || basis === "aisc360";

export const isAiscRow = (d: DesignRow | null | undefined): d is AiscRow => d?.basis === "aisc360";
export const isEnRow = (d: DesignRow | null | undefined): d is En1993Row => !!d && d.basis !== "aisc360";

/** The LTB case that governs among the moment signs checked (largest MEd ÷ Mb,Rd). */
export function governingLtb(d: DesignBlock): LtbDesign | null {
  if (!d.ltb?.length) return null;
  return d.ltb.reduce((a, b) => (b.MEd / b.MbRd > a.MEd / a.MbRd ? b : a));
}

/** A Chapter F block's available strength: the least of its local limit states and LTB. */
const flexAvailable = (f: AiscFlexure) => Math.min(f.availableLocal, f.ltb?.available ?? Infinity);

/** The moment sign that governs flexure (largest required ÷ available strength). */
export function governingFlexure(d: AiscDesign): AiscFlexure | null {
  if (!d.flexure.length) return null;
  return d.flexure.reduce((a, b) => (b.M / flexAvailable(b) > a.M / flexAvailable(a) ? b : a));
}

/** The moment sign whose `strength` is the most used (largest required ÷ available); null when none has one. */
function mostUsed(d: AiscDesign, strength: (f: AiscFlexure) => number | null | undefined): AiscFlexure | null {
  let best: AiscFlexure | null = null,
    u = -Infinity;
  for (const f of d.flexure) {
    const a = strength(f);
    if (a == null || !(a > 0)) continue;
    if (f.M / a > u) {
      u = f.M / a;
      best = f;
    }
  }
  return best;
}

/** The limit state of one check of an AISC verdict, in words, with its equation (AISC 360-16) and the moment sign it is for. */
function aiscLimitState(d: AiscDesign, governing: string): { limitState: string; equation: string; flexure: AiscFlexure | null } {
  // each flexural check names the moment sign that sets it (a tee's two signs have different sections' equations)
  const f = governing === "ltb" ? mostUsed(d, (x) => x.ltb?.available) : governing === "bending-resistance" ? mostUsed(d, (x) => x.availableLocal) : null;
  const r = aiscLimitStateWords(d, governing, f);
  return { ...r, flexure: f };
}

function aiscLimitStateWords(d: AiscDesign, governing: string, f: AiscFlexure | null): { limitState: string; equation: string } {
  switch (governing) {
    case "bending-resistance": {
      if (!f) return { limitState: "flexure", equation: "" };
      const ls = f.limitStates.reduce((a, b) => (b.Mn < a.Mn ? b : a));
      return { limitState: ls.name, equation: ls.equation };
    }
    case "ltb":
      // "Lb ≤ Lp: does not apply" never governs (no LTB demand then); its equation is shown as is
      return f?.ltb ? { limitState: "lateral-torsional buckling", equation: f.ltb.equation } : { limitState: "lateral-torsional buckling", equation: "" };
    case "shear-resistance":
    case "shear-buckling": {
      const s = d.shear;
      const words = governing === "shear-buckling" ? "shear buckling of the web" : "shear yielding";
      if (!s) return { limitState: words, equation: "G2-1" };
      // G2-1 is the nominal strength in every case; Cv1 by G2-2 (rolled), G2-3 or G2-4 (G2.1(b)); G3/G4 by G2.2's Cv2
      const eq = s.clause === "G2.1" ? (s.rolledA ? "G2-1, G2-2" : s.Cv < 1 ? "G2-1, G2-4" : "G2-1, G2-3") : s.clause === "bar" ? "G2-1" : s.clause === "G3" ? "G3-1" : "G4-1";
      return { limitState: words, equation: eq };
    }
    case "weld":
      return { limitState: "flange-to-web fillet weld", equation: "J2-3, Table J2.4" };
    case "bearing": {
      const b = d.bearing;
      if (!b) return { limitState: "web local yielding or crippling", equation: "J10-3, J10-5" };
      // the lesser available strength governs (J10.2: φ 1.00, Ω 1.50; J10.3: φ 0.75, Ω 2.00)
      const asd = d.method === "ASD";
      const y = asd ? b.RnYielding / 1.5 : b.RnYielding * 1.0;
      const c = asd ? b.RnCrippling / 2.0 : b.RnCrippling * 0.75;
      return y <= c ? { limitState: "web local yielding", equation: "J10-3" } : { limitState: "web crippling", equation: b.cripplingEquation };
    }
    case "class-4":
      return { limitState: "element outside this version", equation: "Table B4.1b" };
    case "deflection":
      return { limitState: "deflection (serviceability)", equation: "" };
    default:
      return { limitState: "the brief's slenderness limit", equation: "" };
  }
}

/**
 * The clause beside one check of an AISC 360 verdict, as specific as the engine's figures allow:
 * the Chapter F section and equation that set the strength ("AISC 360-16 §F2, Eq. F2-2"), the
 * shear, weld or bearing equations; `fallback` (the basis's clause for the check, checks.ts) where
 * the check has no equation of its own (deflection, the brief's slenderness limits).
 */
export function aiscCheckClause(d: AiscDesign, check: string, fallback: string): string {
  const { equation, flexure: f } = aiscLimitState(d, check);
  // no equation of its own (deflection, slenderness), or one the basis's clause words better (Table B4.1b, "Lb ≤ Lp")
  if (!/^[A-Z]\d/.test(equation)) return fallback;
  const shear = d.shear && d.shear.clause !== "bar" ? `§${d.shear.clause}, ` : "";
  const section =
    check === "bending-resistance" || check === "ltb"
      ? f
        ? `§${f.section}, `
        : ""
      : check === "shear-resistance" || check === "shear-buckling"
        ? shear
        : check === "weld"
          ? "§J2.4, "
          : check === "bearing"
            ? equation === "J10-3"
              ? "§J10.2, "
              : "§J10.3, "
            : "";
  return `AISC 360-16 ${section}Eq. ${equation}`;
}

/** An AISC 360 verdict's row. */
export function aiscRow(v: Pick<CandidateVerdict, "aisc" | "checks" | "governing">): AiscRow | null {
  const d = v.aisc;
  if (!d) return null;
  const f = governingFlexure(d);
  const l = f?.ltb ?? null;
  const Mn = f ? Math.min(f.MnLocal, l?.Mn ?? Infinity) : null;
  const { limitState, equation } = aiscLimitState(d, v.governing);
  const checkClause = v.checks.find((c) => c.name === v.governing)?.clause ?? "";
  return {
    basis: "aisc360",
    method: d.method,
    section: f?.section ?? null,
    Mn,
    MnAvailable: f ? flexAvailable(f) : null,
    zone: l?.zone ?? null,
    Lp: l?.Lp ?? null,
    Lr: l?.Lr ?? null,
    Cb: l?.Cb ?? null,
    Vn: d.shear?.Vn ?? null,
    VnAvailable: d.shear?.available ?? null,
    weldLeg: d.weld?.w ?? null,
    limitState,
    equation,
    governingClause: aiscCheckClause(d, v.governing, checkClause),
  };
}

/** From a verdict (candidateChecks) or a search candidate, which carry the same design block and checks. */
export function designRow(v: Pick<CandidateVerdict, "design" | "aisc" | "checks" | "governing">): DesignRow | null {
  if (v.aisc) return aiscRow(v);
  const d = v.design;
  if (!d) return null;
  const l = governingLtb(d);
  return {
    basis: "en1993",
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

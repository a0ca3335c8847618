// The caution every results page, API answer and calculation record carries (product.md,
// "Safety"), worded once here so the screen, the API and the printed record never disagree.
// It changes with the brief's design basis (member-checks.md §2–§3, issue 14): what the checks
// cover and, as plainly, what they do not. This is the one source of those words: the engine's
// basis modules (app/optimizer/basis/*.ts) carry none of their own.

/** The part of a problem the caution depends on (a SearchProblem fits; absent fields read as the spec's defaults). */
export interface CautionBasis {
  basis?: "allowable" | "en1993" | "aisc360" | string;
  method?: "ASD" | "LRFD" | string;
  restraint?: unknown;
  supports?: { stiffened?: boolean } | null;
  deflection?: unknown;
  slenderness?: unknown;
}

/** The words shown wherever allowable-basis results appear (member-checks.md §2). */
export const STRESSES_ONLY = "stresses only: no stability checks";

const VERIFY =
  "Verify every result against the governing local design code and have it approved by a licensed engineer before fabrication.";

/** What a code basis's caution says; one sentence shape serves both codes so their cautions cannot drift apart. */
interface CodeCaution {
  basisName: (method: string | undefined) => string;
  /** Checks always made, listed before lateral-torsional buckling. */
  strength: string[];
  /** Covered when the brief states a restraint length. */
  ltb: string;
  /** Not covered when it does not. */
  noLtb: string;
  /** Checks always made, listed after lateral-torsional buckling. */
  shearAndWeld: string[];
  /** Covered at unstiffened supports. */
  unstiffenedSupport: string;
  /** Not covered where supports are stiffened (the default). */
  stiffenedSupport: string;
  /** Sections or mechanisms the basis leaves out, before the list every code basis leaves out. */
  excluded: string[];
  /** What the record calls its departures from the full code ("choices", "simplifications")... */
  choicesWord: string;
  /** ...and their list, as the record states them. */
  choices: string;
}

const CODE_CAUTIONS: Record<"aisc360" | "en1993", CodeCaution> = {
  aisc360: {
    basisName: (method) =>
      `AISC 360-16 basis (${method === "ASD" ? "ASD: available strength Rn/Ω" : method === "LRFD" ? "LRFD: available strength φRn" : "ASD or LRFD"})`,
    strength: [
      "width-to-thickness classification (AISC 360-16 Table B4.1b, welded flanges with kc)",
      "Chapter F flexure (yielding, flange and web local buckling, tension flange yielding, tee stems)",
    ],
    ltb: "lateral-torsional buckling over the stated unbraced length Lb with Cb",
    noLtb: "lateral-torsional buckling (the compression flange is taken as braced throughout)",
    shearAndWeld: [
      "shear by G2.1 (G3 for tees, G4 for boxes) without tension field action",
      "the flange-to-web fillet welds (J2, Table J2.4 minimum size)",
    ],
    unstiffenedSupport: "web local yielding and web crippling at an end support (J10.2, J10.3)",
    stiffenedSupport: "web local yielding or crippling at supports (bearing stiffeners are assumed there and must be provided)",
    excluded: [
      "web local yielding or crippling under concentrated loads within the span",
      "box sections with slender webs and channels with noncompact webs (excluded)",
      "tension field action",
    ],
    choicesWord: "choices",
    // the engine's stated choices (basis/aisc360.ts design notes) that change a strength, as the record words them
    choices:
      'equations marked "mem." recalled from memory, channels\' flange local buckling by F3\'s expressions with the load through the shear centre, ' +
      "shear of bars by G2-1's expression, k = tf at welded supports (the weld leg left out), the weld leg at most the thinner part joined",
  },
  en1993: {
    basisName: () => "EN 1993 basis",
    strength: ["cross-section class (EN 1993-1-1 Table 5.2)", "bending resistance"],
    ltb: "lateral-torsional buckling over the stated restraint length",
    noLtb: "lateral-torsional buckling (the compression flange is taken as restrained throughout)",
    shearAndWeld: ["shear with shear buckling", "bending with shear", "the flange-to-web weld throat"],
    unstiffenedSupport: "web crippling (patch loading) at an end support",
    stiffenedSupport: "web crippling or bearing at supports (bearing stiffeners are assumed there and must be provided)",
    excluded: [],
    choicesWord: "simplifications",
    choices: "class 4 excluded, tee stems as outstands, the general lateral-torsional buckling case, web-only shear buckling",
  },
};

/**
 * The caution's text for a problem's basis. Without a problem: on the section bench ("bench") it
 * speaks of properties alone; on a project-wide page ("project", briefs of either basis) it
 * sends the reader to each brief's own caution.
 */
export function cautionText(p?: CautionBasis | null, scope: "bench" | "project" = "bench"): string {
  if (!p && scope === "project") {
    return (
      "Sparwise is a sizing aid. Each brief's sections were checked on that brief's design basis only (allowable stresses: " +
      `${STRESSES_ONLY}; EN 1993 and AISC 360: the member checks its sweep page lists); none covers connections, fatigue, fire or load ` +
      `combinations. ${VERIFY}`
    );
  }
  if (!p) {
    return (
      "Sparwise is a sizing aid. The section bench computes section properties and elastic stresses only; it checks no " +
      `resistance, stability, connection, fatigue or fire. ${VERIFY}`
    );
  }
  const code = p.basis === "aisc360" || p.basis === "en1993" ? CODE_CAUTIONS[p.basis] : null;
  if (code) {
    const stiffened = p.supports?.stiffened !== false;
    const covers = [
      ...code.strength,
      p.restraint ? code.ltb : null,
      ...code.shearAndWeld,
      stiffened ? null : code.unstiffenedSupport,
      p.deflection ? "deflection" : null,
      p.slenderness && Object.keys(p.slenderness).length ? "the slenderness limits given" : null,
    ].filter(Boolean);
    const notCovered = [
      p.restraint ? null : code.noLtb,
      stiffened ? code.stiffenedSupport : null,
      ...code.excluded,
      "connections",
      "fatigue",
      "fire",
      "load combinations",
      "torsion",
    ].filter(Boolean);
    return (
      `Sparwise is a sizing aid. On the ${code.basisName(p.method)} its checks cover only ${covers.join(", ")}; ` +
      `they do not cover ${notCovered.join(", ")}, and they make the ${code.choicesWord} stated in the record (${code.choices}). ${VERIFY}`
    );
  }
  return (
    `Sparwise is a sizing aid. On the allowable-stress basis (${STRESSES_ONLY}) its checks cover only the elastic bending ` +
    "stress, shear stress and plate slenderness rules listed (and deflection, when a limit is given); they do not cover " +
    "lateral-torsional buckling or any other stability check, web crippling, connections, fatigue, fire or load " +
    `combinations. ${VERIFY}`
  );
}

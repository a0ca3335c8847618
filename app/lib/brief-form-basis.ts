// The brief editor's design-basis fields (member-checks.md §2–§3) ↔ the SearchProblem's
// `basis`, `steel`, `restraint`, `supports` and `fabrication`. Field names are the problem's
// own dotted paths (`steel.fu`, `restraint.length`, `steel.fy[1].fy`), so the engine's issues
// land on the field that caused them; this module only converts units at the edge and turns
// the form's words (a "restrained throughout" tick, a yes/no for stiffeners) into the
// problem's values. The rules stay in searchProblemSchema. brief-form.ts wires it in.
import { z } from "zod";
import { AISC360_DEFAULTS, AISC360_GRADES, AISC360_METHODS, AISC360_PLATE_GRADES, BASES, EN1993_DEFAULTS, EN1993_GRADES, LOAD_POSITIONS, type En1993Grade, type SearchProblem } from "~/optimizer/search-schema";
import type { Quantity } from "~/optimizer/units";
import { matchMomentDiagram, momentDiagram } from "~/lib/moment-diagrams";

/** Rows of the fy-band table the editor shows; blank rows are dropped (EN 10025-2 lists up to six bands to 150 mm). */
export const FY_BAND_ROWS = 5;

/** Quantities of the basis fields with one fixed path (the bands' are in bandQuantity). */
export const BASIS_FIELD_QUANTITIES = {
  "steel.fu": "stress",
  "steel.E": "stress",
  "steel.G": "stress",
  "aisc.Fy": "stress",
  "aisc.Fu": "stress",
  "aisc.E": "stress",
  "aisc.G": "stress",
  "aisc.FEXX": "stress",
  "restraint.length": "span",
  "supports.bearingLength": "length",
  "fabrication.minThickness": "length",
  "fabrication.minBoxClear": "length",
} as const satisfies Record<string, Quantity>;

const BAND_PATH = /^steel\.fy\[(\d+)\]\.(maxThickness|fy)$/;
/** The quantity of an fy-band field ("steel.fy[2].fy" → stress), or undefined for any other path. */
export function bandQuantity(path: string): Quantity | undefined {
  const m = BAND_PATH.exec(path);
  return m ? (m[2] === "fy" ? "stress" : "length") : undefined;
}

/** The EN 1993 grade presets the engine defines (EN1993_GRADES), in the editor's order. */
export const EN1993_GRADE_NAMES = Object.keys(EN1993_GRADES) as En1993Grade[];
/** The grade a new brief starts from (member-checks.md §3: "new briefs default to EN 1993 with the S355 preset"). */
export const DEFAULT_GRADE: En1993Grade = "S355";

/** What a grade preset writes into the form, in SI: the engine's own preset values, nothing derived here. */
export function gradeFill(grade: En1993Grade): { fy: { maxThickness: number; fy: number }[]; fu: number; betaW: number } {
  const g = EN1993_GRADES[grade];
  return { fy: g.fy.map((b) => ({ maxThickness: b.maxThickness, fy: b.fy })), fu: g.fu, betaW: g.betaW };
}

/** The AISC 360 plate presets the engine defines (A992 is for catalogue sections only). */
export const AISC_GRADE_NAMES = AISC360_PLATE_GRADES;
export const DEFAULT_AISC_GRADE = "A572 Gr 50" as const;
/** What an AISC plate preset writes into the form, in SI (the engine's own values). */
export function aiscGradeFill(grade: (typeof AISC360_PLATE_GRADES)[number]): { Fy: number; Fu: number } {
  const g = AISC360_GRADES[grade];
  return { Fy: g.Fy, Fu: g.Fu };
}

/**
 * The moment diagram a new brief starts from: a simply supported floor beam under uniform load,
 * loaded on its top flange (the destabilising position, so the default errs on the safe side).
 */
export const DEFAULT_MOMENT_DIAGRAM = "udl-simple";

// Unreadable text becomes NaN, reported by brief-form's transform beside the other errors.
const num = (name: string) => z.number({ error: `${name} must be a number` }).optional().catch(Number.NaN);

/** Spread into the brief form's zod object (brief-form.ts). */
export const basisFormShape = {
  basis: z.enum(BASES, { error: 'basis must be "allowable", "en1993" or "aisc360"' }).default("allowable"),
  method: z.enum(AISC360_METHODS, { error: 'method must be "ASD" or "LRFD"' }).optional(),
  aisc: z
    .object({
      grade: z.string().max(40, "aisc.grade: at most 40 characters").optional(),
      Fy: num("aisc.Fy"),
      Fu: num("aisc.Fu"),
      E: num("aisc.E"),
      G: num("aisc.G"),
      FEXX: num("aisc.FEXX"),
    })
    .default({}),
  steel: z
    .object({
      grade: z.string().max(40, "steel.grade: at most 40 characters").optional(),
      fy: z
        .array(z.object({ maxThickness: num("steel.fy[].maxThickness"), fy: num("steel.fy[].fy") }).default({}))
        .max(20, "steel.fy: at most 20 bands")
        .default([]),
      fu: num("steel.fu"),
      E: num("steel.E"),
      G: num("steel.G"),
      gammaM0: num("steel.gammaM0"),
      gammaM1: num("steel.gammaM1"),
      gammaM2: num("steel.gammaM2"),
      eta: num("steel.eta"),
      betaW: num("steel.betaW"),
    })
    .default({ fy: [] }),
  /** ticked: no restraint block, the compression flange is restrained throughout (no LTB check) */
  restraintThroughout: z.boolean({ error: "restraintThroughout must be on or off" }).optional(),
  /** the moment-diagram preset last chosen; only fills C1, C2, C3 (not stored) */
  momentDiagram: z.string().max(60, "momentDiagram: at most 60 characters").optional(),
  restraint: z
    .object({
      length: num("restraint.length"),
      C1: num("restraint.C1"),
      C2: num("restraint.C2"),
      C3: num("restraint.C3"),
      Cb: num("restraint.Cb"),
      loadAt: z.enum(LOAD_POSITIONS, { error: "restraint.loadAt: choose top flange, shear centre or bottom flange" }).optional(),
    })
    .default({}),
  supports: z
    .object({
      stiffened: z.enum(["yes", "no"], { error: 'supports.stiffened must be "yes" or "no"' }).optional(),
      bearingLength: num("supports.bearingLength"),
    })
    .default({}),
  fabrication: z
    .object({
      minThickness: num("fabrication.minThickness"),
      flangeAtLeastWeb: z.boolean({ error: "fabrication.flangeAtLeastWeb must be on or off" }).optional(),
      minBoxClear: num("fabrication.minBoxClear"),
    })
    .default({}),
};
const basisForm = z.object(basisFormShape);
export type BasisFormValues = z.output<typeof basisForm>;

/** Converts one shown number to SI (brief-form's exact converter: untouched fields keep their exact SI value). */
export type ToSI = (key: string, q: Quantity, v: number | undefined) => number | undefined;

const defined = <T extends Record<string, unknown>>(o: T): Partial<T> => Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;

/**
 * The basis fields as SearchProblem input (SI, not yet validated), plus the form row each fy
 * band came from (blank rows are dropped, so the engine's `steel.fy[i]` is mapped back to the row).
 */
export function basisToProblemInput(f: BasisFormValues, si: ToSI): { fields: Record<string, unknown>; bandRows: number[] } {
  const out: Record<string, unknown> = { basis: f.basis };
  const bandRows: number[] = [];
  // Fabrication rules are grid filters under either basis (search-schema.ts).
  const fab = defined({
    minThickness: si("fabrication.minThickness", "length", f.fabrication.minThickness),
    flangeAtLeastWeb: f.fabrication.flangeAtLeastWeb ? true : undefined,
    minBoxClear: si("fabrication.minBoxClear", "length", f.fabrication.minBoxClear),
  });
  if (Object.keys(fab).length) out.fabrication = fab;
  if (f.basis === "aisc360") {
    const a = f.aisc;
    if (f.method) out.method = f.method;
    out.aisc = defined({
      grade: a.grade?.trim() ? a.grade.trim() : undefined,
      Fy: si("aisc.Fy", "stress", a.Fy),
      Fu: si("aisc.Fu", "stress", a.Fu),
      E: si("aisc.E", "stress", a.E),
      G: si("aisc.G", "stress", a.G),
      FEXX: si("aisc.FEXX", "stress", a.FEXX),
    });
    if (!f.restraintThroughout) out.restraint = { length: si("restraint.length", "span", f.restraint.length), ...defined({ Cb: f.restraint.Cb }) };
    out.supports = defined({ stiffened: f.supports.stiffened !== "no", bearingLength: si("supports.bearingLength", "length", f.supports.bearingLength) });
    return { fields: out, bandRows };
  }
  if (f.basis !== "en1993") return { fields: out, bandRows };
  const s = f.steel;
  const bands: { maxThickness?: number; fy?: number }[] = [];
  s.fy.forEach((b, i) => {
    if (b.maxThickness === undefined && b.fy === undefined) return;
    bandRows.push(i);
    bands.push({ maxThickness: si(`steel.fy[${i}].maxThickness`, "length", b.maxThickness), fy: si(`steel.fy[${i}].fy`, "stress", b.fy) });
  });
  out.steel = defined({
    grade: s.grade?.trim() ? s.grade.trim() : undefined,
    // No band typed: left out, so the engine fills a named preset's bands or names the field.
    fy: bands.length ? bands : undefined,
    fu: si("steel.fu", "stress", s.fu),
    E: si("steel.E", "stress", s.E),
    G: si("steel.G", "stress", s.G),
    gammaM0: s.gammaM0,
    gammaM1: s.gammaM1,
    gammaM2: s.gammaM2,
    eta: s.eta,
    betaW: s.betaW,
  });
  if (!f.restraintThroughout) {
    const r = f.restraint;
    // A blank length still goes to the engine (as undefined), so the field is named; see basisIssues.
    out.restraint = { length: si("restraint.length", "span", r.length), ...defined({ C1: r.C1, C2: r.C2, C3: r.C3, loadAt: r.loadAt }) };
  }
  out.supports = defined({ stiffened: f.supports.stiffened !== "no", bearingLength: si("supports.bearingLength", "length", f.supports.bearingLength) });
  return { fields: out, bandRows };
}

/** The form's own plain-word messages, checked before the engine's (which would name only the path). */
export function basisIssues(f: BasisFormValues): { path: string[]; message: string }[] {
  const issues: { path: string[]; message: string }[] = [];
  if (f.basis === "allowable") return issues;
  if (f.basis === "aisc360" && !f.method) issues.push({ path: ["method"], message: "method: choose ASD or LRFD" });
  if (!f.restraintThroughout && f.restraint.length === undefined)
    issues.push({
      path: ["restraint", "length"],
      message:
        f.basis === "aisc360"
          ? "restraint.length: enter the unbraced length Lb of the compression flange, or tick “braced throughout”"
          : "restraint.length: enter the longest distance between lateral restraints of the compression flange, or tick “restrained throughout”",
    });
  if (f.supports.stiffened === "no" && f.supports.bearingLength === undefined)
    issues.push({ path: ["supports", "bearingLength"], message: "supports.bearingLength: without bearing stiffeners, enter the stiff bearing length at the support" });
  return issues;
}

/** An engine issue's path as the form field it belongs to (fy bands back to the row typed). */
export function basisIssuePath(path: (string | number)[], bandRows: number[]): (string | number)[] | null {
  if (path[0] === "steel" && path[1] === "fy" && typeof path[2] === "number") return ["steel", "fy", bandRows[path[2]] ?? path[2], ...path.slice(3)];
  return null;
}

/** brief-form's display of an SI value in the form's units (six figures). */
export type FromSI = (q: Quantity, x: number | undefined) => number | undefined;

/** A stored problem's basis fields → the form's default values (shown through `v`), and the exact SI values behind them. */
export function basisFormDefaults(problem: SearchProblem, v: FromSI): { values: Record<string, unknown>; si: Record<string, unknown> } {
  const basis = problem.basis ?? "allowable";
  // A brief without EN 1993 steel (every allowable brief) offers the default grade's preset, so a switch of basis starts filled in.
  const steel = problem.steel ?? { grade: DEFAULT_GRADE, ...gradeFill(DEFAULT_GRADE), E: EN1993_DEFAULTS.E, G: EN1993_DEFAULTS.G, gammaM0: EN1993_DEFAULTS.gammaM0, gammaM1: EN1993_DEFAULTS.gammaM1, gammaM2: EN1993_DEFAULTS.gammaM2, eta: EN1993_DEFAULTS.eta };
  const bands = steel.fy.map((b) => ({ maxThickness: v("length", b.maxThickness), fy: v("stress", b.fy) }));
  while (bands.length < FY_BAND_ROWS) bands.push({ maxThickness: undefined, fy: undefined });
  const dflt = momentDiagram(DEFAULT_MOMENT_DIAGRAM)!;
  const r = problem.restraint;
  const C = r ? { C1: r.C1, C2: r.C2, C3: r.C3 } : { C1: dflt.C1, C2: dflt.C2, C3: dflt.C3 };
  const fab = problem.fabrication ?? {};
  const aisc = problem.aisc ?? { grade: DEFAULT_AISC_GRADE, ...aiscGradeFill(DEFAULT_AISC_GRADE), E: AISC360_DEFAULTS.E, G: AISC360_DEFAULTS.G, FEXX: AISC360_DEFAULTS.FEXX };
  const si: Record<string, unknown> = {
    "aisc.Fy": aisc.Fy,
    "aisc.Fu": aisc.Fu,
    "aisc.E": aisc.E,
    "aisc.G": aisc.G,
    "aisc.FEXX": aisc.FEXX,
    "steel.fu": steel.fu,
    "steel.E": steel.E,
    "steel.G": steel.G,
    "restraint.length": r?.length,
    "supports.bearingLength": problem.supports?.bearingLength,
    "fabrication.minThickness": fab.minThickness,
    "fabrication.minBoxClear": fab.minBoxClear,
  };
  steel.fy.forEach((b, i) => {
    si[`steel.fy[${i}].maxThickness`] = b.maxThickness;
    si[`steel.fy[${i}].fy`] = b.fy;
  });
  return {
    si,
    values: {
      basis,
      steel: {
        grade: steel.grade ?? "",
        fy: bands,
        fu: v("stress", steel.fu),
        E: v("stress", steel.E),
        G: v("stress", steel.G),
        gammaM0: steel.gammaM0,
        gammaM1: steel.gammaM1,
        gammaM2: steel.gammaM2,
        eta: steel.eta,
        betaW: steel.betaW,
      },
      method: problem.method ?? "ASD",
      aisc: { grade: aisc.grade ?? "", Fy: v("stress", aisc.Fy), Fu: v("stress", aisc.Fu), E: v("stress", aisc.E), G: v("stress", aisc.G), FEXX: v("stress", aisc.FEXX) },
      // A limit-state brief without a restraint block states the flange restrained throughout.
      restraintThroughout: (basis === "en1993" || basis === "aisc360") && !r,
      momentDiagram: matchMomentDiagram(C.C1, C.C2, C.C3)?.id ?? "",
      restraint: { length: v("span", r?.length), C1: C.C1, C2: C.C2, C3: C.C3, Cb: r?.Cb ?? 1, loadAt: r?.loadAt ?? (r ? "shearCentre" : "top") },
      supports: { stiffened: problem.supports?.stiffened === false ? "no" : "yes", bearingLength: v("length", problem.supports?.bearingLength) },
      fabrication: { minThickness: v("length", fab.minThickness), flangeAtLeastWeb: fab.flangeAtLeastWeb ?? false, minBoxClear: v("length", fab.minBoxClear) },
    },
  };
}


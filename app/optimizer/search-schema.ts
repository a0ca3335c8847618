// The SearchProblem schema (engine contract, `SearchProblem`) plus the issue's extensions
// (deflection check, cost objective). Single source of truth for the brief form, the API
// routes, the queue and the search itself. Units as the contract: mm, kN·m, kN, MPa, kg/m³;
// the deflection span is in m and its load in kN/m (the way beam tables state them).
import { z } from "zod";
import { FAMILIES, FAMILY_DIMENSIONS, type Family } from "./geometry";
import { DEFAULT_DENSITY } from "./schema";
import { MAX_DENSITY } from "./validate";
import { CATALOGUE_SHAPES, catalogueSectionSchema } from "./catalogue";
import { costsSchema } from "./cost";
import { toSI } from "./units";

/** A brief may search this many catalogues and this many catalogue sections in all. */
export const MAX_CATALOGUES = 10;
export const MAX_CATALOGUE_SECTIONS = 4000;

/**
 * Largest grid one request may define, counted as the plain product of the axes per family
 * (before the geometry rules drop invalid shapes), summed over the families.
 *
 * Why 1e11 and not something like 5e7: the exact search never walks the grid (it bounds
 * whole rows of it), so its run time follows how many shapes come near the optimum, not the
 * grid size; a mono-i grid at 1 mm steps (≈ 5e10) is an intended use. The cap stops requests
 * whose axes alone would be absurd. Brute force (the test/benchmark reference) has its own,
 * much smaller cap, BRUTE_FORCE_MAX_GRID in brute-force.ts.
 */
export const MAX_GRID_CANDIDATES = 1e11;
/**
 * At most this many combinations of depth and plate thicknesses (summed over the families):
 * the search keeps one small record per combination (≈ 30 bytes), so this bounds its memory
 * (≈ 150 MB) whatever the widths. A mono-i grid at 1 mm depth steps with ten thicknesses is 1e6.
 */
export const MAX_GRID_ROWS = 5_000_000;
/** At most this many values per axis (depth or width), so the grid arrays stay small. */
export const MAX_AXIS_VALUES = 100_000;
/** At most this many distinct plate thicknesses in the stock list. */
export const MAX_THICKNESSES = 100;

// Values within this fraction of a step of `max` count as landing on `max` (floating point:
// 0.1 + 2·0.1 > 0.3). The value itself is still min + k·step, as the contract says.
const GRID_EPS = 1e-9;

const finite = (name: string) =>
  z.number({ error: `${name} must be a number` }).refine(Number.isFinite, { message: `${name} must be a finite number` });
const positive = (name: string) => finite(name).refine((x) => x > 0, { message: `${name} must be > 0` });

/**
 * Ranges that keep every intermediate of the checks finite and non-zero in double precision
 * (I ~ length⁴, Iz·Iy ~ length⁸, moments in N·mm): without them a 1e200 mm depth gives Iz =
 * Infinity and a zero stress, a 1e-120 mm plate an area that underflows to 0, and the search
 * answers with a wrong reason or an error that names no field. Far wider than any beam
 * (1 µm … 1 km; 1e12 kN·m), so no real brief meets them. The contract is silent on ranges.
 */
export const LENGTH_RANGE = [1e-6, 1e6] as const;
export const MAX_ACTION = 1e12;
const nonNegative = (name: string) => finite(name).refine((x) => x >= 0, { message: `${name} must be ≥ 0` });
const within = (name: string, lo: number, hi: number, unit: string) =>
  positive(name).refine((x) => x >= lo && x <= hi, { message: `${name} must be between ${lo} and ${hi} ${unit}`.trimEnd() });
const length = (name: string) => within(name, LENGTH_RANGE[0], LENGTH_RANGE[1], "mm");
const action = (name: string, unit: string) =>
  nonNegative(name).refine((x) => x <= MAX_ACTION, { message: `${name} must be at most ${MAX_ACTION} ${unit}` });

const axisSchema = (name: string) =>
  z
    .object({
      min: length(`${name}.min`),
      max: length(`${name}.max`),
      step: positive(`${name}.step`),
    })
    .superRefine((a, ctx) => {
      if (!(a.max >= a.min)) ctx.addIssue({ code: "custom", path: ["max"], message: `${name}.max must be ≥ ${name}.min` });
      else if (axisCount(a) > MAX_AXIS_VALUES)
        ctx.addIssue({
          code: "custom",
          path: ["step"],
          message: `${name}: ${axisCount(a).toLocaleString("en")} values; at most ${MAX_AXIS_VALUES.toLocaleString("en")} per axis (raise ${name}.step)`,
        });
    });

export const familySchema = z.enum(FAMILIES, { error: (iss) => `unknown family "${String(iss.input)}" (one of ${FAMILIES.join(", ")})` });

export const CHECK_NAMES = [
  "bending-compression",
  "bending-tension",
  "shear",
  "slenderness-outstand",
  "slenderness-internal",
  "slenderness-web",
  "slenderness-stem",
  "deflection",
  // EN 1993 basis (member-checks.md §2), in its numbering: ties in governing go to the first
  "class-4",
  "bending-resistance",
  "ltb",
  "shear-resistance",
  "shear-buckling",
  "bending-shear",
  "weld",
  "bearing",
] as const;
export type CheckName = (typeof CHECK_NAMES)[number];

/**
 * Design bases (member-checks.md §2): "allowable" = typed allowable stresses; "en1993" = limit
 * states to EN 1993; "aisc360" = AISC 360-16, ASD or LRFD (issue 14).
 */
export const BASES = ["allowable", "en1993", "aisc360"] as const;
export type Basis = (typeof BASES)[number];

/** Families the EN 1993 basis covers (member-checks.md §2); the others need the allowable basis. */
export const EN1993_FAMILIES = ["i", "mono-i", "channel", "tee", "box", "rectangle"] as const satisfies readonly Family[];
export const EN1993_REFUSAL = "not covered by the EN 1993 basis; use the allowable-stress basis";

/**
 * EN 1993 grade presets: fy bands by plate thickness, fu and the weld correlation factor βw.
 * fy: EN 10025-2 Table 7, nominal yield ReH for t ≤ 16 / ≤ 40 / ≤ 63 mm; fu: EN 10025-2 Table 7
 * for 3 ≤ t ≤ 100 mm (360 / 410 / 470; chosen over EN 1993-1-1 Table 3.1's 360 / 430 / 510
 * for t ≤ 40 mm so one fu holds over every band); βw: EN 1993-1-8 Table 4.1 (0.8 / 0.85 / 0.9).
 * All from memory (member-checks.md lists the same figures, marked mem.).
 */
export const EN1993_GRADES = {
  S235: { fy: [{ maxThickness: 16, fy: 235 }, { maxThickness: 40, fy: 225 }, { maxThickness: 63, fy: 215 }], fu: 360, betaW: 0.8 },
  S275: { fy: [{ maxThickness: 16, fy: 275 }, { maxThickness: 40, fy: 265 }, { maxThickness: 63, fy: 255 }], fu: 410, betaW: 0.85 },
  S355: { fy: [{ maxThickness: 16, fy: 355 }, { maxThickness: 40, fy: 345 }, { maxThickness: 63, fy: 335 }], fu: 470, betaW: 0.9 },
} as const;
export type En1993Grade = keyof typeof EN1993_GRADES;
/**
 * Steel constants and partial factors when the brief leaves them out: E = 210 000 MPa and
 * G = 81 000 MPa (EN 1993-1-1 §3.2.6(1)); γM0 = 1.00, γM1 = 1.00, γM2 = 1.25 (EN 1993-1-1
 * §6.1(1) Note 2B, the recommended values); η = 1.2 (EN 1993-1-5 §5.1(2) Note 2, steels up
 * to S460). βw without a preset grade: 1.0, the largest in EN 1993-1-8 Table 4.1 (the
 * thickest weld), so an unknown steel is never credited with a stronger weld than it has.
 * From memory.
 */
export const EN1993_DEFAULTS = { E: 210000, G: 81000, gammaM0: 1.0, gammaM1: 1.0, gammaM2: 1.25, eta: 1.2, betaW: 1.0 } as const;
/** Families the AISC 360-16 basis covers (Chapter F: F2–F5 I and channel, F7 box, F9 tee, F11 bar). */
export const AISC360_FAMILIES = EN1993_FAMILIES;
export const AISC360_REFUSAL = "not covered by the AISC 360 basis; use the allowable-stress basis";
/** AISC 360-16 §B3.1, B3.2: Load and Resistance Factor Design (φ) or Allowable Strength Design (Ω). */
export const AISC360_METHODS = ["ASD", "LRFD"] as const;
export type Aisc360Method = (typeof AISC360_METHODS)[number];
const ksi = (x: number) => toSI("stress", x, "us");
/**
 * AISC 360 grade presets: Fy, Fu (ASTM minima as tabulated in the AISC Steel Construction Manual
 * Table 2-3, from memory) and the thickest plate the specification covers at that Fy (A36 to 8 in,
 * A572 Gr 50 to 4 in; from memory). A992 is a rolled-shape specification (W shapes): offered for
 * catalogue sections only, never for plate (`aisc.rolledGrade`).
 */
export const AISC360_GRADES = {
  A36: { Fy: ksi(36), Fu: ksi(58), maxThickness: 203.2, plate: true },
  "A572 Gr 50": { Fy: ksi(50), Fu: ksi(65), maxThickness: 101.6, plate: true },
  A992: { Fy: ksi(50), Fu: ksi(65), maxThickness: Infinity, plate: false },
} as const;
export type Aisc360Grade = keyof typeof AISC360_GRADES;
export const AISC360_PLATE_GRADES = ["A36", "A572 Gr 50"] as const satisfies readonly Aisc360Grade[];
/**
 * E = 29,000 ksi and G = 11,200 ksi (AISC 360-16 §B, Symbols / Chapter E, F notation); FEXX =
 * 70 ksi, the E70 electrode that matches A36, A572 Gr 50 and A992 (AISC 360-16 Table J2.5 note,
 * common practice). Converted once here through units.ts.
 */
export const AISC360_DEFAULTS = { E: ksi(29000), G: ksi(11200), FEXX: ksi(70) } as const;

const aiscGradeKey = (g: string | undefined): Aisc360Grade | undefined => {
  const k = g?.trim().toUpperCase().replace(/\s+/g, " ");
  return (Object.keys(AISC360_GRADES) as Aisc360Grade[]).find((n) => n.toUpperCase() === k);
};

const aiscSchema = z
  .object({
    /** plate grade: "A36" or "A572 Gr 50" fill Fy, Fu; any other name needs Fy and Fu typed */
    grade: z.string({ error: "aisc.grade must be text" }).max(40, { message: "aisc.grade: at most 40 characters" }).optional(),
    Fy: within("aisc.Fy", 1, 5000, "MPa").optional(),
    Fu: within("aisc.Fu", 1, 10000, "MPa").optional(),
    E: within("aisc.E", 1, 1e7, "MPa").default(AISC360_DEFAULTS.E),
    G: within("aisc.G", 1, 1e7, "MPa").default(AISC360_DEFAULTS.G),
    FEXX: within("aisc.FEXX", 1, 10000, "MPa").default(AISC360_DEFAULTS.FEXX),
    /** catalogue (rolled) sections: their grade, A992 unless given */
    rolledGrade: z.string({ error: "aisc.rolledGrade must be text" }).max(40, { message: "aisc.rolledGrade: at most 40 characters" }).default("A992"),
    rolledFy: within("aisc.rolledFy", 1, 5000, "MPa").optional(),
  })
  .transform((s, ctx) => {
    const key = aiscGradeKey(s.grade);
    if (key !== undefined && !AISC360_GRADES[key].plate) {
      ctx.addIssue({ code: "custom", path: ["grade"], message: `aisc.grade: ${key} is a rolled-shape specification, for catalogue sections only (aisc.rolledGrade); plate needs ${AISC360_PLATE_GRADES.join(" or ")}, or Fy and Fu typed` });
      return z.NEVER;
    }
    const preset = key !== undefined ? AISC360_GRADES[key] : undefined;
    const Fy = s.Fy ?? preset?.Fy;
    const Fu = s.Fu ?? preset?.Fu;
    if (Fy === undefined) ctx.addIssue({ code: "custom", path: ["Fy"], message: `aisc.Fy is required unless aisc.grade names a preset (${AISC360_PLATE_GRADES.join(", ")})` });
    if (Fu === undefined) ctx.addIssue({ code: "custom", path: ["Fu"], message: `aisc.Fu is required unless aisc.grade names a preset (${AISC360_PLATE_GRADES.join(", ")})` });
    const rk = aiscGradeKey(s.rolledGrade);
    const rolledFy = s.rolledFy ?? (rk !== undefined ? AISC360_GRADES[rk].Fy : undefined);
    if (rolledFy === undefined) ctx.addIssue({ code: "custom", path: ["rolledFy"], message: "aisc.rolledFy is required unless aisc.rolledGrade names a preset (A992, A572 Gr 50, A36)" });
    if (Fy === undefined || Fu === undefined || rolledFy === undefined) return z.NEVER;
    return { ...s, grade: key ?? s.grade, Fy, Fu, rolledFy, maxThickness: preset?.maxThickness };
  });

export const LOAD_POSITIONS = ["top", "shearCentre", "bottom"] as const;
export type LoadPosition = (typeof LOAD_POSITIONS)[number];

const ratio = (name: string, lo: number, hi: number) => within(name, lo, hi, "");
const factor = (name: string) => finite(name).refine((x) => Math.abs(x) <= 100, { message: `${name} must be between −100 and 100` });

const steelSchema = z
  .object({
    grade: z.string({ error: "steel.grade must be text" }).max(40, { message: "steel.grade: at most 40 characters" }).optional(),
    fy: z
      .array(z.object({ maxThickness: length("steel.fy[].maxThickness"), fy: within("steel.fy[].fy", 1, 5000, "MPa") }), {
        error: "steel.fy must be a list of { maxThickness, fy } bands",
      })
      .min(1, { message: "steel.fy must list at least one band" })
      .max(20, { message: "steel.fy: at most 20 bands" })
      .optional(),
    fu: within("steel.fu", 1, 10000, "MPa").optional(),
    E: within("steel.E", 1, 1e7, "MPa").default(EN1993_DEFAULTS.E),
    G: within("steel.G", 1, 1e7, "MPa").default(EN1993_DEFAULTS.G),
    gammaM0: ratio("steel.gammaM0", 0.5, 5).default(EN1993_DEFAULTS.gammaM0),
    gammaM1: ratio("steel.gammaM1", 0.5, 5).default(EN1993_DEFAULTS.gammaM1),
    gammaM2: ratio("steel.gammaM2", 0.5, 5).default(EN1993_DEFAULTS.gammaM2),
    eta: ratio("steel.eta", 1, 1.5).default(EN1993_DEFAULTS.eta),
    betaW: ratio("steel.betaW", 0.1, 2).optional(),
  })
  .superRefine((s, ctx) => {
    s.fy?.forEach((b, i) => {
      if (i > 0 && !(b.maxThickness > s.fy![i - 1].maxThickness))
        ctx.addIssue({ code: "custom", path: ["fy", i, "maxThickness"], message: `steel.fy[${i}].maxThickness must exceed steel.fy[${i - 1}].maxThickness (bands in ascending order)` });
    });
  })
  .transform((s, ctx) => {
    // A named preset grade fills what the brief leaves out; the brief's own values win.
    const key = s.grade?.trim().toUpperCase();
    const preset = key !== undefined && Object.hasOwn(EN1993_GRADES, key) ? EN1993_GRADES[key as En1993Grade] : undefined;
    const fy = s.fy ?? preset?.fy.map((b) => ({ ...b }));
    const fu = s.fu ?? preset?.fu;
    if (!fy) ctx.addIssue({ code: "custom", path: ["fy"], message: "steel.fy is required (bands of { maxThickness, fy }) unless steel.grade names a preset (S235, S275, S355)" });
    if (fu === undefined) ctx.addIssue({ code: "custom", path: ["fu"], message: "steel.fu is required unless steel.grade names a preset (S235, S275, S355)" });
    if (!fy || fu === undefined) return z.NEVER;
    return { ...s, fy, fu, betaW: s.betaW ?? preset?.betaW ?? EN1993_DEFAULTS.betaW };
  });

const restraintSchema = z.object({
  /** Longest segment between lateral-torsional restraints, m. */
  length: within("restraint.length", 1e-3, 1e3, "m"),
  C1: ratio("restraint.C1", 0.1, 100).default(1),
  C2: factor("restraint.C2").default(0),
  C3: factor("restraint.C3").default(1),
  loadAt: z.enum(LOAD_POSITIONS, { error: 'restraint.loadAt must be "top", "shearCentre" or "bottom"' }).default("shearCentre"),
  /**
   * AISC 360 basis: the lateral-torsional buckling modification factor (AISC 360-16 §F1, Eq. F1-1
   * gives it from the moment diagram; 1.0 is always conservative). F1-1 cannot fall below 1 nor
   * rise above 12.5/2.5 = 5, so a typed value outside [1, 5] is refused. Absent: 1.0 (aisc360.ts).
   */
  Cb: within("restraint.Cb", 1, 5, "").optional(),
});

const supportsSchema = z.object({
  stiffened: z.boolean({ error: "supports.stiffened must be true or false" }).default(true),
  /** Stiff bearing length at an end support, mm (patch loading, when not stiffened). */
  bearingLength: finite("supports.bearingLength")
    .refine((x) => x >= 0 && x <= LENGTH_RANGE[1], { message: `supports.bearingLength must be between 0 and ${LENGTH_RANGE[1]} mm` })
    .optional(),
});

const fabricationSchema = z.object({
  minThickness: length("fabrication.minThickness").optional(),
  flangeAtLeastWeb: z.boolean({ error: "fabrication.flangeAtLeastWeb must be true or false" }).optional(),
  minBoxClear: length("fabrication.minBoxClear").optional(),
});

export const searchProblemSchema = z
  .object({
    moment: z.object({
      sagging: action("moment.sagging", "kN·m").default(0),
      hogging: action("moment.hogging", "kN·m").default(0),
    }),
    shear: action("shear", "kN").optional(),
    /** member-checks.md §2: "allowable" (typed allowable stresses, the default) or "en1993". */
    basis: z.enum(BASES, { error: 'basis must be "allowable", "en1993" or "aisc360"' }).default("allowable"),
    /** AISC 360 basis: "ASD" (Ω) or "LRFD" (φ); required under "aisc360". */
    method: z.enum(AISC360_METHODS, { error: 'method must be "ASD" or "LRFD"' }).optional(),
    /** AISC 360 basis: the plate grade or Fy, Fu; E, G, FEXX; the catalogue sections' grade. */
    aisc: aiscSchema.optional(),
    /** Required under "allowable"; not used under "en1993". */
    allowable: z
      .object({
        tension: positive("allowable.tension"),
        compression: positive("allowable.compression"),
        shear: positive("allowable.shear").optional(),
      })
      .optional(),
    /** EN 1993 steel: fy bands by plate thickness, fu, E, G, partial factors, η, βw (required under "en1993"). */
    steel: steelSchema.optional(),
    /** Lateral-torsional restraint (EN 1993 basis); absent: compression flange restrained throughout. */
    restraint: restraintSchema.optional(),
    /** Bearing stiffeners at the supports (EN 1993 basis); unstiffened adds the patch-loading check. */
    supports: supportsSchema.default({ stiffened: true }),
    /** Fabrication rules: grid exclusions under either basis. */
    fabrication: fabricationSchema.optional(),
    depth: axisSchema("depth"),
    width: axisSchema("width"),
    thicknesses: z
      .array(length("thicknesses[]"), { error: "thicknesses must be a list of numbers" })
      .min(1, { message: "thicknesses must list at least one plate thickness" })
      .max(MAX_THICKNESSES, { message: `thicknesses: at most ${MAX_THICKNESSES} values` }),
    families: z
      .array(familySchema, { error: "families must be a list of family names" })
      .min(1, { message: "families must name at least one family" }),
    slenderness: z
      .object({
        outstand: positive("slenderness.outstand").optional(),
        internal: positive("slenderness.internal").optional(),
        web: positive("slenderness.web").optional(),
        stem: positive("slenderness.stem").optional(),
      })
      .optional(),
    density: positive("density").refine((x) => x <= MAX_DENSITY, { message: `density must be at most ${MAX_DENSITY} kg/m³` }).default(DEFAULT_DENSITY),
    /** Simply supported span under uniform service load: 5·w·L⁴/(384·E·I) ≤ L/limitRatio. */
    deflection: z
      .object({
        span: within("deflection.span", 1e-6, 1e3, "m"),
        serviceLoad: action("deflection.serviceLoad", "kN/m"),
        limitRatio: within("deflection.limitRatio", 1e-6, 1e9, ""),
        E: within("deflection.E", 1e-3, 1e9, "MPa"),
      })
      .optional(),
    /** "mass" (the contract's least area) or "cost": Σ plate mass × price of that plate's thickness. */
    objective: z.enum(["mass", "cost"], { error: 'objective must be "mass" or "cost"' }).default("mass"),
    /** Stock-list prices per kg by plate thickness; needed for every thickness when objective is "cost". */
    prices: z
      .array(z.object({ thickness: positive("prices[].thickness"), pricePerKg: positive("prices[].pricePerKg") }))
      .optional(),
    /** Cost objective: price per kg of rolled sections and the cost per metre of weld by throat (cost.ts). */
    costs: costsSchema.optional(),
    /**
     * Team catalogues searched beside the plate families (catalogue-search.ts): each with its
     * sections copied in, so a sweep's snapshot keeps what it searched whatever later happens to
     * the catalogue; `shapes` (optional) keeps only those shapes.
     */
    catalogues: z
      .array(
        z.object({
          name: z.string({ error: "catalogues[].name must be text" }).trim().min(1, "catalogues[].name is required").max(120, "catalogues[].name: at most 120 characters"),
          shapes: z.array(z.enum(CATALOGUE_SHAPES, { error: `catalogues[].shapes: one of ${CATALOGUE_SHAPES.join(", ")}` })).optional(),
          sections: z.array(catalogueSectionSchema).min(1, "catalogues[].sections: at least one section").max(MAX_CATALOGUE_SECTIONS, `catalogues[].sections: at most ${MAX_CATALOGUE_SECTIONS}`),
        }),
        { error: "catalogues must be a list of { name, sections }" },
      )
      .max(MAX_CATALOGUES, `catalogues: at most ${MAX_CATALOGUES}`)
      .optional(),
  })
  .superRefine((p, ctx) => {
    if (p.catalogues) {
      const total = p.catalogues.reduce((n, c) => n + c.sections.length, 0);
      if (total > MAX_CATALOGUE_SECTIONS)
        ctx.addIssue({ code: "custom", path: ["catalogues"], message: `catalogues: ${total} sections in all; at most ${MAX_CATALOGUE_SECTIONS} per brief` });
      if (p.objective === "cost" && p.catalogues.length && p.costs?.rolledPricePerKg === undefined)
        ctx.addIssue({ code: "custom", path: ["costs", "rolledPricePerKg"], message: 'costs.rolledPricePerKg is required when objective is "cost" and catalogues are searched' });
    }
    if (!(p.moment.sagging > 0 || p.moment.hogging > 0))
      ctx.addIssue({ code: "custom", path: ["moment"], message: "moment: sagging or hogging must be > 0" });
    if (p.basis === "allowable") {
      if (!p.allowable) ctx.addIssue({ code: "custom", path: ["allowable"], message: 'allowable is required when basis is "allowable" (tension, compression, and shear when a shear force is given)' });
      else if (p.shear !== undefined && p.shear > 0 && p.allowable.shear === undefined)
        ctx.addIssue({ code: "custom", path: ["allowable", "shear"], message: "allowable.shear is required when shear is given" });
    } else if (p.basis === "aisc360") {
      if (!p.method) ctx.addIssue({ code: "custom", path: ["method"], message: 'method is required when basis is "aisc360" ("ASD" or "LRFD")' });
      if (!p.aisc) ctx.addIssue({ code: "custom", path: ["aisc"], message: 'aisc is required when basis is "aisc360" (a plate grade, A36 or A572 Gr 50, or Fy and Fu)' });
      else if (p.aisc.maxThickness !== undefined) {
        const tMax = p.aisc.maxThickness;
        p.thicknesses.forEach((t, i) => {
          if (t > tMax)
            ctx.addIssue({ code: "custom", path: ["thicknesses", i], message: `thicknesses: ${t} mm is thicker than ${p.aisc!.grade} plate is specified for (${tMax} mm); remove the plate or type Fy and Fu` });
        });
      }
      p.families.forEach((f, i) => {
        if (!(AISC360_FAMILIES as readonly string[]).includes(f)) ctx.addIssue({ code: "custom", path: ["families", i], message: `families: "${f}" is ${AISC360_REFUSAL}` });
      });
      if (p.supports.stiffened === false && p.supports.bearingLength === undefined)
        ctx.addIssue({ code: "custom", path: ["supports", "bearingLength"], message: "supports.bearingLength is required when supports.stiffened is false (the bearing length lb, mm)" });
    } else {
      if (!p.steel) ctx.addIssue({ code: "custom", path: ["steel"], message: 'steel is required when basis is "en1993" (fy bands, fu; or a preset grade)' });
      else {
        // A section takes fy from the band holding its thickest plate; a plate beyond the last band has none.
        const last = p.steel.fy[p.steel.fy.length - 1].maxThickness;
        p.thicknesses.forEach((t, i) => {
          if (t > last)
            ctx.addIssue({ code: "custom", path: ["thicknesses", i], message: `thicknesses: ${t} mm is beyond the last fy band (steel.fy up to ${last} mm); add a band or remove the plate` });
        });
      }
      const lastBand = p.steel ? p.steel.fy[p.steel.fy.length - 1].maxThickness : Infinity;
      p.families.forEach((f, i) => {
        // a rectangle takes fy from its smaller side (member-checks.md, readings pinned): the
        // grid's largest such side must fall inside the bands too
        if (f === "rectangle" && p.depth.max >= p.depth.min && p.width.max >= p.width.min) {
          const nd = axisCount(p.depth) - 1,
            nw = axisCount(p.width) - 1;
          const side = Math.min(p.depth.min + nd * p.depth.step, p.width.min + nw * p.width.step);
          if (side > lastBand)
            ctx.addIssue({
              code: "custom",
              path: ["families", i],
              message: `families: "rectangle" sides up to ${side} mm are beyond the last fy band (steel.fy up to ${lastBand} mm); limit depth.max or width.max to ${lastBand} mm, or add a band`,
            });
        }
        if (!(EN1993_FAMILIES as readonly string[]).includes(f))
          ctx.addIssue({ code: "custom", path: ["families", i], message: `families: "${f}" is ${EN1993_REFUSAL}` });
      });
      if (p.supports.stiffened === false && p.supports.bearingLength === undefined)
        ctx.addIssue({ code: "custom", path: ["supports", "bearingLength"], message: "supports.bearingLength is required when supports.stiffened is false (the stiff bearing length, mm)" });
    }
    const seen = new Set<string>();
    p.families.forEach((f, i) => {
      if (seen.has(f)) ctx.addIssue({ code: "custom", path: ["families", i], message: `families lists "${f}" twice` });
      seen.add(f);
    });
    if (p.objective === "cost") {
      if (!p.prices || p.prices.length === 0)
        ctx.addIssue({ code: "custom", path: ["prices"], message: 'prices are required when objective is "cost"' });
      else
        for (const t of p.thicknesses)
          if (!p.prices.some((q) => q.thickness === t))
            ctx.addIssue({ code: "custom", path: ["prices"], message: `prices: no price for thickness ${t}` });
      if (p.families.includes("rectangle"))
        ctx.addIssue({
          code: "custom",
          path: ["families"],
          message: 'families: "rectangle" is not cut from stock plate, so it has no price; remove it or use objective "mass"',
        });
    }
    const okAxes = p.depth.max >= p.depth.min && p.width.max >= p.width.min;
    if (okAxes) {
      const n = rawGridSize(p);
      const rows = rawRowCount(p);
      if (rows > MAX_GRID_ROWS)
        ctx.addIssue({
          code: "custom",
          path: ["grid"],
          message: `grid: ${rows.toExponential(2)} combinations of depth and plate thicknesses, over the maximum of ${MAX_GRID_ROWS.toExponential(0)} per request (coarsen the depth step or list fewer thicknesses)`,
        });
      if (n > MAX_GRID_CANDIDATES)
        ctx.addIssue({
          code: "custom",
          path: ["grid"],
          message: `grid: ${n.toExponential(2)} candidates, over the maximum of ${MAX_GRID_CANDIDATES.toExponential(0)} per request (coarsen the steps or list fewer thicknesses or families)`,
        });
    }
  });

export type SearchProblemInput = z.input<typeof searchProblemSchema>;

/**
 * The example problem printed in the engine contract (engine-contract.md, "SearchProblem"), kept
 * once so the brief editor's defaults, the tests and the fixtures start from the same brief.
 */
export const CONTRACT_EXAMPLE_PROBLEM: SearchProblemInput = {
  moment: { sagging: 120, hogging: 0 },
  shear: 80,
  allowable: { tension: 165, compression: 165, shear: 100 },
  depth: { min: 100, max: 400, step: 10 },
  width: { min: 50, max: 300, step: 10 },
  thicknesses: [6, 8, 10, 12, 15, 20, 25],
  families: ["i", "channel", "tee", "box", "channel-down"],
  slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 },
  density: 7850,
};
export type SearchProblem = z.output<typeof searchProblemSchema>;
export interface GridAxis {
  min: number;
  max: number;
  step: number;
}

/** Number of grid values min + k·step not exceeding max (see GRID_EPS). */
export function axisCount(a: GridAxis): number {
  if (!(a.max >= a.min) || !(a.step > 0)) return 0;
  return Math.floor((a.max - a.min) / a.step + GRID_EPS) + 1;
}

/** The axis values, each computed as the product min + k·step (never by repeated addition). */
export function gridValues(a: GridAxis): Float64Array {
  const n = axisCount(a);
  const out = new Float64Array(n);
  for (let k = 0; k < n; k++) out[k] = a.min + k * a.step;
  return out;
}

/** Which grid each dimension comes from (engine contract: d from depth, widths from width, the rest from thicknesses). */
export type DimRole = "depth" | "width" | "thickness";
export function dimRole(family: Family, dim: string): DimRole {
  if (dim === "d") return "depth";
  if (dim === "b" || dim === "bt" || dim === "bb") return "width";
  return "thickness";
}

/** Plain product of the axes per family, summed: the figure MAX_GRID_CANDIDATES caps. */
export function rawGridSize(p: Pick<SearchProblem, "depth" | "width" | "thicknesses" | "families">): number {
  const nd = axisCount(p.depth),
    nw = axisCount(p.width),
    nt = new Set(p.thicknesses).size;
  let total = 0;
  for (const f of p.families) {
    let n = 1;
    for (const dim of FAMILY_DIMENSIONS[f]) {
      const r = dimRole(f, dim);
      n *= r === "depth" ? nd : r === "width" ? nw : nt;
    }
    total += n;
  }
  return total;
}

/** Combinations of depth and thicknesses (the widths left out), summed over the families: what MAX_GRID_ROWS caps. */
export function rawRowCount(p: Pick<SearchProblem, "depth" | "thicknesses" | "families">): number {
  const nd = axisCount(p.depth),
    nt = new Set(p.thicknesses).size;
  let total = 0;
  for (const f of p.families) {
    let n = 1;
    for (const dim of FAMILY_DIMENSIONS[f]) {
      const r = dimRole(f, dim);
      if (r === "depth") n *= nd;
      else if (r === "thickness") n *= nt;
    }
    total += n;
  }
  return total;
}

/** Parses or throws a zod error whose issues name the field (routes turn it into a 400). */
export function parseSearchProblem(input: unknown): SearchProblem {
  return searchProblemSchema.parse(input);
}

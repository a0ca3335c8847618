// Catalogue sections: rolled and hollow shapes picked from a table rather than cut from plate.
// One section = a designation, a shape and its dimensions in mm (and, as uploaded, the values the
// table prints). This module maps a section to the engine's SectionInput and checks printed
// values against the properties the engine computes from the dimensions, so a table with a
// typo is caught line by line (the upload, the starter catalogue and the tests share it).
import { z } from "zod";
import { FAMILY_DIMENSIONS } from "./geometry";
import { HOLLOW_DIMENSIONS } from "./hollow";
import { sectionProperties, type SectionProperties } from "./properties";
import type { SectionInput } from "./schema";
import { findInputViolation, pathText } from "./validate";

/** Shapes a catalogue may hold, with the engine family each is drawn and computed as. */
export const CATALOGUE_SHAPES = ["I", "channel", "tee", "angle", "rhs", "chs"] as const;
export type CatalogueShape = (typeof CATALOGUE_SHAPES)[number];

export const SHAPE_FAMILY = {
  I: "i",
  channel: "channel",
  tee: "tee",
  angle: "angle",
  rhs: "rhs",
  chs: "chs",
} as const satisfies Record<CatalogueShape, string>;

export const SHAPE_WORDS: Record<CatalogueShape, string> = {
  I: "I or H section, parallel flanges",
  channel: "channel, parallel flanges",
  tee: "tee, parallel flange",
  angle: "angle",
  rhs: "rectangular or square hollow",
  chs: "circular hollow",
};

/** Dimensions each shape needs (the engine family's own) and may take (radii). */
export const SHAPE_DIMENSIONS: Record<CatalogueShape, { required: readonly string[]; optional: readonly string[] }> = {
  I: { required: FAMILY_DIMENSIONS.i, optional: ["r"] },
  channel: { required: FAMILY_DIMENSIONS.channel, optional: ["r"] },
  tee: { required: FAMILY_DIMENSIONS.tee, optional: ["r"] },
  angle: { required: FAMILY_DIMENSIONS.angle, optional: ["r", "rt"] },
  rhs: { required: HOLLOW_DIMENSIONS.rhs, optional: [] },
  chs: { required: HOLLOW_DIMENSIONS.chs, optional: [] },
};

/** Every dimension name any shape uses. */
export const CATALOGUE_DIMENSIONS = ["d", "b", "tw", "tf", "t", "r", "rt", "ro", "ri"] as const;
export type CatalogueDimension = (typeof CATALOGUE_DIMENSIONS)[number];

/**
 * Printed properties a catalogue may carry, in the units tables print them in, and how each is
 * read from SectionProperties (SI, mm). Axes are the engine's: Iz about the horizontal axis (an
 * I section's strong axis, which tables usually call y–y), Iy about the vertical one. Sz is the
 * smaller elastic modulus about the horizontal axis (I ÷ the farther fibre), as tables print Wel
 * for shapes that are not symmetric about that axis.
 */
export const PRINTED_FIELDS = ["A", "Iz", "Iy", "Sz", "Zz", "mass"] as const;
export type PrintedField = (typeof PRINTED_FIELDS)[number];

export const PRINTED_UNITS: Record<PrintedField, string> = { A: "cm²", Iz: "cm⁴", Iy: "cm⁴", Sz: "cm³", Zz: "cm³", mass: "kg/m" };

export function printedComputed(field: PrintedField, p: SectionProperties): number {
  switch (field) {
    case "A":
      return p.area / 1e2;
    case "Iz":
      return p.Iz / 1e4;
    case "Iy":
      return p.Iy / 1e4;
    case "Sz":
      return Math.min(p.Sz.top, p.Sz.bottom) / 1e3;
    case "Zz":
      return p.Zz / 1e3;
    case "mass":
      return p.massPerMetre;
  }
}

/**
 * How far a printed value may sit from the computed one: half a unit of its last printed digit
 * (the table's rounding) plus PRINTED_RELATIVE of the value. The relative part covers what tables
 * do differently from exact integration (moduli derived from unrounded values, mass from a
 * rounded area); 0.03% is far below what a geometry or typing error moves (a missing root fillet
 * is 0.5–2% of an I section's area; a swapped digit in 8356 → 8365 is 0.1%). A whole number
 * ending in zeros (23130) is read as printed to at least four significant figures, the usual
 * precision of section tables, so "23130" allows ± 5 + 0.03%, not ± 5 000.
 */
export const PRINTED_RELATIVE = 3e-4;
const MIN_SIGNIFICANT = 4;

export function printedAllowance(printed: string): number {
  const s = printed.trim();
  const v = Math.abs(Number(s));
  const dot = s.indexOf(".");
  let unit: number;
  if (dot >= 0) unit = 10 ** -(s.length - dot - 1);
  else {
    const digits = s.replace(/^[-+]/, "").replace(/^0+/, "").length;
    const zeros = s.length - s.replace(/0+$/, "").length;
    unit = 10 ** Math.max(0, Math.min(zeros, digits - MIN_SIGNIFICANT));
  }
  return unit / 2 + PRINTED_RELATIVE * v;
}

/** A number as tables print it: digits with an optional decimal point (no exponent, no sign, no separators). */
export const PRINTED_NUMBER = /^\d+(\.\d+)?$|^\.\d+$/;

export interface PrintedMismatch {
  field: PrintedField;
  printed: string;
  computed: number;
  allowance: number;
}

/** The printed values that disagree with the computed ones beyond printedAllowance. */
export function comparePrinted(p: SectionProperties, printed: Partial<Record<PrintedField, string>>): PrintedMismatch[] {
  const out: PrintedMismatch[] = [];
  for (const f of PRINTED_FIELDS) {
    const text = printed[f];
    if (text === undefined) continue;
    const computed = printedComputed(f, p);
    const allowance = printedAllowance(text);
    if (!(Math.abs(computed - Number(text)) <= allowance)) out.push({ field: f, printed: text, computed, allowance });
  }
  return out;
}

/** Dimensions of one catalogue section, mm. */
export type CatalogueDims = Partial<Record<CatalogueDimension, number>>;

/** The engine input for a catalogue section (density as the problem or the default). */
export function catalogueSectionInput(shape: CatalogueShape, dims: CatalogueDims, density?: number): SectionInput {
  const family = SHAPE_FAMILY[shape];
  const out: Record<string, unknown> = { family };
  const { required, optional } = SHAPE_DIMENSIONS[shape];
  for (const k of required) out[k] = dims[k as CatalogueDimension];
  for (const k of optional) if (dims[k as CatalogueDimension] !== undefined) out[k] = dims[k as CatalogueDimension];
  if (density !== undefined) out.density = density;
  return out as SectionInput;
}

/** The first geometry rule the section breaks, in words naming the dimension, or null. */
export function catalogueGeometryViolation(shape: CatalogueShape, dims: CatalogueDims): { field: string; message: string } | null {
  const v = findInputViolation(catalogueSectionInput(shape, dims));
  return v ? { field: pathText(v.path) || "shape", message: v.message } : null;
}

// ------------------------------------------------------------------ stored and searched form

const MAX_DIMENSION_MM = 5000;
const dimension = (name: string) =>
  z
    .number({ error: `${name} must be a number (mm)` })
    .refine(Number.isFinite, `${name} must be a finite number (mm)`)
    .refine((x) => x >= 0 && x <= MAX_DIMENSION_MM, `${name} must be between 0 and ${MAX_DIMENSION_MM} mm`);

export const DESIGNATION_MAX = 60;
export const designationSchema = z
  .string({ error: "designation must be text" })
  .trim()
  .min(1, "designation is required")
  .max(DESIGNATION_MAX, `designation: at most ${DESIGNATION_MAX} characters`)
  .regex(/^[^\p{Cc}]*$/u, "designation must be one line of plain text");

/**
 * One catalogue section as stored and as a sweep's problem carries it: the shape's dimensions
 * (required ones present, nothing foreign) and a geometry the engine accepts.
 */
export const catalogueSectionSchema = z
  .object({
    designation: designationSchema,
    shape: z.enum(CATALOGUE_SHAPES, { error: `shape must be one of ${CATALOGUE_SHAPES.join(", ")}` }),
    dims: z.partialRecord(z.enum(CATALOGUE_DIMENSIONS, { error: `dimensions are ${CATALOGUE_DIMENSIONS.join(", ")}` }), dimension("dimension")),
  })
  .superRefine((s, ctx) => {
    const { required, optional } = SHAPE_DIMENSIONS[s.shape];
    for (const k of required)
      if (s.dims[k as CatalogueDimension] === undefined) ctx.addIssue({ code: "custom", path: ["dims", k], message: `${s.shape}: ${k} is required` });
    for (const k of Object.keys(s.dims))
      if (!required.includes(k) && !optional.includes(k)) ctx.addIssue({ code: "custom", path: ["dims", k], message: `${s.shape}: takes no ${k}` });
    const bad = catalogueGeometryViolation(s.shape, s.dims);
    if (bad && required.every((k) => s.dims[k as CatalogueDimension] !== undefined))
      ctx.addIssue({ code: "custom", path: ["dims", bad.field], message: `${s.designation}: ${bad.message}` });
  });
export type CatalogueSection = z.output<typeof catalogueSectionSchema>;

/** Properties of a catalogue section (throws EngineInputError on a geometry the engine refuses). */
export function catalogueSectionProperties(s: Pick<CatalogueSection, "shape" | "dims">, density?: number): SectionProperties {
  return sectionProperties(catalogueSectionInput(s.shape, s.dims, density));
}

/**
 * A stored rolled candidate or saved option as the catalogue section it is (its dimensions carry
 * the catalogue's names; its shape as stored, else the one shape drawn as its family), or null
 * for a welded one. Pages, records and rechecks all read rolled sections back through this.
 */
export function rolledSectionOf(c: { source?: string | null; designation?: string | null; family: string; dimensions: Record<string, number>; shape?: CatalogueShape | null }): CatalogueSection | null {
  if (c.source !== "rolled") return null;
  const shape = c.shape ?? (Object.keys(SHAPE_FAMILY) as CatalogueShape[]).find((k) => SHAPE_FAMILY[k] === c.family);
  return shape ? { designation: c.designation ?? "rolled section", shape, dims: c.dimensions } : null;
}

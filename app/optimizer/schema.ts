// zod schemas for SectionInput (engine contract): the single source of truth for forms,
// API routes and workers. The geometry rules come from validate.ts, shared with the
// engine's own hand-written fast check.
import { z } from "zod";
import { FAMILIES, FAMILY_DIMENSIONS, FILLETED_FAMILIES, TOE_RADIUS_FAMILIES, type Family } from "./geometry";
import { HOLLOW_DIMENSIONS, SECTION_FAMILIES, type HollowFamily } from "./hollow";
import { MAX_DENSITY, familyViolation, findInputViolation, platesOverlap, polygonsViolation } from "./validate";

const finite = (what: string) => z.number({ error: `${what} must be a finite number` }).refine(Number.isFinite, `${what} must be a finite number`);
const positive = (what: string) => finite(what).refine((x) => x > 0, `${what} must be positive`);

/** kg/m³; steel 7850 by default: the unit weight 78.5 kN/m³ of EN 1991-1-1 Annex A, Table A.4 (a loads standard), from memory. */
export const DEFAULT_DENSITY = 7850;
const density = positive("density")
  .refine((x) => x <= MAX_DENSITY, `density must be at most ${MAX_DENSITY} kg/m³`)
  .optional();

export const plateSchema = z.object({ b: positive("b"), h: positive("h"), z: finite("z"), y: finite("y") });

export const platesInputSchema = z
  .object({ plates: z.array(plateSchema).min(1, "plates needs at least one plate"), density })
  .superRefine((v, ctx) => {
    const bad = platesOverlap(v.plates);
    if (bad) ctx.addIssue({ code: "custom", path: bad.path, message: bad.message });
  });

export const pointSchema = z.tuple([finite("z"), finite("y")], { error: "a point must be a pair [z, y] of finite numbers" });

export const polygonSchema = z.object({
  points: z.array(pointSchema).min(3, "a polygon needs at least 3 points"),
  hole: z.boolean().default(false),
});

export const polygonsInputSchema = z
  .object({ polygons: z.array(polygonSchema).min(1, "polygons needs at least one polygon"), density })
  .superRefine((v, ctx) => {
    const bad = polygonsViolation(v.polygons);
    if (bad) ctx.addIssue({ code: "custom", path: bad.path, message: bad.message });
  });

function familyObject<F extends Family>(family: F) {
  const dims: Record<string, z.ZodNumber> = {};
  for (const k of FAMILY_DIMENSIONS[family]) dims[k] = positive(`${family}: ${k}`);
  const extra = {
    ...(FILLETED_FAMILIES.includes(family) ? { r: finite(`${family}: r`).refine((x) => x >= 0, `${family}: r must be ≥ 0`).optional() } : {}),
    ...(TOE_RADIUS_FAMILIES.includes(family) ? { rt: finite(`${family}: rt`).refine((x) => x >= 0, `${family}: rt must be ≥ 0`).optional() } : {}),
  };
  return z.object({
    family: z.literal(family),
    ...(dims as { [K in (typeof FAMILY_DIMENSIONS)[F][number]]: z.ZodNumber }),
    ...extra,
    flip: z.boolean().default(false),
    density,
  });
}

/** Hollow families: their corner radii ro, ri may be 0 (sharp), every other dimension positive. */
function hollowObject<F extends HollowFamily>(family: F) {
  const dims: Record<string, z.ZodType<number>> = {};
  for (const k of HOLLOW_DIMENSIONS[family])
    dims[k] = k === "ro" || k === "ri" ? finite(`${family}: ${k}`).refine((x) => x >= 0, `${family}: ${k} must be ≥ 0`) : positive(`${family}: ${k}`);
  return z.object({
    family: z.literal(family),
    ...(dims as { [K in (typeof HOLLOW_DIMENSIONS)[F][number]]: z.ZodNumber }),
    // refused rather than dropped: a root radius given here is a mistake worth naming
    r: z.never({ error: `${family}: takes no root radius r (its corners are ro and ri)` }).optional(),
    flip: z.boolean().default(false),
    density,
  });
}

const familyObjects = [
  familyObject("rectangle"),
  familyObject("i"),
  familyObject("mono-i"),
  familyObject("channel"),
  familyObject("channel-down"),
  familyObject("tee"),
  familyObject("box"),
  familyObject("angle"),
  hollowObject("rhs"),
  hollowObject("chs"),
] as const;

export const familyInputSchema = z
  .discriminatedUnion("family", familyObjects, { error: `family must be one of ${SECTION_FAMILIES.join(", ")}` })
  .superRefine((v, ctx) => {
    const bad = familyViolation(v as Record<string, unknown>);
    if (bad) ctx.addIssue({ code: "custom", path: bad.path, message: bad.message });
  });

/**
 * Any SectionInput. When every form fails, zod reports a bare union failure at the root; the
 * error function replaces it with the first real problem of the form the value was aiming at
 * (found by hand in validate.ts), so the message still names the field.
 */
export const sectionInputSchema = z.union([platesInputSchema, polygonsInputSchema, familyInputSchema], {
  error: (iss) => {
    if (iss.code !== "invalid_union") return undefined;
    const v = findInputViolation(iss.input);
    // validate.ts messages already name the field
    return v ? v.message : "section input needs plates, polygons or family";
  },
});

/** What callers may pass (flip, hole, density optional). */
export type SectionInput = z.input<typeof sectionInputSchema>;
/** What the schema returns (defaults filled in). */
export type ParsedSectionInput = z.output<typeof sectionInputSchema>;
export type PlatesInput = z.input<typeof platesInputSchema>;
export type PolygonsInput = z.input<typeof polygonsInputSchema>;
export type FamilyInput = z.input<typeof familyInputSchema>;

// Each family's lightest feasible section at every depth (issue 11, item 9): what a sweep records
// of them, and the one query schema for filtering a sweep's stored results by depth and family
// (the candidates API and the sweep page's "Lightest at each depth" control both parse with it).
// Browser-safe: the page's control reads the same types.
import { z } from "zod";
import { FAMILIES } from "~/optimizer/geometry";

/**
 * Per-depth bests are stored for grids of at most this many depths: up to one row per family and
 * depth (8 families × 2,000 depths = 16,000 rows at most, beside the front's cap), which bounds
 * what one sweep can cost the database and the CSV export; a grid may have up to 100,000 depths.
 * Choice (the spec is silent): a 1 mm step over 2 m of depth still fits.
 */
export const MAX_DEPTH_BEST_DEPTHS = 2_000;

/**
 * Whether a sweep stored its per-depth bests (sweeps.depth_bests). They are the grid-front
 * search's context points, proven in the same pass as the front, so a sweep has them for every
 * depth or, when that search did not run to the end, for none.
 */
export interface DepthBestsInfo {
  /** "complete": every depth of the grid; "none": not stored (`reason` says why) */
  state: "complete" | "none";
  /** depths on the grid */
  depths: number;
  /** in plain words, for the page, when none */
  reason: string | null;
}

/** The query fields both filters share; the names and messages are the API's (README). */
export const depthFamilyQueryFields = {
  /** only sections of this depth d (mm): with the stored depth bests, each family's lightest there */
  depth: z.coerce
    .number({ error: "depth must be a number of mm" })
    .positive({ message: "depth must be a positive number of mm" })
    .max(100_000, { message: "depth: at most 100000 mm" })
    .optional(),
  family: z.enum(FAMILIES, { error: `family must be one of ${FAMILIES.join(", ")}` }).optional(),
};

/**
 * The sweep page's depth control (GET ?depth=&family=): an empty field means "any". Other query
 * parameters are ignored (the page has no others; the framework may add its own).
 */
export const depthViewQuerySchema = z.preprocess(
  (v) => {
    const o = (v ?? {}) as Record<string, unknown>;
    const pick = (k: string) => (typeof o[k] === "string" && (o[k] as string).trim() !== "" ? (o[k] as string).trim() : undefined);
    return { depth: pick("depth"), family: pick("family") };
  },
  z.object(depthFamilyQueryFields),
);
export type DepthViewQuery = z.output<typeof depthViewQuerySchema>;

/** Grid depths are exact products min + k·step; a query's depth matches one within float noise. */
export const sameDepth = (a: number, b: number) => Math.abs(a - b) < 1e-6;

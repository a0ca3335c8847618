// Geometry rules for SectionInput, written once and used twice: by the zod schema (schema.ts,
// at the edges: forms, API, workers) and by sectionProperties' own hand-written structural
// check, which keeps zod out of the hot path (zod parsing costs several microseconds a
// section; the bench needs well under one).
import { FAMILIES, FAMILY_DIMENSIONS, FILLETED_FAMILIES, TOE_RADIUS_FAMILIES, familyRuleViolation, filletRuleViolation, type Family } from "./geometry";
import { HOLLOW_DIMENSIONS, SECTION_FAMILIES, hollowRuleViolation, isHollowFamily } from "./hollow";
import { ringDefect, ringInside, ringsOverlap } from "./polygon";
import { dropClosingPoint, makeRing } from "./shape";

export interface Violation {
  path: (string | number)[];
  message: string;
}

export const pathText = (path: (string | number)[]): string =>
  path.reduce<string>((s, k) => (typeof k === "number" ? `${s}[${k}]` : s ? `${s}.${k}` : k), "");

const bad = (path: (string | number)[], message: string): Violation => ({ path, message });

type PlateLike = { b: number; h: number; z: number; y: number };

/**
 * Plates may touch; interiors may not overlap. "Touching" allows a relative slack of 1e-9:
 * decimal inputs do not add up exactly (a plate at y = 0.1 with h = 0.2 ends at
 * 0.30000000000000004, above a plate starting at 0.3), and that is not an overlap anyone meant.
 */
export const TOUCH_SLACK = 1e-9;

export function platesOverlapAt(
  az: number, ay: number, ab: number, ah: number,
  bz: number, by: number, bb: number, bh: number,
): boolean {
  const oz = Math.min(az + ab, bz + bb) - Math.max(az, bz);
  if (!(oz > TOUCH_SLACK * (Math.abs(az) + Math.abs(bz) + ab + bb))) return false;
  const oy = Math.min(ay + ah, by + bh) - Math.max(ay, by);
  return oy > TOUCH_SLACK * (Math.abs(ay) + Math.abs(by) + ah + bh);
}

/** The first overlapping pair; the message names both plates. */
export function platesOverlap(plates: readonly PlateLike[]): Violation | null {
  for (let i = 1; i < plates.length; i++) {
    const p = plates[i];
    for (let j = 0; j < i; j++) {
      const q = plates[j];
      if (platesOverlapAt(p.z, p.y, p.b, p.h, q.z, q.y, q.b, q.h)) return bad(["plates", i], `plates[${i}] overlaps plates[${j}]`);
    }
  }
  return null;
}

/**
 * Most points (summed over every polygon, a closing repeat included) and most polygons one
 * section may have. Why: the checks below cost O(n log n) for ordinary outlines but can reach
 * O(n²) pair tests for contrived ones (a fan of spikes all meeting near one point; see
 * polygon.ts), and the ring-against-ring checks run for every pair of polygons; these caps keep
 * the worst accepted section to a few milliseconds (tests/bench/load.bench.ts measures it).
 * 2,000 points draws a rolled section's fillets and any plate outline many times over.
 */
export const MAX_SECTION_POINTS = 2_000;
export const MAX_SECTION_POLYGONS = 100;

/** Polygons: within the caps; simple rings; holes inside a solid; no two holes (or two solids) overlapping. */
export function polygonsViolation(polygons: readonly { points: readonly (readonly number[])[]; hole?: boolean }[]): Violation | null {
  if (polygons.length === 0) return bad(["polygons"], "polygons needs at least one polygon");
  if (polygons.length > MAX_SECTION_POLYGONS)
    return bad(["polygons"], `polygons: ${polygons.length.toLocaleString("en")} polygons; at most ${MAX_SECTION_POLYGONS} per section`);
  const points = polygons.reduce((s, p) => s + p.points.length, 0);
  if (points > MAX_SECTION_POINTS)
    return bad(["polygons"], `polygons: ${points.toLocaleString("en")} points in all; at most ${MAX_SECTION_POINTS.toLocaleString("en")} per section (simplify the outline)`);
  const rings = polygons.map((p) => makeRing(dropClosingPoint(p.points), p.hole === true));
  for (let i = 0; i < rings.length; i++) {
    const d = ringDefect(rings[i].pts);
    if (d) return bad(["polygons", i, "points"], `polygons[${i}] ${d}`);
  }
  const solids = rings.map((r, i) => [r, i] as const).filter(([r]) => !r.hole);
  const holes = rings.map((r, i) => [r, i] as const).filter(([r]) => r.hole);
  if (solids.length === 0) return bad(["polygons"], "polygons needs at least one solid (hole: false) polygon");
  for (const group of [solids, holes])
    for (let a = 1; a < group.length; a++)
      for (let b = 0; b < a; b++)
        if (ringsOverlap(group[a][0].pts, group[b][0].pts))
          return bad(["polygons", group[a][1]], `polygons[${group[a][1]}] overlaps polygons[${group[b][1]}]`);
  for (const [h, i] of holes)
    if (!solids.some(([s]) => ringInside(h.pts, s.pts))) return bad(["polygons", i], `polygons[${i}] (a hole) must lie inside a solid polygon`);
  return null;
}

/** Family dimensions, fillet radius. */
export function familyViolation(input: Record<string, unknown>): Violation | null {
  if (isHollowFamily(input.family)) {
    const h = hollowRuleViolation(input.family, input as Record<string, number>);
    return h ? bad([h.field], h.message) : null;
  }
  const family = input.family as Family;
  const dims = input as Record<string, number>;
  const v = familyRuleViolation(family, dims) ?? filletRuleViolation(family, dims);
  return v ? bad([v.field], v.message) : null;
}

const isNum = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);

/**
 * kg/m³. Far above any material (osmium ≈ 22 600) yet low enough that A × density stays
 * finite for any section whose own properties are (the contract is silent on a range).
 */
export const MAX_DENSITY = 1e6;

/**
 * Full check of an untyped value: structure (by hand, mirroring schema.ts) then geometry.
 * Returns the first violation or null.
 */
export function findInputViolation(input: unknown): Violation | null {
  if (typeof input !== "object" || input === null) return bad([], "section input must be an object with plates, polygons or family");
  const o = input as Record<string, unknown>;
  if (o.density !== undefined && !(isNum(o.density) && o.density > 0)) return bad(["density"], "density must be a positive number (kg/m³)");
  if (o.density !== undefined && (o.density as number) > MAX_DENSITY) return bad(["density"], `density must be at most ${MAX_DENSITY} kg/m³`);
  if (Array.isArray(o.plates)) {
    const ps = o.plates as unknown[];
    if (ps.length === 0) return bad(["plates"], "plates needs at least one plate");
    for (let i = 0; i < ps.length; i++) {
      const p = ps[i] as Record<string, unknown>;
      if (typeof p !== "object" || p === null) return bad(["plates", i], `plates[${i}] must be an object {b, h, z, y}`);
      for (const k of ["b", "h", "z", "y"]) if (!isNum(p[k])) return bad(["plates", i, k], `plates[${i}].${k} must be a finite number`);
      if ((p.b as number) <= 0) return bad(["plates", i, "b"], `plates[${i}].b must be positive`);
      if ((p.h as number) <= 0) return bad(["plates", i, "h"], `plates[${i}].h must be positive`);
    }
    return platesOverlap(ps as PlateLike[]);
  }
  if (Array.isArray(o.polygons)) {
    const gs = o.polygons as unknown[];
    for (let i = 0; i < gs.length; i++) {
      const g = gs[i] as Record<string, unknown>;
      if (typeof g !== "object" || g === null || !Array.isArray(g.points))
        return bad(["polygons", i], `polygons[${i}] must be an object {points, hole}`);
      if (g.hole !== undefined && typeof g.hole !== "boolean") return bad(["polygons", i, "hole"], `polygons[${i}].hole must be true or false`);
      const pts = g.points as unknown[];
      for (let k = 0; k < pts.length; k++) {
        const pt = pts[k];
        if (!Array.isArray(pt) || pt.length !== 2 || !isNum(pt[0]) || !isNum(pt[1]))
          return bad(["polygons", i, "points", k], `polygons[${i}].points[${k}] must be a pair [z, y] of finite numbers`);
      }
    }
    return polygonsViolation(gs as { points: number[][]; hole?: boolean }[]);
  }
  if (typeof o.family === "string") {
    if (isHollowFamily(o.family)) {
      const f = o.family;
      if (o.flip !== undefined && typeof o.flip !== "boolean") return bad(["flip"], "flip must be true or false");
      if (o.r !== undefined) return bad(["r"], `${f}: takes no root radius r (its corners are ro and ri)`);
      for (const k of HOLLOW_DIMENSIONS[f]) if (!isNum(o[k])) return bad([k], `${f}: ${k} must be a finite number`);
      return familyViolation(o);
    }
    if (!(FAMILIES as readonly string[]).includes(o.family)) return bad(["family"], `family must be one of ${SECTION_FAMILIES.join(", ")}`);
    const f = o.family as Family;
    if (o.flip !== undefined && typeof o.flip !== "boolean") return bad(["flip"], "flip must be true or false");
    if (o.r !== undefined) {
      if (!FILLETED_FAMILIES.includes(f)) return bad(["r"], `${f}: takes no root radius r`);
      if (!(isNum(o.r) && o.r >= 0)) return bad(["r"], `${f}: r must be a finite number ≥ 0`);
    }
    if (o.rt !== undefined) {
      if (!TOE_RADIUS_FAMILIES.includes(f)) return bad(["rt"], `${f}: takes no toe radius rt`);
      if (!(isNum(o.rt) && o.rt >= 0)) return bad(["rt"], `${f}: rt must be a finite number ≥ 0`);
    }
    for (const k of FAMILY_DIMENSIONS[f]) if (!isNum(o[k])) return bad([k], `${f}: ${k} must be a finite number`);
    return familyViolation(o);
  }
  return bad([], "section input needs plates, polygons or family");
}

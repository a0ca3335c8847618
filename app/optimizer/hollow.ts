// Hollow sections with rounded corners: the catalogue shapes of EN 10210-2 (hot finished) and
// EN 10219-2 (cold formed). They are bought as tubes, not cut from plate, so they are section
// families for the bench and the catalogues but not for the plate search (FAMILIES in
// geometry.ts stays the searchable list).
//
// Frame as geometry.ts: the bounding box's bottom-left corner at (0, 0), z right, y up, mm.
//
// `rhs` (rectangular or square): d deep, b wide, wall t, outer corner radius ro, inner corner
// radius ri. The standards fix the radii used for the tabulated properties (mem., EN 10210-2
// Annex: ro = 1.5·t, ri = 1.0·t; EN 10219-2 Annex: ro = 2·t, ri = t for t ≤ 6 mm, ro = 2.5·t,
// ri = 1.5·t for 6 < t ≤ 10 mm, ro = 3·t, ri = 2·t above), so both radii are inputs and the
// concentric case ri = ro − t is just one choice of them. `hollowRadii` gives the standards'.
//
// `chs` (circular): outside diameter d, wall t.
//
// Exact geometry without arcs approximated: a rounded rectangle is its rectangle minus a
// spandrel (square minus quarter disc, fillet.ts) in each corner, so the tube is
//   outer rectangle − 4 outer spandrels (ro) − inner rectangle + 4 inner spandrels (ri),
// written as one solid ring, one hole ring and signed fillets. A circle is the same with the
// radius half the side, so `chs` is built the same way (no straight walls).
import { FAMILIES, type Fillet } from "./geometry";

export const HOLLOW_FAMILIES = ["rhs", "chs"] as const;
export type HollowFamily = (typeof HOLLOW_FAMILIES)[number];

/** Every family a SectionInput may name: the plate families, then the hollow ones. */
export const SECTION_FAMILIES = [...FAMILIES, ...HOLLOW_FAMILIES] as const;
export type SectionFamily = (typeof SECTION_FAMILIES)[number];

/** Dimension names, in the order the tables print them; chs: d is the outside diameter. */
export const HOLLOW_DIMENSIONS = {
  rhs: ["d", "b", "t", "ro", "ri"],
  chs: ["d", "t"],
} as const satisfies Record<HollowFamily, readonly string[]>;

/** Dimensions that may be 0 (sharp corners); the rest must be positive. */
const MAY_BE_ZERO = new Set(["ro", "ri"]);

export function isHollowFamily(family: unknown): family is HollowFamily {
  return typeof family === "string" && (HOLLOW_FAMILIES as readonly string[]).includes(family);
}

const v = (field: string, message: string) => ({ field, message });

/**
 * The first geometry rule the dimensions break, or null. Valid: a wall of positive thickness
 * all round. The inner outline must lie inside the outer one: where the inner corner's centre
 * (t + ri from each outer face) sits nearer the corner than the outer one (ro), the inner arc
 * reaches furthest out on the diagonal, and the wall there is √2·t − (√2 − 1)·(ro − ri) thick
 * (distance along the diagonal between the two arcs), so that must be > 0.
 */
export function hollowRuleViolation(family: HollowFamily, dims: Record<string, number>): { field: string; message: string } | null {
  for (const k of HOLLOW_DIMENSIONS[family]) {
    const x = dims[k];
    if (typeof x !== "number" || !Number.isFinite(x)) return v(k, `${family}: ${k} must be a finite number`);
    if (MAY_BE_ZERO.has(k) ? x < 0 : x <= 0) return v(k, `${family}: ${k} must be ${MAY_BE_ZERO.has(k) ? "≥ 0" : "positive"}`);
  }
  const { d, t } = dims;
  if (!(d > 2 * t)) return v("t", `${family}: d must exceed 2·t`);
  if (family === "chs") return null;
  const { b, ro, ri } = dims;
  if (!(b > 2 * t)) return v("t", "rhs: b must exceed 2·t");
  const half = Math.min(b, d) / 2;
  if (ro > half) return v("ro", "rhs: ro must not exceed half the smaller of b and d");
  if (ri > half - t) return v("ri", "rhs: ri must not exceed half the smaller of b and d, less t");
  if (!(Math.SQRT2 * t - (Math.SQRT2 - 1) * (ro - ri) > 0)) return v("ri", "rhs: ri too small for ro: the wall would vanish at the corners (need (√2 − 1)·(ro − ri) < √2·t)");
  return null;
}

/** Corner radii a standard uses for its tabulated properties (mem.; see the header). */
export function hollowRadii(standard: "EN 10210-2" | "EN 10219-2", t: number): { ro: number; ri: number } {
  if (standard === "EN 10210-2") return { ro: 1.5 * t, ri: t };
  if (t <= 6) return { ro: 2 * t, ri: t };
  if (t <= 10) return { ro: 2.5 * t, ri: 1.5 * t };
  return { ro: 3 * t, ri: 2 * t };
}

export interface HollowPieces {
  /** outer rectangle (solid) and inner rectangle (hole), as [z, y] corner lists */
  outer: [number, number][];
  inner: [number, number][];
  fillets: Fillet[];
  /** for the torsion constant */
  torsion: { family: HollowFamily; d: number; b: number; t: number; ro: number; ri: number };
}

function rect(z0: number, y0: number, z1: number, y1: number): [number, number][] {
  return [
    [z0, y0],
    [z1, y0],
    [z1, y1],
    [z0, y1],
  ];
}

/** Four spandrels of radius r in the corners of the rectangle [z0, z1] × [y0, y1]. */
function corners(z0: number, y0: number, z1: number, y1: number, r: number, sign: 1 | -1): Fillet[] {
  if (!(r > 0)) return [];
  return [
    { z: z0, y: y0, dz: 1, dy: 1, r, sign },
    { z: z1, y: y0, dz: -1, dy: 1, r, sign },
    { z: z0, y: y1, dz: 1, dy: -1, r, sign },
    { z: z1, y: y1, dz: -1, dy: -1, r, sign },
  ];
}

/** The pieces of a hollow section whose dimensions passed hollowRuleViolation. */
export function hollowPieces(family: HollowFamily, dims: Record<string, number>): HollowPieces {
  const { d, t } = dims;
  const b = family === "chs" ? d : dims.b;
  const ro = family === "chs" ? d / 2 : dims.ro;
  const ri = family === "chs" ? d / 2 - t : dims.ri;
  return {
    outer: rect(0, 0, b, d),
    inner: rect(t, t, b - t, d - t),
    fillets: [...corners(0, 0, b, d, ro, -1), ...corners(t, t, b - t, d - t, ri, 1)],
    torsion: { family, d, b, t, ro, ri },
  };
}

/**
 * Torsion constant of a closed hollow section, mm⁴.
 * chs: the exact 2·I = π·(d⁴ − (d − 2t)⁴)/32 of a circular tube (any mechanics of materials
 * text, e.g. Gere & Goodno, Mechanics of Materials, 7th ed. (2009), torsion of circular tubes); it equals
 * Bredt's 2π·rm³·t plus a wall term π·rm·t³/2.
 * rhs: Bredt's formula on the midline cell plus the walls' own open-section share, as the
 * standards' annexes write it (mem., EN 10210-2 / EN 10219-2 Annex, "It"):
 *   It = t³·h/3 + 2·K·Ah,  K = 2·Ah·t/h,  Rc = (ro + ri)/2,
 *   h  = 2·((b − t) + (d − t)) − 2·Rc·(4 − π)      (midline perimeter),
 *   Ah = (b − t)·(d − t) − Rc²·(4 − π)              (area the midline encloses).
 */
export function hollowTorsion(p: HollowPieces["torsion"]): number {
  const { family, d, b, t, ro, ri } = p;
  if (family === "chs") {
    const di = d - 2 * t;
    return (Math.PI * (d ** 4 - di ** 4)) / 32;
  }
  const Rc = (ro + ri) / 2;
  const h = 2 * (b - t + (d - t)) - 2 * Rc * (4 - Math.PI);
  const Ah = (b - t) * (d - t) - Rc * Rc * (4 - Math.PI);
  const K = (2 * Ah * t) / h;
  return (t * t * t * h) / 3 + 2 * K * Ah;
}

// A validated section in one internal form: plates (packed), root fillets and polygon rings.
// Every property is a sum over these pieces, so each operation here just visits all three.
import { PLATE_STRIDE, packPlates, type PlateRect } from "./composite";
import { filletAbove, filletIntegrals, filletWidth, transposeFillet } from "./fillet";
import { familyFillets, familyPlates, type Family, type Fillet } from "./geometry";
import { hollowPieces, isHollowFamily, type HollowPieces } from "./hollow";
import { I_A, I_Y, I_YY, I_Z, I_ZY, I_ZZ, ringAbove, ringIntegrals, ringSignedArea, ringWidth } from "./polygon";
import type { SectionInput } from "./schema";

export interface Ring {
  pts: Float64Array;
  hole: boolean;
  ccw: boolean;
}

export interface Shape {
  plates: Float64Array;
  plateCount: number;
  fillets: Fillet[];
  rings: Ring[];
  /** how J is found: "open" Σb·t³/3 over plates; "box" Bredt on the family's cell; "hollow" hollow.ts; "polygon" approximations */
  torsion: "open" | "box" | "hollow" | "polygon";
  /** box family dimensions, for Bredt's formula */
  box?: { d: number; b: number; tf: number; tw: number };
  /** hollow family dimensions (hollow.ts), for its torsion constant */
  hollow?: HollowPieces["torsion"];
}

export function makeRing(points: readonly (readonly number[])[], hole: boolean): Ring {
  const pts = new Float64Array(points.length * 2);
  for (let i = 0; i < points.length; i++) {
    pts[2 * i] = points[i][0];
    pts[2 * i + 1] = points[i][1];
  }
  return { pts, hole, ccw: ringSignedArea(pts) > 0 };
}

/** Builds the shape of an input already checked by findInputViolation (validate.ts). */
export function buildShape(input: SectionInput): Shape {
  if ("plates" in input) {
    return { plates: packPlates(input.plates), plateCount: input.plates.length, fillets: [], rings: [], torsion: "open" };
  }
  if ("polygons" in input) {
    const rings = input.polygons.map((p) => makeRing(dropClosingPoint(p.points), p.hole === true));
    return { plates: new Float64Array(0), plateCount: 0, fillets: [], rings, torsion: "polygon" };
  }
  const { family, flip, ...rest } = input as unknown as { family: Family; flip?: boolean } & Record<string, number>;
  if (isHollowFamily(family)) {
    // symmetric about both axes, so flip changes nothing
    const h = hollowPieces(family, rest);
    return {
      plates: new Float64Array(0),
      plateCount: 0,
      fillets: h.fillets,
      rings: [makeRing(h.outer, false), makeRing(h.inner, true)],
      torsion: "hollow",
      hollow: h.torsion,
    };
  }
  const plates: PlateRect[] = familyPlates(family, rest, flip === true);
  const shape: Shape = {
    plates: packPlates(plates),
    plateCount: plates.length,
    fillets: familyFillets(family, rest, flip === true),
    rings: [],
    torsion: family === "box" ? "box" : "open",
  };
  if (family === "box") shape.box = { d: rest.d, b: rest.b, tf: rest.tf, tw: rest.tw };
  return shape;
}

/** A polygon given closed (last point = first) is accepted; the repeat is dropped. */
export function dropClosingPoint<T extends readonly number[]>(pts: readonly T[]): readonly T[] {
  const n = pts.length;
  if (n > 3 && pts[0][0] === pts[n - 1][0] && pts[0][1] === pts[n - 1][1]) return pts.slice(0, n - 1);
  return pts;
}

/** Area integrals (polygon.ts slots I_*) about the origin (oz, oy). */
export function shapeIntegrals(s: Shape, oz: number, oy: number, out: Float64Array): void {
  out.fill(0);
  const p = s.plates;
  for (let i = 0; i < s.plateCount * PLATE_STRIDE; i += PLATE_STRIDE) {
    const b = p[i],
      h = p[i + 1];
    const a = b * h,
      zc = p[i + 2] + b / 2 - oz,
      yc = p[i + 3] + h / 2 - oy;
    out[I_A] += a;
    out[I_Z] += a * zc;
    out[I_Y] += a * yc;
    out[I_YY] += a * (yc * yc + (h * h) / 12);
    out[I_ZZ] += a * (zc * zc + (b * b) / 12);
    out[I_ZY] += a * zc * yc;
  }
  for (const f of s.fillets) filletIntegrals(f, oz, oy, out);
  for (const r of s.rings) ringIntegrals(r.pts, oz, oy, r.hole ? -1 : 1, out);
}

/** [minZ, maxZ, minY, maxY]. Fillets lie inside their plates' box, so they are not visited. */
export function shapeBBox(s: Shape): [number, number, number, number] {
  let a = Infinity,
    b = -Infinity,
    c = Infinity,
    d = -Infinity;
  const p = s.plates;
  for (let i = 0; i < s.plateCount * PLATE_STRIDE; i += PLATE_STRIDE) {
    a = Math.min(a, p[i + 2]);
    b = Math.max(b, p[i + 2] + p[i]);
    c = Math.min(c, p[i + 3]);
    d = Math.max(d, p[i + 3] + p[i + 1]);
  }
  for (const r of s.rings) {
    if (r.hole) continue;
    for (let i = 0; i < r.pts.length; i += 2) {
      a = Math.min(a, r.pts[i]);
      b = Math.max(b, r.pts[i]);
      c = Math.min(c, r.pts[i + 1]);
      d = Math.max(d, r.pts[i + 1]);
    }
  }
  return [a, b, c, d];
}

const tmp = new Float64Array(2);

/** out = [area with y ≥ c, ∫(y − oy) dA over it]. */
export function shapeAbove(s: Shape, c: number, oy: number, out: Float64Array): void {
  let a = 0,
    m = 0;
  const p = s.plates;
  for (let i = 0; i < s.plateCount * PLATE_STRIDE; i += PLATE_STRIDE) {
    const top = p[i + 3] + p[i + 1];
    if (top <= c) continue;
    const lo = p[i + 3] > c ? p[i + 3] : c;
    const ar = p[i] * (top - lo);
    a += ar;
    m += ar * ((top + lo) / 2 - oy);
  }
  for (const f of s.fillets) {
    filletAbove(f, c, oy, tmp);
    a += tmp[0];
    m += tmp[1];
  }
  for (const r of s.rings) {
    ringAbove(r.pts, c, oy, tmp);
    const w = r.hole ? -1 : 1;
    a += w * tmp[0];
    m += w * tmp[1];
  }
  out[0] = a;
  out[1] = m;
}

/** Width of material cut at height y, just above (side +1) or just below (−1). */
export function shapeWidth(s: Shape, y: number, side: 1 | -1): number {
  let w = 0;
  const p = s.plates;
  for (let i = 0; i < s.plateCount * PLATE_STRIDE; i += PLATE_STRIDE) {
    const bot = p[i + 3],
      top = bot + p[i + 1];
    if (side > 0 ? bot <= y && y < top : bot < y && y <= top) w += p[i];
  }
  for (const f of s.fillets) w += filletWidth(f, y, side);
  for (const r of s.rings) w += (r.hole ? -1 : 1) * ringWidth(r.pts, y, side, r.ccw);
  return w > 0 ? w : 0;
}

/** Heights where the width function changes form: plate edges, fillet ends, ring vertices (sorted, unique). */
export function shapeBreaks(s: Shape): number[] {
  const ys: number[] = [];
  const p = s.plates;
  for (let i = 0; i < s.plateCount * PLATE_STRIDE; i += PLATE_STRIDE) ys.push(p[i + 3], p[i + 3] + p[i + 1]);
  for (const f of s.fillets) ys.push(f.y, f.y + f.dy * f.r);
  for (const r of s.rings) for (let i = 1; i < r.pts.length; i += 2) ys.push(r.pts[i]);
  ys.sort((a, b) => a - b);
  return ys.filter((y, i) => i === 0 || y !== ys[i - 1]);
}

/** The same section with z and y exchanged (its "Iz" is our Iy): used for properties about the vertical axis. */
export function transposeShape(s: Shape): Shape {
  const plates = new Float64Array(s.plateCount * PLATE_STRIDE);
  for (let i = 0; i < plates.length; i += PLATE_STRIDE) {
    plates[i] = s.plates[i + 1];
    plates[i + 1] = s.plates[i];
    plates[i + 2] = s.plates[i + 3];
    plates[i + 3] = s.plates[i + 2];
  }
  const rings = s.rings.map((r) => {
    const pts = new Float64Array(r.pts.length);
    for (let i = 0; i < pts.length; i += 2) {
      pts[i] = r.pts[i + 1];
      pts[i + 1] = r.pts[i];
    }
    return { pts, hole: r.hole, ccw: !r.ccw };
  });
  return { ...s, plates, rings, fillets: s.fillets.map(transposeFillet) };
}

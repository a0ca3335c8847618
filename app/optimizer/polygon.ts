// Simple polygons ("rings"): exact area integrals by Green's theorem, the part above a
// horizontal line, the width cut at a height, and validity (simple, inside, disjoint).
// A ring is a Float64Array [z0, y0, z1, y1, …] of n ≥ 3 distinct points, either winding.

/** Integral slots filled by ringIntegrals / filletIntegrals (about a chosen origin). */
export const I_A = 0,
  I_Z = 1, // ∫ z dA
  I_Y = 2, // ∫ y dA
  I_YY = 3, // ∫ y² dA (→ Iz)
  I_ZZ = 4, // ∫ z² dA (→ Iy)
  I_ZY = 5, // ∫ z·y dA
  INTEGRALS = 6;

/** Signed shoelace area (positive counter-clockwise). */
export function ringSignedArea(r: Float64Array): number {
  const n = r.length;
  let s = 0;
  for (let i = 0; i < n; i += 2) {
    const j = i + 2 === n ? 0 : i + 2;
    s += r[i] * r[j + 1] - r[j] * r[i + 1];
  }
  return 0.5 * s;
}

/**
 * Adds weight × the ring's area integrals, coordinates taken relative to (oz, oy), into out.
 * Green's-theorem polygon formulas (e.g. Steger, "On the calculation of arbitrary moments of
 * polygons", 1996; also Bourke, "Calculating the area and centroid of a polygon", 1988).
 * The winding is normalised, so weight is +1 for a solid and −1 for a hole.
 */
export function ringIntegrals(r: Float64Array, oz: number, oy: number, weight: number, out: Float64Array): void {
  const n = r.length;
  let a = 0,
    sz = 0,
    sy = 0,
    syy = 0,
    szz = 0,
    szy = 0;
  for (let i = 0; i < n; i += 2) {
    const j = i + 2 === n ? 0 : i + 2;
    const z0 = r[i] - oz,
      y0 = r[i + 1] - oy,
      z1 = r[j] - oz,
      y1 = r[j + 1] - oy;
    const c = z0 * y1 - z1 * y0;
    a += c;
    sz += (z0 + z1) * c;
    sy += (y0 + y1) * c;
    syy += (y0 * y0 + y0 * y1 + y1 * y1) * c;
    szz += (z0 * z0 + z0 * z1 + z1 * z1) * c;
    szy += (z0 * y1 + 2 * z0 * y0 + 2 * z1 * y1 + z1 * y0) * c;
  }
  const w = a < 0 ? -weight : weight;
  out[I_A] += (w * a) / 2;
  out[I_Z] += (w * sz) / 6;
  out[I_Y] += (w * sy) / 6;
  out[I_YY] += (w * syy) / 12;
  out[I_ZZ] += (w * szz) / 12;
  out[I_ZY] += (w * szy) / 24;
}

/**
 * Area and ∫(y − oy) dA of the ring's part with y ≥ c (unsigned, winding-normalised).
 * Sutherland–Hodgman clipping against one half-plane, streamed straight into the shoelace
 * sums so nothing is allocated; the zero-width bridges it can leave along the cut line
 * add nothing to the integrals.
 */
export function ringAbove(r: Float64Array, c: number, oy: number, out: Float64Array): void {
  const n = r.length;
  let a = 0,
    sy = 0;
  // first emitted point (fz, fy) and previous one (pz, py); y taken relative to oy
  let fz = 0,
    fy = 0,
    pz = 0,
    py = 0,
    have = false;
  for (let i = 0; i < n; i += 2) {
    const j = i + 2 === n ? 0 : i + 2;
    const z0 = r[i],
      y0 = r[i + 1],
      z1 = r[j],
      y1 = r[j + 1];
    const in0 = y0 >= c,
      in1 = y1 >= c;
    // emit the vertex if kept, then the crossing point if the edge crosses the line
    for (let e = 0; e < 2; e++) {
      let z: number, y: number;
      if (e === 0) {
        if (!in0) continue;
        z = z0;
        y = y0 - oy;
      } else {
        if (in0 === in1) continue;
        z = z0 + ((c - y0) / (y1 - y0)) * (z1 - z0);
        y = c - oy;
      }
      if (!have) {
        fz = z;
        fy = y;
        have = true;
      } else {
        const k = pz * y - z * py;
        a += k;
        sy += (py + y) * k;
      }
      pz = z;
      py = y;
    }
  }
  if (have) {
    const k = pz * fy - fz * py;
    a += k;
    sy += (py + fy) * k;
  }
  const s = ringSignedArea(r) < 0 ? -1 : 1;
  out[0] = (s * a) / 2;
  out[1] = (s * sy) / 6;
}

/**
 * Width of material cut at height y: side = +1 just above y, −1 just below. Each edge
 * crossing the line adds ± its crossing z (right boundary +, left −, for the ring's winding);
 * the half-open span tests pick the side, so a line through a vertex is handled exactly.
 */
export function ringWidth(r: Float64Array, y: number, side: 1 | -1, ccw: boolean): number {
  const n = r.length;
  let w = 0;
  for (let i = 0; i < n; i += 2) {
    const j = i + 2 === n ? 0 : i + 2;
    const y0 = r[i + 1],
      y1 = r[j + 1];
    if (y0 === y1) continue;
    const lo = y0 < y1 ? y0 : y1,
      hi = y0 < y1 ? y1 : y0;
    if (side > 0 ? lo <= y && y < hi : lo < y && y <= hi) {
      const z = r[i] + ((y - y0) / (y1 - y0)) * (r[j] - r[i]);
      w += y1 > y0 ? z : -z;
    }
  }
  return ccw ? w : -w;
}

// ---------------------------------------------------------------- validity

function orient(az: number, ay: number, bz: number, by: number, cz: number, cy: number): number {
  return (bz - az) * (cy - ay) - (by - ay) * (cz - az);
}

function onSegment(az: number, ay: number, bz: number, by: number, pz: number, py: number): boolean {
  return Math.min(az, bz) <= pz && pz <= Math.max(az, bz) && Math.min(ay, by) <= py && py <= Math.max(ay, by);
}

/** Segments AB and CD share any point (touching counts). */
export function segmentsTouch(az: number, ay: number, bz: number, by: number, cz: number, cy: number, dz: number, dy: number): boolean {
  const o1 = orient(az, ay, bz, by, cz, cy),
    o2 = orient(az, ay, bz, by, dz, dy),
    o3 = orient(cz, cy, dz, dy, az, ay),
    o4 = orient(cz, cy, dz, dy, bz, by);
  if (((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0))) return true;
  if (o1 === 0 && onSegment(az, ay, bz, by, cz, cy)) return true;
  if (o2 === 0 && onSegment(az, ay, bz, by, dz, dy)) return true;
  if (o3 === 0 && onSegment(cz, cy, dz, dy, az, ay)) return true;
  if (o4 === 0 && onSegment(cz, cy, dz, dy, bz, by)) return true;
  return false;
}

/** Segments AB and CD cross through each other's interiors (a proper crossing); touching does not count. */
export function segmentsCross(az: number, ay: number, bz: number, by: number, cz: number, cy: number, dz: number, dy: number): boolean {
  const o1 = orient(az, ay, bz, by, cz, cy),
    o2 = orient(az, ay, bz, by, dz, dy),
    o3 = orient(cz, cy, dz, dy, az, ay),
    o4 = orient(cz, cy, dz, dy, bz, by);
  return ((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0));
}

/** First structural defect of a ring, in words, or null. O(n²) pair test, allocation-free. */
export function ringDefect(r: Float64Array): string | null {
  const n = r.length / 2;
  if (n < 3) return "needs at least 3 points";
  const nx = (i: number) => (i + 1 === n ? 0 : i + 1);
  for (let i = 0; i < n; i++) {
    const j = nx(i);
    if (r[2 * i] === r[2 * j] && r[2 * i + 1] === r[2 * j + 1]) return `points[${i}] repeats points[${j}]`;
  }
  for (let i = 0; i < n; i++) {
    const i1 = nx(i);
    const az = r[2 * i], ay = r[2 * i + 1], bz = r[2 * i1], by = r[2 * i1 + 1];
    for (let k = i + 1; k < n; k++) {
      const k1 = nx(k);
      const cz = r[2 * k], cy = r[2 * k + 1], dz = r[2 * k1], dy = r[2 * k1 + 1];
      if (k === i + 1 || (i === 0 && k === n - 1)) {
        // Adjacent edges share one vertex S; they meet elsewhere only if they fold back:
        // the far ends P, Q collinear with S and on the same side of it.
        const [sz, sy, pz, py, qz, qy] = k === i + 1 ? [bz, by, az, ay, dz, dy] : [az, ay, bz, by, cz, cy];
        if (orient(sz, sy, pz, py, qz, qy) === 0 && (pz - sz) * (qz - sz) + (py - sy) * (qy - sy) > 0)
          return `edges ${i} and ${k} fold back on each other`;
      } else if (segmentsTouch(az, ay, bz, by, cz, cy, dz, dy)) return `self-intersects (edges ${i} and ${k})`;
    }
  }
  if (ringSignedArea(r) === 0) return "has zero area";
  return null;
}

/** 1 strictly inside, 0 on the boundary, −1 outside (crossing-number test with boundary check). */
export function pointInRing(r: Float64Array, z: number, y: number): 1 | 0 | -1 {
  const n = r.length;
  let inside = false;
  for (let i = 0; i < n; i += 2) {
    const j = i + 2 === n ? 0 : i + 2;
    const z0 = r[i],
      y0 = r[i + 1],
      z1 = r[j],
      y1 = r[j + 1];
    if (orient(z0, y0, z1, y1, z, y) === 0 && onSegment(z0, y0, z1, y1, z, y)) return 0;
    if (y0 > y !== y1 > y && z < z0 + ((y - y0) / (y1 - y0)) * (z1 - z0)) inside = !inside;
  }
  return inside ? 1 : -1;
}

/**
 * Every test point of `a` (its vertices and edge midpoints) classified against `b`:
 * returns [any strictly inside, any outside, all on the boundary].
 */
function probe(a: Float64Array, b: Float64Array): [boolean, boolean, boolean] {
  let inside = false,
    outside = false,
    allOn = true;
  const n = a.length;
  for (let i = 0; i < n; i += 2) {
    const j = i + 2 === n ? 0 : i + 2;
    for (let e = 0; e < 2; e++) {
      const z = e === 0 ? a[i] : 0.5 * (a[i] + a[j]),
        y = e === 0 ? a[i + 1] : 0.5 * (a[i + 1] + a[j + 1]);
      const w = pointInRing(b, z, y);
      if (w > 0) inside = true;
      if (w < 0) outside = true;
      if (w !== 0) allOn = false;
    }
  }
  return [inside, outside, allOn];
}

function anyCrossing(a: Float64Array, b: Float64Array): boolean {
  const na = a.length,
    nb = b.length;
  for (let i = 0; i < na; i += 2) {
    const i1 = i + 2 === na ? 0 : i + 2;
    for (let k = 0; k < nb; k += 2) {
      const k1 = k + 2 === nb ? 0 : k + 2;
      if (segmentsCross(a[i], a[i + 1], a[i1], a[i1 + 1], b[k], b[k + 1], b[k1], b[k1 + 1])) return true;
    }
  }
  return false;
}

/** inner lies within outer (boundaries may touch). */
export function ringInside(inner: Float64Array, outer: Float64Array): boolean {
  if (anyCrossing(inner, outer)) return false;
  return !probe(inner, outer)[1];
}

/** The rings' interiors share area (boundaries may touch). */
export function ringsOverlap(a: Float64Array, b: Float64Array): boolean {
  if (anyCrossing(a, b)) return true;
  const [aIn, , aAllOn] = probe(a, b);
  if (aIn) return true;
  if (probe(b, a)[0]) return true;
  // Same outline traced twice: every probe on the other's boundary.
  return aAllOn;
}

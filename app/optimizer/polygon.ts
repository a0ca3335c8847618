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
//
// Why no plain all-pairs loops: a ring of n points has n²/2 edge pairs, and two 8,000-point
// outlines kept the server's event loop busy for seconds (issue 9). Two edges can only meet
// where their bounding boxes overlap, and a point can only lie on, or cross the horizontal ray
// from, an edge whose height range holds the point's height. So each test sorts the edges by
// their low end along one axis once (RingIndex) and sweeps, keeping the edges whose range is
// still open, and runs the exact predicate only on the pairs the sweep meets: O(n log n + k),
// k the pairs whose ranges overlap along the swept axis (about n for outlines and digitised
// curves, whichever way they wind). A fan of long thin spikes meeting near one point can still
// make k ≈ n²; the vertex and polygon caps (validate.ts) bound that case.
// Identical answers to the all-pairs loops: the predicates are unchanged, and a pair the sweep
// skips is one the predicate refuses anyway (segmentsTouch and segmentsCross test the boxes first;
// pointInRing's tests need the point's height inside the edge's range).

function orient(az: number, ay: number, bz: number, by: number, cz: number, cy: number): number {
  return (bz - az) * (cy - ay) - (by - ay) * (cz - az);
}

function onSegment(az: number, ay: number, bz: number, by: number, pz: number, py: number): boolean {
  return Math.min(az, bz) <= pz && pz <= Math.max(az, bz) && Math.min(ay, by) <= py && py <= Math.max(ay, by);
}

/**
 * The segments' bounding boxes do not meet. Tested before the orientation signs: for four nearly
 * collinear points rounding can give each sign either way, and segments whose boxes are apart
 * never share a point, so the box has the last word (and the sweeps below may skip such pairs).
 */
function boxesApart(az: number, ay: number, bz: number, by: number, cz: number, cy: number, dz: number, dy: number): boolean {
  return (
    Math.max(az, bz) < Math.min(cz, dz) ||
    Math.max(cz, dz) < Math.min(az, bz) ||
    Math.max(ay, by) < Math.min(cy, dy) ||
    Math.max(cy, dy) < Math.min(ay, by)
  );
}

/** Segments AB and CD share any point (touching counts). */
export function segmentsTouch(az: number, ay: number, bz: number, by: number, cz: number, cy: number, dz: number, dy: number): boolean {
  if (boxesApart(az, ay, bz, by, cz, cy, dz, dy)) return false;
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
  if (boxesApart(az, ay, bz, by, cz, cy, dz, dy)) return false;
  const o1 = orient(az, ay, bz, by, cz, cy),
    o2 = orient(az, ay, bz, by, dz, dy),
    o3 = orient(cz, cy, dz, dy, az, ay),
    o4 = orient(cz, cy, dz, dy, bz, by);
  return ((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0));
}

/** A ring's edges (edge i runs from point i to point i + 1) sorted for the sweeps. */
interface RingIndex {
  pts: Float64Array;
  n: number;
  /** per edge: z low, z high, y low, y high */
  box: Float64Array;
  /** edge ids by low z, and by low y */
  byZ: Int32Array;
  byY: Int32Array;
  /** the axis (0 z, 2 y: offset into box) along which fewer edge ranges overlap */
  axis: 0 | 2;
  /** pairs overlapping along that axis (a measure of the sweep's work) */
  overlaps: number;
  /** probe points (vertices, then edge midpoints) and their order by y */
  tz: Float64Array;
  ty: Float64Array;
  probeByY: Int32Array;
}

/** Ids 0..n−1 sorted by key[4·id + off]. */
function sortedIds(n: number, key: Float64Array, stride: number, off: number): Int32Array {
  const ids = new Int32Array(n);
  for (let i = 0; i < n; i++) ids[i] = i;
  return ids.sort((a, b) => key[stride * a + off] - key[stride * b + off] || a - b);
}

/** Pairs whose [lo, hi] ranges (box offsets off, off + 1) overlap, walking the ids in lo order. */
function overlapCount(ids: Int32Array, box: Float64Array, off: number): number {
  const n = ids.length;
  let total = 0;
  for (let p = 0; p < n; p++) {
    const hi = box[4 * ids[p] + off + 1];
    // first position after p whose lo exceeds hi
    let lo = p + 1,
      up = n;
    while (lo < up) {
      const m = (lo + up) >> 1;
      if (box[4 * ids[m] + off] <= hi) lo = m + 1;
      else up = m;
    }
    total += lo - p - 1;
  }
  return total;
}

const indexCache = new WeakMap<Float64Array, RingIndex>();

/** Built once per ring array (the array must not change afterwards: rings never do). */
function ringIndex(r: Float64Array): RingIndex {
  const hit = indexCache.get(r);
  if (hit) return hit;
  const n = r.length / 2;
  const box = new Float64Array(4 * n);
  const tz = new Float64Array(2 * n),
    ty = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const z0 = r[2 * i], y0 = r[2 * i + 1], z1 = r[2 * j], y1 = r[2 * j + 1];
    box[4 * i] = Math.min(z0, z1);
    box[4 * i + 1] = Math.max(z0, z1);
    box[4 * i + 2] = Math.min(y0, y1);
    box[4 * i + 3] = Math.max(y0, y1);
    tz[i] = z0;
    ty[i] = y0;
    // same midpoint arithmetic as the all-pairs probe always used
    tz[n + i] = 0.5 * (z0 + z1);
    ty[n + i] = 0.5 * (y0 + y1);
  }
  const byZ = sortedIds(n, box, 4, 0),
    byY = sortedIds(n, box, 4, 2);
  const kz = overlapCount(byZ, box, 0),
    ky = overlapCount(byY, box, 2);
  const probeByY = sortedIds(2 * n, ty, 1, 0);
  const ix: RingIndex = { pts: r, n, box, byZ, byY, axis: ky <= kz ? 2 : 0, overlaps: Math.min(kz, ky), tz, ty, probeByY };
  indexCache.set(r, ix);
  return ix;
}

/**
 * Calls visit(e, f) for each pair of distinct edges of one ring whose boxes overlap (each pair
 * once, in no particular order); stops when visit returns true.
 */
function selfPairs(ix: RingIndex, visit: (e: number, f: number) => boolean): void {
  const { box, axis: L } = ix;
  const O = 2 - L;
  const order = L === 0 ? ix.byZ : ix.byY;
  const active = new Int32Array(ix.n);
  let m = 0;
  for (let p = 0; p < order.length; p++) {
    const e = order[p];
    const lo = box[4 * e + L],
      oLo = box[4 * e + O],
      oHi = box[4 * e + O + 1];
    for (let j = 0; j < m; ) {
      const f = active[j];
      if (box[4 * f + L + 1] < lo) {
        active[j] = active[--m];
        continue;
      }
      if (box[4 * f + O] <= oHi && oLo <= box[4 * f + O + 1] && visit(e, f)) return;
      j++;
    }
    active[m++] = e;
  }
}

/** As selfPairs for an edge of a and an edge of b: visit(edge of a, edge of b). */
function crossPairs(a: RingIndex, b: RingIndex, visit: (e: number, f: number) => boolean): boolean {
  // sweep along the axis on which the two rings' own edges overlap less
  const L = pairAxis(a, b);
  const O = 2 - L;
  const oa = L === 0 ? a.byZ : a.byY,
    ob = L === 0 ? b.byZ : b.byY;
  const ba = a.box,
    bb = b.box;
  const actA = new Int32Array(a.n),
    actB = new Int32Array(b.n);
  let ma = 0,
    mb = 0,
    pa = 0,
    pb = 0;
  while (pa < oa.length || pb < ob.length) {
    const takeA = pb >= ob.length || (pa < oa.length && ba[4 * oa[pa] + L] <= bb[4 * ob[pb] + L]);
    if (takeA) {
      const e = oa[pa++];
      const lo = ba[4 * e + L], oLo = ba[4 * e + O], oHi = ba[4 * e + O + 1];
      for (let j = 0; j < mb; ) {
        const f = actB[j];
        if (bb[4 * f + L + 1] < lo) {
          actB[j] = actB[--mb];
          continue;
        }
        if (bb[4 * f + O] <= oHi && oLo <= bb[4 * f + O + 1] && visit(e, f)) return true;
        j++;
      }
      actA[ma++] = e;
    } else {
      const f = ob[pb++];
      const lo = bb[4 * f + L], oLo = bb[4 * f + O], oHi = bb[4 * f + O + 1];
      for (let j = 0; j < ma; ) {
        const e = actA[j];
        if (ba[4 * e + L + 1] < lo) {
          actA[j] = actA[--ma];
          continue;
        }
        if (ba[4 * e + O] <= oHi && oLo <= ba[4 * e + O + 1] && visit(e, f)) return true;
        j++;
      }
      actB[mb++] = f;
    }
  }
  return false;
}

/** The axis for a two-ring sweep: the one both rings prefer, else the one the busier ring prefers. */
function pairAxis(a: RingIndex, b: RingIndex): 0 | 2 {
  if (a.axis === b.axis) return a.axis;
  return a.overlaps >= b.overlaps ? a.axis : b.axis;
}

/** First structural defect of a ring, in words, or null (the first pair (i, k) in order, as an all-pairs loop would report it). */
export function ringDefect(r: Float64Array): string | null {
  const n = r.length / 2;
  if (n < 3) return "needs at least 3 points";
  const nx = (i: number) => (i + 1 === n ? 0 : i + 1);
  for (let i = 0; i < n; i++) {
    const j = nx(i);
    if (r[2 * i] === r[2 * j] && r[2 * i + 1] === r[2 * j + 1]) return `points[${i}] repeats points[${j}]`;
  }
  // the least pair (i, k), i < k, with a defect; kind 1 fold, 2 touch
  let bi = n,
    bk = n,
    kind = 0;
  const better = (i: number, k: number) => i < bi || (i === bi && k < bk);
  // Adjacent edges share one vertex S; they meet elsewhere only if they fold back: the far
  // ends P, Q collinear with S and on the same side of it.
  const fold = (sz: number, sy: number, pz: number, py: number, qz: number, qy: number) =>
    orient(sz, sy, pz, py, qz, qy) === 0 && (pz - sz) * (qz - sz) + (py - sy) * (qy - sy) > 0;
  for (let i = 0; i < n; i++) {
    const i1 = nx(i);
    const az = r[2 * i], ay = r[2 * i + 1], bz = r[2 * i1], by = r[2 * i1 + 1];
    if (i + 1 < n) {
      // edges i and i + 1 share point i + 1
      const k1 = nx(i + 1);
      if (fold(bz, by, az, ay, r[2 * k1], r[2 * k1 + 1]) && better(i, i + 1)) [bi, bk, kind] = [i, i + 1, 1];
    }
  }
  // edges 0 and n − 1 share point 0
  if (fold(r[0], r[1], r[2], r[3], r[2 * (n - 1)], r[2 * (n - 1) + 1]) && better(0, n - 1)) [bi, bk, kind] = [0, n - 1, 1];
  const adjacent = (i: number, k: number) => k === i + 1 || (i === 0 && k === n - 1);
  selfPairs(ringIndex(r), (e, f) => {
    const i = e < f ? e : f,
      k = e < f ? f : e;
    if (adjacent(i, k) || !better(i, k)) return false;
    const i1 = nx(i),
      k1 = nx(k);
    if (segmentsTouch(r[2 * i], r[2 * i + 1], r[2 * i1], r[2 * i1 + 1], r[2 * k], r[2 * k + 1], r[2 * k1], r[2 * k1 + 1])) [bi, bk, kind] = [i, k, 2];
    return false;
  });
  if (kind === 1) return `edges ${bi} and ${bk} fold back on each other`;
  if (kind === 2) return `self-intersects (edges ${bi} and ${bk})`;
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
 * Every test point of `a` (its vertices and edge midpoints) classified against `b` as
 * pointInRing does: returns [any strictly inside, any outside, all on the boundary]. The points
 * go in height order and meet only the edges of b whose height range holds them.
 */
function probe(a: RingIndex, b: RingIndex): [boolean, boolean, boolean] {
  let inside = false,
    outside = false,
    allOn = true;
  const r = b.pts,
    nb = b.n,
    box = b.box,
    order = b.byY;
  const active = new Int32Array(nb);
  let m = 0,
    next = 0;
  const q = a.probeByY;
  for (let p = 0; p < q.length; p++) {
    const z = a.tz[q[p]],
      y = a.ty[q[p]];
    while (next < nb && box[4 * order[next] + 2] <= y) active[m++] = order[next++];
    let on = false,
      odd = false;
    for (let j = 0; j < m; ) {
      const e = active[j];
      if (box[4 * e + 3] < y) {
        active[j] = active[--m];
        continue;
      }
      j++;
      const i = 2 * e,
        k = e + 1 === nb ? 0 : i + 2;
      const z0 = r[i],
        y0 = r[i + 1],
        z1 = r[k],
        y1 = r[k + 1];
      if (orient(z0, y0, z1, y1, z, y) === 0 && onSegment(z0, y0, z1, y1, z, y)) {
        on = true;
        break;
      }
      if (y0 > y !== y1 > y && z < z0 + ((y - y0) / (y1 - y0)) * (z1 - z0)) odd = !odd;
    }
    if (!on && odd) inside = true;
    if (!on && !odd) outside = true;
    if (!on) allOn = false;
    if (inside && outside) break;
  }
  return [inside, outside, allOn];
}

function anyCrossing(a: RingIndex, b: RingIndex): boolean {
  const pa = a.pts,
    pb = b.pts;
  return crossPairs(a, b, (e, f) => {
    const i = 2 * e,
      i1 = e + 1 === a.n ? 0 : i + 2,
      k = 2 * f,
      k1 = f + 1 === b.n ? 0 : k + 2;
    return segmentsCross(pa[i], pa[i + 1], pa[i1], pa[i1 + 1], pb[k], pb[k + 1], pb[k1], pb[k1 + 1]);
  });
}

/** inner lies within outer (boundaries may touch). */
export function ringInside(inner: Float64Array, outer: Float64Array): boolean {
  const a = ringIndex(inner),
    b = ringIndex(outer);
  if (anyCrossing(a, b)) return false;
  return !probe(a, b)[1];
}

/** The rings' interiors share area (boundaries may touch). */
export function ringsOverlap(ra: Float64Array, rb: Float64Array): boolean {
  const a = ringIndex(ra),
    b = ringIndex(rb);
  if (anyCrossing(a, b)) return true;
  const [aIn, , aAllOn] = probe(a, b);
  if (aIn) return true;
  if (probe(b, a)[0]) return true;
  // Same outline traced twice: every probe on the other's boundary.
  return aAllOn;
}

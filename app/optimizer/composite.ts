// Allocation-free section kernel over axis-aligned rectangles ("plates").
// Plates are packed PLATE_STRIDE numbers each: b (width along z), h (height along y),
// z, y (bottom-left corner), all in mm. This is the one the search runs millions of times,
// so it validates nothing: callers (schema.ts, geometry.ts) validate first.

export const PLATE_STRIDE = 4;

export const K_AREA = 0,
  K_CZ = 1,
  K_CY = 2,
  K_IZ = 3,
  K_IY = 4,
  K_IYZ = 5,
  K_MINZ = 6,
  K_MAXZ = 7,
  K_MINY = 8,
  K_MAXY = 9,
  KERNEL_OUT = 10;

/**
 * Area, centroid (absolute, plates' frame), centroidal Iz/Iy/Iyz and bounding box.
 * Two passes (centroid first, then second moments about it) rather than Σy²A − A·ȳ²,
 * because the one-pass form loses digits when the section sits far from the origin
 * (translation invariance is a property test).
 * Rectangle about its own centroid: b·h³/12, h·b³/12, product 0 (any statics text,
 * e.g. Gere & Goodno, Mechanics of Materials, 7th ed. (2009), Appendix D).
 */
export function compositeKernel(plates: Float64Array, count: number, out: Float64Array): void {
  let area = 0,
    sz = 0,
    sy = 0;
  let minZ = Infinity,
    maxZ = -Infinity,
    minY = Infinity,
    maxY = -Infinity;
  const n = count * PLATE_STRIDE;
  for (let i = 0; i < n; i += PLATE_STRIDE) {
    const b = plates[i],
      h = plates[i + 1],
      z = plates[i + 2],
      y = plates[i + 3];
    const a = b * h;
    area += a;
    sz += a * (z + 0.5 * b);
    sy += a * (y + 0.5 * h);
    if (z < minZ) minZ = z;
    if (z + b > maxZ) maxZ = z + b;
    if (y < minY) minY = y;
    if (y + h > maxY) maxY = y + h;
  }
  const cz = sz / area,
    cy = sy / area;
  let iz = 0,
    iy = 0,
    iyz = 0;
  for (let i = 0; i < n; i += PLATE_STRIDE) {
    const b = plates[i],
      h = plates[i + 1];
    const a = b * h;
    const dz = plates[i + 2] + 0.5 * b - cz;
    const dy = plates[i + 3] + 0.5 * h - cy;
    iz += a * (h * h / 12 + dy * dy);
    iy += a * (b * b / 12 + dz * dz);
    iyz += a * dz * dy;
  }
  out[K_AREA] = area;
  out[K_CZ] = cz;
  out[K_CY] = cy;
  out[K_IZ] = iz;
  out[K_IY] = iy;
  out[K_IYZ] = iyz;
  out[K_MINZ] = minZ;
  out[K_MAXZ] = maxZ;
  out[K_MINY] = minY;
  out[K_MAXY] = maxY;
}

/** First moment, about the horizontal axis at height cy, of the plate area above height y. */
export function plateQAbove(plates: Float64Array, count: number, y: number, cy: number): number {
  let q = 0;
  const n = count * PLATE_STRIDE;
  for (let i = 0; i < n; i += PLATE_STRIDE) {
    const top = plates[i + 3] + plates[i + 1];
    if (top <= y) continue;
    const lo = plates[i + 3] > y ? plates[i + 3] : y;
    q += plates[i] * (top - lo) * (0.5 * (top + lo) - cy);
  }
  return q;
}

/**
 * Material width cut at height y. side = +1: just above y (plates with bottom ≤ y < top);
 * side = −1: just below y (bottom < y ≤ top). Exact comparisons are deliberate: plate
 * edges are given numbers, and touching plates share them exactly.
 */
export function plateWidthAt(plates: Float64Array, count: number, y: number, side: 1 | -1): number {
  let w = 0;
  const n = count * PLATE_STRIDE;
  for (let i = 0; i < n; i += PLATE_STRIDE) {
    const bot = plates[i + 3],
      top = bot + plates[i + 1];
    if (side > 0 ? bot <= y && y < top : bot < y && y <= top) w += plates[i];
  }
  return w;
}

/**
 * max over y of Q(y)/(Iz·b(y)), 1/mm² (× V in N → MPa). Widths are piecewise constant,
 * and within a band of constant width Q(y) falls away from the neutral axis, so the
 * maximum lies at the neutral axis or just beside a plate edge (engine contract, shear
 * check). At each candidate height both sides are tried; a side with no material is
 * skipped. Where the neutral axis runs along an edge this takes the smaller width,
 * consistent with widthAtNeutralAxis.
 */
export function maxShearFactor(plates: Float64Array, count: number, cy: number, Iz: number): number {
  return shearScan(plates, count, cy, null) / Iz;
}

/** Where maxShearFactor finds its largest Q/b (for the calculation record): height y, |Q| and width b there. */
export interface ShearPoint {
  /** height from the bottom of the plates' frame, mm */
  y: number;
  /** first moment of the area above y about the horizontal centroidal axis, mm³ (magnitude) */
  Q: number;
  /** the width cut there (the narrower side at an edge), mm */
  b: number;
}

/** maxShearFactor's own scan, also saying where (one source for the search and the record). */
export function maxShearPoint(plates: Float64Array, count: number, cy: number): ShearPoint {
  const out = new Float64Array(3);
  shearScan(plates, count, cy, out);
  return { y: out[0], Q: out[1], b: out[2] };
}

function shearScan(plates: Float64Array, count: number, cy: number, at: Float64Array | null): number {
  let best = shearFactorAt(plates, count, cy, cy);
  if (at) shearPointAt(plates, count, cy, cy, at);
  const n = count * PLATE_STRIDE;
  for (let i = 0; i < n; i += PLATE_STRIDE) {
    const bot = plates[i + 3];
    const f1 = shearFactorAt(plates, count, bot, cy);
    if (f1 > best) {
      best = f1;
      if (at) shearPointAt(plates, count, bot, cy, at);
    }
    const f2 = shearFactorAt(plates, count, bot + plates[i + 1], cy);
    if (f2 > best) {
      best = f2;
      if (at) shearPointAt(plates, count, bot + plates[i + 1], cy, at);
    }
  }
  return best;
}

/** y, |Q| and the width shearFactorAt divided by (the narrower side with material). */
function shearPointAt(plates: Float64Array, count: number, y: number, cy: number, at: Float64Array): void {
  const wa = plateWidthAt(plates, count, y, 1);
  const wb = plateWidthAt(plates, count, y, -1);
  at[0] = y;
  at[1] = Math.abs(plateQAbove(plates, count, y, cy));
  at[2] = wa > 0 && wb > 0 ? (wa < wb ? wa : wb) : wa > 0 ? wa : wb;
}

function shearFactorAt(plates: Float64Array, count: number, y: number, cy: number): number {
  const q = Math.abs(plateQAbove(plates, count, y, cy));
  if (q === 0) return 0;
  const wa = plateWidthAt(plates, count, y, 1);
  const wb = plateWidthAt(plates, count, y, -1);
  let f = 0;
  if (wa > 0) f = q / wa;
  if (wb > 0 && q / wb > f) f = q / wb;
  return f;
}

export interface PlateRect {
  b: number;
  h: number;
  z: number;
  y: number;
}

export interface CompositeRow {
  /** b·h, mm² */
  A: number;
  /** centroid height of the plate, mm (plates' frame) */
  yc: number;
  Ayc: number;
  /** b·h³/12 about the plate's own horizontal centroidal axis, mm⁴ */
  I0: number;
  /** yc − ȳ, mm */
  d: number;
  Ad2: number;
}

export interface CompositeTable {
  rows: CompositeRow[];
  totals: { A: number; Ayc: number; yBar: number; I0: number; Ad2: number; Iz: number };
}

/** The composite-area table (parallel-axis theorem, row by row) for calculation records. */
export function compositeTable(plates: PlateRect[]): CompositeTable {
  let A = 0,
    Ayc = 0;
  for (const p of plates) {
    const a = p.b * p.h;
    A += a;
    Ayc += a * (p.y + p.h / 2);
  }
  const yBar = Ayc / A;
  let I0 = 0,
    Ad2 = 0;
  const rows = plates.map((p) => {
    const a = p.b * p.h;
    const yc = p.y + p.h / 2;
    const i0 = (p.b * p.h ** 3) / 12;
    const d = yc - yBar;
    I0 += i0;
    Ad2 += a * d * d;
    return { A: a, yc, Ayc: a * yc, I0: i0, d, Ad2: a * d * d };
  });
  return { rows, totals: { A, Ayc, yBar, I0, Ad2, Iz: I0 + Ad2 } };
}

/** Packs plate objects into a new Float64Array (edges only; hot loops reuse their own buffer). */
export function packPlates(plates: readonly PlateRect[], into?: Float64Array): Float64Array {
  const buf = into && into.length >= plates.length * PLATE_STRIDE ? into : new Float64Array(plates.length * PLATE_STRIDE);
  for (let i = 0; i < plates.length; i++) {
    const p = plates[i];
    const k = i * PLATE_STRIDE;
    buf[k] = p.b;
    buf[k + 1] = p.h;
    buf[k + 2] = p.z;
    buf[k + 3] = p.y;
  }
  return buf;
}

/**
 * Plastic modulus about the horizontal equal-area axis, exact. Area above a line is linear
 * between consecutive plate edges (slope −width), so starting at the elastic centroid the
 * walk solves the linear equation inside the current band, or steps to the band's edge and
 * tries the next band; a few O(n) steps, no sorting, no allocation. Then
 * Z = Σ b·∫|y − p| dy per plate in closed form.
 */
export function platePlasticModulus(plates: Float64Array, count: number, A: number, start?: number): number {
  return plateModulusAbout(plates, count, plateNeutralAxis(plates, count, A, start));
}

/** The horizontal equal-area (plastic neutral) axis of the plates, by the walk described above. */
export function plateNeutralAxis(plates: Float64Array, count: number, A: number, start?: number): number {
  const half = 0.5 * A;
  const m = count * PLATE_STRIDE;
  let p = start === undefined ? plateCentroidY(plates, count) : start;
  for (let guard = 0; guard <= 2 * count + 2; guard++) {
    let a = 0,
      wUp = 0,
      wDown = 0,
      eUp = Infinity,
      eDown = -Infinity;
    for (let i = 0; i < m; i += PLATE_STRIDE) {
      const b = plates[i],
        bot = plates[i + 3],
        top = bot + plates[i + 1];
      if (top > p) a += b * (top - (bot > p ? bot : p));
      if (bot <= p && p < top) wUp += b;
      if (bot < p && p <= top) wDown += b;
      if (bot > p && bot < eUp) eUp = bot;
      if (top > p && top < eUp) eUp = top;
      if (top < p && top > eDown) eDown = top;
      if (bot < p && bot > eDown) eDown = bot;
    }
    if (a === half) break;
    if (a > half) {
      if (wUp > 0) {
        const y = p + (a - half) / wUp;
        if (y <= eUp) {
          p = y;
          break;
        }
      }
      if (eUp === Infinity) break;
      p = eUp;
    } else {
      if (wDown > 0) {
        const y = p - (half - a) / wDown;
        if (y >= eDown) {
          p = y;
          break;
        }
      }
      if (eDown === -Infinity) break;
      p = eDown;
    }
  }
  return p;
}

/** ∫|y − p| dA over the plates: the plastic modulus when p is the equal-area axis. */
export function plateModulusAbout(plates: Float64Array, count: number, p: number): number {
  const m = count * PLATE_STRIDE;
  let Z = 0;
  for (let i = 0; i < m; i += PLATE_STRIDE) {
    const b = plates[i],
      h = plates[i + 1],
      bot = plates[i + 3],
      top = bot + h;
    if (p <= bot) Z += b * h * (bot + 0.5 * h - p);
    else if (p >= top) Z += b * h * (p - bot - 0.5 * h);
    else Z += 0.5 * b * ((p - bot) * (p - bot) + (top - p) * (top - p));
  }
  return Z;
}

function plateCentroidY(plates: Float64Array, count: number): number {
  let a = 0,
    s = 0;
  for (let i = 0; i < count * PLATE_STRIDE; i += PLATE_STRIDE) {
    const ar = plates[i] * plates[i + 1];
    a += ar;
    s += ar * (plates[i + 3] + 0.5 * plates[i + 1]);
  }
  return s / a;
}

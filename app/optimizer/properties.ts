// sectionProperties: every field of the contract's SectionProperties table.
//
// Two paths, same formulas for everything derived (finish()):
// - plates input: checked by hand, packed into a module scratch buffer, run through the
//   allocation-free plate kernel; plastic axes found exactly (area above a line is piecewise
//   linear between plate edges). This is the path the bench and the search's callers hit.
// - polygons and families: a Shape (plates + root fillets + rings) summed piece by piece;
//   the equal-area axis by bisection to machine precision (the modulus is stationary there,
//   so its error is second order).
// zod is not used here: callers at the edges parse with sectionInputSchema; this function
// re-checks structure by hand (validate.ts) so it never trusts a cast.
import {
  compositeKernel,
  platePlasticModulus,
  KERNEL_OUT,
  K_AREA,
  K_CY,
  K_CZ,
  K_IY,
  K_IYZ,
  K_IZ,
  K_MAXY,
  K_MAXZ,
  K_MINY,
  K_MINZ,
  PLATE_STRIDE,
} from "./composite";
import type { StabilityProperties } from "./design-types";
import { EngineInputError } from "./errors";
import { FAMILY_DIMENSIONS, type Family } from "./geometry";
import { familyStability } from "./stability";
import { I_A, I_Y, I_YY, I_Z, I_ZY, I_ZZ, INTEGRALS, ringInside, ringIntegrals } from "./polygon";
import { DEFAULT_DENSITY, type SectionInput } from "./schema";
import { hollowTorsion } from "./hollow";
import { buildShape, shapeAbove, shapeBBox, shapeBreaks, shapeIntegrals, shapeWidth, transposeShape, type Ring, type Shape } from "./shape";
import { MAX_DENSITY, findInputViolation, pathText, platesOverlapAt } from "./validate";

export type Jmethod = "open-thin-walled" | "closed-bredt" | "polygon-approximate";

export interface SectionProperties {
  area: number;
  centroid: { z: number; y: number };
  extremes: { top: number; bottom: number; left: number; right: number };
  Iz: number;
  Iy: number;
  Iyz: number;
  principal: { I1: number; I2: number; angleDeg: number };
  Sz: { top: number; bottom: number };
  Sy: { left: number; right: number };
  Zz: number;
  Zy: number;
  rz: number;
  ry: number;
  Qz: number;
  widthAtNeutralAxis: number;
  J: number;
  Jmethod: Jmethod;
  massPerMetre: number;
  /** member-checks.md §1 (h0, shear centre, Cw, betaX, J for LTB); null for plates, polygons, angle, channel-down */
  stability: StabilityProperties | null;
}

/** Every property of one section. Throws EngineInputError naming the field on bad input. */
export function sectionProperties(input: SectionInput): SectionProperties {
  const plates = typeof input === "object" && input !== null ? (input as { plates?: unknown }).plates : undefined;
  if (Array.isArray(plates)) return platesProperties(input as { plates: PlateObj[]; density?: number });
  const bad = findInputViolation(input);
  if (bad) throw new EngineInputError(pathText(bad.path) || "input", bad.message);
  const shape = buildShape(input);
  const out = shapeProperties(shape, densityOf(input));
  out.stability = inputStability(input);
  return out;
}

/** properties.stability of an already validated SectionInput (null for plates, polygons and the families without). */
export function inputStability(input: SectionInput): StabilityProperties | null {
  const fam = input as { family?: Family; flip?: boolean };
  if (typeof fam.family !== "string") return null;
  // hollow sections (rhs, chs) are catalogue shapes outside member-checks.md §1's list: no stability block
  const names = (FAMILY_DIMENSIONS as Partial<Record<string, readonly string[]>>)[fam.family];
  if (!names) return null;
  return familyStability(fam.family, input as unknown as Record<string, number>, names, fam.flip === true);
}

function densityOf(input: unknown): number {
  const d = (input as { density?: number }).density;
  return d === undefined ? DEFAULT_DENSITY : d;
}

// ------------------------------------------------------------------ plates fast path

type PlateObj = { b: number; h: number; z: number; y: number };

let buf = new Float64Array(16 * PLATE_STRIDE);
let tbuf = new Float64Array(16 * PLATE_STRIDE);
const kout = new Float64Array(KERNEL_OUT);

const fin = Number.isFinite;

function platesProperties(input: { plates: PlateObj[]; density?: number }): SectionProperties {
  const ps = input.plates;
  const n = ps.length;
  if (n > buf.length / PLATE_STRIDE) {
    buf = new Float64Array(n * 2 * PLATE_STRIDE);
    tbuf = new Float64Array(n * 2 * PLATE_STRIDE);
  }
  // local aliases: module-level lets are re-read on every access
  const P = buf,
    T = tbuf;
  let ok = n > 0;
  for (let i = 0; i < n && ok; i++) {
    const p = ps[i];
    if (typeof p !== "object" || p === null) {
      ok = false;
      break;
    }
    const b = p.b,
      h = p.h,
      z = p.z,
      y = p.y;
    // typeof checks first: Number.isFinite alone rejects strings too, but keep it explicit
    if (!(typeof b === "number" && typeof h === "number" && fin(b) && fin(h) && fin(z) && fin(y) && b > 0 && h > 0)) ok = false;
    const k = i * PLATE_STRIDE;
    P[k] = b;
    P[k + 1] = h;
    P[k + 2] = z;
    P[k + 3] = y;
  }
  const dens = input.density;
  if (dens !== undefined && !(typeof dens === "number" && fin(dens) && dens > 0 && dens <= MAX_DENSITY)) ok = false;
  // Overlap test on the packed numbers (interiors only: touching plates are fine).
  for (let i = 1; i < n && ok; i++) {
    const a = i * PLATE_STRIDE;
    const ab = P[a], ah = P[a + 1], az = P[a + 2], ay = P[a + 3];
    for (let j = 0; j < i; j++) {
      const c = j * PLATE_STRIDE;
      const cb = P[c], ch = P[c + 1], cz = P[c + 2], cy = P[c + 3];
      // cheap strict test first; the slack-aware one (validate.ts) only for candidates
      if (az < cz + cb && cz < az + ab && ay < cy + ch && cy < ay + ah && platesOverlapAt(az, ay, ab, ah, cz, cy, cb, ch)) {
        ok = false;
        break;
      }
    }
  }
  if (!ok) {
    // Slow path only to word the message.
    const bad = findInputViolation(input);
    throw new EngineInputError(bad ? pathText(bad.path) || "input" : "plates", bad ? bad.message : "invalid plates");
  }
  compositeKernel(P, n, kout);
  const A = kout[K_AREA],
    cz = kout[K_CZ],
    cy = kout[K_CY];
  const Iz = kout[K_IZ],
    Iy = kout[K_IY],
    Iyz = kout[K_IYZ];
  const minZ = kout[K_MINZ],
    maxZ = kout[K_MAXZ],
    minY = kout[K_MINY],
    maxY = kout[K_MAXY];
  // One pass at the centroid, both axes: Qz, the widths either side of the axis and J (same
  // rules as plateQAbove, plateWidthAt and torsionConstant's open case; the property tests hold
  // them equal), and for each axis what the equal-area search needs there: the area beyond the
  // centroidal axis, the widths cut just beyond/before it and the nearest plate edges (the
  // first step of platePlasticModulus' walk).
  let Qz = 0,
    wa = 0,
    wb = 0,
    J = 0,
    aY = 0,
    eUpY = Infinity,
    eDnY = -Infinity,
    Qy = 0,
    wRz = 0,
    wLz = 0,
    aZ = 0,
    eUpZ = Infinity,
    eDnZ = -Infinity;
  for (let i = 0; i < n * PLATE_STRIDE; i += PLATE_STRIDE) {
    const b = P[i],
      h = P[i + 1],
      left = P[i + 2],
      right = left + b,
      bot = P[i + 3],
      top = bot + h;
    if (top > cy) {
      const lo = bot > cy ? bot : cy;
      aY += b * (top - lo);
      Qz += b * (top - lo) * (0.5 * (top + lo) - cy);
      if (bot <= cy) wa += b;
      if (top < eUpY) eUpY = top;
    }
    if (bot > cy && bot < eUpY) eUpY = bot;
    if (bot < cy && cy <= top) wb += b;
    if (bot < cy && bot > eDnY) eDnY = bot;
    if (top < cy && top > eDnY) eDnY = top;
    if (right > cz) {
      const lo = left > cz ? left : cz;
      aZ += h * (right - lo);
      Qy += h * (right - lo) * (0.5 * (right + lo) - cz);
      if (left <= cz) wRz += h;
      if (right < eUpZ) eUpZ = right;
    }
    if (left > cz && left < eUpZ) eUpZ = left;
    if (left < cz && cz <= right) wLz += h;
    if (left < cz && left > eDnZ) eDnZ = left;
    if (right < cz && right > eDnZ) eDnZ = right;
    J += b > h ? (b * h * h * h) / 3 : (h * b * b * b) / 3;
  }
  let Zz = bandPlasticModulus(0.5 * A, cy, Qz, aY, wa, wb, eUpY, eDnY);
  if (Zz !== Zz) Zz = platePlasticModulus(P, n, A, cy);
  let Zy = bandPlasticModulus(0.5 * A, cz, Qy, aZ, wRz, wLz, eUpZ, eDnZ);
  if (Zy !== Zy) {
    // the transposed copy is only needed here (the walk reads heights as y)
    for (let i = 0; i < n * PLATE_STRIDE; i += PLATE_STRIDE) {
      T[i] = P[i + 1];
      T[i + 1] = P[i];
      T[i + 2] = P[i + 3];
      T[i + 3] = P[i + 2];
    }
    Zy = platePlasticModulus(T, n, A, cz);
  }
  return finish(A, cz, cy, Iz, Iy, Iyz, minZ, maxZ, minY, maxY, Zz, Zy, Qz, wa < wb ? wa : wb, J, "open-thin-walled", dens === undefined ? DEFAULT_DENSITY : dens);
}

/**
 * Plastic modulus when the equal-area axis lies in the band of constant cut width around the
 * centroidal axis c (the usual case), else NaN (the caller walks: platePlasticModulus).
 * half = A/2, Q = ∫_{s>c} (s − c) dA, a = area beyond c, wUp/wDn the widths cut just beyond and
 * just before c, eUp/eDn the nearest plate edges either side. With p = c ± δ in the band,
 * Z = ∫|s − p| dA = 2·U(p) − A·(c − p), U(p) = ∫_{s>p} (s − p) dA = Q ∓ (a·δ ∓ w·δ²/2), and
 * w·δ = |a − half| reduce it to Z = 2Q − w·δ² (either side).
 */
function bandPlasticModulus(half: number, c: number, Q: number, a: number, wUp: number, wDn: number, eUp: number, eDn: number): number {
  if (a === half) return 2 * Q;
  if (a > half) {
    if (!(wUp > 0)) return NaN;
    const d = (a - half) / wUp;
    return c + d <= eUp ? 2 * Q - wUp * d * d : NaN;
  }
  if (!(wDn > 0)) return NaN;
  const d = (half - a) / wDn;
  return c - d >= eDn ? 2 * Q - wDn * d * d : NaN;
}

// ------------------------------------------------------------------ general path

const acc = new Float64Array(INTEGRALS);
const two = new Float64Array(2);

export function shapeProperties(s: Shape, density: number): SectionProperties {
  const [minZ, maxZ, minY, maxY] = shapeBBox(s);
  // Two passes: integrals about a corner give the centroid; about the centroid give I's
  // without the cancellation of Σy²A − A·ȳ².
  shapeIntegrals(s, minZ, minY, acc);
  const A = acc[I_A];
  if (!(A > 0)) throw new EngineInputError("polygons", "section has no net area (holes cancel the solids)");
  const cz = minZ + acc[I_Z] / A,
    cy = minY + acc[I_Y] / A;
  shapeIntegrals(s, cz, cy, acc);
  const Iz = acc[I_YY],
    Iy = acc[I_ZZ],
    Iyz = acc[I_ZY];
  const t = transposeShape(s);
  const Zz = plasticModulus(s, A, cy);
  const Zy = plasticModulus(t, A, cz);
  shapeAbove(s, cy, cy, two);
  const Qz = two[1];
  const wa = shapeWidth(s, cy, 1),
    wb = shapeWidth(s, cy, -1);
  const [J, Jm] = torsionConstant(s);
  return finish(A, cz, cy, Iz, Iy, Iyz, minZ, maxZ, minY, maxY, Zz, Zy, Qz, Math.min(wa, wb), J, Jm, density);
}

/**
 * Z = ∫|y − p| dA = 2·U(p) − A(ȳ − p), U(p) = ∫_{y>p} (y − p) dA, with p the equal-area axis.
 * p is bracketed between consecutive breaks (binary search: area above is non-increasing),
 * then solved exactly in that band: between breaks the cut width is linear in y, so the area
 * above is quadratic, fixed by three evaluations. Root fillets break that (arc widths), so
 * with fillets the band is bisected to machine precision instead.
 */
function plasticModulus(s: Shape, A: number, cbar: number): number {
  const half = A / 2;
  const br = shapeBreaks(s);
  const above = (c: number) => {
    shapeAbove(s, c, 0, two);
    return two[0];
  };
  let i = 0,
    j = br.length - 1;
  while (j - i > 1) {
    const m = (i + j) >> 1;
    if (above(br[m]) >= half) i = m;
    else j = m;
  }
  const yl = br[i],
    yh = br[j];
  let p: number;
  if (s.fillets.length === 0) {
    const f0 = above(yl),
      fm = above(0.5 * (yl + yh)),
      f1 = above(yh);
    const C = 2 * (f1 - 2 * fm + f0),
      B = f1 - f0 - C,
      c0 = f0 - half;
    let t: number;
    if (Math.abs(C) <= 1e-12 * Math.abs(B)) t = B === 0 ? 0.5 : -c0 / B;
    else {
      // the root of C·t² + B·t + c0 in [0, 1], in the cancellation-free form
      const disc = Math.sqrt(Math.max(0, B * B - 4 * C * c0));
      const q = -0.5 * (B + (B >= 0 ? disc : -disc));
      const t1 = q / C,
        t2 = q !== 0 ? c0 / q : t1;
      t = Math.abs(t1 - 0.5) <= Math.abs(t2 - 0.5) ? t1 : t2;
    }
    p = yl + Math.min(1, Math.max(0, t)) * (yh - yl);
  } else {
    let lo = yl,
      hi = yh;
    for (let k = 0; k < 200; k++) {
      const mid = 0.5 * (lo + hi);
      if (mid <= lo || mid >= hi) break;
      if (above(mid) > half) lo = mid;
      else hi = mid;
    }
    p = 0.5 * (lo + hi);
  }
  shapeAbove(s, p, p, two);
  return 2 * two[1] - A * (cbar - p);
}

function torsionConstant(s: Shape): [number, Jmethod] {
  if (s.torsion === "box" && s.box) {
    // Bredt's formula for one closed cell on the wall midlines: J = 4·Am² / ∮ds/t
    // (Timoshenko & Goodier, Theory of Elasticity, 3rd ed. (1970), thin-walled tubes).
    const { d, b, tf, tw } = s.box;
    const Am = (b - tw) * (d - tf);
    return [(4 * Am * Am) / ((2 * (b - tw)) / tf + (2 * (d - tf)) / tw), "closed-bredt"];
  }
  if (s.torsion === "hollow" && s.hollow) return [hollowTorsion(s.hollow), "closed-bredt"];
  if (s.torsion === "open") {
    // Open thin-walled: Σ b·t³/3 over plates, long side b, short side t (fillets ignored).
    let J = 0;
    for (let i = 0; i < s.plateCount * PLATE_STRIDE; i += PLATE_STRIDE) {
      const b = Math.max(s.plates[i], s.plates[i + 1]),
        t = Math.min(s.plates[i], s.plates[i + 1]);
      J += (b * t * t * t) / 3;
    }
    return [J, "open-thin-walled"];
  }
  return [polygonTorsion(s.rings), "polygon-approximate"];
}

/**
 * Polygons carry no wall thickness, so J is approximate (Jmethod says so). Per solid ring:
 * with exactly one hole, Bredt on a mean wall (Am = mean of the two areas, wall t = net
 * area ÷ mean perimeter); otherwise Saint-Venant's approximation J ≈ A⁴/(4π²·Ip) about the
 * part's own centroid (exact for a circle and an ellipse; Saint-Venant 1855, quoted in
 * Roark's Formulas for Stress and Strain, 7th ed. (2002), torsion chapter).
 */
function polygonTorsion(rings: Ring[]): number {
  let J = 0;
  const solids = rings.filter((r) => !r.hole);
  const holes = rings.filter((r) => r.hole);
  for (const s of solids) {
    const mine = holes.filter((h) => ringInside(h.pts, s.pts));
    if (mine.length === 1) {
      const Ao = ringArea(s), Ai = ringArea(mine[0]);
      const pm = (perimeter(s.pts) + perimeter(mine[0].pts)) / 2;
      const Am = (Ao + Ai) / 2, t = (Ao - Ai) / pm;
      J += (4 * Am * Am * t) / pm;
      continue;
    }
    const parts = [s, ...mine];
    const g = new Float64Array(INTEGRALS);
    for (const r of parts) ringIntegrals(r.pts, 0, 0, r.hole ? -1 : 1, g);
    const a = g[I_A], zc = g[I_Z] / a, yc = g[I_Y] / a;
    const Ip = g[I_YY] - a * yc * yc + g[I_ZZ] - a * zc * zc;
    J += (a * a * a * a) / (4 * Math.PI * Math.PI * Ip);
  }
  return J;
}

function ringArea(r: Ring): number {
  const g = new Float64Array(INTEGRALS);
  ringIntegrals(r.pts, 0, 0, 1, g);
  return g[I_A];
}

function perimeter(p: Float64Array): number {
  let L = 0;
  for (let i = 0; i < p.length; i += 2) {
    const j = i + 2 === p.length ? 0 : i + 2;
    L += Math.hypot(p[j] - p[i], p[j + 1] - p[i + 1]);
  }
  return L;
}

// ------------------------------------------------------------------ shared finish

/** Relative size below which Iyz and Iz − Iy count as rounding noise (symmetric sections). */
const NOISE = 1e-12;

function finish(
  A: number, cz: number, cy: number, Iz: number, Iy: number, Iyz: number,
  minZ: number, maxZ: number, minY: number, maxY: number,
  Zz: number, Zy: number, Qz: number, width: number, J: number, Jmethod: Jmethod, density: number,
): SectionProperties {
  const scale = Iz + Iy;
  // Snap rounding noise so symmetric sections report Iyz = 0 and a clean principal angle.
  if (Math.abs(Iyz) <= NOISE * scale) Iyz = 0;
  const dI = Math.abs(Iz - Iy) <= NOISE * scale ? 0 : Iz - Iy;
  const c = 0.5 * (Iz + Iy),
    R = Math.sqrt(0.25 * dI * dI + Iyz * Iyz); // not Math.hypot: several times slower in V8
  // I(θ) about an axis at θ from z (counter-clockwise) = c + (dI/2)·cos2θ − Iyz·sin2θ,
  // largest at 2θ = atan2(−2·Iyz, dI); atan2's range (−π, π] gives θ in (−90°, 90°] as the
  // contract asks, and 0 for Iz = Iy, Iyz = 0. Iyz = 0 is decided without atan2 (also
  // sidesteps atan2(−0, negative) = −π, which would give −90°).
  let angleDeg = Iyz === 0 ? (dI < 0 ? 90 : 0) : (0.5 * Math.atan2(-2 * Iyz, dI) * 180) / Math.PI;
  if (angleDeg <= -90) angleDeg += 180;
  const top = maxY - cy,
    bottom = cy - minY,
    left = cz - minZ,
    right = maxZ - cz;
  const out: SectionProperties = {
    area: A,
    centroid: { z: cz - minZ, y: cy - minY },
    extremes: { top, bottom, left, right },
    Iz,
    Iy,
    Iyz,
    principal: { I1: c + R, I2: c - R, angleDeg },
    Sz: { top: Iz / top, bottom: Iz / bottom },
    Sy: { left: Iy / left, right: Iy / right },
    Zz,
    Zy,
    rz: Math.sqrt(Iz / A),
    ry: Math.sqrt(Iy / A),
    Qz,
    widthAtNeutralAxis: width,
    J,
    Jmethod,
    massPerMetre: A * density * 1e-6,
    stability: null,
  };
  // Extremes and plastic moduli too: a plate placed so far from the origin that its width is
  // lost to rounding (z = 1e300, b = 1) leaves finite I's but zero fibre distances, so
  // Sz = Infinity and Zz = 0 (engine contract: never Infinity, never a silent zero).
  if (
    !(fin(A) && fin(Iz) && fin(Iy) && fin(Iyz) && fin(Zz) && fin(Zy) && fin(J) && fin(out.massPerMetre) && Iz > 0 && Iy > 0) ||
    !(top > 0 && bottom > 0 && left > 0 && right > 0 && Zz > 0 && Zy > 0 && Qz > 0 && out.massPerMetre > 0) ||
    !(fin(out.Sz.top) && fin(out.Sz.bottom) && fin(out.Sy.left) && fin(out.Sy.right))
  )
    throw new EngineInputError("input", "dimensions are out of the range double precision can handle");
  return out;
}

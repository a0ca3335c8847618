// Stresses in one section under moments about both axes and a vertical shear.
// Units at this boundary (engine contract): moments kN·m, shear kN, lengths mm, stresses MPa.
// Signs: sagging Mz > 0 compresses the top fibre; tension positive.
// Positions in results are measured like centroid.z/y: from the bounding box's left and
// bottom edges, so a drawing can use them directly.
import { PLATE_STRIDE } from "./composite";
import { EngineInputError } from "./errors";
import { inputStability, shapeProperties, type SectionProperties } from "./properties";
import { DEFAULT_DENSITY, type SectionInput } from "./schema";
import { buildShape, shapeAbove, shapeBBox, shapeBreaks, shapeWidth, type Shape } from "./shape";
import { findInputViolation, pathText } from "./validate";

const KNM = 1e6; // kN·m → N·mm
const KN = 1e3; // kN → N

export interface Loads {
  /** moment about the horizontal axis, kN·m, sagging (top in compression) positive */
  Mz?: number;
  /**
   * moment about the vertical axis, kN·m. The contract is silent on its sign; chosen by
   * analogy with Mz: positive My compresses the right-hand fibre (z > centroid).
   */
  My?: number;
  /** vertical shear force, kN */
  V?: number;
}

/**
 * σ = a_z·z + a_y·y (MPa; z, y centroidal, mm): the general (unsymmetric) bending formula.
 * From −∫σ·y dA = Mz and −∫σ·z dA = My with Δ = Iz·Iy − Iyz²:
 *   σ = [Mz·(Iyz·z − Iy·y) + My·(Iyz·y − Iz·z)] / Δ
 * which for My = 0 is the contract's σ = M·(Iyz·z − Iy·y)/(Iz·Iy − Iyz²)
 * (Boresi & Schmidt, Advanced Mechanics of Materials, 6th ed. (2003), ch. 7, unsymmetrical bending).
 */
export function bendingField(p: Pick<SectionProperties, "Iz" | "Iy" | "Iyz">, Mz: number, My = 0): { az: number; ay: number } {
  const D = p.Iz * p.Iy - p.Iyz * p.Iyz;
  const mz = Mz * KNM,
    my = My * KNM;
  return { az: (mz * p.Iyz - my * p.Iz) / D, ay: (my * p.Iyz - mz * p.Iy) / D };
}

/** Normal stress (MPa) at centroidal (z, y) mm under Mz, My (kN·m). */
export function normalStress(p: Pick<SectionProperties, "Iz" | "Iy" | "Iyz">, Mz: number, My: number, z: number, y: number): number {
  const f = bendingField(p, Mz, My);
  return f.az * z + f.ay * y;
}

export interface StressPoint {
  z: number;
  y: number;
  sigma: number;
}

export interface ShearSample {
  /** height from the bottom of the bounding box, mm */
  y: number;
  /** width of material cut there (the smaller side at an edge), mm */
  width: number;
  /** first moment about the horizontal centroidal axis of the area above y, mm³ */
  Q: number;
  /** V·Q/(Iz·b), MPa */
  tau: number;
}

export interface StressResult {
  properties: SectionProperties;
  /** the neutral axis passes through the centroid at angleDeg from z (counter-clockwise, (−90, 90]); null without moment */
  neutralAxis: { z: number; y: number; angleDeg: number } | null;
  /** stresses at the top and bottom fibres; where they vary along the fibre (unsymmetric), the one of largest magnitude */
  fibre: { top: number; bottom: number };
  /** stress at every outline corner (the extremes of a linear field lie at corners of the outline) */
  corners: StressPoint[];
  maxTension: StressPoint;
  maxCompression: StressPoint;
  /** τ(y) over the depth, sorted by y; heights with no material are left out */
  shear: ShearSample[];
  /** the largest τ in shear */
  maxShear: number;
}

function num(x: number | undefined, field: string): number {
  if (x === undefined) return 0;
  if (typeof x !== "number" || !Number.isFinite(x)) throw new EngineInputError(field, `${field} must be a finite number`);
  return x;
}

/** Stresses for one section (any SectionInput form). samples: evenly spaced shear heights, besides every edge. */
export function sectionStresses(input: SectionInput, loads: Loads, samples = 60): StressResult {
  const bad = findInputViolation(input);
  if (bad) throw new EngineInputError(pathText(bad.path) || "input", bad.message);
  const Mz = num(loads.Mz, "Mz"),
    My = num(loads.My, "My"),
    V = num(loads.V, "V");
  const shape = buildShape(input);
  const density = (input as { density?: number }).density ?? DEFAULT_DENSITY;
  const p = shapeProperties(shape, density);
  p.stability = inputStability(input);
  const [minZ, , minY] = shapeBBox(shape);
  const cz = minZ + p.centroid.z,
    cy = minY + p.centroid.y;
  const { az, ay } = bendingField(p, Mz, My);

  const corners = outlineCorners(shape).map(([z, y]) => ({ z: z - minZ, y: y - minY, sigma: az * (z - cz) + ay * (y - cy) }));
  let maxT = corners[0],
    maxC = corners[0];
  for (const c of corners) {
    if (c.sigma > maxT.sigma) maxT = c;
    if (c.sigma < maxC.sigma) maxC = c;
  }
  const H = p.extremes.top + p.extremes.bottom;
  const fibreAt = (yy: number) =>
    corners.filter((c) => Math.abs(c.y - yy) <= 1e-9 * H).reduce((m, c) => (Math.abs(c.sigma) > Math.abs(m) ? c.sigma : m), 0);

  let neutralAxis: StressResult["neutralAxis"] = null;
  if (az !== 0 || ay !== 0) {
    // σ = 0 along the direction (ay, −az); fold the angle into (−90°, 90°]
    let a = (Math.atan2(-az, ay) * 180) / Math.PI;
    if (a > 90) a -= 180;
    if (a <= -90) a += 180;
    neutralAxis = { z: p.centroid.z, y: p.centroid.y, angleDeg: a };
  }

  const shear = shearProfile(shape, p.Iz, cy, minY, V * KN, samples);
  const maxShear = shear.reduce((m, s) => (Math.abs(s.tau) > Math.abs(m) ? s.tau : m), 0);
  return {
    properties: p,
    neutralAxis,
    fibre: { top: fibreAt(H), bottom: fibreAt(0) },
    corners,
    maxTension: maxT,
    maxCompression: maxC,
    shear,
    maxShear,
  };
}

/** Corners of every plate and every solid ring (fillets sit in re-entrant corners, never extreme). */
function outlineCorners(s: Shape): [number, number][] {
  const out: [number, number][] = [];
  const P = s.plates;
  for (let i = 0; i < s.plateCount * PLATE_STRIDE; i += PLATE_STRIDE) {
    const b = P[i], h = P[i + 1], z = P[i + 2], y = P[i + 3];
    out.push([z, y], [z + b, y], [z + b, y + h], [z, y + h]);
  }
  for (const r of s.rings) if (!r.hole) for (let i = 0; i < r.pts.length; i += 2) out.push([r.pts[i], r.pts[i + 1]]);
  return out;
}

/**
 * τ(y) = V·Q(y)/(Iz·b(y)) (Gere & Goodno, 7th ed. §5.8, the elementary shear formula, applied as the
 * contract says to every shape). Sampled evenly, at the neutral axis, and on both sides of
 * every edge (the smaller width, as widthAtNeutralAxis does) so the jumps are drawn.
 */
function shearProfile(s: Shape, Iz: number, cy: number, minY: number, V: number, n: number): ShearSample[] {
  const breaks = shapeBreaks(s);
  const lo = breaks[0],
    hi = breaks[breaks.length - 1];
  const ys = new Set<number>([cy, ...breaks]);
  for (let k = 0; k <= n; k++) ys.add(lo + ((hi - lo) * k) / n);
  const out: ShearSample[] = [];
  const two = new Float64Array(2);
  for (const y of [...ys].sort((a, b) => a - b)) {
    shapeAbove(s, y, cy, two);
    const Q = Math.abs(two[1]) < 1e-12 * Iz ? 0 : two[1];
    const wa = shapeWidth(s, y, 1),
      wb = shapeWidth(s, y, -1);
    // at an edge a width jump gives two values; record both sides so a plot shows the step
    const sides = wa === wb ? [wa] : [wb, wa];
    for (const w of sides) if (w > 0) out.push({ y: y - minY, width: w, Q, tau: (V * Q) / (Iz * w) });
  }
  return out;
}

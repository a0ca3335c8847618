// SI ↔ US customary at the edges (forms, API `units`, reports); the engine itself is SI only.
// Factors are exact by definition, source NIST Special Publication 811 (2008), Appendix B:
//   1 in = 25.4 mm; 1 ft = 0.3048 m; 1 lb (mass) = 0.453 592 37 kg;
//   1 lbf = 0.453 592 37 kg × 9.806 65 m/s² = 4.448 221 615 260 5 N; 1 kip = 1000 lbf.
// Derived factors are computed from those so nothing is typed twice.
import type { SectionProperties } from "./properties";
import type { SectionInput } from "./schema";

export type UnitSystem = "si" | "us";

const IN = 25.4; // mm
const FT = 304.8; // mm
const LB = 0.45359237; // kg
const LBF = 4.4482216152605; // N
const KIP = 1000 * LBF; // N

/** One US unit expressed in the engine's SI unit. */
export const UNITS = {
  length: { si: "mm", us: "in", factor: IN },
  area: { si: "mm²", us: "in²", factor: IN * IN },
  modulus: { si: "mm³", us: "in³", factor: IN * IN * IN },
  inertia: { si: "mm⁴", us: "in⁴", factor: IN * IN * IN * IN },
  warping: { si: "mm⁶", us: "in⁶", factor: IN ** 6 },
  moment: { si: "kN·m", us: "kip·ft", factor: (KIP * FT) / 1e6 }, // N·mm → kN·m
  force: { si: "kN", us: "kip", factor: KIP / 1e3 },
  stress: { si: "MPa", us: "ksi", factor: KIP / (IN * IN) }, // N/mm²
  massPerLength: { si: "kg/m", us: "lb/ft", factor: LB / (FT / 1000) },
  density: { si: "kg/m³", us: "lb/ft³", factor: LB / (FT / 1000) ** 3 },
  // Spans and uniform line loads as briefs state them (the deflection check takes m and kN/m).
  span: { si: "m", us: "ft", factor: FT / 1000 },
  lineLoad: { si: "kN/m", us: "kip/ft", factor: KIP / 1e3 / (FT / 1000) },
  angle: { si: "°", us: "°", factor: 1 },
} as const;

export type Quantity = keyof typeof UNITS;

export function toSI(q: Quantity, value: number, from: UnitSystem): number {
  return from === "us" ? value * UNITS[q].factor : value;
}

export function fromSI(q: Quantity, value: number, to: UnitSystem): number {
  return to === "us" ? value / UNITS[q].factor : value;
}

export function unitLabel(q: Quantity, system: UnitSystem): string {
  return UNITS[q][system];
}

/** The quantity of each SectionProperties field (nested fields by their dotted path). */
export const PROPERTY_QUANTITIES: Record<string, Quantity> = {
  area: "area",
  "centroid.z": "length",
  "centroid.y": "length",
  "extremes.top": "length",
  "extremes.bottom": "length",
  "extremes.left": "length",
  "extremes.right": "length",
  Iz: "inertia",
  Iy: "inertia",
  Iyz: "inertia",
  "principal.I1": "inertia",
  "principal.I2": "inertia",
  "principal.angleDeg": "angle",
  "Sz.top": "modulus",
  "Sz.bottom": "modulus",
  "Sy.left": "modulus",
  "Sy.right": "modulus",
  Zz: "modulus",
  Zy: "modulus",
  rz: "length",
  ry: "length",
  Qz: "modulus",
  widthAtNeutralAxis: "length",
  J: "inertia",
  massPerMetre: "massPerLength",
};

/** The quantity of each field of `properties.stability` (member-checks.md §1), by dotted path. */
export const STABILITY_QUANTITIES: Record<string, Quantity> = {
  "stability.h0": "length",
  "stability.shearCentre.z": "length",
  "stability.shearCentre.y": "length",
  "stability.Cw": "warping",
  "stability.betaX": "length",
  "stability.J": "inertia",
};

/** SectionProperties in the given system (a new object; Jmethod and other strings kept). */
export function propertiesIn(p: SectionProperties, to: UnitSystem): SectionProperties {
  if (to === "si") return p;
  const out = structuredClone(p) as unknown as Record<string, unknown>;
  for (const [path, q] of [...Object.entries(PROPERTY_QUANTITIES), ...Object.entries(STABILITY_QUANTITIES)]) {
    const keys = path.split(".");
    let o = out as Record<string, unknown> | null;
    for (let i = 0; i < keys.length - 1 && o; i++) o = o[keys[i]] as Record<string, unknown> | null;
    // stability is null for sections it is not defined for
    if (!o) continue;
    const k = keys[keys.length - 1];
    o[k] = fromSI(q, o[k] as number, to);
  }
  return out as unknown as SectionProperties;
}

/**
 * A SectionInput given in `from` units, converted to SI for the engine: every length
 * (plate b/h/z/y, polygon points, family dimensions and r) and the density. Keys that are
 * not numbers are copied untouched, so the schema still sees (and reports) bad values.
 */
export function sectionInputToSI<T extends SectionInput>(input: T, from: UnitSystem): T {
  if (from === "si") return input;
  const L = (x: unknown) => (typeof x === "number" ? x * IN : x);
  const src = input as Record<string, unknown>;
  const out: Record<string, unknown> = { ...src };
  if (typeof src.density === "number") out.density = toSI("density", src.density, from);
  if (Array.isArray(src.plates))
    out.plates = src.plates.map((p: Record<string, unknown>) => ({ ...p, b: L(p.b), h: L(p.h), z: L(p.z), y: L(p.y) }));
  else if (Array.isArray(src.polygons))
    out.polygons = src.polygons.map((g: Record<string, unknown>) => ({
      ...g,
      points: Array.isArray(g.points) ? g.points.map((pt: unknown) => (Array.isArray(pt) ? pt.map(L) : pt)) : g.points,
    }));
  else for (const [k, v] of Object.entries(src)) if (k !== "density" && k !== "family" && k !== "flip") out[k] = L(v);
  return out as T;
}

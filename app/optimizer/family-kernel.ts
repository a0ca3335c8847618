// Per-family facts the search needs in its hot loops: how a family's dimension vector (in the
// contract table's order) fills a packed plate buffer, which geometry rules do not involve the
// free width, the slenderness ratios, and which way the centroid moves as the free width grows.
// The plate layout is geometry.ts's (familyPlates); tests/optimizer/search.test.ts checks the
// two agree plate by plate, and that the validity rules here agree with familyRuleViolation.
import * as composite from "./composite";
import { FAMILY_DIMENSIONS, type Family } from "./geometry";
import { dimRole, type DimRole } from "./search-schema";

/** Indices into CHECK_NAMES (search-schema.ts), used by the typed-array check buffers. */
export const C_COMP = 0,
  C_TENS = 1,
  C_SHEAR = 2,
  C_OUTSTAND = 3,
  C_INTERNAL = 4,
  C_WEB = 5,
  C_STEM = 6,
  C_DEFL = 7,
  // EN 1993 basis (member-checks.md §2)
  C_CLASS4 = 8,
  C_BEND = 9,
  C_LTB = 10,
  C_VPL = 11,
  C_VB = 12,
  C_MV = 13,
  C_WELD = 14,
  C_BEARING = 15,
  N_CHECKS = 16;

export interface FamilyKernel {
  family: Family;
  dims: readonly string[];
  roles: readonly DimRole[];
  /** Index (in dims) of the width the search treats as the free variable of a row. */
  free: number;
  /** mono-i only: the other width (bt), enumerated per row; −1 otherwise. */
  second: number;
  nPlates: number;
  /** Writes the plates (geometry.ts order and frame) for dimension vector v. No validation. */
  fill(v: Float64Array, plates: Float64Array): void;
  /** Per plate: index in v of the plate's thickness (for the price per kg); −1 when not a stock plate. */
  plateThickness: readonly number[];
  /** The geometry rules that do not involve the widths (strict, as geometry.ts). */
  groupValid(v: Float64Array): boolean;
  /** The free width must be strictly greater than this (geometry rule). */
  freeMin(v: Float64Array): number;
  /** The second width must be strictly greater than this (mono-i). */
  secondMin(v: Float64Array): number;
  /** Slenderness check index per element (C_OUTSTAND…C_STEM), and the ratios in the same order. */
  slenderKinds: readonly number[];
  slender(v: Float64Array, out: Float64Array): void;
  /**
   * The plate width and thickness of each slenderness element (out[2i] = b, out[2i + 1] = t, mm):
   * the one place the elements are measured; slender() is b/t of these.
   */
  slenderParts(v: Float64Array, out: Float64Array): void;
  /** Per element, for the calculation record: what it is and its width and thickness in the family's symbols. */
  slenderWords: readonly { element: string; width: string; thickness: string }[];
  /**
   * How the centroid moves as the free width grows, for sections symmetric about the vertical
   * axis: +1 up (the free plate is the top plate), −1 down (bottom plate), 0 fixed at mid-depth
   * (symmetric about the horizontal axis too). Adding area whose centroid lies above the
   * section's centroid raises the centroid; the top plate's centroid always does (it is the
   * highest part). Unused for the unsymmetric angle.
   */
  centroidDir: 1 | -1 | 0;
  /**
   * Shear-band facts for the bound in search.ts: F = ∫ Q(y) dy over the flange bands (each
   * band of thickness t, width w, outer fibre at distance c from the centroid contributes
   * w·(c·t²/2 − t³/6), exactly), and the area of the web band (the band of constant width
   * between them). Returns false for the solid rectangle (no web band).
   */
  shearBands(v: Float64Array, cTop: number, cBot: number, out: Float64Array): boolean;
  /** Direction the centroid moves as the free width grows, for the shear bound (the angle's falls). */
  shearDir: 1 | -1 | 0;
  /** Iyz ≠ 0 in general: bending by the general (unsymmetric) formula. */
  unsymmetric: boolean;
  /** Dimension indices in tie-break order: depth, then widths, then thicknesses, each in table order. */
  tieOrder: readonly number[];
}

// local copy: module transforms make each imported-name access a getter call
const PLATE_STRIDE = composite.PLATE_STRIDE;

function put(p: Float64Array, i: number, b: number, h: number, z: number, y: number): void {
  const k = i * PLATE_STRIDE;
  p[k] = b;
  p[k + 1] = h;
  p[k + 2] = z;
  p[k + 3] = y;
}

function tieOrderOf(dims: readonly string[], family: Family): number[] {
  const idx = dims.map((_, i) => i);
  const rank = (r: DimRole) => (r === "depth" ? 0 : r === "width" ? 1 : 2);
  return idx.sort((a, b) => rank(dimRole(family, dims[a])) - rank(dimRole(family, dims[b])) || a - b);
}

type Spec = Omit<FamilyKernel, "family" | "dims" | "roles" | "tieOrder" | "shearBands" | "shearDir" | "slender">;

/** ∫ over a flange band of Q(y) dy per unit width: c·t²/2 − t³/6 (Q(s) = s·(c − s/2) from the outer face). */
const g = (c: number, t: number) => (c * t * t) / 2 - (t * t * t) / 6;

const SHEAR: Record<Family, { bands: FamilyKernel["shearBands"]; dir: 1 | -1 | 0 }> = {
  rectangle: { bands: () => false, dir: 0 },
  i: { bands: (v, cT, cB, o) => ((o[0] = v[1] * (g(cT, v[2]) + g(cB, v[2]))), (o[1] = (v[0] - 2 * v[2]) * v[3]), true), dir: 0 },
  "mono-i": { bands: (v, cT, cB, o) => ((o[0] = v[1] * g(cT, v[2]) + v[3] * g(cB, v[4])), (o[1] = (v[0] - v[2] - v[4]) * v[5]), true), dir: -1 },
  channel: { bands: (v, cT, cB, o) => ((o[0] = v[1] * (g(cT, v[2]) + g(cB, v[2]))), (o[1] = (v[0] - 2 * v[2]) * v[3]), true), dir: 0 },
  "channel-down": { bands: (v, cT, _cB, o) => ((o[0] = v[1] * g(cT, v[2])), (o[1] = (v[0] - v[2]) * 2 * v[3]), true), dir: 1 },
  tee: { bands: (v, cT, _cB, o) => ((o[0] = v[1] * g(cT, v[2])), (o[1] = (v[0] - v[2]) * v[3]), true), dir: 1 },
  box: { bands: (v, cT, cB, o) => ((o[0] = v[1] * (g(cT, v[2]) + g(cB, v[2]))), (o[1] = (v[0] - 2 * v[2]) * 2 * v[3]), true), dir: 0 },
  angle: { bands: (v, _cT, cB, o) => ((o[0] = v[1] * g(cB, v[2])), (o[1] = (v[0] - v[2]) * v[2]), true), dir: -1 },
};

// v layouts follow FAMILY_DIMENSIONS: i/channel/tee/box [d, b, tf, tw]; mono-i [d, bt, tft, bb, tfb, tw];
// channel-down [d, b, tw, tf]; angle [d, b, t]; rectangle [b, d].
const SPECS: Record<Family, Spec> = {
  rectangle: {
    free: 0,
    second: -1,
    nPlates: 1,
    fill: (v, p) => put(p, 0, v[0], v[1], 0, 0),
    plateThickness: [-1],
    groupValid: () => true,
    freeMin: () => 0,
    secondMin: () => 0,
    slenderKinds: [],
    slenderParts: () => {},
    slenderWords: [],
    centroidDir: 0,
    unsymmetric: false,
  },
  i: {
    free: 1,
    second: -1,
    nPlates: 3,
    fill: (v, p) => {
      const d = v[0],
        b = v[1],
        tf = v[2],
        tw = v[3];
      put(p, 0, b, tf, 0, 0);
      put(p, 1, tw, d - 2 * tf, (b - tw) / 2, tf);
      put(p, 2, b, tf, 0, d - tf);
    },
    plateThickness: [2, 3, 2],
    groupValid: (v) => v[0] > 2 * v[2],
    freeMin: (v) => v[3],
    secondMin: () => 0,
    slenderKinds: [C_OUTSTAND, C_WEB],
    slenderParts: (v, o) => {
      o[0] = (v[1] - v[3]) / 2;
      o[1] = v[2];
      o[2] = v[0] - 2 * v[2];
      o[3] = v[3];
    },
    slenderWords: [
      { element: "flange outstand", width: "(b − tw)/2", thickness: "tf" },
      { element: "web", width: "d − 2·tf", thickness: "tw" },
    ],
    centroidDir: 0,
    unsymmetric: false,
  },
  "mono-i": {
    free: 3,
    second: 1,
    nPlates: 3,
    fill: (v, p) => {
      const d = v[0],
        bt = v[1],
        tft = v[2],
        bb = v[3],
        tfb = v[4],
        tw = v[5];
      const W = Math.max(bt, bb);
      put(p, 0, bb, tfb, (W - bb) / 2, 0);
      put(p, 1, tw, d - tft - tfb, (W - tw) / 2, tfb);
      put(p, 2, bt, tft, (W - bt) / 2, d - tft);
    },
    plateThickness: [4, 5, 2],
    groupValid: (v) => v[0] > v[2] + v[4],
    freeMin: (v) => v[5],
    secondMin: (v) => v[5],
    slenderKinds: [C_OUTSTAND, C_OUTSTAND, C_WEB],
    slenderParts: (v, o) => {
      o[0] = (v[1] - v[5]) / 2;
      o[1] = v[2];
      o[2] = (v[3] - v[5]) / 2;
      o[3] = v[4];
      o[4] = v[0] - v[2] - v[4];
      o[5] = v[5];
    },
    slenderWords: [
      { element: "top flange outstand", width: "(bt − tw)/2", thickness: "tft" },
      { element: "bottom flange outstand", width: "(bb − tw)/2", thickness: "tfb" },
      { element: "web", width: "d − tft − tfb", thickness: "tw" },
    ],
    centroidDir: -1,
    unsymmetric: false,
  },
  channel: {
    free: 1,
    second: -1,
    nPlates: 3,
    fill: (v, p) => {
      const d = v[0],
        b = v[1],
        tf = v[2],
        tw = v[3];
      put(p, 0, tw, d, 0, 0);
      put(p, 1, b - tw, tf, tw, 0);
      put(p, 2, b - tw, tf, tw, d - tf);
    },
    plateThickness: [3, 2, 2],
    groupValid: (v) => v[0] > 2 * v[2],
    freeMin: (v) => v[3],
    secondMin: () => 0,
    slenderKinds: [C_OUTSTAND, C_WEB],
    slenderParts: (v, o) => {
      o[0] = v[1] - v[3];
      o[1] = v[2];
      o[2] = v[0] - 2 * v[2];
      o[3] = v[3];
    },
    slenderWords: [
      { element: "flange outstand", width: "b − tw", thickness: "tf" },
      { element: "web", width: "d − 2·tf", thickness: "tw" },
    ],
    centroidDir: 0,
    unsymmetric: false,
  },
  "channel-down": {
    free: 1,
    second: -1,
    nPlates: 3,
    fill: (v, p) => {
      const d = v[0],
        b = v[1],
        tw = v[2],
        tf = v[3];
      put(p, 0, b, tw, 0, d - tw);
      put(p, 1, tf, d - tw, 0, 0);
      put(p, 2, tf, d - tw, b - tf, 0);
    },
    plateThickness: [2, 3, 3],
    groupValid: (v) => v[0] > v[2],
    freeMin: (v) => 2 * v[3],
    secondMin: () => 0,
    slenderKinds: [C_INTERNAL, C_STEM],
    slenderParts: (v, o) => {
      o[0] = v[1] - 2 * v[3];
      o[1] = v[2];
      o[2] = v[0] - v[2];
      o[3] = v[3];
    },
    slenderWords: [
      { element: "top plate between the legs", width: "b − 2·tf", thickness: "tw" },
      { element: "leg", width: "d − tw", thickness: "tf" },
    ],
    centroidDir: 1,
    unsymmetric: false,
  },
  tee: {
    free: 1,
    second: -1,
    nPlates: 2,
    fill: (v, p) => {
      const d = v[0],
        b = v[1],
        tf = v[2],
        tw = v[3];
      put(p, 0, b, tf, 0, d - tf);
      put(p, 1, tw, d - tf, (b - tw) / 2, 0);
    },
    plateThickness: [2, 3],
    groupValid: (v) => v[0] > v[2],
    freeMin: (v) => v[3],
    secondMin: () => 0,
    slenderKinds: [C_OUTSTAND, C_STEM],
    slenderParts: (v, o) => {
      o[0] = (v[1] - v[3]) / 2;
      o[1] = v[2];
      o[2] = v[0] - v[2];
      o[3] = v[3];
    },
    slenderWords: [
      { element: "flange outstand", width: "(b − tw)/2", thickness: "tf" },
      { element: "stem", width: "d − tf", thickness: "tw" },
    ],
    centroidDir: 1,
    unsymmetric: false,
  },
  box: {
    free: 1,
    second: -1,
    nPlates: 4,
    fill: (v, p) => {
      const d = v[0],
        b = v[1],
        tf = v[2],
        tw = v[3];
      put(p, 0, b, tf, 0, 0);
      put(p, 1, b, tf, 0, d - tf);
      put(p, 2, tw, d - 2 * tf, 0, tf);
      put(p, 3, tw, d - 2 * tf, b - tw, tf);
    },
    plateThickness: [2, 2, 3, 3],
    groupValid: (v) => v[0] > 2 * v[2],
    freeMin: (v) => 2 * v[3],
    secondMin: () => 0,
    slenderKinds: [C_INTERNAL, C_WEB],
    slenderParts: (v, o) => {
      o[0] = v[1] - 2 * v[3];
      o[1] = v[2];
      o[2] = v[0] - 2 * v[2];
      o[3] = v[3];
    },
    slenderWords: [
      { element: "flange between the webs", width: "b − 2·tw", thickness: "tf" },
      { element: "web", width: "d − 2·tf", thickness: "tw" },
    ],
    centroidDir: 0,
    unsymmetric: false,
  },
  angle: {
    free: 1,
    second: -1,
    nPlates: 2,
    fill: (v, p) => {
      const d = v[0],
        b = v[1],
        t = v[2];
      put(p, 0, t, d, 0, 0);
      put(p, 1, b - t, t, t, 0);
    },
    plateThickness: [2, 2],
    groupValid: (v) => v[0] > v[2],
    freeMin: (v) => v[2],
    secondMin: () => 0,
    slenderKinds: [C_OUTSTAND, C_OUTSTAND],
    slenderParts: (v, o) => {
      o[0] = v[0] - v[2];
      o[1] = v[2];
      o[2] = v[1] - v[2];
      o[3] = v[2];
    },
    slenderWords: [
      { element: "vertical leg", width: "d − t", thickness: "t" },
      { element: "horizontal leg", width: "b − t", thickness: "t" },
    ],
    centroidDir: 0,
    unsymmetric: true,
  },
};

/** b/t of each element from slenderParts (the same division the ratios always were: ((b − tw)/2)/tf …). */
function slenderOf(spec: Spec): FamilyKernel["slender"] {
  const parts = spec.slenderParts,
    n = spec.slenderKinds.length;
  const bt = new Float64Array(2 * n);
  return (v, o) => {
    parts(v, bt);
    for (let i = 0; i < n; i++) o[i] = bt[2 * i] / bt[2 * i + 1];
  };
}

export const FAMILY_KERNELS: Record<Family, FamilyKernel> = Object.fromEntries(
  (Object.keys(SPECS) as Family[]).map((f) => {
    const dims = FAMILY_DIMENSIONS[f];
    return [
      f,
      { ...SPECS[f], slender: slenderOf(SPECS[f]), family: f, dims, roles: dims.map((d) => dimRole(f, d)), tieOrder: tieOrderOf(dims, f), shearBands: SHEAR[f].bands, shearDir: SHEAR[f].dir },
    ];
  }),
) as unknown as Record<Family, FamilyKernel>;

/** Dimension vector (table order) → the contract's `dimensions` object. */
export function dimsObject(fk: FamilyKernel, v: ArrayLike<number>): Record<string, number> {
  const o: Record<string, number> = {};
  fk.dims.forEach((name, i) => (o[name] = v[i]));
  return o;
}

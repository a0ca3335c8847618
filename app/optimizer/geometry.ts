// The contract's parametric families as plate lists (and, for rolled shapes, root fillets).
// Frame: the bounding box's bottom-left corner at (0, 0); z to the right, y up; mm.
// The plate order per family is part of the interface: the search may fill its typed
// arrays directly in this order and tests its fast path against familyPlates.
import type { PlateRect } from "./composite";
import { EngineInputError } from "./errors";

export const FAMILIES = ["rectangle", "i", "mono-i", "channel", "channel-down", "tee", "box", "angle"] as const;
export type Family = (typeof FAMILIES)[number];

/** Dimension names per family, in the order the contract's table lists them (also the tie-break order). */
export const FAMILY_DIMENSIONS = {
  rectangle: ["b", "d"],
  i: ["d", "b", "tf", "tw"],
  "mono-i": ["d", "bt", "tft", "bb", "tfb", "tw"],
  channel: ["d", "b", "tf", "tw"],
  "channel-down": ["d", "b", "tw", "tf"],
  tee: ["d", "b", "tf", "tw"],
  box: ["d", "b", "tf", "tw"],
  angle: ["d", "b", "t"],
} as const satisfies Record<Family, readonly string[]>;

/** Families that take an optional root radius r. */
export const FILLETED_FAMILIES: readonly Family[] = ["i", "channel", "tee", "angle"];
/**
 * Families that also take a toe radius rt: a rolled angle's leg tips are rounded on the inner
 * face (EN 10056-1 prints it as r2), which moves its area by about 1%, far beyond a table's
 * rounding, so matching printed angle properties needs it.
 */
export const TOE_RADIUS_FAMILIES: readonly Family[] = ["angle"];

export type FamilyDims = Record<string, number>;

/**
 * A root fillet: the spandrel between the square [z, z + dz·r] × [y, y + dy·r] and the
 * quarter circle of radius r centred at its far corner (z + dz·r, y + dy·r). (z, y) is the
 * re-entrant corner where web face meets flange face; dz, dy point into the fillet.
 */
export interface Fillet {
  z: number;
  y: number;
  dz: 1 | -1;
  dy: 1 | -1;
  r: number;
  /**
   * −1: the spandrel is cut away rather than added (the rounded outer corners of a hollow
   * section, hollow.ts). Absent means +1, as every root fillet.
   */
  sign?: 1 | -1;
}

const v = (field: string, message: string) => ({ field, message });

/**
 * The first geometry rule the dimensions break, or null. Valid means strictly positive,
 * finite dimensions and strictly positive clear plates (engine contract, SearchProblem grid).
 * Shared by familyPlates and the search so both reject the same shapes.
 */
export function familyRuleViolation(family: Family, dims: FamilyDims): { field: string; message: string } | null {
  for (const k of FAMILY_DIMENSIONS[family]) {
    const x = dims[k];
    if (typeof x !== "number" || !Number.isFinite(x)) return v(k, `${family}: ${k} must be a finite number`);
    if (x <= 0) return v(k, `${family}: ${k} must be positive`);
  }
  const { d, b, tf, tw, t } = dims;
  switch (family) {
    case "rectangle":
      return null;
    case "i":
      if (!(d > 2 * tf)) return v("d", "i: d must exceed 2·tf");
      if (!(b > tw)) return v("b", "i: b must exceed tw");
      return null;
    case "mono-i":
      if (!(d > dims.tft + dims.tfb)) return v("d", "mono-i: d must exceed tft + tfb");
      if (!(dims.bt > tw)) return v("bt", "mono-i: bt must exceed tw");
      if (!(dims.bb > tw)) return v("bb", "mono-i: bb must exceed tw");
      return null;
    case "channel":
      if (!(d > 2 * tf)) return v("d", "channel: d must exceed 2·tf");
      if (!(b > tw)) return v("b", "channel: b must exceed tw");
      return null;
    case "channel-down":
      if (!(d > tw)) return v("d", "channel-down: d must exceed tw");
      if (!(b > 2 * tf)) return v("b", "channel-down: b must exceed 2·tf");
      return null;
    case "tee":
      if (!(d > tf)) return v("d", "tee: d must exceed tf");
      if (!(b > tw)) return v("b", "tee: b must exceed tw");
      return null;
    case "box":
      if (!(d > 2 * tf)) return v("d", "box: d must exceed 2·tf");
      if (!(b > 2 * tw)) return v("b", "box: b must exceed 2·tw");
      return null;
    case "angle":
      if (!(d > t)) return v("d", "angle: d must exceed t");
      if (!(b > t)) return v("b", "angle: b must exceed t");
      return null;
  }
}

/** Root-radius rule: the fillet must fit in the clear outstand and the clear web/stem. */
export function filletRuleViolation(family: Family, dims: FamilyDims): { field: string; message: string } | null {
  const rt = dims.rt ?? 0;
  if (rt !== 0) {
    if (!TOE_RADIUS_FAMILIES.includes(family)) return v("rt", `${family}: takes no toe radius rt`);
    if (!Number.isFinite(rt) || rt < 0) return v("rt", `${family}: rt must be a finite number ≥ 0`);
    if (rt > dims.t) return v("rt", `${family}: rt must not exceed t`);
  }
  const r = dims.r ?? 0;
  if (r === 0) return null;
  if (!FILLETED_FAMILIES.includes(family)) return v("r", `${family}: takes no root radius r`);
  if (!Number.isFinite(r) || r < 0) return v("r", `${family}: r must be a finite number ≥ 0`);
  const { d, b, tf, tw } = dims;
  if (family === "angle") {
    if (r > Math.min(d, b) - dims.t) return v("r", "angle: r must not exceed the clear leg, min(d, b) − t");
    return null;
  }
  const outstand = family === "channel" ? b - tw : (b - tw) / 2;
  if (r > outstand) return v("r", family === "channel" ? "channel: r must not exceed b − tw" : `${family}: r must not exceed (b − tw)/2`);
  if (family === "tee") {
    if (r > d - tf) return v("r", "tee: r must not exceed d − tf");
  } else if (2 * r > d - 2 * tf) return v("r", `${family}: 2·r must not exceed d − 2·tf`);
  return null;
}

function check(family: Family, dims: FamilyDims): void {
  if (!(FAMILIES as readonly string[]).includes(family)) throw new EngineInputError("family", `unknown family "${String(family)}"`);
  const bad = familyRuleViolation(family, dims) ?? filletRuleViolation(family, dims);
  if (bad) throw new EngineInputError(bad.field, bad.message);
}

/** The family's plates (r ignored: fillets come from familyFillets). Throws EngineInputError. */
export function familyPlates(family: Family, dims: FamilyDims, flip = false): PlateRect[] {
  check(family, dims);
  const plates = unflippedPlates(family, dims);
  if (!flip) return plates;
  const H = dims.d; // every family's overall depth
  return plates.map((p) => ({ b: p.b, h: p.h, z: p.z, y: H - p.y - p.h }));
}

function unflippedPlates(family: Family, dims: FamilyDims): PlateRect[] {
  const { d, b, tf, tw, t } = dims;
  const P = (b: number, h: number, z: number, y: number): PlateRect => ({ b, h, z, y });
  switch (family) {
    case "rectangle":
      return [P(b, d, 0, 0)];
    case "i":
      // bottom flange, web, top flange
      return [P(b, tf, 0, 0), P(tw, d - 2 * tf, (b - tw) / 2, tf), P(b, tf, 0, d - tf)];
    case "mono-i": {
      const { bt, tft, bb, tfb } = dims;
      const W = Math.max(bt, bb);
      // bottom flange, web, top flange, centred on z = W/2
      return [P(bb, tfb, (W - bb) / 2, 0), P(tw, d - tft - tfb, (W - tw) / 2, tfb), P(bt, tft, (W - bt) / 2, d - tft)];
    }
    case "channel":
      // full-depth web at the left, then bottom and top flanges from its right face
      return [P(tw, d, 0, 0), P(b - tw, tf, tw, 0), P(b - tw, tf, tw, d - tf)];
    case "channel-down":
      // web across the top (tw thick), left and right legs (tf thick) hanging below it
      return [P(b, tw, 0, d - tw), P(tf, d - tw, 0, 0), P(tf, d - tw, b - tf, 0)];
    case "tee":
      // flange at the top, stem centred below it
      return [P(b, tf, 0, d - tf), P(tw, d - tf, (b - tw) / 2, 0)];
    case "box":
      // bottom and top plates full width, webs between them at the outer edges
      return [P(b, tf, 0, 0), P(b, tf, 0, d - tf), P(tw, d - 2 * tf, 0, tf), P(tw, d - 2 * tf, b - tw, tf)];
    case "angle":
      // vertical leg full depth at the left, horizontal leg from its right face
      return [P(t, d, 0, 0), P(b - t, t, t, 0)];
  }
}

/**
 * Root fillets for i / channel / tee / angle when r > 0, and an angle's rounded toes when rt > 0
 * (spandrels cut away, sign −1); empty otherwise. Same frame and flip as familyPlates.
 */
export function familyFillets(family: Family, dims: FamilyDims, flip = false): Fillet[] {
  const r = dims.r ?? 0;
  const rt = dims.rt ?? 0;
  if ((r <= 0 && rt <= 0) || !FILLETED_FAMILIES.includes(family)) return [];
  check(family, dims);
  const { d, b, tf, tw } = dims;
  const F = (z: number, y: number, dz: 1 | -1, dy: 1 | -1): Fillet => ({ z, y, dz, dy, r });
  let out: Fillet[];
  const wl = (b - tw) / 2,
    wr = (b + tw) / 2;
  if (family === "angle") {
    const t = dims.t;
    out = r > 0 ? [F(t, t, 1, 1)] : [];
    // the inner corner of each leg's tip: top of the vertical leg, right end of the horizontal one
    if (rt > 0) out.push({ z: t, y: d, dz: -1, dy: -1, r: rt, sign: -1 }, { z: b, y: t, dz: -1, dy: -1, r: rt, sign: -1 });
  } else if (family === "i") out = [F(wl, tf, -1, 1), F(wr, tf, 1, 1), F(wl, d - tf, -1, -1), F(wr, d - tf, 1, -1)];
  else if (family === "channel") out = [F(tw, tf, 1, 1), F(tw, d - tf, 1, -1)];
  else out = [F(wl, d - tf, -1, -1), F(wr, d - tf, 1, -1)];
  if (!flip) return out;
  return out.map((f) => ({ ...f, y: d - f.y, dy: (-f.dy) as 1 | -1 }));
}

/** Closed-cell families (torsion by Bredt's formula). */
export function isClosedFamily(family: Family): boolean {
  return family === "box";
}

// Stability properties of the parametric families (member-checks.md §1): h0, the shear centre,
// the warping constant Cw, the mono-symmetry coefficient betaX and the torsion constant J the
// lateral-torsional buckling check uses. Thin-walled midline model (each flange a line of its
// full width at mid-thickness, the web between the flange midlines), root radius ignored.
//
// One kernel, allocation-free, serves both callers: sectionProperties (the bench, the API,
// the record) and the EN 1993 checks inside the search, so the numbers cannot drift apart.
//
// Sources (closed forms as member-checks.md tabulates them):
// - I and mono-symmetric I: Cw = If,t·If,b·h0²/(If,t + If,b) (= tf·b³·h0²/24 doubly symmetric),
//   shear centre where the flanges' minor-axis stiffnesses balance: Timoshenko & Gere, Theory of
//   Elastic Stability, 2nd ed. (1961), ch. 5 (thin-walled open sections) (mem.).
// - Channel: e0 = 3·b′²·tf/(6·b′·tf + h0·tw) from the web midline, Cw = tf·b′³·h0²·(3·b′·tf +
//   2·h0·tw)/(12·(6·b′·tf + h0·tw)): the usual thin-walled results for a channel of flange
//   width b′ measured to the web midline (e.g. Galambos, Structural Members and Frames, 1968) (mem.).
// - Tee, box, rectangle: Cw = 0 (tee: both plates meet at one line; closed and solid sections:
//   warping negligible), as member-checks.md states.
// - betaX = (1/Iz)·∫ v·(w² + v²) dA − 2·v0 (Wagner's coefficient; v down from the centroid),
//   integrated exactly over the actual plates: for a plate of width b (centred on the symmetry
//   axis) between v1 and v2, ∫ v·w² dA = (b³/12)·(v2² − v1²)/2 and ∫ v³ dA = b·(v2⁴ − v1⁴)/4.
import type { StabilityProperties } from "./design-types";
import type { Family } from "./geometry";

export const ST_H0 = 0,
  ST_SCZ = 1,
  ST_SCY = 2,
  ST_CW = 3,
  ST_BETA = 4,
  ST_J = 5,
  ST_OUT = 6;

/** Families that have stability properties (member-checks.md §1). */
export const STABILITY_FAMILIES: readonly Family[] = ["i", "mono-i", "channel", "tee", "box", "rectangle"];

/** Open thin-walled plate: long side × short side³ / 3 (the engine's J, properties.ts). */
const jPlate = (a: number, b: number) => (a > b ? (a * b * b * b) / 3 : (b * a * a * a) / 3);

/**
 * ∫ v·(w² + v²) dA for a plate of width b centred on the vertical symmetry axis, spanning
 * heights y1 … y2, with v = ybar − y.
 */
function wagnerPlate(b: number, y1: number, y2: number, ybar: number): number {
  const v1 = ybar - y2,
    v2 = ybar - y1;
  const v1s = v1 * v1,
    v2s = v2 * v2;
  return ((b * b * b) / 12) * ((v2s - v1s) / 2) + (b * (v2s * v2s - v1s * v1s)) / 4;
}

/** I about the horizontal axis at ybar of a plate b × (y2 − y1). */
function iPlate(b: number, y1: number, y2: number, ybar: number): number {
  const h = y2 - y1,
    e = 0.5 * (y1 + y2) - ybar;
  return b * h * ((h * h) / 12 + e * e);
}

/**
 * betaX of a section of plates centred on one vertical axis: three plates given as
 * (b, y1, y2) triples (unused ones with b = 0); ysc the shear centre's height.
 */
function wagner(b0: number, a0: number, c0: number, b1: number, a1: number, c1: number, b2: number, a2: number, c2: number, ysc: number): number {
  const A0 = b0 * (c0 - a0),
    A1 = b1 * (c1 - a1),
    A2 = b2 * (c2 - a2);
  const ybar = (A0 * 0.5 * (a0 + c0) + A1 * 0.5 * (a1 + c1) + A2 * 0.5 * (a2 + c2)) / (A0 + A1 + A2);
  const Iz = iPlate(b0, a0, c0, ybar) + iPlate(b1, a1, c1, ybar) + iPlate(b2, a2, c2, ybar);
  const integral = wagnerPlate(b0, a0, c0, ybar) + wagnerPlate(b1, a1, c1, ybar) + wagnerPlate(b2, a2, c2, ybar);
  return integral / Iz - 2 * (ybar - ysc);
}

/**
 * Writes [h0, shear centre z, shear centre y, Cw, betaX, J] for the unflipped family section
 * (geometry.ts frame: bounding box from (0, 0)); v holds the dimensions in FAMILY_DIMENSIONS
 * order. Returns false for families without stability properties. No validation.
 */
export function stabilityKernel(family: Family, v: ArrayLike<number>, out: Float64Array): boolean {
  switch (family) {
    case "i": {
      const d = v[0],
        b = v[1],
        tf = v[2],
        tw = v[3];
      const h0 = d - tf;
      out[ST_H0] = h0;
      out[ST_SCZ] = b / 2;
      out[ST_SCY] = d / 2;
      out[ST_CW] = (tf * b * b * b * h0 * h0) / 24;
      out[ST_BETA] = 0;
      out[ST_J] = 2 * jPlate(b, tf) + jPlate(tw, d - 2 * tf);
      return true;
    }
    case "mono-i": {
      const d = v[0],
        bt = v[1],
        tft = v[2],
        bb = v[3],
        tfb = v[4],
        tw = v[5];
      const h0 = d - tft / 2 - tfb / 2;
      const It = (tft * bt * bt * bt) / 12,
        Ib = (tfb * bb * bb * bb) / 12;
      const ysc = tfb / 2 + (h0 * It) / (It + Ib);
      out[ST_H0] = h0;
      out[ST_SCZ] = Math.max(bt, bb) / 2;
      out[ST_SCY] = ysc;
      out[ST_CW] = (h0 * h0 * It * Ib) / (It + Ib);
      out[ST_BETA] = wagner(bb, 0, tfb, tw, tfb, d - tft, bt, d - tft, d, ysc);
      out[ST_J] = jPlate(bb, tfb) + jPlate(tw, d - tft - tfb) + jPlate(bt, tft);
      return true;
    }
    case "channel": {
      const d = v[0],
        b = v[1],
        tf = v[2],
        tw = v[3];
      const h0 = d - tf,
        bp = b - tw / 2;
      const den = 6 * bp * tf + h0 * tw;
      out[ST_H0] = h0;
      // the web is at the left (z = 0 … tw), the flanges run right: the shear centre lies left of the web's midline
      out[ST_SCZ] = tw / 2 - (3 * bp * bp * tf) / den;
      out[ST_SCY] = d / 2;
      out[ST_CW] = (tf * bp * bp * bp * h0 * h0 * (3 * bp * tf + 2 * h0 * tw)) / (12 * den);
      out[ST_BETA] = 0;
      out[ST_J] = jPlate(tw, d) + 2 * jPlate(b - tw, tf);
      return true;
    }
    case "tee": {
      const d = v[0],
        b = v[1],
        tf = v[2],
        tw = v[3];
      const ysc = d - tf / 2;
      out[ST_H0] = d - tf / 2;
      out[ST_SCZ] = b / 2;
      out[ST_SCY] = ysc;
      out[ST_CW] = 0;
      out[ST_BETA] = wagner(tw, 0, d - tf, b, d - tf, d, 0, 0, 0, ysc);
      out[ST_J] = jPlate(b, tf) + jPlate(tw, d - tf);
      return true;
    }
    case "box": {
      const d = v[0],
        b = v[1],
        tf = v[2],
        tw = v[3];
      // Bredt on the midline cell, as properties.ts (Timoshenko & Goodier, Theory of Elasticity, 3rd ed. (1970), thin-walled tubes)
      const Am = (b - tw) * (d - tf);
      out[ST_H0] = d - tf;
      out[ST_SCZ] = b / 2;
      out[ST_SCY] = d / 2;
      out[ST_CW] = 0;
      out[ST_BETA] = 0;
      out[ST_J] = (4 * Am * Am) / ((2 * (b - tw)) / tf + (2 * (d - tf)) / tw);
      return true;
    }
    case "rectangle": {
      const b = v[0],
        d = v[1];
      // Solid rectangle, s the smaller side and l the larger: J = l·s³·(1/3 − 0.21·(s/l)·(1 − s⁴/(12·l⁴)))
      // (the usual approximation, e.g. Roark's Formulas for Stress and Strain, 7th ed. (2002), torsion table) (mem.)
      const s = Math.min(b, d),
        l = Math.max(b, d);
      const r = s / l;
      out[ST_H0] = d;
      out[ST_SCZ] = b / 2;
      out[ST_SCY] = d / 2;
      out[ST_CW] = 0;
      out[ST_BETA] = 0;
      out[ST_J] = l * s * s * s * (1 / 3 - 0.21 * r * (1 - (r * r * r * r) / 12));
      return true;
    }
    default:
      return false;
  }
}

const buf = new Float64Array(ST_OUT);

/** properties.stability of a family section (null where member-checks.md §1 defines none). */
export function familyStability(family: Family, dims: Record<string, number>, dimNames: readonly string[] | undefined, flip: boolean): StabilityProperties | null {
  if (!STABILITY_FAMILIES.includes(family)) return null;
  const v = (dimNames ?? []).map((n) => dims[n]);
  if (!stabilityKernel(family, v, buf)) return null;
  const d = dims.d;
  // flip mirrors the section about its mid-depth: the shear centre moves to d − y, betaX changes sign
  const y = flip ? d - buf[ST_SCY] : buf[ST_SCY];
  const beta = flip ? -buf[ST_BETA] : buf[ST_BETA];
  return { h0: buf[ST_H0], shearCentre: { z: buf[ST_SCZ], y }, Cw: buf[ST_CW], betaX: beta === 0 ? 0 : beta, J: buf[ST_J] };
}

// Root fillets of rolled shapes: the spandrel between an r × r square and the quarter circle
// of radius r centred at the square's far corner (see Fillet in geometry.ts).
//
// Local axes u, v run from the re-entrant corner into the fillet. Derived as square minus
// quarter disc (quarter disc centroid 4r/(3π) from its centre, Iₓ about a diameter πr⁴/16,
// product about the centre axes r⁴/8: standard tables, e.g. Gere & Goodno, Mechanics of
// Materials, 7th ed. (2009), Appendix D, cases 1 and 10), then moved with the parallel-axis theorem:
//   A      = r²(1 − π/4)
//   ∫u dA  = ∫v dA  = r³(5/6 − π/4)        (centroid r(10 − 3π)/(12 − 3π) ≈ 0.2234 r from each face)
//   ∫u² dA = ∫v² dA = r⁴(1 − 5π/16)
//   ∫uv dA          = r⁴(19/24 − π/4)
// tests/optimizer/properties.test.ts checks these against a finely divided polygon.
import type { Fillet } from "./geometry";
import { I_A, I_Y, I_YY, I_Z, I_ZY, I_ZZ } from "./polygon";

const QPI = Math.PI / 4;

/** Adds the fillet's area integrals, coordinates relative to (oz, oy), into out. */
export function filletIntegrals(f: Fillet, oz: number, oy: number, out: Float64Array): void {
  const r = f.r,
    r2 = r * r;
  const A = r2 * (1 - QPI);
  const m1 = r2 * r * (5 / 6 - QPI);
  const m2 = r2 * r2 * (1 - (5 * Math.PI) / 16);
  const muv = r2 * r2 * (19 / 24 - QPI);
  const Z0 = f.z - oz,
    Y0 = f.y - oy;
  const w = f.sign ?? 1;
  out[I_A] += w * A;
  out[I_Z] += w * (A * Z0 + f.dz * m1);
  out[I_Y] += w * (A * Y0 + f.dy * m1);
  out[I_ZZ] += w * (A * Z0 * Z0 + 2 * Z0 * f.dz * m1 + m2);
  out[I_YY] += w * (A * Y0 * Y0 + 2 * Y0 * f.dy * m1 + m2);
  out[I_ZY] += w * (A * Z0 * Y0 + Z0 * f.dy * m1 + Y0 * f.dz * m1 + f.dz * f.dy * muv);
}

/** ½(u√(r² − u²) + r²·asin(u/r)) = ∫₀ᵘ √(r² − s²) ds (standard integral). */
function circ(u: number, r: number): number {
  const q = r * r - u * u;
  return 0.5 * (u * Math.sqrt(q > 0 ? q : 0) + r * r * Math.asin(Math.max(-1, Math.min(1, u / r))));
}

/** Area G(t) = ∫₀ᵗ w(v) dv and first moment H(t) = ∫₀ᵗ v·w(v) dv, with w(v) = r − √(r² − (r − v)²). */
function partial(t: number, r: number): [number, number] {
  const s = r - t;
  const G = r * t - (QPI * r * r - circ(s, r));
  const q = r * r - s * s;
  const H = (r * t * t) / 2 - r * (QPI * r * r - circ(s, r)) + Math.pow(q > 0 ? q : 0, 1.5) / 3;
  return [G, H];
}

/** Area and ∫(y − oy) dA of the fillet's part with y ≥ c (negative for a cut-away spandrel, sign −1). */
export function filletAbove(f: Fillet, c: number, oy: number, out: Float64Array): void {
  const r = f.r;
  const A = r * r * (1 - QPI),
    M = r * r * r * (5 / 6 - QPI);
  const Y0 = f.y - oy;
  if (f.dy > 0) {
    // part v ≥ t with t = c − y0
    const t = Math.min(r, Math.max(0, c - f.y));
    const [G, H] = partial(t, r);
    const a = A - G;
    out[0] = a;
    out[1] = Y0 * a + (M - H);
  } else {
    // y = y0 − v ≥ c  ⇔  v ≤ y0 − c
    const t = Math.min(r, Math.max(0, f.y - c));
    const [G, H] = partial(t, r);
    out[0] = G;
    out[1] = Y0 * G - H;
  }
  if (f.sign === -1) {
    out[0] = -out[0];
    out[1] = -out[1];
  }
}

/** Width cut at height y (side +1 just above, −1 just below); negative for a cut-away spandrel. */
export function filletWidth(f: Fillet, y: number, side: 1 | -1): number {
  const v = f.dy * (y - f.y);
  const into = side * f.dy > 0;
  if (into ? v < 0 || v >= f.r : v <= 0 || v > f.r) return 0;
  const s = f.r - v;
  const w = f.r - Math.sqrt(Math.max(0, f.r * f.r - s * s));
  return f.sign === -1 ? -w : w;
}

/** The fillet with z and y exchanged (for properties about the vertical axis). */
export function transposeFillet(f: Fillet): Fillet {
  const t: Fillet = { z: f.y, y: f.z, dz: f.dy, dy: f.dz, r: f.r };
  if (f.sign !== undefined) t.sign = f.sign;
  return t;
}

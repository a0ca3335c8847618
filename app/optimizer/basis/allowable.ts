// The allowable-stress basis (member-checks.md §2, "allowable"): the engine contract's elastic
// bending and shear stresses against the brief's typed allowables, and the deflection check.
// It checks no stability, which every result under it says ("stresses only: no stability checks").
import * as composite from "../composite";
import type { FamilyKernel } from "../family-kernel";
import * as fkm from "../family-kernel";
import type { CheckContext, DesignBasisModule, RecordLine, Scratch } from "./core";
import { finish } from "./core";

// Local copies of imported bindings (module transforms make each imported-name access a getter call).
const { maxShearFactor, K_CY, K_CZ, K_IY, K_IYZ, K_IZ, K_MAXY, K_MINY, PLATE_STRIDE } = composite;
const { C_COMP, C_DEFL, C_SHEAR, C_TENS } = fkm;

function evaluate(fk: FamilyKernel, v: Float64Array, ctx: CheckContext, s: Scratch, all: boolean, ok: boolean): boolean {
  const dem = s.demand,
    cap = s.capacity,
    p = s.plates,
    k = s.k;
  const Iz = k[K_IZ];
  // Bending about the horizontal axis (engine contract). Sagging compresses the top fibre.
  let comp: number, tens: number, Idefl: number;
  if (!fk.unsymmetric) {
    const cTop = k[K_MAXY] - k[K_CY],
      cBot = k[K_CY] - k[K_MINY];
    // σ = M·c / Iz (elementary flexure formula; Iyz = 0 for shapes symmetric about an axis).
    comp = Math.max(ctx.Ms * cTop, ctx.Mh * cBot) / Iz;
    tens = Math.max(ctx.Ms * cBot, ctx.Mh * cTop) / Iz;
    Idefl = Iz;
  } else {
    // General (unsymmetric) bending with My = 0: σ = M·(Iyz·z − Iy·y)/(Iz·Iy − Iyz²), z and y
    // centroidal, M > 0 sagging (e.g. Boresi & Schmidt, Advanced Mechanics of Materials, 6th ed.,
    // ch. 7; formula as written in the engine contract). Linear in (z, y), so its extremes over
    // the section are at convex-hull vertices, all of which are plate corners.
    const Iy = k[K_IY],
      Iyz = k[K_IYZ],
      cz = k[K_CZ],
      cy = k[K_CY];
    const den = Iz * Iy - Iyz * Iyz;
    let vmax = -Infinity,
      vmin = Infinity;
    for (let i = 0; i < fk.nPlates; i++) {
      const o = i * PLATE_STRIDE;
      const z0 = p[o + 2] - cz,
        y0 = p[o + 3] - cy,
        z1 = z0 + p[o],
        y1 = y0 + p[o + 1];
      const a = (Iyz * z0 - Iy * y0) / den,
        b = (Iyz * z1 - Iy * y0) / den,
        c = (Iyz * z0 - Iy * y1) / den,
        d = (Iyz * z1 - Iy * y1) / den;
      vmax = Math.max(vmax, a, b, c, d);
      vmin = Math.min(vmin, a, b, c, d);
    }
    // sagging: σ = Ms·v; hogging: σ = −Mh·v (tension positive)
    comp = Math.max(-ctx.Ms * vmin, ctx.Mh * vmax, 0);
    tens = Math.max(ctx.Ms * vmax, -ctx.Mh * vmin, 0);
    // A vertical load on an unsymmetric section bends it about an inclined axis: the same
    // general theory gives the curvatures κ_vertical = M·Iy/den and κ_sideways = M·Iyz/den, so
    // the deflection is total = √(vertical² + sideways²), i.e. that of an I = den/√(Iy² + Iyz²)
    // (Boresi & Schmidt, as above). The check is on the total (issue 10: the angle moves
    // sideways too). This I ≤ den/Iy ≤ Iz, so search.ts's bound (3) (I ≤ Iz) still holds.
    Idefl = den / Math.sqrt(Iy * Iy + Iyz * Iyz);
  }
  dem[C_COMP] = comp;
  cap[C_COMP] = ctx.aC;
  dem[C_TENS] = tens;
  cap[C_TENS] = ctx.aT;
  if (comp > ctx.aC || tens > ctx.aT) {
    ok = false;
    if (!all) return finish(s, false, ctx);
  }
  if (ctx.hasDeflection) {
    s.deflI = Idefl;
    dem[C_DEFL] = ctx.deflNumerator / Idefl;
    cap[C_DEFL] = ctx.deflLimit;
    if (dem[C_DEFL] > ctx.deflLimit) {
      ok = false;
      if (!all) return finish(s, false, ctx);
    }
  }
  if (ctx.hasShear) {
    // max over y of V·Q(y)/(Iz·b(y)) (engine contract, shear check), from the section kernel.
    // a catalogue section brings the same maximum worked out on its exact outline
    dem[C_SHEAR] = ctx.V * (s.rolled !== null ? s.rolled.shearFactor : maxShearFactor(p, fk.nPlates, k[K_CY], Iz));
    cap[C_SHEAR] = ctx.aS;
    if (dem[C_SHEAR] > ctx.aS) ok = false;
  }
  return finish(s, ok, ctx, fk, v);
}

const WORDS: Record<string, string> = {
  "bending-compression": "Compressive bending stress",
  "bending-tension": "Tensile bending stress",
  shear: "Shear stress",
  "slenderness-outstand": "Outstand slenderness",
  "slenderness-internal": "Internal plate slenderness",
  "slenderness-web": "Web slenderness",
  "slenderness-stem": "Stem slenderness",
  deflection: "Deflection",
};

export const allowableBasis: DesignBasisModule = {
  id: "allowable",
  // engine contract order: stresses, shear, slenderness, deflection
  precedence: Int8Array.from([0, 1, 2, 3, 4, 5, 6, 7]),
  evaluate,
  design: () => undefined,
  recordLines(verdict) {
    const lines: RecordLine[] = [{ clause: "allowable-stress basis", text: "Stresses only: no stability checks (no lateral-torsional buckling, no local buckling beyond the brief's slenderness limits, no shear buckling)." }];
    for (const c of verdict.checks)
      lines.push({ clause: c.name, text: `${WORDS[c.name] ?? c.name}: ${fmt(c.demand)} against ${fmt(c.capacity)}, utilisation ${c.utilisation.toFixed(3)}` });
    return lines;
  },
};

function fmt(x: number): string {
  return Math.abs(x) >= 100 ? x.toFixed(1) : x.toPrecision(4);
}

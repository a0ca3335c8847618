import { describe, expect, it } from "vitest";
import {
  compositeKernel,
  compositeTable,
  maxShearFactor,
  maxShearPoint,
  packPlates,
  KERNEL_OUT,
  K_AREA,
  K_CY,
  K_CZ,
  K_IY,
  K_IYZ,
  K_IZ,
  K_MAXY,
  K_MINZ,
} from "~/optimizer/composite";
import { familyPlates } from "~/optimizer/geometry";

const run = (plates: { b: number; h: number; z: number; y: number }[]) => {
  const out = new Float64Array(KERNEL_OUT);
  compositeKernel(packPlates(plates), plates.length, out);
  return out;
};

describe("compositeKernel", () => {
  it("rectangle: A = b·h, Iz = b·h³/12, Iy = h·b³/12, Iyz = 0 (Gere & Goodno, Mechanics of Materials, 7th ed. (2009), App. D case 1)", () => {
    const o = run([{ b: 40, h: 100, z: 5, y: 7 }]);
    expect(o[K_AREA]).toBe(4000);
    expect(o[K_CZ]).toBeCloseTo(25, 12);
    expect(o[K_CY]).toBeCloseTo(57, 12);
    expect(o[K_IZ]).toBeCloseTo((40 * 100 ** 3) / 12, 6);
    expect(o[K_IY]).toBeCloseTo((100 * 40 ** 3) / 12, 6);
    expect(o[K_IYZ]).toBeCloseTo(0, 6);
    expect(o[K_MINZ]).toBe(5);
    expect(o[K_MAXY]).toBe(107);
  });

  it("doubly symmetric I: Iz = [b·d³ − (b − tw)(d − 2tf)³]/12 (difference of rectangles, Gere & Goodno, 7th ed. §12.5, parallel-axis theorem)", () => {
    const d = 300, b = 150, tf = 10.7, tw = 7.1;
    const o = run(familyPlates("i", { d, b, tf, tw }));
    expect(o[K_IZ]).toBeCloseTo((b * d ** 3 - (b - tw) * (d - 2 * tf) ** 3) / 12, 4);
    expect(o[K_IY]).toBeCloseTo((2 * tf * b ** 3 + (d - 2 * tf) * tw ** 3) / 12, 4);
    expect(o[K_CY]).toBeCloseTo(d / 2, 10);
  });

  it("angle: Iyz = ΣA·dz·dy by the parallel-axis theorem, negative for legs along +y and +z", () => {
    // 100×100×10 angle (r = 0): legs 10×100 and 90×10.
    // A = 1900, ȳ = z̄ = (1000·50 + 900·5)/1900 = 28.684...; hand product:
    // leg 1 centroid (5, 50), leg 2 (55, 5): Σ A·(z − z̄)(y − ȳ) (common practice, parallel-axis theorem).
    const zb = (1000 * 5 + 900 * 55) / 1900, yb = (1000 * 50 + 900 * 5) / 1900;
    const expected = 1000 * (5 - zb) * (50 - yb) + 900 * (55 - zb) * (5 - yb);
    const o = run(familyPlates("angle", { d: 100, b: 100, t: 10 }));
    expect(o[K_IYZ]).toBeCloseTo(expected, 6);
    expect(o[K_IYZ]).toBeLessThan(0);
  });
});

describe("maxShearFactor", () => {
  it("rectangle: τmax = 1.5·V/A (Gere & Goodno, 7th ed. §5.8, shear in rectangular beams)", () => {
    const p = packPlates([{ b: 20, h: 200, z: 0, y: 0 }]);
    const o = new Float64Array(KERNEL_OUT);
    compositeKernel(p, 1, o);
    expect(maxShearFactor(p, 1, o[K_CY], o[K_IZ])).toBeCloseTo(1.5 / 4000, 12);
  });

  it("I section: τmax at the neutral axis = V·Q/(Iz·tw), Q = b·tf·(d − tf)/2 + tw·(d/2 − tf)²/2 (Gere & Goodno, 7th ed. §5.10)", () => {
    const d = 400, b = 180, tf = 13.5, tw = 8.6;
    const p = packPlates(familyPlates("i", { d, b, tf, tw }));
    const o = new Float64Array(KERNEL_OUT);
    compositeKernel(p, 3, o);
    const Q = (b * tf * (d - tf)) / 2 + (tw * (d / 2 - tf) ** 2) / 2;
    expect(maxShearFactor(p, 3, o[K_CY], o[K_IZ])).toBeCloseTo(Q / (o[K_IZ] * tw), 14);
  });

  it("tee whose neutral axis lies in the flange: the max is just below the flange edge, in the stem", () => {
    // wide flat flange on a short stem: NA inside the flange; at the flange underside Q is
    // carried by the narrow stem, so Q/(I·tw) there beats Q/(I·b) at the NA.
    const d = 60, b = 300, tf = 40, tw = 10;
    const plates = familyPlates("tee", { d, b, tf, tw });
    const p = packPlates(plates);
    const o = new Float64Array(KERNEL_OUT);
    compositeKernel(p, 2, o);
    const cy = o[K_CY];
    expect(cy).toBeGreaterThan(d - tf);
    // Q at the stem top = first moment of the stem (below) about the NA, by equilibrium.
    const Qstem = tw * (d - tf) * (cy - (d - tf) / 2);
    expect(maxShearFactor(p, 2, cy, o[K_IZ])).toBeCloseTo(Qstem / (o[K_IZ] * tw), 14);
    // maxShearPoint (the record's) names the same place: the flange underside, the stem's Q and width
    const at = maxShearPoint(p, 2, cy);
    expect(at.y).toBe(d - tf);
    expect(at.Q).toBeCloseTo(Qstem, 9);
    expect(at.b).toBe(tw);
  });

  it("maxShearPoint: the I's neutral axis at mid-depth, Q as above, the web's width; Q/(Iz·b) is maxShearFactor", () => {
    const d = 400, b = 180, tf = 13.5, tw = 8.6;
    const p = packPlates(familyPlates("i", { d, b, tf, tw }));
    const o = new Float64Array(KERNEL_OUT);
    compositeKernel(p, 3, o);
    const at = maxShearPoint(p, 3, o[K_CY]);
    expect(at.y).toBeCloseTo(d / 2, 9);
    expect(at.Q).toBeCloseTo((b * tf * (d - tf)) / 2 + (tw * (d / 2 - tf) ** 2) / 2, 9);
    expect(at.b).toBe(tw);
    expect(at.Q / (o[K_IZ] * at.b)).toBeCloseTo(maxShearFactor(p, 3, o[K_CY], o[K_IZ]), 15);
  });
});

describe("compositeTable", () => {
  it("totals match the kernel (parallel-axis theorem row by row)", () => {
    const plates = familyPlates("tee", { d: 200, b: 150, tf: 12, tw: 8 });
    const t = compositeTable(plates);
    const o = run(plates);
    expect(t.rows).toHaveLength(2);
    expect(t.totals.A).toBeCloseTo(o[K_AREA], 9);
    expect(t.totals.yBar).toBeCloseTo(o[K_CY], 9);
    expect(t.totals.Iz).toBeCloseTo(o[K_IZ], 3);
    expect(t.rows[0].I0).toBeCloseTo((150 * 12 ** 3) / 12, 9);
  });
});

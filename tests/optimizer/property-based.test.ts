// Invariants any correct section calculator must satisfy (statics: parallel-axis theorem,
// Mohr's circle for second moments, e.g. Gere & Goodno, Mechanics of Materials, 7th ed. (2009), ch. 12),
// checked over random shapes with fast-check.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  compositeKernel,
  familyPlates,
  maxShearFactor,
  packPlates,
  sectionProperties,
  sectionStresses,
  KERNEL_OUT,
  K_CY,
  K_IZ,
  type SectionInput,
  type SectionProperties,
} from "~/optimizer/index";

type Plate = { b: number; h: number; z: number; y: number };

/** Plates stacked on each other (touching, never overlapping), each shifted sideways at random. */
const arbStack = fc
  .array(
    fc.record({
      b: fc.double({ min: 5, max: 300, noNaN: true }),
      h: fc.double({ min: 3, max: 100, noNaN: true }),
      z: fc.double({ min: -100, max: 100, noNaN: true }),
    }),
    { minLength: 1, maxLength: 6 },
  )
  .map((rows) => {
    let y = 0;
    return rows.map((r) => {
      const p = { b: r.b, h: r.h, z: r.z, y };
      y += r.h;
      return p;
    });
  });

const arbFamily: fc.Arbitrary<SectionInput> = fc.oneof(
  fc.record({ d: fc.integer({ min: 60, max: 600 }), b: fc.integer({ min: 40, max: 400 }), tf: fc.integer({ min: 4, max: 25 }), tw: fc.integer({ min: 4, max: 20 }) })
    .filter((x) => x.d > 2 * x.tf && x.b > 2 * x.tw)
    .chain((x) => fc.constantFrom<SectionInput>({ family: "i", ...x }, { family: "channel", ...x }, { family: "tee", ...x }, { family: "box", ...x }, { family: "channel-down", d: x.d, b: x.b, tw: x.tf, tf: x.tw })),
  fc.record({ d: fc.integer({ min: 60, max: 600 }), bt: fc.integer({ min: 40, max: 400 }), tft: fc.integer({ min: 4, max: 25 }), bb: fc.integer({ min: 40, max: 400 }), tfb: fc.integer({ min: 4, max: 25 }), tw: fc.integer({ min: 4, max: 20 }) })
    .filter((x) => x.d > x.tft + x.tfb)
    .map((x) => ({ family: "mono-i" as const, ...x })),
  fc.record({ d: fc.integer({ min: 30, max: 300 }), b: fc.integer({ min: 30, max: 300 }), t: fc.integer({ min: 3, max: 25 }) })
    .filter((x) => x.d > x.t && x.b > x.t)
    .map((x) => ({ family: "angle" as const, ...x })),
);

const near = (a: number, b: number, scale: number, tol = 1e-9) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(scale, 1e-300));

/** All centroidal properties (J excluded where the test changes the plate layout it is summed over). */
function sameProps(p: SectionProperties, q: SectionProperties, withJ = true, tol = 1e-9) {
  const L = p.extremes.top + p.extremes.bottom + p.extremes.left + p.extremes.right;
  near(q.area, p.area, p.area, tol);
  for (const k of ["Iz", "Iy", "Iyz"] as const) near(q[k], p[k], p.Iz + p.Iy, tol);
  near(q.principal.I1, p.principal.I1, p.principal.I1, tol);
  near(q.principal.I2, p.principal.I2, p.principal.I1, tol);
  for (const k of ["top", "bottom", "left", "right"] as const) near(q.extremes[k], p.extremes[k], L, tol);
  near(q.Sz.top, p.Sz.top, p.Sz.top, tol);
  near(q.Sz.bottom, p.Sz.bottom, p.Sz.bottom, tol);
  near(q.Sy.left, p.Sy.left, p.Sy.left, tol);
  near(q.Sy.right, p.Sy.right, p.Sy.right, tol);
  near(q.Zz, p.Zz, p.Zz, tol);
  near(q.Zy, p.Zy, p.Zy, tol);
  near(q.Qz, p.Qz, p.Zz, tol);
  near(q.centroid.y, p.centroid.y, L, tol);
  near(q.centroid.z, p.centroid.z, L, tol);
  if (withJ) near(q.J, p.J, p.J, tol);
}

const asPolygons = (ps: Plate[]): SectionInput => ({
  polygons: ps.map((p) => ({ points: [[p.z, p.y], [p.z + p.b, p.y], [p.z + p.b, p.y + p.h], [p.z, p.y + p.h]] as [number, number][], hole: false })),
});

describe("property-based invariants", () => {
  it("translation changes no centroidal property", () => {
    fc.assert(
      fc.property(arbStack, fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }), (ps, dz, dy) => {
        const p = sectionProperties({ plates: ps });
        const q = sectionProperties({ plates: ps.map((x) => ({ ...x, z: x.z + dz, y: x.y + dy })) });
        sameProps(p, q, true, 1e-8);
        expect(q.widthAtNeutralAxis).toBeCloseTo(p.widthAtNeutralAxis, 6);
      }),
      { numRuns: 300 },
    );
  });

  it("splitting one plate into two (across or along) changes nothing but the open-section J", () => {
    fc.assert(
      fc.property(arbStack, fc.nat(), fc.double({ min: 0.1, max: 0.9, noNaN: true }), fc.boolean(), (ps, i, f, across) => {
        const k = i % ps.length,
          x = ps[k];
        const parts: Plate[] = across
          ? [{ ...x, h: x.h * f }, { ...x, y: x.y + x.h * f, h: x.h - x.h * f }]
          : [{ ...x, b: x.b * f }, { ...x, z: x.z + x.b * f, b: x.b - x.b * f }];
        const p = sectionProperties({ plates: ps });
        const q = sectionProperties({ plates: [...ps.slice(0, k), ...parts, ...ps.slice(k + 1)] });
        sameProps(p, q, false, 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it("flip swaps Sz.top and Sz.bottom and keeps Iz, Zz, Qz; Iyz changes sign", () => {
    fc.assert(
      fc.property(arbFamily, (input) => {
        const p = sectionProperties(input);
        const q = sectionProperties({ ...input, flip: true } as SectionInput);
        near(q.Iz, p.Iz, p.Iz);
        near(q.Sz.top, p.Sz.bottom, p.Sz.bottom);
        near(q.Sz.bottom, p.Sz.top, p.Sz.top);
        near(q.Zz, p.Zz, p.Zz);
        near(q.Qz, p.Qz, p.Qz);
        near(q.Iyz, -p.Iyz, p.Iz + p.Iy);
      }),
      { numRuns: 200 },
    );
  });

  it("root fillets: each adds r²(1 − π/4) of area; flip still swaps Sz and keeps Iz, Zz", () => {
    const arbRolled = fc
      .record({
        family: fc.constantFrom("i" as const, "channel" as const, "tee" as const),
        d: fc.integer({ min: 100, max: 600 }), b: fc.integer({ min: 60, max: 300 }),
        tf: fc.integer({ min: 5, max: 25 }), tw: fc.integer({ min: 4, max: 15 }), rf: fc.double({ min: 0.01, max: 1, noNaN: true }),
      })
      .filter((x) => x.d > 2 * x.tf + 20 && x.b > x.tw + 20)
      .map(({ rf, ...x }) => ({ ...x, r: Math.round(rf * 10 * 100) / 100 }));
    fc.assert(
      fc.property(arbRolled, (input) => {
        const p = sectionProperties(input);
        const bare = sectionProperties({ ...input, r: 0 });
        const count = input.family === "i" ? 4 : 2;
        near(p.area - bare.area, count * input.r ** 2 * (1 - Math.PI / 4), p.area, 1e-12);
        const q = sectionProperties({ ...input, flip: true });
        near(q.Iz, p.Iz, p.Iz);
        near(q.Sz.top, p.Sz.bottom, p.Sz.bottom);
        near(q.Zz, p.Zz, p.Zz, 1e-9);
        expect(p.Iz).toBeGreaterThan(bare.Iz);
      }),
      { numRuns: 150 },
    );
  });

  it("mirroring about a vertical line negates Iyz and swaps Sy.left/right", () => {
    fc.assert(
      fc.property(arbStack, (ps) => {
        const p = sectionProperties({ plates: ps });
        const q = sectionProperties({ plates: ps.map((x) => ({ ...x, z: -x.z - x.b })) });
        near(q.Iyz, -p.Iyz, p.Iz + p.Iy);
        near(q.Iz, p.Iz, p.Iz);
        near(q.Iy, p.Iy, p.Iy);
        near(q.Sy.left, p.Sy.right, p.Sy.right);
        near(q.principal.angleDeg === 90 ? 90 : -q.principal.angleDeg, p.principal.angleDeg === 90 ? 90 : p.principal.angleDeg, 90, 1e-6);
      }),
      { numRuns: 300 },
    );
  });

  it("rotating a polygon by 90° swaps Iy and Iz (and negates Iyz)", () => {
    fc.assert(
      fc.property(arbStack, (ps) => {
        const poly = asPolygons(ps) as { polygons: { points: [number, number][]; hole: boolean }[] };
        const rot = { polygons: poly.polygons.map((g) => ({ ...g, points: g.points.map(([z, y]) => [-y, z] as [number, number]) })) };
        const p = sectionProperties(poly);
        const q = sectionProperties(rot);
        near(q.Iz, p.Iy, p.Iz + p.Iy);
        near(q.Iy, p.Iz, p.Iz + p.Iy);
        near(q.Iyz, -p.Iyz, p.Iz + p.Iy);
        near(q.Zz, p.Zy, p.Zy);
      }),
      { numRuns: 150 },
    );
  });

  it("I1 + I2 = Iy + Iz, I1 ≥ I2, and I1 is the second moment about the axis at angleDeg (Mohr's circle)", () => {
    fc.assert(
      fc.property(fc.oneof(arbStack.map((ps) => ({ plates: ps }) as SectionInput), arbFamily), (input) => {
        const p = sectionProperties(input);
        near(p.principal.I1 + p.principal.I2, p.Iz + p.Iy, p.Iz + p.Iy, 1e-12);
        expect(p.principal.I1).toBeGreaterThanOrEqual(p.principal.I2);
        expect(p.principal.angleDeg).toBeGreaterThan(-90);
        expect(p.principal.angleDeg).toBeLessThanOrEqual(90);
        const t = (p.principal.angleDeg * Math.PI) / 180;
        const c = Math.cos(t), s = Math.sin(t);
        near(p.Iz * c * c + p.Iy * s * s - 2 * p.Iyz * s * c, p.principal.I1, p.principal.I1, 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it("every property is finite; sizes positive; plastic ≥ elastic modulus (shape factor ≥ 1)", () => {
    fc.assert(
      fc.property(fc.oneof(arbStack.map((ps) => ({ plates: ps }) as SectionInput), arbFamily), (input) => {
        const p = sectionProperties(input);
        const flat = JSON.stringify(p, (_, v) => (typeof v === "number" && !Number.isFinite(v) ? "NONFINITE" : v));
        expect(flat).not.toContain("NONFINITE");
        for (const v of [p.area, p.Iz, p.Iy, p.principal.I1, p.Sz.top, p.Sz.bottom, p.Sy.left, p.Sy.right, p.Zz, p.Zy, p.rz, p.ry, p.Qz, p.J, p.massPerMetre])
          expect(v).toBeGreaterThan(0);
        expect(p.principal.I2).toBeGreaterThanOrEqual(0);
        expect(p.widthAtNeutralAxis).toBeGreaterThanOrEqual(0);
        for (const v of Object.values(p.extremes)) expect(v).toBeGreaterThan(0);
        expect(p.Zz).toBeGreaterThanOrEqual(Math.min(p.Sz.top, p.Sz.bottom) * (1 - 1e-12));
        expect(p.Zy).toBeGreaterThanOrEqual(Math.min(p.Sy.left, p.Sy.right) * (1 - 1e-12));
      }),
      { numRuns: 300 },
    );
  });

  it("plates form = polygon form of the same shape (plate fast path vs Green's-theorem path)", () => {
    fc.assert(
      fc.property(arbStack, (ps) => {
        const p = sectionProperties({ plates: ps });
        const q = sectionProperties(asPolygons(ps));
        sameProps(p, q, false, 1e-9);
        expect(q.widthAtNeutralAxis).toBeCloseTo(p.widthAtNeutralAxis, 9);
      }),
      { numRuns: 300 },
    );
  });

  it("family form = its plates form (r = 0)", () => {
    fc.assert(
      fc.property(arbFamily, fc.boolean(), (input, flip) => {
        const { family, ...dims } = input as unknown as { family: never } & Record<string, number>;
        const p = sectionProperties({ ...input, flip } as SectionInput);
        const q = sectionProperties({ plates: familyPlates(family, dims, flip) });
        sameProps(p, q, family !== "box", 1e-12);
      }),
      { numRuns: 200 },
    );
  });

  it("maxShearFactor (search kernel) = the largest τ of the sampled shear profile, per newton", () => {
    fc.assert(
      fc.property(arbFamily, (input) => {
        const { family, ...dims } = input as unknown as { family: never } & Record<string, number>;
        const plates = familyPlates(family, dims);
        const buf = packPlates(plates), out = new Float64Array(KERNEL_OUT);
        compositeKernel(buf, plates.length, out);
        const k = maxShearFactor(buf, plates.length, out[K_CY], out[K_IZ]);
        const r = sectionStresses(input, { V: 1 });
        near(k * 1e3, r.maxShear, r.maxShear, 1e-9);
      }),
      { numRuns: 200 },
    );
  });
});

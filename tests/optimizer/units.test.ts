// Reference values: NIST Special Publication 811 (2008), Appendix B.8/B.9 conversion factors
// (exact where NIST marks them exact; otherwise to the digits NIST prints).
import { describe, expect, it } from "vitest";
import { UNITS, fromSI, toSI, propertiesIn, sectionInputToSI, sectionProperties, unitLabel } from "~/optimizer/index";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("conversion factors (NIST SP 811 Appendix B)", () => {
  it("inch = 25.4 mm exactly; in² = 645.16 mm²; in³ = 16 387.064 mm³; in⁴ = 416 231.4256 mm⁴", () => {
    expect(UNITS.length.factor).toBe(25.4);
    expect(UNITS.area.factor).toBeCloseTo(645.16, 10);
    expect(UNITS.modulus.factor).toBeCloseTo(16387.064, 8);
    expect(UNITS.inertia.factor).toBeCloseTo(416231.4256, 6);
  });
  it("kip = 4.448 222 kN (NIST: lbf → N 4.448 222 E+00)", () => {
    expect(rel(UNITS.force.factor, 4.448222)).toBeLessThan(1e-6);
  });
  it("ksi = 6.894 757 MPa (NIST: psi → Pa 6.894 757 E+03)", () => {
    expect(rel(UNITS.stress.factor, 6.894757)).toBeLessThan(1e-6);
  });
  it("kip·ft = 1.355 818 kN·m (NIST: ft·lbf → N·m 1.355 818 E+00)", () => {
    expect(rel(UNITS.moment.factor, 1.355818)).toBeLessThan(1e-6);
  });
  it("lb/ft = 1.488 164 kg/m (NIST), lb/ft³ = 16.018 46 kg/m³ (NIST)", () => {
    expect(rel(UNITS.massPerLength.factor, 1.488164)).toBeLessThan(1e-6);
    expect(rel(UNITS.density.factor, 16.01846)).toBeLessThan(1e-6);
  });
  it("round trips and SI identity", () => {
    for (const q of Object.keys(UNITS) as (keyof typeof UNITS)[]) {
      expect(rel(toSI(q, fromSI(q, 123.456, "us"), "us"), 123.456)).toBeLessThan(1e-15);
      expect(toSI(q, 7, "si")).toBe(7);
    }
    expect(unitLabel("stress", "us")).toBe("ksi");
    expect(unitLabel("moment", "si")).toBe("kN·m");
  });
});

describe("section input and properties at the edge", () => {
  it("a 10 in × 2 in plate: Iz = 2·10³/12 = 166.67 in⁴, A = 20 in², Sz = 33.33 in³ (closed form, Gere & Goodno, 7th ed. App. D)", () => {
    const si = sectionInputToSI({ plates: [{ b: 2, h: 10, z: 0, y: 0 }] }, "us");
    const p = propertiesIn(sectionProperties(si), "us");
    expect(p.area).toBeCloseTo(20, 10);
    expect(p.Iz).toBeCloseTo(2000 / 12, 9);
    expect(p.Sz.top).toBeCloseTo(200 / 6, 9);
    expect(p.centroid.y).toBeCloseTo(5, 12);
    expect(p.principal.angleDeg).toBe(0);
    expect(p.Jmethod).toBe("open-thin-walled");
    // steel at 490 lb/ft³ (common practice US figure): 20 in² = 20/144 ft² → 68.06 lb/ft
    const q = propertiesIn(sectionProperties(sectionInputToSI({ plates: [{ b: 2, h: 10, z: 0, y: 0 }], density: 490 }, "us")), "us");
    expect(q.massPerMetre).toBeCloseTo((490 * 20) / 144, 9);
  });
  it("family and polygon inputs convert every length; flip and family are kept", () => {
    const f = sectionInputToSI({ family: "i", d: 10, b: 5, tf: 0.5, tw: 0.25, r: 0.3, flip: true }, "us");
    const want = { d: 254, b: 127, tf: 12.7, tw: 6.35, r: 7.62 };
    for (const [k, v] of Object.entries(want)) expect((f as unknown as Record<string, number>)[k]).toBeCloseTo(v, 12);
    expect(f.family).toBe("i");
    expect(f.flip).toBe(true);
    const g = sectionInputToSI({ polygons: [{ points: [[0, 0], [1, 0], [0, 1]], hole: false }] }, "us");
    expect(g).toEqual({ polygons: [{ points: [[0, 0], [25.4, 0], [0, 25.4]], hole: false }] });
  });
});

import { describe, expect, it } from "vitest";
import { bendingField, normalStress, sectionProperties, sectionStresses, EngineInputError } from "~/optimizer/index";

describe("normal stress, symmetric sections (flexure formula σ = −M·y/I, Gere & Goodno, 7th ed. §5.5)", () => {
  it("rectangle 100×200 under 10 kN·m sagging: ∓15 MPa at top/bottom (S = b·h²/6)", () => {
    const r = sectionStresses({ family: "rectangle", b: 100, d: 200 }, { Mz: 10 });
    expect(r.fibre.top).toBeCloseTo(-15, 10);
    expect(r.fibre.bottom).toBeCloseTo(15, 10);
    expect(r.maxTension.sigma).toBeCloseTo(15, 10);
    expect(r.maxCompression.sigma).toBeCloseTo(-15, 10);
    expect(r.neutralAxis).toEqual({ z: 50, y: 100, angleDeg: 0 });
  });
  it("hogging reverses the signs", () => {
    const r = sectionStresses({ family: "rectangle", b: 100, d: 200 }, { Mz: -10 });
    expect(r.fibre.top).toBeCloseTo(15, 10);
  });
  it("tee: σ_top = −M·c_top/Iz, σ_bottom = M·c_bottom/Iz", () => {
    const input = { family: "tee" as const, d: 300, b: 150, tf: 12, tw: 8 };
    const p = sectionProperties(input);
    const r = sectionStresses(input, { Mz: 25 });
    expect(r.fibre.top).toBeCloseTo((-25e6 * p.extremes.top) / p.Iz, 9);
    expect(r.fibre.bottom).toBeCloseTo((25e6 * p.extremes.bottom) / p.Iz, 9);
  });
  it("My alone (chosen sign: positive compresses the right fibre): neutral axis vertical", () => {
    const r = sectionStresses({ family: "rectangle", b: 100, d: 200 }, { My: 5 });
    expect(r.neutralAxis?.angleDeg).toBe(90);
    const right = r.corners.find((c) => c.z === 100 && c.y === 0)!;
    expect(right.sigma).toBeCloseTo((-5e6 * 50) / ((200 * 100 ** 3) / 12), 9);
  });
});

describe("unsymmetric bending of an angle under Mz only", () => {
  const input = { family: "angle" as const, d: 150, b: 90, t: 10 };
  const p = sectionProperties(input);
  it("general formula equals the principal-axes method σ = −Mu·v/Iu + Mv·u/Iv (Boresi & Schmidt, Advanced Mechanics of Materials, 6th ed. (2003), ch. 7)", () => {
    const th = (p.principal.angleDeg * Math.PI) / 180;
    const M = 12e6; // N·mm
    const Mu = M * Math.cos(th),
      Mv = -M * Math.sin(th);
    for (const [z, y] of [[-20, 80], [50, -30], [-25, -30], [3, 7]]) {
      const u = z * Math.cos(th) + y * Math.sin(th),
        v = -z * Math.sin(th) + y * Math.cos(th);
      const expected = (-Mu * v) / p.principal.I1 + (Mv * u) / p.principal.I2;
      expect(normalStress(p, 12, 0, z, y)).toBeCloseTo(expected, 9);
    }
  });
  it("the neutral axis is inclined and carries zero stress; extremes lie at corners", () => {
    const r = sectionStresses(input, { Mz: 12 });
    const na = r.neutralAxis!;
    expect(Math.abs(na.angleDeg)).toBeGreaterThan(1);
    const a = (na.angleDeg * Math.PI) / 180;
    expect(normalStress(p, 12, 0, 40 * Math.cos(a), 40 * Math.sin(a))).toBeCloseTo(0, 9);
    const all = r.corners.map((c) => c.sigma);
    expect(r.maxTension.sigma).toBe(Math.max(...all));
    expect(r.maxCompression.sigma).toBe(Math.min(...all));
    // the inclined axis raises the peak above the plain M·c/Iz estimate (common practice)
    expect(-r.maxCompression.sigma).toBeGreaterThan((12e6 * p.extremes.top) / p.Iz);
  });
  it("bendingField with Iyz = 0 reduces to −M/Iz per mm of height", () => {
    const f = bendingField({ Iz: 2e8, Iy: 1e7, Iyz: 0 }, 10);
    expect(f.az).toBe(0);
    expect(f.ay).toBeCloseTo(-10e6 / 2e8, 15);
  });
});

describe("shear stress distribution τ = V·Q/(Iz·b) (Gere & Goodno, 7th ed. §5.8–5.10)", () => {
  it("rectangle: parabola with τmax = 1.5·V/A at mid-depth", () => {
    const b = 100, h = 200, V = 50;
    const r = sectionStresses({ family: "rectangle", b, d: h }, { V }, 40);
    expect(r.maxShear).toBeCloseTo((1.5 * V * 1e3) / (b * h), 10);
    const I = (b * h ** 3) / 12;
    for (const s of r.shear) {
      const yc = s.y - h / 2;
      expect(s.tau).toBeCloseTo(((V * 1e3) / (2 * I)) * (h * h / 4 - yc * yc), 9);
    }
  });
  it("I section: jump at the web–flange junction by the ratio b/tw", () => {
    const d = 400, b = 180, tf = 13.5, tw = 8.6;
    const r = sectionStresses({ family: "i", d, b, tf, tw }, { V: 100 });
    const at = r.shear.filter((s) => Math.abs(s.y - (d - tf)) < 1e-9);
    expect(at).toHaveLength(2);
    const [web, flange] = at[0].width < at[1].width ? [at[0], at[1]] : [at[1], at[0]];
    expect(web.tau / flange.tau).toBeCloseTo(b / tw, 10);
    const p = sectionProperties({ family: "i", d, b, tf, tw });
    expect(r.maxShear).toBeCloseTo((100e3 * p.Qz) / (p.Iz * tw), 9);
  });
  it("equilibrium: ∫τ·b dy over the depth = V (trapezoid rule on a fine sampling of a tee)", () => {
    const r = sectionStresses({ family: "tee", d: 300, b: 150, tf: 12, tw: 8 }, { V: 80 }, 6000);
    let F = 0;
    for (let i = 1; i < r.shear.length; i++) {
      const a = r.shear[i - 1], c = r.shear[i];
      if (c.y === a.y) continue;
      F += 0.5 * (a.tau * a.width + c.tau * c.width) * (c.y - a.y);
    }
    expect(F / 80e3).toBeCloseTo(1, 5);
  });
});

describe("loads are checked", () => {
  it("non-finite moment names the field", () => {
    expect(() => sectionStresses({ family: "rectangle", b: 1, d: 1 }, { Mz: Infinity })).toThrow(EngineInputError);
    expect(() => sectionStresses({ family: "rectangle", b: 1, d: 1 }, { V: NaN })).toThrow("V must be a finite number");
  });
});

// The feasibility checks (app/optimizer/checks.ts) against hand calculations by textbook
// relations, each computed here by a route independent of the plate kernel.
import { describe, expect, it } from "vitest";
import { candidateChecks } from "~/optimizer/checks";
import { sectionProperties } from "~/optimizer/properties";
import type { SearchProblem } from "~/optimizer/search-schema";
import { searchProblemSchema } from "~/optimizer/search-schema";

const problem = (over: Partial<Record<string, unknown>> = {}): SearchProblem =>
  searchProblemSchema.parse({
    moment: { sagging: 100, hogging: 0 },
    allowable: { tension: 165, compression: 165, shear: 100 },
    depth: { min: 100, max: 100, step: 1 },
    width: { min: 100, max: 100, step: 1 },
    thicknesses: [10],
    families: ["i"],
    ...over,
  });
const get = (v: ReturnType<typeof candidateChecks>, name: string) => v.checks.find((c) => c.name === name)!;

describe("doubly symmetric I (d 400, b 200, tf 10, tw 8)", () => {
  const dims = { d: 400, b: 200, tf: 10, tw: 8 };
  // Iz by subtracting the two clear rectangles beside the web: (b·d³ − (b − tw)·hw³)/12
  // (Gere & Goodno, Mechanics of Materials, 7th ed. (2009), §12.5, parallel-axis theorem)
  const hw = 380;
  const Iz = (200 * 400 ** 3 - 192 * hw ** 3) / 12;

  it("bending stress M·c/Iz at both fibres (elementary flexure formula)", () => {
    const v = candidateChecks("i", dims, problem({ moment: { sagging: 100, hogging: 60 } }));
    expect(get(v, "bending-compression").demand).toBeCloseTo((100e6 * 200) / Iz, 9);
    expect(get(v, "bending-tension").demand).toBeCloseTo((100e6 * 200) / Iz, 9);
    expect((100e6 * 200) / Iz).toBeCloseTo(105.98, 2);
    expect(v.governing).toBe("bending-compression"); // equal demands: the first check in the contract's order
  });

  it("shear: τ_max = V/(8·Iz·tw)·[b(d² − hw²) + tw·hw²] (Gere & Goodno, 7th ed. §5.10, webs of beams with flanges)", () => {
    const v = candidateChecks("i", dims, problem({ shear: 200 }));
    const tau = (200e3 / (8 * Iz * 8)) * (200 * (400 ** 2 - hw ** 2) + 8 * hw ** 2);
    expect(get(v, "shear").demand).toBeCloseTo(tau, 9);
    expect(tau).toBeCloseTo(70.8, 1);
  });

  it("slenderness ratios as the engine contract defines them", () => {
    const v = candidateChecks("i", dims, problem({ slenderness: { outstand: 9, web: 50 } }));
    expect(get(v, "slenderness-outstand").demand).toBe(9.6);
    expect(get(v, "slenderness-web").demand).toBe(47.5);
    expect(v.feasible).toBe(false);
    expect(v.governing).toBe("slenderness-outstand");
    // the record's working: outstand (b − tw)/2 = 96 over tf = 10, web d − 2·tf = 380 over tw = 8 (engine contract, slenderness)
    expect(v.slendernessWorking).toEqual([
      { name: "slenderness-outstand", element: "flange outstand", widthSymbols: "(b − tw)/2", thicknessSymbols: "tf", b: 96, t: 10, ratio: 9.6, limit: 9, governs: true },
      { name: "slenderness-web", element: "web", widthSymbols: "d − 2·tf", thicknessSymbols: "tw", b: 380, t: 8, ratio: 47.5, limit: 50, governs: true },
    ]);
  });

  it("slenderness working of an angle: both legs under the one outstand limit, the longer governs (engine contract, slenderness)", () => {
    const v = candidateChecks("angle", { d: 150, b: 100, t: 10 }, problem({ families: ["angle"], slenderness: { outstand: 15 } }));
    expect(v.slendernessWorking!.map((e) => [e.element, e.b, e.t, e.ratio, e.governs])).toEqual([
      ["vertical leg", 140, 10, 14, true],
      ["horizontal leg", 90, 10, 9, false],
    ]);
    expect(get(v, "slenderness-outstand").demand).toBe(14);
  });

  it("deflection 5·w·L⁴/(384·E·I) against L/ratio (simply supported, uniform load; AISC Steel Construction Manual beam diagrams case 1; mem.)", () => {
    const v = candidateChecks("i", dims, problem({ deflection: { span: 6, serviceLoad: 10, limitRatio: 360, E: 200000 } }));
    const delta = (5 * 10 * 6000 ** 4) / (384 * 200000 * Iz);
    expect(get(v, "deflection").demand).toBeCloseTo(delta, 9);
    expect(get(v, "deflection").capacity).toBeCloseTo(6000 / 360, 12);
    expect(delta).toBeCloseTo(4.47, 2);
  });
});

describe("tee (d 200, b 150, tf 20, tw 10): centroid off mid-depth", () => {
  // hand table (parallel-axis theorem): flange 3000 mm² at y 190, stem 1800 mm² at y 90
  const ybar = (3000 * 190 + 1800 * 90) / 4800; // 152.5
  const Iz = (150 * 20 ** 3) / 12 + 3000 * (190 - ybar) ** 2 + (10 * 180 ** 3) / 12 + 1800 * (90 - ybar) ** 2; // 16 210 000
  it("sagging and hogging put the larger stress at the stem tip", () => {
    expect(Iz).toBeCloseTo(16_210_000, 6);
    const v = candidateChecks("tee", { d: 200, b: 150, tf: 20, tw: 10 }, problem({ moment: { sagging: 10, hogging: 5 } }));
    // sagging: top (c 47.5) compressed, stem tip (c 152.5) in tension; hogging the reverse
    expect(get(v, "bending-tension").demand).toBeCloseTo((10e6 * 152.5) / Iz, 9);
    expect(get(v, "bending-compression").demand).toBeCloseTo(Math.max(10e6 * 47.5, 5e6 * 152.5) / Iz, 9);
  });
});

describe("equal angle 100 × 100 × 10: unsymmetric bending", () => {
  it("the general formula at the corners equals bending about the principal axes", () => {
    const d = 100,
      b = 100,
      t = 10;
    // centroid and second moments by the parallel-axis theorem on the two legs
    const A1 = t * d,
      A2 = (b - t) * t;
    const A = A1 + A2;
    const cz = (A1 * (t / 2) + A2 * (t + (b - t) / 2)) / A,
      cy = (A1 * (d / 2) + A2 * (t / 2)) / A;
    const Iz = (t * d ** 3) / 12 + A1 * (d / 2 - cy) ** 2 + ((b - t) * t ** 3) / 12 + A2 * (t / 2 - cy) ** 2;
    const Iy = (d * t ** 3) / 12 + A1 * (t / 2 - cz) ** 2 + (t * (b - t) ** 3) / 12 + A2 * (t + (b - t) / 2 - cz) ** 2;
    const Iyz = A1 * (t / 2 - cz) * (d / 2 - cy) + A2 * (t + (b - t) / 2 - cz) * (t / 2 - cy);
    // principal axes: u = z·c + y·s, v = −z·s + y·c with tan 2θ = −2·Iyz/(Iz − Iy) (Mohr's circle for areas)
    const th = 0.5 * Math.atan2(-2 * Iyz, Iz - Iy);
    const c = Math.cos(th),
      s = Math.sin(th);
    const Iu = s * s * Iy + c * c * Iz - 2 * c * s * Iyz,
      Iv = c * c * Iy + s * s * Iz + 2 * c * s * Iyz;
    const M = 5e6; // 5 kN·m sagging about z
    const Mu = M * c,
      Mv = -M * s;
    const corners = [
      [0, 0],
      [b, 0],
      [b, t],
      [t, t],
      [t, d],
      [0, d],
    ].map(([z, y]) => {
      const zz = z - cz,
        yy = y - cy;
      const u = zz * c + yy * s,
        v = -zz * s + yy * c;
      return (-Mu * v) / Iu + (Mv * u) / Iv; // σ about each principal axis, tension positive
    });
    const comp = -Math.min(...corners),
      tens = Math.max(...corners);
    const r = candidateChecks("angle", { d, b, t }, problem({ moment: { sagging: 5, hogging: 0 } }));
    expect(get(r, "bending-compression").demand).toBeCloseTo(comp, 6);
    expect(get(r, "bending-tension").demand).toBeCloseTo(tens, 6);
    // the inclined neutral axis makes the stresses larger than M·c/Iz would say
    expect(comp).toBeGreaterThan((M * (d - cy)) / Iz);
  });
});

describe("angle deflection under the allowable basis: the total, not the vertical component (issue 10)", () => {
  it("total deflection = that of bending about each principal axis, combined (unequal angle 150 × 90 × 10)", () => {
    const d = 150,
      b = 90,
      t = 10;
    const p = sectionPropertiesOf(d, b, t);
    // The vertical load w resolves onto the principal axes (θ from z to axis 1): each bends alone,
    // δ1 = k·cos θ/I1, δ2 = k·sin θ/I2 with k = 5·w·L⁴/(384·E); the two are at right angles, so the
    // total is k·√((cos θ/I1)² + (sin θ/I2)²) (Boresi & Schmidt, Advanced Mechanics of Materials, 6th ed. (2003),
    // 6th ed., ch. 7, unsymmetric bending; any text's principal-axes method).
    const L = 3000,
      w = 2,
      E = 210000;
    const k = (5 * w * L ** 4) / (384 * E);
    const th = (p.principal.angleDeg * Math.PI) / 180;
    const total = k * Math.hypot(Math.cos(th) / p.principal.I1, Math.sin(th) / p.principal.I2);
    const vertical = k * (p.Iy / (p.Iz * p.Iy - p.Iyz ** 2));
    const r = candidateChecks("angle", { d, b, t }, problem({ deflection: { span: 3, serviceLoad: 2, limitRatio: 250, E } }));
    expect(get(r, "deflection").demand).toBeCloseTo(total, 9);
    expect(r.deflection!.total).toBeCloseTo(total, 9);
    expect(r.deflection!.vertical).toBeCloseTo(vertical, 9);
    expect(Math.hypot(r.deflection!.vertical, r.deflection!.sideways)).toBeCloseTo(total, 9);
    // the sideways component makes it larger than the vertical one alone
    expect(total).toBeGreaterThan(vertical * 1.05);
  });
});

function sectionPropertiesOf(d: number, b: number, t: number) {
  return sectionProperties({ family: "angle", d, b, t });
}

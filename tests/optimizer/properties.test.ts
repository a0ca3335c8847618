import { describe, expect, it } from "vitest";
import { sectionProperties, EngineInputError, type SectionInput } from "~/optimizer/index";
import { filletAbove, filletIntegrals } from "~/optimizer/fillet";
import { I_A, I_Y, I_YY, I_Z, I_ZY, I_ZZ, INTEGRALS, ringAbove, ringIntegrals } from "~/optimizer/polygon";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
const close = (a: number, b: number, tol = 1e-12) => expect(rel(a, b)).toBeLessThanOrEqual(tol);

describe("rectangle (Gere & Goodno, Mechanics of Materials, 7th ed. (2009), App. D; plastic: Z = b·h²/4)", () => {
  const b = 40, h = 120;
  const p = sectionProperties({ family: "rectangle", b, d: h });
  it("area, centroid, second moments", () => {
    close(p.area, b * h);
    close(p.centroid.y, h / 2);
    close(p.centroid.z, b / 2);
    close(p.Iz, (b * h ** 3) / 12);
    close(p.Iy, (h * b ** 3) / 12);
    expect(p.Iyz).toBe(0);
  });
  it("moduli, radii, Q, width", () => {
    close(p.Sz.top, (b * h ** 2) / 6);
    close(p.Sz.bottom, (b * h ** 2) / 6);
    close(p.Sy.left, (h * b ** 2) / 6);
    close(p.Zz, (b * h ** 2) / 4);
    close(p.Zy, (h * b ** 2) / 4);
    close(p.rz, h / Math.sqrt(12));
    close(p.Qz, (b * h ** 2) / 8);
    expect(p.widthAtNeutralAxis).toBe(b);
  });
  it("J by the contract's open thin-walled rule b·t³/3, mass = A·ρ·10⁻⁶", () => {
    close(p.J, (h * b ** 3) / 3);
    expect(p.Jmethod).toBe("open-thin-walled");
    close(p.massPerMetre, b * h * 7850e-6);
    close(sectionProperties({ family: "rectangle", b, d: h, density: 2700 }).massPerMetre, b * h * 2700e-6);
  });
  it("principal angle convention (contract): tall 0°, flat 90°, square 0°", () => {
    expect(p.principal.angleDeg).toBe(0);
    close(p.principal.I1, p.Iz);
    close(p.principal.I2, p.Iy);
    expect(sectionProperties({ family: "rectangle", b: 120, d: 40 }).principal.angleDeg).toBe(90);
    expect(sectionProperties({ family: "rectangle", b: 50, d: 50 }).principal.angleDeg).toBe(0);
  });
});

describe("hollow rectangle B×D with wall t (Gere & Goodno, 7th ed. App. D by difference of rectangles)", () => {
  const B = 100, D = 200, tf = 10, tw = 6;
  const bi = B - 2 * tw, di = D - 2 * tf;
  const boxP = sectionProperties({ family: "box", d: D, b: B, tf, tw });
  const polyP = sectionProperties({
    polygons: [
      { points: [[0, 0], [B, 0], [B, D], [0, D]], hole: false },
      { points: [[tw, tf], [tw, D - tf], [B - tw, D - tf], [B - tw, tf]], hole: true },
    ],
  });
  it("Iz = (B·D³ − b·d³)/12, Iy likewise, Zz = (B·D² − b·d²)/4 for the box family and the polygon-with-hole form", () => {
    for (const p of [boxP, polyP]) {
      close(p.area, B * D - bi * di, 1e-13);
      close(p.Iz, (B * D ** 3 - bi * di ** 3) / 12, 1e-13);
      close(p.Iy, (D * B ** 3 - di * bi ** 3) / 12, 1e-13);
      close(p.Zz, (B * D ** 2 - bi * di ** 2) / 4, 1e-12);
      close(p.Zy, (D * B ** 2 - di * bi ** 2) / 4, 1e-12);
      close(p.Qz, (B * (D / 2) ** 2) / 2 - (bi * (di / 2) ** 2) / 2, 1e-12);
      close(p.widthAtNeutralAxis, 2 * tw, 1e-12);
    }
  });
  it("box J by Bredt on the midline: 4·Am²/∮ds/t (Timoshenko & Goodier, Theory of Elasticity, 3rd ed. (1970), thin-walled tubes)", () => {
    const Am = (B - tw) * (D - tf);
    close(boxP.J, (4 * Am * Am) / ((2 * (B - tw)) / tf + (2 * (D - tf)) / tw));
    expect(boxP.Jmethod).toBe("closed-bredt");
    expect(polyP.Jmethod).toBe("polygon-approximate");
    // the polygon form knows no separate flange and web thicknesses, so its Bredt estimate
    // uses one mean wall (net area ÷ mean perimeter): near the midline value, not equal to it
    expect(rel(polyP.J, boxP.J)).toBeLessThan(0.1);
  });
});

describe("doubly symmetric I (Gere & Goodno, 7th ed. §12.5; plastic modulus: Neal, The Plastic Methods of Structural Analysis, 3rd ed. (1977))", () => {
  const d = 400, b = 180, tf = 13.5, tw = 8.6, hw = d - 2 * tf;
  const p = sectionProperties({ family: "i", d, b, tf, tw });
  it("Iz, Iy, Sz, Zz, Zy, Qz", () => {
    close(p.Iz, (b * d ** 3 - (b - tw) * hw ** 3) / 12, 1e-13);
    close(p.Iy, (2 * tf * b ** 3 + hw * tw ** 3) / 12, 1e-13);
    close(p.Sz.top, (b * d ** 3 - (b - tw) * hw ** 3) / 12 / (d / 2), 1e-13);
    close(p.Zz, b * tf * (d - tf) + (tw * hw ** 2) / 4, 1e-13);
    close(p.Zy, (2 * tf * b ** 2) / 4 + (hw * tw ** 2) / 4, 1e-13);
    close(p.Qz, (b * tf * (d - tf)) / 2 + (tw * (hw / 2) ** 2) / 2, 1e-13);
    expect(p.widthAtNeutralAxis).toBe(tw);
    close(p.J, (2 * b * tf ** 3 + hw * tw ** 3) / 3, 1e-13);
  });
});

describe("tee (Gere & Goodno, 7th ed. §12.3, §12.5 composite-area method, worked by hand)", () => {
  const d = 300, b = 150, tf = 12, tw = 8;
  const Af = b * tf, As = tw * (d - tf), A = Af + As;
  const yb = (Af * (d - tf / 2) + (As * (d - tf)) / 2) / A;
  const Iz = (b * tf ** 3) / 12 + Af * (d - tf / 2 - yb) ** 2 + (tw * (d - tf) ** 3) / 12 + As * ((d - tf) / 2 - yb) ** 2;
  it("centroid from the bottom and Iz", () => {
    const p = sectionProperties({ family: "tee", d, b, tf, tw });
    close(p.centroid.y, yb, 1e-13);
    close(p.Iz, Iz, 1e-13);
    close(p.extremes.top, d - yb, 1e-13);
    close(p.Sz.bottom, Iz / yb, 1e-13);
  });
  it("Zz with the equal-area axis in the stem (As > Af): yp = A/(2·tw) from the stem foot", () => {
    expect(As).toBeGreaterThan(Af);
    const yp = A / 2 / tw;
    const Z = (tw * yp ** 2) / 2 + (tw * (d - tf - yp) ** 2) / 2 + Af * (d - tf / 2 - yp);
    close(sectionProperties({ family: "tee", d, b, tf, tw }).Zz, Z, 1e-13);
  });
  it("flip swaps top/bottom moduli and keeps Iz", () => {
    const p = sectionProperties({ family: "tee", d, b, tf, tw });
    const q = sectionProperties({ family: "tee", d, b, tf, tw, flip: true });
    close(q.Sz.top, p.Sz.bottom, 1e-13);
    close(q.Iz, p.Iz, 1e-13);
    close(q.centroid.y, d - p.centroid.y, 1e-13);
  });
});

describe("triangle (Gere & Goodno, 7th ed. App. D case 5: Iz = b·h³/36 about the centroid, ȳ = h/3)", () => {
  const b = 90, h = 60;
  const p = sectionProperties({ polygons: [{ points: [[0, 0], [b, 0], [b / 2, h]] }] });
  it("area, centroid, Iz, Iy (isosceles: h·b³/48)", () => {
    close(p.area, (b * h) / 2, 1e-14);
    close(p.centroid.y, h / 3, 1e-14);
    close(p.Iz, (b * h ** 3) / 36, 1e-13);
    close(p.Iy, (h * b ** 3) / 48, 1e-13);
    expect(p.Iyz).toBe(0);
  });
  it("Zz from the equal-area axis at h(1 − 1/√2): shape factor 2.34 (Neal, The Plastic Methods of Structural Analysis, 3rd ed. (1977), table of shape factors)", () => {
    const Z = ((b * h) / 2) * h * (1 - 2 / (3 * Math.SQRT2) - 1 / 3);
    close(p.Zz, Z, 1e-12);
    expect(p.Zz / p.Sz.top).toBeCloseTo(2.343, 3);
  });
  it("right triangle product Iyz = −b²h²/72 (Gere & Goodno, 7th ed. App. D case 6, legs on the axes)", () => {
    const r = sectionProperties({ polygons: [{ points: [[0, 0], [b, 0], [0, h]] }] });
    close(r.Iyz, (-b * b * h * h) / 72, 1e-13);
  });
});

describe("circle as a regular 720-gon (π·r⁴/4, Gere & Goodno, 7th ed. App. D case 9)", () => {
  const R = 50, n = 720, al = (2 * Math.PI) / n;
  const pts = Array.from({ length: n }, (_, k) => [R * Math.cos(k * al), R * Math.sin(k * al)] as [number, number]);
  const p = sectionProperties({ polygons: [{ points: pts }] });
  it("equals the regular polygon's exact I = n·R⁴·sin α·(2 + cos α)/24 (sum of n centre triangles, J_O = A/6·(|P|²+|Q|²+P·Q))", () => {
    close(p.Iz, (n * R ** 4 * Math.sin(al) * (2 + Math.cos(al))) / 24, 1e-12);
    close(p.Iy, p.Iz, 1e-12);
  });
  it("differs from π·r⁴/4 by less than the annulus bound 1 − cos⁴(π/n) (polygon lies between radii R·cos(π/n) and R)", () => {
    const exact = (Math.PI * R ** 4) / 4;
    const bound = 1 - Math.cos(Math.PI / n) ** 4;
    expect(bound).toBeLessThan(4e-5);
    expect(p.Iz).toBeLessThan(exact);
    expect(rel(p.Iz, exact)).toBeLessThan(bound);
    expect(rel(p.Zz, (4 * R ** 3) / 3)).toBeLessThan(bound); // Z = 4r³/3 for a solid circle
    expect(rel(p.J, (Math.PI * R ** 4) / 2)).toBeLessThan(2 * bound); // Saint-Venant's approximation is exact for a circle
  });
});

describe("equal-leg angle (principal axes at ±45°: Gere & Goodno, 7th ed. §12.9)", () => {
  const p = sectionProperties({ family: "angle", d: 100, b: 100, t: 10 });
  it("Iz = Iy, Iyz < 0, major axis at +45°, I1 = Iz + |Iyz|", () => {
    close(p.Iz, p.Iy, 1e-13);
    expect(p.Iyz).toBeLessThan(0);
    expect(p.principal.angleDeg).toBeCloseTo(45, 12);
    close(p.principal.I1, p.Iz - p.Iyz, 1e-13);
    close(p.principal.I2, p.Iz + p.Iyz, 1e-13);
  });
  it("mirroring (legs pointing left) gives −45°", () => {
    const m = sectionProperties({ plates: [{ b: 10, h: 100, z: 90, y: 0 }, { b: 90, h: 10, z: 0, y: 0 }] });
    close(m.Iyz, -p.Iyz, 1e-13);
    expect(m.principal.angleDeg).toBeCloseTo(-45, 12);
  });
});

describe("root fillet spandrel formulas (fillet.ts) against a finely divided polygon", () => {
  const r = 15, m = 20000;
  // corner at (30, 40), fillet to the right and downward (dz = +1, dy = −1)
  const f = { z: 30, y: 40, dz: 1 as const, dy: -1 as const, r };
  const pts: number[] = [];
  pts.push(30, 40); // the corner
  for (let k = 0; k <= m; k++) {
    // centre (30 + r, 40 − r); the arc bulges toward the corner, from angle 180° (point (30, 40 − r)) to 90° (point (30 + r, 40))
    const th = Math.PI - (k / m) * (Math.PI / 2);
    pts.push(30 + r + r * Math.cos(th), 40 - r + r * Math.sin(th));
  }
  const ring = new Float64Array(pts);
  it("area r²(1 − π/4), first and second moments", () => {
    const a = new Float64Array(INTEGRALS), b = new Float64Array(INTEGRALS);
    filletIntegrals(f, 7, 3, a);
    ringIntegrals(ring, 7, 3, 1, b);
    close(a[I_A], r * r * (1 - Math.PI / 4), 1e-15);
    // chord error of the m-gon arc: relative ~ (π/2m)²/… of the quarter-disc, far below 1e-6 here
    for (const k of [I_A, I_Z, I_Y, I_YY, I_ZZ, I_ZY]) expect(rel(a[k], b[k])).toBeLessThan(1e-6);
  });
  it("part above a cut line: area and first moment", () => {
    for (const c of [25.1, 30, 33.3, 39.9, 41, 20]) {
      const a = new Float64Array(2), b = new Float64Array(2);
      filletAbove(f, c, 5, a);
      ringAbove(ring, c, 5, b);
      expect(Math.abs(a[0] - b[0])).toBeLessThan(1e-5);
      expect(Math.abs(a[1] - b[1])).toBeLessThan(1e-4);
    }
  });
});

describe("widthAtNeutralAxis edge rule (contract: the smaller of the widths just above and just below)", () => {
  it("axis exactly on the joint of a 40×10 plate under a 10×20 plate (b₁h₁² = b₂h₂² puts ȳ at 10): width 10", () => {
    const p = sectionProperties({ plates: [{ b: 40, h: 10, z: 0, y: 0 }, { b: 10, h: 20, z: 15, y: 10 }] });
    expect(p.centroid.y).toBe(10);
    expect(p.widthAtNeutralAxis).toBe(10);
    const q = sectionProperties({ plates: [{ b: 10, h: 20, z: 15, y: 0 }, { b: 40, h: 10, z: 0, y: 20 }] });
    expect(q.centroid.y).toBe(20);
    expect(q.widthAtNeutralAxis).toBe(10);
  });
});

describe("bad input throws EngineInputError naming the field", () => {
  const cases: [unknown, string, string][] = [
    [{ plates: [{ b: 10, h: 10, z: 0, y: 0 }, { b: 10, h: 10, z: 5, y: 5 }, { b: 10, h: 10, z: 20, y: 0 }] }, "plates[1]", "plates[1] overlaps plates[0]"],
    [{ plates: [{ b: 0, h: 10, z: 0, y: 0 }] }, "plates[0].b", "plates[0].b must be positive"],
    [{ plates: [{ b: 1, h: NaN, z: 0, y: 0 }] }, "plates[0].h", "plates[0].h must be a finite number"],
    [{ plates: [] }, "plates", "plates needs at least one plate"],
    [{ family: "i", d: 20, b: 100, tf: 10, tw: 6 }, "d", "i: d must exceed 2·tf"],
    [{ family: "box", d: 100, b: 10, tf: 10, tw: 6 }, "b", "box: b must exceed 2·tw"],
    [{ family: "box", d: 100, b: 100, tf: 10, tw: 10, r: 5 }, "r", "box: takes no root radius r"],
    [{ polygons: [{ points: [[0, 0], [1, 1], [1, 0], [0, 1]] }] }, "polygons[0].points", "polygons[0] self-intersects (edges 0 and 2)"],
    [{ polygons: [{ points: [[0, 0], [1, 0], [2, 0]] }] }, "polygons[0].points", "polygons[0] edges 0 and 2 fold back on each other"],
    [{ polygons: [{ points: [[0, 0], [10, 0], [0, 10]] }, { points: [[5, 5], [20, 5], [5, 20]], hole: true }] }, "polygons[1]", "polygons[1] (a hole) must lie inside a solid polygon"],
    [{ polygons: [{ points: [[0, 0], [10, 0], [10, 10], [0, 10]] }, { points: [[1, 1], [5, 1], [5, 5]], hole: true }, { points: [[2, 1.5], [8, 2], [8, 8]], hole: true }] }, "polygons[2]", "polygons[2] overlaps polygons[1]"],
    [{ family: "rectangle", b: 10, d: 10, density: -1 }, "density", "density must be a positive number (kg/m³)"],
    [{ foo: 1 }, "input", "section input needs plates, polygons or family"],
    [{ family: "rectangle", b: 1e200, d: 1e200 }, "input", "dimensions are out of the range double precision can handle"],
  ];
  it.each(cases)("%j → %s", (input, field, message) => {
    let err: unknown;
    try {
      sectionProperties(input as SectionInput);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EngineInputError);
    expect((err as EngineInputError).field).toBe(field);
    expect((err as EngineInputError).message).toBe(message);
  });
  it("plates touching up to decimal rounding (0.1 + 0.2 ≠ 0.3) are not an overlap", () => {
    expect(sectionProperties({ plates: [{ b: 1, h: 0.2, z: 0, y: 0.1 }, { b: 1, h: 1, z: 0, y: 0.3 }] }).area).toBeCloseTo(1.2, 14);
  });
  it("null or a number is an input error, not a crash", () => {
    expect(() => sectionProperties(null as unknown as SectionInput)).toThrow(EngineInputError);
    expect(() => sectionProperties(3 as unknown as SectionInput)).toThrow(EngineInputError);
  });
  it("touching plates are fine", () => {
    expect(sectionProperties({ plates: [{ b: 10, h: 10, z: 0, y: 0 }, { b: 10, h: 10, z: 10, y: 0 }] }).area).toBe(200);
  });
});

// Hollow sections with rounded corners (families rhs and chs, app/optimizer/hollow.ts) against
// closed forms worked independently of the engine's spandrel construction.
//
// Sources:
// - circular tube: A = π(D² − Di²)/4, I = π(D⁴ − Di⁴)/64, J = 2I (Gere & Goodno, Mechanics of
//   Materials, 7th ed. (2009), Appendix D case 9 (circle) by subtraction, and the thin-walled tube section (number from memory) for thin and thick
//   circular tubes in torsion); plastic modulus (D³ − Di³)/6 = 2 × the first moment of a half
//   annulus, 2·(2/3)(Ro³ − Ri³) (semicircle centroid 4r/3π, Appendix D case 10).
// - rounded rectangle: a cross of two rectangles plus four quarter discs (quarter disc: area
//   πr²/4, centroid 4r/3π from each straight edge, I about its centroidal axis parallel to an
//   edge (π/16 − 4/9π)·r⁴: Gere & Goodno, 7th ed. Appendix D case 11), moved by the parallel-axis theorem;
//   the tube is the outer rounded rectangle minus the inner one. This sums quarter DISCS, the
//   engine sums rectangles and SPANDRELS, so the two routes share no formula.
// - area of a hollow section with radii ro, ri: A = 2t(b + d − 2t) − (4 − π)(ro² − ri²)
//   (mem., EN 10210-2 / EN 10219-2 Annex, "sectional area").
// - a few printed table values (mem., EN 10210-2 hot-finished sizes), with the printed rounding.
import { describe, expect, it } from "vitest";
import { FAMILIES, HOLLOW_FAMILIES, SECTION_FAMILIES, hollowRadii, sectionInputSchema, sectionProperties, type SectionInput } from "~/optimizer/index";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/** Closed form for a tube of outside diameter D and wall t. */
function chsClosed(D: number, t: number) {
  const Di = D - 2 * t;
  const I = (Math.PI * (D ** 4 - Di ** 4)) / 64;
  return {
    A: (Math.PI * (D * D - Di * Di)) / 4,
    I,
    S: (2 * I) / D,
    Z: (D ** 3 - Di ** 3) / 6,
    Q: (D ** 3 - Di ** 3) / 12,
    J: 2 * I,
  };
}

/** Area, second moment about the horizontal centroidal axis, first moment of the upper half: rounded rectangle B wide, H deep, corner radius r. */
function roundedRect(B: number, H: number, r: number) {
  const qa = (Math.PI * r * r) / 4;
  const qc = (4 * r) / (3 * Math.PI);
  const qI = (Math.PI / 16 - 4 / (9 * Math.PI)) * r ** 4;
  // the full-width band between the corner arcs, and the two strips above and below it
  const A1 = B * (H - 2 * r),
    I1 = (B * (H - 2 * r) ** 3) / 12;
  const A2 = (B - 2 * r) * r,
    y2 = H / 2 - r / 2,
    I2 = ((B - 2 * r) * r ** 3) / 12 + A2 * y2 * y2;
  const yq = H / 2 - r + qc;
  const A = A1 + 2 * A2 + 4 * qa;
  const I = I1 + 2 * I2 + 4 * (qI + qa * yq * yq);
  const Q = (B * ((H - 2 * r) / 2) ** 2) / 2 + A2 * y2 + 2 * qa * yq;
  return { A, I, Q };
}

function rhsClosed(d: number, b: number, t: number, ro: number, ri: number) {
  const o = roundedRect(b, d, ro),
    i = roundedRect(b - 2 * t, d - 2 * t, ri);
  const oT = roundedRect(d, b, ro),
    iT = roundedRect(d - 2 * t, b - 2 * t, ri);
  return { A: o.A - i.A, Iz: o.I - i.I, Iy: oT.I - iT.I, Zz: 2 * (o.Q - i.Q), Zy: 2 * (oT.Q - iT.Q), Qz: o.Q - i.Q };
}

describe("circular hollow section (chs) against the tube's closed forms", () => {
  it.each([
    [168.3, 10],
    [48.3, 3.2],
    [508, 50],
    [100, 49], // nearly solid: the inner spandrels are tiny, the outer ones half the side
  ])("D %s, t %s", (D, t) => {
    const p = sectionProperties({ family: "chs", d: D, t } as SectionInput);
    const c = chsClosed(D, t);
    expect(rel(p.area, c.A)).toBeLessThan(1e-12);
    expect(rel(p.Iz, c.I)).toBeLessThan(1e-11);
    expect(rel(p.Iy, c.I)).toBeLessThan(1e-11);
    expect(p.Iyz).toBe(0);
    expect(rel(p.Sz.top, c.S)).toBeLessThan(1e-11);
    // the equal-area axis is found by bisection (fillets present), exact to machine precision here
    expect(rel(p.Zz, c.Z)).toBeLessThan(1e-9);
    expect(rel(p.Zy, c.Z)).toBeLessThan(1e-9);
    expect(rel(p.Qz, c.Q)).toBeLessThan(1e-11);
    expect(p.widthAtNeutralAxis).toBeCloseTo(2 * t, 9);
    expect(rel(p.J, c.J)).toBeLessThan(1e-12);
    expect(p.Jmethod).toBe("closed-bredt");
    expect(p.centroid.y).toBeCloseTo(D / 2, 9);
  });

  it("printed EN 10210-2 values for CHS 168.3 × 10 (mem.): A 49.7 cm², I 1564 cm⁴, Wel 186 cm³, Wpl 251 cm³, 39.0 kg/m", () => {
    const p = sectionProperties({ family: "chs", d: 168.3, t: 10 } as SectionInput);
    expect(Math.abs(p.area / 1e2 - 49.7)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(p.Iz / 1e4 - 1564)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(p.Sz.top / 1e3 - 186)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(p.Zz / 1e3 - 251)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(p.massPerMetre - 39.0)).toBeLessThanOrEqual(0.05);
  });
});

describe("rectangular hollow section (rhs) with corner radii against quarter-disc sums", () => {
  const cases: [string, number, number, number, number, number][] = [
    ["hot finished 200 × 100 × 10, EN 10210-2 radii", 200, 100, 10, 15, 10],
    ["cold formed 150 × 150 × 8, EN 10219-2 radii", 150, 150, 8, 20, 12],
    ["cold formed 300 × 200 × 12.5, EN 10219-2 radii", 300, 200, 12.5, 37.5, 25],
    ["concentric corners ri = ro − t", 250, 150, 6, 18, 12],
    ["sharp corners (ro = ri = 0)", 120, 80, 5, 0, 0],
    ["round outside, sharp inside", 120, 80, 8, 10, 0],
  ];
  it.each(cases)("%s", (_name, d, b, t, ro, ri) => {
    const p = sectionProperties({ family: "rhs", d, b, t, ro, ri } as SectionInput);
    const c = rhsClosed(d, b, t, ro, ri);
    expect(rel(p.area, c.A)).toBeLessThan(1e-12);
    expect(rel(p.area, 2 * t * (b + d - 2 * t) - (4 - Math.PI) * (ro * ro - ri * ri))).toBeLessThan(1e-12);
    expect(rel(p.Iz, c.Iz)).toBeLessThan(1e-11);
    expect(rel(p.Iy, c.Iy)).toBeLessThan(1e-11);
    expect(rel(p.Sz.top, c.Iz / (d / 2))).toBeLessThan(1e-11);
    expect(rel(p.Sy.left, c.Iy / (b / 2))).toBeLessThan(1e-11);
    expect(rel(p.Zz, c.Zz)).toBeLessThan(1e-9);
    expect(rel(p.Zy, c.Zy)).toBeLessThan(1e-9);
    expect(rel(p.Qz, c.Qz)).toBeLessThan(1e-11);
    expect(p.widthAtNeutralAxis).toBeCloseTo(2 * t, 9);
    expect(p.Iyz).toBe(0);
  });

  it("J: Bredt's cell plus the walls' open share; with sharp corners it is the box family's Bredt value + t³·h/3 (h the midline perimeter)", () => {
    const [d, b, t] = [200, 100, 10];
    const rhs = sectionProperties({ family: "rhs", d, b, t, ro: 0, ri: 0 } as SectionInput);
    const box = sectionProperties({ family: "box", d, b, tf: t, tw: t });
    const h = 2 * (b - t + (d - t));
    expect(rel(rhs.J, box.J + (t ** 3 * h) / 3)).toBeLessThan(1e-12);
    // Bredt by hand for the cell (b − t)(d − t) with a uniform wall: 4·Am²·t / perimeter
    const Am = (b - t) * (d - t);
    expect(rel(box.J, (4 * Am * Am * t) / h)).toBeLessThan(1e-12);
  });

  it("a square rhs rounded all the way (ro = d/2, ri = d/2 − t) is the chs: same geometry exactly, and J from Bredt's cell within its thin-wall term", () => {
    const [D, t] = [168.3, 10];
    const rhs = sectionProperties({ family: "rhs", d: D, b: D, t, ro: D / 2, ri: D / 2 - t } as SectionInput);
    const chs = sectionProperties({ family: "chs", d: D, t } as SectionInput);
    expect(rel(rhs.area, chs.area)).toBeLessThan(1e-12);
    expect(rel(rhs.Iz, chs.Iz)).toBeLessThan(1e-12);
    expect(rel(rhs.Zz, chs.Zz)).toBeLessThan(1e-9);
    // midline radius rm: Bredt + open wall gives 2π·rm³·t + 2π·rm·t³/3, the exact tube
    // 2π·rm³·t + π·rm·t³/2 (Gere & Goodno, 7th ed. thin-walled tubes (section from memory), with Ro, Ri = rm ± t/2)
    const rm = (D - t) / 2;
    expect(rel(rhs.J, 2 * Math.PI * rm ** 3 * t + (2 * Math.PI * rm * t ** 3) / 3)).toBeLessThan(1e-12);
    expect(rel(chs.J, 2 * Math.PI * rm ** 3 * t + (Math.PI * rm * t ** 3) / 2)).toBeLessThan(1e-12);
  });

  it("printed EN 10210-2 values for RHS 200 × 100 × 10 (mem.): A 54.9 cm², 43.1 kg/m", () => {
    const p = sectionProperties({ family: "rhs", d: 200, b: 100, t: 10, ...hollowRadii("EN 10210-2", 10) } as SectionInput);
    expect(Math.abs(p.area / 1e2 - 54.9)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(p.massPerMetre - 43.1)).toBeLessThanOrEqual(0.05);
  });

  it("a fine polygon of the same outline (Green's theorem, no fillet code) converges to the same properties", () => {
    const [d, b, t, ro, ri] = [160, 90, 8, 20, 12];
    const outline = (z0: number, y0: number, z1: number, y1: number, r: number, n: number) => {
      const pts: [number, number][] = [];
      const corner = (cz: number, cy: number, a0: number) => {
        for (let k = 0; k <= n; k++) {
          const a = a0 + ((Math.PI / 2) * k) / n;
          pts.push([cz + r * Math.cos(a), cy + r * Math.sin(a)]);
        }
      };
      corner(z1 - r, y0 + r, -Math.PI / 2);
      corner(z1 - r, y1 - r, 0);
      corner(z0 + r, y1 - r, Math.PI / 2);
      corner(z0 + r, y0 + r, Math.PI);
      return pts;
    };
    // 241 points a corner, 1,928 in all: within the section cap of 2,000 points (validate.ts)
    const n = 240;
    const poly = sectionProperties({
      polygons: [
        { points: outline(0, 0, b, d, ro, n), hole: false },
        { points: outline(t, t, b - t, d - t, ri, n), hole: true },
      ],
    });
    const p = sectionProperties({ family: "rhs", d, b, t, ro, ri } as SectionInput);
    // inscribed polygons lose area of order (π/2n)² of the corner quadrants: well under 1e-5 here
    expect(rel(poly.area, p.area)).toBeLessThan(1e-5);
    expect(rel(poly.Iz, p.Iz)).toBeLessThan(1e-5);
    expect(rel(poly.Iy, p.Iy)).toBeLessThan(1e-5);
    expect(rel(poly.Zz, p.Zz)).toBeLessThan(1e-5);
  });
});

describe("hollow families: input rules and where they are offered", () => {
  it("are section families but not plate-search families (bought as tubes, not cut from plate)", () => {
    for (const f of HOLLOW_FAMILIES) {
      expect(SECTION_FAMILIES).toContain(f);
      expect(FAMILIES as readonly string[]).not.toContain(f);
    }
  });

  it.each([
    [{ family: "rhs", d: 50, b: 100, t: 30, ro: 0, ri: 0 }, "t", "d must exceed 2·t"],
    [{ family: "rhs", d: 100, b: 50, t: 30, ro: 0, ri: 0 }, "t", "b must exceed 2·t"],
    [{ family: "rhs", d: 100, b: 50, t: 5, ro: 30, ri: 0 }, "ro", "ro must not exceed"],
    [{ family: "rhs", d: 100, b: 50, t: 5, ro: 10, ri: 21 }, "ri", "ri must not exceed"],
    [{ family: "rhs", d: 100, b: 50, t: 2, ro: 20, ri: 0 }, "ri", "wall would vanish"],
    [{ family: "rhs", d: 100, b: 50, t: 5, ro: -1, ri: 0 }, "ro", "ro must be ≥ 0"],
    [{ family: "chs", d: 100, t: 50 }, "t", "d must exceed 2·t"],
    [{ family: "chs", d: 100, t: 5, r: 3 }, "r", "takes no root radius"],
  ])("%j is refused naming %s", (input, field, words) => {
    expect(() => sectionProperties(input as SectionInput)).toThrow(words);
    const z = sectionInputSchema.safeParse(input);
    expect(z.success).toBe(false);
    const msg = z.error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
    expect(msg).toContain(words);
    try {
      sectionProperties(input as SectionInput);
    } catch (e) {
      expect((e as { field?: string }).field).toBe(field);
    }
  });

  it("the EN 10219-2 radii (mem.) step with the wall: 2t/t to 6 mm, 2.5t/1.5t to 10 mm, 3t/2t above", () => {
    expect(hollowRadii("EN 10219-2", 5)).toEqual({ ro: 10, ri: 5 });
    expect(hollowRadii("EN 10219-2", 8)).toEqual({ ro: 20, ri: 12 });
    expect(hollowRadii("EN 10219-2", 12.5)).toEqual({ ro: 37.5, ri: 25 });
    expect(hollowRadii("EN 10210-2", 10)).toEqual({ ro: 15, ri: 10 });
  });
});

// Rolled angles: root radius r between the legs and toe radius rt at each leg tip's inner corner
// (family angle with r, rt). Checked against the same outline as a fine polygon (Green's theorem,
// no fillet code) and against the closed-form area: legs d·t + (b − t)·t, plus the root spandrel
// r²(1 − π/4), less two toe spandrels rt²(1 − π/4) (square minus quarter disc, Gere & Goodno,
// Mechanics of Materials, 7th ed. (2009), Appendix D). Printed values (mem., EN 10056-1 table for L 100 × 100 × 10,
// r1 = 12, r2 = 6): A 19.2 cm², I 177 cm⁴ about either leg-parallel axis, 15.0 kg/m.
import { describe, expect, it } from "vitest";
import { sectionInputSchema, sectionProperties, type SectionInput } from "~/optimizer/index";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

function anglePolygon(d: number, b: number, t: number, r: number, rt: number, n: number): [number, number][] {
  const pts: [number, number][] = [[0, 0], [b, 0]];
  // right leg tip: up the end face, then the toe arc (centre (b − rt, t − rt)) round to the top face
  for (let k = 0; k <= n; k++) {
    const a = (Math.PI / 2) * (k / n);
    pts.push([b - rt + rt * Math.cos(a), t - rt + rt * Math.sin(a)]);
  }
  // root arc, centre (t + r, t + r), from (t + r, t) to (t, t + r)
  for (let k = 0; k <= n; k++) {
    const a = -Math.PI / 2 - (Math.PI / 2) * (k / n);
    pts.push([t + r + r * Math.cos(a), t + r + r * Math.sin(a)]);
  }
  // top leg tip: the toe arc (centre (t − rt, d − rt)) from the inner face to the top face
  for (let k = 0; k <= n; k++) {
    const a = (Math.PI / 2) * (k / n);
    pts.push([t - rt + rt * Math.cos(a), d - rt + rt * Math.sin(a)]);
  }
  pts.push([0, d]);
  // drop repeated points where arcs meet straight runs
  return pts.filter((p, i) => i === 0 || p[0] !== pts[i - 1]![0] || p[1] !== pts[i - 1]![1]);
}

describe("angle with root and toe radii", () => {
  it.each([
    [100, 100, 10, 12, 6],
    [150, 90, 12, 12, 6],
    [60, 40, 6, 7, 3.5],
  ])("d %s, b %s, t %s, r %s, rt %s against a fine polygon and the closed-form area", (d, b, t, r, rt) => {
    const p = sectionProperties({ family: "angle", d, b, t, r, rt } as SectionInput);
    const k = 1 - Math.PI / 4;
    expect(rel(p.area, d * t + (b - t) * t + k * r * r - 2 * k * rt * rt)).toBeLessThan(1e-12);
    const poly = sectionProperties({ polygons: [{ points: anglePolygon(d, b, t, r, rt, 400), hole: false }] });
    for (const key of ["area", "Iz", "Iy", "Iyz", "Zz", "Zy"] as const) expect(rel(p[key], poly[key]), key).toBeLessThan(2e-5);
    expect(rel(p.centroid.y, poly.centroid.y)).toBeLessThan(1e-5);
  });

  it("printed EN 10056-1 values for L 100 × 100 × 10 (mem.); without the toe radii the area is off by more than the printed rounding", () => {
    const p = sectionProperties({ family: "angle", d: 100, b: 100, t: 10, r: 12, rt: 6 } as SectionInput);
    expect(Math.abs(p.area / 1e2 - 19.2)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(p.Iz / 1e4 - 177)).toBeLessThanOrEqual(0.5 + 3e-4 * 177);
    expect(Math.abs(p.massPerMetre - 15.0)).toBeLessThanOrEqual(0.05);
    const noToes = sectionProperties({ family: "angle", d: 100, b: 100, t: 10, r: 12 } as SectionInput);
    expect(Math.abs(noToes.area / 1e2 - 19.2)).toBeGreaterThan(0.05);
  });

  it.each([
    [{ family: "angle", d: 100, b: 100, t: 10, rt: 11 }, "rt must not exceed t"],
    [{ family: "angle", d: 100, b: 50, t: 10, r: 41 }, "r must not exceed the clear leg"],
  ])("%j is refused", (input, words) => {
    expect(() => sectionProperties(input as SectionInput)).toThrow(words);
    expect(sectionInputSchema.safeParse(input).success).toBe(false);
  });

  it("a toe radius on a family without toes is refused by the engine's own check", () => {
    expect(() => sectionProperties({ family: "i", d: 300, b: 150, tf: 10, tw: 7, rt: 2 } as SectionInput)).toThrow("i: takes no toe radius rt");
  });
});

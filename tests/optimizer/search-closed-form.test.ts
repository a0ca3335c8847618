// Closed-form optima the search must land on: the first grid point past the textbook answer.
import { describe, expect, it } from "vitest";
import { bruteForceSearch } from "~/optimizer/brute-force";
import { candidateChecks } from "~/optimizer/checks";
import { searchSections } from "~/optimizer/search";
import { searchProblemSchema, type SearchProblemInput } from "~/optimizer/search-schema";

describe("solid rectangle of fixed width: d = √(6M/(b·σ))", () => {
  // S = b·d²/6 for a rectangle (Gere & Goodno, Mechanics of Materials, 7th ed. (2009), §5.5); σ = M/S
  for (const [M, b, sigma] of [
    [50, 100, 165],
    [12.5, 40, 140],
    [300, 250, 200],
  ] as const) {
    it(`M ${M} kN·m, b ${b} mm, σ ${sigma} MPa`, () => {
      const dExact = Math.sqrt((6 * M * 1e6) / (b * sigma));
      const p: SearchProblemInput = {
        moment: { sagging: M },
        allowable: { tension: sigma, compression: sigma },
        depth: { min: 10, max: 2000, step: 1 },
        width: { min: b, max: b, step: 1 },
        thicknesses: [10],
        families: ["rectangle"],
      };
      const r = searchSections(p);
      expect(r.best?.dimensions.d).toBe(Math.ceil(dExact));
      expect(r.best?.dimensions.b).toBe(b);
    });
  }
});

describe("I of given depth: flange area from the bending modulus", () => {
  // Exact: S = [b·(d³ − hw³) + tw·hw³]/(6·d) (the I as b×d less the two clear rectangles);
  // the plate-girder proportioning relation S ≈ Af·d + Aw·d/6, i.e. Af ≈ M/(σ·d) − Aw/6
  // (flange-area method, e.g. Salmon, Johnson & Malhas, Steel Structures, plate girders; from
  // memory), is its thin-flange approximation.
  const d = 600,
    t = 10,
    hw = d - 2 * t,
    M = 400,
    sigma = 165;
  const p: SearchProblemInput = {
    moment: { sagging: M },
    allowable: { tension: sigma, compression: sigma },
    depth: { min: d, max: d, step: 1 },
    width: { min: 50, max: 600, step: 1 },
    thicknesses: [t], // tf = tw = 10
    families: ["i"],
  };
  it("the search's flange width is the first grid point past the exact requirement", () => {
    const Sreq = (M * 1e6) / sigma;
    const bExact = (6 * d * Sreq - t * hw ** 3) / (d ** 3 - hw ** 3);
    const r = searchSections(p);
    expect(r.best?.dimensions.b).toBe(Math.ceil(bExact));
    // one grid step narrower fails
    const parsed = searchProblemSchema.parse(p);
    expect(candidateChecks("i", { d, b: Math.ceil(bExact) - 1, tf: t, tw: t }, parsed).feasible).toBe(false);
    expect(bruteForceSearch(p).best?.dimensions.b).toBe(r.best?.dimensions.b);
  });
  it("agrees with the flange-area approximation within a few percent", () => {
    const Af = (M * 1e6) / (sigma * d) - (hw * t) / 6;
    const r = searchSections(p);
    const AfSearch = r.best!.dimensions.b * t;
    expect(AfSearch / Af).toBeGreaterThan(1);
    expect(AfSearch / Af).toBeLessThan(1.06);
  });
});

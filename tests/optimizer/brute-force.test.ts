// The brute-force reference: walks every grid point, counts exactly, refuses huge grids.
import { describe, expect, it } from "vitest";
import { BRUTE_FORCE_MAX_GRID, bruteForceSearch } from "~/optimizer/brute-force";
import { familyRuleViolation } from "~/optimizer/geometry";
import { gridValues, type SearchProblemInput } from "~/optimizer/search-schema";

const p: SearchProblemInput = {
  moment: { sagging: 3, hogging: 1 },
  allowable: { tension: 165, compression: 150 },
  depth: { min: 30, max: 120, step: 15 },
  width: { min: 10, max: 90, step: 20 },
  thicknesses: [5, 10, 20],
  families: ["i", "mono-i", "angle"],
};

describe("brute force", () => {
  it("evaluates every valid grid point once (count checked against familyRuleViolation by hand loops)", () => {
    const D = [...gridValues(p.depth)],
      W = [...gridValues(p.width)],
      T = p.thicknesses;
    let n = 0;
    for (const d of D) for (const b of W) for (const tf of T) for (const tw of T) if (!familyRuleViolation("i", { d, b, tf, tw })) n++;
    for (const d of D)
      for (const bt of W)
        for (const tft of T)
          for (const bb of W) for (const tfb of T) for (const tw of T) if (!familyRuleViolation("mono-i", { d, bt, tft, bb, tfb, tw })) n++;
    for (const d of D) for (const b of W) for (const t of T) if (!familyRuleViolation("angle", { d, b, t })) n++;
    const r = bruteForceSearch(p);
    expect(r.counts.grid).toBe(n);
    expect(r.counts.evaluated).toBe(n);
    expect(r.counts.feasible).toBeGreaterThan(0);
    expect(r.front.length).toBeGreaterThan(0);
    for (const c of r.front) expect(c.utilisation).toBeLessThanOrEqual(1);
  });

  it("refuses grids above its cap with a message naming the grid", () => {
    expect(BRUTE_FORCE_MAX_GRID).toBe(1e8);
    expect(() => bruteForceSearch({ ...p, families: ["mono-i"], depth: { min: 100, max: 1099, step: 1 }, width: { min: 10, max: 109, step: 1 } })).toThrow(
      /grid: .* too many for brute force/,
    );
  });
});

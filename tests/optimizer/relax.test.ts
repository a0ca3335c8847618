// What it would take: nearest misses and the smallest relaxation of each limit, checked against
// closed forms (a solid rectangle in bending: σ = 6M/(b·d²), Gere & Goodno, Mechanics of
// Materials, 8th ed., §5.5) and against brute-force enumeration of the eased problems.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { bruteForceSearch, nearestMisses, relaxLimits, searchProblemSchema, whatItWouldTake, type SearchProblem } from "~/optimizer/index";

// M = 10 kN·m, σ = 100 MPa: b·d²/6 ≥ 1e7/100 = 1e5 mm³. With b = 100 mm: d ≥ √6000 = 77.46 mm.
const bar: SearchProblem = searchProblemSchema.parse({
  moment: { sagging: 10, hogging: 0 },
  allowable: { tension: 100, compression: 100 },
  depth: { min: 50, max: 70, step: 10 },
  width: { min: 100, max: 100, step: 10 },
  thicknesses: [10],
  families: ["rectangle"],
});

describe("relaxLimits", () => {
  it("depth max 70 → 80 mm gives the 100 × 80 bar (d ≥ 77.46 mm), 62.8 kg/m at 7850 kg/m³", () => {
    const r = relaxLimits(bar);
    const depth = r.relaxations.find((x) => x.limit === "depth.max")!;
    expect(depth).toMatchObject({ from: 70, to: 80, steps: 1 });
    expect(depth.best.dimensions).toEqual({ b: 100, d: 80 });
    expect(depth.best.massPerMetre).toBeCloseTo((100 * 80 * 7850) / 1e6, 9);
  });
  it("width max 100 → 130 mm at d = 70 (b ≥ 6·1e7/(100·70²) = 122.4 mm)", () => {
    const width = relaxLimits(bar).relaxations.find((x) => x.limit === "width.max")!;
    expect(width).toMatchObject({ from: 100, to: 130, steps: 3 });
    expect(width.best.dimensions).toEqual({ b: 130, d: 70 });
  });
  it("names the limits that cannot help within their bound (a shallower minimum depth)", () => {
    const r = relaxLimits(bar);
    expect(r.unreachable.map((u) => u.limit)).toContain("depth.min");
    expect(r.relaxations.map((x) => x.limit)).not.toContain("depth.min");
    expect(r.partial).toBe(false);
  });
  it("stops when the search budget runs out and says so", () => {
    expect(relaxLimits(bar, { maxSearches: 1 }).partial).toBe(true);
  });
  it("every relaxation is the least step: one step fewer has no feasible section by brute force", () => {
    let checked = 0;
    fc.assert(
      fc.property(
        fc.record({ M: fc.integer({ min: 20, max: 200 }), dmax: fc.integer({ min: 8, max: 20 }), wmax: fc.integer({ min: 6, max: 12 }), sigma: fc.integer({ min: 100, max: 250 }) }),
        ({ M, dmax, wmax, sigma }) => {
          const p = searchProblemSchema.parse({
            moment: { sagging: M, hogging: 0 },
            allowable: { tension: sigma, compression: sigma },
            depth: { min: 100, max: dmax * 10 + 100, step: 20 },
            width: { min: 60, max: wmax * 10 + 60, step: 20 },
            thicknesses: [6, 10],
            families: ["i", "tee"],
            slenderness: { outstand: 12, web: 60 },
          });
          if (bruteForceSearch(p).best) return;
          checked++;
          const r = relaxLimits(p, { maxSteps: 12 });
          for (const x of r.relaxations) {
            if (x.limit !== "depth.max" && x.limit !== "width.max") continue;
            const axis = x.limit.split(".")[0] as "depth" | "width";
            const at = (v: number) => bruteForceSearch({ ...p, [axis]: { ...p[axis], max: v } }).best;
            expect(at(x.to as number)?.area).toBeCloseTo(x.best.area, 9);
            expect(at((x.to as number) - p[axis].step)).toBeNull();
          }
        },
      ),
      { numRuns: 12, seed: 11 },
    );
    // the draws must include infeasible briefs, or the property says nothing
    expect(checked).toBeGreaterThan(3);
  }, 120_000);
});

describe("nearestMisses", () => {
  it("the deepest bar is the least utilised: 100 × 70, σ = 6·1e7/(100·70²) = 122.4 MPa, u = 1.224", () => {
    const [m] = nearestMisses(bar);
    expect(m.dimensions).toEqual({ b: 100, d: 70 });
    expect(m.utilisation).toBeCloseTo(6e7 / (100 * 4900) / 100, 9);
    expect(m.failing.map((c) => c.name).sort()).toEqual(["bending-compression", "bending-tension"]);
  });
  it("is within the bracket of the least utilisation brute force finds over the grid", () => {
    const p = searchProblemSchema.parse({ ...bar, families: ["i", "channel"], depth: { min: 60, max: 120, step: 20 }, width: { min: 40, max: 80, step: 20 }, thicknesses: [4, 6], moment: { sagging: 40, hogging: 0 } });
    expect(bruteForceSearch(p).best).toBeNull();
    const all = bruteForceSearch({ ...p, allowable: { tension: 1e6, compression: 1e6 } });
    // Brute force with the allowables lifted lists every shape's utilisation on the front's far end:
    // the least utilisation over the grid is the front's last (most capable) point, ×1e4 back to 100 MPa.
    const least = Math.min(...all.front.map((c) => c.utilisation)) * 1e4;
    const misses = nearestMisses(p);
    expect(Math.min(...misses.map((m) => m.utilisation))).toBeLessThanOrEqual(least * (1 + 1e-3));
    expect(Math.min(...misses.map((m) => m.utilisation))).toBeGreaterThanOrEqual(least * (1 - 1e-9));
  });
});

describe("whatItWouldTake", () => {
  it("gathers both for an infeasible brief", () => {
    const w = whatItWouldTake(bar);
    expect(w.nearestMisses).toHaveLength(1);
    expect(w.relaxations[0]).toMatchObject({ limit: "depth.max", steps: 1 });
  });
});

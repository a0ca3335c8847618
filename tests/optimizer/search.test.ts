// The search's contract behaviour: grid rules, validity, tie-breaks, objective, extensions,
// progress/abort, and the schema's named rejections (engine contract, SearchProblem).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { bruteForceSearch } from "~/optimizer/brute-force";
import { FAMILY_KERNELS } from "~/optimizer/family-kernel";
import { FAMILIES, FAMILY_DIMENSIONS, familyPlates, familyRuleViolation, type Family } from "~/optimizer/geometry";
import { searchSections } from "~/optimizer/search";
import { CONTRACT_EXAMPLE_PROBLEM, MAX_GRID_CANDIDATES, gridValues, searchProblemSchema, type SearchProblemInput } from "~/optimizer/search-schema";

const base: SearchProblemInput = CONTRACT_EXAMPLE_PROBLEM;

describe("family kernels match geometry.ts", () => {
  const dimsArb = (f: Family) =>
    fc.tuple(...FAMILY_DIMENSIONS[f].map(() => fc.integer({ min: 1, max: 60 }).map((x) => x * 5))).map((xs) => {
      const o: Record<string, number> = {};
      FAMILY_DIMENSIONS[f].forEach((k, i) => (o[k] = xs[i]));
      return o;
    });
  for (const f of FAMILIES) {
    it(`${f}: same validity as familyRuleViolation and, when valid, the same plates`, () => {
      fc.assert(
        fc.property(dimsArb(f), (dims) => {
          const fk = FAMILY_KERNELS[f];
          const v = Float64Array.from(fk.dims, (k) => dims[k]);
          const ok = fk.groupValid(v) && v[fk.free] > fk.freeMin(v) && (fk.second < 0 || v[fk.second] > fk.secondMin(v));
          expect(ok).toBe(familyRuleViolation(f, dims) === null);
          if (!ok) return;
          const plates = new Float64Array(32);
          fk.fill(v, plates);
          const ref = familyPlates(f, dims);
          expect(fk.nPlates).toBe(ref.length);
          ref.forEach((p, i) => expect([...plates.subarray(i * 4, i * 4 + 4)]).toEqual([p.b, p.h, p.z, p.y]));
        }),
        { numRuns: 300, seed: 50713 },
      );
    });
  }
});

describe("the grid (engine contract: values min + k·step, max only when on the grid)", () => {
  it("computes values as products and includes max only when it lands on the grid", () => {
    expect([...gridValues({ min: 100, max: 130, step: 10 })]).toEqual([100, 110, 120, 130]);
    expect([...gridValues({ min: 100, max: 135, step: 10 })]).toEqual([100, 110, 120, 130]);
    // 0.1 + 2·0.1 is 0.30000000000000004 in floating point: still counts as landing on 0.3
    expect(gridValues({ min: 0.1, max: 0.3, step: 0.1 }).length).toBe(3);
    const many = gridValues({ min: 0.1, max: 1000, step: 0.1 });
    expect(many[9999]).toBe(0.1 + 9999 * 0.1); // a product, not 10 000 additions
  });

  it("counts only valid geometry", () => {
    // i with d = 20: tf = 10 leaves no web (d must exceed 2·tf), tf = 5 is valid; b = 10 ≤ tw = 10 is invalid
    const p: SearchProblemInput = {
      moment: { sagging: 0.001 },
      allowable: { tension: 165, compression: 165 },
      depth: { min: 20, max: 20, step: 1 },
      width: { min: 10, max: 30, step: 10 },
      thicknesses: [5, 10],
      families: ["i"],
    };
    // valid (tf, tw, b): tf = 5 only; tw = 5 → b ∈ {10, 20, 30}; tw = 10 → b ∈ {20, 30}: 5 shapes
    expect(searchSections(p).counts.grid).toBe(5);
    expect(bruteForceSearch(p).counts.grid).toBe(5);
  });

  it("reports when no geometry is valid", () => {
    const p: SearchProblemInput = {
      moment: { sagging: 1 },
      allowable: { tension: 165, compression: 165 },
      depth: { min: 20, max: 20, step: 1 },
      width: { min: 50, max: 50, step: 1 },
      thicknesses: [10, 12],
      families: ["i", "box"],
    };
    const r = searchSections(p);
    expect(r.best).toBeNull();
    expect(r.counts.grid).toBe(0);
    expect(r.reason).toMatch(/valid geometry/);
  });
});

describe("objective and tie-breaks", () => {
  it("equal area: the smaller depth wins (rectangle 50 × 80 over 40 × 100)", () => {
    // S = b·d²/6: 40×80 → 42 667 mm³ fails, 50×80 → 53 333 and 40×100 → 66 667 pass S_req = 5e6/100 = 50 000
    const p: SearchProblemInput = {
      moment: { sagging: 5 },
      allowable: { tension: 100, compression: 100 },
      depth: { min: 80, max: 100, step: 20 },
      width: { min: 40, max: 50, step: 10 },
      thicknesses: [10],
      families: ["rectangle"],
    };
    const r = searchSections(p);
    expect(r.best?.dimensions).toEqual({ b: 50, d: 80 });
    expect(r.best?.area).toBe(4000);
    expect(bruteForceSearch(p).best?.dimensions).toEqual({ b: 50, d: 80 });
  });

  it("between families with the same area, the family listed first wins", () => {
    // an i and a channel with the same d, b, tf, tw have the same area and the same Iz and c = d/2
    const p = (families: Family[]): SearchProblemInput => ({ ...base, shear: undefined, slenderness: undefined, families });
    expect(searchSections(p(["channel", "i"])).best?.family).toBe("channel");
    expect(searchSections(p(["i", "channel"])).best?.family).toBe("i");
    const a = searchSections(p(["i", "channel"]));
    expect(a.bestByFamily.i?.area).toBe(a.bestByFamily.channel?.area);
  });

  it("cost objective: least cost per metre, with cost on each candidate", () => {
    const p: SearchProblemInput = {
      ...base,
      families: ["i", "mono-i"],
      objective: "cost",
      // thin plate dear per kg, thick plate cheap (demo prices)
      prices: [6, 8, 10, 12, 15, 20, 25].map((t) => ({ thickness: t, pricePerKg: 3 / t })),
      depth: { min: 200, max: 400, step: 20 },
      width: { min: 100, max: 240, step: 20 },
      thicknesses: [6, 8, 10, 12, 15, 20, 25],
    };
    const fast = searchSections(p);
    const brute = bruteForceSearch(p);
    expect(fast.best?.dimensions).toEqual(brute.best?.dimensions);
    expect(fast.best?.cost).toBeCloseTo(brute.best!.cost!, 9);
    const mass = searchSections({ ...p, objective: "mass" });
    expect(fast.best!.cost!).toBeGreaterThan(0);
    // the mass optimum is never cheaper than the cost optimum
    const costOf = (c: NonNullable<typeof mass.best>) => {
      const r = searchSections({ ...p, depth: { min: c.dimensions.d, max: c.dimensions.d, step: 1 }, families: [c.family] });
      return r.best!.cost!;
    };
    expect(costOf(mass.best!)).toBeGreaterThanOrEqual(fast.best!.cost! * (1 - 1e-12));
    // brute force over 245,784 shapes: about a second alone, several on a shared, loaded machine
  }, 30_000);
});

describe("extensions", () => {
  it("deflection governs a long lightly loaded span and is named", () => {
    const p: SearchProblemInput = {
      moment: { sagging: 20 },
      allowable: { tension: 165, compression: 165 },
      depth: { min: 100, max: 600, step: 10 },
      width: { min: 100, max: 300, step: 10 },
      thicknesses: [6, 8, 10, 12],
      families: ["i"],
      deflection: { span: 9, serviceLoad: 6, limitRatio: 360, E: 200000 },
    };
    const r = searchSections(p);
    expect(r.best?.governing).toBe("deflection");
    expect(r.best?.dimensions).toEqual(bruteForceSearch(p).best?.dimensions);
    const L = 9000;
    const delta = (5 * 6 * L ** 4) / (384 * 200000 * r.best!.properties.Iz);
    expect(delta).toBeLessThanOrEqual(L / 360);
    const check = r.best!.checks.find((c) => c.name === "deflection")!;
    expect(check.demand).toBeCloseTo(delta, 9);
  });

  it("angle (unsymmetric) best agrees with brute force", () => {
    const p: SearchProblemInput = { ...base, families: ["angle"], moment: { sagging: 8, hogging: 3 }, shear: 20 };
    const r = searchSections(p);
    expect(r.best?.dimensions).toEqual(bruteForceSearch(p).best?.dimensions);
  });
});

describe("result shape", () => {
  it("best carries dimensions by the family's names, properties, checks and utilisation", () => {
    const r = searchSections(base);
    const b = r.best!;
    expect(Object.keys(b.dimensions)).toEqual([...FAMILY_DIMENSIONS[b.family]]);
    expect(b.massPerMetre).toBeCloseTo(b.area * 7850e-6, 12);
    expect(b.properties.area).toBeCloseTo(b.area, 9);
    expect(b.utilisation).toBeLessThanOrEqual(1);
    expect(b.checks.find((c) => c.name === b.governing)!.utilisation).toBeCloseTo(b.utilisation, 12);
    expect(Object.keys(r.bestByFamily)).toEqual(base.families);
    for (let i = 1; i < r.front.length; i++) expect(r.front[i].area).toBeGreaterThanOrEqual(r.front[i - 1].area);
  });

  it("splitting the depth range and taking the least of the parts gives the whole search's best", () => {
    const whole = searchSections(base);
    const n = gridValues(base.depth).length;
    const cuts = [0, 7, 19, n];
    const parts = cuts.slice(0, -1).map((from, i) => searchSections(base, { depthIndexRange: [from, cuts[i + 1]] }));
    const areas = parts.map((r) => r.best?.area ?? Infinity);
    expect(Math.min(...areas)).toBe(whole.best!.area);
    expect(parts.reduce((s, r) => s + r.counts.grid, 0)).toBe(whole.counts.grid);
  });
});

describe("explore", () => {
  it("widens the evaluated front without changing the best (a labelled approximation)", () => {
    const plain = searchSections(base, { front: "evaluated" });
    const wide = searchSections(base, { explore: 0.3 });
    expect(wide.frontScope).toBe("evaluated");
    expect(wide.context).toBeUndefined();
    expect(wide.best?.dimensions).toEqual(plain.best?.dimensions);
    expect(wide.front.length).toBeGreaterThan(plain.front.length);
    for (const c of wide.front) {
      expect(c.utilisation).toBeLessThanOrEqual(1);
      expect(c.area).toBeLessThanOrEqual(wide.bestByFamily[c.family]!.area * 1.3 * (1 + 1e-9));
    }
  });
});

describe("progress and abort", () => {
  it("reports shapes settled against the grid, ending at the grid", () => {
    for (const front of ["grid", "evaluated"] as const) {
      const calls: [number, number][] = [];
      const r = searchSections({ ...base, families: ["i", "mono-i", "tee"] }, { front, onProgress: (d, t) => calls.push([d, t]) });
      expect(calls.length).toBeGreaterThan(2);
      for (const [d, t] of calls) {
        expect(t).toBe(r.counts.grid);
        expect(d).toBeGreaterThanOrEqual(0);
        expect(d).toBeLessThanOrEqual(t);
      }
      for (let i = 1; i < calls.length; i++) expect(calls[i][0]).toBeGreaterThanOrEqual(calls[i - 1][0]);
      expect(calls.at(-1)).toEqual([r.counts.grid, r.counts.grid]);
    }
  });

  it("says what it counts besides shapes: families searched to the end and candidates evaluated (issue 11, item 6)", () => {
    for (const front of ["grid", "evaluated"] as const) {
      const details: { familiesDone: number; familiesTotal: number; evaluated: number }[] = [];
      const r = searchSections({ ...base, families: ["i", "mono-i", "tee"] }, { front, onProgress: (_d, _t, detail) => void (detail && details.push(detail)) });
      expect(details.length).toBeGreaterThan(2);
      for (const d of details) {
        expect(d.familiesTotal).toBe(3);
        expect(d.familiesDone).toBeGreaterThanOrEqual(0);
        expect(d.familiesDone).toBeLessThanOrEqual(3);
      }
      for (let i = 1; i < details.length; i++) {
        expect(details[i].familiesDone).toBeGreaterThanOrEqual(details[i - 1].familiesDone);
        expect(details[i].evaluated).toBeGreaterThanOrEqual(details[i - 1].evaluated);
      }
      // the first report comes before any family is done; the last after all are, with the result's own count
      expect(details[0].familiesDone).toBe(0);
      expect(details.at(-1)).toEqual({ familiesDone: 3, familiesTotal: 3, evaluated: r.counts.evaluated });
    }
  });

  it("an aborted signal stops the search with an AbortError", () => {
    const ac = new AbortController();
    ac.abort();
    expect(() => searchSections(base, { signal: ac.signal })).toThrow(/abort/i);
    const ac2 = new AbortController();
    expect(() =>
      bruteForceSearch(base, {
        signal: ac2.signal,
        onProgress: (d) => {
          if (d > 0) ac2.abort();
        },
      }),
    ).toThrow(/abort/i);
  });

  it("aborts promptly mid-search", () => {
    const ac = new AbortController();
    const big: SearchProblemInput = { ...base, families: ["mono-i"], depth: { min: 200, max: 1199, step: 1 }, width: { min: 100, max: 400, step: 1 } };
    // "Promptly" is counted in progress reports, not wall time (a loaded machine makes timings
    // flaky): the search aborted at its first report gives no second one.
    let calls = 0;
    expect(() =>
      searchSections(big, {
        signal: ac.signal,
        onProgress: () => {
          calls++;
          ac.abort();
        },
      }),
    ).toThrow(/abort/i);
    expect(calls).toBe(1);
  });
});

describe("schema rejections name the field", () => {
  const msg = (p: unknown) => {
    const r = searchProblemSchema.safeParse(p);
    expect(r.success).toBe(false);
    return r.success ? "" : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join(" | ");
  };
  it("min > max", () => expect(msg({ ...base, depth: { min: 400, max: 100, step: 10 } })).toMatch(/depth\.max must be ≥ depth\.min/));
  it("empty thickness list", () => expect(msg({ ...base, thicknesses: [] })).toMatch(/thicknesses must list at least one/));
  it("zero or negative step", () => {
    expect(msg({ ...base, width: { min: 50, max: 300, step: 0 } })).toMatch(/width\.step must be > 0/);
    expect(msg({ ...base, depth: { min: 50, max: 300, step: -5 } })).toMatch(/depth\.step must be > 0/);
  });
  it("NaN", () => expect(msg({ ...base, allowable: { ...base.allowable, tension: NaN } })).toMatch(/allowable\.tension/));
  it("negative moments and both zero", () => {
    expect(msg({ ...base, moment: { sagging: -5, hogging: 0 } })).toMatch(/moment\.sagging must be ≥ 0/);
    expect(msg({ ...base, moment: { sagging: 0, hogging: 0 } })).toMatch(/moment: sagging or hogging must be > 0/);
  });
  it("unknown family", () => expect(msg({ ...base, families: ["i", "zed"] })).toMatch(/unknown family "zed"/));
  it("grid over the maximum", () => {
    expect(MAX_GRID_CANDIDATES).toBe(1e11);
    expect(
      msg({ ...base, families: ["mono-i"], depth: { min: 100, max: 10099, step: 1 }, width: { min: 10, max: 1009, step: 1 }, thicknesses: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10] }),
    ).toMatch(/grid: .* over the maximum/);
  });
  it("too many depth × thickness combinations (memory cap)", () => {
    expect(msg({ ...base, families: ["mono-i"], depth: { min: 100, max: 99999, step: 1 }, width: { min: 100, max: 100, step: 1 }, thicknesses: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10] })).toMatch(
      /grid: .* combinations of depth and plate thicknesses/,
    );
  });
  it("cost without prices, and shear without an allowable", () => {
    expect(msg({ ...base, objective: "cost" })).toMatch(/prices are required/);
    expect(msg({ ...base, objective: "cost", prices: [{ thickness: 6, pricePerKg: 1 }] })).toMatch(/no price for thickness 8/);
    expect(msg({ ...base, allowable: { tension: 165, compression: 165 } })).toMatch(/allowable\.shear is required/);
  });
  it("searchSections throws on a bad problem instead of returning NaN", () => {
    expect(() => searchSections({ ...base, depth: { min: 400, max: 100, step: 10 } })).toThrow(/depth\.max must be ≥ depth\.min/);
  });
});

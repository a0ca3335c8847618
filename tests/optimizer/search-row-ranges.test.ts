// The row families' depth ranges (search.ts (R′)): one node per thickness tuple and run of depths,
// bounded over every depth and width at once (the least width the I and plastic-modulus
// requirements at the shallowest depth allow against the capacity at the deepest, the least depth
// that can pass, the depth elements' slenderness, the incumbent's cut), halved when popped and
// expanded into rows when short. Random small problems over the row families with long depth axes
// (so ranges are split several times before single depths) under the allowable, EN 1993 (with a
// restraint: LTB checked) and AISC 360 bases; each compares the best-only search (front "evaluated")
// (also started from known candidates heavier than the best, so the incumbent's cut bites) and the
// grid-front search (the same ranges at the front's dominance cap, (D)) with plain
// enumeration: best, best per family, grid count, the front and the context points, member for member.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { bruteForceSearch } from "~/optimizer/brute-force";
import type { SearchResult } from "~/optimizer/grid";
import { searchSections, searchWithKnown } from "~/optimizer/search";
import { searchProblemSchema, type SearchProblemInput } from "~/optimizer/search-schema";
import { aisc360Arb, en1993Arb, problemArb } from "./search-arbitraries";

const RUNS = Number(process.env.SEARCH_PROPERTY_RUNS ?? 0) || undefined;
const runs = (n: number) => RUNS ?? n;
const id = (c: { family: string; dimensions: Record<string, number> } | null | undefined) => (c ? `${c.family} ${JSON.stringify(c.dimensions)}` : "none");
const members = (xs: SearchResult["front"] | undefined) => (xs ?? []).map(id);
const byFamily = (r: SearchResult) => Object.fromEntries(Object.entries(r.bestByFamily).map(([f, c]) => [f, id(c)]));

/** The families with depth ranges (all row families but the rectangle), those the basis covers. */
const RANGED = ["i", "channel", "tee", "box", "channel-down", "angle"] as const;

/** The problem over 1–3 ranged families: up to 40 depths (ranges of many depths), at most 5 widths. */
const rowArb = (base: fc.Arbitrary<SearchProblemInput>, allowed: readonly string[]) =>
  fc
    .tuple(base, fc.shuffledSubarray([...allowed], { minLength: 1, maxLength: 3 }), fc.integer({ min: 40, max: 500 }), fc.constantFrom(2, 5, 7.5, 10), fc.integer({ min: 3, max: 40 }), fc.integer({ min: 1, max: 5 }))
    .map(([p, families, dMin, dStep, nD, nW]): SearchProblemInput => {
      const w = p.width as { min: number; step: number };
      return {
        ...p,
        families: families as SearchProblemInput["families"],
        depth: { min: dMin, max: dMin + (nD - 1) * dStep, step: dStep },
        width: { min: w.min, max: w.min + (nW - 1) * w.step, step: w.step },
      };
    })
    .filter((p) => searchProblemSchema.safeParse(p).success);

function check(arb: fc.Arbitrary<SearchProblemInput>, seed: number, n: number): void {
  let found = 0;
  fc.assert(
    fc.property(arb, (p) => {
      const brute = bruteForceSearch(p);
      const fast = searchSections(p, { front: "evaluated" });
      expect(id(fast.best)).toBe(id(brute.best));
      expect(byFamily(fast)).toEqual(byFamily(brute));
      expect(fast.counts.grid).toBe(brute.counts.grid);
      // an incumbent heavier than the best before the search starts (the restraint study's known
      // candidates): the ranges' incumbent cut then bites before the best is popped
      const known = searchWithKnown(p, { front: "evaluated" }, brute.front.slice(1, 4));
      expect(id(known.best)).toBe(id(brute.best));
      expect(byFamily(known)).toEqual(byFamily(brute));
      const grid = searchSections(p);
      expect(grid.frontScope).toBe("grid");
      expect(id(grid.best)).toBe(id(brute.best));
      expect(byFamily(grid)).toEqual(byFamily(brute));
      expect(grid.counts.grid).toBe(brute.counts.grid);
      expect(members(grid.front)).toEqual(members(brute.front));
      expect(members(grid.context)).toEqual(members(brute.context));
      if (brute.best) found++;
    }),
    { numRuns: runs(n), seed },
  );
  // the comparison must meet problems with an answer, not only infeasible ones
  expect(found).toBeGreaterThan(runs(n) / 10);
}

const EN_RANGED = RANGED.filter((f) => f !== "channel-down" && f !== "angle");

/** EN 1993 with a restraint always (LTB checked: the rows' (E2) bounds after the ranges'). */
const enLtbArb = fc
  .tuple(
    rowArb(en1993Arb, EN_RANGED),
    fc.double({ min: 0.5, max: 9, noNaN: true }),
    fc.constantFrom({ C1: 1, C2: 0, C3: 1 }, { C1: 1.13, C2: 0.45, C3: 0.525 }, { C1: 1.35, C2: 0.59, C3: 0.411 }),
    fc.constantFrom("top" as const, "shearCentre" as const, "bottom" as const),
  )
  .map(([p, length, f, loadAt]): SearchProblemInput => ({ ...p, restraint: { length, ...f, loadAt } }))
  .filter((p) => searchProblemSchema.safeParse(p).success);

describe("row families' depth ranges against brute force (best only and the grid front)", () => {
  it("allowable stresses", () => check(rowArb(problemArb, RANGED), 7201, 300), 600_000);
  it("EN 1993 with a restraint", () => check(enLtbArb, 7202, 250), 600_000);
  it("EN 1993 as drawn (with or without a restraint, fabrication rules)", () => check(rowArb(en1993Arb, EN_RANGED), 7204, 200), 600_000);
  it("AISC 360", () => check(rowArb(aisc360Arb, EN_RANGED), 7203, 200), 600_000);
});

// Progress (shapes settled, reported every few thousand heap steps) never moves back and ends at the
// grid: a range's children stand for no more shapes than it did. A grid large enough for many
// reports, so no brute force beside it.
it("progress over depth ranges never moves back and ends at the grid", () => {
  for (const front of ["grid", "evaluated"] as const) {
    const calls: [number, number][] = [];
    const r = searchSections(
      {
        moment: { sagging: 300, hogging: 120 },
        shear: 400,
        allowable: { tension: 165, compression: 150, shear: 100 },
        slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 },
        depth: { min: 150, max: 899, step: 1 },
        width: { min: 100, max: 300, step: 2 },
        thicknesses: [6, 8, 10, 12, 15, 20],
        families: ["i", "channel", "box", "tee", "channel-down", "angle"],
      },
      { front, onProgress: (d, t) => void calls.push([d, t]) },
    );
    if (front === "grid") expect(calls.length).toBeGreaterThan(4);
    for (const [d, t] of calls) {
      expect(t).toBe(r.counts.grid);
      expect(d).toBeGreaterThanOrEqual(0);
      expect(d).toBeLessThanOrEqual(t);
    }
    for (let i = 1; i < calls.length; i++) expect(calls[i][0]).toBeGreaterThanOrEqual(calls[i - 1][0]);
    expect(calls.at(-1)).toEqual([r.counts.grid, r.counts.grid]);
  }
}, 60_000);

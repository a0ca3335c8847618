// The incremental front against its definition (engine contract, SearchResult.front):
// the candidates no other beats on both weight and utilisation.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FAMILY_KERNELS } from "~/optimizer/family-kernel";
import { Front, Staircase, compareInFamily, type RawCandidate } from "~/optimizer/front";

const fk = FAMILY_KERNELS.rectangle;
const cand = (obj: number, util: number, i: number): RawCandidate => ({
  fi: 0,
  fk,
  v: Float64Array.of(i, 1),
  objective: obj,
  area: obj,
  utilisation: util,
  governing: 0,
});

describe("front", () => {
  it("keeps exactly the points no other point beats on both (in any insertion order)", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 30 })), { maxLength: 60 }), (pts) => {
        const cs = pts.map(([a, u], i) => cand(a, u / 30, i));
        const f = new Front();
        for (const c of cs) f.offer(c, (x) => x);
        const expected = cs.filter((c) => !cs.some((o) => o.objective < c.objective && o.utilisation < c.utilisation));
        const ids = (xs: RawCandidate[]) => xs.map((x) => x.v[0]).sort((a, b) => a - b);
        expect(ids(f.items)).toEqual(ids(expected));
      }),
      { numRuns: 300, seed: 30211 },
    );
  });

  it("ties in area are settled by depth, then width (rectangle: d before b)", () => {
    const a: RawCandidate = { ...cand(4000, 0.9, 0), v: Float64Array.of(50, 80) }; // b 50, d 80
    const b: RawCandidate = { ...cand(4000, 0.9, 0), v: Float64Array.of(40, 100) }; // b 40, d 100
    expect(compareInFamily(a, b)).toBeLessThan(0);
  });
});

describe("staircase of other parts' front members (search threads' shared front)", () => {
  it("answers minUtilBelow as the least utilisation among the pairs strictly lighter, in any insertion order", () => {
    const pair = fc.tuple(fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 30 }).map((u) => u / 10));
    fc.assert(
      fc.property(fc.array(pair, { maxLength: 40 }), fc.array(fc.integer({ min: 0, max: 32 }), { minLength: 1, maxLength: 10 }), (pairs, queries) => {
        const s = new Staircase();
        for (const [o, u] of pairs) s.add(o, u);
        for (const q of queries) {
          // the definition, by brute force
          const want = Math.min(Infinity, ...pairs.filter(([o]) => o < q).map(([, u]) => u));
          expect(s.minUtilBelow(q)).toBe(want);
        }
      }),
      { numRuns: 300 },
    );
  });
});

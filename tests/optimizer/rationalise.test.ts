// Project rationalisation (integer program) against plain enumeration on small cases.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { candidateThicknesses, rationalise, rationaliseBruteForce, type RationaliseInput } from "~/optimizer/rationalise";

const STOCK = [6, 8, 10, 12, 15, 20];

const candArb = fc
  .record({
    d: fc.integer({ min: 20, max: 60 }).map((x) => x * 10),
    b: fc.integer({ min: 10, max: 30 }).map((x) => x * 10),
    tf: fc.constantFrom(...STOCK),
    tw: fc.constantFrom(...STOCK),
    mass: fc.integer({ min: 200, max: 2000 }).map((x) => x / 10),
  })
  .map((c) => ({ family: "i" as const, dimensions: { d: c.d, b: c.b, tf: c.tf, tw: c.tw }, massPerMetre: c.mass }));

const inputArb = fc.record({
  briefs: fc.array(
    fc.record({
      length: fc.integer({ min: 2, max: 12 }),
      count: fc.integer({ min: 1, max: 6 }),
      candidates: fc.array(candArb, { minLength: 1, maxLength: 5 }),
    }),
    { minLength: 1, maxLength: 5 },
  ),
  k: fc.integer({ min: 1, max: 4 }),
  m: fc.option(fc.integer({ min: 1, max: 3 }), { nil: undefined }),
});

describe("rationalise", () => {
  it("the integer program finds the brute-force optimum, or agrees that none exists", () => {
    fc.assert(
      fc.property(inputArb, ({ briefs, k, m }) => {
        const input: RationaliseInput = {
          briefs: briefs.map((b, i) => ({ id: `B${i + 1}`, ...b })),
          maxThicknesses: k,
          maxDepths: m,
        };
        const ip = rationalise(input);
        const bf = rationaliseBruteForce(input);
        expect(ip.ok).toBe(bf.ok);
        if (ip.ok && bf.ok) {
          expect(ip.totalMass).toBeCloseTo(bf.totalMass, 6);
          expect(ip.thicknesses.length).toBeLessThanOrEqual(k);
          if (m !== undefined) expect(ip.depths.length).toBeLessThanOrEqual(m);
          // the reported total is the sum of its own choices
          expect(ip.totalMass).toBeCloseTo(
            ip.choices.reduce((s, c, i) => s + c.candidate.massPerMetre * input.briefs[i].length * input.briefs[i].count, 0),
            6,
          );
        }
      }),
      { numRuns: 60 },
    );
  });

  it('says "no selection satisfies k" when none does', () => {
    const r = rationalise({
      briefs: [
        { id: "A", length: 5, count: 1, candidates: [{ family: "i", dimensions: { d: 300, b: 150, tf: 10, tw: 6 }, massPerMetre: 30 }] },
        { id: "B", length: 5, count: 1, candidates: [{ family: "i", dimensions: { d: 300, b: 150, tf: 12, tw: 8 }, massPerMetre: 35 }] },
      ],
      maxThicknesses: 3,
    });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/No selection satisfies k = 3/);
  });

  it("trades a heavier member for fewer thicknesses (hand example)", () => {
    // A's lightest uses 8/6, its alternative 10/6; B only 10/6. With k = 2 A must take 10/6.
    const input: RationaliseInput = {
      briefs: [
        {
          id: "A",
          length: 6,
          count: 2,
          candidates: [
            { family: "i", dimensions: { d: 300, b: 150, tf: 8, tw: 6 }, massPerMetre: 28 },
            { family: "i", dimensions: { d: 300, b: 140, tf: 10, tw: 6 }, massPerMetre: 31 },
          ],
        },
        { id: "B", length: 4, count: 1, candidates: [{ family: "i", dimensions: { d: 400, b: 200, tf: 10, tw: 6 }, massPerMetre: 45 }] },
      ],
      maxThicknesses: 2,
    };
    const r = rationalise(input);
    expect(r.ok && r.choices.map((c) => c.index)).toEqual([1, 0]);
    expect(r.ok && r.totalMass).toBe(31 * 12 + 45 * 4);
    const loose = rationalise({ ...input, maxThicknesses: 3 });
    expect(loose.ok && loose.choices.map((c) => c.index)).toEqual([0, 0]);
  });

  it("reads plate thicknesses by the family table (mono-i uses tft, tfb, tw; rectangle its smaller side)", () => {
    expect(candidateThicknesses({ family: "mono-i", dimensions: { d: 500, bt: 200, tft: 12, bb: 250, tfb: 15, tw: 8 } }).sort()).toEqual([12, 15, 8].sort());
    expect(candidateThicknesses({ family: "rectangle", dimensions: { b: 40, d: 200 } })).toEqual([40]);
  });

  it("rejects bad input naming the field", () => {
    expect(() => rationalise({ briefs: [], maxThicknesses: 2 })).toThrow(/briefs must list at least one brief/);
    expect(() => rationalise({ briefs: [{ id: "A", length: 1, count: 1, candidates: [] }], maxThicknesses: 2 })).toThrow(/at least one candidate/);
    expect(() =>
      rationalise({ briefs: [{ id: "A", length: 1, count: 1, candidates: [{ family: "i", dimensions: { d: 1, b: 1, tf: 1, tw: 1 }, massPerMetre: 1 }] }], maxThicknesses: 0 }),
    ).toThrow(/maxThicknesses must be ≥ 1/);
  });
});

// Axis ticks (issue 11, item 10): round values a reader can read off the chart.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { niceTicks } from "~/lib/nice-ticks";

/** step = m·10^k with m in {1, 2, 2.5, 5} */
function isNiceStep(step: number): boolean {
  const k = Math.floor(Math.log10(step) + 1e-9);
  const m = step / 10 ** k;
  return [1, 2, 2.5, 5].some((n) => Math.abs(m - n) < 1e-9);
}

describe("niceTicks", () => {
  test("the sweep chart's utilisation range that used to read 0.80, 0.86, 0.93, 0.99, 1.05", () => {
    expect(niceTicks(0.8, 1.05).ticks).toEqual([0.8, 0.85, 0.9, 0.95, 1, 1.05]);
  });
  test("a mass range in kg/m", () => {
    expect(niceTicks(42.74, 82.9)).toEqual({ domain: [40, 90], ticks: [40, 50, 60, 70, 80, 90], step: 10 });
    expect(niceTicks(42.74, 47.9).ticks).toEqual([42, 44, 46, 48]);
  });
  test("steps of 2.5 keep their decimal", () => {
    expect(niceTicks(0, 10, 5).ticks).toEqual([0, 2.5, 5, 7.5, 10]);
    expect(niceTicks(0, 0.1, 5).ticks).toEqual([0, 0.025, 0.05, 0.075, 0.1]);
  });
  test("one value: widened by 10 % (1 at zero)", () => {
    expect(niceTicks(50, 50).domain[0]).toBeLessThanOrEqual(45);
    expect(niceTicks(50, 50).domain[1]).toBeGreaterThanOrEqual(55);
    expect(niceTicks(0, 0).domain).toEqual([-1, 1]);
  });
  // Ranges a chart meets: the span at least 1e-4 of the values' size (a narrower one is
  // beyond what 12 printed digits can tick).
  test("any range: covered, nice step, whole multiples, no float noise, at most target + 2 ticks", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 1e-4, max: 1e3, noNaN: true }), fc.integer({ min: 3, max: 10 }), (lo, rel, target) => {
        const hi = lo + rel * Math.max(1, Math.abs(lo));
        if (hi === lo) return;
        const { domain, ticks, step } = niceTicks(lo, hi, target);
        expect(domain[0]).toBeLessThanOrEqual(lo);
        expect(domain[1]).toBeGreaterThanOrEqual(hi);
        expect(isNiceStep(step)).toBe(true);
        expect(ticks.length).toBeLessThanOrEqual(target + 2);
        for (let i = 0; i < ticks.length; i++) {
          expect(Math.abs(ticks[i]! / step - Math.round(ticks[i]! / step))).toBeLessThan(1e-6);
          // printed as the step's decimals allow: no 13.624999999999998
          expect(Number(ticks[i]!.toPrecision(12))).toBe(ticks[i]);
          if (i) expect(ticks[i]! - ticks[i - 1]!).toBeCloseTo(step, 9);
        }
      }),
      { seed: 11, numRuns: 500 },
    );
  });
});

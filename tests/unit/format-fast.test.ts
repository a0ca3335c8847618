// formatNumber writes numbers below 1,000 without the Intl formatter (a fast path for the sweep
// page); whatever the number, it must print exactly what the formatter prints.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { formatNumber } from "~/lib/format";

const GROUPED = new Intl.NumberFormat("en-US", { maximumFractionDigits: 6 });
/** The formatter's answer for the numbers the fast path takes (1e-3 ≤ |x| < 1e7, away from the powers-of-ten form). */
const viaIntl = (x: number, significant = 4) => (x < 0 ? "−" : "") + GROUPED.format(Number(Math.abs(x).toPrecision(significant)));

describe("formatNumber's fast path agrees with Intl.NumberFormat", () => {
  test("chosen edges", () => {
    for (const x of [0.001, 0.0012345, 0.5, 1, 9.9995, 42.76, 99.99, 100, 999.94, 999.95, 999.96, -0.25, -12.3456, 0.000999999, 123.456789]) {
      if (Math.abs(x) < 1e-3) continue;
      expect(formatNumber(x), String(x)).toBe(viaIntl(x));
      expect(formatNumber(x, 8), `${x} to 8 figures`).toBe(viaIntl(x, 8));
    }
  });
  test("random numbers from 1e-3 to 1e7 at 1 to 10 significant figures (fast-check, fixed seed)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 9.99e6, noNaN: true }), fc.boolean(), fc.integer({ min: 1, max: 10 }), (a, negative, sig) => {
        const x = negative ? -a : a;
        expect(formatNumber(x, sig)).toBe(viaIntl(x, sig));
      }),
      { seed: 9_008, numRuns: 20_000 },
    );
  });
});

// Weld pricing by throat (app/optimizer/cost.ts): the smallest listed throat at least as large as
// needed; beyond the table, scaled with the throat's square (weld metal ∝ a², common practice).
import { describe, expect, it } from "vitest";
import { MIN_WELD_THROAT, WELD_RUNS, costsSchema, weldCostPerMetre } from "~/optimizer/index";

const table = [
  { throat: 3, perMetre: 4.2 },
  { throat: 5, perMetre: 6.3 },
  { throat: 4, perMetre: 5.1 },
];

describe("weldCostPerMetre", () => {
  it.each([
    [3, 4.2],
    [2, 4.2],
    [3.5, 5.1],
    [4, 5.1],
    [5, 6.3],
    [10, 6.3 * 4],
  ])("throat %s mm costs %s per metre", (a, cost) => {
    expect(weldCostPerMetre(a, table)).toBeCloseTo(cost, 12);
  });
  it("costs nothing when the team prices no welds", () => {
    expect(weldCostPerMetre(6, undefined)).toBe(0);
    expect(weldCostPerMetre(6, [])).toBe(0);
  });
});

describe("costs schema and weld runs", () => {
  it("refuses a throat listed twice, naming it", () => {
    const r = costsSchema.safeParse({ weld: [{ throat: 4, perMetre: 5 }, { throat: 4, perMetre: 6 }] });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.message).toBe("weld: throat 4 mm is listed twice");
  });
  it("two fillets per flange-to-web junction (member-checks.md §2, check 6); the minimum throat 3 mm (EN 1993-1-8 §4.5.2)", () => {
    expect([WELD_RUNS.i, WELD_RUNS["mono-i"], WELD_RUNS.channel, WELD_RUNS.box, WELD_RUNS.tee, WELD_RUNS.rectangle]).toEqual([4, 4, 4, 4, 2, 0]);
    expect(MIN_WELD_THROAT).toBe(3);
  });
});

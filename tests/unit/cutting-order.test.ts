// The printable cutting list's widths ordered, prices and cost against a hand calculation, and
// the record's page furniture escaping whatever a project is called.
import { describe, expect, test } from "vitest";
import { cuttingList, orderCuttingList } from "~/lib/cutting-list";
import { cssString, recordPageCss } from "~/lib/record-document";

// channel d 300, b 100, tf 10, tw 8 as the engine lays it out: a full-depth web 8 × 300 and two
// flange outstands 10 × 92; 6 m, 4 members, ρ = 7850 kg/m³ (the schedule test's fixture)
const list = cuttingList([{ family: "channel", dimensions: { d: 300, b: 100, tf: 10, tw: 8 }, density: 7850, lengthM: 6, count: 4 }]);

describe("widths ordered and cost", () => {
  test("the stock width needing least steel, its price, else the team's price per thickness", () => {
    const stock = [
      { thickness: 10, width: 190, pricePerKg: 1.5 },
      { thickness: 10, width: 100, pricePerKg: 2.0 },
      { thickness: 10, width: 80, pricePerKg: 1.0 }, // narrower than the 92 mm strip: never chosen
      { thickness: 8, width: 1000, pricePerKg: null },
    ];
    const o = orderCuttingList(list, stock, [{ thickness: 8, pricePerKg: 1.2 }]);
    const [web, flange] = [o.groups[0]!.plates[0]!, o.groups[1]!.plates[0]!];
    // flanges, 8 strips of 92: from 190 wide, floor(190/92) = 2 a plate → 4 plates;
    // 0.010 × 0.190 × 6 × 7850 × 4 = 357.96 kg (from 100 wide: 8 plates, 376.8 kg, more)
    expect([flange.orderWidth, flange.orderCount]).toEqual([190, 4]);
    expect(flange.orderMass).toBeCloseTo(357.96, 6);
    expect(flange.cost).toBeCloseTo(357.96 * 1.5, 6);
    // web, 4 strips of 300 from 1000 wide: 3 a plate → 2 plates; 0.008 × 1.0 × 6 × 7850 × 2 = 753.6 kg;
    // no price in the stock list at 8 mm, so the team's 1.2 per kg
    expect([web.orderWidth, web.orderCount, web.pricePerKg]).toEqual([1000, 2, 1.2]);
    expect(web.orderMass).toBeCloseTo(753.6, 6);
    expect(o.totalMass).toBeCloseTo(346.656 + 452.16, 6);
    expect(o.totalOrderMass).toBeCloseTo(357.96 + 753.6, 6);
    expect(o.totalCost).toBeCloseTo(536.94 + 904.32, 6);
    expect(o.unpriced).toBe(0);
  });

  test("no stock list: the cut mass at the team's prices; a thickness without one leaves no total", () => {
    const o = orderCuttingList(list, [], [{ thickness: 10, pricePerKg: 1.1 }]);
    const flange = o.groups[1]!.plates[0]!;
    expect(flange.orderWidth).toBeNull();
    expect(flange.orderMass).toBeCloseTo(346.656, 6);
    expect(flange.cost).toBeCloseTo(346.656 * 1.1, 6);
    expect(o.groups[0]!.cost).toBeNull();
    expect(o.totalCost).toBeNull();
    expect(o.unpriced).toBe(1);
  });
});

describe("record page furniture", () => {
  test("a hostile project name cannot leave its CSS string or the style element", () => {
    const s = cssString('Depot "east"; } </style><script>alert(1)</script> \\');
    expect(s).not.toMatch(/[<>{}]/);
    expect(s.slice(1, -1)).not.toContain('"');
    const css = recordPageCss({ project: "</style><b>", jobNumber: "J-1", mark: "B1", revision: "B", title: "t" });
    expect(css).not.toMatch(/<|>/);
    expect(css).toContain('counter(page) " of " counter(pages)');
    expect(css).toContain("Job J-1");
  });
});

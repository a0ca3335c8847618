// Issue 11, item 10: the trade-off chart's title names what it plots upwards, against utilisation
// across: mass per length, or cost per metre when the brief asked for the cheapest section.
import { expect, test } from "vitest";
import { tradeoffTitle } from "~/components/TradeoffChart";

test("the chart's title follows the objective", () => {
  expect(tradeoffTitle("mass")).toBe("Mass per length against utilisation");
  expect(tradeoffTitle("cost")).toBe("Cost per metre against utilisation");
});

// Issue 11, item 10 as a person sees it: the sweep page's chart has a title that names its axes
// (mass per length against utilisation), axis labels with units in either unit system, round tick
// values, a legend with a line sample for the front and each family's marker, and the candidate
// table draws each row with the very marker the chart uses for that family.
import { expect, inject, test } from "vitest";
import type { Page } from "playwright-core";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();

const base = () => inject("baseUrl");

/** The tick labels of one axis, as numbers (the page's minus sign and thousands commas undone). */
async function ticks(page: Page, axis: "x" | "y"): Promise<number[]> {
  const texts = await page.getByTestId("tradeoff-chart").locator(`.recharts-${axis}Axis-tick-labels .recharts-cartesian-axis-tick-value`).allTextContents();
  return texts.map((t) => Number(t.replace(/−/g, "-").replace(/,/g, "")));
}

/** Evenly spaced, the step 1, 2, 2.5 or 5 × 10^k, and every tick a whole multiple of the step. */
function expectRound(values: number[], what: string) {
  expect(values.length, what).toBeGreaterThanOrEqual(3);
  const step = values[1]! - values[0]!;
  const k = Math.floor(Math.log10(step) + 1e-9);
  const m = step / 10 ** k;
  expect([1, 2, 2.5, 5].some((n) => Math.abs(m - n) < 1e-6), `${what}: step ${step} in ${values.join(", ")}`).toBe(true);
  for (let i = 1; i < values.length; i++) expect(values[i]! - values[i - 1]!, `${what}: ${values.join(", ")}`).toBeCloseTo(step, 6);
  for (const v of values) expect(Math.abs(v / step - Math.round(v / step)), `${what}: ${v} is not a multiple of ${step}`).toBeLessThan(1e-6);
}

/** Each family's marker as drawn: the path, its fill and its outline. */
async function markers(page: Page, scope: string): Promise<Map<string, Set<string>>> {
  const rows = await page.evaluate((sel) => {
    return Array.from(document.querySelectorAll(`${sel} g[data-family]`)).map((g) => {
      const p = g.querySelector("path")!;
      // the path's numbers to 0.01 px: the server's and the browser's path writers differ in the digits they print
      const d = (p.getAttribute("d") ?? "").replace(/-?\d+(\.\d+)?(e-?\d+)?/g, (n) => (Math.round(Number(n) * 100) / 100 || 0).toFixed(2));
      return [g.getAttribute("data-family")!, `${g.getAttribute("data-marker")} d=${d} fill=${p.getAttribute("fill")} stroke=${p.getAttribute("stroke") ?? "none"}`] as const;
    });
  }, scope);
  const out = new Map<string, Set<string>>();
  for (const [f, m] of rows) out.set(f, (out.get(f) ?? new Set()).add(m));
  return out;
}

test("the trade-off chart: title matching its axes, units, round ticks, a legend with the front's line, the table's markers the chart's", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: /Harbour Street cold store/ }).click();
  await eng.waitForURL(/\/projects\/\d+$/);
  const sweepOf = (brief: string) => eng.getByRole("listitem").filter({ hasText: brief }).getByRole("link", { name: /^sweep \d+/ }).getAttribute("href");
  const welded = await sweepOf("Primary beam, grid B");
  const rolledOrWelded = await sweepOf("Edge channel: rolled or welded");
  await eng.goto(`${base()}${welded}`);
  await eng.getByRole("heading", { level: 2, name: "Mass per length against utilisation" }).waitFor();
  const chart = eng.getByTestId("tradeoff-chart");
  await chart.locator(".recharts-scatter path.recharts-symbols").first().waitFor();

  // Axis labels with their units: mass upwards, utilisation across (the title's order).
  const svgText = (await chart.locator("svg.recharts-surface").first().textContent()) ?? "";
  expect(svgText).toContain("Mass per length (kg/m)");
  expect(svgText).toContain("Utilisation (demand ÷ capacity)");
  await expect(chart.getAttribute("aria-label")).resolves.toBe("Chart: mass per length against utilisation");

  // Round ticks, and the utilisation axis reaches the limit 1.
  const x = await ticks(eng, "x");
  const y = await ticks(eng, "y");
  expectRound(x, "utilisation ticks");
  expectRound(y, "mass ticks");
  expect(x[x.length - 1]).toBeGreaterThanOrEqual(1);

  // The legend: a line sample for the front, each family on the chart with its marker, the limit.
  const legend = eng.getByTestId("chart-legend");
  await expect(legend.locator('[data-legend="front"] svg line').count()).resolves.toBe(1);
  await expect(legend.locator('[data-legend="front"]').textContent()).resolves.toMatch(/^Front/);
  await expect(legend.locator('[data-legend="limit"]').textContent()).resolves.toMatch(/Utilisation 1/);
  const onChart = await markers(eng, '[data-testid="tradeoff-chart"] svg.recharts-surface');
  const inLegend = await markers(eng, '[data-testid="chart-legend"]');
  expect(onChart.size).toBeGreaterThanOrEqual(2);
  expect([...inLegend.keys()].sort()).toEqual([...onChart.keys()].sort());
  for (const [f, m] of onChart) expect([...m], `family ${f}: one marker on the chart`).toHaveLength(1);
  for (const [f, m] of inLegend) expect([...m], `family ${f}: the legend's marker is the chart's`).toEqual([...onChart.get(f)!]);
  // Different families, different marker shapes.
  const shapes = [...onChart.values()].map((m) => [...m][0]!.split(" ")[0]);
  expect(new Set(shapes).size).toBe(shapes.length);

  // The table: every row's marker is the chart's marker for that family.
  const inTable = await markers(eng, '[data-testid="candidate-table"]');
  expect(inTable.size).toBeGreaterThanOrEqual(1);
  for (const [f, m] of inTable) {
    expect(onChart.has(f), `the table's family ${f} is on the chart`).toBe(true);
    expect([...m], `family ${f}: the table's marker is the chart's`).toEqual([...onChart.get(f)!]);
  }
  await screenshot(eng, "chart-si");

  // US customary: the mass axis says lb/ft, and its ticks are still round.
  await eng.locator("label", { hasText: "US customary" }).first().click();
  await expect.poll(async () => (await chart.locator("svg.recharts-surface").first().textContent()) ?? "").toContain("Mass per length (lb/ft)");
  expectRound(await ticks(eng, "y"), "mass ticks (lb/ft)");
  await screenshot(eng, "chart-us");

  // A brief that asks for the cheapest of rolled or welded sections: cost upwards, and the
  // table's filled (rolled) and outlined (welded) markers are the chart's.
  await eng.goto(`${base()}${rolledOrWelded}`);
  await eng.getByRole("heading", { level: 2, name: "Cost per metre against utilisation" }).waitFor();
  await chart.locator(".recharts-scatter path.recharts-symbols").first().waitFor();
  await expect(chart.locator("svg.recharts-surface").first().textContent()).resolves.toContain("Cost per metre");
  expectRound(await ticks(eng, "y"), "cost ticks");
  expectRound(await ticks(eng, "x"), "utilisation ticks (cost)");
  await expect(legend.locator('[data-legend="front"] svg line').count()).resolves.toBe(1);
  const costChart = await markers(eng, '[data-testid="tradeoff-chart"] svg.recharts-surface');
  const costTable = await markers(eng, '[data-testid="candidate-table"]');
  const all = (m: Map<string, Set<string>>) => new Set([...m.values()].flatMap((s) => [...s]));
  expect([...all(costChart)].some((m) => m.includes("-outline")), "welded drawn as outlines").toBe(true);
  expect([...all(costChart)].some((m) => !m.includes("-outline")), "rolled drawn filled").toBe(true);
  for (const m of all(costTable)) expect(all(costChart).has(m), `the table's marker ${m} is on the chart`).toBe(true);
  await screenshot(eng, "chart-cost");
});

// Issue 15: the chart's context points. The filter draws each family's lightest at every depth of a
// chosen family and depth range (the sweep stored them from the search's own pass), every one of
// them, with the whole grid's front kept as the line; "All stored candidates" brings the sample back.
test("the chart's family and depth filter draws every lightest-per-depth point that matches", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: /Harbour Street cold store/ }).click();
  await eng.waitForURL(/\/projects\/\d+$/);
  const href = await eng.getByRole("listitem").filter({ hasText: "Primary beam, grid B" }).getByRole("link", { name: /^sweep \d+/ }).getAttribute("href");
  await eng.goto(`${base()}${href}`);
  const chart = eng.getByTestId("tradeoff-chart");
  await chart.locator(".recharts-scatter path.recharts-symbols").first().waitFor();
  const id = href!.split("/").pop();
  // what the API holds for the filter (the same session's cookies)
  const families = await eng.getByTestId("chart-filter").locator('select[name="chartFamily"] option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value).filter(Boolean));
  expect(families.length).toBeGreaterThanOrEqual(1);
  const family = families[0]!;
  const all = (await (await eng.request.get(`${base()}/api/v1/sweeps/${id}/candidates?depthBest=true&family=${family}&pageSize=500`)).json()) as { total: number; items: { dimensions: { d: number } }[] };
  expect(all.total).toBeGreaterThan(2);
  const ds = all.items.map((c) => c.dimensions.d).sort((a, b) => a - b);
  const lo = ds[1]!,
    hi = ds[ds.length - 2]!;
  const want = ds.filter((d) => d >= lo && d <= hi).length;

  const filter = eng.getByTestId("chart-filter");
  await filter.locator('select[name="chartFamily"]').selectOption(family);
  await filter.locator('input[name="chartDepthFrom"]').fill(String(lo));
  await filter.locator('input[name="chartDepthTo"]').fill(String(hi));
  await filter.getByRole("button", { name: "Show the lightest at each depth" }).click();
  await expect.poll(async () => (await chart.locator("figcaption").textContent()) ?? "").toContain(`lightest section at every depth of the grid from ${lo} to ${hi} mm deep (${want} points)`);
  // every marker drawn is that family's, one per depth in the range, and the front's line stays
  const drawn = await chart.locator("svg.recharts-surface g[data-family]").evaluateAll((gs) => gs.map((g) => g.getAttribute("data-family")));
  expect(drawn).toHaveLength(want);
  expect(new Set(drawn)).toEqual(new Set([family]));
  await expect(chart.locator(".recharts-scatter .recharts-curve").count()).resolves.toBeGreaterThanOrEqual(1);
  await screenshot(eng, "chart-filter");

  // back to the stored candidates
  await filter.getByRole("button", { name: "All stored candidates" }).click();
  await expect.poll(async () => (await chart.locator("figcaption").textContent()) ?? "").toContain("the stored candidates");
});

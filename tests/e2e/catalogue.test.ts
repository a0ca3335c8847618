// Rolled beside welded in the browser (issue 13): the demo engineer writes a brief that searches
// the team's starter catalogue beside the channel family, runs it, reads the rolled-and-welded
// answers (the side-by-side panel, filled and outlined chart series, the table marking each row),
// and saves a rolled channel as an option, whose page and record name it by its designation and
// check it by the rolled rules. Screenshots go to tests/artifacts/screenshots.
import { expect, test } from "vitest";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();

test("a brief with the starter catalogue: sweep, rolled and welded apart, a rolled channel saved as an option", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  const errors: string[] = [];
  eng.on("pageerror", (e) => errors.push(e.message));

  await eng.getByRole("link", { name: "New project" }).click();
  await eng.getByLabel("Project name").fill("Edge beams, rolled or welded (browser test)");
  await eng.getByRole("button", { name: "Create project" }).click();
  await eng.getByRole("heading", { level: 1, name: /Edge beams, rolled or welded/ }).waitFor();
  await eng.getByRole("link", { name: "New brief" }).click();
  await eng.getByLabel("Brief name").fill("Edge channel, rolled or welded");
  await eng.getByLabel(/^Allowable stresses/).check();
  await eng.getByLabel(/^Sagging moment/).fill("45");
  await eng.getByLabel(/^Shear force/).fill("40");
  await eng.getByLabel(/^Tension/).fill("165");
  await eng.getByLabel(/^Compression/).fill("165");
  await eng.getByLabel(/^Shear \(/).fill("100");
  await eng.getByLabel(/Depth, max/).fill("300");
  await eng.getByLabel(/Width, max/).fill("150");

  // The catalogue choice: the team's starter catalogue, channels only.
  const choice = eng.getByTestId("catalogue-choice");
  await choice.getByLabel(/European rolled sections/).check();
  await choice.getByLabel("I or H section, parallel flanges").uncheck();
  await expect(choice.getByLabel("channel, parallel flanges").isChecked()).resolves.toBe(true);
  await screenshot(eng, "catalogue-brief");

  await eng.getByRole("button", { name: "Save and run" }).click();
  await eng.waitForURL(/\/sweeps\/\d+$/);
  await eng.getByRole("heading", { name: /against utilisation$/ }).waitFor({ timeout: 90_000 });

  // Rolled and welded side by side: the lightest of each.
  const panel = eng.getByTestId("rolled-and-welded");
  await panel.waitFor();
  await expect(panel.getByTestId("welded-row").textContent()).resolves.toMatch(/Welded from plate.*Channel.*welded ·/);
  await expect(panel.getByTestId("rolled-row").textContent()).resolves.toMatch(/Rolled \(catalogue\).*UPE \d+.*rolled channel/);
  await expect(panel.textContent()).resolves.toMatch(/Lightest overall: (rolled|welded)\./);

  // The chart: welded and rolled as their own series (outlined and filled markers).
  const legend = eng.getByTestId("chart-legend");
  await expect(legend.textContent()).resolves.toMatch(/Channel \(welded\)/);
  await expect(legend.textContent()).resolves.toMatch(/Channel \(rolled\)/);
  // the outlined series' name is readable (not printed in its white fill)
  await expect(legend.getByText("Channel (welded)").evaluate((el) => getComputedStyle(el).color)).resolves.not.toBe("rgb(255, 255, 255)");
  await expect(eng.getByText(/catalogue \(rolled\) sections as filled markers, welded plate sections as outlines/).count()).resolves.toBe(1);

  // The table names rolled rows by designation; rolled rows rank after the welded ones, so rank
  // descending (one click on the column it is sorted by) brings them first, fetched from the API.
  const table = eng.getByTestId("candidate-table");
  await expect(table.locator("thead").textContent()).resolves.toMatch(/Section/);
  await expect(table.locator("tbody tr").first().textContent()).resolves.toMatch(/welded/);
  await table.getByRole("button", { name: /^Rank/ }).click();
  await table.locator("thead th[aria-sort='descending']").filter({ hasText: "Rank" }).waitFor();
  const first = table.locator("tbody tr").first();
  await first.filter({ hasText: /UPE \d+/ }).waitFor();
  await expect(first.textContent()).resolves.toMatch(/UPE \d+.*rolled channel/);
  const designation = (await first.textContent())!.match(/UPE \d+/)![0];
  // the brief's 300 mm depth limit holds for rolled sections too (a UPE's number is its depth)
  expect(Number(designation.slice(4))).toBeLessThanOrEqual(300);
  const panelRolled = (await panel.getByTestId("rolled-row").textContent())!.match(/UPE (\d+)/)![1];
  expect(Number(panelRolled)).toBeLessThanOrEqual(300);
  await first.click();
  await expect(eng.getByTestId("selected").textContent()).resolves.toMatch(new RegExp(`${designation} \\(rolled channel\\)`));
  await screenshot(eng, "catalogue-sweep");

  // Save it as an option: its page names it and checks it by the rolled rules.
  await eng.getByPlaceholder("why this one").fill("Rolled: no welding on site");
  await eng.getByRole("button", { name: "Save as option" }).click();
  await eng.waitForURL(/\/options\/\d+$/);
  await eng.getByTestId("comparison").getByRole("heading", { name: new RegExp(`${designation} \\(rolled channel\\)`) }).waitFor();
  await expect(eng.getByText("This section fails its own brief's checks").count()).resolves.toBe(0);
  await screenshot(eng, "catalogue-option");

  await eng.getByRole("link", { name: "Calculation record" }).click();
  await eng.waitForURL(/\/options\/\d+\/record$/);
  await eng.getByRole("heading", { level: 1, name: /^Calculation record/ }).waitFor();
  await expect(eng.locator("main").textContent()).resolves.toMatch(new RegExp(`${designation} \\(rolled, from European rolled sections`));
  expect(errors).toEqual([]);
}, 180_000);

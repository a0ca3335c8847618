// Issue 11, item 9 as a person sees it: on a finished sweep's page, "Lightest at each depth" lists
// each family's lightest section at a chosen grid depth from what the sweep stored, worked by
// keyboard alone (a depth, a family, Show), with the depth and mass units shown in either unit
// system and an empty state for a depth where nothing passes. The demo brief "Primary beam, grid B"
// (db/seeds/02_demo_projects.ts): at 150 mm no section passes, at 300 mm the channel, I and box
// do and the tee does not (the engine's depthBests on that brief).
import { expect, inject, test } from "vitest";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();
const base = () => inject("baseUrl");

test("lightest at each depth: keyboard, units, empty state, and selecting a row", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: /Harbour Street cold store/ }).click();
  await eng.waitForURL(/\/projects\/\d+$/);
  const href = await eng.getByRole("listitem").filter({ hasText: "Primary beam, grid B" }).getByRole("link", { name: /^sweep \d+/ }).getAttribute("href");
  await eng.goto(`${base()}${href}`);
  const panel = eng.getByTestId("depth-bests");
  await panel.getByRole("heading", { name: "Lightest at each depth" }).waitFor();

  // Keyboard only: the depth by typing its first digits, Tab to the family, Tab to Show, Enter.
  const depth = panel.getByLabel("Depth (mm)");
  await depth.focus();
  await eng.keyboard.type("300");
  expect(await depth.inputValue()).toBe("300");
  await eng.keyboard.press("Tab");
  expect(await eng.evaluate(() => (document.activeElement as HTMLSelectElement | null)?.name)).toBe("family");
  await eng.keyboard.press("Tab");
  await eng.keyboard.press("Enter");
  await eng.waitForURL(/[?&]depth=300(&|$)/);
  const table = panel.getByTestId("depth-table");
  await table.getByText("Lightest at 300 mm").waitFor();
  // focus stayed on the button the keyboard pressed
  expect(await eng.evaluate(() => document.activeElement?.textContent)).toBe("Show");
  expect(await table.getByRole("columnheader").allTextContents()).toEqual(expect.arrayContaining(["Mass (kg/m)", "Utilisation", "Governing check"]));
  for (const f of ["channel", "i", "box"]) {
    const row = table.locator(`tr[data-family="${f}"]`);
    await expect(row.locator("td").nth(1).textContent()).resolves.toMatch(/^d 300, .* mm$/);
    expect(Number(await row.locator("td").nth(2).textContent())).toBeGreaterThan(40);
  }
  await expect(table.locator('tr[data-family="tee"]').textContent()).resolves.toContain("None of this family at 300 mm passes every check");
  await screenshot(eng, "depth-control-300");

  // The I at 300 mm, selected from here: the page's selection shows it (to compare or save).
  await table.getByRole("button", { name: /^Select I \(equal flanges\) #\d+$/ }).press("Enter");
  await expect(eng.getByTestId("selected").textContent()).resolves.toMatch(/I \(equal flanges\) d 300/);

  // A depth where nothing passes, for one family: an empty state that says so.
  await depth.focus();
  await eng.keyboard.type("150");
  await eng.keyboard.press("Tab");
  await eng.keyboard.type("I");
  expect(await panel.getByLabel("Family").inputValue()).toBe("i");
  await eng.keyboard.press("Tab");
  await eng.keyboard.press("Enter");
  await eng.waitForURL(/depth=150&family=i/);
  await expect(panel.getByTestId("depth-empty").textContent()).resolves.toMatch(/No feasible section of the family “I \(equal flanges\)” at 150 mm: every shape of that depth on the grid fails a check/);

  // US customary: the same control speaks inches and lb/ft.
  await eng.locator("label", { hasText: "US customary" }).first().click();
  await panel.getByLabel("Depth (in)").waitFor();
  await expect(panel.getByTestId("depth-empty").textContent()).resolves.toMatch(/at 5\.9\d* in/);
  await eng.goto(`${base()}${href}?depth=300`);
  await eng.locator("label", { hasText: "US customary" }).first().click();
  await expect(panel.getByTestId("depth-table").getByRole("columnheader", { name: "Mass (lb/ft)" }).count()).resolves.toBe(1);
  await expect(panel.getByTestId("depth-table").locator("caption").textContent()).resolves.toMatch(/^Lightest at 11\.8\d* in$/);
  await screenshot(eng, "depth-control-us");

  // A depth off the grid, typed into the address: the field's message, not an error page.
  await eng.goto(`${base()}${href}?depth=305`);
  await expect(panel.getByText(/305 mm is not on this sweep's depth grid/).count()).resolves.toBe(1);
});

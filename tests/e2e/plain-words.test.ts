// Issue 11, items 5 and 7 as a person sees them: form errors in words beside their fields (a text
// in one number field does not hide the others); no field paths or engine names on the pages; a
// brief with no feasible section shows each family's nearest miss and what it would take, and
// offers no empty CSV.
import { expect, test } from "vitest";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();

/** A field path as the engine writes them ("moment.sagging", "plates[3]"), or an engine family or check name. */
const RAW = /\b(moment|allowable|depth|width|deflection|slenderness|steel|restraint|supports|fabrication)\.[a-z]|\b[a-z]+\[\d+\]|objective "|\bbending-(compression|tension)\b|\bchannel-down\b|\bmono-i\b/;

test("errors in words beside their fields; no feasible section shows nearest misses and what it would take", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: "New project" }).click();
  await eng.getByLabel("Project name").fill("Cold store gantry (plain words test)");
  await eng.getByRole("button", { name: "Create project" }).click();
  await eng.getByRole("heading", { level: 1, name: /Cold store gantry/ }).waitFor();
  await eng.getByRole("link", { name: "New brief" }).click();
  await eng.getByLabel("Brief name").fill("Gantry rail beam");
  await eng.getByLabel(/^Restraint length/).fill("3");

  // Item 5: a text in one number field and a wrong range elsewhere: both errors show, each by its field.
  await eng.getByLabel(/^Sagging moment/).fill("lots");
  await eng.getByLabel(/Depth, max/).fill("50");
  await eng.getByRole("button", { name: "Save brief" }).click();
  const sagErr = eng.locator(`[id="${(await eng.getByLabel(/^Sagging moment/).getAttribute("aria-describedby"))!.split(" ")[0]}"]`);
  await expect(sagErr.textContent()).resolves.toBe("Sagging moment must be a number");
  await eng.getByText("Depth, max must be ≥ depth, min").waitFor();
  const form = (await eng.locator("form").first().textContent()) ?? "";
  expect(form).not.toMatch(RAW);
  await screenshot(eng, "plain-words-errors");

  // Item 7: 6 and 8 mm plates only: every section is too slender (class 4) under EN 1993.
  await eng.getByLabel(/^Sagging moment/).fill("60");
  await eng.getByLabel(/Depth, max/).fill("300");
  await eng.getByLabel(/^Plate thicknesses/).fill("6, 8");
  await eng.getByRole("button", { name: "Save and run" }).click();
  await eng.waitForURL(/\/sweeps\/\d+$/);
  await eng.getByTestId("no-feasible").waitFor({ timeout: 120_000 });
  await eng.getByTestId("advice").waitFor();
  const misses = (await eng.getByTestId("nearest-misses").textContent()) ?? "";
  expect(misses).toContain("Channel");
  expect(misses).toMatch(/1\.\d{3}/);
  const relax = (await eng.getByTestId("relaxations").textContent()) ?? "";
  // the engine's smallest changes: one more plate, closer restraints, a deeper limit (each alone)
  expect(relax).toMatch(/add plate thickness 10 mm gives a Channel at [\d.]+ kg\/m/);
  expect(relax).toMatch(/Depth, max 300 mm → \d+ mm gives a Channel/);
  await expect(eng.getByRole("link", { name: /Download candidates/ }).count()).resolves.toBe(0);
  const page = (await eng.locator("main").textContent()) ?? "";
  expect(page).not.toMatch(RAW);
  await screenshot(eng, "plain-words-no-feasible");
});

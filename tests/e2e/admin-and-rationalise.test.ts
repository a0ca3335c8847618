// Two pages the workflow story does not pass through: the admin's team materials (which then
// appear in the brief editor's presets) and the project page's rationalisation panel, run on the
// demo project seeded with finished sweeps. Screenshots go to tests/artifacts/screenshots.
import { expect, test } from "vitest";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();

test("an admin adds a team material: a unit slip is refused naming the field, then it is listed", async () => {
  const admin = await signIn("admin@tallowfield.example", "/admin/materials");
  await admin.getByLabel("Name").fill("Browser-test alloy 6082");
  // 70 typed in GPa instead of MPa: the page refuses it and names E.
  await admin.getByLabel("E, elastic modulus (MPa)").fill("70");
  await admin.getByLabel("fy, yield strength (MPa)").fill("250");
  await admin.getByLabel("Density (kg/m³)").fill("2700");
  await admin.getByRole("button", { name: "Add material" }).click();
  await admin.getByText(/E: must be between/).first().waitFor();
  await admin.getByLabel("E, elastic modulus (MPa)").fill("70000");
  await admin.getByRole("button", { name: "Add material" }).click();
  await admin.getByRole("button", { name: "Delete Browser-test alloy 6082" }).waitFor();
  await screenshot(admin, "admin-materials");
  await admin.context().close();
});

test("an engineer rationalises the demo project's plate thicknesses; k = 0 is refused naming k", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: "Harbour Street cold store: mezzanine" }).first().click();
  await eng.getByRole("heading", { name: "Rationalise plate thicknesses" }).waitFor();
  await eng.getByLabel("k, most plate thicknesses").fill("0");
  await eng.getByRole("button", { name: "Rationalise" }).click();
  await eng.getByRole("alert").filter({ hasText: /^k / }).waitFor();
  await eng.getByLabel("k, most plate thicknesses").fill("3");
  await eng.getByRole("button", { name: "Rationalise" }).click();
  await eng.getByText("Plate thicknesses used").waitFor();
  await expect(eng.getByText(/Total mass \(k = 3\)/).count()).resolves.toBe(1);
  await eng.locator("#rationalise").scrollIntoViewIfNeeded();
  await screenshot(eng, "project-rationalise");
  await eng.context().close();
});

// An EN 1993 brief in the browser (issue 10): the floor beam unrestrained over 6 m (120 kN·m,
// 150 kN, depth ≤ 450 mm, S355, uniform load on the top flange). The new brief starts on the
// EN 1993 basis; the engineer states the restraint length, runs it, and the sweep page shows
// the section's class, Mcr and χLT, the restraint study and the EN 1993 caution; the option's
// calculation record works the checks through. Screenshots go to tests/artifacts/screenshots.
import { expect, test } from "vitest";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();

test("EN 1993 floor beam: brief → sweep with class, Mcr, χLT and the restraint study → record", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: "New project" }).click();
  await eng.getByLabel("Project name").fill("Office floor (browser test, EN 1993)");
  await eng.getByRole("button", { name: "Create project" }).click();
  await eng.getByRole("heading", { level: 1, name: /Office floor/ }).waitFor();
  await eng.getByRole("link", { name: "New brief" }).click();

  // A new brief is on the EN 1993 basis with the S355 preset; the allowables are hidden.
  await expect(eng.getByLabel(/^EN 1993 limit states/).isChecked()).resolves.toBe(true);
  await expect(eng.getByLabel("Grade (preset)").inputValue()).resolves.toBe("S355");
  await expect(eng.getByLabel(/^Band 1: fy/).inputValue()).resolves.toBe("355");
  await expect(eng.getByLabel(/^Tension/).isVisible()).resolves.toBe(false);

  await eng.getByLabel("Brief name").fill("Floor beam, 6 m unrestrained");
  await eng.getByLabel(/^Sagging moment/).fill("120");
  await eng.getByLabel(/^Shear force/).fill("150");
  await eng.getByLabel(/Depth, min/).fill("200");
  await eng.getByLabel(/Depth, max/).fill("450");
  await eng.getByLabel("I (equal flanges)").check();
  await eng.getByLabel("Channel", { exact: true }).uncheck();

  // The restraint length is the engineer's to state: without it the message sits by the field.
  await eng.getByRole("button", { name: "Save and run" }).click();
  await eng.getByText(/enter the longest distance between lateral restraints/).first().waitFor();
  await eng.getByLabel(/^Restraint length/).fill("6");
  // The moment-diagram preset fills C1, C2, C3 (ENV 1993-1-1 Annex F, mem.); the load sits on the top flange.
  await eng.getByLabel("Moment diagram over that length").selectOption("point-simple");
  await expect(eng.getByLabel(/^C1/).inputValue()).resolves.toBe("1.365");
  await eng.getByLabel("Moment diagram over that length").selectOption("udl-simple");
  await expect(eng.getByLabel(/^C1/).inputValue()).resolves.toBe("1.132");
  await expect(eng.getByLabel("Where the load is applied").inputValue()).resolves.toBe("top");
  // A grade preset fills the bands (S275: 275 MPa up to 16 mm), and back to S355.
  await eng.getByLabel("Grade (preset)").selectOption("S275");
  await expect(eng.getByLabel(/^Band 1: fy/).inputValue()).resolves.toBe("275");
  await eng.getByLabel("Grade (preset)").selectOption("S355");
  await eng.getByTestId("grid-size").waitFor();
  await screenshot(eng, "basis-brief");

  await eng.getByRole("button", { name: "Save and run" }).click();
  await eng.waitForURL(/\/sweeps\/\d+$/);
  await eng.getByRole("heading", { name: /against utilisation$/ }).waitFor({ timeout: 120_000 });

  // The lightest section with the engine's EN 1993 figures, and the basis-specific caution.
  const bestDesign = await eng.getByTestId("best-design").textContent();
  expect(bestDesign).toMatch(/Class [123]/);
  expect(bestDesign).toMatch(/Mcr [\d.,]+ kN·m/);
  expect(bestDesign).toMatch(/χLT 0\.\d+/);
  expect(bestDesign).toMatch(/weld throat a = \d+ mm/);
  await expect(eng.getByTestId("basis-note").first().textContent()).resolves.toContain("EN 1993 limit states");
  const caution = await eng.getByRole("note", { name: "Caution" }).first().textContent();
  expect(caution).toContain("On the EN 1993 basis its checks cover only cross-section class");
  expect(caution).toMatch(/do not cover web crippling or bearing at supports/);
  // The candidate table carries the class, Mcr, χLT and weld columns.
  await expect(eng.getByTestId("candidate-table").locator("thead").textContent()).resolves.toMatch(/Class.*Mcr.*χLT.*Weld a/);
  // The restraint study: 0 … 5 intermediate restraints, charted and tabled.
  await eng.getByTestId("restraint-study").scrollIntoViewIfNeeded();
  await expect(eng.getByTestId("restraint-study-table").locator("tbody tr").count()).resolves.toBe(6);
  // with the C1 each spacing used: the brief's at L, 1.0 (uniform moment) between restraints
  await expect(eng.getByTestId("restraint-study-table").locator("thead").textContent()).resolves.toMatch(/Spacing\s*Moment factor C1/);
  await expect(eng.getByTestId("restraint-study-table").locator('td[data-col="c1"]').allTextContents()).resolves.toEqual(["1.132", "1", "1", "1", "1", "1"]);
  await expect(eng.getByTestId("restraint-study").locator("figcaption").textContent()).resolves.toContain("C1 is the brief's at L (1.132) and 1.0 between intermediate restraints");
  await eng.locator('[data-testid="restraint-study"] .recharts-line-dot, [data-testid="restraint-study"] .recharts-dot').first().waitFor();
  await screenshot(eng, "basis-sweep");

  // Save the lightest and open its calculation record.
  await eng.getByTestId("candidate-table").locator("tbody tr").first().click();
  await eng.getByPlaceholder("why this one").fill("Lightest that carries the load unrestrained");
  await eng.getByRole("button", { name: "Save as option" }).click();
  await eng.waitForURL(/\/options\/\d+$/);
  await expect(eng.getByTestId("design-class").first().textContent()).resolves.toMatch(/^[123]$/);
  await eng.getByRole("link", { name: "Calculation record" }).click();
  await eng.getByTestId("record-en1993").waitFor();
  await expect(eng.getByTestId("record-section-class").textContent()).resolves.toMatch(/class [123]/);
  await expect(eng.getByTestId("record-fy").textContent()).resolves.toMatch(/fy = 355 MPa/);
  await expect(eng.getByTestId("record-mcr").textContent()).resolves.toMatch(/Mcr = 1\.132 × π² × 210,000 .* = [\d.,]+ kN·m/);
  await expect(eng.getByTestId("record-chi").textContent()).resolves.toMatch(/χLT = min\(1, 1\/\(ΦLT \+ √\(ΦLT² − λLT²\)\)\) = .* = 0\.\d+/);
  await expect(eng.getByTestId("record-weld").textContent()).resolves.toMatch(/a = \d+ mm/);
  await expect(eng.getByTestId("record-supports").textContent()).resolves.toContain("bearing stiffeners are required");
  const recordCaution = await eng.getByRole("note", { name: "Caution" }).first().textContent();
  expect(recordCaution).toContain("EN 1993 basis");
  await eng.emulateMedia({ media: "print" });
  await screenshot(eng, "basis-record");
});

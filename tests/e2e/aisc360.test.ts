// An AISC 360-16 brief in the browser (issue 14, done-when): a US-unit brief on AISC 360 (ASD) for a
// beam unbraced over 20 ft (60 kip·ft, 25 kips, A572 Gr 50 plate), Cb offered from the moment
// diagram by Eq. F1-1; the saved section's calculation record shows its Chapter F section, the LTB
// zone with Lp and Lr, Mn/Ω and the G2 shear check. Screenshots go to tests/artifacts/screenshots.
import { expect, test } from "vitest";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();

test("AISC 360 ASD, US units, 20 ft unbraced: record shows the Chapter F zone, Lp, Lr, Mn/Ω and G2", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: "New project" }).click();
  await eng.getByLabel("Project name").fill("Warehouse mezzanine (browser test, AISC 360)");
  await eng.getByRole("button", { name: "Create project" }).click();
  await eng.getByRole("heading", { level: 1, name: /Warehouse mezzanine/ }).waitFor();
  await eng.getByRole("link", { name: "New brief" }).click();

  await eng.getByText("US customary (in, kip·ft, ksi)").first().click();
  await eng.getByLabel(/^AISC 360-16/).check();
  await eng.getByLabel(/^ASD: allowable strength design/).check();
  await expect(eng.getByLabel("ASTM plate grade").inputValue()).resolves.toBe("A572 Gr 50");
  await expect(eng.getByLabel(/^Yield stress Fy/).inputValue()).resolves.toBe("50");
  await expect(eng.getByLabel(/^Tension/).isVisible()).resolves.toBe(false);

  await eng.getByLabel("Brief name").fill("Mezzanine beam, 20 ft unbraced");
  await eng.getByLabel(/^Sagging moment/).fill("60");
  await eng.getByLabel(/^Shear force/).fill("25");
  await eng.getByLabel(/Depth, min/).fill("8");
  await eng.getByLabel(/Depth, max/).fill("20");
  await eng.getByLabel("I (equal flanges)").check();
  await eng.getByLabel("Channel", { exact: true }).uncheck();
  await eng.getByLabel(/^Unbraced length Lb/).fill("20");
  // Cb from the moment diagram by F1-1: uniform load on a simple span → 1.136
  await eng.getByLabel("Cb from the moment diagram").selectOption("udl-simple");
  await expect(eng.getByLabel(/^Cb/).last().inputValue()).resolves.toBe("1.136");
  await eng.getByTestId("grid-size").waitFor();
  await screenshot(eng, "aisc-brief");

  await eng.getByRole("button", { name: "Save and run" }).click();
  await eng.waitForURL(/\/sweeps\/\d+$/, { timeout: 60_000 });
  await eng.getByRole("heading", { name: /against utilisation$/ }).waitFor({ timeout: 120_000 });
  const caution = await eng.getByRole("note", { name: "Caution" }).first().textContent();
  expect(caution).toContain("On the AISC 360-16 basis (ASD");
  // the results table in AISC terms, ASD symbols and the page's units in every head
  const head = (await eng.getByTestId("candidate-table").locator("thead").textContent()) ?? "";
  expect(head).toMatch(/Chapter F.*Mn \((kip·ft|kN·m)\).*Mn\/Ωb \((kip·ft|kN·m)\).*LTB zone.*Lp \((ft|m)\).*Lr \((ft|m)\).*Cb.*Vn \((kip|kN)\).*Vn\/Ωv \((kip|kN)\)/);
  expect(head).not.toMatch(/Mcr|χLT/);
  const first = (await eng.getByTestId("candidate-table").locator("tbody tr").first().textContent()) ?? "";
  expect(first).toMatch(/F[2-5].*(plastic|inelastic|elastic).*AISC 360-16/);
  // the restraint study over Lb, L/2 … L/6 with the Cb each spacing used
  const study = (await eng.getByTestId("restraint-study-table").textContent()) ?? "";
  expect(study).toMatch(/Spacing Lb\s*Cb/);
  expect(study).toContain("1.136");
  await screenshot(eng, "aisc-sweep");

  await eng.getByTestId("candidate-table").locator("tbody tr").first().click();
  await eng.getByPlaceholder("why this one").fill("Lightest on AISC 360 ASD");
  await eng.getByRole("button", { name: "Save as option" }).click();
  await eng.waitForURL(/\/options\/\d+$/);
  await eng.getByRole("link", { name: "Calculation record" }).click();
  // the check table is not the allowable basis's: no "stresses only" beside AISC checks
  await expect(eng.getByTestId("check-table").first().locator("caption").textContent()).resolves.not.toContain("stresses only");
  const record = eng.getByTestId("record-aisc360");
  await record.waitFor();
  const text = (await record.textContent()) ?? "";
  expect(text).toMatch(/AISC 360-16 §F[2-5]/);
  expect(text).toMatch(/zone: (plastic|inelastic|elastic)/);
  expect(text).toMatch(/Lp = [\d.,]+ mm, Lr = [\d.,]+ mm/);
  expect(text).toMatch(/Mn\/Ω = [\d.,]+ kN·m/);
  expect(text).toMatch(/§G2\.1.*Eq\. G2-1/);
  expect(text).toMatch(/Vn = 0\.6·Fy·Aw·Cv = [\d.,]+ kN/);
  await screenshot(eng, "aisc-record");
}, 300_000);

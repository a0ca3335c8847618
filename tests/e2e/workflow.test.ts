// The whole story in the browser: the demo engineer asks for the lightest channel, runs it (the
// in-process queue workers really search), reads the chart, compares candidates, saves an
// option and asks for review; the demo reviewer rechecks with lower allowables, compares,
// approves, and prints the calculation record. Screenshots go to tests/artifacts/screenshots.
import { expect, inject, test } from "vitest";
import type { Page } from "playwright-core";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();

/** Waits for a finished sweep's results on its page (the page polls and reloads its data in place). */
async function waitForResults(page: Page) {
  await page.getByRole("heading", { name: /against utilisation$/ }).waitFor({ timeout: 90_000 });
}

test("engineer → sweep → option → review; reviewer → recheck → approve → record", async () => {
  const base = inject("baseUrl");
  const eng = await signIn("engineer@tallowfield.example", "/projects");

  // A new project and a brief: the default brief asks for the lightest channel; I and tee ride along for comparison.
  await eng.getByRole("link", { name: "New project" }).click();
  await eng.getByLabel("Project name").fill("Footbridge landing (browser test)");
  await eng.getByLabel("Client").fill("Invented client");
  await eng.getByRole("button", { name: "Create project" }).click();
  await eng.getByRole("heading", { level: 1, name: /Footbridge landing/ }).waitFor();
  await eng.getByRole("link", { name: "New brief" }).click();
  await eng.getByLabel("Brief name").fill("Landing beam, lightest channel");
  // New briefs start on the EN 1993 basis; this story sizes by allowable stresses.
  await eng.getByLabel(/^Allowable stresses/).check();
  await eng.getByLabel("I (equal flanges)").check();
  // exact: the catalogue shapes below the families include "tee, parallel flange"
  await eng.getByRole("checkbox", { name: "Tee", exact: true }).check();
  // The preview is computed in the browser from the same schema and engine.
  await eng.getByTestId("grid-size").waitFor();
  await expect(eng.getByTestId("grid-size").textContent()).resolves.toMatch(/Grid: .* shapes/);

  // A material preset fills the allowables (0.60·fy for S355 = 213 MPa); every value stays editable.
  await eng.getByLabel("Material preset").selectOption("s355");
  await expect(eng.getByLabel(/^Tension/).inputValue()).resolves.toBe("213");
  await eng.getByLabel(/^Tension/).fill("165");
  await eng.getByLabel(/^Compression/).fill("165");
  await eng.getByLabel(/^Shear \(/).fill("100");
  // The unit switch re-expresses every value (400 mm = 15.748 in) and comes back exactly.
  await eng.getByText("US customary (in, kip·ft, ksi)").first().click();
  await expect(eng.getByLabel(/Depth, max/).inputValue()).resolves.toBe("15.748");
  await eng.getByText("SI (mm, kN·m, MPa)").first().click();
  await expect(eng.getByLabel(/Depth, max/).inputValue()).resolves.toBe("400");

  await eng.getByLabel(/^Member length/).fill("5.4");
  await eng.getByLabel(/^Member count/).fill("4");

  // A field error sits by its field and nothing is sent until it is fixed.
  await eng.getByLabel(/Depth, max/).fill("50");
  await eng.getByRole("button", { name: "Save and run" }).click();
  await eng.getByText("Depth, max must be ≥ depth, min").waitFor();
  await eng.getByLabel(/Depth, max/).fill("400");
  await screenshot(eng, "workflow-brief");

  await eng.getByRole("button", { name: "Save and run" }).click();
  await eng.waitForURL(/\/sweeps\/\d+$/);
  const sweepUrl = eng.url();
  await waitForResults(eng);
  await eng.getByRole("note", { name: "Caution" }).first().waitFor();
  await expect(eng.getByTestId("best").textContent()).resolves.toMatch(/Lightest section: .* kg\/m/);
  await eng.locator("path.recharts-symbols").first().waitFor();
  await screenshot(eng, "workflow-sweep-chart");

  // Click a chart point: the selection (and the table row) follow it.
  const rows = eng.getByTestId("candidate-table").locator("tbody tr");
  const count = await rows.count();
  expect(count).toBeGreaterThanOrEqual(2);
  const before = await eng.getByTestId("selected").textContent();
  const symbols = eng.locator("path.recharts-symbols");
  let moved = false;
  for (let i = (await symbols.count()) - 1; i >= 0 && !moved; i--) {
    await symbols.nth(i).dispatchEvent("click");
    moved = (await eng.getByTestId("selected").textContent()) !== before;
  }
  expect(moved, "clicking a chart point selects its candidate").toBe(true);

  // Compare two candidates side by side.
  await eng.getByLabel("Compare candidate 1", { exact: true }).check();
  await eng.getByLabel("Compare candidate 2", { exact: true }).check();
  await expect(eng.getByTestId("comparison").locator("article").count()).resolves.toBe(2);
  await eng.getByTestId("comparison").scrollIntoViewIfNeeded();
  await screenshot(eng, "workflow-comparison");

  // Save the lightest as an option and ask for review.
  await rows.first().click();
  await eng.getByPlaceholder("why this one").fill("Lightest; fits the landing depth");
  await eng.getByRole("button", { name: "Save as option" }).click();
  await eng.waitForURL(/\/options\/\d+$/);
  const optionUrl = eng.url();
  await eng.getByRole("note", { name: "Caution" }).first().waitFor();
  await eng.getByRole("button", { name: "Request review" }).click();
  await eng.getByText("Review requested; the team's reviewers were e-mailed.").waitFor();
  await eng.getByText("Waiting for review").first().waitFor();

  // The reviewer finds it on the dashboard, rechecks with lower allowables and compares.
  const rev = await signIn("reviewer@tallowfield.example", "/");
  const optionPath = new URL(optionUrl).pathname;
  // options are numbered within their project: the new project's first option is "Option 1"
  await rev.getByTestId("awaiting-review").locator(`a[href="${optionPath}"]`).filter({ hasText: "Option 1" }).waitFor();
  await rev.goto(optionUrl);
  await rev.getByRole("link", { name: "Recheck with altered limits" }).click();
  await rev.waitForURL(/\/recheck$/);
  await rev.getByLabel(/^Tension/).fill("140");
  await rev.getByLabel(/^Compression/).fill("140");
  await rev.getByRole("button", { name: "Run recheck" }).click();
  await rev.waitForURL((u) => /^\/sweeps\/\d+$/.test(u.pathname) && u.href !== sweepUrl);
  await waitForResults(rev);
  await rev.getByRole("link", { name: "compare with the original" }).click();
  await rev.getByRole("heading", { name: "Recheck comparison" }).waitFor();
  const changes = await rev.getByTestId("changes").textContent();
  expect(changes).toContain("Allowable compression");
  expect(changes).toContain("Allowable tension");
  await expect(rev.getByTestId("mass-difference").textContent()).resolves.toMatch(/Mass difference \(recheck − original\): \+/);
  // The saved option was sized at 165 MPa; at 140 MPa its bending utilisation rises by 165/140.
  await expect(rev.getByTestId("option-verdicts").textContent()).resolves.toMatch(/still fits|now breaks/);
  await screenshot(rev, "workflow-recheck");

  // Approve with a comment; the state shows on the option and the project.
  await rev.goto(optionUrl);
  await rev.getByLabel(/Comment/).fill("Checked against the lower allowable; approve the original with the recheck noted.");
  await rev.getByRole("button", { name: "Approve" }).click();
  await rev.getByText("Option approved.").waitFor();
  await rev.getByText("Approved", { exact: true }).first().waitFor();

  // The calculation record: composite table, flexure written out, checks, decision, caution.
  await rev.goto(`${optionUrl}/record`);
  await rev.getByTestId("composite-table").waitFor();
  await expect(rev.getByTestId("decision").textContent()).resolves.toContain("Approved by Tomasz Ferreira");
  await expect(rev.getByTestId("fibre-sagging").textContent()).resolves.toMatch(/σ_top = −M·c_top ÷ Iz/);
  await expect(rev.getByRole("note", { name: "Caution" }).count()).resolves.toBeGreaterThan(0);
  await expect(rev.getByTestId("quantity").textContent()).resolves.toMatch(/Quantity: 4 members × 5\.4 m × [\d.]+ kg\/m = [\d,.]+ kg/);
  await rev.emulateMedia({ media: "print" });
  await screenshot(rev, "workflow-record");

  // The engineer's project page shows the review state.
  await eng.goto(`${base}/projects`);
  await eng.getByRole("link", { name: /Footbridge landing/ }).click();
  await eng.getByText("Approved", { exact: true }).first().waitFor();
});

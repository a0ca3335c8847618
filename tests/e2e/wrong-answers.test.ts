// Issue 11, items 1–4 as a person meets them in the browser: a brief typed in SI, switched to US
// customary and back and saved in US keeps its exact values (300 mm, not 299.999); the S355
// preset fills E and the brief remembers the grade; the recheck form keeps member length and
// count; a recheck that only moves a depth limit says the saved option now breaks it;
// an option saved from a recheck names the recheck and the sweep it rechecked.
import { expect, test } from "vitest";
import type { Page } from "playwright-core";
import { browserForFile, screenshot } from "./browser";

const { signIn } = browserForFile();

const US = "US customary (in, kip·ft, ksi)";
const SI = "SI (mm, kN·m, MPa)";
const value = (page: Page, label: RegExp) => page.getByLabel(label).inputValue();

test("unit switches leave the brief exact; recheck names the limit an option breaks; provenance", async () => {
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: "New project" }).click();
  await eng.getByLabel("Project name").fill("Loading bay canopy (units test)");
  await eng.getByRole("button", { name: "Create project" }).click();
  await eng.getByRole("heading", { level: 1, name: /Loading bay canopy/ }).waitFor();
  await eng.getByRole("link", { name: "New brief" }).click();
  await eng.getByLabel("Brief name").fill("Canopy edge beam");
  // A new brief is on the EN 1993 basis: it needs the restraint spacing before the preview shows.
  await eng.getByLabel(/^Restraint length/).fill("3");
  await eng.getByTestId("grid-size").waitFor();

  // Item 4: the preset fills E too (EN 1993-1-1 §3.2.6: 210 000 MPa), not only the strengths.
  // (A new brief is on the EN 1993 basis: the preset also fills the steel's fy bands.)
  await eng.getByLabel("Material preset").selectOption("s355");
  await expect(eng.locator('input[name="deflection.E"]').inputValue()).resolves.toBe("210000");
  await expect(value(eng, /^Band 1: fy/)).resolves.toBe("355");

  // Item 1: typed in SI, switched to US and back and to US again, then saved in US.
  await eng.getByLabel(/^Sagging moment/).fill("60");
  await eng.getByLabel(/Depth, max/).fill("300");
  await eng.getByLabel(/Width, min/).fill("50");
  await eng.getByLabel(/^Plate thicknesses/).fill("6, 8, 10, 12, 15, 20, 25");
  await eng.getByLabel(/^Member length/).fill("5.4");
  await eng.getByLabel(/^Member count/).fill("4");
  await eng.getByText(US).first().click();
  await expect(value(eng, /Depth, max/)).resolves.toBe("11.811");
  await expect(value(eng, /^Plate thicknesses/)).resolves.toBe("0.23622, 0.314961, 0.393701, 0.472441, 0.590551, 0.787402, 0.984252");
  // 355 MPa ÷ 6.894757 MPa/ksi = 51.4884 ksi at six figures (NIST SP 811 App. B).
  await expect(value(eng, /^Band 1: fy/)).resolves.toBe("51.4884");
  await eng.getByText(SI).first().click();
  await expect(value(eng, /Depth, max/)).resolves.toBe("300");
  await eng.getByText(US).first().click();
  await eng.getByRole("button", { name: "Save brief" }).click();
  await eng.waitForURL(/\/briefs\/\d+\?saved=1$/);
  const briefUrl = eng.url().replace(/\?saved=1$/, "");

  // Reopened (in US, as saved) and shown in SI: the exact values came back, and the grade is remembered.
  await expect(eng.getByLabel("Material preset").inputValue()).resolves.toBe("s355");
  await expect(value(eng, /Depth, max/)).resolves.toBe("11.811");
  await eng.getByText(SI).first().click();
  await expect(value(eng, /Depth, max/)).resolves.toBe("300");
  await expect(value(eng, /Width, min/)).resolves.toBe("50");
  await expect(value(eng, /^Plate thicknesses/)).resolves.toBe("6, 8, 10, 12, 15, 20, 25");
  await expect(value(eng, /^Density/)).resolves.toBe("7850");
  await expect(value(eng, /^Band 1: fy/)).resolves.toBe("355");
  await expect(value(eng, /^Band 2: plates up to/)).resolves.toBe("40");
  await expect(value(eng, /^Restraint length/)).resolves.toBe("3");
  await expect(eng.locator('input[name="deflection.E"]').inputValue()).resolves.toBe("210000");
  await screenshot(eng, "units-brief-reopened");

  // Run it (no edits) and save the best as an option.
  await eng.getByRole("button", { name: "Save and run" }).click();
  await eng.waitForURL(/\/sweeps\/\d+$/);
  const sweepUrl = eng.url();
  const sweepId = sweepUrl.split("/").pop()!;
  await eng.getByRole("heading", { name: /against utilisation$/ }).waitFor({ timeout: 90_000 });
  await eng.getByText(SI).first().click();
  const best = (await eng.getByTestId("best").textContent()) ?? "";
  const depth = Number(/\bd (\d+(?:\.\d+)?)/.exec(best)?.[1]);
  expect(depth).toBeGreaterThanOrEqual(100);
  expect(depth).toBeLessThanOrEqual(300);
  // The recheck moves one depth limit past the option's depth (whichever side leaves a valid range).
  const [limitLabel, limitValue, words] =
    depth < 300 ? [/Depth, min/, depth + 10, `depth ${depth} mm is below depth, min ${depth + 10} mm`] : [/Depth, max/, depth - 10, `depth ${depth} mm is above depth, max ${depth - 10} mm`];
  await eng.getByTestId("candidate-table").locator("tbody tr").first().click();
  await eng.getByRole("button", { name: "Save as option" }).click();
  await eng.waitForURL(/\/options\/\d+$/);
  // sweeps are numbered within their project: this new project's first sweep is sweep 1
  await expect(eng.getByTestId("provenance").textContent()).resolves.toMatch(/Saved from sweep 1\b/);
  await eng.getByRole("heading", { level: 1, name: /^Option 1\b/ }).waitFor();
  const option1 = eng.url();
  await eng.getByRole("button", { name: "Request review" }).click();
  await eng.getByText("Review requested; the team's reviewers were e-mailed.").waitFor();

  // The reviewer rechecks: member length and count are there; only depth max is cut below the option's depth.
  const rev = await signIn("reviewer@tallowfield.example", "/");
  await rev.goto(`${sweepUrl}/recheck`);
  // The brief was last saved (by "Save and run") in SI, so the recheck opens in SI.
  await expect(value(rev, /^Member length/)).resolves.toBe("5.4");
  await expect(value(rev, /^Member count/)).resolves.toBe("4");
  // 5.4 m ÷ 0.3048 m/ft = 17.7165 ft at six figures (NIST SP 811 App. B).
  await rev.getByText(US).first().click();
  await expect(value(rev, /^Member length/)).resolves.toBe("17.7165");
  await rev.getByText(SI).first().click();
  await rev.getByLabel(limitLabel).fill(String(limitValue));
  await rev.getByRole("button", { name: "Run recheck" }).click();
  await rev.waitForURL((u) => /^\/sweeps\/\d+$/.test(u.pathname) && !u.href.endsWith(`/${sweepId}`));
  const recheckUrl = rev.url();
  const recheckId = recheckUrl.split("/").pop()!;
  await rev.getByRole("heading", { name: /against utilisation$/ }).waitFor({ timeout: 90_000 });
  await rev.getByRole("link", { name: "compare with the original" }).click();
  await rev.getByRole("heading", { name: "Recheck comparison" }).waitFor();
  await expect(rev.getByTestId("changes").textContent()).resolves.toMatch(/Depth, m(in|ax)/);
  const verdicts = (await rev.getByTestId("option-verdicts").textContent()) ?? "";
  expect(verdicts).toContain("now breaks one limit");
  expect(verdicts).toContain(words);
  await screenshot(rev, "units-recheck-breaks-depth");

  // An option saved from the recheck names it, and the sweep it rechecked.
  await eng.goto(recheckUrl);
  await eng.getByRole("heading", { name: /against utilisation$/ }).waitFor({ timeout: 90_000 });
  await eng.getByTestId("candidate-table").locator("tbody tr").first().click();
  await eng.getByRole("button", { name: "Save as option" }).click();
  await eng.waitForURL(/\/options\/\d+$/);
  await expect(eng.getByTestId("provenance").textContent()).resolves.toMatch(/Saved from sweep 2, a recheck of sweep 1\b/);
  await eng.goto(`${eng.url()}/record`);
  await expect(eng.getByTestId("provenance").textContent()).resolves.toMatch(/sweep 2, a recheck of sweep 1\b/);
  void recheckId;

  // Item 12: the reviewer approves option 1; the engineer then changes the brief's limits: the
  // project's options table names brief and member and flags the approval stale.
  await rev.goto(option1);
  await rev.getByRole("button", { name: "Approve" }).click();
  await rev.getByText("Option approved.").waitFor();
  await eng.goto(briefUrl);
  await eng.getByText(SI).first().click();
  await eng.getByLabel(/Depth, max/).fill("290");
  await eng.getByRole("button", { name: "Save brief" }).click();
  await eng.waitForURL(/\?saved=1$/);
  await eng.getByRole("link", { name: /Loading bay canopy/ }).first().click();
  const row = eng.locator("tr").filter({ has: eng.getByRole("link", { name: "Option 1", exact: true }) });
  const text = (await row.textContent()) ?? "";
  expect(text).toContain("Canopy edge beam");
  expect(text).toContain("4 × 5.4 m");
  // The edit made revision B of the option's record, back in draft until approved again
  // (revisions.server.ts); the badge says why its earlier approval no longer stands.
  expect(text).toContain("Draft");
  expect(text).toContain("Brief changed since approval");
  await screenshot(eng, "units-project-options-stale");
});

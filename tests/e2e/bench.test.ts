// The section bench in a real browser: sign in, type a section, watch the centroid and Iz
// change (computed in the page's Web Worker), see a field-named error, switch units, share.
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, screenshot } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const valueOf = (page: Page, key: string) => page.locator(`tr[data-property="${key}"] [data-value]`).textContent();

async function waitForChange(page: Page, key: string, from: string | null): Promise<string> {
  await page.waitForFunction(
    ([k, f]) => {
      const el = document.querySelector(`tr[data-property="${k}"] [data-value]`);
      return el && el.textContent !== f;
    },
    [key, from] as const,
    { timeout: 15_000 },
  );
  return (await valueOf(page, key))!;
}

test("type a section on the bench: centroid and Iz follow, errors name the field, units switch", async () => {
  const base = inject("baseUrl");
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  const pageErrors: string[] = [];
  page.on("pageerror", (e) => pageErrors.push(String(e)));

  // signed out: the bench sends you to sign in and back
  await page.goto(`${base}/bench`);
  expect(page.url()).toContain("/sign-in?next=%2Fbench");
  await page.getByLabel("E-mail address").fill("engineer@tallowfield.example");
  await page.getByLabel("Password").fill("sparwise-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => u.pathname === "/bench");
  // the URL changes a moment before the new page renders: wait for the heading itself
  await page.locator("h1", { hasText: "Section bench" }).waitFor({ timeout: 15_000 });

  // the default welded I, symmetric: centroid at mid-depth
  const iz0 = await waitForChange(page, "Iz", null);
  expect(await valueOf(page, "centroid.y")).toBe("200 mm");
  expect(iz0).toMatch(/mm⁴$/);
  const marker0 = await page.locator('[data-testid="centroid-marker"]').getAttribute("transform");

  // a tee: the centroid moves up towards the flange, Iz changes
  await page.locator('select[name="family"]').selectOption("tee");
  const iz1 = await waitForChange(page, "Iz", iz0);
  const y1 = (await valueOf(page, "centroid.y"))!;
  expect(y1).not.toBe("200 mm");
  expect(Number(y1.replace(/[^\d.]/g, ""))).toBeGreaterThan(200);
  expect(await page.locator('[data-testid="centroid-marker"]').getAttribute("transform")).not.toBe(marker0);

  // typing a deeper stem, character by character, keeps updating
  const d = page.locator('input[name="dim-d"]');
  await d.fill("");
  await d.pressSequentially("500", { delay: 30 });
  const iz2 = await waitForChange(page, "Iz", iz1);
  expect(iz2).not.toBe(iz1);
  await expect(page.locator('[data-testid="fibre-top"]').textContent()).resolves.toMatch(/MPa/);

  // the link holds the section
  // (written a moment after typing stops: wait for the final value, not an earlier pause)
  await page.waitForFunction(
    () => {
      const s = new URL(location.href).searchParams.get("s") ?? "";
      return s.includes('"f":"tee"') && s.includes('"d":"500"');
    },
    undefined,
    { timeout: 5_000 },
  );
  const shared = page.url();

  // an impossible stem: the engine's message names the field, the input is marked
  await page.locator('input[name="dim-tf"]').fill("600");
  const alert = page.getByRole("alert").filter({ hasText: "not valid" });
  await alert.waitFor({ timeout: 10_000 });
  await expect(alert.textContent()).resolves.toContain("Tee: d must exceed tf");
  await expect(page.locator('input[name="dim-tf"]').getAttribute("aria-invalid")).resolves.toBe(null);
  await expect(page.locator('input[name="dim-d"]').getAttribute("aria-invalid")).resolves.toBe("true");
  await page.locator('input[name="dim-tf"]').fill("16");
  await alert.waitFor({ state: "detached", timeout: 10_000 });

  // US customary: the same section retyped in inches, properties in in-based units
  await page.getByText("US customary (in, kip·ft, ksi)").click();
  await expect(page.locator('input[name="dim-d"]').inputValue()).resolves.toBe("19.685");
  await page.waitForFunction(() => document.querySelector('tr[data-property="Iz"] [data-value]')?.textContent?.endsWith("in⁴"), undefined, { timeout: 10_000 });
  await expect(page.locator('[data-testid="fibre-top"]').textContent()).resolves.toMatch(/ksi/);
  await page.getByText("SI (mm, kN·m, MPa)").click();
  await page.waitForFunction(() => document.querySelector('tr[data-property="Iz"] [data-value]')?.textContent?.endsWith("mm⁴"), undefined, { timeout: 10_000 });
  // straight back: what was typed, not a rounded 499.999
  await expect(page.locator('input[name="dim-d"]').inputValue()).resolves.toBe("500");
  expect(await valueOf(page, "Iz")).toBe(iz2);

  await screenshot(page, "bench");

  // plates: add a row, move it up with the keyboard; focus stays on the moved row's button
  await page.getByLabel("Plates", { exact: true }).check();
  await page.getByRole("button", { name: "Add plate" }).click();
  await expect(page.locator("tr[data-plate-row]").count()).resolves.toBe(4);
  await page.getByRole("button", { name: "Move plate 4 up" }).focus();
  await page.keyboard.press("Enter");
  await expect(page.locator('input[aria-label="plate 3 y (mm)"]').inputValue()).resolves.toBe("400");
  await expect(page.evaluate(() => document.activeElement?.getAttribute("aria-label"))).resolves.toBe("Move plate 3 up");
  // Alt+↓ from inside the row's input moves it back down, focus staying in the input
  await page.locator('input[aria-label="plate 3 b (mm)"]').focus();
  await page.keyboard.press("Alt+ArrowDown");
  await expect(page.locator('input[aria-label="plate 4 y (mm)"]').inputValue()).resolves.toBe("400");
  await expect(page.evaluate(() => document.activeElement?.getAttribute("aria-label"))).resolves.toBe("plate 4 b (mm)");
  await screenshot(page, "bench-plates");

  // polygons: the default hollow rectangle 200 × 300 with a centred hole; by symmetry ȳ = 150 mm
  await page.getByLabel("Polygons", { exact: true }).check();
  await page.locator('[data-testid="section-drawing"] path[fill-rule="evenodd"]').waitFor({ timeout: 10_000 });
  await page.waitForFunction(() => document.querySelector('tr[data-property="centroid.y"] [data-value]')?.textContent === "150 mm", undefined, { timeout: 10_000 });
  await expect(page.locator('tr[data-property="J"]').textContent()).resolves.toContain("approximate");
  await page.getByLabel("Polygon 2 points (z,y pairs, mm)").fill("20,20 180,20 180,280 twenty,280");
  await page.getByRole("alert").filter({ hasText: "Polygon 2" }).waitFor({ timeout: 10_000 });
  await page.getByLabel("Polygon 2 points (z,y pairs, mm)").fill("20,20 180,20 180,280 20,280");
  await page.getByRole("alert").filter({ hasText: "not valid" }).waitFor({ state: "detached", timeout: 10_000 });
  await page.getByLabel("Plates", { exact: true }).check();

  // file it under a project (the demo seed has projects when the workflow seed is present)
  const save = page.locator("form").filter({ hasText: "Save to a project" });
  if (await save.count()) {
    await save.getByLabel("Name").fill("Bench trial from the browser test");
    await save.getByRole("button", { name: "Save section" }).click();
    await page.getByText("Saved “Bench trial from the browser test”").waitFor({ timeout: 10_000 });
  }

  // the shared link reopens the tee in a fresh tab
  const other = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  await other.context().addCookies(await page.context().cookies());
  await other.goto(shared);
  await expect(other.locator('select[name="family"]').inputValue()).resolves.toBe("tee");
  await expect(other.locator('input[name="dim-d"]').inputValue()).resolves.toBe("500");
  expect(pageErrors).toEqual([]);
});

import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser, screenshot } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

test("the home page renders with its heading", async () => {
  const page = await browser.newPage();
  await page.goto(inject("baseUrl"));
  await expect(page.locator("h1").first().textContent()).resolves.toContain("Sparwise");
  await screenshot(page, "home");
});

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

test("a newcomer opens the home page, signs in as the demo engineer and sees the dashboard", async () => {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await page.goto(inject("baseUrl"));
  // Signed out, the home page sends you to sign-in.
  await page.waitForURL(/\/sign-in/);
  await expect(page.locator("h1").textContent()).resolves.toContain("Sign in");
  await screenshot(page, "sign-in");

  // Labels, not selectors: the form must be usable by its visible names.
  await page.getByLabel("E-mail address").fill("engineer@tallowfield.example");
  await page.getByLabel("Password").fill("sparwise-demo");
  await page.getByRole("button", { name: "Sign in" }).click();

  // The URL changes a moment before React renders the new page: wait for the heading itself.
  await page.getByRole("heading", { level: 1, name: "Dashboard" }).waitFor();
  expect(new URL(page.url()).pathname).toBe("/");
  await expect(page.locator("header").textContent()).resolves.toContain("Tallowfield Plate & Beam");
  await expect(page.getByText("Signed in as Marek Lindqvist, engineer").count()).resolves.toBe(1);
  // An engineer has no Admin link.
  await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Admin" }).count()).resolves.toBe(0);
  await screenshot(page, "dashboard-engineer");

  // A narrow screen keeps the navigation reachable.
  await page.setViewportSize({ width: 390, height: 800 });
  await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Dashboard" }).isVisible()).resolves.toBe(true);
  await screenshot(page, "dashboard-engineer-narrow");
});

test("a wrong password keeps the newcomer on sign-in with a message by the field", async () => {
  const page = await browser.newPage();
  await page.goto(`${inject("baseUrl")}/sign-in`);
  await page.getByLabel("E-mail address").fill("engineer@tallowfield.example");
  await page.getByLabel("Password").fill("not the password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("E-mail address or password is wrong.").waitFor()).resolves.toBeUndefined();
  expect(new URL(page.url()).pathname).toBe("/sign-in");
});

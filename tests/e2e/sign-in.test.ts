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
  await expect(page.locator("header").textContent()).resolves.toContain("Marek Lindqvist");
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

test("an admin invites a member, copies the link shown once, and the newcomer joins through it", async () => {
  const base = inject("baseUrl");
  const adminCtx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const admin = await adminCtx.newPage();
  await admin.goto(`${base}/sign-in?next=/admin`);
  await admin.getByLabel("E-mail address").fill("admin@tallowfield.example");
  await admin.getByLabel("Password").fill("sparwise-demo");
  await admin.getByRole("button", { name: "Sign in" }).click();
  await admin.getByRole("heading", { level: 1, name: /members/ }).waitFor();

  await admin.getByLabel("E-mail address").fill("new.detailer@example.org");
  await admin.getByLabel("Role", { exact: true }).selectOption("viewer");
  await admin.getByRole("button", { name: "Send invitation" }).click();
  await admin.getByText("Invitation sent to new.detailer@example.org").waitFor();
  const link = await admin.getByLabel("Invitation link").inputValue();
  expect(link).toMatch(/^https?:\/\/\S+\/invite\/[A-Za-z0-9_-]{20,}$/);
  await screenshot(admin, "admin-members");

  // The outbox lists the message with the token hidden.
  await admin.getByRole("link", { name: "Outbox" }).first().click();
  await admin.getByRole("heading", { level: 1, name: "Outbox" }).waitFor();
  await admin.getByText(/invites you to Tallowfield/).first().click();
  const body = (await admin.locator("pre").first().textContent()) ?? "";
  await screenshot(admin, "admin-outbox");
  expect(body).toContain("/invite/[token hidden]");
  expect(body).not.toContain(link);
  await adminCtx.close();

  const newcomerCtx = await browser.newContext();
  const page = await newcomerCtx.newPage();
  await page.goto(link!);
  await page.getByRole("heading", { level: 1, name: "Join Tallowfield Plate & Beam" }).waitFor();
  await page.getByLabel("Your name").fill("Kit Oyelaran");
  await page.getByLabel("Password", { exact: true }).fill("a long new password");
  await page.getByLabel("Repeat the password").fill("a long new password");
  await screenshot(page, "invite-accept");
  await page.getByRole("button", { name: "Join the team" }).click();
  await page.getByRole("heading", { level: 1, name: "Dashboard" }).waitFor();
  await expect(page.locator("header").textContent()).resolves.toContain("Kit Oyelaran");
  await expect(page.locator("header").textContent()).resolves.toContain("Viewer");
  await newcomerCtx.close();
});

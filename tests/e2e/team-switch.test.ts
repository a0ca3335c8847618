// A member of two teams chooses the team they act in from the header (issue 9, item 1).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import type { Knex } from "knex";
import { launchBrowser, screenshot } from "./browser";

let browser: Browser;
let db: Knex;
beforeAll(async () => {
  browser = await launchBrowser();
  // The second team is made in the browser suite's own database, as the app server sees it.
  process.env.DB_NAME = process.env.E2E_DB_NAME ?? "sparwise_e2e";
  const { knexConfig } = await import("../../knexfile");
  db = (await import("knex")).default(knexConfig());
  const engineer = await db("users").where({ email: "engineer2@tallowfield.example" }).first("id");
  const [teamId] = await db("teams").insert({ name: "Harrowgate Frames", slug: "harrowgate-e2e" });
  await db("memberships").insert({ team_id: teamId, user_id: engineer.id, role: "viewer" });
});
afterAll(async () => {
  await db?.("teams").where({ slug: "harrowgate-e2e" }).delete();
  await db?.destroy();
  await browser?.close();
});

test("a member of two teams switches the team they act in from the header", async () => {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await page.goto(`${inject("baseUrl")}/sign-in`);
  await page.getByLabel("E-mail address").fill("engineer2@tallowfield.example");
  await page.getByLabel("Password").fill("sparwise-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.getByRole("heading", { level: 1, name: "Dashboard" }).waitFor();

  const picker = page.getByLabel("Team you act in");
  await expect(picker.locator("option:checked").textContent()).resolves.toContain("Tallowfield Plate & Beam");
  await page.goto(`${inject("baseUrl")}/projects`);
  const demoProjects = await page.locator("main a[href^='/projects/']").count();
  expect(demoProjects).toBeGreaterThan(0);

  await page.getByLabel("Team you act in").selectOption({ label: "Harrowgate Frames (Viewer)" });
  await page.getByRole("button", { name: "Switch" }).click();
  await page.getByRole("heading", { level: 1, name: "Dashboard" }).waitFor();
  await expect(page.getByLabel("Team you act in").locator("option:checked").textContent()).resolves.toContain("Harrowgate Frames");
  await screenshot(page, "team-switch");
  // The other team has no projects: none of the demo team's are listed any more.
  await page.goto(`${inject("baseUrl")}/projects`);
  await expect(page.locator("main a[href^='/projects/']").count()).resolves.toBe(0);
});

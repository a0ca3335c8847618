import { afterAll, beforeAll, inject } from "vitest";
import { chromium, type Browser, type Page } from "playwright-core";
import { mkdirSync } from "node:fs";
import path from "node:path";

// Debian's chromium, never a downloaded browser; flags keep it off this closed network.
// playwright gives every launch a fresh temporary profile (it refuses --user-data-dir here).
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: "/usr/bin/chromium",
    headless: true,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

export interface Viewport {
  width: number;
  height: number;
}
const DESKTOP: Viewport = { width: 1280, height: 900 };

export const SCREENSHOT_DIR = path.resolve("tests/artifacts/screenshots");

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/**
 * One browser for the calling test file, launched before its tests and closed after them;
 * `signIn(email, next, viewport)`: a fresh context (its own cookies) signed in with the demo
 * password through the sign-in form, waiting until it lands on `next`; `newPage(viewport)`: a
 * fresh context signed in as nobody. Call once at the top of a test file.
 */
export function browserForFile(): {
  signIn: (email: string, next?: string, viewport?: Viewport) => Promise<Page>;
  newPage: (viewport?: Viewport) => Promise<Page>;
} {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  async function newPage(viewport: Viewport = DESKTOP): Promise<Page> {
    if (!browser) throw new Error("browserForFile: a page was asked for before the browser started (call it inside a test)");
    return (await browser.newContext({ viewport })).newPage();
  }
  return {
    newPage,
    async signIn(email: string, next = "/", viewport: Viewport = DESKTOP): Promise<Page> {
      const page = await newPage(viewport);
      page.on("pageerror", (e) => console.error(`[browser ${email}]`, e.message));
      await page.goto(`${inject("baseUrl")}/sign-in?next=${encodeURIComponent(next)}`);
      await page.getByLabel("E-mail address").fill(email);
      await page.getByLabel("Password").fill("sparwise-demo");
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL((u) => u.pathname === next);
      return page;
    },
  };
}

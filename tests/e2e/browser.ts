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

export const SCREENSHOT_DIR = path.resolve("tests/artifacts/screenshots");

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

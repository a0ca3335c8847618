// Issue 11, item 11 as a person sees it: no page of the demo scrolls sideways on a 390 px phone
// and the main navigation shows every link there; the four-up comparison at 1440 px clips no
// diagram title and no column; a refused (403) or missing (404) page keeps the app's frame.
import { expect, inject, test } from "vitest";
import type { Page } from "playwright-core";
import { browserForFile, screenshot } from "./browser";

const browser = browserForFile();

const base = () => inject("baseUrl");

/** Signed in on a screen `width` px wide (a phone's 844 px tall). */
function signIn(email: string, width: number, next = "/"): Promise<Page> {
  return browser.signIn(email, next, { width, height: 844 });
}

/** The page's sideways overflow, with the outermost elements that reach past the right edge (for the failure message). */
async function sideways(page: Page): Promise<{ scrollWidth: number; clientWidth: number; culprits: string[] }> {
  return page.evaluate(() => {
    const se = document.scrollingElement!;
    const W = se.clientWidth;
    const culprits: string[] = [];
    for (const el of Array.from(document.body.querySelectorAll("*"))) {
      const r = el.getBoundingClientRect();
      if (r.width === 0 || r.right <= W + 0.5) continue;
      if (el.parentElement && el.parentElement.getBoundingClientRect().right > W + 0.5) continue;
      culprits.push(`<${el.tagName.toLowerCase()} class="${el.getAttribute("class") ?? ""}"> to ${Math.round(r.right)} px: ${(el.textContent ?? "").slice(0, 40)}`);
    }
    return { scrollWidth: se.scrollWidth, clientWidth: W, culprits: culprits.slice(0, 5) };
  });
}

async function settle(page: Page) {
  await page.waitForLoadState("networkidle");
  // charts measure their box after hydration (ResponsiveContainer)
  await page.waitForTimeout(250);
}

/** Tick the first four candidates of a sweep page's table for comparison. */
async function compareFour(page: Page) {
  const boxes = page.getByRole("checkbox", { name: /^Compare candidate/ });
  for (let i = 0; i < 4; i++) await boxes.nth(i).check();
  await expect(page.getByTestId("comparison").locator("article").count()).resolves.toBe(4);
  await settle(page);
}

/**
 * Every internal page reachable by links from `start` (downloads, sign-out and API addresses left
 * out), each checked for sideways overflow once it has settled: the pages visited, and the wide ones.
 */
async function crawlForOverflow(page: Page, start: string[], limit = 80): Promise<{ pages: string[]; wide: string[] }> {
  const seen = new Set<string>(start);
  const queue = [...start];
  const pages: string[] = [];
  const wide: string[] = [];
  while (queue.length && pages.length < limit) {
    const path = queue.shift()!;
    const res = await page.goto(`${base()}${path}`);
    expect(res?.status(), path).toBe(200);
    pages.push(path);
    await settle(page);
    const s = await sideways(page);
    if (s.scrollWidth > s.clientWidth) wide.push(`${path}: ${s.scrollWidth} > ${s.clientWidth} px; ${s.culprits.join("; ")}`);
    const hrefs = await page.evaluate(() =>
      Array.from(document.querySelectorAll("a[href]"))
        .filter((a) => !a.hasAttribute("download"))
        .map((a) => new URL((a as HTMLAnchorElement).href))
        .filter((u) => u.origin === location.origin)
        .map((u) => u.pathname + u.search),
    );
    for (const h of hrefs) {
      if (seen.has(h) || /\.(csv|svg)$|^\/api\/|^\/sign-out/.test(h)) continue;
      seen.add(h);
      queue.push(h);
    }
  }
  return { pages, wide };
}

test("no page of the demo scrolls sideways at 390 px, and the navigation shows every link", { timeout: 600_000 }, async () => {
  const admin = await signIn("admin@tallowfield.example", 390);

  // A recheck, so the recheck comparison page is among the pages crawled.
  await admin.goto(`${base()}/projects`);
  await admin.getByRole("link", { name: /Harbour Street cold store/ }).click();
  await admin.waitForURL(/\/projects\/\d+$/);
  const sweepPath = await admin.getByRole("listitem").filter({ hasText: "Primary beam, grid B" }).getByRole("link", { name: /^sweep \d+/ }).getAttribute("href");
  expect(sweepPath).toMatch(/^\/sweeps\/\d+$/);
  await admin.goto(`${base()}${sweepPath}/recheck`);
  await admin.getByLabel(/^Tension/).fill("150");
  await admin.getByRole("button", { name: "Run recheck" }).click();
  await admin.waitForURL((u) => /^\/sweeps\/\d+$/.test(u.pathname) && u.pathname !== sweepPath);
  await admin.getByRole("link", { name: "compare with the original" }).waitFor({ timeout: 120_000 });
  await admin.getByTestId("best").waitFor({ timeout: 120_000 });

  const { pages, wide } = await crawlForOverflow(admin, ["/", "/account", "/messages", "/admin", "/admin/outbox", "/admin/materials", "/admin/catalogues", "/admin/costs", "/bench", "/notices", "/projects", "/stock-lists"]);
  // the crawl reached every kind of page of the workflow
  for (const kind of [/^\/projects\/\d+$/, /^\/projects\/\d+\/schedule$/, /^\/projects\/\d+\/briefs\/new$/, /^\/briefs\/\d+$/, /^\/sweeps\/\d+$/, /^\/sweeps\/\d+\/recheck$/, /^\/sweeps\/\d+\/comparison$/, /^\/options\/\d+$/, /^\/options\/\d+\/record$/, /^\/admin\/catalogues\?view=\d+$/])
    expect(pages.some((p) => kind.test(p)), `no page like ${kind} was reached`).toBe(true);

  expect(wide).toEqual([]);

  // The four-up comparison on a phone.
  await admin.goto(`${base()}${sweepPath}`);
  await compareFour(admin);
  const cmp = await sideways(admin);
  expect(cmp.scrollWidth, cmp.culprits.join("; ")).toBeLessThanOrEqual(cmp.clientWidth);
  await screenshot(admin, "layout-390-comparison");

  // The main navigation wraps: every link, "Stock lists" among them, lies wholly on screen.
  const nav = admin.getByRole("navigation", { name: "Main" });
  const links = nav.getByRole("link");
  await expect(links.count()).resolves.toBe(5);
  for (let i = 0; i < 5; i++) {
    const box = (await links.nth(i).boundingBox())!;
    expect(box.x, await links.nth(i).textContent() ?? "").toBeGreaterThanOrEqual(0);
    expect(box.x + box.width, await links.nth(i).textContent() ?? "").toBeLessThanOrEqual(390);
  }
  await expect(nav.getByRole("link", { name: "Stock lists" }).isVisible()).resolves.toBe(true);
  await screenshot(admin, "layout-390-nav");

  // The public pages too.
  const out = await browser.newPage({ width: 390, height: 844 });
  for (const path of ["/sign-in", "/forgot-password", "/invite/not-a-real-token", "/reset-password/not-a-real-token"]) {
    await out.goto(`${base()}${path}`);
    await settle(out);
    const s = await sideways(out);
    expect(s.scrollWidth, `${path}: ${s.culprits.join("; ")}`).toBeLessThanOrEqual(s.clientWidth);
  }
});

/** Every element of `root` that reaches outside the nearest box that clips it (an svg, or a box with overflow other than visible). */
async function clippedInside(page: Page, selector: string): Promise<string[]> {
  return page.evaluate((sel) => {
    const out: string[] = [];
    for (const root of Array.from(document.querySelectorAll(sel))) {
      for (const el of Array.from(root.querySelectorAll("*"))) {
        if (el.closest(".sr-only") || el.tagName === "title") continue;
        let clip: Element | null = null;
        for (let a = el.parentElement; a && a !== root.parentElement; a = a.parentElement) {
          if (a.tagName.toLowerCase() === "svg" || getComputedStyle(a).overflowX !== "visible") {
            clip = a;
            break;
          }
        }
        if (!clip) clip = root;
        const r = el.getBoundingClientRect();
        const c = clip.getBoundingClientRect();
        if (r.width === 0 && r.height === 0) continue;
        if (r.left < c.left - 1 || r.right > c.right + 1)
          out.push(`<${el.tagName.toLowerCase()}> "${(el.textContent ?? "").slice(0, 40)}" spans ${Math.round(r.left)}–${Math.round(r.right)} px in a box of ${Math.round(c.left)}–${Math.round(c.right)} px`);
      }
    }
    return out;
  }, selector);
}

test("the four-up comparison at 1440 px clips no diagram title and shows every check's utilisation", { timeout: 180_000 }, async () => {
  const eng = await signIn("engineer@tallowfield.example", 1440, "/projects");
  await eng.getByRole("link", { name: /Harbour Street cold store/ }).click();
  await eng.waitForURL(/\/projects\/\d+$/);
  const sweepPath = await eng.getByRole("listitem").filter({ hasText: "Primary beam, grid B" }).getByRole("link", { name: /^sweep \d+/ }).getAttribute("href");
  expect(sweepPath).toMatch(/^\/sweeps\/\d+$/);
  await eng.goto(`${base()}${sweepPath}`);
  await compareFour(eng);
  const articles = eng.getByTestId("comparison").locator("article");
  // four across, side by side
  const tops = await Promise.all([0, 1, 2, 3].map(async (i) => (await articles.nth(i).boundingBox())!.y));
  expect(new Set(tops.map(Math.round)).size).toBe(1);

  // Nothing in any column reaches past its box: no text cut at a drawing's edge, no column hidden in a scroller.
  expect(await clippedInside(eng, '[data-testid="comparison"] article')).toEqual([]);
  // Every stress diagram's titles are whole and apart from the other labels.
  const overlaps = await eng.evaluate(() => {
    const out: string[] = [];
    for (const svg of Array.from(document.querySelectorAll('[data-testid="comparison"] [data-testid="stress-diagram"] svg'))) {
      const texts = Array.from(svg.querySelectorAll("text")).map((t) => ({ t: t.textContent ?? "", r: t.getBoundingClientRect() }));
      for (let i = 0; i < texts.length; i++)
        for (let j = i + 1; j < texts.length; j++) {
          const a = texts[i].r,
            b = texts[j].r;
          if (a.left < b.right - 1 && b.left < a.right - 1 && a.top < b.bottom - 1 && b.top < a.bottom - 1) out.push(`"${texts[i].t}" overlaps "${texts[j].t}"`);
        }
    }
    return out;
  });
  expect(overlaps).toEqual([]);
  const titles = await eng.getByTestId("comparison").locator('[data-testid="stress-diagram"] svg text').allTextContents();
  expect(titles.filter((t) => t.startsWith("σ under M =")).length).toBe(4);
  expect(titles.filter((t) => t.startsWith("τ under V =")).length).toBe(4);
  // Each check table shows its Utilisation column, with a figure on every row.
  for (let i = 0; i < 4; i++) {
    const table = articles.nth(i).getByTestId("check-table");
    await expect(table.getByRole("columnheader", { name: "Utilisation" }).isVisible()).resolves.toBe(true);
    const rows = table.locator("tbody tr");
    const n = await rows.count();
    expect(n).toBeGreaterThan(2);
    for (let k = 0; k < n; k++) await expect(rows.nth(k).locator("td").last().textContent()).resolves.toMatch(/^\d\.\d{3}$/);
  }
  await screenshot(eng, "layout-1440-comparison");
});

test("403 and 404 pages sit inside the app's frame with their own status", async () => {
  const eng = await signIn("engineer@tallowfield.example", 1280);
  const cases: [string, number, string][] = [
    ["/admin", 403, "Not allowed"],
    ["/admin/catalogues", 403, "Not allowed"],
    ["/projects/987654", 404, "Not found"],
    ["/options/987654/record", 404, "Not found"],
    ["/no-such-page/at-all", 404, "Not found"],
  ];
  for (const [path, status, title] of cases) {
    const res = await eng.goto(`${base()}${path}`);
    expect(res?.status(), path).toBe(status);
    await expect(eng.getByTestId("error-page").getAttribute("data-status")).resolves.toBe(String(status));
    await expect(eng.getByRole("heading", { level: 1 }).textContent()).resolves.toBe(title);
    // the frame: the header's navigation and the engineer's menu, the footer
    for (const name of ["Dashboard", "Projects", "Section bench", "Stock lists"]) await expect(eng.getByRole("navigation", { name: "Main" }).getByRole("link", { name }).isVisible()).resolves.toBe(true);
    await expect(eng.locator("main#content [data-testid=error-page]").count()).resolves.toBe(1);
    await expect(eng.getByText("Sparwise sizes sections; a licensed engineer approves them.").isVisible()).resolves.toBe(true);
  }
  // The navigation still works from an error page.
  await eng.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Projects" }).click();
  await eng.getByRole("heading", { level: 1, name: /Projects/ }).waitFor();
  await eng.goto(`${base()}/no-such-page`);
  await screenshot(eng, "layout-404-in-frame");

  // An unknown API address answers JSON, not a page.
  const api = await eng.request.get(`${base()}/api/v1/no-such-endpoint`);
  expect(api.status()).toBe(404);
  expect(((await api.json()) as { error: string }).error).toMatch(/no API endpoint/);
});

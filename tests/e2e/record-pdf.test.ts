// The calculation record of the demo option printed by chromium (page.pdf, the print path "Save as
// PDF" takes) on A4 and US Letter, then read back with pdf.js: every page carries the running
// header and "Page i of n", the first page the title block with its signature boxes, and every
// section and check heading the page shows is in the document. Page 1 is rasterised to
// tests/artifacts/screenshots/record-pdf-page-1.png and its header band checked for ink.
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { expect, inject, test } from "vitest";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import { createCanvas } from "@napi-rs/canvas";
import { browserForFile, SCREENSHOT_DIR } from "./browser";

const { signIn } = browserForFile();

/** The text of each page, glyph runs joined by spaces and runs of space squeezed. */
async function pdfPages(pdf: Buffer) {
  const doc = await getDocument({ data: new Uint8Array(pdf), disableFontFace: true, useSystemFonts: false }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const content = await (await doc.getPage(i)).getTextContent();
    pages.push(content.items.map((it) => ("str" in it ? it.str : "")).join(" ").replace(/\s+/g, " "));
  }
  return { doc, pages };
}

const squeeze = (s: string) => s.replace(/\s+/g, " ").trim();

test("the demo option's record prints as a signed, numbered calculation on A4 and US Letter", async () => {
  const base = inject("baseUrl");
  const rev = await signIn("reviewer@tallowfield.example", "/projects");
  await rev.getByRole("link", { name: /Harbour Street cold store/ }).click();
  const href = await rev.locator('a[href^="/options/"]').first().getAttribute("href");
  expect(href).toMatch(/^\/options\/\d+$/);
  await rev.goto(`${base}${href}`);
  // The demo option waits for review; the reviewer approves it (unless an earlier test did).
  if (await rev.getByRole("button", { name: "Approve" }).count()) {
    await rev.getByLabel(/Comment/).fill("Checked by hand against the composite table.");
    await rev.getByRole("button", { name: "Approve" }).click();
    await rev.getByText("Option approved.").waitFor();
  }
  await rev.goto(`${base}${href}/record`);
  await rev.getByTestId("title-block").waitFor();
  await rev.emulateMedia({ media: "print" });

  // What the page itself lists: its numbered section headings and every check's name.
  const headings = (await rev.locator("article h2:not(.sr-only)").allTextContents()).map(squeeze).filter(Boolean);
  const checks = (await rev.locator("[data-check] td:first-child").allTextContents()).map((t) => squeeze(t.replace("(governs)", "")));
  expect(headings.length).toBeGreaterThanOrEqual(7);
  expect(checks.length).toBeGreaterThanOrEqual(3);
  const reviewerName = squeeze((await rev.getByTestId("sig-approved").textContent()) ?? "");
  expect(reviewerName).toMatch(/Approved.+\d{4}-\d{2}-\d{2}/);

  for (const format of ["A4", "Letter"] as const) {
    const pdf = await rev.pdf({ format, printBackground: true });
    const { doc, pages } = await pdfPages(pdf);
    const n = pages.length;
    expect(n, `${format}: the record runs over more than one page`).toBeGreaterThanOrEqual(2);
    // the paper size chosen is the one printed (A4 595.3 × 841.9 pt, Letter 612 × 792 pt; chromium
    // rounds A4 to 8.27 × 11.7 in, so within 1.5 pt)
    const vp = (await doc.getPage(1)).getViewport({ scale: 1 });
    const [w, h] = format === "A4" ? [595.3, 841.9] : [612, 792];
    expect(Math.abs(vp.width - w)).toBeLessThan(1.5);
    expect(Math.abs(vp.height - h)).toBeLessThan(1.5);
    pages.forEach((text, i) => {
      expect(text, `${format} page ${i + 1}`).toContain(`Page ${i + 1} of ${n}`);
      expect(text, `${format} page ${i + 1}: running header`).toMatch(/Harbour Street cold store: mezzanine · Job TPB-2611/);
      expect(text, `${format} page ${i + 1}: running header`).toMatch(/Member Primary beam, grid B · Revision A/);
    });
    const first = pages[0]!;
    for (const label of ["Project", "Job number", "TPB-2611", "Member mark", "Revision", "Prepared", "Checked", "Approved"]) expect(first, `${format}: title block`).toContain(label);
    const all = pages.join(" ");
    for (const h of headings) expect(all, `${format}: heading “${h}”`).toContain(h);
    for (const c of checks) expect(all, `${format}: check “${c}”`).toContain(c);

    if (format === "A4") {
      // Rasterise page 1 and look for ink in the top margin band, where only the running header prints.
      const page = await doc.getPage(1);
      const viewport = page.getViewport({ scale: 2 });
      const canvas = createCanvas(Math.ceil(viewport.width), Math.ceil(viewport.height));
      await page.render({ canvasContext: canvas.getContext("2d") as never, viewport }).promise;
      mkdirSync(SCREENSHOT_DIR, { recursive: true });
      writeFileSync(path.join(SCREENSHOT_DIR, "record-pdf-page-1.png"), canvas.toBuffer("image/png"));
      const mm = viewport.height / 297;
      const band = canvas.getContext("2d").getImageData(0, Math.round(5 * mm), canvas.width, Math.round(10 * mm)).data;
      let ink = 0;
      for (let i = 0; i < band.length; i += 4) if (band[i]! < 160 && band[i + 3]! > 0) ink++;
      expect(ink, "the running header is drawn in the top margin").toBeGreaterThan(200);
    }
  }
});

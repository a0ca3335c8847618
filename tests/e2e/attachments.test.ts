// Attaching a file in the browser: the engineer attaches a sketch to the demo option, a file of
// the wrong type is refused with the field named, and the record lists the attachment.
import { expect, inject, test } from "vitest";
import { browserForFile } from "./browser";

const { signIn } = browserForFile();

// a PNG signature and IHDR chunk: the server tells the type by these first bytes
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 6, 0, 0, 0]);

test("attach a sketch to an option; a text file named .png is refused; the record lists it", async () => {
  const base = inject("baseUrl");
  const eng = await signIn("engineer@tallowfield.example", "/projects");
  await eng.getByRole("link", { name: /Harbour Street cold store/ }).click();
  const href = await eng.locator('a[href^="/options/"]').first().getAttribute("href");
  await eng.goto(`${base}${href}`);

  await eng.getByLabel(/Attach a file/).setInputFiles({ name: "notes.png", mimeType: "image/png", buffer: Buffer.from("only words") });
  await eng.getByRole("button", { name: "Upload" }).click();
  await expect(eng.getByRole("alert").filter({ hasText: "file:" }).textContent()).resolves.toMatch(/file: “notes\.png” is not one of the accepted types/);

  await eng.getByLabel(/Attach a file/).setInputFiles({ name: "gridline B sketch.png", mimeType: "image/png", buffer: PNG });
  await eng.getByRole("button", { name: "Upload" }).click();
  await eng.getByTestId("attachments").getByRole("link", { name: "gridline B sketch.png" }).waitFor();

  const download = eng.waitForEvent("download");
  await eng.getByTestId("attachments").getByRole("link", { name: "gridline B sketch.png" }).click();
  expect((await download).suggestedFilename()).toBe("gridline B sketch.png");

  await eng.goto(`${base}${href}/record`);
  await expect(eng.getByTestId("record-attachments").textContent()).resolves.toContain("gridline B sketch.png");
});

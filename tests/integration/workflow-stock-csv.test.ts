// Stock-list upload through the route: good files are kept with every line; bad ones (wrong
// columns, text in numbers, empty, 10 MB) answer 4xx with line-numbered errors and write nothing.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { callRoute, loadRouteModule, requestAs, tableCounts } from "./fixtures";

afterAll(() => closeDb());

async function upload(csv: string | Uint8Array, name = "Test stock", intent = "save") {
  const fd = new FormData();
  fd.set("intent", intent);
  fd.set("name", name);
  fd.set("file", new Blob([csv as BlobPart], { type: "text/csv" }), "stock.csv");
  const mod = await loadRouteModule("routes/stock-lists.tsx");
  return callRoute(mod.action, await requestAs("engineer", "/stock-lists", { method: "POST", body: fd }));
}

type Lines = { errors: Record<string, string> | null; lines?: { line: number; message: string }[]; saved?: number; preview?: unknown[] };

describe("stock-list CSV upload", () => {
  test("a good file is kept for the team with every line", async () => {
    const res = await upload("thickness_mm,width_mm,price_per_kg\n6,1500,1.2\n8,1500,1.15\n10,2000,\n", "Good stock");
    expect(res.status).toBe(200);
    const id = (res.data as Lines).saved!;
    const list = await db("stock_lists").where({ id }).first();
    expect(list.name).toBe("Good stock");
    const items = await db("stock_list_items").where({ stock_list_id: id }).orderBy("thickness_mm");
    expect(items.map((i) => [i.thickness_mm, i.width_mm, i.price_per_kg])).toEqual([
      [6, 1500, 1.2],
      [8, 1500, 1.15],
      [10, 2000, null],
    ]);
  });

  test("preview shows the rows and keeps nothing", async () => {
    const before = await tableCounts();
    const res = await upload("thickness_mm\n6\n8\n", "Preview only", "preview");
    expect(res.status).toBe(200);
    expect((res.data as Lines).preview).toHaveLength(2);
    expect(await tableCounts()).toEqual(before);
  });

  const bad: [string, string | Uint8Array, number, RegExp][] = [
    ["wrong columns", "gauge,colour\n6,red\n", 400, /line 1: unknown column "gauge"/],
    ["text in numbers", "thickness_mm,price_per_kg\n6,1.1\n8,cheap\n", 400, /line 3: price_per_kg "cheap" is not a number/],
    ["an empty file", "", 400, /file is empty/],
    ["a 10 MB file", new Uint8Array(10 * 1024 * 1024).fill(0x36), 413, /too large: over the 1 MB limit/],
  ];
  for (const [label, csv, status, message] of bad) {
    test(`${label} → ${status}, a line-numbered message, nothing saved`, async () => {
      const before = await tableCounts();
      const res = await upload(csv);
      expect(res.status).toBe(status);
      expect((res.data as Lines).errors?.file).toMatch(message);
      expect(await tableCounts()).toEqual(before);
    });
  }

  test("a viewer may not upload", async () => {
    const fd = new FormData();
    fd.set("intent", "save");
    const mod = await loadRouteModule("routes/stock-lists.tsx");
    const res = await callRoute(mod.action, await requestAs("viewer", "/stock-lists", { method: "POST", body: fd }));
    expect(res.status).toBe(403);
  });
});

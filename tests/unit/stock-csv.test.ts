import { describe, expect, it } from "vitest";
import { parseStockCsv, stockThicknesses, STOCK_CSV_EXAMPLE } from "~/lib/stock-csv";

describe("stock-list CSV", () => {
  it("reads the example file", () => {
    const r = parseStockCsv(STOCK_CSV_EXAMPLE);
    expect(r).toEqual({
      ok: true,
      rows: [
        { thickness: 6, width: 1500, pricePerKg: 1.12 },
        { thickness: 8, width: 1500, pricePerKg: 1.1 },
        { thickness: 10, width: 2000, pricePerKg: 1.08 },
      ],
    });
  });
  it("takes a thickness-only file with blank lines and CRLF, keeping line numbers", () => {
    const r = parseStockCsv("thickness\r\n6\r\n\r\n8\r\n");
    expect(r.ok && r.rows.map((x) => x.thickness)).toEqual([6, 8]);
    const bad = parseStockCsv("thickness\n6\n\nabc\n");
    expect(bad).toEqual({ ok: false, errors: [{ line: 4, message: 'thickness_mm "abc" is not a number' }] });
  });
  it("names wrong columns on line 1", () => {
    const r = parseStockCsv("gauge,colour\n6,red\n");
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors[0]).toEqual({ line: 1, message: expect.stringContaining('unknown column "gauge"') });
      expect(r.errors.some((e) => e.message === "missing column thickness_mm")).toBe(true);
    }
  });
  it("reports text in numbers and negative values with their lines, and keeps no rows", () => {
    const r = parseStockCsv("thickness_mm,price_per_kg\n6,1.1\n8,cheap\n-10,1\n");
    expect(r).toEqual({
      ok: false,
      errors: [
        { line: 3, message: 'price_per_kg "cheap" is not a number' },
        { line: 4, message: "thickness_mm must be > 0" },
      ],
    });
  });
  it("refuses an empty file and a header-only file", () => {
    expect(parseStockCsv("")).toMatchObject({ ok: false, errors: [{ line: 0, message: expect.stringContaining("empty") }] });
    expect(parseStockCsv("thickness_mm\n")).toMatchObject({ ok: false, errors: [{ line: 1, message: "no data lines after the header" }] });
  });
  it("refuses a 10 MB file before parsing it", () => {
    const big = "thickness_mm\n" + "6\n".repeat(5 * 1024 * 1024);
    const r = parseStockCsv(big);
    expect(r).toMatchObject({ ok: false, errors: [{ line: 0, message: expect.stringMatching(/10\.0 MB; the limit is 1 MB/) }] });
  });
  it("flags a short row", () => {
    expect(parseStockCsv("thickness_mm,width_mm\n6\n")).toEqual({ ok: false, errors: [{ line: 2, message: "expected 2 values, found 1" }] });
  });
  it("lists distinct thicknesses ascending", () => {
    expect(stockThicknesses([{ thickness: 10 }, { thickness: 6 }, { thickness: 10 }])).toEqual([6, 10]);
  });
});

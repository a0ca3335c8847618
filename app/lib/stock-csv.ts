// Stock-list CSV: a fabricator's plate thicknesses, optionally widths and price per kg.
// Parsed with papaparse (no hand-written CSV splitting); every problem is reported with the
// line it is on, and a file with any error yields no rows, so nothing half-valid is kept.
import Papa from "papaparse";
import { MAX_THICKNESSES } from "~/optimizer/search-schema";

/** Larger files are refused before parsing (a stock list is a few dozen lines). */
export const STOCK_CSV_MAX_BYTES = 1024 * 1024;
export const STOCK_CSV_MAX_ROWS = 1000;
/** Most errors listed; a file wrong on every line would otherwise produce a wall of text. */
const MAX_ERRORS = 20;

export interface StockRow {
  /** mm */
  thickness: number;
  /** mm, optional */
  width: number | null;
  /** per kg, in the team's currency, optional */
  pricePerKg: number | null;
}

export interface StockCsvError {
  /** 1-based line in the file; 0 for the file as a whole */
  line: number;
  message: string;
}

export type StockCsvResult = { ok: true; rows: StockRow[] } | { ok: false; errors: StockCsvError[] };

// Accepted header spellings → our column. Units are stated in the header or assumed mm.
const HEADERS: Record<string, keyof StockRow> = {
  thickness: "thickness",
  thickness_mm: "thickness",
  "thickness (mm)": "thickness",
  t: "thickness",
  width: "width",
  width_mm: "width",
  "width (mm)": "width",
  price_per_kg: "pricePerKg",
  "price per kg": "pricePerKg",
  priceperkg: "pricePerKg",
  price: "pricePerKg",
};

/**
 * A decimal number as people write one in a stock list: digits, an optional decimal point and an
 * optional exponent (6, 0.5, .5, 1e1). Number() alone would also take 0x10, 0b11, 0o7 and "Infinity"
 * (issue 9): a hexadecimal thickness is a mistake, never a plate.
 */
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

export const STOCK_CSV_EXAMPLE = "thickness_mm,width_mm,price_per_kg\n6,1500,1.12\n8,1500,1.10\n10,2000,1.08\n";

export function parseStockCsv(text: string, byteLength = new TextEncoder().encode(text).length): StockCsvResult {
  if (byteLength > STOCK_CSV_MAX_BYTES)
    return { ok: false, errors: [{ line: 0, message: `file is ${(byteLength / 1024 / 1024).toFixed(1)} MB; the limit is ${STOCK_CSV_MAX_BYTES / 1024 / 1024} MB` }] };
  const body = text.replace(/^\uFEFF/, "");
  if (body.trim() === "") return { ok: false, errors: [{ line: 0, message: "file is empty: expected a header line such as thickness_mm,width_mm,price_per_kg" }] };

  const parsed = Papa.parse<string[]>(body, { skipEmptyLines: true, delimiter: "," });
  const errors: StockCsvError[] = [];
  const push = (line: number, message: string) => {
    if (errors.length < MAX_ERRORS) errors.push({ line, message });
  };
  for (const e of parsed.errors) push((e.row ?? 0) + 1, `CSV: ${e.message}`);

  // papaparse drops empty lines (skipEmptyLines: true drops exactly the zero-length ones), so the line number comes from each row's position in the text.
  const lines = lineNumbers(body);
  const [header, ...records] = parsed.data;
  const headerLine = lines[0] ?? 1;
  const cols = header.map((h) => HEADERS[h.trim().toLowerCase()]);
  header.forEach((h, i) => {
    if (!cols[i]) push(headerLine, `unknown column "${h.trim().slice(0, 40)}" (expected thickness_mm and optionally width_mm, price_per_kg)`);
  });
  const seen = new Set<string>();
  for (const c of cols) {
    if (c && seen.has(c)) push(headerLine, `column ${c} appears twice`);
    if (c) seen.add(c);
  }
  if (!cols.includes("thickness")) push(headerLine, "missing column thickness_mm");
  if (errors.length) return { ok: false, errors };
  if (records.length === 0) return { ok: false, errors: [{ line: headerLine, message: "no data lines after the header" }] };
  if (records.length > STOCK_CSV_MAX_ROWS)
    return { ok: false, errors: [{ line: 0, message: `${records.length} data lines; at most ${STOCK_CSV_MAX_ROWS}` }] };

  const rows: StockRow[] = [];
  records.forEach((rec, i) => {
    const line = lines[i + 1] ?? i + 2;
    if (rec.length !== header.length) {
      push(line, `expected ${header.length} values, found ${rec.length}`);
      return;
    }
    const row: StockRow = { thickness: NaN, width: null, pricePerKg: null };
    cols.forEach((c, j) => {
      const raw = rec[j].trim();
      if (raw === "") {
        if (c === "thickness") push(line, "thickness_mm is empty");
        return;
      }
      const x = DECIMAL.test(raw) ? Number(raw) : NaN;
      if (!Number.isFinite(x)) push(line, `${columnName(c!)} "${raw.slice(0, 20)}" is not a number${/^[+-]?0[xbo]/i.test(raw) ? " (write it in decimal)" : ""}`);
      else if (!(x > 0)) push(line, `${columnName(c!)} must be > 0`);
      else if (c === "thickness" && x > 500) push(line, "thickness_mm over 500 mm (is the column in mm?)");
      else row[c!] = x;
    });
    rows.push(row);
  });
  if (errors.length) return { ok: false, errors };
  // A brief takes the list's thicknesses as its own, and a brief lists at most MAX_THICKNESSES.
  const distinct = stockThicknesses(rows).length;
  if (distinct > MAX_THICKNESSES)
    return { ok: false, errors: [{ line: 0, message: `thickness_mm: ${distinct} different thicknesses; a brief takes at most ${MAX_THICKNESSES}, so a stock list may list at most ${MAX_THICKNESSES}` }] };
  return { ok: true, rows };
}

function columnName(c: keyof StockRow): string {
  return c === "thickness" ? "thickness_mm" : c === "width" ? "width_mm" : "price_per_kg";
}

/** 1-based line numbers of the non-empty lines, in order. */
function lineNumbers(text: string): number[] {
  const out: number[] = [];
  text.split(/\r\n|\n|\r/).forEach((l, i) => {
    if (l !== "") out.push(i + 1);
  });
  return out;
}

/** The distinct thicknesses of a stock list, ascending (what a brief's thickness list takes). */
export function stockThicknesses(rows: Pick<StockRow, "thickness">[]): number[] {
  return [...new Set(rows.map((r) => r.thickness))].sort((a, b) => a - b);
}

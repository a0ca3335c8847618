// Catalogue CSV: a team's table of rolled and hollow sections, in a column layout of our own
// (CATALOGUE_CSV_HELP, shown on the upload page and in the README). Parsed with papaparse.
//
// Two kinds of trouble, treated differently:
// - the file is malformed (too large, too many lines, a header we do not know, a line with the
//   wrong number of values, a value that is not a number where one is due, a line without a
//   designation): nothing is kept, and every problem is listed with its line;
// - a row is readable but wrong (unknown shape, a dimension missing or foreign to the shape, a
//   geometry the engine refuses, a printed value the engine's own figure from the dimensions
//   disagrees with beyond the printed rounding, a designation used twice): that row is kept out
//   and listed with its line, field, printed and computed values; the other rows are kept.
import Papa from "papaparse";
import {
  CATALOGUE_SHAPES,
  PRINTED_FIELDS,
  PRINTED_NUMBER,
  PRINTED_UNITS,
  SHAPE_DIMENSIONS,
  SHAPE_WORDS,
  catalogueGeometryViolation,
  catalogueSectionProperties,
  comparePrinted,
  designationSchema,
  type CatalogueDimension,
  type CatalogueShape,
  type PrintedField,
} from "~/optimizer";

/** Larger files are refused before parsing (a catalogue of every European rolled size is about 100 kB). */
export const CATALOGUE_CSV_MAX_BYTES = 512 * 1024;
export const CATALOGUE_CSV_MAX_ROWS = 2000;
/** Most file errors listed; most kept-out rows listed (the count is always given). */
const MAX_FILE_ERRORS = 30;
export const MAX_REJECTED_LISTED = 200;

type Column =
  | { kind: "designation" }
  | { kind: "shape" }
  | { kind: "dim"; dim: CatalogueDimension }
  | { kind: "printed"; field: PrintedField };

/** Header → column (matched case-insensitively, surrounding spaces ignored). Order is free. */
export const CATALOGUE_COLUMNS: Record<string, Column> = {
  designation: { kind: "designation" },
  shape: { kind: "shape" },
  d_mm: { kind: "dim", dim: "d" },
  b_mm: { kind: "dim", dim: "b" },
  tw_mm: { kind: "dim", dim: "tw" },
  tf_mm: { kind: "dim", dim: "tf" },
  t_mm: { kind: "dim", dim: "t" },
  r_mm: { kind: "dim", dim: "r" },
  r_toe_mm: { kind: "dim", dim: "rt" },
  ro_mm: { kind: "dim", dim: "ro" },
  ri_mm: { kind: "dim", dim: "ri" },
  a_cm2: { kind: "printed", field: "A" },
  iz_cm4: { kind: "printed", field: "Iz" },
  iy_cm4: { kind: "printed", field: "Iy" },
  sz_cm3: { kind: "printed", field: "Sz" },
  zz_cm3: { kind: "printed", field: "Zz" },
  mass_kg_m: { kind: "printed", field: "mass" },
};

/** The header each dimension and printed field is written under (for messages). */
export const DIM_HEADER: Record<CatalogueDimension, string> = { d: "d_mm", b: "b_mm", tw: "tw_mm", tf: "tf_mm", t: "t_mm", r: "r_mm", rt: "r_toe_mm", ro: "ro_mm", ri: "ri_mm" };
export const PRINTED_HEADER: Record<PrintedField, string> = { A: "A_cm2", Iz: "Iz_cm4", Iy: "Iy_cm4", Sz: "Sz_cm3", Zz: "Zz_cm3", mass: "mass_kg_m" };

/** Shape words accepted in the shape column (case-insensitive) → shape. */
const SHAPE_ALIASES: Record<string, CatalogueShape> = {
  i: "I",
  h: "I",
  channel: "channel",
  tee: "tee",
  angle: "angle",
  rhs: "rhs",
  shs: "rhs",
  "rectangular hollow": "rhs",
  "square hollow": "rhs",
  chs: "chs",
  "circular hollow": "chs",
};

/** Dimensions beyond this are refused as a likely unit slip (metres or inches typed as mm are far smaller; this catches cm × 10 typed twice). */
const MAX_DIM_MM = 2000;

export const CATALOGUE_CSV_EXAMPLE = [
  "# dimensions in mm; printed values optional, in the units of their headers",
  "designation,shape,d_mm,b_mm,tw_mm,tf_mm,t_mm,r_mm,r_toe_mm,ro_mm,ri_mm,A_cm2,Iz_cm4,Iy_cm4,Sz_cm3,Zz_cm3,mass_kg_m",
  "IPE 300,I,300,150,7.1,10.7,,15,,,,53.8,8356,603.8,557.1,628.4,42.2",
  "RHS 200x100x10,rhs,200,100,,,10,,,15,10,54.9,,,,,43.1",
  "CHS 168.3x10,chs,168.3,,,,10,,,,,49.7,1564,1564,186,251,39.0",
].join("\n");

/** What the upload page and the README say about the layout (one text, two places). */
export const CATALOGUE_CSV_HELP = {
  columns: [
    ["designation", "the section's name as the drawing calls it (unique in the file, at most 60 characters)"],
    ["shape", `one of ${CATALOGUE_SHAPES.join(", ")} (${CATALOGUE_SHAPES.map((s) => `${s}: ${SHAPE_WORDS[s]}`).join("; ")})`],
    ["d_mm, b_mm", "overall depth and width (chs: d_mm is the outside diameter, no b_mm)"],
    ["tw_mm, tf_mm", "web and flange thickness (I, channel, tee)"],
    ["t_mm", "leg or wall thickness (angle, rhs, chs)"],
    ["r_mm", "root radius between web and flange or between the legs (I, channel, tee, angle; blank = 0)"],
    ["r_toe_mm", "angle only: radius at the inner corner of each leg tip (blank = 0)"],
    ["ro_mm, ri_mm", "rhs only: outer and inner corner radius (required; e.g. 1.5·t and 1.0·t for hot-finished sections)"],
    ["A_cm2, Iz_cm4, Iy_cm4, Sz_cm3, Zz_cm3, mass_kg_m", "optional printed values: area; second moments about the horizontal and the vertical axis; the smaller elastic and the plastic modulus about the horizontal axis; mass per metre at 7850 kg/m³"],
  ] as const,
  notes: [
    "Iz is about the horizontal axis: the strong axis of an I or channel standing upright (tables often call it y–y).",
    "Every printed value is compared with the engine's figure computed from the dimensions; it must agree within half a unit of its last printed digit plus 0.03% (a whole number ending in zeros counts as printed to four significant figures).",
    "Rows that disagree, or whose dimensions do not make a valid section, are kept out and listed with their line; the other rows are kept. A malformed file (unknown column, wrong number of values, a value that is not a number) keeps nothing.",
    "Lines starting with # are comments. Columns may come in any order; only designation, shape and d_mm must be present.",
    `At most ${CATALOGUE_CSV_MAX_BYTES / 1024} kB and ${CATALOGUE_CSV_MAX_ROWS} sections per file.`,
  ] as const,
};

export interface CatalogueFileError {
  /** 1-based line; 0 for the file as a whole */
  line: number;
  message: string;
}

export interface CatalogueCsvSection {
  line: number;
  designation: string;
  shape: CatalogueShape;
  /** mm */
  dims: Partial<Record<CatalogueDimension, number>>;
  /** as printed (text keeps the rounding) */
  printed: Partial<Record<PrintedField, string>>;
  /** computed, mm² and kg/m at 7850 kg/m³ */
  area: number;
  massPerMetre: number;
}

export interface RejectedRow {
  line: number;
  designation: string;
  /** the column at fault, by its header */
  field: string;
  message: string;
  printed?: string;
  computed?: number;
}

export type CatalogueCsvResult =
  | { ok: false; errors: CatalogueFileError[] }
  | { ok: true; sections: CatalogueCsvSection[]; rejected: RejectedRow[]; rejectedRows: number; rows: number };

/** 1-based line numbers of the lines papaparse returns rows for (not empty, not # comments). */
function dataLines(text: string): number[] {
  const out: number[] = [];
  text.split(/\r\n|\n|\r/).forEach((l, i) => {
    if (l !== "" && !l.startsWith("#")) out.push(i + 1);
  });
  return out;
}

/** A computed value rounded for a message: two more decimals than printed. */
function shown(computed: number, printed: string): number {
  const dot = printed.indexOf(".");
  const decimals = dot >= 0 ? printed.length - dot - 1 : 0;
  return Number(computed.toFixed(Math.min(6, decimals + 2)));
}

export function parseCatalogueCsv(text: string, byteLength = new TextEncoder().encode(text).length): CatalogueCsvResult {
  if (byteLength > CATALOGUE_CSV_MAX_BYTES)
    return { ok: false, errors: [{ line: 0, message: `file is ${Math.ceil(byteLength / 1024)} kB; the limit is ${CATALOGUE_CSV_MAX_BYTES / 1024} kB` }] };
  const body = text.replace(/^\uFEFF/, "");
  if (body.replace(/^#.*$/gm, "").trim() === "") return { ok: false, errors: [{ line: 0, message: "file is empty: expected a header line starting designation,shape,d_mm" }] };

  const parsed = Papa.parse<string[]>(body, { skipEmptyLines: true, delimiter: ",", comments: "#" });
  const errors: CatalogueFileError[] = [];
  const fileError = (line: number, message: string) => {
    if (errors.length < MAX_FILE_ERRORS) errors.push({ line, message });
  };
  const lines = dataLines(body);
  for (const e of parsed.errors) fileError(lines[e.row ?? 0] ?? 0, `CSV: ${e.message}`);
  // A quoted value running over a line end would shift every later line number: refuse it.
  if (!errors.length && parsed.data.length !== lines.length) return { ok: false, errors: [{ line: 0, message: "a quoted value spans more than one line; keep each section on one line" }] };
  if (errors.length) return { ok: false, errors };

  const [header, ...records] = parsed.data;
  const headerLine = lines[0] ?? 1;
  const cols = header.map((h) => CATALOGUE_COLUMNS[h.trim().toLowerCase()]);
  header.forEach((h, i) => {
    if (!cols[i]) fileError(headerLine, `unknown column "${h.trim().slice(0, 40)}" (columns: ${Object.values({ ...DIM_HEADER }).join(", ")}, ${Object.values(PRINTED_HEADER).join(", ")}, designation, shape)`);
  });
  const seen = new Set<string>();
  header.forEach((h, i) => {
    const k = h.trim().toLowerCase();
    if (cols[i] && seen.has(k)) fileError(headerLine, `column ${h.trim()} appears twice`);
    seen.add(k);
  });
  for (const need of ["designation", "shape", "d_mm"]) if (!seen.has(need)) fileError(headerLine, `missing column ${need}`);
  if (errors.length) return { ok: false, errors };
  if (records.length === 0) return { ok: false, errors: [{ line: headerLine, message: "no sections after the header" }] };
  if (records.length > CATALOGUE_CSV_MAX_ROWS) return { ok: false, errors: [{ line: 0, message: `${records.length} sections; at most ${CATALOGUE_CSV_MAX_ROWS} per file` }] };

  // First pass: structure and types. Any failure here means the file is malformed.
  type Raw = { line: number; designation: string; shapeText: string; dims: Partial<Record<CatalogueDimension, number>>; dimText: Partial<Record<CatalogueDimension, string>>; printed: Partial<Record<PrintedField, string>> };
  const raws: Raw[] = [];
  records.forEach((rec, i) => {
    const line = lines[i + 1] ?? i + 2;
    if (rec.length !== header.length) {
      fileError(line, `expected ${header.length} values, found ${rec.length}`);
      return;
    }
    const raw: Raw = { line, designation: "", shapeText: "", dims: {}, dimText: {}, printed: {} };
    cols.forEach((c, j) => {
      const v = rec[j]!.trim();
      if (c!.kind === "designation") {
        const d = designationSchema.safeParse(v);
        if (!d.success) fileError(line, d.error.issues[0]!.message);
        else raw.designation = d.data;
      } else if (c!.kind === "shape") raw.shapeText = v;
      else if (v === "") return;
      else if (c!.kind === "dim") {
        const x = Number(v);
        if (!PRINTED_NUMBER.test(v) || !Number.isFinite(x)) fileError(line, `${DIM_HEADER[c!.dim]} "${v.slice(0, 20)}" is not a number (mm, digits and a decimal point)`);
        else {
          raw.dims[c!.dim] = x;
          raw.dimText[c!.dim] = v;
        }
      } else {
        if (!PRINTED_NUMBER.test(v)) fileError(line, `${PRINTED_HEADER[c!.field]} "${v.slice(0, 20)}" is not a number as printed (digits and a decimal point)`);
        else raw.printed[c!.field] = v;
      }
    });
    raws.push(raw);
  });
  if (errors.length) return { ok: false, errors };

  // Second pass: each row against the shape's rules and the engine.
  const sections: CatalogueCsvSection[] = [];
  const rejected: RejectedRow[] = [];
  let rejectedRows = 0;
  const taken = new Map<string, number>();
  for (const r of raws) {
    const problems: RejectedRow[] = [];
    const problem = (field: string, message: string, extra: Partial<RejectedRow> = {}) => problems.push({ line: r.line, designation: r.designation, field, message, ...extra });
    const shape = SHAPE_ALIASES[r.shapeText.toLowerCase()];
    const key = r.designation.toLowerCase();
    if (taken.has(key)) problem("designation", `“${r.designation}” is already on line ${taken.get(key)}`);
    else taken.set(key, r.line);
    if (!shape) problem("shape", r.shapeText ? `unknown shape “${r.shapeText.slice(0, 30)}” (one of ${CATALOGUE_SHAPES.join(", ")})` : "shape is empty");
    else {
      const { required, optional } = SHAPE_DIMENSIONS[shape];
      for (const k of required) if (r.dims[k as CatalogueDimension] === undefined) problem(DIM_HEADER[k as CatalogueDimension], `${shape} needs ${DIM_HEADER[k as CatalogueDimension]}`);
      for (const k of Object.keys(r.dims) as CatalogueDimension[]) {
        if (!required.includes(k) && !optional.includes(k)) problem(DIM_HEADER[k], `${shape} takes no ${DIM_HEADER[k]} (leave it blank)`);
        else if (r.dims[k]! > MAX_DIM_MM) problem(DIM_HEADER[k], `${DIM_HEADER[k]} ${r.dimText[k]} is over ${MAX_DIM_MM} mm (is the column in mm?)`);
      }
      if (!problems.length) {
        const bad = catalogueGeometryViolation(shape, r.dims);
        if (bad) problem(DIM_HEADER[bad.field as CatalogueDimension] ?? bad.field, bad.message);
      }
      if (!problems.length) {
        const p = catalogueSectionProperties({ shape, dims: r.dims });
        for (const m of comparePrinted(p, r.printed))
          problem(PRINTED_HEADER[m.field], `printed ${m.printed} ${PRINTED_UNITS[m.field]}, computed ${shown(m.computed, m.printed)} ${PRINTED_UNITS[m.field]} from the dimensions (allowed ± ${Number(m.allowance.toPrecision(2))})`, {
            printed: m.printed,
            computed: shown(m.computed, m.printed),
          });
        if (!problems.length) sections.push({ line: r.line, designation: r.designation, shape, dims: r.dims, printed: r.printed, area: p.area, massPerMetre: p.massPerMetre });
      }
    }
    if (problems.length) {
      rejectedRows++;
      for (const q of problems) if (rejected.length < MAX_REJECTED_LISTED) rejected.push(q);
    }
  }
  return { ok: true, sections, rejected, rejectedRows, rows: raws.length };
}

// The catalogue CSV check (app/lib/catalogue-csv.ts): a good file, a typo in one printed value
// caught with its line, malformed files refused whole, row problems kept out row by row, limits.
// The printed values in the good files are section-table figures recalled from memory (mem.):
// IPE 300 and HE 300 B from the EN 10365 sizes' tables, RHS 200 × 100 × 10 and CHS 168.3 × 10 from
// EN 10210-2's; L 100 × 100 × 10 from EN 10056-1's (A 19.2 cm², 15.0 kg/m, I 177 cm⁴).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import {
  CATALOGUE_CSV_EXAMPLE,
  CATALOGUE_CSV_MAX_BYTES,
  CATALOGUE_CSV_MAX_ROWS,
  parseCatalogueCsv,
  type CatalogueCsvResult,
} from "~/lib/catalogue-csv";
import { printedAllowance, sectionProperties } from "~/optimizer";

const HEADER = "designation,shape,d_mm,b_mm,tw_mm,tf_mm,t_mm,r_mm,r_toe_mm,ro_mm,ri_mm,A_cm2,Iz_cm4,Iy_cm4,Sz_cm3,Zz_cm3,mass_kg_m";
const GOOD = [
  HEADER,
  "IPE 300,I,300,150,7.1,10.7,,15,,,,53.8,8356,603.8,557.1,628.4,42.2",
  "HE 300 B,I,300,300,11,19,,27,,,,149.1,25170,8563,1678,1869,117",
  "RHS 200x100x10,rhs,200,100,,,10,,,15,10,54.9,,,,,43.1",
  "CHS 168.3x10,chs,168.3,,,,10,,,,,49.7,1564,1564,186,251,39.0",
  "L 100x100x10,angle,100,100,,,10,12,6,,,19.2,177,177,,,15.0",
].join("\n");

const ok = (r: CatalogueCsvResult) => {
  if (!r.ok) throw new Error(`expected a readable file, got ${JSON.stringify(r.errors)}`);
  return r;
};
const refused = (r: CatalogueCsvResult) => {
  if (r.ok) throw new Error("expected the file to be refused");
  return r.errors;
};

describe("a good file", () => {
  it("keeps every row, with area and mass from the engine", () => {
    const r = ok(parseCatalogueCsv(GOOD));
    expect(r.rejected).toEqual([]);
    expect(r.sections.map((s) => s.designation)).toEqual(["IPE 300", "HE 300 B", "RHS 200x100x10", "CHS 168.3x10", "L 100x100x10"]);
    expect(r.sections[0]).toMatchObject({ line: 2, shape: "I", dims: { d: 300, b: 150, tw: 7.1, tf: 10.7, r: 15 }, printed: { A: "53.8", mass: "42.2" } });
    expect(r.sections[0]!.massPerMetre).toBeCloseTo(42.24, 2);
    expect(r.sections[4]!.dims).toEqual({ d: 100, b: 100, t: 10, r: 12, rt: 6 });
  });

  it("the page's example passes its own check", () => {
    const r = ok(parseCatalogueCsv(CATALOGUE_CSV_EXAMPLE));
    expect(r.rejected).toEqual([]);
    expect(r.sections).toHaveLength(3);
  });

  it("columns in any order, shape words in any case, # comments and blank lines keep the line numbers", () => {
    const csv = ["# a comment", "", "shape,designation,d_mm,tf_mm,b_mm,tw_mm,r_mm,A_cm2", "", "i,IPE 300,300,10.7,150,7.1,15,53.8", "# another", "H,HE 300 B,300,19,300,11,27,149.1"].join("\r\n");
    const r = ok(parseCatalogueCsv(csv));
    expect(r.sections.map((s) => [s.line, s.shape])).toEqual([
      [5, "I"],
      [7, "I"],
    ]);
  });
});

describe("a deliberate typo in one printed value", () => {
  it("keeps the row out, naming its line, field, printed and computed values; the other rows are kept", () => {
    // IPE 300's Iz 8356 typed as 8536 (two digits swapped) on line 2
    const csv = GOOD.replace("53.8,8356,", "53.8,8536,");
    const r = ok(parseCatalogueCsv(csv));
    expect(r.sections.map((s) => s.designation)).not.toContain("IPE 300");
    expect(r.sections).toHaveLength(4);
    expect(r.rejectedRows).toBe(1);
    expect(r.rejected).toHaveLength(1);
    expect(r.rejected[0]).toMatchObject({ line: 2, designation: "IPE 300", field: "Iz_cm4", printed: "8536" });
    expect(r.rejected[0]!.computed).toBeCloseTo(8356, -1);
    expect(r.rejected[0]!.message).toMatch(/printed 8536 cm⁴, computed 835\d\.\d+ cm⁴/);
  });

  it("a swapped last pair of digits in a four-figure value (8356 → 8365) is caught too", () => {
    const r = ok(parseCatalogueCsv(GOOD.replace("53.8,8356,", "53.8,8365,")));
    expect(r.rejected.map((x) => [x.line, x.field])).toEqual([[2, "Iz_cm4"]]);
  });

  it("a dimension typo shows up through the printed values it breaks (tf 10.7 typed 17.0)", () => {
    const r = ok(parseCatalogueCsv(GOOD.replace("300,150,7.1,10.7", "300,150,7.1,17.0")));
    expect(new Set(r.rejected.map((x) => x.line))).toEqual(new Set([2]));
    expect(r.rejected.map((x) => x.field)).toContain("A_cm2");
  });
});

describe("the printed rounding (half a unit of the last printed digit + 0.03%)", () => {
  it.each([
    ["53.8", 0.05 + 3e-4 * 53.8],
    ["8356", 0.5 + 3e-4 * 8356],
    ["0.5", 0.05 + 3e-4 * 0.5],
    ["23130", 5 + 3e-4 * 23130],
    ["1000", 0.5 + 3e-4 * 1000],
    ["117", 0.5 + 3e-4 * 117],
    ["42.20", 0.005 + 3e-4 * 42.2],
  ])("%s allows ± %f", (printed, allowed) => {
    expect(printedAllowance(printed)).toBeCloseTo(allowed, 12);
  });
});

describe("malformed files are refused whole, every problem with its line", () => {
  const bad: [string, string, RegExp][] = [
    ["an unknown column", "designation,shape,d_mm,colour\nX,I,300,red\n", /unknown column "colour"/],
    ["a missing designation column", "shape,d_mm\nI,300\n", /missing column designation/],
    ["a column twice", "designation,shape,d_mm,d_mm\nX,I,300,300\n", /column d_mm appears twice/],
    ["a line with too few values", `${HEADER}\nIPE 300,I,300,150\n`, /^expected 17 values, found 4$/],
    ["text where a dimension is due", GOOD.replace("300,150,7.1", "300,15O,7.1"), /b_mm "15O" is not a number/],
    ["a printed value with a thousands separator", GOOD.replace("25170", '"25,170"'), /Iz_cm4 "25,170" is not a number as printed/],
    ["a negative dimension", GOOD.replace("300,150,7.1", "300,-150,7.1"), /b_mm "-150" is not a number/],
    ["a line without a designation", `${HEADER}\n,I,300,150,7.1,10.7,,15,,,,,,,,,\n`, /designation is required/],
    ["an empty file", "", /file is empty/],
    ["only comments", "# nothing here\n", /file is empty/],
    ["a header and nothing else", `${HEADER}\n`, /no sections after the header/],
    ["a quoted value running over a line end", `${HEADER}\n"IPE\n300",I,300,150,7.1,10.7,,15,,,,,,,,,\n`, /spans more than one line/],
  ];
  it.each(bad)("%s", (_label, csv, message) => {
    const errors = refused(parseCatalogueCsv(csv));
    expect(errors.map((e) => e.message).join(" | ")).toMatch(message);
  });

  it("the line number of a bad value is its line in the file (comments and blank lines counted)", () => {
    const csv = `# header follows\n${HEADER}\n\nIPE 300,I,300,150,7.1,10.7,,15,,,,53.8,8356,603.8,557.1,628.4,42.2\nHE 300 B,I,300,abc,11,19,,27,,,,,,,,,\n`;
    expect(refused(parseCatalogueCsv(csv))).toEqual([{ line: 5, message: 'b_mm "abc" is not a number (mm, digits and a decimal point)' }]);
  });
});

describe("rows that are readable but wrong are kept out, the rest kept", () => {
  it.each([
    ["an unknown shape", "Trial 300,zed,300,150,7.1,10.7,,15,,,,,,,,,", "shape", /unknown shape “zed”/],
    ["a missing dimension", "Trial 300,I,300,150,,10.7,,15,,,,,,,,,", "tw_mm", /I needs tw_mm/],
    ["a dimension foreign to the shape", "Trial 300,I,300,150,7.1,10.7,10,15,,,,,,,,,", "t_mm", /I takes no t_mm/],
    ["a geometry the engine refuses", "Trial 300,I,300,150,7.1,160,,15,,,,,,,,,", "d_mm", /d must exceed 2·tf/],
    ["a root radius too large", "Trial 300,I,300,150,7.1,10.7,,80,,,,,,,,,", "r_mm", /r must not exceed/],
    ["a unit slip (cm × 10 twice)", "Trial 300,I,30000,150,7.1,10.7,,15,,,,,,,,,", "d_mm", /over 2000 mm/],
    ["an rhs without its corner radii", "RHS,rhs,200,100,,,10,,,,,,,,,,", "ro_mm", /rhs needs ro_mm/],
  ])("%s", (_label, row, field, message) => {
    const r = ok(parseCatalogueCsv(`${GOOD}\n${row}`));
    expect(r.sections).toHaveLength(5);
    expect(r.rejectedRows).toBe(1);
    expect(r.rejected[0]).toMatchObject({ line: 7, field });
    expect(r.rejected[0]!.message).toMatch(message);
  });

  it("a designation used twice keeps the later line out (case and spaces ignored)", () => {
    const r = ok(parseCatalogueCsv(`${GOOD}\n ipe 300 ,I,300,150,7.1,10.7,,15,,,,,,,,,`));
    expect(r.rejected[0]).toMatchObject({ line: 7, field: "designation" });
    expect(r.rejected[0]!.message).toMatch(/already on line 2/);
  });
});

describe("limits", () => {
  it(`a file over ${CATALOGUE_CSV_MAX_BYTES / 1024} kB is refused before parsing`, () => {
    const big = `${HEADER}\n` + "x".repeat(CATALOGUE_CSV_MAX_BYTES);
    expect(refused(parseCatalogueCsv(big))[0]!.message).toMatch(/the limit is 512 kB/);
  });

  it(`more than ${CATALOGUE_CSV_MAX_ROWS} sections are refused`, () => {
    const rows = Array.from({ length: CATALOGUE_CSV_MAX_ROWS + 1 }, (_, i) => `S${i},chs,100,5`);
    const errors = refused(parseCatalogueCsv(`designation,shape,d_mm,t_mm\n${rows.join("\n")}`));
    expect(errors[0]!.message).toBe(`${CATALOGUE_CSV_MAX_ROWS + 1} sections; at most ${CATALOGUE_CSV_MAX_ROWS} per file`);
  });

  it(`exactly ${CATALOGUE_CSV_MAX_ROWS} sections are read`, () => {
    const rows = Array.from({ length: CATALOGUE_CSV_MAX_ROWS }, (_, i) => `S${i},chs,${100 + i / 10},5`);
    expect(ok(parseCatalogueCsv(`designation,shape,d_mm,t_mm\n${rows.join("\n")}`)).sections).toHaveLength(CATALOGUE_CSV_MAX_ROWS);
  });

  it("a file wrong on every line lists a bounded number of problems", () => {
    const rows = Array.from({ length: 500 }, (_, i) => `S${i},I,abc`);
    expect(refused(parseCatalogueCsv(`designation,shape,d_mm\n${rows.join("\n")}`)).length).toBeLessThanOrEqual(30);
  });
});

describe("the starter catalogue (db/seeds/starter-catalogue.csv)", () => {
  const text = readFileSync("db/seeds/starter-catalogue.csv", "utf8");
  const r = ok(parseCatalogueCsv(text));

  it("says its dimensions are recalled and must be verified against EN 10365", () => {
    expect(text).toMatch(/Dimensions as recalled from EN 10365/);
    expect(text).toMatch(/verify against the standard/);
  });

  it("passes the upload check on every row: a few dozen IPE, HEA, HEB and UPE sizes", () => {
    expect(r.rejected).toEqual([]);
    expect(r.sections.length).toBeGreaterThanOrEqual(36);
    for (const series of ["IPE", "HEA", "HEB", "UPE"]) expect(r.sections.some((s) => s.designation.startsWith(`${series} `))).toBe(true);
    expect(r.sections.filter((s) => s.shape === "channel").every((s) => s.designation.startsWith("UPE"))).toBe(true);
  });

  it("holds the eight sections of tests/optimizer/rolled-sections.test.ts with the same dimensions", () => {
    const same: [string, number, number, number, number, number][] = [
      ["IPE 100", 100, 55, 4.1, 5.7, 7],
      ["IPE 200", 200, 100, 5.6, 8.5, 12],
      ["IPE 300", 300, 150, 7.1, 10.7, 15],
      ["IPE 400", 400, 180, 8.6, 13.5, 21],
      ["IPE 500", 500, 200, 10.2, 16, 21],
      ["HEA 200", 190, 200, 6.5, 10, 18],
      ["HEA 300", 290, 300, 8.5, 14, 27],
      ["HEB 300", 300, 300, 11, 19, 27],
    ];
    for (const [name, d, b, tw, tf, rr] of same) expect(r.sections.find((s) => s.designation === name)?.dims).toEqual({ d, b, tw, tf, r: rr });
  });

  it("every section's stored mass is the engine's at 7850 kg/m³", () => {
    for (const s of r.sections) {
      const input = { family: s.shape === "I" ? "i" : "channel", ...s.dims } as Parameters<typeof sectionProperties>[0];
      expect(s.massPerMetre).toBeCloseTo(sectionProperties(input).massPerMetre, 9);
    }
  });
});

describe("the layout is documented where the issue asks", () => {
  it("the README names every column and states the tolerance and limits", () => {
    const readme = readFileSync("README.md", "utf8");
    for (const col of HEADER.split(",")) expect(readme).toContain(`\`${col}\``);
    expect(readme).toMatch(/half a unit\s+of its last printed digit plus 0\.03%/);
    expect(readme).toContain(`${CATALOGUE_CSV_MAX_BYTES / 1024} kB and ${CATALOGUE_CSV_MAX_ROWS} sections per file`);
  });
});

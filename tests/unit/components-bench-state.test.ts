// The bench's URL state and its conversion to engine input (app/lib/bench-state.ts), and the
// worker's entry called directly (no Worker needed in node).
import { describe, expect, test } from "vitest";
import {
  benchHref,
  benchLoads,
  benchSectionInput,
  benchStateFromSection,
  convertBenchState,
  decodeBenchState,
  defaultBenchState,
  encodeBenchState,
  parsePoints,
  parseSectionInput,
  type BenchState,
} from "~/lib/bench-state";
import { analyseSection } from "~/workers/section.worker";
import { sectionProperties } from "~/optimizer";

const strip = (s: BenchState) => ({ ...s, plates: s.plates.map(({ id: _i, ...p }) => p), polygons: s.polygons.map(({ id: _i, ...g }) => g) });

describe("URL state", () => {
  test("encode → decode keeps what the mode uses", () => {
    for (const mode of ["family", "plates", "polygons"] as const) {
      const s = { ...defaultBenchState(), mode, moment: "-42.5", shear: "" };
      const back = decodeBenchState(encodeBenchState(s));
      expect(back.mode).toBe(mode);
      expect(back.moment).toBe("-42.5");
      expect(back.shear).toBe("");
      if (mode === "plates") expect(strip(back).plates).toEqual(strip(s).plates);
      if (mode === "polygons") expect(strip(back).polygons).toEqual(strip(s).polygons);
      if (mode === "family") expect(back.dims.d).toBe("400");
    }
  });

  test("a broken or hostile link falls back to the default bench", () => {
    const def = strip(defaultBenchState());
    for (const bad of ["{", "null", '{"m":"nope"}', JSON.stringify({ m: "plates", u: "si", f: "i", p: [["1", "2", "3"]] }), "x".repeat(100)]) {
      expect(strip(decodeBenchState(bad))).toEqual(def);
    }
  });

  test("switching to US customary and back retypes lengths and loads (1 in = 25.4 mm, 1 kip·ft = 1.355818 kN·m)", () => {
    const s = { ...defaultBenchState(), moment: "100", shear: "50" };
    const us = convertBenchState(s, "us");
    expect(us.dims.d).toBe("15.748");
    expect(Number(us.moment)).toBeCloseTo(100 / 1.3558179483314, 3);
    expect(Number(us.shear)).toBeCloseTo(50 / 4.4482216152605, 3);
    const back = convertBenchState(us, "si");
    expect(Number(back.dims.d)).toBeCloseTo(400, 2);
    expect(Number(back.plates[1]!.h)).toBeCloseTo(368, 2);
  });

  test("benchHref reopens a saved SI section in the chosen units", () => {
    const href = benchHref({ plates: [{ b: 254, h: 25.4, z: 0, y: 0 }] }, "us");
    const s = decodeBenchState(new URL(href, "http://x").searchParams.get("s"));
    expect(s.units).toBe("us");
    expect(strip(s).plates).toEqual([{ b: "10", h: "1", z: "0", y: "0" }]);
    expect(benchStateFromSection({ family: "tee", d: 200, b: 150, tf: 12, tw: 8, flip: true }).flip).toBe(true);
  });
});

describe("state → engine input", () => {
  test("plates typed in inches become the same section in mm", () => {
    const s: BenchState = { ...defaultBenchState(), mode: "plates", units: "us" };
    s.plates = [{ id: "a", b: "10", h: "1", z: "0", y: "0" }];
    const built = benchSectionInput(s);
    if (!("input" in built)) throw new Error("expected input");
    const parsed = parseSectionInput(built.input, "us");
    if (!parsed.ok) throw new Error("expected ok");
    expect(parsed.input).toEqual({ plates: [{ b: 254, h: 25.4, z: 0, y: 0 }] });
  });

  test("errors name the field: a blank dimension, an overlap, bad polygon text, a bad moment", () => {
    const s = defaultBenchState();
    const blank = { ...s, dims: { ...s.dims, tw: "" } };
    const b1 = benchSectionInput(blank);
    const r1 = "input" in b1 ? parseSectionInput(b1.input, "si") : null;
    expect(r1?.ok).toBe(false);
    if (r1 && !r1.ok) expect(r1.errors[0]).toMatchObject({ field: "tw" });

    const overlap = { ...s, mode: "plates" as const, plates: [...s.plates, { id: "x", b: "50", h: "50", z: "0", y: "0" }] };
    const b2 = benchSectionInput(overlap);
    const r2 = "input" in b2 ? parseSectionInput(b2.input, "si") : null;
    if (!r2 || r2.ok) throw new Error("expected an overlap error");
    expect(r2.errors[0]).toMatchObject({ field: "plates[3]", message: "plates[3] overlaps plates[0]" });

    const poly = benchSectionInput({ ...s, mode: "polygons", polygons: [{ id: "p", text: "0,0 10,0 ten,10", hole: false }] });
    expect("errors" in poly && poly.errors[0]!.field).toBe("polygons[0].points");
    expect(parsePoints("0,0 1")).toEqual({ error: expect.stringContaining("pairs") });

    expect(benchLoads({ ...s, moment: "12kNm" })).toEqual({ errors: [expect.objectContaining({ field: "moment" })] });
    expect(benchLoads({ ...s, moment: "", shear: "" })).toEqual({ Mz: 0, V: 0 });
  });

  test("a union failure at the root still gets a field path from the engine's checker", () => {
    const r = parseSectionInput({ family: "i", d: "x", b: 100, tf: 6, tw: 5 }, "si");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]).toMatchObject({ field: "d", path: ["d"] });
  });
});

describe("section worker entry", () => {
  test("answers properties and stresses in SI for input typed in US units", () => {
    const r = analyseSection({ input: { family: "rectangle", b: 4, d: 10 }, units: "us", Mz: 10, V: 0 });
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    // b·d³/12 for a rectangle (closed form), in mm⁴
    expect(r.stress.properties.Iz).toBeCloseTo((101.6 * 254 ** 3) / 12, 3);
    expect(r.stress.properties).toEqual(sectionProperties({ family: "rectangle", b: 101.6, d: 254 }));
  });

  test("answers field errors, never throws, for bad input", () => {
    const r = analyseSection({ input: { plates: [{ b: 1, h: 1, z: 0, y: 0 }, { b: 1, h: 1, z: 0.5, y: 0.5 }] }, units: "si", Mz: 1, V: 0 });
    expect(r).toEqual({ ok: false, errors: [expect.objectContaining({ field: "plates[1]" })] });
    expect(analyseSection({ input: "nonsense", units: "si", Mz: 1, V: 0 }).ok).toBe(false);
  });
});

// Engine contract conformance: one test per rule of /work/shared/design/engine-contract.md
// (quoted in a comment), each checked against a value worked out by hand from a closed form,
// not against the engine's own helpers.
import { describe, expect, test } from "vitest";
import * as engine from "~/optimizer";
import {
  CONTRACT_EXAMPLE_PROBLEM,
  EngineInputError,
  candidateChecks,
  normalStress,
  searchProblemSchema,
  searchSections,
  sectionInputSchema,
  sectionProperties,
  type SearchProblemInput,
} from "~/optimizer";
import { FAMILY_KERNELS } from "~/optimizer/family-kernel";

const rel = (a: number, b: number, tol = 1e-9) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(1, Math.abs(b)));

/** Throws an EngineInputError whose field and message are checked. */
function expectInputError(f: () => unknown, field: string, message: RegExp) {
  let err: unknown;
  try {
    f();
  } catch (e) {
    err = e;
  }
  expect(err).toBeInstanceOf(EngineInputError);
  expect((err as EngineInputError).field).toBe(field);
  expect((err as Error).message).toMatch(message);
}

/** Every number in a result tree is finite (contract: "Never NaN, never Infinity"). */
function allFinite(x: unknown): boolean {
  if (typeof x === "number") return Number.isFinite(x);
  if (x && typeof x === "object") return Object.values(x).every(allFinite);
  return true;
}

const base: SearchProblemInput = {
  moment: { sagging: 1, hogging: 0 },
  allowable: { tension: 1000, compression: 1000 },
  depth: { min: 100, max: 100, step: 10 },
  width: { min: 100, max: 100, step: 10 },
  thicknesses: [10],
  families: ["rectangle"],
};

describe("entry point", () => {
  // "exports at least: sectionProperties, searchSections, sectionInputSchema, searchProblemSchema"
  test("index.ts exports the four contract names", () => {
    expect(typeof engine.sectionProperties).toBe("function");
    expect(typeof engine.searchSections).toBe("function");
    expect(typeof engine.sectionInputSchema.safeParse).toBe("function");
    expect(typeof engine.searchProblemSchema.safeParse).toBe("function");
  });

  // "zod schemas, the single source of truth": the schema accepts each SectionInput form
  test("sectionInputSchema accepts plates, polygons and family inputs", () => {
    expect(sectionInputSchema.safeParse({ plates: [{ b: 10, h: 20, z: 0, y: 0 }] }).success).toBe(true);
    expect(sectionInputSchema.safeParse({ polygons: [{ points: [[0, 0], [10, 0], [10, 10]], hole: false }] }).success).toBe(true);
    expect(sectionInputSchema.safeParse({ family: "i", d: 200, b: 100, tf: 10, tw: 6 }).success).toBe(true);
  });
});

describe("SectionProperties fields and conventions", () => {
  // "area | A", "centroid.z, centroid.y from the left edge and the bottom edge of the bounding box",
  // "extremes ... distances (positive)". Tee 50 × 160, tf = tw = 10 (hand: A = 1600 + 400 = 2000,
  // ȳ = (1600·45 + 400·20)/2000 = 40 from the bottom; plates at z = 1000 to show the frame).
  test("centroid measured from the bounding box's left and bottom edges", () => {
    const p = sectionProperties({ plates: [{ b: 160, h: 10, z: 1000, y: 540 }, { b: 10, h: 40, z: 1075, y: 500 }] });
    expect(p.area).toBe(2000);
    rel(p.centroid.z, 80);
    rel(p.centroid.y, 40);
    rel(p.extremes.top, 10);
    rel(p.extremes.bottom, 40);
    rel(p.extremes.left, 80);
    rel(p.extremes.right, 80);
  });

  // Field names of the SectionProperties table, exactly.
  test("every field of the table is present under its contract name", () => {
    const p = sectionProperties({ family: "i", d: 200, b: 100, tf: 10, tw: 10 });
    for (const path of [
      "area", "centroid.z", "centroid.y", "extremes.top", "extremes.bottom", "extremes.left", "extremes.right",
      "Iz", "Iy", "Iyz", "principal.I1", "principal.I2", "principal.angleDeg", "Sz.top", "Sz.bottom", "Sy.left",
      "Sy.right", "Zz", "Zy", "rz", "ry", "Qz", "widthAtNeutralAxis", "J", "Jmethod", "massPerMetre",
    ])
      expect(p).toHaveProperty(path);
  });

  // I section 200 × 100, tf = tw = 10, closed forms (Gere & Goodno, Mechanics of Materials, 7th ed. (2009),
  // wide-flange beams): Iz = (b·d³ − (b − tw)(d − 2tf)³)/12, Z = b·tf·(d − tf) + tw·(d − 2tf)²/4,
  // Qz = b·tf·(d − tf)/2 + tw·(d/2 − tf)²/2, J = Σ b·t³/3 (open thin-walled).
  test("I section: Iz, Iy, Sz, Zz, Qz, J, r against closed forms", () => {
    const p = sectionProperties({ family: "i", d: 200, b: 100, tf: 10, tw: 10 });
    const Iz = (100 * 200 ** 3 - 90 * 180 ** 3) / 12;
    const Iy = (2 * 10 * 100 ** 3 + 180 * 10 ** 3) / 12;
    rel(p.Iz, Iz);
    rel(p.Iy, Iy);
    expect(p.Iyz).toBe(0);
    rel(p.Sz.top, Iz / 100);
    rel(p.Sz.bottom, Iz / 100);
    rel(p.Sy.left, Iy / 50);
    rel(p.Sy.right, Iy / 50);
    rel(p.Zz, 100 * 10 * 190 + (10 * 180 ** 2) / 4);
    rel(p.Zy, 2 * (10 * 100 ** 2) / 4 + (180 * 10 ** 2) / 4);
    rel(p.Qz, (100 * 10 * 190) / 2 + (10 * 90 ** 2) / 2);
    rel(p.rz, Math.sqrt(Iz / 3800));
    rel(p.ry, Math.sqrt(Iy / 3800));
    rel(p.J, (2 * 100 * 10 ** 3 + 180 * 10 ** 3) / 3);
    expect(p.Jmethod).toBe("open-thin-walled");
    expect(p.widthAtNeutralAxis).toBe(10);
  });

  // "J ... closed cells by Bredt's formula; say which in Jmethod": box J = 4·Am²/∮ds/t on the
  // wall midlines (Timoshenko & Goodier, Theory of Elasticity, 3rd ed. (1970), thin-walled tubes). Box 200 × 100, tf = 10, tw = 8.
  test("box: Bredt's J on the midline, Jmethod closed-bredt", () => {
    const p = sectionProperties({ family: "box", d: 200, b: 100, tf: 10, tw: 8 });
    const Am = (100 - 8) * (200 - 10);
    rel(p.J, (4 * Am * Am) / ((2 * (100 - 8)) / 10 + (2 * (200 - 10)) / 8));
    expect(p.Jmethod).toBe("closed-bredt");
  });

  // "Zz ... about the equal-area axis" when that axis is in another plate than the centroid:
  // plates 200 × 20 on top of a 10 × 100 web on a 50 × 10 plate. A = 5500, ȳ = 98.6 (in the web),
  // but A/2 = 2750 < 4000 puts the equal-area axis 2750/200 = 13.75 below the top, in the top
  // plate. Z = Σ area × distance to that axis (common practice), by hand:
  // 200·13.75·6.875 + 200·6.25·3.125 + 1000·56.25 + 500·111.25 = 134687.5.
  test("Zz with the equal-area axis outside the centroid's plate", () => {
    const plates = [{ b: 50, h: 10, z: 75, y: 0 }, { b: 10, h: 100, z: 95, y: 10 }, { b: 200, h: 20, z: 0, y: 110 }];
    const p = sectionProperties({ plates });
    rel(p.centroid.y, (4000 * 120 + 1000 * 60 + 500 * 5) / 5500);
    rel(p.Zz, 134687.5);
    // Zy: symmetric about the vertical axis, (b²·t)/4 per plate
    rel(p.Zy, (50 ** 2 * 10 + 10 ** 2 * 100 + 200 ** 2 * 20) / 4);
    rel(sectionProperties({ family: "mono-i", d: 130, bt: 200, tft: 20, bb: 50, tfb: 10, tw: 10 }).Zz, 134687.5);
    // the same plates turned on their side: now Zy is the one whose axis leaves the centroid's plate
    const side = sectionProperties({ plates: plates.map((q) => ({ b: q.h, h: q.b, z: q.y, y: q.z })) });
    rel(side.Zy, 134687.5);
    rel(side.Zz, p.Zy);
  });

  // "simple polygons in either winding; holes are subtracted": a clockwise 10 × 10 square with a
  // 4 × 4 hole: A = 84, Iz = (10⁴ − 4⁴)/12 = 812 (Gere & Goodno, 7th ed., Appendix D, by subtraction).
  test("polygons: clockwise winding, hole subtracted", () => {
    const p = sectionProperties({
      polygons: [
        { points: [[0, 0], [0, 10], [10, 10], [10, 0]], hole: false },
        { points: [[3, 3], [3, 7], [7, 7], [7, 3]], hole: true },
      ],
    });
    rel(p.area, 84);
    rel(p.Iz, 812);
    rel(p.Iy, 812);
    expect(p.widthAtNeutralAxis).toBe(6);
  });

  // "a quarter-circle fillet in each re-entrant corner": each adds r² − πr²/4 (common geometry).
  test("i with root radius: four fillets of area (1 − π/4)·r²", () => {
    rel(sectionProperties({ family: "i", d: 200, b: 100, tf: 10, tw: 10, r: 10 }).area, 3800 + 4 * (1 - Math.PI / 4) * 100);
  });

  // "massPerMetre | A × density × 10⁻⁶"; "An optional density (kg/m³, default 7850)".
  test("massPerMetre = A·ρ·1e-6, default density 7850", () => {
    // 100 × 60 rectangle: 6000 mm² × 7850 kg/m³ × 1e-6 = 47.1 kg/m (common practice)
    rel(sectionProperties({ family: "rectangle", b: 60, d: 100 }).massPerMetre, 47.1);
    rel(sectionProperties({ family: "rectangle", b: 60, d: 100, density: 2700 }).massPerMetre, 16.2);
  });

  // "angleDeg ... in (−90, 90]; 0 when Iz = Iy and Iyz = 0 (a flat rectangle, whose major axis is vertical, gives 90)"
  test("principal angle: square 0, flat rectangle 90, tall rectangle 0", () => {
    expect(sectionProperties({ family: "rectangle", b: 100, d: 100 }).principal.angleDeg).toBe(0);
    const flat = sectionProperties({ family: "rectangle", b: 200, d: 10 });
    expect(flat.principal.angleDeg).toBe(90);
    // I1 = b³·d/12 about the vertical axis (Gere & Goodno, 7th ed., Appendix D)
    rel(flat.principal.I1, (200 ** 3 * 10) / 12);
    rel(flat.principal.I2, (200 * 10 ** 3) / 12);
    expect(sectionProperties({ family: "rectangle", b: 10, d: 200 }).principal.angleDeg).toBe(0);
  });

  // Equal angle 100 × 100 × 10 by the parallel-axis theorem (Gere & Goodno, 7th ed., §12.9 principal
  // axes): I1,2 = (Iz + Iy)/2 ± √(((Iz − Iy)/2)² + Iyz²); Iyz = ∫ y·z dA < 0 with the legs
  // along +z and +y, so the major axis runs at +45° (through the heel, away from both toes).
  test("angle: Iyz = ∫ y·z dA, principal moments and +45° major axis", () => {
    const p = sectionProperties({ family: "angle", d: 100, b: 100, t: 10 });
    const c = (1000 * 5 + 900 * 55) / 1900; // centroid from the heel, both ways
    const Iz = (10 * 100 ** 3) / 12 + 1000 * (50 - c) ** 2 + (90 * 10 ** 3) / 12 + 900 * (5 - c) ** 2;
    const Iyz = 1000 * (5 - c) * (50 - c) + 900 * (55 - c) * (5 - c);
    expect(p.area).toBe(1900);
    rel(p.centroid.z, c);
    rel(p.centroid.y, c);
    rel(p.Iz, Iz);
    rel(p.Iy, Iz);
    rel(p.Iyz, Iyz);
    expect(p.Iyz).toBeLessThan(0);
    rel(p.principal.I1, Iz + Math.abs(Iyz));
    rel(p.principal.I2, Iz - Math.abs(Iyz));
    rel(p.principal.angleDeg, 45);
  });

  // "widthAtNeutralAxis | ... where that axis runs exactly along a plate edge, the smaller of
  // the widths just above and just below". The tee above has ȳ = 40 exactly at the underside
  // of its 160-wide flange, over a 10-wide stem: the answer is 10, for plates and family alike,
  // and for the flipped tee. Qz there = flange 1600 × 5 = 8000 (= stem 400 × 20 below).
  test("width at the neutral axis on a plate edge: the smaller side", () => {
    const tee = sectionProperties({ family: "tee", d: 50, b: 160, tf: 10, tw: 10 });
    const plates = sectionProperties({ plates: [{ b: 160, h: 10, z: 0, y: 40 }, { b: 10, h: 40, z: 75, y: 0 }] });
    const flipped = sectionProperties({ family: "tee", d: 50, b: 160, tf: 10, tw: 10, flip: true });
    for (const p of [tee, plates, flipped]) {
      expect(p.widthAtNeutralAxis).toBe(10);
      rel(p.Qz, 8000);
    }
    // "flip: true mirrors the section about the horizontal axis": ȳ = 50 − 40
    rel(flipped.centroid.y, 10);
    rel(flipped.Iz, tee.Iz);
  });

  // "Zz, Zy | plastic section moduli about the equal-area axes": tee 50 × 160 × 10 × 10, A/2 =
  // 1000 lies in the flange 1000/160 = 6.25 below the top (common practice: first moments of
  // the two halves about the equal-area axis).
  test("tee: Zz about the equal-area axis", () => {
    const p = sectionProperties({ family: "tee", d: 50, b: 160, tf: 10, tw: 10 });
    rel(p.Zz, 160 * 6.25 * 3.125 + 160 * 3.75 * 1.875 + 400 * (3.75 + 20));
  });
});

describe("family geometry", () => {
  // "channel-down | d, b, tw, tf | web b × tw across the top (horizontal); two legs tf thick at
  // the outer edges, hanging down to depth d". d = 100, b = 200, tw = 10, tf = 12 by hand:
  // A = 2000 + 2·12·90 = 4160; ȳ = (2000·95 + 2160·45)/4160; Iy = 10·200³/12 + 2(90·12³/12 + 1080·94²).
  test("channel-down: web across the top, legs hanging down", () => {
    const p = sectionProperties({ family: "channel-down", d: 100, b: 200, tw: 10, tf: 12 });
    expect(p.area).toBe(4160);
    rel(p.centroid.y, (2000 * 95 + 2160 * 45) / 4160);
    rel(p.centroid.z, 100);
    rel(p.Iy, (10 * 200 ** 3) / 12 + 2 * ((90 * 12 ** 3) / 12 + 1080 * 94 ** 2));
    // the centroidal axis cuts the two legs only
    expect(p.widthAtNeutralAxis).toBe(24);
  });

  // "channel | web tw × d at the left edge; flanges of thickness tf ... reaching to width b":
  // same Iz as the I of the same dimensions; centroid z = (d·tw²/2 + 2(b − tw)tf(b + tw)/2)/A.
  test("channel: web at the left edge", () => {
    const p = sectionProperties({ family: "channel", d: 200, b: 100, tf: 10, tw: 10 });
    const A = 200 * 10 + 2 * 90 * 10;
    rel(p.centroid.z, (2000 * 5 + 1800 * 55) / A);
    rel(p.Iz, (100 * 200 ** 3 - 90 * 180 ** 3) / 12);
  });

  // "mono-i | ... top flange bt × tft, bottom flange bb × tfb ... all centred on one vertical axis"
  test("mono-i: flanges centred on one vertical axis; bigger top flange raises the centroid", () => {
    const p = sectionProperties({ family: "mono-i", d: 200, bt: 160, tft: 10, bb: 100, tfb: 10, tw: 10 });
    rel(p.centroid.z, 80);
    expect(p.Iyz).toBe(0);
    rel(p.centroid.y, (1000 * 5 + 1800 * 100 + 1600 * 195) / 4400);
  });

  // "dimensions that leave no positive clear plate are an error naming the rule (e.g. "i: d must exceed 2·tf")"
  test("validity rules name the family and the rule", () => {
    expectInputError(() => sectionProperties({ family: "i", d: 20, b: 100, tf: 10, tw: 5 }), "d", /^i: d must exceed 2·tf$/);
    expectInputError(() => sectionProperties({ family: "i", d: 200, b: 5, tf: 10, tw: 5 }), "b", /i: b must exceed tw/);
    expectInputError(() => sectionProperties({ family: "box", d: 200, b: 20, tf: 10, tw: 10 }), "b", /box: b must exceed 2·tw/);
    expectInputError(() => sectionProperties({ family: "tee", d: 10, b: 100, tf: 10, tw: 5 }), "d", /tee: d must exceed tf/);
    expectInputError(() => sectionProperties({ family: "channel-down", d: 100, b: 20, tw: 10, tf: 10 }), "b", /channel-down: b must exceed 2·tf/);
    expectInputError(() => sectionProperties({ family: "angle", d: 10, b: 100, t: 10 }), "d", /angle: d must exceed t/);
  });
});

describe("bad input", () => {
  // "overlap is an error that names both plates", e.g. "plates[2] overlaps plates[0]"
  test("overlapping plates: both named", () => {
    expectInputError(
      () => sectionProperties({ plates: [{ b: 10, h: 10, z: 0, y: 0 }, { b: 10, h: 10, z: 20, y: 0 }, { b: 10, h: 10, z: 5, y: 5 }] }),
      "plates[2]",
      /plates\[2\] overlaps plates\[0\]/,
    );
  });

  // "Plates may touch"
  test("touching plates are fine", () => {
    expect(sectionProperties({ plates: [{ b: 10, h: 10, z: 0, y: 0 }, { b: 10, h: 10, z: 10, y: 0 }] }).area).toBe(200);
  });

  // "Self-intersection is an error"; "Never NaN, never Infinity, never a silent zero"
  test("zero-area and self-intersecting polygons, holes cancelling the solid: errors, not zeros", () => {
    expect(() => sectionProperties({ polygons: [{ points: [[0, 0], [10, 0], [20, 0]], hole: false }] })).toThrow(EngineInputError);
    expect(() => sectionProperties({ polygons: [{ points: [[0, 0], [10, 10], [10, 0], [0, 10]], hole: false }] })).toThrow(/self-intersects/);
    const sq: [number, number][] = [[0, 0], [10, 0], [10, 10], [0, 10]];
    expect(() => sectionProperties({ polygons: [{ points: sq, hole: false }, { points: sq, hole: true }] })).toThrow(EngineInputError);
  });

  // "Never NaN, never Infinity, never a silent zero": numbers past double precision's reach
  test("huge, tiny and far-off numbers throw instead of Infinity or zero", () => {
    const cases: unknown[] = [
      { plates: [{ b: 1e200, h: 1e200, z: 0, y: 0 }] },
      { family: "rectangle", b: 1e200, d: 1e200 },
      { plates: [{ b: 1e-200, h: 1e-200, z: 0, y: 0 }] },
      // width lost to rounding: 1e300 + 1 === 1e300, so the extremes would be 0 and Sz infinite
      { plates: [{ b: 1, h: 1, z: 1e300, y: 1e300 }] },
      { plates: [{ b: 1, h: 1, z: 0, y: 0 }, { b: 1, h: 1, z: 1e200, y: 1e200 }] },
    ];
    for (const c of cases) expect(() => sectionProperties(c as never), JSON.stringify(c)).toThrow(EngineInputError);
  });

  // "density (kg/m³ ...)": a negative or zero density would give a negative or zero mass
  test("negative or zero density names the field", () => {
    expectInputError(() => sectionProperties({ plates: [{ b: 1, h: 1, z: 0, y: 0 }], density: -1 }), "density", /density/);
    expectInputError(() => sectionProperties({ family: "rectangle", b: 1, d: 1, density: 0 }), "density", /density/);
    expect(sectionInputSchema.safeParse({ family: "rectangle", b: 1, d: 1, density: -1 }).success).toBe(false);
    // A × density past double precision (A = 1e8 mm², ρ = 1e308): refused up front, naming density
    expectInputError(() => sectionProperties({ plates: [{ b: 1e4, h: 1e4, z: 0, y: 0 }], density: 1e308 }), "density", /density/);
    expectInputError(() => sectionProperties({ family: "rectangle", b: 1e4, d: 1e4, density: 1e308 }), "density", /density/);
    expect(sectionInputSchema.safeParse({ family: "rectangle", b: 1, d: 1, density: 1e308 }).success).toBe(false);
  });

  test("NaN and strings name the field", () => {
    expectInputError(() => sectionProperties({ plates: [{ b: NaN, h: 1, z: 0, y: 0 }] }), "plates[0].b", /finite/);
    expectInputError(() => sectionProperties({ plates: [{ b: "5" as never, h: 1, z: 0, y: 0 }] }), "plates[0].b", /finite/);
  });

  // "Never NaN, never Infinity, never a silent zero" in the search: a 1e200 mm depth makes
  // Iz = b·d³/12 overflow (a zero stress), a 1e-120 mm plate an area that underflows; both are
  // refused by the schema naming the field (range choice: 1 µm … 1 km, see search-schema.ts).
  test("search problem: lengths past double precision's reach name the field", async () => {
    const msgs = (pr: object) => searchProblemSchema.safeParse(pr).error?.issues.map((i) => `${i.path.join(".")}: ${i.message}`) ?? [];
    expect(msgs({ ...base, depth: { min: 1e200, max: 1e200, step: 1 } }).join()).toMatch(/depth\.min: depth\.min must be between/);
    expect(msgs({ ...base, thicknesses: [1e-121] }).join()).toMatch(/thicknesses\.0: thicknesses\[\] must be between/);
    expect(msgs({ ...base, moment: { sagging: 1e308, hogging: 0 } }).join()).toMatch(/moment\.sagging: moment\.sagging must be at most/);
    expect(msgs({ ...base, density: 1e300 }).join()).toMatch(/density: density must be at most/);
    await expect(async () => searchSections({ ...base, width: { min: 1e-120, max: 1e-120, step: 1 } })).rejects.toThrow(/width\.min/);
  });

  // "depth.max must be ≥ depth.min" (the contract's own example)
  test("search problem: max below min, negative moment, no moment", () => {
    const r = searchProblemSchema.safeParse({ ...base, depth: { min: 100, max: 50, step: 1 } });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.message)).toContain("depth.max must be ≥ depth.min");
    expect(r.error!.issues[0].path).toEqual(["depth", "max"]);
    const neg = searchProblemSchema.safeParse({ ...base, moment: { sagging: -1, hogging: 0 } });
    expect(neg.error!.issues.some((i) => i.path.join(".") === "moment.sagging")).toBe(true);
    // "at least one > 0"
    expect(searchProblemSchema.safeParse({ ...base, moment: { sagging: 0, hogging: 0 } }).success).toBe(false);
  });
});

describe("bending signs", () => {
  // "A positive (sagging) moment compresses the top fibre. Stresses: tension positive,
  // compression negative." Tee 50 × 160 × 10 × 10: ȳ = 40, Iz = 160·10³/12 + 1600·5² +
  // 10·40³/12 + 400·20² = 800000/3 (parallel axes, Gere & Goodno, 7th ed.). M = 1 kN·m = 1e6 N·mm.
  test("sagging: top fibre −M·10/Iz (compression), bottom +M·40/Iz (tension)", () => {
    const p = sectionProperties({ family: "tee", d: 50, b: 160, tf: 10, tw: 10 });
    const Iz = 800000 / 3;
    rel(p.Iz, Iz);
    rel(normalStress(p, 1, 0, 0, 10), -1e6 * 10 / Iz);
    rel(normalStress(p, 1, 0, 0, -40), 1e6 * 40 / Iz);
  });

  // "sagging: top compressed, bottom in tension; hogging: the reverse"
  test("search checks: sagging vs hogging on the tee", () => {
    const Iz = 800000 / 3;
    const sag = candidateChecks("tee", { d: 50, b: 160, tf: 10, tw: 10 }, searchProblemSchema.parse({ ...base, moment: { sagging: 1, hogging: 0 } }));
    const hog = candidateChecks("tee", { d: 50, b: 160, tf: 10, tw: 10 }, searchProblemSchema.parse({ ...base, moment: { sagging: 0, hogging: 1 } }));
    const d = (v: typeof sag, n: string) => v.checks.find((c) => c.name === n)!.demand;
    rel(d(sag, "bending-compression"), (1e6 * 10) / Iz);
    rel(d(sag, "bending-tension"), (1e6 * 40) / Iz);
    rel(d(hog, "bending-compression"), (1e6 * 40) / Iz);
    rel(d(hog, "bending-tension"), (1e6 * 10) / Iz);
  });

  // "σ = M·(Iyz·z − Iy·y) / (Iz·Iy − Iyz²) ... taken at every corner of the section" (angle).
  // Unequal angle 150 × 90 × 10 by parallel axes; the six outline corners by hand.
  test("angle: general bending formula at every corner, sagging and hogging", () => {
    const [d, b, t] = [150, 90, 10];
    const A1 = t * d, A2 = (b - t) * t, A = A1 + A2;
    const cz = (A1 * t / 2 + A2 * (t + (b - t) / 2)) / A;
    const cy = (A1 * d / 2 + A2 * t / 2) / A;
    const Iz = (t * d ** 3) / 12 + A1 * (d / 2 - cy) ** 2 + ((b - t) * t ** 3) / 12 + A2 * (t / 2 - cy) ** 2;
    const Iy = (d * t ** 3) / 12 + A1 * (t / 2 - cz) ** 2 + (t * (b - t) ** 3) / 12 + A2 * (t + (b - t) / 2 - cz) ** 2;
    const Iyz = A1 * (t / 2 - cz) * (d / 2 - cy) + A2 * (t + (b - t) / 2 - cz) * (t / 2 - cy);
    const M = 1e6 * 2; // 2 kN·m
    const corners = [[0, 0], [b, 0], [b, t], [t, t], [t, d], [0, d]];
    const sig = corners.map(([z, y]) => (M * (Iyz * (z - cz) - Iy * (y - cy))) / (Iz * Iy - Iyz ** 2));
    const sag = candidateChecks("angle", { d, b, t }, searchProblemSchema.parse({ ...base, moment: { sagging: 2, hogging: 0 } }));
    const hog = candidateChecks("angle", { d, b, t }, searchProblemSchema.parse({ ...base, moment: { sagging: 0, hogging: 2 } }));
    const dm = (v: typeof sag, n: string) => v.checks.find((c) => c.name === n)!.demand;
    rel(dm(sag, "bending-tension"), Math.max(...sig));
    rel(dm(sag, "bending-compression"), -Math.min(...sig));
    rel(dm(hog, "bending-tension"), -Math.min(...sig));
    rel(dm(hog, "bending-compression"), Math.max(...sig));
    // the inclined neutral axis makes the result differ from M·c/Iz
    expect(Math.abs(dm(sag, "bending-compression") - (M * (d - cy)) / Iz)).toBeGreaterThan(1);
    // same formula as the section-level stress function
    const p = sectionProperties({ family: "angle", d, b, t });
    rel(normalStress(p, 2, 0, 0 - cz, d - cy), sig[5]);
  });
});

describe("search checks", () => {
  // "shear ... the largest V·Q(y)/(Iz·b(y))": for an I section at the neutral axis
  // τ = V·Q/(Iz·tw) (Gere & Goodno, 7th ed., shear stresses in the webs of beams with flanges).
  test("shear demand on an I section", () => {
    const Iz = (100 * 200 ** 3 - 90 * 180 ** 3) / 12;
    const Q = 100 * 10 * 95 + 10 * 90 * 45;
    const v = candidateChecks("i", { d: 200, b: 100, tf: 10, tw: 10 }, searchProblemSchema.parse({ ...base, shear: 100, allowable: { tension: 1000, compression: 1000, shear: 100 } }));
    rel(v.checks.find((c) => c.name === "shear")!.demand, (1e5 * Q) / (Iz * 10));
  });

  // "for piecewise-constant widths the maximum lies at the neutral axis or just beside a plate
  // edge": tee 60 × 200, tf = 30, tw = 5 has its centroidal axis inside the thick flange, so
  // the stem's top (width 5) beats the axis (width 200). By hand (parallel axes, Gere & Goodno, 7th ed.):
  // ȳ = (6000·45 + 150·15)/6150; Q at the stem top = 150·(ȳ − 15); at the axis 200·(60 − ȳ)²/2.
  test("shear: maximum just beside a plate edge, not at the axis", () => {
    const A = 6150, cy = (6000 * 45 + 150 * 15) / A;
    const Iz = (200 * 30 ** 3) / 12 + 6000 * (45 - cy) ** 2 + (5 * 30 ** 3) / 12 + 150 * (15 - cy) ** 2;
    const atEdge = (1e5 * 150 * (cy - 15)) / (Iz * 5);
    const atAxis = (1e5 * 200 * (60 - cy) ** 2) / 2 / (Iz * 200);
    expect(atEdge).toBeGreaterThan(atAxis);
    const v = candidateChecks("tee", { d: 60, b: 200, tf: 30, tw: 5 }, searchProblemSchema.parse({ ...base, shear: 100, allowable: { tension: 1000, compression: 1000, shear: 100 } }));
    rel(v.checks.find((c) => c.name === "shear")!.demand, atEdge);
  });

  // The slenderness ratios, exactly as listed in the contract, per family.
  test("slenderness ratios per family", () => {
    const pr = searchProblemSchema.parse({ ...base, slenderness: { outstand: 1000, internal: 1000, web: 1000, stem: 1000 } });
    const ratios = (family: Parameters<typeof candidateChecks>[0], dims: Record<string, number>) =>
      Object.fromEntries(candidateChecks(family, dims, pr).checks.filter((c) => c.name.startsWith("slender")).map((c) => [c.name, c.demand]));
    // i: (b − tw)/2 ÷ tf; (d − tft − tfb) ÷ tw
    expect(ratios("i", { d: 300, b: 150, tf: 10, tw: 6 })).toEqual({ "slenderness-outstand": 72 / 10, "slenderness-web": 280 / 6 });
    // mono-i: the worse outstand of the two flanges; web (d − tft − tfb) ÷ tw
    expect(ratios("mono-i", { d: 300, bt: 200, tft: 10, bb: 100, tfb: 8, tw: 6 })).toEqual({ "slenderness-outstand": 97 / 10, "slenderness-web": 282 / 6 });
    // channel: (b − tw) ÷ tf; (d − 2tf) ÷ tw
    expect(ratios("channel", { d: 300, b: 100, tf: 10, tw: 6 })).toEqual({ "slenderness-outstand": 94 / 10, "slenderness-web": 280 / 6 });
    // tee: (b − tw)/2 ÷ tf; (d − tf) ÷ tw → stem
    expect(ratios("tee", { d: 300, b: 150, tf: 10, tw: 6 })).toEqual({ "slenderness-outstand": 72 / 10, "slenderness-stem": 290 / 6 });
    // box: (b − 2tw) ÷ tf → internal; (d − 2tf) ÷ tw → web
    expect(ratios("box", { d: 300, b: 150, tf: 10, tw: 6 })).toEqual({ "slenderness-internal": 138 / 10, "slenderness-web": 280 / 6 });
    // channel-down: (b − 2tf) ÷ tw → internal; (d − tw) ÷ tf → stem
    expect(ratios("channel-down", { d: 300, b: 150, tw: 10, tf: 6 })).toEqual({ "slenderness-internal": 138 / 10, "slenderness-stem": 290 / 6 });
    // angle: (d − t) ÷ t and (b − t) ÷ t → outstand (the worse leg)
    expect(ratios("angle", { d: 150, b: 90, t: 10 })).toEqual({ "slenderness-outstand": 14 });
  });

  // "Every check passes when demand ≤ limit". Rectangle 60 × 100: σ = 6M/(b·d²) = 6·16e6/600000
  // = 160 MPa exactly (Gere & Goodno, 7th ed., flexure formula), against an allowable of exactly 160.
  test("demand exactly on the limit passes; a hair over fails", async () => {
    const pr: SearchProblemInput = { ...base, moment: { sagging: 16, hogging: 0 }, allowable: { tension: 160, compression: 160 }, width: { min: 60, max: 60, step: 10 } };
    const r = await searchSections(pr);
    expect(r.best).not.toBeNull();
    expect(r.best!.utilisation).toBe(1);
    expect(r.best!.checks.find((c) => c.name === "bending-compression")!.demand).toBe(160);
    const over = await searchSections({ ...pr, allowable: { tension: 159.99, compression: 159.99 } });
    expect(over.best).toBeNull();
  });
});

describe("grid", () => {
  // "every depth min + k·step ... computed as a product, never by repeated addition": 0.1 added
  // nine times to 0.1 gives 0.9999999999999999, but 0.1 + 9·0.1 = 1 (IEEE 754 double). A 1 mm wide
  // rectangle under 0.1 N·mm: σ = 0.6/d² (flexure formula), so only d = 1 passes 0.65 MPa.
  test("grid values are min + k·step (product)", async () => {
    const r = await searchSections({
      ...base,
      moment: { sagging: 1e-7, hogging: 0 },
      allowable: { tension: 0.65, compression: 0.65 },
      depth: { min: 0.1, max: 1, step: 0.1 },
      width: { min: 1, max: 1, step: 1 },
    });
    expect(r.best!.dimensions.d).toBe(1);
    expect(r.counts.grid).toBe(10);
  });

  // "that does not exceed max (so max is included only when it lands on the grid)"
  test("max included only when on the grid", async () => {
    const g = async (max: number) => (await searchSections({ ...base, depth: { min: 100, max, step: 10 } })).counts.grid;
    expect(await g(125)).toBe(3); // 100, 110, 120
    expect(await g(130)).toBe(4); // 100 … 130
  });

  // "counts | grid size (valid geometry only)" and "i: d > 2·tf and b > tw": depths {20, 30},
  // widths {5, 20}, tf = tw = 10 leave only d = 30, b = 20.
  test("grid counts valid geometry only", async () => {
    const r = await searchSections({ ...base, families: ["i"], depth: { min: 20, max: 30, step: 10 }, width: { min: 5, max: 20, step: 15 } });
    expect(r.counts.grid).toBe(1);
    expect(r.best!.dimensions).toEqual({ d: 30, b: 20, tf: 10, tw: 10 });
  });
});

describe("tie-breaks", () => {
  // "then the thinner plates, each in the order the family table lists its dimensions (so
  // mono-i compares bt before bb, channel-down tw before tf)"
  test("tie order: depth, widths, thicknesses, each in table order", () => {
    const names = (f: keyof typeof FAMILY_KERNELS) => FAMILY_KERNELS[f].tieOrder.map((i) => FAMILY_KERNELS[f].dims[i]);
    expect(names("mono-i")).toEqual(["d", "bt", "bb", "tft", "tfb", "tw"]);
    expect(names("channel-down")).toEqual(["d", "b", "tw", "tf"]);
    expect(names("rectangle")).toEqual(["d", "b"]);
  });

  // channel-down d = 100, b = 200: areas b·tw + 2·tf·(d − tw) are equal for (tw, tf) = (10, 12)
  // and (12, 10): 2000 + 2160 = 2400 + 1760 = 4160. Stem limit 8.9 rules out (10, 10) (ratio 9.0)
  // and passes both (90/12 = 7.5, 88/10 = 8.8). "channel-down tw before tf" → tw = 10.
  test("channel-down: equal areas settle on the thinner tw", async () => {
    const r = await searchSections({
      ...base,
      families: ["channel-down"],
      width: { min: 200, max: 200, step: 10 },
      thicknesses: [10, 12],
      slenderness: { stem: 8.9 },
    });
    expect(r.best!.area).toBe(4160);
    expect(r.best!.dimensions).toEqual({ d: 100, b: 200, tw: 10, tf: 12 });
  });

  // mono-i 200 deep, tf = tw = 10, widths {100, 120}: (bt, bb) = (100, 120) and (120, 100) are
  // mirror images (same area 4000, same Iz, same worst fibre distance 104.75), so under sagging
  // with equal allowables both pass or fail together. By parallel axes Iz = 24.643e6, S = 235,256
  // mm³ vs 229,267 for (100, 100): at 160 MPa that is 37.6 vs 36.7 kN·m, so M = 37 leaves the pair.
  // "mono-i compares bt before bb" → bt = 100.
  test("mono-i: equal areas settle on the narrower bt", async () => {
    const r = await searchSections({
      ...base,
      families: ["mono-i"],
      moment: { sagging: 37, hogging: 0 },
      allowable: { tension: 160, compression: 160 },
      depth: { min: 200, max: 200, step: 10 },
      width: { min: 100, max: 120, step: 20 },
    });
    expect(r.best!.area).toBe(4000);
    expect(r.best!.dimensions).toEqual({ d: 200, bt: 100, tft: 10, bb: 120, tfb: 10, tw: 10 });
  });

  // "between families, to the family listed first in families": an i and a channel of the same
  // d, b, tf, tw have the same area and the same Iz, so the same bending verdict.
  test("between families: the one listed first", async () => {
    const pr: SearchProblemInput = { ...base, depth: { min: 200, max: 200, step: 10 }, width: { min: 100, max: 100, step: 10 } };
    expect((await searchSections({ ...pr, families: ["channel", "i"] })).best!.family).toBe("channel");
    expect((await searchSections({ ...pr, families: ["i", "channel"] })).best!.family).toBe("i");
  });
});

describe("SearchResult", () => {
  const problem: SearchProblemInput = {
    ...CONTRACT_EXAMPLE_PROBLEM,
    depth: { min: 100, max: 400, step: 20 },
    width: { min: 50, max: 300, step: 25 },
  };

  // "best ... { family, dimensions, area, massPerMetre, utilisation, governing, properties } with
  // dimensions keyed by the family table's names"; "front ... sorted by area"; "utilisation ≤ 1
  // when feasible"; "bestByFamily | an object keyed by family name"
  test("shape of a feasible result", async () => {
    const r = await searchSections(problem, { explore: 0.2 });
    expect(allFinite(r)).toBe(true);
    const b = r.best!;
    expect(Object.keys(b.dimensions)).toEqual(b.family === "channel-down" ? ["d", "b", "tw", "tf"] : ["d", "b", "tf", "tw"]);
    rel(b.massPerMetre, b.area * 7850e-6);
    rel(b.properties.area, b.area);
    expect(b.utilisation).toBeLessThanOrEqual(1);
    expect(Object.keys(r.bestByFamily).sort()).toEqual([...problem.families!].sort());
    for (const c of r.front) expect(c.utilisation).toBeLessThanOrEqual(1);
    for (let i = 1; i < r.front.length; i++) expect(r.front[i].area).toBeGreaterThanOrEqual(r.front[i - 1].area);
    // "those no other beats on both area and utilisation"
    for (const a of r.front) for (const c of r.front) expect(c.area < a.area && c.utilisation < a.utilisation).toBe(false);
    // best is the lightest of the family bests
    const lightest = Math.min(...Object.values(r.bestByFamily).filter((x) => x).map((x) => x!.area));
    expect(b.area).toBe(lightest);
    expect(r.counts.feasible).toBeGreaterThan(0);
    expect(r.counts.evaluated).toBeLessThanOrEqual(r.counts.grid);
    expect(r.reason).toBeUndefined();
  });

  // "governing | ... one of bending-compression, bending-tension, shear, slenderness-…, deflection"
  // and utilisation = "the largest demand ÷ limit over all checks"
  test("governing names and utilisation = largest demand ÷ limit", async () => {
    const r = await searchSections(problem);
    const names = ["bending-compression", "bending-tension", "shear", "slenderness-outstand", "slenderness-internal", "slenderness-web", "slenderness-stem", "deflection"];
    // front members carry no check table (a light point each); their checks come from the same evaluation
    const parsed = engine.searchProblemSchema.parse(problem);
    const withChecks = r.front.map((c) => ({ ...c, checks: engine.candidateChecks(c.family, c.dimensions, parsed).checks }));
    for (const c of [r.best!, ...withChecks, ...Object.values(r.bestByFamily).filter((x) => x)]) {
      expect(names).toContain(c!.governing);
      const worst = c!.checks.reduce((m, k) => (k.demand / k.capacity > m.demand / m.capacity ? k : m));
      expect(c!.governing).toBe(worst.name);
      rel(c!.utilisation, worst.demand / worst.capacity);
    }
  });

  // "bestByFamily | ... that family's best candidate, or null"; "reason | present when best is null"
  test("null family bests and the reason when nothing is feasible", async () => {
    const r = await searchSections({ ...base, families: ["i", "rectangle"], depth: { min: 200, max: 200, step: 10 }, slenderness: { web: 0.5 } });
    expect("i" in r.bestByFamily).toBe(true);
    expect(r.bestByFamily.i).toBeNull();
    expect(r.bestByFamily.rectangle!.family).toBe("rectangle");
    const none = await searchSections({ ...base, families: ["i"], depth: { min: 200, max: 200, step: 10 }, slenderness: { web: 0.5 } });
    expect(none.best).toBeNull();
    expect(none.bestByFamily).toEqual({ i: null });
    expect(none.reason).toMatch(/slenderness-web/);
    expect(none.front).toEqual([]);
  });
});

// The design-basis fields of SearchProblem (member-checks.md §2): defaults, refusals and the
// messages naming the field. Preset figures: EN 10025-2 Table 7 (fy bands, fu for 3 ≤ t ≤ 100 mm),
// EN 1993-1-8 Table 4.1 (βw), EN 1993-1-1 §3.2.6 (E, G), §6.1 Note 2B (γM), EN 1993-1-5 §5.1
// Note 2 (η); all from memory, as member-checks.md lists them.
import { describe, expect, it } from "vitest";
import { CHECK_NAMES, CONTRACT_EXAMPLE_PROBLEM, bruteForceSearch, searchProblemSchema, searchSections, type SearchProblemInput } from "~/optimizer/index";

const issues = (v: unknown) => {
  const r = searchProblemSchema.safeParse(v);
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
};

const { allowable: _a, ...noAllowable } = CONTRACT_EXAMPLE_PROBLEM;
const en: SearchProblemInput = {
  ...noAllowable,
  families: ["i", "channel", "tee", "box"],
  basis: "en1993",
  steel: { grade: "S355" },
};

describe("basis", () => {
  it("defaults to allowable; the contract's example parses unchanged", () => {
    const p = searchProblemSchema.parse(CONTRACT_EXAMPLE_PROBLEM);
    expect(p.basis).toBe("allowable");
    expect(p.allowable).toEqual({ tension: 165, compression: 165, shear: 100 });
    expect(p.supports).toEqual({ stiffened: true });
  });

  it("allowable is required under the allowable basis, not under en1993", () => {
    expect(issues(noAllowable)).toContainEqual({ path: "allowable", message: expect.stringMatching(/^allowable is required when basis is "allowable"/) });
    expect(issues(en)).toEqual([]);
  });

  it("an unknown basis names the field", () => {
    expect(issues({ ...en, basis: "bs5950" })).toContainEqual({ path: "basis", message: 'basis must be "allowable", "en1993" or "aisc360"' });
  });

  it("S355 preset fills fy bands, fu, βw; E, G, partial factors and η take the recommended values", () => {
    const p = searchProblemSchema.parse(en);
    expect(p.steel).toEqual({
      grade: "S355",
      fy: [{ maxThickness: 16, fy: 355 }, { maxThickness: 40, fy: 345 }, { maxThickness: 63, fy: 335 }],
      fu: 470,
      E: 210000,
      G: 81000,
      gammaM0: 1.0,
      gammaM1: 1.0,
      gammaM2: 1.25,
      eta: 1.2,
      betaW: 0.9,
    });
    // the preset ids of materials.ts are lower case; "toString" is no grade
    expect(searchProblemSchema.parse({ ...en, steel: { grade: "s355" } }).steel).toMatchObject({ fu: 470, betaW: 0.9 });
    expect(issues({ ...en, steel: { grade: "toString" } })).toContainEqual({ path: "steel.fu", message: expect.stringMatching(/^steel\.fu is required/) });
    expect(searchProblemSchema.parse({ ...en, steel: { grade: "S235" } }).steel).toMatchObject({ fu: 360, betaW: 0.8, fy: [{ fy: 235 }, { fy: 225 }, { fy: 215 }] });
    expect(searchProblemSchema.parse({ ...en, steel: { grade: "S275" } }).steel).toMatchObject({ fu: 410, betaW: 0.85, fy: [{ fy: 275 }, { fy: 265 }, { fy: 255 }] });
  });

  it("the brief's own steel values win over the preset; without a preset fy and fu are required", () => {
    const p = searchProblemSchema.parse({ ...en, steel: { grade: "S355", fu: 490, betaW: 1, fy: [{ maxThickness: 100, fy: 300 }] } });
    expect(p.steel).toMatchObject({ fu: 490, betaW: 1, fy: [{ maxThickness: 100, fy: 300 }] });
    expect(issues({ ...en, steel: { grade: "X1" } })).toEqual(
      expect.arrayContaining([
        { path: "steel.fy", message: expect.stringMatching(/^steel\.fy is required/) },
        { path: "steel.fu", message: expect.stringMatching(/^steel\.fu is required/) },
      ]),
    );
    // no preset and no βw: the largest βw of EN 1993-1-8 Table 4.1 (conservative)
    expect(searchProblemSchema.parse({ ...en, steel: { fy: [{ maxThickness: 40, fy: 300 }], fu: 450 } }).steel!.betaW).toBe(1.0);
  });

  it("steel is required under en1993", () => {
    const { steel: _s, ...rest } = en;
    expect(issues(rest)).toContainEqual({ path: "steel", message: expect.stringMatching(/^steel is required when basis is "en1993"/) });
  });

  it("fy bands must ascend", () => {
    expect(issues({ ...en, steel: { fu: 470, fy: [{ maxThickness: 40, fy: 345 }, { maxThickness: 16, fy: 355 }] } })).toContainEqual({
      path: "steel.fy.1.maxThickness",
      message: "steel.fy[1].maxThickness must exceed steel.fy[0].maxThickness (bands in ascending order)",
    });
    expect(issues({ ...en, steel: { fu: 470, fy: [{ maxThickness: 16, fy: -1 }] } })).toContainEqual({ path: "steel.fy.0.fy", message: "steel.fy[].fy must be > 0" });
  });

  it("a plate thicker than the last fy band is an error naming it", () => {
    expect(issues({ ...en, thicknesses: [6, 80] })).toContainEqual({
      path: "thicknesses.1",
      message: "thicknesses: 80 mm is beyond the last fy band (steel.fy up to 63 mm); add a band or remove the plate",
    });
    expect(issues({ ...en, thicknesses: [6, 63] })).toEqual([]);
  });

  it("angle and channel-down are refused under en1993, naming them", () => {
    expect(issues({ ...en, families: ["i", "angle", "channel-down"] })).toEqual([
      { path: "families.1", message: 'families: "angle" is not covered by the EN 1993 basis; use the allowable-stress basis' },
      { path: "families.2", message: 'families: "channel-down" is not covered by the EN 1993 basis; use the allowable-stress basis' },
    ]);
    expect(issues({ ...CONTRACT_EXAMPLE_PROBLEM, families: ["angle"] })).toEqual([]);
  });

  it("restraint: defaults C1 = 1, C2 = 0, C3 = 1, load at the shear centre; bad values name the field", () => {
    expect(searchProblemSchema.parse({ ...en, restraint: { length: 6 } }).restraint).toEqual({ length: 6, C1: 1, C2: 0, C3: 1, loadAt: "shearCentre" });
    expect(issues({ ...en, restraint: { length: 6, loadAt: "middle" } })).toContainEqual({ path: "restraint.loadAt", message: 'restraint.loadAt must be "top", "shearCentre" or "bottom"' });
    expect(issues({ ...en, restraint: { length: 0 } })).toContainEqual({ path: "restraint.length", message: "restraint.length must be > 0" });
    expect(issues({ ...en, restraint: {} })).toContainEqual({ path: "restraint.length", message: "restraint.length must be a number" });
  });

  it("supports: stiffened by default; unstiffened needs a bearing length", () => {
    expect(searchProblemSchema.parse(en).supports).toEqual({ stiffened: true });
    expect(issues({ ...en, supports: { stiffened: false } })).toContainEqual({
      path: "supports.bearingLength",
      message: "supports.bearingLength is required when supports.stiffened is false (the stiff bearing length, mm)",
    });
    expect(issues({ ...en, supports: { stiffened: false, bearingLength: 100 } })).toEqual([]);
    expect(issues({ ...en, supports: { stiffened: "no" } })).toContainEqual({ path: "supports.stiffened", message: "supports.stiffened must be true or false" });
  });

  it("fabrication: every field optional, each validated by name", () => {
    expect(searchProblemSchema.parse({ ...en, fabrication: {} }).fabrication).toEqual({});
    expect(issues({ ...en, fabrication: { minThickness: -2 } })).toContainEqual({ path: "fabrication.minThickness", message: "fabrication.minThickness must be > 0" });
    expect(issues({ ...en, fabrication: { flangeAtLeastWeb: 1 } })).toContainEqual({ path: "fabrication.flangeAtLeastWeb", message: "fabrication.flangeAtLeastWeb must be true or false" });
  });

  it("check names: the existing eight first, then member-checks.md §2 in its numbering", () => {
    expect(CHECK_NAMES).toEqual([
      "bending-compression", "bending-tension", "shear", "slenderness-outstand", "slenderness-internal", "slenderness-web",
      "slenderness-stem", "deflection", "class-4", "bending-resistance", "ltb", "shear-resistance", "shear-buckling",
      "bending-shear", "weld", "bearing",
    ]);
  });
});

describe("searches under en1993", () => {
  it("fast search and brute force agree; allowable candidates carry no design block", () => {
    const p: SearchProblemInput = { ...en, depth: { min: 200, max: 300, step: 20 }, width: { min: 80, max: 160, step: 20 }, thicknesses: [6, 8, 10] };
    const a = searchSections(p),
      b = bruteForceSearch(p);
    expect(a.best?.dimensions).toEqual(b.best?.dimensions);
    expect(a.best?.family).toEqual(b.best?.family);
    const allow = searchSections(CONTRACT_EXAMPLE_PROBLEM);
    expect(allow.best?.design).toBeUndefined();
    expect(allow.best?.checks.every((c) => c.clause.length > 0)).toBe(true);
  });
});

// sectionLimits: one section against every limit of a problem (grid, ranges, thicknesses,
// families, geometry, checks). The check values are closed forms: the flexure formula
// σ = M·c/I and the I-section's I = b·d³/12 − (b − tw)(d − 2tf)³/12 (Gere & Goodno, Mechanics
// of Materials, 8th ed., §5.5 and the composite-area method of §5.6).
import { describe, expect, it } from "vitest";
import { sectionLimits, searchProblemSchema, type SearchProblem } from "~/optimizer/index";

const base: SearchProblem = searchProblemSchema.parse({
  moment: { sagging: 120, hogging: 0 },
  allowable: { tension: 250, compression: 250 },
  depth: { min: 100, max: 300, step: 10 },
  width: { min: 50, max: 300, step: 10 },
  thicknesses: [8, 10, 12],
  families: ["i", "channel"],
});
const I300 = { d: 300, b: 150, tf: 10, tw: 8 };
const with_ = (patch: Record<string, unknown>) => searchProblemSchema.parse({ ...base, ...patch });

describe("sectionLimits", () => {
  it("passes a section on the grid that meets every check", () => {
    const r = sectionLimits("i", I300, base);
    expect(r.breaches).toEqual([]);
    expect(r.verdict?.feasible).toBe(true);
  });
  it("names depth.max when the new limit is below the section's depth (the issue's recheck: 300 → 250)", () => {
    const r = sectionLimits("i", I300, with_({ depth: { min: 100, max: 250, step: 10 } }));
    expect(r.breaches).toEqual([{ kind: "above", limit: "depth.max", dim: "d", value: 300, bound: 250 }]);
  });
  it("names depth.min, width.max and the step when the grid no longer holds the value", () => {
    expect(sectionLimits("i", I300, with_({ depth: { min: 310, max: 400, step: 10 } })).breaches[0]).toMatchObject({ kind: "below", limit: "depth.min", value: 300, bound: 310 });
    expect(sectionLimits("i", I300, with_({ width: { min: 50, max: 140, step: 10 } })).breaches[0]).toMatchObject({ kind: "above", limit: "width.max", dim: "b" });
    expect(sectionLimits("i", I300, with_({ depth: { min: 105, max: 400, step: 10 } })).breaches[0]).toEqual({ kind: "off-grid", limit: "depth.step", dim: "d", value: 300, below: 295, above: 305 });
  });
  it("counts a value on the grid within rounding (0.1 + 29 · 0.1 is 3)", () => {
    const p = with_({ depth: { min: 0.1, max: 400, step: 0.1 } });
    expect(sectionLimits("i", { ...I300, d: 3 * 100 }, p).breaches.filter((b) => b.limit.startsWith("depth"))).toEqual([]);
  });
  it("names each plate thickness no longer stocked, and a family no longer searched", () => {
    const r = sectionLimits("i", I300, with_({ thicknesses: [10, 12], families: ["channel"] }));
    expect(r.breaches).toEqual([
      { kind: "family", limit: "families", family: "i" },
      { kind: "thickness", limit: "thicknesses", dim: "tw", value: 8 },
    ]);
  });
  it("names the allowable a check now exceeds, with the engine's demand (σ = M·c/I)", () => {
    // I = 150·300³/12 − 142·280³/12 = 77.7347e6 mm⁴; σ = 120e6 N·mm × 150 mm / I = 231.55 MPa.
    const I = (150 * 300 ** 3) / 12 - (142 * 280 ** 3) / 12;
    const sigma = (120e6 * 150) / I;
    const r = sectionLimits("i", I300, with_({ allowable: { tension: 250, compression: 200 } }));
    expect(r.breaches).toHaveLength(1);
    const b = r.breaches[0];
    expect(b).toMatchObject({ kind: "check", limit: "allowable.compression", check: "bending-compression", capacity: 200 });
    if (b.kind === "check") expect(b.demand).toBeCloseTo(sigma, 6);
  });
  it("names a slenderness limit: web (d − 2tf)/tw = 280/8 = 35 against 30 (engine contract, slenderness)", () => {
    const r = sectionLimits("i", I300, with_({ slenderness: { web: 30 } }));
    expect(r.breaches).toEqual([{ kind: "check", limit: "slenderness.web", check: "slenderness-web", demand: 35, capacity: 30, utilisation: 35 / 30, unit: "ratio" }]);
  });
  it("names the fabrication rules as member-checks.md states them (min thickness, tf ≥ tw, box clear width)", () => {
    const p = with_({ fabrication: { minThickness: 10, flangeAtLeastWeb: true, minBoxClear: 140 }, families: ["i", "box"] });
    expect(sectionLimits("i", { d: 300, b: 150, tf: 8, tw: 10 }, p).breaches.filter((b) => b.kind === "fabrication")).toEqual([
      { kind: "fabrication", limit: "fabrication.minThickness", dim: "tf", value: 8, bound: 10 },
      { kind: "fabrication", limit: "fabrication.flangeAtLeastWeb", dim: "tf", value: 8, bound: 10 },
    ]);
    // b − 2·tw = 150 − 24 = 126 < 140
    expect(sectionLimits("box", { d: 300, b: 150, tf: 12, tw: 12 }, p).breaches.filter((b) => b.kind === "fabrication")).toEqual([
      { kind: "fabrication", limit: "fabrication.minBoxClear", dim: "b", value: 126, bound: 140 },
    ]);
  });
  it("reports invalid geometry and unknown families without throwing", () => {
    expect(sectionLimits("i", { d: 20, b: 150, tf: 10, tw: 8 }, base).breaches.at(-1)).toMatchObject({ kind: "geometry" });
    expect(sectionLimits("zed", {}, base)).toEqual({ breaches: [{ kind: "family", limit: "families", family: "zed" }], verdict: null });
    expect(sectionLimits("i", { d: 300 }, base).verdict).toBeNull();
  });
});

// Material presets and the limits derived from them, against the published figures.
import { describe, expect, it } from "vitest";
import { STEEL_GRADES, presetFill, suggestedAllowables, suggestedSlenderness } from "~/optimizer/materials";
import { searchProblemSchema } from "~/optimizer/search-schema";
import { briefFromFill } from "./material-brief";

describe("steel presets", () => {
  it("EN 10025-2 yields for t ≤ 16 mm and ASTM minimum yields (from memory)", () => {
    const fy = Object.fromEntries(STEEL_GRADES.map((g) => [g.id, g.fy]));
    expect(fy).toMatchObject({ s235: 235, s275: 275, s355: 355, a36: 250, "a572-50": 345, a992: 345 });
    // 50 ksi = 344.7 MPa
    expect(50 * 6.894757).toBeCloseTo(344.7, 1);
  });

  it("allowables: AISC ASD fractions — A36 gives the classic Fb = 24 ksi (compact), 21.6 ksi, Fv = 14.4 ksi", () => {
    const ksi = 6.894757;
    const a = suggestedAllowables(36 * ksi, true);
    expect(a.compression / ksi).toBeCloseTo(23.76, 2); // 0.66 × 36 = 23.76, tabulated as 24 ksi
    expect(suggestedAllowables(36 * ksi).compression / ksi).toBeCloseTo(21.6, 6);
    expect(a.shear / ksi).toBeCloseTo(14.4, 6);
    expect(a.tension / ksi).toBeCloseTo(21.6, 6);
  });

  it("EN 1993-1-1 Table 5.2 in ε = √(235/fy): S355 ε = 0.81, outstand 14ε ≈ 11.4, web 124ε ≈ 100.9", () => {
    const s = suggestedSlenderness(355, 210000, "en-1993");
    expect(Math.sqrt(235 / 355)).toBeCloseTo(0.8136, 4);
    expect(s.outstand).toBeCloseTo(11.39, 2);
    expect(s.internal).toBeCloseTo(34.17, 2);
    expect(s.web).toBeCloseTo(100.89, 2);
  });

  it("AISC 360 Table B4.1b in √(E/Fy): 50 ksi steel gives λp 9.15 and λr 24.1 for flanges, λr 137 for webs (from memory)", () => {
    const ksi = 6.894757;
    const s = suggestedSlenderness(50 * ksi, 29000 * ksi, "aisc-360", true);
    expect(s.outstand).toBeCloseTo(9.15, 2);
    const r = suggestedSlenderness(50 * ksi, 29000 * ksi, "aisc-360");
    expect(r.outstand).toBeCloseTo(24.08, 2);
    expect(r.web).toBeCloseTo(137.3, 1);
  });

  it("a preset fills a brief that the search schema accepts", () => {
    const f = presetFill("s355");
    const p = searchProblemSchema.parse(briefFromFill(f));
    expect(p.allowable!.compression).toBe(213);
    expect(() => presetFill("s999")).toThrow(/unknown steel grade/);
  });
});

// Material presets and the limits derived from them, against the published figures.
import { describe, expect, it } from "vitest";
import { STEEL_GRADES, allowableShear, fyBandWarnings, presetFill, stockyWebLimit, suggestedAllowables, suggestedSlenderness } from "~/optimizer/materials";
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

  it("AISC 360-16 Table B4.1b in √(E/Fy), welded plate sections: 50 ksi steel gives λp 9.15; the built-up flange λr = 0.95·√(kc·E/FL) (case 11) with kc = 0.35, FL = 0.7·Fy = 16.2; webs 137 (from memory)", () => {
    const ksi = 6.894757;
    const s = suggestedSlenderness(50 * ksi, 29000 * ksi, "aisc-360", true);
    expect(s.outstand).toBeCloseTo(9.15, 2);
    // compact: box webs' λp 2.42 (case 19) is the least of the webs the kind covers
    expect(s.web).toBeCloseTo(2.42 * Math.sqrt(29000 / 50), 9);
    const r = suggestedSlenderness(50 * ksi, 29000 * ksi, "aisc-360");
    // 0.95·√(0.35·29 000/(0.7·50)) = 0.95·√290 = 16.18, below the rolled-shape case's 1.0·√(E/Fy) = 24.1
    expect(r.outstand).toBeCloseTo(0.95 * Math.sqrt((0.35 * 29000) / (0.7 * 50)), 9);
    expect(r.outstand).toBeCloseTo(16.18, 2);
    expect(r.web).toBeCloseTo(137.3, 1);
  });

  it("kc = 4/√(h/tw) within 0.35…0.76; where the welded-flange limit exceeds the angle leg's 0.91·√(E/Fy) (case 12), the leg governs", () => {
    const ksi = 6.894757;
    const sq = Math.sqrt(29000 / 50);
    // h/tw = 64: kc = 0.5, λr = 0.95·√(0.5/0.7)·√(E/Fy)
    expect(suggestedSlenderness(50 * ksi, 29000 * ksi, "aisc-360", false, { webSlenderness: 64 }).outstand).toBeCloseTo(0.95 * Math.sqrt(0.5 / 0.7) * sq, 9);
    // h/tw = 20: kc = 0.894 → 0.76 (cap): 0.95·√(0.76/0.7) = 0.99 > 0.91
    expect(suggestedSlenderness(50 * ksi, 29000 * ksi, "aisc-360", false, { webSlenderness: 20 }).outstand).toBeCloseTo(0.91 * sq, 9);
  });

  it("EN 1993 grade presets: fy bands and fu of EN 10025-2 (3 ≤ t ≤ 100 mm: 360 / 410 / 470), βw of EN 1993-1-8 Table 4.1, E and G of EN 1993-1-1 §3.2.6 (from memory)", () => {
    const g = Object.fromEntries(STEEL_GRADES.map((x) => [x.id, x]));
    expect(g.s235).toMatchObject({ fu: 360, betaW: 0.8, E: 210000, G: 81000, fyBands: [{ maxThickness: 16, fy: 235 }, { maxThickness: 40, fy: 225 }, { maxThickness: 63, fy: 215 }] });
    expect(g.s275).toMatchObject({ fu: 410, betaW: 0.85, fyBands: [{ fy: 275 }, { fy: 265 }, { fy: 255 }] });
    expect(g.s355).toMatchObject({ fu: 470, betaW: 0.9, fyBands: [{ fy: 355 }, { fy: 345 }, { fy: 335 }] });
    // G = E/(2·(1 + ν)) with ν = 0.3: 80 769, which §3.2.6 rounds to 81 000
    expect(210000 / 2.6).toBeCloseTo(80769, 0);
    // ASTM: G = 11 200 ksi (AISC 360-16 notation) = 77 221 MPa
    expect(g.a992.G).toBeCloseTo(11200 * 6.894757, -2);
    // density: EN 1991-1-1 Annex A, Table A.4 gives steel 77.0 to 78.5 kN/m³; 7850 kg/m³ is its
    // upper value with g taken as 10 m/s² (7850 × 9.81 = 77.0 kN/m³, the lower one)
    expect((7850 * 10) / 1000).toBe(78.5);
    expect((7850 * 9.81) / 1000).toBeCloseTo(77.0, 1);
    for (const x of STEEL_GRADES) expect(x.density).toBe(7850);
    expect(g.s355.source).toMatch(/EN 1991-1-1 Annex A/);
  });

  it("allowable shear: 0.40·fy only for stocky webs, h/tw ≤ 380/√Fy (ksi); slender webs reduced (AISC ASD 1989 §F4, from memory)", () => {
    const ksi = 6.894757;
    expect(stockyWebLimit(36 * ksi)).toBeCloseTo(63.3, 1);
    expect(stockyWebLimit(50 * ksi)).toBeCloseTo(53.7, 1);
    expect(allowableShear(36 * ksi, 60)).toBeCloseTo(0.4 * 36 * ksi, 9);
    // h/tw = 150, Fy 36 ksi: Cv = 45 000·5.34/(36·150²) = 0.2967 ≤ 0.8; Fv = 36/2.89·0.2967 = 3.70 ksi
    expect(allowableShear(36 * ksi, 150) / ksi).toBeCloseTo((36 / 2.89) * ((45000 * 5.34) / (36 * 150 ** 2)), 9);
    // h/tw = 70: Cv = 45 000·5.34/(36·4900) = 1.36 > 0.8, so Cv = 190/70·√(5.34/36) = 1.045; Fv = min(0.4·36, 36/2.89·1.045) = 13.0 ksi
    expect(allowableShear(36 * ksi, 70) / ksi).toBeCloseTo(Math.min(14.4, (36 / 2.89) * (190 / 70) * Math.sqrt(5.34 / 36)), 9);
    expect(presetFill("a36").shearNote).toMatch(/stocky webs/);
  });

  it("fy band warnings: plates beyond the band the preset's fy comes from", () => {
    const s355 = STEEL_GRADES.find((x) => x.id === "s355")!;
    expect(fyBandWarnings(s355, [6, 10, 16])).toEqual([]);
    expect(fyBandWarnings(s355, [10, 20, 50, 80])).toEqual([
      "S355: plates of 20, 50 mm are thicker than 16 mm, where fy is lower (345 MPa at 20 mm, 335 MPa at 50 mm) than the 355 MPa the preset's figures use.",
      "S355: plates of 80 mm are beyond the last fy band (63 mm): the preset gives no fy for them.",
    ]);
  });

  it("a preset fills a brief that the search schema accepts", () => {
    const f = presetFill("s355");
    const p = searchProblemSchema.parse(briefFromFill(f));
    expect(p.allowable!.compression).toBe(213);
    expect(() => presetFill("s999")).toThrow(/unknown steel grade/);
  });
});

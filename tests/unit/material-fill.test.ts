// materialFill: the one derivation behind the built-in presets and a team's own materials.
import { describe, expect, it } from "vitest";
import { materialFill, OWN_MATERIAL_RULES, presetFill, STEEL_GRADES } from "~/optimizer/materials";
import { searchProblemSchema } from "~/optimizer/search-schema";
import { MATERIAL_LIMITS } from "~/lib/material-limits";
import { briefFromFill } from "../optimizer/material-brief";

describe("materialFill", () => {
  it("is what every built-in preset fills (same function, the grade's own table)", () => {
    for (const g of STEEL_GRADES) {
      expect(presetFill(g.id)).toEqual(materialFill(g, { rules: g.rules }));
      expect(presetFill(g.id, { compact: true })).toEqual(materialFill(g, { rules: g.rules, compact: true }));
    }
  });

  it("S355 through the EN table: 0.60·fy = 213 MPa, 0.40·fy = 142 MPa; outstand 14ε = 11.4 with ε = √(235/355) (EN 1993-1-1 Table 5.2; AISC ASD 1989 §F1, §F4; from memory)", () => {
    const f = materialFill({ E: 210000, fy: 355, density: 7850 }, { rules: "en-1993" });
    expect(f.allowable).toEqual({ tension: 213, compression: 213, shear: 142 });
    expect(f.slenderness.outstand).toBe(11.4);
    expect(f.slenderness.web).toBe(100.9); // 124ε = 100.89
  });

  it("a team's own material takes AISC 360-16 Table B4.1b in √(E/Fy): aluminium E 69 000, fy 240 → built-up flange λr 0.95·√(0.35/0.7)·√287.5 = 11.4 (case 11), web 5.70·√287.5 = 96.6 (from memory)", () => {
    expect(OWN_MATERIAL_RULES).toBe("aisc-360");
    // 6061-T6 handbook figures (E ≈ 69 GPa, fy ≈ 240 MPa, ρ ≈ 2700 kg/m³; from memory).
    const f = materialFill({ E: 69000, fy: 240, density: 2700 });
    const r = Math.sqrt(69000 / 240); // 16.956
    expect(f.slenderness).toEqual({ outstand: 11.4, internal: 23.7, web: 96.6, stem: 25.8 });
    expect(f.slenderness.web).toBeCloseTo(5.7 * r, 1);
    expect(f.allowable).toEqual({ tension: 144, compression: 144, shear: 96 });
    expect(f.density).toBe(2700);
    expect(f.E).toBe(69000);
  });

  it("the √(E/Fy) form follows E: half the stiffness at the same yield gives limits √2 smaller", () => {
    const steel = materialFill({ E: 200000, fy: 345, density: 7850 });
    const soft = materialFill({ E: 100000, fy: 345, density: 7850 });
    expect(steel.slenderness.outstand).toBe(16.2); // 50 ksi built-up flange λr = 0.95·√(0.35/0.7)·24.08 = 16.2 (AISC 360-16 Table B4.1b case 11, kc = 0.35; from memory)
    expect(soft.slenderness.outstand / steel.slenderness.outstand).toBeCloseTo(1 / Math.SQRT2, 2);
  });

  it("every corner of the admin page's accepted ranges fills a brief the search schema accepts (nothing rounds to zero)", () => {
    const { E, fy, density } = MATERIAL_LIMITS;
    for (const e of [E.min, E.max])
      for (const y of [fy.min, fy.max])
        for (const rho of [density.min, density.max])
          for (const compact of [false, true]) {
            const f = materialFill({ E: e, fy: y, density: rho }, { compact });
            const r = searchProblemSchema.safeParse(briefFromFill(f));
            expect(r.success, `E ${e}, fy ${y}, ρ ${rho}, compact ${compact}: ${JSON.stringify(r.error?.issues)}`).toBe(true);
          }
  });
});

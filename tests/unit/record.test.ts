// The calculation record's numbers for a welded tee, checked against a hand calculation by the
// parallel-axis theorem (the tabular method of e.g. Gere & Goodno, Mechanics of Materials, 7th ed. (2009),
// §12.5 and Appendix D): flange 150 × 20 on a 10 × 180 stem, d = 200 mm.
//   flange: A = 3000 mm², y = 190 mm, I0 = 150·20³/12 = 100 000 mm⁴
//   stem:   A = 1800 mm², y = 90 mm,  I0 = 10·180³/12 = 4 860 000 mm⁴
//   ȳ = (3000·190 + 1800·90) / 4800 = 152.5 mm
//   A·d²: 3000·37.5² = 4 218 750; 1800·62.5² = 7 031 250 → Iz = 16 210 000 mm⁴
//   M = 20 kN·m sagging: σ_top = −20e6·47.5/16.21e6 = −58.606 MPa; σ_bottom = +20e6·152.5/16.21e6 = +188.155 MPa
import { describe, expect, it } from "vitest";
import { buildRecord } from "~/lib/record";
import { searchProblemSchema } from "~/optimizer/search-schema";

const problem = searchProblemSchema.parse({
  moment: { sagging: 20, hogging: 0 },
  allowable: { tension: 200, compression: 165 },
  depth: { min: 100, max: 300, step: 10 },
  width: { min: 50, max: 200, step: 10 },
  thicknesses: [10, 20],
  families: ["tee"],
});

describe("calculation record: welded tee by hand", () => {
  const rec = buildRecord("tee", { d: 200, b: 150, tf: 20, tw: 10 }, problem);
  it("composite table rows and totals", () => {
    const flange = rec.table.rows.find((r) => r.A === 3000)!;
    const stem = rec.table.rows.find((r) => r.A === 1800)!;
    expect(flange.yc).toBe(190);
    expect(stem.yc).toBe(90);
    expect(flange.I0).toBeCloseTo(100_000, 6);
    expect(stem.I0).toBeCloseTo(4_860_000, 6);
    expect(rec.table.totals.yBar).toBeCloseTo(152.5, 9);
    expect(flange.Ad2).toBeCloseTo(4_218_750, 4);
    expect(stem.Ad2).toBeCloseTo(7_031_250, 4);
    expect(rec.table.totals.Iz).toBeCloseTo(16_210_000, 3);
    // The table and the engine's properties agree (one source of truth).
    expect(rec.properties.Iz).toBeCloseTo(rec.table.totals.Iz, 3);
  });
  it("fibre stresses by the flexure formula", () => {
    const f = rec.fibres[0];
    expect(f.case).toBe("sagging");
    expect(f.symmetric).toBe(true);
    expect(f.top).toBeCloseTo(-58.606, 3);
    expect(f.bottom).toBeCloseTo(188.155, 3);
  });
  it("checks: tension governs at 188.155 / 200", () => {
    expect(rec.verdict.governing).toBe("bending-tension");
    expect(rec.verdict.utilisation).toBeCloseTo(188.155 / 200, 5);
    expect(rec.verdict.feasible).toBe(true);
  });
});

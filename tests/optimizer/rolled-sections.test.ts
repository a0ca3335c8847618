// Rolled European I sections against their published section tables.
//
// Source: EN 10365:2017, Hot rolled steel channels, I and H sections — dimensions and masses,
// the IPE and HE A / HE B tables (formerly DIN 1025-5, -3 and -2): dimensions h, b, tw, tf, r in
// mm and the tabulated section constants, A in cm², Iy, Iz in cm⁴, Wel, Wpl in cm³. Values are
// FROM MEMORY of those tables.
//
// Axis naming: the tables' y–y is the strong axis (about the horizontal), which is our z
// (contract: Iz about the horizontal axis). So table Iy ↔ our Iz, table Iz ↔ our Iy.
//
// Tolerance: each value must agree within half a unit of its last printed digit (the table's
// rounding) plus 0.03% of the value, because the tables derive moduli from unrounded
// properties and some printings round the root-fillet contribution; a geometry error (say a
// missing fillet, ~0.5–2% of A) is far larger than this allowance and would fail.
import { describe, expect, it } from "vitest";
import { sectionProperties } from "~/optimizer/index";

type Row = {
  name: string;
  h: number; b: number; tw: number; tf: number; r: number;
  // printed strings keep the number of decimals, which sets the rounding allowance
  A: string; Iy: string; Wely: string; Wply: string; Iz: string; Welz: string; Wplz: string;
};

const T: Row[] = [
  { name: "IPE 100", h: 100, b: 55, tw: 4.1, tf: 5.7, r: 7, A: "10.3", Iy: "171.0", Wely: "34.2", Wply: "39.41", Iz: "15.92", Welz: "5.79", Wplz: "9.15" },
  { name: "IPE 200", h: 200, b: 100, tw: 5.6, tf: 8.5, r: 12, A: "28.5", Iy: "1943", Wely: "194.3", Wply: "220.6", Iz: "142.4", Welz: "28.47", Wplz: "44.61" },
  { name: "IPE 300", h: 300, b: 150, tw: 7.1, tf: 10.7, r: 15, A: "53.8", Iy: "8356", Wely: "557.1", Wply: "628.4", Iz: "603.8", Welz: "80.5", Wplz: "125.2" },
  { name: "IPE 400", h: 400, b: 180, tw: 8.6, tf: 13.5, r: 21, A: "84.5", Iy: "23130", Wely: "1156", Wply: "1307", Iz: "1318", Welz: "146.4", Wplz: "229.0" },
  { name: "IPE 500", h: 500, b: 200, tw: 10.2, tf: 16, r: 21, A: "115.5", Iy: "48200", Wely: "1928", Wply: "2194", Iz: "2142", Welz: "214.2", Wplz: "335.9" },
  { name: "HE 200 A", h: 190, b: 200, tw: 6.5, tf: 10, r: 18, A: "53.8", Iy: "3692", Wely: "388.6", Wply: "429.5", Iz: "1336", Welz: "133.6", Wplz: "203.8" },
  { name: "HE 300 A", h: 290, b: 300, tw: 8.5, tf: 14, r: 27, A: "112.5", Iy: "18260", Wely: "1260", Wply: "1383", Iz: "6310", Welz: "420.6", Wplz: "641.2" },
  { name: "HE 300 B", h: 300, b: 300, tw: 11, tf: 19, r: 27, A: "149.1", Iy: "25170", Wely: "1678", Wply: "1869", Iz: "8563", Welz: "570.9", Wplz: "870.1" },
];

/** Half a unit of the last printed digit; for integers printed with trailing zeros (23130) a unit of the last non-zero digit's place. */
function allowance(printed: string): number {
  const v = Number(printed);
  const dot = printed.indexOf(".");
  let unit: number;
  if (dot >= 0) unit = 10 ** -(printed.length - dot - 1);
  else {
    const zeros = printed.length - printed.replace(/0+$/, "").length;
    unit = 10 ** zeros;
  }
  return unit / 2 + 3e-4 * v;
}

function check(got: number, printed: string) {
  expect(Math.abs(got - Number(printed)), `got ${got} vs printed ${printed}`).toBeLessThanOrEqual(allowance(printed));
}

describe("rolled I sections with root radius r (family i, r > 0)", () => {
  it.each(T)("$name", (s) => {
    const p = sectionProperties({ family: "i", d: s.h, b: s.b, tf: s.tf, tw: s.tw, r: s.r });
    check(p.area / 1e2, s.A);
    check(p.Iz / 1e4, s.Iy);
    check(p.Sz.top / 1e3, s.Wely);
    check(p.Sz.bottom / 1e3, s.Wely);
    check(p.Zz / 1e3, s.Wply);
    check(p.Iy / 1e4, s.Iz);
    check(p.Sy.left / 1e3, s.Welz);
    check(p.Zy / 1e3, s.Wplz);
  });

  it("without the fillets the same check fails (so the fillet geometry is what matches the tables)", () => {
    const s = T[3];
    const p = sectionProperties({ family: "i", d: s.h, b: s.b, tf: s.tf, tw: s.tw });
    expect(Math.abs(p.area / 1e2 - Number(s.A))).toBeGreaterThan(allowance(s.A));
  });

  it("mass per metre at 7850 kg/m³: IPE 300 42.2 kg/m, HE 300 B 117 kg/m (same tables, from memory)", () => {
    expect(sectionProperties({ family: "i", d: 300, b: 150, tf: 10.7, tw: 7.1, r: 15 }).massPerMetre).toBeCloseTo(42.2, 1);
    expect(Math.round(sectionProperties({ family: "i", d: 300, b: 300, tf: 19, tw: 11, r: 27 }).massPerMetre)).toBe(117);
  });
});

// The EN 1993 basis (member-checks.md §2) against its formulas written out here, a worked hand
// calculation, the classic closed form for Mcr and the buckling-curve formula at chosen λLT.
// Clauses: EN 1993-1-1 (2005) Table 5.2, §6.2.5, §6.2.6, §6.2.8, §6.3.2.2; EN 1993-1-5 (2006)
// §5, §6; EN 1993-1-8 (2005) §4.5.3.3 — quoted from memory (mem.) where noted.
import { describe, expect, it } from "vitest";
import {
  bruteForceSearch,
  candidateChecks,
  chiLT,
  recordLines,
  searchProblemSchema,
  searchSections,
  sectionProperties,
  type CandidateVerdict,
  type Family,
  type SearchProblemInput,
} from "~/optimizer/index";

const rel = (a: number, b: number, tol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(Math.abs(b), 1e-300));

const BASE: SearchProblemInput = {
  moment: { sagging: 120 },
  shear: 150,
  basis: "en1993",
  steel: { grade: "S355" },
  depth: { min: 100, max: 450, step: 10 },
  width: { min: 50, max: 300, step: 10 },
  thicknesses: [4, 6, 8, 10, 12, 15, 20, 25],
  families: ["i", "mono-i", "channel", "tee", "box"],
};
/** ε = 1 steel so Table 5.2's limits are round numbers. */
const S235_FLAT = { fy: [{ maxThickness: 100, fy: 235 }], fu: 360, betaW: 0.8 };
const problem = (over: Partial<SearchProblemInput> = {}) => searchProblemSchema.parse({ ...BASE, ...over });
const check = (v: CandidateVerdict, name: string) => v.checks.find((c) => c.name === name);
const E = 210000,
  G = 81000;
const UDL = { C1: 1.13, C2: 0.454, C3: 0.525 }; // simply supported, uniform load (mem.)

describe("worked hand calculation: welded I 450 × 110 × 8/6, S355, 6 m between restraints", () => {
  // Iy = 2·8·110³/12 + 434·6³/12 = 1 774 666.7 + 7 812 = 1 782 478.7 mm⁴
  // J = 2·110·8³/3 + 434·6³/3 = 37 546.7 + 31 248 = 68 794.7 mm⁴
  // Cw = tf·b³·h0²/24 = 8·110³·442²/24 = 8.6677e10 mm⁶
  // π²·E·Iy/L² = 9.8696·210 000·1 782 478.7/6000² = 102 622 N
  // Cw/Iy = 48 628 mm²; L²·G·J/(π²·E·Iy) = 54 300 mm²
  // load at the shear centre: Mcr = 1.13·102 622·√(102 928) = 37.2 kN·m (member-checks.md: ≈ 37)
  // load on the top flange, zg = 225 mm: C2·zg = 102.2 mm, Mcr = 1.13·102 622·(√(102 928 + 102.2²) − 102.2) = 27.2 kN·m (≈ 27)
  const dims = { d: 450, b: 110, tf: 8, tw: 6 };
  const Iy = (2 * 8 * 110 ** 3) / 12 + (434 * 6 ** 3) / 12;
  const J = (2 * 110 * 8 ** 3) / 3 + (434 * 6 ** 3) / 3;
  const Cw = (8 * 110 ** 3 * 442 ** 2) / 24;
  const L = 6000;
  const mcr = (zg: number) => {
    const t = UDL.C2 * zg;
    return ((UDL.C1 * Math.PI ** 2 * E * Iy) / L ** 2) * (Math.sqrt(Cw / Iy + (L ** 2 * G * J) / (Math.PI ** 2 * E * Iy) + t * t) - t);
  };

  it("Mcr ≈ 37 kN·m with the load at the shear centre, ≈ 27 kN·m on the top flange", () => {
    const sc = candidateChecks("i", dims, problem({ restraint: { length: 6, ...UDL, loadAt: "shearCentre" } }));
    const top = candidateChecks("i", dims, problem({ restraint: { length: 6, ...UDL, loadAt: "top" } }));
    expect(sc.design!.ltb![0].Mcr).toBeCloseTo(37.2, 1);
    expect(top.design!.ltb![0].Mcr).toBeCloseTo(27.2, 1);
    rel(sc.design!.ltb![0].Mcr * 1e6, mcr(0), 1e-9);
    rel(top.design!.ltb![0].Mcr * 1e6, mcr(225), 1e-9);
    expect(top.design!.ltb![0].zg).toBe(225);
  });

  it("class 3 (web 434/6 = 72.3 > 83ε·… class-2 limit 67.5), W = Wel, curve d (d/b = 4.1 > 2), Mb,Rd = χLT·W·fy/γM1; it fails by LTB", () => {
    const v = candidateChecks("i", dims, problem({ restraint: { length: 6, ...UDL, loadAt: "top" } }));
    const d = v.design!;
    const eps = Math.sqrt(235 / 355);
    expect(d.fy).toBe(355);
    expect(d.sectionClass).toBe(3);
    const web = d.elements.find((e) => e.element === "web")!;
    expect(web.alpha).toBe(0.5);
    expect(web.psi).toBe(-1);
    rel(web.limits[1], 83 * eps); // 41.5ε/0.5
    const Iz = (110 * 450 ** 3 - 104 * 434 ** 3) / 12;
    rel(d.W!, Iz / 225, 1e-9);
    const l = d.ltb![0];
    expect(l.curve).toBe("d");
    const lam = Math.sqrt((d.W! * 355) / mcr(225));
    rel(l.lambdaLT, lam, 1e-9);
    const phi = 0.5 * (1 + 0.76 * (lam - 0.2) + lam * lam);
    const chi = Math.min(1, 1 / (phi + Math.sqrt(phi * phi - lam * lam)));
    rel(l.chiLT, chi, 1e-9);
    rel(l.MbRd * 1e6, (chi * d.W! * 355) / 1.0, 1e-9);
    expect(v.feasible).toBe(false);
    expect(v.governing).toBe("ltb");
    expect(check(v, "ltb")!.clause).toBe("EN 1993-1-1 §6.3.2.2");
  });

  it("without a restraint length: no LTB check, and the design block says the flange is restrained throughout", () => {
    const v = candidateChecks("i", dims, problem());
    expect(check(v, "ltb")).toBeUndefined();
    expect(v.design!.ltb).toBeNull();
    expect(v.design!.notes.join(" ")).toMatch(/restrained throughout/);
  });
});

describe("Mcr against the classic closed form", () => {
  // Doubly symmetric I in uniform moment, simply supported ends free to warp (Timoshenko & Gere,
  // Theory of Elastic Stability, 2nd ed., 1961, §6.2, mem.): Mcr = (π/L)·√(E·Iy·G·J·(1 + π²·E·Cw/(G·J·L²)))
  it.each([2, 4, 6, 10])("i 400 × 180 × 12/8 over %d m, C1 = 1, load at the shear centre", (Lm) => {
    const dims = { d: 400, b: 180, tf: 12, tw: 8 };
    const v = candidateChecks("i", dims, problem({ restraint: { length: Lm } }));
    const Iy = (2 * 12 * 180 ** 3) / 12 + (376 * 8 ** 3) / 12;
    const J = (2 * 180 * 12 ** 3) / 3 + (376 * 8 ** 3) / 3;
    const Cw = (12 * 180 ** 3 * 388 ** 2) / 24;
    const L = Lm * 1000;
    const Mcr = (Math.PI / L) * Math.sqrt(E * Iy * G * J * (1 + (Math.PI ** 2 * E * Cw) / (G * J * L * L)));
    rel(v.design!.ltb![0].Mcr * 1e6, Mcr, 1e-9);
  });
});

describe("χLT against the curve formula at chosen λLT (EN 1993-1-1 §6.3.2.2, (6.56))", () => {
  // tabulated buckling-curve values (EN 1993-1-1 §6.3.1.2 curves, as tabulated in design texts; mem.):
  // curve c: 0.5399 at λ = 1.0, 0.1962 at 2.0; curve d: 0.4671 at 1.0, 0.1766 at 2.0
  it.each([
    [1.0, 0.49, 0.5399],
    [2.0, 0.49, 0.1962],
    [1.0, 0.76, 0.4671],
    [2.0, 0.76, 0.1766],
    [0.2, 0.76, 1],
    [0.1, 0.49, 1],
  ])("λLT %d, αLT %d → χLT %d", (lam, a, chi) => {
    expect(chiLT(lam, a)).toBeCloseTo(chi, 4);
    const phi = 0.5 * (1 + a * (lam - 0.2) + lam * lam);
    rel(chiLT(lam, a), Math.min(1, 1 / (phi + Math.sqrt(phi * phi - lam * lam))));
  });
  it("curve c for a welded I with d/b ≤ 2 (mono-i: the narrower flange), d otherwise", () => {
    const p = problem({ restraint: { length: 4 } });
    expect(candidateChecks("i", { d: 400, b: 200, tf: 12, tw: 8 }, p).design!.ltb![0]).toMatchObject({ curve: "c", alphaLT: 0.49 });
    expect(candidateChecks("i", { d: 401, b: 200, tf: 12, tw: 8 }, p).design!.ltb![0]).toMatchObject({ curve: "d", alphaLT: 0.76 });
    expect(candidateChecks("mono-i", { d: 400, bt: 250, tft: 12, bb: 190, tfb: 12, tw: 8 }, p).design!.ltb![0].curve).toBe("d");
    expect(candidateChecks("box", { d: 300, b: 200, tf: 12, tw: 8 }, p).design!.ltb![0].curve).toBe("d");
  });
  it("hogging: zj = −betaX/2 and the bottom flange in compression", () => {
    const p = problem({ moment: { sagging: 0, hogging: 50 }, restraint: { length: 4, loadAt: "top" } });
    const v = candidateChecks("mono-i", { d: 440, bt: 170, tft: 10, bb: 130, tfb: 6, tw: 6 }, p);
    const st = sectionProperties({ family: "mono-i", d: 440, bt: 170, tft: 10, bb: 130, tfb: 6, tw: 6 }).stability!;
    const l = v.design!.ltb![0];
    expect(l.moment).toBe("hogging");
    rel(l.zj, -st.betaX / 2);
    rel(l.zg, 440 - st.shearCentre.y);
    expect(v.design!.elements.map((e) => e.element)).toEqual(["bottom flange", "web"]);
  });
});

describe("classification, EN 1993-1-1 Table 5.2 (ε = 1: fy 235), at the boundaries", () => {
  const p = problem({ steel: S235_FLAT, shear: 0 });
  const cls = (family: Family, dims: Record<string, number>, pp = p) => candidateChecks(family, dims, pp).design!;
  const el = (family: Family, dims: Record<string, number>, name: string, pp = p) => cls(family, dims, pp).elements.find((e) => e.element === name)!;

  it("i flange outstand c = (b − tw)/2: 9 → class 1, 9.1 → 2, 10 → 2, 10.1 → 3, 14 → 3, 14.1 → 4", () => {
    const f = (b: number) => el("i", { d: 200, b, tf: 10, tw: 6 }, "top flange").class;
    expect([f(186), f(188), f(206), f(208), f(286), f(288)]).toEqual([1, 2, 2, 3, 3, 4]);
  });
  it("channel flange outstand c = b − tw", () => {
    const f = (b: number) => el("channel", { d: 200, b, tf: 10, tw: 6 }, "top flange");
    expect(f(96)).toMatchObject({ c: 90, ratio: 9, class: 1 });
    expect(f(97).class).toBe(2);
  });
  it("webs (α = 0.5, ψ = −1): 72 → class 1, 73 → 2, 83 → 2, 84 → 3, 124 → 3, 125 → 4", () => {
    const f = (hw: number) => el("i", { d: hw + 20, b: 100, tf: 10, tw: 5 }, "web").class;
    expect([f(360), f(365), f(415), f(420), f(620), f(625)]).toEqual([1, 2, 2, 3, 3, 4]);
  });
  it("box flange (internal) c = b − 2·tw: 33 → 1, 33.2 → 2, 38 → 2, 42 → 3, 42.2 → 4", () => {
    const f = (b: number) => el("box", { d: 200, b, tf: 10, tw: 10 }, "top flange").class;
    expect([f(350), f(352), f(400), f(440), f(442)]).toEqual([1, 2, 2, 3, 4]);
  });
  it("tee stem as an outstand c = d − tf: 9 → 1, 14 → 3, 14.1 → 4; the flange only when compressed", () => {
    const f = (d: number) => el("tee", { d, b: 100, tf: 10, tw: 10 }, "stem").class;
    expect([f(100), f(150), f(151)]).toEqual([1, 3, 4]);
    const hog = problem({ steel: S235_FLAT, shear: 0, moment: { sagging: 0, hogging: 10 } });
    expect(cls("tee", { d: 100, b: 400, tf: 10, tw: 10 }, hog).elements.map((e) => e.element)).toEqual(["stem"]);
    expect(cls("tee", { d: 100, b: 400, tf: 10, tw: 10 }).elements.map((e) => e.element)).toEqual(["top flange", "stem"]);
  });
  it("rectangle: class 1, no elements", () => {
    expect(cls("rectangle", { b: 40, d: 80 })).toMatchObject({ sectionClass: 1, elements: [] });
  });
  it("class 4 fails with governing class-4 (c/t over the class-3 limit) and is not checked further", () => {
    const v = candidateChecks("i", { d: 200, b: 288, tf: 10, tw: 6 }, problem({ steel: S235_FLAT, restraint: { length: 3 }, slenderness: { outstand: 5 } }));
    expect(v.feasible).toBe(false);
    expect(v.governing).toBe("class-4");
    expect(v.checks).toEqual([{ name: "class-4", demand: 14.1, capacity: 14, utilisation: 14.1 / 14, unit: "ratio", clause: expect.stringMatching(/Table 5\.2/) }]);
    expect(v.design).toMatchObject({ sectionClass: 4, McRd: null, W: null, ltb: null, shear: null, weld: null });
  });
  it("mono-i web: α from the plastic (equal-area) axis, ψ from the elastic one (hand calculation)", () => {
    // A = 1700 + 780 + 424·6 = 5024 mm²; half 2512: the top flange (1700) and 812/6 = 135.33 mm of web
    // above the plastic axis, so α (sagging, compression above) = 135.33/424 = 0.3192.
    // ȳ = (780·3 + 2544·218 + 1700·435)/5024 = 258.05 mm; ψ = (6 − ȳ)/(430 − ȳ) = −1.466.
    const pp = problem({ steel: S235_FLAT, shear: 0 });
    const w = el("mono-i", { d: 440, bt: 170, tft: 10, bb: 130, tfb: 6, tw: 6 }, "web", pp);
    const alpha = 812 / 6 / 424;
    const yb = (780 * 3 + 2544 * 218 + 1700 * 435) / 5024;
    const psi = (6 - yb) / (430 - yb);
    rel(w.alpha!, alpha, 1e-12);
    rel(w.psi!, psi, 1e-12);
    rel(w.limits[0], 36 / alpha, 1e-12);
    rel(w.limits[1], 41.5 / alpha, 1e-12);
    rel(w.limits[2], 62 * (1 - psi) * Math.sqrt(-psi), 1e-12);
    expect(w.under).toEqual(["sagging"]);
  });
  it("W: Zz for classes 1 and 2, min(Sz) for class 3; Mc,Rd = W·fy/γM0", () => {
    const pp = problem({ steel: S235_FLAT, shear: 0, moment: { sagging: 10 } });
    const c1 = candidateChecks("tee", { d: 100, b: 100, tf: 10, tw: 10 }, pp);
    const props = sectionProperties({ family: "tee", d: 100, b: 100, tf: 10, tw: 10 });
    rel(c1.design!.W!, props.Zz, 1e-9);
    rel(c1.design!.McRd!, (props.Zz * 235) / 1e6, 1e-9);
    const c3 = candidateChecks("tee", { d: 150, b: 100, tf: 10, tw: 10 }, pp);
    const p3 = sectionProperties({ family: "tee", d: 150, b: 100, tf: 10, tw: 10 });
    expect(c3.design!.sectionClass).toBe(3);
    rel(c3.design!.W!, Math.min(p3.Sz.top, p3.Sz.bottom), 1e-9);
  });
});

describe("shear, EN 1993-1-1 §6.2.6 and EN 1993-1-5 §5", () => {
  it("slender web (hw/tw = 72.3 > 72ε/η = 48.8): λw = hw/(86.4·tw·ε), χw = 0.83/λw, Vb,Rd = χw·fy·hw·tw/√3 → shear-buckling", () => {
    const v = candidateChecks("i", { d: 450, b: 110, tf: 8, tw: 6 }, problem());
    const eps = Math.sqrt(235 / 355);
    const s = v.design!.shear!;
    rel(s.VplRd, (1.2 * 434 * 6 * 355) / Math.sqrt(3) / 1e3, 1e-12);
    rel(s.bucklingLimit!, (72 * eps) / 1.2, 1e-12);
    const lw = 434 / (86.4 * 6 * eps);
    rel(s.lambdaW!, lw, 1e-12);
    rel(s.chiW!, 0.83 / lw, 1e-12);
    rel(s.VbRd!, ((0.83 / lw) * 355 * 434 * 6) / Math.sqrt(3) / 1e3, 1e-12);
    expect(s.VbRd!).toBeCloseTo(430.5, 1);
    expect(s.governing).toBe("shear-buckling");
    expect(check(v, "shear-buckling")!.capacity).toBe(s.VRd);
    expect(check(v, "shear-resistance")).toBeUndefined();
  });
  it("stocky web: Vpl,Rd = η·hw·tw·fy/√3 → shear-resistance; box: two webs; tee tw·(d − tf/2); rectangle b·d", () => {
    const p = problem({ shear: 100 });
    const i = candidateChecks("i", { d: 300, b: 150, tf: 10, tw: 10 }, p).design!.shear!;
    expect(i).toMatchObject({ buckling: false, governing: "shear-resistance" });
    rel(i.VplRd, (1.2 * 280 * 10 * 355) / Math.sqrt(3) / 1e3, 1e-12);
    rel(candidateChecks("box", { d: 300, b: 120, tf: 10, tw: 10 }, p).design!.shear!.Av, 1.2 * 2 * 280 * 10);
    rel(candidateChecks("tee", { d: 100, b: 150, tf: 10, tw: 10 }, p).design!.shear!.Av, 10 * 95);
    const rp = problem({ shear: 100, families: ["rectangle"], depth: { min: 20, max: 60, step: 10 }, width: { min: 20, max: 60, step: 10 } });
    rel(candidateChecks("rectangle", { b: 30, d: 60 }, rp).design!.shear!.Av, 1800);
    // box: Vb,Rd summed over both webs
    const b = candidateChecks("box", { d: 450, b: 200, tf: 10, tw: 6 }, p).design!.shear!;
    const eps = Math.sqrt(235 / 355),
      lw = 430 / (86.4 * 6 * eps);
    rel(b.VbRd!, (2 * (0.83 / lw) * 355 * 430 * 6) / Math.sqrt(3) / 1e3, 1e-12);
  });
  it("bending and shear (6.2.8): ρ = (2·VEd/VRd − 1)², MV,Rd = (W − ρ·hw²·tw/4)·fy/γM0 when 0.5·VRd < VEd ≤ VRd", () => {
    const dims = { d: 300, b: 150, tf: 10, tw: 10 };
    const Vpl = (1.2 * 280 * 10 * 355) / Math.sqrt(3) / 1e3;
    const none = candidateChecks("i", dims, problem({ shear: 0.5 * Vpl, moment: { sagging: 50 } }));
    expect(none.design!.bendingShear).toBeNull();
    const v = candidateChecks("i", dims, problem({ shear: 0.75 * Vpl, moment: { sagging: 50 } }));
    const d = v.design!;
    rel(d.bendingShear!.rho, 0.25, 1e-9);
    rel(d.bendingShear!.MVRd, ((d.W! - (0.25 * 280 ** 2 * 10) / 4) * 355) / 1e6, 1e-9);
    expect(check(v, "bending-shear")).toMatchObject({ demand: 50, clause: "EN 1993-1-1 §6.2.8" });
    // tee: (1 − ρ)·Mc,Rd
    const t = candidateChecks("tee", { d: 100, b: 150, tf: 10, tw: 10 }, problem({ shear: 0.75 * ((10 * 95 * 355) / Math.sqrt(3) / 1e3), moment: { sagging: 10 } })).design!;
    rel(t.bendingShear!.MVRd, 0.75 * t.McRd!, 1e-9);
  });
});

describe("flange-to-web weld, EN 1993-1-8 §4.5.3.3", () => {
  it("q = VEd·Qf/Iz, fvw,d = fu/(√3·βw·γM2), a = q/(2·fvw,d) rounded up, at least 3 mm; fails above 0.7·min(tf, tw)", () => {
    const dims = { d: 600, b: 300, tf: 25, tw: 15 };
    const v = candidateChecks("i", dims, problem({ shear: 2500, moment: { sagging: 100 } }));
    const Iz = (300 * 600 ** 3 - 285 * 550 ** 3) / 12;
    const Qf = 300 * 25 * (300 - 12.5);
    const q = (2500e3 * Qf) / Iz;
    const fvwd = 470 / (Math.sqrt(3) * 0.9 * 1.25);
    const w = v.design!.weld!;
    rel(w.Qf, Qf, 1e-9);
    rel(w.q, q, 1e-9);
    rel(w.fvwd, fvwd, 1e-12);
    expect(w.a).toBe(Math.max(3, Math.ceil(q / (2 * fvwd))));
    // q = 2.5e6·2 156 250/1.4484e9 = 3722 N/mm, fvw,d = 241.2 MPa: a = 7.72 → 8 mm ≤ 0.7·15 = 10.5 mm
    expect(w.a).toBe(8);
    rel(w.aMax, 0.7 * 15);
    expect(check(v, "weld")).toMatchObject({ demand: 8, capacity: 0.7 * 15, unit: "mm" });
    // no shear: still 3 mm; 4 mm web: 3 > 2.8, fails
    const thin = candidateChecks("i", { d: 200, b: 100, tf: 8, tw: 4 }, problem({ shear: 0, moment: { sagging: 1 } }));
    expect(thin.design!.weld!.a).toBe(3);
    expect(check(thin, "weld")!.utilisation).toBeCloseTo(3 / 2.8, 12);
    expect(thin.feasible).toBe(false);
  });
  it("mono-i: the flange with the larger first moment; channel: the flange plate (b − tw) × tf; box: the whole flange on its two welds", () => {
    const m = candidateChecks("mono-i", { d: 440, bt: 170, tft: 10, bb: 130, tfb: 6, tw: 6 }, problem({ shear: 100 })).design!.weld!;
    const yb = (780 * 3 + 2544 * 218 + 1700 * 435) / 5024;
    rel(m.Qf, Math.max(1700 * (435 - yb), 780 * (yb - 3)), 1e-9);
    rel(m.aMax, 0.7 * 6);
    const c = candidateChecks("channel", { d: 300, b: 90, tf: 12, tw: 8 }, problem({ shear: 100 })).design!.weld!;
    rel(c.Qf, 82 * 12 * (150 - 6), 1e-9);
    const b = candidateChecks("box", { d: 300, b: 200, tf: 12, tw: 8 }, problem({ shear: 100 })).design!.weld!;
    rel(b.Qf, 200 * 12 * 144, 1e-9);
  });
});

describe("patch loading at an unstiffened end support, EN 1993-1-5 §6 type (c) (mem.)", () => {
  it("kF, Fcr, m1, m2, le, ly, λF, χF, Leff, FRd by the formulas", () => {
    const v = candidateChecks("i", { d: 450, b: 110, tf: 8, tw: 6 }, problem({ supports: { stiffened: false, bearingLength: 100 } }));
    const hw = 434,
      tw = 6,
      tf = 8,
      fy = 355,
      ss = 100;
    const kF = Math.min(6, 2 + (6 * ss) / hw);
    const Fcr = (0.9 * kF * E * tw ** 3) / hw;
    const m1 = 110 / tw;
    const le = Math.min(ss, (kF * E * tw * tw) / (2 * fy * hw));
    const m2 = 0.02 * (hw / tf) ** 2;
    const ly = Math.min(le + tf * Math.sqrt(m1 / 2 + (le / tf) ** 2 + m2), le + tf * Math.sqrt(m1 + m2));
    const lamF = Math.sqrt((ly * tw * fy) / Fcr);
    expect(lamF).toBeGreaterThan(0.5);
    const chiF = Math.min(1, 0.5 / lamF);
    const FRd = (fy * chiF * ly * tw) / 1.0;
    const b = v.design!.bearing!;
    rel(b.kF, kF);
    rel(b.ly, ly, 1e-12);
    rel(b.FRd, FRd / 1e3, 1e-12);
    expect(b.FRd).toBeCloseTo(161.2, 0);
    expect(check(v, "bearing")).toMatchObject({ demand: 150, clause: "EN 1993-1-5 §6" });
    // stiffened (the default): no bearing check, the record lists the stiffeners as required
    const s = candidateChecks("i", { d: 450, b: 110, tf: 8, tw: 6 }, problem());
    expect(check(s, "bearing")).toBeUndefined();
    expect(s.design!.notes.join(" ")).toMatch(/Bearing stiffeners are required/);
  });
});

describe("deflection, slenderness, precedence, record", () => {
  it("deflection and the brief's slenderness limits work under en1993 too; the checks list in member-checks.md's order", () => {
    const v = candidateChecks(
      "i",
      { d: 400, b: 200, tf: 12, tw: 8 },
      problem({ restraint: { length: 3 }, deflection: { span: 6, serviceLoad: 20, limitRatio: 250, E: 210000 }, slenderness: { outstand: 12, web: 60 } }),
    );
    const Iz = (200 * 400 ** 3 - 192 * 376 ** 3) / 12;
    rel(check(v, "deflection")!.demand, (5 * 20 * 6000 ** 4) / (384 * 210000 * Iz), 1e-12);
    expect(v.checks.map((c) => c.name)).toEqual(["bending-resistance", "ltb", "shear-resistance", "weld", "deflection", "slenderness-outstand", "slenderness-web"]);
    expect(check(v, "slenderness-web")!.utilisation).toBeCloseTo(376 / 8 / 60, 12);
  });
  it("record lines name their clauses and state the assumptions", () => {
    const p = problem({ restraint: { length: 6, ...UDL, loadAt: "top" }, supports: { stiffened: false, bearingLength: 100 } });
    const v = candidateChecks("i", { d: 450, b: 110, tf: 8, tw: 6 }, p);
    const lines = recordLines(p, v);
    const clauses = lines.map((l) => l.clause);
    for (const c of ["EN 1993-1-1 Table 5.2", "EN 1993-1-1 §6.2.5", "EN 1993-1-1 §6.3.2.2", "EN 1993-1-5 §5.2, §5.3", "EN 1993-1-8 §4.5.3.3", "EN 1993-1-5 §6"]) expect(clauses).toContain(c);
    expect(lines.find((l) => l.clause === "EN 1993-1-1 §6.3.2.2")!.text).toMatch(/Mcr = 27\.2 kN·m/);
  });
});

describe("the search under en1993", () => {
  it("6 m unrestrained, 120 kN·m, 150 kN, depth ≤ 450: brute force returns a heavier I (50–60 kg/m), the search the same", () => {
    const p: SearchProblemInput = { ...BASE, thicknesses: [6, 8, 10, 12, 15, 20, 25], families: ["i"], restraint: { length: 6, ...UDL, loadAt: "top" } };
    const b = bruteForceSearch(p);
    expect(b.best!.massPerMetre).toBeGreaterThan(50);
    expect(b.best!.massPerMetre).toBeLessThan(60);
    expect(b.best!.design!.ltb![0].chiLT).toBeLessThan(1);
    const f = searchSections(p);
    expect(f.best!.dimensions).toEqual(b.best!.dimensions);
    // restrained throughout, the same brief takes a much lighter section
    const free = bruteForceSearch({ ...p, restraint: undefined });
    expect(free.best!.massPerMetre).toBeLessThan(0.8 * b.best!.massPerMetre);
  }, 60000);

  it("fast search = brute force over random problems with LTB, shear buckling, classes, patch loading and fabrication rules", () => {
    let seed = 12345;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const pick = <T,>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)];
    for (let run = 0; run < 12; run++) {
      const p: SearchProblemInput = {
        moment: { sagging: pick([0, 20, 60, 150]), hogging: pick([0, 10, 40]) || (rnd() < 0.5 ? 30 : 0) },
        shear: pick([0, 40, 150, 400]),
        basis: "en1993",
        steel: { grade: pick(["S235", "S275", "S355"]) },
        depth: { min: 120, max: 420, step: pick([20, 30]) },
        width: { min: 60, max: 260, step: pick([20, 25]) },
        thicknesses: [4, 6, 8, 12, 20],
        families: [pick(["i", "mono-i"]), pick(["channel", "tee", "box"])],
        restraint: rnd() < 0.7 ? { length: pick([1.5, 3, 6]), ...UDL, loadAt: pick(["top", "shearCentre", "bottom"]) } : undefined,
        supports: rnd() < 0.4 ? { stiffened: false, bearingLength: pick([0, 50, 150]) } : undefined,
        fabrication: rnd() < 0.5 ? { minThickness: pick([4, 6]), flangeAtLeastWeb: rnd() < 0.5, minBoxClear: pick([60, 100]) } : undefined,
        deflection: rnd() < 0.3 ? { span: 6, serviceLoad: 10, limitRatio: 250, E: 210000 } : undefined,
      };
      if (!(p.moment.sagging! > 0 || p.moment.hogging! > 0)) p.moment.sagging = 30;
      if (p.families[1] === p.families[0]) p.families.pop();
      const b = bruteForceSearch(p),
        f = searchSections(p);
      expect([f.best?.family, f.best?.dimensions], JSON.stringify(p)).toEqual([b.best?.family, b.best?.dimensions]);
      expect(f.counts.grid).toBe(b.counts.grid);
      for (const fam of Object.keys(b.bestByFamily) as Family[]) expect(f.bestByFamily[fam]?.dimensions).toEqual(b.bestByFamily[fam]?.dimensions);
    }
  }, 120000);

  it("fabrication rules are grid exclusions: counts.grid drops them and no best breaks them", () => {
    const p: SearchProblemInput = { ...BASE, moment: { sagging: 80 }, depth: { min: 200, max: 400, step: 50 }, width: { min: 100, max: 250, step: 50 }, families: ["i", "box"] };
    const all = bruteForceSearch(p);
    const fab = bruteForceSearch({ ...p, fabrication: { minThickness: 6, flangeAtLeastWeb: true, minBoxClear: 150 } });
    // hand count: i: 5 depths × 4 widths × flange/web pairs; box likewise with b − 2·tw ≥ 150
    const T = [4, 6, 8, 10, 12, 15, 20, 25],
      T6 = T.filter((t) => t >= 6);
    let n = 0;
    for (const d of [200, 250, 300, 350, 400])
      for (const b of [100, 150, 200, 250])
        for (const tf of T6)
          for (const tw of T6) {
            if (tf < tw) continue;
            if (d > 2 * tf && b > tw) n++; // i
            if (d > 2 * tf && b > 2 * tw && b - 2 * tw >= 150) n++; // box
          }
    expect(fab.counts.grid).toBe(n);
    expect(fab.counts.grid).toBeLessThan(all.counts.grid);
    for (const c of Object.values(fab.bestByFamily)) {
      if (!c) continue;
      expect(c.dimensions.tf).toBeGreaterThanOrEqual(c.dimensions.tw);
      expect(c.dimensions.tw).toBeGreaterThanOrEqual(6);
      if (c.family === "box") expect(c.dimensions.b - 2 * c.dimensions.tw).toBeGreaterThanOrEqual(150);
    }
    expect(searchSections({ ...p, fabrication: { minThickness: 6, flangeAtLeastWeb: true, minBoxClear: 150 } }).counts.grid).toBe(n);
  });
});

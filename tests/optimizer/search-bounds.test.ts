// The facts search.ts's EN 1993 bounds rest on ((E1), (E2) in its header), checked numerically
// against the engine's own formulas: if a formula changes so that a fact no longer holds, the
// proof in the header is void and this fails.
import { describe, expect, it } from "vitest";
import { chiLT, ALPHA_LT_C, ALPHA_LT_D } from "~/optimizer/basis/en1993";
import { plateModulusAbout, platePlasticModulus, plateNeutralAxis, K_AREA, KERNEL_OUT, compositeKernel } from "~/optimizer/composite";
import { FAMILY_KERNELS } from "~/optimizer/family-kernel";

/** B(Mpl, Mcr) = χLT(√(Mpl/Mcr))·Mpl (EN 1993-1-1 §6.3.2.2, general case), the resistance before γM1. */
const B = (mpl: number, mcr: number, a: number) => chiLT(Math.sqrt(mpl / mcr), a) * mpl;

describe("(E2) the LTB resistance grows with the plastic moment and with Mcr, and falls with α", () => {
  for (const a of [0.21, 0.34, ALPHA_LT_C, ALPHA_LT_D])
    it(`α = ${a}: on a fine grid of λ from 0 to 4`, () => {
      const mcr = 1;
      const bad: string[] = [];
      let prevB = -Infinity,
        prevChi = Infinity;
      for (let i = 0; i <= 4000; i++) {
        const lam = i / 1000;
        const b = B(lam * lam * mcr, mcr, a);
        const chi = chiLT(lam, a);
        if (b < prevB * (1 - 1e-12)) bad.push(`ψ = χ·λ² falls at λ = ${lam}`);
        if (chi > prevChi * (1 + 1e-12)) bad.push(`χ rises at λ = ${lam}`);
        if (chi > 1 || chi * lam * lam > 1 + 1e-12) bad.push(`χ > min(1, 1/λ²) at λ = ${lam}`);
        if (a < ALPHA_LT_D && chiLT(lam, ALPHA_LT_D) > chi * (1 + 1e-12)) bad.push(`a larger α raises χ at λ = ${lam}`);
        prevB = b;
        prevChi = chi;
      }
      expect(bad).toEqual([]);
    });
});

describe("(E1) the plastic modulus: least over the axis at the equal-area axis, affine in a free width", () => {
  it("i section: ∫|y − a| dA is least at the neutral axis and affine in b for a fixed a", () => {
    const fk = FAMILY_KERNELS.i;
    const p = new Float64Array(32),
      k = new Float64Array(KERNEL_OUT);
    const at = (b: number, a: number) => {
      fk.fill(Float64Array.from([400, b, 12, 8]), p);
      return plateModulusAbout(p, fk.nPlates, a);
    };
    fk.fill(Float64Array.from([400, 180, 12, 8]), p);
    compositeKernel(p, fk.nPlates, k);
    const zz = platePlasticModulus(p, fk.nPlates, k[K_AREA]);
    const na = plateNeutralAxis(p, fk.nPlates, k[K_AREA]);
    for (const a of [0, 100, 190, 199, 201, 250, 400]) expect(at(180, a)).toBeGreaterThanOrEqual(zz * (1 - 1e-12));
    expect(at(180, na)).toBeCloseTo(zz, 6);
    // affine in b about a fixed axis (here off the neutral axis)
    const z1 = at(100, 150),
      z2 = at(200, 150),
      z3 = at(300, 150);
    expect(z3 - z2).toBeCloseTo(z2 - z1, 3);
  });

  it("mono-i: adding bottom-flange width never lowers Zz", () => {
    const fk = FAMILY_KERNELS["mono-i"];
    const p = new Float64Array(32),
      k = new Float64Array(KERNEL_OUT);
    let prev = 0;
    for (let bb = 20; bb <= 600; bb += 7) {
      fk.fill(Float64Array.from([500, 220, 15, bb, 10, 8]), p);
      compositeKernel(p, fk.nPlates, k);
      const zz = platePlasticModulus(p, fk.nPlates, k[K_AREA]);
      expect(zz).toBeGreaterThanOrEqual(prev * (1 - 1e-12));
      prev = zz;
    }
  });
});

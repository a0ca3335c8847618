// The engine's restraint study (restraint-study.ts, member-checks.md §3): each spacing's answer is
// the exact search of the brief at that spacing (brute force on small grids) with the moment
// factor the point reports (EN 1993: the brief's C1 at L, C1 = 1.0 between intermediate
// restraints, the uniform-moment value of ENV 1993-1-1:1992 Annex F, Table F.1.1, ψ = +1, mem.;
// AISC 360: the brief's Cb at L, 1.0 between braces), more restraints at the same factor never
// make the lightest section heavier, and bad requests name their field.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { bruteForceSearch } from "~/optimizer/brute-force";
import { EngineInputError } from "~/optimizer/errors";
import type { Family } from "~/optimizer/geometry";
import { restraintStudy } from "~/optimizer/restraint-study";
import { searchSections } from "~/optimizer/search";
import { CONTRACT_EXAMPLE_PROBLEM, type SearchProblemInput } from "~/optimizer/search-schema";
import { aisc360Arb, en1993Arb } from "./search-arbitraries";

const RUNS = Number(process.env.SEARCH_PROPERTY_RUNS ?? 0) || undefined;
const dims = (c: { family: string; dimensions: Record<string, number> } | null | undefined) => (c ? `${c.family} ${JSON.stringify(c.dimensions)}` : "none");

const withRestraint = en1993Arb.filter((p) => p.restraint !== undefined);

describe("restraint study against independent searches", () => {
  it("every spacing's best and bests per family equal brute force at that spacing with the C1 it reports; lighter (or equal) with more restraints at the same C1", () => {
    fc.assert(
      fc.property(withRestraint, fc.integer({ min: 1, max: 6 }), (p, divisions) => {
        const study = restraintStudy(p, { divisions });
        expect(study.points.map((q) => q.segments)).toEqual(Array.from({ length: divisions }, (_, i) => i + 1));
        const briefC1 = p.restraint!.C1 ?? 1;
        let prev = Infinity,
          prevC1 = NaN;
        for (const q of study.points) {
          expect(q.intermediateRestraints).toBe(q.segments - 1);
          expect(q.spacing).toBeCloseTo(p.restraint!.length / q.segments, 12);
          expect(q.Cb).toBeUndefined();
          expect(q.C1).toBe(q.segments === 1 ? briefC1 : Math.min(briefC1, 1));
          // C2, C3 and the load position stay the brief's
          const brute = bruteForceSearch({ ...p, restraint: { ...p.restraint!, length: p.restraint!.length / q.segments, C1: q.C1 } });
          expect(dims(q.best)).toBe(dims(brute.best));
          for (const f of Object.keys(brute.bestByFamily) as Family[]) expect(dims(q.bestByFamily[f])).toBe(dims(brute.bestByFamily[f]));
          const obj = q.best ? (q.best.cost ?? q.best.area) : Infinity;
          // at the same C1 a shorter segment only raises Mcr: the feasible set grows, the best
          // cannot get heavier (from L to L/2 C1 may drop, and the best may be heavier)
          if (q.C1 === prevC1) expect(obj).toBeLessThanOrEqual(prev * (1 + 1e-12));
          prev = obj;
          prevC1 = q.C1!;
        }
      }),
      { numRuns: RUNS ?? 40, seed: 6061 },
    );
  }, 600_000);

  it("a 6 m floor beam: the study's spacings match the search run at each spacing, C1 = 1.13 at L and 1.0 between restraints", () => {
    const p: SearchProblemInput = {
      basis: "en1993",
      steel: { grade: "S355" },
      restraint: { length: 6, C1: 1.13, C2: 0.45, C3: 0.525, loadAt: "top" },
      moment: { sagging: 120 },
      shear: 150,
      depth: { min: 200, max: 450, step: 10 },
      width: { min: 100, max: 300, step: 10 },
      thicknesses: [6, 8, 10, 12, 15, 20],
      families: ["i", "box"],
    };
    const study = restraintStudy(p);
    expect(study.length).toBe(6);
    expect(study.points).toHaveLength(6);
    expect(study.points.map((q) => q.C1)).toEqual([1.13, 1, 1, 1, 1, 1]);
    for (const q of study.points) {
      const r = searchSections({ ...p, restraint: { ...p.restraint!, length: 6 / q.segments, C1: q.segments === 1 ? 1.13 : 1 } }, { front: "evaluated" });
      expect(dims(q.best)).toBe(dims(r.best));
    }
    // L is the sweep's own answer (the brief's C1)
    expect(dims(study.points[0].best)).toBe(dims(searchSections(p, { front: "evaluated" }).best));
    // At L/2 = 3 m the brief's C1 = 1.13 (a uniform load over the whole 6 m, ENV 1993-1-1:1992
    // Annex F, Table F.1.2, mem.) would over-estimate Mcr of the middle segments, whose moment is
    // nearly uniform (C1 = 1.0, Table F.1.1, ψ = +1, mem.): with 1.13 a lighter box would pass
    // (250 × 120 × 6, 33.7 kg/m); with 1.0 the study's is heavier.
    const keptC1 = searchSections({ ...p, restraint: { ...p.restraint!, length: 3 } }, { front: "evaluated" }).best!;
    const half = study.points[1].best!;
    expect(dims(half)).not.toBe(dims(keptC1));
    expect(half.massPerMetre).toBeGreaterThan(keptC1.massPerMetre);
    expect(half.checks.find((c) => c.name === "ltb")!.capacity).toBeGreaterThanOrEqual(120);
    // the I unrestrained over 6 m is markedly heavier than one braced at 1 m (LTB governs it);
    // the box, stiff in torsion, hardly cares
    const i6 = study.points[0].bestByFamily.i!,
      i1 = study.points[5].bestByFamily.i!;
    expect(i6.governing).toBe("ltb");
    expect(i6.massPerMetre).toBeGreaterThan(i1.massPerMetre * 1.5);
    expect(study.points[0].bestByFamily.box!.massPerMetre).toBeLessThan(i6.massPerMetre);
  });
});

// AISC 360-16 (issue 14): Lb = L/k; the brief's Cb at L, Cb = 1.0 between intermediate braces
// (§F1 permits 1.0 as a conservative value, mem.; restraint-study.ts says why).
const aiscWithRestraint = aisc360Arb.filter((p) => p.restraint !== undefined);

describe("restraint study under AISC 360", () => {
  it("every spacing's best equals brute force at Lb = L/k with the Cb the point reports", () => {
    fc.assert(
      fc.property(aiscWithRestraint, fc.integer({ min: 1, max: 4 }), (p, divisions) => {
        const study = restraintStudy(p, { divisions });
        for (const q of study.points) {
          expect(q.Cb).toBe(q.segments === 1 ? (p.restraint!.Cb ?? 1) : 1);
          expect(q.C1).toBeUndefined();
          const brute = bruteForceSearch({ ...p, restraint: { ...p.restraint!, length: p.restraint!.length / q.segments, Cb: q.Cb } });
          expect(dims(q.best)).toBe(dims(brute.best));
          for (const f of Object.keys(brute.bestByFamily) as Family[]) expect(dims(q.bestByFamily[f])).toBe(dims(brute.bestByFamily[f]));
        }
      }),
      { numRuns: RUNS ?? 20, seed: 3601 },
    );
  }, 600_000);

  it("a 20 ft ASD beam: L keeps the brief's Cb and is the search's own answer; bracing at L/6 saves steel", () => {
    // 60 kip·ft = 81.35 kN·m, 25 kips = 111.2 kN, Lb 20 ft = 6.096 m, Cb 1.136 (F1-1, uniform load on a simple span)
    const p: SearchProblemInput = {
      basis: "aisc360",
      method: "ASD",
      aisc: { grade: "A572 Gr 50" },
      restraint: { length: 6.096, Cb: 1.136 },
      moment: { sagging: 81.35 },
      shear: 111.2,
      depth: { min: 200, max: 500, step: 20 },
      width: { min: 100, max: 300, step: 20 },
      thicknesses: [6, 8, 10, 12, 16, 20],
      families: ["i"],
    };
    const study = restraintStudy(p);
    expect(study.points.map((q) => q.Cb)).toEqual([1.136, 1, 1, 1, 1, 1]);
    expect(dims(study.points[0].best)).toBe(dims(searchSections(p, { front: "evaluated" }).best));
    // unbraced over 20 ft lateral-torsional buckling is checked and near its limit (F2-2 or F2-3 applies); at 1 m spacing the I is far lighter
    expect(study.points[0].best!.checks.find((c) => c.name === "ltb")!.utilisation).toBeGreaterThan(0.8);
    expect(study.points[5].best!.massPerMetre).toBeLessThan(study.points[0].best!.massPerMetre * 0.8);
  });
});

describe("restraint study: a brief's C1 below 1.0", () => {
  it("is kept at every spacing (the study only lowers C1 to 1.0, never raises it)", () => {
    const p: SearchProblemInput = { ...CONTRACT_EXAMPLE_PROBLEM, basis: "en1993", steel: { grade: "S355" }, families: ["i"], restraint: { length: 4, C1: 0.9, C2: 0.45, C3: 0.525, loadAt: "top" } };
    const study = restraintStudy(p, { divisions: 3 });
    expect(study.points.map((q) => q.C1)).toEqual([0.9, 0.9, 0.9]);
    for (const q of study.points) expect(dims(q.best)).toBe(dims(searchSections({ ...p, restraint: { ...p.restraint!, length: 4 / q.segments } }, { front: "evaluated" }).best));
  });
});

describe("restraint study rejections name the field", () => {
  const en: SearchProblemInput = { ...CONTRACT_EXAMPLE_PROBLEM, basis: "en1993", steel: { grade: "S355" }, families: ["i"], restraint: { length: 4 } };
  const field = (f: () => unknown) => {
    try {
      f();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      return (e as EngineInputError).field;
    }
    throw new Error("no error");
  };
  it("divisions outside 1 … 6 or not whole", () => {
    for (const d of [0, 7, 2.5, NaN]) expect(field(() => restraintStudy(en, { divisions: d }))).toBe("divisions");
  });
  it("the allowable basis, or no restraint length", () => {
    expect(field(() => restraintStudy({ ...CONTRACT_EXAMPLE_PROBLEM }))).toBe("basis");
    expect(field(() => restraintStudy({ ...en, restraint: undefined }))).toBe("restraint");
  });
});

// The brief editor's design-basis fields ↔ SearchProblem (member-checks.md §2–§3): round trips
// in SI and US customary, grade presets filling the bands, the restraint and supports words,
// and the engine's issues landing on the field (an fy band on the row it was typed in).
// Unit factors: NIST SP 811 (1 in = 25.4 mm, 1 ft = 0.3048 m, 1 ksi = 6.894757 MPa).
import { describe, expect, it } from "vitest";
import { parseWithZod } from "@conform-to/zod/v4";
import { briefFormSchema, changedLimits, DEFAULT_PROBLEM, NEW_BRIEF_PROBLEM, newBriefFormDefaults, problemToFormDefaults } from "~/lib/brief-form";
import { gradeFill } from "~/lib/brief-form-basis";
import { MOMENT_DIAGRAMS, matchMomentDiagram, momentDiagram } from "~/lib/moment-diagrams";
import { EN1993_GRADES, searchProblemSchema, type SearchProblem } from "~/optimizer/search-schema";
import { formData } from "./form-data";

const errorsOf = (s: unknown) => (s as { error?: Record<string, string[] | null> }).error ?? {};
type Values = Record<string, any>;

/** An EN 1993 floor beam: S355, 6 m between restraints, uniform load on the top flange, no stiffeners. */
const EN_PROBLEM: SearchProblem = searchProblemSchema.parse({
  ...NEW_BRIEF_PROBLEM,
  allowable: undefined,
  families: ["i", "box"],
  moment: { sagging: 120, hogging: 0 },
  shear: 150,
  restraint: { length: 6, C1: 1.132, C2: 0.459, C3: 0.525, loadAt: "top" },
  supports: { stiffened: false, bearingLength: 100 },
  fabrication: { minThickness: 6, flangeAtLeastWeb: true, minBoxClear: 100 },
});

const parse = (v: Values) => parseWithZod(formData(v), { schema: briefFormSchema });
function ok(v: Values) {
  const s = parse(v);
  if (s.status !== "success") throw new Error(JSON.stringify(errorsOf(s)));
  return s.value;
}

describe("design basis fields ↔ SearchProblem", () => {
  it("an EN 1993 problem round-trips in SI, every basis field included", () => {
    const v = ok(problemToFormDefaults(EN_PROBLEM, { units: "si", name: "Floor beam" }));
    expect(v.problem).toEqual(EN_PROBLEM);
    expect(v.problem.allowable).toBeUndefined();
  });

  it("and in US customary, untouched fields keep their exact SI values (6 m shows as 19.685 ft)", () => {
    const d = problemToFormDefaults(EN_PROBLEM, { units: "us", name: "Floor beam" }) as Values;
    expect(d.restraint.length).toBe(19.685); // 6 ÷ 0.3048 = 19.68504 ft, six figures
    expect(d.steel.fy[0]).toEqual({ maxThickness: 0.629921, fy: 51.4884 }); // 16 mm, 355 MPa (355 ÷ 6.894757)
    expect(d.supports.bearingLength).toBe(3.93701);
    const v = ok(d);
    expect(v.problem).toEqual(EN_PROBLEM);
    expect(changedLimits(EN_PROBLEM, v.problem)).toEqual([]);
  });

  it("an edited US field is converted from what was typed", () => {
    const d = problemToFormDefaults(EN_PROBLEM, { units: "us", name: "B" }) as Values;
    d.restraint.length = 10; // ft
    d.fabrication.minBoxClear = 5; // in
    const v = ok(d);
    expect(v.problem.restraint!.length).toBeCloseTo(3.048, 12);
    expect(v.problem.fabrication!.minBoxClear).toBeCloseTo(127, 9);
  });

  it("an allowable brief stays allowable and gains no EN fields (stored briefs without basis)", () => {
    const { basis: _b, ...old } = DEFAULT_PROBLEM;
    const d = problemToFormDefaults(old as SearchProblem, { units: "si", name: "Old brief" }) as Values;
    expect(d.basis).toBe("allowable");
    const v = ok(d);
    expect(v.problem).toEqual(DEFAULT_PROBLEM);
    expect(v.problem.steel).toBeUndefined();
    expect(v.problem.restraint).toBeUndefined();
    // a problem stored before the basis existed compares as allowable: nothing changed
    expect(changedLimits(old as SearchProblem, v.problem)).toEqual([]);
  });

  it("under EN 1993 the allowables are left out even when the form still holds them", () => {
    const d = problemToFormDefaults(EN_PROBLEM, { units: "si", name: "B" }) as Values;
    d.allowable = { tension: 165, compression: 165, shear: 100 };
    expect(ok(d).problem.allowable).toBeUndefined();
  });

  it("switching an allowable brief to EN 1993 starts from the S355 preset", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "B" }) as Values;
    d.basis = "en1993";
    d.restraintThroughout = true;
    d.families = ["i"];
    const v = ok(d);
    expect(v.problem.basis).toBe("en1993");
    expect(v.problem.steel).toMatchObject({ grade: "S355", fy: EN1993_GRADES.S355.fy, fu: 470, betaW: 0.9 });
    expect(v.problem.restraint).toBeUndefined();
  });
});

describe("new brief", () => {
  it("defaults to EN 1993 with the S355 preset and asks for the restraint length in words", () => {
    const d = newBriefFormDefaults("si") as Values;
    expect(d.basis).toBe("en1993");
    expect(d.steel.grade).toBe("S355");
    expect(d.steel.fy.slice(0, 3)).toEqual([{ maxThickness: 16, fy: 355 }, { maxThickness: 40, fy: 345 }, { maxThickness: 63, fy: 335 }]);
    expect(d.restraintThroughout).toBe(false);
    expect(d.restraint).toMatchObject({ length: undefined, C1: 1.132, C2: 0.459, C3: 0.525, loadAt: "top" });
    d.name = "New";
    const s = parse(d);
    expect(s.status).toBe("error");
    expect(errorsOf(s)["restraint.length"]).toEqual([
      "Restraint length: enter the longest distance between lateral restraints of the compression flange, or tick “restrained throughout”",
    ]);
    d.restraint.length = 6;
    expect(ok(d).problem.restraint).toEqual({ length: 6, C1: 1.132, C2: 0.459, C3: 0.525, loadAt: "top" });
  });

  it("“restrained throughout” leaves the restraint block out (no lateral-torsional buckling check)", () => {
    const d = { ...newBriefFormDefaults("si"), name: "N", restraintThroughout: true } as Values;
    expect(ok(d).problem.restraint).toBeUndefined();
  });
});

describe("presets fill", () => {
  it("each EN grade preset fills the bands, fu and βw with the engine's own values", () => {
    for (const g of ["S235", "S275", "S355"] as const) {
      const d = problemToFormDefaults(EN_PROBLEM, { units: "si", name: "B" }) as Values;
      const fill = gradeFill(g);
      d.steel = { ...d.steel, grade: g, fu: fill.fu, betaW: fill.betaW, fy: [...fill.fy, {}, {}] };
      const steel = ok(d).problem.steel!;
      // EN 10025-2 Table 7 and EN 1993-1-8 Table 4.1 as the engine holds them (mem.)
      expect(steel).toMatchObject({ grade: g, fy: EN1993_GRADES[g].fy, fu: EN1993_GRADES[g].fu, betaW: EN1993_GRADES[g].betaW });
    }
    expect(gradeFill("S275")).toEqual({ fy: [{ maxThickness: 16, fy: 275 }, { maxThickness: 40, fy: 265 }, { maxThickness: 63, fy: 255 }], fu: 410, betaW: 0.85 });
  });

  it("moment-diagram presets: C2 = 0 without transverse load; uniform moment is C1 = 1; the table's values are recognised again", () => {
    // Uniform moment is the case the classic closed form Mcr = (π/L)·√(E·Iz·G·J)·√(1 + π²E·Cw/(L²G·J)) is written for: C1 = 1 by definition.
    expect(momentDiagram("end-moments-1")).toMatchObject({ C1: 1, C2: 0, C3: 1 });
    for (const d of MOMENT_DIAGRAMS) {
      if (!d.transverseLoad) expect(d.C2).toBe(0);
      expect(matchMomentDiagram(d.C1, d.C2, d.C3)?.id).toBe(d.id);
    }
    // ENV 1993-1-1 Annex F Table F.1.2, k = 1, simply supported under uniform load (mem.)
    expect(matchMomentDiagram(1.132, 0.459, 0.525)?.label).toBe("Simply supported, uniform load");
    expect(matchMomentDiagram(1.2, 0.459, 0.525)).toBeUndefined();
    expect(new Set(MOMENT_DIAGRAMS.map((d) => d.id)).size).toBe(MOMENT_DIAGRAMS.length);
  });
});

describe("messages next to the field", () => {
  it("an fy band error lands on the row it was typed in, blank rows skipped", () => {
    const d = problemToFormDefaults(EN_PROBLEM, { units: "si", name: "B" }) as Values;
    d.steel.fy = [{ maxThickness: 16, fy: 355 }, {}, { maxThickness: 10, fy: 345 }, {}, {}];
    const e = errorsOf(parse(d));
    // worded by the rows the editor shows (labels.ts): rows 3 and 1, not the engine's indices 1 and 0
    expect(e["steel.fy[2].maxThickness"]?.[0]).toMatch(/Band 3, plates up to must exceed band 1, plates up to/);
  });

  it("a plate beyond the last band, an angle under EN 1993 and a missing bearing length are named", () => {
    const d = problemToFormDefaults(EN_PROBLEM, { units: "si", name: "B" }) as Values;
    d.thicknesses = "6, 8, 80";
    d.families = ["i", "angle"];
    d.supports = { stiffened: "no" };
    const e = errorsOf(parse(d));
    expect(e.thicknesses?.[0]).toMatch(/80 mm is beyond the last fy band/);
    expect(e.families?.[0]).toMatch(/“Angle” is not covered by the EN 1993 basis; use the allowable-stress basis/);
    expect(e["supports.bearingLength"]).toEqual(["Stiff bearing length: without bearing stiffeners, enter the stiff bearing length at the support"]);
  });

  it("text in a basis number field is named", () => {
    const d = problemToFormDefaults(EN_PROBLEM, { units: "si", name: "B" }) as Values;
    d.restraint.C1 = "big";
    d.steel.fu = "strong";
    const e = errorsOf(parse(d));
    expect(e["restraint.C1"]).toEqual(["Moment factor C1 must be a number"]);
    expect(e["steel.fu"]).toEqual(["Tensile strength fu must be a number"]);
  });

  it("changed limits name a band by its index, with the quantity's unit", () => {
    const b = searchProblemSchema.parse({ ...EN_PROBLEM, steel: { ...EN_PROBLEM.steel, fy: [{ maxThickness: 16, fy: 355 }, { maxThickness: 40, fy: 340 }, { maxThickness: 63, fy: 335 }] } });
    expect(changedLimits(EN_PROBLEM, b)).toEqual([{ path: "steel.fy[1].fy", before: 345, after: 340 }]);
  });
});

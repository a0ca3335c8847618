import { describe, expect, it } from "vitest";
import { parseWithZod } from "@conform-to/zod/v4";
import { briefFormSchema, changedLimits, DEFAULT_PROBLEM, problemToFormDefaults } from "~/lib/brief-form";
import { searchProblemSchema } from "~/optimizer/search-schema";
import { formData } from "./form-data";

const errorsOf = (s: unknown) => (s as { error?: Record<string, string[] | null> }).error;


describe("brief form ↔ SearchProblem", () => {
  it("round-trips the default problem in SI", () => {
    const fd = formData({ ...problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "Roof beam" }) });
    const s = parseWithZod(fd, { schema: briefFormSchema });
    expect(s.status).toBe("success");
    if (s.status === "success") expect(s.value.problem).toEqual(DEFAULT_PROBLEM);
  });
  it("converts US customary at the edge (NIST SP 811 factors: 1 in = 25.4 mm, 1 ksi = 6.894757 MPa)", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "us", name: "B" }) as Record<string, any>;
    d.depth = { min: 4, max: 16, step: 1 };
    d.allowable = { tension: 24, compression: 24, shear: 14.5 };
    const s = parseWithZod(formData(d), { schema: briefFormSchema });
    expect(s.status).toBe("success");
    if (s.status === "success") {
      expect(s.value.problem.depth).toEqual({ min: 101.6, max: 406.4, step: 25.4 });
      expect(s.value.problem.allowable!.tension).toBeCloseTo(24 * 6.894757, 4);
      expect(s.value.meta.units).toBe("us");
    }
  });
  it("puts the engine's own messages on the field that broke the rule", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "B" }) as Record<string, any>;
    d.depth = { min: 400, max: 100, step: 10 };
    d.families = [];
    const s = parseWithZod(formData(d), { schema: briefFormSchema });
    expect(s.status).toBe("error");
    expect(errorsOf(s)?.["depth.max"]).toEqual(["Depth, max must be ≥ depth, min"]);
    expect(errorsOf(s)?.families?.[0]).toMatch(/at least one family/);
  });
  it("names text in a number field and a bad thickness", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "B" }) as Record<string, any>;
    d.moment = { sagging: "lots", hogging: 0 };
    const s = parseWithZod(formData(d), { schema: briefFormSchema });
    expect(errorsOf(s)?.["moment.sagging"]).toEqual(["Sagging moment must be a number"]);
    d.moment = { sagging: 120, hogging: 0 };
    d.thicknesses = "6, eight";
    const t = parseWithZod(formData(d), { schema: briefFormSchema });
    expect(errorsOf(t)?.thicknesses?.[0]).toMatch(/entry 2 \("eight"\) is not a number/);
  });
  it("lists changed limits", () => {
    const b = searchProblemSchema.parse({ ...DEFAULT_PROBLEM, depth: { ...DEFAULT_PROBLEM.depth, max: 350 } });
    expect(changedLimits(DEFAULT_PROBLEM, b)).toEqual([{ path: "depth.max", before: 400, after: 350 }]);
  });
});

describe("US customary round trip", () => {
  it("an untouched US form gives back the exact SI problem (no drift from the six-figure display)", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "us", name: "B" }) as Record<string, any>;
    // 165 MPa shows as 23.9312 ksi (165 ÷ 6.894757 MPa per ksi, NIST SP 811); sent back unchanged it is 165 exactly.
    expect(d.allowable.tension).toBe(23.9312);
    const s = parseWithZod(formData(d), { schema: briefFormSchema });
    expect(s.status).toBe("success");
    if (s.status === "success") {
      expect(s.value.problem).toEqual(DEFAULT_PROBLEM);
      expect(changedLimits(DEFAULT_PROBLEM, s.value.problem)).toEqual([]);
    }
  });
  it("an edited US field is converted from what was typed", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "us", name: "B" }) as Record<string, any>;
    d.allowable = { ...d.allowable, tension: 20 };
    const s = parseWithZod(formData(d), { schema: briefFormSchema });
    if (s.status !== "success") throw new Error("expected success");
    expect(s.value.problem.allowable!.tension).toBeCloseTo(20 * 6.894757, 4);
    expect(s.value.problem.allowable!.compression).toBe(165);
  });
});

describe("cost objective", () => {
  it("takes the stock list's prices; without them the engine names prices", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "B" }) as Record<string, any>;
    d.objective = "cost";
    const none = parseWithZod(formData(d), { schema: briefFormSchema });
    expect(errorsOf(none)?.prices?.[0]).toMatch(/Plate prices are required when the objective is cheapest/);
    d.prices = JSON.stringify(DEFAULT_PROBLEM.thicknesses.map((t) => ({ thickness: t, pricePerKg: 1 + t / 100 })));
    const ok = parseWithZod(formData(d), { schema: briefFormSchema });
    if (ok.status !== "success") throw new Error(JSON.stringify(errorsOf(ok)));
    expect(ok.value.problem.objective).toBe("cost");
    expect(ok.value.problem.prices).toHaveLength(7);
  });
  it("in US units a stock-list thickness shown rounded still matches its price (6.35 mm = 0.25 in)", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "us", name: "B" }) as Record<string, any>;
    d.objective = "cost";
    d.thicknesses = "0.23622, 0.314961"; // 6 mm and 8 mm at six figures
    d.prices = JSON.stringify([{ thickness: 6, pricePerKg: 1.2 }, { thickness: 8, pricePerKg: 1.1 }]);
    const ok = parseWithZod(formData(d), { schema: briefFormSchema });
    if (ok.status !== "success") throw new Error(JSON.stringify(errorsOf(ok)));
    expect(ok.value.problem.thicknesses).toEqual([6, 8]);
  });
});

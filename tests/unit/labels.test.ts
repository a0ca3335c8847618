// Issue 11, item 5: one label table for every message people read. Engine and form messages are
// reworded through plainMessage (no field paths, rows counted from 1), and a text in one number
// field does not hide the other fields' errors.
import { describe, expect, it } from "vitest";
import { parseWithZod } from "@conform-to/zod/v4";
import { briefFormSchema, DEFAULT_PROBLEM, problemToFormDefaults } from "~/lib/brief-form";
import { FAMILY_LABELS, describeBreach, familyLabel, fieldLabel, plainMessage } from "~/lib/labels";
import { FAMILIES } from "~/optimizer/geometry";
import { searchProblemSchema } from "~/optimizer/search-schema";
import { formData } from "./form-data";

const errorsOf = (s: unknown) => (s as { error?: Record<string, string[] | null> }).error ?? {};
/** A field path as the engine writes them: word.word or word[digit]. */
const PATH = /\b[a-z][A-Za-z]*\.[a-z][A-Za-z]*\b|\b[a-z]+\[\d*\]/;

describe("plainMessage", () => {
  it("reads list indices as the rows shown (1-based) and paths as labels", () => {
    expect(plainMessage("plates[3] overlaps plates[2]")).toBe("Plate 4 overlaps plate 3");
    expect(plainMessage("plates[0].h must be > 0")).toBe("Plate 1, height h must be > 0");
    expect(plainMessage("polygons[1].points[4] makes the polygon cross itself")).toBe("Polygon 2, point 5 makes the polygon cross itself");
    expect(plainMessage("moment.sagging must be ≥ 0")).toBe("Sagging moment must be ≥ 0");
    expect(plainMessage("allowable.shear is required when shear is given")).toBe("Allowable shear is required when shear is given");
    expect(plainMessage('families: "rectangle" is not cut from stock plate, so it has no price; remove it or use objective "mass"')).toBe(
      'Shape families: “Rectangle (solid bar)” is not cut from stock plate, so it has no price; remove it or use the lightest objective',
    );
    expect(plainMessage("depth: 200,000 values; at most 100,000 per axis (raise depth.step)")).toBe("Depth: 200,000 values; at most 100,000 per axis (raise depth, step)");
  });
});

describe("brief form errors", () => {
  it("a text in a number field does not hide the other errors, and none names a field path", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "B" }) as Record<string, any>;
    d.moment = { sagging: "lots", hogging: 0 };
    d.depth = { min: 400, max: 100, step: 10 };
    d.memberCount = "2.5";
    d.thicknesses = "6, eight";
    const e = errorsOf(parseWithZod(formData(d), { schema: briefFormSchema }));
    expect(e["moment.sagging"]).toEqual(["Sagging moment must be a number"]);
    expect(e["depth.max"]).toEqual(["Depth, max must be ≥ depth, min"]);
    expect(e.memberCount).toEqual(["Member count must be a whole number"]);
    expect(e.thicknesses?.[0]).toMatch(/^Plate thicknesses: entry 2 \("eight"\) is not a number/);
    for (const messages of Object.values(e)) for (const m of messages ?? []) expect(m).not.toMatch(PATH);
  });
  it("a group's issue (both moments zero) sits on the group's first field", () => {
    const d = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "B" }) as Record<string, any>;
    d.moment = { sagging: 0, hogging: 0 };
    const e = errorsOf(parseWithZod(formData(d), { schema: briefFormSchema }));
    expect(e["moment.sagging"]).toEqual(["Design moment: sagging or hogging must be > 0"]);
  });
});

describe("labels", () => {
  it("every family has one name, used by every page", () => {
    for (const f of FAMILIES) expect(familyLabel(f)).toBe(FAMILY_LABELS[f]);
    expect(fieldLabel("deflection.limitRatio")).toBe("Limit ratio (span ÷ …)");
  });
  it("words a broken limit with the page's units (300 mm = 11.81 in)", () => {
    expect(describeBreach({ kind: "above", limit: "depth.max", dim: "d", value: 300, bound: 250 }, "si")).toBe("depth 300 mm is above depth, max 250 mm");
    expect(describeBreach({ kind: "above", limit: "depth.max", dim: "d", value: 300, bound: 254 }, "us")).toBe("depth 11.811 in is above depth, max 10 in");
  });
});

// The restraint length is named as the basis's panel names it (DesignBasisPanel.tsx, from the same
// table): "Restraint length" under EN 1993 and allowable stresses, "Unbraced length Lb" under
// AISC 360 (Chapter F's Lb), so a refusal names the field the engineer sees.
describe("a field the basis names its own way", () => {
  it("fieldLabel and plainMessage with the brief's basis", () => {
    expect(fieldLabel("restraint.length")).toBe("Restraint length");
    expect(fieldLabel("restraint.length", "en1993")).toBe("Restraint length");
    expect(fieldLabel("restraint.length", "allowable")).toBe("Restraint length");
    expect(fieldLabel("restraint.length", "aisc360")).toBe("Unbraced length Lb");
    // fields without a basis's own name keep theirs
    expect(fieldLabel("restraint.Cb", "aisc360")).toBe("Cb (lateral-torsional buckling modification factor)");
    expect(plainMessage("restraint.length must be ≥ 0.001 m", "aisc360")).toBe("Unbraced length Lb must be ≥ 0.001 m");
    expect(plainMessage("restraint.length must be ≥ 0.001 m", "en1993")).toBe("Restraint length must be ≥ 0.001 m");
    expect(plainMessage("the brief's restraint.length is short", "aisc360")).toBe("The brief's unbraced length Lb is short");
  });

  const AISC = searchProblemSchema.parse({ ...DEFAULT_PROBLEM, allowable: undefined, slenderness: undefined, families: ["i"], basis: "aisc360", method: "ASD", aisc: { grade: "A572 Gr 50" }, restraint: { length: 6, Cb: 1.136 } });
  const refusal = (edit: (d: Record<string, any>) => void) => {
    const d = problemToFormDefaults(AISC, { units: "si", name: "B" }) as Record<string, any>;
    edit(d);
    return errorsOf(parseWithZod(formData(d), { schema: briefFormSchema }))["restraint.length"];
  };
  it("an AISC 360 brief refused for its unbraced length says “Unbraced length Lb”, never “Restraint length”", () => {
    expect(refusal(() => {})).toBeUndefined();
    expect(refusal((d) => (d.restraint.length = undefined))).toEqual(["Unbraced length Lb: enter the unbraced length Lb of the compression flange, or tick “braced throughout”"]);
    const zero = refusal((d) => (d.restraint.length = 0));
    expect(zero?.[0]).toMatch(/^Unbraced length Lb\b/);
    const text = refusal((d) => (d.restraint.length = "six"));
    expect(text).toEqual(["Unbraced length Lb must be a number"]);
    for (const m of [...zero!, ...text!]) expect(m).not.toMatch(/restraint length/i);
  });
  it("an EN 1993 brief's keeps “Restraint length”", () => {
    const en = searchProblemSchema.parse({ ...AISC, basis: "en1993", method: undefined, aisc: undefined, steel: { grade: "S355" }, restraint: { length: 6 } });
    const d = problemToFormDefaults(en, { units: "si", name: "B" }) as Record<string, any>;
    d.restraint.length = 0;
    expect(errorsOf(parseWithZod(formData(d), { schema: briefFormSchema }))["restraint.length"]?.[0]).toMatch(/^Restraint length\b/);
  });
});

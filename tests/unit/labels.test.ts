// Issue 11, item 5: one label table for every message people read. Engine and form messages are
// reworded through plainMessage (no field paths, rows counted from 1), and a text in one number
// field does not hide the other fields' errors.
import { describe, expect, it } from "vitest";
import { parseWithZod } from "@conform-to/zod/v4";
import { briefFormSchema, DEFAULT_PROBLEM, problemToFormDefaults } from "~/lib/brief-form";
import { FAMILY_LABELS, describeBreach, familyLabel, fieldLabel, plainMessage } from "~/lib/labels";
import { FAMILIES } from "~/optimizer/geometry";
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

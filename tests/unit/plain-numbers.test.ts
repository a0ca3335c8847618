// Issue 11, item 13: numbers in JSON and CSV without binary float noise.
import { describe, expect, it } from "vitest";
import { plainNumber, plainNumbers } from "~/lib/plain-numbers";
import { apiProperties, unitsBlock } from "~/lib/api-properties";
import { propertiesIn, sectionProperties } from "~/optimizer";

describe("plain numbers", () => {
  it("drops the noise a sum of steps or a conversion leaves, and nothing else", () => {
    expect(plainNumber(13.624999999999998)).toBe(13.625);
    expect(plainNumber(0.1 + 0.2)).toBe(0.3);
    expect(plainNumber(5.99999999999999)).toBe(6);
    // real digits stay: 12 significant digits are kept
    expect(plainNumber(0.123456789012)).toBe(0.123456789012);
    expect(plainNumber(277596160)).toBe(277596160);
    expect(plainNumber(-1.0000000000000002)).toBe(-1);
  });

  it("goes through objects and arrays, leaving strings, booleans, nulls and dates", () => {
    const at = new Date(0);
    expect(plainNumbers({ a: [1.0000000000000002, "x", null, true], b: { c: 2.9999999999999996 }, at })).toEqual({ a: [1, "x", null, true], b: { c: 3 }, at });
  });
});

describe("the properties API's field names", () => {
  it("mass per length is named without a unit and its unit is in the units block", () => {
    const us = propertiesIn(sectionProperties({ family: "rectangle", b: 101.6, d: 254 }), "us");
    const out = apiProperties(us);
    expect(out).not.toHaveProperty("massPerMetre");
    expect(out.massPerLength).toBeCloseTo((40 / 144) * (7850 / 16.01846337396), 6);
    expect(unitsBlock("us").fields.massPerLength).toBe("lb/ft");
    expect(unitsBlock("si").fields.massPerLength).toBe("kg/m");
    // every field of the answer has its unit named (strings such as Jmethod and null blocks aside)
    const fields = unitsBlock("us").fields;
    for (const [k, v] of Object.entries(out)) if (typeof v === "number") expect(fields, k).toHaveProperty(k);
  });
});

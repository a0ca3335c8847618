// sectionInputSchema: the zod form of the contract's SectionInput (engine contract, "SectionInput").
import { describe, expect, it } from "vitest";
import { sectionInputSchema, sectionProperties } from "~/optimizer/index";

const issues = (v: unknown) => {
  const r = sectionInputSchema.safeParse(v);
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
};

describe("sectionInputSchema", () => {
  it("accepts the three forms and fills defaults (flip false, hole false)", () => {
    expect(sectionInputSchema.parse({ family: "i", d: 300, b: 150, tf: 10, tw: 6 })).toMatchObject({ flip: false });
    expect(sectionInputSchema.parse({ polygons: [{ points: [[0, 0], [1, 0], [0, 1]] }] })).toMatchObject({ polygons: [{ hole: false }] });
    expect(sectionInputSchema.parse({ plates: [{ b: 1, h: 2, z: 0, y: 0 }], density: 7850 })).toBeTruthy();
  });
  it("parsed output feeds sectionProperties unchanged", () => {
    const v = sectionInputSchema.parse({ family: "tee", d: 200, b: 100, tf: 10, tw: 8, r: 5, flip: true });
    expect(sectionProperties(v).area).toBeGreaterThan(0);
  });
  it.each([
    [{ plates: [{ b: 1, h: 1, z: 0, y: 0 }, { b: 1, h: 1, z: 0.5, y: 0.5 }] }, "plates.1", "plates[1] overlaps plates[0]"],
    [{ plates: [{ b: -1, h: 1, z: 0, y: 0 }] }, "plates.0.b", "b must be positive"],
    [{ plates: [{ b: "1", h: 1, z: 0, y: 0 }] }, "", "plates[0].b must be a finite number"], // a wrong type fails every form: the root message names the field
    [{ family: "i", d: 20, b: 100, tf: 10, tw: 5 }, "d", "i: d must exceed 2·tf"],
    [{ family: "box", d: 200, b: 10, tf: 10, tw: 5 }, "b", "box: b must exceed 2·tw"],
    [{ family: "i", d: 200, b: 100, tf: 10, tw: 5, r: 60 }, "r", "i: r must not exceed (b − tw)/2"],
    [{ family: "i", b: 100, tf: 10, tw: 5 }, "", "i: d must be a finite number"],
    [{ family: "girder" }, "", "family must be one of rectangle, i, mono-i, channel, channel-down, tee, box, angle, rhs, chs"],
    [{ polygons: [{ points: [[0, 0], [1, 1], [1, 0], [0, 1]] }] }, "polygons.0.points", "polygons[0] self-intersects (edges 0 and 2)"],
    [{ polygons: [{ points: [[0, 0], [1, 0]] }] }, "polygons.0.points", "a polygon needs at least 3 points"],
    [{ plates: [{ b: 1, h: 1, z: 0, y: 0 }], density: 0 }, "density", "density must be positive"],
    [{}, "", "section input needs plates, polygons or family"],
    ["text", "", "section input must be an object with plates, polygons or family"],
  ])("%j → %s: %s", (v, path, message) => {
    expect(issues(v)).toContainEqual({ path, message });
  });
});

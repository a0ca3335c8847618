import { describe, expect, it } from "vitest";
import { FAMILIES, familyFillets, familyPlates, familyRuleViolation } from "~/optimizer/geometry";
import { EngineInputError } from "~/optimizer/errors";

const area = (ps: { b: number; h: number }[]) => ps.reduce((s, p) => s + p.b * p.h, 0);

describe("familyPlates", () => {
  // Areas by hand from the contract's family table (common practice: sum of plates).
  const cases: [string, Record<string, number>, number][] = [
    ["rectangle", { b: 50, d: 100 }, 5000],
    ["i", { d: 300, b: 150, tf: 10, tw: 8 }, 2 * 1500 + 8 * 280],
    ["mono-i", { d: 300, bt: 120, tft: 10, bb: 200, tfb: 15, tw: 8 }, 1200 + 3000 + 8 * 275],
    ["channel", { d: 200, b: 80, tf: 10, tw: 6 }, 6 * 200 + 2 * 74 * 10],
    ["channel-down", { d: 100, b: 200, tw: 10, tf: 8 }, 2000 + 2 * 8 * 90],
    ["tee", { d: 150, b: 120, tf: 12, tw: 8 }, 1440 + 8 * 138],
    ["box", { d: 200, b: 100, tf: 10, tw: 6 }, 2 * 1000 + 2 * 6 * 180],
    ["angle", { d: 100, b: 75, t: 8 }, 800 + 67 * 8],
  ];
  it.each(cases)("%s: area and bounding box", (family, dims, A) => {
    const ps = familyPlates(family as never, dims);
    expect(area(ps)).toBeCloseTo(A, 9);
    const top = Math.max(...ps.map((p) => p.y + p.h));
    const right = Math.max(...ps.map((p) => p.z + p.b));
    expect(Math.min(...ps.map((p) => p.y))).toBe(0);
    expect(Math.min(...ps.map((p) => p.z))).toBe(0);
    expect(top).toBeCloseTo(dims.d, 12);
    expect(right).toBeCloseTo(family === "mono-i" ? 200 : dims.b, 12);
  });

  it("flip mirrors about the horizontal axis: tee flange goes to the bottom", () => {
    const up = familyPlates("tee", { d: 150, b: 120, tf: 12, tw: 8 }, true);
    expect(up[0]).toEqual({ b: 120, h: 12, z: 0, y: 0 });
    expect(up[1].y).toBe(12);
  });

  it("covers every family", () => {
    expect(FAMILIES).toHaveLength(8);
  });

  it.each([
    ["i", { d: 20, b: 100, tf: 10, tw: 6 }, "i: d must exceed 2·tf"],
    ["i", { d: 200, b: 6, tf: 10, tw: 6 }, "i: b must exceed tw"],
    ["box", { d: 200, b: 12, tf: 10, tw: 6 }, "box: b must exceed 2·tw"],
    ["tee", { d: 12, b: 100, tf: 12, tw: 6 }, "tee: d must exceed tf"],
    ["channel-down", { d: 10, b: 100, tw: 10, tf: 6 }, "channel-down: d must exceed tw"],
    ["angle", { d: 100, b: 8, t: 8 }, "angle: b must exceed t"],
    ["i", { d: 200, b: 100, tf: -1, tw: 6 }, "i: tf must be positive"],
    ["i", { d: NaN, b: 100, tf: 10, tw: 6 }, "i: d must be a finite number"],
  ])("%s rejects %j with the rule", (family, dims, msg) => {
    expect(() => familyPlates(family as never, dims)).toThrow(msg);
    expect(familyRuleViolation(family as never, dims)?.message).toBe(msg);
  });

  it("errors are EngineInputError naming the field", () => {
    try {
      familyPlates("box", { d: 200, b: 12, tf: 10, tw: 6 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(EngineInputError);
      expect((e as EngineInputError).field).toBe("b");
    }
  });
});

describe("familyFillets", () => {
  it("i: four fillets in the re-entrant corners, pointing away from the web and flanges", () => {
    const f = familyFillets("i", { d: 200, b: 100, tf: 8.5, tw: 5.6, r: 12 });
    expect(f).toHaveLength(4);
    expect(f[0]).toEqual({ z: 47.2, y: 8.5, dz: -1, dy: 1, r: 12 });
  });
  it("flip mirrors fillets too", () => {
    const f = familyFillets("tee", { d: 100, b: 100, tf: 10, tw: 8, r: 5 }, true);
    expect(f.every((x) => x.y === 10 && x.dy === 1)).toBe(true);
  });
  it("rejects a radius that does not fit", () => {
    expect(() => familyFillets("i", { d: 200, b: 100, tf: 8.5, tw: 5.6, r: 60 })).toThrow("i: r must not exceed (b − tw)/2");
  });
  it("r = 0 gives no fillets", () => {
    expect(familyFillets("channel", { d: 200, b: 80, tf: 10, tw: 6, r: 0 })).toEqual([]);
  });
});

// Issue 11, item 9: each family's lightest feasible section at every depth, checked against the
// plain brute-force reference (every grid shape evaluated; its `context` is the lightest feasible
// per family and depth by plain enumeration), and the one "same section" test the stored results use.
import { describe, expect, it } from "vitest";
import { bruteForceSearch } from "~/optimizer/brute-force";
import { depthBests, geometryKey } from "~/optimizer/depth-bests";
import { CONTRACT_EXAMPLE_PROBLEM, type SearchProblemInput } from "~/optimizer/search-schema";
import { candidatesToStore } from "~/workers/queue.server";
import { searchSections } from "~/optimizer/search";

const strip = (p: { family: string; dimensions: Record<string, number>; area: number }) => ({ family: p.family, dimensions: p.dimensions, area: p.area });

describe("depthBests", () => {
  it("equals brute force's lightest feasible per family and depth", () => {
    for (const families of [["i", "mono-i", "tee"], ["channel", "box", "angle"]] as const) {
      // a grid brute force enumerates in well under a second
      const problem: SearchProblemInput = { ...CONTRACT_EXAMPLE_PROBLEM, families: [...families], width: { min: 100, max: 200, step: 25 }, thicknesses: [6, 10, 16] };
      const d = depthBests(problem);
      const ref = bruteForceSearch(problem).context!;
      expect(d.complete).toBe(true);
      expect(ref.length).toBeGreaterThan(3);
      expect(d.points.map(strip)).toEqual(ref.map(strip));
    }
  }, 60_000);

  it("stops when asked, saying it is not complete", () => {
    let calls = 0;
    const d = depthBests(CONTRACT_EXAMPLE_PROBLEM, { stopWhen: () => ++calls > 2 });
    expect(d.complete).toBe(false);
  });

  // Stopped part way, what it keeps is still exact: only depths searched to the end, each with
  // brute force's lightest per family; a depth whose search was cut short keeps no point at all
  // (its best so far is not proven the lightest).
  it("stopped part way keeps only depths searched to the end, each exact", () => {
    const problem: SearchProblemInput = { ...CONTRACT_EXAMPLE_PROBLEM, families: ["i", "tee"], width: { min: 100, max: 200, step: 25 }, thicknesses: [6, 10, 16] };
    const ref = bruteForceSearch(problem).context!;
    for (const stopAt of [1, 2, 3, 5, 8]) {
      let calls = 0;
      const d = depthBests(problem, { stopWhen: () => ++calls > stopAt });
      const searched = new Set(d.searched);
      expect(d.points.every((p) => searched.has(p.dimensions.d))).toBe(true);
      expect(d.points.map(strip)).toEqual(ref.filter((p) => searched.has(p.dimensions.d)).map(strip));
    }
  });
});

describe("one section, one row", () => {
  it("a mono-symmetric I with equal flanges is the I", () => {
    expect(geometryKey("mono-i", { d: 300, bt: 150, tft: 10, bb: 150, tfb: 10, tw: 6 })).toBe(geometryKey("i", { d: 300, b: 150, tf: 10, tw: 6 }));
    expect(geometryKey("mono-i", { d: 300, bt: 160, tft: 10, bb: 150, tfb: 10, tw: 6 })).not.toBe(geometryKey("i", { d: 300, b: 150, tf: 10, tw: 6 }));
  });

  it("stored results list a shape two families found once, under the family listed first", () => {
    const i = { family: "i" as const, dimensions: { d: 300, b: 150, tf: 10, tw: 6 }, area: 4680, massPerMetre: 36.738, utilisation: 0.9, governing: "bending" as const };
    const mono = { ...i, family: "mono-i" as const, dimensions: { d: 300, bt: 150, tft: 10, bb: 150, tfb: 10, tw: 6 } };
    const tee = { ...i, family: "tee" as const, dimensions: { d: 300, b: 150, tf: 10, tw: 6 }, area: 4700, massPerMetre: 36.9, utilisation: 0.95 };
    const result = { best: null, bestByFamily: { i, "mono-i": mono, tee }, front: [mono, i], frontScope: "evaluated" as const, counts: { grid: 1, evaluated: 1, feasible: 1 }, depthBests: [mono, i, tee] };
    for (const families of [["i", "mono-i", "tee"], ["mono-i", "i", "tee"]] as const) {
      const rows = candidatesToStore(result as never, "mass", { ...CONTRACT_EXAMPLE_PROBLEM, families: [...families] } as never);
      expect(rows.map((r) => r.family)).toEqual([families[0], "tee"]);
      expect(rows[0]).toMatchObject({ on_front: true, family_best: true, depth_best: true });
    }
  });

  it("a real sweep's stored rows hold each family's depth bests and no section twice", () => {
    const problem: SearchProblemInput = { ...CONTRACT_EXAMPLE_PROBLEM, families: ["i", "mono-i", "tee"] };
    const parsed = searchSections(problem, { explore: 0.25 });
    const result = { ...parsed, depthBests: depthBests(problem).points };
    const rows = candidatesToStore(result, "mass", { ...CONTRACT_EXAMPLE_PROBLEM, families: ["i", "mono-i", "tee"] } as never);
    const keys = rows.map((r) => geometryKey(r.family, JSON.parse(r.dimensions)));
    expect(new Set(keys).size).toBe(keys.length);
    expect(result.depthBests.length).toBeGreaterThan(3);
    for (const p of result.depthBests) expect(rows.some((r) => r.depth_best && geometryKey(r.family, JSON.parse(r.dimensions)) === geometryKey(p.family, p.dimensions))).toBe(true);
  });
});

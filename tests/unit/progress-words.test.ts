// Issue 11, item 6: the sweep's progress says what it counts and gives an estimate only when
// there is one ("0 of ? (0%) · about — left" and a bare "3 of 16" are what it said before).
import { describe, expect, it } from "vitest";
import { progressLines } from "~/components/ProgressBar";

const SHAPES = "shapes settled (evaluated, or proven unable to change the answer)";

describe("progress in words", () => {
  it("before the search has counted its grid: no 'of ?', no blank estimate", () => {
    const lines = progressLines({ done: 0, total: 0, counts: null }, "running", 400, null);
    expect(lines).toEqual(["Starting the search: counting the shapes of the grid.", "Elapsed 0 s"]);
    expect(lines.join(" ")).not.toMatch(/\?|—|left/);
  });

  it("queued: waiting, nothing counted and no times", () => {
    expect(progressLines({ done: 0, total: 0 }, "queued", null, null)).toEqual(["Waiting in the queue; the search starts when a worker is free."]);
  });

  it("running: every count names what it counts; the estimate only when the queue has one", () => {
    const p = { done: 3, total: 16, counts: SHAPES, families: { done: 1, total: 4 }, evaluated: 1234 };
    expect(progressLines(p, "running", 5_000, null)).toEqual([`3 of 16 ${SHAPES} (18%)`, "Families searched: 1 of 4 · Candidates evaluated: 1,234", "Elapsed 5 s"]);
    expect(progressLines(p, "running", 5_000, 22_000).at(-1)).toBe("Elapsed 5 s · about 22 s left");
  });

  it("an older sweep stored without a unit still says the grid's shapes", () => {
    expect(progressLines({ done: 3, total: 16, counts: null }, "running", 1000, null)[0]).toBe("3 of 16 shapes of the grid settled (18%)");
  });

  it("never rounds an unfinished search up to 100 %; a finished search says it is finishing", () => {
    expect(progressLines({ done: 9_999, total: 10_000, counts: SHAPES }, "running", 1000, null)[0]).toMatch(/\(99%\)$/);
    expect(progressLines({ done: 16, total: 16, counts: SHAPES, families: { done: 4, total: 4 }, evaluated: 20 }, "running", 1000, null)[0]).toBe(
      "Search done: all 16 shapes of the grid settled; finishing the results.",
    );
  });
});

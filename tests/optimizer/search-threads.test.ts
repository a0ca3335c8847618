// The threaded search (app/workers/search-threads.ts) combines to the one-thread answer.
import { describe, expect, it } from "vitest";
import { searchSections } from "~/optimizer/search";
import type { SearchProblemInput } from "~/optimizer/search-schema";
import { availableParallelism } from "node:os";
import { idleSearchThreads, searchInThreads } from "~/workers/search-threads";

const problem: SearchProblemInput = {
  moment: { sagging: 150, hogging: 40 },
  shear: 120,
  allowable: { tension: 165, compression: 150, shear: 100 },
  depth: { min: 150, max: 500, step: 5 },
  width: { min: 80, max: 300, step: 10 },
  thicknesses: [6, 8, 10, 12, 15, 20],
  families: ["tee", "i", "mono-i", "box"],
  slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 },
};

describe("search on worker threads", () => {
  it("gives the same best, bests per family, grid count, grid front and context as one thread; exhaustive fronts match", async () => {
    const one = searchSections(problem);
    const progress: number[] = [];
    const many = await searchInThreads(problem, { threads: 3, onProgress: (d) => progress.push(d) });
    expect(many.best?.family).toBe(one.best?.family);
    expect(many.best?.dimensions).toEqual(one.best?.dimensions);
    for (const f of problem.families) expect(many.bestByFamily[f]?.dimensions ?? null).toEqual(one.bestByFamily[f]?.dimensions ?? null);
    expect(many.counts.grid).toBe(one.counts.grid);
    // progress in shapes: the parts' grids add up to the whole grid
    expect(progress.at(-1)).toBe(one.counts.grid);
    // the parts' exact fronts combine to the whole grid's front; context points by family, then depth
    expect(many.frontScope).toBe("grid");
    expect(many.front.map((c) => [c.family, c.dimensions])).toEqual(one.front.map((c) => [c.family, c.dimensions]));
    expect(many.context!.map((c) => [c.family, c.dimensions])).toEqual(one.context!.map((c) => [c.family, c.dimensions]));
    const small: SearchProblemInput = { ...problem, depth: { min: 150, max: 300, step: 10 }, width: { min: 80, max: 200, step: 20 } };
    const ex1 = searchSections(small, { exhaustive: true });
    const exN = await searchInThreads(small, { threads: 2, exhaustive: true });
    expect(exN.counts).toEqual(ex1.counts);
    expect(exN.front.map((c) => [c.family, c.dimensions])).toEqual(ex1.front.map((c) => [c.family, c.dimensions]));
  }, 60_000);

  it("keeps finished threads warm for the next search, and ends the threads of an aborted one", async () => {
    const small: SearchProblemInput = { ...problem, depth: { min: 150, max: 300, step: 10 } };
    const before = idleSearchThreads();
    const a = await searchInThreads(small, { threads: 2 });
    // the two threads wait, unreferenced, for the next search (at most one per core are kept)
    const kept = idleSearchThreads();
    expect(kept).toBe(Math.min(Math.max(before, 2), availableParallelism()));
    const b = await searchInThreads(small, { threads: 2 });
    expect(idleSearchThreads()).toBe(kept);
    expect(b.front.map((c) => [c.family, c.dimensions])).toEqual(a.front.map((c) => [c.family, c.dimensions]));
    expect(b.context!.map((c) => [c.family, c.dimensions])).toEqual(a.context!.map((c) => [c.family, c.dimensions]));
    // an aborted search's threads are terminated, not returned to the pool
    const ac = new AbortController();
    const p = searchInThreads({ ...problem, families: ["mono-i"], depth: { min: 200, max: 1199, step: 1 }, width: { min: 100, max: 500, step: 1 } }, { threads: 2, signal: ac.signal });
    expect(idleSearchThreads()).toBe(Math.max(0, kept - 2));
    setTimeout(() => ac.abort(), 50);
    await expect(p).rejects.toThrow(/abort/i);
    expect(idleSearchThreads()).toBe(Math.max(0, kept - 2));
    // and the next search starts what it needs
    const c = await searchInThreads(small, { threads: 2 });
    expect(c.front.map((x) => [x.family, x.dimensions])).toEqual(a.front.map((x) => [x.family, x.dimensions]));
  }, 60_000);

  it("rejects with the abort reason and stops the threads", async () => {
    const ac = new AbortController();
    const p = searchInThreads({ ...problem, families: ["mono-i"], depth: { min: 200, max: 1199, step: 1 }, width: { min: 100, max: 500, step: 1 } }, { threads: 2, signal: ac.signal });
    setTimeout(() => ac.abort(), 50);
    await expect(p).rejects.toThrow(/abort/i);
  }, 60_000);
});

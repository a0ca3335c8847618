// stopWhen (issue 9, item 6: a sweep's time budget): the search stops where asked and returns the
// best found so far, marked stoppedEarly; asked never, it is the ordinary exact search.
import { describe, expect, it } from "vitest";
import { CONTRACT_EXAMPLE_PROBLEM, searchSections, type SearchProblemInput } from "~/optimizer";

// Fine steps so each family takes many thousand heap steps (the stop is asked every 4096).
// the sweeps' options before they asked for the grid front (sweep-search.server.ts now passes front
// "grid", the {} case below): family by family, front over what was evaluated
const SWEEP = { explore: 0.25 };
const FINE: SearchProblemInput = { ...CONTRACT_EXAMPLE_PROBLEM, depth: { min: 100, max: 600, step: 1 }, width: { min: 50, max: 400, step: 1 } };

describe("searchSections with stopWhen", () => {
  it("never asked to stop: the same answer as without it, not marked", () => {
    const plain = searchSections(CONTRACT_EXAMPLE_PROBLEM);
    const r = searchSections(CONTRACT_EXAMPLE_PROBLEM, { stopWhen: () => false });
    expect(r).toEqual(plain);
    expect(r.stoppedEarly).toBeUndefined();
  });

  for (const mode of [{}, SWEEP]) {
    it(`stopped at once (${mode === SWEEP ? "the sweeps' evaluated front" : "the grid front"}): nothing evaluated, marked, no grid front claimed, and a reason that says the grid was not searched`, () => {
      const r = searchSections(FINE, { ...mode, stopWhen: () => true });
      expect(r.stoppedEarly).toBe(true);
      expect(r.best).toBeNull();
      expect(r.counts.evaluated).toBe(0);
      expect(r.frontScope).toBe("evaluated");
      expect(r.context).toBeUndefined();
      expect(r.reason).toMatch(/stopped before it found/);
    });
  }

  it("stopped part way: the best so far is a feasible candidate no lighter than the proven best, and families not reached are null", () => {
    const exact = searchSections(FINE);
    let asked = 0;
    // Asked before the first family, then every 4096 heap steps and before each next family: the
    // second ask stops it inside or right after the first family (deterministic: no clock).
    const r = searchSections(FINE, { ...SWEEP, stopWhen: () => ++asked > 1 });
    expect(r.stoppedEarly).toBe(true);
    const fam = FINE.families;
    expect(r.bestByFamily[fam[fam.length - 1]!]).toBeNull();
    expect(r.best).not.toBeNull();
    expect(r.best!.utilisation).toBeLessThanOrEqual(1);
    expect(r.best!.area).toBeGreaterThanOrEqual(exact.best!.area * (1 - 1e-12));
    expect(r.counts.evaluated).toBeLessThan(exact.counts.evaluated);
  }, 30_000);

  it("stopped part way in the grid front (what sweeps run): no front or context claimed for the grid, any best found is feasible and no lighter than the proven best", () => {
    const exact = searchSections(FINE);
    let asked = 0;
    // one heap over every family: asked before the first step, then every 4096 heap steps
    const r = searchSections(FINE, { stopWhen: () => ++asked > 2 });
    expect(r.stoppedEarly).toBe(true);
    expect(r.frontScope).toBe("evaluated");
    expect(r.context).toBeUndefined();
    expect(r.counts.evaluated).toBeLessThan(exact.counts.evaluated);
    for (const c of r.front) expect(c.utilisation).toBeLessThanOrEqual(1);
    if (r.best) {
      expect(r.best.utilisation).toBeLessThanOrEqual(1);
      expect(r.best.area).toBeGreaterThanOrEqual(exact.best!.area * (1 - 1e-12));
    } else expect(r.reason).toMatch(/stopped before it found/);
  }, 30_000);
});

// The plain reference: every grid point of every family, every check, no bounds. The tests
// and the benchmark compare the fast search against it. Deliberately simple. Its front is the
// grid's (every candidate is evaluated), and it keeps the context points (each family's
// lightest feasible per depth) as the fast search does.
import { Scratch, evaluateCandidate } from "./checks";
import { EngineInputError } from "./errors";
import type { RawCandidate } from "./front";
import { ABORT_EVERY, Tally, buildResult, checkAbort, offerFeasible, prepare, type SearchOptions, type SearchResult } from "./grid";
import { rawGridSize, searchProblemSchema, type SearchProblemInput } from "./search-schema";

/** Brute force refuses grids larger than this (raw product): 1e8 × ~0.3 µs ≈ 30 s. */
export const BRUTE_FORCE_MAX_GRID = 1e8;

export function bruteForceSearch(input: SearchProblemInput, options: SearchOptions = {}): SearchResult {
  const problem = searchProblemSchema.parse(input);
  const raw = rawGridSize(problem);
  if (raw > BRUTE_FORCE_MAX_GRID)
    throw new EngineInputError("grid", `grid: ${raw.toExponential(2)} candidates is too many for brute force (at most ${BRUTE_FORCE_MAX_GRID.toExponential(0)})`);
  const p = prepare(problem, options.depthIndexRange, options.depthInterleave);
  const t = new Tally(p.families.length, p.depths.length);
  const s = new Scratch();
  let enumerated = 0;
  const total = raw;
  options.onProgress?.(0, total);
  for (const pf of p.families) {
    const { fk, axes } = pf;
    const n = fk.dims.length;
    const idx = new Int32Array(n);
    const v = new Float64Array(n);
    if (axes.some((a) => a.length === 0)) continue;
    for (let j = 0; j < n; j++) v[j] = axes[j][0];
    const cand: RawCandidate = { fi: pf.fi, fk, v, objective: 0, area: 0, utilisation: 0, governing: -1 };
    const dDim = fk.roles.indexOf("depth");
    for (;;) {
      // validity: the same strict rules as geometry.ts (tested against familyRuleViolation)
      const sec = fk.second;
      if (fk.groupValid(v) && v[fk.free] > fk.freeMin(v) && (sec < 0 || v[sec] > fk.secondMin(v))) {
        t.grid++;
        t.evaluated++;
        if (evaluateCandidate(fk, v, p.ctx, s, false)) {
          cand.objective = s.objective;
          cand.area = s.area;
          cand.utilisation = s.utilisation;
          cand.governing = s.governing;
          offerFeasible(t, cand, idx[dDim]);
        } else t.ruledOut[s.governing]++;
        if (t.evaluated % ABORT_EVERY === 0) {
          checkAbort(options.signal);
          if (t.evaluated % (ABORT_EVERY * 16) === 0) options.onProgress?.(enumerated, total);
        }
      }
      enumerated++;
      // odometer over the dimensions, last dimension fastest
      let j = n - 1;
      while (j >= 0) {
        idx[j]++;
        if (idx[j] < axes[j].length) {
          v[j] = axes[j][idx[j]];
          break;
        }
        idx[j] = 0;
        v[j] = axes[j][0];
        j--;
      }
      if (j < 0) break;
    }
  }
  options.onProgress?.(total, total);
  // every candidate evaluated: the front is the grid's
  return buildResult(p, t, "grid");
}

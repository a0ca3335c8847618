// What a sweep may cost (issue 9, item 6: a legal 1e11-candidate brief held the only worker for
// minutes while another team's 6 ms sweep waited 47 s). Two limits, both settings:
// - before enqueueing, the brief's grid (the engine's own count, rawGridSize) against
//   SWEEP_MAX_GRID: a brief far too large to finish is refused with the numbers and what to change;
// - while running, a time budget (SWEEP_TIME_BUDGET_S): the search stops there and the sweep ends
//   as `timed_out` with the best candidate found so far, never presented as proven lightest, and
//   advice that narrows the grid.
// Pure: no I/O; the queue and the runner read the settings through these functions.
import { axisCount, rawGridSize, FAMILY_DIMENSIONS, dimRole, type SearchCandidate, type SearchProblem } from "~/optimizer";

/**
 * Default grid limit for a queued sweep. Half the engine's own cap (MAX_GRID_CANDIDATES, 1e11):
 * the probe's 1e11 brief (mono-i at 1 mm steps with ten thicknesses) took about a minute of one
 * core on the test machine, near the default budget; the engine's intended finest mono-i grid
 * (≈ 5e10, search-schema.ts) still queues. The search's time follows how many shapes come near
 * the optimum more than the grid, so the budget, not this limit, is what bounds a sweep's time.
 */
export const DEFAULT_MAX_SWEEP_GRID = 5e10;
export const DEFAULT_TIME_BUDGET_S = 120;

function positiveEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  const v = raw === undefined || raw.trim() === "" ? NaN : Number(raw);
  return Number.isFinite(v) && v > 0 ? v : fallback;
}

/** SWEEP_TIME_BUDGET_S (seconds, fractions allowed; default 120) in ms. */
export const sweepTimeBudgetMs = () => Math.round(positiveEnv("SWEEP_TIME_BUDGET_S", DEFAULT_TIME_BUDGET_S) * 1000);
/** SWEEP_MAX_GRID (candidates; default 5e10). */
export const maxSweepGrid = () => positiveEnv("SWEEP_MAX_GRID", DEFAULT_MAX_SWEEP_GRID);

const sci = (n: number) => (n >= 1e6 ? n.toExponential(2).replace("e+", "e") : n.toLocaleString("en"));

/** The refusal for a brief over the grid limit, or null when it may be queued. */
export function gridCostProblem(problem: SearchProblem): string | null {
  const n = rawGridSize(problem);
  const limit = maxSweepGrid();
  if (n <= limit) return null;
  return `grid: ${sci(n)} candidates, over the ${sci(limit)} this server runs in one sweep (it could not finish within its time budget). ${narrowingHints(problem, null).join("; ")}.`;
}

/** Ways to shrink the grid, the biggest lever first (at most three). */
export function narrowingHints(problem: SearchProblem, best: Pick<SearchCandidate, "dimensions"> | null): string[] {
  const hints: { gain: number; text: string }[] = [];
  const nd = axisCount(problem.depth),
    nw = axisCount(problem.width),
    nt = new Set(problem.thicknesses).size;
  // How often each axis appears in the biggest family's grid decides what a coarser step buys.
  const perFamily = problem.families.map((f) => {
    let n = 1,
      w = 0,
      t = 0;
    for (const dim of FAMILY_DIMENSIONS[f]) {
      const r = dimRole(f, dim);
      if (r === "depth") n *= nd;
      else if (r === "width") (n *= nw), w++;
      else (n *= nt), t++;
    }
    return { f, n, w, t };
  });
  const total = perFamily.reduce((s, x) => s + x.n, 0);
  const big = perFamily.reduce((a, b) => (b.n > a.n ? b : a));
  const d = best?.dimensions.d;
  if (d !== undefined && nd > 20) {
    const lo = Math.max(problem.depth.min, d * 0.85),
      hi = Math.min(problem.depth.max, d * 1.15);
    hints.push({ gain: nd / Math.max(1, (hi - lo) / problem.depth.step), text: `search depths near the best found (d = ${d} mm), e.g. depth.min ${Math.floor(lo)} and depth.max ${Math.ceil(hi)} mm` });
  }
  if (nd > 20) hints.push({ gain: 5, text: `a coarser depth step (depth.step ${problem.depth.step * 5} mm instead of ${problem.depth.step} mm divides the grid by about 5)` });
  if (nw > 20 && big.w > 0) hints.push({ gain: 5 ** big.w, text: `a coarser width step (width.step ${problem.width.step * 5} mm instead of ${problem.width.step} mm divides ${big.f}'s grid by about ${5 ** big.w})` });
  if (nt > 6 && big.t > 0) hints.push({ gain: (nt / 6) ** big.t, text: `fewer thicknesses (${nt} listed; ${big.f} uses ${big.t} of them per shape)` });
  if (problem.families.length > 1 && big.n > total / 2) hints.push({ gain: total / Math.max(1, total - big.n), text: `fewer families (${big.f} alone has ${Math.round((100 * big.n) / total)} % of the grid)` });
  hints.sort((a, b) => b.gain - a.gain);
  const out = hints.slice(0, 3).map((h) => h.text);
  return out.length ? ["Narrow the grid: " + out[0], ...out.slice(1)] : ["Narrow the grid: narrower depth or width ranges, coarser steps or fewer thicknesses"];
}

/** The reason kept on a timed-out sweep: what it means and how to get a proven answer. */
export function timedOutReason(problem: SearchProblem, best: Pick<SearchCandidate, "dimensions"> | null, budgetMs: number): string {
  const head = best
    ? `Stopped at the time budget (${budgetMs / 1000} s) before the search finished: the best candidate shown is the lightest found so far, NOT proven lightest.`
    : `Stopped at the time budget (${budgetMs / 1000} s) before the search found any candidate that passes every check.`;
  return `${head} ${narrowingHints(problem, best).join("; ")}; then run it again.`;
}

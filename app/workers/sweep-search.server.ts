// How a runner executes one sweep's search. One function, so the runner does not care where the
// search runs.
//
// Now: in the runner's own thread. searchSections is synchronous, so while it runs the runner's
// timers (heartbeat, cancel poll) wait; that is harmless for the searches a sweep usually runs
// (the exact search settles typical briefs in milliseconds to a few hundred ms, far inside a
// lease), and the signal is still checked between families and every 4096 search steps.
// When app/workers/search-threads.ts (the search helper's worker-thread pool) is available, this
// is where sweeps switch to it, so long searches leave the runner's event loop free.
import { searchSections, type SearchProblem, type SearchResult } from "~/optimizer";

export async function runSweepSearch(
  problem: SearchProblem,
  opts: { signal: AbortSignal; onProgress: (done: number, total: number) => void },
): Promise<SearchResult> {
  // Let pending timers (a cancel that arrived while queued in p-queue) run first.
  await new Promise((r) => setImmediate(r));
  opts.signal.throwIfAborted();
  return searchSections(problem, { signal: opts.signal, onProgress: opts.onProgress });
}

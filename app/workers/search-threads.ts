// Runs one exact search split across worker threads (node:worker_threads through comlink's
// node adapter), so a long search leaves the caller's event loop free and uses every core.
//
// Split: the depth grid is dealt out to the threads like cards (thread i takes every n-th depth
// from the i-th, SearchOptions.depthInterleave); each thread runs searchSections on its depths
// (all families). Interleaved, not contiguous: each part then holds light and heavy depths alike,
// so its own front, which the grid-front search's dominance bound (search.ts (D)) prunes with, is
// close to the whole grid's; a contiguous shallow part would have only heavy sections to prune
// with and work nearly as long as the whole. Combined result, same as one thread:
// - bestByFamily: the least of the parts' family bests by the contract's order and tie-breaks
//   (every shape lies in exactly one range, and each part's family best is exact for it);
// - best: the least of those, ties to the family listed first;
// - counts: summed (grid is exact; evaluated and feasible are what the threads did);
// - front: the front of the union of the parts' fronts;
// - reason (nothing feasible anywhere): the reason of the part with the largest grid;
// - stoppedEarly: if any part was stopped (a deadline), the whole is not proven.
// Abort: the threads are terminated at once (a synchronous search cannot read messages while
// it runs, so terminating is the prompt way) and the promise rejects with the signal's reason.
// Threads are kept warm: one that finished its part waits, unreferenced (it never keeps the
// process alive), for the next search, so a sweep does not pay each thread's start-up (loading
// the bundle, or tsx compiling the engine from source: up to a second or more on a busy machine);
// warmSearchThreads starts them ahead (the runner does, as it starts). A thread that was
// terminated (abort) or failed is never reused.
import { availableParallelism } from "node:os";
import { MessageChannel, isMainThread, parentPort, workerData, type MessagePort, type Worker } from "node:worker_threads";
import * as Comlink from "comlink";
import { FAMILY_KERNELS } from "../optimizer/family-kernel";
import { Front, compareAcross, type RawCandidate } from "../optimizer/front";
import type { FrontShare, ProgressDetail, SearchCandidate, SearchOptions, SearchPoint, SearchResult } from "../optimizer/grid";
import { searchSections } from "../optimizer/search";
import { axisCount, searchProblemSchema, type SearchProblemInput } from "../optimizer/search-schema";
import { nodeEndpoint, spawnThread } from "./thread-spawn";
const WORKER_FLAG = "sparwise-search-thread";

interface ThreadApi {
  run(
    problem: SearchProblemInput,
    part: [number, number],
    options: Pick<SearchOptions, "exhaustive" | "explore" | "front">,
    /** progress as [done, total, detail] messages; closed when the part ends */
    progress?: MessagePort,
    deadline?: number,
    /** the parts' shared front (sharedFront), grid front only */
    shared?: SharedArrayBuffer,
  ): SearchResult;
}

if (!isMainThread && parentPort && (workerData as { kind?: string } | undefined)?.kind === WORKER_FLAG) {
  const api: ThreadApi = {
    run: (problem, part, options, progress, deadline, shared) => {
      try {
        return searchSections(problem, {
          ...options,
          depthInterleave: part,
          frontShare: shared ? sharedFront(shared, part[0], part[1]) : undefined,
          onProgress: progress ? (d, t, detail) => progress.postMessage([d, t, detail]) : undefined,
          // threads share the process's wall clock, so one deadline serves them all
          stopWhen: deadline === undefined ? undefined : () => Date.now() >= deadline,
        });
      } finally {
        progress?.close();
      }
    },
  };
  Comlink.expose(api, nodeEndpoint(parentPort));
}

export interface ThreadSearchOptions {
  /** default: the machine's available parallelism, at most one per depth value */
  threads?: number;
  signal?: AbortSignal;
  /** brute force on each thread: the combined front and feasible count are then the whole grid's */
  exhaustive?: boolean;
  /** as SearchOptions.explore (each thread explores around its own range's best) */
  explore?: number;
  /** as SearchOptions.front: "grid" (default) combines the parts' exact fronts into the grid's */
  front?: SearchOptions["front"];
  /** shapes settled and the grid, summed over the threads; the detail once every thread gave one (SearchOptions.onProgress) */
  onProgress?: SearchOptions["onProgress"];
  /** Date.now() after which every thread stops and returns what it has (SearchResult.stoppedEarly) */
  deadline?: number;
}

/** Front members each part can publish (16 bytes each); past it a part keeps its further ones to itself (still exact, only less pruning). */
const SHARE_CAP = 1 << 16;

/** The memory the parts share their front members through: per part a count, then its (objective, utilisation) pairs. */
function sharedFrontBuffer(parts: number): SharedArrayBuffer {
  return new SharedArrayBuffer(8 * parts + 16 * SHARE_CAP * parts);
}

/**
 * Part i's view of the shared front (SearchOptions.frontShare): it writes its own pairs, then
 * publishes the count with Atomics.store; a reader's Atomics.load of that count makes the pairs
 * before it visible (JS memory model: the store synchronises with the load that reads it).
 */
function sharedFront(buf: SharedArrayBuffer, i: number, parts: number): FrontShare {
  const counts = new Int32Array(buf, 0, parts);
  const data = new Float64Array(buf, 8 * parts);
  const seen = new Int32Array(parts);
  let mine = 0;
  return {
    publish(objective, utilisation) {
      if (mine >= SHARE_CAP) return;
      const o = 2 * (i * SHARE_CAP + mine);
      data[o] = objective;
      data[o + 1] = utilisation;
      Atomics.store(counts, i, ++mine);
    },
    poll(take) {
      for (let j = 0; j < parts; j++) {
        if (j === i) continue;
        const c = Atomics.load(counts, j);
        for (let k = seen[j]; k < c; k++) {
          const o = 2 * (j * SHARE_CAP + k);
          take(data[o], data[o + 1]);
        }
        seen[j] = c;
      }
    },
  };
}

/** At most this many idle threads are kept (more than the cores would only hold memory). */
const MAX_IDLE = Math.max(1, availableParallelism());

interface PooledThread {
  worker: Worker;
  api: Comlink.Remote<ThreadApi>;
}
const idle: PooledThread[] = [];

function spawn(): PooledThread {
  const worker = spawnThread(import.meta.url, WORKER_FLAG);
  const t: PooledThread = { worker, api: Comlink.wrap<ThreadApi>(nodeEndpoint(worker)) };
  // an idle thread that exits (it should not) leaves the pool
  worker.once("exit", () => {
    const i = idle.indexOf(t);
    if (i >= 0) idle.splice(i, 1);
  });
  return t;
}

function acquire(): PooledThread {
  const t = idle.pop() ?? spawn();
  t.worker.ref();
  return t;
}

function release(t: PooledThread): void {
  t.worker.unref();
  if (idle.length < MAX_IDLE) idle.push(t);
  else void t.worker.terminate();
}

/** Idle search threads waiting for the next search (for tests and diagnostics). */
export function idleSearchThreads(): number {
  return idle.length;
}

/** Starts search threads ahead of the first search, up to n idle ones (default: one per core). */
export function warmSearchThreads(n = availableParallelism()): void {
  while (idle.length < Math.min(n, MAX_IDLE)) {
    const t = spawn();
    t.worker.unref();
    idle.push(t);
  }
}

function raw<T extends SearchPoint>(problemFamilies: string[], c: T): RawCandidate & { out: T } {
  const fk = FAMILY_KERNELS[c.family];
  return {
    fi: problemFamilies.indexOf(c.family),
    fk,
    v: Float64Array.from(fk.dims, (d) => c.dimensions[d]),
    objective: c.cost ?? c.area,
    area: c.area,
    utilisation: c.utilisation,
    governing: 0,
    out: c,
  };
}

export function combineResults(problemFamilies: string[], parts: SearchResult[]): SearchResult {
  const bestByFamily: SearchResult["bestByFamily"] = {};
  let best: (RawCandidate & { out: SearchCandidate }) | null = null;
  for (const f of problemFamilies as (keyof SearchResult["bestByFamily"])[]) {
    let fb: (RawCandidate & { out: SearchCandidate }) | null = null;
    for (const p of parts) {
      const c = p.bestByFamily[f];
      if (!c) continue;
      const r = raw(problemFamilies, c);
      if (!fb || compareAcross(r, fb) < 0) fb = r;
    }
    bestByFamily[f] = fb ? fb.out : null;
    if (fb && (!best || compareAcross(fb, best) < 0)) best = fb;
  }
  // The grid's front is the front of the parts' grid fronts (a grid front member is on its own
  // part's front; a part's member beaten in the union is beaten in the grid).
  const front = new Front();
  for (const p of parts) for (const c of p.front) front.offer(raw(problemFamilies, c), (x) => x);
  const frontOut = [...front.items]
    .sort((a, b) => a.objective - b.objective || a.utilisation - b.utilisation || compareAcross(a, b))
    .map((x) => (x as RawCandidate & { out: SearchPoint }).out);
  const counts = { grid: 0, evaluated: 0, feasible: 0 };
  for (const p of parts) {
    counts.grid += p.counts.grid;
    counts.evaluated += p.counts.evaluated;
    counts.feasible += p.counts.feasible;
  }
  const frontScope = parts.length > 0 && parts.every((p) => p.frontScope === "grid") ? "grid" : "evaluated";
  const res: SearchResult = { best: best ? best.out : null, bestByFamily, front: frontOut, frontScope, counts };
  if (frontScope === "grid") {
    // parts hold disjoint sets of depths: per family (in the brief's order), by depth
    res.context = problemFamilies.flatMap((f) =>
      parts
        .flatMap((p) => (p.context ?? []).filter((c) => c.family === f))
        .sort((a, b) => a.dimensions.d - b.dimensions.d),
    );
  }
  const stopped = parts.some((p) => p.stoppedEarly);
  if (stopped) res.stoppedEarly = true;
  if (!best && stopped) res.reason = parts.find((p) => p.stoppedEarly && p.reason)?.reason ?? "The search was stopped before it found a candidate that passes every check.";
  else if (!best) {
    const withReason = parts.filter((p) => p.reason).sort((a, b) => b.counts.grid - a.counts.grid);
    res.reason = withReason[0]?.reason ?? "No candidate passes every check.";
    if (counts.grid > 0) res.reason = res.reason.replace(/Of the [\d,]+ shapes in the grid/, `Of the ${counts.grid.toLocaleString("en")} shapes in the grid`);
  }
  return res;
}

/** The exact search on worker threads; resolves to the same best as searchSections. */
export async function searchInThreads(input: SearchProblemInput, options: ThreadSearchOptions = {}): Promise<SearchResult> {
  const problem = searchProblemSchema.parse(input);
  options.signal?.throwIfAborted();
  const nDepths = axisCount(problem.depth);
  const n = Math.max(1, Math.min(options.threads ?? availableParallelism(), nDepths));
  const threads = Array.from({ length: n }, acquire);
  const ports: MessagePort[] = [];
  const portsDone: Promise<unknown>[] = [];
  // Each thread reports shapes of its own grid part; the sum is the whole grid's only once every
  // part has counted its grid, so nothing is reported before then (the total never jumps).
  const progress = new Array<[number, number, ProgressDetail | undefined]>(n).fill([0, -1, undefined]);
  const report = () => {
    if (!options.onProgress || progress.some((p) => p[1] < 0)) return;
    const details = progress.map((p) => p[2]);
    // Each thread searches every family over its own depths: a family is searched once every
    // thread has finished it, so the whole search has finished at least the fewest any thread has.
    const detail = details.every((d) => d !== undefined)
      ? { familiesDone: Math.min(...details.map((d) => d!.familiesDone)), familiesTotal: details[0]!.familiesTotal, evaluated: details.reduce((s, d) => s + d!.evaluated, 0) }
      : undefined;
    options.onProgress(
      progress.reduce((s, p) => s + p[0], 0),
      progress.reduce((s, p) => s + p[1], 0),
      detail,
    );
  };
  let onAbort: (() => void) | undefined;
  const aborted = new Promise<never>((_, reject) => {
    onAbort = () => {
      for (const t of threads) void t.worker.terminate();
      reject(options.signal!.reason);
    };
    options.signal?.addEventListener("abort", onAbort, { once: true });
  });
  let ok = false;
  let onError: ((e: unknown) => void) | undefined, onExit: ((code: number) => void) | undefined;
  // the grid-front search shares front members between the parts (frontShare); best only and brute force need not
  const shared = n > 1 && !options.exhaustive && (options.front ?? (options.explore ? "evaluated" : "grid")) === "grid" ? sharedFrontBuffer(n) : undefined;
  try {
    const runs = threads.map((t, i) => {
      let port: MessagePort | undefined;
      if (options.onProgress) {
        const ch = new MessageChannel();
        ch.port1.on("message", ([d, tot, detail]: [number, number, ProgressDetail | undefined]) => {
          progress[i] = [d, tot, detail];
          report();
        });
        ports.push(ch.port1);
        // the thread closes its end after its last report: 'close' comes after every message
        portsDone.push(new Promise((r) => ch.port1.once("close", r)));
        port = ch.port2;
      }
      const opts = { exhaustive: options.exhaustive, explore: options.explore, front: options.front };
      return (port ? t.api.run(input, [i, n], opts, Comlink.transfer(port, [port]), options.deadline, shared) : t.api.run(input, [i, n], opts, undefined, options.deadline, shared)) as Promise<SearchResult>;
    });
    // a thread that dies mid-search (out of memory, a crash) would leave its call unanswered: fail instead
    const died = new Promise<never>((_, reject) => {
      onError = reject;
      onExit = (code: number) => reject(new Error(`a search thread exited (code ${code}) before its part was done`));
      for (const t of threads) t.worker.on("error", onError).on("exit", onExit);
    });
    died.catch(() => undefined);
    const parts = await Promise.race([Promise.all(runs), aborted, died]);
    await Promise.race([Promise.all(portsDone), aborted, died]);
    ok = true;
    return combineResults(problem.families, parts);
  } finally {
    if (onAbort) options.signal?.removeEventListener("abort", onAbort);
    for (const t of threads) {
      if (onError) t.worker.off("error", onError);
      if (onExit) t.worker.off("exit", onExit);
    }
    for (const p of ports) p.close();
    // finished threads wait for the next search; after an abort or a failure they are ended
    if (ok) threads.forEach(release);
    else await Promise.all(threads.map((t) => t.worker.terminate()));
  }
}

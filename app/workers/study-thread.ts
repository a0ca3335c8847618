// The restraint study of a sweep (lib/restraint-study.ts), computed in the sweep's queue run on
// its own worker thread and stored with the sweep's results.
//
// Why in the queue run and not on demand: the study is six exact searches of the brief (seconds
// on a fine grid), its answer is fixed by the sweep's problem, and the queue already bounds how
// many searches run at once, holds the lease, and cancels. Computed once and stored, every view
// of the sweep reads it for free; on demand, each page view (or a script hitting the route) would
// cost the server those seconds again.
//
// Why a thread: searchSections is synchronous; six of them in the runner's thread would hold its
// event loop (heartbeats, cancel polls) for seconds. A fresh thread per study, terminated at once
// on cancel (a synchronous search cannot read messages while it runs).
import { isMainThread, parentPort, workerData } from "node:worker_threads";
import * as Comlink from "comlink";
import { restraintStudy, searchProblemSchema, type SearchProblemInput } from "../optimizer/index";
import { STUDY_SEGMENTS, studyApplies, type RestraintStudy, type StudyPoint } from "../lib/restraint-study";
import { nodeEndpoint, spawnThread } from "./thread-spawn";

const KIND = "sparwise-study-thread";

/**
 * The lightest section at each restraint spacing L/k, k = 1 … 6: the engine's restraintStudy
 * (each spacing the exact search of the brief with only restraint.length changed). Runs on the thread.
 */
export function restraintStudyJob(input: SearchProblemInput): RestraintStudy {
  const problem = searchProblemSchema.parse(input);
  if (!studyApplies(problem)) throw new Error("the restraint study needs an EN 1993 or AISC 360 brief with a restraint length");
  const t0 = Date.now();
  const study = restraintStudy(problem, { divisions: STUDY_SEGMENTS.length });
  const points: StudyPoint[] = study.points.map((q) => {
    const b = q.best;
    const point: StudyPoint = {
      restraints: q.intermediateRestraints,
      lengthM: q.spacing,
      ...(q.Cb !== undefined ? { Cb: q.Cb } : {}),
      ...(q.C1 !== undefined ? { C1: q.C1 } : {}),
      best: b ? { family: b.family, dimensions: b.dimensions, massPerMetre: b.massPerMetre, utilisation: b.utilisation, governing: b.governing, ...(b.cost !== undefined ? { cost: b.cost } : {}) } : null,
    };
    if (!b && q.reason) point.reason = q.reason;
    return point;
  });
  return { lengthM: study.length, points, elapsedMs: Date.now() - t0 };
}

const api = { study: restraintStudyJob };

if (!isMainThread && parentPort && (workerData as { kind?: string } | undefined)?.kind === KIND) {
  Comlink.expose(api, nodeEndpoint(parentPort));
}

/** The study on a thread of its own; rejects with the signal's reason when aborted (the thread is terminated). */
export async function runRestraintStudy(problem: SearchProblemInput, opts: { signal?: AbortSignal } = {}): Promise<RestraintStudy> {
  opts.signal?.throwIfAborted();
  const worker = spawnThread(import.meta.url, KIND);
  const remote = Comlink.wrap<typeof api>(nodeEndpoint(worker));
  let onAbort: (() => void) | null = null;
  try {
    return await new Promise<RestraintStudy>((resolve, reject) => {
      onAbort = () => reject(opts.signal!.reason);
      opts.signal?.addEventListener("abort", onAbort, { once: true });
      worker.once("error", reject);
      worker.once("exit", (code) => reject(new Error(`the restraint study's thread stopped (exit code ${code})`)));
      remote.study(problem).then(resolve, reject);
    });
  } finally {
    if (onAbort) opts.signal?.removeEventListener("abort", onAbort);
    remote[Comlink.releaseProxy]();
    await worker.terminate();
  }
}

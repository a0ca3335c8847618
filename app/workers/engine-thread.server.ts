// Engine calls a request may trigger that can take longer than ~50 ms (a section's properties, the
// EN 1993 figures of a page of candidates, a project's thickness rationalisation) run here, on one worker
// thread, so the event loop that serves every other request (and /healthz) never waits on them
// (issue 9: one 185 kB POST /api/v1/properties held the server for 8.9 s). The vertex caps
// (validate.ts) keep the worst accepted section to tens of milliseconds, but a contrived outline
// still costs more than the loop can spare, and the thread keeps that true whatever the engine
// does next.
//
// One thread, started on first use (starting one costs tens of milliseconds, more under tsx),
// and unref'd so it never keeps a process alive. Jobs queue on it in order; at most
// ENGINE_MAX_PENDING wait at once (then 503 with Retry-After: the per-user API limit keeps one
// user from filling it alone), and a job running past ENGINE_JOB_TIMEOUT_MS ends the thread (a
// new one starts for the next job) and answers 503 for everything that was waiting on it.
import { isMainThread, parentPort, workerData, type Worker } from "node:worker_threads";
import * as Comlink from "comlink";
import { isEngineInputError } from "../optimizer/errors";
import { sectionProperties, type SectionProperties } from "../optimizer/properties";
import { propertiesIn, type UnitSystem } from "../optimizer/units";
import { parseSectionInput, type FieldError } from "../lib/bench-state";
import { candidateChecks } from "../optimizer/checks";
import type { Family } from "../optimizer/geometry";
import type { SearchProblem } from "../optimizer/search-schema";
import { designRow, type DesignRow } from "../lib/design-summary";
import { rationalise, type RationaliseInput, type RationaliseResult } from "../optimizer";
import { nodeEndpoint, spawnThread } from "./thread-spawn";

const KIND = "sparwise-engine-thread";
export const ENGINE_MAX_PENDING = 16;
export const ENGINE_JOB_TIMEOUT_MS = 10_000;

export type PropertiesAnswer = { ok: true; properties: SectionProperties } | { ok: false; errors: FieldError[] };

/** A SectionInput in `units` → its properties in `units`, or the field errors. Runs on the thread. */
export function sectionPropertiesJob(input: unknown, units: UnitSystem): PropertiesAnswer {
  const parsed = parseSectionInput(input, units);
  if (!parsed.ok) return parsed;
  try {
    return { ok: true, properties: propertiesIn(sectionProperties(parsed.input), units) };
  } catch (e) {
    // The engine names the field (e.g. sizes beyond double precision); still the caller's input.
    if (isEngineInputError(e)) return { ok: false, errors: [{ path: [e.field], field: e.field, message: e.message }] };
    throw e;
  }
}

/**
 * The EN 1993 figures of stored candidates (the rows keep only the summary columns): the engine's
 * one evaluation, candidateChecks, per row, a few hundredths of a millisecond each warm and more
 * cold, so a page of them stays off the event loop. Runs on the thread; exported for tests.
 */
export function designRowsJob(problem: SearchProblem, rows: { family: string; dimensions: Record<string, number> }[]): (DesignRow | null)[] {
  return rows.map((r) => {
    try {
      return designRow(candidateChecks(r.family as Family, r.dimensions, problem));
    } catch {
      // a row the current engine cannot evaluate (stored by an older version) shows no figures rather than failing the page
      return null;
    }
  });
}

/**
 * A project's thickness rationalisation: the engine's integer program, up to about 2 s at the
 * variable budget (rationalise.server.ts). It throws only when its own self-check fails; the
 * error crosses the thread as a rejection, so the caller handles it as before.
 */
export function rationaliseJob(input: RationaliseInput): RationaliseResult {
  return rationalise(input);
}

const jobs = { sectionProperties: sectionPropertiesJob, designRows: designRowsJob, rationalise: rationaliseJob };
type Jobs = typeof jobs;

if (!isMainThread && parentPort && (workerData as { kind?: string } | undefined)?.kind === KIND) {
  Comlink.expose(jobs, nodeEndpoint(parentPort));
}

interface Thread {
  worker: Worker;
  api: Comlink.Remote<Jobs>;
  /** rejecters of the jobs waiting on this thread, so a thread that dies fails them at once */
  waiting: Set<(e: unknown) => void>;
}

let thread: Thread | null = null;
let pending = 0;

function unavailable(error: string): Response {
  return Response.json({ error }, { status: 503, headers: { "Retry-After": "1" } });
}

function getThread(): Thread {
  if (thread) return thread;
  const worker = spawnThread(import.meta.url, KIND);
  worker.unref();
  const t: Thread = { worker, api: Comlink.wrap<Jobs>(nodeEndpoint(worker)), waiting: new Set() };
  const fail = (why: unknown) => {
    if (thread === t) thread = null;
    for (const reject of t.waiting) reject(why);
    t.waiting.clear();
  };
  worker.on("error", fail);
  worker.on("exit", () => fail(unavailable("The section engine restarted; send the request again.")));
  thread = t;
  return t;
}

/** Runs one engine job on the thread; throws a 503 Response when the queue is full or the job overran. */
export async function runOnEngineThread<K extends keyof Jobs>(job: K, ...args: Parameters<Jobs[K]>): Promise<ReturnType<Jobs[K]>> {
  if (pending >= ENGINE_MAX_PENDING) throw unavailable("The section engine is busy; try again in a second.");
  pending++;
  const t = getThread();
  try {
    return await new Promise<ReturnType<Jobs[K]>>((resolve, reject) => {
      t.waiting.add(reject);
      const timer = setTimeout(() => {
        reject(unavailable(`The section took over ${ENGINE_JOB_TIMEOUT_MS / 1000} s to compute; simplify it.`));
        void t.worker.terminate();
      }, ENGINE_JOB_TIMEOUT_MS);
      const call = t.api[job] as unknown as (...a: unknown[]) => Promise<ReturnType<Jobs[K]>>;
      call(...args)
        .then(resolve, reject)
        .finally(() => {
          clearTimeout(timer);
          t.waiting.delete(reject);
        });
    });
  } finally {
    pending--;
  }
}

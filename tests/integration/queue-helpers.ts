// Helpers for the queue tests: trivial problems, worker processes, waiting on sweep states.
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { db } from "~/lib/db.server";
import { depthBests, searchProblemSchema, searchSections, type SearchProblemInput } from "~/optimizer";
import { candidatesToStore } from "~/workers/queue.server";
import { SWEEP_SEARCH_OPTIONS } from "~/workers/sweep-search.server";

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

/** A small problem the exact search settles in milliseconds; `i` varies the moment so results differ. */
export function tinyProblem(i = 0): SearchProblemInput {
  return {
    moment: { sagging: 40 + (i % 37) * 5, hogging: 0 },
    shear: 60,
    allowable: { tension: 165, compression: 165, shear: 100 },
    depth: { min: 100, max: 400, step: 20 },
    width: { min: 50, max: 250, step: 10 },
    thicknesses: [6, 8, 10, 12, 15],
    families: ["i", "tee", "box"],
  };
}

export async function teamAndUser(email = "engineer@tallowfield.example") {
  const row = await db("users").join("memberships", "memberships.user_id", "users.id").where("users.email", email).first("users.id", "memberships.team_id", "memberships.role");
  return { ownerId: row.id as number, teamId: row.team_id as number, role: row.role as "admin" | "engineer" | "reviewer" | "viewer" };
}

export interface WorkerProc {
  child: ChildProcess;
  id: string;
  output: () => string;
  exited: Promise<number | null>;
}

/** Starts `npx tsx app/workers/worker-process.ts` against the test database with the given env. */
export function startWorker(id: string, env: Record<string, string> = {}): WorkerProc {
  let out = "";
  // tsx directly (not npx) so the pid we signal is the node process that runs the worker.
  const child = spawn(process.execPath, ["--import", "tsx", "app/workers/worker-process.ts"], {
    cwd: ROOT,
    env: {
      ...process.env,
      SPARWISE_WORKER_ID: id,
      SPARWISE_INPROCESS_WORKERS: "0",
      DB_POOL_MAX: "4",
      ...env,
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout!.on("data", (d) => (out += d));
  child.stderr!.on("data", (d) => (out += d));
  const exited = new Promise<number | null>((r) => child.on("exit", (code) => r(code)));
  return { child, id, output: () => out, exited };
}

export async function stopWorker(w: WorkerProc, signal: NodeJS.Signals = "SIGTERM", timeoutMs = 15_000): Promise<void> {
  if (w.child.exitCode !== null || w.child.signalCode !== null) return;
  w.child.kill(signal);
  const t = setTimeout(() => w.child.kill("SIGKILL"), timeoutMs);
  await w.exited;
  clearTimeout(t);
}

export async function waitFor<T>(what: string, f: () => Promise<T | null | undefined | false>, timeoutMs = 30_000, everyMs = 100): Promise<T> {
  const t0 = Date.now();
  for (;;) {
    const v = await f();
    if (v) return v;
    if (Date.now() - t0 > timeoutMs) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

export async function sweepRow(id: number) {
  return db("sweeps").where({ id }).first();
}

/** How many candidate rows the runner stores for tinyProblem(i): the engine's answer with each
 *  family's lightest at every depth, through the runner's own candidatesToStore. */
export function storedCandidateCount(i: number): number {
  const problem = searchProblemSchema.parse(tinyProblem(i));
  const result = searchSections(tinyProblem(i), SWEEP_SEARCH_OPTIONS);
  return candidatesToStore({ ...result, depthBests: depthBests(problem).points }, "mass", problem).length;
}

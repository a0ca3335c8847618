// Starts one sweep runner inside the app server (so `npm run up` alone runs sweeps). Imported for
// its side effect by app/entry.server.tsx; started once per process (the flag lives on globalThis
// so dev-server module reloads do not start a second one). SPARWISE_INPROCESS_WORKERS=0 turns it
// off (the integration tests run their own workers; a deployment may run only `npm run worker`).
import { isMainThread } from "node:worker_threads";
import { SweepRunner } from "./runner.server";
import { warmSearchThreads } from "./search-threads";
import { sweepThreads } from "./sweep-search.server";

const g = globalThis as unknown as { __sparwiseRunner?: SweepRunner };

export function startInProcessWorkers(): SweepRunner | null {
  if (process.env.SPARWISE_INPROCESS_WORKERS === "0") return null;
  // Search threads may load the server bundle (search-threads.ts spawns its own module): never
  // start a runner inside one.
  if (!isMainThread) return null;
  if (process.env.NODE_ENV === "test" || process.env.VITEST) return null;
  if (g.__sparwiseRunner) return g.__sparwiseRunner;
  const runner = new SweepRunner().start();
  g.__sparwiseRunner = runner;
  // the sweeps' search threads, started now so the first large sweep does not wait for them
  warmSearchThreads(sweepThreads(runner.concurrency) * runner.concurrency);
  const stop = (signal: NodeJS.Signals) => {
    // Finish or release running sweeps, then exit the way the signal asked.
    void runner.stop().finally(() => process.exit(signal === "SIGINT" ? 130 : 0));
  };
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
  return runner;
}

startInProcessWorkers();

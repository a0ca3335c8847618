// `npm run worker`: a standalone queue worker. Run any number of these, on any machine that
// reaches the database (DB_HOST, DB_PORT/SPARWISE_DB_PORT, DB_NAME, DB_USER, DB_PASSWORD).
// SIGTERM / SIGINT: stop claiming, let running sweeps finish for SPARWISE_SHUTDOWN_GRACE_MS, then
// release the rest to the queue and exit 0.
import { closeDb } from "~/lib/db.server";
import { SweepRunner } from "./runner.server";

const runner = new SweepRunner({ workerId: process.env.SPARWISE_WORKER_ID || undefined }).start();
console.log(`[sweeps] worker ${runner.workerId} started: concurrency ${runner.concurrency}, database ${process.env.DB_NAME ?? "sparwise"}`);
if (process.send) process.send({ ready: runner.workerId });

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[sweeps] ${signal}: stopping (finishing or releasing ${runner.active} running sweep(s))`);
  try {
    await runner.stop();
    console.log(`[sweeps] stopped: ${JSON.stringify(runner.stats)}`);
  } finally {
    await closeDb().catch(() => undefined);
    process.exit(0);
  }
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));

// Starting a worker thread on one of our own modules, from the production bundle or from
// TypeScript source. Shared by search-threads.ts and engine-thread.server.ts.
import { createRequire } from "node:module";
import { pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import * as Comlink from "comlink";
// @ts-expect-error comlink ships node-adapter.d.ts, not the .d.mts this .mjs path would need
import nodeEndpointUntyped from "comlink/dist/esm/node-adapter.mjs";

export const nodeEndpoint = nodeEndpointUntyped as (nep: unknown) => Comlink.Endpoint;

/**
 * A thread running the module at moduleUrl with workerData { kind }: the module exposes its API
 * when it finds itself in a thread of that kind. From the bundle (the server build holds every
 * module in one file) the thread loads the bundle; from TypeScript source (tests, the tsx-run
 * queue worker) it registers tsx's loader first (loader hooks are per thread), then imports the file.
 */
export function spawnThread(moduleUrl: string, kind: string): Worker {
  const url = new URL(moduleUrl);
  const workerOptions = { workerData: { kind } };
  if (!url.pathname.endsWith(".ts")) return new Worker(url, workerOptions);
  const tsxApi = pathToFileURL(createRequire(moduleUrl).resolve("tsx/esm/api").replace(/index\.cjs$/, "index.mjs")).href;
  const boot = `import(${JSON.stringify(tsxApi)}).then((m) => { m.register(); return import(${JSON.stringify(url.href)}); });`;
  return new Worker(boot, { ...workerOptions, eval: true });
}

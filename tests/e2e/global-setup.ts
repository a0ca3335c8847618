import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import type { TestProject } from "vitest/node";
import os from "node:os";
import path from "node:path";

// The browser suite runs the production build against a fresh seeded database of its own.
let server: ChildProcess | undefined;

export default async function setup(project: TestProject) {
  const name = process.env.E2E_DB_NAME ?? "sparwise_e2e";
  const port = Number(process.env.E2E_PORT ?? 3100);
  execFileSync("bash", ["db/start.sh"], { stdio: "inherit" });
  execFileSync("bash", ["db/create-database.sh", name, "--fresh"], { stdio: "inherit" });
  // Migrations are TypeScript: run them under tsx, not in this process.
  execFileSync("npx", ["tsx", "db/migrate.ts", "--seed"], { stdio: "inherit", env: { ...process.env, DB_NAME: name } });
  // The production server (server.ts) as npm start runs it: node itself, in a process group of
  // its own (detached) that the teardown stops whole.
  const base = `http://127.0.0.1:${port}`;
  server = spawn(process.execPath, ["--import", "tsx", "server.ts"], {
    // VITEST is blanked so the server starts its in-process sweep workers (in-process.server.ts skips them under vitest).
    // APP_URL is this server's own address: links in e-mails must lead back to it, not to .env's.
    // Attachments go to a folder of the run's own, never the demo's data folder.
    env: { ...process.env, DB_NAME: name, PORT: String(port), APP_URL: base, NODE_ENV: "production", VITEST: "", SPARWISE_ATTACHMENTS_DIR: path.join(os.tmpdir(), `sparwise-attachments-${name}`) },
    stdio: ["ignore", "inherit", "inherit"],
    detached: true,
  });
  let exited: string | null = null;
  server.once("exit", (code, signal) => (exited = `exited with ${signal ?? code}`));
  const deadline = Date.now() + 90_000;
  for (;;) {
    // Something else answering on the port is no success: our own server must be alive.
    if (exited) throw new Error(`the app server for the browser tests ${exited} (is port ${port} taken?)`);
    try {
      const res = await fetch(`${base}/healthz`);
      if (res.ok) break;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline) {
      if (server.pid) process.kill(-server.pid, "SIGTERM");
      throw new Error("the app server did not start for the browser tests");
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  project.provide("baseUrl", base);
  return async () => {
    if (server?.pid) {
      try {
        process.kill(-server.pid, "SIGTERM");
      } catch {
        // already gone
      }
    }
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

// What the benchmarks share: the walkthrough brief, a fresh database of their own and an up-to-date
// production build. Imports nothing of the app, so a bench can set DB_NAME before it loads the app.
import { execFileSync, type ChildProcess } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import net from "node:net";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { SearchProblemInput } from "../../app/optimizer/search-schema";

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

/**
 * Issue 15's walkthrough brief: all eight families on fine grids (depth 200–1199 by 1, widths
 * 150–452 by 1, eight thicknesses; 4.7·10^10 shapes with mono-i), allowable stresses.
 */
export const WALKTHROUGH_BRIEF: SearchProblemInput = {
  moment: { sagging: 900, hogging: 0 },
  shear: 600,
  allowable: { tension: 165, compression: 165, shear: 100 },
  slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 },
  depth: { min: 200, max: 1199, step: 1 },
  width: { min: 150, max: 452, step: 1 },
  thicknesses: [8, 10, 12, 15, 20, 25, 30, 35],
  families: ["i", "channel", "tee", "box", "channel-down", "angle", "rectangle", "mono-i"],
};

/** A fresh database (BENCH_DB_NAME, else `fallback`) on the project's MariaDB, migrated and seeded; sets DB_NAME. */
export function freshBenchDatabase(fallback: string): string {
  const name = process.env.BENCH_DB_NAME ?? fallback;
  process.env.DB_NAME = name;
  execFileSync("bash", ["db/start.sh"], { cwd: ROOT, stdio: "ignore" });
  execFileSync("bash", ["db/create-database.sh", name, "--fresh"], { cwd: ROOT, stdio: "inherit" });
  execFileSync("npx", ["tsx", "db/migrate.ts", "--seed"], { cwd: ROOT, stdio: "ignore", env: { ...process.env, DB_NAME: name } });
  return name;
}

function newest(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newest(p) : statSync(p).mtimeMs);
  }
  return t;
}

/** Rebuilds the production build when any file under app/ is newer than it. */
export function ensureBuild(): void {
  const built = path.join(ROOT, "build/server/index.js");
  if (!existsSync(built) || statSync(built).mtimeMs < newest(path.join(ROOT, "app"))) {
    console.log("building (app/ is newer than build/) …");
    execFileSync("npm", ["run", "build"], { cwd: ROOT, stdio: "ignore" });
  }
}

/** Waits until the app server at base answers /healthz (at most a minute). */
export async function waitUntilUp(base: string): Promise<void> {
  for (const deadline = Date.now() + 60_000; ; ) {
    try {
      if ((await fetch(`${base}/healthz`)).ok) return;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline) throw new Error("the app server did not start");
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** A TCP port free on the loopback now, for a server the bench starts. */
export function freePort(): Promise<number> {
  return new Promise<number>((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/**
 * Ends a server the bench started detached (its whole process group) when this process exits or
 * fails; returns the stop, for the bench's own end.
 */
export function stopOnExit(child: ChildProcess): () => void {
  let live: ChildProcess | undefined = child;
  const stop = () => {
    if (live?.pid)
      try {
        process.kill(-live.pid, "SIGTERM");
      } catch {
        // already gone
      }
    live = undefined;
  };
  process.on("exit", stop);
  for (const ev of ["uncaughtException", "unhandledRejection"] as const)
    process.on(ev, (e) => {
      stop();
      console.error(e);
      process.exit(1);
    });
  return stop;
}

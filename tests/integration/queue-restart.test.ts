// Database restart mid-run: a worker process keeps running while its MariaDB server is shut
// down and started again; it reconnects and every sweep finishes, once.
//
// The shared development server (port 3307) is used by everyone's tests at the same time, so
// this test starts a SECOND, private MariaDB instance of its own (data under .data/test-restart,
// a port of its own) and restarts only that one.
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { existsSync, mkdirSync, rmSync } from "node:fs";
import net from "node:net";
import path from "node:path";
import knex, { type Knex } from "knex";
import { afterAll, beforeAll, expect, test } from "vitest";
import { knexConfig } from "../../knexfile";
import { searchProblemSchema } from "~/optimizer";
import { ROOT, startWorker, stopWorker, storedCandidateCount, tinyProblem, waitFor, type WorkerProc } from "./queue-helpers";

const DIR = path.join(ROOT, ".data/test-restart");
const SOCK = path.join(DIR, "mysqld.sock");
const DB = "sparwise_restart";
const SBIN = ["/usr/sbin", "/usr/bin"];
const bin = (name: string) => SBIN.map((d) => path.join(d, name)).find(existsSync) ?? name;

let port = 0;
let server: ChildProcess | null = null;
let conn: Knex | null = null;
let worker: WorkerProc | null = null;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const p = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(p));
    });
  });
}

const rootSql = (sql: string) => execFileSync(bin("mariadb"), ["--no-defaults", `--socket=${SOCK}`, "-uroot", "-e", sql], { stdio: "pipe" });
const ping = () => {
  try {
    execFileSync(bin("mariadb-admin"), ["--no-defaults", `--socket=${SOCK}`, "-uroot", "ping"], { stdio: "pipe" });
    return true;
  } catch {
    return false;
  }
};

async function startServer() {
  server = spawn(
    bin("mariadbd"),
    ["--no-defaults", "--user=root", `--datadir=${DIR}/data`, `--socket=${SOCK}`, `--port=${port}`, "--bind-address=127.0.0.1", `--pid-file=${DIR}/mysqld.pid`, `--log-error=${DIR}/mysqld.log`, "--character-set-server=utf8mb4", "--innodb-buffer-pool-size=32M"],
    { stdio: "ignore" },
  );
  await waitFor("the private MariaDB to answer", async () => ping(), 30_000, 100);
}

async function shutdownServer() {
  execFileSync(bin("mariadb-admin"), ["--no-defaults", `--socket=${SOCK}`, "-uroot", "shutdown"], { stdio: "pipe" });
  const s = server;
  if (s && s.exitCode === null) await new Promise((r) => s.once("exit", r));
  server = null;
}

beforeAll(async () => {
  rmSync(DIR, { recursive: true, force: true });
  mkdirSync(DIR, { recursive: true });
  port = await freePort();
  execFileSync(bin("mariadb-install-db"), ["--no-defaults", "--user=root", `--datadir=${DIR}/data`, "--auth-root-authentication-method=socket", "--skip-test-db"], { stdio: "pipe" });
  await startServer();
  const user = process.env.DB_USER ?? "sparwise";
  const pw = (process.env.DB_PASSWORD ?? "").replace(/'/g, "''");
  rootSql(
    `CREATE DATABASE ${DB} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; CREATE USER '${user}'@'127.0.0.1' IDENTIFIED BY '${pw}'; GRANT ALL ON ${DB}.* TO '${user}'@'127.0.0.1';`,
  );
  const env = { ...process.env, SPARWISE_DB_PORT: String(port), DB_NAME: DB };
  execFileSync("npx", ["tsx", "db/migrate.ts", "--seed"], { cwd: ROOT, env, stdio: "pipe" });
  const cfg = knexConfig(DB);
  conn = knex({ ...cfg, connection: { ...(cfg.connection as object), port } });
}, 120_000);

afterAll(async () => {
  if (worker) await stopWorker(worker, "SIGKILL");
  await conn?.destroy();
  if (ping()) await shutdownServer().catch(() => undefined);
  server?.kill("SIGKILL");
  rmSync(DIR, { recursive: true, force: true });
});

test("database restart mid-run: the worker reconnects and every sweep finishes exactly once", async () => {
  const db = conn!;
  const owner = await db("users").where({ email: "engineer@tallowfield.example" }).first("id");
  const team = await db("teams").where({ slug: "tallowfield" }).first("id");
  const N = 8;
  const ids: number[] = [];
  for (let i = 0; i < N; i++) {
    const [id] = await db("sweeps").insert({ team_id: team.id, owner_id: owner.id, status: "queued", problem: JSON.stringify(searchProblemSchema.parse(tinyProblem(i))) });
    ids.push(Number(id));
  }
  // Test-only delay (runner.server.ts) so sweeps are mid-run when the server goes away.
  worker = startWorker("restart-w", {
    SPARWISE_DB_PORT: String(port),
    DB_NAME: DB,
    SPARWISE_WORKER_CONCURRENCY: "2",
    SPARWISE_TEST_SWEEP_DELAY_MS: "1000",
    SPARWISE_LEASE_MS: "3000",
    SPARWISE_HEARTBEAT_MS: "500",
    SPARWISE_POLL_MS: "100",
  });
  await waitFor("some sweeps done and some running", async () => {
    const rows = await db("sweeps").whereIn("id", ids).select("status");
    return rows.some((r) => r.status === "succeeded") && rows.some((r) => r.status === "running");
  }, 60_000);
  await shutdownServer();
  await new Promise((r) => setTimeout(r, 2_000));
  await startServer();
  await waitFor("every sweep to succeed after the restart", async () => {
    try {
      const n = await db("sweeps").whereIn("id", ids).where({ status: "succeeded" }).count({ n: "*" }).first();
      return Number(n!.n) === N;
    } catch {
      return false; // this test's own pool reconnecting
    }
  }, 90_000, 250);
  for (const [i, id] of ids.entries()) {
    const expected = storedCandidateCount(i);
    const row = await db("sweeps").where({ id }).first("finished_attempt");
    const c = await db("candidates").where({ sweep_id: id }).select("attempt");
    expect(c.length).toBe(expected);
    expect(c.every((x) => x.attempt === row.finished_attempt)).toBe(true);
    expect(await db("notifications").where({ link: `/sweeps/${id}` }).count({ n: "*" }).first()).toEqual({ n: 1 });
  }
  // The worker did see the outage (knex logs its refused reconnects; the runner its failed claims).
  expect(worker.output()).toMatch(/ECONNREFUSED|claim failed|lease lost/);
  const attempts = await db("sweeps").whereIn("id", ids).pluck("attempts");
  console.log(`restart test: attempts per sweep ${JSON.stringify(attempts)}`);
  await stopWorker(worker, "SIGTERM");
  expect(worker.child.exitCode).toBe(0);
}, 180_000);

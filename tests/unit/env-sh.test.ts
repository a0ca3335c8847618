// db/env.sh's ensure_env writes APP_URL into .env (issue 9, item 2): a fresh .env gets it, an
// older .env that lacks it gets it appended, and one that has it is left alone.
import { execFileSync } from "node:child_process";
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, expect, test } from "vitest";

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

/** A scratch checkout holding only db/env.sh; ensure_env works on its .env. */
function scratch(env?: string): string {
  const root = mkdtempSync(path.join(tmpdir(), "sparwise-env-"));
  dirs.push(root);
  mkdirSync(path.join(root, "db"));
  copyFileSync("db/env.sh", path.join(root, "db", "env.sh"));
  if (env !== undefined) writeFileSync(path.join(root, ".env"), env);
  // A clean environment, so the caller's own APP_URL or DB_PORT cannot leak into the check.
  execFileSync("bash", ["-c", `. "${root}/db/env.sh"; ensure_env`], { env: { PATH: process.env.PATH ?? "/usr/bin:/bin" } });
  return readFileSync(path.join(root, ".env"), "utf8");
}

test("a fresh .env carries APP_URL=http://localhost:3000", () => {
  const env = scratch();
  expect(env).toMatch(/^APP_URL=http:\/\/localhost:3000$/m);
  expect(env).toMatch(/^SESSION_SECRET=[0-9a-f]{64}$/m);
});

test("an existing .env without APP_URL gets it appended, its other lines kept", () => {
  const env = scratch("SESSION_SECRET=abc\nPORT=3000"); // no final newline
  expect(env).toBe("SESSION_SECRET=abc\nPORT=3000\nAPP_URL=http://localhost:3000\n");
});

test("an .env that has APP_URL is left as it is", () => {
  const before = "SESSION_SECRET=abc\nAPP_URL=https://sparwise.example.com\n";
  expect(scratch(before)).toBe(before);
});

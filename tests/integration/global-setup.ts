import { execFileSync } from "node:child_process";

// Integration tests get a fresh database of their own (never the demo's): sparwise_test, or
// TEST_DB_NAME when several people run suites side by side on one server.
export default async function setup() {
  const name = process.env.TEST_DB_NAME ?? "sparwise_test";
  process.env.DB_NAME = name;
  execFileSync("bash", ["db/start.sh"], { stdio: "inherit" });
  execFileSync("bash", ["db/create-database.sh", name, "--fresh"], { stdio: "inherit" });
  // Migrations are TypeScript: run them under tsx, not in this process.
  execFileSync("npx", ["tsx", "db/migrate.ts", "--seed"], { stdio: "inherit", env: { ...process.env, DB_NAME: name } });
}

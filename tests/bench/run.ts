// `npm run bench`: runs every tests/bench/*.bench.ts in its own process, one after another, so one
// benchmark's warm-up or worker threads never disturb the next one's figures.
import { readdirSync } from "node:fs";
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";

const dir = path.dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(dir)
  .filter((f) => f.endsWith(".bench.ts"))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();
let failed = 0;
for (const file of files) {
  console.log(`\n=== ${file}`);
  const run = spawnSync("npx", ["tsx", path.join(dir, file)], { stdio: "inherit" });
  if (run.status !== 0) failed++;
}
process.exit(failed ? 1 : 0);

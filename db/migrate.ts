// Usage: tsx db/migrate.ts [--seed] — bring DB_NAME to the latest schema (and seed the demo).
import knex from "knex";
import { knexConfig } from "../knexfile";

const db = knex(knexConfig());
try {
  const [, applied] = await db.migrate.latest();
  if (applied.length) console.log(`Applied ${applied.length} migration(s) to ${process.env.DB_NAME ?? "sparwise"}.`);
  if (process.argv.includes("--seed")) {
    await db.seed.run();
    console.log("Demo data seeded.");
  }
} finally {
  await db.destroy();
}

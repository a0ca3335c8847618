import type { Knex } from "knex";
import { fileURLToPath } from "node:url";
import path from "node:path";

const root = path.dirname(fileURLToPath(import.meta.url));
// The server build bundles this file, so look for .env in the working directory first.
for (const file of [path.join(process.cwd(), ".env"), path.join(root, ".env")]) {
  try {
    process.loadEnvFile(file);
    break;
  } catch {
    // No .env here: the environment must carry the settings.
  }
}

/** One place that turns the environment into a Knex config; DB_NAME picks demo or test database. */
export function knexConfig(database = process.env.DB_NAME ?? "sparwise"): Knex.Config {
  return {
    client: "mysql2",
    connection: {
      host: process.env.DB_HOST ?? "127.0.0.1",
      port: Number(process.env.SPARWISE_DB_PORT ?? process.env.DB_PORT ?? 3307),
      user: process.env.DB_USER ?? "sparwise",
      password: process.env.DB_PASSWORD ?? "",
      database,
      charset: "utf8mb4",
      timezone: "Z",
      dateStrings: false,
      supportBigNumbers: true,
    },
    pool: { min: 0, max: Number(process.env.DB_POOL_MAX ?? 10) },
    migrations: { directory: path.join(root, "db/migrations"), loadExtensions: [".ts"], extension: "ts" },
    seeds: { directory: path.join(root, "db/seeds"), loadExtensions: [".ts"], extension: "ts" },
  };
}

export default knexConfig();

import knex, { type Knex } from "knex";
import { knexConfig } from "../../knexfile";

// One pool per process; kept on globalThis so dev-server reloads do not leak pools.
const g = globalThis as unknown as { __sparwiseDb?: Knex };

export function getDb(): Knex {
  if (!g.__sparwiseDb) g.__sparwiseDb = knex(knexConfig());
  return g.__sparwiseDb;
}

// A lazy handle, so importing this module never opens a connection.
export const db: Knex = new Proxy(function lazyKnex() {} as unknown as Knex, {
  get: (_t, prop) => Reflect.get(getDb(), prop),
  apply: (_t, thisArg, args) => Reflect.apply(getDb() as unknown as (...a: unknown[]) => unknown, thisArg, args),
}) as Knex;

export async function closeDb(): Promise<void> {
  if (g.__sparwiseDb) {
    await g.__sparwiseDb.destroy();
    g.__sparwiseDb = undefined;
  }
}

/** MariaDB returns JSON columns as strings; parse them in one place. */
export function parseJson<T>(value: unknown): T {
  return (typeof value === "string" ? JSON.parse(value) : value) as T;
}

// Sweeps and options are numbered within their project (issue 11, item 12): "sweep 3" is the
// project's third sweep, whatever its id across the team. The number is the count of the
// project's rows up to and including the row (ids only grow and rows are never deleted apart
// from their whole project), so it never changes once given and needs no column to keep in
// step. A sweep run outside any project (through the API) keeps its id.
import type { Knex } from "knex";
import { db } from "~/lib/db.server";
import type { Numbers } from "~/lib/numbering";

type Id = number | null | undefined;

/**
 * A select column with the project number of each row of `table` read under `alias`, as `n`:
 * null for a row outside any project. For a page that lists rows anyway, so their numbers come
 * with them instead of from a second round trip.
 */
export function projectNumberColumn(table: "sweeps" | "options", alias: "s" | "o" | "t", q: Knex | Knex.Transaction = db) {
  return q.raw(`${projectNumberSql(table, alias)} as n`);
}

/** The same number as an SQL expression, for a hand-written query (`alias` is the query's own, never input). */
export function projectNumberSql(table: "sweeps" | "options", alias: "s" | "o" | "t"): string {
  return `(CASE WHEN ${alias}.project_id IS NULL THEN NULL ELSE (SELECT COUNT(*) FROM ${table} u WHERE u.project_id = ${alias}.project_id AND u.id <= ${alias}.id) END)`;
}

async function numbersOf(table: "sweeps" | "options", ids: Id[], q: Knex | Knex.Transaction): Promise<Record<number, number>> {
  const wanted = [...new Set(ids.filter((x): x is number => typeof x === "number" && Number.isSafeInteger(x)))];
  if (!wanted.length) return {};
  const rows = await q(`${table} as t`).whereIn("t.id", wanted).whereNotNull("t.project_id").select("t.id", projectNumberColumn(table, "t", q));
  return Object.fromEntries(rows.map((r: { id: number; n: number | string }) => [r.id, Number(r.n)]));
}

/** The project numbers of the sweeps and options a page, e-mail or notice names (q: inside a transaction, its own). */
export async function projectNumbers(ids: { sweeps?: Id[]; options?: Id[] }, q: Knex | Knex.Transaction = db): Promise<Numbers> {
  const [sweep, option] = await Promise.all([numbersOf("sweeps", ids.sweeps ?? [], q), numbersOf("options", ids.options ?? [], q)]);
  return { sweep, option };
}

// The sweep queue, kept in MariaDB (issue 5). Every state change of a sweep goes through here:
// the API routes and pages (enqueue, read, cancel) and the runners (claim, heartbeat, finish).
//
// Rules the module keeps:
// - Time is the database's (NOW(3)), never a worker's clock, so workers on machines whose clocks
//   disagree still agree on when a lease ran out.
// - Fencing: each claim writes a fresh random lease_token; every later write a worker makes for
//   that sweep is `WHERE id = ? AND lease_token = ? AND status = 'running'`. A write that matches
//   no row means the lease was lost (expired and taken by another worker, or the sweep ended):
//   the worker drops the sweep quietly and never touches it again.
// - Results and the final status are written in ONE transaction, after the token is checked
//   under a row lock; earlier rows of the sweep are deleted in the same transaction and the
//   (sweep_id, rank) unique key backs it up, so no retry can leave duplicates.
// - An engine error (the search throwing) is deterministic, so it fails the sweep at once; only
//   a lost worker (lease expiry) is retried, up to max_attempts claims.
import { randomBytes } from "node:crypto";
import { EventEmitter } from "node:events";
import type { Knex } from "knex";
import { z } from "zod";
import { db, parseJson } from "~/lib/db.server";
import { can, type Role } from "~/lib/roles";
import { fieldErrorsFrom } from "~/lib/forms.server";
import { searchProblemSchema, FAMILIES, type SearchProblem, type SearchResult, type SearchCandidate, type SearchPoint, type WhatItWouldTake } from "~/optimizer";
import { sendEmail } from "~/lib/email.server";
import { notify } from "~/lib/notifications.server";
import type { RestraintStudy, SweepResult } from "~/lib/restraint-study";

export type SweepStatus = "queued" | "running" | "succeeded" | "failed" | "cancelled";
export const TERMINAL: ReadonlySet<SweepStatus> = new Set(["succeeded", "failed", "cancelled"]);

function intEnv(name: string, fallback: number, min = 0): number {
  const raw = process.env[name];
  const v = raw === undefined || raw === "" ? NaN : Number(raw);
  return Number.isInteger(v) && v >= min ? v : fallback;
}

/** Read on every call, so tests and worker processes can set them through the environment. */
export function queueSettings() {
  const leaseMs = intEnv("SPARWISE_LEASE_MS", 30_000, 200);
  return {
    leaseMs,
    /** how often a running sweep's lease is extended (and its progress written) */
    heartbeatMs: intEnv("SPARWISE_HEARTBEAT_MS", Math.max(100, Math.min(5_000, Math.floor(leaseMs / 3))), 50),
    maxQueuedPerUser: intEnv("SPARWISE_MAX_QUEUED_PER_USER", 20, 1),
    maxAttempts: intEnv("SPARWISE_MAX_ATTEMPTS", 3, 1),
  };
}

/** In-process signals: a runner in this process wakes at once on enqueue and aborts at once on cancel. */
export const queueEvents = new EventEmitter();
queueEvents.setMaxListeners(100);

function jsonError(status: number, error: string, extra: Record<string, unknown> = {}): Response {
  return Response.json({ error, ...extra }, { status });
}

/** How many candidates of a sweep are stored at most besides the front and the family bests. */
export const STORED_FRONT_CAP = 2_000;

// ───────────────────────────── enqueue ─────────────────────────────

export interface EnqueueInput {
  teamId: number;
  ownerId: number;
  projectId?: number | null;
  briefId?: number | null;
  recheckOf?: number | null;
  problem: unknown;
  idempotencyKey?: string | null;
  /** the member the sweep is run for (quantities of options saved from it); m and count */
  member?: { lengthM?: number | null; count?: number | null };
}

export const idempotencyKeySchema = z
  .string()
  .min(1, { message: "Idempotency-Key must not be empty" })
  .max(100, { message: "Idempotency-Key: at most 100 characters" })
  .regex(/^[\x21-\x7e]+$/, { message: "Idempotency-Key: printable ASCII without spaces only" });

/**
 * Validates the problem (searchProblemSchema), then inserts a queued sweep. With an idempotency
 * key, the owner's earlier sweep with that key is returned instead (created: false); the same key
 * with a different problem is a 409. Throws a 429 Response when the owner already has
 * maxQueuedPerUser sweeps waiting. The owner's user row is locked for the check-and-insert, so
 * two simultaneous requests cannot both slip under the limit or both insert one key.
 */
export async function enqueueSweep(input: EnqueueInput): Promise<{ id: number; created: boolean }> {
  const parsed = searchProblemSchema.safeParse(input.problem);
  if (!parsed.success) {
    const errors = Object.fromEntries(Object.entries(fieldErrorsFrom(parsed.error)).map(([k, v]) => [`problem.${k}`, v]));
    throw jsonError(400, `problem is invalid: ${Object.values(errors)[0] ?? "see errors"}`, { errors });
  }
  const key = input.idempotencyKey ?? null;
  if (key !== null) {
    const k = idempotencyKeySchema.safeParse(key);
    if (!k.success) throw jsonError(400, k.error.issues[0].message);
  }
  const problemJson = JSON.stringify(parsed.data);
  const { maxQueuedPerUser, maxAttempts } = queueSettings();
  const result = await db.transaction(async (trx) => {
    await trx("users").where({ id: input.ownerId }).forUpdate().first("id");
    if (key !== null) {
      const prior = await trx("sweeps").where({ owner_id: input.ownerId, idempotency_key: key }).first("id", "problem", "brief_id", "project_id", "recheck_of");
      if (prior) {
        const same =
          JSON.stringify(parseJson(prior.problem)) === problemJson &&
          (prior.brief_id ?? null) === (input.briefId ?? null) &&
          (prior.project_id ?? null) === (input.projectId ?? null) &&
          (prior.recheck_of ?? null) === (input.recheckOf ?? null);
        if (!same) throw jsonError(409, `Idempotency-Key "${key}" was already used for sweep ${prior.id} with a different request`);
        return { id: Number(prior.id), created: false };
      }
    }
    const [{ n }] = await trx("sweeps").where({ owner_id: input.ownerId, status: "queued" }).count({ n: "*" });
    if (Number(n) >= maxQueuedPerUser)
      throw jsonError(
        429,
        `You already have ${Number(n)} sweeps waiting in the queue (the limit is ${maxQueuedPerUser}); wait for some to start or cancel them, then try again.`,
      );
    const [id] = await trx("sweeps").insert({
      team_id: input.teamId,
      owner_id: input.ownerId,
      project_id: input.projectId ?? null,
      brief_id: input.briefId ?? null,
      recheck_of: input.recheckOf ?? null,
      problem: problemJson,
      status: "queued",
      max_attempts: maxAttempts,
      idempotency_key: key,
      member_length_m: input.member?.lengthM ?? null,
      member_count: input.member?.count ?? null,
    });
    return { id: Number(id), created: true };
  });
  if (result.created) queueEvents.emit("enqueued", result.id);
  return result;
}

// ───────────────────────────── claim ─────────────────────────────

export interface Claim {
  id: number;
  token: string;
  attempt: number;
  workerId: string;
  teamId: number;
  ownerId: number;
  problem: SearchProblem;
}

interface EndedNotice {
  id: number;
  teamId: number;
  ownerId: number;
  status: SweepStatus;
  summary: string;
}

/**
 * Claims up to `limit` sweeps for `workerId`: first running ones whose lease expired (their worker
 * died or stalled), then queued ones, oldest first. One short READ COMMITTED transaction with
 * FOR UPDATE SKIP LOCKED, so competing workers never wait on or take each other's rows. A claim
 * over max_attempts fails the sweep; a sweep whose cancel was requested is cancelled, not run.
 */
export async function claimNextSweeps(workerId: string, limit: number): Promise<Claim[]> {
  if (limit <= 0) return [];
  const { leaseMs } = queueSettings();
  const ended: EndedNotice[] = [];
  const claims = await db.transaction(
    async (trx) => {
      const pick = async (sql: string, n: number) => (n > 0 ? ((await trx.raw(sql, [n]))[0] as ClaimRow[]) : []);
      const expired = await pick(
        `SELECT id, team_id, owner_id, attempts, max_attempts, cancel_requested, lease_owner, problem FROM sweeps
         WHERE status = 'running' AND lease_expires_at < NOW(3) ORDER BY lease_expires_at LIMIT ? FOR UPDATE SKIP LOCKED`,
        limit,
      );
      const queued = await pick(
        `SELECT id, team_id, owner_id, attempts, max_attempts, cancel_requested, lease_owner, problem FROM sweeps
         WHERE status = 'queued' ORDER BY id LIMIT ? FOR UPDATE SKIP LOCKED`,
        limit - expired.length,
      );
      const out: Claim[] = [];
      for (const row of [...expired, ...queued]) {
        const id = Number(row.id);
        if (row.cancel_requested) {
          await trx("sweeps").where({ id }).update(endColumns(trx, "cancelled", { reason: "Cancelled before it ran." }));
          const n: EndedNotice = { id, teamId: row.team_id, ownerId: row.owner_id, status: "cancelled", summary: "It was cancelled before it ran." };
          await announceEnd(n, trx);
          ended.push(n);
          continue;
        }
        if (row.attempts >= row.max_attempts) {
          const error = `The worker running this sweep stopped responding ${row.attempts} time(s) (last: ${row.lease_owner ?? "unknown"}); gave up after ${row.max_attempts} attempts. Try a smaller grid, or run it again.`;
          await trx("sweeps").where({ id }).update(endColumns(trx, "failed", { error }));
          const n: EndedNotice = { id, teamId: row.team_id, ownerId: row.owner_id, status: "failed", summary: error };
          await announceEnd(n, trx);
          ended.push(n);
          continue;
        }
        // A stored problem the current schema refuses (written before a schema change) would fail
        // every claim forever: fail that sweep alone, with the schema's words.
        const problem = searchProblemSchema.safeParse(parseJson(row.problem));
        if (!problem.success) {
          const error = `The sweep's stored problem is no longer valid: ${problem.error.issues.map((i) => `${i.path.join(".") || "problem"}: ${i.message}`).join("; ")}`;
          await trx("sweeps").where({ id }).update(endColumns(trx, "failed", { error }));
          const n: EndedNotice = { id, teamId: row.team_id, ownerId: row.owner_id, status: "failed", summary: error };
          await announceEnd(n, trx);
          ended.push(n);
          continue;
        }
        const token = randomBytes(16).toString("hex");
        await trx.raw(
          `UPDATE sweeps SET status = 'running', lease_token = ?, lease_owner = ?, lease_expires_at = NOW(3) + INTERVAL ? MICROSECOND,
             heartbeat_at = NOW(3), attempts = attempts + 1, started_at = COALESCE(started_at, NOW(3)), updated_at = NOW()
           WHERE id = ?`,
          [token, workerId.slice(0, 100), leaseMs * 1000, id],
        );
        out.push({
          id,
          token,
          attempt: row.attempts + 1,
          workerId,
          teamId: row.team_id,
          ownerId: row.owner_id,
          problem: problem.data,
        });
      }
      return out;
    },
    { isolationLevel: "read committed" },
  );
  ended.forEach(emitEnded);
  return claims;
}

interface ClaimRow {
  id: number;
  team_id: number;
  owner_id: number;
  attempts: number;
  max_attempts: number;
  cancel_requested: number;
  lease_owner: string | null;
  problem: string;
}

function endColumns(trx: Knex | Knex.Transaction, status: SweepStatus, extra: Record<string, unknown> = {}) {
  return {
    status,
    lease_token: null,
    lease_expires_at: null,
    finished_at: trx.raw("NOW(3)"),
    updated_at: trx.raw("NOW()"),
    ...extra,
  };
}

// ───────────────────────────── while running ─────────────────────────────

/** Extends the lease and records progress; false when the lease is no longer this claim's. */
export async function heartbeat(claim: Pick<Claim, "id" | "token">, progress?: { done: number; total: number }): Promise<boolean> {
  const { leaseMs } = queueSettings();
  const sets = progress ? ", progress_done = ?, progress_total = ?" : "";
  const params: (string | number)[] = [leaseMs * 1000];
  if (progress) params.push(Math.max(0, Math.round(progress.done)), Math.max(0, Math.round(progress.total)));
  params.push(claim.id, claim.token);
  const [res] = await db.raw(
    `UPDATE sweeps SET lease_expires_at = NOW(3) + INTERVAL ? MICROSECOND, heartbeat_at = NOW(3)${sets}
     WHERE id = ? AND lease_token = ? AND status = 'running'`,
    params,
  );
  return (res as { affectedRows: number }).affectedRows > 0;
}

export interface Control {
  /** the lease is still this claim's */
  held: boolean;
  cancelRequested: boolean;
}

/** One cheap read for all of a runner's sweeps: is each lease still held, is a cancel requested? */
export async function readControl(claims: Pick<Claim, "id" | "token">[]): Promise<Map<number, Control>> {
  const out = new Map<number, Control>();
  if (claims.length === 0) return out;
  const rows = await db("sweeps")
    .whereIn(
      "id",
      claims.map((c) => c.id),
    )
    .select("id", "lease_token", "status", "cancel_requested");
  const byId = new Map(rows.map((r) => [Number(r.id), r]));
  for (const c of claims) {
    const r = byId.get(c.id);
    out.set(c.id, { held: !!r && r.status === "running" && r.lease_token === c.token, cancelRequested: !!r?.cancel_requested });
  }
  return out;
}

// ───────────────────────────── ending ─────────────────────────────

/** Locks the row if the claim still holds it; null otherwise (lease lost: write nothing). */
async function lockHeld(trx: Knex.Transaction, claim: Pick<Claim, "id" | "token">) {
  return trx("sweeps").where({ id: claim.id, lease_token: claim.token, status: "running" }).forUpdate().first("id", "team_id", "owner_id", "progress_total");
}

/**
 * Which candidates a sweep stores (the search returns no more than these): the front (the
 * contract's front is over the feasible candidates the search evaluated, so a best-first search
 * reports a subset of the exhaustive front), every family's best, and the overall best; duplicates
 * (a family best on the front) are stored once. Ranked by the objective (area, or cost), then
 * utilisation, with the overall best always rank 1. The front is capped at STORED_FRONT_CAP rows
 * (lightest first) so one pathological sweep cannot write an unbounded number of rows.
 */
export function candidatesToStore(result: SearchResult, objective: "mass" | "cost") {
  const keyOf = (c: SearchPoint) => `${c.family}|${JSON.stringify(c.dimensions)}`;
  const familyBest = new Set<string>();
  for (const c of Object.values(result.bestByFamily)) if (c) familyBest.add(keyOf(c));
  const front = new Set(result.front.slice(0, STORED_FRONT_CAP).map(keyOf));
  const all = new Map<string, SearchPoint>();
  for (const c of [...(result.best ? [result.best] : []), ...result.front.slice(0, STORED_FRONT_CAP), ...Object.values(result.bestByFamily)])
    if (c && !all.has(keyOf(c))) all.set(keyOf(c), c);
  const bestKey = result.best ? keyOf(result.best) : null;
  const obj = (c: SearchPoint) => (objective === "cost" && c.cost !== undefined ? c.cost : c.area);
  const list = [...all.values()].sort((a, b) => {
    if (bestKey && keyOf(a) === bestKey) return -1;
    if (bestKey && keyOf(b) === bestKey) return 1;
    return obj(a) - obj(b) || a.area - b.area || a.utilisation - b.utilisation;
  });
  return list.map((c, i) => ({
    rank: i + 1,
    family: c.family,
    dimensions: JSON.stringify(c.dimensions),
    area: c.area,
    mass_per_metre: c.massPerMetre,
    cost: c.cost ?? null,
    utilisation: c.utilisation,
    governing: c.governing,
    on_front: front.has(keyOf(c)),
    family_best: familyBest.has(keyOf(c)),
  }));
}

/**
 * Final writes run READ COMMITTED: under the default REPEATABLE READ the DELETE of a sweep's
 * (usually absent) earlier candidates takes a gap lock on the (sweep_id, rank) index, and two
 * workers finishing neighbouring sweeps then deadlock on each other's gap when they insert. The
 * sweep row lock (FOR UPDATE) still serialises attempts on one sweep, and the unique key still
 * refuses a duplicate.
 */
const FINAL_WRITE = { isolationLevel: "read committed" } as const;

/** Writes results and "succeeded" in one transaction if the claim still holds the lease; false if lost. */
export async function finishSweep(claim: Claim, result: SweepResult & { advice?: WhatItWouldTake | null }): Promise<boolean> {
  const rows = candidatesToStore(result, claim.problem.objective);
  const notice = await db.transaction(async (trx) => {
    const held = await lockHeld(trx, claim);
    if (!held) return null;
    await trx("candidates").where({ sweep_id: claim.id }).delete();
    for (let i = 0; i < rows.length; i += 500)
      await trx("candidates").insert(rows.slice(i, i + 500).map((r) => ({ ...r, sweep_id: claim.id, attempt: claim.attempt })));
    const b = result.best;
    const summary = b
      ? `Best: ${b.family} ${Object.entries(b.dimensions)
          .map(([k, v]) => `${k} ${v}`)
          .join(", ")} mm, ${b.massPerMetre.toFixed(1)} kg/m, utilisation ${b.utilisation.toFixed(3)} (${b.governing}).`
      : `No feasible section: ${result.reason ?? "every candidate failed a check"}`;
    await trx("sweeps")
      .where({ id: claim.id })
      .update(
        endColumns(trx, "succeeded", {
          counts: JSON.stringify(result.counts),
          best: result.best ? JSON.stringify(result.best) : null,
          reason: result.reason ?? null,
          restraint_study: result.restraintStudy ? JSON.stringify(result.restraintStudy) : null,
          advice: result.advice ? JSON.stringify(result.advice) : null,
          progress_done: trx.raw("GREATEST(progress_total, 1)"),
          progress_total: trx.raw("GREATEST(progress_total, 1)"),
          finished_by: claim.workerId.slice(0, 100),
          finished_attempt: claim.attempt,
          error: null,
        }),
      );
    const n: EndedNotice = { id: claim.id, teamId: held.team_id, ownerId: held.owner_id, status: "succeeded", summary };
    await announceEnd(n, trx);
    return n;
  }, FINAL_WRITE);
  if (!notice) return false;
  emitEnded(notice);
  return true;
}

/** Ends a held sweep as failed (engine error) or cancelled (abort on request); false if the lease was lost. */
export async function endHeldSweep(claim: Claim, status: "failed" | "cancelled", message: string): Promise<boolean> {
  const notice = await db.transaction(async (trx) => {
    const held = await lockHeld(trx, claim);
    if (!held) return null;
    await trx("sweeps")
      .where({ id: claim.id })
      .update(
        endColumns(trx, status, {
          ...(status === "failed" ? { error: message.slice(0, 60_000) } : { reason: message }),
          finished_by: claim.workerId.slice(0, 100),
          finished_attempt: claim.attempt,
        }),
      );
    const n: EndedNotice = { id: claim.id, teamId: held.team_id, ownerId: held.owner_id, status, summary: message };
    await announceEnd(n, trx);
    return n;
  }, FINAL_WRITE);
  if (!notice) return false;
  emitEnded(notice);
  return true;
}

/**
 * Hands a running sweep back to the queue (graceful shutdown): queued again, lease cleared, and
 * the attempt this claim counted is given back, because the worker did not fail, it was asked to
 * stop; so a sweep released N times by restarts is not failed for "too many attempts".
 */
export async function releaseSweep(claim: Pick<Claim, "id" | "token">): Promise<boolean> {
  const n = await db("sweeps")
    .where({ id: claim.id, lease_token: claim.token, status: "running" })
    .update({
      status: "queued",
      lease_token: null,
      lease_owner: null,
      lease_expires_at: null,
      attempts: db.raw("GREATEST(attempts, 1) - 1"),
      updated_at: db.raw("NOW()"),
    });
  if (n > 0) queueEvents.emit("enqueued", claim.id);
  return n > 0;
}

// ───────────────────────────── notification ─────────────────────────────

const STATUS_WORDS: Record<SweepStatus, string> = {
  queued: "is queued",
  running: "is running",
  succeeded: "finished",
  failed: "failed",
  cancelled: "was cancelled",
};

function sweepLink(id: number): string {
  return `/sweeps/${id}`;
}

function absolute(link: string): string {
  const base = process.env.APP_URL ?? `http://localhost:${process.env.PORT ?? 3000}`;
  return base.replace(/\/$/, "") + link;
}

/**
 * The owner's e-mail (outbox) and in-app notice, written inside the transaction that ends the
 * sweep, so both exist exactly when the final status does: a retried or fenced-off attempt never
 * sends a second pair, and a crash before the commit sends none.
 */
async function announceEnd(n: EndedNotice, trx: Knex.Transaction): Promise<void> {
  const owner = await trx("users").where({ id: n.ownerId }).first("email", "name", "disabled_at");
  if (!owner || owner.disabled_at) return;
  const title = `Sweep ${n.id} ${STATUS_WORDS[n.status]}`;
  await sendEmail(
    { teamId: n.teamId, to: owner.email, subject: title, text: `Hello ${owner.name},\n\n${title}. ${n.summary}\n\nOpen it: ${absolute(sweepLink(n.id))}\n\n— Sparwise` },
    trx,
  );
  await notify(n.ownerId, { title, body: n.summary.slice(0, 2000), link: sweepLink(n.id) }, trx);
}

function emitEnded(n: EndedNotice): void {
  queueEvents.emit("ended", n.id, n.status);
}

// ───────────────────────────── reading and cancelling ─────────────────────────────

export interface SweepActor {
  id: number;
  teamId: number;
  role: Role;
}

export interface SweepView {
  id: number;
  teamId: number;
  projectId: number | null;
  briefId: number | null;
  recheckOf: number | null;
  ownerId: number;
  status: SweepStatus;
  cancelRequested: boolean;
  progress: { done: number; total: number; fraction: number };
  counts: SearchResult["counts"] | null;
  best: SearchCandidate | null;
  /** EN 1993 sweeps with a restraint length: the lightest section at L … L/6 */
  restraintStudy: RestraintStudy | null;
  reason: string | null;
  error: string | null;
  attempts: number;
  maxAttempts: number;
  queuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  /** ms since start (to the end when finished), measured by the database clock */
  elapsedMs: number | null;
  /** rough ms left from the progress fraction so far; null when unknown */
  etaMs: number | null;
  problem: SearchProblem;
  /** the member the sweep was run for (m, count); null where not given */
  member: { lengthM: number | null; count: number | null };
  /** no feasible section: nearest misses and relaxations (engine's whatItWouldTake); null otherwise or not worked out */
  advice: WhatItWouldTake | null;
}

const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : d ? new Date(String(d)).toISOString() : null);

/** The sweep as the API and pages show it, or null when it does not exist. */
export async function getSweep(id: number): Promise<SweepView | null> {
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  const row = await db("sweeps")
    .where({ id })
    .first("*", db.raw("TIMESTAMPDIFF(MICROSECOND, started_at, COALESCE(finished_at, NOW(3))) DIV 1000 AS elapsed_ms"));
  if (!row) return null;
  const done = Number(row.progress_done),
    total = Number(row.progress_total);
  const fraction = row.status === "succeeded" ? 1 : total > 0 ? Math.min(1, done / total) : 0;
  const elapsedMs = row.elapsed_ms === null || row.elapsed_ms === undefined ? null : Number(row.elapsed_ms);
  const etaMs = row.status === "running" && elapsedMs !== null && fraction > 0 && fraction < 1 ? Math.round((elapsedMs * (1 - fraction)) / fraction) : null;
  return {
    id: row.id,
    teamId: row.team_id,
    projectId: row.project_id,
    briefId: row.brief_id,
    recheckOf: row.recheck_of,
    ownerId: row.owner_id,
    status: row.status,
    cancelRequested: !!row.cancel_requested,
    progress: { done, total, fraction },
    counts: row.counts ? parseJson(row.counts) : null,
    best: row.best ? parseJson(row.best) : null,
    restraintStudy: row.restraint_study ? parseJson(row.restraint_study) : null,
    reason: row.reason,
    error: row.error,
    attempts: row.attempts,
    maxAttempts: row.max_attempts,
    queuedAt: iso(row.queued_at)!,
    startedAt: iso(row.started_at),
    finishedAt: iso(row.finished_at),
    elapsedMs,
    etaMs,
    problem: parseJson(row.problem),
    member: { lengthM: row.member_length_m ?? null, count: row.member_count ?? null },
    advice: row.advice ? parseJson(row.advice) : null,
  };
}

/** The sweep if it exists and belongs to the actor's team; null otherwise (callers answer 404, never 403, so ids do not leak). */
export async function getTeamSweep(id: number, actor: Pick<SweepActor, "teamId">): Promise<SweepView | null> {
  const s = await getSweep(id);
  return s && s.teamId === actor.teamId ? s : null;
}

export const CANDIDATE_SORTS = ["rank", "area", "-area", "mass", "-mass", "utilisation", "-utilisation", "cost", "-cost"] as const;
export const candidatesQuerySchema = z
  .object({
    page: z.coerce.number({ error: "page must be a whole number ≥ 1" }).int({ message: "page must be a whole number ≥ 1" }).min(1, { message: "page must be a whole number ≥ 1" }).max(100_000).default(1),
    pageSize: z.coerce.number({ error: "pageSize must be a whole number" }).int({ message: "pageSize must be a whole number" }).min(1, { message: "pageSize must be 1 to 500" }).max(500, { message: "pageSize must be 1 to 500" }).default(50),
    sort: z.enum(CANDIDATE_SORTS, { error: `sort must be one of ${CANDIDATE_SORTS.join(", ")}` }).default("rank"),
    family: z.enum(FAMILIES, { error: `family must be one of ${FAMILIES.join(", ")}` }).optional(),
    frontOnly: z
      .enum(["true", "false", "1", "0"], { error: "frontOnly must be true or false" })
      .optional()
      .transform((v) => v === "true" || v === "1"),
  })
  .strict();
export type CandidatesQuery = z.output<typeof candidatesQuerySchema>;

export interface CandidateRow {
  rank: number;
  family: string;
  dimensions: Record<string, number>;
  area: number;
  massPerMetre: number;
  cost: number | null;
  utilisation: number;
  governing: string;
  onFront: boolean;
  familyBest: boolean;
}

export async function listCandidates(
  sweepId: number,
  q: Partial<CandidatesQuery> = {},
): Promise<{ total: number; page: number; pageSize: number; items: CandidateRow[] }> {
  const page = q.page ?? 1,
    pageSize = q.pageSize ?? 50,
    sort = q.sort ?? "rank";
  const base = db("candidates").where({ sweep_id: sweepId });
  if (q.family) base.andWhere({ family: q.family });
  if (q.frontOnly) base.andWhere({ on_front: true });
  const [{ n }] = await base.clone().count({ n: "*" });
  const desc = sort.startsWith("-");
  const col = { rank: "rank", area: "area", mass: "mass_per_metre", utilisation: "utilisation", cost: "cost" }[sort.replace(/^-/, "") as "rank"];
  const rows = await base
    .clone()
    .orderBy([
      { column: col, order: desc ? "desc" : "asc" },
      { column: "rank", order: "asc" },
    ])
    .limit(pageSize)
    .offset((page - 1) * pageSize)
    .select("rank", "family", "dimensions", "area", "mass_per_metre", "cost", "utilisation", "governing", "on_front", "family_best");
  return {
    total: Number(n),
    page,
    pageSize,
    items: rows.map((r) => ({
      rank: r.rank,
      family: r.family,
      dimensions: parseJson(r.dimensions),
      area: r.area,
      massPerMetre: r.mass_per_metre,
      cost: r.cost,
      utilisation: r.utilisation,
      governing: r.governing,
      onFront: !!r.on_front,
      familyBest: !!r.family_best,
    })),
  };
}

/** May this actor cancel this sweep? Owners with a sweep-running permission, admins any in the team. */
export function mayCancel(actor: SweepActor, sweep: { ownerId: number; teamId: number }): boolean {
  if (sweep.teamId !== actor.teamId) return false;
  if (can(actor.role, "cancelAnySweep")) return true;
  return sweep.ownerId === actor.id && (can(actor.role, "runSweep") || can(actor.role, "recheck"));
}

/**
 * Cancels: a queued sweep ends at once; a running one is flagged, and its worker aborts the
 * search (within a control poll, ≈ 0.25 s) and records "cancelled". Cancelling a cancelled or
 * cancel-requested sweep again is a no-op; a finished one is a 409. Throws 404/403/409 Responses.
 */
export async function cancelSweep(id: number, actor: SweepActor): Promise<{ id: number; status: SweepStatus; cancelRequested: boolean }> {
  const notice = await db.transaction(async (trx) => {
    const row =
      Number.isSafeInteger(id) && id > 0
        ? await trx("sweeps").where({ id }).forUpdate().first("id", "team_id", "owner_id", "status", "cancel_requested", trx.raw("lease_expires_at < NOW(3) AS lease_expired"))
        : null;
    if (!row || row.team_id !== actor.teamId) throw jsonError(404, `sweep ${id} not found`);
    if (!mayCancel(actor, { ownerId: row.owner_id, teamId: row.team_id }))
      throw jsonError(403, "only the sweep's owner (an engineer) or a team admin may cancel it");
    // Queued, or running with its lease run out (its worker is gone; fencing keeps a late one out): end it now.
    if (row.status === "queued" || (row.status === "running" && row.lease_expired)) {
      const words = row.status === "queued" ? "Cancelled before it ran." : "Cancelled while its worker was not responding.";
      await trx("sweeps").where({ id }).update(endColumns(trx, "cancelled", { cancel_requested: true, reason: words }));
      const n: EndedNotice = { id, teamId: row.team_id, ownerId: row.owner_id, status: "cancelled", summary: words };
      await announceEnd(n, trx);
      return { notice: n, status: "cancelled" as SweepStatus, cancelRequested: true };
    }
    if (row.status === "running") {
      if (!row.cancel_requested) await trx("sweeps").where({ id }).update({ cancel_requested: true, updated_at: trx.raw("NOW()") });
      return { notice: null, status: "running" as SweepStatus, cancelRequested: true };
    }
    if (row.status === "cancelled") return { notice: null, status: "cancelled" as SweepStatus, cancelRequested: true };
    throw jsonError(409, `sweep ${id} already ${row.status}; there is nothing to cancel`);
  });
  if (notice.notice) emitEnded(notice.notice);
  else if (notice.status === "running") queueEvents.emit("cancel", id);
  return { id, status: notice.status, cancelRequested: notice.cancelRequested };
}

// ───────────────────────────── health (dashboard) ─────────────────────────────

export interface QueueHealth {
  /** the team's sweeps by status */
  byStatus: Record<SweepStatus, number>;
  /** how long the team's oldest waiting sweep has waited */
  oldestQueuedMs: number | null;
  /** distinct workers holding an unexpired lease on one of the team's sweeps */
  activeWorkers: number;
  /** the team's running sweeps whose lease ran out (their worker died; another will take them over) */
  expiredLeases: number;
}

/**
 * Queue health for one team, by the database clock. Every figure is the team's own (issue 9:
 * the whole server's queue length and oldest wait told one team how busy the others were).
 */
export async function queueHealth(teamId: number): Promise<QueueHealth> {
  const byStatus: Record<SweepStatus, number> = { queued: 0, running: 0, succeeded: 0, failed: 0, cancelled: 0 };
  for (const r of await db("sweeps").where({ team_id: teamId }).groupBy("status").select("status", db.raw("COUNT(*) AS n"))) byStatus[r.status as SweepStatus] = Number(r.n);
  const [[q]] = await db.raw(`SELECT TIMESTAMPDIFF(MICROSECOND, MIN(queued_at), NOW(3)) DIV 1000 AS oldest FROM sweeps WHERE status = 'queued' AND team_id = ?`, [teamId]);
  const [[w]] = await db.raw(
    `SELECT COUNT(DISTINCT CASE WHEN lease_expires_at >= NOW(3) THEN lease_owner END) AS workers, SUM(lease_expires_at < NOW(3)) AS expired FROM sweeps WHERE status = 'running' AND team_id = ?`,
    [teamId],
  );
  return {
    byStatus,
    oldestQueuedMs: q.oldest === null ? null : Number(q.oldest),
    activeWorkers: Number(w.workers ?? 0),
    expiredLeases: Number(w.expired ?? 0),
  };
}

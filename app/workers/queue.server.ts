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
import { catalogueSummary, withRolledRows, type CatalogueSummary } from "~/lib/catalogue-sweep";
import { randomBytes } from "node:crypto";
import { EventEmitter } from "node:events";
import type { Knex } from "knex";
import { z } from "zod";
import { db, parseJson } from "~/lib/db.server";
import { can, type Role } from "~/lib/roles";
import { fieldErrorsFrom } from "~/lib/forms.server";
import { axisCount, searchProblemSchema, geometryKey, type SearchProblem, type SearchResult, type SearchCandidate, type SearchPoint, type WhatItWouldTake } from "~/optimizer";
import { sendEmail } from "~/lib/email.server";
import { sweepNo } from "~/lib/numbering";
import { projectNumbers } from "~/lib/numbering.server";
import { appUrl } from "~/lib/app-url.server";
import { gridCostProblem, timedOutReason } from "./sweep-budget";
import type { ProgressUnit, SweepProgress } from "./sweep-search.server";
import { notify } from "~/lib/notifications.server";
import type { RestraintStudy, SweepResult } from "~/lib/restraint-study";
import { MAX_DEPTH_BEST_DEPTHS, depthFamilyQueryFields, type DepthBestsInfo } from "~/lib/depth-bests";
import { designRow, isCodeBasis, type DesignRow } from "~/lib/design-summary";
import { candidateChecks } from "~/optimizer/checks";

export type SweepStatus = "queued" | "running" | "succeeded" | "failed" | "cancelled" | "timed_out";
export const TERMINAL: ReadonlySet<SweepStatus> = new Set(["succeeded", "failed", "cancelled", "timed_out"]);
/** Ended with results to show: all of the grid searched (succeeded), or the best found within the time budget (timed_out). */
export const WITH_RESULTS: ReadonlySet<SweepStatus> = new Set(["succeeded", "timed_out"]);

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

/**
 * Most front members a sweep stores (lightest first). The grid's front is stored whole up to this:
 * the walkthrough's all-families fine-grid brief has 10,250 members, so the cap is twice that. It
 * stays as a bound on what one sweep can write (a pathological brief, say a 0.1 mm width step, could
 * have a front of hundreds of thousands of shapes); when it cuts, the sweep's stored counts keep the
 * front's full size (counts.front) and the page says that only the lightest part was stored.
 */
export const STORED_FRONT_CAP = 20_000;

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
export async function enqueueSweep(input: EnqueueInput): Promise<{ id: number; created: boolean; status: SweepStatus }> {
  const parsed = searchProblemSchema.safeParse(input.problem);
  if (!parsed.success) {
    const errors = Object.fromEntries(Object.entries(fieldErrorsFrom(parsed.error)).map(([k, v]) => [`problem.${k}`, v]));
    throw jsonError(400, `problem is invalid: ${Object.values(errors)[0] ?? "see errors"}`, { errors });
  }
  // The brief's cost, estimated before it takes a place in the queue (sweep-budget.ts).
  const tooBig = gridCostProblem(parsed.data);
  if (tooBig) throw jsonError(400, `problem is too large to run: ${tooBig}`, { errors: { "problem.grid": tooBig } });
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
      const prior = await trx("sweeps").where({ owner_id: input.ownerId, idempotency_key: key }).first("id", "status", "problem", "brief_id", "project_id", "recheck_of");
      if (prior) {
        const same =
          JSON.stringify(parseJson(prior.problem)) === problemJson &&
          (prior.brief_id ?? null) === (input.briefId ?? null) &&
          (prior.project_id ?? null) === (input.projectId ?? null) &&
          (prior.recheck_of ?? null) === (input.recheckOf ?? null);
        if (!same) throw jsonError(409, `Idempotency-Key "${key}" was already used for sweep ${prior.id} with a different request`);
        // a replay answers with the sweep as it is now (it may have run since the first request)
        return { id: Number(prior.id), created: false, status: prior.status as SweepStatus };
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
    return { id: Number(id), created: true, status: "queued" as SweepStatus };
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
 * died or stalled), then queued ones in fair order (fairQueued). One short READ COMMITTED
 * transaction with FOR UPDATE SKIP LOCKED, so competing workers never wait on or take each other's
 * rows. A claim over max_attempts fails the sweep; a sweep whose cancel was requested is
 * cancelled, not run. Every claim stamps claimed_at, which the fair order reads.
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
      const queued = await fairQueued(trx, limit - expired.length);
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
             heartbeat_at = NOW(3), attempts = attempts + 1, started_at = COALESCE(started_at, NOW(3)), claimed_at = NOW(3), updated_at = NOW()
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

const CLAIM_COLUMNS = "id, team_id, owner_id, attempts, max_attempts, cancel_requested, lease_owner, problem";

/**
 * Up to n queued sweeps, locked, in fair order: round-robin over the teams with work waiting,
 * the team served least recently first (never served before all others); inside a team, the
 * owner served least recently; for that owner, their oldest sweep. "Served" is the latest
 * claimed_at of the team's (owner's) sweeps, so a team that just had a sweep claimed goes to the
 * back of the line, whatever it queued and whenever.
 *
 * Two steps so the locks stay on the rows claimed: a plain read of each team/owner's oldest
 * queued sweeps with their served times, the order worked out here, then FOR UPDATE SKIP LOCKED
 * on those ids only, as many as still needed at a time (a filesort under FOR UPDATE would lock
 * every queued row and make competing workers skip them all). A row another worker holds is
 * skipped; the next in order follows.
 */
async function fairQueued(trx: Knex.Transaction, n: number): Promise<ClaimRow[]> {
  if (n <= 0) return [];
  const [rows] = (await trx.raw(
    `SELECT q.id, q.team_id, q.owner_id,
            (SELECT MAX(t.claimed_at) FROM sweeps t WHERE t.team_id = q.team_id) AS team_served,
            (SELECT MAX(o.claimed_at) FROM sweeps o WHERE o.owner_id = q.owner_id) AS owner_served
       FROM (SELECT id, team_id, owner_id, ROW_NUMBER() OVER (PARTITION BY team_id, owner_id ORDER BY id) AS k
               FROM sweeps WHERE status = 'queued') q
      WHERE q.k <= ?`,
    [2 * n],
  )) as [{ id: number; team_id: number; owner_id: number; team_served: Date | null; owner_served: Date | null }[]];
  if (rows.length === 0) return [];
  const order = fairOrder(
    rows.map((r) => ({ id: Number(r.id), team: r.team_id, owner: r.owner_id, teamServed: r.team_served ? new Date(r.team_served).getTime() : -Infinity, ownerServed: r.owner_served ? new Date(r.owner_served).getTime() : -Infinity })),
    2 * n,
  );
  // Lock no more than still needed at each step: a locked row this claim does not take would stay
  // locked until the commit, and a competing worker would skip it for nothing.
  const out: ClaimRow[] = [];
  for (let at = 0; out.length < n && at < order.length; ) {
    const ids = order.slice(at, at + (n - out.length));
    at += ids.length;
    const [locked] = (await trx.raw(`SELECT ${CLAIM_COLUMNS} FROM sweeps WHERE id IN (${ids.map(() => "?").join(",")}) AND status = 'queued' FOR UPDATE SKIP LOCKED`, ids)) as [ClaimRow[]];
    const byId = new Map(locked.map((r) => [Number(r.id), r]));
    for (const id of ids) if (byId.has(id)) out.push(byId.get(id)!);
  }
  return out;
}

export interface FairCandidate {
  id: number;
  team: number;
  owner: number;
  /** when the team / owner was last served (ms; −Infinity: never) */
  teamServed: number;
  ownerServed: number;
}

/** The round-robin order of fairQueued, worked out on plain values (exported for its unit test). */
export function fairOrder(list: FairCandidate[], n: number): number[] {
  const teamServed = new Map<number, number>(),
    ownerServed = new Map<number, number>();
  const waiting = new Map<number, Map<number, number[]>>(); // team → owner → ids, oldest first
  for (const c of [...list].sort((a, b) => a.id - b.id)) {
    teamServed.set(c.team, c.teamServed);
    ownerServed.set(c.owner, c.ownerServed);
    const owners = waiting.get(c.team) ?? new Map<number, number[]>();
    waiting.set(c.team, owners);
    owners.set(c.owner, [...(owners.get(c.owner) ?? []), c.id]);
  }
  const out: number[] = [];
  // a logical clock past every real time: each pick serves its team and owner "now"
  let now = Math.max(0, ...[...teamServed.values(), ...ownerServed.values()].filter(Number.isFinite)) + 1;
  const oldest = (owners: Map<number, number[]>) => Math.min(...[...owners.values()].map((ids) => ids[0]));
  while (out.length < n && waiting.size > 0) {
    let team = -1;
    for (const [t, owners] of waiting)
      if (team < 0 || teamServed.get(t)! < teamServed.get(team)! || (teamServed.get(t) === teamServed.get(team) && oldest(owners) < oldest(waiting.get(team)!))) team = t;
    const owners = waiting.get(team)!;
    let owner = -1;
    for (const [o, ids] of owners)
      if (owner < 0 || ownerServed.get(o)! < ownerServed.get(owner)! || (ownerServed.get(o) === ownerServed.get(owner) && ids[0] < owners.get(owner)![0])) owner = o;
    const ids = owners.get(owner)!;
    out.push(ids.shift()!);
    if (ids.length === 0) owners.delete(owner);
    if (owners.size === 0) waiting.delete(team);
    teamServed.set(team, now);
    ownerServed.set(owner, now);
    now++;
  }
  return out;
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

/** progress_families_done, progress_families_total, progress_evaluated (null where the search gave none) */
function detailColumns(p: SweepProgress): [number | null, number | null, number | null] {
  const d = p.detail;
  const n = (x: number | undefined) => (x === undefined || !Number.isFinite(x) ? null : Math.max(0, Math.round(x)));
  return [n(d?.familiesDone), n(d?.familiesTotal), n(d?.evaluated)];
}

/** Extends the lease and records progress; false when the lease is no longer this claim's. */
export async function heartbeat(claim: Pick<Claim, "id" | "token">, progress?: SweepProgress): Promise<boolean> {
  const { leaseMs } = queueSettings();
  const sets = progress ? ", progress_done = ?, progress_total = ?, progress_unit = ?, progress_families_done = ?, progress_families_total = ?, progress_evaluated = ?" : "";
  const params: (string | number | null)[] = [leaseMs * 1000];
  if (progress) params.push(Math.max(0, Math.round(progress.done)), Math.max(0, Math.round(progress.total)), progress.unit ?? null, ...detailColumns(progress));
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
 * Each family's lightest feasible section at every depth, as a sweep stores them: the grid-front
 * search's context points, proven in the same pass as the front (search.ts (D)), whatever the grid's
 * size; a result without them (a search stopped at its budget, whose context is not proven, or one
 * run for the best alone) stores what depthBests found, if anything was run.
 */
export function storedDepthBests(result: SweepResult): SearchPoint[] {
  if (result.depthBests) return result.depthBests;
  return result.frontScope === "grid" && !result.stoppedEarly ? (result.context ?? []) : [];
}

/**
 * Whether a sweep keeps its per-depth bests (sweeps.depth_bests, read by the sweep page's depth
 * control), and why not. Not kept past MAX_DEPTH_BEST_DEPTHS depths (what one sweep may store).
 */
export function depthBestsInfo(problem: SearchProblem, result: SweepResult): DepthBestsInfo {
  const depths = axisCount(problem.depth);
  const none = (reason: string): DepthBestsInfo => ({ state: "none", depths, reason });
  if (depths > MAX_DEPTH_BEST_DEPTHS)
    return none(
      `The grid has ${depths.toLocaleString("en")} depths; each family's lightest at every depth is kept for grids of up to ${MAX_DEPTH_BEST_DEPTHS.toLocaleString("en")} depths. A coarser depth step keeps them.`,
    );
  if (result.depthBests || (result.frontScope === "grid" && !result.stoppedEarly)) return { state: "complete", depths, reason: null };
  if (result.stoppedEarly) return none("The search stopped at the sweep's time budget, before it had proven each family's lightest at every depth (they are proven in the same pass as the whole grid's front).");
  return none("The search looked for the best section alone, without proving each family's lightest at every depth.");
}

/**
 * Which candidates a sweep stores (the search returns no more than these): the front (the
 * contract's front is over the feasible candidates the search evaluated, so a best-first search
 * reports a subset of the exhaustive front), every family's best, and the overall best; duplicates
 * (a family best on the front) are stored once. Ranked by the objective (area, or cost), then
 * utilisation, with the overall best always rank 1. The front is capped at STORED_FRONT_CAP rows
 * (lightest first) so one pathological sweep cannot write an unbounded number of rows.
 */
export function candidatesToStore(result: SweepResult, objective: "mass" | "cost", problem?: SearchProblem) {
  // One row per section: a shape two families describe (a mono-symmetric I with equal flanges and
  // the I) is the same welded section (geometryKey: the same plates), kept once under the family
  // the problem lists first, with every flag any of its finders earned.
  const order = (f: string) => {
    const i = problem?.families.indexOf(f as never) ?? -1;
    return i < 0 ? Number.MAX_SAFE_INTEGER : i;
  };
  // Each point's key and sort figures are worked out once: the walkthrough's fine-grid brief stores
  // about 11,700 rows, and worked out inside the sort's comparisons (two keys each) they were most of
  // the half second this took (tests/bench/click-to-chart.bench.ts).
  const keys = new Map<SearchPoint, string>();
  const keyOf = (c: SearchPoint) => {
    let k = keys.get(c);
    if (k === undefined) keys.set(c, (k = geometryKey(c.family, c.dimensions) ?? `${c.family}|${JSON.stringify(c.dimensions)}`));
    return k;
  };
  const familyBest = new Set<string>();
  for (const c of Object.values(result.bestByFamily)) if (c) familyBest.add(keyOf(c));
  const frontKept = result.front.length > STORED_FRONT_CAP ? result.front.slice(0, STORED_FRONT_CAP) : result.front;
  const front = new Set(frontKept.map(keyOf));
  const perDepth = problem && depthBestsInfo(problem, result).state === "none" ? [] : storedDepthBests(result);
  // for each section, the families whose lightest at its depth it is (more than one when two
  // families found the same section), so a filter by either family still finds it
  const depthBestFor = new Map<string, Set<string>>();
  for (const c of perDepth) {
    const k = keyOf(c);
    if (!depthBestFor.has(k)) depthBestFor.set(k, new Set());
    depthBestFor.get(k)!.add(c.family);
  }
  const all = new Map<string, { c: SearchPoint; order: number }>();
  const take = (c: SearchPoint | null | undefined) => {
    if (!c) return;
    const k = keyOf(c);
    const had = all.get(k);
    const o = order(c.family);
    // (a replaced row's design figures are worked out again from its own family by storedDesign)
    if (!had || o < had.order) all.set(k, { c, order: o });
  };
  take(result.best);
  for (const c of frontKept) take(c);
  for (const c of Object.values(result.bestByFamily)) take(c);
  for (const c of perDepth) take(c);
  const bestKey = result.best ? keyOf(result.best) : null;
  const obj = (c: SearchPoint) => (objective === "cost" && c.cost !== undefined ? c.cost : c.area);
  const list = [...all].map(([k, { c, order }]) => ({ k, c, order, obj: obj(c) }));
  list.sort((a, b) => {
    if (bestKey && a.k === bestKey) return -1;
    if (bestKey && b.k === bestKey) return 1;
    return a.obj - b.obj || a.c.area - b.c.area || a.c.utilisation - b.c.utilisation || a.order - b.order;
  });
  const code = problem && isCodeBasis(problem.basis);
  return list.map(({ k, c }, i) => {
    const depthFor = depthBestFor.get(k);
    return {
      rank: i + 1,
      family: c.family,
      dimensions: JSON.stringify(c.dimensions),
      area: c.area,
      mass_per_metre: c.massPerMetre,
      cost: c.cost ?? null,
      utilisation: c.utilisation,
      governing: c.governing,
      on_front: front.has(k),
      family_best: familyBest.has(k),
      depth_best: depthFor !== undefined,
      depth_best_for: depthFor ? [...depthFor].sort((a, b) => order(a) - order(b)).join(",") : null,
      // the code bases' figures (EN 1993 or AISC 360); the allowable basis has none
      design: code ? storedDesign(c, problem) : null,
    };
  });
}

/**
 * A code basis row's design figures (lib/design-summary.ts: EN 1993 or AISC 360), stored so no page view re-runs the
 * checks. The best and family bests carry the search's design block; front points are light, so
 * theirs comes from candidateChecks, the evaluation the search itself ran (≈ 50 µs each, once per
 * sweep, before the results transaction).
 */
function storedDesign(c: SearchPoint & { design?: SearchCandidate["design"]; aisc?: SearchCandidate["aisc"]; checks?: SearchCandidate["checks"] }, problem: SearchProblem): string | null {
  try {
    const row = (c.design || c.aisc) && c.checks ? designRow({ design: c.design, aisc: c.aisc, checks: c.checks, governing: c.governing }) : designRow(candidateChecks(c.family, c.dimensions, problem));
    return row ? JSON.stringify(row) : null;
  } catch {
    return null;
  }
}

/**
 * Final writes run READ COMMITTED: under the default REPEATABLE READ the DELETE of a sweep's
 * (usually absent) earlier candidates takes a gap lock on the (sweep_id, rank) index, and two
 * workers finishing neighbouring sweeps then deadlock on each other's gap when they insert. The
 * sweep row lock (FOR UPDATE) still serialises attempts on one sweep, and the unique key still
 * refuses a duplicate.
 */
const FINAL_WRITE = { isolationLevel: "read committed" } as const;

/**
 * Writes results and the final status in one transaction if the claim still holds the lease;
 * false if lost. The status is "succeeded", or "timed_out" when the search stopped at the time
 * budget (result.stoppedEarly; budgetMs says how long that was): its best is kept but never
 * called the lightest, and its reason carries advice that narrows the grid.
 */
export async function finishSweep(
  claim: Claim,
  result: SweepResult & { advice?: WhatItWouldTake | null },
  budgetMs = 0,
  progress?: SweepProgress,
): Promise<boolean> {
  // the brief's catalogue sections ranked after the plate candidates (catalogue-sweep.ts)
  const rows = withRolledRows(candidatesToStore(result, claim.problem.objective, claim.problem), result, claim.problem);
  const catalogue = catalogueSummary(result, claim.problem);
  const timedOut = result.stoppedEarly === true;
  const reason = timedOut ? timedOutReason(claim.problem, result.best, budgetMs) : (result.reason ?? null);
  const notice = await db.transaction(async (trx) => {
    const held = await lockHeld(trx, claim);
    if (!held) return null;
    await trx("candidates").where({ sweep_id: claim.id }).delete();
    for (let i = 0; i < rows.length; i += 500)
      await trx("candidates").insert(rows.slice(i, i + 500).map((r) => ({ ...r, sweep_id: claim.id, attempt: claim.attempt })));
    const b = result.best;
    const words = b
      ? `${b.family} ${Object.entries(b.dimensions)
          .map(([k, v]) => `${k} ${v}`)
          .join(", ")} mm, ${b.massPerMetre.toFixed(1)} kg/m, utilisation ${b.utilisation.toFixed(3)} (${b.governing}).`
      : null;
    const summary = timedOut
      ? `${words ? `Best found so far (not proven lightest): ${words} ` : ""}${reason}`
      : words
        ? `Best: ${words}`
        : `No feasible section: ${result.reason ?? "every candidate failed a check"}`;
    await trx("sweeps")
      .where({ id: claim.id })
      .update(
        endColumns(trx, timedOut ? "timed_out" : "succeeded", {
          // the front's full size beside the grid's counts (the page says when STORED_FRONT_CAP cut it)
          counts: JSON.stringify({ ...result.counts, front: result.front.length }),
          best: result.best ? JSON.stringify(result.best) : null,
          reason,
          restraint_study: result.restraintStudy ? JSON.stringify(result.restraintStudy) : null,
          depth_bests: JSON.stringify(depthBestsInfo(claim.problem, result)),
          advice: result.advice ? JSON.stringify(result.advice) : null,
          catalogue_result: catalogue ? JSON.stringify(catalogue) : null,
          // the search's last report (a short sweep ends before any heartbeat wrote one); a stopped
          // search did not finish its families, so its progress stays where it stopped
          ...(progress
            ? {
                progress_done: timedOut ? progress.done : progress.total,
                progress_total: progress.total,
                progress_unit: progress.unit ?? null,
                ...(() => {
                  const [familiesDone, familiesTotal, evaluated] = detailColumns(progress);
                  // a finished search has searched every family, whatever its last report said
                  return { progress_families_done: timedOut ? familiesDone : familiesTotal, progress_families_total: familiesTotal, progress_evaluated: result.counts?.evaluated ?? evaluated };
                })(),
              }
            : timedOut
              ? {}
              : { progress_done: trx.raw("GREATEST(progress_total, 1)"), progress_total: trx.raw("GREATEST(progress_total, 1)") }),
          finished_by: claim.workerId.slice(0, 100),
          finished_attempt: claim.attempt,
          error: null,
        }),
      );
    const n: EndedNotice = { id: claim.id, teamId: held.team_id, ownerId: held.owner_id, status: timedOut ? "timed_out" : "succeeded", summary };
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
  timed_out: "stopped at its time budget",
};

function sweepLink(id: number): string {
  return `/sweeps/${id}`;
}

/**
 * The owner's e-mail (outbox) and in-app notice, written inside the transaction that ends the
 * sweep, so both exist exactly when the final status does: a retried or fenced-off attempt never
 * sends a second pair, and a crash before the commit sends none.
 */
async function announceEnd(n: EndedNotice, trx: Knex.Transaction): Promise<void> {
  const owner = await trx("users").where({ id: n.ownerId }).first("email", "name", "disabled_at");
  if (!owner || owner.disabled_at) return;
  // named as its page names it: its number and project; a sweep outside any project (the API) by its id
  const place = await trx("sweeps as s").join("projects as p", "p.id", "s.project_id").where("s.id", n.id).first("p.name");
  const no = sweepNo(await projectNumbers({ sweeps: [n.id] }, trx), n.id);
  const title = place ? `Sweep ${no} in ${place.name} ${STATUS_WORDS[n.status]}` : `Sweep ${n.id} ${STATUS_WORDS[n.status]}`;
  await sendEmail(
    { teamId: n.teamId, to: owner.email, subject: title, text: `Hello ${owner.name},\n\n${title}. ${n.summary}\n\nOpen it: ${appUrl(sweepLink(n.id))}\n\n— Sparwise` },
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
  /**
   * done of total, and what they count, in words ("shapes settled …"); null before the search
   * reports. families: searched to the end, of how many; evaluated: candidates evaluated so far
   * (both null until the search reports them).
   */
  progress: { done: number; total: number; fraction: number; counts: string | null; families: { done: number; total: number } | null; evaluated: number | null };
  /**
   * false when the sweep stopped at its time budget (timed_out): `best` is then the lightest
   * found so far, not proven lightest; true when the whole grid was searched; null before it ends.
   */
  provenLightest: boolean | null;
  /** the search's counts; front: the front's members (stored up to STORED_FRONT_CAP), absent on sweeps stored before it */
  counts: (SearchResult["counts"] & { front?: number }) | null;
  best: SearchCandidate | null;
  /** EN 1993 sweeps with a restraint length: the lightest section at L … L/6 */
  restraintStudy: RestraintStudy | null;
  /** whether each family's lightest at every depth was kept; null for sweeps stored before this was recorded */
  depthBests: DepthBestsInfo | null;
  /** the brief searched catalogues: lightest and cheapest welded and rolled, counts, sections left out */
  catalogueResult: CatalogueSummary | null;
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

const ETA_MIN_ELAPSED_MS = 1000;
const ETA_MIN_FRACTION = 0.01;

const PROGRESS_WORDS: Record<ProgressUnit, string> = {
  shapes: "shapes settled (evaluated, or proven unable to change the answer)",
};

/** What a stored progress_unit counts, in words; null for sweeps stored without one. */
export function progressCountsWords(unit: unknown): string | null {
  return PROGRESS_WORDS[unit as ProgressUnit] ?? null;
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
  const fraction = WITH_RESULTS.has(row.status) ? 1 : total > 0 ? Math.min(1, done / total) : 0;
  const elapsedMs = row.elapsed_ms === null || row.elapsed_ms === undefined ? null : Number(row.elapsed_ms);
  // An estimate only once there is something to go by: a second of searching and 1 % of the grid
  // settled (before that, the rate is mostly start-up and the guess would swing wildly).
  const etaMs =
    row.status === "running" && elapsedMs !== null && elapsedMs >= ETA_MIN_ELAPSED_MS && fraction >= ETA_MIN_FRACTION && fraction < 1
      ? Math.round((elapsedMs * (1 - fraction)) / fraction)
      : null;
  const famTotal = row.progress_families_total === null || row.progress_families_total === undefined ? null : Number(row.progress_families_total);
  return {
    id: row.id,
    teamId: row.team_id,
    projectId: row.project_id,
    briefId: row.brief_id,
    recheckOf: row.recheck_of,
    ownerId: row.owner_id,
    status: row.status,
    cancelRequested: !!row.cancel_requested,
    progress: {
      done,
      total,
      fraction,
      counts: progressCountsWords(row.progress_unit),
      families: famTotal !== null && famTotal > 0 ? { done: Math.min(famTotal, Number(row.progress_families_done ?? 0)), total: famTotal } : null,
      evaluated: row.progress_evaluated === null || row.progress_evaluated === undefined ? null : Number(row.progress_evaluated),
    },
    provenLightest: row.status === "succeeded" ? true : row.status === "timed_out" ? false : null,
    counts: row.counts ? parseJson(row.counts) : null,
    best: row.best ? parseJson(row.best) : null,
    restraintStudy: row.restraint_study ? parseJson(row.restraint_study) : null,
    depthBests: row.depth_bests ? parseJson(row.depth_bests) : null,
    catalogueResult: row.catalogue_result ? parseJson(row.catalogue_result) : null,
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

export const CANDIDATE_SORTS = [
  "rank",
  "-rank",
  "area",
  "-area",
  "mass",
  "-mass",
  "utilisation",
  "-utilisation",
  "cost",
  "-cost",
  "family",
  "-family",
  "governing",
  "-governing",
] as const;
export const candidatesQuerySchema = z
  .object({
    page: z.coerce.number({ error: "page must be a whole number ≥ 1" }).int({ message: "page must be a whole number ≥ 1" }).min(1, { message: "page must be a whole number ≥ 1" }).max(100_000).default(1),
    pageSize: z.coerce.number({ error: "pageSize must be a whole number" }).int({ message: "pageSize must be a whole number" }).min(1, { message: "pageSize must be 1 to 500" }).max(500, { message: "pageSize must be 1 to 500" }).default(50),
    sort: z.enum(CANDIDATE_SORTS, { error: `sort must be one of ${CANDIDATE_SORTS.join(", ")}` }).default("rank"),
    family: depthFamilyQueryFields.family,
    frontOnly: z
      .enum(["true", "false", "1", "0"], { error: "frontOnly must be true or false" })
      .optional()
      .transform((v) => v === "true" || v === "1"),
    /** only sections of this depth d (mm): with the stored depth bests, each family's lightest there */
    depth: depthFamilyQueryFields.depth,
    /** only each family's lightest at its depth (the chart's context points) */
    depthBest: z
      .enum(["true", "false", "1", "0"], { error: "depthBest must be true or false" })
      .optional()
      .transform((v) => v === "true" || v === "1"),
    /** only sections at least / at most this deep (mm, both ends included): the chart's depth filter */
    depthMin: z.coerce.number({ error: "depthMin must be a number of mm" }).min(0, { message: "depthMin must be 0 mm or more" }).max(100_000, { message: "depthMin: at most 100000 mm" }).optional(),
    depthMax: z.coerce.number({ error: "depthMax must be a number of mm" }).min(0, { message: "depthMax must be 0 mm or more" }).max(100_000, { message: "depthMax: at most 100000 mm" }).optional(),
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
  /** its family's lightest feasible section at its depth (issue 11, item 9) */
  depthBest: boolean;
  /** EN 1993 and AISC 360 sweeps: the design figures stored with the row (null under the allowable basis) */
  design: DesignRow | null;
  /** "rolled": a catalogue section (its designation and catalogue below); "plate": welded from plate */
  source: "plate" | "rolled";
  designation: string | null;
  catalogue: string | null;
  /** objective "cost": the material and fabrication parts of `cost` */
  costMaterial: number | null;
  costFabrication: number | null;
}

export async function listCandidates(
  sweepId: number,
  q: Partial<CandidatesQuery> = {},
): Promise<{ total: number; page: number; pageSize: number; items: CandidateRow[] }> {
  const page = q.page ?? 1,
    pageSize = q.pageSize ?? 50,
    sort = q.sort ?? "rank";
  const base = db("candidates").where({ sweep_id: sweepId });
  // Each family's lightest at a depth: a section two families found is stored once, under the
  // family listed first, and depth_best_for names both, so either family finds it.
  if (q.family && q.depthBest) base.andWhereRaw("FIND_IN_SET(?, COALESCE(depth_best_for, family)) > 0", [q.family]);
  else if (q.family) base.andWhere({ family: q.family });
  if (q.frontOnly) base.andWhere({ on_front: true });
  // grid depths are exact sums of steps; the tolerance only absorbs their float noise
  if (q.depth !== undefined) base.andWhereRaw("ABS(JSON_VALUE(dimensions, '$.d') - ?) < 1e-6", [q.depth]);
  if (q.depthBest) base.andWhere({ depth_best: true });
  if (q.depthMin !== undefined) base.andWhereRaw("JSON_VALUE(dimensions, '$.d') >= ? - 1e-6", [q.depthMin]);
  if (q.depthMax !== undefined) base.andWhereRaw("JSON_VALUE(dimensions, '$.d') <= ? + 1e-6", [q.depthMax]);
  const [{ n }] = await base.clone().count({ n: "*" });
  const desc = sort.startsWith("-");
  const col = { rank: "rank", area: "area", mass: "mass_per_metre", utilisation: "utilisation", cost: "cost", family: "family", governing: "governing" }[sort.replace(/^-/, "") as "rank"];
  const rows = await base
    .clone()
    .orderBy([
      { column: col, order: desc ? "desc" : "asc" },
      { column: "rank", order: "asc" },
    ])
    .limit(pageSize)
    .offset((page - 1) * pageSize)
    .select("rank", "family", "dimensions", "area", "mass_per_metre", "cost", "utilisation", "governing", "on_front", "family_best", "depth_best", "design", "source", "designation", "catalogue", "cost_material", "cost_fabrication");
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
      depthBest: !!r.depth_best,
      design: r.design ? parseJson<DesignRow>(r.design) : null,
      source: r.source === "rolled" ? "rolled" : "plate",
      designation: r.designation ?? null,
      catalogue: r.catalogue ?? null,
      costMaterial: r.cost_material ?? null,
      costFabrication: r.cost_fabrication ?? null,
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
  const byStatus: Record<SweepStatus, number> = { queued: 0, running: 0, succeeded: 0, failed: 0, cancelled: 0, timed_out: 0 };
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

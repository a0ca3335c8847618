import { createHash } from "node:crypto";
import { isIP } from "node:net";
import { RateLimiterMySQL, RateLimiterRes } from "rate-limiter-flexible";
import type { AppLoadContext } from "react-router";
import { db, getDb } from "~/lib/db.server";

// Sign-in throttling. Failures are counted per account+address pair and per address in MariaDB
// (table signin_throttle, migration 20261203_0300), so the count holds across app processes
// and restarts. Past a few free failures each further attempt holds the next one back for a
// delay that doubles up to a cap: a guesser slows to a crawl while the real owner, signing in
// from their own address, is never held by someone else's guesses. There is deliberately no
// account-wide count: that is what let anyone lock the real admin out. Guessing one account
// from many addresses is bounded per address and by bcrypt's cost.
export const PAIR_FREE_FAILURES = Number(process.env.SIGNIN_ACCOUNT_FAILURES ?? 5);
export const ADDRESS_FREE_FAILURES = Number(process.env.SIGNIN_ADDRESS_FAILURES ?? 20);
export const FIRST_DELAY_MS = 1000;
export const MAX_DELAY_MS = Number(process.env.SIGNIN_MAX_DELAY_S ?? 900) * 1000;
/** A pair or address quiet for this long starts again from no failures. */
export const MEMORY_MS = 60 * 60 * 1000;

// Reset e-mails per address and per client per hour: enough for a real user, too few to flood a mailbox.
export const RESET_MAILS_PER_ADDRESS = 3;
export const RESET_MAILS_PER_CLIENT = 20;

let limiters: { resetTo: RateLimiterMySQL; resetFrom: RateLimiterMySQL; dbName: string } | undefined;

function getLimiters() {
  const dbName = String((getDb().client.config.connection as { database?: string }).database ?? "sparwise");
  if (!limiters || limiters.dbName !== dbName) {
    const common = { storeClient: db, storeType: "knex", dbName, tableName: "login_limits", tableCreated: true, duration: 3600 };
    limiters = {
      dbName,
      resetTo: new RateLimiterMySQL({ ...common, keyPrefix: "rsto", points: RESET_MAILS_PER_ADDRESS }),
      resetFrom: new RateLimiterMySQL({ ...common, keyPrefix: "rsfr", points: RESET_MAILS_PER_CLIENT }),
    };
  }
  return limiters;
}

// Keys stay short and carry no address in clear text.
const key = (value: string) => createHash("sha256").update(value).digest("hex");

/**
 * The bucket an address counts in: IPv4 as is (an IPv4-mapped IPv6 address as its IPv4), IPv6 by
 * its /64, since one subscriber usually holds a whole /64 and could otherwise rotate through it.
 */
export function addressBucket(raw: string): string {
  const ip = raw.startsWith("::ffff:") && isIP(raw.slice(7)) === 4 ? raw.slice(7) : raw;
  if (isIP(ip) !== 6) return ip || "unknown";
  const [head, tail = ""] = ip.split("%")[0]!.split("::");
  const left = head ? head.split(":") : [];
  const right = tail ? tail.split(":") : [];
  const groups = ip.includes("::") ? [...left, ...Array(8 - left.length - right.length).fill("0"), ...right] : left;
  return `${groups.slice(0, 4).map((g) => parseInt(g, 16).toString(16)).join(":")}::/64`;
}

/**
 * The client's address bucket, as the server (server.ts) put it in the load context: the socket's
 * peer, or with TRUST_PROXY_HOPS set the X-Forwarded-For entry that many hops out. Never read
 * from a request header here: any client can write those. Without a load context (the Vite dev
 * server) every client shares the "unknown" bucket.
 */
export function clientAddress(context: AppLoadContext | Record<string, unknown> | null | undefined): string {
  const raw = (context as { clientAddress?: unknown } | null | undefined)?.clientAddress;
  return typeof raw === "string" && raw ? addressBucket(raw) : "unknown";
}

/** "Too many sign-in attempts; try again in N seconds." (minutes from 90 s on) for a wait of ms. */
export function tooManyMessage(ms: number): string {
  const s = Math.max(1, Math.ceil(ms / 1000));
  if (s < 90) return `Too many sign-in attempts; try again in ${s} second${s === 1 ? "" : "s"}.`;
  const n = Math.ceil(s / 60);
  return `Too many sign-in attempts; try again in ${n} minutes.`;
}

/** The hold after the n-th counted attempt: none within the free ones, then 1 s, 2 s, 4 s … up to the cap. */
export function throttleDelay(n: number, free: number): number {
  if (n <= free) return 0;
  return Math.min(FIRST_DELAY_MS * 2 ** Math.min(n - free - 1, 40), MAX_DELAY_MS);
}

const pairKey = (email: string, address: string) => `p:${key(`${email}\n${address}`)}`;
const addressKey = (address: string) => `a:${key(address)}`;

async function dbNow(trx: typeof db): Promise<number> {
  const [rows] = (await trx.raw("SELECT CAST(ROUND(UNIX_TIMESTAMP(NOW(3)) * 1000) AS UNSIGNED) AS now")) as [{ now: number | string }[]];
  return Number(rows[0]!.now);
}

interface ThrottleRow {
  key: string;
  failures: number;
  held_until: number | string;
  forget_at: number | string;
}

/** An attempt let through: which counts it went into, to hold the next one once it has failed. */
export interface SignInTicket {
  counted: { key: string; failures: number; free: number }[];
}

/**
 * Lets one sign-in attempt through (a ticket), or answers how long to wait (ms). An attempt let
 * through is counted as a failure at once and already holds the next one back, before the
 * password is even checked, so a burst of parallel guesses cannot slip in between check and
 * count (the rows are locked in key order for the decision). signInFailed restarts the hold
 * when the answer is known, so the delay runs between attempts however slow the check was;
 * signInSucceeded refunds the attempt. A refused attempt counts nothing.
 */
export async function beginSignIn(email: string, address: string): Promise<SignInTicket | { waitMs: number }> {
  const scopes = [
    { key: pairKey(email, address), free: PAIR_FREE_FAILURES },
    { key: addressKey(address), free: ADDRESS_FREE_FAILURES },
  ].sort((a, b) => (a.key < b.key ? -1 : 1));
  // The rows exist before the transaction locks them, so it takes record locks, never gap locks.
  await db.raw(`INSERT IGNORE INTO signin_throttle (\`key\`) VALUES ${scopes.map(() => "(?)").join(", ")}`, scopes.map((s) => s.key));
  const result = await db.transaction(async (trx): Promise<SignInTicket | { waitMs: number }> => {
    const rows = (await trx("signin_throttle")
      .whereIn("key", scopes.map((s) => s.key))
      .orderBy("key")
      .forUpdate()
      .select("key", "failures", "held_until", "forget_at")) as ThrottleRow[];
    const now = await dbNow(trx);
    const waitMs = Math.max(0, ...rows.map((r) => Number(r.held_until) - now));
    if (waitMs > 0) return { waitMs };
    const counted: SignInTicket["counted"] = [];
    for (const scope of scopes) {
      const row = rows.find((r) => r.key === scope.key);
      const failures = (row && Number(row.forget_at) > now ? Number(row.failures) : 0) + 1;
      await trx("signin_throttle")
        .where({ key: scope.key })
        .update({ failures, held_until: now + throttleDelay(failures, scope.free), forget_at: now + MEMORY_MS });
      counted.push({ ...scope, failures });
    }
    return { counted };
  });
  // Now and then, drop rows nobody has touched for the memory window.
  if (Math.random() < 0.02) {
    const stale = Date.now() - 60_000;
    await db("signin_throttle").where("forget_at", "<", stale).andWhere("held_until", "<", stale).limit(500).delete();
  }
  return result;
}

/** The wrong password: each count's hold runs from now. */
export async function signInFailed(ticket: SignInTicket): Promise<void> {
  for (const { key: k, failures, free } of ticket.counted) {
    const delay = throttleDelay(failures, free);
    if (delay === 0) continue;
    await db("signin_throttle")
      .where({ key: k })
      .update({ held_until: db.raw("GREATEST(held_until, CAST(ROUND(UNIX_TIMESTAMP(NOW(3)) * 1000) AS UNSIGNED) + ?)", [delay]) });
  }
}

/** The right password: the pair starts again from nothing; the address gets its attempt back. */
export async function signInSucceeded(email: string, address: string): Promise<void> {
  await db("signin_throttle").where({ key: pairKey(email, address) }).delete();
  // Assignments run left to right: the hold lifts when the refunded count is back within the free ones.
  await db("signin_throttle")
    .where({ key: addressKey(address) })
    .update({
      held_until: db.raw("IF(failures <= ?, 0, held_until)", [ADDRESS_FREE_FAILURES + 1]),
      failures: db.raw("IF(failures > 0, failures - 1, 0)"),
    });
}

/** Spends one reset e-mail for the address and the client; false when either is used up this hour. */
export async function resetMailAllowed(email: string, ip: string): Promise<boolean> {
  const { resetTo, resetFrom } = getLimiters();
  try {
    await resetFrom.consume(key(ip));
    await resetTo.consume(key(email));
    return true;
  } catch (e) {
    if (e instanceof RateLimiterRes) return false;
    throw e;
  }
}

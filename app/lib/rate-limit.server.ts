import { createHash } from "node:crypto";
import { RateLimiterMySQL, RateLimiterRes } from "rate-limiter-flexible";
import { db, getDb } from "~/lib/db.server";

// Failed sign-ins are counted per account and per client address in MariaDB (table
// login_limits, migration 20261201_0010), so the limit holds across app processes and restarts.
// Only failures count; a success clears the account's counter (not the address's).
export const ACCOUNT_FAILURES = Number(process.env.SIGNIN_ACCOUNT_FAILURES ?? 5);
export const ADDRESS_FAILURES = Number(process.env.SIGNIN_ADDRESS_FAILURES ?? 20);
export const WINDOW_SECONDS = 15 * 60;

// Reset e-mails per address and per client per hour: enough for a real user, too few to flood a mailbox.
export const RESET_MAILS_PER_ADDRESS = 3;
export const RESET_MAILS_PER_CLIENT = 20;

let limiters: { account: RateLimiterMySQL; address: RateLimiterMySQL; resetTo: RateLimiterMySQL; resetFrom: RateLimiterMySQL; dbName: string } | undefined;

function getLimiters() {
  const dbName = String((getDb().client.config.connection as { database?: string }).database ?? "sparwise");
  if (!limiters || limiters.dbName !== dbName) {
    const common = { storeClient: db, storeType: "knex", dbName, tableName: "login_limits", tableCreated: true, duration: WINDOW_SECONDS };
    limiters = {
      dbName,
      account: new RateLimiterMySQL({ ...common, keyPrefix: "acct", points: ACCOUNT_FAILURES }),
      address: new RateLimiterMySQL({ ...common, keyPrefix: "addr", points: ADDRESS_FAILURES }),
      resetTo: new RateLimiterMySQL({ ...common, keyPrefix: "rsto", points: RESET_MAILS_PER_ADDRESS, duration: 3600 }),
      resetFrom: new RateLimiterMySQL({ ...common, keyPrefix: "rsfr", points: RESET_MAILS_PER_CLIENT, duration: 3600 }),
    };
  }
  return limiters;
}

// Keys stay short and carry no address in clear text.
const key = (value: string) => createHash("sha256").update(value).digest("hex");

/**
 * The client's address from X-Forwarded-For, counted TRUST_PROXY_HOPS (default 1) entries from the
 * right: the entry our own proxy appended, which a client cannot forge (entries further left can be).
 * react-router-serve gives route code no socket address, so without a proxy every client shares
 * the "direct" bucket: the per-address limit then acts team-wide, and the per-account one still
 * applies to each account. Put a proxy that sets X-Forwarded-For in front of a public deployment.
 */
export function clientAddress(request: Request): string {
  const hops = Math.max(1, Number(process.env.TRUST_PROXY_HOPS ?? 1) || 1);
  const chain = (request.headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  return chain[chain.length - hops] ?? chain[0] ?? "direct";
}

/** "Too many sign-in attempts; try again in N minutes." for a wait of ms. */
export function tooManyMessage(ms: number): string {
  const n = Math.max(1, Math.ceil(ms / 60_000));
  return `Too many sign-in attempts; try again in ${n} minute${n === 1 ? "" : "s"}.`;
}

/** Milliseconds until the next attempt is allowed: 0 when neither counter is spent. */
export async function signInWait(email: string, ip: string): Promise<number> {
  const { account, address } = getLimiters();
  const [a, b] = await Promise.all([account.get(key(email)), address.get(key(ip))]);
  const blocked = [
    a && a.consumedPoints >= ACCOUNT_FAILURES ? a.msBeforeNext : 0,
    b && b.consumedPoints >= ADDRESS_FAILURES ? b.msBeforeNext : 0,
  ];
  return Math.max(...blocked);
}

export async function recordSignInFailure(email: string, ip: string): Promise<void> {
  const { account, address } = getLimiters();
  await Promise.all(
    [account.consume(key(email)), address.consume(key(ip))].map((p) =>
      p.catch((e: unknown) => {
        // Spending the last point rejects with RateLimiterRes: that is the count doing its job.
        if (!(e instanceof RateLimiterRes)) throw e;
      }),
    ),
  );
}

export async function recordSignInSuccess(email: string, _ip: string): Promise<void> {
  await getLimiters().account.delete(key(email));
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

// Per-user limit on the JSON API (issue 9): every authenticated API request spends points from the
// user's bucket (cookie session and API tokens alike, so more tokens buy no more requests); an
// empty bucket answers 429 with Retry-After. Kept in MariaDB (table login_limits, the store the
// sign-in limits use) so the limit holds across app processes; once a bucket is empty the limiter
// also remembers that in memory until the window ends, so a flood costs no database write per
// request.
import { RateLimiterMySQL, RateLimiterRes } from "rate-limiter-flexible";
import { db, getDb } from "~/lib/db.server";

export const API_WINDOW_SECONDS = 60;

/**
 * Points per user per minute (SPARWISE_API_POINTS_PER_MINUTE, default 600). A request costs 1; the
 * one endpoint that runs the engine on demand (POST /api/v1/properties) costs API_ENGINE_COST,
 * so one user gets at most 150 sections a minute, about ten seconds of the engine thread at the
 * worst section the caps allow. The sweep page polls its sweep four times a second for its first 5 s, then once a second: 60 a minute (sweep-poll.ts).
 */
export function apiPointsPerMinute(): number {
  const v = Number(process.env.SPARWISE_API_POINTS_PER_MINUTE);
  return Number.isInteger(v) && v >= 1 ? v : 600;
}
export const API_ENGINE_COST = 4;

let limiter: { rl: RateLimiterMySQL; dbName: string; points: number } | undefined;

function getLimiter(): RateLimiterMySQL {
  const dbName = String((getDb().client.config.connection as { database?: string }).database ?? "sparwise");
  const points = apiPointsPerMinute();
  if (!limiter || limiter.dbName !== dbName || limiter.points !== points) {
    const rl = new RateLimiterMySQL({
      storeClient: db,
      storeType: "knex",
      dbName,
      tableName: "login_limits",
      tableCreated: true,
      keyPrefix: "api",
      points,
      duration: API_WINDOW_SECONDS,
      inMemoryBlockOnConsumed: points,
      inMemoryBlockDuration: 0,
    });
    limiter = { rl, dbName, points };
  }
  return limiter.rl;
}

/** Spends `cost` points of the user's minute; throws a 429 Response (with Retry-After) when they are spent. */
export async function spendApiPoints(userId: number, cost = 1): Promise<void> {
  try {
    await getLimiter().consume(String(userId), cost);
  } catch (e) {
    if (!(e instanceof RateLimiterRes)) throw e;
    const seconds = Math.max(1, Math.ceil(e.msBeforeNext / 1000));
    throw Response.json(
      { error: `Too many API requests: at most ${apiPointsPerMinute()} points a minute per user (this request costs ${cost}); try again in ${seconds} s.` },
      { status: 429, headers: { "Retry-After": String(seconds) } },
    );
  }
}

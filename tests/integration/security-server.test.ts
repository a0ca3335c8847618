// Server-level findings of the outside probe (issue 9), each as a test that failed on the code
// before the fix: sign-in throttling by account+address and by address (item 7), the cookie
// API's origin and content-type checks (item 11), draining oversized bodies (item 15) and the
// session cookie's Secure flag (item 16). Headers, the socket address and the start/stop
// scripts need the real HTTP server: tests/e2e/security-server.test.ts.
import { afterAll, afterEach, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { hashPassword, hashToken, newToken } from "~/lib/auth.server";
import { ADDRESS_FREE_FAILURES, PAIR_FREE_FAILURES } from "~/lib/rate-limit.server";
import { DRAIN_CAP, readForm, readJson } from "~/lib/forms.server";
import * as signIn from "~/routes/sign-in";
import * as sweepsApi from "~/routes/api.v1.sweeps";
import * as cancelApi from "~/routes/api.v1.sweeps.$id.cancel";
import * as propertiesApi from "~/routes/api.v1.properties";
import { BASE, callRoute, cookieFor, DEMO_EMAIL, DEMO_PASSWORD, FixtureContext, formPost, fromAddress, messageOf, tableCounts, type RouteResult } from "./fixtures";
import { workflowFixture, type WorkflowFixture } from "./workflow-fixtures";

const PASSWORD = "the right password";
const TEAM_SLUG = "secserver-fixture";
const created: string[] = [];

afterAll(async () => {
  await db("users").whereIn("email", created).delete();
  await db("teams").where({ slug: TEAM_SLUG }).delete();
  await closeDb();
});

async function makeUser(email: string): Promise<void> {
  created.push(email);
  let team = await db("teams").where({ slug: TEAM_SLUG }).first("id");
  if (!team) team = { id: (await db("teams").insert({ name: "Security fixture team", slug: TEAM_SLUG }))[0] };
  const [id] = await db("users").insert({ email, name: "Fixture Person", password_hash: await hashPassword(PASSWORD) });
  await db("memberships").insert({ team_id: team.id, user_id: id, role: "engineer" });
}

let seq = 0;
/** A fresh address per test (RFC 2544's benchmarking block: no other test file uses it), so no test's counts reach another's. */
const freshAddress = () => `198.18.0.${++seq}`;

async function attempt(email: string, password: string, address: string, headers: HeadersInit = {}): Promise<RouteResult> {
  return callRoute(signIn.action, fromAddress(await formPost(null, "/sign-in", { email, password }, headers), address));
}

/** What the clock would do: every hold ends now. */
const endHolds = () => db("signin_throttle").update({ held_until: 0 });

describe("sign-in throttling (item 7)", () => {
  test("a guesser elsewhere never locks the real owner out: the owner's own address signs in", async () => {
    const email = "owner-elsewhere@tallowfield.example";
    await makeUser(email);
    const attacker = freshAddress();
    // Well past the old hard lock of five, with the holds waited out.
    for (let i = 0; i < PAIR_FREE_FAILURES + 4; i++) {
      await endHolds();
      expect((await attempt(email, `guess ${i}`, attacker)).status).toBe(401);
    }
    const owner = await attempt(email, PASSWORD, freshAddress());
    expect(owner.status, messageOf(owner)).toBe(302);
  });

  test("past the free failures each attempt waits a doubling delay: 429 with Retry-After, even for the right password", async () => {
    const email = "doubling@tallowfield.example";
    await makeUser(email);
    const from = freshAddress();
    // Retry-After counts whole seconds up from what is left, so it may read one less on a slow machine.
    const retryAfter = (r: RouteResult) => Number(r.headers.get("retry-after"));
    for (let i = 0; i < PAIR_FREE_FAILURES; i++) expect((await attempt(email, "nope", from)).status).toBe(401);
    // The first one past the free ones is let through (and fails), then holds the next for 1 s …
    expect((await attempt(email, "nope", from)).status).toBe(401);
    let held = await attempt(email, PASSWORD, from);
    expect(held.status).toBe(429);
    expect(retryAfter(held)).toBe(1);
    expect(messageOf(held)).toMatch(/Too many sign-in attempts; try again in 1 second\./);
    // … then 2 s, then 4 s.
    await endHolds();
    expect((await attempt(email, "nope", from)).status).toBe(401);
    held = await attempt(email, PASSWORD, from);
    expect(retryAfter(held)).toBeGreaterThanOrEqual(1);
    expect(retryAfter(held)).toBeLessThanOrEqual(2);
    await endHolds();
    expect((await attempt(email, "nope", from)).status).toBe(401);
    held = await attempt(email, PASSWORD, from);
    expect(held.status).toBe(429);
    expect(retryAfter(held)).toBeGreaterThanOrEqual(3);
    expect(retryAfter(held)).toBeLessThanOrEqual(4);
    // Once the hold has passed, the right password signs in and the count starts again.
    await endHolds();
    expect((await attempt(email, PASSWORD, from)).status).toBe(302);
    for (let i = 0; i < PAIR_FREE_FAILURES; i++) expect((await attempt(email, "nope", from)).status).toBe(401);
  });

  test("a refused attempt is not counted: hammering during a hold does not lengthen it", async () => {
    const email = "hammer@tallowfield.example";
    await makeUser(email);
    const from = freshAddress();
    for (let i = 0; i <= PAIR_FREE_FAILURES; i++) await attempt(email, "nope", from);
    for (let i = 0; i < 5; i++) expect((await attempt(email, "nope", from)).status).toBe(429);
    await endHolds();
    expect((await attempt(email, "nope", from)).status).toBe(401);
    expect(Number((await attempt(email, "nope", from)).headers.get("retry-after"))).toBeLessThanOrEqual(2);
  });

  test("a burst of parallel guesses cannot slip past the count", async () => {
    const email = "burst@tallowfield.example";
    await makeUser(email);
    const from = freshAddress();
    // Deep enough into the count that the next hold (32 s) outlasts the whole burst.
    for (let i = 0; i < PAIR_FREE_FAILURES + 5; i++) {
      await endHolds();
      await attempt(email, "nope", from);
    }
    await endHolds();
    const results = await Promise.all(Array.from({ length: 20 }, (_, i) => attempt(email, `burst ${i}`, from)));
    expect(results.map((r) => r.status).sort()).toEqual([401, ...Array(19).fill(429)]);
  });

  test(`one address spraying many accounts is held after ${ADDRESS_FREE_FAILURES} failures; other addresses are not`, async () => {
    const from = freshAddress();
    for (let i = 0; i < ADDRESS_FREE_FAILURES + 1; i++) {
      expect((await attempt(`spray${i}@tallowfield.example`, "x", from)).status).toBe(401);
    }
    const held = await attempt(DEMO_EMAIL.admin, DEMO_PASSWORD, from);
    expect(held.status).toBe(429);
    expect(Number(held.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
    // The old code put every client without a proxy header in one bucket: everyone was locked out.
    expect((await attempt(DEMO_EMAIL.admin, DEMO_PASSWORD, freshAddress())).status).toBe(302);
  });

  test("a forged X-Forwarded-For buys no fresh bucket: only the server's address counts", async () => {
    const from = freshAddress();
    for (let i = 0; i < ADDRESS_FREE_FAILURES + 1; i++) {
      const r = await attempt(`forger${i}@tallowfield.example`, "x", from, { "X-Forwarded-For": `198.51.100.${i + 1}` });
      expect(r.status).toBe(401);
    }
    const held = await attempt("forger-last@tallowfield.example", "x", from, { "X-Forwarded-For": "198.51.100.250" });
    expect(held.status).toBe(429);
  });

  test("the right password refunds the address's count (a team behind one address is not held by its own sign-ins)", async () => {
    const from = freshAddress();
    for (let i = 0; i < ADDRESS_FREE_FAILURES * 2; i++) expect((await attempt(DEMO_EMAIL.viewer, DEMO_PASSWORD, from)).status).toBe(302);
  });
});

describe("the cookie-authenticated API refuses other sites (item 11)", () => {
  const ctx = new FixtureContext();
  let fx: WorkflowFixture;
  let token: string;
  beforeAll(async () => {
    fx = await workflowFixture(ctx);
    token = newToken("spw_");
    const engineer = await ctx.user("engineer");
    await db("api_tokens").insert({ user_id: engineer.id, team_id: engineer.teamId, name: "security test", token_hash: hashToken(token) });
  });

  // Sweeps these tests queue are removed afterwards: a queued sweep left behind would move the
  // demo team's queue figures (oldest wait) under other files' feet.
  const queued: number[] = [];
  afterAll(async () => {
    await db("sweeps").whereIn("id", queued).delete();
  });
  async function post(headers: Record<string, string>, body: string, route: unknown = sweepsApi.action, path = "/api/v1/sweeps", params = {}) {
    const res = await callRoute(route, new Request(new URL(path, BASE), { method: "POST", body, headers }), params);
    const id = (res.data as { id?: unknown } | undefined)?.id;
    if (res.status === 202 && typeof id === "number") queued.push(id);
    return res;
  }
  const sweepBody = () => JSON.stringify({ briefId: fx.briefId });

  test("text/plain from another Origin with the session cookie → 403, no sweep queued", async () => {
    const cookie = await cookieFor("engineer");
    const before = await tableCounts();
    const res = await post({ Cookie: cookie, "Content-Type": "text/plain", Origin: "https://evil.example" }, sweepBody());
    expect(res.status, messageOf(res)).toBe(403);
    expect(messageOf(res)).toMatch(/cross-origin/);
    expect(await tableCounts()).toEqual(before);
  });

  test.each([
    ["another Origin, JSON", 403, { "Content-Type": "application/json", Origin: "https://evil.example" }],
    ["a browser saying cross-site", 403, { "Content-Type": "application/json", "Sec-Fetch-Site": "cross-site", Origin: BASE }],
    ["a sibling subdomain (same-site)", 403, { "Content-Type": "application/json", "Sec-Fetch-Site": "same-site" }],
    ["no Origin at all", 403, { "Content-Type": "application/json" }],
    ["Origin null (sandboxed frame)", 403, { "Content-Type": "application/json", Origin: "null" }],
    ["our Origin but text/plain", 415, { "Content-Type": "text/plain", Origin: BASE }],
    ["our Origin but a form", 415, { "Content-Type": "application/x-www-form-urlencoded", Origin: BASE }],
  ])("cookie POST with %s → %i, nothing written", async (_label, status, headers) => {
    const cookie = await cookieFor("engineer");
    const before = await tableCounts();
    const res = await post({ Cookie: cookie, ...headers }, sweepBody());
    expect(res.status, messageOf(res)).toBe(status);
    expect(await tableCounts()).toEqual(before);
  });

  test("the cancel endpoint (no body) is held to the same rule", async () => {
    const cookie = await cookieFor("engineer");
    const params = { id: String(fx.sweepId) };
    const path = `/api/v1/sweeps/${fx.sweepId}/cancel`;
    expect((await post({ Cookie: cookie, Origin: "https://evil.example", "Content-Type": "application/json" }, "", cancelApi.action, path, params)).status).toBe(403);
    expect((await post({ Cookie: cookie, Origin: BASE }, "", cancelApi.action, path, params)).status).toBe(415);
    // Same origin and JSON: through to the handler (the sweep has finished: 409).
    expect((await post({ Cookie: cookie, Origin: BASE, "Content-Type": "application/json" }, "", cancelApi.action, path, params)).status).toBe(409);
  });

  test("our own pages get through: same Origin, or Sec-Fetch-Site same-origin, or APP_URL's origin behind a proxy", async () => {
    const cookie = await cookieFor("engineer");
    const ok: Record<string, string>[] = [
      { Origin: BASE },
      { "Sec-Fetch-Site": "same-origin" },
      { "Sec-Fetch-Site": "same-origin", Origin: BASE },
    ];
    for (const h of ok) {
      const res = await post({ Cookie: cookie, "Content-Type": "application/json; charset=utf-8", ...h }, sweepBody());
      expect(res.status, messageOf(res)).toBe(202);
    }
    const saved = process.env.APP_URL;
    process.env.APP_URL = "https://beams.example";
    try {
      const res = await post({ Cookie: cookie, "Content-Type": "application/json", Origin: "https://beams.example" }, sweepBody());
      expect(res.status, messageOf(res)).toBe(202);
    } finally {
      if (saved === undefined) delete process.env.APP_URL;
      else process.env.APP_URL = saved;
    }
  });

  test("a bearer token is not a browser credential: any Origin and content type reach the handler", async () => {
    const res = await post({ Authorization: `Bearer ${token}`, "Content-Type": "text/plain", Origin: "https://elsewhere.example" }, sweepBody());
    expect(res.status, messageOf(res)).toBe(202);
    const props = await post({ Authorization: `Bearer ${token}` }, JSON.stringify({ plates: [{ b: 200, h: 16, z: 0, y: 0 }] }), propertiesApi.action, "/api/v1/properties");
    expect(props.status, messageOf(props)).toBe(200);
  });

  test("reads stay open to the cookie (a GET changes nothing; CORS keeps other sites from reading it)", async () => {
    const res = await callRoute(sweepsApi.loader, new Request(new URL("/api/v1/sweeps", BASE), { headers: { Cookie: await cookieFor("viewer"), "Sec-Fetch-Site": "same-origin" } }));
    expect(res.status).toBe(200);
  });
});

describe("an oversized body is drained before the 413 (item 15)", () => {
  /** A request whose body is `total` bytes in 64 kB chunks, counting how many were read. */
  function streamed(total: number, type: string) {
    const chunk = new Uint8Array(64 * 1024).fill(0x61);
    let sent = 0;
    let cancelled = false;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent >= total) return controller.close();
        const n = Math.min(chunk.byteLength, total - sent);
        sent += n;
        controller.enqueue(chunk.subarray(0, n));
      },
      cancel() {
        cancelled = true;
      },
    });
    const request = new Request(new URL("/x", BASE), { method: "POST", body, headers: { "Content-Type": type }, duplex: "half" } as RequestInit);
    return { request, read: () => sent, cancelled: () => cancelled };
  }

  test("JSON over 256 kB: 413 with the message, the rest read to the end (not cut, which resets the client)", async () => {
    const s = streamed(3 * 1024 * 1024, "application/json");
    const thrown = (await readJson(s.request).catch((e: unknown) => e)) as Response;
    expect(thrown.status).toBe(413);
    expect(await thrown.json()).toEqual({ error: "body over 256 kB" });
    expect(s.read()).toBe(3 * 1024 * 1024);
    expect(s.cancelled()).toBe(false);
  });

  test("a stock-list sized form over its limit is drained too", async () => {
    const s = streamed(2 * 1024 * 1024, "application/x-www-form-urlencoded");
    const thrown = (await readForm(s.request, 1024 * 1024).catch((e: unknown) => e)) as Response;
    expect(thrown.status).toBe(413);
    expect(s.read()).toBe(2 * 1024 * 1024);
  });

  test("past the drain cap the body is cut off: a client cannot make the server read forever", async () => {
    const s = streamed(DRAIN_CAP + 4 * 1024 * 1024, "application/json");
    const thrown = (await readJson(s.request).catch((e: unknown) => e)) as Response;
    expect(thrown.status).toBe(413);
    expect(s.read()).toBeLessThan(DRAIN_CAP + 4 * 1024 * 1024);
    expect(s.cancelled()).toBe(true);
  });
});

describe("the session cookie's Secure flag follows APP_URL (item 16)", () => {
  const saved = process.env.APP_URL;
  afterEach(() => {
    if (saved === undefined) delete process.env.APP_URL;
    else process.env.APP_URL = saved;
  });
  const setCookie = async () => (await attempt(DEMO_EMAIL.reviewer, DEMO_PASSWORD, freshAddress())).headers.get("set-cookie") ?? "";

  test("https → Secure", async () => {
    process.env.APP_URL = "https://beams.example";
    expect(await setCookie()).toMatch(/;\s*Secure/i);
  });

  test("http or unset → not Secure (the local server speaks plain http)", async () => {
    process.env.APP_URL = "http://localhost:3000";
    expect(await setCookie()).not.toMatch(/Secure/i);
    delete process.env.APP_URL;
    const cookie = await setCookie();
    expect(cookie).toMatch(/^__sparwise=/);
    expect(cookie).not.toMatch(/Secure/i);
  });
});

import { createHash, randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";
import { redirect } from "react-router";
import { Authenticator } from "remix-auth";
import { FormStrategy } from "remix-auth-form";
import { z } from "zod";
import { db } from "~/lib/db.server";
import { appOrigin } from "~/lib/app-url.server";
import { can, isRole, type Permission, type Role } from "~/lib/roles";
import { commitSession, destroySession, getSession } from "~/lib/session.server";
import { spendApiPoints } from "~/lib/api-rate-limit.server";
import { beginSignIn, signInFailed, signInSucceeded, tooManyMessage } from "~/lib/rate-limit.server";

export type { Role, Permission } from "~/lib/roles";

/** One team the user belongs to, for the header's team switcher. */
export interface TeamChoice {
  id: number;
  name: string;
  role: Role;
}

export interface SessionUser {
  id: number;
  email: string;
  name: string;
  /** The team the user acts in now (chosen in the header, kept in the session); every guard uses it. */
  teamId: number;
  teamName: string;
  role: Role;
  /** Every team the user belongs to, the acting one included. */
  teams: TeamChoice[];
}

// ---------------------------------------------------------------- tokens and passwords

const BCRYPT_ROUNDS = 10;
export const MIN_PASSWORD_LENGTH = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_ROUNDS);
}

/** sha256 hex: invitation, reset and API tokens are stored only as this, so a leaked table grants nothing. */
export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** 32 random bytes, URL-safe; the prefix lets a leaked API token be recognised in logs. */
export function newToken(prefix = ""): string {
  return prefix + randomBytes(32).toString("base64url");
}

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

// ---------------------------------------------------------------- loading the signed-in user

interface MembershipRow {
  id: number;
  email: string;
  name: string;
  session_version: number;
  team_id: number;
  team_name: string;
  role: string;
  unread_notices: number | string;
}

/**
 * The user acting in `teamId` when they are a member of it, else in their first team (oldest
 * membership); null when disabled or belonging to no team. The team is only ever one of the
 * user's own memberships, so a stale or forged choice cannot reach another team.
 */
async function loadUser(userId: number, teamId?: number | null): Promise<(SessionUser & { sessionVersion: number; unreadNotices: number }) | null> {
  const rows = (await db("users")
    .join("memberships", "memberships.user_id", "users.id")
    .join("teams", "teams.id", "memberships.team_id")
    .where("users.id", userId)
    .whereNull("users.disabled_at")
    .orderBy("memberships.id")
    .select(
      "users.id",
      "users.email",
      "users.name",
      "users.session_version",
      "memberships.team_id",
      "teams.name as team_name",
      "memberships.role",
      // The header's unread count rides along (an index range on notifications(user_id, read_at)):
      // every signed-in page shows it, and one round trip fewer per page view counts at 20 readers
      // (issue 9, item 8). It is the user's own count, whatever team they act in.
      db.raw("(SELECT COUNT(*) FROM notifications n WHERE n.user_id = users.id AND n.read_at IS NULL) AS unread_notices"),
    )) as MembershipRow[];
  const valid = rows.filter((r) => isRole(r.role));
  const row = valid.find((r) => r.team_id === teamId) ?? valid[0];
  if (!row) return null;
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    teamId: row.team_id,
    teamName: row.team_name,
    role: row.role as Role,
    teams: valid.map((r) => ({ id: r.team_id, name: r.team_name, role: r.role as Role })),
    sessionVersion: row.session_version,
    unreadNotices: Number(row.unread_notices),
  };
}

// A loader and its parent layout often both ask; one query per request is enough.
const perRequest = new WeakMap<Request, Promise<{ user: SessionUser; unreadNotices: number } | null>>();

function sessionUser(request: Request): Promise<{ user: SessionUser; unreadNotices: number } | null> {
  let pending = perRequest.get(request);
  if (!pending) {
    pending = (async () => {
      const session = await getSession(request);
      const userId = session.get("userId");
      const sv = session.get("sv");
      if (typeof userId !== "number" || typeof sv !== "number") return null;
      const chosen = session.get("teamId");
      const loaded = await loadUser(userId, typeof chosen === "number" ? chosen : null);
      // A cookie minted before the last sign-out or password reset is dead.
      if (!loaded || loaded.sessionVersion !== sv) return null;
      const { sessionVersion: _sv, unreadNotices, ...user } = loaded;
      return { user, unreadNotices };
    })();
    perRequest.set(request, pending);
  }
  return pending;
}

export async function getUser(request: Request): Promise<SessionUser | null> {
  return (await sessionUser(request))?.user ?? null;
}

/** requireUser, with the user's unread notices as of the same query (the signed-in frame's header). */
export async function requireUserWithNotices(request: Request): Promise<{ user: SessionUser; unreadNotices: number }> {
  const found = await sessionUser(request);
  if (found) return found;
  throw signInRedirect(request);
}

function forbidden(message: string): Response {
  return new Response(message, { status: 403, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}

/** To the sign-in page, coming back here after. */
function signInRedirect(request: Request): Response {
  const url = new URL(request.url);
  const next = url.pathname + url.search;
  return redirect(next && next !== "/" ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
}

export async function requireUser(request: Request): Promise<SessionUser> {
  const user = await getUser(request);
  if (user) return user;
  throw signInRedirect(request);
}

const PERMISSION_WORDS: Record<Permission, string> = {
  read: "read this team's work",
  createProject: "create projects",
  editBrief: "edit briefs",
  runSweep: "run sweeps",
  saveOption: "save options",
  requestReview: "request reviews",
  recheck: "run rechecks",
  review: "review options",
  cancelAnySweep: "cancel other members' sweeps",
  manageTeam: "manage the team",
  manageCatalogues: "manage the team's section catalogues",
  attach: "attach files to options",
};

/** The user, when a member of teamId whose role grants permission; otherwise a thrown 403 (or sign-in redirect). */
export async function requireTeamRole(request: Request, teamId: number, permission: Permission): Promise<SessionUser> {
  const user = await requireUser(request);
  if (user.teamId !== teamId) throw forbidden("You are not a member of this team.");
  if (!can(user.role, permission)) {
    throw forbidden(`Your role (${user.role}) may not ${PERMISSION_WORDS[permission]}.`);
  }
  return user;
}

/** requireTeamRole for the signed-in user's own team. */
export async function requirePermission(request: Request, permission: Permission): Promise<SessionUser> {
  const user = await requireUser(request);
  return requireTeamRole(request, user.teamId, permission);
}

/** API routes: the session cookie or `Authorization: Bearer <token>`; failures are JSON 401/403. */
/**
 * The API caller (bearer token or cookie session), charged `cost` points of their per-minute API
 * budget (api-rate-limit.server.ts: 429 with Retry-After when spent), then checked for `permission`.
 */
export async function requireApiUser(request: Request, permission?: Permission, cost = 1): Promise<SessionUser> {
  const header = request.headers.get("authorization");
  let user: SessionUser | null = null;
  if (header) {
    const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
    if (!match) throw Response.json({ error: "Authorization header must be 'Bearer <token>'" }, { status: 401 });
    user = await userForApiToken(match[1]!);
    if (!user) throw Response.json({ error: "API token is unknown or revoked" }, { status: 401 });
  } else {
    user = await getUser(request);
    if (!user) throw Response.json({ error: "sign in or send an API token" }, { status: 401 });
    assertCookieRequestFromOwnPages(request);
  }
  await spendApiPoints(user.id, cost);
  if (permission && !can(user.role, permission)) {
    throw Response.json({ error: `role ${user.role} may not ${PERMISSION_WORDS[permission]}` }, { status: 403 });
  }
  return user;
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** The origins our own pages are served from: the request's, and APP_URL's behind a proxy. */
function ownOrigins(request: Request): Set<string> {
  const origins = new Set([new URL(request.url).origin]);
  // a malformed APP_URL adds nothing
  const app = appOrigin();
  if (app) origins.add(app);
  return origins;
}

/**
 * A browser attaches the session cookie to requests other sites make, so a state-changing API
 * call on a cookie must prove it comes from our own pages: Sec-Fetch-Site "same-origin" (set by
 * the browser, no page can forge it) or, from browsers without it, an Origin of ours. A missing
 * Origin is refused too: browsers always send one on a POST, so only a non-browser client omits
 * it, and those use a bearer token. A JSON Content-Type forces a CORS preflight on any other
 * site's fetch, which this server never grants. Bearer tokens are not sent by browsers on
 * their own, so they skip both checks.
 */
function assertCookieRequestFromOwnPages(request: Request): void {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return;
  const site = request.headers.get("sec-fetch-site");
  const origin = request.headers.get("origin");
  const sameOrigin = site !== null ? site === "same-origin" : origin !== null && ownOrigins(request).has(origin);
  if (!sameOrigin) {
    throw Response.json(
      { error: "cross-origin request refused: a session-cookie request must come from this site's own pages (Origin); scripts use an API token" },
      { status: 403 },
    );
  }
  // Asked even of a body-less POST (cancel): whether a body follows cannot be told from every
  // request, and the header is what makes another site's fetch need a preflight.
  const type = (request.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (type !== "application/json") {
    throw Response.json({ error: "Content-Type must be application/json on a session-cookie request" }, { status: 415 });
  }
}

async function userForApiToken(token: string): Promise<SessionUser | null> {
  if (token.length > 200) return null;
  const row = await db("api_tokens").where({ token_hash: hashToken(token) }).whereNull("revoked_at").first("id", "user_id", "team_id");
  if (!row) return null;
  // The token acts in the team it was made in, whatever team the owner's browser session has chosen;
  // a member who left that team loses it.
  const user = await loadUser(row.user_id, row.team_id);
  if (!user || user.teamId !== row.team_id) return null;
  await db("api_tokens").where({ id: row.id }).update({ last_used_at: db.fn.now() });
  const { sessionVersion: _sv, ...rest } = user;
  return rest;
}

// ---------------------------------------------------------------- sign-in (remix-auth 4)

export class SignInError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly field: "email" | "password" | "form",
    /** Seconds until the next attempt may succeed (429 only): the Retry-After header. */
    readonly retryAfter?: number,
  ) {
    super(message);
    this.name = "SignInError";
  }
}

export const signInSchema = z.object({
  email: z.string({ error: "Enter your e-mail address." }).trim().max(254, "E-mail address is too long.").pipe(z.email("Enter a valid e-mail address.")),
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200, "Password is too long."),
});

// Compared against when the address is unknown, so a wrong address takes as long as a wrong password.
const DUMMY_HASH = bcrypt.hashSync("not-a-real-password", BCRYPT_ROUNDS);

export interface VerifiedUser {
  id: number;
  sessionVersion: number;
}

/** `address` is the client's address bucket from the load context (rate-limit.server.ts clientAddress). */
export async function verifyCredentials(form: FormData, address: string): Promise<VerifiedUser> {
  const parsed = signInSchema.safeParse({ email: form.get("email") ?? undefined, password: form.get("password") ?? undefined });
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    const field = issue.path[0] === "password" ? "password" : "email";
    throw new SignInError(issue.message, 400, field);
  }
  const user = await checkPassword(parsed.data.email, parsed.data.password, address);
  if (!(await loadUser(user.id))) {
    throw new SignInError("This account is not a member of any team. Ask your admin for an invitation.", 403, "email");
  }
  return user;
}

/**
 * The account's own password, with the sign-in throttle (rate-limit.server.ts): used by sign-in
 * and by an existing user accepting an invitation. A disabled account never passes. `address` is
 * the client's address from the load context (clientAddress(context)).
 */
export async function checkPassword(rawEmail: string, password: string, address: string): Promise<VerifiedUser> {
  const email = normaliseEmail(rawEmail);
  const ticket = await beginSignIn(email, address);
  if ("waitMs" in ticket) throw new SignInError(tooManyMessage(ticket.waitMs), 429, "form", Math.ceil(ticket.waitMs / 1000));
  const row = await db("users").where({ email }).whereNull("disabled_at").first("id", "password_hash", "session_version");
  const ok = await bcrypt.compare(password, row?.password_hash ?? DUMMY_HASH);
  if (!row || !row.password_hash || !ok) {
    await signInFailed(ticket);
    throw new SignInError("E-mail address or password is wrong.", 401, "password");
  }
  // The password was right: this was no guess.
  await signInSucceeded(email, address);
  return { id: row.id, sessionVersion: row.session_version };
}

// remix-auth hands the strategy a copy of the request and nothing else, so the address rides in a
// header that only authenticateSignIn writes (any copy the client sent is dropped first). The
// authenticator is not exported: no other caller can hand it a request with a forged one.
const ADDRESS_HEADER = "x-sparwise-signin-address";

const authenticator = new Authenticator<VerifiedUser>();
authenticator.use(
  new FormStrategy<VerifiedUser>(({ form, request }) => verifyCredentials(form, request.headers.get(ADDRESS_HEADER) ?? "unknown")),
  "form",
);

/** Signs in with the size-checked form; throws SignInError on any refusal. */
export async function authenticateSignIn(request: Request, form: FormData, address: string): Promise<VerifiedUser> {
  // FormStrategy reads the body itself: hand it the form already read, in a fresh request.
  const body = new URLSearchParams();
  for (const [k, v] of form) if (typeof v === "string") body.append(k, v);
  const headers = new Headers(request.headers);
  headers.delete("content-length");
  headers.set("content-type", "application/x-www-form-urlencoded");
  headers.set(ADDRESS_HEADER, address);
  return authenticator.authenticate("form", new Request(request.url, { method: "POST", headers, body }));
}

// ---------------------------------------------------------------- the acting team

/**
 * Makes `teamId` the team the signed-in user acts in; a team they do not belong to is refused
 * (404: whether the team exists is none of their business). Returns the Set-Cookie value.
 */
export async function chooseTeam(request: Request, teamId: number): Promise<{ user: SessionUser; setCookie: string }> {
  const user = await requireUser(request);
  if (!user.teams.some((t) => t.id === teamId)) throw forbiddenTeam();
  const session = await getSession(request);
  session.set("teamId", teamId);
  const chosen = user.teams.find((t) => t.id === teamId)!;
  return { user: { ...user, teamId, teamName: chosen.name, role: chosen.role }, setCookie: await commitSession(session) };
}

function forbiddenTeam(): Response {
  return new Response("You are not a member of that team.", { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}

// ---------------------------------------------------------------- sign-out

/** Kills every session of the user (bumps session_version) and clears this cookie. */
export async function signOut(request: Request): Promise<Response> {
  const session = await getSession(request);
  // Only a live cookie may end the user's sessions; a dead one just gets cleared.
  const user = await getUser(request);
  if (user) await db("users").where({ id: user.id }).increment("session_version", 1);
  return redirect("/sign-in", { headers: { "Set-Cookie": await destroySession(session) } });
}

/** Bumps session_version (e.g. after a password reset) so older cookies stop working. */
export async function invalidateSessions(userId: number): Promise<number> {
  await db("users").where({ id: userId }).increment("session_version", 1);
  const row = await db("users").where({ id: userId }).first("session_version");
  return row.session_version as number;
}

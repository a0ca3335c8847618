import { createCookieSessionStorage, createSession, redirect, type Session } from "react-router";
import "~/lib/db.server"; // loads .env (through knexfile) before the secret is read
import { appServedOverHttps } from "~/lib/app-url.server";

// The cookie carries the user id and the user's session_version at sign-in. Sign-out (and a
// password reset) bumps users.session_version, so every cookie issued before dies at once —
// a cookie session cannot be revoked any other way.
export interface SessionData {
  userId: number;
  sv: number;
  /** The team the user acts in (a user may belong to several); only ever one of their memberships counts. */
  teamId: number;
}
export interface SessionFlash {
  notice: string;
}

const SESSION_DAYS = 14;
let storage: { secure: boolean; value: ReturnType<typeof createCookieSessionStorage<SessionData, SessionFlash>> } | undefined;

function sessionSecret(): string {
  const secret = process.env.SESSION_SECRET;
  if (secret && secret.length >= 16) return secret;
  if (process.env.NODE_ENV === "production") {
    throw new Error("SESSION_SECRET is missing or shorter than 16 characters: run `npm run up` to generate .env");
  }
  // Development and tests without .env only; production refuses to start above.
  return "sparwise-development-only-secret";
}

/**
 * The cookie is Secure exactly when the app is reached over https (APP_URL's scheme): a browser
 * then never sends it over plain http. Unset APP_URL means the local plain-http server, where a
 * Secure cookie would never come back (browsers only exempt localhost).
 */
export function sessionCookieSecure(): boolean {
  return appServedOverHttps();
}

export function getSessionStorage() {
  const secure = sessionCookieSecure();
  if (!storage || storage.secure !== secure) {
    storage = {
      secure,
      value: createCookieSessionStorage<SessionData, SessionFlash>({
        cookie: {
          name: "__sparwise",
          httpOnly: true,
          sameSite: "lax",
          path: "/",
          secure,
          secrets: [sessionSecret()],
          maxAge: SESSION_DAYS * 24 * 3600,
        },
      }),
    };
  }
  return storage.value;
}

/**
 * Cookie headers whose signature has been checked, with what they carried. Checking the signature
 * (HMAC through WebCrypto) was about a millisecond of every signed-in page view under load (issue 9,
 * item 8); the same header always carries the same data, so each process checks it once. Only a
 * header that verified is kept (a forged one is checked, and refused, every time), at most
 * VERIFIED_MAX of them, and each request still gets a session of its own (flash reads stay per
 * request). Nothing here decides who the user is now: getUser still reads the user and their
 * session_version from the database on every request, so sign-out and resets end a cookie at once.
 */
const VERIFIED_MAX = 1_000;
let verified: { storage: ReturnType<typeof getSessionStorage>; data: Map<string, string> } | undefined;

export async function getSession(request: Request): Promise<Session<SessionData, SessionFlash>> {
  const storage = getSessionStorage();
  const header = request.headers.get("Cookie");
  // a new storage (a new secret or cookie setting) starts a new memory
  if (verified?.storage !== storage) verified = { storage, data: new Map() };
  const known = header ? verified.data.get(header) : undefined;
  if (known !== undefined) return createSession<SessionData, SessionFlash>(JSON.parse(known));
  const session = await storage.getSession(header);
  if (header && header.length <= 4096 && Object.keys(session.data).length > 0) {
    verified.data.set(header, JSON.stringify(session.data));
    if (verified.data.size > VERIFIED_MAX) verified.data.delete(verified.data.keys().next().value!);
  }
  return session;
}

export function commitSession(session: Session<SessionData, SessionFlash>): Promise<string> {
  return getSessionStorage().commitSession(session);
}

export function destroySession(session: Session<SessionData, SessionFlash>): Promise<string> {
  return getSessionStorage().destroySession(session);
}

const ORIGIN_PROBE = "http://sparwise.invalid";

/**
 * A same-origin path (with its query and hash) to redirect to after sign-in, else `fallback`.
 * `to` is resolved against the app's origin exactly as a browser would resolve a Location, and
 * only a result on that origin counts: "//evil", "/\\evil" and "/\t/evil" (browsers drop tabs and
 * newlines, then see "//") all leave it. Control characters, whitespace and line separators are
 * refused outright; the result is the parser's ASCII serialisation, so it is always a valid header.
 */
export function safeRedirect(to: unknown, fallback = "/"): string {
  if (typeof to !== "string" || to.length > 2048 || !to.startsWith("/")) return fallback;
  if (/[\u0000-\u0020\u007f-\u00a0\u1680\u2000-\u200f\u2028-\u202f\u205f\u3000\ufeff\\]/.test(to)) return fallback;
  let url: URL;
  try {
    url = new URL(to, ORIGIN_PROBE);
  } catch {
    return fallback;
  }
  if (url.origin !== ORIGIN_PROBE) return fallback;
  const path = url.pathname + url.search + url.hash;
  return path.startsWith("/") && !path.startsWith("//") ? path : fallback;
}

/** A fresh session for a user who just proved who they are; redirects with the cookie set. */
export async function createUserSession(request: Request, user: { id: number; sessionVersion: number }, redirectTo: string, teamId?: number) {
  const session = await getSession(request);
  session.set("userId", user.id);
  session.set("sv", user.sessionVersion);
  if (teamId !== undefined) session.set("teamId", teamId);
  else session.unset("teamId");
  return redirect(safeRedirect(redirectTo), { headers: { "Set-Cookie": await commitSession(session) } });
}

/** A Set-Cookie header value for a session that is not bound to a request (tests, scripts). */
export async function sessionCookieFor(userId: number, sessionVersion: number, teamId?: number): Promise<string> {
  const session = await getSessionStorage().getSession();
  session.set("userId", userId);
  session.set("sv", sessionVersion);
  if (teamId !== undefined) session.set("teamId", teamId);
  return commitSession(session);
}

export async function flashNotice(request: Request, notice: string): Promise<string> {
  const session = await getSession(request);
  session.flash("notice", notice);
  return commitSession(session);
}

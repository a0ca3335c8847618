// The address people open Sparwise at, decided here alone from APP_URL: links in e-mail (resets,
// invitations, sweep notices), the session cookie's Secure flag, HSTS and the origin the cookie
// API accepts behind a proxy all read it through this module, so they cannot disagree.
//
// Never from the request: Host and X-Forwarded-Host are whatever the sender typed, and a reset
// link pointing at their server hands them the token (issue 9, item 2).
import "~/lib/db.server"; // loads .env (through knexfile) before APP_URL is read, as the check at load needs

/** The address when APP_URL is unset outside production (development and tests): `npm run up`'s default. */
export const DEV_APP_URL = "http://localhost:3000";

/** APP_URL as a URL, null when unset, or the message saying what is wrong with it. */
function parseAppUrl(): { url: URL | null } | { error: string } {
  const raw = process.env.APP_URL?.trim();
  if (!raw) return { url: null };
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    return { error: `APP_URL is not a valid URL: ${JSON.stringify(raw)}. Give the full address, e.g. https://sparwise.example.com` };
  }
  if (url.protocol !== "http:" && url.protocol !== "https:") return { error: `APP_URL must start with http:// or https://, not ${url.protocol}` };
  return { url };
}

/** The base of every absolute link: APP_URL; in development and tests DEV_APP_URL when unset. Throws on a malformed APP_URL. */
export function appBaseUrl(): string {
  const p = parseAppUrl();
  if ("error" in p) throw new Error(p.error);
  if (!p.url) {
    if (process.env.NODE_ENV === "production") {
      throw new Error(
        "APP_URL is not set: links in e-mail need the address people open Sparwise at (e.g. APP_URL=https://sparwise.example.com in .env). `npm run up` writes APP_URL=http://localhost:3000.",
      );
    }
    return DEV_APP_URL;
  }
  // A path prefix is kept (the app may be served under one); a query or fragment would break every link.
  return p.url.origin + p.url.pathname.replace(/\/+$/, "");
}

/** Absolute link (e-mails), from APP_URL only. `path` starts with "/". */
export function appUrl(path: string): string {
  return appBaseUrl() + path;
}

/**
 * Whether APP_URL says the site is reached over https (Secure cookie, HSTS). Unset or malformed
 * means no: the local plain-http server, where a Secure cookie would never come back. (Production
 * refuses to start with a malformed one: the check at the end of this module.)
 */
export function appServedOverHttps(): boolean {
  const p = parseAppUrl();
  return "url" in p && p.url?.protocol === "https:";
}

/** APP_URL's origin when it is set and well formed (a proxy's public address), else null. */
export function appOrigin(): string | null {
  const p = parseAppUrl();
  return "url" in p && p.url ? p.url.origin : null;
}

// Fail at start, not at the first e-mail: the server bundle runs this when it loads.
if (process.env.NODE_ENV === "production") appBaseUrl();

// Shared helpers for integration tests: sign in as a demo role, build requests, call a route
// module's loader/action directly and read back a uniform { status, location, data } answer.
import path from "node:path";
import routes from "~/routes";
import { db } from "~/lib/db.server";
import { sessionCookieFor } from "~/lib/session.server";
import type { Role } from "~/lib/roles";

export const BASE = "http://sparwise.test";

/** The demo seed's people (db/seeds/01_demo.ts). "engineer2" is a second engineer for ownership tests. */
export type DemoRole = Role | "engineer2";
export const DEMO_EMAIL: Record<DemoRole, string> = {
  admin: "admin@tallowfield.example",
  engineer: "engineer@tallowfield.example",
  engineer2: "engineer2@tallowfield.example",
  reviewer: "reviewer@tallowfield.example",
  viewer: "viewer@tallowfield.example",
};
export const DEMO_PASSWORD = "sparwise-demo";

export interface DemoUser {
  id: number;
  email: string;
  teamId: number;
  sessionVersion: number;
}

export async function demoUser(role: DemoRole): Promise<DemoUser> {
  const row = await db("users")
    .join("memberships", "memberships.user_id", "users.id")
    .where("users.email", DEMO_EMAIL[role])
    .first("users.id", "users.email", "users.session_version", "memberships.team_id");
  if (!row) throw new Error(`demo user for ${role} is missing: is the test database seeded?`);
  return { id: row.id, email: row.email, teamId: row.team_id, sessionVersion: row.session_version };
}

/** A Cookie header value signed in as the demo role (read fresh: sign-out tests bump the version). */
export async function cookieFor(role: DemoRole): Promise<string> {
  const user = await demoUser(role);
  return cookieForUser(user.id, user.sessionVersion);
}

export async function cookieForUser(userId: number, sessionVersion?: number): Promise<string> {
  const sv = sessionVersion ?? (await db("users").where({ id: userId }).first("session_version")).session_version;
  const setCookie = await sessionCookieFor(userId, sv);
  return setCookie.split(";")[0]!;
}

export type As = DemoRole | null;

/** A GET (or any) request as a role; null means signed out. */
export async function requestAs(as: As, path: string, init: RequestInit = {}): Promise<Request> {
  const headers = new Headers(init.headers);
  if (as) headers.set("Cookie", await cookieFor(as));
  // A browser names the page's origin on every POST; the cookie API refuses requests without it.
  if (as && init.method && init.method !== "GET" && !headers.has("Origin")) headers.set("Origin", BASE);
  return new Request(new URL(path, BASE), { ...init, headers });
}

/** A urlencoded form POST as a role. */
export async function formPost(as: As, path: string, fields: Record<string, string | string[]> = {}, headers: HeadersInit = {}): Promise<Request> {
  const body = new URLSearchParams();
  for (const [k, v] of Object.entries(fields)) for (const one of Array.isArray(v) ? v : [v]) body.append(k, one);
  const h = new Headers(headers);
  h.set("Content-Type", "application/x-www-form-urlencoded");
  return requestAs(as, path, { method: "POST", body, headers: h });
}

export interface RouteResult {
  status: number;
  location: string | null;
  headers: Headers;
  /** Parsed JSON, the text of a text response, or the value a loader returned. */
  data: unknown;
  /** Set when the route threw something that is not a Response (a would-be 500). */
  error?: unknown;
}

type RouteFn = (args: { request: Request; params: Record<string, string | undefined>; context: unknown }) => unknown;

// server.ts puts the socket's address in the load context; a test says which address it sends from.
const clientAddresses = new WeakMap<Request, string>();
/** The address this test request comes from, as the server would read it off the socket. */
export function fromAddress<T extends Request>(request: T, address: string): T {
  clientAddresses.set(request, address);
  return request;
}
/** Requests with no address of their own share this one (TEST-NET-1, RFC 5737). */
export const DEFAULT_TEST_ADDRESS = "192.0.2.10";

async function fromResponse(res: Response): Promise<RouteResult> {
  const text = await res.text();
  let data: unknown = text;
  if ((res.headers.get("content-type") ?? "").includes("json")) {
    try {
      data = JSON.parse(text);
    } catch {
      // leave as text
    }
  }
  return { status: res.status, location: res.headers.get("location"), headers: res.headers, data };
}

function isDataWithInit(v: unknown): v is { type: "DataWithResponseInit"; data: unknown; init: ResponseInit | null } {
  return typeof v === "object" && v !== null && (v as { type?: unknown }).type === "DataWithResponseInit";
}

/** Calls a loader or action the way the framework would, folding returns and throws into one shape. */
export async function callRoute(fn: unknown, request: Request, params: Record<string, string | undefined> = {}): Promise<RouteResult> {
  if (typeof fn !== "function") throw new Error("callRoute: the route module has no such export");
  try {
    const context = { clientAddress: clientAddresses.get(request) ?? DEFAULT_TEST_ADDRESS };
    const out = await (fn as RouteFn)({ request, params, context });
    return normalise(out);
  } catch (thrown) {
    if (thrown instanceof Response || isDataWithInit(thrown)) return normalise(thrown);
    return { status: 500, location: null, headers: new Headers(), data: undefined, error: thrown };
  }
}

async function normalise(out: unknown): Promise<RouteResult> {
  if (out instanceof Response) return fromResponse(out);
  if (isDataWithInit(out)) {
    const headers = new Headers(out.init?.headers);
    return { status: out.init?.status ?? 200, location: headers.get("location"), headers, data: out.data };
  }
  return { status: 200, location: null, headers: new Headers(), data: out };
}

/** Every message a RouteResult carries, flattened to one string (for "names the field" checks). */
export function messageOf(result: RouteResult): string {
  const d = result.data as { errors?: Record<string, string>; error?: string } | string | undefined;
  if (typeof d === "string") return d;
  if (d && typeof d === "object") {
    const parts: string[] = [];
    if (d.errors) for (const [k, v] of Object.entries(d.errors)) parts.push(`${k}: ${v}`);
    if (d.error) parts.push(String(d.error));
    return parts.join(" | ");
  }
  return "";
}

// ---------------------------------------------------------------- the route table, for the matrix and bad-input tests


export interface FlatRoute {
  /** "/projects/:projectId" for a page or API route; "(layout) routes/app-layout.tsx" for a pathless layout. */
  key: string;
  file: string;
}

interface RouteEntry {
  path?: string;
  index?: boolean;
  file: string;
  children?: RouteEntry[];
}

/** Every route of app/routes.ts, with full paths; pathless layouts are listed under their file. */
export function flattenRoutes(entries: RouteEntry[] = routes as RouteEntry[], parent = ""): FlatRoute[] {
  const out: FlatRoute[] = [];
  for (const e of entries) {
    const full = e.path ? `${parent}/${e.path}`.replace(/\/+/g, "/") : parent;
    if (e.index) out.push({ key: full || "/", file: e.file });
    else if (e.path === undefined) out.push({ key: `(layout) ${e.file}`, file: e.file });
    else out.push({ key: full || "/", file: e.file });
    if (e.children) out.push(...flattenRoutes(e.children, full));
  }
  return out;
}

export interface RouteModule {
  loader?: unknown;
  action?: unknown;
}

export async function loadRouteModule(file: string): Promise<RouteModule> {
  return (await import(/* @vite-ignore */ path.resolve("app", file))) as RouteModule;
}

/** "/projects/:projectId" + { projectId: "7" } → "/projects/7". */
export function fillPath(pattern: string, params: Record<string, string> = {}): string {
  return pattern.replace(/:([A-Za-z0-9_]+)\??/g, (_m, name: string) => {
    const v = params[name];
    if (v === undefined) throw new Error(`no fixture value for :${name} in ${pattern}`);
    return encodeURIComponent(v);
  });
}

/** Fixture helpers handed to the tables' param functions; `once` makes one fixture per key per run. */
export class FixtureContext {
  private cache = new Map<string, Promise<unknown>>();
  readonly db = db;

  once<T>(key: string, make: () => Promise<T>): Promise<T> {
    let hit = this.cache.get(key) as Promise<T> | undefined;
    if (!hit) {
      hit = make();
      this.cache.set(key, hit);
    }
    return hit;
  }

  /** The demo team's id. */
  teamId(): Promise<number> {
    return this.once("team", async () => (await db("teams").where({ slug: "tallowfield" }).first("id")).id as number);
  }

  user(role: DemoRole): Promise<DemoUser> {
    return demoUser(role);
  }

  /** A second team with one admin, for "no page shows another team's data" rows. */
  otherTeam(): Promise<{ teamId: number; adminId: number }> {
    return this.once("otherTeam", async () => {
      const [teamId] = await db("teams").insert({ name: "Brackwater Steelworks (fixture)", slug: `brackwater-${Date.now()}` });
      const [adminId] = await db("users").insert({ email: `admin-${Date.now()}@brackwater.example`, name: "Other Admin", password_hash: null });
      await db("memberships").insert({ team_id: teamId, user_id: adminId, role: "admin" });
      return { teamId: Number(teamId), adminId: Number(adminId) };
    });
  }
}

/** Row counts of every table (minus bookkeeping), to prove a refused post wrote nothing. */
export async function tableCounts(): Promise<Record<string, number>> {
  const [rows] = (await db.raw("SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE'")) as [{ t: string }[]];
  const skip = new Set(["knex_migrations", "knex_migrations_lock", "login_limits", "signin_throttle"]);
  const out: Record<string, number> = {};
  for (const { t } of rows) {
    if (skip.has(t)) continue;
    out[t] = Number((await db(t).count({ n: "*" }).first())!.n);
  }
  return out;
}

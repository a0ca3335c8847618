// Issue 9's server-level findings against the real HTTP server (server.ts), each a test that
// failed under the old react-router-serve set-up: headers on every response with a working CSP
// nonce (item 9), the client address from the socket and TRUST_PROXY_HOPS (item 7), a 413 rather
// than a connection reset for oversized bodies (item 15), and start/stop of the server process
// group with a loud failure on a taken port (item 14). Requests that sign in come from their own
// loopback addresses (127.0.0.x) so the throttle they trip never reaches the other browser tests.
import { execFile, spawn, type ChildProcess } from "node:child_process";
import { request as httpRequest } from "node:http";
import { createServer, type Server } from "node:net";
import { mkdtempSync, readFileSync, readdirSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser } from "./browser";

interface Answer {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

/** One HTTP request from a chosen local address (node:http: fetch cannot pick its source). */
function send(url: string, opts: { method?: string; headers?: Record<string, string>; body?: string | Buffer; from?: string } = {}): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = httpRequest(url, { method: opts.method ?? "GET", headers: opts.headers, localAddress: opts.from }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks).toString("utf8") }));
      res.on("error", reject);
    });
    req.on("error", reject);
    if (opts.body !== undefined) req.end(opts.body);
    else req.end();
  });
}

const form = (fields: Record<string, string>) => new URLSearchParams(fields).toString();
const FORM = { "Content-Type": "application/x-www-form-urlencoded" };

function signInAttempt(base: string, email: string, password: string, from: string, headers: Record<string, string> = {}) {
  return send(`${base}/sign-in`, { method: "POST", headers: { ...FORM, ...headers }, body: form({ email, password }), from });
}

async function signedInCookie(base: string, email: string, from: string): Promise<string> {
  const res = await signInAttempt(base, email, "sparwise-demo", from);
  expect(res.status).toBe(302);
  const set = res.headers["set-cookie"];
  return String(Array.isArray(set) ? set[0] : set).split(";")[0]!;
}

function expectSecurityHeaders(res: Answer, where: string) {
  const h = res.headers;
  expect(h["content-security-policy"], where).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{16,}'/);
  expect(h["content-security-policy"], where).toMatch(/frame-ancestors 'none'/);
  expect(h["content-security-policy"], where).toMatch(/object-src 'none'/);
  expect(h["content-security-policy"], where).not.toMatch(/script-src[^;]*'unsafe-inline'/);
  expect(h["x-frame-options"], where).toBe("DENY");
  expect(h["x-content-type-options"], where).toBe("nosniff");
  expect(h["referrer-policy"], where).toBe("same-origin");
}

describe("headers on every response (item 9)", () => {
  const base = () => inject("baseUrl");
  let cookie: string;
  beforeAll(async () => {
    cookie = await signedInCookie(base(), "viewer@tallowfield.example", "127.0.0.4");
  });

  test("pages: every inline script carries this response's nonce, and each response has a new one", async () => {
    const a = await send(`${base()}/sign-in`);
    const b = await send(`${base()}/sign-in`);
    expectSecurityHeaders(a, "/sign-in");
    const nonce = /'nonce-([^']+)'/.exec(String(a.headers["content-security-policy"]))![1]!;
    expect(/'nonce-([^']+)'/.exec(String(b.headers["content-security-policy"]))![1]).not.toBe(nonce);
    const scripts = [...a.body.matchAll(/<script\b([^>]*)>/g)].map((m) => m[1]!);
    expect(scripts.length).toBeGreaterThan(0);
    for (const attrs of scripts) if (!/\bsrc=/.test(attrs)) expect(attrs).toContain(`nonce="${nonce}"`);
    // No HSTS while APP_URL is plain http (the browser suite's server).
    expect(a.headers["strict-transport-security"]).toBeUndefined();
  });

  test("signed-in pages and the API are no-store; fingerprinted files are cached for a year", async () => {
    const dashboard = await send(`${base()}/`, { headers: { Cookie: cookie } });
    expect(dashboard.status).toBe(200);
    expectSecurityHeaders(dashboard, "/");
    expect(dashboard.headers["cache-control"]).toBe("no-store");

    const api = await send(`${base()}/api/v1/sweeps`, { headers: { Cookie: cookie } });
    expect(api.status).toBe(200);
    expectSecurityHeaders(api, "/api/v1/sweeps");
    expect(api.headers["cache-control"]).toBe("no-store");
    const refused = await send(`${base()}/api/v1/sweeps`);
    expect(refused.status).toBe(401);
    expect(refused.headers["cache-control"]).toBe("no-store");
    expectSecurityHeaders(refused, "401");

    // A route's own Cache-Control replaces the default rather than joining it.
    const one = (JSON.parse(api.body) as { items: { id: number }[] }).items[0]!;
    const single = await send(`${base()}/api/v1/sweeps/${one.id}`, { headers: { Cookie: cookie } });
    expect(single.headers["cache-control"]).toBe("no-store");
    const csv = await send(`${base()}/sweeps/${one.id}/candidates.csv`, { headers: { Cookie: cookie } });
    expect(csv.status).toBe(200);
    expectSecurityHeaders(csv, "candidates.csv");
    expect(csv.headers["cache-control"]).toBe("no-store");

    const asset = readdirSync("build/client/assets").find((f) => f.endsWith(".js"))!;
    const file = await send(`${base()}/assets/${asset}`);
    expect(file.status).toBe(200);
    expectSecurityHeaders(file, asset);
    expect(file.headers["cache-control"]).toBe("public, max-age=31536000, immutable");
    const icon = await send(`${base()}/favicon.svg`);
    expectSecurityHeaders(icon, "favicon.svg");
    expect(icon.headers["cache-control"]).toBe("public, max-age=3600");
    const missing = await send(`${base()}/assets/no-such-file.js`);
    expect(missing.status).toBe(404);
    expectSecurityHeaders(missing, "404");
  });

  describe("in a browser", () => {
    let browser: Browser;
    beforeAll(async () => {
      browser = await launchBrowser();
    });
    afterAll(async () => {
      await browser?.close();
    });

    test("the pages still run their scripts under the policy: no violation on sign-in, dashboard, bench, sweep and record", async () => {
      const ctx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      const violations: string[] = [];
      await ctx.addInitScript(() => {
        document.addEventListener("securitypolicyviolation", (e) => {
          (window as unknown as { __csp: string[] }).__csp ??= [];
          (window as unknown as { __csp: string[] }).__csp.push(`${e.violatedDirective} ${e.blockedURI}`);
        });
      });
      const page = await ctx.newPage();
      page.on("console", (m) => {
        if (/Content Security Policy|Refused to/i.test(m.text())) violations.push(m.text());
      });
      const collect = async () => violations.push(...((await page.evaluate(() => (window as unknown as { __csp?: string[] }).__csp ?? [])) as string[]));

      await page.goto(`${base()}/sign-in`);
      await page.getByLabel("E-mail address").fill("reviewer@tallowfield.example");
      await page.getByLabel("Password").fill("sparwise-demo");
      await page.getByRole("button", { name: "Sign in" }).click();
      // A client-side navigation after sign-in: hydration ran.
      await page.getByRole("heading", { level: 1, name: "Dashboard" }).waitFor();
      await collect();

      // The bench runs the engine in a Web Worker loaded from /assets.
      await page.goto(`${base()}/bench`);
      await page.getByRole("heading", { level: 1 }).first().waitFor();
      await page.waitForFunction(() => document.body.innerText.includes("mm⁴"), undefined, { timeout: 30_000 });
      await collect();

      // A finished sweep with results draws its chart (SVG with style attributes): the demo's oldest.
      const api = await page.request.get(`${base()}/api/v1/sweeps`);
      const items = ((await api.json()) as { items: { id: number; status: string }[] }).items;
      let withResults: number | undefined;
      for (const s of [...items].reverse().filter((s) => s.status === "succeeded")) {
        const one = (await (await page.request.get(`${base()}/api/v1/sweeps/${s.id}`)).json()) as { best: unknown };
        if (one.best) {
          withResults = s.id;
          break;
        }
      }
      expect(withResults).toBeDefined();
      await page.goto(`${base()}/sweeps/${withResults}`);
      await page.getByRole("heading", { name: /against utilisation$/ }).waitFor({ timeout: 60_000 });
      await collect();

      expect(violations).toEqual([]);
      await ctx.close();
    });

    test("another site cannot frame a form", async () => {
      const page = await browser.newPage();
      // A page of another origin (data:) framing the sign-in form: the browser refuses the frame.
      await page.goto(`data:text/html,<iframe id="f" src="${base()}/sign-in"></iframe>`);
      await page.waitForTimeout(1500);
      const frame = page.frames().find((f) => f.url().includes("/sign-in"));
      const loaded = frame ? await frame.locator("form").count().catch(() => 0) : 0;
      expect(loaded).toBe(0);
      await page.close();
    });
  });
});

describe("the client address comes from the socket (item 7)", () => {
  test("a forged X-Forwarded-For buys no fresh bucket; another client is not held", async () => {
    const base = inject("baseUrl");
    const attacker = "127.0.0.2";
    let last: Answer | undefined;
    // The per-address allowance is 20 free failures (SIGNIN_ADDRESS_FAILURES); each guess names another "client".
    for (let i = 0; i < 21; i++) {
      last = await signInAttempt(base, `nobody${i}@tallowfield.example`, "guess", attacker, { "X-Forwarded-For": `198.51.100.${i + 1}` });
      expect(last.status).toBe(401);
    }
    last = await signInAttempt(base, "admin@tallowfield.example", "sparwise-demo", attacker, { "X-Forwarded-For": "198.51.100.200" });
    expect(last.status).toBe(429);
    expect(Number(last.headers["retry-after"])).toBeGreaterThanOrEqual(1);
    // The real admin, from their own address, is not held by someone else's guessing.
    expect((await signInAttempt(base, "admin@tallowfield.example", "sparwise-demo", "127.0.0.3")).status).toBe(302);
  });
});

/** A second server of our own on a free port with its own settings; resolves once it listens. */
async function startServer(env: Record<string, string>): Promise<{ child: ChildProcess; base: string; output: () => string }> {
  const child = spawn(process.execPath, ["--import", "tsx", "server.ts"], {
    env: { ...process.env, PORT: "0", NODE_ENV: "production", SPARWISE_INPROCESS_WORKERS: "0", DB_NAME: process.env.E2E_DB_NAME ?? "sparwise_e2e", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  child.stdout!.on("data", (c: Buffer) => (out += c.toString()));
  child.stderr!.on("data", (c: Buffer) => (out += c.toString()));
  const base = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start: ${out}`)), 90_000);
    child.stdout!.on("data", () => {
      const m = /listening on http:\/\/localhost:(\d+)/.exec(out);
      if (m) {
        clearTimeout(timer);
        resolve(`http://127.0.0.1:${m[1]}`);
      }
    });
    child.once("exit", (code) => {
      clearTimeout(timer);
      reject(new Error(`server exited with ${code}: ${out}`));
    });
  });
  return { child, base, output: () => out };
}

describe("TRUST_PROXY_HOPS (item 7) and HSTS behind https (item 9)", () => {
  let server: Awaited<ReturnType<typeof startServer>>;
  beforeAll(async () => {
    server = await startServer({ TRUST_PROXY_HOPS: "1", APP_URL: "https://beams.example" });
  });
  afterAll(() => {
    server?.child.kill("SIGTERM");
  });

  test("with one trusted proxy, the entry it appended is the client; entries further left are ignored", async () => {
    const proxied = (client: string) => ({ "X-Forwarded-For": `6.6.6.6, ${client}` });
    for (let i = 0; i < 21; i++) {
      expect((await signInAttempt(server.base, `proxied${i}@tallowfield.example`, "guess", "127.0.0.6", proxied("203.0.113.50"))).status).toBe(401);
    }
    expect((await signInAttempt(server.base, "proxied-x@tallowfield.example", "guess", "127.0.0.6", proxied("203.0.113.50"))).status).toBe(429);
    // Another client behind the same proxy (same socket address) is not held.
    expect((await signInAttempt(server.base, "proxied-y@tallowfield.example", "guess", "127.0.0.6", proxied("203.0.113.51"))).status).toBe(401);
  });

  test("APP_URL https: Strict-Transport-Security on every response", async () => {
    for (const p of ["/sign-in", "/healthz", "/favicon.svg"]) {
      expect((await send(`${server.base}${p}`)).headers["strict-transport-security"], p).toBe("max-age=31536000");
    }
  });

  test("a TRUST_PROXY_HOPS that is not a number stops the server with a message", async () => {
    await expect(startServer({ TRUST_PROXY_HOPS: "all" })).rejects.toThrow(/TRUST_PROXY_HOPS must be a whole number/);
  });
});

describe("oversized bodies get their 413, not a connection reset (item 15)", () => {
  const big = (n: number) => "x".repeat(n);

  test("the API: a 2 MB JSON body → 413 with the JSON message", async () => {
    const base = inject("baseUrl");
    const cookie = await signedInCookie(base, "engineer@tallowfield.example", "127.0.0.7");
    const res = await send(`${base}/api/v1/properties`, {
      method: "POST",
      headers: { Cookie: cookie, Origin: base, "Content-Type": "application/json" },
      body: JSON.stringify({ plates: big(2 * 1024 * 1024) }),
    });
    expect(res.status).toBe(413);
    expect(JSON.parse(res.body)).toEqual({ error: "body over 256 kB" });
  });

  test("the stock-list upload: a 3 MB file → 413 with the page's message", async () => {
    const base = inject("baseUrl");
    const cookie = await signedInCookie(base, "engineer@tallowfield.example", "127.0.0.7");
    const fd = new FormData();
    fd.set("intent", "preview");
    fd.set("file", new Blob([`thickness_mm\n${"8\n".repeat(1.5 * 1024 * 1024)}`]), "huge.csv");
    const encoded = new Response(fd);
    const body = Buffer.from(await encoded.arrayBuffer());
    const res = await send(`${base}/stock-lists`, { method: "POST", headers: { Cookie: cookie, "Content-Type": encoded.headers.get("content-type")! }, body });
    expect(res.status).toBe(413);
    expect(res.body).toMatch(/over the 1 MB limit; nothing was saved/);
  });

  test("a sign-in form over 64 kB → 413 naming the field", async () => {
    const base = inject("baseUrl");
    const res = await send(`${base}/sign-in`, { method: "POST", headers: FORM, body: form({ email: big(2 * 1024 * 1024) }), from: "127.0.0.8" });
    expect(res.status).toBe(413);
  });
});

describe("starting and stopping the server process (item 14)", () => {
  const script = path.resolve("db/app-server.sh");
  function run(cmd: "start" | "stop", env: Record<string, string>): Promise<{ code: number; out: string }> {
    return new Promise((resolve) => {
      execFile("bash", [script, cmd], { env: { ...process.env, ...env } }, (error, stdout, stderr) => {
        resolve({ code: error ? Number((error as { code?: number }).code ?? 1) : 0, out: stdout + stderr });
      });
    });
  }
  function freePort(): Promise<number> {
    return new Promise((resolve) => {
      const s = createServer().listen(0, () => {
        const port = (s.address() as { port: number }).port;
        s.close(() => resolve(port));
      });
    });
  }
  const alive = (pid: number) => {
    try {
      process.kill(pid, 0);
      return true;
    } catch {
      return false;
    }
  };

  test("start fails loudly when the port is taken; otherwise start answers /healthz from its own node, and stop ends its whole group", async () => {
    const state = mkdtempSync(path.join(tmpdir(), "sparwise-app-"));
    const port = await freePort();
    const env = { APP_STATE_DIR: state, PORT: String(port), DB_NAME: process.env.E2E_DB_NAME ?? "sparwise_e2e", SPARWISE_INPROCESS_WORKERS: "0" };

    // Something else holds the port: no success, a message that says so.
    const squatter: Server = createServer((s) => s.end("not sparwise\n")).listen(port);
    await new Promise((r) => squatter.once("listening", r));
    const refused = await run("start", env);
    squatter.close();
    expect(refused.code).not.toBe(0);
    expect(refused.out).toMatch(new RegExp(`Port ${port} is already in use`));

    const started = await run("start", env);
    expect(started.code, started.out).toBe(0);
    const pid = Number(readFileSync(path.join(state, "app.pid"), "utf8"));
    // The recorded pid is node running server.ts, leader of its own process group.
    expect(readFileSync(`/proc/${pid}/cmdline`, "utf8").split("\0")).toContain("server.ts");
    expect(readFileSync(`/proc/${pid}/stat`, "utf8").split(" ")[4]).toBe(String(pid));
    expect((await send(`http://127.0.0.1:${port}/healthz`)).status).toBe(200);

    const stopped = await run("stop", env);
    expect(stopped.code, stopped.out).toBe(0);
    expect(alive(pid)).toBe(false);
    await expect(send(`http://127.0.0.1:${port}/healthz`)).rejects.toThrow();
  });
});

// The production server: `npm start`, `npm run up` and the browser tests run this file with
// `node --import tsx server.ts` after `npm run build`. It is React Router's documented Express
// adapter (@react-router/express) plus what the framework's stock server cannot do:
//  - the client's address comes from the socket (or, with TRUST_PROXY_HOPS, from the proxy's
//    X-Forwarded-For entry) and reaches the sign-in limits through the load context;
//  - security headers on every response, with a fresh Content-Security-Policy nonce per request;
//  - Cache-Control: long for fingerprinted assets, no-store for everything the app renders;
//  - a declared body far over any limit gets its 413 before a byte is read.
// Settings (environment or .env): PORT (3000), HOST (all interfaces), TRUST_PROXY_HOPS (unset:
// trust no forwarded header), APP_URL (https → Strict-Transport-Security and Secure cookie).
import { randomBytes } from "node:crypto";
import { createServer } from "node:http";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import compression from "compression";
import express, { type NextFunction, type Request, type Response } from "express";
import { createRequestHandler } from "@react-router/express";
import type { AppLoadContext, ServerBuild } from "react-router";
import "./app/lib/load-context";
import { DRAIN_CAP } from "./app/lib/forms.server";
import { appServedOverHttps } from "./app/lib/app-url.server";

const root = path.dirname(fileURLToPath(import.meta.url));
// Same lookup as knexfile.ts: the working directory's .env first; set variables always win.
for (const file of [path.join(process.cwd(), ".env"), path.join(root, ".env")]) {
  try {
    process.loadEnvFile(file);
    break;
  } catch {
    // no .env here
  }
}

function fail(message: string): never {
  console.error(message);
  process.exit(1);
}

/** A declared body over this is refused unread; smaller overflows are drained by forms.server.ts. */
export const HARD_BODY_CAP = DRAIN_CAP;

/**
 * TRUST_PROXY_HOPS: how many proxies of ours stand in front (express's "trust proxy" hop count).
 * Unset or 0: none, so X-Forwarded-* headers are ignored and the socket's peer is the client.
 */
function trustProxyHops(): number {
  const raw = (process.env.TRUST_PROXY_HOPS ?? "").trim();
  if (raw === "") return 0;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0 || n > 10) fail(`TRUST_PROXY_HOPS must be a whole number of proxies (0–10), not "${raw}".`);
  return n;
}

/**
 * Scripts only from our own origin or inline with this response's nonce (React's and the router's
 * hydration scripts); no plugins, no <base> rewriting, forms post only here, and no framing
 * (frame-ancestors, plus X-Frame-Options for older browsers). Styles allow 'unsafe-inline'
 * because React's style props, the drawings' and the charts' SVG set style attributes, which a
 * nonce cannot cover; a style cannot run code. Workers (the section bench's engine) are files
 * under /assets.
 */
export function contentSecurityPolicy(nonce: string): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}'`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

function securityHeaders(https: boolean) {
  return (_req: Request, res: Response, next: NextFunction) => {
    const nonce = randomBytes(16).toString("base64");
    res.locals.cspNonce = nonce;
    res.setHeader("Content-Security-Policy", contentSecurityPolicy(nonce));
    res.setHeader("X-Frame-Options", "DENY");
    res.setHeader("X-Content-Type-Options", "nosniff");
    // same-origin, not no-referrer: with no-referrer a browser sends "Origin: null" on our own
    // POSTs, which the cookie API's origin check would refuse. Tokens in /invite and
    // /reset-password paths never leave the site either way.
    res.setHeader("Referrer-Policy", "same-origin");
    res.setHeader("Cross-Origin-Opener-Policy", "same-origin");
    res.setHeader("Cross-Origin-Resource-Policy", "same-origin");
    // Only when APP_URL says the site is reached over https: then the promise "this host is
    // https-only" is known to hold. (Browsers ignore the header on plain http anyway.)
    if (https) res.setHeader("Strict-Transport-Security", "max-age=31536000");
    next();
  };
}

/** A declared body far over every route's limit: 413 at once, and close rather than read it. */
function refuseHugeBodies(req: Request, res: Response, next: NextFunction) {
  const declared = Number(req.headers["content-length"] ?? 0);
  if (!(declared > HARD_BODY_CAP)) return next();
  res.setHeader("Connection", "close");
  const message = `body over ${HARD_BODY_CAP / 1024 / 1024} MB`;
  if (req.path.startsWith("/api/")) res.status(413).json({ error: message });
  else res.status(413).type("text/plain").send(`The request is too large: ${message}.`);
}

/** Everything the app renders (pages, data, API, downloads) is per-user: no cache keeps it. */
function noStoreByDefault(_req: Request, res: Response, next: NextFunction) {
  res.setHeader("Cache-Control", "no-store");
  // The adapter appends each header of the route's Response; a route's own Cache-Control
  // replaces this default instead of joining it.
  const append = res.append.bind(res);
  res.append = (field: string, value?: string | string[]) => (field.toLowerCase() === "cache-control" ? res.set(field, value) : append(field, value));
  next();
}

export function createApp(build: ServerBuild, options: { trustProxyHops: number; https: boolean; clientDir: string }) {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", options.trustProxyHops > 0 ? options.trustProxyHops : false);
  app.use(securityHeaders(options.https));
  // Build files are compressed at zlib's default level (they are cached for a year, so bytes count
  // more than the one compression). A rendered page is compressed anew on every view, and level 1
  // takes about a third of the default's time for a document a fifth or so larger (issue 9, item 8).
  const compressFile = compression();
  const compressRendered = compression({ level: 1 });
  app.use((req, res, next) => (req.path.startsWith("/assets/") ? compressFile(req, res, next) : compressRendered(req, res, next)));
  app.use(refuseHugeBodies);
  // Fingerprinted build output never changes under its name; the rest (favicon) may.
  app.use("/assets", express.static(path.join(options.clientDir, "assets"), { immutable: true, maxAge: "1y", index: false, redirect: false }));
  app.use(express.static(options.clientDir, { maxAge: "1h", index: false, redirect: false }));
  app.use(noStoreByDefault);
  app.all(
    "/{*path}",
    createRequestHandler({
      build,
      getLoadContext: (req, res): AppLoadContext => ({
        // req.ip is the socket's peer unless "trust proxy" names hops to count back through.
        clientAddress: req.ip ?? req.socket.remoteAddress ?? "",
        cspNonce: String(res.locals.cspNonce ?? ""),
      }),
    }),
  );
  // Last resort: log it, answer without a stack trace.
  app.use((error: unknown, _req: Request, res: Response, _next: NextFunction) => {
    console.error(error);
    if (res.headersSent) {
      res.destroy();
      return;
    }
    res.status(500).type("text/plain").send("Something went wrong on the server. Nothing you saved was lost.");
  });
  return app;
}

async function main() {
  const port = Number(process.env.PORT ?? 3000);
  if (!Number.isInteger(port) || port < 0 || port > 65535) fail(`PORT must be a port number, not "${process.env.PORT}".`);
  const hops = trustProxyHops();
  const https = appServedOverHttps();
  const buildDir = path.join(root, "build");
  const build = (await import(pathToFileURL(path.join(buildDir, "server", "index.js")).href).catch((e: unknown) =>
    fail(`No server build in ${buildDir}: run \`npm run build\` first.\n${String(e)}`),
  )) as ServerBuild;
  const app = createApp(build, { trustProxyHops: hops, https, clientDir: path.join(buildDir, "client") });
  const server = createServer(app);
  server.on("error", (e: NodeJS.ErrnoException) => {
    if (e.code === "EADDRINUSE") fail(`Port ${port} is already in use by another program; stop it (or set PORT) and start again.`);
    fail(`The server could not start: ${e.message}`);
  });
  server.listen(port, process.env.HOST || undefined, () => {
    const address = server.address();
    const actual = typeof address === "object" && address ? address.port : port;
    console.log(`Sparwise listening on http://localhost:${actual} (pid ${process.pid}${hops ? `, trusting ${hops} proxy hop(s)` : ""})`);
  });
  // The in-process sweep runner (loaded with the build) already stops on these signals and
  // exits once its sweeps are settled; here the listener closes so no new request starts. With
  // no runner (SPARWISE_INPROCESS_WORKERS=0) nothing else would exit, so this handler does.
  for (const signal of ["SIGTERM", "SIGINT"] as const) {
    const exitHere = process.listenerCount(signal) === 0;
    process.once(signal, () => {
      server.close();
      server.closeIdleConnections();
      if (exitHere) process.exit(signal === "SIGINT" ? 130 : 0);
    });
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) await main();

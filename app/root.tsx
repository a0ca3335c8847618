import { Links, Meta, Outlet, Scripts, ScrollRestoration, isRouteErrorResponse } from "react-router";
import type { Route } from "./+types/root";
import "./app.css";
import { z } from "zod";
import { useNonce } from "./lib/nonce";

// In the browser zod would probe eval to compile faster parsers; the Content-Security-Policy
// (server.ts) forbids eval, so the probe would only raise a violation report. The interpreted
// parsers give the same answers. (The server keeps the compiled ones: it has no CSP to obey.)
if (typeof document !== "undefined") z.config({ jitless: true });

export function Layout({ children }: { children: React.ReactNode }) {
  const nonce = useNonce();
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <link rel="icon" href="/favicon.svg" type="image/svg+xml" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen">
        {children}
        <ScrollRestoration nonce={nonce} />
        <Scripts nonce={nonce} />
      </body>
    </html>
  );
}

export default function App() {
  return <Outlet />;
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  let title = "Something went wrong";
  let detail = "An unexpected error occurred. Nothing you saved was lost.";
  if (isRouteErrorResponse(error)) {
    title = error.status === 404 ? "Not found" : error.status === 403 ? "Not allowed" : `Error ${error.status}`;
    detail = typeof error.data === "string" && error.data ? error.data : error.statusText || detail;
  }
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1 className="text-2xl font-bold">{title}</h1>
      <p className="mt-2">{detail}</p>
      <a className="mt-4 inline-block text-accent underline" href="/">Back to the dashboard</a>
    </main>
  );
}

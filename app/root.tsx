import { Links, Meta, Outlet, Scripts, ScrollRestoration } from "react-router";
import type { Route } from "./+types/root";
import "./app.css";
import { z } from "zod";
import { useNonce } from "./lib/nonce";
import { ErrorMessage } from "./components/ErrorMessage";

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

// Errors outside the signed-in frame (public pages, or the frame itself failing to render).
export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return (
    <main className="px-4">
      <ErrorMessage error={error} />
    </main>
  );
}

import type { ReactNode } from "react";
import { Outlet, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/app-layout";
import { AppHeader, SparwiseMark } from "~/components/AppHeader";
import { ErrorMessage } from "~/components/ErrorMessage";
import { requireUserWithNotices } from "~/lib/auth.server";

// The frame of every signed-in page. Child loaders run in parallel with this one, so each
// still calls its own guard; this one only feeds the header (the user and their unread notices
// come from one query, shared with the child's guard).
export async function loader({ request }: Route.LoaderArgs) {
  return requireUserWithNotices(request);
}

function Frame({ header, children }: { header: ReactNode; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#content" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded-md focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      {header}
      {/* min-w-0: a wide child (a table, a chart) scrolls in its own box instead of widening the page */}
      <main id="content" tabIndex={-1} className="mx-auto w-full min-w-0 max-w-6xl flex-1 px-4 py-6 focus:outline-none">
        {children}
      </main>
      <footer className="no-print border-t border-ink/10 px-4 py-4 text-center text-xs text-ink/70">
        Sparwise sizes sections; a licensed engineer approves them.
      </footer>
    </div>
  );
}

export default function AppLayout({ loaderData }: Route.ComponentProps) {
  return (
    <Frame header={<AppHeader user={loaderData.user} unreadNotices={loaderData.unreadNotices} />}>
      <Outlet />
    </Frame>
  );
}

// A page of the frame that refuses (403), finds nothing (404) or fails keeps the header and
// navigation, so the person can go on from there; the status is the child's own. When this
// route's own loader is what failed there is no user to show, so the header is the mark alone.
export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  const frame = useRouteLoaderData<typeof loader>("routes/app-layout");
  const header = frame ? (
    <AppHeader user={frame.user} unreadNotices={frame.unreadNotices} />
  ) : (
    <header className="no-print border-b border-ink/15 bg-white/80">
      <div className="mx-auto flex max-w-6xl items-center gap-2 px-4 py-3 text-accent-strong">
        <SparwiseMark />
        <span className="text-lg font-bold tracking-tight text-ink">Sparwise</span>
      </div>
    </header>
  );
  return (
    <Frame header={header}>
      <ErrorMessage error={error} />
    </Frame>
  );
}

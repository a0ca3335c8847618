import { Outlet } from "react-router";
import type { Route } from "./+types/app-layout";
import { AppHeader } from "~/components/AppHeader";
import { requireUser } from "~/lib/auth.server";
import { unreadNoticeCount } from "~/lib/notifications.server";

// The frame of every signed-in page. Child loaders run in parallel with this one, so each
// still calls its own guard; this one only feeds the header.
export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return { user, unreadNotices: await unreadNoticeCount(user.id) };
}

export default function AppLayout({ loaderData }: Route.ComponentProps) {
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#content" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded-md focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <AppHeader user={loaderData.user} unreadNotices={loaderData.unreadNotices} />
      <main id="content" tabIndex={-1} className="mx-auto w-full max-w-6xl flex-1 px-4 py-6 focus:outline-none">
        <Outlet />
      </main>
      <footer className="no-print border-t border-ink/10 px-4 py-4 text-center text-xs text-ink/70">
        Sparwise sizes sections; a licensed engineer approves them.
      </footer>
    </div>
  );
}

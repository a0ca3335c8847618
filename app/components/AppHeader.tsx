import { Form, NavLink } from "react-router";
import { ROLE_LABELS, type Role } from "~/lib/roles";

export interface HeaderUser {
  name: string;
  email: string;
  teamId: number;
  teamName: string;
  role: Role;
  teams: { id: number; name: string; role: Role }[];
}

// The Sparwise mark: a welded I section in outline, drawn here so it is ours and needs no asset.
export function SparwiseMark({ className = "h-7 w-7" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect x="4" y="4" width="24" height="5" rx="1" fill="currentColor" />
      <rect x="13.5" y="9" width="5" height="14" fill="currentColor" opacity="0.75" />
      <rect x="7" y="23" width="18" height="5" rx="1" fill="currentColor" />
    </svg>
  );
}

const navItems = (isAdmin: boolean) => [
  { to: "/", label: "Dashboard", end: true },
  { to: "/projects", label: "Projects", end: false },
  { to: "/bench", label: "Section bench", end: false },
  { to: "/stock-lists", label: "Stock lists", end: false },
  ...(isAdmin ? [{ to: "/admin", label: "Admin", end: false }] : []),
];

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-2 text-sm font-semibold whitespace-nowrap transition-colors ${
    isActive ? "bg-accent text-white" : "text-ink hover:bg-ink/10"
  }`;

export function AppHeader({ user, unreadNotices }: { user: HeaderUser; unreadNotices: number }) {
  return (
    <header className="no-print border-b border-ink/15 bg-white/80">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <a href="/" className="flex items-center gap-2 rounded-md text-accent-strong">
          <SparwiseMark />
          <span className="text-lg font-bold tracking-tight text-ink">Sparwise</span>
        </a>
        {user.teams.length > 1 ? (
          <TeamSwitcher user={user} />
        ) : (
          <span className="hidden text-sm text-ink/70 sm:inline" title="Your team">
            {user.teamName}
          </span>
        )}

        {/* Wraps rather than scrolls: a sideways-scrolling nav hid "Stock lists" at phone width. */}
        <nav aria-label="Main" className="order-last -mx-1 flex w-full flex-wrap gap-1 md:order-none md:w-auto">
          {navItems(user.role === "admin").map((item) => (
            <NavLink key={item.to} to={item.to} end={item.end} className={linkClass}>
              {item.label}
            </NavLink>
          ))}
        </nav>

        <div className="ml-auto flex items-center gap-2">
          <NavLink to="/notices" className={linkClass} aria-label={`Notices, ${unreadNotices} unread`}>
            Notices
            {unreadNotices > 0 && (
              <span className="ml-1 rounded-full bg-caution px-1.5 py-0.5 text-xs font-bold text-white">{unreadNotices}</span>
            )}
          </NavLink>
          <details className="relative">
            <summary className="flex cursor-pointer list-none items-center gap-2 rounded-md px-3 py-2 text-sm font-semibold hover:bg-ink/10">
              <span aria-hidden="true" className="flex h-7 w-7 items-center justify-center rounded-full bg-ink text-xs font-bold text-paper">
                {initials(user.name)}
              </span>
              <span className="hidden sm:inline">{user.name}</span>
              <span className="sr-only">Open the user menu</span>
            </summary>
            <div className="absolute right-0 z-20 mt-2 w-64 rounded-md border border-ink/15 bg-white p-2 shadow-lg">
              <p className="px-3 pt-1 text-sm font-semibold">{user.name}</p>
              <p className="px-3 text-xs text-ink/70">{user.email}</p>
              <p className="px-3 pb-2 text-xs text-ink/70">
                {ROLE_LABELS[user.role]} · {user.teamName}
              </p>
              <a href="/account" className="block rounded-md px-3 py-2 text-sm hover:bg-ink/10">
                Account and API tokens
              </a>
              <a href="/messages" className="block rounded-md px-3 py-2 text-sm hover:bg-ink/10">
                My messages
              </a>
              <Form method="post" action="/sign-out">
                <button type="submit" className="w-full rounded-md px-3 py-2 text-left text-sm hover:bg-ink/10">
                  Sign out
                </button>
              </Form>
            </div>
          </details>
        </div>
      </div>
    </header>
  );
}

// A plain form (works without scripts): the server checks the membership and keeps the choice in the session.
function TeamSwitcher({ user }: { user: HeaderUser }) {
  return (
    <Form method="post" action="/account" className="flex items-center gap-1 text-sm">
      <input type="hidden" name="intent" value="switchTeam" />
      <label htmlFor="acting-team" className="sr-only">Team you act in</label>
      <select id="acting-team" name="teamId" defaultValue={user.teamId} className="max-w-48 truncate rounded-md border border-ink/30 bg-white px-2 py-1 text-sm">
        {user.teams.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name} ({ROLE_LABELS[t.role]})
          </option>
        ))}
      </select>
      <button type="submit" className="rounded-md px-2 py-1 text-sm font-semibold hover:bg-ink/10">Switch</button>
    </Form>
  );
}

function initials(name: string): string {
  const parts = name.trim().split(/\s+/);
  return ((parts[0]?.[0] ?? "") + (parts.length > 1 ? (parts[parts.length - 1]?.[0] ?? "") : "")).toUpperCase() || "?";
}

import type { Route } from "./+types/dashboard";
import { requirePermission } from "~/lib/auth.server";
import { can, ROLE_LABELS } from "~/lib/roles";

export function meta() {
  return [{ title: "Dashboard · Sparwise" }];
}

// Placeholder until the workflow pages land: who you are and where to start.
export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  return { user };
}

export default function Dashboard({ loaderData }: Route.ComponentProps) {
  const { user } = loaderData;
  const starts = [
    can(user.role, "createProject") && { href: "/projects", title: "Projects", text: "Start a project, write a brief and run a sweep." },
    can(user.role, "review") && { href: "/projects", title: "Reviews", text: "Open an option, recheck it with altered limits, approve or return it." },
    { href: "/bench", title: "Section bench", text: "Build any section from plates and see its properties and stresses." },
    can(user.role, "manageTeam") && { href: "/admin", title: "Team", text: "Invite members, change roles, follow the outbox." },
  ].filter((x): x is { href: string; title: string; text: string } => Boolean(x));
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-bold">Dashboard</h1>
        <p className="mt-1 text-ink/80">
          Signed in as {user.name}, {ROLE_LABELS[user.role].toLowerCase()} at {user.teamName}.
        </p>
      </div>
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {starts.map((s) => (
          <li key={s.title}>
            <a href={s.href} className="block h-full rounded-lg border border-ink/15 bg-white p-4 hover:border-accent">
              <h2 className="font-bold text-accent-strong">{s.title}</h2>
              <p className="mt-1 text-sm text-ink/80">{s.text}</p>
            </a>
          </li>
        ))}
      </ul>
    </div>
  );
}

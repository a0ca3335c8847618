import type { Route } from "./+types/dashboard";
import { optionNo, sweepNo } from "~/lib/numbering";
import { projectNumbers } from "~/lib/numbering.server";
import { requirePermission } from "~/lib/auth.server";
import { can, ROLE_LABELS } from "~/lib/roles";
import { dashboardData } from "~/lib/dashboard.server";

export function meta() {
  return [{ title: "Dashboard · Sparwise" }];
}

// Who you are, where to start, and the work waiting: my projects, my sweeps, reviews, the queue.
export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const d = await dashboardData(user);
  const numbers = await projectNumbers({ sweeps: d.sweeps.flatMap((s) => [s.id, s.recheckOf]), options: d.reviews.map((r) => r.id) });
  return { user, ...d, numbers };
}

export default function Dashboard({ loaderData }: Route.ComponentProps) {
  const { user, projects, sweeps, reviews, queue, numbers } = loaderData;
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
      <div className="grid gap-6 md:grid-cols-2">
        <section aria-labelledby="my-projects-h" className="rounded-lg border border-ink/15 bg-white p-4">
          <h2 id="my-projects-h" className="font-bold">
            My projects
          </h2>
          {projects.length ? (
            <ul className="mt-2 space-y-1 text-sm">
              {projects.map((p) => (
                <li key={p.id}>
                  <a href={`/projects/${p.id}`} className="text-accent underline">
                    {p.name}
                  </a>
                  {p.client ? <span className="text-ink/70"> · {p.client}</span> : null}
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-2 text-sm text-ink/70">You are not on any project yet.</p>
          )}
        </section>
        <section aria-labelledby="reviews-h" className="rounded-lg border border-ink/15 bg-white p-4">
          <h2 id="reviews-h" className="font-bold">
            Options waiting for review
          </h2>
          {reviews.length ? (
            <ul className="mt-2 space-y-1 text-sm" data-testid="awaiting-review">
              {reviews.map((r) => (
                <li key={r.id}>
                  <a href={`/options/${r.id}`} className="text-accent underline">
                    Option {optionNo(numbers, r.id)}
                  </a>{" "}
                  in {r.project}
                  {r.author ? ` (from ${r.author})` : ""}
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-2 text-sm text-ink/70">Nothing waiting.</p>
          )}
        </section>
        <section aria-labelledby="sweeps-h" className="rounded-lg border border-ink/15 bg-white p-4">
          <h2 id="sweeps-h" className="font-bold">
            My running and recent sweeps
          </h2>
          {sweeps.length ? (
            <ul className="mt-2 space-y-1 text-sm">
              {sweeps.map((s) => (
                <li key={s.id}>
                  <a href={`/sweeps/${s.id}`} className="text-accent underline">
                    Sweep {sweepNo(numbers, s.id)}
                  </a>{" "}
                  {s.brief ? `· ${s.brief} ` : ""}
                  {s.recheckOf ? `· recheck of sweep ${sweepNo(numbers, s.recheckOf)} ` : ""}· {s.status}
                  {s.status === "running" ? (s.percent === null ? " (starting)" : ` (${s.percent}% of the grid's shapes settled)`) : ""}
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-2 text-sm text-ink/70">No sweeps yet.</p>
          )}
        </section>
        <section aria-labelledby="queue-h" className="rounded-lg border border-ink/15 bg-white p-4">
          <h2 id="queue-h" className="font-bold">
            Queue
          </h2>
          <p className="mt-2 text-sm tabular-nums" data-testid="queue-health">
            {queue.running} running · {queue.queued} waiting (whole team)
          </p>
        </section>
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

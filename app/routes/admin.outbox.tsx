import type { Route } from "./+types/admin.outbox";
import { requirePermission } from "~/lib/auth.server";
import { db } from "~/lib/db.server";

export function meta() {
  return [{ title: "Outbox · Sparwise" }];
}

// The local stand-in for e-mail: every message the team's members were sent, newest first.
export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "manageTeam");
  const messages = await db("outbox")
    .where({ team_id: user.teamId })
    .orderBy("id", "desc")
    .limit(200)
    .select("id", "to_address as to", "subject", "text_body as body", "transport", "created_at as createdAt");
  return { messages: messages as { id: number; to: string; subject: string; body: string; transport: string; createdAt: Date }[] };
}

export default function Outbox({ loaderData }: Route.ComponentProps) {
  const { messages } = loaderData;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-4">
        <h1 className="text-2xl font-bold">Outbox</h1>
        <a href="/admin" className="text-sm font-semibold text-accent-strong underline">Back to members</a>
      </div>
      <p className="text-sm text-ink/80">Every e-mail Sparwise sent to your team: invitations and password resets. The newest 200 are shown.</p>
      {messages.length === 0 ? (
        <p className="text-sm text-ink/70">Nothing sent yet.</p>
      ) : (
        <ul className="space-y-3">
          {messages.map((m) => (
            <li key={m.id} className="rounded-lg border border-ink/15 bg-white">
              <details>
                <summary className="flex cursor-pointer flex-wrap gap-x-4 gap-y-1 px-4 py-3 text-sm">
                  <span className="font-semibold">{m.subject}</span>
                  <span>to {m.to}</span>
                  <time dateTime={new Date(m.createdAt).toISOString()} className="text-ink/70">
                    {new Date(m.createdAt).toISOString().slice(0, 16).replace("T", " ")} UTC
                  </time>
                  {m.transport !== "capture" && <span className="text-caution">{m.transport}</span>}
                </summary>
                <pre className="overflow-x-auto whitespace-pre-wrap border-t border-ink/10 px-4 py-3 font-sans text-sm">{m.body}</pre>
              </details>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

import { Form, data } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/notices";
import { requireUser } from "~/lib/auth.server";
import { db } from "~/lib/db.server";
import { badRequest, parseForm, readForm } from "~/lib/forms.server";
import { Button } from "~/components/ui";

export function meta() {
  return [{ title: "Notices · Sparwise" }];
}

// The signed-in user's in-app notices (sweeps that ended, and whatever else notify() records),
// newest first. Everyone reads only their own; marking read touches only their own rows.
export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const notices = await db("notifications")
    .where({ user_id: user.id })
    .orderBy("id", "desc")
    .limit(100)
    .select("id", "title", "body", "link", "read_at as readAt", "created_at as createdAt");
  return { notices: notices as { id: number; title: string; body: string | null; link: string | null; readAt: Date | null; createdAt: Date }[] };
}

const actionSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({ intent: z.literal("readAll") }),
    z.object({ intent: z.literal("read"), id: z.coerce.number({ error: "id must be a notice number" }).int({ message: "id must be a notice number" }).positive({ message: "id must be a notice number" }) }),
  ],
  { error: 'intent must be "readAll" or "read"' },
);

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const form = await readForm(request, 4 * 1024);
  const parsed = parseForm(form, actionSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  const q = db("notifications").where({ user_id: user.id }).whereNull("read_at");
  if (parsed.data.intent === "read") q.andWhere({ id: parsed.data.id });
  const n = await q.update({ read_at: db.fn.now() });
  return data({ marked: n });
}

const when = (d: Date) => new Date(d).toISOString().slice(0, 16).replace("T", " ") + " UTC";

export default function Notices({ loaderData }: Route.ComponentProps) {
  const { notices } = loaderData;
  const unread = notices.filter((n) => !n.readAt).length;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-4">
        <h1 className="text-2xl font-bold">Notices</h1>
        {unread > 0 && (
          <Form method="post">
            <input type="hidden" name="intent" value="readAll" />
            <Button variant="quiet">Mark all {unread} read</Button>
          </Form>
        )}
      </div>
      <div className="max-w-3xl text-sm text-ink/80" data-testid="notices-about">
        <p>Noted here for you, and each also e-mailed to you:</p>
        <ul className="list-disc pl-5">
          <li>a sweep you started has ended: finished, stopped at its time budget, failed or cancelled;</li>
          <li>someone asks you to review an option;</li>
          <li>an option you saved was approved or returned, with the reviewer's comment.</li>
        </ul>
        <p>The newest 100 are shown.</p>
      </div>
      {notices.length === 0 ? (
        <p className="text-sm text-ink/70">No notices yet.</p>
      ) : (
        <ul className="space-y-2">
          {notices.map((n) => (
            <li key={n.id} className={`rounded-lg border px-4 py-3 text-sm ${n.readAt ? "border-ink/10 bg-white/60" : "border-accent/40 bg-white"}`}>
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                {n.link ? (
                  <a href={n.link} className="font-semibold text-accent-strong underline">
                    {n.title}
                  </a>
                ) : (
                  <span className="font-semibold">{n.title}</span>
                )}
                <time dateTime={new Date(n.createdAt).toISOString()} className="text-ink/70">
                  {when(n.createdAt)}
                  {!n.readAt && <span className="ml-2 font-semibold text-accent-strong">new</span>}
                </time>
              </div>
              {n.body && <p className="mt-1 text-ink/85">{n.body}</p>}
              {!n.readAt && (
                <Form method="post" className="mt-1">
                  <input type="hidden" name="intent" value="read" />
                  <input type="hidden" name="id" value={n.id} />
                  <button className="text-xs text-ink/70 underline">Mark read</button>
                </Form>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

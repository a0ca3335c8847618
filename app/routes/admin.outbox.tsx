import type { Route } from "./+types/admin.outbox";
import { MessageList } from "~/components/MessageList";
import { requirePermission } from "~/lib/auth.server";
import { listTeamOutbox } from "~/lib/outbox.server";

export function meta() {
  return [{ title: "Outbox · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "manageTeam");
  return { messages: await listTeamOutbox(user.teamId) };
}

export default function Outbox({ loaderData }: Route.ComponentProps) {
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-4">
        <h1 className="text-2xl font-bold">Outbox</h1>
        <a href="/admin" className="text-sm font-semibold text-accent-strong underline">Back to members</a>
      </div>
      <div className="max-w-3xl space-y-1 text-sm text-ink/80" data-testid="outbox-about">
        <p>Every e-mail Sparwise sent for your team, newest 200 first:</p>
        <ul className="list-disc pl-5">
          <li>invitations to join the team, including to people who are not members yet;</li>
          <li>password-reset links asked for by the team's members;</li>
          <li>a sweep ended (finished, stopped at its time budget, failed or cancelled), to whoever started it;</li>
          <li>review requests, to the team's reviewers, and review decisions, to whoever saved the option.</li>
        </ul>
        <p>
          The secret part of each link is hidden: only the person a message was sent to can open it, under{" "}
          <a href="/messages" className="text-accent-strong underline">
            My messages
          </a>
          .
        </p>
      </div>
      <MessageList messages={loaderData.messages} empty="Nothing sent yet." />
    </div>
  );
}

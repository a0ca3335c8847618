import type { Route } from "./+types/messages";
import { MessageList } from "~/components/MessageList";
import { requireUser } from "~/lib/auth.server";
import { listMyMessages } from "~/lib/outbox.server";

export function meta() {
  return [{ title: "My messages · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return { email: user.email, messages: await listMyMessages(user.email) };
}

export default function Messages({ loaderData }: Route.ComponentProps) {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">My messages</h1>
      <p className="max-w-3xl text-sm text-ink/80">
        The e-mails Sparwise sent to {loaderData.email}, newest 200 first, with their links whole. They stand in for your mailbox while
        Sparwise runs without a mail server.
      </p>
      <MessageList messages={loaderData.messages} empty="No messages for you yet." />
    </div>
  );
}

import { db } from "~/lib/db.server";

// The outbox stands in for each recipient's mailbox (no mail server runs locally). Who reads what:
// - the recipient: every message sent to their own address, in full (/messages);
// - a team admin: the team's messages with every token in a link masked (/admin/outbox), so no admin
//   can use another person's reset or invitation link;
// - the person running the server: any message in full from the command line (`npm run outbox`),
//   as they would a local mail catcher.

export interface OutboxMessage {
  id: number;
  to: string;
  subject: string;
  body: string;
  transport: string;
  createdAt: Date;
}

const LIST_LIMIT = 200;

/**
 * Hides the secret part of every link: a path segment of 20 or more URL-safe characters (the
 * invitation and reset tokens are 43). Ordinary ids and words in paths are far shorter.
 */
export function maskTokens(text: string): string {
  return text.replace(/\/[A-Za-z0-9_-]{20,}/g, "/[token hidden]");
}

function select(query: ReturnType<typeof db>) {
  return query.orderBy("id", "desc").limit(LIST_LIMIT).select("id", "to_address as to", "subject", "text_body as body", "transport", "created_at as createdAt") as Promise<OutboxMessage[]>;
}

/** The admin's view: the team's messages, newest first, tokens masked before they leave the server. */
export async function listTeamOutbox(teamId: number): Promise<OutboxMessage[]> {
  const rows = await select(db("outbox").where({ team_id: teamId }));
  return rows.map((m) => ({ ...m, body: maskTokens(m.body) }));
}

/** The recipient's mailbox: everything sent to their address, from any team, in full. */
export async function listMyMessages(email: string): Promise<OutboxMessage[]> {
  return select(db("outbox").where({ to_address: email }));
}

export interface OutboxQuery {
  id?: number;
  to?: string;
  limit?: number;
}

/** For `npm run outbox`: messages in full, the newest `limit` (10) oldest first, so the newest ends last. */
export async function readOutbox(q: OutboxQuery = {}): Promise<OutboxMessage[]> {
  let query = db("outbox");
  if (q.id !== undefined) query = query.where({ id: q.id });
  if (q.to) query = query.where({ to_address: q.to.trim().toLowerCase() });
  const rows = await query
    .orderBy("id", "desc")
    .limit(Math.max(1, Math.min(q.limit ?? 10, 1000)))
    .select("id", "to_address as to", "subject", "text_body as body", "transport", "created_at as createdAt");
  return (rows as OutboxMessage[]).reverse();
}

export function formatMessage(m: OutboxMessage): string {
  const at = new Date(m.createdAt).toISOString().slice(0, 19).replace("T", " ");
  return [`#${m.id}  ${at} UTC  (${m.transport})`, `To:      ${m.to}`, `Subject: ${m.subject}`, "", m.body.trimEnd(), ""].join("\n");
}

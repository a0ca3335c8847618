import type { Knex } from "knex";
import { db } from "~/lib/db.server";

export interface Notice {
  title: string;
  body?: string | null;
  /** A same-site path, e.g. "/sweeps/12". */
  link?: string | null;
}

export async function notify(userId: number, notice: Notice, trx?: Knex.Transaction): Promise<void> {
  await (trx ?? db)("notifications").insert({
    user_id: userId,
    title: notice.title.slice(0, 200),
    body: notice.body ?? null,
    link: notice.link && notice.link.startsWith("/") ? notice.link.slice(0, 300) : null,
  });
}


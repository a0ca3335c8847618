import type { Knex } from "knex";
import { db } from "~/lib/db.server";

export interface ActivityEntry {
  teamId: number;
  projectId?: number | null;
  userId: number | null;
  /** Short verb phrase in snake case, e.g. "member_invited", "sweep_started", "option_approved". */
  action: string;
  subjectType?: string | null;
  subjectId?: number | null;
  detail?: unknown;
}

/** One row in activity_log; pass the transaction so the entry commits (or rolls back) with the change it records. */
export async function logActivity(entry: ActivityEntry, trx?: Knex.Transaction): Promise<void> {
  await (trx ?? db)("activity_log").insert({
    team_id: entry.teamId,
    project_id: entry.projectId ?? null,
    user_id: entry.userId,
    action: entry.action.slice(0, 60),
    subject_type: entry.subjectType ?? null,
    subject_id: entry.subjectId ?? null,
    detail: entry.detail === undefined ? null : JSON.stringify(entry.detail),
  });
}

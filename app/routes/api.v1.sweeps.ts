import { requireApiUser } from "~/lib/auth.server";
import { plainJson } from "~/lib/plain-numbers";
import { readJson } from "~/lib/forms.server";
import { db } from "~/lib/db.server";
import { can } from "~/lib/roles";
import { SWEEP_BODY_LIMIT, createSweepFromRequest } from "~/workers/sweep-api.server";
import { progressCountsWords, queueHealth } from "~/workers/queue.server";

// POST /api/v1/sweeps: { briefId } or { problem } (+ projectId, recheckOf); Idempotency-Key
// header honoured per user. 202 with the sweep's id and URLs; a replay of the same key answers
// as the first request did (202, the same id) with created: false and the sweep's status now
// ("succeeded" once it has run), so a client that lost the first answer learns where it stands.
export async function action({ request }: { request: Request }) {
  const user = await requireApiUser(request);
  // Roles that may run no sweep at all are refused before the body is read; which of the two
  // permissions applies (a recheck or not) is decided once the body says.
  if (!can(user.role, "runSweep") && !can(user.role, "recheck"))
    return Response.json({ error: `role ${user.role} may not run sweeps` }, { status: 403 });
  const body = await readJson(request, SWEEP_BODY_LIMIT);
  const { id, created, status } = await createSweepFromRequest(user, body, request.headers.get("idempotency-key"));
  const url = `/api/v1/sweeps/${id}`;
  return Response.json({ id, created, status, url, page: `/sweeps/${id}` }, { status: 202, headers: { Location: url } });
}

// GET /api/v1/sweeps: the team's latest sweeps and the queue's health (for dashboards and scripts).
export async function loader({ request }: { request: Request }) {
  const user = await requireApiUser(request, "read");
  const rows = await db("sweeps")
    .where({ team_id: user.teamId })
    .orderBy("id", "desc")
    .limit(50)
    .select("id", "status", "project_id", "brief_id", "owner_id", "progress_done", "progress_total", "progress_unit", "queued_at", "finished_at");
  return plainJson({
    health: await queueHealth(user.teamId),
    items: rows.map((r) => ({
      id: r.id,
      status: r.status,
      projectId: r.project_id,
      briefId: r.brief_id,
      ownerId: r.owner_id,
      progress: { done: Number(r.progress_done), total: Number(r.progress_total), counts: progressCountsWords(r.progress_unit) },
      queuedAt: r.queued_at,
      finishedAt: r.finished_at,
      url: `/api/v1/sweeps/${r.id}`,
    })),
  });
}

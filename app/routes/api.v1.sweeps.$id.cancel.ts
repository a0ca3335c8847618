import { requireApiUser } from "~/lib/auth.server";
import { cancelSweep } from "~/workers/queue.server";
import { requireTeamSweep, sweepIdParam } from "~/workers/sweep-api.server";

// POST /api/v1/sweeps/:id/cancel (no body needed): owners (engineers, or reviewers for their
// rechecks) cancel their own sweeps, admins any in the team. 200 with the new state; a running
// sweep answers status "running" with cancelRequested true until its worker stops it (< 1 s).
// The body, if any, is ignored (never read), so no body can be too large or malformed.
export async function action({ request, params }: { request: Request; params: { id?: string } }) {
  const user = await requireApiUser(request);
  const id = sweepIdParam(params.id);
  await requireTeamSweep(id, user);
  const result = await cancelSweep(id, user);
  return Response.json(result);
}

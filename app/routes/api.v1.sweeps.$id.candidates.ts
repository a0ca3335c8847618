import { requireApiUser } from "~/lib/auth.server";
import { fieldErrorsFrom } from "~/lib/forms.server";
import { candidatesQuerySchema, listCandidates } from "~/workers/queue.server";
import { requireTeamSweep, sweepIdParam } from "~/workers/sweep-api.server";

// GET /api/v1/sweeps/:id/candidates?page=&pageSize=&sort=&family=&frontOnly= : the stored
// candidates (front, family bests, best; see candidatesToStore), paged.
export async function loader({ request, params }: { request: Request; params: { id?: string } }) {
  const user = await requireApiUser(request, "read");
  const sweep = await requireTeamSweep(sweepIdParam(params.id), user);
  const query = Object.fromEntries(new URL(request.url).searchParams);
  const parsed = candidatesQuerySchema.safeParse(query);
  if (!parsed.success) {
    const errors = fieldErrorsFrom(parsed.error);
    return Response.json({ error: Object.values(errors)[0], errors }, { status: 400 });
  }
  const page = await listCandidates(sweep.id, parsed.data);
  return Response.json({ sweepId: sweep.id, status: sweep.status, ...page });
}

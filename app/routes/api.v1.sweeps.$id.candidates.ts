import { requireApiUser } from "~/lib/auth.server";
import { plainJson } from "~/lib/plain-numbers";
import { fieldErrorsFrom } from "~/lib/forms.server";
import { candidatesQuerySchema } from "~/workers/queue.server";
import { candidatesPage } from "~/lib/sweep-page.server";
import { requireTeamSweep, sweepIdParam } from "~/workers/sweep-api.server";

// GET /api/v1/sweeps/:id/candidates?page=&pageSize=&sort=&family=&frontOnly=&depth=&depthBest=&depthMin=&depthMax= :
// the stored candidates (front, family bests, each family's lightest at every depth, best; see candidatesToStore), paged, sorted and filtered here (the
// sweep page's table reads its pages from this); under the EN 1993 basis each with its design figures.
export async function loader({ request, params }: { request: Request; params: { id?: string } }) {
  const user = await requireApiUser(request, "read");
  const sweep = await requireTeamSweep(sweepIdParam(params.id), user);
  const query = Object.fromEntries(new URL(request.url).searchParams);
  const parsed = candidatesQuerySchema.safeParse(query);
  if (!parsed.success) {
    const errors = fieldErrorsFrom(parsed.error);
    return Response.json({ error: Object.values(errors)[0], errors }, { status: 400 });
  }
  const page = await candidatesPage(sweep, parsed.data);
  return plainJson({ sweepId: sweep.id, status: sweep.status, provenLightest: sweep.provenLightest, ...page });
}

import { requireApiUser } from "~/lib/auth.server";
import { plainJson } from "~/lib/plain-numbers";
import { requireTeamSweep, sweepIdParam } from "~/workers/sweep-api.server";
import { cautionText } from "~/lib/caution";

// GET /api/v1/sweeps/:id: status, progress (done/total, elapsed, estimate), counts, best. The
// sweep page polls this. Another team's sweep is a 404. Results read through the API carry the
// same caution as the pages (product.md, "Safety").
export async function loader({ request, params }: { request: Request; params: { id?: string } }) {
  const user = await requireApiUser(request, "read");
  const sweep = await requireTeamSweep(sweepIdParam(params.id), user);
  return plainJson(
    { ...sweep, url: `/api/v1/sweeps/${sweep.id}`, candidatesUrl: `/api/v1/sweeps/${sweep.id}/candidates`, page: `/sweeps/${sweep.id}`, caution: cautionText(sweep.problem) },
    { headers: { "Cache-Control": "no-store" } },
  );
}

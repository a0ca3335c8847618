// The dashboard's lists: my projects, my running and recent sweeps, options waiting for review,
// and the queue's health (how many sweeps wait and run across the team).
import { db } from "~/lib/db.server";
import { optionsAwaitingReview } from "~/lib/options.server";
import type { SessionUser } from "~/lib/auth.server";

export async function dashboardData(user: SessionUser) {
  const [projects, sweeps, reviews, queue] = await Promise.all([
    db("projects as p")
      .where("p.team_id", user.teamId)
      .whereNull("p.archived_at")
      .where((q) => q.where("p.created_by", user.id).orWhereExists(db("project_members as pm").whereRaw("pm.project_id = p.id").where("pm.user_id", user.id)))
      .orderBy("p.updated_at", "desc")
      .limit(8)
      .select("p.id", "p.name", "p.client"),
    db("sweeps as s")
      .leftJoin("briefs as b", "b.id", "s.brief_id")
      .where({ "s.team_id": user.teamId, "s.owner_id": user.id })
      .orderByRaw("s.status in ('queued','running') desc, s.id desc")
      .limit(10)
      .select("s.id", "s.status", "s.recheck_of", "s.progress_done", "s.progress_total", "b.name as brief"),
    optionsAwaitingReview(user.teamId, 10),
    db("sweeps").where({ team_id: user.teamId }).whereIn("status", ["queued", "running"]).groupBy("status").select("status").count({ n: "*" }),
  ]);
  const count = (s: string) => Number((queue as { status: string; n: number }[]).find((q) => q.status === s)?.n ?? 0);
  return {
    projects: projects as { id: number; name: string; client: string | null }[],
    sweeps: (sweeps as Record<string, unknown>[]).map((s) => ({
      id: s.id as number,
      status: s.status as string,
      recheckOf: s.recheck_of as number | null,
      brief: (s.brief as string | null) ?? null,
      /** share of the grid's shapes settled; null before the search has counted its grid */
      percent: Number(s.progress_total) > 0 ? Math.min(100, Math.floor((100 * Number(s.progress_done)) / Number(s.progress_total))) : null,
    })),
    reviews: (reviews as Record<string, unknown>[]).map((r) => ({ id: r.id as number, project: r.project as string, author: r.author as string | null })),
    queue: { queued: count("queued"), running: count("running") },
  };
}

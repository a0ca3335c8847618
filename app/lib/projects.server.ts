// Projects, their members and briefs. Every getter takes the caller's team and answers 404
// for another team's rows, so an id in a URL never leaks whether the row exists.
import { projectFormSchema } from "~/lib/project-form";
import { reviseOptionsOfBrief } from "~/lib/revisions.server";
import type { z } from "zod";
import { db, parseJson } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import type { BriefMeta } from "~/lib/brief-form";
import type { SearchProblem } from "~/optimizer/search-schema";
import type { UnitSystem } from "~/optimizer/units";

export function notFound(what = "Not found"): Response {
  return new Response(what, { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}

export { projectFormSchema };
export type ProjectForm = z.output<typeof projectFormSchema>;

export interface ProjectRow {
  id: number;
  team_id: number;
  name: string;
  client: string | null;
  job_number: string | null;
  description: string | null;
  created_by: number | null;
  archived_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

export async function listProjects(teamId: number, opts: { archived?: boolean } = {}) {
  const q = db("projects as p")
    .where("p.team_id", teamId)
    .select(
      "p.id",
      "p.name",
      "p.client",
      "p.archived_at",
      "p.updated_at",
      db.raw("(select count(*) from briefs b where b.project_id = p.id) as briefs"),
      db.raw("(select count(*) from options o where o.project_id = p.id) as options"),
      db.raw("(select count(*) from options o where o.project_id = p.id and o.review_state = 'in_review') as in_review"),
    )
    .orderBy("p.updated_at", "desc");
  if (opts.archived) q.whereNotNull("p.archived_at");
  else q.whereNull("p.archived_at");
  return (await q).map((r: Record<string, unknown>) => ({
    id: r.id as number,
    name: r.name as string,
    client: r.client as string | null,
    archived: r.archived_at != null,
    updatedAt: String(r.updated_at),
    briefs: Number(r.briefs),
    options: Number(r.options),
    inReview: Number(r.in_review),
  }));
}

export async function getProject(teamId: number, id: number): Promise<ProjectRow> {
  const row = Number.isSafeInteger(id) ? await db("projects").where({ id, team_id: teamId }).first() : undefined;
  if (!row) throw notFound("No such project in your team.");
  return row as ProjectRow;
}

export async function createProject(teamId: number, userId: number, form: ProjectForm): Promise<number> {
  return db.transaction(async (trx) => {
    const [id] = await trx("projects").insert({
      team_id: teamId,
      name: form.name,
      client: form.client || null,
      job_number: form.jobNumber || null,
      description: form.description || null,
      created_by: userId,
    });
    await trx("project_members").insert({ project_id: id, user_id: userId });
    await logActivity({ teamId, projectId: id, userId, action: "project_created", subjectType: "project", subjectId: id, detail: { name: form.name } }, trx);
    return Number(id);
  });
}

export async function updateProject(teamId: number, userId: number, id: number, form: ProjectForm): Promise<void> {
  await getProject(teamId, id);
  await db.transaction(async (trx) => {
    await trx("projects").where({ id, team_id: teamId }).update({ name: form.name, client: form.client || null, job_number: form.jobNumber || null, description: form.description || null, updated_at: trx.fn.now() });
    await logActivity({ teamId, projectId: id, userId, action: "project_edited", subjectType: "project", subjectId: id, detail: { name: form.name } }, trx);
  });
}

export async function setArchived(teamId: number, userId: number, id: number, archived: boolean): Promise<void> {
  await getProject(teamId, id);
  await db.transaction(async (trx) => {
    await trx("projects").where({ id, team_id: teamId }).update({ archived_at: archived ? trx.fn.now() : null, updated_at: trx.fn.now() });
    await logActivity({ teamId, projectId: id, userId, action: archived ? "project_archived" : "project_restored", subjectType: "project", subjectId: id }, trx);
  });
}

export async function projectMembers(projectId: number) {
  return db("project_members as pm")
    .join("users as u", "u.id", "pm.user_id")
    .join("projects as p", "p.id", "pm.project_id")
    .leftJoin("memberships as m", function () {
      this.on("m.user_id", "=", "u.id").andOn("m.team_id", "=", "p.team_id");
    })
    .where("pm.project_id", projectId)
    .select("u.id", "u.name", "u.email", "m.role")
    .orderBy("u.name");
}

/** Team members not yet on the project (for the "add member" list). */
export async function teamMembersOutside(teamId: number, projectId: number) {
  return db("memberships as m")
    .join("users as u", "u.id", "m.user_id")
    .where("m.team_id", teamId)
    .whereNull("u.disabled_at")
    .whereNotExists(db("project_members").where("project_id", projectId).whereRaw("project_members.user_id = u.id"))
    .select("u.id", "u.name", "m.role")
    .orderBy("u.name");
}

export async function addMember(teamId: number, actorId: number, projectId: number, userId: number): Promise<string | null> {
  await getProject(teamId, projectId);
  const member = await db("memberships").where({ team_id: teamId, user_id: userId }).first("id");
  if (!member) return "userId: not a member of your team";
  await db.transaction(async (trx) => {
    const exists = await trx("project_members").where({ project_id: projectId, user_id: userId }).first("id");
    if (exists) return;
    await trx("project_members").insert({ project_id: projectId, user_id: userId });
    await logActivity({ teamId, projectId, userId: actorId, action: "member_added", subjectType: "user", subjectId: userId }, trx);
  });
  return null;
}

export async function removeMember(teamId: number, actorId: number, projectId: number, userId: number): Promise<void> {
  await getProject(teamId, projectId);
  await db.transaction(async (trx) => {
    const n = await trx("project_members").where({ project_id: projectId, user_id: userId }).delete();
    if (n) await logActivity({ teamId, projectId, userId: actorId, action: "member_removed", subjectType: "user", subjectId: userId }, trx);
  });
}

export async function projectActivity(projectId: number, limit = 50) {
  const rows = await db("activity_log as a")
    .leftJoin("users as u", "u.id", "a.user_id")
    .where("a.project_id", projectId)
    .orderBy("a.id", "desc")
    .limit(limit)
    .select("a.id", "a.action", "a.subject_type", "a.subject_id", "a.created_at", "u.name as user_name");
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    action: String(r.action),
    subjectType: r.subject_type as string | null,
    subjectId: r.subject_id as number | null,
    at: new Date(r.created_at as string).toISOString(),
    who: (r.user_name as string | null) ?? "someone",
  }));
}

// ------------------------------------------------------------------ briefs

export interface BriefRecord {
  id: number;
  projectId: number;
  teamId: number;
  name: string;
  problem: SearchProblem;
  units: UnitSystem;
  memberLengthM: number | null;
  memberCount: number | null;
  /** the preset chosen in the editor ("s355", "team:7"), or null */
  material: string | null;
  /** MPa, or null */
  elasticModulus: number | null;
  updatedAt: string;
  /** when the problem last changed (ISO), or null for briefs saved before this was kept */
  problemChangedAt: string | null;
}

export async function getBrief(teamId: number, id: number): Promise<BriefRecord> {
  const row = Number.isSafeInteger(id)
    ? await db("briefs as b").join("projects as p", "p.id", "b.project_id").where({ "b.id": id, "p.team_id": teamId }).first("b.*", "p.team_id")
    : undefined;
  if (!row) throw notFound("No such brief in your team.");
  return {
    id: row.id,
    projectId: row.project_id,
    teamId: row.team_id,
    name: row.name,
    problem: parseJson<SearchProblem>(row.problem),
    units: row.units,
    memberLengthM: row.member_length_m,
    memberCount: row.member_count,
    material: row.material ?? null,
    elasticModulus: row.elastic_modulus_mpa ?? null,
    updatedAt: String(row.updated_at),
    problemChangedAt: row.problem_changed_at ? new Date(row.problem_changed_at).toISOString() : null,
  };
}

export async function listBriefs(projectId: number) {
  const rows = await db("briefs as b")
    .leftJoin("users as u", "u.id", "b.created_by")
    .where("b.project_id", projectId)
    .orderBy("b.updated_at", "desc")
    .select(
      "b.id",
      "b.name",
      "b.units",
      "b.updated_at",
      "u.name as author",
      db.raw("(select max(s.id) from sweeps s where s.brief_id = b.id) as last_sweep_id"),
    );
  const sweepIds = rows.map((r: Record<string, unknown>) => r.last_sweep_id).filter(Boolean) as number[];
  const sweeps = sweepIds.length ? await db("sweeps").whereIn("id", sweepIds).select("id", "status") : [];
  const status = new Map(sweeps.map((s: { id: number; status: string }) => [s.id, s.status]));
  return rows.map((r: Record<string, unknown>) => ({
    id: r.id as number,
    name: r.name as string,
    units: r.units as UnitSystem,
    author: r.author as string | null,
    updatedAt: String(r.updated_at),
    lastSweepId: (r.last_sweep_id as number | null) ?? null,
    lastSweepStatus: r.last_sweep_id ? (status.get(r.last_sweep_id as number) ?? null) : null,
  }));
}

export async function saveBrief(
  teamId: number,
  userId: number,
  target: { projectId: number; briefId?: number },
  meta: BriefMeta,
  problem: SearchProblem,
): Promise<number> {
  await getProject(teamId, target.projectId);
  const row = {
    name: meta.name,
    problem: JSON.stringify(problem),
    units: meta.units,
    member_length_m: meta.memberLengthM ?? null,
    member_count: meta.memberCount ?? null,
    material: meta.material ?? null,
    elastic_modulus_mpa: meta.elasticModulus ?? null,
  };
  return db.transaction(async (trx) => {
    let id = target.briefId;
    if (id) {
      const prior = await trx("briefs").where({ id, project_id: target.projectId }).forUpdate().first("problem", "member_length_m", "member_count");
      // Only a changed problem moves problem_changed_at (approvals given before it go stale).
      const changed = !prior || JSON.stringify(parseJson(prior.problem)) !== row.problem;
      await trx("briefs")
        .where({ id, project_id: target.projectId })
        .update({ ...row, updated_at: trx.fn.now(), ...(changed ? { problem_changed_at: trx.raw("NOW(3)") } : {}) });
      // The member is part of the record's basis too (its quantity), so a new length or count revises.
      if (changed || prior.member_length_m !== row.member_length_m || prior.member_count !== row.member_count)
        await reviseOptionsOfBrief(trx, { teamId, userId, projectId: target.projectId, briefId: id, briefName: meta.name, problem, memberLengthM: row.member_length_m, memberCount: row.member_count });
    } else {
      const [newId] = await trx("briefs").insert({ ...row, project_id: target.projectId, created_by: userId, problem_changed_at: trx.raw("NOW(3)") });
      id = Number(newId);
    }
    await trx("projects").where({ id: target.projectId }).update({ updated_at: trx.fn.now() });
    await logActivity(
      { teamId, projectId: target.projectId, userId, action: target.briefId ? "brief_edited" : "brief_created", subjectType: "brief", subjectId: id, detail: { name: meta.name } },
      trx,
    );
    return id;
  });
}

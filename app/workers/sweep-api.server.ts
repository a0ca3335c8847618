// What the /api/v1/sweeps routes share: id parsing, the POST body schema, and the brief /
// project / recheck lookups that decide the new sweep's links. The routes stay thin.
import { z } from "zod";
import { db, parseJson } from "~/lib/db.server";
import { can } from "~/lib/roles";
import type { SessionUser } from "~/lib/auth.server";
import { fieldErrorsFrom } from "~/lib/forms.server";
import { logActivity } from "~/lib/activity.server";
import { enqueueSweep, getTeamSweep, idempotencyKeySchema, type SweepView } from "./queue.server";
import { idParam } from "~/lib/route-params";

export const SWEEP_BODY_LIMIT = 64 * 1024;

export function notFound(what = "sweep"): Response {
  return Response.json({ error: `${what} not found` }, { status: 404 });
}

/** The :id param as a positive integer, or a thrown 404 (a malformed id is just an id that does not exist). */
export function sweepIdParam(raw: string | undefined): number {
  const id = idParam(raw);
  if (Number.isNaN(id)) throw notFound();
  return id;
}

/** The sweep in the caller's team, or a thrown 404 (another team's sweep looks exactly like a missing one). */
export async function requireTeamSweep(id: number, user: SessionUser): Promise<SweepView> {
  const s = await getTeamSweep(id, user);
  if (!s) throw notFound();
  return s;
}

const positiveId = (name: string) =>
  z.number({ error: `${name} must be a number` }).int({ message: `${name} must be a whole number` }).positive({ message: `${name} must be > 0` }).max(2 ** 31 - 1, { message: `${name} is too large` });

export const createSweepSchema = z
  .object({
    briefId: positiveId("briefId").optional(),
    /** a full SearchProblem (engine units); validated by searchProblemSchema in enqueueSweep */
    problem: z.record(z.string(), z.unknown(), { error: "problem must be an object (a SearchProblem)" }).optional(),
    projectId: positiveId("projectId").optional(),
    recheckOf: positiveId("recheckOf").optional(),
  }, { error: (iss) => (iss.code === "invalid_type" ? "the body must be a JSON object" : undefined) })
  .strict()
  .superRefine((b, ctx) => {
    if ((b.briefId === undefined) === (b.problem === undefined))
      ctx.addIssue({ code: "custom", path: ["briefId"], message: "send either briefId or problem (exactly one)" });
  });

function fail(status: number, error: string, errors?: Record<string, string>): Response {
  return Response.json(errors ? { error, errors } : { error }, { status });
}

/**
 * POST /api/v1/sweeps: checks the body and what it points at (all in the caller's team, else
 * 404), the role (a recheck needs "recheck", anything else "runSweep"), then enqueues.
 */
export async function createSweepFromRequest(user: SessionUser, body: unknown, idempotencyKey: string | null) {
  const parsed = createSweepSchema.safeParse(body);
  if (!parsed.success) {
    const errors = fieldErrorsFrom(parsed.error);
    const first = parsed.error.issues[0]!;
    const where = first.path.map(String).join(".");
    throw fail(400, where ? `${where}: ${first.message}` : first.message, errors);
  }
  if (idempotencyKey !== null) {
    const k = idempotencyKeySchema.safeParse(idempotencyKey);
    if (!k.success) throw fail(400, k.error.issues[0]!.message);
  }
  const b = parsed.data;
  const permission = b.recheckOf !== undefined ? "recheck" : "runSweep";
  if (!can(user.role, permission))
    throw fail(403, permission === "recheck" ? `role ${user.role} may not run a recheck` : `role ${user.role} may not run sweeps${can(user.role, "recheck") ? " (only rechecks: send recheckOf)" : ""}`);

  let projectId: number | null = b.projectId ?? null;
  let briefId: number | null = b.briefId ?? null;
  let problem: unknown = b.problem;
  if (b.recheckOf !== undefined) {
    const original = await getTeamSweep(b.recheckOf, user);
    if (!original) throw notFound("recheckOf sweep");
    projectId ??= original.projectId;
    briefId ??= original.briefId;
  }
  if (b.briefId !== undefined) {
    const brief = await db("briefs").join("projects", "projects.id", "briefs.project_id").where("briefs.id", b.briefId).first("briefs.id", "briefs.problem", "briefs.project_id", "projects.team_id");
    if (!brief || brief.team_id !== user.teamId) throw notFound("brief");
    if (b.projectId !== undefined && b.projectId !== brief.project_id) throw fail(400, "projectId does not match the brief's project", { projectId: "projectId does not match the brief's project" });
    projectId = brief.project_id;
    // Briefs keep their problem in engine units (the brief form converts at the edge).
    problem = parseJson(brief.problem);
  } else if (projectId !== null) {
    const project = await db("projects").where({ id: projectId }).first("team_id");
    if (!project || project.team_id !== user.teamId) throw notFound("project");
  }
  const out = await enqueueSweep({ teamId: user.teamId, ownerId: user.id, projectId, briefId, recheckOf: b.recheckOf ?? null, problem, idempotencyKey });
  // Same activity entries the workflow pages write when they start a sweep (a replayed key adds none).
  if (out.created)
    await logActivity({
      teamId: user.teamId,
      projectId,
      userId: user.id,
      action: b.recheckOf !== undefined ? "recheck_started" : "sweep_started",
      subjectType: "sweep",
      subjectId: out.id,
      detail: { via: "api", briefId, ...(b.recheckOf !== undefined ? { recheckOf: b.recheckOf } : {}) },
    });
  return out;
}

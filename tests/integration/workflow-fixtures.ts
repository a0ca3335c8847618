// One project with a brief, a finished sweep (real engine results), a recheck of it and a saved
// option, made once per run for the role-matrix, bad-input and workflow tests.
import { db, parseJson } from "~/lib/db.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { CONTRACT_EXAMPLE_PROBLEM, type SearchProblemInput } from "~/optimizer";

// The fixture brief leaves density to the engine's default, as a typed brief would.
function withoutDensity({ density: _density, ...rest }: SearchProblemInput): SearchProblemInput {
  return rest;
}
import type { FixtureContext } from "./fixtures";

/** The engine contract's example problem, channels only, on a coarse grid (runs in milliseconds). */
export const CHANNEL_PROBLEM: SearchProblemInput = {
  ...withoutDensity(CONTRACT_EXAMPLE_PROBLEM),
  depth: { min: 100, max: 400, step: 20 },
  width: { min: 50, max: 300, step: 25 },
  families: ["channel", "i"],
};

export interface WorkflowFixture {
  projectId: number;
  briefId: number;
  sweepId: number;
  recheckId: number;
  optionId: number;
}

export function workflowFixture(ctx: FixtureContext): Promise<WorkflowFixture> {
  return ctx.once("workflow", async () => {
    const teamId = await ctx.teamId();
    const engineer = await ctx.user("engineer");
    const [projectId] = await db("projects").insert({ team_id: teamId, name: "Fixture warehouse mezzanine", created_by: engineer.id });
    const [briefId] = await db("briefs").insert({ project_id: projectId, name: "Fixture floor beam", problem: JSON.stringify(CHANNEL_PROBLEM), units: "si", created_by: engineer.id });
    const sweepId = await recordFinishedSweep(db, { teamId, ownerId: engineer.id, projectId: Number(projectId), briefId: Number(briefId), problem: CHANNEL_PROBLEM });
    const reviewer = await ctx.user("reviewer");
    const recheckId = await recordFinishedSweep(db, {
      teamId,
      ownerId: reviewer.id,
      projectId: Number(projectId),
      briefId: Number(briefId),
      recheckOf: sweepId,
      problem: { ...CHANNEL_PROBLEM, allowable: { tension: 140, compression: 140, shear: 100 } },
    });
    const c = await db("candidates").where({ sweep_id: sweepId, rank: 1 }).first();
    const [optionId] = await db("options").insert({
      project_id: projectId,
      brief_id: briefId,
      sweep_id: sweepId,
      candidate: JSON.stringify({ family: c.family, dimensions: parseJson(c.dimensions), area: c.area, massPerMetre: c.mass_per_metre, utilisation: c.utilisation, governing: c.governing, rank: 1 }),
      problem: JSON.stringify(parseJson((await db("sweeps").where({ id: sweepId }).first("problem")).problem)),
      review_state: "draft",
      created_by: engineer.id,
    });
    return { projectId: Number(projectId), briefId: Number(briefId), sweepId, recheckId, optionId: Number(optionId) };
  });
}

/** Another team's project, brief, sweep and option: every page must answer 404 for them. */
export function foreignFixture(ctx: FixtureContext): Promise<WorkflowFixture> {
  return ctx.once("workflowForeign", async () => {
    const { teamId, adminId } = await ctx.otherTeam();
    const [projectId] = await db("projects").insert({ team_id: teamId, name: "Other team's project", created_by: adminId });
    const [briefId] = await db("briefs").insert({ project_id: projectId, name: "Other brief", problem: JSON.stringify(CHANNEL_PROBLEM), units: "si", created_by: adminId });
    const sweepId = await recordFinishedSweep(db, { teamId, ownerId: adminId, projectId: Number(projectId), briefId: Number(briefId), problem: CHANNEL_PROBLEM });
    const recheckId = await recordFinishedSweep(db, { teamId, ownerId: adminId, projectId: Number(projectId), briefId: Number(briefId), recheckOf: sweepId, problem: CHANNEL_PROBLEM });
    const [optionId] = await db("options").insert({ project_id: projectId, sweep_id: sweepId, candidate: JSON.stringify({ family: "channel", dimensions: { d: 300, b: 100, tf: 10, tw: 8 }, area: 1, massPerMetre: 1, utilisation: 0.5, governing: "shear", rank: 1 }), problem: JSON.stringify(CHANNEL_PROBLEM), created_by: adminId });
    return { projectId: Number(projectId), briefId: Number(briefId), sweepId, recheckId, optionId: Number(optionId) };
  });
}

/** A small PNG's first bytes (the signature and an IHDR chunk): enough for the type check. */
export const PNG_BYTES = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 0, 1, 0, 0, 0, 1, 8, 6, 0, 0, 0]);

/** An attachment on the workflow option (or the other team's), file and row, made once per run. */
export function attachmentFixture(ctx: FixtureContext, foreign = false): Promise<number> {
  return ctx.once(foreign ? "attachmentForeign" : "attachment", async () => {
    const { addAttachment } = await import("~/lib/attachments.server");
    const f = foreign ? await foreignFixture(ctx) : await workflowFixture(ctx);
    const teamId = foreign ? (await ctx.otherTeam()).teamId : await ctx.teamId();
    const userId = foreign ? (await ctx.otherTeam()).adminId : (await ctx.user("engineer")).id;
    const user = { id: userId, teamId, role: foreign ? "admin" : "engineer", name: "Fixture", email: "fixture@example.org", teamName: "Fixture" } as never;
    return addAttachment(user, f.optionId, { name: "site sketch.png", bytes: PNG_BYTES });
  });
}

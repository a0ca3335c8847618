// The team's own materials (product.md: an admin manages them). They sit beside the built-in
// presets of app/optimizer/materials.ts and, like them, only fill a brief's fields: the brief
// stores values, so changing or deleting a material never changes a saved brief or sweep.
import { z } from "zod";
import { db } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import { FieldError } from "~/lib/forms.server";
import type { SessionUser } from "~/lib/auth.server";
import { STEEL_GRADES } from "~/optimizer/materials";
import type { TeamMaterialChoice } from "~/components/BriefEditor";
import { grouped, MATERIAL_LIMITS, MATERIAL_NAME_MAX } from "~/lib/material-limits";

export { grouped, MATERIAL_LIMITS, MATERIAL_NAME_MAX };

type LimitKey = keyof typeof MATERIAL_LIMITS;
function bounded(key: LimitKey) {
  const { min, max, unit } = MATERIAL_LIMITS[key];
  const range = `must be between ${grouped(min)} and ${grouped(max)} ${unit}`;
  // Blank fields arrive as undefined (formToObject) and are reported as "… is required".
  return z.coerce.number({ error: `must be a number in ${unit}` }).min(min, range).max(max, range);
}

const nameField = z
  .string({ error: "must be text" })
  .trim()
  .min(1, "is required")
  .max(MATERIAL_NAME_MAX, `must be at most ${MATERIAL_NAME_MAX} characters`)
  .regex(/^[^\p{Cc}]*$/u, "must be one line of plain text");
const idField = z.coerce.number({ error: "must be a material id" }).int("must be a whole number").positive("must be a material id");

export const materialFields = z.object({ name: nameField, E: bounded("E"), fy: bounded("fy"), density: bounded("density") });
export type MaterialInput = z.output<typeof materialFields>;

export const materialActionSchema = z.discriminatedUnion(
  "intent",
  [
    materialFields.extend({ intent: z.literal("create") }),
    materialFields.extend({ intent: z.literal("update"), id: idField }),
    z.object({ intent: z.literal("delete"), id: idField }),
  ],
  { error: "must be create, update or delete" },
);

export async function listMaterials(teamId: number): Promise<TeamMaterialChoice[]> {
  const rows = await db("materials").where({ team_id: teamId }).orderBy("name").select("id", "name", "e_mpa", "fy_mpa", "density");
  return rows.map((r) => ({ id: r.id, name: r.name, E: r.e_mpa, fy: r.fy_mpa, density: r.density }));
}

const BUILT_IN_NAMES = new Set(STEEL_GRADES.flatMap((g) => [g.name.toLowerCase(), g.id.toLowerCase()]));

/** Name rules the schema cannot see: a built-in preset's name would make the brief's list ambiguous. */
function assertNameFree(name: string) {
  if (BUILT_IN_NAMES.has(name.toLowerCase())) throw new FieldError("name", `Name: “${name}” is a built-in preset; choose another name.`);
}

const duplicate = (name: string) => new FieldError("name", `Name: your team already has a material called “${name}”.`);

/** MariaDB's duplicate-key error (the unique (team_id, name) index, case-insensitive collation). */
function isDuplicateKey(error: unknown): boolean {
  return typeof error === "object" && error !== null && (error as { code?: unknown }).code === "ER_DUP_ENTRY";
}

function row(input: MaterialInput) {
  return { name: input.name, e_mpa: input.E, fy_mpa: input.fy, density: input.density };
}

export async function createMaterial(admin: SessionUser, input: MaterialInput): Promise<number> {
  assertNameFree(input.name);
  try {
    return await db.transaction(async (trx) => {
      const [id] = await trx("materials").insert({ team_id: admin.teamId, ...row(input) });
      await logActivity({ teamId: admin.teamId, userId: admin.id, action: "material_added", subjectType: "material", subjectId: Number(id), detail: row(input) }, trx);
      return Number(id);
    });
  } catch (error) {
    // The unique index decides, so two admins adding the same name at once still get the message.
    if (isDuplicateKey(error)) throw duplicate(input.name);
    throw error;
  }
}

export async function updateMaterial(admin: SessionUser, id: number, input: MaterialInput): Promise<void> {
  assertNameFree(input.name);
  try {
    await db.transaction(async (trx) => {
      const before = await trx("materials").where({ id, team_id: admin.teamId }).forUpdate().first();
      if (!before) throw new FieldError("id", "No such material in your team.", 404);
      await trx("materials").where({ id }).update({ ...row(input), updated_at: trx.fn.now() });
      await logActivity(
        {
          teamId: admin.teamId,
          userId: admin.id,
          action: "material_changed",
          subjectType: "material",
          subjectId: id,
          detail: { before: { name: before.name, e_mpa: before.e_mpa, fy_mpa: before.fy_mpa, density: before.density }, after: row(input) },
        },
        trx,
      );
    });
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicate(input.name);
    throw error;
  }
}

export async function deleteMaterial(admin: SessionUser, id: number): Promise<string> {
  return db.transaction(async (trx) => {
    const before = await trx("materials").where({ id, team_id: admin.teamId }).forUpdate().first();
    if (!before) throw new FieldError("id", "No such material in your team.", 404);
    await trx("materials").where({ id }).delete();
    await logActivity({ teamId: admin.teamId, userId: admin.id, action: "material_deleted", subjectType: "material", subjectId: id, detail: { name: before.name } }, trx);
    return before.name as string;
  });
}

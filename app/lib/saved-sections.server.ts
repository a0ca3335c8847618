// Sections saved from the section bench to a project (table saved_sections). The section is
// stored as the engine's SI SectionInput, validated by the engine's schema before insert.
import { z } from "zod";
import { db, parseJson } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import type { SessionUser } from "~/lib/auth.server";
import type { ParsedSectionInput } from "~/optimizer/schema";
import type { UnitSystem } from "~/optimizer/units";

export const saveSectionFormSchema = z.object({
  projectId: z.coerce.number({ error: "choose a project" }).int("choose a project").positive("choose a project"),
  name: z.string({ error: "name is required" }).trim().min(1, "name is required").max(160, "name: at most 160 characters"),
});

export interface SavedSection {
  id: number;
  projectId: number;
  name: string;
  section: ParsedSectionInput;
  units: UnitSystem;
  createdBy: number | null;
  createdByName: string | null;
  createdAt: string;
}

/**
 * Files a validated section under a project of the user's own team. Returns null when the
 * project is not one of the team's (the caller answers 404 without saying whether it exists).
 */
export async function saveSection(
  user: SessionUser,
  projectId: number,
  name: string,
  section: ParsedSectionInput,
  units: UnitSystem,
): Promise<number | null> {
  return db.transaction(async (trx) => {
    const project = await trx("projects").where({ id: projectId, team_id: user.teamId }).whereNull("archived_at").first("id");
    if (!project) return null;
    const [id] = await trx("saved_sections").insert({
      project_id: projectId,
      name,
      section: JSON.stringify(section),
      units,
      created_by: user.id,
    });
    await logActivity(
      { teamId: user.teamId, projectId, userId: user.id, action: "section_saved", subjectType: "saved_section", subjectId: id, detail: { name } },
      trx,
    );
    return id as number;
  });
}

/** A project's saved sections, newest first (the caller has already checked the project's team). */
export async function listSavedSections(projectId: number): Promise<SavedSection[]> {
  const rows = await db("saved_sections as s")
    .leftJoin("users as u", "u.id", "s.created_by")
    .where("s.project_id", projectId)
    .orderBy("s.created_at", "desc")
    .orderBy("s.id", "desc")
    .select("s.id", "s.project_id", "s.name", "s.section", "s.units", "s.created_by", "u.name as created_by_name", "s.created_at");
  return rows.map((r: Record<string, unknown>) => ({
    id: r.id as number,
    projectId: r.project_id as number,
    name: r.name as string,
    section: parseJson<ParsedSectionInput>(r.section),
    units: r.units as UnitSystem,
    createdBy: (r.created_by as number | null) ?? null,
    createdByName: (r.created_by_name as string | null) ?? null,
    createdAt: String(r.created_at),
  }));
}

// Team catalogues of rolled and hollow sections (product.md, "Catalogue"): kept only from a CSV
// that is not malformed, and then only its rows that passed the check against the engine; the
// rows kept out are remembered in `last_report` until a corrected file replaces them. A save is
// one transaction: the catalogue, all its sections and the activity entry, or nothing.
import type { Knex } from "knex";
import { z } from "zod";
import { db } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import { FieldError } from "~/lib/forms.server";
import type { CatalogueCsvSection, RejectedRow } from "~/lib/catalogue-csv";
import { catalogueSectionSchema, type CatalogueSection, type CatalogueShape, type PrintedField } from "~/optimizer";

import { CATALOGUE_NAME_MAX } from "~/lib/catalogue-limits";
export { CATALOGUE_NAME_MAX };
/** A team may keep this many catalogues (each up to CATALOGUE_CSV_MAX_ROWS sections). */
export const MAX_CATALOGUES_PER_TEAM = 50;

const nameField = z
  .string({ error: "must be text" })
  .trim()
  .min(1, "is required")
  .max(CATALOGUE_NAME_MAX, `must be at most ${CATALOGUE_NAME_MAX} characters`)
  .regex(/^[^\p{Cc}]*$/u, "must be one line of plain text");
const idField = z.coerce.number({ error: "must be a catalogue id" }).int("must be a whole number").positive("must be a catalogue id").max(2 ** 31 - 1, "must be a catalogue id");

/** The form fields besides the file: check (nothing written), save as new or over an existing catalogue, delete. */
export const catalogueActionSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({ intent: z.literal("check") }),
    z.object({ intent: z.literal("create"), name: nameField }),
    z.object({ intent: z.literal("replace"), id: idField }),
    z.object({ intent: z.literal("delete"), id: idField }),
  ],
  { error: "must be check, create, replace or delete" },
);
export type CatalogueAction = z.output<typeof catalogueActionSchema>;

export interface UploadReport {
  rows: number;
  kept: number;
  rejectedRows: number;
  /** the first MAX_REJECTED_LISTED problems */
  rejected: RejectedRow[];
}

export interface CatalogueSummary {
  id: number;
  name: string;
  sections: number;
  rejectedRows: number;
  updatedAt: string;
  uploadedBy: string | null;
}

export interface CatalogueSectionRow extends CatalogueSection {
  line: number;
  printed: Partial<Record<PrintedField, string>>;
  area: number;
  massPerMetre: number;
}

const json = <T>(v: unknown): T => (typeof v === "string" ? JSON.parse(v) : v) as T;

export async function listCatalogues(teamId: number): Promise<CatalogueSummary[]> {
  const rows = await db("catalogues as c")
    .leftJoin("users as u", "u.id", "c.uploaded_by")
    .where("c.team_id", teamId)
    .orderBy("c.name")
    .select("c.id", "c.name", "c.section_count", "c.last_report", "c.updated_at", "u.name as uploader");
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    sections: r.section_count,
    rejectedRows: json<UploadReport | null>(r.last_report)?.rejectedRows ?? 0,
    updatedAt: new Date(r.updated_at).toISOString(),
    uploadedBy: r.uploader ?? null,
  }));
}

/** One catalogue of the team with its sections (by mass) and the last upload's report; null when not the team's. */
export async function getCatalogue(teamId: number, id: number): Promise<(CatalogueSummary & { sectionRows: CatalogueSectionRow[]; report: UploadReport | null }) | null> {
  if (!Number.isSafeInteger(id)) return null;
  const c = await db("catalogues").where({ id, team_id: teamId }).first();
  if (!c) return null;
  const rows = await db("catalogue_sections").where({ catalogue_id: id }).orderBy([{ column: "mass_kg_m" }, { column: "designation" }]);
  const summary = (await listCatalogues(teamId)).find((s) => s.id === id)!;
  return {
    ...summary,
    report: json<UploadReport | null>(c.last_report),
    sectionRows: rows.map((r) => ({
      line: r.line,
      designation: r.designation,
      shape: r.shape as CatalogueShape,
      dims: json(r.dims),
      printed: json(r.printed),
      area: r.area_mm2,
      massPerMetre: r.mass_kg_m,
    })),
  };
}

/**
 * The sections of the given catalogues of one team, for a sweep's problem: each re-checked by the
 * engine's schema (a row written by an older version must not reach the search unchecked).
 * Catalogues of another team are simply not found.
 */
export async function catalogueSectionsFor(teamId: number, ids: number[]): Promise<{ id: number; name: string; sections: CatalogueSection[] }[]> {
  const wanted = [...new Set(ids.filter((i) => Number.isSafeInteger(i) && i > 0))];
  if (!wanted.length) return [];
  const cats = await db("catalogues").where("team_id", teamId).whereIn("id", wanted).select("id", "name");
  if (!cats.length) return [];
  const rows = await db("catalogue_sections").whereIn("catalogue_id", cats.map((c) => c.id)).orderBy(["catalogue_id", "line"]);
  return cats.map((c) => ({
    id: c.id,
    name: c.name,
    sections: rows
      .filter((r) => r.catalogue_id === c.id)
      .map((r) => catalogueSectionSchema.safeParse({ designation: r.designation, shape: r.shape, dims: json(r.dims) }))
      .filter((p) => p.success)
      .map((p) => p.data!),
  }));
}

function report(parsed: { rows: number; sections: CatalogueCsvSection[]; rejectedRows: number; rejected: RejectedRow[] }): UploadReport {
  return { rows: parsed.rows, kept: parsed.sections.length, rejectedRows: parsed.rejectedRows, rejected: parsed.rejected };
}

function sectionRows(catalogueId: number, sections: CatalogueCsvSection[]) {
  return sections.map((s) => ({
    catalogue_id: catalogueId,
    line: s.line,
    designation: s.designation,
    shape: s.shape,
    dims: JSON.stringify(s.dims),
    printed: JSON.stringify(s.printed),
    area_mm2: s.area,
    mass_kg_m: s.massPerMetre,
  }));
}

async function insertSections(trx: Knex.Transaction, catalogueId: number, sections: CatalogueCsvSection[]) {
  const rows = sectionRows(catalogueId, sections);
  // batches keep each statement well under the server's packet limit
  for (let i = 0; i < rows.length; i += 500) await trx("catalogue_sections").insert(rows.slice(i, i + 500));
}

function isDuplicateKey(error: unknown): boolean {
  return typeof error === "object" && error !== null && (error as { code?: unknown }).code === "ER_DUP_ENTRY";
}

export interface SaveInput {
  teamId: number;
  userId: number | null;
  parsed: { rows: number; sections: CatalogueCsvSection[]; rejectedRows: number; rejected: RejectedRow[] };
}

/** A new catalogue from a parsed file (its kept rows). `knex` lets the demo seed share this. */
export async function createCatalogue(input: SaveInput & { name: string }, knex: Knex = db): Promise<number> {
  try {
    return await knex.transaction(async (trx) => {
      const [{ n }] = await trx("catalogues").where("team_id", input.teamId).count({ n: "*" });
      if (Number(n) >= MAX_CATALOGUES_PER_TEAM) throw new FieldError("name", `Name: your team already keeps ${MAX_CATALOGUES_PER_TEAM} catalogues; delete one first.`);
      const [id] = await trx("catalogues").insert({
        team_id: input.teamId,
        name: input.name,
        section_count: input.parsed.sections.length,
        last_report: JSON.stringify(report(input.parsed)),
        uploaded_by: input.userId,
      });
      await insertSections(trx, Number(id), input.parsed.sections);
      await logActivity({ teamId: input.teamId, userId: input.userId, action: "catalogue_added", subjectType: "catalogue", subjectId: Number(id), detail: { name: input.name, kept: input.parsed.sections.length, keptOut: input.parsed.rejectedRows } }, trx);
      return Number(id);
    });
  } catch (error) {
    if (isDuplicateKey(error)) throw new FieldError("name", `Name: your team already has a catalogue called “${input.name}”; replace it instead.`);
    throw error;
  }
}

/** Replaces every section of one of the team's catalogues with a parsed file's kept rows. Returns its name. */
export async function replaceCatalogue(input: SaveInput & { id: number }): Promise<string> {
  return db.transaction(async (trx) => {
    const c = await trx("catalogues").where({ id: input.id, team_id: input.teamId }).forUpdate().first("id", "name");
    if (!c) throw new FieldError("id", "Catalogue: no such catalogue in your team.", 404);
    await trx("catalogue_sections").where({ catalogue_id: c.id }).delete();
    await insertSections(trx, c.id, input.parsed.sections);
    await trx("catalogues").where({ id: c.id }).update({ section_count: input.parsed.sections.length, last_report: JSON.stringify(report(input.parsed)), uploaded_by: input.userId, updated_at: trx.fn.now() });
    await logActivity({ teamId: input.teamId, userId: input.userId, action: "catalogue_replaced", subjectType: "catalogue", subjectId: c.id, detail: { name: c.name, kept: input.parsed.sections.length, keptOut: input.parsed.rejectedRows } }, trx);
    return c.name as string;
  });
}

/** Deletes one of the team's catalogues. Sweeps that searched it keep their own copy of its sections. */
export async function deleteCatalogue(teamId: number, userId: number, id: number): Promise<string> {
  return db.transaction(async (trx) => {
    const c = await trx("catalogues").where({ id, team_id: teamId }).first("id", "name");
    if (!c) throw new FieldError("id", "Catalogue: no such catalogue in your team.", 404);
    await trx("catalogues").where({ id }).delete();
    await logActivity({ teamId, userId, action: "catalogue_deleted", subjectType: "catalogue", subjectId: id, detail: { name: c.name } }, trx);
    return c.name as string;
  });
}

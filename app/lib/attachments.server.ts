// Files attached to an option (issue 12, item 6): a sketch, a photo of a site measurement.
// The file lives on disk under the data folder with a random name and nothing of the user's in
// its path; its metadata (the name the user gave, type, size, checksum, who and when) lives in
// MariaDB. Every lookup goes through the option's team, so an attachment id of another team's
// option reaches nothing (404).
//
// Choices (the spec is silent):
// - Types: PNG, JPEG, WebP and PDF, told by the file's first bytes (never by the name or the
//   browser's Content-Type), and the name's extension must agree, so a file reads as what it says.
//   Other types (SVG and HTML can carry script) are refused. Downloads are always sent as
//   attachments with the stored type and nosniff, never shown inline.
// - Limits: 5 MB a file, 20 files an option, 500 MB a team (bounds what one team can cost the disk).
// - A name with a path in it ("../x.png", "a/b.png", "C:\x.png"), control characters, a leading dot
//   or over 120 characters is refused, not cleaned up, so the user knows what was kept.
// - Deleting: its uploader or a team admin, and only while no approval has been given on the
//   option since it was attached: once approved it is part of a signed record.
import { createHash, randomBytes } from "node:crypto";
import { mkdir, readFile, rename, unlink, writeFile } from "node:fs/promises";
import path from "node:path";
import { db } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import { getOption } from "~/lib/options.server";
import { notFound } from "~/lib/projects.server";
import type { SessionUser } from "~/lib/auth.server";

import { ATTACHMENT_MAX_BYTES, ATTACHMENT_NAME_MAX, ATTACHMENTS_PER_OPTION, TEAM_ATTACHMENT_BYTES, type AttachmentRow, type AttachmentType } from "~/lib/attachments";
export { ATTACHMENT_MAX_BYTES, ATTACHMENT_NAME_MAX, ATTACHMENTS_PER_OPTION, TEAM_ATTACHMENT_BYTES, type AttachmentRow };

export const ATTACHMENT_TYPES: Record<AttachmentType, { label: string; extensions: readonly string[]; magic: (b: Uint8Array) => boolean }> = {
  "image/png": { label: "PNG image", extensions: [".png"], magic: (b: Uint8Array) => starts(b, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]) },
  "image/jpeg": { label: "JPEG image", extensions: [".jpg", ".jpeg"], magic: (b: Uint8Array) => starts(b, [0xff, 0xd8, 0xff]) },
  "image/webp": { label: "WebP image", extensions: [".webp"], magic: (b: Uint8Array) => starts(b, [0x52, 0x49, 0x46, 0x46]) && starts(b.subarray(8), [0x57, 0x45, 0x42, 0x50]) },
  "application/pdf": { label: "PDF document", extensions: [".pdf"], magic: (b: Uint8Array) => starts(b, [0x25, 0x50, 0x44, 0x46, 0x2d]) },
};
const ACCEPTED = "PNG, JPEG or WebP images and PDF documents";

function starts(b: Uint8Array, sig: number[]): boolean {
  return b.length >= sig.length && sig.every((x, i) => b[i] === x);
}

export class AttachmentError extends Error {
  constructor(
    message: string,
    readonly status = 400,
  ) {
    super(message);
  }
}

/** The folder files are kept in: SPARWISE_ATTACHMENTS_DIR, else .data/attachments in the project. */
export function attachmentsDir(): string {
  return path.resolve(process.env.SPARWISE_ATTACHMENTS_DIR || path.join(process.cwd(), ".data", "attachments"));
}

/** Why this name is refused, or null. The name is shown and sent back, never used as a path. */
export function attachmentNameProblem(name: string): string | null {
  if (!name.trim()) return "the file has no name";
  if (name.length > ATTACHMENT_NAME_MAX) return `the file name is over ${ATTACHMENT_NAME_MAX} characters; shorten it`;
  if (/[\p{Cc}\p{Cf}]/u.test(name)) return "the file name contains control characters; rename the file";
  if (/[/\\]/.test(name) || name.includes("..") || /^[A-Za-z]:/.test(name)) return `the file name “${name.slice(0, 60)}” contains a path (/, \\, .. or a drive); send the file under its own name`;
  if (name.startsWith(".")) return "the file name starts with a dot; rename the file";
  return null;
}

/** The type told by the content, checked against the name's extension; throws AttachmentError. */
export function attachmentType(name: string, bytes: Uint8Array): AttachmentType {
  const found = (Object.keys(ATTACHMENT_TYPES) as AttachmentType[]).find((t) => ATTACHMENT_TYPES[t].magic(bytes));
  if (!found) throw new AttachmentError(`file: “${name.slice(0, 60)}” is not one of the accepted types (${ACCEPTED})`, 415);
  const ext = path.extname(name).toLowerCase();
  const allowed = ATTACHMENT_TYPES[found].extensions;
  if (!allowed.includes(ext))
    throw new AttachmentError(`file: “${name.slice(0, 60)}” holds a ${ATTACHMENT_TYPES[found].label}, so its name must end in ${allowed.join(" or ")}`, 415);
  return found;
}

function toRow(r: Record<string, unknown>): AttachmentRow {
  return {
    id: r.id as number,
    optionId: r.option_id as number,
    fileName: r.file_name as string,
    contentType: r.content_type as AttachmentType,
    sizeBytes: r.size_bytes as number,
    createdBy: (r.author as string | null) ?? null,
    createdById: (r.created_by as number | null) ?? null,
    createdAt: new Date(r.created_at as string).toISOString(),
  };
}

export async function listAttachments(teamId: number, optionId: number): Promise<AttachmentRow[]> {
  const rows = await db("attachments as a").leftJoin("users as u", "u.id", "a.created_by").where({ "a.team_id": teamId, "a.option_id": optionId }).orderBy("a.id").select("a.*", "u.name as author");
  return rows.map(toRow);
}

/**
 * Keeps one uploaded file. Everything is checked before a byte is written; the file is written
 * under a temporary name and renamed, and removed again if the row cannot be kept, so a refusal
 * leaves neither a row nor a file.
 */
export async function addAttachment(user: SessionUser, optionId: number, file: { name: string; bytes: Uint8Array }): Promise<number> {
  const option = await getOption(user.teamId, optionId);
  const problem = attachmentNameProblem(file.name);
  if (problem) throw new AttachmentError(`file: ${problem}`);
  if (file.bytes.byteLength === 0) throw new AttachmentError("file: the file is empty");
  if (file.bytes.byteLength > ATTACHMENT_MAX_BYTES) throw new AttachmentError(`file: larger than ${ATTACHMENT_MAX_BYTES / 1024 / 1024} MB; send a smaller file`, 413);
  const type = attachmentType(file.name, file.bytes);
  const dir = attachmentsDir();
  const stored = randomBytes(16).toString("hex");
  const target = path.join(dir, stored);
  let written = false;
  try {
    return await db.transaction(async (trx) => {
      // The option row is locked so two uploads at once cannot both pass the limits.
      await trx("options").where({ id: option.id }).forUpdate().first("id");
      const onOption = Number((await trx("attachments").where({ option_id: option.id }).count({ n: "*" }).first())!.n);
      if (onOption >= ATTACHMENTS_PER_OPTION) throw new AttachmentError(`file: this option already has ${ATTACHMENTS_PER_OPTION} attachments, the most it may have; delete one first`, 409);
      const used = Number((await trx("attachments").where({ team_id: user.teamId }).sum({ n: "size_bytes" }).first())?.n ?? 0);
      if (used + file.bytes.byteLength > TEAM_ATTACHMENT_BYTES) throw new AttachmentError(`file: the team's attachments would pass ${TEAM_ATTACHMENT_BYTES / 1024 / 1024} MB; delete some first`, 409);
      await mkdir(dir, { recursive: true, mode: 0o700 });
      await writeFile(`${target}.part`, file.bytes, { flag: "wx", mode: 0o600 });
      written = true;
      await rename(`${target}.part`, target);
      const [id] = await trx("attachments").insert({
        team_id: user.teamId,
        project_id: option.projectId,
        option_id: option.id,
        stored_name: stored,
        file_name: file.name,
        content_type: type,
        size_bytes: file.bytes.byteLength,
        sha256: createHash("sha256").update(file.bytes).digest("hex"),
        created_by: user.id,
      });
      await logActivity({ teamId: user.teamId, projectId: option.projectId, userId: user.id, action: "attachment_added", subjectType: "option", subjectId: option.id, detail: { attachment: Number(id), name: file.name } }, trx);
      return Number(id);
    });
  } catch (e) {
    if (written) await Promise.allSettled([unlink(target), unlink(`${target}.part`)]);
    throw e;
  }
}

async function findAttachment(teamId: number, optionId: number | null, id: number) {
  const row = Number.isSafeInteger(id)
    ? await db("attachments as a")
        .join("options as o", "o.id", "a.option_id")
        .join("projects as p", "p.id", "o.project_id")
        .where({ "a.id": id, "a.team_id": teamId, "p.team_id": teamId })
        .modify((q) => {
          if (optionId !== null) q.where("a.option_id", optionId);
        })
        .first("a.*")
    : undefined;
  if (!row) throw notFound("No such attachment in your team.");
  return row;
}

/** The file's bytes and what to call it, for the owning team only. */
export async function readAttachment(teamId: number, id: number): Promise<{ row: AttachmentRow; bytes: Buffer }> {
  const row = await findAttachment(teamId, null, id);
  // The stored name is ours (32 hex characters); checked again so no row can point outside the folder.
  if (!/^[0-9a-f]{32}$/.test(row.stored_name)) throw notFound("No such attachment in your team.");
  let bytes: Buffer;
  try {
    bytes = await readFile(path.join(attachmentsDir(), row.stored_name));
  } catch {
    throw new Response("The attachment's file is missing from the server's data folder; ask an admin.", { status: 410, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  }
  return { row: toRow(row), bytes };
}

export async function deleteAttachment(user: SessionUser, optionId: number, id: number): Promise<void> {
  const option = await getOption(user.teamId, optionId);
  const row = await findAttachment(user.teamId, option.id, id);
  if (row.created_by !== user.id && user.role !== "admin") throw new AttachmentError("attachmentId: only the person who attached the file or an admin may delete it", 403);
  await db.transaction(async (trx) => {
    const approvedSince = await trx("reviews").where({ option_id: option.id, decision: "approved" }).where("created_at", ">=", row.created_at).first("id");
    if (approvedSince) throw new AttachmentError("attachmentId: the option was approved with this file attached, so it is part of a signed record and is kept", 409);
    await trx("attachments").where({ id: row.id }).delete();
    await logActivity({ teamId: user.teamId, projectId: option.projectId, userId: user.id, action: "attachment_deleted", subjectType: "option", subjectId: option.id, detail: { attachment: row.id, name: row.file_name } }, trx);
  });
  // After the commit: a file whose row is gone is unreachable; one left behind by a failed unlink only costs disk.
  await unlink(path.join(attachmentsDir(), row.stored_name)).catch(() => undefined);
}

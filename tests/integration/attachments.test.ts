// Option attachments (issue 12, item 6): limits refused with a message naming the field and
// nothing written (no row, no file); files under the data folder with random names; downloads and
// deletions for the owning team only; deletion rules.
import { readdir, stat } from "node:fs/promises";
import path from "node:path";
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { ATTACHMENT_MAX_BYTES, ATTACHMENTS_PER_OPTION, attachmentsDir, readAttachment } from "~/lib/attachments.server";
import { callRoute, FixtureContext, formPost, loadRouteModule, messageOf, requestAs, tableCounts, type DemoRole } from "./fixtures";
import { CHANNEL_PROBLEM, PNG_BYTES } from "./workflow-fixtures";

afterAll(() => closeDb());
const ctx = new FixtureContext();

async function freshOption(): Promise<number> {
  const teamId = await ctx.teamId();
  const engineer = await ctx.user("engineer");
  const [projectId] = await db("projects").insert({ team_id: teamId, name: "Attachment fixture yard", created_by: engineer.id });
  const [id] = await db("options").insert({
    project_id: projectId,
    candidate: JSON.stringify({ family: "channel", dimensions: { d: 300, b: 100, tf: 10, tw: 8 }, area: 1, massPerMetre: 40, utilisation: 0.5, governing: "shear", rank: 1 }),
    problem: JSON.stringify(CHANNEL_PROBLEM),
    created_by: engineer.id,
  });
  return Number(id);
}

async function upload(as: DemoRole, optionId: number, name: string, bytes: Uint8Array) {
  const mod = await loadRouteModule("routes/options.$optionId.attachments.ts");
  const form = new FormData();
  form.set("intent", "upload");
  form.set("file", new File([bytes as BlobPart], name));
  return callRoute(mod.action, await requestAs(as, `/options/${optionId}/attachments`, { method: "POST", body: form }), { optionId: String(optionId) });
}

async function filesOnDisk(): Promise<string[]> {
  return readdir(attachmentsDir()).catch(() => []);
}

const PDF = new TextEncoder().encode("%PDF-1.4\n% a site note\n");

describe("upload limits", () => {
  test("a PNG is kept: a row with its name, a file under a random name in the data folder", async () => {
    const optionId = await freshOption();
    const res = await upload("engineer", optionId, "gridline C sketch.png", PNG_BYTES);
    expect(res.status, messageOf(res)).toBe(200);
    const row = await db("attachments").where({ option_id: optionId }).first();
    expect(row.file_name).toBe("gridline C sketch.png");
    expect(row.content_type).toBe("image/png");
    expect(row.size_bytes).toBe(PNG_BYTES.byteLength);
    expect(row.stored_name).toMatch(/^[0-9a-f]{32}$/);
    const st = await stat(path.join(attachmentsDir(), row.stored_name));
    expect(st.size).toBe(PNG_BYTES.byteLength);
  });

  const refusals: [string, string, Uint8Array, number, RegExp][] = [
    ["over the size limit", "big.png", (() => { const b = new Uint8Array(ATTACHMENT_MAX_BYTES + 1); b.set(PNG_BYTES); return b; })(), 413, /file: larger than 5 MB/],
    ["text named .png", "notes.png", new TextEncoder().encode("just words"), 415, /file: .*not one of the accepted types/],
    ["an SVG (can carry script)", "drawing.svg", new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 415, /file: .*accepted types/],
    ["a PDF named .png", "photo.png", PDF, 415, /file: .*PDF document.*must end in \.pdf/],
    ["an empty file", "empty.pdf", new Uint8Array(), 400, /file: the file is empty/],
    ["a parent-folder path", "../../etc/passwd.png", PNG_BYTES, 400, /file: .*contains a path/],
    ["a folder in the name", "sub/dir.png", PNG_BYTES, 400, /file: .*contains a path/],
    ["a backslash path", "..\\..\\boot.png", PNG_BYTES, 400, /file: .*contains a path/],
    ["a drive letter", "C:evil.png", PNG_BYTES, 400, /file: .*contains a path/],
    ["a leading dot", ".htaccess.png", PNG_BYTES, 400, /file: .*starts with a dot/],
    ["a control character", "a\u0000b.png", PNG_BYTES, 400, /file: .*control characters/],
    ["a very long name", `${"x".repeat(130)}.png`, PNG_BYTES, 400, /file: .*over 120 characters/],
  ];
  for (const [label, name, bytes, status, message] of refusals) {
    test(`${label}: ${status}, the field named, nothing written`, async () => {
      const optionId = await freshOption();
      const rows = await tableCounts();
      const files = await filesOnDisk();
      const res = await upload("engineer", optionId, name, bytes);
      expect(res.status, messageOf(res)).toBe(status);
      expect(messageOf(res)).toMatch(message);
      expect(await tableCounts()).toEqual(rows);
      expect(await filesOnDisk()).toEqual(files);
    });
  }

  test(`one file past ${ATTACHMENTS_PER_OPTION} on an option is refused`, async () => {
    const optionId = await freshOption();
    const option = await db("options").where({ id: optionId }).first("project_id");
    const teamId = await ctx.teamId();
    for (let i = 0; i < ATTACHMENTS_PER_OPTION; i++)
      await db("attachments").insert({ team_id: teamId, project_id: option.project_id, option_id: optionId, stored_name: `${optionId}`.padStart(8, "0") + `${i}`.padStart(24, "0"), file_name: `f${i}.png`, content_type: "image/png", size_bytes: 1, sha256: "0".repeat(64) });
    const files = await filesOnDisk();
    const res = await upload("engineer", optionId, "one more.png", PNG_BYTES);
    expect(res.status).toBe(409);
    expect(messageOf(res)).toMatch(/file: this option already has 20 attachments/);
    expect(await filesOnDisk()).toEqual(files);
  });

  test("a viewer may not upload (403); another team's option is 404", async () => {
    const optionId = await freshOption();
    expect((await upload("viewer", optionId, "x.png", PNG_BYTES)).status).toBe(403);
    const { teamId, adminId } = await ctx.otherTeam();
    const [p] = await db("projects").insert({ team_id: teamId, name: "Foreign", created_by: adminId });
    const [foreign] = await db("options").insert({ project_id: p, candidate: "{}", problem: "{}", created_by: adminId });
    const rows = await tableCounts();
    expect((await upload("engineer", Number(foreign), "x.png", PNG_BYTES)).status).toBe(404);
    expect(await tableCounts()).toEqual(rows);
  });
});

describe("download and deletion", () => {
  test("the team downloads the exact bytes as an attachment; another team gets 404", async () => {
    const optionId = await freshOption();
    await upload("reviewer", optionId, "site photo «east».pdf", PDF);
    const row = await db("attachments").where({ option_id: optionId }).first();
    const mod = await loadRouteModule("routes/attachments.$attachmentId.ts");
    const res = await callRoute(mod.loader, await requestAs("viewer", `/attachments/${row.id}`), { attachmentId: String(row.id) });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="site photo _east_.pdf"; filename\*=UTF-8''site%20photo%20%C2%ABeast%C2%BB.pdf$/);
    const raw = await (mod.loader as (args: unknown) => Promise<Response>)({ request: await requestAs("viewer", `/attachments/${row.id}`), params: { attachmentId: String(row.id) }, context: {} });
    expect(new Uint8Array(await raw.arrayBuffer())).toEqual(PDF);
    const { teamId } = await ctx.otherTeam();
    await expect(readAttachment(teamId, row.id)).rejects.toMatchObject({ status: 404 });
  });

  test("only the uploader or an admin deletes, and not after an approval; the file goes with the row", async () => {
    const optionId = await freshOption();
    await upload("engineer", optionId, "a.png", PNG_BYTES);
    await upload("engineer", optionId, "b.png", PNG_BYTES);
    const [a, b] = await db("attachments").where({ option_id: optionId }).orderBy("id");
    const del = async (as: DemoRole, id: number) => {
      const mod = await loadRouteModule("routes/options.$optionId.attachments.ts");
      return callRoute(mod.action, await formPost(as, `/options/${optionId}/attachments`, { intent: "delete", attachmentId: String(id) }), { optionId: String(optionId) });
    };
    expect((await del("viewer", a.id)).status).toBe(403);
    const byReviewer = await del("reviewer", a.id);
    expect(byReviewer.status).toBe(403);
    expect(messageOf(byReviewer)).toMatch(/attachmentId: only the person who attached/);
    expect((await del("engineer", a.id)).status).toBe(200);
    expect(await db("attachments").where({ id: a.id }).first()).toBeUndefined();
    expect(await filesOnDisk()).not.toContain(a.stored_name);

    // approved with b attached: b is part of a signed record
    const reviewer = await ctx.user("reviewer");
    await db("reviews").insert({ option_id: optionId, user_id: reviewer.id, decision: "approved", created_at: db.raw("NOW() + INTERVAL 1 SECOND") });
    const late = await del("admin", b.id);
    expect(late.status).toBe(409);
    expect(messageOf(late)).toMatch(/approved with this file attached/);
    expect(await filesOnDisk()).toContain(b.stored_name);
    // an attachment id from another option of ours is not this option's
    const other = await freshOption();
    const mod = await loadRouteModule("routes/options.$optionId.attachments.ts");
    const cross = await callRoute(mod.action, await formPost("admin", `/options/${other}/attachments`, { intent: "delete", attachmentId: String(b.id) }), { optionId: String(other) });
    expect(cross.status).toBe(404);
  });
});

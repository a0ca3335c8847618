// Upload (intent=upload, multipart field `file`) or delete (intent=delete, attachmentId) an
// option's attachment. Answers JSON for the option page's fetcher: { ok } or { errors }.
import { data, redirect } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/options.$optionId.attachments";
import { requirePermission } from "~/lib/auth.server";
import { DEFAULT_FORM_LIMIT, readForm } from "~/lib/forms.server";
import { getOption } from "~/lib/options.server";
import { idParam } from "~/lib/route-params";
import { addAttachment, AttachmentError, ATTACHMENT_MAX_BYTES, deleteAttachment } from "~/lib/attachments.server";

// The body may hold the file and a few small fields; past that readForm stops reading.
const BODY_LIMIT = ATTACHMENT_MAX_BYTES + 64 * 1024;

const uploadSchema = z.object({
  intent: z.literal("upload"),
  file: z.instanceof(File, { error: "file: choose a file to attach" }),
});
const deleteSchema = z.object({
  intent: z.literal("delete"),
  attachmentId: z.coerce.number({ error: "attachmentId: must be a number" }).int("attachmentId: must be a whole number").positive("attachmentId: must be a whole number"),
});
const formSchema = z.discriminatedUnion("intent", [uploadSchema, deleteSchema], { error: 'intent: must be "upload" or "delete"' });

// Nothing to show here: the list is on the option page (only the option's own team is sent there).
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const option = await getOption(user.teamId, idParam(params.optionId));
  throw redirect(`/options/${option.id}`);
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requirePermission(request, "attach");
  const option = await getOption(user.teamId, idParam(params.optionId));
  let form: FormData;
  try {
    // only a multipart body can carry a file; any other form keeps the ordinary limit
    const multipart = (request.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data");
    form = await readForm(request, multipart ? BODY_LIMIT : DEFAULT_FORM_LIMIT);
  } catch (e) {
    if (e instanceof Response && e.status === 413 && (request.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data")) return data({ ok: false, errors: { file: `file: larger than ${ATTACHMENT_MAX_BYTES / 1024 / 1024} MB; send a smaller file` } }, { status: 413 });
    throw e;
  }
  const p = formSchema.safeParse({ intent: form.get("intent") ?? undefined, file: form.get("file") ?? undefined, attachmentId: form.get("attachmentId") ?? undefined });
  if (!p.success) {
    const issue = p.error.issues[0]!;
    return data({ ok: false, errors: { [String(issue.path[0] ?? "form")]: issue.message } }, { status: 400 });
  }
  try {
    if (p.data.intent === "upload") {
      const f = p.data.file;
      // File.size is known before reading: an over-size file is refused without copying it.
      if (f.size > ATTACHMENT_MAX_BYTES) return data({ ok: false, errors: { file: `file: larger than ${ATTACHMENT_MAX_BYTES / 1024 / 1024} MB; send a smaller file` } }, { status: 413 });
      await addAttachment(user, option.id, { name: f.name, bytes: new Uint8Array(await f.arrayBuffer()) });
      return { ok: true, errors: null };
    }
    await deleteAttachment(user, option.id, p.data.attachmentId);
    return { ok: true, errors: null };
  } catch (e) {
    if (e instanceof AttachmentError) return data({ ok: false, errors: { [e.message.split(":")[0]!]: e.message } }, { status: e.status });
    throw e;
  }
}

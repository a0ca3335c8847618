// The option's attachments: the list, an upload form and delete buttons, through a fetcher so a
// refusal (type, size, name) shows its message beside the form.
import { useFetcher } from "react-router";
import { ATTACHMENT_ACCEPT, ATTACHMENT_MAX_BYTES, ATTACHMENTS_PER_OPTION, sizeInWords, type AttachmentRow } from "~/lib/attachments";

export function OptionAttachments({ optionId, attachments, mayAttach, mayDelete }: { optionId: number; attachments: AttachmentRow[]; mayAttach: boolean; mayDelete: (a: AttachmentRow) => boolean }) {
  const upload = useFetcher<{ ok: boolean; errors: Record<string, string> | null }>();
  const remove = useFetcher<{ ok: boolean; errors: Record<string, string> | null }>();
  const errors = { ...(upload.data?.errors ?? {}), ...(remove.data?.errors ?? {}) };
  const action = `/options/${optionId}/attachments`;
  return (
    <section aria-labelledby="attachments-h" className="space-y-2">
      <h2 id="attachments-h" className="text-lg font-bold">
        Attachments
      </h2>
      {attachments.length ? (
        <ul className="space-y-1 text-sm" data-testid="attachments">
          {attachments.map((a) => (
            <li key={a.id} className="flex flex-wrap items-center gap-2">
              <a href={`/attachments/${a.id}`} className="text-accent underline">
                {a.fileName}
              </a>
              <span className="text-ink/70">
                {sizeInWords(a.sizeBytes)} · {a.createdBy ?? "someone"} · {a.createdAt.slice(0, 10)}
              </span>
              {mayDelete(a) ? (
                <remove.Form method="post" action={action}>
                  <input type="hidden" name="intent" value="delete" />
                  <input type="hidden" name="attachmentId" value={a.id} />
                  <button className="rounded-md border border-ink/30 px-2 py-0.5 text-xs">Delete</button>
                </remove.Form>
              ) : null}
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink/70">No attachments.</p>
      )}
      {mayAttach ? (
        <upload.Form method="post" action={action} encType="multipart/form-data" className="flex flex-wrap items-end gap-2 text-sm">
          <input type="hidden" name="intent" value="upload" />
          <label>
            <span className="block font-semibold">Attach a file</span>
            <span className="block text-xs text-ink/70">
              PNG, JPEG, WebP or PDF, at most {sizeInWords(ATTACHMENT_MAX_BYTES)}; up to {ATTACHMENTS_PER_OPTION} an option.
            </span>
            <input type="file" name="file" accept={ATTACHMENT_ACCEPT} required className="mt-1 block" aria-invalid={errors.file ? true : undefined} />
          </label>
          <button className="rounded-md bg-accent px-3 py-1.5 font-semibold text-white" disabled={upload.state !== "idle"}>
            {upload.state !== "idle" ? "Uploading…" : "Upload"}
          </button>
        </upload.Form>
      ) : null}
      {Object.keys(errors).length ? (
        <p role="alert" className="rounded-md border border-red-800 bg-red-50 px-3 py-2 text-sm font-semibold text-red-900">
          {Object.values(errors).join("; ")}
        </p>
      ) : null}
    </section>
  );
}

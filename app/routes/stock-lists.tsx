// Stock lists: upload a CSV, see a preview (or the line-numbered errors), keep it for the team.
// The upload is read under a size cap; a file with any error saves nothing.
import { Form, data } from "react-router";
import { useState } from "react";
import { z } from "zod";
import type { Route } from "./+types/stock-lists";
import { requirePermission } from "~/lib/auth.server";
import { readForm } from "~/lib/forms.server";
import { can, mayDeleteStockList } from "~/lib/roles";
import { parseStockCsv, STOCK_CSV_EXAMPLE, STOCK_CSV_MAX_BYTES, type StockCsvError, type StockRow } from "~/lib/stock-csv";
import { deleteStockList, listStockLists, saveStockList } from "~/lib/stock-lists.server";
import { TableScroll } from "~/components/DataTable";

export function meta() {
  return [{ title: "Stock lists · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const lists = await listStockLists(user.teamId);
  return {
    lists: lists.map((l) => ({ ...l, mayDelete: mayDeleteStockList(user.role, user.id, l.uploadedBy) })),
    mayEdit: can(user.role, "editBrief"),
  };
}

// Room for the multipart envelope and the name around a file at the limit.
const FORM_LIMIT = STOCK_CSV_MAX_BYTES + 16 * 1024;
const nameSchema = z.string({ error: "name is required" }).trim().min(1, "name is required").max(120, "name: at most 120 characters");

/** `errors` is { field: message } like every action; `lines` keeps the CSV's line-numbered list for the page. */
type ActionResult = { errors: Record<string, string> | null; lines?: StockCsvError[]; preview?: StockRow[]; saved?: number; deleted?: boolean };

function csvFailure(lines: StockCsvError[], status: number) {
  const text = lines.map((e) => (e.line ? `line ${e.line}: ${e.message}` : e.message)).join("; ");
  return data<ActionResult>({ errors: { file: `file: ${text}` }, lines }, { status });
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requirePermission(request, "editBrief");
  // Only an upload (multipart) gets the file-sized limit; any other post keeps the default cap.
  const upload = (request.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data");
  let form: FormData;
  try {
    form = upload ? await readForm(request, FORM_LIMIT) : await readForm(request);
  } catch (e) {
    if (upload && e instanceof Response && e.status === 413)
      return csvFailure([{ line: 0, message: `too large: over the ${STOCK_CSV_MAX_BYTES / 1024 / 1024} MB limit; nothing was saved` }], 413);
    throw e;
  }
  const intent = String(form.get("intent") ?? "");
  if (intent === "delete") {
    const id = Number(form.get("id"));
    const done = Number.isSafeInteger(id) && id > 0 ? await deleteStockList(user, id) : "missing";
    if (done === "missing") return data<ActionResult>({ errors: { id: "Stock list: no such stock list in your team" } }, { status: 404 });
    if (done === "refused")
      return data<ActionResult>({ errors: { id: "Stock list: only an admin or the person who uploaded it may delete it; it is the team's shared list" } }, { status: 403 });
    return { errors: null, deleted: true } satisfies ActionResult;
  }
  if (intent !== "preview" && intent !== "save") return data<ActionResult>({ errors: { intent: 'intent must be "preview" or "save"' } }, { status: 400 });
  const file = form.get("file");
  const text = typeof file === "string" ? file : file ? await file.text() : "";
  if (!file || (typeof file !== "string" && file.size === 0 && !file.name))
    return csvFailure([{ line: 0, message: "choose a CSV file" }], 400);
  const parsed = parseStockCsv(text, typeof file === "string" ? undefined : file.size);
  if (!parsed.ok) return csvFailure(parsed.errors, 400);
  if (intent === "preview") return { errors: null, preview: parsed.rows } satisfies ActionResult;
  const name = nameSchema.safeParse(form.get("name") ?? undefined);
  if (!name.success) return data<ActionResult>({ errors: { name: name.error.issues[0].message }, preview: parsed.rows }, { status: 400 });
  const id = await saveStockList(user.teamId, user.id, name.data, parsed.rows);
  return { errors: null, saved: id } satisfies ActionResult;
}

export default function StockLists({ loaderData, actionData }: Route.ComponentProps) {
  const { lists, mayEdit } = loaderData;
  const result = actionData as ActionResult | undefined;
  const [intent, setIntent] = useState("preview");
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold">Stock lists</h1>
      <p className="max-w-3xl text-sm">
        The plate thicknesses (mm) your fabricator can supply, optionally with widths (mm) and a price per kg. A brief can fill its thickness list from one. Files up to {STOCK_CSV_MAX_BYTES / 1024 / 1024} MB; a
        file with any error is not kept.
      </p>
      {result?.errors?.id ? (
        <p role="alert" className="font-semibold text-red-800">
          {result.errors.id}
        </p>
      ) : null}
      {result?.deleted ? <p role="status" className="rounded-md border border-accent bg-teal-50 p-2 text-sm">Stock list deleted.</p> : null}
      {lists.length ? (
        <TableScroll>
        <table className="w-full max-w-3xl border-collapse bg-white text-sm">
          <thead>
            <tr className="border-b border-ink/30 text-left">
              <th className="p-2">Name</th>
              <th className="p-2">Thicknesses (mm)</th>
              <th className="p-2 text-right">Lines</th>
              <th className="p-2">Prices</th>
              <th className="p-2">Uploaded by</th>
              {mayEdit ? <th className="p-2" /> : null}
            </tr>
          </thead>
          <tbody>
            {lists.map((l) => (
              <tr key={l.id} className="border-b border-ink/10">
                <td className="p-2 font-semibold">{l.name}</td>
                <td className="p-2 tabular-nums">{l.thicknesses.join(", ")}</td>
                <td className="p-2 text-right tabular-nums">{l.items}</td>
                <td className="p-2">{l.withPrices ? "yes" : "no"}</td>
                <td className="p-2">{l.uploadedByName ?? "—"}</td>
                {mayEdit ? (
                  <td className="p-2">
                    {l.mayDelete ? (
                      <Form method="post">
                        <input type="hidden" name="intent" value="delete" />
                        <input type="hidden" name="id" value={l.id} />
                        <button className="text-xs text-red-800 underline" aria-label={`Delete ${l.name}`}>
                          Delete
                        </button>
                      </Form>
                    ) : (
                      <span className="text-xs text-ink/60">admin or uploader deletes</span>
                    )}
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
        </TableScroll>
      ) : (
        <p className="text-ink/70">No stock lists yet.</p>
      )}
      {mayEdit ? (
        <section aria-labelledby="upload-h" className="max-w-3xl space-y-3 rounded-lg border border-ink/15 bg-white p-4">
          <h2 id="upload-h" className="text-lg font-bold">
            Upload a CSV
          </h2>
          <p className="text-xs text-ink/70">
            Example:
            <code className="ml-1 whitespace-pre-wrap">{STOCK_CSV_EXAMPLE}</code>
          </p>
          <Form method="post" encType="multipart/form-data" className="space-y-3" onSubmit={(e) => setIntent(((e.nativeEvent as SubmitEvent).submitter as HTMLButtonElement | null)?.value ?? "preview")}>
            <label className="block text-sm">
              <span className="block font-semibold">CSV file</span>
              <input type="file" name="file" accept=".csv,text/csv" required aria-describedby="csv-errors" />
            </label>
            <label className="block text-sm">
              <span className="block font-semibold">Name (to keep it for the team)</span>
              <input name="name" maxLength={120} className="w-80 rounded-md border border-ink/30 px-2 py-1" aria-invalid={result?.errors?.name ? true : undefined} />
              {result?.errors?.name ? <span className="block font-semibold text-red-800">{result.errors.name}</span> : null}
            </label>
            <div className="flex gap-2">
              <button name="intent" value="preview" className="rounded-md border border-ink/30 bg-white px-3 py-1.5 text-sm font-semibold">
                Preview
              </button>
              <button name="intent" value="save" className="rounded-md bg-accent px-3 py-1.5 text-sm font-semibold text-white">
                Keep for the team
              </button>
            </div>
          </Form>
          <div id="csv-errors" aria-live="polite">
            {result?.lines?.length ? (
              <div role="alert" className="rounded-md border border-red-800 bg-red-50 p-3 text-sm">
                <p className="font-semibold">The file was not kept:</p>
                <ul className="list-disc pl-5">
                  {result.lines.map((e, i) => (
                    <li key={i}>{e.line ? `line ${e.line}: ${e.message}` : e.message}</li>
                  ))}
                </ul>
              </div>
            ) : null}
            {result?.errors && !result.lines && !result.errors.name && !result.errors.id ? <p role="alert" className="font-semibold text-red-800">{Object.values(result.errors).join("; ")}</p> : null}
            {result?.saved ? <p role="status" className="rounded-md border border-accent bg-teal-50 p-2 text-sm">Stock list saved.</p> : null}
            {result?.preview && !result.saved ? (
              <TableScroll>
              <table className="mt-2 border-collapse text-sm" data-testid="csv-preview">
                <caption className="text-left font-semibold">Preview ({result.preview.length} lines{intent === "preview" ? "; not yet kept" : ""})</caption>
                <thead>
                  <tr className="border-b border-ink/30">
                    <th className="px-2 text-right">Thickness (mm)</th>
                    <th className="px-2 text-right">Width (mm)</th>
                    <th className="px-2 text-right">Price per kg</th>
                  </tr>
                </thead>
                <tbody>
                  {result.preview.slice(0, 50).map((r, i) => (
                    <tr key={i} className="border-b border-ink/10 text-right tabular-nums">
                      <td className="px-2">{r.thickness}</td>
                      <td className="px-2">{r.width ?? "—"}</td>
                      <td className="px-2">{r.pricePerKg ?? "—"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              </TableScroll>
            ) : null}
          </div>
        </section>
      ) : null}
    </div>
  );
}

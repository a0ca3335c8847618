// Section catalogues: upload a CSV of rolled or hollow sections in our own column layout (documented
// on this page from CATALOGUE_CSV_HELP, and in the README), see every row the engine disagrees
// with, keep the rows that pass. A malformed file keeps nothing; the upload is read under a cap.
import { Form, Link, data } from "react-router";
import type { Route } from "./+types/admin.catalogues";
import { Button, Field, FormError, Notice } from "~/components/ui";
import { DataTable, RowActions, TableScroll } from "~/components/DataTable";
import { requirePermission } from "~/lib/auth.server";
import { fieldErrorsFrom, formToObject, readForm, withFieldErrors } from "~/lib/forms.server";
import {
  CATALOGUE_CSV_EXAMPLE,
  CATALOGUE_CSV_HELP,
  CATALOGUE_CSV_MAX_BYTES,
  DIM_HEADER,
  PRINTED_HEADER,
  parseCatalogueCsv,
  type CatalogueFileError,
} from "~/lib/catalogue-csv";
import {
  catalogueActionSchema,
  createCatalogue,
  deleteCatalogue,
  getCatalogue,
  listCatalogues,
  replaceCatalogue,
  type UploadReport,
} from "~/lib/catalogues.server";
import { CATALOGUE_NAME_MAX } from "~/lib/catalogue-limits";
import { idParam } from "~/lib/route-params";
import { CATALOGUE_DIMENSIONS, PRINTED_FIELDS, PRINTED_UNITS, SHAPE_WORDS } from "~/optimizer";

export function meta() {
  return [{ title: "Catalogues · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "manageCatalogues");
  const url = new URL(request.url);
  const view = idParam(url.searchParams.get("view") ?? undefined);
  const [catalogues, viewing] = await Promise.all([listCatalogues(user.teamId), Number.isNaN(view) ? null : getCatalogue(user.teamId, view)]);
  return { teamName: user.teamName, catalogues, viewing };
}

// Room for the multipart envelope and the other fields around a file at the limit.
const FORM_LIMIT = CATALOGUE_CSV_MAX_BYTES + 16 * 1024;

type ActionResult = {
  errors: Record<string, string> | null;
  /** a malformed file's line-numbered problems (nothing was kept) */
  lines?: CatalogueFileError[];
  report?: UploadReport;
  done?: string;
};

function fileFailure(lines: CatalogueFileError[], status: number) {
  const text = lines.map((e) => (e.line ? `line ${e.line}: ${e.message}` : e.message)).join("; ");
  return data<ActionResult>({ errors: { file: `File: ${text}` }, lines }, { status });
}

export async function action({ request }: Route.ActionArgs) {
  const admin = await requirePermission(request, "manageCatalogues");
  const upload = (request.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data");
  let form: FormData;
  try {
    form = upload ? await readForm(request, FORM_LIMIT) : await readForm(request);
  } catch (e) {
    if (upload && e instanceof Response && e.status === 413)
      return fileFailure([{ line: 0, message: `too large: over the ${CATALOGUE_CSV_MAX_BYTES / 1024} kB limit; nothing was kept` }], 413);
    throw e;
  }
  const { file, ...fields } = formToObject(form);
  const parsedAction = catalogueActionSchema.safeParse(fields);
  if (!parsedAction.success) return data<ActionResult>({ errors: fieldErrorsFrom(parsedAction.error, fields) }, { status: 400 });
  const input = parsedAction.data;
  if (input.intent === "delete")
    return withFieldErrors(async () => {
      const name = await deleteCatalogue(admin.teamId, admin.id, input.id);
      return { errors: null, done: `Deleted “${name}”. Sweeps that searched it keep their own copy of its sections.` } satisfies ActionResult;
    });

  if (!(file instanceof File) && typeof file !== "string") return fileFailure([{ line: 0, message: "choose a CSV file" }], 400);
  if (file instanceof File && file.size === 0 && !file.name) return fileFailure([{ line: 0, message: "choose a CSV file" }], 400);
  const text = typeof file === "string" ? file : await file.text();
  const parsed = parseCatalogueCsv(text, typeof file === "string" ? undefined : file.size);
  if (!parsed.ok) return fileFailure(parsed.errors, 400);
  const report: UploadReport = { rows: parsed.rows, kept: parsed.sections.length, rejectedRows: parsed.rejectedRows, rejected: parsed.rejected };
  if (input.intent === "check") return { errors: null, report } satisfies ActionResult;
  if (parsed.sections.length === 0)
    return data<ActionResult>({ errors: { file: "File: no row passed the check, so nothing was kept; fix the rows listed and upload again." }, report }, { status: 400 });
  return withFieldErrors(async () => {
    if (input.intent === "create") {
      await createCatalogue({ teamId: admin.teamId, userId: admin.id, name: input.name, parsed });
      return { errors: null, report, done: `Kept “${input.name}”: ${parsed.sections.length} sections.` } satisfies ActionResult;
    }
    const name = await replaceCatalogue({ teamId: admin.teamId, userId: admin.id, id: input.id, parsed });
    return { errors: null, report, done: `Replaced the sections of “${name}”: ${parsed.sections.length} now.` } satisfies ActionResult;
  });
}

const day = (d: string) => d.slice(0, 10);

function Report({ report, kept }: { report: UploadReport; kept: boolean }) {
  return (
    <div className="space-y-2" data-testid="catalogue-report">
      <p className="text-sm">
        {report.rows} {report.rows === 1 ? "section" : "sections"} read: {report.kept} passed the check{kept ? " and were kept" : ""}
        {report.rejectedRows ? `, ${report.rejectedRows} ${report.rejectedRows === 1 ? "row was" : "rows were"} kept out` : ""}.
      </p>
      {report.rejected.length ? (
        <div>
          <p className="font-semibold">Rows kept out until fixed</p>
          <DataTable
            testId="rejected-rows"
            caption="Rows kept out until fixed"
            columns={[
              { key: "line", header: "Line", numeric: true, cell: (r) => r.line },
              { key: "designation", header: "Designation", rowHeader: true, cell: (r) => r.designation },
              { key: "field", header: "Field", className: "font-mono text-xs", cell: (r) => r.field },
              { key: "printed", header: "Printed", numeric: true, cell: (r) => r.printed ?? "—" },
              { key: "computed", header: "Computed", numeric: true, cell: (r) => r.computed ?? "—" },
              { key: "problem", header: "Problem", cell: (r) => r.message },
            ]}
            rows={report.rejected.map((r, i) => ({ ...r, i }))}
            rowKey={(r) => r.i}
          />
          {report.rejected.length < report.rejectedRows ? <p className="text-xs text-ink/70">The first {report.rejected.length} problems are listed.</p> : null}
        </div>
      ) : null}
    </div>
  );
}

export default function AdminCatalogues({ loaderData, actionData }: Route.ComponentProps) {
  const { teamName, catalogues, viewing } = loaderData;
  const result = actionData as ActionResult | undefined;
  const errors = result?.errors ?? {};
  const topError = errors.id ?? errors.intent ?? errors.form;
  return (
    <div className="space-y-8">
      <div className="flex flex-wrap items-baseline justify-between gap-4">
        <h1 className="text-2xl font-bold">{teamName}: section catalogues</h1>
        <nav aria-label="Team admin" className="flex gap-4 text-sm font-semibold">
          <a href="/admin" className="text-accent-strong underline">Members</a>
          <a href="/admin/materials" className="text-accent-strong underline">Materials</a>
          <a href="/admin/costs" className="text-accent-strong underline">Costs</a>
          <a href="/stock-lists" className="text-accent-strong underline">Stock lists</a>
          <a href="/admin/outbox" className="text-accent-strong underline">Outbox</a>
        </nav>
      </div>
      <p className="max-w-3xl text-sm text-ink/80">
        A catalogue is your team's table of rolled and hollow sections. Every printed value in it is checked against the section properties computed from its dimensions, so a
        typing slip in a table shows up here, with its line, before any sweep relies on it.
      </p>
      <Notice message={result?.done ?? null} />
      <FormError message={topError} />

      <section aria-labelledby="list-h" className="space-y-3">
        <h2 id="list-h" className="text-xl font-bold">Your team's catalogues</h2>
        {catalogues.length === 0 ? (
          <p className="text-sm text-ink/70">No catalogues yet. Upload one below.</p>
        ) : (
          <DataTable
            caption="Your team's catalogues"
            columns={[
              { key: "name", header: "Name", rowHeader: true, cell: (c) => c.name },
              { key: "sections", header: "Sections", numeric: true, cell: (c) => c.sections },
              { key: "rejected", header: "Kept out at the last upload", numeric: true, cell: (c) => c.rejectedRows },
              { key: "updated", header: "Updated", className: "whitespace-nowrap", cell: (c) => `${day(c.updatedAt)}${c.uploadedBy ? ` · ${c.uploadedBy}` : ""}` },
              {
                key: "actions",
                header: <span className="sr-only">Actions</span>,
                cell: (c) => <RowActions to={`/admin/catalogues?view=${c.id}`} label="Sections" accessibleLabel={`Show the sections of ${c.name}`} deleteId={c.id} deleteLabel={`Delete ${c.name}`} />,
              },
            ]}
            rows={catalogues}
            rowKey={(c) => c.id}
            highlighted={(c) => viewing?.id === c.id}
          />
        )}
      </section>

      {viewing ? (
        <section aria-labelledby="view-h" className="space-y-3">
          <h2 id="view-h" className="text-xl font-bold">{viewing.name}: {viewing.sections} sections, lightest first</h2>
          <DataTable
            testId="catalogue-sections"
            caption={`The sections of ${viewing.name}`}
            scrollClassName="max-h-[32rem] overflow-y-auto rounded border border-ink/15 bg-white"
            stickyHead
            columns={[
              { key: "designation", header: "Designation", rowHeader: true, cell: (s) => s.designation },
              { key: "shape", header: "Shape", cell: (s) => SHAPE_WORDS[s.shape] },
              {
                key: "dims",
                header: "Dimensions (mm)",
                className: "tabular-nums",
                cell: (s) =>
                  CATALOGUE_DIMENSIONS.filter((k) => s.dims[k] !== undefined)
                    .map((k) => `${k} ${s.dims[k]}`)
                    .join(" · "),
              },
              { key: "mass", header: "Mass (kg/m)", numeric: true, cell: (s) => s.massPerMetre.toFixed(2) },
              {
                key: "printed",
                header: "Printed values checked",
                className: "text-xs",
                cell: (s) =>
                  PRINTED_FIELDS.filter((f) => s.printed[f] !== undefined)
                    .map((f) => `${f} ${s.printed[f]}`)
                    .join(" · ") || "none",
              },
            ]}
            rows={viewing.sectionRows}
            rowKey={(s) => s.designation}
          />
          {viewing.report && viewing.report.rejectedRows ? <Report report={viewing.report} kept /> : null}
        </section>
      ) : null}

      <section aria-labelledby="upload-h" className="max-w-4xl space-y-3 rounded-lg border border-ink/15 bg-white p-4">
        <h2 id="upload-h" className="text-lg font-bold">Upload a catalogue</h2>
        <Form method="post" encType="multipart/form-data" className="space-y-3" noValidate>
          <label className="block text-sm">
            <span className="block font-semibold">CSV file</span>
            <input type="file" name="file" accept=".csv,text/csv" required aria-describedby="catalogue-file-errors" />
          </label>
          <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
            <Field id="catalogue-name" label="Name for a new catalogue" name="name" maxLength={CATALOGUE_NAME_MAX} error={errors.name} hint={`Up to ${CATALOGUE_NAME_MAX} characters; unique in the team.`} />
            {catalogues.length ? (
              <div className="space-y-1">
                <label htmlFor="catalogue-replace" className="block text-sm font-semibold">Or replace the sections of</label>
                <select id="catalogue-replace" name="id" className="block w-full rounded-md border border-ink/30 bg-white px-2 py-2 text-sm" defaultValue={viewing?.id}>
                  {catalogues.map((c) => (
                    <option key={c.id} value={c.id}>{c.name}</option>
                  ))}
                </select>
              </div>
            ) : null}
          </div>
          <div className="flex flex-wrap gap-2">
            <Button variant="quiet" name="intent" value="check">Check only</Button>
            <Button name="intent" value="create">Keep as a new catalogue</Button>
            {catalogues.length ? (
              <Button variant="quiet" name="intent" value="replace">Replace the chosen catalogue's sections</Button>
            ) : null}
          </div>
        </Form>
        <div id="catalogue-file-errors" aria-live="polite" className="space-y-2">
          {result?.lines?.length ? (
            <div role="alert" className="rounded-md border border-red-800 bg-red-50 p-3 text-sm" data-testid="catalogue-file-errors">
              <p className="font-semibold">The file is malformed; nothing was kept:</p>
              <ul className="list-disc pl-5">
                {result.lines.map((e, i) => (
                  <li key={i}>{e.line ? `line ${e.line}: ${e.message}` : e.message}</li>
                ))}
              </ul>
            </div>
          ) : null}
          {errors.file && !result?.lines ? <p role="alert" className="font-semibold text-red-800">{errors.file}</p> : null}
          {result?.report ? <Report report={result.report} kept={Boolean(result.done)} /> : null}
        </div>
      </section>

      <section aria-labelledby="layout-h" className="max-w-4xl space-y-3">
        <h2 id="layout-h" className="text-lg font-bold">The file's layout</h2>
        <p className="text-sm">One section per line, comma-separated, with a header line naming the columns:</p>
        <TableScroll>
        <table className="text-left text-sm">
          <tbody>
            {CATALOGUE_CSV_HELP.columns.map(([col, words]) => (
              <tr key={col} className="border-b border-ink/10 align-top">
                <th scope="row" className="py-1 pr-4 font-mono text-xs whitespace-nowrap">{col}</th>
                <td className="py-1">{words}</td>
              </tr>
            ))}
          </tbody>
        </table>
        </TableScroll>
        <ul className="list-disc pl-5 text-sm">
          {CATALOGUE_CSV_HELP.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
        <p className="text-xs text-ink/70">
          Headers: {[ "designation", "shape", ...Object.values(DIM_HEADER), ...Object.values(PRINTED_HEADER)].join(", ")}. Printed units:{" "}
          {PRINTED_FIELDS.map((f) => `${f} ${PRINTED_UNITS[f]}`).join(", ")}.
        </p>
        <pre className="overflow-x-auto rounded bg-ink/5 p-3 text-xs">{CATALOGUE_CSV_EXAMPLE}</pre>
      </section>
    </div>
  );
}

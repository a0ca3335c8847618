// The team's materials beside the built-in presets. Both only fill a brief's fields (through the
// one derivation in app/optimizer/materials.ts); briefs keep the values, so editing or deleting a
// material here changes no saved brief, sweep or option.
import { Form, Link, redirect } from "react-router";
import type { Route } from "./+types/admin.materials";
import { Button, Field, FormError, Notice } from "~/components/ui";
import { DataTable, RowActions, type Column } from "~/components/DataTable";
import type { TeamMaterialChoice } from "~/components/BriefEditor";
import { requirePermission } from "~/lib/auth.server";
import { badRequest, parseForm, readForm, withFieldErrors } from "~/lib/forms.server";
import { grouped, MATERIAL_LIMITS, MATERIAL_NAME_MAX } from "~/lib/material-limits";
import { createMaterial, deleteMaterial, listMaterials, materialActionSchema, updateMaterial } from "~/lib/materials.server";
import { idParam } from "~/lib/route-params";
import { materialFill, OWN_MATERIAL_RULES, presetFill, STEEL_GRADES, type PresetFill, type SlendernessRules } from "~/optimizer/materials";

export function meta() {
  return [{ title: "Materials · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "manageTeam");
  const url = new URL(request.url);
  const materials = await listMaterials(user.teamId);
  const find = (param: string) => materials.find((m) => m.id === idParam(url.searchParams.get(param) ?? undefined)) ?? null;
  return { teamName: user.teamName, materials, editing: find("edit"), saved: find("saved")?.name ?? null };
}

export async function action({ request }: Route.ActionArgs) {
  const admin = await requirePermission(request, "manageTeam");
  const parsed = parseForm(await readForm(request), materialActionSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  const input = parsed.data;
  return withFieldErrors(async () => {
    switch (input.intent) {
      case "create": {
        const id = await createMaterial(admin, input);
        return { done: `Added “${input.name}”. It is now in every brief's material preset list.`, added: id };
      }
      case "update":
        await updateMaterial(admin, input.id, input);
        // Back to the list: the edit form closes and the notice names what was saved.
        return redirect(`/admin/materials?saved=${input.id}`);
      case "delete": {
        const name = await deleteMaterial(admin, input.id);
        return { done: `Deleted “${name}”. Briefs it filled keep their values.` };
      }
    }
  });
}

const RULES_LABEL: Record<SlendernessRules, string> = {
  "en-1993": "EN 1993-1-1 Table 5.2",
  "aisc-360": "AISC 360-16 Table B4.1b",
};

const mpa = (x: number) => grouped(x);
const range = (k: keyof typeof MATERIAL_LIMITS) => `${grouped(MATERIAL_LIMITS[k].min)} to ${grouped(MATERIAL_LIMITS[k].max)} ${MATERIAL_LIMITS[k].unit}`;

function Allowables({ fill }: { fill: PresetFill }) {
  return (
    <span className="whitespace-nowrap tabular-nums">
      {fill.allowable.tension} / {fill.allowable.compression} / {fill.allowable.shear}
    </span>
  );
}

interface MaterialValues {
  name: string;
  E: number;
  fy: number;
  density: number;
}

/** The columns a team material and a built-in preset share: what each fills in a brief. */
function materialColumns<M extends MaterialValues>(rules: (m: M) => string, fill: (m: M) => PresetFill, note?: (m: M) => React.ReactNode): Column<M>[] {
  return [
    {
      key: "name",
      header: "Name",
      rowHeader: true,
      cell: (m) => (
        <>
          {m.name}
          {note?.(m)}
        </>
      ),
    },
    { key: "E", header: "E (MPa)", numeric: true, cell: (m) => mpa(m.E) },
    { key: "fy", header: "fy (MPa)", numeric: true, cell: (m) => mpa(m.fy) },
    { key: "density", header: "Density (kg/m³)", numeric: true, cell: (m) => grouped(m.density) },
    { key: "allowables", header: "Allowables: tension / compression / shear (MPa)", cell: (m) => <Allowables fill={fill(m)} /> },
    { key: "rules", header: "Slenderness limits", cell: rules },
  ];
}

function MaterialForm({ material, errors }: { material: TeamMaterialChoice | null; errors: Record<string, string> }) {
  const nameMax = MATERIAL_NAME_MAX;
  const editing = material !== null;
  const prefix = editing ? `edit-${material.id}` : "add";
  return (
    <Form method="post" className="space-y-3" noValidate>
      <input type="hidden" name="intent" value={editing ? "update" : "create"} />
      {editing ? <input type="hidden" name="id" value={material.id} /> : null}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Field
          id={`${prefix}-name`}
          label="Name"
          name="name"
          required
          maxLength={nameMax}
          defaultValue={material?.name}
          autoFocus={editing}
          error={errors.name}
          hint={`Up to ${nameMax} characters; unique in the team.`}
        />
        <Field id={`${prefix}-E`} label="E, elastic modulus (MPa)" name="E" inputMode="decimal" required defaultValue={material?.E} error={errors.E} hint={range("E")} />
        <Field id={`${prefix}-fy`} label="fy, yield strength (MPa)" name="fy" inputMode="decimal" required defaultValue={material?.fy} error={errors.fy} hint={range("fy")} />
        <Field id={`${prefix}-density`} label="Density (kg/m³)" name="density" inputMode="decimal" required defaultValue={material?.density} error={errors.density} hint={range("density")} />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button>{editing ? "Save changes" : "Add material"}</Button>
        {editing ? (
          <Link to="/admin/materials" className="text-sm font-semibold text-accent-strong underline">
            Cancel
          </Link>
        ) : null}
      </div>
    </Form>
  );
}

export default function AdminMaterials({ loaderData, actionData }: Route.ComponentProps) {
  const { teamName, materials, editing, saved } = loaderData;
  const errors: Record<string, string> = (actionData && "errors" in actionData ? actionData.errors : undefined) ?? {};
  const done = actionData && "done" in actionData ? actionData.done : saved ? `Saved “${saved}”.` : null;
  const added = actionData && "added" in actionData ? actionData.added : 0;
  // Errors not shown beside a field of the open form go to the top.
  const topError = errors.id ?? errors.intent ?? errors.form;
  return (
    <div className="space-y-8">
      <div className="flex flex-wrap items-baseline justify-between gap-4">
        <h1 className="text-2xl font-bold">{teamName}: materials</h1>
        <nav aria-label="Team admin" className="flex gap-4 text-sm font-semibold">
          <a href="/admin" className="text-accent-strong underline">Members</a>
          <a href="/stock-lists" className="text-accent-strong underline">Stock lists</a>
          <a href="/admin/catalogues" className="text-accent-strong underline">Catalogues</a>
          <a href="/admin/costs" className="text-accent-strong underline">Costs</a>
          <a href="/admin/outbox" className="text-accent-strong underline">Outbox</a>
        </nav>
      </div>
      <p className="max-w-3xl text-sm text-ink/80">
        A material fills a brief's density, allowable stresses (0.60·fy tension, 0.60·fy compression, 0.40·fy shear) and slenderness limits; the engineer can change every
        value, and the brief keeps the values, not the material. Editing or deleting a material here changes no saved brief.
      </p>
      <Notice message={done} />
      <FormError message={topError} />

      <section aria-labelledby="own-h" className="space-y-3">
        <h2 id="own-h" className="text-xl font-bold">
          Your team's materials
        </h2>
        {materials.length === 0 ? (
          <p className="text-sm text-ink/70">Your team has no materials of its own yet. Add one below; it will appear in every brief's material preset list after the built-in presets.</p>
        ) : (
          <DataTable
            caption="Your team's materials, with the values they fill"
            columns={[...materialColumns<TeamMaterialChoice>(() => RULES_LABEL[OWN_MATERIAL_RULES], materialFill), {
              key: "actions",
              header: <span className="sr-only">Actions</span>,
              cell: (m) => <RowActions to={`/admin/materials?edit=${m.id}`} label="Edit" accessibleLabel={`Edit ${m.name}`} deleteId={m.id} deleteLabel={`Delete ${m.name}`} />,
            }]}
            rows={materials}
            rowKey={(m) => m.id}
            highlighted={(m) => editing?.id === m.id}
          />
        )}
      </section>

      <section aria-labelledby="form-h" className="max-w-4xl space-y-3 rounded-lg border border-ink/15 bg-white p-4">
        <h2 id="form-h" className="text-lg font-bold">
          {editing ? `Edit “${editing.name}”` : "Add a material"}
        </h2>
        <p className="text-xs text-ink/70">
          Team materials take the slenderness limits of {RULES_LABEL[OWN_MATERIAL_RULES]}, written in √(E/fy), so they follow a material whose E is not steel's.
        </p>
        <MaterialForm key={editing ? `edit-${editing.id}` : `add-${added}`} material={editing} errors={errors} />
      </section>

      <section aria-labelledby="presets-h" className="space-y-3">
        <h2 id="presets-h" className="text-xl font-bold">
          Built-in presets
        </h2>
        <p className="text-sm text-ink/70">Read-only; listed first in every brief's material preset list.</p>
        <DataTable
          caption="Built-in steel presets, with their sources"
          columns={[
            ...materialColumns<(typeof STEEL_GRADES)[number]>((g) => RULES_LABEL[g.rules], (g) => presetFill(g.id), (g) => <span className="block text-xs font-normal text-ink/70">{g.note}</span>),
            { key: "source", header: "Source", cell: (g) => g.source, className: "text-xs" },
          ]}
          rows={[...STEEL_GRADES]}
          rowKey={(g) => g.id}
        />
      </section>
    </div>
  );
}

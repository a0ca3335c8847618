// The brief editor: every field of the search problem, validated by the same schema the server
// and the queue use (briefFormSchema wraps searchProblemSchema), wired with Conform so errors
// sit beside their fields with aria-describedby, and the form still posts without JavaScript.
// The preview (grid size, one sample section's properties and checks) runs the engine in the browser.
import { checkLabel, fieldLabel } from "~/lib/labels";
import { CatalogueChoice, type CatalogueChoiceOption, type KeptCatalogueOption } from "~/components/CatalogueChoice";
import type { CatalogueShape } from "~/optimizer/catalogue";
import { useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import { Form } from "react-router";
import { getCollectionProps, getFormProps, getInputProps, useForm, type FieldMetadata, type SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import {
  briefFormSchema,
  type BriefFormShape,
  type BriefParsed,
  displayNumber,
  FAMILY_LABELS,
  FIELD_QUANTITIES,
  fieldUnit,
  readSiMemo,
  shownValue,
  SEARCH_FAMILIES,
  switchShownUnits,
  type NumericField,
  type SiMemo,
} from "~/lib/brief-form";
import { fromSI, type Quantity, type UnitSystem } from "~/optimizer/units";
import { FAMILY_DIMENSIONS, familyRuleViolation, type Family } from "~/optimizer/geometry";
import { axisCount, gridValues, rawGridSize, type SearchProblem } from "~/optimizer/search-schema";
import { sectionProperties } from "~/optimizer/properties";
import { candidateChecks } from "~/optimizer/checks";
import { materialFill, presetFill, STEEL_GRADES, type MaterialProperties } from "~/optimizer/materials";
import { SectionDrawing } from "~/components/SectionDrawing";
import { formatNumber, formatQuantity } from "~/components/PropertyTable";
import { UnitSwitch } from "~/components/UnitSwitch";
import { BasisPanels, BasisSwitch, fillGrade, type BasisFields } from "~/components/DesignBasisPanel";
import { EN1993_FAMILIES, EN1993_GRADES, type Basis, type En1993Grade } from "~/optimizer/search-schema";
import { gradeFill } from "~/lib/brief-form-basis";

export interface StockListChoice {
  id: number;
  name: string;
  /** mm, ascending */
  thicknesses: number[];
  /** per kg by thickness (mm), for the cost objective; empty when the list has no prices */
  prices: { thickness: number; pricePerKg: number }[];
}

/** A team's own material (admin → Materials): E and fy in MPa, density in kg/m³. */
export interface TeamMaterialChoice extends MaterialProperties {
  id: number;
  name: string;
}

/** The preset list's value for a team material; built-in grades use their own ids ("s355"). */
const TEAM_PRESET_PREFIX = "team:";

type Meta = FieldMetadata<unknown>;

function NumberInput({ meta, label, field, units, hint }: { meta: Meta; label: string; field?: NumericField; units: UnitSystem; hint?: string }) {
  const unit = field ? fieldUnit(field, units) : null;
  const props = getInputProps(meta as FieldMetadata<number>, { type: "text" });
  return (
    <div className="space-y-1">
      <label htmlFor={meta.id} className="block text-sm font-semibold">
        {label} {unit ? <span className="font-normal text-ink/70">({unit})</span> : null}
      </label>
      <input
        {...props}
        key={props.key}
        inputMode="decimal"
        data-quantity={field ? FIELD_QUANTITIES[field] : undefined}
        className={`block w-full rounded-md border bg-white px-2 py-1.5 tabular-nums ${meta.errors ? "border-red-700" : "border-ink/30"}`}
      />
      {hint ? <p className="text-xs text-ink/70">{hint}</p> : null}
      {meta.errors ? (
        <p id={meta.errorId} className="text-sm font-semibold text-red-800">
          {meta.errors.join("; ")}
        </p>
      ) : null}
    </div>
  );
}

function Group({ title, children, note, hidden }: { title: string; children: ReactNode; note?: string; hidden?: boolean }) {
  // Hidden groups are disabled too, so they send nothing (the allowables under the EN 1993 basis).
  return (
    <fieldset className="rounded-lg border border-ink/15 bg-white p-4" hidden={hidden} disabled={hidden}>
      <legend className="px-1 text-base font-bold">{title}</legend>
      {note ? <p className="mb-2 text-xs text-ink/70">{note}</p> : null}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">{children}</div>
    </fieldset>
  );
}

/** The problem as typed so far, for the preview: a missing brief name does not hold it back. */
function previewProblem(form: HTMLFormElement): SearchProblem | null {
  const fd = new FormData(form);
  if (!String(fd.get("name") ?? "").trim()) fd.set("name", "preview");
  const s = parseWithZod(fd, { schema: briefFormSchema });
  return s.status === "success" ? s.value.problem : null;
}

/** A mid-grid sample of a family: middle depth and width, middle thickness (for the preview only). */
function sampleDimensions(problem: SearchProblem, family: Family): Record<string, number> | null {
  const mid = (a: Float64Array) => a[Math.floor(a.length / 2)];
  const depths = gridValues(problem.depth),
    widths = gridValues(problem.width);
  const ts = [...new Set(problem.thicknesses)].sort((a, b) => a - b);
  if (!depths.length || !widths.length || !ts.length) return null;
  const t = ts[Math.floor(ts.length / 2)];
  const dims: Record<string, number> = {};
  for (const k of FAMILY_DIMENSIONS[family]) dims[k] = k === "d" ? mid(depths) : k === "b" || k === "bt" || k === "bb" ? mid(widths) : t;
  return familyRuleViolation(family, dims) ? null : dims;
}

export function BriefEditor({
  defaultValue,
  lastResult,
  stockLists,
  teamMaterials = [],
  intro,
  submitLabel = "Save brief",
  runLabel = "Save and run",
  allowSave = true,
  original,
  catalogues,
}: {
  defaultValue: Record<string, unknown>;
  lastResult?: SubmissionResult<string[]> | null;
  stockLists: StockListChoice[];
  /** listed after the built-in presets */
  teamMaterials?: TeamMaterialChoice[];
  intro?: ReactNode;
  submitLabel?: string;
  runLabel?: string;
  allowSave?: boolean;
  /** for a recheck: the original values, shown beside each changed field */
  original?: Record<string, unknown>;
  /** the team's section catalogues and the brief's choice among them (absent: no catalogue choice shown) */
  catalogues?: { options: CatalogueChoiceOption[]; chosen: string[]; shapes?: CatalogueShape[]; kept?: KeptCatalogueOption[] };
}) {
  const [units, setUnits] = useState<UnitSystem>((defaultValue.units as UnitSystem) ?? "si");
  const [problem, setProblem] = useState<SearchProblem | null>(() => {
    const r = briefFormSchema.safeParse({ ...defaultValue, name: defaultValue.name || "preview" });
    return r.success ? r.data.problem : null;
  });
  const formRef = useRef<HTMLFormElement>(null);
  const [form, fields] = useForm<BriefFormShape, BriefParsed>({
    lastResult: lastResult ?? undefined,
    defaultValue: defaultValue as never,
    shouldValidate: "onBlur",
    shouldRevalidate: "onInput",
    onValidate: ({ formData }) => parseWithZod(formData, { schema: briefFormSchema }),
  });
  const moment = fields.moment.getFieldset();
  const allowable = fields.allowable.getFieldset();
  const depth = fields.depth.getFieldset();
  const width = fields.width.getFieldset();
  const slender = fields.slenderness.getFieldset();
  const defl = fields.deflection.getFieldset();
  const [prices, setPrices] = useState(String(defaultValue.prices ?? ""));
  const [sampleFamily, setSampleFamily] = useState<Family>(((defaultValue.families as string[] | undefined)?.[0] as Family) ?? "channel");
  const [basis, setBasis] = useState<Basis>(defaultValue.basis === "en1993" || defaultValue.basis === "aisc360" ? defaultValue.basis : "allowable");
  // The basis decides which panels are enabled (and so sent): re-read the preview once they have re-rendered.
  useEffect(() => {
    if (formRef.current) setProblem(previewProblem(formRef.current));
  }, [basis]);

  // The exact SI value behind every shown number (brief-form.ts, SiMemo); sent as the hidden
  // siValues. Controlled: React re-applies a hidden input's defaultValue on every render.
  const [siMemo, setSiMemo] = useState(String(defaultValue.siValues ?? ""));
  const writeMemo = (el: HTMLFormElement, memo: SiMemo) => {
    const text = JSON.stringify(memo);
    setSiMemo(text);
    // The state reaches the hidden input on the next render; the preview reads it now.
    const hidden = el.querySelector<HTMLInputElement>("input[name=siValues]");
    if (hidden) hidden.value = text;
  };
  const stockThicknessesMm = () => stockLists.flatMap((l) => l.thicknesses);
  // A grade preset's SI values (EN 10025-2 bands, fu) stand behind the fields it filled, so a US
  // display (355 MPa = 51.4884 ksi) does not come back as 355.000002. Only fields still showing
  // the preset's value are remembered; a typed one is converted from what was typed.
  function rememberGrade(el: HTMLFormElement) {
    const grade = el.querySelector<HTMLSelectElement>("select[name='steel.grade']")?.value ?? "";
    if (!(grade in EN1993_GRADES)) return;
    const fill = gradeFill(grade as En1993Grade);
    const memo = readSiMemo(el.querySelector<HTMLInputElement>("input[name=siValues]")?.value);
    const exact: [string, Quantity, number][] = [["steel.fu", "stress", fill.fu]];
    fill.fy.forEach((b, i) => exact.push([`steel.fy[${i}].maxThickness`, "length", b.maxThickness], [`steel.fy[${i}].fy`, "stress", b.fy]));
    let changed = false;
    for (const [name, q, si] of exact) {
      const input = el.querySelector<HTMLInputElement>(`input[name="${name}"]`);
      if (input && input.value.trim() !== "" && Number(input.value) === shownValue(q, si, units) && memo[name] !== si) {
        memo[name] = si;
        changed = true;
      }
    }
    if (changed) writeMemo(el, memo);
  }

  // Switching units only re-expresses what is shown: every field keeps its exact SI value
  // (switchShownUnits), so any number of switches leaves the brief byte-identical.
  function switchUnits(next: UnitSystem) {
    const el = formRef.current;
    if (el && next !== units) {
      const inputs = [...el.querySelectorAll<HTMLInputElement>("input[data-quantity], input[name=thicknesses]")];
      const shown = Object.fromEntries(inputs.map((i) => [i.name, i.value]));
      const r = switchShownUnits(shown, readSiMemo(el.querySelector<HTMLInputElement>("input[name=siValues]")?.value), units, next, stockThicknessesMm());
      for (const i of inputs) i.value = r.shown[i.name];
      writeMemo(el, r.memo);
      // The radio's state reaches the DOM on the next render; the preview reads the new units now.
      const radio = el.querySelector<HTMLInputElement>(`input[name=units][value=${next}]`);
      if (radio) radio.checked = true;
      setProblem(previewProblem(el));
    }
    setUnits(next);
  }

  // A material preset only fills fields (materials.ts): every value stays editable and the brief stores values.
  function applyPreset(id: string) {
    const el = formRef.current;
    if (!el || !id) return;
    // Built-in grades and team materials go through the same derivation (materialFill).
    const own = id.startsWith(TEAM_PRESET_PREFIX) ? teamMaterials.find((m) => `${TEAM_PRESET_PREFIX}${m.id}` === id) : undefined;
    if (id.startsWith(TEAM_PRESET_PREFIX) && !own) return;
    const fill = own ? materialFill(own) : presetFill(id);
    const memo = readSiMemo(el.querySelector<HTMLInputElement>("input[name=siValues]")?.value);
    const set = (name: string, q: Quantity | null, v: number) => {
      const input = el.querySelector<HTMLInputElement>(`input[name="${name}"]`);
      if (input) input.value = String(displayNumber(q ? fromSI(q, v, units) : v));
      // The preset's own SI value stands behind what is shown (213 MPa, not 30.8927 ksi × 6.894757).
      if (q) memo[name] = v;
    };
    set("density", "density", fill.density);
    set("allowable.tension", "stress", fill.allowable.tension);
    set("allowable.compression", "stress", fill.allowable.compression);
    set("allowable.shear", "stress", fill.allowable.shear);
    for (const k of ["outstand", "internal", "web", "stem"] as const) set(`slenderness.${k}`, null, fill.slenderness[k]);
    // E belongs to the material: filled always, so a deflection limit added later has it (E alone asks for no check).
    set("deflection.E", "stress", fill.E);
    writeMemo(el, memo);
    // A built-in EN grade (s355) also fills the EN 1993 steel: bands, fu, βw.
    const en = id.toUpperCase();
    if (en in EN1993_GRADES) {
      fillGrade(el, en as En1993Grade, units);
      rememberGrade(el);
    }
    setProblem(previewProblem(el));
  }

  function useStockList(id: string) {
    const list = stockLists.find((s) => String(s.id) === id);
    const th = formRef.current?.querySelector<HTMLInputElement>("input[name=thicknesses]");
    const el0 = formRef.current;
    if (list && th && el0) {
      th.value = list.thicknesses.map((t) => String(displayNumber(fromSI("length", t, units)))).join(", ");
      // The list's exact mm values stand behind what is shown (see switchUnits).
      writeMemo(el0, { ...readSiMemo(el0.querySelector<HTMLInputElement>("input[name=siValues]")?.value), thicknesses: [...list.thicknesses] });
    }
    const next = list && list.prices.length ? JSON.stringify(list.prices) : "";
    setPrices(next);
    const el = formRef.current;
    if (el) {
      // The state reaches the hidden input on the next render; the preview reads it now.
      const fd = el.querySelector<HTMLInputElement>("input[name=prices]");
      if (fd) fd.value = next;
      setProblem(previewProblem(el));
    }
  }

  const preview = useMemo(() => {
    if (!problem) return null;
    const grid = rawGridSize(problem);
    const fam = problem.families.includes(sampleFamily) ? sampleFamily : problem.families[0];
    const dims = sampleDimensions(problem, fam);
    if (!dims) return { grid, fam, dims: null };
    try {
      const section = { family: fam, ...dims, density: problem.density } as Parameters<typeof sectionProperties>[0];
      return { grid, fam, dims, section, props: sectionProperties(section), verdict: candidateChecks(fam, dims, problem) };
    } catch {
      return { grid, fam, dims: null };
    }
  }, [problem, sampleFamily]);

  const thicknessMeta = fields.thicknesses;
  const origText = (path: string) => {
    if (!original) return null;
    const v = path.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), original);
    return v === undefined || v === null || v === "" ? "—" : Array.isArray(v) ? v.join(", ") : String(v);
  };

  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
      <Form
        method="post"
        {...getFormProps(form)}
        ref={formRef}
        className="space-y-4"
        onInput={(e) => setProblem(previewProblem(e.currentTarget))}
      >
        {intro}
        <input type="hidden" name={fields.siValues.name} value={siMemo} />
        {form.errors ? (
          <p role="alert" id={form.errorId} className="rounded-md border border-red-800 bg-red-50 px-3 py-2 text-sm font-semibold text-red-900">
            {form.errors.join("; ")}
          </p>
        ) : null}
        <div className="flex flex-wrap items-end gap-4">
          <div className="min-w-64 flex-1 space-y-1">
            <label htmlFor={fields.name.id} className="block text-sm font-semibold">
              Brief name
            </label>
            <input {...getInputProps(fields.name, { type: "text" })} key={fields.name.key} className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5" />
            {fields.name.errors ? (
              <p id={fields.name.errorId} className="text-sm font-semibold text-red-800">
                {fields.name.errors.join("; ")}
              </p>
            ) : null}
          </div>
          <div className="space-y-1">
            <label htmlFor="material-preset" className="block text-sm font-semibold">
              Material preset
            </label>
            <select
              id="material-preset"
              name={fields.material.name}
              defaultValue={String(defaultValue.material ?? "")}
              onChange={(e) => applyPreset(e.target.value)}
              aria-describedby="material-preset-hint"
              className="rounded-md border border-ink/30 bg-white px-2 py-1.5"
            >
              <option value="">— none —</option>
              <optgroup label="Built-in presets">
                {STEEL_GRADES.map((g) => (
                  <option key={g.id} value={g.id}>
                    {g.name} (fy {g.fy} MPa)
                  </option>
                ))}
              </optgroup>
              {teamMaterials.length ? (
                <optgroup label="Your team's materials">
                  {teamMaterials.map((m) => (
                    <option key={m.id} value={`${TEAM_PRESET_PREFIX}${m.id}`}>
                      {m.name} (fy {m.fy} MPa)
                    </option>
                  ))}
                </optgroup>
              ) : null}
            </select>
            <p id="material-preset-hint" className="text-xs text-ink/70">
              Fills density, allowables (0.60/0.60/0.40·fy) and slenderness limits; all stay editable. Team materials take the √(E/fy) limits of AISC 360.
            </p>
          </div>
          <UnitSwitch value={units} onChange={switchUnits} name="units" />
        </div>

        <BasisSwitch meta={fields.basis} basis={basis} onChange={setBasis} />

        <Group
          title="Loads"
          note={`Design moments about the horizontal axis; sagging compresses the top fibre.${basis === "en1993" ? " Factored values (ultimate limit state)." : basis === "aisc360" ? " Required strengths of the chosen method (LRFD: factored; ASD: ASD load combinations)." : ""}`}
        >
          <NumberInput meta={moment.sagging} label="Sagging moment" field="moment.sagging" units={units} />
          <NumberInput meta={moment.hogging} label="Hogging moment" field="moment.hogging" units={units} />
          <NumberInput meta={fields.shear} label="Shear force" field="shear" units={units} hint="optional" />
        </Group>

        <Group title="Allowable stresses" hidden={basis !== "allowable"}>
          <NumberInput meta={allowable.tension} label="Tension" field="allowable.tension" units={units} />
          <NumberInput meta={allowable.compression} label="Compression" field="allowable.compression" units={units} />
          <NumberInput meta={allowable.shear} label="Shear" field="allowable.shear" units={units} hint="required when a shear force is given" />
        </Group>

        <BasisPanels
          fields={fields as unknown as BasisFields}
          units={units}
          basis={basis}
          defaultValue={defaultValue}
          onChange={() => {
            if (!formRef.current) return;
            rememberGrade(formRef.current);
            setProblem(previewProblem(formRef.current));
          }}
        />

        <Group title="Depth and width limits" note="The grid takes every min + k·step up to max.">
          <NumberInput meta={depth.min} label="Depth, min" field="depth.min" units={units} />
          <NumberInput meta={depth.max} label="Depth, max" field="depth.max" units={units} />
          <NumberInput meta={depth.step} label="Depth, step" field="depth.step" units={units} />
          <NumberInput meta={width.min} label="Width, min" field="width.min" units={units} />
          <NumberInput meta={width.max} label="Width, max" field="width.max" units={units} />
          <NumberInput meta={width.step} label="Width, step" field="width.step" units={units} />
        </Group>

        <fieldset className="rounded-lg border border-ink/15 bg-white p-4">
          <legend className="px-1 text-base font-bold">Plate stock</legend>
          <div className="grid gap-3 sm:grid-cols-[1fr_16rem]">
            <div className="space-y-1">
              <label htmlFor={thicknessMeta.id} className="block text-sm font-semibold">
                Plate thicknesses <span className="font-normal text-ink/70">({fieldUnit("thicknesses", units)}, separated by commas)</span>
              </label>
              <input
                {...getInputProps(thicknessMeta, { type: "text" })}
                key={thicknessMeta.key}
                className={`block w-full rounded-md border bg-white px-2 py-1.5 tabular-nums ${thicknessMeta.errors ? "border-red-700" : "border-ink/30"}`}
              />
              {thicknessMeta.errors ? (
                <p id={thicknessMeta.errorId} className="text-sm font-semibold text-red-800">
                  {thicknessMeta.errors.join("; ")}
                </p>
              ) : null}
            </div>
            <div className="space-y-1">
              <label htmlFor="stock-list" className="block text-sm font-semibold">
                Fill from a stock list
              </label>
              <select
                id="stock-list"
                name={fields.stockListId.name}
                defaultValue={String(defaultValue.stockListId ?? "")}
                onChange={(e) => useStockList(e.target.value)}
                className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5"
              >
                <option value="">— none —</option>
                {stockLists.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name} ({s.thicknesses.length} thicknesses)
                  </option>
                ))}
              </select>
            </div>
          </div>
        </fieldset>

        <fieldset className="rounded-lg border border-ink/15 bg-white p-4">
          <legend className="px-1 text-base font-bold">Objective</legend>
          {/* Controlled: React re-applies a hidden input's defaultValue on every render, which would wipe a DOM-set value. */}
          <input type="hidden" name={fields.prices.name} value={prices} />
          <label htmlFor={fields.objective.id} className="sr-only">
            Objective
          </label>
          <select
            id={fields.objective.id}
            name={fields.objective.name}
            defaultValue={String(defaultValue.objective ?? "mass")}
            aria-describedby={fields.prices.errors ? fields.prices.errorId : undefined}
            className="rounded-md border border-ink/30 bg-white px-2 py-1.5"
          >
            <option value="mass">Lightest (least mass per length)</option>
            <option value="cost">Cheapest (plate mass × the stock list's price per kg)</option>
          </select>
          {fields.prices.errors || fields.objective.errors ? (
            <p id={fields.prices.errorId} className="mt-1 text-sm font-semibold text-red-800">
              {[...(fields.objective.errors ?? []), ...(fields.prices.errors ?? [])].join("; ")} (choose a stock list with prices for every thickness)
            </p>
          ) : null}
        </fieldset>

        <fieldset className="rounded-lg border border-ink/15 bg-white p-4">
          <legend className="px-1 text-base font-bold">Shape families</legend>
          <div className="grid grid-cols-2 gap-2 sm:grid-cols-4">
            {getCollectionProps(fields.families, { type: "checkbox", options: [...SEARCH_FAMILIES] }).map((p) => (
              <label key={p.key} className="flex items-center gap-2 text-sm">
                <input {...p} key={p.key} />
                {FAMILY_LABELS[p.value as Family]}
                {basis === "en1993" && !(EN1993_FAMILIES as readonly string[]).includes(p.value) ? <span className="text-xs text-ink/70">(allowable basis only)</span> : null}
              </label>
            ))}
          </div>
          {fields.families.errors ? (
            <p id={fields.families.errorId} className="mt-1 text-sm font-semibold text-red-800">
              {fields.families.errors.join("; ")}
            </p>
          ) : null}
        </fieldset>
        {catalogues ? <CatalogueChoice catalogues={catalogues.options} chosen={catalogues.chosen} shapes={catalogues.shapes} kept={catalogues.kept} /> : null}

        <Group title="Slenderness limits (width ÷ thickness)" note="Leave a limit empty to skip that check.">
          <NumberInput meta={slender.outstand} label="Flange outstand" units={units} />
          <NumberInput meta={slender.internal} label="Internal plate" units={units} />
          <NumberInput meta={slender.web} label="Web" units={units} />
          <NumberInput meta={slender.stem} label="Stem" units={units} />
        </Group>

        <Group title="Material and deflection" note="Deflection: simply supported span, uniform service load, limit span ÷ ratio. Leave all four empty to skip.">
          <NumberInput meta={fields.density} label="Density" field="density" units={units} />
          <NumberInput meta={defl.E} label="Elastic modulus E" field="deflection.E" units={units} />
          <NumberInput meta={defl.span} label="Span" field="deflection.span" units={units} />
          <NumberInput meta={defl.serviceLoad} label="Service load" field="deflection.serviceLoad" units={units} />
          <NumberInput meta={defl.limitRatio} label="Limit ratio (span ÷ …)" units={units} />
        </Group>

        <Group title="Member (for quantities)">
          <NumberInput meta={fields.memberLength} label="Member length" field="memberLength" units={units} hint="optional" />
          <NumberInput meta={fields.memberCount} label="Member count" units={units} hint="optional" />
        </Group>

        {original ? (
          <details className="rounded-lg border border-ink/15 bg-white p-4 text-sm">
            <summary className="cursor-pointer font-semibold">Original values</summary>
            <ul className="mt-2 grid gap-1 sm:grid-cols-2">
              {["moment.sagging", "moment.hogging", "shear", "allowable.tension", "allowable.compression", "allowable.shear", "depth.min", "depth.max", "depth.step", "width.min", "width.max", "width.step", "thicknesses", "families"].map((p) => (
                <li key={p}>
                  <span className="text-ink/70">{fieldLabel(p)}:</span> {origText(p)}
                </li>
              ))}
            </ul>
          </details>
        ) : null}

        <div className="flex flex-wrap gap-3">
          {allowSave ? (
            <button type="submit" name="intent" value="save" className="rounded-md border border-ink/30 bg-white px-4 py-2 text-sm font-semibold hover:bg-ink/5">
              {submitLabel}
            </button>
          ) : null}
          <button type="submit" name="intent" value="run" className="rounded-md bg-accent px-4 py-2 text-sm font-semibold text-white hover:bg-accent-strong">
            {runLabel}
          </button>
        </div>
      </Form>

      <aside aria-label="Preview" className="space-y-3 lg:sticky lg:top-4 lg:self-start">
        <div className="rounded-lg border border-ink/15 bg-white p-4 text-sm">
          <h2 className="text-base font-bold">Preview</h2>
          {!problem ? (
            <p className="mt-2 text-ink/70">Edit a field: the preview appears once every value passes its checks.</p>
          ) : (
            <>
              <p className="mt-2" data-testid="grid-size">
                Grid: <strong>{formatNumber(preview?.grid ?? 0)}</strong> shapes ({axisCount(problem.depth)} depths × {axisCount(problem.width)} widths ×{" "}
                {new Set(problem.thicknesses).size} thicknesses, over {problem.families.length} famil{problem.families.length === 1 ? "y" : "ies"}; before invalid geometry is dropped)
              </p>
              <label className="mt-3 block text-sm font-semibold" htmlFor="sample-family">
                Sample section (mid-grid)
              </label>
              <select id="sample-family" value={preview?.fam ?? sampleFamily} onChange={(e) => setSampleFamily(e.target.value as Family)} className="mt-1 w-full rounded-md border border-ink/30 px-2 py-1">
                {problem.families.map((f) => (
                  <option key={f} value={f}>
                    {FAMILY_LABELS[f]}
                  </option>
                ))}
              </select>
              {preview?.dims && preview.props ? (
                <div className="mt-2 space-y-2">
                  <p className="tabular-nums">
                    {Object.entries(preview.dims)
                      .map(([k, v]) => `${k} ${formatNumber(fromSI("length", v, units))}`)
                      .join(", ")}{" "}
                    {fieldUnit("thicknesses", units)}
                  </p>
                  <SectionDrawing section={preview.section!} properties={preview.props} units={units} width={300} height={220} showDimensions={false} />
                  <dl className="grid grid-cols-2 gap-x-2 tabular-nums">
                    <dt>A</dt>
                    <dd>{formatQuantity("area", preview.props.area, units)}</dd>
                    <dt>Mass</dt>
                    <dd>{formatQuantity("massPerLength", preview.props.massPerMetre, units)}</dd>
                    <dt>Iz</dt>
                    <dd>{formatQuantity("inertia", preview.props.Iz, units)}</dd>
                    <dt>ȳ</dt>
                    <dd>{formatQuantity("length", preview.props.centroid.y, units)}</dd>
                    <dt>Utilisation</dt>
                    <dd>
                      {preview.verdict!.utilisation.toFixed(3)} ({checkLabel(preview.verdict!.governing)}){preview.verdict!.feasible ? "" : " — fails"}
                    </dd>
                  </dl>
                </div>
              ) : (
                <p className="mt-2 text-ink/70">No valid mid-grid shape for this family.</p>
              )}
            </>
          )}
        </div>
      </aside>
    </div>
  );
}

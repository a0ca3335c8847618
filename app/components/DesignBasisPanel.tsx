// The brief editor's design-basis panels (member-checks.md §3): the basis switch, the EN 1993
// steel (grade presets filling the fy bands, fu and βw from the engine's EN1993_GRADES), the
// lateral-torsional restraint (length or "restrained throughout", moment-diagram presets
// filling C1, C2, C3, load position), the supports and the fabrication rules. Every number
// shows its unit and converts with the editor's unit switch (data-quantity); errors sit under
// their fields (Conform, aria-describedby). Field names are the SearchProblem's own paths.
import { useEffect, useRef, useState, type ReactNode } from "react";
import { getInputProps, type FieldMetadata } from "@conform-to/react";
import { AISC_GRADE_NAMES, DEFAULT_AISC_GRADE, DEFAULT_GRADE, EN1993_GRADE_NAMES, FY_BAND_ROWS, aiscGradeFill, gradeFill } from "~/lib/brief-form-basis";
import { MOMENT_DIAGRAMS, MOMENT_DIAGRAM_SOURCE, cbOf, matchMomentDiagram, momentDiagram } from "~/lib/moment-diagrams";
import { STRESSES_ONLY } from "~/lib/caution";
import { fieldLabel } from "~/lib/labels";
import type { Basis, En1993Grade } from "~/optimizer/search-schema";
import { fromSI, unitLabel, type Quantity, type UnitSystem } from "~/optimizer/units";
import { TableScroll } from "~/components/DataTable";

type Meta = FieldMetadata<unknown>;
/** The Conform fields of the brief form the panels use (typed loosely: nested fieldsets are read by name). */
export interface BasisFields {
  basis: Meta;
  method: Meta;
  aisc: { getFieldset(): Record<string, Meta> };
  steel: { getFieldset(): Record<string, Meta> & { fy: { getFieldList(): { getFieldset(): Record<string, Meta> }[] } } };
  restraintThroughout: Meta;
  momentDiagram: Meta;
  restraint: { getFieldset(): Record<string, Meta> };
  supports: { getFieldset(): Record<string, Meta> };
  fabrication: { getFieldset(): Record<string, Meta> };
}

export const BASIS_LABELS: Record<Basis, string> = {
  en1993: "EN 1993 limit states: resistances, lateral-torsional buckling, shear buckling, welds",
  allowable: `Allowable stresses (${STRESSES_ONLY})`,
  aisc360: "AISC 360-16 (ASD or LRFD): Chapter F flexure with lateral-torsional buckling, G2 shear, J2 welds, J10 web yielding and crippling",
};

const LOAD_LABELS = { top: "Top flange (destabilising)", shearCentre: "Shear centre", bottom: "Bottom flange (stabilising)" } as const;

function Errors({ meta }: { meta: Meta }) {
  return meta.errors ? (
    <p id={meta.errorId} className="text-sm font-semibold text-red-800">
      {meta.errors.join("; ")}
    </p>
  ) : null;
}

/** A number field with its unit (or "no unit") beside the label; data-quantity lets the unit switch convert it. */
function UnitInput({ meta, label, quantity, units, hint, disabled }: { meta: Meta; label: string; quantity?: Quantity; units: UnitSystem; hint?: string; disabled?: boolean }) {
  const props = getInputProps(meta as FieldMetadata<number>, { type: "text" });
  return (
    <div className="space-y-1">
      <label htmlFor={meta.id} className="block text-sm font-semibold">
        {label} <span className="font-normal text-ink/70">({quantity ? unitLabel(quantity, units) : "no unit"})</span>
      </label>
      <input
        {...props}
        key={props.key}
        inputMode="decimal"
        disabled={disabled}
        data-quantity={quantity}
        className={`block w-full rounded-md border bg-white px-2 py-1.5 tabular-nums disabled:bg-ink/5 ${meta.errors ? "border-red-700" : "border-ink/30"}`}
      />
      {hint ? <p className="text-xs text-ink/70">{hint}</p> : null}
      <Errors meta={meta} />
    </div>
  );
}

function Panel({ title, note, children, hidden }: { title: string; note?: ReactNode; children: ReactNode; hidden?: boolean }) {
  // Disabled as well as hidden: a panel of the other basis sends nothing with the form.
  return (
    <fieldset className="rounded-lg border border-ink/15 bg-white p-4" hidden={hidden} disabled={hidden}>
      <legend className="px-1 text-base font-bold">{title}</legend>
      {note ? <div className="mb-2 text-xs text-ink/70">{note}</div> : null}
      {children}
    </fieldset>
  );
}

/** Writes a grade preset (SI values from the engine) into the form's steel fields, shown in `units`. */
export function fillGrade(form: HTMLFormElement, grade: En1993Grade, units: UnitSystem) {
  const fill = gradeFill(grade);
  const set = (name: string, text: string) => {
    const el = form.querySelector<HTMLInputElement | HTMLSelectElement>(`[name="${name}"]`);
    if (el) el.value = text;
  };
  const show = (q: Quantity, x: number) => String(Number(fromSI(q, x, units).toPrecision(6)));
  set("steel.grade", grade);
  for (let i = 0; i < FY_BAND_ROWS; i++) {
    const b = fill.fy[i];
    set(`steel.fy[${i}].maxThickness`, b ? show("length", b.maxThickness) : "");
    set(`steel.fy[${i}].fy`, b ? show("stress", b.fy) : "");
  }
  set("steel.fu", show("stress", fill.fu));
  set("steel.betaW", String(fill.betaW));
}

export function BasisSwitch({ meta, basis, onChange }: { meta: Meta; basis: Basis; onChange: (b: Basis) => void }) {
  return (
    <fieldset className="rounded-lg border border-ink/15 bg-white p-4" aria-describedby={meta.errors ? meta.errorId : undefined}>
      <legend className="px-1 text-base font-bold">Design basis</legend>
      <div className="space-y-1">
        {(["en1993", "aisc360", "allowable"] as const).map((b) => (
          <label key={b} className="flex items-start gap-2 text-sm">
            <input type="radio" name={meta.name} value={b} checked={basis === b} onChange={() => onChange(b)} className="mt-1" />
            <span>{BASIS_LABELS[b]}</span>
          </label>
        ))}
      </div>
      <p className="mt-1 text-xs text-ink/70">
        {basis === "en1993"
          ? "Moments and shear are factored design values (ultimate limit state); resistances per EN 1993-1-1, EN 1993-1-5 and EN 1993-1-8."
          : basis === "aisc360"
            ? "Moments and shear are required strengths of the chosen method (ASD or LRFD); available strengths per AISC 360-16 Chapters B, F, G and J."
            : "Typed allowable stresses against elastic fibre and shear stresses; no buckling of any kind is checked."}
      </p>
      <Errors meta={meta} />
    </fieldset>
  );
}

export function BasisPanels({ fields, units, basis, defaultValue, onChange }: { fields: BasisFields; units: UnitSystem; basis: Basis; defaultValue: Record<string, unknown>; onChange: () => void }) {
  const steel = fields.steel.getFieldset();
  const bands = steel.fy.getFieldList();
  const restraint = fields.restraint.getFieldset();
  const supports = fields.supports.getFieldset();
  const fab = fields.fabrication.getFieldset();
  const en = basis === "en1993";
  const us = basis === "aisc360";
  const aisc = fields.aisc.getFieldset();
  const [cbDiagram, setCbDiagram] = useState("");
  const dv = defaultValue as { restraintThroughout?: boolean; momentDiagram?: string; steel?: { grade?: string }; supports?: { stiffened?: string }; restraint?: { loadAt?: string } };
  const [throughout, setThroughout] = useState(Boolean(dv.restraintThroughout));
  const [diagram, setDiagram] = useState(String(dv.momentDiagram ?? ""));
  const [stiffened, setStiffened] = useState(dv.supports?.stiffened === "no" ? "no" : "yes");
  const chosen = momentDiagram(diagram);
  // Ticks that enable or disable fields change what the form sends: tell the editor after they re-render.
  const first = useRef(true);
  useEffect(() => {
    if (first.current) first.current = false;
    else onChange();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [throughout]);

  const formOf = (el: Element) => (el as HTMLInputElement).form;
  function chooseDiagram(el: HTMLSelectElement) {
    setDiagram(el.value);
    const d = momentDiagram(el.value);
    const form = formOf(el);
    if (d && form)
      for (const k of ["C1", "C2", "C3"] as const) {
        const input = form.querySelector<HTMLInputElement>(`input[name="restraint.${k}"]`);
        if (input) input.value = String(d[k]);
      }
    onChange();
  }
  // Typing a factor by hand shows which preset (if any) the three values still match.
  function factorTyped(form: HTMLFormElement | null) {
    if (!form) return;
    const val = (k: string) => Number(form.querySelector<HTMLInputElement>(`input[name="restraint.${k}"]`)?.value);
    setDiagram(matchMomentDiagram(val("C1"), val("C2"), val("C3"))?.id ?? "");
  }
  function chooseAiscGrade(el: HTMLSelectElement) {
    const form = formOf(el);
    if (form && (AISC_GRADE_NAMES as readonly string[]).includes(el.value)) {
      const fill = aiscGradeFill(el.value as (typeof AISC_GRADE_NAMES)[number]);
      const show = (x: number) => String(Number(fromSI("stress", x, units).toPrecision(6)));
      for (const [k, x] of [["Fy", fill.Fy], ["Fu", fill.Fu]] as const) {
        const input = form.querySelector<HTMLInputElement>(`input[name="aisc.${k}"]`);
        if (input) input.value = show(x);
      }
    }
    onChange();
  }
  // Cb offered from the moment diagram by AISC 360-16 Eq. F1-1 (moment-diagrams.ts), or typed
  function chooseCb(el: HTMLSelectElement) {
    setCbDiagram(el.value);
    const d = momentDiagram(el.value);
    const input = formOf(el)?.querySelector<HTMLInputElement>('input[name="restraint.Cb"]');
    if (d && input) input.value = String(cbOf(d));
    onChange();
  }
  function chooseGrade(el: HTMLSelectElement) {
    const form = formOf(el);
    if (form && (EN1993_GRADE_NAMES as string[]).includes(el.value)) fillGrade(form, el.value as En1993Grade, units);
    onChange();
  }

  return (
    <>
      <Panel
        title="Method and steel (AISC 360-16)"
        hidden={!us}
        note="ASD compares required strengths with Rn/Ω, LRFD with φ·Rn (AISC 360-16 §B3). Plate presets A36 and A572 Gr 50 fill Fy and Fu; A992 is a rolled-shape specification, used for catalogue sections only."
      >
        <fieldset className="space-y-1" aria-describedby={fields.method.errors ? fields.method.errorId : undefined}>
          <legend className="text-sm font-semibold">Method</legend>
          {(
            [
              ["ASD", "ASD: allowable strength design (Rn/Ω)"],
              ["LRFD", "LRFD: load and resistance factor design (φ·Rn)"],
            ] as const
          ).map(([m, words]) => (
            <label key={m} className="flex items-start gap-2 text-sm">
              <input type="radio" name={fields.method.name} value={m} defaultChecked={(fields.method.initialValue ?? "ASD") === m} onChange={onChange} className="mt-1" />
              <span>{words}</span>
            </label>
          ))}
          <Errors meta={fields.method} />
        </fieldset>
        <div className="mt-3 grid grid-cols-1 gap-3 sm:grid-cols-3">
          <div className="space-y-1">
            <label htmlFor={aisc.grade.id} className="block text-sm font-semibold">
              ASTM plate grade
            </label>
            <select
              id={aisc.grade.id}
              name={aisc.grade.name}
              defaultValue={String(aisc.grade.initialValue || DEFAULT_AISC_GRADE)}
              onChange={(e) => chooseAiscGrade(e.currentTarget)}
              className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5"
            >
              {AISC_GRADE_NAMES.map((g) => (
                <option key={g} value={g}>
                  ASTM {g}
                </option>
              ))}
              <option value="">Own values (no preset)</option>
            </select>
            <Errors meta={aisc.grade} />
          </div>
          <UnitInput meta={aisc.Fy} label="Yield stress Fy" quantity="stress" units={units} />
          <UnitInput meta={aisc.Fu} label="Tensile strength Fu" quantity="stress" units={units} />
        </div>
        <details className="mt-3">
          <summary className="cursor-pointer text-sm font-semibold">Elastic constants and weld metal</summary>
          <div className="mt-2 grid grid-cols-1 gap-3 sm:grid-cols-3">
            <UnitInput meta={aisc.E} label="Elastic modulus E" quantity="stress" units={units} hint="29,000 ksi" />
            <UnitInput meta={aisc.G} label="Shear modulus G" quantity="stress" units={units} hint="11,200 ksi" />
            <UnitInput meta={aisc.FEXX} label="Electrode strength FEXX" quantity="stress" units={units} hint="E70: 70 ksi" />
          </div>
        </details>
      </Panel>

      <Panel
        title="Steel (EN 1993)"
        hidden={!en}
        note="A section takes fy from the band holding its thickest plate. Presets: EN 10025-2 yield by thickness and tensile strength, βw from EN 1993-1-8 Table 4.1 (values as the engine holds them); every value stays editable."
      >
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <div className="space-y-1">
            <label htmlFor={steel.grade.id} className="block text-sm font-semibold">
              Grade (preset)
            </label>
            <select
              id={steel.grade.id}
              name={steel.grade.name}
              defaultValue={String(dv.steel?.grade ?? DEFAULT_GRADE)}
              onChange={(e) => chooseGrade(e.currentTarget)}
              aria-describedby={steel.grade.errors ? steel.grade.errorId : undefined}
              className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5"
            >
              {EN1993_GRADE_NAMES.map((g) => (
                <option key={g} value={g}>
                  {g} (EN 10025-2)
                </option>
              ))}
              <option value="">Own values (no preset)</option>
            </select>
            <Errors meta={steel.grade} />
          </div>
          <UnitInput meta={steel.fu} label="Tensile strength fu" quantity="stress" units={units} />
          <UnitInput meta={steel.betaW} label="Weld correlation factor βw" units={units} hint="EN 1993-1-8 Table 4.1" />
        </div>
        <TableScroll>
        <table className="mt-3 w-full max-w-lg border-collapse text-sm">
          <caption className="text-left font-semibold">Yield strength by plate thickness</caption>
          <thead>
            <tr className="text-left">
              <th scope="col" className="py-1 pr-2 font-normal text-ink/70">
                Band
              </th>
              <th scope="col" className="py-1 pr-2 font-normal text-ink/70">
                Plates up to ({unitLabel("length", units)})
              </th>
              <th scope="col" className="py-1 font-normal text-ink/70">
                fy ({unitLabel("stress", units)})
              </th>
            </tr>
          </thead>
          <tbody>
            {bands.map((row, i) => {
              const b = row.getFieldset();
              return (
                <tr key={i} className="align-top">
                  <th scope="row" className="py-1 pr-2 font-normal">
                    {i + 1}
                  </th>
                  {(["maxThickness", "fy"] as const).map((k) => {
                    const props = getInputProps(b[k] as FieldMetadata<number>, { type: "text" });
                    return (
                      <td key={k} className="py-1 pr-2">
                        <input
                          {...props}
                          key={props.key}
                          inputMode="decimal"
                          aria-label={k === "fy" ? `Band ${i + 1}: fy (${unitLabel("stress", units)})` : `Band ${i + 1}: plates up to (${unitLabel("length", units)})`}
                          data-quantity={k === "fy" ? "stress" : "length"}
                          className={`block w-full rounded-md border bg-white px-2 py-1 tabular-nums ${b[k].errors ? "border-red-700" : "border-ink/30"}`}
                        />
                        <Errors meta={b[k]} />
                      </td>
                    );
                  })}
                </tr>
              );
            })}
          </tbody>
        </table>
        </TableScroll>
        <p className="text-xs text-ink/70">Leave a row empty to drop it. A plate thicker than the last band is refused (name a band that holds it).</p>
        <details className="mt-3">
          <summary className="cursor-pointer text-sm font-semibold">Elastic constants and partial factors</summary>
          <div className="mt-2 grid grid-cols-1 gap-3 sm:grid-cols-3">
            <UnitInput meta={steel.E} label="Elastic modulus E" quantity="stress" units={units} hint="EN 1993-1-1 §3.2.6" />
            <UnitInput meta={steel.G} label="Shear modulus G" quantity="stress" units={units} hint="EN 1993-1-1 §3.2.6" />
            <UnitInput meta={steel.eta} label="Shear area factor η" units={units} hint="EN 1993-1-5 §5.1" />
            <UnitInput meta={steel.gammaM0} label="γM0, cross-section resistance" units={units} hint="EN 1993-1-1 §6.1" />
            <UnitInput meta={steel.gammaM1} label="γM1, member buckling" units={units} hint="EN 1993-1-1 §6.1" />
            <UnitInput meta={steel.gammaM2} label="γM2, welds" units={units} hint="EN 1993-1-8 §2.2" />
          </div>
        </details>
      </Panel>

      <Panel
        title={us ? "Unbraced length and Cb" : "Lateral-torsional restraint"}
        hidden={!en && !us}
        note={
          us
            ? "Lb: the length of compression flange between points braced against lateral movement or twist (AISC 360-16 §F1). Cb from the moment diagram over that length by Eq. F1-1, or typed."
            : "The longest length of compression flange between lateral restraints (bracing, a deck fixed to it, or the supports). The moment diagram over that length sets C1, C2, C3."
        }
      >
        <label className="flex items-center gap-2 text-sm">
          <input
            {...getInputProps(fields.restraintThroughout as FieldMetadata<boolean>, { type: "checkbox" })}
            key={fields.restraintThroughout.key}
            onChange={(e) => setThroughout(e.currentTarget.checked)}
          />
          {us ? "Braced throughout" : "Restrained throughout"}: the compression flange is held sideways along its whole length (no lateral-torsional buckling check)
        </label>
        <Errors meta={fields.restraintThroughout} />
        {/* Disabled while restrained throughout: the restraint block is then left out of the brief. */}
        <fieldset disabled={throughout} className="mt-3 grid grid-cols-1 gap-3 disabled:opacity-60 sm:grid-cols-3">
          <UnitInput meta={restraint.length} label={fieldLabel("restraint.length", basis)} quantity="span" units={units} hint="longest segment between restraints" />
          <fieldset disabled={!us} hidden={!us} className="contents">
            <div className="space-y-1">
              <label htmlFor="cb-diagram" className="block text-sm font-semibold">
                Cb from the moment diagram
              </label>
              <select id="cb-diagram" value={cbDiagram} onChange={(e) => chooseCb(e.currentTarget)} className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5">
                <option value="">Typed (below)</option>
                {MOMENT_DIAGRAMS.map((d) => (
                  <option key={d.id} value={d.id}>
                    {d.label} — Cb {cbOf(d)}
                  </option>
                ))}
              </select>
              <p className="text-xs text-ink/70">Cb = 12.5·Mmax/(2.5·Mmax + 3·MA + 4·MB + 3·MC), AISC 360-16 Eq. F1-1</p>
            </div>
            <UnitInput meta={restraint.Cb} label="Cb" units={units} hint="1.0 is always conservative" />
          </fieldset>
          <fieldset disabled={us} hidden={us} className="contents">
          <div className="space-y-1 sm:col-span-2">
            <label htmlFor={fields.momentDiagram.id} className="block text-sm font-semibold">
              Moment diagram over that length
            </label>
            <select
              id={fields.momentDiagram.id}
              name={fields.momentDiagram.name}
              value={diagram}
              onChange={(e) => chooseDiagram(e.currentTarget)}
              aria-describedby="moment-diagram-source"
              className="block w-full rounded-md border border-ink/30 bg-white px-2 py-1.5"
            >
              <option value="">Own values (type C1, C2, C3)</option>
              {MOMENT_DIAGRAMS.map((d) => (
                <option key={d.id} value={d.id}>
                  {d.label} — C1 {d.C1}, C2 {d.C2}, C3 {d.C3}
                </option>
              ))}
            </select>
            <p id="moment-diagram-source" className="text-xs text-ink/70">
              Presets fill C1, C2, C3 from {MOMENT_DIAGRAM_SOURCE}: values recalled from memory, check them against the table.
            </p>
          </div>
          <div className="contents" onInput={(e) => factorTyped((e.target as HTMLInputElement).form)}>
            <UnitInput meta={restraint.C1} label="C1" units={units} hint="moment-gradient factor" />
            <UnitInput meta={restraint.C2} label="C2" units={units} hint="multiplies the load height" />
            <UnitInput meta={restraint.C3} label="C3" units={units} hint="multiplies the mono-symmetry term" />
          </div>
          <div className="space-y-1 sm:col-span-3">
            <label htmlFor={restraint.loadAt.id} className="block text-sm font-semibold">
              Where the load is applied
            </label>
            <select
              id={restraint.loadAt.id}
              name={restraint.loadAt.name}
              defaultValue={String(dv.restraint?.loadAt ?? "top")}
              onChange={onChange}
              aria-describedby={restraint.loadAt.errors ? restraint.loadAt.errorId : "load-at-hint"}
              className="rounded-md border border-ink/30 bg-white px-2 py-1.5"
            >
              {(Object.keys(LOAD_LABELS) as (keyof typeof LOAD_LABELS)[]).map((k) => (
                <option key={k} value={k}>
                  {LOAD_LABELS[k]}
                </option>
              ))}
            </select>
            <p id="load-at-hint" className="text-xs text-ink/70">
              {chosen && !chosen.transverseLoad
                ? "End moments only: no transverse load, so the load position does not change Mcr (C2 = 0)."
                : "A load on the top flange lowers Mcr (it tips the beam further); on the bottom flange it raises it."}
            </p>
            <Errors meta={restraint.loadAt} />
          </div>
          </fieldset>
        </fieldset>
      </Panel>

      <Panel title="Supports" hidden={!en && !us} note="At each end support the web carries the reaction (taken as the design shear).">
        <fieldset className="space-y-1" aria-describedby={supports.stiffened.errors ? supports.stiffened.errorId : undefined}>
          <legend className="text-sm font-semibold">Bearing stiffeners at the supports</legend>
          {(
            [
              ["yes", "Yes, provided (the record lists them as required; web crippling is not checked)"],
              ["no", us ? "No: check web local yielding and crippling at an end support (AISC 360-16 §J10.2, §J10.3)" : "No: check the unstiffened web for patch loading at an end support (EN 1993-1-5 §6)"],
            ] as const
          ).map(([v, words]) => (
            <label key={v} className="flex items-start gap-2 text-sm">
              <input
                type="radio"
                name={supports.stiffened.name}
                value={v}
                checked={stiffened === v}
                onChange={() => {
                  setStiffened(v);
                  onChange();
                }}
                className="mt-1"
              />
              <span>{words}</span>
            </label>
          ))}
          <Errors meta={supports.stiffened} />
        </fieldset>
        <div className="mt-3 grid grid-cols-1 gap-3 sm:grid-cols-3">
          <UnitInput meta={supports.bearingLength} label={us ? "Bearing length lb" : "Stiff bearing length"} quantity="length" units={units} hint={stiffened === "no" ? "required without stiffeners" : "used only without stiffeners"} />
        </div>
      </Panel>

      <Panel title="Fabrication rules" note="Shapes that break a rule are left out of the grid (on either basis). Leave a field empty to skip that rule.">
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <UnitInput meta={fab.minThickness} label="Thinnest plate allowed" quantity="length" units={units} />
          <UnitInput meta={fab.minBoxClear} label="Least clear width inside a box (b − 2·tw)" quantity="length" units={units} hint="room to weld inside" />
          <div className="space-y-1 self-end">
            <label className="flex items-center gap-2 text-sm">
              <input {...getInputProps(fab.flangeAtLeastWeb as FieldMetadata<boolean>, { type: "checkbox" })} key={fab.flangeAtLeastWeb.key} onChange={onChange} />
              Each flange at least as thick as the web
            </label>
            <Errors meta={fab.flangeAtLeastWeb} />
          </div>
        </div>
      </Panel>
    </>
  );
}

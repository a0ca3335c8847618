// The section bench: build any section (a family, a table of plates, or polygons), see it
// drawn to scale with every property and the stresses under a moment. The engine runs in a
// Web Worker (app/workers/section.worker.ts) so typing never waits for it; the state lives
// in the URL (?s=…) so a bench can be shared; members who may edit briefs can file the
// section under a project.
import { FAMILY_LABELS } from "~/lib/labels";
import { useEffect, useRef, useState } from "react";
import { useFetcher, useSearchParams, type ShouldRevalidateFunctionArgs } from "react-router";
import * as Comlink from "comlink";
import type { Route } from "./+types/bench";
import { requirePermission } from "~/lib/auth.server";
import { can } from "~/lib/roles";
import { badRequest, parseForm, readForm } from "~/lib/forms.server";
import { listProjects } from "~/lib/projects.server";
import { saveSection, saveSectionFormSchema } from "~/lib/saved-sections.server";
import {
  benchLoads,
  benchSectionInput,
  convertBenchState,
  decodeBenchState,
  plainFieldError,
  encodeBenchState,
  parseBenchState,
  parseSectionInput,
  rowId,
  type BenchState,
  type FieldError,
} from "~/lib/bench-state";
import { analyseSection, type SectionRequest, type SectionResponse, type SectionWorkerApi } from "~/workers/section.worker";
import { FAMILIES, FAMILY_DIMENSIONS, FILLETED_FAMILIES, type Family } from "~/optimizer/geometry";
import { isEngineInputError } from "~/optimizer/errors";
import { sectionProperties } from "~/optimizer/properties";
import { unitLabel, type UnitSystem } from "~/optimizer/units";
import { SectionDrawing } from "~/components/SectionDrawing";
import { StressDiagram } from "~/components/StressDiagram";
import { PropertyTable, formatQuantity } from "~/components/PropertyTable";
import { UnitSwitch } from "~/components/UnitSwitch";
import { Caution } from "~/components/Caution";
import { TableScroll } from "~/components/DataTable";

export function meta() {
  return [{ title: "Section bench · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const canSave = can(user.role, "editBrief");
  const projects = canSave ? (await listProjects(user.teamId)).map((p) => ({ id: p.id, name: p.name })) : [];
  return { canSave, projects };
}

// The bench rewrites ?s= as the user types; that alone is no reason to reload the loader.
export function shouldRevalidate({ currentUrl, nextUrl, formMethod, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  if (!formMethod && currentUrl.pathname === nextUrl.pathname) return false;
  return defaultShouldRevalidate;
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requirePermission(request, "editBrief");
  // polygons with many vertices make long states; still bounded
  const form = await readForm(request, 512 * 1024);
  const parsed = parseForm(form, saveSectionFormSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  const state = parseBenchState(form.get("state"));
  if (!state) return badRequest({ state: "The section could not be read: reload the bench and try again." });
  const built = benchSectionInput(state);
  const section = "errors" in built ? { ok: false as const, errors: built.errors } : parseSectionInput(built.input, state.units);
  if (!section.ok) return badRequest({ section: `Section: ${plainFieldError(section.errors[0]!)}` });
  try {
    sectionProperties(section.input);
  } catch (e) {
    if (isEngineInputError(e)) return badRequest({ section: `Section: ${e.message}` });
    throw e;
  }
  const id = await saveSection(user, parsed.data.projectId, parsed.data.name, section.input, state.units);
  if (id === null) return badRequest({ projectId: "Project: no such open project in your team." }, 404);
  return { ok: true as const, id, projectId: parsed.data.projectId, name: parsed.data.name };
}

// ---------------------------------------------------------------- words

// Family names: the one label table (labels.ts), the same as the brief and the sweep pages.

const DIM_WORDS: Record<string, string> = {
  d: "overall depth",
  b: "overall width",
  tf: "flange thickness",
  tw: "web thickness",
  bt: "top flange width",
  tft: "top flange thickness",
  bb: "bottom flange width",
  tfb: "bottom flange thickness",
  t: "leg thickness",
  r: "root radius (optional)",
};
const DIM_WORDS_BY_FAMILY: Partial<Record<Family, Record<string, string>>> = {
  tee: { tw: "stem thickness" },
  "channel-down": { tw: "web (top plate) thickness", tf: "leg thickness" },
};


const samePath = (a: (string | number)[], b: (string | number)[]) => a.length === b.length && a.every((k, i) => k === b[i]);

// ---------------------------------------------------------------- page

/** The worker through comlink, or the same function in the page when workers are unavailable. */
interface Engine {
  analyseSection(req: SectionRequest): Promise<SectionResponse>;
}

interface Computed {
  response: Extract<SectionResponse, { ok: true }>;
  Mz: number;
  V: number;
  units: UnitSystem;
}

export default function Bench({ loaderData }: Route.ComponentProps) {
  const [params] = useSearchParams();
  const [state, setState] = useState<BenchState>(() => decodeBenchState(params.get("s")));
  const [computed, setComputed] = useState<Computed | null>(null);
  const [errors, setErrors] = useState<FieldError[]>([]);
  const [busy, setBusy] = useState(false);
  const [engine, setEngine] = useState<Engine | null>(null);
  const seq = useRef(0);
  const addPlateRef = useRef<HTMLButtonElement>(null);
  const addPolygonRef = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    // Without module workers (an old browser, a blocked script) the same function runs on the
    // page's thread: slower for big polygons, but the bench still answers.
    const inPage: Engine = { analyseSection: async (req) => analyseSection(req) };
    let worker: Worker;
    try {
      worker = new Worker(new URL("../workers/section.worker.ts", import.meta.url), { type: "module" });
    } catch {
      setEngine(() => inPage);
      return;
    }
    const remote = Comlink.wrap<SectionWorkerApi>(worker);
    worker.addEventListener("error", () => setEngine(() => inPage));
    setEngine(() => remote);
    return () => {
      remote[Comlink.releaseProxy]();
      worker.terminate();
    };
  }, []);

  // Keep the link current, a little after typing stops. replaceState rather than a router
  // navigation: a navigation would rerun the layout's loader (a server round trip) for every
  // pause in typing. The router's own history entry state is kept as it is.
  useEffect(() => {
    const t = setTimeout(() => {
      const url = new URL(window.location.href);
      const s = encodeBenchState(state);
      if (url.searchParams.get("s") === s) return;
      url.searchParams.set("s", s);
      window.history.replaceState(window.history.state, "", url);
    }, 400);
    return () => clearTimeout(t);
  }, [state]);

  // Switching units retypes every number (rounded to six figures); switching straight back
  // restores what was typed, so a round trip never turns 500 into 499.999.
  const [unitUndo, setUnitUndo] = useState<{ before: BenchState; after: BenchState } | null>(null);
  const switchUnits = (to: UnitSystem) => {
    if (to === state.units) return;
    if (unitUndo && unitUndo.after === state && unitUndo.before.units === to) {
      setState(unitUndo.before);
      setUnitUndo(null);
      return;
    }
    const after = convertBenchState(state, to);
    setUnitUndo({ before: state, after });
    setState(after);
  };

  // Recompute shortly after the last keystroke; stale answers are dropped by sequence number.
  useEffect(() => {
    if (!engine) return;
    const my = ++seq.current;
    const built = benchSectionInput(state);
    const loads = benchLoads(state);
    const early = [...("errors" in built ? built.errors : []), ...("errors" in loads ? loads.errors : [])];
    if (early.length || "errors" in built || "errors" in loads) {
      setErrors(early);
      setBusy(false);
      return;
    }
    const t = setTimeout(async () => {
      setBusy(true);
      try {
        const r = await engine.analyseSection({ input: built.input, units: state.units, Mz: loads.Mz, V: loads.V });
        if (my !== seq.current) return;
        if (r.ok) {
          setComputed({ response: r, Mz: loads.Mz, V: loads.V, units: state.units });
          setErrors([]);
        } else setErrors(r.errors);
      } catch (e) {
        if (my === seq.current) setErrors([{ path: [], field: "input", message: `The calculation failed: ${e instanceof Error ? e.message : String(e)}` }]);
      } finally {
        if (my === seq.current) setBusy(false);
      }
    }, 120);
    return () => clearTimeout(t);
  }, [state, engine]);

  const units = state.units;
  const L = unitLabel("length", units);
  const update = (patch: Partial<BenchState>) => setState((s) => ({ ...s, ...patch }));
  const errorAt = (...path: (string | number)[]) => errors.find((e) => samePath(e.path, path));
  const rowError = (kind: "plates" | "polygons", i: number) =>
    errors.find((e) => e.path[0] === kind && e.path[1] === i);

  const input = (
    label: string,
    value: string,
    onChange: (v: string) => void,
    error: FieldError | undefined,
    opts: { ariaLabel?: string; name?: string; className?: string; onKeyDown?: React.KeyboardEventHandler<HTMLInputElement> } = {},
  ) => (
    <input
      onKeyDown={opts.onKeyDown}
      type="text"
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      name={opts.name}
      aria-label={opts.ariaLabel ?? label}
      aria-invalid={error ? true : undefined}
      value={value}
      onChange={(e) => onChange(e.target.value)}
      className={`w-full rounded border bg-white px-2 py-1 tabular-nums ${error ? "border-red-700 ring-1 ring-red-700" : "border-ink/30"} ${opts.className ?? ""}`}
    />
  );

  const familyDims = [...FAMILY_DIMENSIONS[state.family], ...(FILLETED_FAMILIES.includes(state.family) ? ["r"] : [])];
  const shown = computed?.response;
  const stale = errors.length > 0 && shown != null;

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold">Section bench</h1>
          <p className="mt-1 max-w-2xl text-ink/80">
            Build a section from a family, a table of plates or polygons. Every property and the stresses under a moment update as you
            type; the link always holds the section, so you can share it.
          </p>
        </div>
        <UnitSwitch value={units} onChange={switchUnits} />
      </div>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)]">
        {/* ------------------------------------------------ inputs */}
        <section aria-labelledby="bench-build" className="space-y-5">
          <h2 id="bench-build" className="sr-only">
            Build the section
          </h2>
          <fieldset className="flex flex-wrap gap-3">
            <legend className="mb-1 text-sm font-semibold">Build from</legend>
            {(
              [
                ["family", "A family"],
                ["plates", "Plates"],
                ["polygons", "Polygons"],
              ] as const
            ).map(([m, text]) => (
              <label key={m} className="inline-flex items-center gap-1.5">
                <input type="radio" name="mode" value={m} checked={state.mode === m} onChange={() => update({ mode: m })} />
                {text}
              </label>
            ))}
          </fieldset>

          {state.mode === "family" ? (
            <div className="space-y-3 rounded-lg border border-ink/15 bg-white p-4">
              <label className="block text-sm font-semibold">
                Family
                <select
                  name="family"
                  value={state.family}
                  onChange={(e) => update({ family: e.target.value as Family })}
                  className="mt-1 block w-full rounded border border-ink/30 bg-white px-2 py-1 font-normal"
                >
                  {FAMILIES.map((f) => (
                    <option key={f} value={f}>
                      {FAMILY_LABELS[f]}
                    </option>
                  ))}
                </select>
              </label>
              <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
                {familyDims.map((k) => {
                  const words = DIM_WORDS_BY_FAMILY[state.family]?.[k] ?? DIM_WORDS[k] ?? k;
                  return (
                    <label key={k} className="block text-sm">
                      <span className="font-semibold">{k}</span> <span className="text-ink/70">{words}</span> <span className="text-ink/70">({L})</span>
                      {input(`${k}, ${words} (${L})`, state.dims[k] ?? "", (v) => update({ dims: { ...state.dims, [k]: v } }), errorAt(k), {
                        name: `dim-${k}`,
                      })}
                    </label>
                  );
                })}
              </div>
              <label className="inline-flex items-center gap-2 text-sm">
                <input type="checkbox" checked={state.flip} onChange={(e) => update({ flip: e.target.checked })} />
                Flip upside down
              </label>
            </div>
          ) : null}

          {state.mode === "plates" ? (
            <div className="rounded-lg border border-ink/15 bg-white p-4">
              <TableScroll>
              <table className="w-full text-sm">
                <caption className="mb-2 text-left text-ink/80">
                  Each plate is b wide and h high, with its bottom-left corner at (z, y); lengths in {L}. Plates may touch but not overlap. Alt+↑ and Alt+↓ move the row you are typing in.
                </caption>
                <thead>
                  <tr className="text-left">
                    <th scope="col" className="w-8">#</th>
                    <th scope="col">b</th>
                    <th scope="col">h</th>
                    <th scope="col">z</th>
                    <th scope="col">y</th>
                    <th scope="col">
                      <span className="sr-only">Order and remove</span>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {state.plates.map((p, i) => {
                    const bad = rowError("plates", i);
                    const setPlate = (k: "b" | "h" | "z" | "y", v: string) =>
                      setState((s) => ({ ...s, plates: s.plates.map((q) => (q.id === p.id ? { ...q, [k]: v } : q)) }));
                    const move = (to: number) =>
                      setState((s) => {
                        const plates = [...s.plates];
                        const [row] = plates.splice(i, 1);
                        plates.splice(to, 0, row!);
                        return { ...s, plates };
                      });
                    return (
                      <tr key={p.id} className={bad ? "bg-red-50" : undefined} data-plate-row={i}>
                        <th scope="row" className="pr-1 text-left font-semibold">
                          {i + 1}
                        </th>
                        {(["b", "h", "z", "y"] as const).map((k) => (
                          <td key={k} className="px-0.5 py-0.5">
                            {input(`plate ${i + 1} ${k}`, p[k], (v) => setPlate(k, v), errorAt("plates", i, k) ?? (bad && bad.path.length === 2 ? bad : undefined), {
                              ariaLabel: `plate ${i + 1} ${k} (${L})`,
                              // Alt+↑ / Alt+↓ move the row; rows are keyed, so focus stays in this input
                              onKeyDown: (e) => {
                                if (!e.altKey) return;
                                if (e.key === "ArrowUp" && i > 0) {
                                  e.preventDefault();
                                  move(i - 1);
                                } else if (e.key === "ArrowDown" && i < state.plates.length - 1) {
                                  e.preventDefault();
                                  move(i + 1);
                                }
                              },
                            })}
                          </td>
                        ))}
                        <td className="whitespace-nowrap pl-1">
                          <button
                            type="button"
                            className="rounded px-1.5 py-0.5 hover:bg-paper disabled:opacity-30"
                            aria-label={`Move plate ${i + 1} up`}
                            disabled={i === 0}
                            onClick={() => move(i - 1)}
                          >
                            ↑
                          </button>
                          <button
                            type="button"
                            className="rounded px-1.5 py-0.5 hover:bg-paper disabled:opacity-30"
                            aria-label={`Move plate ${i + 1} down`}
                            disabled={i === state.plates.length - 1}
                            onClick={() => move(i + 1)}
                          >
                            ↓
                          </button>
                          <button
                            type="button"
                            className="rounded px-1.5 py-0.5 text-red-800 hover:bg-red-50 disabled:opacity-30"
                            aria-label={`Remove plate ${i + 1}`}
                            disabled={state.plates.length === 1}
                            onClick={() => {
                              setState((s) => ({ ...s, plates: s.plates.filter((q) => q.id !== p.id) }));
                              addPlateRef.current?.focus();
                            }}
                          >
                            ✕
                          </button>
                        </td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
              </TableScroll>
              <button
                ref={addPlateRef}
                type="button"
                className="mt-3 rounded-md border border-accent px-3 py-1 text-sm font-semibold text-accent-strong hover:bg-paper"
                onClick={() =>
                  setState((s) => {
                    // a new plate on top of the others, as wide as the last one: a sensible start to edit
                    const last = s.plates[s.plates.length - 1];
                    const top = Math.max(0, ...s.plates.map((q) => Number(q.y) + Number(q.h)).filter(Number.isFinite));
                    return { ...s, plates: [...s.plates, { id: rowId(), b: last?.b ?? "100", h: last?.h ?? "10", z: last?.z ?? "0", y: String(top) }] };
                  })
                }
              >
                Add plate
              </button>
            </div>
          ) : null}

          {state.mode === "polygons" ? (
            <div className="space-y-3 rounded-lg border border-ink/15 bg-white p-4">
              <p className="text-sm text-ink/80">
                Each polygon is a list of z,y corner pairs in {L} (e.g. <code>0,0 200,0 200,10 0,10</code>), either winding. Holes must lie
                inside a solid polygon.
              </p>
              {state.polygons.map((g, i) => {
                const bad = rowError("polygons", i);
                return (
                  <div key={g.id} className={`rounded border p-2 ${bad ? "border-red-700 bg-red-50" : "border-ink/15"}`}>
                    <label className="block text-sm font-semibold">
                      Polygon {i + 1} points (z,y pairs, {L})
                      <textarea
                        rows={3}
                        spellCheck={false}
                        aria-invalid={bad ? true : undefined}
                        value={g.text}
                        onChange={(e) => {
                          const text = e.target.value;
                          setState((s) => ({ ...s, polygons: s.polygons.map((q) => (q.id === g.id ? { ...q, text } : q)) }));
                        }}
                        className="mt-1 block w-full rounded border border-ink/30 bg-white px-2 py-1 font-mono text-sm font-normal"
                      />
                    </label>
                    <div className="mt-1 flex items-center justify-between">
                      <label className="inline-flex items-center gap-2 text-sm">
                        <input
                          type="checkbox"
                          checked={g.hole}
                          onChange={(e) => {
                            const hole = e.target.checked;
                            setState((s) => ({ ...s, polygons: s.polygons.map((q) => (q.id === g.id ? { ...q, hole } : q)) }));
                          }}
                        />
                        Hole (subtracted)
                      </label>
                      <button
                        type="button"
                        className="rounded px-2 py-0.5 text-sm text-red-800 hover:bg-red-50 disabled:opacity-30"
                        disabled={state.polygons.length === 1}
                        onClick={() => {
                          setState((s) => ({ ...s, polygons: s.polygons.filter((q) => q.id !== g.id) }));
                          addPolygonRef.current?.focus();
                        }}
                      >
                        Remove polygon {i + 1}
                      </button>
                    </div>
                  </div>
                );
              })}
              <button
                ref={addPolygonRef}
                type="button"
                className="rounded-md border border-accent px-3 py-1 text-sm font-semibold text-accent-strong hover:bg-paper"
                onClick={() => setState((s) => ({ ...s, polygons: [...s.polygons, { id: rowId(), text: "", hole: false }] }))}
              >
                Add polygon
              </button>
            </div>
          ) : null}

          <fieldset className="grid grid-cols-2 gap-3 rounded-lg border border-ink/15 bg-white p-4">
            <legend className="px-1 text-sm font-semibold">Loads</legend>
            <label className="block text-sm">
              <span className="font-semibold">Moment M</span> ({unitLabel("moment", units)}, sagging +)
              {input(`Moment M (${unitLabel("moment", units)})`, state.moment, (v) => update({ moment: v }), errorAt("moment"), { name: "moment" })}
            </label>
            <label className="block text-sm">
              <span className="font-semibold">Shear V</span> ({unitLabel("force", units)}, optional)
              {input(`Shear V (${unitLabel("force", units)})`, state.shear, (v) => update({ shear: v }), errorAt("shear"), { name: "shear" })}
            </label>
          </fieldset>

          <div role="alert" aria-live="assertive" className="empty:hidden">
            {errors.length > 0 ? (
              <div className="rounded-md border-l-4 border-red-700 bg-red-50 px-4 py-3 text-sm">
                <p className="font-semibold text-red-900">The section is not valid yet:</p>
                <ul className="mt-1 list-disc pl-5">
                  {errors.map((e, i) => (
                    <li key={i} data-field={e.field}>
                      {plainFieldError(e)}
                    </li>
                  ))}
                </ul>
              </div>
            ) : null}
          </div>

          <ShareLink state={state} />
          <SaveForm state={state} canSave={loaderData.canSave} projects={loaderData.projects} disabled={errors.length > 0 || !shown} />
        </section>

        {/* ------------------------------------------------ results */}
        <section aria-labelledby="bench-results" className={`space-y-5 ${stale ? "opacity-50" : ""}`} aria-busy={busy}>
          <div className="flex items-baseline justify-between">
            <h2 id="bench-results" className="text-lg font-bold">
              Results
            </h2>
            <p className="text-xs text-ink/70" aria-live="polite">
              {!shown ? "Calculating…" : stale ? "Showing the last valid section." : busy ? "Updating…" : `Computed in the browser in ${shown.ms.toFixed(1)} ms.`}
            </p>
          </div>
          {shown && computed ? (
            <>
              <p className="sr-only" aria-live="polite">
                {`Area ${formatQuantity("area", shown.stress.properties.area, units)}, Iz ${formatQuantity("inertia", shown.stress.properties.Iz, units)}.`}
              </p>
              <div className="grid gap-4">
                <div className="flex justify-center rounded-lg border border-ink/15 bg-white p-3">
                  <SectionDrawing
                    section={shown.section}
                    properties={shown.stress.properties}
                    neutralAxisAngleDeg={shown.stress.neutralAxis?.angleDeg ?? null}
                    units={units}
                  />
                </div>
                <div className="rounded-lg border border-ink/15 bg-white p-3">
                  <StressDiagram result={shown.stress} moment={computed.Mz} shearForce={computed.V} units={units} width={640} height={320} />
                </div>
              </div>
              <div className="rounded-lg border border-ink/15 bg-white p-3">
                <PropertyTable properties={shown.stress.properties} units={units} />
              </div>
            </>
          ) : (
            <div className="rounded-lg border border-dashed border-ink/30 p-8 text-center text-ink/70">Calculating…</div>
          )}
          <Caution />
        </section>
      </div>
    </div>
  );
}

function ShareLink({ state }: { state: BenchState }) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="flex items-center gap-3 text-sm">
      <button
        type="button"
        className="rounded-md border border-ink/30 bg-white px-3 py-1 hover:bg-paper"
        onClick={async () => {
          const url = new URL(window.location.href);
          url.searchParams.set("s", encodeBenchState(state));
          try {
            await navigator.clipboard.writeText(url.toString());
            setCopied(true);
            setTimeout(() => setCopied(false), 2000);
          } catch {
            window.prompt("Copy this link", url.toString());
          }
        }}
      >
        Copy link to this section
      </button>
      <span aria-live="polite" className="text-ink/70">
        {copied ? "Link copied." : ""}
      </span>
    </div>
  );
}

function SaveForm({
  state,
  canSave,
  projects,
  disabled,
}: {
  state: BenchState;
  canSave: boolean;
  projects: { id: number; name: string }[];
  disabled: boolean;
}) {
  const fetcher = useFetcher<typeof action>();
  if (!canSave) return <p className="text-sm text-ink/70">Saving a section to a project needs a role that may edit briefs.</p>;
  if (projects.length === 0)
    return (
      <p className="text-sm text-ink/70">
        To keep this section, first <a className="text-accent underline" href="/projects">create a project</a>.
      </p>
    );
  const answer = fetcher.data as { ok?: true; name?: string; projectId?: number; errors?: Record<string, string> } | undefined;
  const errs = answer?.errors ?? {};
  return (
    <fetcher.Form method="post" className="space-y-2 rounded-lg border border-ink/15 bg-white p-4">
      <h2 className="text-sm font-semibold">Save to a project</h2>
      <input type="hidden" name="state" value={encodeBenchState(state)} />
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="block text-sm">
          Project
          <select name="projectId" aria-invalid={errs.projectId ? true : undefined} className="mt-1 block w-full rounded border border-ink/30 bg-white px-2 py-1">
            {projects.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </select>
        </label>
        <label className="block text-sm">
          Name
          <input
            name="name"
            required
            maxLength={160}
            aria-invalid={errs.name ? true : undefined}
            placeholder="e.g. Crane runway, trial 2"
            className="mt-1 block w-full rounded border border-ink/30 bg-white px-2 py-1"
          />
        </label>
      </div>
      <div className="flex items-center gap-3">
        <button
          type="submit"
          disabled={disabled || fetcher.state !== "idle"}
          className="rounded-md bg-accent px-4 py-1.5 text-sm font-semibold text-white hover:bg-accent-strong disabled:opacity-50"
        >
          {fetcher.state !== "idle" ? "Saving…" : "Save section"}
        </button>
        <span aria-live="polite" className="text-sm">
          {answer?.ok ? (
            <>
              Saved “{answer.name}”.{" "}
              <a className="text-accent underline" href={`/projects/${answer.projectId}`}>
                Open the project
              </a>
            </>
          ) : null}
        </span>
      </div>
      {Object.keys(errs).length ? (
        <ul role="alert" className="list-disc pl-5 text-sm text-red-900">
          {Object.entries(errs).map(([k, v]) => (
            <li key={k}>{v}</li>
          ))}
        </ul>
      ) : null}
    </fetcher.Form>
  );
}

// "Lightest at each depth" on the sweep page (issue 11, item 9): each family's lightest feasible
// section at a chosen depth, read from the rows the sweep stored (never a new search). A plain GET
// form (?depth=&family=), so it works by keyboard and without scripts; the loader answers it
// (sweep-page.server.ts depthView). Depths are offered from the sweep's own grid, labelled in the
// page's units; the query carries them in mm, as stored.
import { useEffect, useState } from "react";
import { Form } from "react-router";
import { checkLabel, familyLabel } from "~/lib/labels";
import { formatNumber } from "~/components/PropertyTable";
import { describeDimensions, type ChartCandidate } from "~/components/TradeoffChart";
import { FamilyMarker } from "~/components/FamilyMarker";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import type { DepthBestsInfo } from "~/lib/depth-bests";

/** A stored depth best as the depth control lists it: the row, and whose lightest at its depth it is. */
export type DepthRow = ChartCandidate & { depthBestFor: string[] };

/**
 * The sweep page's "Lightest at each depth" control (issue 11, item 9): read from the rows the
 * sweep stored, never by searching again.
 * - info: how far the sweep stored them; "unknown" for sweeps stored before that was recorded.
 * - grid: the depth grid (mm) the control offers, or null when there is none to offer.
 * - rows: null until a depth is asked for; then each stored depth best at that depth (of the one
 *   family, when asked) whose depthBestFor names the family or families asked.
 * - complete: true when the sweep kept every depth (a family with no row there has no feasible
 *   section at that depth); null for a sweep stored before that was recorded.
 * - errors: the query's, by field (a depth off the grid, a family the sweep did not search).
 */
export interface DepthView {
  info: DepthBestsInfo | { state: "unknown"; depths: number; reason: string | null };
  grid: { min: number; step: number; count: number } | null;
  families: string[];
  query: { depth: number | null; family: string | null };
  errors: Partial<Record<"depth" | "family", string>> | null;
  rows: DepthRow[] | null;
  complete: boolean | null;
}


/** A grid depth as the query carries it: mm, without the float noise of min + k·step. */
const depthParam = (d: number) => String(Number(d.toFixed(6)));

export function DepthBests({ view, units, onSelect, selected }: { view: DepthView; units: UnitSystem; onSelect: (c: ChartCandidate) => void; selected: number | null }) {
  const { info, grid, query, errors, rows, complete } = view;
  const lengthUnit = unitLabel("length", units);
  const showDepth = (d: number) => `${formatNumber(fromSI("length", d, units))} ${lengthUnit}`;
  const depths = grid ? Array.from({ length: grid.count }, (_, k) => grid.min + k * grid.step) : [];
  const asked = query.family ? [query.family] : view.families;
  const depthError = errors?.depth,
    familyError = errors?.family;
  // Controlled, and never re-mounted on an answer: focus stays where the keyboard left it (the
  // Show button); the fields follow the URL when it changes otherwise (back, forward, a link).
  const [depthValue, setDepthValue] = useState(query.depth === null ? "" : depthParam(query.depth));
  const [familyValue, setFamilyValue] = useState(query.family ?? "");
  useEffect(() => setDepthValue(query.depth === null ? "" : depthParam(query.depth)), [query.depth]);
  useEffect(() => setFamilyValue(query.family ?? ""), [query.family]);
  return (
    <section aria-labelledby="depth-h" className="space-y-2" data-testid="depth-bests">
      <h2 id="depth-h" className="text-lg font-bold">
        Lightest at each depth
      </h2>
      <p className="text-sm text-ink/80">
        Each family's lightest section that passes every check, at every depth of the grid, kept with the sweep: choose a depth to see them without running it again. A section two families describe (a mono-symmetric I with equal flanges is an I) is listed once, under the family the brief lists first.
      </p>
      {grid ? (
        <Form method="get" preventScrollReset className="flex flex-wrap items-end gap-3 text-sm" aria-label="Lightest at a depth">
          <label className="block">
            <span className="block font-semibold">Depth ({lengthUnit})</span>
            <select
              name="depth"
              value={depthValue}
              onChange={(e) => setDepthValue(e.target.value)}
              aria-invalid={depthError ? true : undefined}
              aria-describedby={depthError ? "depth-error" : undefined}
              className="rounded-md border border-ink/30 bg-white px-2 py-1"
            >
              <option value="">choose a depth</option>
              {depths.map((d) => (
                <option key={d} value={depthParam(d)}>
                  {showDepth(d)}
                </option>
              ))}
            </select>
            {depthError ? (
              <span id="depth-error" className="block font-semibold text-red-800">
                {depthError}
              </span>
            ) : null}
          </label>
          <label className="block">
            <span className="block font-semibold">Family</span>
            <select
              name="family"
              value={familyValue}
              onChange={(e) => setFamilyValue(e.target.value)}
              aria-invalid={familyError ? true : undefined}
              aria-describedby={familyError ? "family-error" : undefined}
              className="rounded-md border border-ink/30 bg-white px-2 py-1"
            >
              <option value="">every family</option>
              {view.families.map((f) => (
                <option key={f} value={f}>
                  {familyLabel(f)}
                </option>
              ))}
            </select>
            {familyError ? (
              <span id="family-error" className="block font-semibold text-red-800">
                {familyError}
              </span>
            ) : null}
          </label>
          <button type="submit" className="rounded-md border border-ink/30 bg-white px-3 py-1 font-semibold">
            Show
          </button>
        </Form>
      ) : (
        <p role="note" className="rounded-md border border-ink/30 bg-white p-2 text-sm" data-testid="depth-none">
          <strong>Not kept for this sweep.</strong> {info.reason}
        </p>
      )}
      <div aria-live="polite" data-testid="depth-results">
        {rows && query.depth !== null ? <DepthRows rows={rows} asked={asked} depth={showDepth(query.depth)} complete={complete} units={units} onSelect={onSelect} selected={selected} /> : null}
      </div>
    </section>
  );
}

function DepthRows({
  rows,
  asked,
  depth,
  complete,
  units,
  onSelect,
  selected,
}: {
  rows: DepthRow[];
  asked: string[];
  depth: string;
  complete: boolean | null;
  units: UnitSystem;
  onSelect: (c: ChartCandidate) => void;
  selected: number | null;
}) {
  // Why a family has no row at this depth, in words that claim no more than is known.
  const missing =
    complete === true
      ? () => `None of this family at ${depth} passes every check.`
      : () => `Nothing stored at ${depth} for this family (the sweep was stored before it recorded whether every depth was kept).`;
  if (rows.length === 0)
    return (
      <p className="rounded-md border border-ink/30 bg-white p-3 text-sm" data-testid="depth-empty">
        {complete === true ? (
          <>
            <strong>
              No feasible section{asked.length === 1 ? ` of the family “${familyLabel(asked[0])}”` : ""} at {depth}
            </strong>
            : every shape of that depth on the grid fails a check. Another depth, or the limits of a recheck, may give one.
          </>
        ) : (
          missing()
        )}
      </p>
    );
  return (
    <div className="overflow-auto rounded-lg border border-ink/15 bg-white">
      <table className="w-full border-collapse text-sm" data-testid="depth-table">
        <caption className="p-2 text-left font-semibold">Lightest at {depth}</caption>
        <thead>
          <tr className="border-b border-ink/30 text-left">
            <th scope="col" className="p-2">
              Family
            </th>
            <th scope="col" className="p-2">
              Rank
            </th>
            <th scope="col" className="p-2">
              Dimensions
            </th>
            <th scope="col" className="p-2 text-right">
              Mass ({unitLabel("massPerLength", units)})
            </th>
            <th scope="col" className="p-2 text-right">
              Utilisation
            </th>
            <th scope="col" className="p-2">
              Governing check
            </th>
            <th scope="col" className="p-2">
              <span className="sr-only">Select</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {asked.map((f) => {
            const r = rows.find((x) => x.depthBestFor.includes(f));
            if (!r)
              return (
                <tr key={f} className="border-b border-ink/10" data-family={f}>
                  <th scope="row" className="p-2 text-left font-normal">
                    {familyLabel(f)}
                  </th>
                  <td className="p-2 text-ink/80" colSpan={6}>
                    {missing()}
                  </td>
                </tr>
              );
            return (
              <tr key={f} className={`border-b border-ink/10 ${selected === r.rank ? "bg-teal-50" : ""}`} data-family={f} data-rank={r.rank}>
                <th scope="row" className="p-2 text-left font-normal">
                  {familyLabel(f)}
                </th>
                <td className="p-2">
                  <FamilyMarker family={r.family} className="mr-1" />
                  {r.family === f ? `#${r.rank}` : `#${r.rank}: the same section, listed once under ${familyLabel(r.family)} (the family listed first)`}
                </td>
                <td className="p-2 tabular-nums">{describeDimensions(r.dimensions, units)}</td>
                <td className="p-2 text-right tabular-nums">{formatNumber(fromSI("massPerLength", r.massPerMetre, units))}</td>
                <td className="p-2 text-right tabular-nums">{r.utilisation.toFixed(3)}</td>
                <td className="p-2">{checkLabel(r.governing)}</td>
                <td className="p-2">
                  <button type="button" className="rounded-md border border-ink/30 bg-white px-2 py-0.5 font-semibold" aria-label={`Select ${familyLabel(f)} #${r.rank}`} onClick={() => onSelect(r)}>
                    Select
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="p-2 text-xs text-ink/70">Mass per length in {unitLabel("massPerLength", units)}; dimensions in {unitLabel("length", units)}. Select a row to compare it or save it as an option.</p>
    </div>
  );
}

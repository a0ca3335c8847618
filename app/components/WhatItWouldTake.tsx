// No feasible section: how near each family came (its least-utilised candidate and the checks it
// fails) and, for each limit, the smallest change along its grid that makes some section
// feasible. Every figure is the engine's (whatItWouldTake, stored with the sweep); this only
// words it, through the one label table.
import type { WhatItWouldTake as Advice } from "~/optimizer/relax";
import type { SearchProblem } from "~/optimizer/search-schema";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { checkLabel, familyLabel, fieldLabel } from "~/lib/labels";
import { formatNumber, formatQuantity } from "~/lib/format";
import { pathQuantity } from "~/lib/brief-form";
import { describeDimensions } from "~/components/TradeoffChart";
import { TableScroll } from "~/components/DataTable";

function limitValue(limit: string, v: number | number[] | boolean, units: UnitSystem): string {
  if (typeof v === "boolean") return v ? "on" : "off";
  if (Array.isArray(v)) return `${v.map((t) => formatNumber(fromSI("length", t, units))).join(", ")} ${unitLabel("length", units)}`;
  const q = pathQuantity(limit) ?? (limit === "thicknesses" || limit.startsWith("fabrication.") ? "length" : undefined);
  return q ? formatQuantity(q, v, units, 6) : formatNumber(v, 6);
}

/** "Depth, max 400 → 460 mm", "add plates 30, 35 mm", "flanges at least as thick as the web: off". */
export function relaxationWords(limit: string, from: number | number[] | boolean, to: number | number[] | boolean, units: UnitSystem): string {
  if (limit === "thicknesses") return `add plate thickness${Array.isArray(to) && to.length > 1 ? "es" : ""} ${limitValue(limit, to, units)}`;
  if (typeof to === "boolean") return `${fieldLabel(limit)}: ${to ? "on" : "off"}`;
  return `${fieldLabel(limit)} ${limitValue(limit, from, units)} → ${limitValue(limit, to, units)}`;
}

export function WhatItWouldTake({ advice, units, problem }: { advice: Advice | null; units: UnitSystem; problem: SearchProblem }) {
  if (!advice)
    return (
      <p className="text-sm text-ink/80" data-testid="advice-none">
        The grid is too large to search again for what it would take; ease one limit at a time (deeper, wider, thicker plates) and rerun.
      </p>
    );
  const en = problem.basis === "en1993";
  return (
    <div className="space-y-4" data-testid="advice">
      <section aria-labelledby="misses-h">
        <h3 id="misses-h" className="font-semibold">
          Nearest misses
        </h3>
        <p className="text-xs text-ink/70">
          Each family's least-utilised section on the grid {en ? "(found by easing every action together; close for the bending–shear interaction)" : ""} and the checks it fails under this brief.
        </p>
        {advice.nearestMisses.length === 0 ? (
          <p className="text-sm">No family has a valid shape on this grid.</p>
        ) : (
          <TableScroll>
            <table className="mt-1 w-full border-collapse bg-white text-sm" data-testid="nearest-misses">
              <thead>
                <tr className="border-b border-ink/30 text-left">
                  <th className="p-2">Family</th>
                  <th className="p-2">Section</th>
                  <th className="p-2 text-right">Mass</th>
                  <th className="p-2 text-right">Utilisation</th>
                  <th className="p-2">Fails</th>
                </tr>
              </thead>
              <tbody>
                {advice.nearestMisses.map((m) => (
                  <tr key={m.family} className="border-b border-ink/10 align-top">
                    <td className="p-2">{familyLabel(m.family)}</td>
                    <td className="p-2 tabular-nums">{describeDimensions(m.dimensions, units)}</td>
                    <td className="p-2 text-right tabular-nums">{formatQuantity("massPerLength", m.massPerMetre, units)}</td>
                    <td className="p-2 text-right tabular-nums">{m.utilisation.toFixed(3)}</td>
                    <td className="p-2">{m.failing.map((c) => `${checkLabel(c.name)} (${c.utilisation.toFixed(3)})`).join("; ")}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        )}
      </section>
      <section aria-labelledby="relax-h">
        <h3 id="relax-h" className="font-semibold">
          What it would take
        </h3>
        <p className="text-xs text-ink/70">For each limit on its own, the smallest change along its grid that makes some section feasible, and the lightest section it then gives.</p>
        {advice.relaxations.length === 0 ? (
          <p className="text-sm">No single limit eased within its bound makes a section feasible: the loads need a larger change (several limits at once).</p>
        ) : (
          <ul className="mt-1 list-disc space-y-1 pl-5 text-sm" data-testid="relaxations">
            {advice.relaxations.map((r) => (
              <li key={r.limit}>
                {relaxationWords(r.limit, r.from, r.to, units)} gives {/^[AEIOU]/.test(familyLabel(r.best.family)) ? "an" : "a"} {familyLabel(r.best.family)} at {formatQuantity("massPerLength", r.best.massPerMetre, units)} (
                {describeDimensions(r.best.dimensions, units)})
              </li>
            ))}
          </ul>
        )}
        {advice.unreachable.length ? (
          <p className="mt-1 text-xs text-ink/70">
            No help within their bound: {advice.unreachable.map((u) => `${fieldLabel(u.limit).toLowerCase()} (tried to ${limitValue(u.limit, u.bound, units)})`).join("; ")}.
          </p>
        ) : null}
        {advice.partial ? <p className="mt-1 text-xs text-ink/70">The search budget ran out before every limit was tried.</p> : null}
      </section>
    </div>
  );
}

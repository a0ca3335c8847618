import { Link } from "react-router";
import { optionNo, sweepNo } from "~/lib/numbering";
import { projectNumbers } from "~/lib/numbering.server";
import { useState } from "react";
import type { Route } from "./+types/sweeps.$sweepId.comparison";
import { requirePermission } from "~/lib/auth.server";
import { compareRecheck } from "~/lib/recheck.server";
import { pathQuantity } from "~/lib/brief-form";
import { Caution } from "~/components/Caution";
import { CompareCandidates } from "~/components/CompareCandidates";
import { ReviewBadge } from "~/components/ReviewBadge";
import { BasisNote } from "~/components/BasisAssumptions";
import { UnitSwitch } from "~/components/UnitSwitch";
import { describeDimensions, type ChartCandidate } from "~/components/TradeoffChart";
import { formatNumber, formatQuantity } from "~/components/PropertyTable";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { idParam } from "~/lib/route-params";
import { describeBreach, familyLabel, fieldLabel } from "~/lib/labels";
import { TableScroll } from "~/components/DataTable";

export function meta() {
  return [{ title: "Recheck comparison · Sparwise" }];
}


export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const c = await compareRecheck(user.teamId, idParam(params.sweepId));
  const slim = (s: typeof c.original) => ({ id: s.id, status: s.status, best: s.best ? { family: s.best.family, dimensions: s.best.dimensions, massPerMetre: s.best.massPerMetre, utilisation: s.best.utilisation, governing: s.best.governing } : null, reason: s.reason, problem: s.problem });
  const numbers = await projectNumbers({ sweeps: [c.original.id, c.recheck.id], options: c.options.map((o) => o.id) });
  return { original: slim(c.original), recheck: slim(c.recheck), changes: c.changes, massDifference: c.massDifference, options: c.options, numbers };
}

function valueText(path: string, v: unknown, units: UnitSystem): string {
  if (v === undefined || v === null) return "—";
  const q = pathQuantity(path);
  if (typeof v === "number" && q) return `${formatNumber(fromSI(q, v, units))} ${unitLabel(q, units)}`;
  if (path === "thicknesses" && typeof v === "string" && units === "us")
    return `${v
      .split(", ")
      .map((t) => formatNumber(fromSI("length", Number(t), units)))
      .join(", ")} in`;
  if (path === "thicknesses") return `${v} mm`;
  return String(v);
}

export default function Comparison({ loaderData }: Route.ComponentProps) {
  const { original, recheck, changes, massDifference, options, numbers } = loaderData;
  const [units, setUnits] = useState<UnitSystem>("si");
  const asCandidate = (s: typeof original, rank: number): ChartCandidate[] => (s.best ? [{ rank, ...s.best, onFront: true }] : []);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Recheck comparison</h1>
          <p className="text-sm">
            <Link to={`/sweeps/${original.id}`} className="text-accent underline">
              Original: sweep {sweepNo(numbers, original.id)}
            </Link>{" "}
            ·{" "}
            <Link to={`/sweeps/${recheck.id}`} className="text-accent underline">
              Recheck: sweep {sweepNo(numbers, recheck.id)}
            </Link>{" "}
            ({recheck.status})
          </p>
        </div>
        <UnitSwitch value={units} onChange={setUnits} name="view-units" />
      </div>
      <Caution problem={recheck.problem} />
      {(original.problem.basis ?? "allowable") !== (recheck.problem.basis ?? "allowable") ? <Caution problem={original.problem} /> : null}
      <section aria-labelledby="changes-h">
        <h2 id="changes-h" className="text-lg font-bold">
          Limits that changed
        </h2>
        {changes.length === 0 ? (
          <p className="text-ink/70">None: the recheck ran the same problem.</p>
        ) : (
          <TableScroll>
          <table className="mt-2 w-full max-w-3xl border-collapse bg-white text-sm" data-testid="changes">
            <thead>
              <tr className="border-b border-ink/30 text-left">
                <th className="p-2">Field</th>
                <th className="p-2">Original</th>
                <th className="p-2">Recheck</th>
              </tr>
            </thead>
            <tbody>
              {changes.map((c) => (
                <tr key={c.path} className="border-b border-ink/10">
                  <td className="p-2 font-semibold">{fieldLabel(c.path)}</td>
                  <td className="p-2 tabular-nums">{valueText(c.path, c.before, units)}</td>
                  <td className="p-2 tabular-nums">{valueText(c.path, c.after, units)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          </TableScroll>
        )}
      </section>
      {recheck.status !== "succeeded" ? (
        <p className="rounded-md border border-ink/30 bg-white p-3 text-sm">The recheck is {recheck.status}; its results appear here when it has finished.</p>
      ) : (
        <>
          <section aria-labelledby="bests-h" className="space-y-2">
            <h2 id="bests-h" className="text-lg font-bold">
              The two lightest sections
            </h2>
            <p className="text-sm" data-testid="mass-difference">
              {massDifference === null
                ? `${original.best ? "" : "The original found no feasible section. "}${recheck.best ? "" : `The recheck found no feasible section: ${recheck.reason}`}`
                : `Mass difference (recheck − original): ${massDifference >= 0 ? "+" : "−"}${formatQuantity("massPerLength", Math.abs(massDifference), units)} (${formatNumber((100 * massDifference) / original.best!.massPerMetre, 3)}%).`}
            </p>
            <div className="grid gap-4 md:grid-cols-2">
              <div>
                <h3 className="font-semibold">Original (sweep {sweepNo(numbers, original.id)})</h3>
                <BasisNote problem={original.problem} />
                <CompareCandidates candidates={asCandidate(original, 1)} problem={original.problem} units={units} />
              </div>
              <div>
                <h3 className="font-semibold">Recheck (sweep {sweepNo(numbers, recheck.id)})</h3>
                <BasisNote problem={recheck.problem} />
                <CompareCandidates candidates={asCandidate(recheck, 1)} problem={recheck.problem} units={units} />
              </div>
            </div>
          </section>
        </>
      )}
      <section aria-labelledby="options-h">
        <h2 id="options-h" className="text-lg font-bold">
          Saved options under the new limits
        </h2>
        {options.length === 0 ? (
          <p className="text-ink/70">No option was saved from the original sweep.</p>
        ) : (
          <TableScroll>
          <table className="mt-2 w-full border-collapse bg-white text-sm" data-testid="option-verdicts">
            <thead>
              <tr className="border-b border-ink/30 text-left">
                <th className="p-2">Option</th>
                <th className="p-2">Section</th>
                <th className="p-2 text-right">Utilisation before</th>
                <th className="p-2 text-right">Utilisation now</th>
                <th className="p-2">Under the new limits</th>
              </tr>
            </thead>
            <tbody>
              {options.map((o) => (
                <tr key={o.id} className="border-b border-ink/10">
                  <td className="p-2">
                    <Link to={`/options/${o.id}`} className="text-accent underline">
                      Option {optionNo(numbers, o.id)}
                    </Link>{" "}
                    <ReviewBadge state={o.reviewState} />
                  </td>
                  <td className="p-2">
                    {familyLabel(o.candidate.family)} {describeDimensions(o.candidate.dimensions, units)}
                  </td>
                  <td className="p-2 text-right tabular-nums">{o.utilisationBefore.toFixed(3)}</td>
                  <td className="p-2 text-right tabular-nums">{o.utilisation === null ? "—" : o.utilisation.toFixed(3)}</td>
                  <td className={`p-2 ${o.feasible ? "font-semibold text-accent-strong" : "text-red-800"}`} data-testid={`verdict-${o.id}`}>
                    {o.feasible ? (
                      "still fits: on the new grid and passes every check"
                    ) : (
                      <>
                        <span className="font-semibold">now breaks {o.breaches.length === 1 ? "one limit" : `${o.breaches.length} limits`}:</span>
                        <ul className="list-disc pl-5">
                          {o.breaches.map((b, i) => (
                            <li key={i}>{describeBreach(b, units)}</li>
                          ))}
                        </ul>
                      </>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          </TableScroll>
        )}
      </section>
    </div>
  );
}

// The sweep's welded and rolled answers side by side (a brief that searched catalogues): the
// lightest of each and, with the cost objective, the cheapest of each with its material and
// fabrication parts. Pure props: SI values in, the brief's units out.
import type { CatalogueSummary, SummaryPoint } from "~/lib/catalogue-sweep";
import { checkLabel, familyLabel } from "~/lib/labels";
import type { UnitSystem } from "~/optimizer/units";
import { formatQuantity } from "~/components/PropertyTable";
import { describeDimensions } from "~/components/TradeoffChart";

function Section({ p, units }: { p: SummaryPoint | null; units: UnitSystem }) {
  if (!p) return <span className="text-ink/70">none feasible</span>;
  return (
    <span>
      <strong>{p.source === "rolled" ? p.designation : familyLabel(p.family)}</strong>
      <span className="block text-xs text-ink/70">
        {p.source === "rolled" ? `rolled ${familyLabel(p.family).toLowerCase()}${p.catalogue ? ` · ${p.catalogue}` : ""}` : `welded · ${describeDimensions(p.dimensions, units)}`}
      </span>
      <span className="block tabular-nums">
        {formatQuantity("massPerLength", p.massPerMetre, units)} · utilisation {p.utilisation.toFixed(3)} ({checkLabel(p.governing)})
      </span>
      {p.cost !== undefined ? (
        <span className="block tabular-nums" data-testid="cost-parts">
          cost {p.cost.toFixed(2)} per m
          {p.costParts ? ` = material ${p.costParts.material.toFixed(2)} + fabrication ${p.costParts.fabrication.toFixed(2)}` : ""}
          {p.costParts?.weldRuns ? ` (${p.costParts.weldRuns} runs of ${p.costParts.weldThroat} mm fillet weld per m)` : ""}
        </span>
      ) : null}
    </span>
  );
}

export function RolledAndWelded({ summary, units, cost }: { summary: CatalogueSummary; units: UnitSystem; cost: boolean }) {
  const s = summary.sideBySide;
  return (
    <section aria-labelledby="rolled-welded-h" className="space-y-2 rounded-lg border border-ink/15 bg-white p-4 text-sm" data-testid="rolled-and-welded">
      <h2 id="rolled-welded-h" className="text-lg font-bold">
        Rolled and welded
      </h2>
      <p className="text-ink/80">
        Catalogue sections searched beside the plate families: {summary.catalogues.join(", ")} ({summary.counts.sections} sections, {summary.counts.evaluated} checked, {summary.counts.feasible} feasible).{" "}
        {s.winner ? (
          <strong>
            {cost ? "Cheapest" : "Lightest"} overall: {s.winner === "rolled" ? "rolled" : "welded"}.
          </strong>
        ) : null}
      </p>
      <table className="w-full border-collapse text-left">
        <thead>
          <tr className="border-b border-ink/30">
            <th scope="col" className="p-2" />
            <th scope="col" className="p-2">Lightest</th>
            {cost ? <th scope="col" className="p-2">Cheapest</th> : null}
          </tr>
        </thead>
        <tbody>
          <tr className="border-b border-ink/10 align-top" data-testid="welded-row">
            <th scope="row" className="p-2">Welded from plate</th>
            <td className="p-2"><Section p={s.welded.lightest} units={units} /></td>
            {cost ? <td className="p-2"><Section p={s.welded.cheapest} units={units} /></td> : null}
          </tr>
          <tr className="align-top" data-testid="rolled-row">
            <th scope="row" className="p-2">Rolled (catalogue)</th>
            <td className="p-2"><Section p={s.rolled.lightest} units={units} /></td>
            {cost ? <td className="p-2"><Section p={s.rolled.cheapest} units={units} /></td> : null}
          </tr>
        </tbody>
      </table>
      {cost ? (
        <p className="text-xs text-ink/70">
          Welded sections' fabrication: the team's cost per metre of fillet weld at the 3 mm minimum throat (EN 1993-1-8 §4.5.2), two runs per flange-to-web junction; rolled sections have none.
        </p>
      ) : null}
      {summary.skipped.length ? (
        <details className="text-xs">
          <summary className="cursor-pointer">{summary.skipped.length} catalogue sections left out (each with its reason: a shape the brief does not take, one this basis does not check, or a size outside the brief's depth or width limits)</summary>
          <ul className="list-disc pl-5">
            {summary.skipped.map((k, i) => (
              <li key={i}>
                {k.designation} ({k.catalogue}): {k.reason}
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </section>
  );
}

// Side-by-side comparison of up to four candidates: each drawn to one common scale, its
// properties, its stress diagram under the brief's governing moment, and every check. All
// from the engine in the browser (sectionStresses, candidateChecks): nothing re-derived here.
import { checkLabel, familyLabel } from "~/lib/labels";
import { candidateChecks } from "~/optimizer/checks";
import { catalogueCandidateChecks } from "~/optimizer/catalogue-search";
import { rolledSectionOf } from "~/optimizer/catalogue";
import { sectionStresses } from "~/optimizer/stress";
import type { Family } from "~/optimizer/geometry";
import type { SectionInput } from "~/optimizer/schema";
import type { SearchProblem } from "~/optimizer/search-schema";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { SectionDrawing } from "~/components/SectionDrawing";
import { StressDiagram } from "~/components/StressDiagram";
import { formatNumber, formatQuantity } from "~/components/PropertyTable";
import { describeDimensions, type ChartCandidate } from "~/components/TradeoffChart";
import { CheckTable } from "~/components/CheckTable";
import { DesignFigures } from "~/components/BasisAssumptions";

/** The moment the diagrams show: the larger of sagging and hogging (hogging as a negative Mz). */
export function designMoment(problem: SearchProblem): number {
  return problem.moment.sagging >= problem.moment.hogging ? problem.moment.sagging : -problem.moment.hogging;
}

export function CompareCandidates({ candidates, problem, units, onRemove, actions }: { candidates: ChartCandidate[]; problem: SearchProblem; units: UnitSystem; onRemove?: (rank: number) => void; actions?: (c: ChartCandidate) => React.ReactNode }) {
  if (!candidates.length) return <p className="text-sm text-ink/70">Tick up to four candidates in the table (or click chart points and add them) to compare them here.</p>;
  const M = designMoment(problem);
  // One scale for every drawing: the largest depth and width decide the pixel size.
  const maxD = Math.max(...candidates.map((c) => c.dimensions.d ?? 0));
  const W = candidates.length > 2 ? 260 : 380;
  return (
    <div className={`grid gap-4 ${candidates.length > 2 ? "md:grid-cols-2 xl:grid-cols-4" : candidates.length === 2 ? "md:grid-cols-2" : ""}`} data-testid="comparison">
      {candidates.map((c) => {
        const section = { family: c.family as Family, ...c.dimensions, density: problem.density } as SectionInput;
        const stress = sectionStresses(section, { Mz: M, V: problem.shear ?? 0 });
        // a rolled section by the catalogue rules (its own properties, the rolled EN 1993 rules)
        const rolled = rolledSectionOf(c);
        const verdict = rolled ? catalogueCandidateChecks(rolled, problem) : candidateChecks(c.family as Family, c.dimensions, problem);
        const p = stress.properties;
        const h = Math.max(120, Math.round((220 * (c.dimensions.d ?? maxD)) / maxD));
        return (
          <article key={c.rank} className="space-y-2 rounded-lg border border-ink/15 bg-white p-3 text-sm">
            <header className="flex items-start justify-between gap-2">
              <h3 className="font-bold">
                #{c.rank} {rolled ? `${rolled.designation} (rolled ${familyLabel(c.family).toLowerCase()})` : familyLabel(c.family)}
              </h3>
              {onRemove ? (
                <button type="button" className="text-xs underline" onClick={() => onRemove(c.rank)}>
                  remove
                </button>
              ) : null}
            </header>
            <p className="tabular-nums">{describeDimensions(c.dimensions, units)}</p>
            <SectionDrawing section={section} properties={p} units={units} width={W} height={h} showDimensions />
            <dl className="grid grid-cols-2 gap-x-2 tabular-nums">
              <dt>Mass</dt>
              <dd>{formatQuantity("massPerLength", p.massPerMetre, units)}</dd>
              <dt>A</dt>
              <dd>{formatQuantity("area", p.area, units)}</dd>
              <dt>Iz</dt>
              <dd>{formatQuantity("inertia", p.Iz, units)}</dd>
              <dt>Sz top / bottom</dt>
              <dd>
                {formatNumber(fromSI("modulus", p.Sz.top, units))} / {formatNumber(fromSI("modulus", p.Sz.bottom, units))} {unitLabel("modulus", units)}
              </dd>
              <dt>ȳ</dt>
              <dd>{formatQuantity("length", p.centroid.y, units)}</dd>
              <dt>Utilisation</dt>
              <dd>
                <strong>{verdict.utilisation.toFixed(3)}</strong> ({checkLabel(verdict.governing)})
              </dd>
            </dl>
            <DesignFigures verdict={verdict} units={units} />
            <StressDiagram result={stress} moment={M} shearForce={problem.shear ?? 0} units={units} width={W} height={220} />
            <CheckTable verdict={verdict} units={units} compact />
            {actions ? actions(c) : null}
          </article>
        );
      })}
    </div>
  );
}

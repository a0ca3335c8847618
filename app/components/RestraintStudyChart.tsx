// The restraint study on the sweep page (member-checks.md §3): the lightest section at the
// restraint spacings L, L/2 … L/6, charted as mass per length against the number of
// intermediate lateral restraints, with the same figures as a table (the chart's text form).
import { checkLabel, familyLabel, fieldLabel } from "~/lib/labels";
import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { formatNumber, formatQuantity } from "~/components/PropertyTable";
import { describeDimensions } from "~/components/TradeoffChart";
import { niceTicks } from "~/lib/nice-ticks";
import type { RestraintStudy } from "~/lib/restraint-study";
import { TableScroll } from "~/components/DataTable";

export function RestraintStudyChart({ study, units, height = 280 }: { study: RestraintStudy; units: UnitSystem; height?: number }) {
  if (study.error) return <p className="rounded-md border border-ink/30 bg-white p-3 text-sm">The restraint study could not run: {study.error}. The sweep's own results above are unaffected.</p>;
  const massUnit = unitLabel("massPerLength", units);
  const data = study.points.map((p) => ({ x: p.restraints, y: p.best ? fromSI("massPerLength", p.best.massPerMetre, units) : null, p }));
  const span = (m: number) => formatQuantity("span", m, units);
  const masses = data.map((d) => d.y).filter((y): y is number => y !== null);
  // round ticks (nice-ticks.ts), not the library's 41.37, 43.81 …
  const yAxis = niceTicks(masses.length ? Math.min(...masses) : 0, masses.length ? Math.max(...masses) : 1, 5);
  // AISC 360 studies carry the Cb each spacing was searched with (engine restraint-study.ts)
  const aisc = study.points.some((p) => p.Cb !== undefined);
  // EN 1993 studies carry the C1 each spacing was searched with; one stored before they did
  // (neither Cb nor C1) kept the brief's C1 at every spacing, which over-estimates Mcr between
  // intermediate restraints, so the page says so rather than show it as current
  const en = study.points.some((p) => p.C1 !== undefined);
  const legacyEn = !aisc && !en && study.points.length > 0;
  const c1L = study.points[0]?.C1 ?? 1,
    c1Between = study.points[1]?.C1 ?? Math.min(c1L, 1);
  return (
    <div className="space-y-2" data-testid="restraint-study">
      <figure className="rounded-lg border border-ink/15 bg-white p-3" aria-label="Restraint study: lightest mass per length against the number of intermediate restraints">
        <ResponsiveContainer width="100%" height={height}>
          <LineChart data={data} margin={{ top: 10, right: 20, bottom: 30, left: 24 }}>
            <CartesianGrid stroke="#1d273322" />
            <XAxis type="number" dataKey="x" domain={[0, 5]} ticks={[0, 1, 2, 3, 4, 5]} allowDecimals={false} label={{ value: "Intermediate lateral restraints", position: "bottom", offset: 10 }} />
            <YAxis type="number" domain={yAxis.domain} ticks={yAxis.ticks} interval={0} allowDataOverflow width={64} tickFormatter={(v: number) => formatNumber(v, 6)} label={{ value: `Lightest mass per length (${massUnit})`, angle: -90, position: "insideLeft", offset: -10, style: { textAnchor: "middle" } }} />
            <Tooltip
              formatter={(v: unknown) => [`${formatNumber(Number(v))} ${massUnit}`, "lightest"]}
              labelFormatter={(x: unknown) => {
                const p = study.points.find((q) => q.restraints === Number(x));
                return p ? `${p.restraints} restraint${p.restraints === 1 ? "" : "s"}, spacing ${span(p.lengthM)}` : "";
              }}
            />
            <Line type="linear" dataKey="y" stroke="#0f6b66" strokeWidth={2} dot={{ r: 4 }} connectNulls={false} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
        <figcaption className="mt-1 text-xs text-ink/70">
          The same brief searched with the compression flange braced at L = {span(study.lengthM)} and at L/2 … L/6 (0 to 5 intermediate restraints); each point is the exact lightest section at that spacing.
          {aisc
            ? ` AISC 360-16: the unbraced length Lb is the spacing; Cb is the brief's at L (${formatNumber(study.points[0]?.Cb ?? 1, 4)}) and 1.0 between intermediate braces, the conservative value §F1 permits, since the brief's Cb belongs to the moment diagram over the whole of L.`
            : ""}
          {en
            ? c1Between < 1
              ? ` EN 1993: C1 is the brief's (${formatNumber(c1L, 4)}) at every spacing, already below 1.0, the uniform-moment value taken between intermediate restraints; C2 and C3 are the brief's.`
              : ` EN 1993: C1 is the brief's at L (${formatNumber(c1L, 4)}) and 1.0 between intermediate restraints, the uniform-moment value (common practice), since the brief's C1 belongs to the moment diagram over the whole of L; C2 and C3 are the brief's.`
            : ""}
          {legacyEn ? " This study was computed before the study took C1 = 1.0 between intermediate restraints: its spacings below L kept the brief's C1, which over-estimates Mcr there (unconservative); run the brief again for a current study." : ""}{" "}
          Computed with the sweep ({formatNumber(study.elapsedMs / 1000, 2)} s).
        </figcaption>
      </figure>
      <TableScroll>
      <table className="w-full border-collapse bg-white text-sm" data-testid="restraint-study-table">
        <thead>
          <tr className="border-b border-ink/30 text-left">
            <th className="p-2 text-right">Intermediate restraints</th>
            <th className="p-2 text-right">{aisc ? "Spacing Lb" : "Spacing"}</th>
            {aisc ? <th className="p-2 text-right">Cb</th> : null}
            {en ? <th className="p-2 text-right">{fieldLabel("restraint.C1")}</th> : null}
            <th className="p-2">Lightest section</th>
            <th className="p-2 text-right">Mass ({massUnit})</th>
            <th className="p-2 text-right">Saving against none</th>
            <th className="p-2">Governing check</th>
          </tr>
        </thead>
        <tbody>
          {study.points.map((p) => {
            const none = study.points[0]?.best?.massPerMetre;
            return (
              <tr key={p.restraints} className="border-b border-ink/10">
                <td className="p-2 text-right tabular-nums">{p.restraints}</td>
                <td className="p-2 text-right tabular-nums">{span(p.lengthM)}</td>
                {aisc ? <td className="p-2 text-right tabular-nums" data-col="cb">{p.Cb === undefined ? "—" : formatNumber(p.Cb, 4)}</td> : null}
                {en ? <td className="p-2 text-right tabular-nums" data-col="c1">{p.C1 === undefined ? "—" : formatNumber(p.C1, 4)}</td> : null}
                <td className="p-2">{p.best ? `${familyLabel(p.best.family)} ${describeDimensions(p.best.dimensions, units)}` : `none passes${p.reason ? `: ${p.reason}` : ""}`}</td>
                <td className="p-2 text-right tabular-nums">{p.best ? formatNumber(fromSI("massPerLength", p.best.massPerMetre, units)) : "—"}</td>
                <td className="p-2 text-right tabular-nums">{p.best && none ? `${formatNumber((100 * (none - p.best.massPerMetre)) / none, 3)} %` : "—"}</td>
                <td className="p-2">{p.best ? `${checkLabel(p.best.governing)} (utilisation ${p.best.utilisation.toFixed(3)})` : "—"}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      </TableScroll>
    </div>
  );
}

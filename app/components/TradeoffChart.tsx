// Mass per length (cost per metre when the brief asks for the cheapest) against utilisation for a
// sweep's stored candidates: one series per family (colour and marker shape, drawn by FamilyMarker
// as the candidate table draws them), the front as a line, utilisation 1 (the limit) as a
// reference line, round ticks on both axes (nice-ticks.ts), and the legend as HTML above the plot.
// Hover shows the section; a click selects it (the table follows).
import { checkLabel, familyLabel } from "~/lib/labels";
import { CartesianGrid, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { FamilyMarker, MarkerSymbol } from "~/components/FamilyMarker";
import { niceTicks } from "~/lib/nice-ticks";
import { formatNumber } from "~/components/PropertyTable";
import type { DesignRow } from "~/lib/design-summary";

export interface ChartCandidate {
  rank: number;
  family: string;
  dimensions: Record<string, number>;
  massPerMetre: number;
  utilisation: number;
  governing: string;
  onFront: boolean;
  /** its family's lightest feasible section at its depth (a context point: the chart's family and depth filter draws these) */
  depthBest?: boolean;
  /** per metre, in the stock list's currency (cost objective only) */
  cost?: number | null;
  /** EN 1993 basis: the engine's class, Mcr, χLT, resistances and weld throat (null under the allowable basis) */
  design?: DesignRow | null;
  /** "rolled": a catalogue section, named by its designation; absent or "plate": welded from plate */
  source?: "plate" | "rolled";
  designation?: string | null;
  catalogue?: string | null;
  /** cost objective: the material and fabrication parts of cost */
  costMaterial?: number | null;
  costFabrication?: number | null;
}

/** The section's name on pages: a rolled section's designation, else its family. */
export function candidateName(c: Pick<ChartCandidate, "family" | "source" | "designation">): string {
  return c.source === "rolled" && c.designation ? c.designation : c.family;
}

interface Point {
  x: number;
  y: number;
  c: ChartCandidate;
}

export function describeDimensions(dims: Record<string, number>, units: UnitSystem): string {
  return `${Object.entries(dims)
    .map(([k, v]) => `${k} ${formatNumber(fromSI("length", v, units))}`)
    .join(", ")} ${unitLabel("length", units)}`;
}

function Tip({ active, payload, units }: { active?: boolean; payload?: { payload: Point }[]; units: UnitSystem }) {
  if (!active || !payload?.length) return null;
  const { c } = payload[0].payload;
  if (!c) return null;
  return (
    <div className="rounded-md border border-ink/20 bg-white p-2 text-xs shadow">
      <p className="font-semibold">
        #{c.rank} {c.source === "rolled" ? candidateName(c) : familyLabel(c.family)}
        {c.source === "rolled" ? <span className="font-normal"> (rolled, {familyLabel(c.family).toLowerCase()})</span> : null}
      </p>
      <p>{describeDimensions(c.dimensions, units)}</p>
      <p>
        {formatNumber(fromSI("massPerLength", c.massPerMetre, units))} {unitLabel("massPerLength", units)} · utilisation {c.utilisation.toFixed(3)} ({checkLabel(c.governing)})
      </p>
    </div>
  );
}

/** What the chart plots upwards: the sweep's objective. */
export type ChartObjective = "mass" | "cost";

/** The chart's title: its vertical axis against its horizontal one (the page's heading uses it too). */
export function tradeoffTitle(objective: ChartObjective): string {
  return objective === "cost" ? "Cost per metre against utilisation" : "Mass per length against utilisation";
}

const INK = "#1d2733";
const LIMIT = "#8a4b00";

interface Series {
  key: string;
  name: string;
  family: string;
  list: ChartCandidate[];
  /** welded plate sections in a sweep that also has rolled ones */
  outline: boolean;
}

function LineSample({ dashed = false }: { dashed?: boolean }) {
  return (
    <svg width={24} height={14} viewBox="0 0 24 14" aria-hidden="true" focusable="false" data-sample="line">
      <line x1={1} y1={7} x2={23} y2={7} stroke={INK} strokeWidth={1.5} strokeDasharray={dashed ? "4 3" : undefined} />
    </svg>
  );
}

/** The legend as HTML above the plot (it wraps on a phone): a line sample for each front, each series' marker, the limit, the selection. */
function ChartLegend({ series, mixed, rolledFront, byCost }: { series: Series[]; mixed: boolean; rolledFront: boolean; byCost: boolean }) {
  return (
    <ul className="mb-2 flex flex-wrap gap-x-4 gap-y-1 text-sm" data-testid="chart-legend" aria-label="Legend">
      <li className="flex items-center gap-1.5" data-legend="front">
        <LineSample />
        {mixed ? "Front, welded" : "Front"} (none {byCost ? "cheaper" : "lighter"} and less utilised)
      </li>
      {rolledFront ? (
        <li className="flex items-center gap-1.5" data-legend="front-rolled">
          <LineSample dashed />
          Front, rolled
        </li>
      ) : null}
      {series.map((s) => (
        <li key={s.key} className="flex items-center gap-1.5" data-legend="series" data-family={s.family}>
          <FamilyMarker family={s.family} outline={s.outline} />
          {s.name}
        </li>
      ))}
      <li className="flex items-center gap-1.5" data-legend="limit">
        <svg width={14} height={14} viewBox="0 0 14 14" aria-hidden="true" focusable="false">
          <line x1={7} y1={0} x2={7} y2={14} stroke={LIMIT} strokeWidth={1.5} strokeDasharray="4 3" />
        </svg>
        Utilisation 1, the limit
      </li>
      <li className="flex items-center gap-1.5" data-legend="selected">
        <svg width={16} height={16} viewBox="0 0 16 16" aria-hidden="true" focusable="false">
          <circle cx={8} cy={8} r={7} fill="none" stroke={INK} strokeWidth={2} />
        </svg>
        Selected
      </li>
    </ul>
  );
}

export function TradeoffChart({
  candidates,
  units,
  selected,
  onSelect,
  objective = "mass",
  mixed: mixedProp,
  height = 380,
  frontLine,
  caption,
}: {
  candidates: ChartCandidate[];
  units: UnitSystem;
  selected: number | null;
  onSelect: (rank: number) => void;
  /** "cost": cost per metre upwards (the brief asked for the cheapest), else mass per length */
  objective?: ChartObjective;
  /** the sweep also searched catalogues: welded sections as outlines (the table is told the same) */
  mixed?: boolean;
  height?: number;
  /** the points the front's line is drawn through, when they are not among `candidates` (a filtered chart keeps the whole grid's front) */
  frontLine?: ChartCandidate[];
  /** what the markers are, when not the stored candidates (a filtered chart) */
  caption?: string;
}) {
  const byCost = objective === "cost";
  const value = (c: ChartCandidate) => (byCost ? (c.cost ?? NaN) : fromSI("massPerLength", c.massPerMetre, units));
  const toPoint = (c: ChartCandidate): Point => ({ x: c.utilisation, y: value(c), c });
  const plotted = candidates.filter((c) => Number.isFinite(value(c)));
  const families = [...new Set(plotted.map((c) => c.family))];
  // With catalogue sections in the sweep, rolled and welded are told apart by the marker: rolled
  // filled, welded drawn as an outline in the family's colour (shape and colour still the family's).
  const mixed = mixedProp ?? plotted.some((c) => c.source === "rolled");
  const series: Series[] = mixed
    ? (["plate", "rolled"] as const).flatMap((src) =>
        families
          .filter((f) => plotted.some((c) => c.family === f && (c.source ?? "plate") === src))
          .map((f) => ({ key: `${src}-${f}`, name: `${familyLabel(f)} (${src === "rolled" ? "rolled" : "welded"})`, family: f, list: plotted.filter((c) => c.family === f && (c.source ?? "plate") === src), outline: src === "plate" })),
      )
    : families.map((f) => ({ key: f, name: familyLabel(f), family: f, list: plotted.filter((c) => c.family === f), outline: false }));
  // each side's own front (the rolled rows' front is worked out among them: catalogue-sweep.ts)
  const lined = frontLine ? frontLine.filter((c) => Number.isFinite(value(c))) : plotted;
  const front = lined.filter((c) => c.onFront && c.source !== "rolled").map(toPoint).sort((a, b) => a.x - b.x);
  const rolledFront = lined.filter((c) => c.onFront && c.source === "rolled").map(toPoint).sort((a, b) => a.x - b.x);
  const sel = plotted.find((c) => c.rank === selected);
  const massUnit = unitLabel("massPerLength", units);
  const yLabel = byCost ? "Cost per metre (prices' currency per m)" : `Mass per length (${massUnit})`;
  const xLabel = "Utilisation (demand ÷ capacity)";
  // Round ticks; the utilisation axis always reaches 1, so the limit is on the chart.
  const us = [...plotted, ...(frontLine ?? [])].map((c) => c.utilisation);
  const vs = [...plotted, ...(frontLine ?? [])].map(value).filter(Number.isFinite);
  const xAxis = niceTicks(us.length ? Math.min(...us) : 0, Math.max(1, ...us), 6);
  const yAxis = niceTicks(vs.length ? Math.min(...vs) : 0, vs.length ? Math.max(...vs) : 1, 6);
  const title = tradeoffTitle(objective);
  const pick = (p: unknown) => {
    const c = (p as { payload?: Point })?.payload?.c ?? (p as Point)?.c;
    if (c) onSelect(c.rank);
  };
  return (
    <figure className="rounded-lg border border-ink/15 bg-white p-3" aria-label={`Chart: ${title.toLowerCase()}`} data-testid="tradeoff-chart">
      <ChartLegend series={series} mixed={mixed} rolledFront={rolledFront.length > 0} byCost={byCost} />
      <ResponsiveContainer width="100%" height={height}>
        <ScatterChart margin={{ top: 10, right: 20, bottom: 30, left: 20 }}>
          <CartesianGrid stroke="#1d273322" />
          <XAxis type="number" dataKey="x" name="Utilisation" domain={xAxis.domain} ticks={xAxis.ticks} interval={0} allowDataOverflow label={{ value: xLabel, position: "bottom", offset: 10 }} tickFormatter={(v: number) => formatNumber(v, 6)} />
          <YAxis
            type="number"
            dataKey="y"
            name={byCost ? "Cost" : "Mass"}
            domain={yAxis.domain}
            ticks={yAxis.ticks}
            interval={0}
            allowDataOverflow
            width={64}
            label={{ value: yLabel, angle: -90, position: "insideLeft", offset: -10, style: { textAnchor: "middle" } }}
            tickFormatter={(v: number) => formatNumber(v, 6)}
          />
          <Tooltip content={<Tip units={units} />} />
          <ReferenceLine x={1} stroke={LIMIT} strokeDasharray="6 4" />
          <Scatter name="Front" data={front} line={{ stroke: INK, strokeWidth: 1.5 }} shape={() => <g />} legendType="none" isAnimationActive={false} />
          {mixed && rolledFront.length ? <Scatter name="Front (rolled)" data={rolledFront} line={{ stroke: INK, strokeWidth: 1.5, strokeDasharray: "4 3" }} shape={() => <g />} legendType="none" isAnimationActive={false} /> : null}
          {series.map(({ key, name, family: f, list, outline }) => (
            <Scatter
              key={key}
              name={name}
              data={list.map(toPoint)}
              shape={(p: { cx?: number; cy?: number }) => <MarkerSymbol family={f} outline={outline} cx={p.cx} cy={p.cy} />}
              isAnimationActive={false}
              onClick={pick}
              cursor="pointer"
            />
          ))}
          {sel ? <Scatter name="Selected" data={[toPoint(sel)]} shape={(p: { cx?: number; cy?: number }) => <circle cx={p.cx} cy={p.cy} r={8} fill="none" stroke={INK} strokeWidth={2} />} legendType="none" isAnimationActive={false} /> : null}
        </ScatterChart>
      </ResponsiveContainer>
      <figcaption className="mt-1 text-xs text-ink/70">
        {caption ? (
          <>
            {title}: {caption}, with the whole grid's front as the line. Click a point to select it.
          </>
        ) : (
          <>
            {title}: the stored candidates, the front ({byCost ? "cheapest" : "lightest"} at each utilisation) and each family's {byCost ? "cheapest" : "lightest"}
            {mixed ? "; catalogue (rolled) sections as filled markers, welded plate sections as outlines" : ""}. Click a point to select it; the table below lists the same candidates with the
            same markers.
          </>
        )}
      </figcaption>
    </figure>
  );
}

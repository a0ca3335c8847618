// Mass per metre against utilisation for a sweep's stored candidates: one series per family
// (colour and marker shape), the front as a line, utilisation = 1 (the allowable limit) as a
// reference line. Hover shows the section; a click selects it (the table follows).
import { checkLabel, familyLabel } from "~/lib/labels";
import { CartesianGrid, Legend, ReferenceLine, ResponsiveContainer, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import type { Family } from "~/optimizer/geometry";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { FAMILY_STYLE } from "~/components/family-style";
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

export function TradeoffChart({
  candidates,
  units,
  selected,
  onSelect,
  height = 380,
}: {
  candidates: ChartCandidate[];
  units: UnitSystem;
  selected: number | null;
  onSelect: (rank: number) => void;
  height?: number;
}) {
  const toPoint = (c: ChartCandidate): Point => ({ x: fromSI("massPerLength", c.massPerMetre, units), y: c.utilisation, c });
  const families = [...new Set(candidates.map((c) => c.family))] as Family[];
  // With catalogue sections in the sweep, rolled and welded are told apart by the marker: rolled
  // filled, welded drawn as an outline in the family's colour (shape and colour still the family's).
  const mixed = candidates.some((c) => c.source === "rolled");
  const series = mixed
    ? (["plate", "rolled"] as const).flatMap((src) =>
        families
          .filter((f) => candidates.some((c) => c.family === f && (c.source ?? "plate") === src))
          .map((f) => ({ key: `${src}-${f}`, name: `${familyLabel(f)} (${src === "rolled" ? "rolled" : "welded"})`, family: f, list: candidates.filter((c) => c.family === f && (c.source ?? "plate") === src), outline: src === "plate" })),
      )
    : families.map((f) => ({ key: f, name: familyLabel(f), family: f, list: candidates.filter((c) => c.family === f), outline: false }));
  // each side's own front (the rolled rows' front is worked out among them: catalogue-sweep.ts)
  const front = candidates.filter((c) => c.onFront && c.source !== "rolled").map(toPoint).sort((a, b) => a.x - b.x);
  const rolledFront = candidates.filter((c) => c.onFront && c.source === "rolled").map(toPoint).sort((a, b) => a.x - b.x);
  const sel = candidates.find((c) => c.rank === selected);
  const massUnit = unitLabel("massPerLength", units);
  return (
    <figure className="rounded-lg border border-ink/15 bg-white p-3" aria-label="Trade-off chart: mass per length against utilisation">
      <ResponsiveContainer width="100%" height={height}>
        <ScatterChart margin={{ top: 10, right: 20, bottom: 30, left: 10 }}>
          <CartesianGrid stroke="#1d273322" />
          <XAxis type="number" dataKey="x" name="Mass" domain={["auto", "auto"]} label={{ value: `Mass per length (${massUnit})`, position: "bottom", offset: 10 }} tickFormatter={(v: number) => formatNumber(v, 3)} />
          <YAxis type="number" dataKey="y" name="Utilisation" domain={[(min: number) => Math.max(0, Math.floor((min - 0.05) * 10) / 10), (max: number) => Math.max(1.05, Math.ceil(max * 20) / 20)]} label={{ value: "Utilisation", angle: -90, position: "insideLeft" }} tickFormatter={(v: number) => v.toFixed(2)} />
          <Tooltip content={<Tip units={units} />} />
          {/* an outlined (welded) series would print its name in its white fill: name it in its stroke colour */}
          <Legend verticalAlign="top" formatter={(value: string, entry: { color?: string; payload?: { stroke?: string } }) => <span style={{ color: entry.payload?.stroke ?? entry.color }}>{value}</span>} />
          <ReferenceLine y={1} stroke="#8a4b00" strokeDasharray="6 4" label={{ value: "utilisation 1 (the limit)", position: "insideTopRight", fill: "#8a4b00", fontSize: 12 }} />
          <Scatter name={mixed ? "Front (welded)" : "Front"} data={front} line={{ stroke: "#1d2733", strokeWidth: 1.5 }} shape={() => <g />} legendType="line" isAnimationActive={false} />
          {mixed && rolledFront.length ? (
            <Scatter name="Front (rolled)" data={rolledFront} line={{ stroke: "#1d2733", strokeWidth: 1.5, strokeDasharray: "4 3" }} shape={() => <g />} legendType="line" isAnimationActive={false} />
          ) : null}
          {series.map(({ key, name, family: f, list, outline }) => (
            <Scatter
              key={key}
              name={name}
              data={list.map(toPoint)}
              fill={outline ? "#ffffff" : (FAMILY_STYLE[f]?.colour ?? "#1d2733")}
              stroke={outline ? (FAMILY_STYLE[f]?.colour ?? "#1d2733") : undefined}
              strokeWidth={outline ? 1.5 : undefined}
              shape={FAMILY_STYLE[f]?.shape ?? "circle"}
              isAnimationActive={false}
              onClick={(p: unknown) => {
                const c = (p as { payload?: Point })?.payload?.c ?? (p as Point)?.c;
                if (c) onSelect(c.rank);
              }}
              cursor="pointer"
            />
          ))}
          {sel ? <Scatter name="Selected" data={[toPoint(sel)]} fill="none" stroke="#1d2733" strokeWidth={2} shape="circle" legendType="none" isAnimationActive={false} /> : null}
        </ScatterChart>
      </ResponsiveContainer>
      <figcaption className="mt-1 text-xs text-ink/70">
        Stored candidates: the front (lightest at each utilisation) and each family's lightest{mixed ? "; catalogue (rolled) sections as filled markers, welded plate sections as outlines" : ""}. Click a point to select it; the table below lists the same candidates.
      </figcaption>
    </figure>
  );
}

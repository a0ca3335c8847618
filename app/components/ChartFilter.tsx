// The trade-off chart's family and depth filter. A sweep stores each family's lightest feasible
// section at every depth of its grid (the search's context points, proven in the same pass as the
// front); the chart's default view samples the stored candidates, so a chosen family or depth
// range is read from the candidates API instead: every context point that matches, lightest first.
import { useState } from "react";
import { familyLabel } from "~/lib/labels";
import { toSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import type { ChartCandidate } from "~/components/TradeoffChart";

/** Most context points a filtered chart draws (four of the API's pages); more are counted, not drawn. */
export const FILTER_MAX_POINTS = 2_000;
const PAGE = 500;

export interface FilteredChart {
  points: ChartCandidate[];
  /** context points matching the filter, drawn or not */
  total: number;
  /** what the markers are, for the chart's caption */
  caption: string;
}

export function ChartFilter({
  sweepId,
  families,
  units,
  onChange,
}: {
  sweepId: number;
  families: string[];
  units: UnitSystem;
  /** null: the default view (the stored candidates, sampled) */
  onChange: (filtered: FilteredChart | null) => void;
}) {
  const [family, setFamily] = useState("");
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const [status, setStatus] = useState<"idle" | "loading" | "error">("idle");
  const [error, setError] = useState<string | null>(null);
  const len = unitLabel("length", units);

  const apply = async () => {
    setError(null);
    const lo = from.trim() === "" ? undefined : Number(from),
      hi = to.trim() === "" ? undefined : Number(to);
    if ((lo !== undefined && !(lo >= 0)) || (hi !== undefined && !(hi >= 0))) {
      setError(`Depth: give a number of ${len} (0 or more), or leave it empty.`);
      return;
    }
    if (lo !== undefined && hi !== undefined && lo > hi) {
      setError("Depth: the first value must not exceed the second.");
      return;
    }
    if (!family && lo === undefined && hi === undefined) {
      onChange(null);
      return;
    }
    const params = new URLSearchParams({ depthBest: "true", pageSize: String(PAGE), sort: "rank" });
    if (family) params.set("family", family);
    // the API takes mm; the page's inputs are in its length unit
    if (lo !== undefined) params.set("depthMin", String(toSI("length", lo, units)));
    if (hi !== undefined) params.set("depthMax", String(toSI("length", hi, units)));
    setStatus("loading");
    try {
      const points: ChartCandidate[] = [];
      let total = 0;
      for (let page = 1; points.length < FILTER_MAX_POINTS; page++) {
        params.set("page", String(page));
        const res = await fetch(`/api/v1/sweeps/${sweepId}/candidates?${params}`, { headers: { Accept: "application/json" } });
        if (!res.ok) throw new Error(String(res.status));
        const body = (await res.json()) as { items: ChartCandidate[]; total: number };
        total = body.total;
        points.push(...body.items.map((c) => ({ ...c, design: null })));
        if (body.items.length < PAGE) break;
      }
      const who = family ? familyLabel(family).toLowerCase() : "each family";
      const range =
        lo !== undefined && hi !== undefined
          ? ` from ${lo} to ${hi} ${len} deep`
          : lo !== undefined
            ? ` at least ${lo} ${len} deep`
            : hi !== undefined
              ? ` at most ${hi} ${len} deep`
              : "";
      const shown = points.length < total ? `the lightest ${points.length.toLocaleString("en")} of ${total.toLocaleString("en")}` : `${total.toLocaleString("en")}`;
      onChange({ points, total, caption: `${who}'s lightest section at every depth of the grid${range} (${shown} points)` });
      setStatus("idle");
    } catch {
      setStatus("error");
    }
  };

  return (
    <form
      className="flex flex-wrap items-end gap-3 text-sm"
      aria-label="Chart filter"
      data-testid="chart-filter"
      onSubmit={(e) => {
        e.preventDefault();
        void apply();
      }}
    >
      <label className="flex flex-col">
        Family
        <select value={family} onChange={(e) => setFamily(e.target.value)} className="rounded-md border border-ink/30 bg-white px-2 py-1" name="chartFamily">
          <option value="">all</option>
          {families.map((f) => (
            <option key={f} value={f}>
              {familyLabel(f)}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col">
        Depth from ({len})
        <input value={from} onChange={(e) => setFrom(e.target.value)} inputMode="decimal" className="w-24 rounded-md border border-ink/30 px-2 py-1" name="chartDepthFrom" />
      </label>
      <label className="flex flex-col">
        to ({len})
        <input value={to} onChange={(e) => setTo(e.target.value)} inputMode="decimal" className="w-24 rounded-md border border-ink/30 px-2 py-1" name="chartDepthTo" />
      </label>
      <button type="submit" className="rounded-md border border-ink/30 bg-white px-3 py-1">
        Show the lightest at each depth
      </button>
      <button
        type="button"
        className="rounded-md px-2 py-1 text-accent underline"
        onClick={() => {
          setFamily("");
          setFrom("");
          setTo("");
          setError(null);
          onChange(null);
        }}
      >
        All stored candidates
      </button>
      <span className="text-ink/70" aria-live="polite">
        {status === "loading" ? "Loading…" : status === "error" ? "Could not load the points; try again." : (error ?? "")}
      </span>
    </form>
  );
}

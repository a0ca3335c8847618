// The sweep's candidates as a table, sortable by any column and filterable by family and
// front, linked to the chart through the selected rank; up to four ticked for comparison.
import { useMemo, useState } from "react";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { formatNumber } from "~/components/PropertyTable";
import { describeDimensions, type ChartCandidate } from "~/components/TradeoffChart";
import { FAMILY_STYLE } from "~/components/family-style";
import type { Family } from "~/optimizer/geometry";
import type { DesignRow } from "~/lib/design-summary";
import { STRESSES_ONLY } from "~/lib/caution";

/** The EN 1993 columns of one row; Mb,Rd where lateral-torsional buckling is checked, else Mc,Rd (marked). */
function DesignCells({ d, units }: { d: DesignRow | null; units: UnitSystem }) {
  const n = (q: "moment" | "force" | "length", x: number | null | undefined) => (x == null ? "—" : formatNumber(fromSI(q, x, units)));
  return (
    <>
      <td className="p-2 text-right tabular-nums" data-col="class">
        {d?.sectionClass ?? "—"}
      </td>
      <td className="p-2 text-right tabular-nums" data-col="mcr">
        {n("moment", d?.Mcr)}
      </td>
      <td className="p-2 text-right tabular-nums" data-col="chi">
        {d?.chiLT == null ? "—" : d.chiLT.toFixed(3)}
      </td>
      <td className="p-2 text-right tabular-nums">{d ? (d.MbRd != null ? n("moment", d.MbRd) : `${n("moment", d.McRd)} (c)`) : "—"}</td>
      <td className="p-2 text-right tabular-nums">{n("force", d?.VRd)}</td>
      <td className="p-2 text-right tabular-nums" data-col="weld">
        {n("length", d?.weldThroat)}
      </td>
    </>
  );
}

type SortKey = "rank" | "family" | "massPerMetre" | "utilisation" | "governing" | "cost" | "sectionClass" | "Mcr" | "chiLT" | "MRd" | "VRd" | "weldThroat";
export const MAX_COMPARE = 4;

export function CandidateTable({
  candidates,
  units,
  selected,
  onSelect,
  compare,
  onCompare,
}: {
  candidates: ChartCandidate[];
  units: UnitSystem;
  selected: number | null;
  onSelect: (rank: number) => void;
  compare: number[];
  onCompare: (ranks: number[]) => void;
}) {
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: "rank", dir: 1 });
  const [family, setFamily] = useState("");
  const [frontOnly, setFrontOnly] = useState(false);
  const families = [...new Set(candidates.map((c) => c.family))];
  const withCost = candidates.some((c) => c.cost != null);
  // EN 1993 results carry the engine's design figures; allowable ones say they check no stability.
  const withDesign = candidates.some((c) => c.design);
  const rows = useMemo(() => {
    const list = candidates.filter((c) => (!family || c.family === family) && (!frontOnly || c.onFront));
    const key = (c: ChartCandidate) => {
      const d = c.design;
      switch (sort.key) {
        case "sectionClass":
          return d?.sectionClass;
        case "Mcr":
          return d?.Mcr;
        case "chiLT":
          return d?.chiLT;
        case "MRd":
          return d ? (d.MbRd ?? d.McRd) : null;
        case "VRd":
          return d?.VRd;
        case "weldThroat":
          return d?.weldThroat;
        default:
          return c[sort.key];
      }
    };
    return list.sort((a, b) => {
      const x = key(a) ?? 0,
        y = key(b) ?? 0;
      const d = typeof x === "number" && typeof y === "number" ? x - y : String(x).localeCompare(String(y));
      return d * sort.dir || a.rank - b.rank;
    });
  }, [candidates, family, frontOnly, sort]);
  const head = (key: SortKey, label: string, right = false) => (
    <th scope="col" className={`p-2 ${right ? "text-right" : ""}`} aria-sort={sort.key === key ? (sort.dir === 1 ? "ascending" : "descending") : "none"}>
      <button type="button" className="font-semibold underline decoration-dotted" onClick={() => setSort((s) => ({ key, dir: s.key === key ? ((-s.dir) as 1 | -1) : 1 }))}>
        {label}
        {sort.key === key ? (sort.dir === 1 ? " ▲" : " ▼") : ""}
      </button>
    </th>
  );
  const toggle = (rank: number) => {
    if (compare.includes(rank)) onCompare(compare.filter((r) => r !== rank));
    else if (compare.length < MAX_COMPARE) onCompare([...compare, rank]);
  };
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-4 text-sm">
        <label className="flex items-center gap-2">
          Family
          <select value={family} onChange={(e) => setFamily(e.target.value)} className="rounded-md border border-ink/30 bg-white px-2 py-1">
            <option value="">all</option>
            {families.map((f) => (
              <option key={f}>{f}</option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={frontOnly} onChange={(e) => setFrontOnly(e.target.checked)} /> front only
        </label>
        {withDesign ? null : (
          <span className="font-semibold text-caution" data-testid="stresses-only">
            Allowable stresses: {STRESSES_ONLY}
          </span>
        )}
        <span className="text-ink/70">
          {rows.length} of {candidates.length} shown · tick up to {MAX_COMPARE} to compare ({compare.length} ticked)
        </span>
      </div>
      <div className="max-h-[28rem] overflow-auto rounded-lg border border-ink/15 bg-white">
        <table className="w-full border-collapse text-sm" data-testid="candidate-table">
          <thead className="sticky top-0 bg-white">
            <tr className="border-b border-ink/30 text-left">
              <th scope="col" className="p-2">
                Compare
              </th>
              {head("rank", "Rank")}
              {head("family", "Family")}
              <th scope="col" className="p-2">
                Dimensions
              </th>
              {head("massPerMetre", `Mass (${unitLabel("massPerLength", units)})`, true)}
              {withCost ? head("cost", "Cost per m", true) : null}
              {head("utilisation", "Utilisation", true)}
              {withDesign ? (
                <>
                  {head("sectionClass", "Class", true)}
                  {head("Mcr", `Mcr (${unitLabel("moment", units)})`, true)}
                  {head("chiLT", "χLT", true)}
                  {head("MRd", `Mb,Rd or Mc,Rd (${unitLabel("moment", units)})`, true)}
                  {head("VRd", `VRd (${unitLabel("force", units)})`, true)}
                  {head("weldThroat", `Weld a (${unitLabel("length", units)})`, true)}
                </>
              ) : null}
              {head("governing", "Governing check")}
              <th scope="col" className="p-2">
                Front
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((c) => (
              <tr
                key={c.rank}
                data-rank={c.rank}
                aria-selected={selected === c.rank}
                onClick={() => onSelect(c.rank)}
                className={`cursor-pointer border-b border-ink/10 ${selected === c.rank ? "bg-teal-50 outline outline-2 outline-accent" : "hover:bg-paper"}`}
              >
                <td className="p-2">
                  <input
                    type="checkbox"
                    aria-label={`Compare candidate ${c.rank}`}
                    checked={compare.includes(c.rank)}
                    disabled={!compare.includes(c.rank) && compare.length >= MAX_COMPARE}
                    onChange={() => toggle(c.rank)}
                    onClick={(e) => e.stopPropagation()}
                  />
                </td>
                <td className="p-2 tabular-nums">{c.rank}</td>
                <td className="p-2">
                  <span aria-hidden="true" style={{ color: FAMILY_STYLE[c.family as Family]?.colour }}>
                    ●{" "}
                  </span>
                  {c.family}
                </td>
                <td className="p-2 tabular-nums">{describeDimensions(c.dimensions, units)}</td>
                <td className="p-2 text-right tabular-nums">{formatNumber(fromSI("massPerLength", c.massPerMetre, units))}</td>
                {withCost ? <td className="p-2 text-right tabular-nums">{c.cost != null ? c.cost.toFixed(2) : "—"}</td> : null}
                <td className="p-2 text-right tabular-nums">{c.utilisation.toFixed(3)}</td>
                {withDesign ? <DesignCells d={c.design ?? null} units={units} /> : null}
                <td className="p-2">
                  {c.governing}
                  {c.design?.governingClause ? <span className="block text-xs text-ink/70">{c.design.governingClause}</span> : null}
                </td>
                <td className="p-2">{c.onFront ? "yes" : ""}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {withDesign ? (
        <p className="text-xs text-ink/70">
          Moment resistance: Mb,Rd where lateral-torsional buckling is checked; “(c)” marks Mc,Rd where the compression flange is restrained throughout. Figures from the engine's EN 1993 checks.
        </p>
      ) : null}
    </div>
  );
}

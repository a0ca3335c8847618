// The sweep's candidates as a table, paged, sorted and filtered by the server (GET
// /api/v1/sweeps/:id/candidates): the page brings the first page, and every other page, sort and
// filter is fetched, so the page stays small however many candidates a sweep stored (issue 9).
// Linked to the chart through the selected rank; up to four ticked for comparison.
import { useEffect, useRef, useState } from "react";
import { checkLabel, familyLabel } from "~/lib/labels";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { formatNumber } from "~/components/PropertyTable";
import { candidateName, describeDimensions, type ChartCandidate } from "~/components/TradeoffChart";
import { FamilyMarker } from "~/components/FamilyMarker";
import { isAiscRow, isEnRow, type AiscRow, type En1993Row } from "~/lib/design-summary";
import { STRESSES_ONLY } from "~/lib/caution";

/** The EN 1993 columns of one row; Mb,Rd where lateral-torsional buckling is checked, else Mc,Rd (marked). */
function DesignCells({ d, units }: { d: En1993Row | null; units: UnitSystem }) {
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

/** The AISC 360-16 column heads (issue 14), with the method's symbols and the page's units. */
export function aiscHeads(method: "ASD" | "LRFD", units: UnitSystem): { key: string; label: string }[] {
  const asd = method === "ASD";
  const M = unitLabel("moment", units),
    V = unitLabel("force", units),
    L = unitLabel("span", units);
  return [
    { key: "section", label: "Chapter F" },
    { key: "mn", label: `Mn (${M})` },
    { key: "mn-available", label: `${asd ? "Mn/Ωb" : "φbMn"} (${M})` },
    { key: "zone", label: "LTB zone" },
    { key: "lp", label: `Lp (${L})` },
    { key: "lr", label: `Lr (${L})` },
    { key: "cb", label: "Cb" },
    { key: "vn", label: `Vn (${V})` },
    { key: "vn-available", label: `${asd ? "Vn/Ωv" : "φvVn"} (${V})` },
    { key: "weld", label: `Weld w (${unitLabel("length", units)})` },
  ];
}

/** The AISC 360-16 columns of one row, in aiscHeads' order (Lp and Lr as spans: m or ft). */
function AiscCells({ d, units }: { d: AiscRow | null; units: UnitSystem }) {
  const n = (q: "moment" | "force" | "length", x: number | null | undefined) => (x == null ? "—" : formatNumber(fromSI(q, x, units)));
  const span = (mm: number | null | undefined) => (mm == null ? "—" : formatNumber(fromSI("span", mm / 1000, units)));
  const cells: [string, string][] = [
    ["section", d?.section ?? "—"],
    ["mn", n("moment", d?.Mn)],
    ["mn-available", n("moment", d?.MnAvailable)],
    ["zone", d ? (d.zone ?? "braced") : "—"],
    ["lp", span(d?.Lp)],
    ["lr", span(d?.Lr)],
    ["cb", d?.Cb == null ? "—" : formatNumber(d.Cb, 4)],
    ["vn", n("force", d?.Vn)],
    ["vn-available", n("force", d?.VnAvailable)],
    ["weld", n("length", d?.weldLeg)],
  ];
  return (
    <>
      {cells.map(([key, text]) => (
        <td key={key} className={`p-2 tabular-nums ${key === "zone" || key === "section" ? "" : "text-right"}`} data-col={`aisc-${key}`}>
          {text}
        </td>
      ))}
    </>
  );
}

/**
 * The columns the server sorts by (stored with each candidate). The design figures (EN 1993 or
 * AISC 360) are kept as one JSON block per row, not as columns, so they do not sort: sorting
 * them would mean reading and parsing every stored candidate for each click.
 */
type SortKey = "rank" | "family" | "massPerMetre" | "utilisation" | "governing" | "cost";
export const MAX_COMPARE = 4;

/** The API's sort name for each column. */
const API_SORT: Record<SortKey, string> = { rank: "rank", family: "family", massPerMetre: "mass", utilisation: "utilisation", governing: "governing", cost: "cost" };

export interface CandidatePage {
  items: ChartCandidate[];
  total: number;
  page: number;
  pageSize: number;
}

interface Query {
  page: number;
  key: SortKey;
  dir: 1 | -1;
  family: string;
  frontOnly: boolean;
}

export function CandidateTable({
  sweepId,
  initial,
  families,
  withCost,
  basis,
  method = "LRFD",
  withRolled = false,
  units,
  selected,
  onSelect,
  compare,
  onCompare,
  onRows,
}: {
  sweepId: number;
  /** page 1 by rank, unfiltered (from the page's loader) */
  initial: CandidatePage;
  /** the families present in the sweep (the filter's choices) */
  families: string[];
  withCost: boolean;
  /** the brief's basis: EN 1993 and AISC 360 rows carry the engine's design figures in that code's terms; allowable: the table says it checks stresses only */
  basis: string | undefined;
  /** AISC 360: ASD (Ω) or LRFD (φ), which names the available-strength columns */
  method?: "ASD" | "LRFD";
  /** the sweep searched catalogues: rows say rolled (with designation) or welded */
  withRolled?: boolean;
  units: UnitSystem;
  selected: number | null;
  onSelect: (rank: number) => void;
  compare: number[];
  onCompare: (ranks: number[]) => void;
  /** told each page of rows shown, so the page can select and compare them */
  onRows?: (rows: ChartCandidate[]) => void;
}) {
  const [query, setQuery] = useState<Query>({ page: 1, key: "rank", dir: 1, family: "", frontOnly: false });
  const [data, setData] = useState<CandidatePage>(initial);
  const [status, setStatus] = useState<"idle" | "loading" | "error">("idle");
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    const ac = new AbortController();
    const params = new URLSearchParams({ page: String(query.page), pageSize: String(initial.pageSize), sort: `${query.dir < 0 ? "-" : ""}${API_SORT[query.key]}` });
    if (query.family) params.set("family", query.family);
    if (query.frontOnly) params.set("frontOnly", "true");
    setStatus("loading");
    fetch(`/api/v1/sweeps/${sweepId}/candidates?${params}`, { headers: { Accept: "application/json" }, signal: ac.signal })
      .then(async (res) => {
        if (!res.ok) throw new Error(String(res.status));
        const body = (await res.json()) as { items: (ChartCandidate & { area: number; familyBest: boolean })[]; total: number; page: number; pageSize: number };
        const items = body.items.map(({ rank, family, dimensions, massPerMetre, utilisation, governing, onFront, cost, design, source, designation, catalogue, costMaterial, costFabrication }) => ({
          rank,
          family,
          dimensions,
          massPerMetre,
          utilisation,
          governing,
          onFront,
          cost,
          design: design ?? null,
          source,
          designation,
          catalogue,
          costMaterial,
          costFabrication,
        }));
        setData({ items, total: body.total, page: body.page, pageSize: body.pageSize });
        onRows?.(items);
        setStatus("idle");
      })
      .catch(() => {
        if (!ac.signal.aborted) setStatus("error");
      });
    return () => ac.abort();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [query, sweepId, initial.pageSize]);

  const pages = Math.max(1, Math.ceil(data.total / data.pageSize));
  const en = basis === "en1993",
    us = basis === "aisc360",
    withDesign = en || us;
  const head = (key: SortKey, label: string, right = false) => (
    <th scope="col" className={`p-2 ${right ? "text-right" : ""}`} aria-sort={query.key === key ? (query.dir === 1 ? "ascending" : "descending") : "none"}>
      <button
        type="button"
        className="font-semibold underline decoration-dotted"
        onClick={() => setQuery((q) => ({ ...q, page: 1, key, dir: q.key === key ? ((-q.dir) as 1 | -1) : 1 }))}
      >
        {label}
        {query.key === key ? (query.dir === 1 ? " ▲" : " ▼") : ""}
      </button>
    </th>
  );
  const plain = (label: string) => (
    <th scope="col" className="p-2 text-right">
      {label}
    </th>
  );
  const toggle = (rank: number) => {
    if (compare.includes(rank)) onCompare(compare.filter((r) => r !== rank));
    else if (compare.length < MAX_COMPARE) onCompare([...compare, rank]);
  };
  const from = data.total === 0 ? 0 : (data.page - 1) * data.pageSize + 1;
  const to = Math.min(data.total, data.page * data.pageSize);
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-4 text-sm">
        <label className="flex items-center gap-2">
          Family
          <select value={query.family} onChange={(e) => setQuery((q) => ({ ...q, page: 1, family: e.target.value }))} className="rounded-md border border-ink/30 bg-white px-2 py-1">
            <option value="">all</option>
            {families.map((f) => (
              <option key={f}>{f}</option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={query.frontOnly} onChange={(e) => setQuery((q) => ({ ...q, page: 1, frontOnly: e.target.checked }))} /> front only
        </label>
        {withDesign ? null : (
          <span className="font-semibold text-caution" data-testid="stresses-only">
            Allowable stresses: {STRESSES_ONLY}
          </span>
        )}
        <span className="text-ink/70" aria-live="polite">
          {status === "loading" ? "Loading… " : status === "error" ? "Could not load that page; try again. " : ""}
          rows {from}–{to} of {data.total.toLocaleString("en")} · tick up to {MAX_COMPARE} to compare ({compare.length} ticked)
        </span>
      </div>
      <div className="relative max-h-[28rem] overflow-auto rounded-lg border border-ink/15 bg-white">
        <table className="w-full border-collapse text-sm" data-testid="candidate-table">
          <thead className="sticky top-0 bg-white">
            <tr className="border-b border-ink/30 text-left">
              <th scope="col" className="p-2">
                Compare
              </th>
              {head("rank", "Rank")}
              {head("family", withRolled ? "Section" : "Family")}
              <th scope="col" className="p-2">
                Dimensions
              </th>
              {head("massPerMetre", `Mass (${unitLabel("massPerLength", units)})`, true)}
              {withCost ? head("cost", "Cost per m", true) : null}
              {head("utilisation", "Utilisation", true)}
              {us ? aiscHeads(method, units).map((h) => <th key={h.key} scope="col" className="p-2 text-right">{h.label}</th>) : null}
              {en ? (
                <>
                  {plain("Class")}
                  {plain(`Mcr (${unitLabel("moment", units)})`)}
                  {plain("χLT")}
                  {plain(`Mb,Rd or Mc,Rd (${unitLabel("moment", units)})`)}
                  {plain(`VRd (${unitLabel("force", units)})`)}
                  {plain(`Weld a (${unitLabel("length", units)})`)}
                </>
              ) : null}
              {head("governing", "Governing check")}
              <th scope="col" className="p-2">
                Front
              </th>
            </tr>
          </thead>
          <tbody>
            {data.items.map((c) => (
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
                  {/* the chart's own marker for this row's series (FamilyMarker): welded as an outline when the sweep also has rolled sections */}
                  <FamilyMarker family={c.family} outline={withRolled && c.source !== "rolled"} className="mr-1" />
                  {c.source === "rolled" ? candidateName(c) : familyLabel(c.family)}
                  {c.source === "rolled" ? (
                    <span className="block text-xs text-ink/70">
                      rolled {familyLabel(c.family).toLowerCase()}
                      {c.catalogue ? ` · ${c.catalogue}` : ""}
                    </span>
                  ) : withRolled ? (
                    <span className="block text-xs text-ink/70">welded</span>
                  ) : null}
                </td>
                <td className="p-2 tabular-nums">{describeDimensions(c.dimensions, units)}</td>
                <td className="p-2 text-right tabular-nums">{formatNumber(fromSI("massPerLength", c.massPerMetre, units))}</td>
                {withCost ? (
                  <td className="p-2 text-right tabular-nums">
                    {c.cost != null ? c.cost.toFixed(2) : "—"}
                    {c.costMaterial != null ? (
                      <span className="block text-xs text-ink/70" data-testid="cost-parts">
                        material {c.costMaterial.toFixed(2)} + fabrication {(c.costFabrication ?? 0).toFixed(2)}
                      </span>
                    ) : null}
                  </td>
                ) : null}
                <td className="p-2 text-right tabular-nums">{c.utilisation.toFixed(3)}</td>
                {en ? <DesignCells d={isEnRow(c.design) ? c.design : null} units={units} /> : null}
                {us ? <AiscCells d={isAiscRow(c.design) ? c.design : null} units={units} /> : null}
                <td className="p-2">
                  {checkLabel(c.governing)}
                  {/* AISC 360: the governing limit state in words and its equation (e.g. lateral-torsional buckling, Eq. F2-2) */}
                  {isAiscRow(c.design) ? <span className="block text-xs" data-col="limit-state">{c.design.limitState}</span> : null}
                  {c.design?.governingClause ? <span className="block text-xs text-ink/70">{c.design.governingClause}</span> : null}
                </td>
                <td className="p-2">{c.onFront ? "yes" : ""}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {pages > 1 ? (
        <nav className="flex items-center gap-3 text-sm" aria-label="Candidate pages">
          <button type="button" className="rounded-md border border-ink/30 bg-white px-3 py-1 disabled:opacity-50" disabled={data.page <= 1 || status === "loading"} onClick={() => setQuery((q) => ({ ...q, page: q.page - 1 }))}>
            Previous
          </button>
          <span className="tabular-nums">
            page {data.page} of {pages}
          </span>
          <button type="button" className="rounded-md border border-ink/30 bg-white px-3 py-1 disabled:opacity-50" disabled={data.page >= pages || status === "loading"} onClick={() => setQuery((q) => ({ ...q, page: q.page + 1 }))}>
            Next
          </button>
        </nav>
      ) : null}
      {en ? (
        <p className="text-xs text-ink/70">
          Moment resistance: Mb,Rd where lateral-torsional buckling is checked; “(c)” marks Mc,Rd where the compression flange is restrained throughout. Figures from the engine's EN 1993 checks.
        </p>
      ) : null}
      {us ? (
        <p className="text-xs text-ink/70" data-testid="aisc-table-note">
          AISC 360-16 {method}: Mn is the least nominal flexural strength of the Chapter F section's limit states, lateral-torsional buckling included, for the governing moment sign; {method === "ASD" ? "Mn/Ωb and Vn/Ωv are the allowable strengths (Ωb = Ωv = 1.67; 1.50 for rolled I webs under G2.1(a))" : "φbMn and φvVn are the design strengths (φb = φv = 0.90; 1.00 for rolled I webs under G2.1(a))"}. LTB zone, Lp and Lr over the unbraced length Lb with Cb (Chapter F; “braced” where no Lb is given). Weld w: the flange-to-web fillet weld leg (J2.4, Table J2.4). Figures from the engine's AISC 360 checks.
        </p>
      ) : null}
    </div>
  );
}

// Every check of one section with demand, capacity, utilisation and the clause it implements
// (candidateChecks' output), its name and the brief's fields in its clause through the one label
// table (labels.ts), in the page's units: each check's own unit (CheckResult.unit) is converted
// through units.ts. Under the allowable basis the caption says that no stability is checked.
import type { CandidateVerdict, CheckResult } from "~/optimizer/checks";
import { fromSI, unitLabel, type Quantity, type UnitSystem } from "~/optimizer/units";
import { formatNumber } from "~/components/PropertyTable";
import { STRESSES_ONLY } from "~/lib/caution";
import { TableScroll } from "~/components/DataTable";
import { checkTitle, clauseLabel } from "~/lib/labels";
import { aiscCheckClause } from "~/lib/design-summary";

/**
 * The same checks in AISC 360-16's terms (issue 14): required strength (Ma, Va, Ra under ASD;
 * Mu, Vu, Ru under LRFD) against available strength (Rn/Ω or φRn). The checks the bases share
 * (deflection, the brief's slenderness limits) keep their labels (labels.ts checkTitle).
 */
export function aiscCheckWords(method: "ASD" | "LRFD"): Record<string, string> {
  const asd = method === "ASD";
  const [M, V, R] = asd ? ["Ma", "Va", "Ra"] : ["Mu", "Vu", "Ru"];
  const Mn = asd ? "Mn/Ωb" : "φbMn",
    Vn = asd ? "Vn/Ωv" : "φvVn",
    Rn = asd ? "Rn/Ω" : "φRn";
  return {
    "class-4": "Width-to-thickness (Table B4.1b): outside this version",
    "bending-resistance": `Flexure, yielding and local buckling ${M} ≤ ${Mn}`,
    ltb: `Lateral-torsional buckling over Lb ${M} ≤ ${Mn}`,
    "shear-resistance": `Shear ${V} ≤ ${Vn}`,
    "shear-buckling": `Shear with web buckling (Cv < 1) ${V} ≤ ${Vn}`,
    weld: "Flange-to-web fillet weld leg w ≤ thinner part joined",
    bearing: `Web local yielding and crippling at the support ${R} ≤ ${Rn}`,
  };
}

const UNIT_QUANTITY: Record<CheckResult["unit"], Quantity | null> = { MPa: "stress", mm: "length", "kN·m": "moment", kN: "force", ratio: null };

function unitOf(c: CheckResult, units: UnitSystem): { q: Quantity | null; label: string } {
  const q = UNIT_QUANTITY[c.unit] ?? null;
  return { q, label: q ? unitLabel(q, units) : "ratio" };
}

/**
 * `compact` (a column of the four-up comparison, about 250 px): two columns, the check with its
 * demand, capacity and clause under its name, and the utilisation, so nothing needs to scroll.
 */
export function CheckTable({ verdict, units, compact = false }: { verdict: CandidateVerdict; units: UnitSystem; compact?: boolean }) {
  // a code basis (EN 1993's design block or AISC 360's) checks stability; only the allowable basis is "stresses only"
  const stressesOnly = !verdict.design && !verdict.aisc;
  const us = verdict.aisc ?? null;
  // AISC 360: its own words for the checks it words differently; the shared ones keep their labels
  const words: Record<string, string> | null = us ? aiscCheckWords(us.method) : null;
  // AISC 360: the section and equation that set each strength, from the engine's design block
  const clauseOf = (c: CheckResult) => (us ? aiscCheckClause(us, c.name, c.clause) : c.clause);
  return (
    <TableScroll>
    <table className="w-full border-collapse text-xs sm:text-sm" data-testid="check-table">
      <caption className="text-left font-semibold">
        Checks {verdict.feasible ? "(all pass)" : "(FAILS)"}
        {stressesOnly ? <span className="font-normal text-caution"> — {STRESSES_ONLY}</span> : null}
      </caption>
      <thead>
        <tr className="border-b border-ink/30 text-left">
          <th className="py-1 pr-2">Check</th>
          {compact ? null : (
            <>
              <th className="py-1 pr-2 text-right">Demand</th>
              <th className="py-1 pr-2 text-right">Capacity</th>
              <th className="py-1 pr-2">Unit</th>
            </>
          )}
          <th className="py-1 pr-2 text-right">Utilisation</th>
          {compact ? null : <th className="py-1">Clause</th>}
        </tr>
      </thead>
      <tbody>
        {verdict.checks.map((c) => {
          const u = unitOf(c, units);
          const v = (x: number) => formatNumber(u.q ? fromSI(u.q, x, units) : x);
          return (
            <tr key={c.name} className={`border-b border-ink/10 align-top ${c.name === verdict.governing ? "font-semibold" : ""}`} data-check={c.name}>
              <td className="py-1 pr-2">
                {words?.[c.name] ?? checkTitle(c.name)}
                {c.name === verdict.governing ? " (governs)" : ""}
                {compact ? (
                  <span className="block text-xs font-normal tabular-nums" data-demand>
                    demand {v(c.demand)} {u.label}, capacity {v(c.capacity)} {u.label}
                  </span>
                ) : null}
                {compact && c.clause ? <span className="block text-[0.7rem] font-normal text-ink/70">{clauseLabel(clauseOf(c))}</span> : null}
              </td>
              {compact ? null : (
                <>
                  <td className="py-1 pr-2 text-right tabular-nums">{v(c.demand)}</td>
                  <td className="py-1 pr-2 text-right tabular-nums">{v(c.capacity)}</td>
                  <td className="py-1 pr-2">{u.label}</td>
                </>
              )}
              <td className={`py-1 pr-2 text-right tabular-nums ${c.utilisation > 1 ? "text-red-800" : ""}`}>{c.utilisation.toFixed(3)}</td>
              {compact ? null : <td className="py-1 text-xs font-normal text-ink/80">{clauseLabel(clauseOf(c))}</td>}
            </tr>
          );
        })}
      </tbody>
    </table>
    </TableScroll>
  );
}

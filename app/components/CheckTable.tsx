// Every check of one section with demand, capacity and utilisation (candidateChecks' output),
// in the page's units: stresses MPa/ksi, deflection mm/in, slenderness a plain ratio.
import type { CandidateVerdict } from "~/optimizer/checks";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { formatNumber } from "~/components/PropertyTable";

const WORDS: Record<string, string> = {
  "bending-compression": "Bending, compressive fibre stress",
  "bending-tension": "Bending, tensile fibre stress",
  shear: "Shear stress V·Q/(Iz·b)",
  "slenderness-outstand": "Slenderness, flange outstand",
  "slenderness-internal": "Slenderness, internal plate",
  "slenderness-web": "Slenderness, web",
  "slenderness-stem": "Slenderness, stem",
  deflection: "Deflection 5wL⁴/(384EI)",
};

function unitOf(name: string, units: UnitSystem): { q: "stress" | "length" | null; label: string } {
  if (name.startsWith("slenderness")) return { q: null, label: "ratio" };
  if (name === "deflection") return { q: "length", label: unitLabel("length", units) };
  return { q: "stress", label: unitLabel("stress", units) };
}

export function CheckTable({ verdict, units, compact = false }: { verdict: CandidateVerdict; units: UnitSystem; compact?: boolean }) {
  return (
    <table className="w-full border-collapse text-xs sm:text-sm">
      <caption className="text-left font-semibold">Checks {verdict.feasible ? "(all pass)" : "(FAILS)"}</caption>
      <thead>
        <tr className="border-b border-ink/30 text-left">
          <th className="py-1 pr-2">Check</th>
          <th className="py-1 pr-2 text-right">Demand</th>
          <th className="py-1 pr-2 text-right">Capacity</th>
          {compact ? null : <th className="py-1 pr-2">Unit</th>}
          <th className="py-1 text-right">Utilisation</th>
        </tr>
      </thead>
      <tbody>
        {verdict.checks.map((c) => {
          const u = unitOf(c.name, units);
          const v = (x: number) => formatNumber(u.q ? fromSI(u.q, x, units) : x);
          return (
            <tr key={c.name} className={`border-b border-ink/10 ${c.name === verdict.governing ? "font-semibold" : ""}`} data-check={c.name}>
              <td className="py-1 pr-2">
                {WORDS[c.name] ?? c.name}
                {c.name === verdict.governing ? " (governs)" : ""}
              </td>
              <td className="py-1 pr-2 text-right tabular-nums">
                {v(c.demand)}
                {compact ? ` ${u.label}` : ""}
              </td>
              <td className="py-1 pr-2 text-right tabular-nums">
                {v(c.capacity)}
                {compact ? ` ${u.label}` : ""}
              </td>
              {compact ? null : <td className="py-1 pr-2">{u.label}</td>}
              <td className={`py-1 text-right tabular-nums ${c.utilisation > 1 ? "text-red-800" : ""}`}>{c.utilisation.toFixed(3)}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

// The calculation record's worked-line builder, one for every basis: a result line is the
// expression in symbols, the numbers put in, the result in bold and the clause in brackets
// (Step, Clause), its numbers written by the one formatter (n; f for a factor inside a product)
// and, on a US customary record, the result again in its own units (Also). The EN 1993 part,
// the AISC 360 part and the shared checks (WorkedChecks.tsx) are all set out with these.
import { fromSI, unitLabel, type Quantity, type UnitSystem } from "~/optimizer/units";
import { formatNumber } from "~/components/PropertyTable";

export const n = (x: number, sig = 4) => formatNumber(x, sig);

/** A factor inside a written-out product: powers of ten in brackets, so "÷ (2.028 × 10⁷)" reads unambiguously. */
export const f = (x: number, sig = 4) => {
  const t = formatNumber(x, sig);
  return t.includes("×") ? `(${t})` : t;
};

/** The result again in US customary units, in brackets (nothing on an SI record). */
export function Also({ q, x, units }: { q: Quantity; x: number; units: UnitSystem }) {
  return units === "us" ? (
    <span className="text-ink/70">
      {" "}
      ({n(fromSI(q, x, units))} {unitLabel(q, units)})
    </span>
  ) : null;
}

export function Clause({ children }: { children: string }) {
  return <span className="ml-1 text-xs text-ink/70">[{children}]</span>;
}

export function Step({ children, testid }: { children: React.ReactNode; testid?: string }) {
  return (
    <p className="text-sm" data-testid={testid}>
      {children}
    </p>
  );
}

// How numbers are shown: one formatter for every page, table, chart and message.
import { fromSI, unitLabel, type Quantity, type UnitSystem } from "~/optimizer/units";

const SUPERSCRIPT: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };

// One formatter for every call: Number#toLocaleString with options builds a new Intl.NumberFormat
// each time (tens of microseconds), and a sweep page formats thousands of numbers; at 20 clients
// that alone was about a quarter of the server's time (issue 9, item 8).
const GROUPED = new Intl.NumberFormat("en-US", { maximumFractionDigits: 6 });

/**
 * Four significant figures (an engineer's table precision), a true minus sign, and powers of
 * ten written out past 10⁷ so Iz of a girder stays readable. Never prints NaN: "—" instead.
 */
export function formatNumber(x: number, significant = 4): string {
  if (!Number.isFinite(x)) return "—";
  if (x === 0) return "0";
  const sign = x < 0 ? "−" : "";
  const a = Math.abs(x);
  if (a >= 1e7 || a < 1e-3) {
    let e = Math.floor(Math.log10(a));
    let m = Number((a / 10 ** e).toPrecision(significant));
    if (m >= 10) {
      m /= 10;
      e += 1;
    }
    const exp = String(e).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
    return `${sign}${m.toFixed(significant - 1)} × 10${exp}`;
  }
  const rounded = Number(a.toPrecision(significant));
  // Below 1,000 there is nothing to group, and the shortest round-trip text is what the formatter
  // would print while it has at most its six decimals: written directly, several times faster (a
  // sweep page formats a few hundred numbers per view; tests/unit/format-fast.test.ts compares them).
  if (rounded < 1000) {
    const text = String(rounded);
    const dot = text.indexOf(".");
    if (dot < 0 || text.length - dot - 1 <= 6) return sign + text;
  }
  return sign + GROUPED.format(rounded);
}

/** A value of a quantity given in SI, shown in `units` with its unit: "1.234 × 10⁸ mm⁴". */
export function formatQuantity(q: Quantity, valueSI: number, units: UnitSystem, significant = 4): string {
  const unit = unitLabel(q, units);
  const sep = unit === "°" ? "" : " ";
  return `${formatNumber(fromSI(q, valueSI, units), significant)}${sep}${unit}`;
}


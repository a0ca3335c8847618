// Every SectionProperties field with its symbol, value and unit. Values arrive in SI (the
// engine's units) and are converted for display only through units.ts.
import type { SectionProperties } from "~/optimizer/properties";
import { PROPERTY_QUANTITIES, STABILITY_QUANTITIES, fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";

// The one number formatter lives in lib/format.ts (lib/ may not import components); re-exported
// here, where the pages have always found it.
export { formatNumber, formatQuantity } from "~/lib/format";
import { formatQuantity } from "~/lib/format";
import { TableScroll } from "~/components/DataTable";

/** A signed stress with its sense: "+123.4 MPa (tension)", "−98.7 MPa (compression)". */
export function formatStress(sigmaSI: number, units: UnitSystem): string {
  const body = formatQuantity("stress", sigmaSI, units);
  if (sigmaSI > 0) return `+${body} (tension)`;
  if (sigmaSI < 0) return `${body} (compression)`;
  return body;
}

export interface PropertyRow {
  /** dotted SectionProperties path */
  key: string;
  symbol: string;
  name: string;
}

/** Row order and wording; PROPERTY_QUANTITIES (units.ts) says which unit each one takes. */
export const PROPERTY_ROWS: readonly PropertyRow[] = [
  { key: "area", symbol: "A", name: "Area" },
  { key: "massPerMetre", symbol: "m", name: "Mass per length" },
  { key: "centroid.z", symbol: "z̄", name: "Centroid from the left edge" },
  { key: "centroid.y", symbol: "ȳ", name: "Centroid from the bottom edge" },
  { key: "extremes.top", symbol: "c_top", name: "Centroid to top fibre" },
  { key: "extremes.bottom", symbol: "c_bot", name: "Centroid to bottom fibre" },
  { key: "extremes.left", symbol: "c_left", name: "Centroid to left fibre" },
  { key: "extremes.right", symbol: "c_right", name: "Centroid to right fibre" },
  { key: "Iz", symbol: "Iz", name: "Second moment about the horizontal centroidal axis" },
  { key: "Iy", symbol: "Iy", name: "Second moment about the vertical centroidal axis" },
  { key: "Iyz", symbol: "Iyz", name: "Product of inertia ∫yz dA" },
  { key: "principal.I1", symbol: "I1", name: "Major principal second moment" },
  { key: "principal.I2", symbol: "I2", name: "Minor principal second moment" },
  { key: "principal.angleDeg", symbol: "θp", name: "Angle from z to the I1 axis (counter-clockwise)" },
  { key: "Sz.top", symbol: "Sz,top", name: "Elastic modulus, top fibre" },
  { key: "Sz.bottom", symbol: "Sz,bot", name: "Elastic modulus, bottom fibre" },
  { key: "Sy.left", symbol: "Sy,left", name: "Elastic modulus, left fibre" },
  { key: "Sy.right", symbol: "Sy,right", name: "Elastic modulus, right fibre" },
  { key: "Zz", symbol: "Zz", name: "Plastic modulus about the equal-area horizontal axis" },
  { key: "Zy", symbol: "Zy", name: "Plastic modulus about the equal-area vertical axis" },
  { key: "rz", symbol: "rz", name: "Radius of gyration about z" },
  { key: "ry", symbol: "ry", name: "Radius of gyration about y" },
  { key: "Qz", symbol: "Qz", name: "First moment of the area above the neutral axis" },
  { key: "widthAtNeutralAxis", symbol: "b_NA", name: "Material width cut by the neutral axis" },
  { key: "J", symbol: "J", name: "Torsion constant" },
];

/** properties.stability (member-checks.md §1), the constants lateral-torsional buckling uses; units from STABILITY_QUANTITIES. */
export const STABILITY_ROWS: readonly PropertyRow[] = [
  { key: "stability.h0", symbol: "h0", name: "Distance between the flanges' mid-thickness lines" },
  { key: "stability.shearCentre.z", symbol: "z_sc", name: "Shear centre from the left edge" },
  { key: "stability.shearCentre.y", symbol: "y_sc", name: "Shear centre from the bottom edge" },
  { key: "stability.Cw", symbol: "Cw", name: "Warping constant" },
  { key: "stability.betaX", symbol: "βx", name: "Wagner coefficient for unequal flanges; > 0 when the top flange is the larger" },
  { key: "stability.J", symbol: "J_LTB", name: "Torsion constant used for lateral-torsional buckling" },
];

const J_METHOD_WORDS: Record<SectionProperties["Jmethod"], string> = {
  "open-thin-walled": "open thin-walled, Σ b·t³/3",
  "closed-bredt": "closed cell, Bredt's formula",
  "polygon-approximate": "approximate (polygon outline)",
};

export function propertyValue(p: SectionProperties, key: string): number {
  let v: unknown = p;
  for (const k of key.split(".")) v = v && typeof v === "object" ? (v as Record<string, unknown>)[k] : undefined;
  return typeof v === "number" ? v : NaN;
}

/** A symbol like "Sz,top" with its subscript set as a subscript. */
function Symbol({ text }: { text: string }) {
  const m = /^([A-Za-zθ]\u0304?)(?:_)?(.*)$/.exec(text);
  if (!m || !m[2]) return <span>{text}</span>;
  return (
    <span>
      {m[1]}
      <sub>{m[2]}</sub>
    </span>
  );
}

export function PropertyTable({
  properties,
  units,
  caption = "Section properties (centroidal axes)",
  className = "",
}: {
  /** in SI, as the engine returns them */
  properties: SectionProperties;
  units: UnitSystem;
  caption?: string;
  className?: string;
}) {
  return (
    <TableScroll>
    <table className={`w-full border-collapse text-sm ${className}`}>
      <caption className="mb-2 text-left text-base font-bold">{caption}</caption>
      <thead>
        <tr className="border-b border-ink/30 text-left">
          <th scope="col" className="py-1 pr-2 font-semibold">Symbol</th>
          <th scope="col" className="py-1 pr-2 font-semibold">Property</th>
          <th scope="col" className="py-1 text-right font-semibold">Value</th>
        </tr>
      </thead>
      <tbody>
        {PROPERTY_ROWS.map((row) => {
          const q = PROPERTY_QUANTITIES[row.key]!;
          return (
            <tr key={row.key} data-property={row.key} className="border-b border-ink/10 align-top">
              <th scope="row" className="py-1 pr-2 font-semibold whitespace-nowrap">
                <Symbol text={row.symbol} />
              </th>
              <td className="py-1 pr-2">
                {row.name}
                {row.key === "J" ? <span className="block text-xs text-ink/70">{J_METHOD_WORDS[properties.Jmethod]}</span> : null}
              </td>
              <td className="py-1 text-right tabular-nums whitespace-nowrap" data-value>
                {formatQuantity(q, propertyValue(properties, row.key), units)}
              </td>
            </tr>
          );
        })}
        <tr className="border-b border-ink/30">
          <th scope="rowgroup" colSpan={3} className="pt-3 pb-1 text-left font-semibold">
            Stability constants (lateral-torsional buckling; thin-walled midline model)
          </th>
        </tr>
        {properties.stability ? (
          STABILITY_ROWS.map((row) => (
            <tr key={row.key} data-property={row.key} className="border-b border-ink/10 align-top">
              <th scope="row" className="py-1 pr-2 font-semibold whitespace-nowrap">
                <Symbol text={row.symbol} />
              </th>
              <td className="py-1 pr-2">{row.name}</td>
              <td className="py-1 text-right tabular-nums whitespace-nowrap" data-value>
                {formatQuantity(STABILITY_QUANTITIES[row.key]!, propertyValue(properties, row.key), units)}
              </td>
            </tr>
          ))
        ) : (
          <tr data-property="stability">
            <td colSpan={3} className="py-1 text-ink/70">
              Not defined for this section: stability constants are given for the I (equal or unequal flanges), channel, tee, box and rectangle families only.
            </td>
          </tr>
        )}
      </tbody>
    </table>
    </TableScroll>
  );
}

export default PropertyTable;

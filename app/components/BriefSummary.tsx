// A brief's values with their units, read-only (option page and calculation record).
import type { SearchProblem } from "~/optimizer/search-schema";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { formatNumber } from "~/components/PropertyTable";
import { FIELD_QUANTITIES, type NumericField } from "~/lib/brief-form";

export function BriefSummary({ problem, units }: { problem: SearchProblem; units: UnitSystem }) {
  const q = (field: NumericField, v: number | undefined) => (v === undefined ? "—" : `${formatNumber(fromSI(FIELD_QUANTITIES[field], v, units))} ${unitLabel(FIELD_QUANTITIES[field], units)}`);
  const axis = (name: "depth" | "width") => `${q(`${name}.min`, problem[name].min)} to ${q(`${name}.max`, problem[name].max)}, step ${q(`${name}.step`, problem[name].step)}`;
  const s = problem.slenderness ?? {};
  const rows: [string, string][] = [
    ["Sagging moment", q("moment.sagging", problem.moment.sagging)],
    ["Hogging moment", q("moment.hogging", problem.moment.hogging)],
    ["Shear force", q("shear", problem.shear)],
    ["Allowable tension", q("allowable.tension", problem.allowable?.tension)],
    ["Allowable compression", q("allowable.compression", problem.allowable?.compression)],
    ["Allowable shear", q("allowable.shear", problem.allowable?.shear)],
    ["Depth", axis("depth")],
    ["Width", axis("width")],
    ["Plate thicknesses", `${problem.thicknesses.map((t) => formatNumber(fromSI("length", t, units))).join(", ")} ${unitLabel("length", units)}`],
    ["Families", problem.families.join(", ")],
    ["Slenderness limits (b/t)", Object.entries(s).map(([k, v]) => `${k} ${v}`).join(", ") || "none"],
    ["Density", q("density", problem.density)],
    [
      "Objective",
      problem.objective === "cost"
        ? `cheapest; prices per kg: ${(problem.prices ?? []).map((x) => `${formatNumber(fromSI("length", x.thickness, units))} ${unitLabel("length", units)} → ${x.pricePerKg}`).join(", ")}`
        : "lightest (least mass per length)",
    ],
    [
      "Deflection",
      problem.deflection
        ? `span ${q("deflection.span", problem.deflection.span)}, service load ${q("deflection.serviceLoad", problem.deflection.serviceLoad)}, limit span/${problem.deflection.limitRatio}, E ${q("deflection.E", problem.deflection.E)}`
        : "not checked",
    ],
  ];
  return (
    <table className="w-full border-collapse text-sm" data-testid="brief-summary">
      <tbody>
        {rows.map(([k, v]) => (
          <tr key={k} className="border-b border-ink/10 align-top">
            <th scope="row" className="py-1 pr-2 text-left font-semibold">
              {k}
            </th>
            <td className="py-1 tabular-nums">{v}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

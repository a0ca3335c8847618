// A brief's values with their units, read-only (option page and calculation record).
import { familyLabel } from "~/lib/labels";
import type { SearchProblem } from "~/optimizer/search-schema";
import { SHAPE_WORDS } from "~/optimizer";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { formatNumber } from "~/components/PropertyTable";
import { FIELD_QUANTITIES, type NumericField } from "~/lib/brief-form";
import { TableScroll } from "~/components/DataTable";

const SLENDERNESS_WORDS: Record<string, string> = { outstand: "flange outstand", internal: "internal plate", web: "web", stem: "stem" };

export function BriefSummary({ problem, units }: { problem: SearchProblem; units: UnitSystem }) {
  const q = (field: NumericField, v: number | undefined) => (v === undefined ? "—" : `${formatNumber(fromSI(FIELD_QUANTITIES[field], v, units))} ${unitLabel(FIELD_QUANTITIES[field], units)}`);
  const axis = (name: "depth" | "width") => `${q(`${name}.min`, problem[name].min)} to ${q(`${name}.max`, problem[name].max)}, step ${q(`${name}.step`, problem[name].step)}`;
  const s = problem.slenderness ?? {};
  const en = problem.basis === "en1993";
  const st = problem.steel;
  const r = problem.restraint;
  const fab = problem.fabrication;
  const L = (x: number) => `${formatNumber(fromSI("length", x, units))} ${unitLabel("length", units)}`;
  const S = (x: number) => `${formatNumber(fromSI("stress", x, units))} ${unitLabel("stress", units)}`;
  const basisRows: [string, string][] = en
    ? [
        ["Design basis", "EN 1993 limit states (factored design actions)"],
        [
          "Steel",
          st
            ? `${st.grade ? `${st.grade}: ` : ""}fy ${st.fy.map((b) => `${S(b.fy)} to ${L(b.maxThickness)}`).join(", ")}; fu ${S(st.fu)}; E ${S(st.E)}; G ${S(st.G)}`
            : "—",
        ],
        ["Partial factors", st ? `γM0 ${st.gammaM0}, γM1 ${st.gammaM1}, γM2 ${st.gammaM2}; η ${st.eta}; βw ${st.betaW}` : "—"],
        [
          "Lateral-torsional restraint",
          r ? `${q("restraint.length", r.length)} between restraints; C1 ${r.C1}, C2 ${r.C2}, C3 ${r.C3}; load at the ${r.loadAt === "shearCentre" ? "shear centre" : `${r.loadAt} flange`}` : "compression flange restrained throughout",
        ],
        [
          "Supports",
          problem.supports?.stiffened === false
            ? `no bearing stiffeners (patch loading checked${problem.supports.bearingLength !== undefined ? `, stiff bearing ${q("supports.bearingLength", problem.supports.bearingLength)}` : ""})`
            : "bearing stiffeners at both supports",
        ],
      ]
    : problem.basis === "aisc360"
      ? [
          ["Design basis", `AISC 360-16, ${problem.method ?? "—"} (${problem.method === "LRFD" ? "factored required strengths, φ·Rn" : "ASD required strengths, Rn/Ω"})`],
          ["Steel", problem.aisc ? `${problem.aisc.grade ? `${problem.aisc.grade}: ` : ""}Fy ${S(problem.aisc.Fy)}; Fu ${S(problem.aisc.Fu)}; E ${S(problem.aisc.E)}; G ${S(problem.aisc.G)}; FEXX ${S(problem.aisc.FEXX)}` : "—"],
          ["Unbraced length", r ? `Lb ${q("restraint.length", r.length)}, Cb ${r.Cb ?? 1}` : "compression flange braced throughout"],
          [
            "Supports",
            problem.supports?.stiffened === false
              ? `no bearing stiffeners (J10.2, J10.3 checked${problem.supports.bearingLength !== undefined ? `, bearing length ${q("supports.bearingLength", problem.supports.bearingLength)}` : ""})`
              : "bearing stiffeners at both supports",
          ],
        ]
      : [
        ["Design basis", "allowable stresses (stresses only: no stability checks)"],
        ["Allowable tension", q("allowable.tension", problem.allowable?.tension)],
        ["Allowable compression", q("allowable.compression", problem.allowable?.compression)],
        ["Allowable shear", q("allowable.shear", problem.allowable?.shear)],
      ];
  const fabText = fab
    ? [
        fab.minThickness !== undefined ? `plates ≥ ${q("fabrication.minThickness", fab.minThickness)}` : null,
        fab.flangeAtLeastWeb ? "flange ≥ web thickness" : null,
        fab.minBoxClear !== undefined ? `box clear width ≥ ${q("fabrication.minBoxClear", fab.minBoxClear)}` : null,
      ]
        .filter(Boolean)
        .join("; ")
    : "";
  const rows: [string, string][] = [
    ["Sagging moment", q("moment.sagging", problem.moment.sagging)],
    ["Hogging moment", q("moment.hogging", problem.moment.hogging)],
    ["Shear force", q("shear", problem.shear)],
    ...basisRows,
    ["Fabrication rules", fabText || "none"],
    ["Depth", axis("depth")],
    ["Width", axis("width")],
    ["Plate thicknesses", `${problem.thicknesses.map((t) => formatNumber(fromSI("length", t, units))).join(", ")} ${unitLabel("length", units)}`],
    ["Shape families", problem.families.map(familyLabel).join(", ")],
    [
      "Catalogues searched",
      // each by the name it was searched under, its section count and any shapes it was cut to
      (problem.catalogues ?? [])
        .map((c) => `${c.name}: ${c.sections.length} section${c.sections.length === 1 ? "" : "s"}${c.shapes?.length ? ` (only ${c.shapes.map((x) => SHAPE_WORDS[x]).join("; ")})` : ""}`)
        .join(" · ") || "none (plate families only)",
    ],
    ["Slenderness limits (b/t)", Object.entries(s).filter(([, v]) => v !== undefined).map(([k, v]) => `${SLENDERNESS_WORDS[k] ?? k} ${v}`).join(", ") || "none"],
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
    <TableScroll>
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
    </TableScroll>
  );
}

// The calculation record's deflection check worked through (every basis): the formula, the
// numbers the engine evaluated it with (CandidateVerdict.deflectionWorking: w, L, E, the I it
// divided by, δ and the limit) and, for an unsymmetric section, the vertical and sideways parts.
// Worked in SI, the engine's units; a US customary record also gets the results in brackets.
import type { CandidateVerdict } from "~/optimizer/checks";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { formatNumber } from "~/components/PropertyTable";

const n = (x: number, sig = 4) => formatNumber(x, sig);
/** a factor inside a product: powers of ten in brackets */
const f = (x: number) => {
  const t = formatNumber(x);
  return t.includes("×") ? `(${t})` : t;
};

export function DeflectionWorked({ verdict, units }: { verdict: CandidateVerdict; units: UnitSystem }) {
  const w = verdict.deflectionWorking;
  if (!w) return null;
  const c = verdict.checks.find((x) => x.name === "deflection");
  const parts = verdict.deflection;
  const inclined = parts !== undefined && parts.sideways > 0;
  const also = (x: number) => (units === "us" ? ` (${n(fromSI("length", x, units))} ${unitLabel("length", units)})` : "");
  return (
    <section aria-labelledby="deflection-h" className="mt-3 text-sm" data-testid="record-deflection">
      <h3 id="deflection-h" className="font-semibold">
        Deflection under the service load (simply supported, uniform load)
      </h3>
      <p>
        δ = 5·w·L⁴/(384·E·I) = 5 × {n(w.w)} N/mm × {f(w.L)}⁴ mm⁴ ÷ (384 × {f(w.E)} MPa × {f(w.I)} mm⁴) = <strong>{n(w.delta)} mm</strong>
        {also(w.delta)}; limit L/{n(w.limitRatio)} = {n(w.L)}/{n(w.limitRatio)} = <strong>{n(w.limit)} mm</strong>
        {also(w.limit)}; δ/limit = <strong>{c ? c.utilisation.toFixed(3) : "—"}</strong>
      </p>
      {inclined ? (
        <p>
          The section is unsymmetric and bends about an inclined axis: I = (Iz·Iy − Iyz²)/√(Iy² + Iyz²), the second moment that gives the total movement; vertical {n(parts.vertical)} mm, sideways{" "}
          {n(parts.sideways)} mm, total √(vertical² + sideways²) = {n(parts.total)} mm.
        </p>
      ) : null}
    </section>
  );
}

// The calculation record's checks shared by the bases, worked through from the numbers the engine
// evaluated them with: the deflection (every basis; CandidateVerdict.deflectionWorking: w, L, E,
// the I it divided by, δ and the limit; an unsymmetric section's vertical and sideways parts) and
// the allowable basis's shear stress (shearWorking: where V·Q/(Iz·b) is largest, Q, b, Iz, τ) and
// the brief's plate slenderness limits (slendernessWorking: each element's b and t, b/t, the limit).
// Worked in SI, the engine's units; a US customary record also gets the results in brackets.
import type { CandidateVerdict } from "~/optimizer/checks";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { Clause, Step, f, n } from "~/components/Worked";

export function ShearWorked({ verdict, units }: { verdict: CandidateVerdict; units: UnitSystem }) {
  const s = verdict.shearWorking;
  const c = verdict.checks.find((x) => x.name === "shear");
  if (!s || !c) return null;
  return (
    <section aria-labelledby="shear-worked-h" className="mt-3 text-sm" data-testid="record-shear">
      <h3 id="shear-worked-h" className="font-semibold">
        Shear stress τ = V·Q/(Iz·b), at its largest over the depth
      </h3>
      <p>
        Largest at y = {n(s.y)} mm above the bottom edge, where Q = {n(s.Q)} mm³ (the area above y about the neutral axis) and b = {n(s.b)} mm: τ = {n(s.V)} kN × 10³ N × {f(s.Q)} mm³ ÷ ({f(s.Iz)}{" "}
        mm⁴ × {n(s.b)} mm) = <strong>{n(s.tau)} MPa</strong>
        {units === "us" ? ` (${n(fromSI("stress", s.tau, units))} ${unitLabel("stress", units)})` : ""}; allowable {n(c.capacity)} MPa; τ/allowable = <strong>{c.utilisation.toFixed(3)}</strong>
      </p>
    </section>
  );
}

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

export function SlendernessWorked({ verdict }: { verdict: CandidateVerdict }) {
  const els = verdict.slendernessWorking;
  if (!els) return null;
  return (
    <section aria-labelledby="slenderness-h" className="mt-3 text-sm" data-testid="record-slenderness">
      <h3 id="slenderness-h" className="font-semibold">
        Plate slenderness b/t against the brief's limits
      </h3>
      {els.map((e, i) => {
        const c = verdict.checks.find((x) => x.name === e.name);
        return (
          <Step key={i} testid={`record-slenderness-${i}`}>
            {e.element}: width b = {e.widthSymbols} = {n(e.b)} mm, thickness t = {e.thicknessSymbols} = {n(e.t)} mm; b/t = {n(e.b)}/{n(e.t)} = <strong>{n(e.ratio)}</strong> {e.ratio <= e.limit ? "≤" : ">"} limit{" "}
            {n(e.limit)}
            {c ? <Clause>{c.clause}</Clause> : null}
            {e.governs && c ? (
              <>
                ; b/t ÷ limit = <strong>{c.utilisation.toFixed(3)}</strong>
              </>
            ) : (
              "; not the largest of its kind"
            )}
          </Step>
        );
      })}
    </section>
  );
}

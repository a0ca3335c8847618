// The design basis beside every result (member-checks.md §3): a one-line note naming the basis
// ("stresses only: no stability checks" under the allowable basis), the brief's assumptions in
// words, and one candidate's EN 1993 figures (class, Mcr, χLT, resistances, weld throat, the
// governing check and its clause). Numbers come from the engine's verdict; units via units.ts.
import { checkLabel } from "~/lib/labels";
import type { CandidateVerdict } from "~/optimizer/checks";
import type { SearchProblem } from "~/optimizer/search-schema";
import { fromSI, unitLabel, type UnitSystem } from "~/optimizer/units";
import { formatNumber, formatQuantity } from "~/components/PropertyTable";
import { STRESSES_ONLY } from "~/lib/caution";
import { matchMomentDiagram, MOMENT_DIAGRAM_SOURCE } from "~/lib/moment-diagrams";
import { designRow, isAiscRow, isEnRow } from "~/lib/design-summary";

/** The basis in a few words, for headings beside results. */
export function basisWords(problem: Pick<SearchProblem, "basis">): string {
  return problem.basis === "en1993" ? "EN 1993 limit states" : problem.basis === "aisc360" ? `AISC 360-16 ${(problem as { method?: string }).method ?? ""}`.trimEnd() : `allowable stresses — ${STRESSES_ONLY}`;
}

const LOAD_WORDS = { top: "on the top flange", shearCentre: "at the shear centre", bottom: "on the bottom flange" } as const;

/**
 * Every assumption of the brief in words (restraint, load position, stiffeners at supports,
 * fabrication rules), in the page's units. The stated simplifications are the engine's own
 * notes on each candidate (DesignBlock.notes), listed beside the candidate.
 */
export function assumptionsInWords(problem: SearchProblem, units: UnitSystem): string[] {
  if (problem.basis === "aisc360") {
    const r = problem.restraint;
    const a = problem.aisc;
    return [
      `Design basis: AISC 360-16, ${problem.method === "LRFD" ? "LRFD (available strength φ·Rn; the moments and shear are factored required strengths)" : "ASD (available strength Rn/Ω; the moments and shear are ASD required strengths)"}.`,
      a ? `Steel${a.grade ? ` ${a.grade}` : ""}: Fy ${formatQuantity("stress", a.Fy, units)}, Fu ${formatQuantity("stress", a.Fu, units)}, E ${formatQuantity("stress", a.E, units)}; catalogue sections ${a.rolledGrade}.` : "",
      r ? `Unbraced length Lb ${formatQuantity("length", r.length * 1000, units)}, Cb ${r.Cb ?? 1}.` : "Compression flange braced throughout: no lateral-torsional buckling check.",
      problem.supports?.stiffened === false ? "No bearing stiffeners: web local yielding and crippling checked at an end support (J10.2, J10.3)." : "Bearing stiffeners at both supports (assumed, not designed).",
      ...fabricationWords(problem, units),
    ].filter(Boolean);
  }
  if (problem.basis !== "en1993") {
    return [
      `Design basis: allowable stresses (${STRESSES_ONLY}). The elastic fibre stresses and the shear stress are compared with the typed allowables; no buckling of any kind and no resistance to EN 1993 or any other code is checked.`,
      ...fabricationWords(problem, units),
    ];
  }
  const L = (x: number) => formatQuantity("length", x, units);
  const S = (x: number) => formatQuantity("stress", x, units);
  const out: string[] = ["Design basis: EN 1993 limit states. The moments and shear are factored design values (ultimate limit state) of one load case."];
  const st = problem.steel;
  if (st) {
    const bands = st.fy.map((b) => `${S(b.fy)} up to ${L(b.maxThickness)}`).join(", ");
    out.push(
      `Steel${st.grade ? ` ${st.grade}` : ""}: fy ${bands}, taken from the band holding each section's thickest plate; fu ${S(st.fu)}; E ${S(st.E)}, G ${S(st.G)}; γM0 ${st.gammaM0}, γM1 ${st.gammaM1}, γM2 ${st.gammaM2}; η ${st.eta}; βw ${st.betaW}.`,
    );
  }
  const r = problem.restraint;
  if (r) {
    const d = matchMomentDiagram(r.C1, r.C2, r.C3);
    out.push(
      `Lateral-torsional restraint: the compression flange is restrained laterally at most ${formatQuantity("span", r.length, units)} apart; ` +
        `moment diagram ${d ? `“${d.label}”, ` : ""}C1 = ${r.C1}, C2 = ${r.C2}, C3 = ${r.C3}${d ? ` (${MOMENT_DIAGRAM_SOURCE})` : " (typed by the engineer)"}; the load acts ${LOAD_WORDS[r.loadAt]}.`,
    );
  } else out.push("Lateral-torsional restraint: the compression flange is taken as restrained throughout its length, so lateral-torsional buckling is not checked. That restraint must be provided.");
  const sup = problem.supports;
  if (sup?.stiffened === false)
    out.push(
      `Supports: no bearing stiffeners; the web is checked for patch loading at an end support (EN 1993-1-5 §6) with the reaction equal to the design shear${sup.bearingLength !== undefined ? ` over a stiff bearing of ${L(sup.bearingLength)}` : ""}.`,
    );
  else out.push("Supports: bearing stiffeners are required at both supports (assumed provided); web crippling at the supports is therefore not checked.");
  return [...out, ...fabricationWords(problem, units)];
}

function fabricationWords(problem: SearchProblem, units: UnitSystem): string[] {
  const f = problem.fabrication;
  if (!f) return [];
  const L = (x: number) => formatQuantity("length", x, units);
  const rules = [
    f.minThickness !== undefined ? `no plate thinner than ${L(f.minThickness)}` : null,
    f.flangeAtLeastWeb ? "each flange at least as thick as the web" : null,
    f.minBoxClear !== undefined ? `boxes at least ${L(f.minBoxClear)} clear between their webs` : null,
  ].filter(Boolean);
  return rules.length ? [`Fabrication rules: ${rules.join("; ")} (shapes breaking them were left out of the search).`] : [];
}

/** One line naming the basis; under "allowable" it says "stresses only: no stability checks". */
export function BasisNote({ problem, className = "" }: { problem: Pick<SearchProblem, "basis">; className?: string }) {
  const en = problem.basis === "en1993" || problem.basis === "aisc360";
  return (
    <p data-testid="basis-note" data-basis={problem.basis ?? "allowable"} className={`text-sm ${en ? "" : "font-semibold text-caution"} ${className}`}>
      Design basis: {basisWords(problem)}
    </p>
  );
}

/** The brief's assumptions as a list (and, when given, the engine's stated simplifications). */
export function Assumptions({ problem, units, notes, heading = "Assumptions" }: { problem: SearchProblem; units: UnitSystem; notes?: string[]; heading?: string }) {
  return (
    <section aria-label={heading} className="text-sm" data-testid="assumptions">
      <h3 className="font-semibold">{heading}</h3>
      <ul className="list-disc space-y-0.5 pl-5">
        {assumptionsInWords(problem, units).map((a) => (
          <li key={a}>{a}</li>
        ))}
      </ul>
      {notes?.length ? (
        <>
          <h4 className="mt-2 font-semibold">Stated simplifications</h4>
          <ul className="list-disc space-y-0.5 pl-5" data-testid="simplifications">
            {notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        </>
      ) : null}
    </section>
  );
}

/** One candidate's design figures under its basis (a definition list); under the allowable basis, the basis note. */
export function DesignFigures({ verdict, units }: { verdict: CandidateVerdict; units: UnitSystem }) {
  const row = designRow(verdict);
  if (isAiscRow(row)) {
    const asd = row.method === "ASD";
    // Lp and Lr as spans (m, ft), as AISC tables give them
    const len = (x: number | null) => (x === null ? "—" : formatQuantity("span", x / 1000, units));
    return (
      <dl className="grid grid-cols-2 gap-x-2 tabular-nums" data-testid="design-figures-aisc">
        <dt>Method</dt>
        <dd>{row.method}</dd>
        <dt>Chapter F</dt>
        <dd>{row.section ? `§${row.section}` : "—"}</dd>
        <dt>Mn</dt>
        <dd>{row.Mn === null ? "—" : formatQuantity("moment", row.Mn, units)}</dd>
        <dt>{asd ? "Mn/Ωb" : "φbMn"}</dt>
        <dd>{row.MnAvailable === null ? "—" : formatQuantity("moment", row.MnAvailable, units)}</dd>
        <dt>LTB zone</dt>
        <dd>{row.zone ?? "braced throughout"}</dd>
        <dt>Lp, Lr</dt>
        <dd>{row.Lp === null && row.Lr === null ? "—" : `${len(row.Lp)}, ${len(row.Lr)}`}</dd>
        <dt>Cb</dt>
        <dd>{row.Cb === null ? "—" : formatNumber(row.Cb, 4)}</dd>
        <dt>{asd ? "Vn/Ωv" : "φvVn"}</dt>
        <dd>{row.VnAvailable === null ? "—" : formatQuantity("force", row.VnAvailable, units)}</dd>
        <dt>Weld leg w</dt>
        <dd>{row.weldLeg === null ? "— (no welds)" : formatQuantity("length", row.weldLeg, units)}</dd>
        <dt>Governs</dt>
        <dd>
          {row.limitState} <span className="text-xs text-ink/70">({row.governingClause})</span>
        </dd>
      </dl>
    );
  }
  if (!isEnRow(row)) return <p className="text-sm font-semibold text-caution">Design basis: allowable stresses — {STRESSES_ONLY}</p>;
  const M = (x: number | null) => (x === null ? "—" : formatQuantity("moment", x, units));
  const V = (x: number | null) => (x === null ? "—" : formatQuantity("force", x, units));
  return (
    <dl className="grid grid-cols-2 gap-x-2 tabular-nums" data-testid="design-figures">
      <dt>Class</dt>
      <dd data-testid="design-class">{row.sectionClass}</dd>
      <dt>Mcr</dt>
      <dd data-testid="design-mcr">{row.Mcr === null ? "no LTB check (restrained)" : M(row.Mcr)}</dd>
      <dt>λLT / χLT</dt>
      <dd data-testid="design-chi">{row.chiLT === null ? "—" : `${formatNumber(row.lambdaLT!, 3)} / ${formatNumber(row.chiLT, 3)}`}</dd>
      <dt>Mc,Rd</dt>
      <dd>{M(row.McRd)}</dd>
      <dt>Mb,Rd</dt>
      <dd>{M(row.MbRd)}</dd>
      <dt>VRd</dt>
      <dd>{V(row.VRd)}</dd>
      <dt>Weld throat a</dt>
      <dd data-testid="design-weld">{row.weldThroat === null ? "— (no welds)" : `${formatNumber(fromSI("length", row.weldThroat, units))} ${unitLabel("length", units)}`}</dd>
      <dt>Governs</dt>
      <dd>
        {checkLabel(verdict.governing)} <span className="text-xs text-ink/70">({row.governingClause})</span>
      </dd>
    </dl>
  );
}

// The calculation record's EN 1993 part (member-checks.md §2–§3): the design basis and its
// inputs, then every check worked through the way the record works the flexure formula:
// the expression with its symbols, the numbers put in, the result and the clause.
// Every number printed is the engine's own: the DesignBlock of candidateChecks (fy, ε, class
// and c/t per element, W, Mc,Rd, Mcr, λLT, ΦLT, χLT, Mb,Rd, Av, Vpl,Rd, λw, χw, Vb,Rd, ρ, MV,Rd,
// q, fvw,d, a) and the inputs it used (the brief's steel and restraint, the section properties
// with their stability constants). Nothing is recomputed here, only set out.
//
// Worked in SI, EN 1993's own units (mm, N, MPa, kN·m); a US customary brief also gets each
// result in its own units in brackets, so the substituted numbers read as the code writes them.
import { checkLabel } from "~/lib/labels";
import type { CandidateVerdict } from "~/optimizer/checks";
import type { ClassifiedElement, DesignBlock, LtbDesign } from "~/optimizer/design-types";
import type { Family } from "~/optimizer/geometry";
import type { SectionProperties } from "~/optimizer/properties";
import type { SearchProblem } from "~/optimizer/search-schema";
import type { UnitSystem } from "~/optimizer/units";
import { Also, Clause, Step, f, n } from "~/components/Worked";
import { CheckTable } from "~/components/CheckTable";
import { matchMomentDiagram, MOMENT_DIAGRAM_SOURCE } from "~/lib/moment-diagrams";
import { TableScroll } from "~/components/DataTable";

const PART_WORDS: Record<ClassifiedElement["part"], string> = {
  outstand: "outstand flange in compression",
  internal: "internal part in compression",
  web: "web in bending",
  stem: "tee stem (as an outstand)",
};

const LOAD_WORDS = { top: "top flange", shearCentre: "shear centre", bottom: "bottom flange" } as const;

/** 5. The design basis and its inputs. */
export function En1993Inputs({ problem, design, units }: { problem: SearchProblem; design: DesignBlock; units: UnitSystem }) {
  const st = problem.steel!;
  const r = problem.restraint;
  const sup = problem.supports;
  const fab = problem.fabrication;
  const band = st.fy.find((b) => b.fy === design.fy && design.fyPlate <= b.maxThickness);
  const diagram = r ? matchMomentDiagram(r.C1, r.C2, r.C3) : undefined;
  return (
    <div className="space-y-1 text-sm" data-testid="record-basis">
      <p>
        <strong>Design basis: EN 1993 limit states.</strong> The moments (sagging {n(problem.moment.sagging)} kN·m, hogging {n(problem.moment.hogging)} kN·m) and the shear (
        {n(problem.shear ?? 0)} kN) are factored design values of one load case (ultimate limit state).
      </p>
      <p>
        Steel {st.grade ?? "(own values)"}: yield strength by plate thickness{" "}
        {st.fy.map((b, i) => (
          <span key={i}>
            {i ? "; " : ""}t ≤ {n(b.maxThickness)} mm: fy = {n(b.fy)} MPa
          </span>
        ))}
        <Clause>EN 10025-2 (values as the brief states them)</Clause>; fu = {n(st.fu)} MPa; E = {n(st.E)} MPa; G = {n(st.G)} MPa<Clause>EN 1993-1-1 §3.2.6</Clause>.
      </p>
      <Step testid="record-fy">
        fy used: the section's thickest plate is t = {n(design.fyPlate)} mm{band ? `, which the band t ≤ ${n(band.maxThickness)} mm holds` : ""}, so fy = <strong>{n(design.fy)} MPa</strong> (one fy for the whole section, from its
        thickest plate); ε = √(235/fy) = √(235/{n(design.fy)}) = <strong>{n(design.epsilon, 4)}</strong>
        <Clause>EN 1993-1-1 Table 5.2</Clause>
      </Step>
      <p>
        Partial factors γM0 = {st.gammaM0}, γM1 = {st.gammaM1}<Clause>EN 1993-1-1 §6.1</Clause>, γM2 = {st.gammaM2}
        <Clause>EN 1993-1-8 §2.2</Clause>; η = {st.eta}
        <Clause>EN 1993-1-5 §5.1</Clause>; βw = {st.betaW}
        <Clause>EN 1993-1-8 Table 4.1</Clause>.
      </p>
      <p data-testid="record-restraint">
        {r ? (
          <>
            Lateral-torsional restraint: compression flange restrained at most L = {n(r.length)} m apart
            <Also q="span" x={r.length} units={units} />; moment diagram {diagram ? `“${diagram.label}” ` : "(typed) "}C1 = {r.C1}, C2 = {r.C2}, C3 = {r.C3}
            {diagram ? ` (${MOMENT_DIAGRAM_SOURCE})` : ""}; load applied at the {LOAD_WORDS[r.loadAt]}.
          </>
        ) : (
          "Lateral-torsional restraint: the compression flange is taken as restrained throughout its length; lateral-torsional buckling is therefore not checked, and that restraint must be provided."
        )}
      </p>
      <p data-testid="record-supports">
        {sup?.stiffened === false
          ? `Supports: no bearing stiffeners; the unstiffened web is checked for patch loading at an end support${sup.bearingLength !== undefined ? ` over a stiff bearing ss = ${n(sup.bearingLength)} mm` : ""}, the reaction taken as the design shear (EN 1993-1-5 §6).`
          : "Supports: bearing stiffeners are required at both supports (assumed provided, not designed here); web crippling at the supports is therefore not checked."}
      </p>
      <p>
        Fabrication rules:{" "}
        {fab && (fab.minThickness !== undefined || fab.flangeAtLeastWeb || fab.minBoxClear !== undefined)
          ? [
              fab.minThickness !== undefined ? `no plate under ${n(fab.minThickness)} mm` : null,
              fab.flangeAtLeastWeb ? "each flange at least as thick as the web" : null,
              fab.minBoxClear !== undefined ? `boxes at least ${n(fab.minBoxClear)} mm clear inside (b − 2·tw)` : null,
            ]
              .filter(Boolean)
              .join("; ")
          : "none"}
        .
      </p>
    </div>
  );
}

function LtbWorked({ l, design, problem, props, family, dims, units }: { l: LtbDesign; design: DesignBlock; problem: SearchProblem; props: SectionProperties; family: Family; dims: Record<string, number>; units: UnitSystem }) {
  const st = problem.steel!;
  const r = problem.restraint!;
  const s = props.stability;
  // L, Iz, Iw, It, C2·zg − C3·zj, h/b and the ratio are the engine's (LtbDesign), the values Mcr
  // was worked with: the page converts and computes none of them (issue 12, one source of truth).
  const a = l.zTerm;
  const narrow = family === "mono-i" ? Math.min(dims.bt, dims.bb) : dims.b;
  const curveWhy =
    l.hOverB !== null
      ? `h/b = ${n(dims.d)}/${n(narrow)} = ${n(l.hOverB, 3)} ${l.hOverB <= 2 ? "≤" : ">"} 2${family === "mono-i" ? " (b the narrower flange)" : ""}`
      : `${family}: every family but the I`;
  return (
    <div className="mt-2 space-y-0.5" data-testid={`record-ltb-${l.moment}`}>
      <p className="font-semibold">
        {l.moment === "sagging" ? "Sagging" : "Hogging"} moment MEd = {n(l.MEd)} kN·m (the {l.moment === "sagging" ? "top" : "bottom"} flange in compression)
      </p>
      <Step>
        zg = height of the load point ({LOAD_WORDS[r.loadAt]}) above the shear centre = <strong>{n(l.zg)} mm</strong>; zj = βc/2 with βc = {l.moment === "sagging" ? "βx" : "−βx"} ={" "}
        {s ? n(l.moment === "sagging" ? s.betaX : -s.betaX) : "—"} mm, zj = <strong>{n(l.zj)} mm</strong>
      </Step>
      <Step testid="record-mcr">
        Mcr = C1·(π²·E·Iz/L²)·[√(Iw/Iz + L²·G·It/(π²·E·Iz) + (C2·zg − C3·zj)²) − (C2·zg − C3·zj)] with Iz (minor axis) = {n(l.Iz)} mm⁴, Iw = Cw = {n(l.Iw)} mm⁶, It = J = {n(l.It)} mm⁴, L ={" "}
        {n(l.L)} mm, C2·zg − C3·zj = {r.C2}·{n(l.zg)} − {r.C3}·{n(l.zj)} = {n(a)} mm:
        <br />
        Mcr = {r.C1} × π² × {f(st.E)} × {f(l.Iz)} ÷ {f(l.L)}² × [√({f(l.Iw)}/{f(l.Iz)} + {f(l.L)}² × {f(st.G)} × {f(l.It)}/(π² × {f(st.E)} × {f(l.Iz)}) + ({n(a)})²) − ({n(a)})] ={" "}
        <strong>{n(l.Mcr)} kN·m</strong>
        <Also q="moment" x={l.Mcr} units={units} />
        <Clause>EN 1993-1-1 §6.3.2.2; three-factor formula (ENV 1993-1-1 Annex F)</Clause>
      </Step>
      <Step>
        λLT = √(W·fy/Mcr) = √({n(design.W ?? NaN)} mm³ × {n(design.fy)} MPa ÷ ({n(l.Mcr)} × 10⁶ N·mm)) = <strong>{n(l.lambdaLT, 4)}</strong>
        <Clause>EN 1993-1-1 §6.3.2.2(1)</Clause>
      </Step>
      <Step>
        Buckling curve {l.curve} ({curveWhy}), αLT = {l.alphaLT}
        <Clause>EN 1993-1-1 Tables 6.3 and 6.4</Clause>; ΦLT = 0.5·[1 + αLT·(λLT − 0.2) + λLT²] = 0.5 × [1 + {l.alphaLT} × ({n(l.lambdaLT, 4)} − 0.2) + {n(l.lambdaLT, 4)}²] ={" "}
        <strong>{n(l.phiLT, 4)}</strong>
      </Step>
      <Step testid="record-chi">
        χLT = min(1, 1/(ΦLT + √(ΦLT² − λLT²))) = 1/({n(l.phiLT, 4)} + √({n(l.phiLT, 4)}² − {n(l.lambdaLT, 4)}²)) = <strong>{n(l.chiLT, 4)}</strong>
      </Step>
      <Step>
        Mb,Rd = χLT·W·fy/γM1 = {n(l.chiLT, 4)} × {n(design.W ?? NaN)} mm³ × {n(design.fy)} MPa ÷ {st.gammaM1} = <strong>{n(l.MbRd)} kN·m</strong>
        <Also q="moment" x={l.MbRd} units={units} />; MEd/Mb,Rd = {n(l.MEd)}/{n(l.MbRd)} = <strong>{l.utilisation.toFixed(3)}</strong>
        <Clause>EN 1993-1-1 §6.3.2.1</Clause>
      </Step>
    </div>
  );
}

/** 6. Every EN 1993 check of the section worked through, then the check table and the engine's stated simplifications. */
export function En1993Checks({ problem, verdict, props, family, dims, units }: { problem: SearchProblem; verdict: CandidateVerdict; props: SectionProperties; family: Family; dims: Record<string, number>; units: UnitSystem }) {
  const d = verdict.design!;
  const st = problem.steel!;
  const V = problem.shear ?? 0;
  // ratios are the engine's utilisations (candidateChecks), printed as the check table prints them
  const util = (name: string) => verdict.checks.find((c) => c.name === name)?.utilisation.toFixed(3) ?? "—";
  const MEd = verdict.checks.find((c) => c.name === "bending-resistance")?.demand ?? NaN;
  const sh = d.shear;
  const nWebs = family === "box" ? 2 : 1;
  const avExpr: Record<string, string> = {
    i: "η·hw·tw",
    "mono-i": "η·hw·tw",
    channel: "η·hw·tw",
    box: "η·2·hw·tw",
    tee: "tw·(d − tf/2)",
    rectangle: "b·d (mem.)",
  };
  return (
    <div className="space-y-3 text-sm">
      <section aria-labelledby="class-h">
        <h3 id="class-h" className="font-semibold">
          6.1 Cross-section class<Clause>EN 1993-1-1 §5.5, Table 5.2</Clause>
        </h3>
        <TableScroll>
        <table className="mt-1 w-full border-collapse tabular-nums" data-testid="record-class">
          <thead>
            <tr className="border-b border-ink/30 text-right">
              <th className="py-1 text-left">Element</th>
              <th className="text-left">Table 5.2 part</th>
              <th>c (mm)</th>
              <th>t (mm)</th>
              <th>c/t</th>
              <th>limits class 1 / 2 / 3</th>
              <th>α, ψ</th>
              <th>class</th>
            </tr>
          </thead>
          <tbody>
            {d.elements.map((e, i) => (
              <tr key={i} className="border-b border-ink/10 text-right">
                <td className="py-1 text-left">
                  {e.element}
                  {e.under.length ? <span className="text-xs text-ink/70"> ({e.under.join(", ")})</span> : null}
                </td>
                <td className="text-left">{PART_WORDS[e.part]}</td>
                <td>{n(e.c)}</td>
                <td>{n(e.t)}</td>
                <td>{n(e.ratio)}</td>
                <td>{e.limits.map((x) => (Number.isFinite(x) ? n(x) : "none")).join(" / ")}</td>
                <td>{e.alpha !== undefined ? `α = ${n(e.alpha, 3)}, ψ = ${n(e.psi!, 3)}` : "—"}</td>
                <td className="font-semibold">{e.class}</td>
              </tr>
            ))}
          </tbody>
        </table>
        </TableScroll>
        <p className="mt-1">
          Limits with ε = {n(d.epsilon, 4)}: outstands 9ε, 10ε, 14ε; internal parts 33ε, 38ε, 42ε; webs 396ε/(13α − 1) or 36ε/α (class 1), 456ε/(13α − 1) or 41.5ε/α (class 2), 42ε/(0.67 + 0.33ψ) or
          62ε·(1 − ψ)·√(−ψ) (class 3). The section takes its worst element's class: <strong data-testid="record-section-class">class {d.sectionClass}</strong>
          {d.sectionClass === 4 ? " — outside this version: the section is excluded and not checked further." : "."}
        </p>
      </section>

      {d.McRd !== null && d.W !== null ? (
        <section aria-labelledby="bend-h">
          <h3 id="bend-h" className="font-semibold">
            6.2 Bending resistance<Clause>EN 1993-1-1 §6.2.5</Clause>
          </h3>
          <Step>
            W = {d.Wkind === "plastic" ? "Wpl = Zz (class 1 or 2)" : "Wel,min = min(Sz,top, Sz,bottom) (class 3)"} = <strong>{n(d.W)} mm³</strong>
          </Step>
          <Step testid="record-mcrd">
            Mc,Rd = W·fy/γM0 = {n(d.W)} mm³ × {n(d.fy)} MPa ÷ {st.gammaM0} = <strong>{n(d.McRd)} kN·m</strong>
            <Also q="moment" x={d.McRd} units={units} />; MEd = {n(MEd)} kN·m, MEd/Mc,Rd = <strong>{util("bending-resistance")}</strong>
          </Step>
        </section>
      ) : null}

      {d.sectionClass !== 4 ? (
        <section aria-labelledby="ltb-h">
          <h3 id="ltb-h" className="font-semibold">
            6.3 Lateral-torsional buckling<Clause>EN 1993-1-1 §6.3.2.2, general case</Clause>
          </h3>
          {d.ltb ? (
            d.ltb.map((l) => <LtbWorked key={l.moment} l={l} design={d} problem={problem} props={props} family={family} dims={dims} units={units} />)
          ) : (
            <p>Not checked: the brief states the compression flange restrained throughout its length.</p>
          )}
        </section>
      ) : null}

      {sh ? (
        <section aria-labelledby="shear-h">
          <h3 id="shear-h" className="font-semibold">
            6.4 Shear<Clause>EN 1993-1-1 §6.2.6; EN 1993-1-5 §5</Clause>
          </h3>
          <Step>
            Av = {avExpr[family]} = <strong>{n(sh.Av)} mm²</strong> (hw = {n(sh.hw)} mm, tw = {n(sh.tw)} mm, η = {st.eta}); Vpl,Rd = Av·fy/(√3·γM0) = {n(sh.Av)} × {n(d.fy)} ÷ (√3 × {st.gammaM0}) ={" "}
            <strong>{n(sh.VplRd)} kN</strong>
          </Step>
          {sh.bucklingLimit !== null ? (
            sh.buckling ? (
              <Step>
                hw/tw = {n(sh.hw)}/{n(sh.tw)} = {n(sh.hwOverTw ?? NaN)} &gt; 72ε/η = <strong>{n(sh.bucklingLimit)}</strong>: shear buckling applies. λw = hw/(86.4·tw·ε) = {n(sh.hw)}/(86.4 × {n(sh.tw)} × {n(d.epsilon, 4)}) ={" "}
                <strong>{n(sh.lambdaW!, 4)}</strong>; χw = {sh.lambdaW! < 0.83 / st.eta ? "η (λw < 0.83/η)" : "0.83/λw (non-rigid end post)"} = <strong>{n(sh.chiW!, 4)}</strong>; Vb,Rd = {nWebs > 1 ? "2 × " : ""}
                χw·fy·hw·tw/(√3·γM1) = {nWebs > 1 ? "2 × " : ""}
                {n(sh.chiW!, 4)} × {n(d.fy)} × {n(sh.hw)} × {n(sh.tw)} ÷ (√3 × {st.gammaM1}) = <strong>{n(sh.VbRd!)} kN</strong> (the flanges' share ignored)
                <Clause>EN 1993-1-5 §5.2, §5.3</Clause>
              </Step>
            ) : (
              <Step>
                hw/tw = {n(sh.hw)}/{n(sh.tw)} = {n(sh.hwOverTw ?? NaN)} ≤ 72ε/η = {n(sh.bucklingLimit)}: no shear buckling check needed<Clause>EN 1993-1-1 §6.2.6(6)</Clause>
              </Step>
            )
          ) : null}
          <Step testid="record-vrd">
            VRd = <strong>{n(sh.VRd)} kN</strong>
            <Also q="force" x={sh.VRd} units={units} /> ({sh.governing === "shear-buckling" ? "min(Vpl,Rd, Vb,Rd)" : "Vpl,Rd"}); VEd/VRd = {n(V)}/{n(sh.VRd)} = <strong>{util(sh.governing)}</strong>
          </Step>
        </section>
      ) : null}

      {sh ? (
        <section aria-labelledby="mv-h">
          <h3 id="mv-h" className="font-semibold">
            6.5 Bending with shear<Clause>EN 1993-1-1 §6.2.8</Clause>
          </h3>
          {d.bendingShear ? (
            <Step>
              VEd = {n(V)} kN &gt; 0.5·VRd = 0.5 × {n(sh.VRd)} kN: ρ = (2·VEd/VRd − 1)² = (2 × {n(V)}/{n(sh.VRd)} − 1)² = <strong>{n(d.bendingShear.rho, 4)}</strong>;{" "}
              {family === "tee" || family === "rectangle" ? "MV,Rd = (1 − ρ)·Mc,Rd" : `MV,Rd = (W − ρ·Σhw²·tw/4)·fy/γM0 (§6.2.8(5)${nWebs > 1 ? ", both webs" : ""})`} = <strong>{n(d.bendingShear.MVRd)} kN·m</strong>; MEd/MV,Rd ={" "}
              <strong>{util("bending-shear")}</strong>
            </Step>
          ) : (
            <Step>
              VEd = {n(V)} kN ≤ 0.5·VRd = 0.5 × {n(sh.VRd)} kN: no reduction of the bending resistance<Clause>EN 1993-1-1 §6.2.8(2)</Clause>
            </Step>
          )}
        </section>
      ) : null}

      {d.weld ? (
        <section aria-labelledby="weld-h">
          <h3 id="weld-h" className="font-semibold">
            6.6 Flange-to-web welds<Clause>EN 1993-1-8 §4.5.3.3, simplified method</Clause>
          </h3>
          <Step>
            q = VEd·Qf/Iz = {n(V)} × 10³ N × {f(d.weld.Qf)} mm³ ÷ {f(props.Iz)} mm⁴ = <strong>{n(d.weld.q)} N/mm</strong> per junction (Qf: first moment of the flange about the elastic neutral axis)
          </Step>
          <Step>
            fvw,d = fu/(√3·βw·γM2) = {n(st.fu)}/(√3 × {st.betaW} × {st.gammaM2}) = <strong>{n(d.weld.fvwd)} MPa</strong>
          </Step>
          <Step testid="record-weld">
            a = q/({d.weld.welds}·fvw,d) = {n(d.weld.q)}/({d.weld.welds} × {n(d.weld.fvwd)}) = {n(d.weld.aExact, 3)} mm → rounded up to a whole mm, at least 3 mm: <strong>a = {d.weld.a} mm</strong>
            <Also q="length" x={d.weld.a} units={units} />; at most 0.7 × the thinner joined plate = <strong>{n(d.weld.aMax)} mm</strong> ({d.weld.a <= d.weld.aMax ? "fits" : "does not fit"})
          </Step>
        </section>
      ) : null}

      {d.bearing ? (
        <section aria-labelledby="bearing-h">
          <h3 id="bearing-h" className="font-semibold">
            6.7 Web at an unstiffened end support<Clause>EN 1993-1-5 §6, type (c)</Clause>
          </h3>
          <Step>
            ss = {n(d.bearing.ss)} mm; kF = {n(d.bearing.kF, 4)}; m1 = {n(d.bearing.m1, 4)}; m2 = {n(d.bearing.m2, 4)}; ly = <strong>{n(d.bearing.ly)} mm</strong>; Fcr = {n(d.bearing.Fcr)} kN (per web); λF ={" "}
            {n(d.bearing.lambdaF, 4)}; χF = {n(d.bearing.chiF, 4)}; Leff = χF·ly = {n(d.bearing.Leff)} mm; FRd = fy·Leff·tw/γM1 = <strong>{n(d.bearing.FRd)} kN</strong>
            {nWebs > 1 ? " (both webs)" : ""}; VEd/FRd = {util("bearing")}
          </Step>
        </section>
      ) : null}

      <section aria-labelledby="en-checks-h">
        <h3 id="en-checks-h" className="font-semibold">
          6.8 Every check, with its clause
        </h3>
        <CheckTable verdict={verdict} units={units} />
        <p className="mt-1">
          Utilisation = demand ÷ resistance; the largest, <strong>{verdict.utilisation.toFixed(3)}</strong>, is set by {checkLabel(verdict.governing)} (
          {verdict.checks.find((c) => c.name === verdict.governing)?.clause}).
        </p>
      </section>

      {d.notes.length ? (
        <section aria-labelledby="notes-h">
          <h3 id="notes-h" className="font-semibold">
            6.9 Stated simplifications and assumptions
          </h3>
          <ul className="list-disc pl-5" data-testid="record-notes">
            {d.notes.map((x) => (
              <li key={x}>{x}</li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

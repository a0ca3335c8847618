// The calculation record's AISC 360-16 part (issue 14): every check worked through with its
// section and equation number, from the engine's own record lines (basis/aisc360.ts recordLines),
// so the numbers printed are those that decided the search. Worked in SI (the engine's units);
// the checks table beside it shows demand and capacity in the record's units.
// The main checks are also set out as the EN 1993 part sets out its own (Aisc360Worked, with the
// shared builder of components/Worked.tsx): flexure by F2 and F3 (yielding F2-1, flange local
// buckling F3-1 / F3-2, lateral-torsional buckling F2-2 or F2-3 with Lp, Lr and Cb), shear by G2-1
// with Cv1 (G2-3 / G2-4), and the flange-to-web welds by J2-3 with Table J2.5's Fnw. Every number
// is a field of the engine's AiscDesign (Zx, Mr, ry, J·c/(Sx·h0), the h/tw limit of Cv1, the
// weld's strength per mm of leg are returned for this); the page computes none of them.
import type { CandidateVerdict } from "~/optimizer/checks";
import type { AiscDesign, AiscFlexure } from "~/optimizer/design-types";
import { recordLines, type SearchProblem } from "~/optimizer/index";
import type { UnitSystem } from "~/optimizer/units";
import { Also, Clause, Step, f, n } from "~/components/Worked";

const AW_SYMBOLS = { "G2.1": "d·tw", G3: "d·tw (b·t of §G3, b the full depth)", G4: "2·h·tw", bar: "b·d" } as const;

function FlexureWorked({ fl, a, verdict, units }: { fl: AiscFlexure; a: AiscDesign; verdict: CandidateVerdict; units: UnitSystem }) {
  const asd = a.method === "ASD";
  const req = asd ? "Ma" : "Mu";
  const flange = a.elements.find((e) => e.element.endsWith("flange") && e.under.includes(fl.moment));
  const flb = fl.limitStates.find((x) => x.equation === "F3-1" || x.equation === "F3-2");
  const l = fl.ltb;
  // a ratio is shown where this sign's numbers are the check's own (the other sign may govern it)
  const ratio = (name: string, avail: number) => {
    const c = verdict.checks.find((x) => x.name === name);
    return c && c.demand === fl.M && c.capacity === avail ? (
      <>
        ; {req}/{asd ? "(Mn/Ωb)" : "φbMn"} = {n(fl.M)}/{n(avail)} = <strong>{c.utilisation.toFixed(3)}</strong>
      </>
    ) : null;
  };
  const availWorked = (Mn: number, avail: number) =>
    asd ? (
      <>
        Mn/Ωb = {n(Mn)}/{fl.omega} = <strong>{n(avail)} kN·m</strong>
      </>
    ) : (
      <>
        φbMn = {fl.phi} × {n(Mn)} = <strong>{n(avail)} kN·m</strong>
      </>
    );
  return (
    <div className="mt-2 space-y-0.5" data-testid={`record-aisc-flexure-${fl.moment}`}>
      <p className="font-semibold">
        {fl.moment === "sagging" ? "Sagging" : "Hogging"} moment {req} = {n(fl.M)} kN·m<Also q="moment" x={fl.M} units={units} /> (section {fl.section})
      </p>
      <Step>
        Yielding: Mn = Mp = Fy·Zx = {n(a.Fy)} MPa × {f(fl.Zx)} mm³ = <strong>{n(fl.Mp)} kN·m</strong>
        <Also q="moment" x={fl.Mp} units={units} />
        <Clause>AISC 360-16 Eq. F2-1</Clause>
      </Step>
      {flange ? (
        flb && fl.Mr !== undefined ? (
          flb.equation === "F3-1" ? (
            <Step>
              Flange local buckling, {flange.element} noncompact: λpf = {n(flange.lambdaP)} &lt; λ = {n(flange.ratio)} ≤ λrf = {n(flange.lambdaR)}; Mr = 0.7·Fy·Sx = {n(fl.Mr)} kN·m (Sx = {f(fl.Sxc)} mm³); Mn = Mp − (Mp − 0.7·Fy·Sx)·(λ − λpf)/(λrf − λpf) ={" "}
              {n(fl.Mp)} − ({n(fl.Mp)} − {n(fl.Mr)}) × ({n(flange.ratio)} − {n(flange.lambdaP)})/({n(flange.lambdaR)} − {n(flange.lambdaP)}) = <strong>{n(flb.Mn)} kN·m</strong>
              <Clause>AISC 360-16 Eq. F3-1</Clause>
            </Step>
          ) : (
            <Step>
              Flange local buckling, {flange.element} slender: λ = {n(flange.ratio)} &gt; λrf = {n(flange.lambdaR)}; Mn = 0.9·E·kc·Sx/λ² = 0.9 × {f(a.E)} MPa × {n(flange.kc ?? NaN)} × {f(fl.Sxc)} mm³ ÷ {n(flange.ratio)}² ={" "}
              <strong>{n(flb.Mn)} kN·m</strong>
              <Clause>AISC 360-16 Eq. F3-2</Clause>
            </Step>
          )
        ) : flange.class === "compact" ? (
          <Step>
            Flange local buckling: {flange.element} λ = {n(flange.ratio)} ≤ λpf = {n(flange.lambdaP)} (compact), does not apply<Clause>AISC 360-16 §F2, Table B4.1b</Clause>
          </Step>
        ) : null
      ) : null}
      <Step>
        Mn = <strong>{n(fl.MnLocal)} kN·m</strong> (the least of yielding and the local buckling limit states, each listed below); {availWorked(fl.MnLocal, fl.availableLocal)}
        <Also q="moment" x={fl.availableLocal} units={units} />
        {ratio("bending-resistance", fl.availableLocal)}
        <Clause>AISC 360-16 §F1</Clause>
      </Step>
      {l && l.ry !== undefined && l.jc !== undefined && l.Lp !== null && l.Lr !== null && l.radius !== null ? (
        <>
          <Step>
            Lateral-torsional buckling over Lb = {n(l.Lb)} mm, Cb = {l.Cb}: Lp = 1.76·ry·√(E/Fy) = 1.76 × {n(l.ry)} mm × √({f(a.E)}/{n(a.Fy)}) = <strong>{n(l.Lp)} mm</strong>
            <Clause>AISC 360-16 Eq. F2-5</Clause>
          </Step>
          <Step>
            Lr = 1.95·rts·(E/(0.7·Fy))·√(J·c/(Sx·h0) + √((J·c/(Sx·h0))² + 6.76·(0.7·Fy/E)²)) with rts = {n(l.radius)} mm and J·c/(Sx·h0) = {f(l.jc)}: Lr = 1.95 × {n(l.radius)} × ({f(a.E)}/(0.7 × {n(a.Fy)})) × √({f(l.jc)} + √({f(l.jc)}² + 6.76 × (0.7 × {n(a.Fy)}/{f(a.E)})²)) ={" "}
            <strong>{n(l.Lr)} mm</strong>
            <Clause>AISC 360-16 Eq. F2-6, F2-7</Clause>
          </Step>
          {l.zone === "plastic" ? (
            <Step>
              Lb = {n(l.Lb)} mm ≤ Lp = {n(l.Lp)} mm: lateral-torsional buckling does not apply<Clause>AISC 360-16 §F2.2(a)</Clause>
            </Step>
          ) : l.zone === "inelastic" && fl.Mr !== undefined && l.Mn !== null ? (
            <Step>
              Lp &lt; Lb ≤ Lr: Mn = Cb·[Mp − (Mp − 0.7·Fy·Sx)·(Lb − Lp)/(Lr − Lp)] ≤ Mp = {l.Cb} × [{n(fl.Mp)} − ({n(fl.Mp)} − {n(fl.Mr)}) × ({n(l.Lb)} − {n(l.Lp)})/({n(l.Lr)} − {n(l.Lp)})], at most {n(fl.Mp)} ={" "}
              <strong>{n(l.Mn)} kN·m</strong>
              <Clause>AISC 360-16 Eq. F2-2</Clause>
            </Step>
          ) : l.Fcr !== undefined && l.Mn !== null ? (
            <Step>
              Lb &gt; Lr: Fcr = Cb·π²·E/(Lb/rts)²·√(1 + 0.078·(J·c/(Sx·h0))·(Lb/rts)²) = {l.Cb} × π² × {f(a.E)} ÷ ({n(l.Lb)}/{n(l.radius)})² × √(1 + 0.078 × {f(l.jc)} × ({n(l.Lb)}/{n(l.radius)})²) ={" "}
              <strong>{n(l.Fcr)} MPa</strong>
              <Clause>AISC 360-16 Eq. F2-4</Clause>; Mn = Fcr·Sx ≤ Mp = {n(l.Fcr)} MPa × {f(fl.Sxc)} mm³, at most {n(fl.Mp)} = <strong>{n(l.Mn)} kN·m</strong>
              <Clause>AISC 360-16 Eq. F2-3</Clause>
            </Step>
          ) : null}
          {l.Mn !== null && l.available !== null ? (
            <Step>
              {availWorked(l.Mn, l.available)}
              <Also q="moment" x={l.available} units={units} />
              {ratio("ltb", l.available)}
            </Step>
          ) : null}
        </>
      ) : null}
    </div>
  );
}

/** The main AISC 360-16 checks worked through: formula, numbers, result, clause (as the EN 1993 part). */
export function Aisc360Worked({ verdict, units }: { verdict: CandidateVerdict; units: UnitSystem }) {
  const a = verdict.aisc;
  if (!a) return null;
  const asd = a.method === "ASD";
  const s = a.shear;
  const w = a.weld;
  const shearCheck = verdict.checks.find((c) => c.name === "shear-resistance" || c.name === "shear-buckling");
  const weldCheck = verdict.checks.find((c) => c.name === "weld");
  const main = a.flexure.filter((x) => x.section === "F2" || x.section === "F3");
  return (
    <div className="mt-3 space-y-3 text-sm" data-testid="record-aisc-worked">
      {main.length ? (
        <section aria-labelledby="aisc-flexure-h">
          <h3 id="aisc-flexure-h" className="font-semibold">
            5.1 Flexure, doubly symmetric I or channel<Clause>AISC 360-16 §F2, §F3</Clause>
          </h3>
          {main.map((fl) => (
            <FlexureWorked key={fl.moment} fl={fl} a={a} verdict={verdict} units={units} />
          ))}
        </section>
      ) : null}
      {s ? (
        <section aria-labelledby="aisc-shear-h">
          <h3 id="aisc-shear-h" className="font-semibold">
            5.2 Shear<Clause>{s.clause === "G2.1" ? "AISC 360-16 §G2.1" : s.clause === "bar" ? "AISC 360-16 §G2.1, by analogy" : `AISC 360-16 §${s.clause}, §G2.2`}</Clause>
          </h3>
          <Step>
            Aw = {AW_SYMBOLS[s.clause]} = <strong>{n(s.Aw)} mm²</strong>; h/tw = {n(s.h)}/{n(s.tw)} = {n(s.hOverTw)}
            {s.kv !== null ? `, kv = ${s.kv}` : ""}
          </Step>
          {s.clause === "G2.1" && s.htLimit !== null ? (
            s.rolledA ? (
              <Step>
                Rolled I web, h/tw = {n(s.hOverTw)} ≤ 2.24·√(E/Fy) = {n(s.htLimit)}: Cv1 = <strong>{n(s.Cv)}</strong>, φv = {s.phi}, Ωv = {s.omega}
                <Clause>AISC 360-16 §G2.1(a)</Clause>
              </Step>
            ) : s.Cv < 1 ? (
              <Step>
                h/tw = {n(s.hOverTw)} &gt; 1.10·√(kv·E/Fy) = {n(s.htLimit)}: Cv1 = 1.10·√(kv·E/Fy)/(h/tw) = {n(s.htLimit)}/{n(s.hOverTw)} = <strong>{n(s.Cv)}</strong>
                <Clause>AISC 360-16 Eq. G2-4</Clause>
              </Step>
            ) : (
              <Step>
                h/tw = {n(s.hOverTw)} ≤ 1.10·√(kv·E/Fy) = {n(s.htLimit)}: Cv1 = <strong>{n(s.Cv)}</strong>
                <Clause>AISC 360-16 Eq. G2-3</Clause>
              </Step>
            )
          ) : (
            <Step>
              Cv = <strong>{n(s.Cv)}</strong>
              <Clause>{s.clause === "bar" ? "a stated choice: Cv = 1 for a solid bar" : "AISC 360-16 §G2.2, Cv2"}</Clause>
            </Step>
          )}
          <Step testid="record-aisc-vn">
            Vn = 0.6·Fy·Aw·Cv = 0.6 × {n(a.Fy)} MPa × {f(s.Aw)} mm² × {n(s.Cv)} = <strong>{n(s.Vn)} kN</strong>
            <Clause>{s.clause === "G3" ? "AISC 360-16 Eq. G3-1" : s.clause === "G4" ? "AISC 360-16 Eq. G2-1 by §G4" : "AISC 360-16 Eq. G2-1"}</Clause>;{" "}
            {asd ? (
              <>
                Vn/Ωv = {n(s.Vn)}/{s.omega} = <strong>{n(s.available)} kN</strong>
              </>
            ) : (
              <>
                φvVn = {s.phi} × {n(s.Vn)} = <strong>{n(s.available)} kN</strong>
              </>
            )}
            <Also q="force" x={s.available} units={units} />
            {shearCheck ? (
              <>
                ; {asd ? "Va/(Vn/Ωv)" : "Vu/φvVn"} = {n(shearCheck.demand)}/{n(shearCheck.capacity)} = <strong>{shearCheck.utilisation.toFixed(3)}</strong>
              </>
            ) : null}
          </Step>
        </section>
      ) : null}
      {w ? (
        <section aria-labelledby="aisc-weld-h">
          <h3 id="aisc-weld-h" className="font-semibold">
            5.3 Flange-to-web fillet welds<Clause>AISC 360-16 §J2.4, Table J2.5, Table J2.4</Clause>
          </h3>
          <Step>
            q = V·Qf/Iz = <strong>{n(w.q)} N/mm</strong> per junction (Qf = {f(w.Qf)} mm³, the flange's first moment about the neutral axis)
          </Step>
          <Step>
            Fnw = 0.60·FEXX = 0.60 × {n(w.FEXX)} = <strong>{n(w.Fnw)} MPa</strong>
            <Clause>AISC 360-16 Table J2.5</Clause>; Rn = Fnw·Awe with Awe = 0.707·w per mm of weld
            <Clause>AISC 360-16 Eq. J2-3, J2-4</Clause>:{" "}
            {asd ? (
              <>
                Fnw·0.707/Ω = {n(w.Fnw)} × 0.707 ÷ {w.omega}
              </>
            ) : (
              <>
                φ·Fnw·0.707 = {w.phi} × {n(w.Fnw)} × 0.707
              </>
            )}{" "}
            = <strong>{n(w.perLeg)} N/mm</strong> per mm of leg
          </Step>
          <Step testid="record-aisc-weld">
            Two welds: w = q/(2 × that) = {n(w.q)}/(2 × {n(w.perLeg)}) = {n(w.wExact, 3)} mm → rounded up to a whole mm, at least the Table J2.4 minimum {n(w.wMin)} mm: <strong>w = {n(w.w)} mm</strong>
            <Also q="length" x={w.w} units={units} />; at most the thinner part joined, {n(w.wMax)} mm
            {weldCheck ? (
              <>
                ; w/limit = <strong>{weldCheck.utilisation.toFixed(3)}</strong>
              </>
            ) : null}
          </Step>
        </section>
      ) : null}
    </div>
  );
}

export function Aisc360Checks({ problem, verdict }: { problem: SearchProblem; verdict: CandidateVerdict }) {
  const lines = recordLines(problem, verdict);
  return (
    <table className="w-full border-collapse text-sm" data-testid="record-aisc360">
      <thead>
        <tr className="text-left">
          <th scope="col" className="border-b border-ink/30 py-1 pr-2">
            Section and equation
          </th>
          <th scope="col" className="border-b border-ink/30 py-1">
            Worked through
          </th>
        </tr>
      </thead>
      <tbody>
        {lines.map((l, i) => (
          <tr key={i} className="align-top">
            <td className="py-1 pr-2 whitespace-nowrap text-ink/80">{l.clause}</td>
            <td className="py-1 tabular-nums">{l.text}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

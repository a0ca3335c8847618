// The calculation record: one printable sheet per option. Every number comes from the engine
// (record.ts gathers them); the composite-area table is the engine's own compositeTable.
import { StaleApproval } from "~/components/ReviewBadge";
import { optionNo, sweepNo } from "~/lib/numbering";
import { checkLabel, familyLabel } from "~/lib/labels";
import { Link } from "react-router";
import type { Route } from "./+types/options.$optionId.record";
import { requirePermission } from "~/lib/auth.server";
import { rolledSectionOf } from "~/optimizer/catalogue";
import { buildRecord } from "~/lib/record";
import { Caution } from "~/components/Caution";
import { SectionDrawing } from "~/components/SectionDrawing";
import { CheckTable } from "~/components/CheckTable";
import { BriefSummary } from "~/components/BriefSummary";
import { OptionProvenance } from "~/components/OptionProvenance";
import { BasisNote } from "~/components/BasisAssumptions";
import { En1993Checks, En1993Inputs } from "~/components/En1993Record";
import { Aisc360Checks, Aisc360Worked } from "~/components/Aisc360Record";
import { DeflectionWorked, ShearWorked, SlendernessWorked } from "~/components/WorkedChecks";
import { PropertyTable, formatNumber } from "~/components/PropertyTable";
import { fromSI, unitLabel } from "~/optimizer/units";
import { idParam } from "~/lib/route-params";
import { TableScroll } from "~/components/DataTable";
import { z } from "zod";
import { recordDocument } from "~/lib/record-document.server";
import { recordPageCss } from "~/lib/record-document";
import { revisionNumber } from "~/lib/revisions";
import { RecordTitleBlock, RevisionHistory, RecordAttachments } from "~/components/RecordTitleBlock";

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data && "option" in data ? `Calculation record, ${data.mark}, revision ${data.revision.letter} · Sparwise` : "Calculation record · Sparwise" }];
}

// ?rev=B shows an earlier (or the current) revision; absent, the current one.
const recordQuery = z.object({
  rev: z
    .string()
    .regex(/^[A-Za-z]{1,3}$/, "rev: a revision letter such as A or B")
    .optional(),
});

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const q = recordQuery.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!q.success) throw new Response(q.error.issues[0]!.message, { status: 400, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  const doc = await recordDocument(user.teamId, idParam(params.optionId), q.data.rev ? revisionNumber(q.data.rev) : undefined);
  return { ...doc, team: user.teamName, printedAt: new Date().toISOString() };
}

export default function RecordPage({ loaderData }: Route.ComponentProps) {
  const { option, reviews, team, printedAt, jobNumber, mark, revision, revisions, signatures, attachments, numbers } = loaderData;
  const units = option.units;
  const c = option.candidate;
  const rolled = rolledSectionOf(c);
  const rec = buildRecord(c.family, c.dimensions, option.problem, rolled);
  // The EN 1993 part needs the engine's design block (absent under the allowable basis).
  const en = option.problem.basis === "en1993" ? (rec.verdict.design ?? null) : null;
  const L = unitLabel("length", units),
    A2 = unitLabel("area", units),
    A3 = unitLabel("modulus", units),
    A4 = unitLabel("inertia", units),
    S = unitLabel("stress", units),
    MU = unitLabel("moment", units);
  const n = (q: Parameters<typeof fromSI>[0], x: number) => formatNumber(fromSI(q, x, units), 5);
  const t = rec.table;
  const p = rec.properties;
  // Written-out flexure formula: the moment's unit to force × length of the section's length unit.
  const MF = units === "si" ? "× 10⁶ N·mm/kN·m" : "× 12 in/ft";
  const decision = [...reviews].reverse().find((r) => r.decision === "approved" || r.decision === "returned");
  const css = recordPageCss({ project: option.projectName, jobNumber, mark, revision: revision.letter, title: `Sparwise calculation record · option ${optionNo(numbers, option.id)} · printed ${printedAt.slice(0, 10)}` });
  return (
    <article className="mx-auto max-w-4xl space-y-6 bg-white p-6 print:max-w-none print:p-0" data-testid="record">
      {/* the page furniture of the printed sheet; every value in it is escaped by recordPageCss */}
      <style dangerouslySetInnerHTML={{ __html: css }} />
      <div className="no-print flex flex-wrap justify-end gap-2">
        <Link to={`/options/${option.id}`} className="rounded-md border border-ink/30 px-3 py-1.5 text-sm">
          Back to the option
        </Link>
        <button type="button" onClick={() => window.print()} className="rounded-md bg-accent px-3 py-1.5 text-sm font-semibold text-white">
          Print or save as PDF
        </button>
      </div>
      {!revision.current ? (
        <p role="status" className="rounded-md border border-ink/40 bg-paper px-3 py-2 text-sm font-semibold" data-testid="superseded">
          Revision {revision.letter} has been superseded: the current revision is {revisions.find((r) => r.current)?.letter}. This sheet shows revision {revision.letter} as it was.
        </p>
      ) : null}
      {revision.state !== "approved" ? (
        <p className="rounded-md border-2 border-red-800 px-3 py-2 text-sm font-bold uppercase tracking-wide text-red-900" data-testid="not-approved">
          Not approved: revision {revision.letter} is {revision.state === "in_review" ? "waiting for review" : revision.state === "returned" ? "returned by the reviewer" : "a draft"}.
        </p>
      ) : null}
      <header className="border-b border-ink/30 pb-3">
        <p className="text-sm text-ink/70">{team}</p>
        <h1 className="text-2xl font-bold">
          Calculation record: {mark}, revision {revision.letter}
          {option.approvalStale ? <StaleApproval /> : null}
        </h1>
        <p className="text-sm">
          {rolled ? `${rolled.designation} (rolled, from ${c.catalogue ?? "a catalogue"}; root fillets and corner radii in the properties, not in the table of rectangles): ` : ""}
          {familyLabel(c.family)} section, {Object.entries(c.dimensions).map(([k, v]) => `${k} = ${n("length", v)} ${L}`).join(", ")}
          {option.note ? ` · note: ${option.note}` : ""}
        </p>
      </header>
      <RecordTitleBlock
        facts={{
          project: option.projectName,
          jobNumber,
          mark,
          optionNo: optionNo(numbers, option.id),
          briefName: option.briefName,
          sweepNo: option.sweepId ? sweepNo(numbers, option.sweepId) : null,
          recheckOfNo: option.recheckOf ? sweepNo(numbers, option.recheckOf) : null,
          revision: revision.letter,
          revisionDate: revision.prepared?.at ?? null,
          reason: revision.reason,
        }}
        signatures={signatures}
      />
      <Caution problem={option.problem} />

      <section aria-labelledby="inputs-h">
        <h2 id="inputs-h" className="text-lg font-bold">
          1. Inputs
        </h2>
        <OptionProvenance option={{ ...option, revision: revision.number }} numbers={numbers} linked={false} />
        <BasisNote problem={option.problem} className="mb-1" />
        <BriefSummary problem={option.problem} units={units} />
        {option.memberLengthM && option.memberCount ? (
          <p className="mt-2 text-sm" data-testid="quantity">
            Quantity: {option.memberCount} members × {n("span", option.memberLengthM)} {unitLabel("span", units)} × {n("massPerLength", p.massPerMetre)} {unitLabel("massPerLength", units)} ={" "}
            <strong>
              {formatNumber(option.memberCount * fromSI("span", option.memberLengthM, units) * fromSI("massPerLength", p.massPerMetre, units), 4)} {units === "si" ? "kg" : "lb"}
            </strong>{" "}
            of steel (before welds, cut-offs and coatings).
          </p>
        ) : null}
      </section>

      <section aria-labelledby="section-h" className="grid gap-4 break-inside-avoid sm:grid-cols-2">
        <div>
          <h2 id="section-h" className="text-lg font-bold">
            2. Section
          </h2>
          <SectionDrawing section={rec.section} properties={p} units={units} width={340} height={300} />
        </div>
        <div>
          <h3 className="font-semibold">Plates (bottom-left corner z, y; width b; height h)</h3>
          <TableScroll>
          <table className="w-full border-collapse text-sm tabular-nums">
            <thead>
              <tr className="border-b border-ink/30 text-right">
                <th className="py-1 text-left">Plate</th>
                <th>b ({L})</th>
                <th>h ({L})</th>
                <th>z ({L})</th>
                <th>y ({L})</th>
              </tr>
            </thead>
            <tbody>
              {rec.plates.map((pl, i) => (
                <tr key={i} className="border-b border-ink/10 text-right">
                  <td className="py-1 text-left">{i + 1}</td>
                  <td>{n("length", pl.b)}</td>
                  <td>{n("length", pl.h)}</td>
                  <td>{n("length", pl.z)}</td>
                  <td>{n("length", pl.y)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          </TableScroll>
        </div>
      </section>

      <section aria-labelledby="composite-h" className="break-inside-avoid">
        <h2 id="composite-h" className="text-lg font-bold">
          3. Centroid and moment of inertia (parallel-axis theorem)
        </h2>
        <TableScroll>
        <table className="mt-2 w-full border-collapse text-sm tabular-nums" data-testid="composite-table">
          <thead>
            <tr className="border-b border-ink/30 text-right">
              <th className="py-1 text-left">Plate</th>
              <th>A ({A2})</th>
              <th>y ({L})</th>
              <th>A·y ({A3})</th>
              <th>I₀ = b·h³/12 ({A4})</th>
              <th>d = y − ȳ ({L})</th>
              <th>A·d² ({A4})</th>
            </tr>
          </thead>
          <tbody>
            {t.rows.map((r, i) => (
              <tr key={i} className="border-b border-ink/10 text-right">
                <td className="py-1 text-left">{i + 1}</td>
                <td>{n("area", r.A)}</td>
                <td>{n("length", r.yc)}</td>
                <td>{n("modulus", r.Ayc)}</td>
                <td>{n("inertia", r.I0)}</td>
                <td>{n("length", r.d)}</td>
                <td>{n("inertia", r.Ad2)}</td>
              </tr>
            ))}
            <tr className="border-t-2 border-ink/40 text-right font-semibold">
              <td className="py-1 text-left">Σ</td>
              <td>{n("area", t.totals.A)}</td>
              <td></td>
              <td>{n("modulus", t.totals.Ayc)}</td>
              <td>{n("inertia", t.totals.I0)}</td>
              <td></td>
              <td>{n("inertia", t.totals.Ad2)}</td>
            </tr>
          </tbody>
        </table>
        </TableScroll>
        <p className="mt-2 text-sm">
          ȳ = ΣA·y ÷ ΣA = {n("modulus", t.totals.Ayc)} ÷ {n("area", t.totals.A)} = <strong>{n("length", t.totals.yBar)} {L}</strong> from the bottom edge.
        </p>
        <p className="text-sm">
          Iz = ΣI₀ + ΣA·d² = {n("inertia", t.totals.I0)} + {n("inertia", t.totals.Ad2)} = <strong>{n("inertia", t.totals.Iz)} {A4}</strong>.
        </p>
      </section>

      <section aria-labelledby="stress-h" className="break-inside-avoid">
        <h2 id="stress-h" className="text-lg font-bold">
          4. Fibre stresses
        </h2>
        <p className="text-sm">
          c_top = {n("length", p.extremes.top)} {L}, c_bottom = {n("length", p.extremes.bottom)} {L}. Tension positive, compression negative.
        </p>
        {rec.fibres.map((f) => (
          <div key={f.case} className="mt-2 text-sm" data-testid={`fibre-${f.case}`}>
            <p className="font-semibold">
              {f.case === "sagging" ? "Sagging" : "Hogging"} moment M = {n("moment", f.M)} {MU}
            </p>
            {f.symmetric ? (
              <>
                <p>
                  σ_top = {f.case === "sagging" ? "−" : "+"}M·c_top ÷ Iz = {f.case === "sagging" ? "−" : "+"}
                  {n("moment", f.M)} {MU} {MF} × {n("length", p.extremes.top)} {L} ÷ {n("inertia", p.Iz)} {A4} = <strong>{n("stress", f.top)} {S}</strong>
                </p>
                <p>
                  σ_bottom = {f.case === "sagging" ? "+" : "−"}M·c_bottom ÷ Iz = {f.case === "sagging" ? "+" : "−"}
                  {n("moment", f.M)} {MU} {MF} × {n("length", p.extremes.bottom)} {L} ÷ {n("inertia", p.Iz)} {A4} = <strong>{n("stress", f.bottom)} {S}</strong>
                </p>
              </>
            ) : (
              <p>
                Unsymmetric section (Iyz = {n("inertia", p.Iyz)} {A4}): σ = M·(Iyz·z − Iy·y) ÷ (Iz·Iy − Iyz²) at every corner; largest top {n("stress", f.top)} {S}, bottom {n("stress", f.bottom)} {S}.
              </p>
            )}
          </div>
        ))}
      </section>

      {option.problem.basis === "aisc360" && rec.verdict.aisc ? (
        <section aria-labelledby="checks-h">
          <h2 id="checks-h" className="text-lg font-bold">
            5. AISC 360-16 checks worked through ({option.problem.method})
          </h2>
          <CheckTable verdict={rec.verdict} units={units} />
          <p className="mt-1 text-sm">
            Utilisation = required ÷ available strength; the largest, <strong>{rec.verdict.utilisation.toFixed(3)}</strong>, is set by {checkLabel(rec.verdict.governing)}. Worked in SI units, the
            engine's own; section and equation numbers of AISC 360-16 beside each line.
          </p>
          <Aisc360Worked verdict={rec.verdict} units={units} />
          <h3 className="mt-3 font-semibold">5.4 Every limit state, with its section and equation</h3>
          <Aisc360Checks problem={option.problem} verdict={rec.verdict} />
        </section>
      ) : en ? (
        <>
          <section aria-labelledby="basis-h" className="break-inside-avoid">
            <h2 id="basis-h" className="text-lg font-bold">
              5. Design basis and inputs
            </h2>
            <En1993Inputs problem={option.problem} design={en} units={units} />
          </section>
          <section aria-labelledby="checks-h" data-testid="record-en1993">
            <h2 id="checks-h" className="text-lg font-bold">
              6. EN 1993 checks worked through
            </h2>
            <p className="text-sm text-ink/80">Worked in SI units, the code's own{units === "us" ? "; each result also in US customary units in brackets" : ""}. Clauses in brackets.</p>
            <En1993Checks problem={option.problem} verdict={rec.verdict} props={p} family={c.family} dims={c.dimensions} units={units} />
          </section>
        </>
      ) : (
        <section aria-labelledby="checks-h" className="break-inside-avoid">
          <h2 id="checks-h" className="text-lg font-bold">
            5. Checks
          </h2>
          <CheckTable verdict={rec.verdict} units={units} />
          <p className="mt-1 text-sm">
            Utilisation = demand ÷ capacity; the largest, <strong>{rec.verdict.utilisation.toFixed(3)}</strong>, is set by {checkLabel(rec.verdict.governing)}.
            {option.problem.basis === "en1993"
              ? " The engine returned no EN 1993 design block for this section, so its checks cannot be worked through here."
              : " Allowable-stress basis: stresses only, no stability checks (no lateral-torsional buckling, no shear buckling, no local buckling beyond the slenderness limits given)."}
          </p>
        </section>
      )}

      <ShearWorked verdict={rec.verdict} units={units} />
      <SlendernessWorked verdict={rec.verdict} />
      <DeflectionWorked verdict={rec.verdict} units={units} />

      <section aria-labelledby="props-h" className="break-inside-avoid">
        <h2 id="props-h" className="sr-only">
          Section properties
        </h2>
        <PropertyTable properties={p} units={units} caption={`${en ? 7 : 6}. Section properties (centroidal axes)`} />
      </section>

      <section aria-labelledby="decision-h" className="break-inside-avoid">
        <h2 id="decision-h" className="text-lg font-bold">
          {en ? 8 : 7}. Review
        </h2>
        <p className="text-sm" data-testid="decision">
          {decision
            ? `${decision.decision === "approved" ? "Approved" : "Returned"} by ${decision.who} on ${decision.at.slice(0, 10)}${decision.comment ? `: “${decision.comment}”` : "."}`
            : revision.state === "in_review"
              ? "Waiting for review."
              : "Not reviewed."}
        </p>
        <p className="mt-2 text-xs text-ink/70">Printed {printedAt.slice(0, 16).replace("T", " ")} UTC from Sparwise.</p>
      </section>
      <RecordAttachments attachments={attachments} number={en ? 9 : 8} />
      <Caution problem={option.problem} />
      <RevisionHistory optionId={option.id} revisions={revisions} shown={revision.number} number={en ? 10 : 9} />
    </article>
  );
}

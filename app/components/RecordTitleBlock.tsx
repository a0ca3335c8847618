// The calculation record's document parts: the title block with its prepared / checked / approved
// boxes, the attachments list and the revision history. Pure props, print-friendly.
import { Link } from "react-router";
import type { RecordRevision, RevisionSignature } from "~/lib/revisions";
import { sizeInWords, type AttachmentRow } from "~/lib/attachments";
import { TableScroll } from "~/components/DataTable";

export interface TitleFacts {
  project: string;
  jobNumber: string | null;
  mark: string;
  /** the option's and sweeps' numbers within the project, as every page names them */
  optionNo: number;
  briefName: string | null;
  sweepNo: number | null;
  recheckOfNo: number | null;
  revision: string;
  revisionDate: string | null;
  reason: string;
}

const day = (iso: string | null | undefined) => (iso ? iso.slice(0, 10) : "—");

function Signature({ label, sig, testId }: { label: string; sig: RevisionSignature | null; testId: string }) {
  return (
    <div className="border border-ink/40 p-2" data-testid={testId}>
      <p className="text-xs font-semibold tracking-wide text-ink/70">{label}</p>
      <p className="min-h-5 text-sm font-semibold">{sig ? sig.who : "—"}</p>
      <p className="whitespace-nowrap text-xs tabular-nums">{sig ? day(sig.at) : "not signed"}</p>
    </div>
  );
}

export function RecordTitleBlock({ facts, signatures }: { facts: TitleFacts; signatures: { prepared: RevisionSignature | null; checked: RevisionSignature | null; approved: RevisionSignature | null } }) {
  const row = (k: string, v: React.ReactNode, testId?: string) => (
    <div className="flex gap-2 border-b border-ink/20 py-0.5" data-testid={testId}>
      <dt className="w-28 shrink-0 text-ink/70">{k}</dt>
      <dd className="font-semibold">{v}</dd>
    </div>
  );
  return (
    <section aria-label="Title block" className="record-keep grid gap-3 border-2 border-ink/60 p-3 text-sm sm:grid-cols-[3fr_2fr]" data-testid="title-block">
      <dl>
        {row("Project", facts.project, "tb-project")}
        {row("Job number", facts.jobNumber ?? "—", "tb-job")}
        {row("Member mark", facts.mark, "tb-mark")}
        {row("Option", facts.optionNo)}
        {row("Brief", facts.briefName ?? "—")}
        {row("From", facts.sweepNo ? (facts.recheckOfNo ? `recheck sweep ${facts.sweepNo} of sweep ${facts.recheckOfNo}` : `sweep ${facts.sweepNo}`) : "a sweep no longer kept")}
        {row("Revision", `${facts.revision}, ${day(facts.revisionDate)} (${facts.reason})`, "tb-revision")}
      </dl>
      <div className="grid grid-cols-3 content-start gap-1">
        <Signature label="Prepared" sig={signatures.prepared} testId="sig-prepared" />
        <Signature label="Checked" sig={signatures.checked} testId="sig-checked" />
        <Signature label="Approved" sig={signatures.approved} testId="sig-approved" />
        <p className="col-span-3 text-xs text-ink/70">Names and dates from the review history of this revision; a revision not yet approved carries no check or approval.</p>
      </div>
    </section>
  );
}

export function RecordAttachments({ attachments, number }: { attachments: AttachmentRow[]; number: number }) {
  return (
    <section aria-labelledby="attachments-h" className="record-keep">
      <h2 id="attachments-h" className="text-lg font-bold">
        {number}. Attachments
      </h2>
      {attachments.length ? (
        <ul className="list-disc pl-5 text-sm" data-testid="record-attachments">
          {attachments.map((a) => (
            <li key={a.id}>
              <a href={`/attachments/${a.id}`} className="text-accent underline">
                {a.fileName}
              </a>{" "}
              ({sizeInWords(a.sizeBytes)}, attached by {a.createdBy ?? "someone"} on {day(a.createdAt)})
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm">None.</p>
      )}
    </section>
  );
}

export function RevisionHistory({ optionId, revisions, shown, number }: { optionId: number; revisions: RecordRevision[]; shown: number; number: number }) {
  return (
    <section aria-labelledby="revisions-h" className="record-keep">
      <h2 id="revisions-h" className="text-lg font-bold">
        {number}. Revision history
      </h2>
      <TableScroll>
      <table className="w-full border-collapse text-sm" data-testid="revision-history">
        <thead>
          <tr className="border-b border-ink/40 text-left">
            <th className="py-1 pr-2">Rev.</th>
            <th className="pr-2">Date</th>
            <th className="pr-2">What changed</th>
            <th className="pr-2">Prepared</th>
            <th>Approved</th>
          </tr>
        </thead>
        <tbody>
          {revisions.map((r) => (
            <tr key={r.number} className="border-b border-ink/15" aria-current={r.number === shown ? "page" : undefined}>
              <td className="py-1 pr-2 font-semibold">
                {r.number === shown ? (
                  r.letter
                ) : (
                  <Link to={`/options/${optionId}/record?rev=${r.letter}`} className="text-accent underline">
                    {r.letter}
                  </Link>
                )}
                {r.current ? " (current)" : ""}
              </td>
              <td className="pr-2 tabular-nums">{day(r.prepared?.at)}</td>
              <td className="pr-2">{r.reason}</td>
              <td className="pr-2">{r.prepared?.who ?? "—"}</td>
              <td>{r.approved ? `${r.approved.who}, ${day(r.approved.at)}` : r.state === "in_review" ? "waiting for review" : r.state === "returned" ? "returned" : "not approved"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      </TableScroll>
    </section>
  );
}

import { Form, Link, data } from "react-router";
import { StaleApproval } from "~/components/ReviewBadge";
import { optionNo, sweepNo } from "~/lib/numbering";
import { projectNumbers } from "~/lib/numbering.server";
import type { Route } from "./+types/options.$optionId";
import { requirePermission } from "~/lib/auth.server";
import { readForm } from "~/lib/forms.server";
import { appUrl } from "~/lib/app-url.server";
import { decideReview, decisionSchema, getOption, listReviews, optionVerdict, requestReview, reviewTies, WorkflowError } from "~/lib/options.server";
import { can, reviewRefusal } from "~/lib/roles";
import { z } from "zod";
import { Caution } from "~/components/Caution";
import { CompareCandidates } from "~/components/CompareCandidates";
import { ReviewBadge } from "~/components/ReviewBadge";
import { BriefSummary } from "~/components/BriefSummary";
import { OptionProvenance } from "~/components/OptionProvenance";
import { Assumptions, BasisNote } from "~/components/BasisAssumptions";
import { idParam } from "~/lib/route-params";
import { listAttachments } from "~/lib/attachments.server";
import { OptionAttachments } from "~/components/OptionAttachments";
import { revisionLetter } from "~/lib/revisions";

export function meta({ data }: Route.MetaArgs) {
  return [{ title: `Option ${data ? optionNo(data.numbers, data.option.id) : ""} · Sparwise` }];
}


export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const option = await getOption(user.teamId, idParam(params.optionId));
  const verdict = optionVerdict(option, option.problem);
  const inReview = option.reviewState === "in_review";
  // Said on the page only to people whose role reviews: the others never see review buttons anyway.
  const refusal = inReview && can(user.role, "review") ? reviewRefusal(user.role, await reviewTies(option, user.id)) : null;
  return {
    option,
    numbers: await projectNumbers({ sweeps: [option.sweepId, option.recheckOf], options: [option.id] }),
    feasible: verdict.feasible,
    notes: verdict.design?.notes ?? null,
    reviews: await listReviews(option.id),
    attachments: await listAttachments(user.teamId, option.id),
    me: { id: user.id, admin: user.role === "admin" },
    reviewRefusal: refusal,
    may: {
      request: can(user.role, "requestReview") && (option.reviewState === "draft" || option.reviewState === "returned"),
      review: can(user.role, "review") && inReview && !refusal,
      recheck: can(user.role, "recheck") && option.sweepId !== null,
      attach: can(user.role, "attach"),
    },
  };
}

const requestSchema = z.object({ comment: z.string().trim().max(4000, "Note to the reviewer: at most 4000 characters").optional() });

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requirePermission(request, "read");
  const id = idParam(params.optionId);
  await getOption(user.teamId, id);
  const form = await readForm(request);
  const intent = String(form.get("intent") ?? "");
  const link = (path: string) => appUrl(path);
  try {
    if (intent === "requestReview") {
      await requirePermission(request, "requestReview");
      const p = requestSchema.safeParse({ comment: form.get("comment") || undefined });
      if (!p.success) return data({ intent, errors: { comment: p.error.issues[0].message } }, { status: 400 });
      const asked = await requestReview(user, id, p.data.comment, link);
      return {
        intent,
        errors: null,
        done: asked
          ? "Review requested; the team's reviewers were e-mailed."
          : "Review requested, but nobody else in the team may review it (nobody approves their own work): ask an admin to invite a reviewer.",
      };
    }
    if (intent === "decide") {
      await requirePermission(request, "review");
      const p = decisionSchema.safeParse({ decision: form.get("decision") ?? undefined, comment: form.get("comment") || undefined });
      if (!p.success) return data({ intent, errors: { [String(p.error.issues[0].path[0] ?? "form")]: p.error.issues[0].message } }, { status: 400 });
      await decideReview(user, id, p.data.decision, p.data.comment, link);
      return { intent, errors: null, done: `Option ${p.data.decision}.` };
    }
  } catch (e) {
    if (e instanceof WorkflowError) return data({ intent, errors: { [e.field]: e.message } }, { status: e.status });
    throw e;
  }
  return data({ intent, errors: { intent: `intent: unknown action "${intent.slice(0, 30)}"` } }, { status: 400 });
}

export default function OptionPage({ loaderData, actionData }: Route.ComponentProps) {
  const { option, reviews, may, feasible, notes, reviewRefusal: refusal, numbers, attachments, me } = loaderData;
  const errors = (actionData?.errors ?? null) as Record<string, string> | null;
  // Each form's errors sit beside its own fields and buttons (issue 11, item 8); only what belongs
  // to neither form is said at the top.
  const actedOn = actionData && "intent" in actionData ? actionData.intent : null;
  const requestErrors = actedOn === "requestReview" ? errors : null;
  const decideErrors = actedOn === "decide" ? errors : null;
  const otherErrors = errors && !requestErrors && !decideErrors ? errors : null;
  const done = actionData && "done" in actionData && actionData.done ? actionData.done : null;
  const c = option.candidate;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-sm">
            <Link to={`/projects/${option.projectId}`} className="text-accent underline">
              {option.projectName}
            </Link>
            {option.sweepId ? (
              <>
                {" › "}
                <Link to={`/sweeps/${option.sweepId}`} className="text-accent underline">
                  sweep {sweepNo(numbers, option.sweepId)}
                </Link>
              </>
            ) : null}
          </p>
          <h1 className="text-2xl font-bold">
            Option {optionNo(numbers, option.id)} <ReviewBadge state={option.reviewState} />
            {option.approvalStale ? <StaleApproval /> : null}{" "}
            <span className="text-base font-semibold text-ink/70" data-testid="revision">
              revision {revisionLetter(option.revision)}
            </span>
          </h1>
          <p className="text-sm text-ink/80">
            Saved by {option.createdBy ?? "—"} on {option.createdAt.slice(0, 10)}
            {option.note ? ` · “${option.note}”` : ""}
          </p>
        </div>
        <div className="no-print flex flex-wrap gap-2">
          <Link to={`/options/${option.id}/record`} className="rounded-md bg-accent px-3 py-1.5 text-sm font-semibold text-white">
            Calculation record
          </Link>
          <a href={`/options/${option.id}/section.svg`} download className="rounded-md border border-ink/30 bg-white px-3 py-1.5 text-sm font-semibold">
            Section drawing (SVG)
          </a>
          {may.recheck ? (
            <Link to={`/sweeps/${option.sweepId}/recheck`} className="rounded-md border border-ink/30 bg-white px-3 py-1.5 text-sm font-semibold">
              Recheck with altered limits
            </Link>
          ) : null}
        </div>
      </div>
      {otherErrors ? (
        <p role="alert" className="rounded-md border border-red-800 bg-red-50 px-3 py-2 text-sm font-semibold text-red-900">
          {Object.values(otherErrors).join("; ")}
        </p>
      ) : null}
      <Caution problem={option.problem} />
      {!feasible ? <p className="rounded-md border border-red-800 bg-red-50 p-3 text-sm">This section fails its own brief's checks (the engine may have changed since it was saved). Recheck it.</p> : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <section aria-label="Candidate">
          <CompareCandidates candidates={[{ rank: c.rank, family: c.family, dimensions: c.dimensions, massPerMetre: c.massPerMetre, utilisation: c.utilisation, governing: c.governing, onFront: false, source: c.source, designation: c.designation, catalogue: c.catalogue }]} problem={option.problem} units={option.units} />
        </section>
        <section aria-labelledby="brief-h" className="space-y-2">
          <h2 id="brief-h" className="text-lg font-bold">
            The problem it was checked against
          </h2>
          <OptionProvenance option={option} numbers={numbers} />
          <BasisNote problem={option.problem} />
          <BriefSummary problem={option.problem} units={option.units} />
          <Assumptions problem={option.problem} units={option.units} notes={notes ?? undefined} />
        </section>
      </div>
      <OptionAttachments
        optionId={option.id}
        attachments={attachments}
        mayAttach={may.attach}
        // the server decides (attachments.server.ts); this only hides buttons it would refuse
        mayDelete={(a) => may.attach && (me.admin || a.createdById === me.id)}
      />
      <section aria-labelledby="review-h" className="space-y-3">
        <h2 id="review-h" className="text-lg font-bold">
          Review
        </h2>
        {reviews.length ? (
          <ol className="space-y-1 text-sm" data-testid="reviews">
            {reviews.map((r) => (
              <li key={r.id}>
                <time className="text-ink/60 tabular-nums">{r.at.slice(0, 16).replace("T", " ")}</time> {r.who}: <strong>{r.decision}</strong> (revision {revisionLetter(r.revision)})
                {r.comment ? ` — ${r.comment}` : ""}
              </li>
            ))}
          </ol>
        ) : (
          <p className="text-sm text-ink/70">No review yet.</p>
        )}
        {done ? (
          <p role="status" className="rounded-md border border-accent bg-teal-50 px-3 py-2 text-sm">
            {done}
          </p>
        ) : null}
        {may.request ? (
          <Form method="post" className="flex flex-wrap items-end gap-2 text-sm">
            <input type="hidden" name="intent" value="requestReview" />
            <label>
              <span className="block font-semibold">Note to the reviewer (optional)</span>
              <input
                name="comment"
                maxLength={4000}
                className="w-80 max-w-full rounded-md border border-ink/30 px-2 py-1"
                aria-invalid={requestErrors?.comment ? true : undefined}
                aria-describedby={requestErrors ? "request-error" : undefined}
              />
            </label>
            <button className="rounded-md bg-accent px-3 py-1.5 font-semibold text-white">Request review</button>
            <FieldErrors id="request-error" errors={requestErrors} />
          </Form>
        ) : null}
        {refusal ? <p className="rounded-md border border-ink/20 bg-paper p-3 text-sm">{refusal}</p> : null}
        {may.review ? (
          <Form method="post" className="space-y-2 text-sm">
            <input type="hidden" name="intent" value="decide" />
            <label className="block">
              <span className="block font-semibold">Comment (required to return)</span>
              <textarea
                name="comment"
                rows={3}
                maxLength={4000}
                className="w-full max-w-xl rounded-md border border-ink/30 px-2 py-1"
                aria-invalid={decideErrors?.comment ? true : undefined}
                aria-describedby={decideErrors ? "decide-error" : undefined}
              />
            </label>
            <FieldErrors id="decide-error" errors={decideErrors} />
            <div className="flex gap-2">
              <button name="decision" value="approved" className="rounded-md bg-accent px-3 py-1.5 font-semibold text-white">
                Approve
              </button>
              <button name="decision" value="returned" className="rounded-md border border-red-800 bg-white px-3 py-1.5 font-semibold text-red-800">
                Return
              </button>
            </div>
          </Form>
        ) : null}
      </section>
    </div>
  );
}

/** A form's errors, written where its fields and buttons are (announced when they appear). */
function FieldErrors({ id, errors }: { id: string; errors: Record<string, string> | null }) {
  if (!errors) return null;
  return (
    <p id={id} role="alert" className="basis-full font-semibold text-red-800">
      {Object.values(errors).join("; ")}
    </p>
  );
}

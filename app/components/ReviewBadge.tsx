// An option's review state in words and a colour of our own palette (never colour alone: the word is always there).
const LOOK: Record<string, { text: string; cls: string }> = {
  draft: { text: "Draft", cls: "border-ink/30 text-ink" },
  in_review: { text: "Waiting for review", cls: "border-caution text-caution" },
  approved: { text: "Approved", cls: "border-accent text-accent-strong" },
  returned: { text: "Returned", cls: "border-red-800 text-red-800" },
};

export function ReviewBadge({ state }: { state: string }) {
  const l = LOOK[state] ?? { text: state, cls: "border-ink/30" };
  return <span className={`inline-block rounded-full border bg-white px-2 py-0.5 text-xs font-semibold ${l.cls}`}>{l.text}</span>;
}

/** Beside an approval whose brief changed afterwards: the approval was given for other limits. */
export function StaleApproval() {
  return (
    <span className="ml-1 inline-block rounded-full border border-caution bg-white px-2 py-0.5 text-xs font-semibold text-caution" data-testid="stale-approval" title="The brief's limits changed after this approval; recheck it">
      Brief changed since approval
    </span>
  );
}

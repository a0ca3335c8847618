// A sweep's progress in words (issue 11, item 6): what is counted (shapes of the grid settled,
// families searched, candidates evaluated), elapsed time, and an estimate of what is left only when
// the queue has one. Before the search has counted its grid there is no "of ?" and no blank
// estimate: the line says the search is starting. Drawn as a native <progress> (announced by
// screen readers) with the words beside it.
export function formatDuration(ms: number | null): string {
  if (ms === null || !Number.isFinite(ms)) return "—";
  const s = Math.round(ms / 1000);
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  return m < 60 ? `${m} min ${s % 60} s` : `${Math.floor(m / 60)} h ${m % 60} min`;
}

export interface ProgressFacts {
  done: number;
  total: number;
  /** what done and total count, in words ("shapes settled …"); null for older sweeps */
  counts?: string | null;
  /** families searched to the end, of how many; null until the search reports it */
  families?: { done: number; total: number } | null;
  /** candidates evaluated so far; null until the search reports it */
  evaluated?: number | null;
}

const n = (x: number) => x.toLocaleString("en");

/** The lines the progress section reads, in order (pure, so the wording is tested on its own). */
export function progressLines(p: ProgressFacts, status: string, elapsedMs: number | null, etaMs: number | null): string[] {
  if (status === "queued") return ["Waiting in the queue; the search starts when a worker is free."];
  const time = `Elapsed ${formatDuration(elapsedMs)}${etaMs !== null && Number.isFinite(etaMs) ? ` · about ${formatDuration(etaMs)} left` : ""}`;
  if (!(p.total > 0)) return ["Starting the search: counting the shapes of the grid.", time];
  const lines: string[] = [];
  if (p.done >= p.total) lines.push(`Search done: all ${n(p.total)} shapes of the grid settled; finishing the results.`);
  else {
    const pct = Math.min(99, Math.floor((100 * p.done) / p.total));
    // older sweeps stored no unit: the grid's shapes is still what the engine counts
    lines.push(`${n(p.done)} of ${n(p.total)} ${p.counts ?? "shapes of the grid settled"} (${pct}%)`);
  }
  const more = [
    p.families ? `Families searched: ${n(p.families.done)} of ${n(p.families.total)}` : null,
    p.evaluated !== null && p.evaluated !== undefined ? `Candidates evaluated: ${n(p.evaluated)}` : null,
  ].filter((x): x is string => x !== null);
  if (more.length) lines.push(more.join(" · "));
  lines.push(time);
  return lines;
}

export function ProgressBar({ progress, elapsedMs, etaMs, status }: { progress: ProgressFacts; elapsedMs: number | null; etaMs: number | null; status: string }) {
  const { done, total } = progress;
  const fraction = total > 0 ? Math.min(1, done / total) : 0;
  return (
    <div className="space-y-1">
      <progress className="h-3 w-full accent-accent" max={total > 0 ? total : 1} value={total > 0 && status !== "queued" ? done : undefined} aria-label="Sweep progress">
        {Math.round(fraction * 100)}%
      </progress>
      <div className="text-sm tabular-nums" aria-live="polite" data-testid="progress-words">
        {progressLines(progress, status, elapsedMs, etaMs).map((l) => (
          <p key={l}>{l}</p>
        ))}
      </div>
    </div>
  );
}

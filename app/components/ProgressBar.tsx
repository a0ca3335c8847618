// A sweep's progress: done / total and what they count, elapsed and a rough estimate of what is
// left, as a native <progress> (announced by screen readers) with the numbers written beside it.
export function formatDuration(ms: number | null): string {
  if (ms === null || !Number.isFinite(ms)) return "—";
  const s = Math.round(ms / 1000);
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  return m < 60 ? `${m} min ${s % 60} s` : `${Math.floor(m / 60)} h ${m % 60} min`;
}

export function ProgressBar({
  done,
  total,
  counts = null,
  elapsedMs,
  etaMs,
  status,
}: {
  done: number;
  total: number;
  /** what done and total count, in words ("shapes settled …"); null before the search reports */
  counts?: string | null;
  elapsedMs: number | null;
  etaMs: number | null;
  status: string;
}) {
  const fraction = total > 0 ? Math.min(1, done / total) : 0;
  return (
    <div className="space-y-1">
      <progress className="h-3 w-full accent-accent" max={total > 0 ? total : 1} value={total > 0 ? done : undefined} aria-label="Sweep progress">
        {Math.round(fraction * 100)}%
      </progress>
      <p className="text-sm tabular-nums" aria-live="polite">
        {status === "queued" ? "Waiting in the queue…" : `${done.toLocaleString("en")} of ${total > 0 ? total.toLocaleString("en") : "?"} ${counts ?? "steps"} (${Math.round(fraction * 100)}%)`} · elapsed{" "}
        {formatDuration(elapsedMs)} · about {formatDuration(etaMs)} left
      </p>
    </div>
  );
}

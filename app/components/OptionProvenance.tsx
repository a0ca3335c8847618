// Where an option came from and which problem it was checked against: the sweep it was saved
// from (and, for a recheck, the sweep that one rechecked), the brief, and the fact that the limits
// shown are that sweep's own snapshot, not the brief's current values (issue 11, item 3).
import { NO_NUMBERS, sweepNo, type Numbers } from "~/lib/numbering";
import { Link } from "react-router";

export interface ProvenanceFacts {
  sweepId: number | null;
  recheckOf: number | null;
  briefId: number | null;
  briefName: string | null;
  /** the record revision shown (1 = A); later ones are checked against the brief as edited */
  revision?: number;
}

export function OptionProvenance({ option, numbers = NO_NUMBERS, linked = true }: { option: ProvenanceFacts; numbers?: Numbers; linked?: boolean }) {
  const sweep = (id: number) =>
    linked ? (
      <Link to={`/sweeps/${id}`} className="text-accent underline">
        sweep {sweepNo(numbers, id)}
      </Link>
    ) : (
      <>sweep {sweepNo(numbers, id)}</>
    );
  return (
    <p className="text-sm" data-testid="provenance">
      {option.sweepId ? (
        <>
          Saved from {sweep(option.sweepId)}
          {option.recheckOf ? <>, a recheck of {sweep(option.recheckOf)}</> : null}
        </>
      ) : (
        <>Saved from a sweep that no longer exists</>
      )}
      {option.briefName ? <> · brief “{option.briefName}”</> : null}.{" "}
      {option.revision && option.revision > 1 ? (
        <>This revision checks the same section against the brief's limits as edited after it was put to review, listed here.</>
      ) : (
        <>
          Checked against the limits {option.recheckOf ? "the recheck" : "that sweep"} ran with, listed here
          {option.recheckOf ? "; they differ from the brief's own" : ""} (an edit of the brief after the option was put to review makes a new revision of its record).
        </>
      )}
    </p>
  );
}

// Record revisions (product.md, "Member mark, revision"): pure helpers shared by pages and modules.
import type { SearchProblem } from "~/optimizer/search-schema";

export interface RevisionSignature {
  who: string;
  at: string;
  comment: string | null;
}

export interface RecordRevision {
  number: number;
  letter: string;
  problem: SearchProblem;
  memberLengthM: number | null;
  memberCount: number | null;
  /** why this revision was made, in words */
  reason: string;
  /** who made it (saved the option, or edited the brief) and when */
  prepared: RevisionSignature | null;
  /** the approval given on this revision (the latest decision on it was an approval), else null */
  approved: RevisionSignature | null;
  /** the latest decision or request on this revision */
  state: "draft" | "in_review" | "approved" | "returned";
  current: boolean;
}


/** 1 → "A", 26 → "Z", 27 → "AA": the letters drawings use for revisions. */
export function revisionLetter(n: number): string {
  let s = "";
  for (let k = Math.max(1, Math.floor(n)); k > 0; k = Math.floor((k - 1) / 26)) s = String.fromCharCode(65 + ((k - 1) % 26)) + s;
  return s;
}

/** "A" → 1, "ab" → 28; NaN for anything that is not letters only (at most 3 of them). */
export function revisionNumber(letter: string | null | undefined): number {
  if (!letter || !/^[A-Za-z]{1,3}$/.test(letter)) return NaN;
  let n = 0;
  for (const ch of letter.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n;
}

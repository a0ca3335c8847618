// Candidate ordering (engine contract, "Objective" and its tie-breaks) and the weight-versus-
// utilisation front, shared by the brute-force reference and the fast search.
import type { FamilyKernel } from "./family-kernel";

/** A candidate as the searches hold it: dimension vector in the family table's order. */
export interface RawCandidate {
  /** index of the family in problem.families */
  fi: number;
  fk: FamilyKernel;
  v: Float64Array;
  /** area (mm²) for objective "mass", cost per metre for "cost" */
  objective: number;
  area: number;
  utilisation: number;
  governing: number;
}

/**
 * Objective values this close (relative) are a tie, settled by the contract's tie-breaks.
 * Why a tolerance: areas of different shapes that are equal on paper can differ in the last
 * bit (sums of products of decimal steps). 1e-12 is far below any real difference on a grid.
 */
export const TIE_REL = 1e-12;

export function sameObjective(a: number, b: number): boolean {
  return Math.abs(a - b) <= TIE_REL * Math.max(Math.abs(a), Math.abs(b));
}

/** Negative when a ranks before b within one family (objective, then area for "cost", then tie order). */
export function compareInFamily(a: RawCandidate, b: RawCandidate): number {
  if (!sameObjective(a.objective, b.objective)) return a.objective - b.objective;
  if (!sameObjective(a.area, b.area)) return a.area - b.area;
  for (const i of a.fk.tieOrder) if (a.v[i] !== b.v[i]) return a.v[i] - b.v[i];
  return 0;
}

/** Across families: objective (then area), then the family listed first in `families`. */
export function compareAcross(a: RawCandidate, b: RawCandidate): number {
  if (a.fi === b.fi) return compareInFamily(a, b);
  if (!sameObjective(a.objective, b.objective)) return a.objective - b.objective;
  if (!sameObjective(a.area, b.area)) return a.area - b.area;
  return a.fi - b.fi;
}

/**
 * The front, kept incrementally: candidates that no other beats on both objective and
 * utilisation. "Beats on both" is read literally (engine contract, SearchResult.front):
 * strictly lighter AND strictly lower utilisation; so equal-weight candidates with different
 * utilisations can all stay, and exact duplicates of a point all stay.
 * Invariant: sorted by (objective, utilisation); across distinct objectives utilisation never
 * rises (each member is at or below every utilisation of the strictly lighter members).
 */
export class Front {
  items: RawCandidate[] = [];

  /** Would c survive against the current members? (cheap: one binary search) */
  private admits(obj: number, util: number): { ok: boolean; at: number } {
    const it = this.items;
    let lo = 0,
      hi = it.length;
    while (lo < hi) {
      const m = (lo + hi) >> 1;
      if (it[m].objective < obj) lo = m + 1;
      else hi = m;
    }
    // strictly lighter members are it[0..lo); their least utilisation sits in the last objective group
    if (lo > 0) {
      const g = it[lo - 1].objective;
      let minU = Infinity;
      for (let j = lo - 1; j >= 0 && it[j].objective === g; j--) if (it[j].utilisation < minU) minU = it[j].utilisation;
      if (util > minU) return { ok: false, at: lo };
    }
    return { ok: true, at: lo };
  }

  /**
   * The least utilisation among members strictly lighter than obj (Infinity when none). Every
   * feasible candidate offered so far that is strictly lighter than obj has a utilisation at
   * least this (a non-member is beaten by a lighter member with a lower utilisation), so any
   * candidate of objective ≥ obj whose utilisation exceeds it is beaten: the search's dominance
   * bound (search.ts, (D)).
   */
  minUtilBelow(obj: number): number {
    const it = this.items;
    let lo = 0,
      hi = it.length;
    while (lo < hi) {
      const m = (lo + hi) >> 1;
      if (it[m].objective < obj) lo = m + 1;
      else hi = m;
    }
    if (lo === 0) return Infinity;
    const g = it[lo - 1].objective;
    let minU = Infinity;
    for (let j = lo - 1; j >= 0 && it[j].objective === g; j--) if (it[j].utilisation < minU) minU = it[j].utilisation;
    return minU;
  }

  /** Offers c; true when it became a member. */
  offer(c: RawCandidate, copy: (c: RawCandidate) => RawCandidate): boolean {
    const { ok, at } = this.admits(c.objective, c.utilisation);
    if (!ok) return false;
    const it = this.items;
    let pos = at;
    while (pos < it.length && it[pos].objective === c.objective && it[pos].utilisation <= c.utilisation) {
      // the same candidate offered again (a search that already knew it): keep one
      if (it[pos].utilisation === c.utilisation && it[pos].fi === c.fi && it[pos].v.every((x, i) => x === c.v[i])) return false;
      pos++;
    }
    // members strictly heavier and strictly more utilised are now beaten
    let j = pos;
    while (j < it.length && it[j].objective === c.objective) j++;
    let w = j;
    for (let r = j; r < it.length; r++) {
      const x = it[r];
      if (x.objective > c.objective && x.utilisation > c.utilisation) continue;
      it[w++] = x;
    }
    it.length = w;
    it.splice(pos, 0, copy(c));
    return true;
  }
}

/**
 * (objective, utilisation) pairs of feasible candidates found elsewhere (another thread's part of
 * the same grid), kept only for minUtilBelow: a staircase, objectives ascending and utilisations
 * strictly falling (a pair with a lighter-or-equal, no more utilised pair before it can never give
 * a smaller answer).
 */
export class Staircase {
  private o: number[] = [];
  private u: number[] = [];

  add(objective: number, utilisation: number): void {
    const o = this.o,
      u = this.u;
    let lo = 0,
      hi = o.length;
    while (lo < hi) {
      const m = (lo + hi) >> 1;
      if (o[m] <= objective) lo = m + 1;
      else hi = m;
    }
    // o[0..lo) are at or below objective: the last has their least utilisation
    if (lo > 0 && u[lo - 1] <= utilisation) return;
    let e = lo;
    while (e < o.length && u[e] >= utilisation) e++;
    o.splice(lo, e - lo, objective);
    u.splice(lo, e - lo, utilisation);
  }

  /** The least utilisation among the pairs strictly lighter than objective (Infinity when none). */
  minUtilBelow(objective: number): number {
    const o = this.o;
    let lo = 0,
      hi = o.length;
    while (lo < hi) {
      const m = (lo + hi) >> 1;
      if (o[m] < objective) lo = m + 1;
      else hi = m;
    }
    return lo === 0 ? Infinity : this.u[lo - 1];
  }
}

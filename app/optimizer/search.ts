// The exact section search (engine contract, SearchProblem / SearchResult): best-first
// branch-and-bound over the grid, ordered by the objective (area, or cost), with only sound
// bounds, so `best` (and each `bestByFamily`) is exactly what brute-force.ts finds.
//
// How it stays exact:
// - A row is one family with every dimension fixed except one width ("free", b; bb for
//   mono-i). Along a row the objective grows strictly with the free width (plate areas are
//   linear in it), so the first feasible point of a row is the row's best.
// - Rows sit in a min-heap keyed by a lower bound on the objective of their next unexcluded
//   point. Points are excluded only by necessary conditions proven below; every other point
//   is evaluated by checks.ts (the same evaluation as brute force), in objective order.
//   The family's search stops when the heap's least key exceeds the incumbent (with a 1e-9
//   relative margin, so ties are still popped and settled by the contract's tie-breaks).
// - Necessary conditions (each relaxed by 1e-9 relative so rounding never excludes a point):
//   (1) Iz grows with every dimension: adding material never lowers the centroidal second
//       moment (parallel-axis theorem: I_new ≥ I_old + ΔA·e²·(1 − ΔA/A_new) ≥ I_old), and a
//       deeper shape is the shallower one split and pulled apart plus web.
//   (2) Bending needs Iz ≥ M·c/σ at each fibre. Since c_top + c_bot = d, max over the two
//       fibres of c/σ ≥ d/(σc + σt): Iz ≥ M·d/(σc + σt) for every family, the angle included
//       (its two left corners are d apart in the general formula's lever arm, and the
//       effective I = Iz − Iyz²/Iy ≤ Iz). Shapes symmetric about z have c = d/2 exactly.
//       Sections with one plate on top (tee, channel-down) or, for mono-i, the bottom flange
//       as the free width: the centroid moves monotonically with the free width (toward
//       the free plate), so over the rest of the row the far fibre's c is at least its
//       value now, and the near fibre's at least its value at the row's widest point.
//   (3) Deflection needs I ≥ 5wL⁴/(384·E·δ_allow) (I ≤ Iz as in (2)).
//   (4) For any axis y0, Iz ≤ I about y0 (parallel-axis theorem), and I about a fixed y0 is
//       affine in the free width, so "Iz ≥ I_req" gives a closed-form lower bound on the
//       free width; with y0 at the current centroid it is tight for symmetric shapes and
//       converges in a few rounds otherwise.
//   (5) Shear (i, channel, box, rectangle: neutral axis fixed at mid-depth): the shear stress
//       at the neutral axis, V·Q_NA/(Iz·b_NA), is one of the points the contract's maximum
//       runs over, so it must not exceed the allowable. Q_NA and Iz are affine in the free
//       width and b_NA is fixed (rectangle: 1.5V/(b·d)), so the ratio is monotone along the
//       row and its passing points form one interval, found by bisection.
//   (6) Slenderness ratios are affine in the free width: explicit limits on it.
// - mono-i has two widths: a "super" node per (d, tft, tfb, tw) bounds both with the
//   fractional-knapsack solution of min objective s.t. I_y0(bt, bb) ≥ I_req (a 2-variable
//   LP solved in closed form, valid by (4)); popping it spawns one row per bt.
//
// What the fast search guarantees: `best`, `bestByFamily` and `counts.grid` equal brute
// force's; `counts.evaluated` is the number of candidates it actually evaluated;
// `counts.feasible` and `front` are over those evaluated candidates only (engine contract:
// "among the feasible candidates evaluated"), so they are a subset of brute force's. Pass
// `exhaustive: true` to get the brute-force front and feasible count.
//
// Progress: onProgress(familiesDone, families) per family (a best-first search has no honest
// per-candidate fraction). Abort: the signal is checked every 4096 heap steps; an aborted
// search throws the signal's reason (an AbortError DOMException unless the caller gave one).
import { Scratch, evaluateCandidate, plateObjective, type CheckContext } from "./checks";
import { compositeKernel, plateQAbove, plateWidthAt, K_CY, K_IZ, K_MAXY, K_MINY, PLATE_STRIDE } from "./composite";
import { bruteForceSearch } from "./brute-force";
import { C_COMP, C_DEFL, C_SHEAR, C_TENS, type FamilyKernel } from "./family-kernel";
import type { RawCandidate } from "./front";
import { ABORT_EVERY, Tally, buildResult, checkAbort, offerFeasible, prepare, type PreparedFamily, type SearchOptions, type SearchResult } from "./grid";
import { searchProblemSchema, type SearchProblemInput } from "./search-schema";

export type { SearchOptions, SearchResult, SearchCandidate } from "./grid";

const REL = 1e-9;
const KIND_READY = 0,
  KIND_RAW = 1,
  KIND_SUPER = 2;

/** Binary min-heap on typed arrays: key, row id, k (next free-width index), kHi, kind. */
class Heap {
  key = new Float64Array(1024);
  id = new Float64Array(1024);
  k = new Int32Array(1024);
  hi = new Int32Array(1024);
  kind = new Int8Array(1024);
  size = 0;
  private grow() {
    const n = this.key.length * 2;
    const g = <T extends Float64Array | Int32Array | Int8Array>(a: T, C: new (n: number) => T): T => {
      const b = new C(n);
      b.set(a);
      return b;
    };
    this.key = g(this.key, Float64Array);
    this.id = g(this.id, Float64Array);
    this.k = g(this.k, Int32Array);
    this.hi = g(this.hi, Int32Array);
    this.kind = g(this.kind, Int8Array);
  }
  push(key: number, id: number, k: number, hi: number, kind: number) {
    if (this.size === this.key.length) this.grow();
    let i = this.size++;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (this.key[p] <= key) break;
      this.move(p, i);
      i = p;
    }
    this.key[i] = key;
    this.id[i] = id;
    this.k[i] = k;
    this.hi[i] = hi;
    this.kind[i] = kind;
  }
  private move(from: number, to: number) {
    this.key[to] = this.key[from];
    this.id[to] = this.id[from];
    this.k[to] = this.k[from];
    this.hi[to] = this.hi[from];
    this.kind[to] = this.kind[from];
  }
  // pops the top into the out fields
  outKey = 0;
  outId = 0;
  outK = 0;
  outHi = 0;
  outKind = 0;
  pop() {
    this.outKey = this.key[0];
    this.outId = this.id[0];
    this.outK = this.k[0];
    this.outHi = this.hi[0];
    this.outKind = this.kind[0];
    const n = --this.size;
    if (n === 0) return;
    const key = this.key[n];
    let i = 0;
    for (;;) {
      let c = 2 * i + 1;
      if (c >= n) break;
      if (c + 1 < n && this.key[c + 1] < this.key[c]) c++;
      if (this.key[c] >= key) break;
      this.move(c, i);
      i = c;
    }
    this.move(n, i);
  }
}

/** Second moment of the plates about the horizontal line y = y0 (parallel-axis theorem). */
function iAbout(p: Float64Array, n: number, y0: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) {
    const o = i * PLATE_STRIDE;
    const b = p[o],
      h = p[o + 1];
    const e = p[o + 3] + 0.5 * h - y0;
    s += b * h * (h * h / 12 + e * e);
  }
  return s;
}

/** First index k with a[k] > x (a ascending). */
function firstAbove(a: Float64Array, x: number): number {
  let lo = 0,
    hi = a.length;
  while (lo < hi) {
    const m = (lo + hi) >> 1;
    if (a[m] > x) hi = m;
    else lo = m + 1;
  }
  return lo;
}
/** First index k with a[k] ≥ x. */
function firstAtLeast(a: Float64Array, x: number): number {
  let lo = 0,
    hi = a.length;
  while (lo < hi) {
    const m = (lo + hi) >> 1;
    if (a[m] >= x) hi = m;
    else lo = m + 1;
  }
  return lo;
}

/** One family's branch-and-bound. */
class FamilySearch {
  readonly fk: FamilyKernel;
  readonly ctx: CheckContext;
  readonly W: Float64Array;
  readonly v: Float64Array;
  readonly plates = new Float64Array(8 * PLATE_STRIDE);
  readonly kout = new Float64Array(16);
  readonly scratch = new Scratch();
  readonly heap = new Heap();
  readonly groupDims: number[];
  readonly radix: number[];
  readonly sym: boolean;
  readonly sumAllow: number;
  readonly minAllow: number;
  readonly Idefl: number;
  readonly cand: RawCandidate;
  /** the check that last excluded points in rowStart (for `reason`) */
  cause = C_TENS;
  slR1 = new Float64Array(8);
  slR2 = new Float64Array(8);

  constructor(
    readonly pf: PreparedFamily,
    ctx: CheckContext,
    readonly t: Tally,
  ) {
    this.fk = pf.fk;
    this.ctx = ctx;
    this.W = pf.axes[pf.fk.free];
    this.v = new Float64Array(pf.fk.dims.length);
    this.groupDims = pf.fk.dims.map((_, i) => i).filter((i) => i !== pf.fk.free);
    this.radix = this.groupDims.map((i) => pf.axes[i].length);
    this.sym = this.fk.centroidDir === 0 && !this.fk.unsymmetric;
    this.sumAllow = ctx.aC + ctx.aT;
    this.minAllow = Math.min(ctx.aC, ctx.aT);
    this.Idefl = ctx.hasDeflection ? ctx.deflNumerator / ctx.deflLimit : 0;
    this.cand = { fi: pf.fi, fk: this.fk, v: this.v, objective: 0, area: 0, utilisation: 0, governing: -1 };
  }

  /** row id (mixed radix over the group dimensions) → v */
  decode(id: number): void {
    for (let j = this.groupDims.length - 1; j >= 0; j--) {
      const r = this.radix[j];
      const q = Math.floor(id / r);
      const dIdx = this.groupDims[j];
      this.v[dIdx] = this.pf.axes[dIdx][id - q * r];
      id = q;
    }
  }

  incumbent(): number {
    const c = this.t.bestByFamily[this.pf.fi];
    return c ? c.objective * (1 + REL) : Infinity;
  }

  objectiveAt(k: number): number {
    this.v[this.fk.free] = this.W[k];
    this.fk.fill(this.v, this.plates);
    return plateObjective(this.fk, this.v, this.plates, this.ctx);
  }

  /** Base I requirement from (2) and (3) for depth d (relaxed by REL later). */
  baseIreq(d: number): number {
    const c = this.ctx;
    const M = Math.max(c.Ms, c.Mh);
    const bend = this.sym ? (M * d) / 2 / this.minAllow : (M * d) / this.sumAllow;
    return Math.max(bend, this.Idefl);
  }

  /**
   * Slenderness limits along the row, (6): returns kHi (last allowed free index), or −1 when
   * a ratio that does not involve the free width already fails. kLo given.
   */
  rowHi(kLo: number): number {
    const fk = this.fk,
      W = this.W,
      last = W.length - 1;
    let kHi = last;
    if (fk.slenderKinds.length === 0) return kHi;
    const v = this.v,
      f = fk.free;
    v[f] = W[kLo];
    fk.slender(v, this.slR1);
    v[f] = W[last];
    fk.slender(v, this.slR2);
    for (let e = 0; e < fk.slenderKinds.length; e++) {
      const c = fk.slenderKinds[e];
      const lim = this.ctx.slenderLimit[c];
      if (lim !== lim) continue;
      const r1 = this.slR1[e],
        r2 = this.slR2[e];
      if (r1 === r2 || kLo === last) {
        if (r1 > lim * (1 + REL)) {
          this.t.ruledOut[c] += last - kLo + 1;
          return -1;
        }
        continue;
      }
      // affine: r(b) = r1 + (b − b1)·slope
      const slope = (r2 - r1) / (W[last] - W[kLo]);
      if (slope > 0) {
        const bMax = W[kLo] + (lim - r1) / slope;
        const h = firstAbove(W, bMax + REL * (Math.abs(bMax) + 1)) - 1;
        if (h < kHi) {
          this.t.ruledOut[c] += kHi - Math.max(h, kLo - 1);
          kHi = h;
        }
      }
    }
    return kHi < kLo ? -1 : kHi;
  }

  /**
   * First index ≥ k (≤ kHi) not excluded by (1)–(5), or −1. Leaves nothing in v but the free width.
   */
  rowStart(k: number, kHi: number): number {
    const fk = this.fk,
      ctx = this.ctx,
      W = this.W,
      v = this.v,
      p = this.plates,
      ko = this.kout,
      n = fk.nPlates,
      f = fk.free;
    if (k > kHi) return -1;
    const d = this.depthOf();
    const base = this.baseIreq(d);
    let cTopHi = 0,
      cBotHi = 0;
    if (!this.sym && !fk.unsymmetric) {
      v[f] = W[kHi];
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      cTopHi = ko[K_MAXY] - ko[K_CY];
      cBotHi = ko[K_CY] - ko[K_MINY];
    }
    for (let iter = 0; iter < 12; iter++) {
      const b = W[k];
      v[f] = b;
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      const Iz = ko[K_IZ],
        cy = ko[K_CY];
      let req = base;
      let cause = base === this.Idefl && this.Idefl > 0 ? C_DEFL : ctx.aT <= ctx.aC ? C_TENS : C_COMP;
      if (!this.sym && !fk.unsymmetric) {
        const cTop = ko[K_MAXY] - cy,
          cBot = cy - ko[K_MINY];
        const cTopLb = fk.centroidDir > 0 ? cTopHi : cTop;
        const cBotLb = fk.centroidDir > 0 ? cBot : cBotHi;
        const terms = [
          [(ctx.Ms * cTopLb) / ctx.aC, C_COMP],
          [(ctx.Ms * cBotLb) / ctx.aT, C_TENS],
          [(ctx.Mh * cTopLb) / ctx.aT, C_TENS],
          [(ctx.Mh * cBotLb) / ctx.aC, C_COMP],
        ];
        for (const [r, c] of terms)
          if (r > req) {
            req = r;
            cause = c;
          }
      }
      req *= 1 - REL;
      if (Iz >= req) break;
      this.cause = cause;
      if (k === kHi) return this.dead(k, kHi);
      // (4): I about the current centroid, affine in the free width
      v[f] = W[kHi];
      fk.fill(v, p);
      const iHi = iAbout(p, n, cy);
      if (iHi < req) return this.dead(k, kHi);
      const slope = (iHi - Iz) / (W[kHi] - b);
      const bNeed = b + (req - Iz) / slope;
      let k2 = firstAtLeast(W, bNeed - REL * (Math.abs(bNeed) + 1));
      if (k2 <= k) k2 = k + 1;
      if (k2 > kHi) return this.dead(k, kHi);
      this.t.ruledOut[cause] += k2 - k;
      k = k2;
    }
    if (ctx.hasShear && ctx.V > 0 && this.sym) {
      if (!this.shearOk(k)) {
        this.cause = C_SHEAR;
        if (k === kHi || !this.shearOk(kHi)) return this.dead(k, kHi);
        // monotone along the row, (5): bisect for the first passing index
        let lo = k,
          hi = kHi; // lo fails, hi passes
        while (hi - lo > 1) {
          const m = (lo + hi) >> 1;
          if (this.shearOk(m)) hi = m;
          else lo = m;
        }
        this.t.ruledOut[C_SHEAR] += hi - k;
        k = hi;
      }
    }
    return k;
  }

  private dead(k: number, kHi: number): number {
    this.t.ruledOut[this.cause] += kHi - k + 1;
    return -1;
  }

  /** (5): the shear stress at the neutral axis does not exceed the allowable (necessary). */
  shearOk(k: number): boolean {
    const fk = this.fk,
      p = this.plates,
      n = fk.nPlates;
    this.v[fk.free] = this.W[k];
    fk.fill(this.v, p);
    compositeKernel(p, n, this.kout);
    const cy = this.kout[K_CY];
    const q = Math.abs(plateQAbove(p, n, cy, cy));
    const w = Math.max(plateWidthAt(p, n, cy, 1), plateWidthAt(p, n, cy, -1));
    // the contract's maximum at the NA takes the larger of q/w_above, q/w_below; the smaller
    // width gives the larger factor, so the larger width gives a value it cannot be below
    const tau = (this.ctx.V * q) / (this.kout[K_IZ] * w);
    return tau <= this.ctx.aS * (1 + REL);
  }

  depthOf(): number {
    // every family's overall depth is its "d"
    return this.v[this.fk.dims.indexOf("d")];
  }

  /** Pushes a ready row node at its first unexcluded index, if it can still beat the incumbent. */
  pushReady(id: number, k: number, kHi: number): void {
    const k2 = this.rowStart(k, kHi);
    if (k2 < 0) return;
    const key = this.objectiveAt(k2);
    if (key <= this.incumbent()) this.heap.push(key, id, k2, kHi, KIND_READY);
  }

  run(signal: AbortSignal | undefined): void {
    const fk = this.fk;
    if (this.pf.axes.some((a) => a.length === 0)) return;
    if (fk.second >= 0) this.seedSupers();
    else this.seedRows();
    const h = this.heap;
    let steps = 0;
    while (h.size > 0) {
      if (++steps % ABORT_EVERY === 0) checkAbort(signal);
      if (h.key[0] > this.incumbent()) break;
      h.pop();
      const id = h.outId,
        k = h.outK,
        kHi = h.outHi;
      this.decode(id);
      if (h.outKind === KIND_SUPER) {
        this.expandSuper(id);
        continue;
      }
      if (h.outKind === KIND_RAW) {
        this.pushReady(id, k, kHi);
        continue;
      }
      // KIND_READY: evaluate the point (same evaluation as brute force)
      this.v[fk.free] = this.W[k];
      this.t.evaluated++;
      const s = this.scratch;
      if (evaluateCandidate(fk, this.v, this.ctx, s, false)) {
        const c = this.cand;
        c.objective = s.objective;
        c.area = s.area;
        c.utilisation = s.utilisation;
        c.governing = s.governing;
        offerFeasible(this.t, c);
        // the rest of the row is heavier
      } else {
        this.t.ruledOut[s.governing]++;
        if (k < kHi) this.pushReady(id, k + 1, kHi);
      }
    }
    // Rows left in the heap are pruned by the incumbent, which exists whenever anything was left.
  }

  /** Every valid row: counts the grid and seeds the heap with a cheap key (the row's least objective). */
  seedRows(): void {
    const fk = this.fk,
      gd = this.groupDims,
      rad = this.radix,
      v = this.v,
      W = this.W;
    const idx = new Int32Array(gd.length);
    for (let j = 0; j < gd.length; j++) v[gd[j]] = this.pf.axes[gd[j]][0];
    let id = 0;
    for (;;) {
      if (fk.groupValid(v)) {
        const kLo = firstAbove(W, fk.freeMin(v));
        if (kLo < W.length) {
          this.t.grid += W.length - kLo;
          const kHi = this.rowHi(kLo);
          if (kHi >= 0) this.heap.push(this.objectiveAt(kLo), id, kLo, kHi, KIND_RAW);
        }
      }
      id++;
      let j = gd.length - 1;
      while (j >= 0) {
        idx[j]++;
        if (idx[j] < rad[j]) {
          v[gd[j]] = this.pf.axes[gd[j]][idx[j]];
          break;
        }
        idx[j] = 0;
        v[gd[j]] = this.pf.axes[gd[j]][0];
        j--;
      }
      if (j < 0) break;
    }
  }

  // ---- mono-i: two widths ----------------------------------------------------------------
  // super node = (d, tft, tfb, tw) with bt index 0 in its id; rows add bt.

  private btRange(): [number, number] {
    // bt > tw; top outstand (bt − tw)/2/tft ≤ limit (6)
    const fk = this.fk,
      v = this.v,
      W = this.W,
      sec = fk.second;
    const lo = firstAbove(W, fk.secondMin(v));
    let hi = W.length - 1;
    const lim = this.ctx.slenderLimit[3];
    if (lim === lim && lo < W.length) {
      // (bt − tw)/2/tft is the first slenderness element of mono-i
      v[sec] = W[lo];
      fk.slender(v, this.slR1);
      v[sec] = W[hi];
      fk.slender(v, this.slR2);
      const slope = (this.slR2[0] - this.slR1[0]) / (W[hi] - W[lo]);
      if (hi > lo && slope > 0) {
        const bMax = W[lo] + (lim - this.slR1[0]) / slope;
        hi = Math.min(hi, firstAbove(W, bMax + REL * (Math.abs(bMax) + 1)) - 1);
      } else if (this.slR1[0] > lim * (1 + REL)) hi = lo - 1;
    }
    return [lo, hi];
  }

  seedSupers(): void {
    const fk = this.fk,
      gd = this.groupDims,
      rad = this.radix,
      v = this.v,
      W = this.W,
      sec = fk.second;
    const secPos = gd.indexOf(sec);
    // enumerate group dims except `second` (held at index 0)
    const outer = gd.map((_, j) => j).filter((j) => j !== secPos);
    const idx = new Int32Array(gd.length);
    for (let j = 0; j < gd.length; j++) v[gd[j]] = this.pf.axes[gd[j]][0];
    for (;;) {
      if (fk.groupValid(v)) {
        const nBt = W.length - firstAbove(W, fk.secondMin(v));
        const kLo = firstAbove(W, fk.freeMin(v));
        const nBb = W.length - kLo;
        if (nBt > 0 && nBb > 0) {
          this.t.grid += nBt * nBb;
          const id = this.encode(idx);
          const bound = this.superBound(id);
          if (bound !== null) this.heap.push(bound, id, 0, 0, KIND_SUPER);
        }
      }
      let o = outer.length - 1;
      while (o >= 0) {
        const j = outer[o];
        idx[j]++;
        if (idx[j] < rad[j]) {
          v[gd[j]] = this.pf.axes[gd[j]][idx[j]];
          break;
        }
        idx[j] = 0;
        v[gd[j]] = this.pf.axes[gd[j]][0];
        o--;
      }
      if (o < 0) break;
    }
  }

  encode(idx: Int32Array): number {
    let id = 0;
    for (let j = 0; j < this.groupDims.length; j++) id = id * this.radix[j] + idx[j];
    return id;
  }

  // affine model of the super node (filled by superBound): I about y0 and objective in (bt, bb)
  private m = { y0: 0, i00: 0, it: 0, ib: 0, o00: 0, ot: 0, ob: 0, bt0: 0, bb0: 0, jLo: 0, jHi: 0, kLo: 0, kHi: 0, req: 0 };

  /** Lower bound on the objective over the super node's (bt, bb) rectangle, or null when none can pass. */
  superBound(id: number): number | null {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      sec = fk.second,
      f = fk.free,
      p = this.plates,
      n = fk.nPlates;
    const [jLo, jHi] = this.btRange();
    if (jHi < jLo) {
      this.t.ruledOut[3] += 1;
      return null;
    }
    const kLo = firstAbove(W, fk.freeMin(v));
    // bottom outstand and web; the top outstand element is held at an allowed bt (jLo)
    v[sec] = W[jLo];
    const kHi = this.rowHi(kLo);
    if (kHi < 0) return null;
    const req = this.baseIreq(this.depthOf()) * (1 - REL);
    const m = this.m;
    m.jLo = jLo;
    m.jHi = jHi;
    m.kLo = kLo;
    m.kHi = kHi;
    m.req = req;
    const bt0 = W[jLo],
      bt1 = W[jHi],
      bb0 = W[kLo],
      bb1 = W[kHi];
    let best = -Infinity;
    let y0 = this.depthOf() / 2;
    for (let round = 0; round < 2; round++) {
      v[sec] = bt0;
      v[f] = bb0;
      fk.fill(v, p);
      const i00 = iAbout(p, n, y0),
        o00 = plateObjective(fk, v, p, this.ctx);
      v[sec] = bt1;
      fk.fill(v, p);
      const it = bt1 > bt0 ? (iAbout(p, n, y0) - i00) / (bt1 - bt0) : 0,
        ot = bt1 > bt0 ? (plateObjective(fk, v, p, this.ctx) - o00) / (bt1 - bt0) : 0;
      v[sec] = bt0;
      v[f] = bb1;
      fk.fill(v, p);
      const ib = bb1 > bb0 ? (iAbout(p, n, y0) - i00) / (bb1 - bb0) : 0,
        ob = bb1 > bb0 ? (plateObjective(fk, v, p, this.ctx) - o00) / (bb1 - bb0) : 0;
      // fractional knapsack: cheapest I per unit objective first
      let deficit = req - i00;
      let bt = bt0,
        bb = bb0,
        obj = o00;
      if (deficit > 0) {
        const order: [number, number, number, number][] = [
          [it, ot, bt1 - bt0, 0],
          [ib, ob, bb1 - bb0, 1],
        ];
        order.sort((a, b) => (b[0] > 0 ? b[0] / b[1] : 0) - (a[0] > 0 ? a[0] / a[1] : 0));
        for (const [di, dobj, room, which] of order) {
          if (deficit <= 0 || di <= 0) continue;
          const x = Math.min(room, deficit / di);
          deficit -= x * di;
          obj += x * dobj;
          if (which === 0) bt += x;
          else bb += x;
        }
        if (deficit > REL * req) {
          this.t.ruledOut[this.ctx.aT <= this.ctx.aC ? C_TENS : C_COMP] += (jHi - jLo + 1) * (kHi - kLo + 1);
          return null;
        }
      }
      if (obj > best) {
        best = obj;
        m.y0 = y0;
        m.i00 = i00;
        m.it = it;
        m.ib = ib;
        m.o00 = o00;
        m.ot = ot;
        m.ob = ob;
        m.bt0 = bt0;
        m.bb0 = bb0;
      }
      // second round: y0 at the centroid of the relaxed optimum
      v[sec] = bt;
      v[f] = bb;
      fk.fill(v, p);
      compositeKernel(p, n, this.kout);
      y0 = this.kout[K_CY];
    }
    void id;
    return best;
  }

  /** Pops of a super node: one raw row per bt, keyed by the affine model's bound for that bt. */
  expandSuper(id: number): void {
    if (this.superBound(id) === null) return;
    const m = this.m,
      W = this.W,
      inc = this.incumbent();
    const secPos = this.groupDims.indexOf(this.fk.second);
    // the second width's radix position: id with bt index j = id + j·stride
    let stride = 1;
    for (let j = this.groupDims.length - 1; j > secPos; j--) stride *= this.radix[j];
    for (let j = m.jLo; j <= m.jHi; j++) {
      const bt = W[j];
      const deficit = m.req - (m.i00 + m.it * (bt - m.bt0));
      let bb = m.bb0;
      if (deficit > 0) {
        if (!(m.ib > 0)) continue;
        bb = m.bb0 + deficit / m.ib;
        if (bb > W[m.kHi] * (1 + REL) + REL) continue;
      }
      const key = m.o00 + m.ot * (bt - m.bt0) + m.ob * (bb - m.bb0);
      if (key > inc) continue;
      const k = Math.max(m.kLo, firstAtLeast(W, bb - REL * (Math.abs(bb) + 1)));
      if (k > m.kHi) continue;
      this.heap.push(key, id + j * stride, k, m.kHi, KIND_RAW);
    }
  }
}

/** The exact search. Throws a ZodError (fields named) on a bad problem. */
export function searchSections(input: SearchProblemInput, options: SearchOptions = {}): SearchResult {
  if (options.exhaustive) return bruteForceSearch(input, options);
  const problem = searchProblemSchema.parse(input);
  const p = prepare(problem, options.depthIndexRange);
  const t = new Tally(p.families.length);
  options.onProgress?.(0, p.families.length);
  p.families.forEach((pf, i) => {
    checkAbort(options.signal);
    new FamilySearch(pf, p.ctx, t).run(options.signal);
    options.onProgress?.(i + 1, p.families.length);
  });
  return buildResult(p, t);
}

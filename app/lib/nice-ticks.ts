// Axis ticks a reader can read off: steps of 1, 2, 2.5 or 5 times a power of ten, every tick a
// whole multiple of the step, the range covered with at most one step to spare at each end.
// (Chart axes left to the charting library land on values like 0.86 and 0.93.)

/** The nice steps within one decade, as multiples of its power of ten. */
const MANTISSAS = [1, 2, 2.5, 5];

export interface NiceAxis {
  /** first and last tick: the axis' domain */
  domain: [number, number];
  ticks: number[];
  step: number;
}

/**
 * Ticks covering [lo, hi] with about `target` ticks (never fewer than two intervals' worth of
 * range asked for). An empty range (lo = hi) is widened by 10 % of its value (1 at zero).
 */
export function niceTicks(lo: number, hi: number, target = 5): NiceAxis {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) throw new Error(`niceTicks: range must be finite, got ${lo} to ${hi}`);
  if (hi < lo) [lo, hi] = [hi, lo];
  if (hi === lo) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= pad;
    hi += pad;
  }
  const raw = (hi - lo) / Math.max(1, target - 1);
  const decade = 10 ** Math.floor(Math.log10(raw));
  // Of the nice steps near the raw one, the one whose tick count comes closest to the target;
  // then the one wasting least of the axis beyond the data; then the larger step (fewer labels).
  let best: { step: number; mantissa: number; first: number; last: number; miss: number; waste: number } | null = null;
  for (const d of [decade / 10, decade, decade * 10])
    for (const mantissa of MANTISSAS) {
      const step = mantissa * d;
      // a hair of tolerance so 0.3 / 0.1 = 2.9999999999999996 counts as 3, then a check that the ends still cover the data
      let first = Math.floor(lo / step + 1e-9);
      if (first * step > lo) first -= 1;
      let last = Math.ceil(hi / step - 1e-9);
      if (last * step < hi) last += 1;
      const miss = Math.abs(last - first + 1 - target);
      const waste = (last - first) * step - (hi - lo);
      const better = !best || miss < best.miss || (miss === best.miss && (waste < best.waste - 1e-9 * step || (Math.abs(waste - best.waste) <= 1e-9 * step && step > best.step)));
      if (better) best = { step, mantissa, first, last, miss, waste };
    }
  const { step, mantissa, first, last } = best!;
  // Whole multiples of the step, counted in integers so no float noise builds up (0.1 + 0.2).
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9) + (mantissa === 2.5 ? 1 : 0));
  const ticks: number[] = [];
  for (let i = first; i <= last; i++) ticks.push(Number((i * step).toFixed(decimals)));
  return { domain: [ticks[0]!, ticks[ticks.length - 1]!], ticks, step: Number(step.toFixed(decimals)) };
}

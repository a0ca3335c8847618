// The sweep page's poll schedule (app/lib/sweep-poll.ts): quick while the page is young, then once
// a second, and never quick after a failed poll. Schedules only; no timing is asserted.
import { describe, expect, it } from "vitest";
import { SWEEP_POLL_FAST_FOR_MS, SWEEP_POLL_FAST_MS, SWEEP_POLL_MS, sweepPollDelay } from "~/lib/sweep-poll";

/** The times (ms after the page started polling) at which it polls, following sweepPollDelay, up to `until`. */
function pollTimes(until: number, failAt: Set<number> = new Set()): number[] {
  const out: number[] = [];
  for (let t = sweepPollDelay(0); t <= until; ) {
    out.push(t);
    t += sweepPollDelay(t, !failAt.has(out.length - 1));
  }
  return out;
}

describe("sweep page poll schedule", () => {
  it("polls every 250 ms for the first 5 s, then every second", () => {
    expect(sweepPollDelay(0)).toBe(250);
    expect(sweepPollDelay(4_999)).toBe(250);
    expect(sweepPollDelay(5_000)).toBe(1_000);
    expect(sweepPollDelay(60_000)).toBe(1_000);
    expect([SWEEP_POLL_FAST_MS, SWEEP_POLL_FAST_FOR_MS, SWEEP_POLL_MS]).toEqual([250, 5_000, 1_000]);
  });

  it("a sweep that ends in the first 5 s is seen within 250 ms of its end (at one poll a second, up to 1 s)", () => {
    const times = pollTimes(10_000);
    for (let end = 0; end < 5_000; end += 37) {
      const seen = times.find((t) => t >= end)!;
      expect(seen - end).toBeLessThanOrEqual(250);
    }
  });

  it("costs 20 polls in the first 5 s and one a second after, well inside the API's 600 a minute", () => {
    const times = pollTimes(60_000);
    expect(times.filter((t) => t <= 5_000).length).toBe(20);
    expect(times.length).toBeLessThanOrEqual(20 + 55);
  });

  it("waits the slow interval after a failed poll (a 429 from the per-user limit is not hurried)", () => {
    expect(sweepPollDelay(1_000, false)).toBe(1_000);
    const times = pollTimes(2_000, new Set([0]));
    expect(times[1]! - times[0]!).toBe(1_000);
  });
});

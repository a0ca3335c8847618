// Search benchmark (issue 4): run with `npx tsx tests/bench/search.bench.ts`.
// Prints each figure, its target and, where brute force is feasible, the ratio against the
// brute-force reference measured in the same run on the same machine.
import { bruteForceSearch } from "../../app/optimizer/brute-force";
import { rationalise } from "../../app/optimizer/rationalise";
import { searchSections } from "../../app/optimizer/search";
import type { SearchProblemInput } from "../../app/optimizer/search-schema";
import type { SearchResult } from "../../app/optimizer/grid";

const THICK = [6, 8, 10, 12, 15, 18, 20, 25, 30, 35];

function time<T>(f: () => T): [T, number] {
  const t0 = performance.now();
  const r = f();
  return [r, performance.now() - t0];
}
/** median of n runs (after one warm-up) */
function timeMedian<T>(f: () => T, n = 5): [T, number] {
  f();
  const ts: number[] = [];
  let r!: T;
  for (let i = 0; i < n; i++) {
    const [x, t] = time(f);
    r = x;
    ts.push(t);
  }
  ts.sort((a, b) => a - b);
  return [r, ts[n >> 1]];
}
const desc = (r: SearchResult) =>
  r.best ? `${r.best.family} ${JSON.stringify(r.best.dimensions)} A=${r.best.area} mm² u=${r.best.utilisation.toFixed(4)} (${r.best.governing})` : `none: ${r.reason}`;
const same = (a: SearchResult, b: SearchResult) =>
  JSON.stringify([a.best?.family, a.best?.dimensions]) === JSON.stringify([b.best?.family, b.best?.dimensions]);
const verdict = (ok: boolean) => (ok ? "MET" : "MISSED");

const base: SearchProblemInput = {
  moment: { sagging: 900, hogging: 0 },
  allowable: { tension: 165, compression: 165, shear: 100 },
  depth: { min: 200, max: 1199, step: 1 },
  width: { min: 100, max: 595, step: 5 },
  thicknesses: THICK,
  families: ["i"],
};

function compare(label: string, problem: SearchProblemInput, targetMs: number, evalTarget: boolean) {
  const [fast, tf] = timeMedian(() => searchSections(problem));
  const [brute, tb] = time(() => bruteForceSearch(problem));
  console.log(`\n${label}`);
  console.log(`  grid ${fast.counts.grid.toLocaleString("en")} candidates`);
  console.log(`  fast : ${tf.toFixed(1)} ms, evaluated ${fast.counts.evaluated.toLocaleString("en")}; best ${desc(fast)}`);
  console.log(`  brute: ${tb.toFixed(0)} ms, evaluated ${brute.counts.evaluated.toLocaleString("en")}; best ${desc(brute)}`);
  console.log(`  same best: ${same(fast, brute) ? "yes" : "NO"}`);
  const evalRatio = fast.counts.grid / Math.max(1, fast.counts.evaluated);
  console.log(`  evaluations: grid/fast = ${evalRatio.toFixed(0)}× fewer${evalTarget ? ` (target ≥ 1000×: ${verdict(evalRatio >= 1000)})` : ""}`);
  console.log(`  time: brute/fast = ${(tb / tf).toFixed(0)}×; fast ${tf.toFixed(1)} ms (target < ${targetMs} ms: ${verdict(tf < targetMs)})`);
}

console.log(`search benchmark, node ${process.version}, ${new Date().toISOString()}`);

// (1) i family, 10 million candidates, bending only
compare("(1) i family, depth 200–1199 by 1, width 100–595 by 5, ten thicknesses, bending only", base, 100, true);

// (2) the same with shear and slenderness on; then all families at once
const checksOn: SearchProblemInput = {
  ...base,
  shear: 600,
  slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 },
};
compare("(2a) same i grid with shear and slenderness limits on", checksOn, 1000, false);
{
  const all: SearchProblemInput = { ...checksOn, families: ["i", "channel", "tee", "box", "channel-down", "angle", "rectangle", "mono-i"] };
  const [r, t] = timeMedian(() => searchSections(all), 3);
  console.log(`\n(2b) all eight families at once, same axes, shear and slenderness on`);
  console.log(`  grid ${r.counts.grid.toLocaleString("en")} candidates (brute force impossible: mono-i alone is 10^10)`);
  console.log(`  fast: ${t.toFixed(1)} ms, evaluated ${r.counts.evaluated.toLocaleString("en")}; best ${desc(r)}`);
  for (const [f, c] of Object.entries(r.bestByFamily)) console.log(`    ${f.padEnd(13)} ${c ? `${JSON.stringify(c.dimensions)} A=${c.area}` : "none"}`);
  console.log(`  target < 1000 ms: ${verdict(t < 1000)}`);
  const noMono: SearchProblemInput = { ...all, families: ["i", "channel", "tee", "box", "channel-down", "angle", "rectangle"] };
  const [fm, tfm] = timeMedian(() => searchSections(noMono), 3);
  const [bm, tbm] = time(() => bruteForceSearch(noMono));
  console.log(`  without mono-i (brute-forceable, ${fm.counts.grid.toLocaleString("en")} candidates): fast ${tfm.toFixed(1)} ms vs brute ${tbm.toFixed(0)} ms (${(tbm / tfm).toFixed(0)}×), evaluations ${(fm.counts.grid / fm.counts.evaluated).toFixed(0)}× fewer, same best: ${same(fm, bm) ? "yes" : "NO"}, same best per family: ${Object.keys(fm.bestByFamily).every((f) => JSON.stringify((fm.bestByFamily as any)[f]?.dimensions) === JSON.stringify((bm.bestByFamily as any)[f]?.dimensions)) ? "yes" : "NO"}`);
}

// (3) mono-i, 1 mm depth and width steps (far too large to brute-force)
{
  const mono: SearchProblemInput = {
    moment: { sagging: 900, hogging: 200 },
    allowable: { tension: 165, compression: 140, shear: 100 },
    depth: { min: 200, max: 1199, step: 1 },
    width: { min: 150, max: 449, step: 1 },
    thicknesses: [8, 10, 12, 15, 20, 25, 30, 35],
    families: ["mono-i"],
  };
  const [r, t] = timeMedian(() => searchSections(mono), 3);
  console.log(`\n(3) mono-i, depth 200–1199 by 1, bt and bb 150–449 by 1, eight thicknesses`);
  console.log(`  grid ${r.counts.grid.toExponential(3)} candidates; evaluated ${r.counts.evaluated.toLocaleString("en")}`);
  console.log(`  time to exact best: ${t.toFixed(1)} ms; best ${desc(r)}`);
  console.log(`  target < 2000 ms: ${verdict(t < 2000)}`);
  // (3b) a harder variant: unequal allowables (the best mono-i is far from symmetric), shear,
  // and a web slenderness limit that keeps the best off the deepest grid depth
  const hard: SearchProblemInput = {
    ...mono,
    moment: { sagging: 600, hogging: 0 },
    shear: 300,
    allowable: { tension: 220, compression: 90, shear: 100 },
    slenderness: { outstand: 15, web: 120 },
  };
  const [h, th] = timeMedian(() => searchSections(hard), 3);
  console.log(`  (3b) same grid, allowables 90 / 220 MPa, shear 300 kN, web ≤ 120: ${th.toFixed(1)} ms, evaluated ${h.counts.evaluated}; best ${desc(h)} (target < 2000 ms: ${verdict(th < 2000)})`);
}


// (4) rationalisation: 30 briefs × 20 candidates, at most 3 plate thicknesses
{
  // Demo candidates (invented, deterministic): each brief's 20 feasible i-sections, lighter ones
  // using thinner plates, with thicknesses drawn from a 10-plate stock list.
  let seed = 12345;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
  const stock = [6, 8, 10, 12, 15, 18, 20, 25, 30, 35];
  const briefs = Array.from({ length: 30 }, (_, i) => ({
    id: `B${i + 1}`,
    length: 4 + Math.floor(rnd() * 9),
    count: 1 + Math.floor(rnd() * 8),
    candidates: Array.from({ length: 20 }, () => {
      const tf = stock[Math.floor(rnd() * stock.length)],
        tw = stock[Math.floor(rnd() * 5)];
      const d = 300 + 10 * Math.floor(rnd() * 60),
        b = 150 + 5 * Math.floor(rnd() * 40);
      const area = 2 * b * tf + (d - 2 * tf) * tw;
      return { family: "i" as const, dimensions: { d, b, tf, tw }, massPerMetre: area * 7850e-6 };
    }),
  }));
  const [r, t] = time(() => rationalise({ briefs, maxThicknesses: 3 }));
  console.log(`\n(4) rationalisation, 30 briefs × 20 candidates, k = 3 (integer program, javascript-lp-solver)`);
  console.log(`  ${r.ok ? `total ${r.totalMass.toFixed(0)} kg with thicknesses ${r.thicknesses.join(", ")} mm` : r.reason}`);
  // reference: every 3-thickness subset of the stock list, each brief taking its lightest candidate within it
  let bestTotal = Infinity;
  for (let a = 0; a < stock.length; a++)
    for (let b = a + 1; b < stock.length; b++)
      for (let c = b + 1; c < stock.length; c++) {
        const set = new Set([stock[a], stock[b], stock[c]]);
        let total = 0;
        for (const br of briefs) {
          let m = Infinity;
          for (const cd of br.candidates) if (set.has(cd.dimensions.tf) && set.has(cd.dimensions.tw)) m = Math.min(m, cd.massPerMetre);
          total += m * br.length * br.count;
        }
        bestTotal = Math.min(bestTotal, total);
      }
  console.log(`  time ${t.toFixed(0)} ms (target < 2000 ms: ${verdict(t < 2000)}); same total as enumerating all 120 thickness triples: ${r.ok && Math.abs(r.totalMass - bestTotal) < 1e-6 * bestTotal ? "yes" : "NO"}`);
}

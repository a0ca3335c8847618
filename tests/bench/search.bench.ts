// Search benchmark (issue 4): run with `npx tsx tests/bench/search.bench.ts`.
// Prints each figure, its target and, where brute force is feasible, the ratio against the
// brute-force reference measured in the same run on the same machine.
import os from "node:os";
import { bruteForceSearch } from "../../app/optimizer/brute-force";
import { rationalise } from "../../app/optimizer/rationalise";
import { restraintStudy } from "../../app/optimizer/restraint-study";
import { searchSections } from "../../app/optimizer/search";
import { searchInThreads } from "../../app/workers/search-threads";
import { SWEEP_SEARCH_OPTIONS, sweepThreads } from "../../app/workers/sweep-search.server";
import type { SearchProblemInput } from "../../app/optimizer/search-schema";
import type { SearchResult } from "../../app/optimizer/grid";
import { WALKTHROUGH_BRIEF } from "./bench-setup";

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
// The machine may be loaded by other work: beside each wall time the process's CPU time (user +
// system) for the same run, which other processes inflate far less. The searches are synchronous
// and single-threaded, so the process's CPU time is the search's.
/** [result, wall ms, CPU ms] of one run */
function timeC<T>(f: () => T): [T, number, number] {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const r = f();
  const t = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return [r, t, (c.user + c.system) / 1000];
}
/** median wall and median CPU of n runs (after one warm-up) */
function timeMedianC<T>(f: () => T, n = 3): [T, number, number] {
  f();
  const ws: number[] = [],
    cs: number[] = [];
  let r!: T;
  for (let i = 0; i < n; i++) {
    const [x, w, c] = timeC(f);
    r = x;
    ws.push(w);
    cs.push(c);
  }
  ws.sort((a, b) => a - b);
  cs.sort((a, b) => a - b);
  return [r, ws[n >> 1], cs[n >> 1]];
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

// Sections (1)–(3) time the best-only search (front "evaluated": best and bestByFamily proven,
// the front over what was evaluated), as these figures always have; (5d), (6) time the grid front.
function compare(label: string, problem: SearchProblemInput, targetMs: number, evalTarget: boolean) {
  const [fast, tf] = timeMedian(() => searchSections(problem, { front: "evaluated" }));
  const [brute, tb, cb] = timeC(() => bruteForceSearch(problem));
  console.log(`\n${label}`);
  console.log(`  grid ${fast.counts.grid.toLocaleString("en")} candidates`);
  console.log(`  fast : ${tf.toFixed(1)} ms, evaluated ${fast.counts.evaluated.toLocaleString("en")}; best ${desc(fast)}`);
  console.log(`  brute: ${tb.toFixed(0)} ms (CPU ${cb.toFixed(0)} ms), evaluated ${brute.counts.evaluated.toLocaleString("en")}; best ${desc(brute)}`);
  console.log(`  same best: ${same(fast, brute) ? "yes" : "NO"}`);
  const evalRatio = fast.counts.grid / Math.max(1, fast.counts.evaluated);
  console.log(`  evaluations: grid/fast = ${evalRatio.toFixed(0)}× fewer${evalTarget ? ` (target ≥ 1000×: ${verdict(evalRatio >= 1000)})` : ""}`);
  console.log(`  time: brute/fast = ${(tb / tf).toFixed(0)}×; fast ${tf.toFixed(1)} ms (target < ${targetMs} ms: ${verdict(tf < targetMs)})`);
  return { brute, tb, cb };
}

// the machine may be shared: its load beside the figures says how far wall times are inflated
const load = () => os.loadavg().map((x) => x.toFixed(1)).join(" / ");
console.log(`search benchmark, node ${process.version}, ${new Date().toISOString()}, ${os.availableParallelism()} cores, load average ${load()}`);

// (1) i family, 10 million candidates, bending only
const base1 = compare("(1) i family, depth 200–1199 by 1, width 100–595 by 5, ten thicknesses, bending only", base, 100, true);

// (2) the same with shear and slenderness on; then all families at once
const checksOn: SearchProblemInput = {
  ...base,
  shear: 600,
  slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 },
};
compare("(2a) same i grid with shear and slenderness limits on", checksOn, 1000, false);
// (2c) the same i grid under AISC 360-16 (issue 14), Lb = 6 m: target the same best as brute
// force, under 0.5 s and at most a tenth of brute force's time. The fast search runs in best mode
// (front "evaluated": best and bestByFamily proven, the front over what it evaluated).
// Brute force over 10⁷ AISC evaluations takes minutes, so it runs for ASD only; LRFD is timed alone.
let bruteAsd: [SearchResult, number] | null = null;
for (const method of ["ASD", "LRFD"] as const) {
  const aisc: SearchProblemInput = { ...base, allowable: undefined, basis: "aisc360", method, aisc: { grade: "A572 Gr 50" }, shear: 600, restraint: { length: 6, Cb: 1.14 } };
  const [fast, tf] = timeMedian(() => searchSections(aisc, { front: "evaluated" }), 3);
  if (method === "LRFD") {
    console.log(`\n(2c) same i grid under AISC 360-16 LRFD: fast ${tf.toFixed(1)} ms, evaluated ${fast.counts.evaluated.toLocaleString("en")}; best ${desc(fast)}; fast < 500 ms: ${verdict(tf < 500)}`);
    continue;
  }
  bruteAsd = time(() => bruteForceSearch(aisc));
  const [brute, tb] = bruteAsd;
  console.log(`\n(2c) same i grid under AISC 360-16 ${method}, A572 Gr 50, Lb = 6 m, Cb = 1.14, shear 600 kN`);
  console.log(`  fast : ${tf.toFixed(1)} ms, evaluated ${fast.counts.evaluated.toLocaleString("en")}; best ${desc(fast)}`);
  console.log(`  brute: ${tb.toFixed(0)} ms, evaluated ${brute.counts.evaluated.toLocaleString("en")}; best ${desc(brute)}`);
  console.log(`  same best: ${same(fast, brute) ? "yes" : "NO"}; fast/brute = ${(tf / tb).toFixed(4)} (target ≤ 0.1: ${verdict(tf <= 0.1 * tb)}); fast < 500 ms: ${verdict(tf < 500)}`);
}
{
  const all: SearchProblemInput = { ...checksOn, families: ["i", "channel", "tee", "box", "channel-down", "angle", "rectangle", "mono-i"] };
  const [r, t] = timeMedian(() => searchSections(all, { front: "evaluated" }), 3);
  console.log(`\n(2b) all eight families at once, same axes, shear and slenderness on`);
  console.log(`  grid ${r.counts.grid.toLocaleString("en")} candidates (brute force impossible: mono-i alone is 10^10)`);
  console.log(`  fast: ${t.toFixed(1)} ms, evaluated ${r.counts.evaluated.toLocaleString("en")}; best ${desc(r)}`);
  for (const [f, c] of Object.entries(r.bestByFamily)) console.log(`    ${f.padEnd(13)} ${c ? `${JSON.stringify(c.dimensions)} A=${c.area}` : "none"}`);
  console.log(`  target < 1000 ms: ${verdict(t < 1000)}`);
  const noMono: SearchProblemInput = { ...all, families: ["i", "channel", "tee", "box", "channel-down", "angle", "rectangle"] };
  const [fm, tfm] = timeMedian(() => searchSections(noMono, { front: "evaluated" }), 3);
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
  const [r, t] = timeMedian(() => searchSections(mono, { front: "evaluated" }), 3);
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
  const [h, th] = timeMedian(() => searchSections(hard, { front: "evaluated" }), 3);
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

const members = (r: SearchResult, which: "front" | "context") => (r[which] ?? []).map((c) => `${c.family} ${JSON.stringify(c.dimensions)}`).join("|");
const sameBests = (a: SearchResult, b: SearchResult) =>
  Object.keys(b.bestByFamily).every((f) => JSON.stringify((a.bestByFamily as any)[f]?.dimensions ?? null) === JSON.stringify((b.bestByFamily as any)[f]?.dimensions ?? null));
const ms = (t: number) => (t < 10_000 ? `${t.toFixed(0)} ms` : `${(t / 1000).toFixed(1)} s`);

// (5) EN 1993 (issue 10, member checks; issue 15, the exact front): the search bench's axes, S355,
// a 6 m segment between lateral restraints (C1 1.13, C2 0.45, C3 0.525: a uniformly loaded simply
// supported span, mem.) loaded on the top flange, shear and slenderness on.
const en: SearchProblemInput = {
  ...checksOn,
  basis: "en1993",
  steel: { grade: "S355" },
  restraint: { length: 6, C1: 1.13, C2: 0.45, C3: 0.525, loadAt: "top" },
};
// (5b)'s solid rectangles reach 595 mm: S355's bands as EN 10025-2 gives them (mem.: 325, 315, 295,
// 285, 275 up to 80, 100, 150, 200, 250 mm), then 265 to 600 mm, an invented extension for the
// bench alone (the standard's thickest band is 400 mm, mem.).
const enWide: SearchProblemInput = {
  ...en,
  steel: {
    grade: "S355",
    fy: [
      { maxThickness: 16, fy: 355 }, { maxThickness: 40, fy: 345 }, { maxThickness: 63, fy: 335 }, { maxThickness: 80, fy: 325 },
      { maxThickness: 100, fy: 315 }, { maxThickness: 150, fy: 295 }, { maxThickness: 200, fy: 285 }, { maxThickness: 250, fy: 275 },
      { maxThickness: 600, fy: 265 },
    ],
  },
};
delete (en as { allowable?: unknown }).allowable;
{
  // one brute-force run serves (5a) and (5d): it yields the best and the grid's front together
  const [best, tBest, cBest] = timeMedianC(() => searchSections(en, { front: "evaluated" }), 3);
  const [grid, tGrid, cGrid] = timeMedianC(() => searchSections(en), 3);
  const [brute, tb, cb] = timeC(() => bruteForceSearch(en));
  console.log(`\n(5a) EN 1993, i family, the 10^7 grid of (1) (${best.counts.grid.toLocaleString("en")} candidates), 6 m restraint: best only`);
  console.log(`  fast : ${ms(tBest)} wall, ${ms(cBest)} CPU, evaluated ${best.counts.evaluated.toLocaleString("en")}; best ${desc(best)}`);
  console.log(`  brute: ${ms(tb)} wall, ${ms(cb)} CPU, evaluated ${brute.counts.evaluated.toLocaleString("en")}; best ${desc(brute)}`);
  const ratio = tb / tBest,
    ratioC = cb / cBest;
  console.log(`  same best: ${same(best, brute) ? "yes" : "NO"}; brute/fast = ${ratio.toFixed(0)}× wall, ${ratioC.toFixed(0)}× CPU (target < 500 ms and ≥ 10×: wall ${verdict(tBest < 500 && ratio >= 10)}, CPU ${verdict(cBest < 500 && ratioC >= 10)})`);
  console.log(`\n(5d) the exact front of the same grid (front "grid": every shape on the grid no other beats on mass and utilisation)`);
  console.log(`  fast : ${ms(tGrid)} wall, ${ms(cGrid)} CPU, evaluated ${grid.counts.evaluated.toLocaleString("en")}; front ${grid.front.length} members, context ${grid.context?.length ?? 0} points`);
  console.log(`  brute: ${ms(tb)} wall, ${ms(cb)} CPU (the same run as (5a)); front ${brute.front.length} members`);
  const fr = tb / tGrid,
    frc = cb / cGrid;
  const sf = members(grid, "front") === members(brute, "front") && members(grid, "context") === members(brute, "context");
  console.log(`  same front and context, member for member: ${sf ? "yes" : "NO"}; brute/fast = ${fr.toFixed(0)}× wall, ${frc.toFixed(0)}× CPU (target ≥ 10×: ${verdict(sf && Math.min(fr, frc) >= 10)})`);
}
{
  const six: SearchProblemInput = { ...enWide, families: ["i", "mono-i", "channel", "tee", "box", "rectangle"] };
  // after a warm-up run, the median of three like (5a), so one noisy run on a shared machine does not decide it
  const [r, t, c] = timeMedianC(() => searchSections(six, { front: "evaluated" }), 3);
  console.log(`\n(5b) EN 1993, all six EN 1993 families on the axes of (2b), best only (median of 3 runs)`);
  console.log(`  grid ${r.counts.grid.toExponential(3)} candidates (brute force impossible: mono-i alone is 10^10); evaluated ${r.counts.evaluated.toLocaleString("en")}`);
  console.log(`  fast: ${ms(t)} wall, ${ms(c)} CPU; best ${desc(r)}`);
  for (const [f, x] of Object.entries(r.bestByFamily)) console.log(`    ${f.padEnd(10)} ${x ? `${JSON.stringify(x.dimensions)} ${x.massPerMetre.toFixed(1)} kg/m (${x.governing})` : "none"}`);
  console.log(`  target < 2 s: wall ${verdict(t < 2000)}, CPU ${verdict(c < 2000)}`);
  const noMono: SearchProblemInput = { ...six, families: ["i", "channel", "tee", "box", "rectangle"] };
  const [fm, tfm, cfm] = timeMedianC(() => searchSections(noMono, { front: "evaluated" }), 1);
  console.log(`  the five without mono-i (${fm.counts.grid.toExponential(3)} candidates): fast ${ms(tfm)} wall, ${ms(cfm)} CPU, evaluated ${fm.counts.evaluated.toLocaleString("en")}`);
}
{
  // the sweep's restraint study: L, L/2 … L/6, each an exact best-only search
  const [r, t, c] = timeMedianC(() => restraintStudy(en), 1);
  const last = r.points[r.points.length - 1];
  // brute force at the 1 m spacing with the C1 the study used there (1.0 between intermediate restraints)
  const [b1, tb1, cb1] = timeC(() => bruteForceSearch({ ...en, restraint: { ...en.restraint!, length: 6 / 6, ...(last.C1 !== undefined ? { C1: last.C1 } : {}) } }));
  console.log(`\n(5c) restraint study, i family on the 10^7 grid of (5a), six spacings 6 m … 1 m`);
  console.log(`  ${r.points.map((p) => `${(en.restraint!.length / p.segments).toFixed(2)} m: ${p.best ? p.best.massPerMetre.toFixed(1) : "none"}`).join("; ")} kg/m`);
  console.log(`  fast: ${ms(t)} wall, ${ms(c)} CPU for all six (target < 3 s: wall ${verdict(t < 3000)}, CPU ${verdict(c < 3000)}); brute force at the 1 m spacing alone (C1 ${last.C1 ?? "as the brief"}): ${ms(tb1)} wall, ${ms(cb1)} CPU, same best there: ${last.best && b1.best && JSON.stringify(last.best.dimensions) === JSON.stringify(b1.best.dimensions) ? "yes" : "NO"}`);
}

// (6a) issue 15: the exact front of (1)'s 10^7 i grid against brute force's front, whose run (1) timed
{
  const [g, tg, cg] = timeMedianC(() => searchSections(base), 3);
  const sf = members(g, "front") === members(base1.brute, "front") && members(g, "context") === members(base1.brute, "context");
  const r = base1.tb / tg,
    rc = base1.cb / cg;
  console.log(`\n(6a) the exact front of (1)'s 10^7 i grid (allowable stresses, bending only)`);
  console.log(`  fast : ${ms(tg)} wall, ${ms(cg)} CPU, evaluated ${g.counts.evaluated.toLocaleString("en")}; front ${g.front.length} members, context ${g.context?.length ?? 0} points`);
  console.log(`  brute: ${ms(base1.tb)} wall, ${ms(base1.cb)} CPU (the run of (1)); front ${base1.brute.front.length} members`);
  console.log(`  same front and context, member for member: ${sf ? "yes" : "NO"}; brute/fast = ${r.toFixed(0)}× wall, ${rc.toFixed(0)}× CPU (target ≥ 10×: ${verdict(sf && Math.min(r, rc) >= 10)})`);
}

// (6b) issue 15's walkthrough brief: all eight families on fine grids (depth 200–1199 by 1, widths
// 150–452 by 1, eight thicknesses; 4.7·10^10 shapes with mono-i), allowable stresses. The sweep
// needs the exact best and the grid's front (with its context points): one pass, which a sweep
// runs as runSweepSearch does, on sweepThreads() worker threads (the cores divided among the
// sweeps a runner runs at once; 2 on a 2-core machine), each taking every n-th depth and sharing
// its front members with the others (search-threads.ts; the answer is the same). Timed that
// way, wall from the call to the combined result: with the threads already started, as in a
// running server (its runner starts them with itself; search-threads.ts keeps them warm), and
// once cold, start-up included (under tsx, which compiles the engine in each thread); and on one
// thread;
// against both, the sweep's former explore-based search (explore 0.25: rows within 25 % of each
// family's best, a front over what was evaluated), timed in the same run.
{
  const walk: SearchProblemInput = WALKTHROUGH_BRIEF;
  const threads = sweepThreads();
  const [g, tg, cg] = timeC(() => searchSections(walk));
  // the sweep's way: first cold (the threads start), then three times warm, the median reported
  let sw!: SearchResult, tCold = 0;
  const runs: [number, number][] = [];
  for (let i = 0; i < 4; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    sw = await searchInThreads(walk, { ...SWEEP_SEARCH_OPTIONS, threads });
    const t = performance.now() - t0;
    const c = process.cpuUsage(c0); // every thread of the process
    if (i === 0) tCold = t;
    else runs.push([t, (c.user + c.system) / 1000]);
  }
  const ts = runs.map((r) => r[0]).sort((a, b) => a - b)[1],
    cs = runs.map((r) => r[1]).sort((a, b) => a - b)[1];
  const [x, tx, cx] = timeC(() => searchSections(walk, { explore: 0.25 }));
  const sf = members(g, "front") === members(sw, "front") && members(g, "context") === members(sw, "context") && same(g, sw) && sameBests(g, sw);
  console.log(`\n(6b) all-families fine-grid brief (${g.counts.grid.toExponential(3)} shapes on valid geometry), allowable stresses, load average ${load()}`);
  console.log(`  exact best + grid front, one thread: ${ms(tg)} wall, ${ms(cg)} CPU, evaluated ${g.counts.evaluated.toLocaleString("en")}; front ${g.front.length}, context ${g.context?.length ?? 0}; best ${desc(g)}`);
  console.log(`  the same as a sweep runs it, ${threads} thread(s), depths interleaved: ${ms(ts)} wall, ${ms(cs)} CPU (all threads; threads warm, median of 3); cold, threads starting: ${ms(tCold)} wall; same best, front and context, member for member: ${sf ? "yes" : "NO"}`);
  console.log(`  explore 0.25 (former sweep), one thread: ${ms(tx)} wall, ${ms(cx)} CPU, evaluated ${x.counts.evaluated.toLocaleString("en")}; front over the evaluated ${x.front.length}; same best: ${same(g, x) && sameBests(g, x) ? "yes" : "NO"}`);
  console.log(`  explore/exact (one thread each) = ${(tx / tg).toFixed(1)}× wall, ${(cx / cg).toFixed(1)}× CPU; explore/sweep = ${(tx / ts).toFixed(1)}× wall`);
  console.log(`  target: the sweep's exact best + front < 2 s wall: ${ms(ts)} (${verdict(sf && ts < 2000)}); one thread ${ms(tg)}`);
}

// (6c) issue 14's gap: the exact grid front (the sweep's own search options, front "grid") of
// (2c)'s AISC 360 grid, ASD and LRFD, against the sweep's time budget (SWEEP_TIME_BUDGET_S, 120 s
// by default: a sweep that reaches it ends "timed_out", not proven lightest) and, for ASD, against
// brute force's front from (2c)'s run, member for member. One run each (a front takes seconds to
// a minute); wall and CPU time beside each other, since the machine may be loaded.
{
  for (const method of ["ASD", "LRFD"] as const) {
    const aisc: SearchProblemInput = { ...base, allowable: undefined, basis: "aisc360", method, aisc: { grade: "A572 Gr 50" }, shear: 600, restraint: { length: 6, Cb: 1.14 } };
    const [best, tb, cb] = timeC(() => searchSections(aisc, { front: "evaluated" }));
    const [g, tg, cg] = timeC(() => searchSections(aisc, { front: "grid" }));
    console.log(`\n(6c) the exact grid front of (2c)'s 10^7 i grid under AISC 360-16 ${method} (the sweep's search), load average ${load()}`);
    console.log(`  grid front: ${ms(tg)} wall, ${ms(cg)} CPU, evaluated ${g.counts.evaluated.toLocaleString("en")}; front ${g.front.length.toLocaleString("en")} members, context ${g.context?.length ?? 0} points; same best as best-only: ${same(g, best) ? "yes" : "NO"}`);
    console.log(`  best only (same run): ${ms(tb)} wall, ${ms(cb)} CPU; front/best = ${(tg / tb).toFixed(0)}× wall, ${(cg / cb).toFixed(0)}× CPU`);
    console.log(`  within the sweep's 120 s time budget: ${verdict(tg < 120_000)} (${((100 * tg) / 120_000).toFixed(0)} % of it, wall)`);
    if (method === "ASD" && bruteAsd) {
      const [brute, tbr] = bruteAsd;
      const sf = members(g, "front") === members(brute, "front");
      console.log(`  brute force's front ((2c)'s run, ${ms(tbr)} wall): ${brute.front.length.toLocaleString("en")} members; same front, member for member: ${sf ? "yes" : "NO"}; brute/front = ${(tbr / tg).toFixed(0)}×`);
    }
  }
}

console.log(`\nload average at the end: ${load()} (1 / 5 / 15 min)`);

// A sweep over the starter catalogue and four plate families (issue 13): `npx tsx tests/bench/catalogue.bench.ts`.
// Not a timed test: prints the figures. Baseline measured in the same run: the same sweep without
// the catalogue (plates only), so the ratio says what searching the catalogue beside them costs.
// Both bases: EN 1993 (S355, 4 m between restraints) and allowable stresses.
import { readFileSync } from "node:fs";
import { parseCatalogueCsv } from "~/lib/catalogue-csv";
import { searchProblemSchema, searchSections, withCatalogues, type SearchProblemInput } from "~/optimizer/index";
import { SWEEP_SEARCH_OPTIONS } from "~/workers/sweep-search.server";

const parsed = parseCatalogueCsv(readFileSync("db/seeds/starter-catalogue.csv", "utf8"));
if (!parsed.ok) throw new Error("starter catalogue is malformed");
const sections = parsed.sections.map((s) => ({ designation: s.designation, shape: s.shape, dims: s.dims }));

function timeMedian<T>(fn: () => T, n: number): [T, number] {
  const times: number[] = [];
  let r!: T;
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    r = fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return [r, times[Math.floor(n / 2)]!];
}

const common = {
  moment: { sagging: 180, hogging: 0 },
  shear: 120,
  depth: { min: 150, max: 600, step: 10 },
  width: { min: 80, max: 300, step: 10 },
  thicknesses: [6, 8, 10, 12, 15, 20, 25],
  families: ["i", "channel", "tee", "box"],
} satisfies Partial<SearchProblemInput>;
const cases: [string, SearchProblemInput][] = [
  ["EN 1993, S355, 4 m between restraints", { ...common, basis: "en1993", steel: { grade: "S355" }, restraint: { length: 4, C1: 1.13, C2: 0.454, C3: 0.525, loadAt: "top" } } as SearchProblemInput],
  ["allowable stresses 165/165/100 MPa", { ...common, basis: "allowable", allowable: { tension: 165, compression: 165, shear: 100 }, slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 } } as SearchProblemInput],
];

console.log(`Starter catalogue: ${sections.length} sections (IPE, HEA, HEB, UPE); plate families i, channel, tee, box; depth 150–600 by 10, width 80–300 by 10, seven thicknesses; the queue's search options.`);
for (const [label, input] of cases) {
  const plates = searchProblemSchema.parse(input);
  const both = searchProblemSchema.parse({ ...input, catalogues: [{ name: "starter", sections }] });
  const run = (p: typeof plates) => withCatalogues(p, searchSections(p, SWEEP_SEARCH_OPTIONS));
  run(both); // warm-up
  run(plates);
  // interleaved, so a busy moment on a shared machine falls on both alike
  const tp: number[] = [],
    tt: number[] = [];
  let rb!: ReturnType<typeof run>, r!: ReturnType<typeof run>;
  for (let i = 0; i < 7; i++) {
    let t0 = performance.now();
    rb = run(plates);
    tp.push(performance.now() - t0);
    t0 = performance.now();
    r = run(both);
    tt.push(performance.now() - t0);
  }
  const med = (a: number[]) => [...a].sort((x, y) => x - y)[a.length >> 1]!;
  const tb = med(tp),
    t = med(tt);
  const [, tc] = timeMedian(() => withCatalogues(both, rb), 5);
  const w = r.sideBySide!.welded.lightest,
    rl = r.sideBySide!.rolled.lightest;
  console.log(`\n${label}`);
  console.log(`  sweep, catalogue + plates: ${t.toFixed(1)} ms (median of 7, interleaved); plates only (baseline, same run): ${tb.toFixed(1)} ms; ratio ${(t / tb).toFixed(2)}`);
  console.log(`  catalogue part alone: ${tc.toFixed(1)} ms for ${r.catalogue!.counts.evaluated} sections (${(tc / Math.max(1, r.catalogue!.counts.evaluated)).toFixed(2)} ms each), ${r.catalogue!.counts.feasible} feasible`);
  console.log(`  lightest welded: ${w ? `${w.family} ${JSON.stringify(w.dimensions)} ${w.massPerMetre.toFixed(1)} kg/m` : "none"}; lightest rolled: ${rl ? `${rl.designation} ${rl.massPerMetre.toFixed(1)} kg/m` : "none"}; lighter: ${r.sideBySide!.winner}`);
}

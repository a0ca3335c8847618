// What the sweep page reads: the sweep (queue's view), a bounded sample of its stored candidates
// for the chart and the first page of the table, the brief and project it belongs to, its
// rechecks and the options saved from it.
//
// Why bounded (issue 9, item 8): a sweep stores its whole front (up to 20,000 members) and each
// family's lightest at every depth, and sending them all
// (each worked through the EN 1993 checks again) made a 1.5 MB page that took 650 ms. The page's
// document now stays small whatever the sweep: the table's other pages, sorts and filters come
// from GET /api/v1/sweeps/:id/candidates (candidatesPage, which the table fetches), and the chart
// draws the front sampled evenly plus every family's best.
import { db, getDb, parseJson } from "~/lib/db.server";
import { notFound } from "~/lib/projects.server";
import { listCandidates, getTeamSweep, STORED_FRONT_CAP, TERMINAL, WITH_RESULTS, type CandidateRow, type CandidatesQuery, type SweepView } from "~/workers/queue.server";
import { runOnEngineThread } from "~/workers/engine-thread.server";
import type { ChartCandidate } from "~/components/TradeoffChart";
import type { UnitSystem } from "~/optimizer/units";
import type { SearchProblem } from "~/optimizer";
import { isCodeBasis, type DesignRow } from "~/lib/design-summary";
import type { Numbers } from "~/lib/numbering";
import { projectNumberSql } from "~/lib/numbering.server";
import { MAX_DEPTH_BEST_DEPTHS, sameDepth, type DepthViewQuery } from "~/lib/depth-bests";
import type { DepthView } from "~/components/DepthBests";
import { FAMILIES, axisCount, gridValues } from "~/optimizer";
import { familyLabel } from "~/lib/labels";

/**
 * Rows of the candidate table per page (the page's first page, and each page the table fetches).
 * 25, not 50: the table's rows were most of the page's markup and of its server time (issue 9,
 * item 8); 25 rows still fill the table's scrolling box, and the next page is one click.
 */
export const TABLE_PAGE_SIZE = 25;
/**
 * Most points the chart draws: every k-th stored candidate by rank (evenly along the front), plus
 * rank 1, the front's heaviest end and each family's best (at most one per family, ≤ 20).
 */
export const CHART_MAX_POINTS = 200;
/** Most rechecks and saved options listed by name on the page (the rest are counted). */
export const PAGE_LIST_MAX = 30;

/**
 * The CSV export's cap: what the queue stores, the front (up to STORED_FRONT_CAP) plus each family's
 * lightest at every depth and the family bests (the walkthrough's fine-grid brief: about 18,000 rows).
 */
const MAX_EXPORT_CANDIDATES = 2 * STORED_FRONT_CAP;

export const toChartCandidate = (c: CandidateRow): ChartCandidate => ({
  rank: c.rank,
  family: c.family,
  dimensions: c.dimensions,
  massPerMetre: c.massPerMetre,
  utilisation: c.utilisation,
  governing: c.governing,
  onFront: c.onFront,
  // only when set: most stored rows are not, and the chart's JSON stays small
  depthBest: c.depthBest || undefined,
  cost: c.cost,
  source: c.source,
  designation: c.designation,
  catalogue: c.catalogue,
  costMaterial: c.costMaterial,
  costFabrication: c.costFabrication,
});

/**
 * Under a code basis, each row with the engine's design figures (EN 1993: class, Mcr, χLT,
 * resistances, weld throat; AISC 360: Chapter F section, Mn, zone, Lp, Lr, Cb, Vn, weld leg,
 * the governing limit state): the ones the sweep stored with its results (candidates.design);
 * rows stored before that column get them from candidateChecks, the one evaluation the search
 * itself ran, worked out on the engine thread. Under the allowable basis, none. A rolled row always
 * stored its figures with the sweep (catalogue-sweep.ts); worked out again through its family's
 * welded checks they would be wrong (no fillets, welded curves), so one without stays without.
 */
export async function withDesign<T extends { family: string; dimensions: Record<string, number>; design?: DesignRow | null; source?: "plate" | "rolled" }>(
  rows: T[],
  problem: SearchProblem,
): Promise<(T & { design: DesignRow | null })[]> {
  if (!isCodeBasis(problem.basis) || rows.length === 0) return rows.map((r) => ({ ...r, design: null }));
  const missing = rows.flatMap((r, i) => (r.design || r.source === "rolled" ? [] : [i]));
  const computed = missing.length
    ? await runOnEngineThread(
        "designRows",
        problem,
        missing.map((i) => ({ family: rows[i].family, dimensions: rows[i].dimensions })),
      )
    : [];
  const byRow = new Map(missing.map((i, k) => [i, computed[k] ?? null]));
  return rows.map((r, i) => ({ ...r, design: r.design ?? byRow.get(i) ?? null }));
}

/** Every stored candidate, rank order (the CSV export; never the page). */
export async function sweepCandidates(sweepId: number, problem?: SearchProblem): Promise<ChartCandidate[]> {
  const out: ChartCandidate[] = [];
  for (let page = 1; out.length < MAX_EXPORT_CANDIDATES; page++) {
    const r = await listCandidates(sweepId, { page, pageSize: 500, sort: "rank" });
    const rows = r.items.map((c) => ({ ...toChartCandidate(c), design: c.design }));
    out.push(...(problem ? await withDesign(rows, problem) : rows));
    if (r.items.length < 500) break;
  }
  return out;
}

/** One page of the table (GET /api/v1/sweeps/:id/candidates): the stored rows, with design figures under a code basis. */
export async function candidatesPage(sweep: Pick<SweepView, "id" | "problem">, q: Partial<CandidatesQuery>) {
  const page = await listCandidates(sweep.id, q);
  return { ...page, items: await withDesign(page.items, sweep.problem) };
}

export interface ChartSample {
  points: ChartCandidate[];
  /** candidates stored for the sweep, and how many of them are on the front */
  stored: number;
  front: number;
}

const CHART_COLUMNS = ["rank", "family", "dimensions", "area", "mass_per_metre", "cost", "utilisation", "governing", "on_front", "family_best", "depth_best", "source", "designation", "catalogue", "cost_material", "cost_fabrication"];
/** Most rolled front rows the chart draws (a catalogue's front is short: rarely more than a dozen). */
const ROLLED_CHART_MAX = 20;

/**
 * The chart's points: every k-th stored candidate by rank (k chosen so at most CHART_MAX_POINTS
 * remain; the stored candidates are the front plus a few family bests, so this samples the front
 * evenly), and always rank 1, the front's heaviest end and every family's best. Ranks run 1…n
 * (candidatesToStore), so the sample is a list of ranks read through the (sweep_id, rank) key, and
 * the counts come from the (sweep_id, on_front) index alone: a 2,000-candidate sweep costs the
 * database a few index lookups, not a scan of its rows. A sweep that searched catalogues stores its
 * rolled rows after the welded ones (catalogue-sweep.ts), each side with its own front: the last
 * ROLLED_CHART_MAX front rows by rank bring the rolled front whole (they are the highest ranks),
 * and the welded front's heaviest end is its own last front row.
 */
/** A stored candidates row read with CHART_COLUMNS, as listCandidates would give it (no design figures). */
function rowToCandidate(r: Record<string, unknown>): CandidateRow {
  return {
    rank: Number(r.rank),
    family: String(r.family),
    dimensions: parseJson(r.dimensions as string),
    area: Number(r.area),
    massPerMetre: Number(r.mass_per_metre),
    cost: r.cost === null ? null : Number(r.cost),
    utilisation: Number(r.utilisation),
    governing: String(r.governing),
    onFront: !!r.on_front,
    familyBest: !!r.family_best,
    depthBest: !!r.depth_best,
    source: r.source === "rolled" ? "rolled" : "plate",
    designation: (r.designation as string | null) ?? null,
    catalogue: (r.catalogue as string | null) ?? null,
    costMaterial: r.cost_material == null ? null : Number(r.cost_material),
    costFabrication: r.cost_fabrication == null ? null : Number(r.cost_fabrication),
    design: null, // neither the chart nor the depth control draws design figures
  };
}

export async function chartSample(sweepId: number): Promise<ChartSample> {
  const [counts, last] = await Promise.all([
    db("candidates").where({ sweep_id: sweepId }).first(db.raw("COUNT(*) AS n"), db.raw("COALESCE(SUM(on_front), 0) AS f")),
    db("candidates").where({ sweep_id: sweepId, on_front: true }).orderBy("rank", "desc").limit(ROLLED_CHART_MAX).select(CHART_COLUMNS),
  ]);
  const stored = Number(counts?.n ?? 0),
    front = Number(counts?.f ?? 0);
  if (stored === 0) return { points: [], stored, front };
  const rolledFront = (last as Record<string, unknown>[]).filter((r) => r.source === "rolled");
  const lastWelded =
    (last as Record<string, unknown>[]).find((r) => r.source !== "rolled") ??
    (rolledFront.length ? await db("candidates").where({ sweep_id: sweepId, on_front: true, source: "plate" }).orderBy("rank", "desc").first("rank") : null);
  const k = Math.max(1, Math.ceil(stored / (CHART_MAX_POINTS - 20 - rolledFront.length)));
  const ranks = new Set<number>();
  for (let r = 1; r <= stored; r += k) ranks.add(r);
  if (lastWelded) ranks.add(Number(lastWelded.rank));
  const [sampled, bests] = await Promise.all([
    db("candidates").where({ sweep_id: sweepId }).whereIn("rank", [...ranks]).select(CHART_COLUMNS),
    db("candidates").where({ sweep_id: sweepId, family_best: true }).select(CHART_COLUMNS),
  ]);
  const byRank = new Map<number, Record<string, unknown>>();
  for (const r of [...sampled, ...bests, ...rolledFront]) byRank.set(Number(r.rank), r);
  const points = [...byRank.values()]
    .sort((a, b) => Number(a.rank) - Number(b.rank))
    .map((r) => toChartCandidate(rowToCandidate(r)));
  return { points, stored, front };
}

/**
 * The chart as the page's document carries it: the points as one JSON text, which the page parses
 * in the browser. The framework encodes loader data value by value in JavaScript (turbo-stream), and
 * 200 points of a dozen values each were most of a sweep page's encoding time; one string costs it
 * next to nothing (issue 9, item 8). The chart is never drawn on the server (it measures its box in
 * the browser first), so the server neither parses nor lays out the points; what the server-drawn
 * part of the page needs from them comes worked out (drawn, withCost).
 */
export interface PageChart {
  /** JSON of ChartCandidate[], rank order */
  pointsJson: string;
  /** how many points pointsJson holds */
  drawn: number;
  /** some point carries a cost (the table then shows its cost column) */
  withCost: boolean;
  stored: number;
  front: number;
}

/**
 * The table's first page as the document carries it: the rows as one JSON text (ChartCandidate[]
 * with their design figures, null fields left out), parsed by the page on the server and in the
 * browser, for the same reason as the chart's points (PageChart).
 */
export interface PageTable {
  /** JSON of ChartCandidate[], rank order */
  itemsJson: string;
  total: number;
  page: number;
  pageSize: number;
}

/** What a finished sweep's page shows of its candidates: never changes once the sweep has ended. */
interface ResultParts {
  chart: PageChart;
  table: PageTable;
  /** rank 1's design figures (the summary line), when the basis has them */
  bestDesign: DesignRow | null;
  families: string[];
}

/** null fields left out (every ChartCandidate field that may be null is optional): most of a welded sweep's catalogue and cost fields are null, and each one cost the document bytes */
const withoutNulls = (_k: string, v: unknown) => (v === null ? undefined : v);
const topLevelWithoutNulls = <T extends object>(o: T): Partial<T> => Object.fromEntries(Object.entries(o).filter(([, v]) => v !== null)) as Partial<T>;

/**
 * A sweep's stored candidates are written once, in the transaction that ends it, and never change
 * after, so each process keeps the result parts of the last RESULT_CACHE_SIZE finished sweeps it
 * served (a page view then costs the database the sweep's row and its small lists, not the chart
 * and table reads). Keyed by database and id; only ever filled for ended sweeps.
 */
const RESULT_CACHE_SIZE = 200;
const resultCache = new Map<string, ResultParts>();

async function resultParts(sweep: SweepView): Promise<ResultParts> {
  // The end time and queue time too: should an id ever come back for another sweep (a database
  // restored from a dump, AUTO_INCREMENT reset), the key differs and the old parts are never served.
  // The team was checked by the caller (getTeamSweep) on this request; the key holds no team because
  // the parts belong to the sweep, and a sweep to one team.
  const key = `${String((getDb().client.config.connection as { database?: string }).database)}:${sweep.id}:${sweep.queuedAt}:${sweep.finishedAt}`;
  const hit = resultCache.get(key);
  if (hit) {
    resultCache.delete(key);
    resultCache.set(key, hit);
    return hit;
  }
  const [chart, table, families] = await Promise.all([
    chartSample(sweep.id),
    candidatesPage(sweep, { page: 1, pageSize: TABLE_PAGE_SIZE, sort: "rank" }),
    db("candidates").where({ sweep_id: sweep.id }).distinct("family").orderBy("family"),
  ]);
  const parts: ResultParts = {
    chart: { pointsJson: JSON.stringify(chart.points, withoutNulls), drawn: chart.points.length, withCost: chart.points.some((c) => c.cost != null), stored: chart.stored, front: chart.front },
    table: {
      // null fields of the rows left out as in the chart's; the design block is kept as the engine wrote it
      itemsJson: JSON.stringify(table.items.map((c) => ({ ...topLevelWithoutNulls(toChartCandidate(c)), design: c.design ?? null }))),
      total: table.total,
      page: table.page,
      pageSize: table.pageSize,
    },
    // rank 1 is on the table's first page
    bestDesign: table.items.find((c) => c.rank === 1)?.design ?? null,
    families: (families as { family: string }[]).map((f) => f.family),
  };
  if (TERMINAL.has(sweep.status)) {
    resultCache.set(key, parts);
    if (resultCache.size > RESULT_CACHE_SIZE) resultCache.delete(resultCache.keys().next().value!);
  }
  return parts;
}

/** The sweep page's depth control, from the rows the sweep stored (DepthView says what each part means). */
export async function depthView(sweep: Pick<SweepView, "id" | "problem" | "depthBests">, parsed: { success: true; data: DepthViewQuery } | { success: false; errors: Partial<Record<"depth" | "family", string>> }): Promise<DepthView> {
  const problem = sweep.problem;
  const families = [...problem.families];
  const count = axisCount(problem.depth);
  let info: DepthView["info"];
  if (sweep.depthBests) info = sweep.depthBests;
  else {
    // stored before sweeps recorded whether they kept them: the rows, if any, are all there is to go by
    const any = await db("candidates").where({ sweep_id: sweep.id, depth_best: true }).first("rank");
    info = {
      state: "unknown",
      depths: count,
      reason: any ? null : "This sweep was stored before each family's lightest at every depth was kept. Run it again (a recheck with the same limits) to filter it by depth.",
    };
  }
  // a sweep stored before the cap on depths (queue.server.ts depthBestsInfo): the page offers no more depths than a sweep keeps
  if (count > MAX_DEPTH_BEST_DEPTHS && info.state !== "none")
    info = { state: "none", depths: count, reason: `The grid has ${count.toLocaleString("en")} depths; the page offers each family's lightest at every depth for grids of up to ${MAX_DEPTH_BEST_DEPTHS.toLocaleString("en")} depths.` };
  // rolled sections only (no plate family searched): nothing per depth to offer
  if (families.length === 0) info = { state: "none", depths: count, reason: "This sweep searched catalogue sections only; each family's lightest at every depth is kept for the welded families." };
  const grid = info.state === "none" || (info.state === "unknown" && info.reason) ? null : { min: problem.depth.min, step: problem.depth.step, count };
  const view: DepthView = { info, grid, families, query: { depth: null, family: null }, errors: null, rows: null, complete: null };
  if (!parsed.success) return { ...view, errors: parsed.errors };
  const q = parsed.data;
  const errors: Partial<Record<"depth" | "family", string>> = {};
  const depths = gridValues(problem.depth);
  const depth = q.depth === undefined ? undefined : depths.find((d) => sameDepth(d, q.depth!));
  if (q.depth !== undefined && depth === undefined)
    errors.depth = `depth: ${q.depth} mm is not on this sweep's depth grid (${problem.depth.min} to ${problem.depth.max} mm by ${problem.depth.step} mm)`;
  if (q.family && !families.includes(q.family)) errors.family = `family: this sweep did not search “${familyLabel(q.family)}” (it searched ${families.map((f) => `“${familyLabel(f)}”`).join(", ")})`;
  view.query = { depth: depth ?? q.depth ?? null, family: q.family ?? null };
  if (Object.keys(errors).length) return { ...view, errors };
  if (depth === undefined || !grid) return view;
  const found = await db("candidates")
    .where({ sweep_id: sweep.id, depth_best: true })
    // grid depths are exact products; the tolerance only absorbs float noise (as listCandidates)
    .andWhereRaw("ABS(JSON_VALUE(dimensions, '$.d') - ?) < 1e-6", [depth])
    .modify((b) => {
      if (q.family) b.andWhereRaw("FIND_IN_SET(?, COALESCE(depth_best_for, family)) > 0", [q.family]);
    })
    .orderBy("rank")
    .limit(FAMILIES.length)
    .select(CHART_COLUMNS.concat("depth_best_for"));
  view.rows = (found as Record<string, unknown>[]).map((r) => ({
    ...toChartCandidate(rowToCandidate(r)),
    // rows stored before depth_best_for: their own family's only
    depthBestFor: r.depth_best_for ? String(r.depth_best_for).split(",") : [String(r.family)],
  }));
  view.complete = info.state === "complete" ? true : null;
  return view;
}

/** A row of the sweep page's one read of what it names (loadSweepPage). */
interface ListedRow {
  kind: "sweep" | "option" | "brief" | "project";
  id: number;
  label: string;
  ref: number | string | null;
  candidate: unknown;
  n: number | string | null;
}

export async function loadSweepPage(teamId: number, id: number, depthQuery?: Parameters<typeof depthView>[1]) {
  const sweep = await getTeamSweep(id, { teamId });
  if (!sweep) throw notFound("No such sweep in your team.");
  const done = WITH_RESULTS.has(sweep.status);
  // Every query a page view makes is one more round trip 20 readers queue for on the pool (about a
  // millisecond of server time each at 20 readers), so what the page names besides the sweep comes
  // in one read (issue 9, item 8): the sweeps it names (itself, the original it rechecks, its latest
  // rechecks, all of this team), its options, its brief and its project, each sweep and option with
  // its project number (numbering.server.ts). Each part keeps its own order and limit.
  const named = [sweep.id, sweep.recheckOf].filter((x): x is number => typeof x === "number");
  const [listed, parts, depth] = await Promise.all([
    db.raw(
      `(SELECT 'sweep' AS kind, s.id, s.status AS label, s.recheck_of AS ref, NULL AS candidate, ${projectNumberSql("sweeps", "s")} AS n
          FROM sweeps s WHERE s.team_id = ? AND (s.id IN (${named.map(() => "?").join(", ")}) OR s.recheck_of = ?)
          ORDER BY (s.recheck_of <=> ?) ASC, s.id DESC LIMIT ?)
       UNION ALL
       (SELECT 'option', o.id, o.review_state, NULL, o.candidate, ${projectNumberSql("options", "o")}
          FROM options o WHERE o.sweep_id = ? ORDER BY o.id LIMIT ?)
       UNION ALL
       (SELECT 'brief', b.id, b.name, b.units, NULL, NULL FROM briefs b WHERE b.id = ?)
       UNION ALL
       (SELECT 'project', p.id, p.name, NULL, NULL, NULL FROM projects p WHERE p.id = ?)`,
      // the named ones first (at most two), then the rechecks newest first
      [teamId, ...named, sweep.id, sweep.id, PAGE_LIST_MAX + named.length, sweep.id, PAGE_LIST_MAX, sweep.briefId ?? null, sweep.projectId ?? null],
    ) as Promise<unknown> as Promise<[ListedRow[], unknown]>,
    done ? resultParts(sweep) : null,
    // (not cached with the results: it depends on the query; none or one indexed read)
    done ? depthView(sweep, depthQuery ?? { success: true, data: {} }) : null,
  ]);
  const rows = listed[0];
  // UNION ALL gives each column the type the parts share: ids in `ref` may come back as text
  const sweepRows = rows.filter((r) => r.kind === "sweep").map((r) => ({ id: Number(r.id), status: r.label, recheck_of: r.ref === null ? null : Number(r.ref), n: r.n }));
  const options = rows.filter((r) => r.kind === "option").map((r) => ({ id: Number(r.id), review_state: r.label, candidate: r.candidate, n: r.n }));
  const brief = rows.find((r) => r.kind === "brief") ?? null;
  const project = rows.find((r) => r.kind === "project") ?? null;
  const rechecks = sweepRows.filter((r) => r.recheck_of === sweep.id).slice(0, PAGE_LIST_MAX);
  // Counted only when the list is full: most sweeps have a few of each.
  const [rechecksN, optionsN] = await Promise.all([
    rechecks.length < PAGE_LIST_MAX ? { n: rechecks.length } : db("sweeps").where({ recheck_of: sweep.id, team_id: teamId }).count({ n: "*" }).first(),
    options.length < PAGE_LIST_MAX ? { n: options.length } : db("options").where({ sweep_id: sweep.id }).count({ n: "*" }).first(),
  ]);
  const numbered = (rows: { id: number; n: number | string | null }[]) => Object.fromEntries(rows.filter((r) => r.n !== null).map((r) => [r.id, Number(r.n)]));
  const numbers: Numbers = { sweep: numbered(sweepRows), option: numbered(options) };
  const chart: PageChart = parts?.chart ?? { pointsJson: "[]", drawn: 0, withCost: false, stored: 0, front: 0 };
  return {
    sweep: publicSweep(sweep),
    chart,
    table: parts?.table ?? { itemsJson: "[]", total: 0, page: 1, pageSize: TABLE_PAGE_SIZE },
    bestDesign: parts?.bestDesign ?? null,
    families: parts?.families ?? [],
    depth,
    /** most front members a sweep stores (the page says so when a front was longer) */
    frontCap: STORED_FRONT_CAP,
    brief: brief ? { id: Number(brief.id), name: brief.label } : null,
    project: project ? { id: Number(project.id), name: project.label } : null,
    units: ((brief?.ref as UnitSystem | null | undefined) ?? "si") as UnitSystem,
    rechecks: rechecks.map((r) => ({ id: r.id, status: r.status })),
    rechecksTotal: Number(rechecksN?.n ?? 0),
    options: options.map((o) => ({ id: o.id, reviewState: o.review_state, rank: parseJson<{ rank: number }>(o.candidate).rank })),
    optionsTotal: Number(optionsN?.n ?? 0),
    numbers,
  };
}

/** Drops queue internals (lease, attempts) the page has no use for. */
function publicSweep(s: SweepView) {
  return {
    id: s.id,
    status: s.status,
    recheckOf: s.recheckOf,
    ownerId: s.ownerId,
    cancelRequested: s.cancelRequested,
    progress: s.progress,
    provenLightest: s.provenLightest,
    counts: s.counts,
    best: s.best
      ? {
          family: s.best.family,
          dimensions: s.best.dimensions,
          massPerMetre: s.best.massPerMetre,
          utilisation: s.best.utilisation,
          governing: s.best.governing,
          cost: s.best.cost ?? null,
          // the engine's stated simplifications for the section it found (a code basis)
          notes: s.best.design?.notes ?? s.best.aisc?.notes ?? null,
        }
      : null,
    restraintStudy: s.restraintStudy,
    catalogueResult: s.catalogueResult,
    reason: s.reason,
    advice: s.advice,
    error: s.error,
    queuedAt: s.queuedAt,
    finishedAt: s.finishedAt,
    elapsedMs: s.elapsedMs,
    etaMs: s.etaMs,
    problem: s.problem,
  };
}

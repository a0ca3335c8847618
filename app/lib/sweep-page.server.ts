// What the sweep page reads: the sweep (queue's view), a bounded sample of its stored candidates
// for the chart and the first page of the table, the brief and project it belongs to, its
// rechecks and the options saved from it.
//
// Why bounded (issue 9, item 8): a sweep stores up to 2,000 front candidates, and sending them all
// (each worked through the EN 1993 checks again) made a 1.5 MB page that took 650 ms. The page's
// document now stays small whatever the sweep: the table's other pages, sorts and filters come
// from GET /api/v1/sweeps/:id/candidates (candidatesPage, which the table fetches), and the chart
// draws the front sampled evenly plus every family's best.
import { db, parseJson } from "~/lib/db.server";
import { notFound } from "~/lib/projects.server";
import { listCandidates, getTeamSweep, WITH_RESULTS, type CandidateRow, type CandidatesQuery, type SweepView } from "~/workers/queue.server";
import { runOnEngineThread } from "~/workers/engine-thread.server";
import type { ChartCandidate } from "~/components/TradeoffChart";
import type { UnitSystem } from "~/optimizer/units";
import type { SearchProblem } from "~/optimizer";
import type { DesignRow } from "~/lib/design-summary";

/** Rows of the candidate table per page (the page's first page, and each page the table fetches). */
export const TABLE_PAGE_SIZE = 50;
/** Most front candidates the chart draws (evenly spaced along the front, its two ends kept). */
export const CHART_FRONT_MAX = 250;
/** Most candidates off the front the chart draws (the queue stores few: family bests). */
export const CHART_OTHERS_MAX = 100;
/** Most rechecks and saved options listed by name on the page (the rest are counted). */
export const PAGE_LIST_MAX = 30;

/** The CSV export's cap: every candidate the queue stores (its front cap plus the family bests). */
const MAX_EXPORT_CANDIDATES = 2_500;

export const toChartCandidate = (c: CandidateRow): ChartCandidate => ({
  rank: c.rank,
  family: c.family,
  dimensions: c.dimensions,
  massPerMetre: c.massPerMetre,
  utilisation: c.utilisation,
  governing: c.governing,
  onFront: c.onFront,
  cost: c.cost,
});

/**
 * Under the EN 1993 basis, each row with the engine's design figures (class, Mcr, χLT,
 * resistances, weld throat): the ones the sweep stored with its results (candidates.design);
 * rows stored before that column get them from candidateChecks, the one evaluation the search
 * itself ran, worked out on the engine thread. Under the allowable basis, none.
 */
export async function withDesign<T extends { family: string; dimensions: Record<string, number>; design?: DesignRow | null }>(rows: T[], problem: SearchProblem): Promise<(T & { design: DesignRow | null })[]> {
  if (problem.basis !== "en1993" || rows.length === 0) return rows.map((r) => ({ ...r, design: null }));
  const missing = rows.flatMap((r, i) => (r.design ? [] : [i]));
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

/** One page of the table (GET /api/v1/sweeps/:id/candidates): the stored rows, with design figures under EN 1993. */
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

/**
 * The chart's points: the front sampled evenly by rank (every k-th, k chosen so at most
 * CHART_FRONT_MAX remain, the last kept so the line reaches the heaviest end), the candidates off
 * the front likewise up to CHART_OTHERS_MAX, and always rank 1 and every family's best.
 */
export async function chartSample(sweepId: number): Promise<ChartSample> {
  const [rows] = (await db.raw(
    `SELECT \`rank\`, family, dimensions, area, mass_per_metre, cost, utilisation, governing, on_front, family_best, n, front_n FROM (
       SELECT c.*, ROW_NUMBER() OVER (PARTITION BY on_front ORDER BY \`rank\`) AS k, COUNT(*) OVER (PARTITION BY on_front) AS part_n,
              COUNT(*) OVER () AS n, SUM(on_front) OVER () AS front_n
         FROM candidates c WHERE sweep_id = ?
     ) x
     WHERE \`rank\` = 1 OR family_best = 1 OR k = part_n
        OR MOD(k - 1, CEIL(part_n / IF(on_front, ?, ?))) = 0
     ORDER BY \`rank\``,
    [sweepId, CHART_FRONT_MAX - 1, CHART_OTHERS_MAX - 1],
  )) as [Record<string, unknown>[]];
  const points = rows.map((r) =>
    toChartCandidate({
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
      design: null, // the chart draws no design figures
    }),
  );
  return { points, stored: Number(rows[0]?.n ?? 0), front: Number(rows[0]?.front_n ?? 0) };
}

export async function loadSweepPage(teamId: number, id: number) {
  const sweep = await getTeamSweep(id, { teamId });
  if (!sweep) throw notFound("No such sweep in your team.");
  const done = WITH_RESULTS.has(sweep.status);
  const [brief, project, rechecks, rechecksN, options, optionsN, chart, table, families] = await Promise.all([
    sweep.briefId ? db("briefs").where({ id: sweep.briefId }).first("id", "name", "units") : null,
    sweep.projectId ? db("projects").where({ id: sweep.projectId }).first("id", "name") : null,
    db("sweeps").where({ recheck_of: sweep.id, team_id: teamId }).orderBy("id", "desc").limit(PAGE_LIST_MAX).select("id", "status"),
    db("sweeps").where({ recheck_of: sweep.id, team_id: teamId }).count({ n: "*" }).first(),
    db("options").where({ sweep_id: sweep.id }).orderBy("id").limit(PAGE_LIST_MAX).select("id", "review_state", "candidate"),
    db("options").where({ sweep_id: sweep.id }).count({ n: "*" }).first(),
    done ? chartSample(sweep.id) : ({ points: [], stored: 0, front: 0 } as ChartSample),
    done ? candidatesPage(sweep, { page: 1, pageSize: TABLE_PAGE_SIZE, sort: "rank" }) : null,
    done ? db("candidates").where({ sweep_id: sweep.id }).distinct("family").orderBy("family") : [],
  ]);
  // the best's design figures for the summary line (rank 1 is on the table's first page)
  const bestRow = table?.items.find((c) => c.rank === 1);
  return {
    sweep: publicSweep(sweep),
    chart,
    table: table ? { items: table.items.map((c) => ({ ...toChartCandidate(c), design: c.design ?? null })), total: table.total, page: table.page, pageSize: table.pageSize } : { items: [], total: 0, page: 1, pageSize: TABLE_PAGE_SIZE },
    bestDesign: bestRow?.design ?? null,
    families: (families as { family: string }[]).map((f) => f.family),
    brief: brief ? { id: brief.id as number, name: brief.name as string } : null,
    project: project ? { id: project.id as number, name: project.name as string } : null,
    units: ((brief?.units as UnitSystem | undefined) ?? "si") as UnitSystem,
    rechecks: rechecks.map((r) => ({ id: r.id as number, status: r.status as string })),
    rechecksTotal: Number(rechecksN?.n ?? 0),
    options: options.map((o) => ({ id: o.id as number, reviewState: o.review_state as string, rank: parseJson<{ rank: number }>(o.candidate).rank })),
    optionsTotal: Number(optionsN?.n ?? 0),
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
          // the engine's stated simplifications for the section it found (EN 1993 basis)
          notes: s.best.design?.notes ?? null,
        }
      : null,
    restraintStudy: s.restraintStudy,
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

// Project rationalisation: the engine's integer program (app/optimizer/rationalise.ts) fed with
// what a project already has in the database — each brief's latest finished sweep and its stored
// candidates — so a fabricator can see the lightest job that uses at most k plate thicknesses.
// Reads only; nothing here writes a row.
import { z } from "zod";
import { db, parseJson } from "~/lib/db.server";
import { candidateThicknesses, FAMILIES, type Family, type RationaliseInput, type RationaliseResult } from "~/optimizer";
import { runOnEngineThread } from "~/workers/engine-thread.server";

/**
 * Candidates per brief handed to the integer program: the "best few dozen" the issue asks for,
 * the lightest by area. The stored set is the best, each family's best and the weight-versus-
 * utilisation front, so the lightest 30 cover the useful trades between mass and thickness.
 * The solve runs on the server's engine thread (engine-thread.server.ts), off the event loop, but
 * one solve still holds that thread (and the section requests queued behind it), so the whole
 * program is held to about RATIONALISE_VARIABLE_BUDGET candidate variables: measured on this machine with random
 * 7-thickness candidate sets, 30 briefs × 20 took up to 1.9 s, 20 × 30 0.6 s, 60 × 10 0.8 s
 * (real sweeps' candidates are far more alike and solve in milliseconds). Large projects get
 * fewer candidates per brief, never fewer than RATIONALISE_MIN_PER_BRIEF; the page says how many.
 */
export const RATIONALISE_CANDIDATES_PER_BRIEF = 30;
export const RATIONALISE_MIN_PER_BRIEF = 5;
export const RATIONALISE_VARIABLE_BUDGET = 600;
export function candidatesPerBrief(briefsWithSweeps: number): number {
  return Math.min(RATIONALISE_CANDIDATES_PER_BRIEF, Math.max(RATIONALISE_MIN_PER_BRIEF, Math.floor(RATIONALISE_VARIABLE_BUDGET / Math.max(1, briefsWithSweeps))));
}
export const K_MAX = 10;
export const M_MAX = 20;

// Blank m (the form always sends the field) means "no limit on depths".
const blankToUndefined = (v: unknown) => (v === "" || v === null ? undefined : v);

export const rationaliseQuerySchema = z.object({
  k: z.preprocess(
    blankToUndefined,
    z.coerce
      .number({ error: "k must be a whole number from 1 to 10" })
      .int(`k must be a whole number from 1 to ${K_MAX}`)
      .min(1, `k must be at least 1`)
      .max(K_MAX, `k must be at most ${K_MAX}`)
      .default(3),
  ),
  m: z.preprocess(
    blankToUndefined,
    z.coerce
      .number({ error: `m must be a whole number from 1 to ${M_MAX}, or left blank` })
      .int(`m must be a whole number from 1 to ${M_MAX}, or left blank`)
      .min(1, "m must be at least 1, or left blank")
      .max(M_MAX, `m must be at most ${M_MAX}, or left blank`)
      .optional(),
  ),
});
export type RationaliseQuery = z.output<typeof rationaliseQuerySchema>;

/** Parses ?k=&m= into the query or a message per field (k, m). NaN/Infinity fail `int()`. */
export function parseRationaliseQuery(
  params: URLSearchParams,
): { ok: true; query: RationaliseQuery } | { ok: false; errors: Partial<Record<"k" | "m", string>> } {
  const raw = { k: params.get("k") ?? undefined, m: params.get("m") ?? undefined };
  const r = rationaliseQuerySchema.safeParse(raw);
  if (r.success) return { ok: true, query: r.data };
  const errors: Partial<Record<"k" | "m", string>> = {};
  for (const issue of r.error.issues) {
    const f = issue.path[0];
    if ((f === "k" || f === "m") && !errors[f]) errors[f] = issue.message;
  }
  return { ok: false, errors };
}

export interface RationalisedBrief {
  briefId: number;
  briefName: string;
  sweepId: number;
  family: Family;
  /** mm */
  dimensions: Record<string, number>;
  /** kg/m */
  massPerMetre: number;
  /** m; 1 when the brief has none */
  lengthM: number;
  count: number;
  /** true when length or count was missing and the default (1 m, 1 member) stands in */
  defaulted: boolean;
  /** massPerMetre × length × count, kg */
  mass: number;
  /** the brief's own lightest stored candidate × length × count, kg */
  ownBestMass: number;
  /** the chosen candidate's rank in its sweep's stored list */
  rank: number;
  /** plate thicknesses the chosen candidate uses, mm (the engine's rule) */
  thicknesses: number[];
}

export interface SkippedBrief {
  briefId: number;
  briefName: string;
  reason: string;
}

export interface ProjectRationalisation {
  k: number;
  m?: number;
  /** stored candidates per brief the program chose from (the lightest by area) */
  perBrief: number;
  skipped: SkippedBrief[];
  /** null when no brief has candidates to choose from */
  outcome:
    | null
    | { ok: false; reason: string; unconstrainedMass: number }
    | {
        ok: true;
        selection: RationalisedBrief[];
        /** mm, ascending */
        thicknesses: number[];
        /** mm, ascending */
        depths: number[];
        /** kg */
        totalMass: number;
        /** Σ each brief's own lightest candidate, kg: the job with no limit on thicknesses */
        unconstrainedMass: number;
      };
}

interface Usable {
  briefId: number;
  briefName: string;
  sweepId: number;
  lengthM: number;
  count: number;
  defaulted: boolean;
  candidates: { rank: number; family: Family; dimensions: Record<string, number>; massPerMetre: number }[];
}

const FAMILY_SET = new Set<string>(FAMILIES);

export async function rationaliseProject(projectId: number, query: RationaliseQuery): Promise<ProjectRationalisation> {
  const briefs = await db("briefs").where({ project_id: projectId }).orderBy("id").select("id", "name", "member_length_m", "member_count");
  // The latest succeeded sweep of each brief, rechecks left out: a recheck reruns the problem with
  // altered limits to check a result, it is not the brief's design answer.
  const sweeps = briefs.length
    ? await db("sweeps")
        .whereIn(
          "id",
          db("sweeps")
            .whereIn(
              "brief_id",
              briefs.map((b) => b.id),
            )
            .where({ project_id: projectId, status: "succeeded" })
            .whereNull("recheck_of")
            .groupBy("brief_id")
            .max({ id: "id" }),
        )
        .select("id", "brief_id")
    : [];
  const sweepOf = new Map<number, number>(sweeps.map((s: { id: number; brief_id: number }) => [s.brief_id, s.id]));
  const perBrief = candidatesPerBrief(sweepOf.size);
  const skipped: SkippedBrief[] = [];
  const usable: Usable[] = [];
  for (const b of briefs) {
    const sweepId = sweepOf.get(b.id);
    if (!sweepId) {
      skipped.push({ briefId: b.id, briefName: b.name, reason: "no finished sweep yet: run one from the brief" });
      continue;
    }
    const rows = await db("candidates")
      .where({ sweep_id: sweepId })
      .orderBy([
        { column: "area", order: "asc" },
        { column: "rank", order: "asc" },
      ])
      .limit(perBrief)
      .select("rank", "family", "dimensions", "mass_per_metre");
    const candidates = rows
      .map((r: { rank: number; family: string; dimensions: unknown; mass_per_metre: number }) => ({
        rank: Number(r.rank),
        family: r.family as Family,
        dimensions: parseJson<Record<string, number>>(r.dimensions),
        massPerMetre: Number(r.mass_per_metre),
      }))
      // The engine's schema would throw on these; a stored row from an older engine must not 500 the page.
      .filter((c) => FAMILY_SET.has(c.family) && Number.isFinite(c.massPerMetre) && c.massPerMetre > 0 && c.dimensions && typeof c.dimensions.d === "number");
    if (!candidates.length) {
      skipped.push({ briefId: b.id, briefName: b.name, reason: `sweep ${sweepId} found no feasible section` });
      continue;
    }
    const len = Number(b.member_length_m);
    const cnt = Number(b.member_count);
    const lengthOk = b.member_length_m != null && Number.isFinite(len) && len > 0;
    const countOk = b.member_count != null && Number.isInteger(cnt) && cnt >= 1;
    usable.push({
      briefId: b.id,
      briefName: b.name,
      sweepId,
      // A brief without a member length or count weighs as one member 1 m long (the page says so).
      lengthM: lengthOk ? len : 1,
      count: countOk ? cnt : 1,
      defaulted: !lengthOk || !countOk,
      candidates,
    });
  }
  if (!usable.length) return { k: query.k, m: query.m, perBrief, skipped, outcome: null };

  const ownBest = (u: Usable) => Math.min(...u.candidates.map((c) => c.massPerMetre)) * u.lengthM * u.count;
  const unconstrainedMass = usable.reduce((s, u) => s + ownBest(u), 0);
  const input: RationaliseInput = {
    briefs: usable.map((u) => ({
      id: String(u.briefId),
      length: u.lengthM,
      count: u.count,
      candidates: u.candidates.map((c) => ({ family: c.family, dimensions: c.dimensions, massPerMetre: c.massPerMetre })),
    })),
    maxThicknesses: query.k,
    maxDepths: query.m,
  };
  let r: RationaliseResult;
  try {
    r = await runOnEngineThread("rationalise", input);
  } catch (e) {
    // the engine thread full or past its time limit: a page, so say it in words rather than a 503
    if (e instanceof Response) return { k: query.k, m: query.m, perBrief, skipped, outcome: { ok: false, reason: "The engine is busy with other work; reload the page in a moment.", unconstrainedMass } };
    // The engine throws only when the solver's rounding breaks the limits it was given (its own
    // self-check): say so rather than answer a 500 or show a selection that is not right.
    console.error("rationalise failed", e);
    return { k: query.k, m: query.m, perBrief, skipped, outcome: { ok: false, reason: "The solver could not settle a selection for these limits; try another k or m.", unconstrainedMass } };
  }
  if (!r.ok) return { k: query.k, m: query.m, perBrief, skipped, outcome: { ok: false, reason: r.reason, unconstrainedMass } };
  const selection = r.choices.map((ch, i) => {
    const u = usable[i];
    const c = u.candidates[ch.index];
    return {
      briefId: u.briefId,
      briefName: u.briefName,
      sweepId: u.sweepId,
      family: c.family,
      dimensions: c.dimensions,
      massPerMetre: c.massPerMetre,
      lengthM: u.lengthM,
      count: u.count,
      defaulted: u.defaulted,
      mass: ch.mass,
      ownBestMass: ownBest(u),
      rank: c.rank,
      thicknesses: [...candidateThicknesses(c)].sort((a, b) => a - b),
    };
  });
  return {
    k: query.k,
    m: query.m,
    perBrief,
    skipped,
    outcome: { ok: true, selection, thicknesses: r.thicknesses, depths: r.depths, totalMass: r.totalMass, unconstrainedMass },
  };
}


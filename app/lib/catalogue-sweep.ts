// How a sweep's catalogue results are stored beside its plate candidates (the queue's finishSweep
// and the seed's recordFinishedSweep both call these): rolled candidates as rows ranked after the
// plate ones, the cost parts of every costed row, and the side-by-side summary for the sweep row.
// Pure (no database): returns what to write.
import { designRow, isCodeBasis } from "~/lib/design-summary";
import { MIN_WELD_THROAT, WELD_RUNS, weldCostPerMetre, type CatalogueResult, type CostParts, type Family, type RolledCandidate, type SearchProblem, type SideBySide } from "~/optimizer";

/** At most this many rolled candidates are stored per sweep (the lightest, or cheapest, first). */
export const STORED_ROLLED_CAP = 300;

export interface StoredRow {
  rank: number;
  family: string;
  dimensions: string;
  area: number;
  mass_per_metre: number;
  cost: number | null;
  utilisation: number;
  governing: string;
  on_front: boolean;
  family_best: boolean;
  source?: "plate" | "rolled";
  designation?: string | null;
  catalogue?: string | null;
  cost_material?: number | null;
  cost_fabrication?: number | null;
  /** EN 1993 or AISC 360: the design figures as JSON (lib/design-summary.ts), null under the allowable basis */
  design?: string | null;
}

/** A welded row's cost split as the objective priced it: its weld runs at the minimum throat, the rest material. */
export function weldedParts(family: string, cost: number, problem: SearchProblem): { material: number; fabrication: number } {
  const runs = (WELD_RUNS as Record<string, number>)[family] ?? 0;
  const fabrication = runs * weldCostPerMetre(MIN_WELD_THROAT, problem.costs?.weld);
  return { material: cost - fabrication, fabrication };
}

/** The plate rows with their cost parts, then the rolled candidates ranked after them. */
export function withRolledRows(rows: StoredRow[], sweepResult: object, problem: SearchProblem): StoredRow[] {
  const result = sweepResult as { catalogue?: CatalogueResult };
  const out: StoredRow[] = rows.map((r) => {
    if (r.cost === null || r.cost === undefined) return { ...r, source: "plate" };
    const p = weldedParts(r.family, r.cost, problem);
    return { ...r, source: "plate", cost_material: p.material, cost_fabrication: p.fabrication };
  });
  const cat = result.catalogue;
  if (!cat) return out;
  const kept = cat.feasible.slice(0, STORED_ROLLED_CAP);
  const objective = (c: RolledCandidate) => (problem.objective === "cost" ? (c.cost ?? Infinity) : c.area);
  // the rolled front: no other rolled section both lighter (cheaper) and less utilised
  const front = new Set<RolledCandidate>();
  let bestU = Infinity;
  for (const c of [...kept].sort((a, b) => objective(a) - objective(b) || a.utilisation - b.utilisation))
    if (c.utilisation < bestU) {
      front.add(c);
      bestU = c.utilisation;
    }
  let rank = out.length;
  for (const c of kept)
    out.push({
      rank: ++rank,
      family: c.family,
      dimensions: JSON.stringify(c.dimensions),
      area: c.area,
      mass_per_metre: c.massPerMetre,
      cost: c.cost ?? null,
      utilisation: c.utilisation,
      governing: c.governing,
      on_front: front.has(c),
      family_best: c === cat.lightest || c === cat.cheapest,
      source: "rolled",
      designation: c.designation,
      catalogue: c.catalogue,
      cost_material: c.costParts?.material ?? null,
      cost_fabrication: c.costParts?.fabrication ?? null,
      design: isCodeBasis(problem.basis) ? rolledDesign(c) : null,
    });
  return out;
}

/** A rolled row's design figures from the evaluation the catalogue search ran (nothing re-checked). */
function rolledDesign(c: RolledCandidate): string | null {
  const row = designRow({ design: c.design, aisc: c.aisc, checks: c.checks, governing: c.governing });
  return row ? JSON.stringify(row) : null;
}

/** One side's section in the stored summary (enough to show, draw and save it). */
export interface SummaryPoint {
  source: "plate" | "rolled";
  family: string;
  dimensions: Record<string, number>;
  designation?: string;
  catalogue?: string;
  area: number;
  massPerMetre: number;
  cost?: number;
  costParts?: CostParts;
  utilisation: number;
  governing: string;
}

export interface CatalogueSummary {
  sideBySide: {
    welded: { lightest: SummaryPoint | null; cheapest: SummaryPoint | null };
    rolled: { lightest: SummaryPoint | null; cheapest: SummaryPoint | null };
    winner: SideBySide["winner"];
  };
  counts: CatalogueResult["counts"];
  skipped: CatalogueResult["skipped"];
  catalogues: string[];
}

function point(c: { family: string; dimensions: Record<string, number>; area: number; massPerMetre: number; cost?: number; utilisation: number; governing: string } | null, problem: SearchProblem): SummaryPoint | null {
  if (!c) return null;
  const rolled = "source" in c && (c as RolledCandidate).source === "rolled";
  const out: SummaryPoint = { source: rolled ? "rolled" : "plate", family: c.family, dimensions: c.dimensions, area: c.area, massPerMetre: c.massPerMetre, utilisation: c.utilisation, governing: c.governing };
  if (rolled) {
    out.designation = (c as RolledCandidate).designation;
    out.catalogue = (c as RolledCandidate).catalogue;
    if ((c as RolledCandidate).costParts) out.costParts = (c as RolledCandidate).costParts;
  }
  if (c.cost !== undefined) {
    out.cost = c.cost;
    if (!rolled) {
      const p = weldedParts(c.family as Family, c.cost, problem);
      out.costParts = { material: p.material, fabrication: p.fabrication, total: c.cost, ...(p.fabrication > 0 ? { weldRuns: WELD_RUNS[c.family as Family], weldThroat: MIN_WELD_THROAT } : {}) };
    }
  }
  return out;
}

/** The sweep row's catalogue_result, or null when the brief searched no catalogue. */
export function catalogueSummary(sweepResult: object, problem: SearchProblem): CatalogueSummary | null {
  const result = sweepResult as { catalogue?: CatalogueResult; sideBySide?: SideBySide };
  if (!result.catalogue || !result.sideBySide) return null;
  const s = result.sideBySide;
  return {
    sideBySide: {
      welded: { lightest: point(s.welded.lightest, problem), cheapest: point(s.welded.cheapest, problem) },
      rolled: { lightest: point(s.rolled.lightest, problem), cheapest: point(s.rolled.cheapest, problem) },
      winner: s.winner,
    },
    counts: result.catalogue.counts,
    skipped: result.catalogue.skipped,
    catalogues: (problem.catalogues ?? []).map((c) => c.name),
  };
}

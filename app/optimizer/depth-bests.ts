// Each family's lightest feasible section at every depth of the grid (issue 11, item 9), so a
// sweep's results can be filtered by depth or family without searching again. Each depth is its
// own exact search (searchSections over that one depth index: its bestByFamily is exact for the
// range, the contract search-threads.ts already relies on), so every point is proven the lightest
// (by the problem's objective) of its family at its depth. And geometryKey: the one test of "the
// same section" that the stored results use to list a shape found by two families once.
import { familyPlates, type Family } from "./geometry";
import type { SearchPoint } from "./grid";
import { searchSections } from "./search";
import { gridValues, searchProblemSchema, type SearchProblemInput } from "./search-schema";

export interface DepthBestsOptions {
  signal?: AbortSignal;
  /** asked before each depth and inside its search; once true the rest are skipped and `complete` is false */
  stopWhen?: () => boolean;
}

export interface DepthBests {
  /** by family in the problem's order, then depth; one point per (family, depth) that has a feasible section */
  points: SearchPoint[];
  /** false when stopWhen cut the work short (the points found are still exact for their depths) */
  complete: boolean;
  /**
   * The depths (mm, grid values) searched to the end, ascending: at these a family without a
   * point has no feasible section; at the others nothing is known.
   */
  searched: number[];
}

export function depthBests(input: SearchProblemInput, options: DepthBestsOptions = {}): DepthBests {
  const problem = searchProblemSchema.parse(input);
  const depths = gridValues(problem.depth);
  const byFamily = new Map<Family, SearchPoint[]>(problem.families.map((f) => [f, []]));
  const searched: number[] = [];
  let complete = true;
  for (let i = 0; i < depths.length; i++) {
    if (options.stopWhen?.()) {
      complete = false;
      break;
    }
    const r = searchSections(problem, { front: "evaluated", depthIndexRange: [i, i + 1], signal: options.signal, stopWhen: options.stopWhen });
    // A search stopped part way has a best so far, not the lightest: none of its points is kept.
    if (r.stoppedEarly) {
      complete = false;
      break;
    }
    searched.push(depths[i]);
    for (const f of problem.families) {
      const c = r.bestByFamily[f];
      if (!c) continue;
      const point: SearchPoint = { family: c.family, dimensions: c.dimensions, area: c.area, massPerMetre: c.massPerMetre, utilisation: c.utilisation, governing: c.governing };
      if (c.cost !== undefined) point.cost = c.cost;
      byFamily.get(f)!.push(point);
    }
  }
  return { points: problem.families.flatMap((f) => byFamily.get(f)!), complete, searched };
}

/**
 * The same section, whatever family found it: the plates it is welded from (familyPlates), sorted.
 * A mono-symmetric I with equal flanges and the I of the same sizes give one key. Null for what is
 * not a plate family (catalogue sections keep their own identity).
 */
export function geometryKey(family: string, dimensions: Record<string, number>): string | null {
  try {
    const plates = familyPlates(family as Family, dimensions as never);
    const r = (x: number) => Math.round(x * 1e6) / 1e6;
    return plates
      .map((p) => `${r(p.b)},${r(p.h)},${r(p.z)},${r(p.y)}`)
      .sort()
      .join(";");
  } catch {
    return null;
  }
}

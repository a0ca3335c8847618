// The calculation record's numbers, all from the engine: the family's plates (familyPlates),
// the composite-area table (compositeTable, the same parallel-axis table the kernel sums), the
// section properties, the fibre stresses and every check (candidateChecks). Nothing is
// recomputed here; this module only gathers them for printing.
import { compositeTable, type CompositeTable, type PlateRect } from "~/optimizer/composite";
import { FAMILIES, familyPlates, type Family } from "~/optimizer/geometry";
import type { CatalogueSection } from "~/optimizer/catalogue";
import { catalogueCandidateChecks } from "~/optimizer/catalogue-search";
import { sectionProperties, type SectionProperties } from "~/optimizer/properties";
import { sectionStresses } from "~/optimizer/stress";
import { candidateChecks, type CandidateVerdict } from "~/optimizer/checks";
import type { SearchProblem } from "~/optimizer/search-schema";
import type { SectionInput } from "~/optimizer/schema";

export interface FibreStress {
  case: "sagging" | "hogging";
  /** kN·m */
  M: number;
  /** top and bottom fibre stresses, MPa (tension positive) */
  top: number;
  bottom: number;
  /** Iyz ≈ 0: σ = M·c/Iz applies as written; otherwise the general formula was used */
  symmetric: boolean;
}

export interface CalculationRecord {
  section: SectionInput;
  plates: PlateRect[];
  table: CompositeTable;
  properties: SectionProperties;
  fibres: FibreStress[];
  verdict: CandidateVerdict;
}

export function buildRecord(family: Family, dimensions: Record<string, number>, problem: SearchProblem, rolled: CatalogueSection | null = null): CalculationRecord {
  const section = { family, ...dimensions, density: problem.density } as SectionInput;
  const properties = sectionProperties(section);
  // A rolled section's table lists its rectangles (root fillets and rounded corners are in the
  // properties, not in the table); a hollow one has no rectangles, so its table is its totals.
  const plates = (FAMILIES as readonly string[]).includes(family) ? familyPlates(family, dimensions) : [];
  const table = plates.length
    ? compositeTable(plates)
    : { rows: [], totals: { A: properties.area, Ayc: properties.area * properties.centroid.y, yBar: properties.centroid.y, I0: properties.Iz, Ad2: 0, Iz: properties.Iz } };
  // Relative to Iz·Iy: below this the product of inertia is rounding, and the elementary formula holds.
  const symmetric = Math.abs(properties.Iyz) <= 1e-9 * Math.sqrt(properties.Iz * properties.Iy);
  const fibres: FibreStress[] = [];
  for (const [name, M] of [
    ["sagging", problem.moment.sagging],
    ["hogging", -problem.moment.hogging],
  ] as const) {
    if (M === 0) continue;
    const s = sectionStresses(section, { Mz: M });
    fibres.push({ case: name, M: Math.abs(M), top: s.fibre.top, bottom: s.fibre.bottom, symmetric });
  }
  return { section, plates, table, properties, fibres, verdict: rolled ? catalogueCandidateChecks(rolled, problem) : candidateChecks(family, dimensions, problem) };
}

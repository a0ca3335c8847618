// Plate cutting list from the member schedule: the engine's own plates of each section
// (familyPlates, the layout the properties were computed from), one strip per plate per member,
// grouped by thickness with their mass.
//
// Choices (spec silent): a plate's thickness is the smaller of its two cross-section sides and
// its width the larger; its length is the member length. Members without a length and count,
// and sections not made of plates the engine knows (rolled catalogue sections among them: bought
// as sections, not cut), are left out and counted in `skipped`.
// Prices from stock lists are not applied yet.
import Papa from "papaparse";
import { plainNumbers } from "~/lib/plain-numbers";
import { familyPlates, type Family } from "~/optimizer/geometry";

export interface CuttingInput {
  family: Family;
  dimensions: Record<string, number>;
  density: number;
  lengthM: number | null;
  count: number | null;
  rolled?: boolean;
}

export interface CutPlate {
  thickness: number;
  width: number;
  lengthM: number;
  count: number;
  /** kg, all `count` plates */
  mass: number;
}

export interface ThicknessGroup {
  thickness: number;
  plates: CutPlate[];
  mass: number;
}

export function cuttingList(rows: CuttingInput[]): { groups: ThicknessGroup[]; totalMass: number; skipped: number } {
  const byKey = new Map<string, CutPlate>();
  let skipped = 0;
  for (const r of rows) {
    if (r.lengthM == null || r.count == null || r.rolled) {
      skipped++;
      continue;
    }
    let plates;
    try {
      plates = familyPlates(r.family, r.dimensions as never);
    } catch {
      skipped++;
      continue;
    }
    for (const p of plates) {
      const thickness = Math.min(p.b, p.h),
        width = Math.max(p.b, p.h);
      const key = `${thickness}|${width}|${r.lengthM}|${r.density}`;
      // mass = t·w (mm²) × 1e-6 (m²/mm²) × L (m) × ρ (kg/m³)
      const each = thickness * width * 1e-6 * r.lengthM * r.density;
      const hit = byKey.get(key);
      if (hit) {
        hit.count += r.count;
        hit.mass += each * r.count;
      } else byKey.set(key, { thickness, width, lengthM: r.lengthM, count: r.count, mass: each * r.count });
    }
  }
  const groups = new Map<number, ThicknessGroup>();
  for (const p of byKey.values()) {
    const g = groups.get(p.thickness) ?? { thickness: p.thickness, plates: [], mass: 0 };
    g.plates.push(p);
    g.mass += p.mass;
    groups.set(p.thickness, g);
  }
  const sorted = [...groups.values()].sort((a, b) => a.thickness - b.thickness);
  for (const g of sorted) g.plates.sort((a, b) => a.width - b.width || a.lengthM - b.lengthM);
  return { groups: sorted, totalMass: sorted.reduce((a, g) => a + g.mass, 0), skipped };
}

export const CUTTING_CSV_FIELDS = ["thickness_mm", "width_mm", "length_m", "count", "mass_kg"] as const;

export function cuttingListCsv(list: ReturnType<typeof cuttingList>): string {
  return Papa.unparse({ fields: [...CUTTING_CSV_FIELDS], data: plainNumbers(list.groups.flatMap((g) => g.plates.map((p) => [p.thickness, p.width, p.lengthM, p.count, p.mass]))) }) + "\n";
}

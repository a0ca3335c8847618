// Plate cutting list from the member schedule: the engine's own plates of each section
// (familyPlates, the layout the properties were computed from), one strip per plate per member,
// grouped by thickness with their mass.
//
// Choices (spec silent): a plate's thickness is the smaller of its two cross-section sides and
// its width the larger; its length is the member length. Members without a length and count,
// and sections not made of plates the engine knows (rolled catalogue sections among them: bought
// as sections, not cut), are left out and counted in `skipped`.
// Widths ordered and prices: orderCuttingList below.
import Papa from "papaparse";
import { z } from "zod";
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

// ---- Ordering and cost (the printable cutting list) ----
//
// Choices (the spec is silent):
// - Widths ordered: where the chosen stock list gives widths at a plate's thickness, each cut
//   plate is taken from the stock width that needs the least steel ordered: floor(W ÷ w) strips
//   side by side from each plate of width W and the member's length, so ceil(count ÷ strips)
//   plates are ordered. No allowance is made for the cutting kerf or for nesting lengths end to
//   end (both the fabricator's to judge); the offcut is in the ordered mass.
// - Price per kg: the stock list's price for that thickness and width when it gives one, else the
//   team's plate price for the thickness (/admin/costs), else none; the cost is the ordered mass
//   (the cut mass where no width is ordered) times that price. A total cost is given only when
//   every line has a price; otherwise the lines without one are counted.

export interface StockItem {
  thickness: number;
  width: number | null;
  pricePerKg: number | null;
}

export interface OrderedPlate extends CutPlate {
  /** the stock width ordered (mm), or null when the stock list gives none at this thickness */
  orderWidth: number | null;
  /** how many plates of orderWidth × lengthM are ordered */
  orderCount: number | null;
  /** kg ordered (the cut mass when no width is ordered) */
  orderMass: number;
  pricePerKg: number | null;
  cost: number | null;
}

export interface OrderedGroup {
  thickness: number;
  plates: OrderedPlate[];
  mass: number;
  orderMass: number;
  cost: number | null;
}

export interface OrderedList {
  groups: OrderedGroup[];
  totalMass: number;
  totalOrderMass: number;
  /** null when any line lacks a price */
  totalCost: number | null;
  unpriced: number;
  skipped: number;
}

export function orderCuttingList(list: ReturnType<typeof cuttingList>, stock: StockItem[], platePrices: { thickness: number; pricePerKg: number }[]): OrderedList {
  let unpriced = 0;
  const groups = list.groups.map((g): OrderedGroup => {
    const widths = stock.filter((s) => s.thickness === g.thickness && s.width != null && s.width > 0);
    const teamPrice = platePrices.find((p) => p.thickness === g.thickness)?.pricePerKg ?? null;
    const plates = g.plates.map((p): OrderedPlate => {
      // ρ of this line back from its own mass: mass = t·w·1e-6·L·ρ·count
      const perMm2 = p.mass / (p.thickness * p.width);
      let best: { item: StockItem; n: number; mass: number } | null = null;
      for (const item of widths) {
        const strips = Math.floor(item.width! / p.width);
        if (strips < 1) continue;
        const n = Math.ceil(p.count / strips);
        const mass = (perMm2 / p.count) * p.thickness * item.width! * n;
        if (!best || mass < best.mass - 1e-9 || (Math.abs(mass - best.mass) <= 1e-9 && item.width! < best.item.width!)) best = { item, n, mass };
      }
      const orderMass = best ? best.mass : p.mass;
      const pricePerKg = best?.item.pricePerKg ?? teamPrice;
      if (pricePerKg == null) unpriced++;
      return { ...p, orderWidth: best?.item.width ?? null, orderCount: best?.n ?? null, orderMass, pricePerKg, cost: pricePerKg == null ? null : orderMass * pricePerKg };
    });
    const priced = plates.every((p) => p.cost != null);
    return {
      thickness: g.thickness,
      plates,
      mass: g.mass,
      orderMass: plates.reduce((a, p) => a + p.orderMass, 0),
      cost: priced ? plates.reduce((a, p) => a + p.cost!, 0) : null,
    };
  });
  return {
    groups,
    totalMass: list.totalMass,
    totalOrderMass: groups.reduce((a, g) => a + g.orderMass, 0),
    totalCost: unpriced === 0 && groups.length ? groups.reduce((a, g) => a + g.cost!, 0) : null,
    unpriced,
    skipped: list.skipped,
  };
}

export const CUTTING_CSV_FIELDS = ["thickness_mm", "width_mm", "length_m", "count", "mass_kg", "order_width_mm", "order_count", "order_mass_kg", "price_per_kg", "cost", "currency"] as const;

/** One line per cut plate; the order columns blank where no width is ordered or no price known. */
export function cuttingListCsv(list: OrderedList, currency = ""): string {
  const blank = (x: number | null) => (x == null ? "" : x);
  const data = list.groups.flatMap((g) =>
    g.plates.map((p) => [p.thickness, p.width, p.lengthM, p.count, p.mass, blank(p.orderWidth), blank(p.orderCount), p.orderMass, blank(p.pricePerKg), blank(p.cost), p.cost == null ? "" : currency]),
  );
  return Papa.unparse({ fields: [...CUTTING_CSV_FIELDS], data: plainNumbers(data) }) + "\n";
}

/** ?stock=ID: the team's stock list to order widths from (absent or empty: none). */
export const cuttingListQuery = z.object({
  stock: z
    .string()
    .regex(/^(|[1-9]\d{0,9})$/, "stock: choose one of the team's stock lists")
    .optional()
    .transform((v) => (v ? Number(v) : undefined)),
});

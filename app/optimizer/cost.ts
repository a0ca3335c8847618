// Cost per metre of beam for comparing rolled with welded sections: material (mass × price per kg
// of its product: rolled section, or plate by thickness) plus fabrication (metres of weld per metre
// of beam × the cost per metre of a fillet weld of the throat it needs). Pure; the team's settings
// reach the engine as the problem's `costs` and `prices`.
import { z } from "zod";
import type { Family } from "./geometry";

const money = (name: string) =>
  z
    .number({ error: `${name} must be a number` })
    .refine(Number.isFinite, `${name} must be a finite number`)
    .refine((x) => x >= 0 && x <= 1e6, `${name} must be between 0 and 1000000`);
const throat = (name: string) =>
  z
    .number({ error: `${name} must be a number (mm)` })
    .refine(Number.isFinite, `${name} must be a finite number (mm)`)
    .refine((x) => x >= 1 && x <= 50, `${name} must be between 1 and 50 mm`);

export const MAX_WELD_SIZES = 30;

/** Fabrication cost of one metre of fillet weld by throat size a (mm): a row per size the shop prices. */
export const weldCostsSchema = z
  .array(z.object({ throat: throat("weld[].throat"), perMetre: money("weld[].perMetre") }), { error: "weld must be a list of { throat, perMetre }" })
  .min(1, "weld needs at least one throat size")
  .max(MAX_WELD_SIZES, `weld: at most ${MAX_WELD_SIZES} throat sizes`)
  .superRefine((rows, ctx) => {
    const seen = new Set<number>();
    rows.forEach((r, i) => {
      if (seen.has(r.throat)) ctx.addIssue({ code: "custom", path: [i, "throat"], message: `weld: throat ${r.throat} mm is listed twice` });
      seen.add(r.throat);
    });
  });
export type WeldCosts = z.output<typeof weldCostsSchema>;

/** The problem's cost settings beside the plate prices (`prices`, by thickness). */
export const costsSchema = z.object({
  /** price per kg of rolled (catalogue) sections */
  rolledPricePerKg: money("costs.rolledPricePerKg").refine((x) => x > 0, "costs.rolledPricePerKg must be > 0").optional(),
  /** fabrication cost per metre of fillet weld by throat size */
  weld: weldCostsSchema.optional(),
});
export type Costs = z.output<typeof costsSchema>;

/**
 * Fillet weld runs per metre of beam for each plate family: two fillets at each flange-to-web
 * junction (member-checks.md §2, check 6: "two fillet welds per junction"; the box: one per web
 * per flange, so four). A solid rectangle has none; rolled catalogue sections have none.
 */
export const WELD_RUNS: Record<Family, number> = {
  rectangle: 0,
  i: 4,
  "mono-i": 4,
  channel: 4,
  "channel-down": 4,
  tee: 2,
  box: 4,
  angle: 2,
};

/**
 * Under the allowable-stress basis nothing sizes the welds, so their cost is priced at this
 * throat: EN 1993-1-8 §4.5.2(2) asks for a fillet throat of at least 3 mm, and member-checks.md
 * rounds every required throat up to at least 3 mm. A choice, stated with the cost.
 */
export const MIN_WELD_THROAT = 3;

/**
 * Cost of one metre of fillet weld of throat a: the price of the smallest listed throat ≥ a;
 * above the largest listed throat, that price × (a / throat)², since weld metal and passes grow
 * with the throat's square (common practice). 0 when no weld costs are set.
 */
export function weldCostPerMetre(a: number, table: WeldCosts | undefined): number {
  if (!table || table.length === 0) return 0;
  let best: { throat: number; perMetre: number } | null = null,
    largest = table[0]!;
  for (const r of table) {
    if (r.throat >= a && (!best || r.throat < best.throat)) best = r;
    if (r.throat > largest.throat) largest = r;
  }
  if (best) return best.perMetre;
  return largest.perMetre * (a / largest.throat) ** 2;
}

/** Material and fabrication cost per metre of beam, in the team's currency. */
export interface CostParts {
  material: number;
  fabrication: number;
  total: number;
  /** the throat the weld cost was priced at (mm), when the section has welds */
  weldThroat?: number;
  /** metres of weld per metre of beam */
  weldRuns?: number;
}

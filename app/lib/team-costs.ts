// The team's cost settings (issue: cost that compares rolled with welded): price per kg of rolled
// sections and of plate by thickness, and the fabrication cost per metre of fillet weld by throat
// size. Pure (form schema, parsing of the two price lists); team-costs.server.ts stores them.
// Lists are typed one pair per line ("10, 1.12"), so a row can never lose its partner the way two
// parallel inputs could.
import { z } from "zod";
import { MAX_WELD_SIZES, weldCostsSchema, type WeldCosts } from "~/optimizer";

export const MAX_PLATE_PRICES = 100;
export const CURRENCY_MAX = 8;

export interface TeamCosts {
  currency: string;
  rolledPricePerKg: number | null;
  platePrices: { thickness: number; pricePerKg: number }[];
  weld: WeldCosts;
}

export const EMPTY_COSTS: TeamCosts = { currency: "", rolledPricePerKg: null, platePrices: [], weld: [] };

const NUMBER = /^\d+(\.\d+)?$/;

/** "a, b" lines → pairs; messages name the line. Blank lines are skipped. */
function pairs(text: string, what: string, ctx: z.RefinementCtx, path: string): [number, number][] | null {
  const out: [number, number][] = [];
  let ok = true;
  text.split(/\r\n|\n|\r/).forEach((raw, i) => {
    const line = raw.trim();
    if (!line) return;
    const parts = line.split(/\s*[,;\t ]\s*/);
    if (parts.length !== 2 || !parts.every((p) => NUMBER.test(p))) {
      ctx.addIssue({ code: "custom", path: [path], message: `line ${i + 1}: “${line.slice(0, 30)}” is not two numbers (${what})` });
      ok = false;
      return;
    }
    out.push([Number(parts[0]), Number(parts[1])]);
  });
  return ok ? out : null;
}

const money = (x: number) => x > 0 && x <= 1e6;

export const teamCostsFormSchema = z
  .object({
    intent: z.literal("save", { error: 'must be "save"' }),
    currency: z
      .string({ error: "must be text" })
      .trim()
      .max(CURRENCY_MAX, `must be at most ${CURRENCY_MAX} characters`)
      .regex(/^[^\p{Cc}]*$/u, "must be one line of plain text")
      .optional()
      .default(""),
    rolledPricePerKg: z.coerce
      .number({ error: "must be a number (price per kg)" })
      .refine((x) => money(x), "must be more than 0 and at most 1000000 per kg")
      .optional(),
    platePrices: z.string({ error: "must be text" }).max(8000, "is too long").optional().default(""),
    weld: z.string({ error: "must be text" }).max(4000, "is too long").optional().default(""),
  })
  .transform((v, ctx): TeamCosts => {
    const plate = pairs(v.platePrices, "thickness in mm, price per kg", ctx, "platePrices") ?? [];
    const weldPairs = pairs(v.weld, "throat in mm, cost per metre", ctx, "weld") ?? [];
    const platePrices: TeamCosts["platePrices"] = [];
    const seen = new Set<number>();
    for (const [thickness, pricePerKg] of plate) {
      if (!(thickness > 0 && thickness <= 500)) ctx.addIssue({ code: "custom", path: ["platePrices"], message: `thickness ${thickness} mm must be more than 0 and at most 500 mm` });
      else if (!money(pricePerKg)) ctx.addIssue({ code: "custom", path: ["platePrices"], message: `price ${pricePerKg} for ${thickness} mm must be more than 0 and at most 1000000 per kg` });
      else if (seen.has(thickness)) ctx.addIssue({ code: "custom", path: ["platePrices"], message: `thickness ${thickness} mm is listed twice` });
      else {
        seen.add(thickness);
        platePrices.push({ thickness, pricePerKg });
      }
    }
    if (platePrices.length > MAX_PLATE_PRICES) ctx.addIssue({ code: "custom", path: ["platePrices"], message: `at most ${MAX_PLATE_PRICES} thicknesses` });
    let weld: WeldCosts = [];
    if (weldPairs.length) {
      const w = weldCostsSchema.safeParse(weldPairs.map(([throat, perMetre]) => ({ throat, perMetre })));
      if (!w.success) ctx.addIssue({ code: "custom", path: ["weld"], message: w.error.issues[0]!.message.replace(/^weld(\[\])?\.?/, "").trim() || "is not valid" });
      else weld = w.data;
    }
    if (weldPairs.length > MAX_WELD_SIZES) ctx.addIssue({ code: "custom", path: ["weld"], message: `at most ${MAX_WELD_SIZES} throat sizes` });
    return {
      currency: v.currency,
      rolledPricePerKg: v.rolledPricePerKg ?? null,
      platePrices: platePrices.sort((a, b) => a.thickness - b.thickness),
      weld: [...weld].sort((a, b) => a.throat - b.throat),
    };
  });

/** The lists back as the form's text. */
export function pairsText(rows: { a: number; b: number }[]): string {
  return rows.map((r) => `${r.a}, ${r.b}`).join("\n");
}

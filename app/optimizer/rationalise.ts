// Project rationalisation: one candidate per brief, least total steel mass, with at most k
// distinct plate thicknesses over the whole project (and optionally at most m distinct
// depths). An integer program solved by javascript-lp-solver's branch and bound:
//
//   min  Σ_i Σ_j  mass_ij · length_i · count_i · x_ij
//   s.t. Σ_j x_ij = 1                                   (each brief picks one candidate)
//        Σ_{j : t ∈ T_ij} x_ij ≤ y_t      for each brief i, thickness t
//        Σ_t y_t ≤ k
//        (and likewise z_d for depths with Σ_d z_d ≤ m)
//        x, y, z binary
//
// The per-brief linking rows (rather than x_ij ≤ y_t per candidate) are valid because a brief
// picks exactly one candidate, and they give a much tighter LP relaxation.
import solver from "javascript-lp-solver";
import { z } from "zod";
import { FAMILIES, FAMILY_DIMENSIONS, type Family } from "./geometry";
import { dimRole } from "./search-schema";

export const rationaliseInputSchema = z.object({
  briefs: z
    .array(
      z.object({
        id: z.string().min(1, { message: "briefs[].id must not be empty" }),
        /** member length, m */
        length: z.number().refine((x) => Number.isFinite(x) && x > 0, { message: "briefs[].length must be > 0" }),
        count: z.number().int({ message: "briefs[].count must be a whole number" }).min(1, { message: "briefs[].count must be ≥ 1" }),
        candidates: z
          .array(
            z.object({
              family: z.enum(FAMILIES),
              dimensions: z.record(z.string(), z.number()),
              massPerMetre: z.number().refine((x) => Number.isFinite(x) && x > 0, { message: "candidates[].massPerMetre must be > 0" }),
            }),
          )
          .min(1, { message: "each brief needs at least one candidate" }),
      }),
    )
    .min(1, { message: "briefs must list at least one brief" }),
  maxThicknesses: z.number().int({ message: "maxThicknesses must be a whole number" }).min(1, { message: "maxThicknesses must be ≥ 1" }),
  maxDepths: z.number().int({ message: "maxDepths must be a whole number" }).min(1, { message: "maxDepths must be ≥ 1" }).optional(),
});
export type RationaliseInput = z.input<typeof rationaliseInputSchema>;
type Cand = RationaliseInput["briefs"][number]["candidates"][number];

export interface RationaliseChoice {
  briefId: string;
  /** index into that brief's candidates */
  index: number;
  candidate: Cand;
  /** massPerMetre × length × count, kg */
  mass: number;
}

export type RationaliseResult =
  | { ok: true; choices: RationaliseChoice[]; totalMass: number; thicknesses: number[]; depths: number[] }
  | { ok: false; reason: string };

/**
 * The stock plate thicknesses a candidate uses. A solid rectangle is cut from plate as thick as
 * its smaller side (common practice), so that is its thickness.
 */
export function candidateThicknesses(c: { family: Family; dimensions: Record<string, number> }): number[] {
  if (c.family === "rectangle") return [Math.min(c.dimensions.b, c.dimensions.d)];
  const out = new Set<number>();
  for (const k of FAMILY_DIMENSIONS[c.family]) if (dimRole(c.family, k) === "thickness") out.add(c.dimensions[k]);
  return [...out];
}

const depthOf = (c: { dimensions: Record<string, number> }) => c.dimensions.d;

export function rationalise(input: RationaliseInput): RationaliseResult {
  const p = rationaliseInputSchema.parse(input);
  const k = p.maxThicknesses,
    m = p.maxDepths;
  const thick = new Map<number, string>();
  const depths = new Map<number, string>();
  const model = {
    optimize: "mass",
    opType: "min" as const,
    constraints: {} as Record<string, { equal?: number; max?: number }>,
    variables: {} as Record<string, Record<string, number>>,
    binaries: {} as Record<string, 1>,
  };
  const tName = (t: number) => {
    if (!thick.has(t)) thick.set(t, `y${thick.size}`);
    return thick.get(t)!;
  };
  const dName = (d: number) => {
    if (!depths.has(d)) depths.set(d, `z${depths.size}`);
    return depths.get(d)!;
  };
  p.briefs.forEach((b, i) => {
    model.constraints[`pick${i}`] = { equal: 1 };
    b.candidates.forEach((c, j) => {
      const x = `x${i}_${j}`;
      const v: Record<string, number> = { mass: c.massPerMetre * b.length * b.count, [`pick${i}`]: 1 };
      for (const t of candidateThicknesses(c)) v[`lt${i}_${tName(t)}`] = 1;
      if (m !== undefined) v[`ld${i}_${dName(depthOf(c))}`] = 1;
      model.variables[x] = v;
      model.binaries[x] = 1;
    });
  });
  const link = (names: Map<number, string>, prefix: string, cap: string, limit: number) => {
    model.constraints[cap] = { max: limit };
    for (const y of names.values()) {
      const v: Record<string, number> = { [cap]: 1 };
      p.briefs.forEach((_, i) => {
        const row = `${prefix}${i}_${y}`;
        // only rows some candidate of brief i uses exist
        if (Object.values(model.variables).some((xv) => xv[row] === 1)) {
          model.constraints[row] = { max: 0 };
          v[row] = -1;
        }
      });
      model.variables[y] = v;
      model.binaries[y] = 1;
    }
  };
  link(thick, "lt", "thicknessCap", k);
  if (m !== undefined) link(depths, "ld", "depthCap", m);

  const sol = solver.Solve(model) as Record<string, number | boolean | undefined>;
  const words = `at most ${k} distinct plate thickness${k === 1 ? "" : "es"}${m !== undefined ? ` and at most ${m} distinct depth${m === 1 ? "" : "s"}` : ""}`;
  if (!sol.feasible)
    return {
      ok: false,
      reason: `No selection satisfies k = ${k}${m !== undefined ? `, m = ${m}` : ""}: no choice of one candidate per brief uses ${words}. Allow more thicknesses${m !== undefined ? " or depths" : ""}, or give the briefs more candidates.`,
    };
  const choices: RationaliseChoice[] = p.briefs.map((b, i) => {
    let best = 0,
      bestVal = -1;
    b.candidates.forEach((_, j) => {
      const val = Number(sol[`x${i}_${j}`] ?? 0);
      if (val > bestVal) {
        bestVal = val;
        best = j;
      }
    });
    const c = b.candidates[best];
    return { briefId: b.id, index: best, candidate: c, mass: c.massPerMetre * b.length * b.count };
  });
  const usedT = [...new Set(choices.flatMap((c) => candidateThicknesses(c.candidate)))].sort((a, b) => a - b);
  const usedD = [...new Set(choices.map((c) => depthOf(c.candidate)))].sort((a, b) => a - b);
  // The solver's rounding is trusted only after checking the limits on the integer choice.
  if (usedT.length > k || (m !== undefined && usedD.length > m))
    throw new Error("rationalise: the solver returned a selection that breaks the limits");
  return { ok: true, choices, totalMass: choices.reduce((s, c) => s + c.mass, 0), thicknesses: usedT, depths: usedD };
}

/** Plain enumeration over thickness subsets (and depth subsets): the reference for the tests. */
export function rationaliseBruteForce(input: RationaliseInput): RationaliseResult {
  const p = rationaliseInputSchema.parse(input);
  let best: { total: number; pick: number[] } | null = null;
  const n = p.briefs.length;
  const pick = new Array<number>(n).fill(0);
  const rec = (i: number, ts: Set<number>, ds: Set<number>, total: number) => {
    if (best && total >= best.total) return;
    if (i === n) {
      best = { total, pick: [...pick] };
      return;
    }
    const b = p.briefs[i];
    b.candidates.forEach((c, j) => {
      const t2 = new Set([...ts, ...candidateThicknesses(c)]);
      if (t2.size > p.maxThicknesses) return;
      const d2 = new Set([...ds, depthOf(c)]);
      if (p.maxDepths !== undefined && d2.size > p.maxDepths) return;
      pick[i] = j;
      rec(i + 1, t2, d2, total + c.massPerMetre * b.length * b.count);
    });
  };
  rec(0, new Set(), new Set(), 0);
  if (!best) return { ok: false, reason: "No selection satisfies k" };
  const bb = best as { total: number; pick: number[] };
  const choices = p.briefs.map((b, i) => {
    const c = b.candidates[bb.pick[i]];
    return { briefId: b.id, index: bb.pick[i], candidate: c, mass: c.massPerMetre * b.length * b.count };
  });
  return {
    ok: true,
    choices,
    totalMass: bb.total,
    thicknesses: [...new Set(choices.flatMap((c) => candidateThicknesses(c.candidate)))].sort((a, b) => a - b),
    depths: [...new Set(choices.map((c) => depthOf(c.candidate)))].sort((a, b) => a - b),
  };
}

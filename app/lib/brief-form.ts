// The brief editor's form ↔ the engine's SearchProblem. The form's field names are the
// SearchProblem's own dotted paths ("depth.max", "allowable.shear", …), so every issue the
// engine's schema raises lands on the field that caused it; the form schema only converts
// units at the edge (units.ts) and turns text into numbers. The rules themselves live in
// searchProblemSchema and are not repeated here.
import { z } from "zod";
import { FAMILIES, type Family } from "~/optimizer/geometry";
import { CONTRACT_EXAMPLE_PROBLEM, searchProblemSchema, rawGridSize, type SearchProblem } from "~/optimizer/search-schema";
import { fromSI, toSI, unitLabel, type Quantity, type UnitSystem } from "~/optimizer/units";
import { plainMessage } from "~/lib/labels";
import { BASIS_FIELD_QUANTITIES, DEFAULT_GRADE, bandQuantity, gradeFill, basisFormDefaults, basisFormShape, basisIssuePath, basisIssues, basisToProblemInput } from "~/lib/brief-form-basis";

/** Which quantity each numeric field holds (for conversion and for the unit shown beside it). */
export const FIELD_QUANTITIES = {
  "moment.sagging": "moment",
  "moment.hogging": "moment",
  shear: "force",
  "allowable.tension": "stress",
  "allowable.compression": "stress",
  "allowable.shear": "stress",
  "depth.min": "length",
  "depth.max": "length",
  "depth.step": "length",
  "width.min": "length",
  "width.max": "length",
  "width.step": "length",
  density: "density",
  "deflection.span": "span",
  "deflection.serviceLoad": "lineLoad",
  "deflection.E": "stress",
  memberLength: "span",
  ...BASIS_FIELD_QUANTITIES,
} as const satisfies Record<string, Quantity>;
export type NumericField = keyof typeof FIELD_QUANTITIES;

/** The quantity of any numeric problem path, the fy bands' included (for showing changed limits with units). */
export function pathQuantity(path: string): Quantity | undefined {
  return (FIELD_QUANTITIES as Record<string, Quantity>)[path] ?? bandQuantity(path);
}

export const SLENDERNESS_KEYS = ["outstand", "internal", "web", "stem"] as const;

export function fieldUnit(field: NumericField | "thicknesses", units: UnitSystem): string {
  return unitLabel(field === "thicknesses" ? "length" : FIELD_QUANTITIES[field], units);
}

// Unreadable text becomes NaN (caught, not thrown), so the transform still runs and reports it
// beside every other field's error instead of stopping the whole form at the first bad number.
const num = (name: string) => z.number({ error: `${name} must be a number` }).optional().catch(Number.NaN);

/**
 * Thicknesses are typed as a list ("6, 8, 10"). Each entry must be a number; the engine's
 * schema then applies its own rules (positive, at most 100, at least one).
 */
export function parseThicknessList(text: string): { values: number[]; error?: string } {
  const parts = text
    .split(/[\s,;]+/)
    .map((s) => s.trim())
    .filter(Boolean);
  const values: number[] = [];
  for (const [i, p] of parts.entries()) {
    const x = Number(p);
    if (!Number.isFinite(x)) return { values, error: `thicknesses: entry ${i + 1} ("${p.slice(0, 20)}") is not a number` };
    values.push(x);
  }
  return { values };
}

const formFields = z.object({
  name: z
    .string({ error: "name is required" })
    .trim()
    .min(1, "name is required")
    .max(160, "name: at most 160 characters"),
  units: z.enum(["si", "us"], { error: 'units must be "si" or "us"' }).default("si"),
  material: z.string().max(80).optional(),
  stockListId: z.number().int().positive().optional(),
  memberLength: num("memberLength"),
  // whole, 1 … 100000: checked in the transform beside the other fields' errors
  memberCount: num("memberCount"),
  moment: z.object({ sagging: num("moment.sagging"), hogging: num("moment.hogging") }).default({}),
  shear: num("shear"),
  allowable: z.object({ tension: num("allowable.tension"), compression: num("allowable.compression"), shear: num("allowable.shear") }).default({}),
  depth: z.object({ min: num("depth.min"), max: num("depth.max"), step: num("depth.step") }).default({}),
  width: z.object({ min: num("width.min"), max: num("width.max"), step: num("width.step") }).default({}),
  thicknesses: z.string({ error: "thicknesses: list at least one plate thickness" }).max(2000, "thicknesses: list too long"),
  families: z.array(z.string(), { error: "families must name at least one family" }).default([]),
  slenderness: z.object({ outstand: num("slenderness.outstand"), internal: num("slenderness.internal"), web: num("slenderness.web"), stem: num("slenderness.stem") }).default({}),
  density: num("density"),
  /**
   * JSON { field: SI value } of the values the form was opened with. A US customary display
   * rounds to six figures, so 165 MPa shows as 23.9312 ksi; a field sent back unchanged takes
   * its exact SI value from here, so an untouched field never drifts (or shows as a changed limit).
   */
  siValues: z.string().max(20000, "siValues: too long").optional(),
  objective: z.enum(["mass", "cost"], { error: 'objective must be "mass" or "cost"' }).default("mass"),
  /** JSON [{ thickness (mm), pricePerKg }] filled from the chosen stock list (the cost objective needs it). */
  prices: z.string().max(20000, "prices: too long").optional(),
  deflection: z
    .object({ span: num("deflection.span"), serviceLoad: num("deflection.serviceLoad"), limitRatio: num("deflection.limitRatio"), E: num("deflection.E") })
    .default({}),
  // Design basis, steel, restraint, supports, fabrication (brief-form-basis.ts).
  ...basisFormShape,
});
export type BriefFormValues = z.output<typeof formFields>;
/** The form's shape before parsing (what Conform's field metadata is typed by). */
export type BriefFormShape = z.input<typeof formFields>;

export interface BriefMeta {
  name: string;
  units: UnitSystem;
  material?: string;
  stockListId?: number;
  /** SI (m), as the briefs table stores it */
  memberLengthM?: number;
  memberCount?: number;
  /** the material's elastic modulus, MPa, kept with the brief even when no deflection is checked */
  elasticModulus?: number;
}

/**
 * The exact SI value behind each shown number: a NumericField → number, "thicknesses" → the
 * list in mm. The form sends it as the hidden `siValues` (JSON). Why: a US customary display
 * rounds to six figures (300 mm shows as 11.811 in), so a value converted back from what is
 * shown drifts (299.999 mm), which can move a limit off its grid. A shown number that still
 * reads what its SI value displays as takes that SI value; only an edited field is converted
 * from what was typed. Unit switches (switchShownUnits) keep the memo, so any number of them
 * leaves the problem byte-identical.
 */
export type SiMemo = Record<string, number | number[]>;

export function readSiMemo(text: string | undefined): SiMemo {
  if (!text) return {};
  try {
    const v = JSON.parse(text) as unknown;
    if (!v || typeof v !== "object" || Array.isArray(v)) return {};
    const out: SiMemo = {};
    for (const [k, x] of Object.entries(v as Record<string, unknown>)) {
      if (typeof x === "number" && Number.isFinite(x)) out[k] = x;
      else if (Array.isArray(x) && x.every((t) => typeof t === "number" && Number.isFinite(t))) out[k] = x as number[];
    }
    return out;
  } catch {
    return {};
  }
}

/** What an SI value shows as in `units` (the display the memo is compared with). */
export function shownValue(q: Quantity, si: number, units: UnitSystem): number {
  return displayNumber(fromSI(q, si, units));
}

/** The SI value of a shown number: the remembered one while the display still matches it, else converted. */
export function siOfShown(q: Quantity, shown: number, remembered: number | undefined, units: UnitSystem): number {
  return remembered !== undefined && Number.isFinite(remembered) && shownValue(q, remembered, units) === shown ? remembered : toSI(q, shown, units);
}

/**
 * The SI thicknesses (mm) of a shown list: each entry takes an exact value it displays as (the
 * memo's, then the stock list's), else is converted. Thicknesses closer than the display's six
 * figures (59.998 and 59.9981 mm both show as 2.36213 in) must not merge, so each known value
 * is taken once: the one at the entry's own position first (the memo lists the thicknesses in
 * the order shown), then the first unused one that displays alike. Only when every alike value
 * is used (the same thickness typed twice) is one taken again.
 */
export function thicknessesOfShown(shown: number[], known: number[], units: UnitSystem): number[] {
  const used = new Array<boolean>(known.length).fill(false);
  const alike = (k: number, t: number) => shownValue("length", k, units) === t;
  return shown.map((t, i) => {
    let j = i < known.length && !used[i] && alike(known[i], t) ? i : known.findIndex((k, n) => !used[n] && alike(k, t));
    if (j < 0) j = known.findIndex((k) => alike(k, t));
    if (j < 0) return toSI("length", t, units);
    used[j] = true;
    return known[j];
  });
}

/** Parses a plain number the way the form does (blank or text → null). */
function shownNumber(text: string | undefined): number | null {
  if (text === undefined || text.trim() === "") return null;
  const x = Number(text.trim());
  return Number.isFinite(x) ? x : null;
}

/**
 * Re-expresses the shown numeric fields (NumericField → text, and "thicknesses") in `to` units.
 * Pure, so the editor and the property test run the same code. A blank or non-numeric field is
 * left as typed (its error still shows) and forgets its SI value.
 */
export function switchShownUnits(
  shown: Record<string, string>,
  memo: SiMemo,
  from: UnitSystem,
  to: UnitSystem,
  extraThicknesses: number[] = [],
): { shown: Record<string, string>; memo: SiMemo } {
  const out: Record<string, string> = { ...shown };
  const next: SiMemo = { ...memo };
  if (from === to) return { shown: out, memo: next };
  for (const [field, text] of Object.entries(shown)) {
    if (field === "thicknesses") continue;
    const q = pathQuantity(field);
    if (!q) continue;
    const x = shownNumber(text);
    if (x === null) {
      delete next[field];
      continue;
    }
    const m = memo[field];
    const si = siOfShown(q, x, typeof m === "number" ? m : undefined, from);
    next[field] = si;
    out[field] = String(shownValue(q, si, to));
  }
  if (shown.thicknesses !== undefined) {
    const t = parseThicknessList(shown.thicknesses);
    if (t.error) delete next.thicknesses;
    else {
      const m = memo.thicknesses;
      const si = thicknessesOfShown(t.values, [...(Array.isArray(m) ? m : []), ...extraThicknesses], from);
      next.thicknesses = si;
      out.thicknesses = si.map((v) => String(shownValue("length", v, to))).join(", ");
    }
  }
  return { shown: out, memo: next };
}

/** Form values (in the chosen units) → a SearchProblem input in SI, not yet validated. */
function fieldToSI(known: SiMemo, units: UnitSystem, field: NumericField, v: number | undefined): number | undefined {
  if (v === undefined) return undefined;
  const m = known[field];
  return siOfShown(FIELD_QUANTITIES[field], v, typeof m === "number" ? m : undefined, units);
}

export function formToProblemInput(f: BriefFormValues): Record<string, unknown> {
  const u = f.units;
  const known = readSiMemo(f.siValues);
  const si = (field: NumericField, v: number | undefined) => fieldToSI(known, u, field, v);
  // Exact mm values a shown thickness may stand for: the opened problem's and the stock list's (prices).
  let priced: unknown[] = [];
  try {
    const p = f.prices ? (JSON.parse(f.prices) as unknown) : [];
    if (Array.isArray(p)) priced = p.map((x) => (x && typeof x === "object" ? (x as { thickness?: unknown }).thickness : undefined));
  } catch {
    priced = [];
  }
  const knownThick = [...(Array.isArray(known.thicknesses) ? known.thicknesses : []), ...priced].filter((x): x is number => typeof x === "number" && Number.isFinite(x));
  const thick = thicknessesOfShown(parseThicknessList(f.thicknesses).values, knownThick, u);
  const slenderness = Object.fromEntries(SLENDERNESS_KEYS.filter((k) => f.slenderness[k] !== undefined).map((k) => [k, f.slenderness[k]]));
  const d = f.deflection;
  // E is the material's (a preset fills it); on its own it asks for no deflection check. Any of
  // the other three does, and a partly filled block then names its missing field.
  const anyDeflection = d.span !== undefined || d.serviceLoad !== undefined || d.limitRatio !== undefined;
  const out: Record<string, unknown> = {
    moment: { sagging: si("moment.sagging", f.moment.sagging) ?? 0, hogging: si("moment.hogging", f.moment.hogging) ?? 0 },
    // The EN 1993 basis uses no allowable stresses: a brief on it stores none.
    allowable:
      f.basis !== "allowable"
        ? undefined
        : {
            tension: si("allowable.tension", f.allowable.tension),
            compression: si("allowable.compression", f.allowable.compression),
            ...(f.allowable.shear !== undefined ? { shear: si("allowable.shear", f.allowable.shear) } : {}),
          },
    depth: { min: si("depth.min", f.depth.min), max: si("depth.max", f.depth.max), step: si("depth.step", f.depth.step) },
    width: { min: si("width.min", f.width.min), max: si("width.max", f.width.max), step: si("width.step", f.width.step) },
    thicknesses: thick,
    families: f.families,
  };
  if (f.shear !== undefined) out.shear = si("shear", f.shear);
  out.objective = f.objective;
  if (f.prices) {
    try {
      out.prices = JSON.parse(f.prices) as unknown;
    } catch {
      // left out: the engine's schema then names prices as missing
    }
  }
  if (Object.keys(slenderness).length) out.slenderness = slenderness;
  if (f.density !== undefined) out.density = si("density", f.density);
  // A partly filled deflection block goes to the engine as given, so its schema names the missing field.
  if (anyDeflection)
    out.deflection = {
      span: si("deflection.span", d.span),
      serviceLoad: si("deflection.serviceLoad", d.serviceLoad),
      limitRatio: d.limitRatio,
      E: si("deflection.E", d.E),
    };
  if (out.allowable === undefined) delete out.allowable;
  Object.assign(
    out,
    basisToProblemInput(f, (key, q, v) => {
      if (v === undefined) return undefined;
      const m = known[key];
      return siOfShown(q, v, typeof m === "number" ? m : undefined, u);
    }).fields,
  );
  return out;
}

/**
 * The form schema: text → numbers (Conform coerces), then units → SI, then the engine's
 * searchProblemSchema, whose issues are copied onto the same paths.
 */
/** Numbers the form could not read (text in a number field, NaN after coercion): their paths, and the values with them left out. */
function dropUnreadable<T>(values: T): { values: T; paths: (string | number)[][] } {
  const paths: (string | number)[][] = [];
  const walk = (o: unknown, at: (string | number)[]): unknown => {
    if (typeof o === "number" && Number.isNaN(o)) {
      paths.push(at);
      return undefined;
    }
    if (Array.isArray(o)) return o.map((x, i) => walk(x, [...at, i]));
    if (o && typeof o === "object") return Object.fromEntries(Object.entries(o).map(([k, x]) => [k, walk(x, [...at, k])]));
    return o;
  };
  return { values: walk(values, []) as T, paths };
}

/**
 * Issues of the engine that name a group rather than one of its fields go to the group's first
 * field, so every message sits beside an input (the editor has none for "moment" itself).
 */
const GROUP_FIELD: Record<string, (string | number)[]> = {
  moment: ["moment", "sagging"],
  allowable: ["allowable", "tension"],
  deflection: ["deflection", "span"],
  steel: ["steel", "grade"],
  restraint: ["restraint", "length"],
  supports: ["supports", "bearingLength"],
  grid: ["depth", "step"],
};

/**
 * The form schema: text → numbers (Conform coerces), then units → SI, then the engine's
 * searchProblemSchema, whose issues are copied onto the same paths. Every issue is gathered
 * before any is reported, so a text in one number field does not hide the others' errors, and
 * every message is worded through the one label table (labels.ts: no field paths on the page).
 */
export const briefFormSchema = formFields.transform((raw, ctx): { meta: BriefMeta; problem: SearchProblem } => {
  const issues: { path: (string | number)[]; message: string }[] = [];
  const taken = new Set<string>();
  const add = (path: (string | number)[], message: string) => {
    const key = path.join(".");
    if (taken.has(key)) return;
    taken.add(key);
    issues.push({ path, message });
  };
  const { values: f, paths: unreadable } = dropUnreadable(raw);
  for (const p of unreadable) add(p, `${p.map((x) => (typeof x === "number" ? "[]" : x)).join(".").replace(/\.\[\]/g, "[]")} must be a number`);
  const t = parseThicknessList(f.thicknesses);
  if (t.error) add(["thicknesses"], t.error);
  // The basis fields' own plain-word messages first; the engine's issue on the same field is then left out.
  for (const i of basisIssues(f)) add(i.path, i.message);
  const r = searchProblemSchema.safeParse(formToProblemInput(f));
  if (!r.success) {
    const { bandRows } = basisToProblemInput(f, (_k, _q, v) => v);
    for (const issue of r.error.issues) {
      // Array items (thicknesses[3], families[1]) belong to the list's one field; an fy band to the
      // row it was typed in; a group's issue to its first field.
      let path: (string | number)[] = basisIssuePath(issue.path as (string | number)[], bandRows) ?? (issue.path.filter((p) => typeof p === "string") as string[]);
      if (path.length === 1 && GROUP_FIELD[String(path[0])]) path = GROUP_FIELD[String(path[0])];
      // the message names bands by the engine's index; the editor shows rows (blank rows dropped)
      add(path, issue.message.replace(/steel\.fy\[(\d+)\]/g, (_, i: string) => `steel.fy[${bandRows[Number(i)] ?? Number(i)}]`));
    }
  }
  const meta: BriefMeta = { name: f.name, units: f.units };
  if (f.material) meta.material = f.material;
  if (f.stockListId) meta.stockListId = f.stockListId;
  const known = readSiMemo(f.siValues);
  if (f.memberLength !== undefined) {
    if (!(f.memberLength > 0)) add(["memberLength"], "memberLength must be > 0");
    else meta.memberLengthM = fieldToSI(known, f.units, "memberLength", f.memberLength);
  }
  if (f.memberCount !== undefined) {
    if (!Number.isInteger(f.memberCount)) add(["memberCount"], "memberCount must be a whole number");
    else if (f.memberCount < 1) add(["memberCount"], "memberCount must be ≥ 1");
    else if (f.memberCount > 100000) add(["memberCount"], "memberCount: at most 100000");
    else meta.memberCount = f.memberCount;
  }
  const E = r.success ? (r.data.deflection?.E ?? fieldToSI(known, f.units, "deflection.E", f.deflection.E)) : undefined;
  if (E !== undefined) {
    if (!(E > 0) || !Number.isFinite(E)) add(["deflection", "E"], "deflection.E must be > 0");
    else meta.elasticModulus = E;
  }
  if (issues.length || !r.success) {
    // named as the basis's panel names them (labels.ts: "restraint.length" is "Unbraced length Lb" under AISC 360)
    for (const i of issues) ctx.addIssue({ code: "custom", path: i.path, message: plainMessage(i.message, f.basis) });
    return z.NEVER;
  }
  return { meta, problem: r.data };
});

export type BriefParsed = z.output<typeof briefFormSchema>;

/** Rounds a converted value for display so 165 MPa shows as 23.9312 ksi, not 23.931245…; six significant figures, the precision of the inputs people type. */
export function displayNumber(x: number): number {
  if (!Number.isFinite(x) || x === 0) return x;
  return Number(x.toPrecision(6));
}

/** A stored SI problem → the form's default values in `units` (for editing and rechecks). */
export function problemToFormDefaults(problem: SearchProblem, meta: Partial<BriefMeta> & { units: UnitSystem }): Record<string, unknown> {
  const u = meta.units;
  const v = (field: NumericField, x: number | undefined) => (x === undefined ? undefined : displayNumber(fromSI(FIELD_QUANTITIES[field], x, u)));
  const s = problem.slenderness ?? {};
  const d = problem.deflection;
  const basis = basisFormDefaults(problem, (q, x) => (x === undefined ? undefined : displayNumber(fromSI(q, x, u))));
  const siValues: Record<string, unknown> = {
    ...basis.si,
    "moment.sagging": problem.moment.sagging,
    "moment.hogging": problem.moment.hogging,
    shear: problem.shear,
    "allowable.tension": problem.allowable?.tension,
    "allowable.compression": problem.allowable?.compression,
    "allowable.shear": problem.allowable?.shear,
    "depth.min": problem.depth.min,
    "depth.max": problem.depth.max,
    "depth.step": problem.depth.step,
    "width.min": problem.width.min,
    "width.max": problem.width.max,
    "width.step": problem.width.step,
    density: problem.density,
    "deflection.span": d?.span,
    "deflection.serviceLoad": d?.serviceLoad,
    "deflection.E": d?.E ?? meta.elasticModulus,
    memberLength: meta.memberLengthM,
    thicknesses: problem.thicknesses,
  };
  return {
    siValues: JSON.stringify(siValues),
    objective: problem.objective,
    prices: problem.prices ? JSON.stringify(problem.prices) : "",
    name: meta.name ?? "",
    units: u,
    material: meta.material ?? "",
    stockListId: meta.stockListId,
    memberLength: meta.memberLengthM === undefined ? undefined : v("memberLength", meta.memberLengthM),
    memberCount: meta.memberCount,
    moment: { sagging: v("moment.sagging", problem.moment.sagging), hogging: v("moment.hogging", problem.moment.hogging) },
    shear: v("shear", problem.shear),
    allowable: {
      tension: v("allowable.tension", problem.allowable?.tension),
      compression: v("allowable.compression", problem.allowable?.compression),
      shear: v("allowable.shear", problem.allowable?.shear),
    },
    depth: { min: v("depth.min", problem.depth.min), max: v("depth.max", problem.depth.max), step: v("depth.step", problem.depth.step) },
    width: { min: v("width.min", problem.width.min), max: v("width.max", problem.width.max), step: v("width.step", problem.width.step) },
    thicknesses: problem.thicknesses.map((t) => displayNumber(fromSI("length", t, u))).join(", "),
    families: [...problem.families],
    slenderness: { outstand: s.outstand, internal: s.internal, web: s.web, stem: s.stem },
    density: v("density", problem.density),
    deflection: d
      ? { span: v("deflection.span", d.span), serviceLoad: v("deflection.serviceLoad", d.serviceLoad), limitRatio: d.limitRatio, E: v("deflection.E", d.E) }
      : meta.elasticModulus !== undefined
        ? { E: v("deflection.E", meta.elasticModulus) }
        : {},
    ...basis.values,
  };
}

/**
 * Sensible defaults for a new brief: the engine contract's example problem, asking for the
 * lightest channel. The slenderness limits are the contract's example values (common practice
 * order of magnitude, not a code's classification limits).
 */
export const DEFAULT_PROBLEM: SearchProblem = searchProblemSchema.parse({ ...CONTRACT_EXAMPLE_PROBLEM, families: ["channel"] });

/**
 * A new brief (member-checks.md §3): the EN 1993 basis with the S355 preset, on the contract's
 * example loads and grid. Its allowables stay in the form (hidden) so a switch to the
 * allowable basis starts filled in; its slenderness limits are left out, since the EN 1993
 * classification already bounds every plate. Fabrication rules: the member-checks.md example
 * (common practice: flanges no thinner than the web, 100 mm to weld inside a box).
 */
export const NEW_BRIEF_PROBLEM: SearchProblem = searchProblemSchema.parse({
  ...CONTRACT_EXAMPLE_PROBLEM,
  families: ["channel"],
  slenderness: undefined,
  basis: "en1993",
  steel: { grade: DEFAULT_GRADE, ...gradeFill(DEFAULT_GRADE) },
  fabrication: { minThickness: 6, flangeAtLeastWeb: true, minBoxClear: 100 },
});

/** The new-brief form: the restraint length is left for the engineer to state (or to tick "restrained throughout"). */
export function newBriefFormDefaults(units: UnitSystem): Record<string, unknown> {
  return { ...problemToFormDefaults(NEW_BRIEF_PROBLEM, { units, name: "" }), restraintThroughout: false };
}

/** Family names come from the one label table (labels.ts). */
export { FAMILY_LABELS } from "~/lib/labels";
export const SEARCH_FAMILIES: readonly Family[] = FAMILIES;

/** The grid size the preview shows (the engine's own count, before invalid geometry is dropped). */
export function previewGridSize(problem: SearchProblem): number {
  return rawGridSize(problem);
}

/** Problem paths whose values differ between two problems (for the recheck comparison). */
export function changedLimits(a: SearchProblem, b: SearchProblem): { path: string; before: unknown; after: unknown }[] {
  const flat = (p: SearchProblem) => {
    const out: Record<string, unknown> = {};
    const walk = (o: unknown, prefix: string) => {
      if (o && typeof o === "object" && !Array.isArray(o)) for (const [k, x] of Object.entries(o)) walk(x, prefix ? `${prefix}.${k}` : k);
      // Lists of objects (the fy bands) by item: steel.fy[1].fy.
      else if (Array.isArray(o) && o.some((x) => x && typeof x === "object")) o.forEach((x, i) => walk(x, `${prefix}[${i}]`));
      else out[prefix] = Array.isArray(o) ? o.join(", ") : o;
    };
    // A problem stored before the basis existed is an allowable-stress problem.
    walk({ ...p, basis: p.basis ?? "allowable" }, "");
    return out;
  };
  const fa = flat(a),
    fb = flat(b);
  const keys = [...new Set([...Object.keys(fa), ...Object.keys(fb)])].sort();
  return keys.filter((k) => fa[k] !== fb[k]).map((k) => ({ path: k, before: fa[k], after: fb[k] }));
}

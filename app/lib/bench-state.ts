// The section bench's state: what the user typed, in the units they chose. It lives in the
// URL (`?s=<compact JSON>`) so a bench can be shared by link, and it is turned into the
// engine's SectionInput here, in one place, for the browser worker, the save action and any
// "open in the bench" link. Pure: safe in components, the worker and server code.
//
// Typed text is kept as text (not numbers) so a half-typed "12." or a blank field survives a
// reload and the engine's message about it is the one shown.
import { plainMessage } from "~/lib/labels";
import { z } from "zod";
import { FAMILIES, FAMILY_DIMENSIONS, FILLETED_FAMILIES, type Family } from "~/optimizer/geometry";
import { sectionInputSchema, type ParsedSectionInput, type SectionInput } from "~/optimizer/schema";
import { fromSI, sectionInputToSI, toSI, type UnitSystem } from "~/optimizer/units";
import { findInputViolation, pathText } from "~/optimizer/validate";

export type BenchMode = "family" | "plates" | "polygons";

export interface PlateRow {
  /** stable key for React (rows keep focus when reordered); never stored in the URL */
  id: string;
  b: string;
  h: string;
  z: string;
  y: string;
}

export interface PolygonRow {
  id: string;
  /** z,y pairs: "0,0 200,0 200,10 0,10" or one pair a line */
  text: string;
  hole: boolean;
}

export interface BenchState {
  mode: BenchMode;
  units: UnitSystem;
  family: Family;
  /** family dimensions by the contract's names, plus r for rolled shapes */
  dims: Record<string, string>;
  flip: boolean;
  plates: PlateRow[];
  polygons: PolygonRow[];
  /** Mz, kN·m or kip·ft, sagging positive */
  moment: string;
  /** V, kN or kip; blank for none */
  shear: string;
}

export interface FieldError {
  /** the SectionInput path, e.g. ["plates", 1] */
  path: (string | number)[];
  /** the same as text, e.g. "plates[1]" */
  field: string;
  message: string;
}

let nextId = 0;
export const rowId = (): string => `r${++nextId}`;

/** Demo values only: a welded I of plausible proportions. */
export function defaultBenchState(): BenchState {
  return {
    mode: "family",
    units: "si",
    family: "i",
    dims: { d: "400", b: "200", tf: "16", tw: "10", bt: "200", tft: "16", bb: "250", tfb: "20", t: "10", r: "" },
    flip: false,
    plates: [
      { id: rowId(), b: "200", h: "16", z: "0", y: "0" },
      { id: rowId(), b: "10", h: "368", z: "95", y: "16" },
      { id: rowId(), b: "200", h: "16", z: "0", y: "384" },
    ],
    polygons: [
      { id: rowId(), text: "0,0 200,0 200,300 0,300", hole: false },
      { id: rowId(), text: "20,20 180,20 180,280 20,280", hole: true },
    ],
    moment: "150",
    shear: "200",
  };
}

// ---------------------------------------------------------------- URL form

const text = z.string().max(40);
// The wire form is compact (plates as [b, h, z, y] arrays) and bounded, so a hostile link
// cannot make the page parse megabytes.
const wireSchema = z.object({
  m: z.enum(["family", "plates", "polygons"]),
  u: z.enum(["si", "us"]),
  f: z.enum(FAMILIES),
  d: z.record(z.string().max(8), text).optional(),
  x: z.boolean().optional(),
  p: z.array(z.tuple([text, text, text, text])).max(200).optional(),
  g: z.array(z.tuple([z.string().max(20_000), z.boolean()])).max(50).optional(),
  M: text.optional(),
  V: text.optional(),
});
type Wire = z.infer<typeof wireSchema>;

/** Only what the current mode uses goes into the link, so links stay short. */
export function encodeBenchState(s: BenchState): string {
  const w: Wire = { m: s.mode, u: s.units, f: s.family, M: s.moment, V: s.shear };
  if (s.mode === "family") {
    const keys = [...FAMILY_DIMENSIONS[s.family], ...(FILLETED_FAMILIES.includes(s.family) ? ["r"] : [])];
    w.d = Object.fromEntries(keys.map((k) => [k, s.dims[k] ?? ""]));
    if (s.flip) w.x = true;
  } else if (s.mode === "plates") w.p = s.plates.map((p) => [p.b, p.h, p.z, p.y]);
  else w.g = s.polygons.map((g) => [g.text, g.hole]);
  return JSON.stringify(w);
}

/** The state a link carries; anything unreadable falls back to the defaults (a bad link never breaks the page). */
export function decodeBenchState(param: string | null | undefined): BenchState {
  return (param ? parseBenchState(param) : null) ?? defaultBenchState();
}

/** The state in an encoded string, or null when it is not one (the save action rejects it). */
export function parseBenchState(param: unknown): BenchState | null {
  if (typeof param !== "string" || param.length > 1_100_000) return null;
  let raw: unknown;
  try {
    raw = JSON.parse(param);
  } catch {
    return null;
  }
  const r = wireSchema.safeParse(raw);
  if (!r.success) return null;
  const base = defaultBenchState();
  const w = r.data;
  return {
    ...base,
    mode: w.m,
    units: w.u,
    family: w.f,
    dims: { ...base.dims, ...(w.d ?? {}) },
    flip: w.x === true,
    plates: w.p ? w.p.map(([b, h, z, y]) => ({ id: rowId(), b, h, z, y })) : base.plates,
    polygons: w.g ? w.g.map(([t, hole]) => ({ id: rowId(), text: t, hole })) : base.polygons,
    moment: w.M ?? base.moment,
    shear: w.V ?? base.shear,
  };
}

/** "/bench?s=…" for a saved or searched section (e.g. a project page's "open in the bench"). */
export function benchHref(section: SectionInput, units: UnitSystem = "si"): string {
  return `/bench?s=${encodeURIComponent(encodeBenchState(benchStateFromSection(section, units)))}`;
}

/** A bench state showing an SI SectionInput in the given units. */
export function benchStateFromSection(section: SectionInput, units: UnitSystem = "si"): BenchState {
  const s = { ...defaultBenchState(), units };
  const L = (x: number) => numText(fromSI("length", x, units));
  if ("plates" in section) {
    s.mode = "plates";
    s.plates = section.plates.map((p) => ({ id: rowId(), b: L(p.b), h: L(p.h), z: L(p.z), y: L(p.y) }));
  } else if ("polygons" in section) {
    s.mode = "polygons";
    s.polygons = section.polygons.map((g) => ({ id: rowId(), text: g.points.map(([z, y]) => `${L(z)},${L(y)}`).join(" "), hole: g.hole === true }));
  } else {
    const f = section as unknown as Record<string, unknown>;
    s.mode = "family";
    s.family = f.family as Family;
    s.flip = f.flip === true;
    for (const [k, v] of Object.entries(f)) if (typeof v === "number" && k !== "density") s.dims[k] = L(v);
  }
  return s;
}

/** Up to six significant figures without float noise (15.748031496… in → "15.748"). */
export function numText(x: number): string {
  if (!Number.isFinite(x)) return "";
  return String(Number(x.toPrecision(6)));
}

// ---------------------------------------------------------------- unit switch

const convertText = (t: string, q: "length" | "moment" | "force", from: UnitSystem, to: UnitSystem): string => {
  if (t.trim() === "") return t;
  const x = Number(t);
  return Number.isFinite(x) ? numText(fromSI(q, toSI(q, x, from), to)) : t;
};

/** The same section and loads, retyped in the other unit system (unreadable text is left as typed). */
export function convertBenchState(s: BenchState, to: UnitSystem): BenchState {
  if (s.units === to) return s;
  const L = (t: string) => convertText(t, "length", s.units, to);
  return {
    ...s,
    units: to,
    dims: Object.fromEntries(Object.entries(s.dims).map(([k, v]) => [k, L(v)])),
    plates: s.plates.map((p) => ({ ...p, b: L(p.b), h: L(p.h), z: L(p.z), y: L(p.y) })),
    polygons: s.polygons.map((g) => {
      const parsed = parsePoints(g.text);
      if ("error" in parsed) return g;
      return { ...g, text: parsed.points.map(([z, y]) => `${L(String(z))},${L(String(y))}`).join(" ") };
    }),
    moment: convertText(s.moment, "moment", s.units, to),
    shear: convertText(s.shear, "force", s.units, to),
  };
}

// ---------------------------------------------------------------- state → engine input

/** Text → number; blank and junk become NaN so the engine's schema names the field. */
const num = (t: string | undefined): number => (t === undefined || t.trim() === "" ? Number.NaN : Number(t));

/** "0,0 200,0; 200,10\n0,10" → [[0,0],[200,0],[200,10],[0,10]]. */
export function parsePoints(t: string): { points: [number, number][] } | { error: string } {
  const tokens = t.split(/[\s,;]+/).filter(Boolean);
  const values: number[] = [];
  for (const tok of tokens) {
    const x = Number(tok);
    if (!Number.isFinite(x)) return { error: `"${tok.slice(0, 20)}" is not a number` };
    values.push(x);
  }
  if (values.length % 2 === 1) return { error: "needs z,y pairs: an odd count of numbers was given" };
  const points: [number, number][] = [];
  for (let i = 0; i < values.length; i += 2) points.push([values[i]!, values[i + 1]!]);
  return { points };
}

/** The SectionInput the state describes, still in the state's units (not validated). */
export function benchSectionInput(s: BenchState): { input: SectionInput } | { errors: FieldError[] } {
  if (s.mode === "plates") return { input: { plates: s.plates.map((p) => ({ b: num(p.b), h: num(p.h), z: num(p.z), y: num(p.y) })) } };
  if (s.mode === "polygons") {
    const errors: FieldError[] = [];
    const polygons = s.polygons.map((g, i) => {
      const parsed = parsePoints(g.text);
      if ("error" in parsed) {
        errors.push({ path: ["polygons", i, "points"], field: `polygons[${i}].points`, message: `polygons[${i}]: ${parsed.error}` });
        return { points: [], hole: g.hole };
      }
      return { points: parsed.points, hole: g.hole };
    });
    return errors.length ? { errors } : { input: { polygons } };
  }
  const dims: Record<string, number> = {};
  for (const k of FAMILY_DIMENSIONS[s.family]) dims[k] = num(s.dims[k]);
  // r is optional: blank means none (0), as the contract's default
  if (FILLETED_FAMILIES.includes(s.family) && (s.dims.r ?? "").trim() !== "") dims.r = num(s.dims.r);
  return { input: { family: s.family, ...dims, flip: s.flip } as unknown as SectionInput };
}

/**
 * Raw input in `units` → validated SI SectionInput, or the engine schema's issues with their
 * field paths. A union failure (zod reports it at the root) gets the path the engine's own
 * checker finds, so a form can still mark the field. Shared by the bench worker and the API.
 */
export function parseSectionInput(raw: unknown, units: UnitSystem): { ok: true; input: ParsedSectionInput } | { ok: false; errors: FieldError[] } {
  const si = typeof raw === "object" && raw !== null && !Array.isArray(raw) ? sectionInputToSI(raw as SectionInput, units) : raw;
  const r = sectionInputSchema.safeParse(si);
  if (r.success) return { ok: true, input: r.data };
  const errors = r.error.issues.map((issue) => {
    let path = issue.path.filter((k): k is string | number => typeof k !== "symbol");
    if (path.length === 0) path = findInputViolation(si)?.path ?? [];
    return { path, field: pathText(path) || "input", message: issue.message };
  });
  return { ok: false, errors };
}

/** The message, prefixed with its field when the engine's wording does not name it already. */
/** The error as the API states it: the field's path (an API client addresses fields by path). */
export function describeFieldError(e: FieldError): string {
  return e.message.includes(e.field) || e.field === "input" ? e.message : `${e.field}: ${e.message}`;
}

/** The error as a person reads it on the bench: worded through the one label table, rows counted from 1 as shown. */
export function plainFieldError(e: FieldError): string {
  return plainMessage(describeFieldError(e));
}

/** Loads as typed → SI numbers; blank moment means 0, blank shear means none. */
export function benchLoads(s: BenchState): { Mz: number; V: number } | { errors: FieldError[] } {
  const errors: FieldError[] = [];
  const M = s.moment.trim() === "" ? 0 : Number(s.moment);
  const V = s.shear.trim() === "" ? 0 : Number(s.shear);
  if (!Number.isFinite(M)) errors.push({ path: ["moment"], field: "moment", message: "moment M must be a number" });
  if (!Number.isFinite(V)) errors.push({ path: ["shear"], field: "shear", message: "shear V must be a number" });
  if (errors.length) return { errors };
  return { Mz: toSI("moment", M, s.units), V: toSI("force", V, s.units) };
}

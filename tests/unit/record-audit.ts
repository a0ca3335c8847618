// The calculation record's number audit (issue 12, "a unit test that each number in the record
// equals the engine's value"). Given the record page's server-rendered HTML and the engine's own
// results for the same option (computed by the caller straight from the engine, not through
// lib/record.ts), it reports every number of the calculation part of the sheet that is not an
// engine value put through the one unit conversion (units.ts fromSI) and the one formatter
// (lib/format.ts formatNumber; utilisations and the engine's own worded lines use toFixed).
//
// Two levels:
//  1. every number token of sections 1–7 (header line, inputs, section, composite table, fibre
//     stresses, checks, properties) must be some engine value in the unit written after it; a
//     token with no engine counterpart is listed with its line. Formula constants (π², √3, 0.5·,
//     × 10⁶ N·mm/kN·m …) and citations (clauses, headings, grade and catalogue names) are taken
//     out first, each by the literal text listed in FORMULA_TEXT, so nothing else can hide there.
//  2. the labelled values (property rows, check rows, the plate and composite tables, ȳ, Iz, the
//     fibre stresses, and each worked result "symbol = … = value") must equal the engine value of
//     that label, not just any engine value.
// The title block, review, attachments and revision history are the document's facts (ids,
// names, dates), not engine numbers, and are outside the audit (a choice, stated here).
import { formatNumber, formatQuantity } from "~/lib/format";
import { PROPERTY_QUANTITIES, STABILITY_QUANTITIES, UNITS, fromSI, unitLabel, type Quantity, type UnitSystem } from "~/optimizer/units";
import type { CandidateVerdict } from "~/optimizer/checks";
import type { CompositeTable, PlateRect } from "~/optimizer/composite";
import type { SectionProperties } from "~/optimizer/properties";
import type { SearchProblem } from "~/optimizer/search-schema";

/** What the engine says about one option, gathered by the test from the engine's entry points. */
export interface EngineFacts {
  units: UnitSystem;
  problem: SearchProblem;
  dims: Record<string, number>;
  properties: SectionProperties;
  plates: PlateRect[];
  table: CompositeTable;
  /** per non-zero moment: the moment (kN·m, magnitude) and the engine's fibre stresses (MPa) */
  fibres: { case: "sagging" | "hogging"; M: number; top: number; bottom: number }[];
  verdict: CandidateVerdict;
  /** member length (m) × count, when the brief gives them */
  quantity: { lengthM: number; count: number } | null;
  /** words that carry digits but are names, not numbers (catalogue designation, grade) */
  names: string[];
}

// ---------------------------------------------------------------- text

const ENTITIES: Record<string, string> = { "&amp;": "&", "&lt;": "<", "&gt;": ">", "&quot;": '"', "&#x27;": "'", "&#39;": "'", "&nbsp;": " " };

/** HTML → lines: block ends and <br> end a line, table cells are joined by " | ". */
export function htmlLines(html: string): string[] {
  return html
    .replace(/<style[\s\S]*?<\/style>/g, "")
    .replace(/<\/(p|tr|li|h1|h2|h3|h4|caption|text|title|desc|dd|div|section|aside|header|ul|table|thead|tbody)>|<br\s*\/?>/g, "\n")
    .replace(/<\/(td|th|dt)>/g, " | ")
    .replace(/<[^>]+>/g, "")
    .replace(/&[#\w]+;/g, (e) => ENTITIES[e] ?? e)
    .split("\n")
    .map((s) => s.replace(/\s+/g, " ").trim())
    .filter(Boolean);
}

/** The calculation part of the sheet: the header's section line, then sections 1 to 7 (up to the review). */
export function calculationHtml(html: string): string {
  const header = /<header[\s\S]*?<\/header>/.exec(html)?.[0] ?? "";
  const start = html.indexOf('aria-labelledby="inputs-h"');
  const end = html.indexOf('aria-labelledby="decision-h"');
  if (start < 0 || end < start) throw new Error("record HTML: sections 1 (inputs) to the review not found");
  return header.replace(/<h1[\s\S]*?<\/h1>/, "") + "<section " + html.slice(start, end);
}

/**
 * Formula text: constants of the formulas and clause citations, written into the record as words.
 * Each is removed before numbers are read, as literal text, so a number cannot hide in a pattern.
 */
export const FORMULA_TEXT: readonly string[] = [
  // textbook citations of the allowable basis's stress checks (checks.ts CHECK_CLAUSES)
  "(Gere & Goodno, Mechanics of Materials, 7th ed., ch. 5; Boresi & Schmidt, Advanced Mechanics of Materials, 6th ed., ch. 7)",
  "(Gere & Goodno, Mechanics of Materials, 7th ed., ch. 5)",
  // unit factors written out in a substituted formula
  "× 10⁶ N·mm/kN·m",
  "× 12 in/ft",
  "× 10⁶ N·mm",
  "× 10³ N",
  // the flexure formula and the composite table's headings
  "b·h³/12",
  // EN 1993-1-1 Table 5.2 and §6.3.2.2, §6.2.6, §6.2.8; EN 1993-1-5 §5, §6; EN 1993-1-8 §4.5.3.3
  "√(235/fy) = √(235/",
  "√(235/fy)",
  "outstands 9ε, 10ε, 14ε; internal parts 33ε, 38ε, 42ε; webs 396ε/(13α − 1) or 36ε/α (class 1), 456ε/(13α − 1) or 41.5ε/α (class 2), 42ε/(0.67 + 0.33ψ) or 62ε·(1 − ψ)·√(−ψ) (class 3)",
  "limits class 1 / 2 / 3",
  "Wpl = Zz (class 1 or 2)",
  "Wel,min = min(Sz,top, Sz,bottom) (class 3)",
  "Mcr = C1·(π²·E·Iz/L²)·[√(Iw/Iz + L²·G·It/(π²·E·Iz) + (C2·zg − C3·zj)²) − (C2·zg − C3·zj)]",
  "× π² ×",
  "× (π² ×",
  "/(π² ×",
  "0.5·[1 + αLT·(λLT − 0.2) + λLT²] = 0.5 × [1 +",
  "− 0.2) +",
  "min(1, 1/(ΦLT + √(ΦLT² − λLT²))) = 1/(",
  "Av·fy/(√3·γM0)",
  "÷ (√3 ×",
  "72ε/η",
  "hw/(86.4·tw·ε)",
  "/(86.4 ×",
  "η (λw < 0.83/η)",
  "0.83/λw",
  "χw·fy·hw·tw/(√3·γM1)",
  "2 × χw",
  "0.5·VRd",
  "0.5 ×",
  "(2·VEd/VRd − 1)² = (2 ×",
  "− 1)²",
  "(1 − ρ)·Mc,Rd",
  "(W − ρ·Σhw²·tw/4)·fy/γM0 (§6.2.8(5), both webs)",
  "(W − ρ·Σhw²·tw/4)·fy/γM0 (§6.2.8(5))",
  "fu/(√3·βw·γM2)",
  "/(√3 ×",
  "rounded up to a whole mm, at least 3 mm",
  "at most 0.7 × the thinner joined plate",
  "a ≤ 0.7·t",
  "5wL⁴/(384EI)",
  "5·w·L⁴/(384·E·I)",
  "δ = 5·w·L⁴/(384·E·I) = 5 ×",
  "÷ (384 ×",
  "I = (Iz·Iy − Iyz²)/√(Iy² + Iyz²)",
  "√(vertical² + sideways²)",
  "τ = V·Q/(Iz·b)",
  "V·Q/(Iz·b)",
  "Σ b·t³/3",
  "zj = βc/2",
  "> 2)",
  "≤ 2)",
  "h/b ≤ 2",
  // the brief's slenderness limits: each element's width and thickness in the family's symbols
  // (family-kernel.ts slenderWords; the rest of them carry no digit)
  "(b − tw)/2",
  "(bt − tw)/2",
  "(bb − tw)/2",
  "d − 2·tf",
  "b − 2·tf",
  "b − 2·tw",
  "b/t ÷ limit",
  // AISC 360-16 (the engine's record lines)
  "Fnw = 0.60·FEXX",
  "on the throat 0.707·w",
  "Vn = 0.6·Fy·Aw·Cv",
  "Table J2.4 minimum",
  "kv = 5.34 for I webs and channels (G2.1), 5 for box webs (G4), 1.2 for tee stems (G3)",
  // AISC 360-16 worked through (Aisc360Worked): Chapter F, G2.1, J2.4
  "Lp = 1.76·ry·√(E/Fy) = 1.76 ×",
  "Lr = 1.95·rts·(E/(0.7·Fy))·√(J·c/(Sx·h0) + √((J·c/(Sx·h0))² + 6.76·(0.7·Fy/E)²))",
  "Lr = 1.95 ×",
  "/(0.7 ×",
  "6.76 × (0.7 ×",
  "Mr = 0.7·Fy·Sx",
  "Mn = Mp − (Mp − 0.7·Fy·Sx)·(λ − λpf)/(λrf − λpf)",
  "Mn = Cb·[Mp − (Mp − 0.7·Fy·Sx)·(Lb − Lp)/(Lr − Lp)] ≤ Mp",
  "Fcr = Cb·π²·E/(Lb/rts)²·√(1 + 0.078·(J·c/(Sx·h0))·(Lb/rts)²)",
  "× √(1 + 0.078 ×",
  "Mn = 0.9·E·kc·Sx/λ² = 0.9 ×",
  "Cv1 = 1.10·√(kv·E/Fy)/(h/tw)",
  "1.10·√(kv·E/Fy)",
  "2.24·√(E/Fy)",
  "Vn = 0.6·Fy·Aw·Cv = 0.6 ×",
  "Fnw = 0.60·FEXX = 0.60 ×",
  "Awe = 0.707·w",
  "φ·Fnw·0.707",
  "Fnw·0.707/Ω",
  "× 0.707",
  "w = q/(2 × that) = ",
  "/(2 ×",
];

// longest first, so a phrase is taken out whole before a shorter one inside it
const FORMULA_LONGEST_FIRST = [...FORMULA_TEXT].sort((x, y) => y.length - x.length);

// Citations and names: a section sign and what follows, EN/ENV/AISC/ASTM standard numbers, tables,
// equations, annexes, Clause brackets, headings' numbers, the table's plate index column.
const CITATIONS: readonly RegExp[] = [
  /\[[^\]]*\]/g, // <Clause> brackets
  /\b(?:EN|ENV|AISC|ASTM|ISO)\s\d[\d\-–]*(?:\s\d+[\d\-]*)?/g,
  /§\s?[A-Z]?\d[\d.]*(?:\([\w]+\))*(?:[,–-]\s?§?[A-Z]?\d[\d.]*(?:\(\w+\))*)*/g,
  /\b(?:Tables?|Eqs?\.|Annex|Chapter|section)\s[A-Z]?\d[\w.\-–]*(?:\s(?:and|or)\s[A-Z]?\d[\w.\-–]*)?/g,
  /\(\d+\.\d+\)/g, // equation numbers such as (6.18)
  /:\d{4}\b/g, // a standard's year (ENV 1993-1-1:1992)
  /\bcase \d+\b/g, // Table B4.1b case 11
  /\bclass(?:es)? \d\b/g, // classes are checked by label (level 2)
  /\bGr \d+/g,
];

function stripFormulaText(line: string, names: string[]): string {
  // the flexure formula's sign before the substituted moment ("= −20 kN·m × 10⁶ …") is the formula's, not the value's
  let s = line.replace(/(= )([−+])(?=\d[\d,.]* (?:kN·m|kip·ft) × )/g, "$1$2 ");
  for (const n of names) s = s.split(n).join(" ");
  for (const t of FORMULA_LONGEST_FIRST) s = s.split(t).join(" ");
  for (const r of CITATIONS) s = s.replace(r, " ");
  // a heading's number ("6.2 Bending resistance", "3. Centroid") and a table's row number ("1 | 200 | …")
  s = s.replace(/^\d+(?:\.\d+)*\.?\s(?=[A-Z|])/, "").replace(/^\d+ \| /, "| ");
  return s;
}

const SUP = "⁻⁰¹²³⁴⁵⁶⁷⁸⁹";
// formatNumber's three shapes (d.ddd × 10ⁿ, grouped, plain) with a true or ASCII minus; a token
// glued to a letter or subscript on either side is a symbol (C1, γM0, 9ε), not a number.
const NUMBER = new RegExp(
  String.raw`(?<![\p{L}\p{N}_.,\u2080-\u2089${SUP}])([−-]?)(\d\.\d+ × 10[${SUP}]+|\d{1,3}(?:,\d{3})+(?:\.\d+)?|\d+(?:\.\d+)?)(?![\p{L}\d\u2080-\u2089])`,
  "gu",
);

export interface Token {
  text: string;
  /** the unit written after it, if any */
  unit: string | null;
  line: string;
}

const UNIT_WORDS = Object.entries(UNITS).flatMap(([q, u]) => [
  { label: u.si, q: q as Quantity, sys: "si" as const },
  { label: u.us, q: q as Quantity, sys: "us" as const },
]);
// longest first, so "mm⁴" is not read as "mm"
const UNIT_ORDER = [...new Set(UNIT_WORDS.map((u) => u.label))].sort((a, b) => b.length - a.length);

function unitAfter(rest: string): string | null {
  const r = rest.replace(/^\s/, "");
  for (const u of UNIT_ORDER) if (r.startsWith(u) && !/^[\p{L}\d·/]/u.test(r.slice(u.length))) return u;
  return null;
}

export function numberTokens(line: string, names: string[] = []): Token[] {
  const s = stripFormulaText(line, names);
  const out: Token[] = [];
  for (const m of s.matchAll(NUMBER)) {
    const text = (m[1] ?? "") + m[2]!;
    const rest = s.slice(m.index! + m[0].length);
    // a power of ten written on its own ("× 10⁶") is a factor, not a value
    if (m[2] === "10" && new RegExp(`^[${SUP}]`).test(rest)) continue;
    out.push({ text, unit: unitAfter(rest), line });
  }
  return out;
}

// ---------------------------------------------------------------- engine values

/** Every finite number in an engine result, with where it came from. */
function leaves(x: unknown, path: string, out: { path: string; v: number }[]): void {
  if (typeof x === "number") {
    if (Number.isFinite(x)) out.push({ path, v: x });
  } else if (Array.isArray(x)) x.forEach((y, i) => leaves(y, `${path}[${i}]`, out));
  else if (x && typeof x === "object") for (const [k, y] of Object.entries(x)) leaves(y, path ? `${path}.${k}` : k, out);
}

/** The ways the record writes a number: the one formatter at 3–5 figures; toFixed for utilisations and the engine's worded lines; as typed. */
function spellings(x: number): string[] {
  const out = new Set<string>([formatNumber(x, 3), formatNumber(x, 4), formatNumber(x, 5), String(x)]);
  for (let k = 0; k <= 3; k++) out.add(x.toFixed(k));
  return [...out];
}

export function engineValues(e: EngineFacts): { path: string; v: number }[] {
  const out: { path: string; v: number }[] = [];
  leaves(e.problem, "problem", out);
  leaves(e.dims, "dims", out);
  leaves(e.properties, "properties", out);
  leaves(e.plates, "plates", out);
  leaves(e.table, "table", out);
  leaves(e.fibres, "fibres", out);
  leaves(e.verdict, "verdict", out);
  if (e.quantity) {
    leaves(e.quantity, "quantity", out);
    // the one figure the record works out itself: the member quantity's total mass, in its own units
    const total = e.quantity.count * fromSI("span", e.quantity.lengthM, e.units) * fromSI("massPerLength", e.properties.massPerMetre, e.units);
    out.push({ path: "quantity.count × length × mass per length", v: total });
  }
  return out;
}

type Index = Map<string, Map<string, string[]>>;

/** spelling → engine paths, for each unit written after a number ("" = none). */
function buildIndex(e: EngineFacts): Index {
  const vals = engineValues(e);
  const idx: Index = new Map();
  const add = (unit: string, x: number, path: string) => {
    let m = idx.get(unit);
    if (!m) idx.set(unit, (m = new Map()));
    for (const s of spellings(x)) {
      const l = m.get(s);
      if (l) l.push(path);
      else m.set(s, [path]);
    }
  };
  for (const { path, v } of vals) {
    add("", v, path);
    if (e.units === "us") for (const q of Object.keys(UNITS) as Quantity[]) add("", fromSI(q, v, "us"), `${path} (${UNITS[q].us})`);
    for (const u of UNIT_WORDS) add(u.label, fromSI(u.q, v, u.sys), `${path} (${u.label})`);
  }
  return idx;
}

/** Level 1: numbers of the calculation part with no engine counterpart, each with its line. */
export function unmatchedNumbers(html: string, e: EngineFacts): string[] {
  const idx = buildIndex(e);
  const bad: string[] = [];
  for (const line of htmlLines(calculationHtml(html)))
    for (const t of numberTokens(line, e.names)) {
      const byUnit = idx.get(t.unit ?? "")!;
      const hit = byUnit.get(t.text) ?? byUnit.get(t.text.replace("-", "−"));
      if (!hit) bad.push(`${t.text}${t.unit ? ` ${t.unit}` : ""} — no engine value; in: “${t.line}”`);
    }
  return bad;
}

// ---------------------------------------------------------------- labelled values

export interface Labelled {
  failures: string[];
  /** how many labelled values were compared (so a silently empty audit fails) */
  compared: number;
}

const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
const NUM = String.raw`(−?\d[\d,.]*(?: × 10[${SUP}]+)?)`;

function cells(rowHtml: string): string[] {
  return [...rowHtml.matchAll(/<t[dh][^>]*>([\s\S]*?)<\/t[dh]>/g)].map((m) => htmlLines(m[1]!).join(" "));
}

function rowsOf(html: string, testid: string): string[] {
  const t = new RegExp(`<table[^>]*data-testid="${testid}"[^>]*>([\\s\\S]*?)</table>`).exec(html);
  if (!t) return [];
  const body = /<tbody>([\s\S]*?)<\/tbody>/.exec(t[1]!)?.[1] ?? "";
  return [...body.matchAll(/<tr[^>]*>([\s\S]*?)<\/tr>/g)].map((m) => m[1]!);
}

/** Level 2: each labelled number equals the engine's value of that label. */
export function labelledMismatches(html: string, e: EngineFacts): Labelled {
  const failures: string[] = [];
  let compared = 0;
  const u = e.units;
  const eq = (label: string, shown: string | undefined, want: string) => {
    compared++;
    if (shown !== want) failures.push(`${label}: the record shows ${shown === undefined ? "nothing" : `“${shown}”`}, the engine's value is “${want}”`);
  };
  const calc = calculationHtml(html);
  const text = htmlLines(calc).join("\n");
  /** the first number after `before` (a literal) in the calculation text, optionally from `from` on */
  const after = (before: string, from = 0): string | undefined => new RegExp(esc(before) + "\\s*" + NUM).exec(text.slice(from))?.[1];
  const q5 = (q: Quantity, x: number) => formatNumber(fromSI(q, x, u), 5);

  // property table: every row by its data-property key
  for (const m of calc.matchAll(/<tr[^>]*data-property="([^"]+)"[^>]*>([\s\S]*?)<\/tr>/g)) {
    const key = m[1]!;
    if (key === "stability") continue;
    const q = PROPERTY_QUANTITIES[key] ?? STABILITY_QUANTITIES[key];
    const v = key.split(".").reduce<unknown>((o, k) => (o as Record<string, unknown> | null)?.[k], e.properties);
    const shown = /data-value[^>]*>([\s\S]*?)<\/td>/.exec(m[2]!)?.[1];
    eq(`property ${key}`, shown && htmlLines(shown).join(" "), q && typeof v === "number" ? formatQuantity(q, v, u) : "(no engine value)");
  }

  // check table: one row per engine check, demand, capacity, unit and utilisation
  const CHECK_Q: Record<string, Quantity | null> = { MPa: "stress", mm: "length", "kN·m": "moment", kN: "force", ratio: null };
  const checkRows = [...calc.matchAll(/<tr[^>]*data-check="([^"]+)"[^>]*>([\s\S]*?)<\/tr>/g)];
  // the EN 1993 sheet shows the table once, in 6.8; the others once in section 5
  const shownChecks = new Map<string, string[]>();
  for (const m of checkRows) if (!shownChecks.has(m[1]!)) shownChecks.set(m[1]!, cells(m[2]!));
  eq("checks listed", [...shownChecks.keys()].join(", "), e.verdict.checks.map((c) => c.name).join(", "));
  for (const c of e.verdict.checks) {
    const cs = shownChecks.get(c.name);
    const q = CHECK_Q[c.unit] ?? null;
    const v = (x: number) => formatNumber(q ? fromSI(q, x, u) : x);
    eq(`check ${c.name} demand`, cs?.[1], v(c.demand));
    eq(`check ${c.name} capacity`, cs?.[2], v(c.capacity));
    eq(`check ${c.name} unit`, cs?.[3], q ? unitLabel(q, u) : "ratio");
    eq(`check ${c.name} utilisation`, cs?.[4], c.utilisation.toFixed(3));
  }

  // plates and the composite-area table, row by row
  const plateRows = [...calc.matchAll(/<h3[^>]*>Plates[\s\S]*?<tbody>([\s\S]*?)<\/tbody>/g)][0]?.[1] ?? "";
  const pr = [...plateRows.matchAll(/<tr[^>]*>([\s\S]*?)<\/tr>/g)].map((m) => cells(m[1]!));
  eq("plates listed", String(pr.length), String(e.plates.length));
  e.plates.forEach((p, i) => {
    for (const [k, j] of [["b", 1], ["h", 2], ["z", 3], ["y", 4]] as const) eq(`plate ${i + 1} ${k}`, pr[i]?.[j], q5("length", p[k]));
  });
  const ct = rowsOf(calc, "composite-table").map(cells);
  eq("composite rows", String(ct.length), String(e.table.rows.length + 1));
  e.table.rows.forEach((r, i) => {
    const c = ct[i];
    eq(`composite row ${i + 1} A`, c?.[1], q5("area", r.A));
    eq(`composite row ${i + 1} y`, c?.[2], q5("length", r.yc));
    eq(`composite row ${i + 1} A·y`, c?.[3], q5("modulus", r.Ayc));
    eq(`composite row ${i + 1} I0`, c?.[4], q5("inertia", r.I0));
    eq(`composite row ${i + 1} d`, c?.[5], q5("length", r.d));
    eq(`composite row ${i + 1} A·d²`, c?.[6], q5("inertia", r.Ad2));
  });
  const tot = ct[e.table.rows.length];
  const T = e.table.totals;
  eq("composite Σ A", tot?.[1], q5("area", T.A));
  eq("composite Σ A·y", tot?.[3], q5("modulus", T.Ayc));
  eq("composite Σ I0", tot?.[4], q5("inertia", T.I0));
  eq("composite Σ A·d²", tot?.[6], q5("inertia", T.Ad2));
  eq("ȳ = ΣA·y ÷ ΣA", new RegExp(`ȳ = ΣA·y ÷ ΣA = ${NUM} ÷ ${NUM} = ${NUM}`).exec(text)?.[3], q5("length", T.yBar));
  eq("Iz = ΣI₀ + ΣA·d²", new RegExp(`Iz = ΣI₀ \\+ ΣA·d² = ${NUM} \\+ ${NUM} = ${NUM}`).exec(text)?.[3], q5("inertia", T.Iz));
  eq("c_top", after("c_top ="), q5("length", e.properties.extremes.top));
  eq("c_bottom", after("c_bottom ="), q5("length", e.properties.extremes.bottom));

  // fibre stresses: the result after the last "=" of each σ line, per moment case
  for (const f of e.fibres) {
    const from = text.indexOf(`${f.case === "sagging" ? "Sagging" : "Hogging"} moment M =`);
    eq(`${f.case} M`, from < 0 ? undefined : after("moment M =", from), q5("moment", f.M));
    const block = from < 0 ? "" : text.slice(from).split("\n").slice(0, 3).join("\n");
    const sym = /σ_top = /.test(block);
    const top = sym ? /σ_top = [^\n]* = (−?[\d,.]+(?: × 10[⁻⁰-⁹]+)?) \S+\n/.exec(block)?.[1] : /largest top (−?[\d,.]+(?: × 10[⁻⁰-⁹]+)?)/.exec(block)?.[1];
    const bottom = sym ? /σ_bottom = [^\n]* = (−?[\d,.]+(?: × 10[⁻⁰-⁹]+)?) \S+(?:\n|$)/.exec(block)?.[1] : /bottom (−?[\d,.]+(?: × 10[⁻⁰-⁹]+)?)/.exec(block)?.[1];
    eq(`${f.case} σ_top`, top, q5("stress", f.top));
    eq(`${f.case} σ_bottom`, bottom, q5("stress", f.bottom));
  }

  // the header's dimensions
  for (const [k, v] of Object.entries(e.dims)) eq(`dimension ${k}`, after(` ${k} =`), q5("length", v));

  // the member quantity, when the brief gives it
  if (e.quantity) {
    const total = e.quantity.count * fromSI("span", e.quantity.lengthM, u) * fromSI("massPerLength", e.properties.massPerMetre, u);
    eq("quantity total mass", new RegExp(`Quantity: [^\\n]* = ${NUM} (?:kg|lb)`).exec(text)?.[1], formatNumber(total, 4));
  }

  // the deflection worked through (every basis)
  const dw = e.verdict.deflectionWorking;
  eq("deflection worked", String(/data-testid="record-deflection"/.test(calc)), String(dw !== undefined));
  if (dw) {
    const m = new RegExp(`δ = 5·w·L⁴/\\(384·E·I\\) = 5 × ${NUM} N/mm × \\(?${NUM}\\)?⁴ mm⁴ ÷ \\(384 × \\(?${NUM}\\)? MPa × \\(?${NUM}\\)? mm⁴\\) = ${NUM} mm`).exec(text);
    eq("deflection w", m?.[1], formatNumber(dw.w));
    eq("deflection L", m?.[2], formatNumber(dw.L));
    eq("deflection E", m?.[3], formatNumber(dw.E));
    eq("deflection I", m?.[4], formatNumber(dw.I));
    eq("deflection δ", m?.[5], formatNumber(dw.delta));
    eq("deflection limit", new RegExp(`limit L/[\\d.,]+ = [\\d.,]+/[\\d.,]+ = ${NUM} mm`).exec(text)?.[1], formatNumber(dw.limit));
    eq("deflection δ/limit", after("δ/limit ="), e.verdict.checks.find((c) => c.name === "deflection")!.utilisation.toFixed(3));
    const parts = e.verdict.deflection;
    if (parts && parts.sideways > 0) {
      eq("deflection vertical", after("vertical"), formatNumber(parts.vertical));
      eq("deflection sideways", after("sideways"), formatNumber(parts.sideways));
      eq("deflection total", after("total √(vertical² + sideways²) ="), formatNumber(parts.total));
    }
  }

  // the allowable shear stress worked through
  const sw = e.verdict.shearWorking;
  eq("shear worked", String(/data-testid="record-shear"/.test(calc)), String(sw !== undefined));
  if (sw) {
    eq("shear y", after("Largest at y ="), formatNumber(sw.y));
    eq("shear Q", after("where Q ="), formatNumber(sw.Q));
    eq("shear b", after("mm³ (the area above y about the neutral axis) and b ="), formatNumber(sw.b));
    const m = new RegExp(`τ = ${NUM} kN × 10³ N × \\(?${NUM}\\)? mm³ ÷ \\(\\(?${NUM}\\)? mm⁴ × ${NUM} mm\\) = ${NUM} MPa`).exec(text);
    eq("shear V", m?.[1], formatNumber(sw.V));
    eq("shear Iz", m?.[3], formatNumber(sw.Iz));
    eq("shear τ", m?.[5], formatNumber(sw.tau));
    eq("shear τ/allowable", after("τ/allowable ="), e.verdict.checks.find((c) => c.name === "shear")!.utilisation.toFixed(3));
  }

  // the brief's slenderness limits worked through, element by element
  const sl = e.verdict.slendernessWorking ?? [];
  eq("slenderness worked", String(/data-testid="record-slenderness"/.test(calc)), String(sl.length > 0));
  for (const el of sl) {
    const m = new RegExp(`${esc(el.element)}: width b = ${esc(el.widthSymbols)} = ${NUM} mm, thickness t = ${esc(el.thicknessSymbols)} = ${NUM} mm; b/t = ${NUM}/${NUM} = ${NUM} [≤>] limit ${NUM}`).exec(text);
    eq(`${el.element} b`, m?.[1], formatNumber(el.b));
    eq(`${el.element} t`, m?.[2], formatNumber(el.t));
    eq(`${el.element} b in b/t`, m?.[3], formatNumber(el.b));
    eq(`${el.element} t in b/t`, m?.[4], formatNumber(el.t));
    eq(`${el.element} b/t`, m?.[5], formatNumber(el.ratio));
    eq(`${el.element} limit`, m?.[6], formatNumber(el.limit));
    if (el.governs)
      eq(`${el.element} b/t ÷ limit`, new RegExp(`${esc(el.element)}: width [^\\n]*b/t ÷ limit = ${NUM}`).exec(text)?.[1], e.verdict.checks.find((c) => c.name === el.name)!.utilisation.toFixed(3));
  }

  // the worked checks, by basis
  const d = e.verdict.design;
  if (d) enLabelled(text, calc, e, eq, after);
  const a = e.verdict.aisc;
  if (a) aiscLabelled(text, e, eq);
  return { failures, compared };
}

type Eq = (label: string, shown: string | undefined, want: string) => void;

function enLabelled(text: string, calc: string, e: EngineFacts, eq: Eq, after: (before: string, from?: number) => string | undefined) {
  const d = e.verdict.design!;
  const n = (x: number, sig = 4) => formatNumber(x, sig);
  const util = (name: string) => e.verdict.checks.find((c) => c.name === name)?.utilisation.toFixed(3) ?? "(no such check)";
  eq("fy used", after("so fy ="), n(d.fy));
  eq("thickest plate", after("thickest plate is t ="), n(d.fyPlate));
  eq("ε", new RegExp(`ε = √\\(235/fy\\) = √\\(235/${NUM}\\) = ${NUM}`).exec(text)?.[2], n(d.epsilon, 4));
  // class table: element by element
  const rows = rowsOf(calc, "record-class").map(cells);
  eq("class rows", String(rows.length), String(d.elements.length));
  d.elements.forEach((el, i) => {
    const r = rows[i];
    eq(`class ${el.element} c`, r?.[2], n(el.c));
    eq(`class ${el.element} t`, r?.[3], n(el.t));
    eq(`class ${el.element} c/t`, r?.[4], n(el.ratio));
    eq(`class ${el.element} limits`, r?.[5], el.limits.map((x) => (Number.isFinite(x) ? n(x) : "none")).join(" / "));
    eq(`class ${el.element} α, ψ`, r?.[6], el.alpha !== undefined ? `α = ${n(el.alpha, 3)}, ψ = ${n(el.psi!, 3)}` : "—");
    eq(`class ${el.element} class`, r?.[7], String(el.class));
  });
  eq("section class", /data-testid="record-section-class"[^>]*>class (\d)/.exec(calc)?.[1], String(d.sectionClass));
  if (d.W !== null && d.McRd !== null) {
    eq("W", new RegExp(`(?:^|\\n)W = W[^\\n]*? = ${NUM} mm³`).exec(text)?.[1], n(d.W));
    eq("Mc,Rd", new RegExp(`Mc,Rd = W·fy/γM0 = [^\\n]*? = ${NUM} kN·m`).exec(text)?.[1], n(d.McRd));
    eq("MEd/Mc,Rd", after("MEd/Mc,Rd ="), util("bending-resistance"));
  }
  for (const l of d.ltb ?? []) {
    const from = text.indexOf(`${l.moment === "sagging" ? "Sagging" : "Hogging"} moment MEd =`);
    const block = from < 0 ? "" : text.slice(from);
    const at = (before: string) => new RegExp(esc(before) + "\\s*" + NUM).exec(block)?.[1];
    const res = (sym: string, unit = "") => new RegExp(`(?:^|\\n)${esc(sym)} = [^\\n]*? = ${NUM}${unit ? " " + esc(unit) : ""}(?:[;\\n\\[ ]|$)`).exec(block)?.[1];
    eq(`${l.moment} MEd`, at("moment MEd ="), n(l.MEd));
    eq(`${l.moment} zg`, at("above the shear centre ="), n(l.zg));
    eq(`${l.moment} zj`, at("mm, zj ="), n(l.zj));
    eq(`${l.moment} Mcr`, res("Mcr", "kN·m"), n(l.Mcr));
    eq(`${l.moment} λLT`, res("λLT"), n(l.lambdaLT, 4));
    eq(`${l.moment} αLT`, at("αLT ="), String(l.alphaLT));
    eq(`${l.moment} ΦLT`, new RegExp(`λLT²\\] = 0\\.5 × \\[1 \\+ [^\\n]*? = ${NUM}`).exec(block)?.[1], n(l.phiLT, 4));
    eq(`${l.moment} χLT`, res("χLT"), n(l.chiLT, 4));
    eq(`${l.moment} Mb,Rd`, new RegExp(`Mb,Rd = χLT·W·fy/γM1 = [^\\n]*? = ${NUM} kN·m`).exec(block)?.[1], n(l.MbRd));
  }
  const sh = d.shear;
  if (sh) {
    eq("Av", new RegExp(`Av = [^=\\n]* = ${NUM} mm²`).exec(text)?.[1], n(sh.Av));
    eq("hw", after("(hw ="), n(sh.hw));
    eq("tw", after("mm, tw ="), n(sh.tw));
    eq("Vpl,Rd", new RegExp(`Vpl,Rd = Av·fy/\\(√3·γM0\\) = [^\\n]*? = ${NUM} kN`).exec(text)?.[1], n(sh.VplRd));
    if (sh.bucklingLimit !== null) eq("72ε/η", after(sh.buckling ? "72ε/η =" : "≤ 72ε/η ="), n(sh.bucklingLimit));
    if (sh.buckling) {
      eq("λw", new RegExp(`λw = hw/\\(86\\.4·tw·ε\\) = [^;\\n]*? = ${NUM}`).exec(text)?.[1], n(sh.lambdaW!, 4));
      eq("χw", new RegExp(`χw = [^;\\n]*? = ${NUM}`).exec(text)?.[1], n(sh.chiW!, 4));
      eq("Vb,Rd", new RegExp(`Vb,Rd = [^\\n]*?χw·fy·hw·tw/\\(√3·γM1\\) = [^\\n]*? = ${NUM} kN`).exec(text)?.[1], n(sh.VbRd!));
    }
    eq("VRd", after("VRd ="), n(sh.VRd));
    eq("VEd/VRd", new RegExp(`VEd/VRd = [^\\n]*? = ${NUM}`).exec(text)?.[1], util(sh.governing));
    if (d.bendingShear) {
      eq("ρ", new RegExp(`ρ = \\(2·VEd/VRd − 1\\)² = [^\\n]*? = ${NUM}`).exec(text)?.[1], n(d.bendingShear.rho, 4));
      eq("MV,Rd", new RegExp(`MV,Rd = [^\\n]*? = ${NUM} kN·m`).exec(text)?.[1], n(d.bendingShear.MVRd));
      eq("MEd/MV,Rd", after("MEd/MV,Rd ="), util("bending-shear"));
    }
  }
  if (d.weld) {
    const w = d.weld;
    eq("q", new RegExp(`q = VEd·Qf/Iz = [^\\n]*? = ${NUM} N/mm`).exec(text)?.[1], n(w.q));
    eq("fvw,d", new RegExp(`fvw,d = fu/\\(√3·βw·γM2\\) = [^\\n]*? = ${NUM} MPa`).exec(text)?.[1], n(w.fvwd));
    eq("a exact", new RegExp(`a = q/\\(\\d·fvw,d\\) = [^\\n]*? = ${NUM} mm →`).exec(text)?.[1], n(w.aExact, 3));
    eq("a", after("at least 3 mm: a ="), String(w.a));
    eq("a max", after("the thinner joined plate ="), n(w.aMax));
  }
  if (d.bearing) {
    const b = d.bearing;
    for (const [sym, v, sig] of [["ss =", b.ss, 4], ["kF =", b.kF, 4], ["m1 =", b.m1, 4], ["m2 =", b.m2, 4], ["ly =", b.ly, 4], ["Fcr =", b.Fcr, 4], ["λF =", b.lambdaF, 4], ["χF =", b.chiF, 4], ["Leff = χF·ly =", b.Leff, 4], ["FRd = fy·Leff·tw/γM1 =", b.FRd, 4]] as const)
      eq(`bearing ${sym.split(" ")[0]}`, after(`; ${sym}`) ?? after(`${sym}`), n(v, sig));
    eq("VEd/FRd", after("VEd/FRd ="), util("bearing"));
  }
}

function aiscLabelled(text: string, e: EngineFacts, eq: Eq) {
  const a = e.verdict.aisc!;
  // the engine's record lines format with f3 (basis/aisc360.ts); the page must show them as they are
  const f3 = (x: number) => (Math.abs(x) >= 1000 ? x.toFixed(0) : Math.abs(x) >= 10 ? x.toFixed(1) : x.toFixed(3));
  eq("Fy", /Fy = (\d[\d.]*) MPa/.exec(text)?.[1], a.Fy.toFixed(1));
  for (const el of a.elements) {
    const m = new RegExp(`${esc(el.element)} \\([^)]*\\): λ = ${NUM}; λp = ${NUM}, λr = ${NUM}`).exec(text);
    eq(`${el.element} λ`, m?.[1], f3(el.ratio));
    eq(`${el.element} λp`, m?.[2], f3(el.lambdaP));
    eq(`${el.element} λr`, m?.[3], f3(el.lambdaR));
  }
  for (const f of a.flexure) {
    const m = new RegExp(`${f.moment}: Chapter F section ${f.section}; Mp = ${NUM} kN·m, My = ${NUM} kN·m`).exec(text);
    eq(`${f.moment} Mp`, m?.[1], f3(f.Mp));
    eq(`${f.moment} My`, m?.[2], f3(f.My));
    for (const ls of f.limitStates) eq(`${f.moment} ${ls.name}`, new RegExp(`${f.moment}: ${esc(ls.name)}: Mn = ${NUM} kN·m`).exec(text)?.[1], f3(ls.Mn));
    const k = new RegExp(`${f.moment}: Mn = ${NUM} kN·m \\(least of the above\\), \\S+ = ${NUM} kN·m against ${NUM} kN·m`).exec(text);
    eq(`${f.moment} Mn`, k?.[1], f3(f.MnLocal));
    eq(`${f.moment} available`, k?.[2], f3(f.availableLocal));
    eq(`${f.moment} required`, k?.[3], f3(f.M));
    if (f.ltb) {
      const l = f.ltb;
      const t = new RegExp(`${f.moment}: lateral-torsional buckling, Lb = ${NUM} mm, Cb = ([\\d.]+)`).exec(text);
      eq(`${f.moment} Lb`, t?.[1], f3(l.Lb));
      eq(`${f.moment} Cb`, t?.[2], String(l.Cb));
      if (l.Lp !== null) eq(`${f.moment} Lp`, new RegExp(`${f.moment}: lateral-torsional[^\\n]*Lp = ${NUM} mm`).exec(text)?.[1], f3(l.Lp));
      if (l.Mn !== null) eq(`${f.moment} LTB Mn`, new RegExp(`${f.moment}: lateral-torsional[^\\n]*; Mn = ${NUM} kN·m`).exec(text)?.[1], f3(l.Mn));
    }
  }
  if (a.shear) {
    const s = a.shear;
    eq("Aw", /Aw = ([\d.]+) mm²/.exec(text)?.[1], f3(s.Aw));
    eq("Cv", /Cv = ([\d.]+);/.exec(text)?.[1], f3(s.Cv));
    eq("Vn", /Vn = 0\.6·Fy·Aw·Cv = ([\d.]+) kN/.exec(text)?.[1], f3(s.Vn));
  }
  if (a.weld) eq("weld leg", /→ (\d+) mm \(Table J2\.4/.exec(text)?.[1], String(a.weld.w));
  aiscWorkedLabelled(text, e, eq);
  if (a.bearing) eq("bearing available", /available ([\d.]+) kN/.exec(text)?.[1], f3(a.bearing.available));
}

/** The AISC 360-16 checks worked through (Aisc360Worked): each result after its formula and substitution. */
function aiscWorkedLabelled(text: string, e: EngineFacts, eq: Eq) {
  const a = e.verdict.aisc!;
  const n = (x: number, sig = 4) => formatNumber(x, sig);
  const res = (block: string, formula: string, unit = "") => new RegExp(`${esc(formula)} = [^\\n]*? = ${NUM}${unit ? " " + esc(unit) : ""}(?:[;\\n\\[ ]|$)`).exec(block)?.[1];
  for (const f of a.flexure) {
    if (f.section !== "F2" && f.section !== "F3") continue;
    const from = text.indexOf(`${f.moment === "sagging" ? "Sagging" : "Hogging"} moment ${a.method === "ASD" ? "Ma" : "Mu"} =`);
    eq(`${f.moment} worked flexure shown`, String(from >= 0), "true");
    const block = from < 0 ? "" : text.slice(from);
    eq(`${f.moment} Fy·Zx`, res(block, "Mn = Mp = Fy·Zx", "kN·m"), n(f.Mp));
    const flb = f.limitStates.find((x) => x.equation === "F3-1" || x.equation === "F3-2");
    if (flb) eq(`${f.moment} ${flb.equation}`, res(block, flb.equation === "F3-1" ? "Mn = Mp − (Mp − 0.7·Fy·Sx)·(λ − λpf)/(λrf − λpf)" : "Mn = 0.9·E·kc·Sx/λ²", "kN·m"), n(flb.Mn));
    if (f.Mr !== undefined && flb?.equation === "F3-1") eq(`${f.moment} Mr`, new RegExp(`Mr = 0\\.7·Fy·Sx = ${NUM} kN·m`).exec(block)?.[1], n(f.Mr));
    const local = new RegExp(`Mn = ${NUM} kN·m \\(the least[^\\n]*? = ${NUM} kN·m`).exec(block);
    eq(`${f.moment} worked Mn`, local?.[1], n(f.MnLocal));
    eq(`${f.moment} worked available`, local?.[2], n(f.availableLocal));
    const l = f.ltb;
    if (l && l.Lp !== null && l.Lr !== null) {
      eq(`${f.moment} worked Lp`, res(block, "Lp = 1.76·ry·√(E/Fy)", "mm"), n(l.Lp));
      eq(`${f.moment} worked ry`, new RegExp(`1\\.76 × ${NUM} mm`).exec(block)?.[1], n(l.ry ?? NaN));
      eq(`${f.moment} worked Lr`, new RegExp(`: Lr = 1\\.95 × [^\\n]*? = ${NUM} mm`).exec(block)?.[1], n(l.Lr));
      if (l.zone === "inelastic") eq(`${f.moment} F2-2 Mn`, new RegExp(`Lp < Lb ≤ Lr: [^\\n]*? = ${NUM} kN·m`).exec(block)?.[1], n(l.Mn ?? NaN));
      if (l.zone === "elastic") {
        eq(`${f.moment} F2-4 Fcr`, new RegExp(`Lb > Lr: Fcr = [^\\n]*? = ${NUM} MPa`).exec(block)?.[1], n(l.Fcr ?? NaN));
        eq(`${f.moment} F2-3 Mn`, new RegExp(`Mn = Fcr·Sx ≤ Mp = [^\\n]*? = ${NUM} kN·m`).exec(block)?.[1], n(l.Mn ?? NaN));
      }
    }
  }
  const s = a.shear;
  if (s) {
    eq("worked Aw", new RegExp(`\\nAw = [^\\n=]* = ${NUM} mm²`).exec(text)?.[1], n(s.Aw));
    const shear = text.slice(text.indexOf("\nAw = "));
    eq("worked Cv", new RegExp(`Cv1? = (?:[^\\n;\\[,]*? = )?(\\d(?:\\.\\d+)?)(?=[,;\\[\\s]|$)`).exec(shear)?.[1], n(s.Cv));
    if (s.htLimit !== null) eq("worked h/tw limit", new RegExp(`√\\((?:kv·)?E/Fy\\) = ${NUM}`).exec(shear)?.[1], n(s.htLimit));
    eq("worked Vn", res(text, "Vn = 0.6·Fy·Aw·Cv", "kN"), n(s.Vn));
    eq("worked available V", new RegExp(`(?:φvVn|Vn/Ωv) = [^\\n]*? = ${NUM} kN`).exec(text)?.[1], n(s.available));
  }
  const w = a.weld;
  if (w) {
    eq("worked q", new RegExp(`\\nq = V·Qf/Iz = ${NUM} N/mm`).exec(text)?.[1], n(w.q));
    eq("worked Fnw", res(text, "Fnw = 0.60·FEXX", "MPa"), n(w.Fnw));
    eq("worked per mm of leg", new RegExp(`= ${NUM} N/mm per mm of leg`).exec(text)?.[1], n(w.perLeg));
    eq("worked w exact", new RegExp(`w = q/\\(2 × that\\) = [^\\n]*? = ${NUM} mm →`).exec(text)?.[1], n(w.wExact, 3));
    eq("worked w", new RegExp(`minimum [^\\n]*: w = ${NUM} mm`).exec(text)?.[1], n(w.w));
  }
}

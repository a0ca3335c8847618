// The one table of human labels (issue 11, item 5): every form error, summary, comparison, chart
// and table names a field, a family or a check through here, so no page shows the engine's
// field paths ("allowable.tension", "plates[3]") and every page calls a family by the same name.
import type { Family } from "~/optimizer/geometry";
import type { Basis, CheckName } from "~/optimizer/search-schema";
import type { LimitBreach } from "~/optimizer/limits";
import type { CheckUnit } from "~/optimizer/checks";
import { unitLabel, type Quantity, type UnitSystem } from "~/optimizer/units";
import { formatNumber, formatQuantity } from "~/lib/format";

/**
 * Problem and brief fields by their dotted path. A field the editor names per basis has a
 * "path@basis" entry beside its own (the AISC 360 panel calls the restraint length the unbraced
 * length Lb, Chapter F's term), read by fieldLabel and plainMessage when given the brief's basis,
 * so a refusal names the field as the form in front of the engineer does.
 */
export const FIELD_LABELS: Record<string, string> = {
  name: "Brief name",
  units: "Units",
  material: "Material preset",
  stockListId: "Stock list",
  memberLength: "Member length",
  memberCount: "Member count",
  moment: "Design moment",
  "moment.sagging": "Sagging moment",
  "moment.hogging": "Hogging moment",
  shear: "Shear force",
  allowable: "Allowable stresses",
  "allowable.tension": "Allowable tension",
  "allowable.compression": "Allowable compression",
  "allowable.shear": "Allowable shear",
  depth: "Depth",
  "depth.min": "Depth, min",
  "depth.max": "Depth, max",
  "depth.step": "Depth, step",
  width: "Width",
  "width.min": "Width, min",
  "width.max": "Width, max",
  "width.step": "Width, step",
  thicknesses: "Plate thicknesses",
  families: "Shape families",
  slenderness: "Slenderness limits",
  "slenderness.outstand": "Flange outstand limit",
  "slenderness.internal": "Internal plate limit",
  "slenderness.web": "Web slenderness limit",
  "slenderness.stem": "Stem slenderness limit",
  density: "Density",
  deflection: "Deflection",
  "deflection.span": "Span",
  "deflection.serviceLoad": "Service load",
  "deflection.limitRatio": "Limit ratio (span ÷ …)",
  "deflection.E": "Elastic modulus E",
  objective: "Objective",
  prices: "Plate prices",
  "prices[].thickness": "Priced thickness",
  "prices[].pricePerKg": "Price per kg",
  "thicknesses[]": "Plate thickness",
  grid: "Grid size",
  basis: "Design basis",
  // AISC 360 (issue 14): the brief editor's own labels, so a refusal reads as the form does
  method: "Design method",
  aisc: "AISC 360 steel",
  "aisc.grade": "ASTM plate grade",
  "aisc.Fy": "Yield stress Fy",
  "aisc.Fu": "Tensile strength Fu",
  "aisc.E": "Elastic modulus E (AISC 360)",
  "aisc.G": "Shear modulus G (AISC 360)",
  "aisc.FEXX": "Electrode strength FEXX",
  "aisc.rolledGrade": "Rolled-shape grade",
  "aisc.rolledFy": "Rolled-shape yield stress Fy",
  "restraint.Cb": "Cb (lateral-torsional buckling modification factor)",
  steel: "Steel",
  "steel.grade": "Steel grade",
  "steel.fy": "Yield strength bands",
  "steel.fy[].maxThickness": "Band up to thickness",
  "steel.fy[].fy": "Yield strength fy",
  "steel.fu": "Tensile strength fu",
  "steel.E": "Elastic modulus E",
  "steel.G": "Shear modulus G",
  "steel.gammaM0": "γM0, cross-section resistance",
  "steel.gammaM1": "γM1, member buckling",
  "steel.gammaM2": "γM2, welds",
  "steel.eta": "Shear area factor η",
  "steel.betaW": "Weld correlation factor βw",
  restraint: "Lateral restraint",
  "restraint.length": "Restraint length",
  "restraint.length@aisc360": "Unbraced length Lb",
  "restraint.C1": "Moment factor C1",
  "restraint.C2": "Moment factor C2",
  "restraint.C3": "Moment factor C3",
  "restraint.loadAt": "Load position",
  supports: "Supports",
  "supports.stiffened": "Stiffened supports",
  "supports.bearingLength": "Stiff bearing length",
  fabrication: "Fabrication rules",
  "fabrication.minThickness": "Thinnest plate allowed",
  "fabrication.flangeAtLeastWeb": "Flanges at least as thick as the web",
  "fabrication.minBoxClear": "Least clear width inside a box (b − 2·tw)",
  geometry: "Geometry",
  rank: "Candidate",
  note: "Note",
  comment: "Comment",
  decision: "Decision",
};

/** A field's label; with the brief's basis, the basis's own name for it where it has one ("restraint.length@aisc360"). */
export function fieldLabel(path: string, basis?: Basis): string {
  const general = path.replace(/\[\d+\]/g, "[]");
  return (basis && (FIELD_LABELS[`${path}@${basis}`] ?? FIELD_LABELS[`${general}@${basis}`])) ?? FIELD_LABELS[path] ?? FIELD_LABELS[general] ?? path;
}

/** Family names, the same on the bench, the brief, the sweep, the comparison and the record. */
export const FAMILY_LABELS: Record<Family, string> = {
  rectangle: "Rectangle (solid bar)",
  i: "I (equal flanges)",
  "mono-i": "Mono-symmetric I",
  channel: "Channel",
  "channel-down": "Channel, web on top",
  tee: "Tee",
  box: "Box",
  angle: "Angle",
};

export function familyLabel(f: string): string {
  return FAMILY_LABELS[f as Family] ?? f;
}

/** The objective as the editor's choice reads. */
export const OBJECTIVE_LABELS: Record<"mass" | "cost", string> = { mass: "lightest", cost: "cheapest" };

/** Each check by what it compares. */
export const CHECK_LABELS: Record<CheckName, string> = {
  "bending-compression": "bending, compressive fibre stress",
  "bending-tension": "bending, tensile fibre stress",
  shear: "shear stress",
  "slenderness-outstand": "flange outstand slenderness",
  "slenderness-internal": "internal plate slenderness",
  "slenderness-web": "web slenderness",
  "slenderness-stem": "stem slenderness",
  deflection: "deflection",
  "class-4": "class 4 cross-section (outside this version)",
  "bending-resistance": "bending resistance",
  ltb: "lateral-torsional buckling resistance",
  "shear-resistance": "shear resistance",
  "shear-buckling": "shear buckling resistance",
  "bending-shear": "bending resistance reduced for shear",
  weld: "web-to-flange weld throat",
  bearing: "web bearing (patch loading) resistance",
};

export function checkLabel(name: string): string {
  return CHECK_LABELS[name as CheckName] ?? name;
}

/** Family dimensions in words. */
export const DIMENSION_LABELS: Record<string, string> = {
  d: "depth",
  b: "width",
  tf: "flange thickness",
  tw: "web thickness",
  bt: "top flange width",
  tft: "top flange thickness",
  bb: "bottom flange width",
  tfb: "bottom flange thickness",
  t: "leg thickness",
  r: "root radius",
};

function length(x: number, units: UnitSystem): string {
  return formatQuantity("length", x, units, 6);
}

/** The quantity a check's demand and capacity are measured in (checks.ts CHECK_UNITS). */
const UNIT_QUANTITY: Record<CheckUnit, Quantity | null> = { MPa: "stress", mm: "length", "kN·m": "moment", kN: "force", ratio: null };

/** One broken limit (engine's sectionLimits) in words: what is wrong and against which limit. */
export function describeBreach(b: LimitBreach, units: UnitSystem): string {
  switch (b.kind) {
    case "family":
      return `the ${familyLabel(b.family)} family is no longer among the shape families`;
    case "below":
      return `${DIMENSION_LABELS[b.dim] ?? b.dim} ${length(b.value, units)} is below ${fieldLabel(b.limit).toLowerCase()} ${length(b.bound, units)}`;
    case "above":
      return `${DIMENSION_LABELS[b.dim] ?? b.dim} ${length(b.value, units)} is above ${fieldLabel(b.limit).toLowerCase()} ${length(b.bound, units)}`;
    case "off-grid":
      return `${DIMENSION_LABELS[b.dim] ?? b.dim} ${length(b.value, units)} is not on the new ${b.limit.split(".")[0]} grid (nearest ${length(b.below, units)} and ${length(b.above, units)})`;
    case "thickness":
      return `${DIMENSION_LABELS[b.dim] ?? b.dim} ${length(b.value, units)} is not among the plate thicknesses`;
    case "geometry":
      return `invalid geometry: ${b.rule}`;
    case "fabrication":
      return b.limit === "fabrication.flangeAtLeastWeb"
        ? `${DIMENSION_LABELS[b.dim] ?? b.dim} ${length(b.value, units)} is thinner than the web ${length(b.bound, units)} (flanges at least as thick as the web)`
        : b.limit === "fabrication.minBoxClear"
          ? `the clear width inside the box ${length(b.value, units)} is below the least allowed ${length(b.bound, units)}`
          : `${DIMENSION_LABELS[b.dim] ?? b.dim} ${length(b.value, units)} is thinner than the thinnest plate allowed ${length(b.bound, units)}`;
    case "check": {
      const q = UNIT_QUANTITY[b.unit];
      const v = (x: number) => (q ? formatQuantity(q, x, units) : formatNumber(x));
      return `${checkLabel(b.check)} ${v(b.demand)} exceeds ${fieldLabel(b.limit).toLowerCase()} ${v(b.capacity)} (utilisation ${b.utilisation.toFixed(3)})`;
    }
    case "catalogue":
      return `${b.designation} is no longer among the catalogue sections searched${b.catalogue ? ` (${b.catalogue})` : ""}`;
    case "basis":
      return b.reason;
  }
}

/**
 * An engine or form message with every field path replaced by its label and zero-based list
 * indices read as the row numbers a person sees ("plates[3] overlaps plates[2]" → "plate 4
 * overlaps plate 3"). Longest paths first, so "depth.max" is not read as "depth" + ".max".
 */
const PATHS = Object.keys(FIELD_LABELS)
  .filter((p) => !p.includes("@"))
  .sort((a, b) => b.length - a.length);
// (used by plainMessage below)
const PLATE_DIMENSIONS: Record<string, string> = { b: "width b", h: "height h", z: "left edge z", y: "bottom edge y" };
const ROW_NOUNS: Record<string, string> = { plates: "plate", polygons: "polygon", points: "point", thicknesses: "thickness", families: "family", prices: "price", rows: "row" };

/** A label inside a sentence: lower case, except a leading symbol ("I (equal flanges)", "E"). */
function midSentence(label: string): string {
  return /^[A-Z][a-z]/.test(label) ? label.charAt(0).toLowerCase() + label.slice(1) : label;
}

/** Dotted and list paths anywhere ("allowable.tension", "thicknesses[]", "prices[].pricePerKg") → their labels (the basis's own where it has one). */
function labelPaths(text: string, basis?: Basis): string {
  let out = text;
  for (const p of PATHS) {
    if (!p.includes(".") && !p.includes("[")) continue;
    const re = new RegExp(`(^|[^\\w.\\[])${p.replace(/[.[\]]/g, (c) => `\\${c}`)}(?![\\w\\[])`, "g");
    const label = fieldLabel(p, basis);
    out = out.replace(re, (_, pre: string) => `${pre}${pre === "" ? label : midSentence(label)}`);
  }
  return out;
}

/**
 * A check's clause (checks.ts CHECK_CLAUSES, which the API gives with the problem's field paths)
 * as the option page and the record show it: the brief's fields by their labels
 * ("≤ allowable.compression" → "≤ allowable compression", "the brief's limit slenderness.web" →
 * "the brief's web slenderness limit", "L/limitRatio" → "L/limit ratio").
 */
export function clauseLabel(clause: string): string {
  const bare = (path: string) => midSentence(fieldLabel(path).replace(/ \(.*\)$/, ""));
  return labelPaths(
    clause
      .replace(/the brief's limit ([a-z]+\.[a-zA-Z]+)/g, (_, p: string) => `the brief's ${bare(p)}`)
      .replace(/\bL\/limitRatio\b/g, `L/${bare("deflection.limitRatio")}`),
  );
}

/** A check's name at the head of a table row or sentence ("Web slenderness"). */
export function checkTitle(name: string): string {
  const l = checkLabel(name);
  return l.charAt(0).toUpperCase() + l.slice(1);
}

/** An engine or form message in the editor's words; with the brief's basis, fields the basis names its own way are named so ("restraint.length" under AISC 360 → "Unbraced length Lb"). */
export function plainMessage(message: string, basis?: Basis): string {
  // fy bands by the row the editor shows ("steel.fy[1].maxThickness" → "band 2, plates up to")
  let out = labelPaths(message.replace(/steel\.fy\[(\d+)\]\.(maxThickness|fy)/g, (_, i: string, k: string) => `band ${Number(i) + 1}, ${k === "fy" ? "fy" : "plates up to"}`), basis);
  // a plate's own dimension ("plates[2].b" → "plate 3, width b")
  out = out.replace(/\bplates\[(\d+)\]\.(b|h|z|y)\b/g, (_, i: string, k: string) => `plate ${Number(i) + 1}, ${PLATE_DIMENSIONS[k]}`);
  out = out.replace(/\]\.points\[/g, "], points[");
  out = out.replace(/\bpolygons\[(\d+)\]\.(points|hole)\b/g, (_, i: string, k: string) => `polygon ${Number(i) + 1} ${k}`);
  out = out.replace(/\b(plates|polygons|points|thicknesses|families|prices|rows)\[(\d+)\]/g, (_, list: string, i: string) => `${ROW_NOUNS[list]} ${Number(i) + 1}`);
  out = out.replace(/objective is "(mass|cost)"/g, (_, o: "mass" | "cost") => `the objective is ${OBJECTIVE_LABELS[o]}`);
  out = out.replace(/(use )?objective "(mass|cost)"/g, (_, use: string | undefined, o: "mass" | "cost") => `${use ?? ""}the ${OBJECTIVE_LABELS[o]} objective`);
  // A family named in quotes by its engine name ("mono-i") → its label.
  out = out.replace(/"([a-z-]+)"/g, (m: string, f: string) => (f in FAMILY_LABELS ? `“${FAMILY_LABELS[f as Family]}”` : m));
  // A one-word field opening the message ("shear must be ≥ 0", "grid: …").
  out = out.replace(/^([a-zA-Z]+)(?=[: ])/, (w: string) => (w in FIELD_LABELS ? fieldLabel(w, basis) : w));
  return out.charAt(0).toUpperCase() + out.slice(1);
}

/** "(mm)", "(in)": the unit a field is typed in. */
export function unitSuffix(q: Quantity, units: UnitSystem): string {
  return `(${unitLabel(q, units)})`;
}

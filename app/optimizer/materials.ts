// Structural steel presets and the limits suggested for them. Presets only fill the brief form:
// the user can change every value, and the brief stores the values, never the preset name.
// Sources are named beside each number; "from memory" marks values recalled rather than
// copied from the document in hand.

export type SlendernessRules = "en-1993" | "aisc-360";

export interface SteelGrade {
  id: string;
  name: string;
  standard: string;
  /** elastic modulus, MPa */
  E: number;
  /** yield strength for the thinnest product range, MPa */
  fy: number;
  /** tensile strength, MPa */
  fu: number;
  /** kg/m³ */
  density: number;
  /** the width-to-thickness table that belongs with this grade's standard */
  rules: SlendernessRules;
  note: string;
  /** where the figures come from, as the comments below name it (shown on the admin materials page) */
  source: string;
}

const EN_SOURCE = "EN 10025-2 Table 7 (fy for t ≤ 16 mm, fu); EN 1993-1-1 §3.2.6 (E, density); from memory";
const ASTM_SOURCE = "ASTM specification minima as tabulated in the AISC Steel Construction Manual, Table 2-3 (Fy, Fu); E = 29 000 ksi and 490 lb/ft³ in AISC 360 notation; from memory";

export const STEEL_GRADES: readonly SteelGrade[] = [
  // EN 10025-2 non-alloy structural steels, nominal yield ReH for t ≤ 16 mm and tensile
  // strength for 3 ≤ t ≤ 100 mm (EN 10025-2 Table 7; from memory). E and density from
  // EN 1993-1-1 §3.2.6 (E = 210 000 MPa, ρ = 7850 kg/m³).
  { id: "s235", name: "S235", standard: "EN 10025-2", E: 210000, fy: 235, fu: 360, density: 7850, rules: "en-1993", note: "fy for t ≤ 16 mm; lower for thicker plate", source: EN_SOURCE },
  { id: "s275", name: "S275", standard: "EN 10025-2", E: 210000, fy: 275, fu: 430, density: 7850, rules: "en-1993", note: "fy for t ≤ 16 mm; lower for thicker plate", source: EN_SOURCE },
  { id: "s355", name: "S355", standard: "EN 10025-2", E: 210000, fy: 355, fu: 490, density: 7850, rules: "en-1993", note: "fy for t ≤ 16 mm; lower for thicker plate", source: EN_SOURCE },
  // ASTM grades: A36 Fy 36 ksi / Fu 58 ksi; A572 Grade 50 and A992 Fy 50 ksi / Fu 65 ksi
  // (the ASTM specifications, as tabulated in the AISC Steel Construction Manual, Table 2-3;
  // from memory). E = 29 000 ksi and 490 lb/ft³ (AISC 360 notation). ksi × 6.894757 = MPa.
  { id: "a36", name: "ASTM A36", standard: "ASTM A36", E: 200000, fy: 250, fu: 400, density: 7850, rules: "aisc-360", note: "36 ksi ≈ 248 MPa; 250 MPa is the usual metric statement", source: ASTM_SOURCE },
  { id: "a572-50", name: "ASTM A572 Gr 50", standard: "ASTM A572", E: 200000, fy: 345, fu: 450, density: 7850, rules: "aisc-360", note: "50 ksi", source: ASTM_SOURCE },
  { id: "a992", name: "ASTM A992", standard: "ASTM A992", E: 200000, fy: 345, fu: 450, density: 7850, rules: "aisc-360", note: "50 ksi; rolled wide-flange shapes", source: ASTM_SOURCE },
];

export function steelGrade(id: string): SteelGrade | undefined {
  return STEEL_GRADES.find((g) => g.id === id);
}

/**
 * Allowable stresses by the classic allowable-stress-design fractions of yield (AISC
 * Specification for Structural Steel Buildings, Allowable Stress Design, 1989, §D1 tension
 * Ft = 0.60·Fy; §F1 bending Fb = 0.66·Fy for compact sections, 0.60·Fy otherwise; §F4 shear
 * Fv = 0.40·Fy; from memory). These are suggestions for a sizing aid, not a code check.
 */
export function suggestedAllowables(fy: number, compact = false): { tension: number; compression: number; shear: number } {
  return { tension: 0.6 * fy, compression: (compact ? 0.66 : 0.6) * fy, shear: 0.4 * fy };
}

export interface SlendernessLimits {
  outstand: number;
  internal: number;
  web: number;
  stem: number;
}

/**
 * Width-to-thickness limits as the usual tables state them.
 * - "en-1993": EN 1993-1-1 Table 5.2, with ε = √(235/fy): outstand flange in compression
 *   c/t ≤ 14ε (class 3; 9ε class 1, 10ε class 2); internal part in compression c/t ≤ 42ε
 *   (class 3; 33ε, 38ε); web in bending c/t ≤ 124ε (class 3; 72ε, 83ε). For a tee stem the
 *   table's outstand-in-compression 14ε is used (conservative: the stem's stress varies).
 *   Compact (class 2) limits with compact = true. (From memory.)
 * - "aisc-360": AISC 360-16 Table B4.1b (members in flexure), λr for noncompact / λp for
 *   compact, in √(E/Fy): flanges of I-shapes 1.0 / 0.38 (case 10); flanges of boxes (internal)
 *   1.40 / 1.12 (case 17); webs of doubly symmetric I-shapes 5.70 / 3.76 (case 15); stems of
 *   tees 1.52 / 0.84 (case 14). (From memory.)
 * The contract measures outstands as (b − tw)/2 and webs as clear depth over thickness,
 * close to how both tables measure them; the tables' own definitions differ in detail.
 */
export function suggestedSlenderness(fy: number, E: number, rules: SlendernessRules, compact = false): SlendernessLimits {
  if (rules === "en-1993") {
    const eps = Math.sqrt(235 / fy);
    return compact
      ? { outstand: 10 * eps, internal: 38 * eps, web: 83 * eps, stem: 10 * eps }
      : { outstand: 14 * eps, internal: 42 * eps, web: 124 * eps, stem: 14 * eps };
  }
  const r = Math.sqrt(E / fy);
  return compact
    ? { outstand: 0.38 * r, internal: 1.12 * r, web: 3.76 * r, stem: 0.84 * r }
    : { outstand: 1.0 * r, internal: 1.4 * r, web: 5.7 * r, stem: 1.52 * r };
}

/** What a preset writes into the brief form (rounded for display; every field stays editable). */
export interface PresetFill {
  density: number;
  allowable: { tension: number; compression: number; shear: number };
  slenderness: SlendernessLimits;
  /** for the optional deflection check */
  E: number;
}

const round1 = (x: number) => Math.round(x * 10) / 10;

/** What a material must give for a fill: a built-in grade and a team's own material alike. */
export interface MaterialProperties {
  /** MPa */
  E: number;
  /** MPa */
  fy: number;
  /** kg/m³ */
  density: number;
}

/**
 * The slenderness table a team's own material is filled with. AISC 360's limits are written in
 * √(E/Fy), so they follow a material whose E is not steel's; EN 1993-1-1's ε = √(235/fy) has
 * E = 210 000 MPa built in and would give an aluminium the limits of a steel of the same yield.
 */
export const OWN_MATERIAL_RULES: SlendernessRules = "aisc-360";

/**
 * The one derivation behind every preset, built-in or the team's own: allowables from fy
 * (suggestedAllowables, AISC ASD 1989 fractions) and slenderness limits from fy and E
 * (suggestedSlenderness, EN 1993-1-1 Table 5.2 or AISC 360-16 Table B4.1b), rounded to 0.1.
 */
export function materialFill(m: MaterialProperties, options: { compact?: boolean; rules?: SlendernessRules } = {}): PresetFill {
  const a = suggestedAllowables(m.fy, options.compact);
  const s = suggestedSlenderness(m.fy, m.E, options.rules ?? OWN_MATERIAL_RULES, options.compact);
  return {
    density: m.density,
    allowable: { tension: round1(a.tension), compression: round1(a.compression), shear: round1(a.shear) },
    slenderness: { outstand: round1(s.outstand), internal: round1(s.internal), web: round1(s.web), stem: round1(s.stem) },
    E: m.E,
  };
}

export function presetFill(gradeId: string, options: { compact?: boolean; rules?: SlendernessRules } = {}): PresetFill {
  const g = steelGrade(gradeId);
  if (!g) throw new Error(`unknown steel grade "${gradeId}" (one of ${STEEL_GRADES.map((s) => s.id).join(", ")})`);
  return materialFill(g, { compact: options.compact, rules: options.rules ?? g.rules });
}

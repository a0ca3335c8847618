// Structural steel presets and the limits suggested for them. Presets only fill the brief form:
// the user can change every value, and the brief stores the values, never the preset name.
// Sources are named beside each number; "from memory" marks values recalled rather than
// copied from the document in hand.
import { EN1993_DEFAULTS, EN1993_GRADES, type En1993Grade } from "./search-schema";

export type SlendernessRules = "en-1993" | "aisc-360";

/** A yield-strength band: fy holds for plates up to maxThickness (mm). */
export interface FyBand {
  maxThickness: number;
  fy: number;
}

export interface SteelGrade {
  id: string;
  name: string;
  standard: string;
  /** elastic modulus, MPa */
  E: number;
  /** shear modulus, MPa */
  G: number;
  /** yield strength for the thinnest product range, MPa */
  fy: number;
  /** fy by plate thickness; the first band is the one `fy` is taken from */
  fyBands: readonly FyBand[];
  /** tensile strength, MPa */
  fu: number;
  /** fillet-weld correlation factor βw (EN 1993-1-8 Table 4.1); EN grades only */
  betaW?: number;
  /** kg/m³ */
  density: number;
  /** the width-to-thickness table that belongs with this grade's standard */
  rules: SlendernessRules;
  note: string;
  /** where the figures come from, as the comments below name it (shown on the admin materials page) */
  source: string;
}

const EN_SOURCE =
  "EN 10025-2 Table 7 (fy bands for t ≤ 16 / 40 / 63 mm; fu for 3 ≤ t ≤ 100 mm); EN 1993-1-8 Table 4.1 (βw); EN 1993-1-1 §3.2.6 (E, G); EN 1991-1-1 Annex A Table A.4 (density, 78.5 kN/m³); from memory";
const ASTM_SOURCE =
  "ASTM specification minima as tabulated in the AISC Steel Construction Manual, Table 2-3 (Fy, Fu); E = 29 000 ksi, G = 11 200 ksi and 490 lb/ft³ in AISC 360 notation; from memory";

/**
 * The EN grades read their bands, fu and βw from EN1993_GRADES (search-schema.ts), the same
 * table the EN 1993 basis fills a brief's steel from, so a preset and a brief cannot disagree.
 * fu is EN 10025-2's for 3 ≤ t ≤ 100 mm (360 / 410 / 470 MPa), one value over every band,
 * rather than EN 1993-1-1 Table 3.1's 360 / 430 / 510 for t ≤ 40 mm. E = 210 000 MPa and
 * G = 81 000 MPa: EN 1993-1-1 §3.2.6. Density 7850 kg/m³: the unit weight of steel, 78.5 kN/m³,
 * in EN 1991-1-1 Annex A, Table A.4 (a loads standard; the design code's §3.2.6 repeats it).
 */
function enGrade(name: En1993Grade): SteelGrade {
  const g = EN1993_GRADES[name];
  return {
    id: name.toLowerCase(),
    name,
    standard: "EN 10025-2",
    E: EN1993_DEFAULTS.E,
    G: EN1993_DEFAULTS.G,
    fy: g.fy[0].fy,
    fyBands: g.fy,
    fu: g.fu,
    betaW: g.betaW,
    density: 7850,
    rules: "en-1993",
    note: `fy ${g.fy.map((b) => b.fy).join(" / ")} MPa for t ≤ ${g.fy.map((b) => b.maxThickness).join(" / ")} mm`,
    source: EN_SOURCE,
  };
}

// ASTM grades: A36 Fy 36 ksi / Fu 58 ksi (plates to 8 in); A572 Grade 50 Fy 50 ksi / Fu 65 ksi
// (plates to 4 in); A992 Fy 50 ksi / Fu 65 ksi (rolled shapes, no plate band) — the ASTM
// specifications as tabulated in the AISC Steel Construction Manual, Table 2-3; from memory.
// E = 29 000 ksi, G = 11 200 ksi (AISC 360-16 notation) and 490 lb/ft³. ksi × 6.894757 = MPa.
const ASTM = { E: 200000, G: 77200, density: 7850, rules: "aisc-360" as const, source: ASTM_SOURCE };
export const STEEL_GRADES: readonly SteelGrade[] = [
  enGrade("S235"),
  enGrade("S275"),
  enGrade("S355"),
  { id: "a36", name: "ASTM A36", standard: "ASTM A36", fy: 250, fyBands: [{ maxThickness: 203.2, fy: 250 }], fu: 400, note: "36 ksi ≈ 248 MPa; 250 MPa is the usual metric statement", ...ASTM },
  { id: "a572-50", name: "ASTM A572 Gr 50", standard: "ASTM A572", fy: 345, fyBands: [{ maxThickness: 101.6, fy: 345 }], fu: 450, note: "50 ksi", ...ASTM },
  { id: "a992", name: "ASTM A992", standard: "ASTM A992", fy: 345, fyBands: [], fu: 450, note: "50 ksi; rolled wide-flange shapes", ...ASTM },
];

export function steelGrade(id: string): SteelGrade | undefined {
  return STEEL_GRADES.find((g) => g.id === id);
}

/**
 * Allowable stresses by the classic allowable-stress-design fractions of yield (AISC
 * Specification for Structural Steel Buildings, Allowable Stress Design, 1989, §D1 tension
 * Ft = 0.60·Fy; §F1 bending Fb = 0.66·Fy for compact sections, 0.60·Fy otherwise; §F4 shear
 * Fv = 0.40·Fy; from memory). These are suggestions for a sizing aid, not a code check.
 * Fv = 0.40·Fy holds only for stocky webs, h/tw ≤ 380/√Fy (Fy in ksi; STOCKY_WEB_NOTE);
 * allowableShear gives the reduced value for a slender web.
 */
export function suggestedAllowables(fy: number, compact = false): { tension: number; compression: number; shear: number } {
  return { tension: 0.6 * fy, compression: (compact ? 0.66 : 0.6) * fy, shear: 0.4 * fy };
}

const KSI = 6.894757; // MPa per ksi (NIST SP 811)

/** The largest h/tw for which Fv = 0.40·Fy holds: 380/√Fy with Fy in ksi (AISC ASD 1989 §F4, from memory). */
export function stockyWebLimit(fy: number): number {
  return 380 / Math.sqrt(fy / KSI);
}

export const STOCKY_WEB_NOTE =
  "The allowable shear 0.40·fy holds only for stocky webs, h/tw ≤ 380/√Fy (Fy in ksi: 63 for 36 ksi, 54 for 50 ksi); a more slender web needs the reduced value (AISC ASD 1989 §F4).";

/**
 * Allowable shear stress of an unstiffened web of slenderness h/tw (AISC ASD 1989 §F4, from
 * memory): Fv = 0.40·Fy when h/tw ≤ 380/√Fy; otherwise Fv = (Fy/2.89)·Cv ≤ 0.40·Fy with
 * kv = 5.34 (no intermediate stiffeners), Cv = 45 000·kv/(Fy·(h/tw)²) when that is ≤ 0.8, else
 * Cv = (190/(h/tw))·√(kv/Fy) (Fy in ksi inside the formulas). fy and the answer in MPa.
 */
export function allowableShear(fy: number, hOverTw: number): number {
  if (hOverTw <= stockyWebLimit(fy)) return 0.4 * fy;
  const Fy = fy / KSI,
    kv = 5.34;
  let Cv = (45000 * kv) / (Fy * hOverTw * hOverTw);
  if (Cv > 0.8) Cv = (190 / hOverTw) * Math.sqrt(kv / Fy);
  return Math.min(0.4 * fy, (fy / 2.89) * Cv);
}

/**
 * Warnings when a brief's plates fall outside the band a preset's fy was taken from: a plate
 * thicker than the first band has a lower fy than the one the allowables (or the brief) assume,
 * and one beyond the last band has none. Empty when every plate is inside the first band.
 */
export function fyBandWarnings(grade: Pick<SteelGrade, "name" | "fy" | "fyBands">, thicknesses: readonly number[]): string[] {
  const bands = grade.fyBands;
  if (bands.length === 0) return [];
  const out: string[] = [];
  const first = bands[0].maxThickness,
    last = bands[bands.length - 1].maxThickness;
  const over = [...new Set(thicknesses)].filter((t) => t > first).sort((a, b) => a - b);
  const beyond = over.filter((t) => t > last);
  const inside = over.filter((t) => t <= last);
  if (inside.length)
    out.push(
      `${grade.name}: plates of ${inside.join(", ")} mm are thicker than ${first} mm, where fy is lower (${inside
        .map((t) => `${bands.find((b) => t <= b.maxThickness)!.fy} MPa at ${t} mm`)
        .join(", ")}) than the ${grade.fy} MPa the preset's figures use.`,
    );
  if (beyond.length) out.push(`${grade.name}: plates of ${beyond.join(", ")} mm are beyond the last fy band (${last} mm): the preset gives no fy for them.`);
  return out;
}

export interface SlendernessLimits {
  outstand: number;
  internal: number;
  web: number;
  stem: number;
}

/**
 * Width-to-thickness limits as the usual tables state them, for the welded plate sections the
 * search builds. Each of the brief's four kinds covers several elements (outstand: I, channel
 * and tee flanges and angle legs; internal: box flanges and the channel-down's top; web: I,
 * channel and box webs; stem: tee stems and channel-down legs), so each suggestion is the
 * least of the cases it covers (SLENDERNESS_CASES names them).
 * - "en-1993": EN 1993-1-1 Table 5.2, ε = √(235/fy): outstand flanges c/t ≤ 9ε, 10ε, 14ε (class
 *   1, 2, 3; c for welded sections from the web face, as the contract measures it); angle legs
 *   h/t ≤ 15ε (class 3, sheet 3); internal parts in compression 33ε, 38ε, 42ε; webs in bending,
 *   I and box alike, 72ε, 83ε, 124ε; a tee stem as an outstand in compression (conservative).
 *   Class 3 limits, or class 2 with compact = true. (From memory.)
 * - "aisc-360": AISC 360-16 Table B4.1b (members in flexure), λr for noncompact / λp for compact,
 *   in √(E/Fy): flanges of built-up (welded) I-shapes λr = 0.95·√(kc·E/FL) with FL = 0.7·Fy and
 *   kc = 4/√(h/tw) within 0.35…0.76 (case 11; kc = 0.35, its floor, unless the web slenderness is
 *   given), λp 0.38 (case 10/11); legs of single angles 0.91 / 0.54 (case 12); box flanges 1.40 /
 *   1.12 (case 17); webs of I-shapes 5.70 / 3.76 (case 15) and of boxes 5.70 / 2.42 (case 19);
 *   tee stems 1.52 / 0.84 (case 14). (From memory.)
 */
export function suggestedSlenderness(fy: number, E: number, rules: SlendernessRules, compact = false, options: { webSlenderness?: number } = {}): SlendernessLimits {
  if (rules === "en-1993") {
    const eps = Math.sqrt(235 / fy);
    return compact
      ? { outstand: 10 * eps, internal: 38 * eps, web: 83 * eps, stem: 10 * eps }
      : { outstand: Math.min(14, 15) * eps, internal: 42 * eps, web: 124 * eps, stem: 14 * eps };
  }
  const r = Math.sqrt(E / fy);
  if (compact) return { outstand: Math.min(0.38, 0.54) * r, internal: 1.12 * r, web: Math.min(3.76, 2.42) * r, stem: 0.84 * r };
  const hw = options.webSlenderness;
  const kc = hw === undefined ? 0.35 : Math.min(0.76, Math.max(0.35, 4 / Math.sqrt(hw)));
  // 0.95·√(kc·E/(0.7·Fy)) = 0.95·√(kc/0.7)·√(E/Fy)
  const weldedFlange = 0.95 * Math.sqrt(kc / 0.7);
  return { outstand: Math.min(weldedFlange, 0.91) * r, internal: 1.4 * r, web: 5.7 * r, stem: 1.52 * r };
}

/** Which table cases each kind's suggestion is the least of (for the preset's note). */
export const SLENDERNESS_CASES: Record<SlendernessRules, Record<keyof SlendernessLimits, string>> = {
  "en-1993": {
    outstand: "EN 1993-1-1 Table 5.2: outstand flanges (welded) 14ε / 10ε; angle legs 15ε",
    internal: "EN 1993-1-1 Table 5.2: internal parts in compression 42ε / 38ε",
    web: "EN 1993-1-1 Table 5.2: internal parts in bending (I and box webs) 124ε / 83ε",
    stem: "EN 1993-1-1 Table 5.2: outstand in compression 14ε / 10ε (conservative for a tee stem)",
  },
  "aisc-360": {
    outstand: "AISC 360-16 Table B4.1b: built-up I flanges 0.95·√(kc·E/FL) (case 11), angle legs 0.91 / 0.54 (case 12)",
    internal: "AISC 360-16 Table B4.1b: box flanges 1.40 / 1.12 (case 17)",
    web: "AISC 360-16 Table B4.1b: I webs 5.70 / 3.76 (case 15), box webs 5.70 / 2.42 (case 19)",
    stem: "AISC 360-16 Table B4.1b: tee stems 1.52 / 0.84 (case 14)",
  },
};

/** What a preset writes into the brief form (rounded for display; every field stays editable). */
export interface PresetFill {
  density: number;
  /** what the allowable shear assumes (STOCKY_WEB_NOTE) */
  shearNote: string;
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
    shearNote: STOCKY_WEB_NOTE,
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

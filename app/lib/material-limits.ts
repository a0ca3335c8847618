// The ranges a team material must fall in (pure: the admin page shows them as hints, the
// schema in materials.server.ts enforces them).

/**
 * Accepted ranges, tighter than the engine's (density ≤ 1e6 kg/m³, deflection E 1e-3…1e9 MPa)
 * on purpose: a team material is typed once and reused in many briefs, so a unit slip should be
 * refused here rather than copied into every brief it fills. Each range spans real structural
 * materials with room to spare (common practice figures):
 * - E 1 000–1 000 000 MPa: structural plastics (a few GPa) up to tungsten carbide (~700 GPa).
 *   Refuses E typed in GPa (210) or in psi (29 000 000).
 * - fy 1–5 000 MPa: soft alloys up to the strongest wire steels (~2 000–3 000 MPa). At least 1 MPa
 *   also keeps the derived allowables (0.4·fy, rounded to 0.1 MPa) above zero.
 * - density 100–30 000 kg/m³: structural foams and timber up to osmium (~22 600). Refuses
 *   density typed in t/m³ or g/cm³ (7.85).
 */
export const MATERIAL_LIMITS = {
  E: { min: 1_000, max: 1_000_000, unit: "MPa" },
  fy: { min: 1, max: 5_000, unit: "MPa" },
  density: { min: 100, max: 30_000, unit: "kg/m³" },
} as const;
export const MATERIAL_NAME_MAX = 80; // the column's width (materials.name varchar(80))

/** 1000000 → "1 000 000", as the limits are written on the page. */
export function grouped(x: number): string {
  return x.toLocaleString("en", { maximumFractionDigits: 6 }).replace(/,/g, " ");
}

// The section's pieces (plates, root fillets, polygon rings) from the engine's buildShape, in a
// frame whose bounding box starts at (0, 0). One source for the on-screen drawing
// (SectionDrawing) and the SVG file export (section-svg.ts), so both draw what the properties
// were computed from.
import { buildShape, shapeBBox } from "~/optimizer/shape";
import { PLATE_STRIDE } from "~/optimizer/composite";
import type { Fillet } from "~/optimizer/geometry";
import type { SectionInput } from "~/optimizer/schema";

export interface SectionOutline {
  /** every piece in the frame the properties use: bounding box's bottom-left corner at (0, 0), mm */
  plates: { b: number; h: number; z: number; y: number }[];
  fillets: Fillet[];
  rings: { points: [number, number][]; hole: boolean }[];
  width: number;
  depth: number;
}

/** The section's pieces, shifted so the bounding box starts at (0, 0). Throws on invalid input. */
export function sectionOutline(section: SectionInput): SectionOutline {
  const s = buildShape(section);
  const [minZ, maxZ, minY, maxY] = shapeBBox(s);
  const plates = [];
  for (let i = 0; i < s.plateCount * PLATE_STRIDE; i += PLATE_STRIDE) {
    plates.push({ b: s.plates[i]!, h: s.plates[i + 1]!, z: s.plates[i + 2]! - minZ, y: s.plates[i + 3]! - minY });
  }
  const fillets = s.fillets.map((f) => ({ ...f, z: f.z - minZ, y: f.y - minY }));
  const rings = s.rings.map((r) => {
    const points: [number, number][] = [];
    for (let i = 0; i < r.pts.length; i += 2) points.push([r.pts[i]! - minZ, r.pts[i + 1]! - minY]);
    return { points, hole: r.hole };
  });
  return { plates, fillets, rings, width: maxZ - minZ, depth: maxY - minY };
}

/** Fillet spandrel as a closed outline: the re-entrant corner, then the quarter arc. */
export function filletPoints(f: Fillet, steps = 12): [number, number][] {
  const cz = f.z + f.dz * f.r,
    cy = f.y + f.dy * f.r;
  const pts: [number, number][] = [[f.z, f.y]];
  // arc from (cz, f.y) to (f.z, cy) around the centre (cz, cy)
  for (let k = 0; k <= steps; k++) {
    const t = ((Math.PI / 2) * k) / steps;
    pts.push([cz - f.dz * f.r * Math.sin(t), cy - f.dy * f.r * Math.cos(t)]);
  }
  return pts;
}

/**
 * The material as drawing pieces in a caller's coordinates (X, Y map mm to the picture):
 * separate rectangles, one even-odd path, and loose fillet paths.
 */
export function outlinePieces(outline: SectionOutline, X: (z: number) => number, Y: (y: number) => number) {
  const poly = (pts: [number, number][]) => pts.map(([z, y], i) => `${i ? "L" : "M"}${X(z).toFixed(2)},${Y(y).toFixed(2)}`).join("") + "Z";
  // Spandrels cut away (sign −1: a hollow section's outer corners, an angle's rounded toes) are
  // drawn as sub-paths of one even-odd path with what they are cut from, so they show as gaps.
  // A hollow section (rings) puts every corner piece there: those inside its hole come back
  // filled. Otherwise the cut ones go with the plates and root fillets stay separate pieces.
  const hasRings = outline.rings.length > 0;
  const cuts = outline.fillets.some((f) => f.sign === -1);
  const platesInPath = !hasRings && cuts;
  const pathFillets = hasRings ? outline.fillets : outline.fillets.filter((f) => f.sign === -1);
  const looseFillets = hasRings ? [] : outline.fillets.filter((f) => f.sign !== -1);
  const rectPoints = (p: { b: number; h: number; z: number; y: number }): [number, number][] => [
    [p.z, p.y],
    [p.z + p.b, p.y],
    [p.z + p.b, p.y + p.h],
    [p.z, p.y + p.h],
  ];
  const evenOdd = [
    ...outline.rings.map((r) => poly(r.points)),
    ...(platesInPath ? outline.plates.map((p) => poly(rectPoints(p))) : []),
    ...(hasRings || platesInPath ? pathFillets.map((f) => poly(filletPoints(f))) : []),
  ].join("");
  return {
    rects: platesInPath ? [] : outline.plates.map((p) => ({ x: X(p.z), y: Y(p.y + p.h), width: Math.abs(X(p.z + p.b) - X(p.z)), height: Math.abs(Y(p.y) - Y(p.y + p.h)) })),
    evenOdd,
    loose: looseFillets.map((f) => poly(filletPoints(f))),
  };
}

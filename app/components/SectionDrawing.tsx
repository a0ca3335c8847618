// A cross-section drawn to scale from the engine's own geometry (buildShape: the plates, root
// fillets and polygon rings the properties were computed from), with the centroid, the
// horizontal centroidal axis, the inclined neutral axis of an unsymmetric section, and the
// overall dimensions. Pure props: the same drawing serves the bench, the sweep comparison and
// the calculation record.
import { useId } from "react";
import type { SectionProperties } from "~/optimizer/properties";
import type { SectionInput } from "~/optimizer/schema";
import { outlinePieces, sectionOutline, type SectionOutline } from "~/lib/section-outline";
import type { UnitSystem } from "~/optimizer/units";
import { formatQuantity } from "~/components/PropertyTable";

// Kept where other modules have imported them from; the outline itself lives in app/lib so the SVG file export draws the same pieces.
export { sectionOutline, type SectionOutline };

const INK = "var(--color-ink, #1d2733)";
const ACCENT = "var(--color-accent, #0f6e6e)";
const CAUTION = "var(--color-caution, #8a4b00)";

export interface SectionDrawingProps {
  /** the section in SI (mm), any SectionInput form */
  section: SectionInput;
  /** SI properties of the same section: adds the centroid, the axis and the ȳ dimension */
  properties?: SectionProperties | null;
  /** neutral axis angle from z (counter-clockwise), e.g. sectionStresses().neutralAxis.angleDeg; drawn when not horizontal */
  neutralAxisAngleDeg?: number | null;
  units?: UnitSystem;
  /** drawing size in CSS pixels (the SVG scales to its container's width) */
  width?: number;
  height?: number;
  title?: string;
  showDimensions?: boolean;
  className?: string;
}

export function SectionDrawing({
  section,
  properties,
  neutralAxisAngleDeg,
  units = "si",
  width = 420,
  height = 360,
  title = "Cross-section, to scale",
  showDimensions = true,
  className = "",
}: SectionDrawingProps) {
  // one page may carry several drawings (comparison): ids must not collide
  const uid = useId().replace(/[^a-zA-Z0-9_-]/g, "");
  let outline: SectionOutline;
  try {
    outline = sectionOutline(section);
  } catch (e) {
    return (
      <figure className={className} data-testid="section-drawing">
        <div className="flex items-center justify-center rounded border border-dashed border-ink/40 p-8 text-sm text-ink/70" style={{ minHeight: height / 2 }}>
          No drawing: {e instanceof Error ? e.message : "the section is not valid"}
        </div>
      </figure>
    );
  }
  const { width: bw, depth: bh } = outline;
  // Margins leave room for the dimension lines and their labels in screen pixels, so text
  // keeps its size whatever the section's scale.
  const ml = showDimensions ? 70 : 16,
    mr = showDimensions ? 56 : 16,
    mt = 20,
    mb = showDimensions ? 48 : 16;
  const scale = Math.min((width - ml - mr) / bw, (height - mt - mb) / bh);
  const ox = ml + (width - ml - mr - bw * scale) / 2;
  const oy = mt + (height - mt - mb - bh * scale) / 2;
  const X = (z: number) => ox + z * scale;
  const Y = (y: number) => oy + (bh - y) * scale;
  const pieces = outlinePieces(outline, X, Y);

  const c = properties ? { z: properties.centroid.z, y: properties.centroid.y } : null;
  const inclined = c && neutralAxisAngleDeg != null && Number.isFinite(neutralAxisAngleDeg) && Math.abs(neutralAxisAngleDeg) > 1e-6;
  const fmtL = (v: number) => formatQuantity("length", v, units);
  const titleId = `sd-title-${uid}`;
  const arrow = `url(#sd-arrow-${uid})`;

  return (
    <figure className={className} data-testid="section-drawing">
      <svg viewBox={`0 0 ${width} ${height}`} width="100%" role="img" aria-labelledby={titleId} className="max-w-full" style={{ maxWidth: width }}>
        <title id={titleId}>
          {`${title}: ${fmtL(bw)} wide, ${fmtL(bh)} deep${c ? `, centroid ${fmtL(c.y)} above the bottom edge` : ""}`}
        </title>
        <defs>
          <marker id={`sd-arrow-${uid}`} viewBox="0 0 10 10" refX="10" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse">
            <path d="M0,0 L10,5 L0,10 z" fill={INK} />
          </marker>
        </defs>
        {/* material */}
        <g fill={ACCENT} fillOpacity={0.22} stroke={INK} strokeWidth={1.25}>
          {pieces.rects.map((r, i) => (
            <rect key={`p${i}`} {...r} />
          ))}
          {pieces.evenOdd ? <path d={pieces.evenOdd} fillRule="evenodd" /> : null}
        </g>
        {pieces.loose.map((d, i) => (
          <path key={`f${i}`} d={d} fill={ACCENT} fillOpacity={0.22} stroke="none" />
        ))}
        {/* dimensions */}
        {showDimensions ? (
          <g stroke={INK} strokeWidth={0.8} fontSize={12} fill={INK}>
            <line x1={X(0)} y1={Y(0) + 4} x2={X(0)} y2={Y(0) + 30} />
            <line x1={X(bw)} y1={Y(0) + 4} x2={X(bw)} y2={Y(0) + 30} />
            <line x1={X(0)} y1={Y(0) + 24} x2={X(bw)} y2={Y(0) + 24} markerStart={arrow} markerEnd={arrow} />
            <text x={(X(0) + X(bw)) / 2} y={Y(0) + 42} textAnchor="middle" stroke="none" data-testid="dim-width">
              {fmtL(bw)}
            </text>
            <line x1={X(bw) + 4} y1={Y(0)} x2={X(bw) + 30} y2={Y(0)} />
            <line x1={X(bw) + 4} y1={Y(bh)} x2={X(bw) + 30} y2={Y(bh)} />
            <line x1={X(bw) + 24} y1={Y(0)} x2={X(bw) + 24} y2={Y(bh)} markerStart={arrow} markerEnd={arrow} />
            <text
              x={X(bw) + 40}
              y={(Y(0) + Y(bh)) / 2}
              textAnchor="middle"
              stroke="none"
              transform={`rotate(-90 ${X(bw) + 40} ${(Y(0) + Y(bh)) / 2})`}
              data-testid="dim-depth"
            >
              {fmtL(bh)}
            </text>
            {c ? (
              <>
                <line x1={X(0) - 4} y1={Y(0)} x2={X(0) - 30} y2={Y(0)} />
                <line x1={X(0) - 24} y1={Y(0)} x2={X(0) - 24} y2={Y(c.y)} markerStart={arrow} markerEnd={arrow} />
                <text
                  x={X(0) - 32}
                  y={(Y(0) + Y(c.y)) / 2}
                  textAnchor="middle"
                  stroke="none"
                  transform={`rotate(-90 ${X(0) - 32} ${(Y(0) + Y(c.y)) / 2})`}
                >
                  {`ȳ = ${fmtL(c.y)}`}
                </text>
              </>
            ) : null}
          </g>
        ) : null}
        {/* axes and centroid */}
        {c ? (
          <g>
            <line
              x1={X(0) - 28}
              y1={Y(c.y)}
              x2={X(bw) + 14}
              y2={Y(c.y)}
              stroke={ACCENT}
              strokeWidth={1.2}
              strokeDasharray="10 3 2 3"
              data-testid="axis-horizontal"
            />
            {/* Axis labels sit above their axis line and "C" below it, so the two never meet
                whatever the section's width or where its centroid falls. */}
            <text x={X(bw) + 6} y={Y(c.y) - 5} fontSize={12} fill={ACCENT} textAnchor="end" data-testid="axis-label">
              {inclined ? "z" : "N.A."}
            </text>
            {inclined
              ? (() => {
                  const a = (neutralAxisAngleDeg! * Math.PI) / 180;
                  const cx = X(c.z),
                    cyp = Y(c.y);
                  // screen y points down, so the counter-clockwise angle flips sign
                  const ux = Math.cos(a),
                    uy = -Math.sin(a);
                  // as long as the section's diagonal, but kept inside the picture both ways so the label shows
                  const reach = (p: number, u: number, lo: number, hi: number) => (u > 1e-9 ? (hi - p) / u : u < -1e-9 ? (lo - p) / u : Infinity);
                  const L = Math.min(
                    Math.hypot(bw, bh) * scale * 0.6 + 12,
                    reach(cx, ux, 6, width - 6),
                    reach(cx, -ux, 6, width - 6),
                    reach(cyp, uy, 16, height - 6),
                    reach(cyp, -uy, 16, height - 6),
                  );
                  // label the end that is higher on the screen
                  const sgn = uy <= 0 ? 1 : -1;
                  const dx = sgn * ux * L,
                    dy = sgn * uy * L;
                  return (
                    <g data-testid="axis-neutral-inclined">
                      <line x1={cx - dx} y1={cyp - dy} x2={cx + dx} y2={cyp + dy} stroke={CAUTION} strokeWidth={1.4} strokeDasharray="10 3 2 3" />
                      <text x={cx + dx} y={cyp + dy - 4} fontSize={12} fill={CAUTION} textAnchor={dx >= 0 ? "end" : "start"} data-testid="axis-label">
                        {`N.A. ${formatQuantity("angle", neutralAxisAngleDeg!, units)}`}
                      </text>
                    </g>
                  );
                })()
              : null}
            <g data-testid="centroid-marker" transform={`translate(${X(c.z)} ${Y(c.y)})`}>
              <circle r={6} fill="white" stroke={INK} strokeWidth={1.2} />
              {/* the draughtsman's centroid symbol: two opposite quarters filled */}
              <path d="M0,0 L6,0 A6,6 0 0,1 0,6 Z M0,0 L-6,0 A6,6 0 0,1 0,-6 Z" fill={INK} />
              <text x={8} y={18} fontSize={12} fill={INK} data-testid="centroid-label">
                C
              </text>
            </g>
          </g>
        ) : null}
      </svg>
      <figcaption className="mt-1 text-xs text-ink/70">
        {title}. {c ? `Centroid C at z̄ = ${fmtL(c.z)}, ȳ = ${fmtL(c.y)} from the bottom-left corner.` : null}
      </figcaption>
    </figure>
  );
}

export default SectionDrawing;

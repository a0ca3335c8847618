// Normal stress across the depth under a moment (tension +, compression −, as the engine
// contract signs them), with the top and bottom fibre stresses labelled, and optionally the
// shear stress τ(y) = V·Q/(Iz·b). Draws what sectionStresses returned; computes nothing of
// its own beyond placing points. Pure props.
import { useId } from "react";
import type { StressResult } from "~/optimizer/stress";
import type { UnitSystem } from "~/optimizer/units";
import { formatQuantity, formatStress } from "~/components/PropertyTable";

const INK = "var(--color-ink, #1d2733)";
const TENSION = "var(--color-accent, #0f6e6e)";
const COMPRESSION = "var(--color-caution, #8a4b00)";

export interface StressDiagramProps {
  result: Pick<StressResult, "properties" | "fibre" | "shear" | "maxShear">;
  /** the moment that produced result, kN·m (SI), sagging positive: for the caption */
  moment: number;
  /** the shear force, kN (SI); the τ panel is drawn when it is non-zero and showShear is on */
  shearForce?: number;
  units: UnitSystem;
  showShear?: boolean;
  width?: number;
  height?: number;
  className?: string;
}

/** Narrower than this, the shear panel is drawn under the normal-stress panel (px of the drawing's own width). */
export const STACK_BELOW = 560;

export function StressDiagram({
  result,
  moment,
  shearForce = 0,
  units,
  showShear = true,
  width = 520,
  height = 320,
  className = "",
}: StressDiagramProps) {
  const uid = useId().replace(/[^a-zA-Z0-9_-]/g, "");
  const p = result.properties;
  const H = p.extremes.top + p.extremes.bottom;
  const st = result.fibre.top,
    sb = result.fibre.bottom;
  const withShear = showShear && shearForce !== 0 && result.shear.length > 0;
  // Side by side the two panels share the width; below STACK_BELOW each panel would be too
  // narrow for its title and fibre labels (a four-up comparison draws at 260), so the shear
  // panel goes under the normal-stress one and each gets the full width.
  const stacked = withShear && width < STACK_BELOW;
  const panelW = withShear && !stacked ? width / 2 : width;
  const totalH = stacked ? 2 * height : height;
  const mt = 40,
    mb = 40;
  const Hd = height - mt - mb;
  const Yp = (y: number) => mt + ((H - y) / H) * Hd;
  // the shear panel's origin: right of the normal-stress panel, or under it
  const shearDx = stacked ? 0 : panelW;
  const shearDy = stacked ? height : 0;

  // ---- normal stress panel
  const x0 = panelW / 2;
  const smax = Math.max(Math.abs(st), Math.abs(sb));
  const k = smax > 0 ? (panelW / 2 - 24) / smax : 0;
  const pts = (arr: [number, number][]) => arr.map(([x, y]) => `${x.toFixed(2)},${y.toFixed(2)}`).join(" ");
  const shapes: { points: string; fill: string }[] = [];
  let y0: number | null = null;
  if (smax > 0) {
    if (st * sb < 0) {
      // linear between the fibres: zero where the line crosses
      y0 = (H * sb) / (sb - st);
      shapes.push({ points: pts([[x0, Yp(H)], [x0 + st * k, Yp(H)], [x0, Yp(y0)]]), fill: st > 0 ? TENSION : COMPRESSION });
      shapes.push({ points: pts([[x0, Yp(0)], [x0 + sb * k, Yp(0)], [x0, Yp(y0)]]), fill: sb > 0 ? TENSION : COMPRESSION });
    } else {
      shapes.push({ points: pts([[x0, Yp(H)], [x0 + st * k, Yp(H)], [x0 + sb * k, Yp(0)], [x0, Yp(0)]]), fill: st + sb > 0 ? TENSION : COMPRESSION });
    }
  }
  const unsymmetric = p.Iyz !== 0;
  const Mtext = `${formatQuantity("moment", Math.abs(moment), units)}${moment > 0 ? " (sagging)" : moment < 0 ? " (hogging)" : ""}`;

  // ---- shear panel
  let shearPath = "";
  let tauMax = 0,
    tauMaxY = 0;
  const sx0 = shearDx + 16;
  if (withShear) {
    for (const s of result.shear)
      if (Math.abs(s.tau) > Math.abs(tauMax)) {
        tauMax = s.tau;
        tauMaxY = s.y;
      }
    const kt = tauMax !== 0 ? (panelW - 40) / Math.abs(tauMax) : 0;
    const sorted = result.shear; // already sorted by y (stress.ts)
    const first = sorted[0]!,
      last = sorted[sorted.length - 1]!;
    // τ is drawn by magnitude to the right; its sign follows V's and is stated in the caption
    shearPath = pts([[sx0, shearDy + Yp(first.y)], ...sorted.map((s) => [sx0 + Math.abs(s.tau) * kt, shearDy + Yp(s.y)] as [number, number]), [sx0, shearDy + Yp(last.y)]]);
  }
  const titleId = `stress-title-${uid}`;

  return (
    <figure className={className} data-testid="stress-diagram">
      <svg viewBox={`0 0 ${width} ${totalH}`} width="100%" role="img" aria-labelledby={titleId} style={{ maxWidth: width }}>
        <title id={titleId}>
          {`Normal stress across the depth under M = ${Mtext}: top fibre ${formatStress(st, units)}, bottom fibre ${formatStress(sb, units)}` +
            (withShear ? `; shear stress up to ${formatQuantity("stress", Math.abs(tauMax), units)} under V = ${formatQuantity("force", shearForce, units)}` : "")}
        </title>
        <g fontSize={12} fill={INK}>
          <text x={x0} y={14} textAnchor="middle" fontWeight={600}>
            {`σ under M = ${Mtext}`}
          </text>
          {shapes.map((s, i) => (
            <polygon key={i} points={s.points} fill={s.fill} fillOpacity={0.35} stroke={s.fill} strokeWidth={1.2} />
          ))}
          <line x1={x0} y1={Yp(H)} x2={x0} y2={Yp(0)} stroke={INK} strokeWidth={1.2} />
          <line x1={8} y1={Yp(H)} x2={panelW - 8} y2={Yp(H)} stroke={INK} strokeWidth={0.4} strokeDasharray="2 3" />
          <line x1={8} y1={Yp(0)} x2={panelW - 8} y2={Yp(0)} stroke={INK} strokeWidth={0.4} strokeDasharray="2 3" />
          <text x={x0} y={Yp(H) - 8} textAnchor="middle" data-testid="fibre-top" fill={st > 0 ? TENSION : st < 0 ? COMPRESSION : INK}>
            {`top ${formatStress(st, units)}`}
          </text>
          <text x={x0} y={Yp(0) + 18} textAnchor="middle" data-testid="fibre-bottom" fill={sb > 0 ? TENSION : sb < 0 ? COMPRESSION : INK}>
            {`bottom ${formatStress(sb, units)}`}
          </text>
          {y0 !== null && !unsymmetric ? (
            <g>
              <line x1={8} y1={Yp(y0)} x2={panelW - 8} y2={Yp(y0)} stroke={INK} strokeWidth={0.8} strokeDasharray="10 3 2 3" />
              <text x={10} y={Yp(y0) - 4}>
                N.A.
              </text>
            </g>
          ) : null}
          {smax === 0 ? (
            <text x={x0 + 6} y={(Yp(0) + Yp(H)) / 2}>
              no moment
            </text>
          ) : (
            <>
              <text x={panelW - 10} y={height - 4} textAnchor="end" fill={TENSION}>
                tension + →
              </text>
              <text x={10} y={height - 4} fill={COMPRESSION}>
                ← − compression
              </text>
            </>
          )}
        </g>
        {withShear ? (
          <g fontSize={12} fill={INK}>
            <text x={shearDx + panelW / 2} y={shearDy + 14} textAnchor="middle" fontWeight={600}>
              {`τ under V = ${formatQuantity("force", shearForce, units)}`}
            </text>
            <polygon points={shearPath} fill={TENSION} fillOpacity={0.2} stroke={TENSION} strokeWidth={1.2} />
            <line x1={sx0} y1={shearDy + Yp(H)} x2={sx0} y2={shearDy + Yp(0)} stroke={INK} strokeWidth={1.2} />
            <text x={width - 6} y={shearDy + Math.min(Math.max(Yp(tauMaxY) - 6, mt), height - mb)} textAnchor="end" data-testid="tau-max">
              {`τmax = ${formatQuantity("stress", Math.abs(tauMax), units)}`}
            </text>
          </g>
        ) : null}
      </svg>
      <figcaption className="mt-1 text-xs text-ink/70">
        Tension positive, compression negative; a sagging moment compresses the top fibre.
        {unsymmetric
          ? " Unsymmetric section (Iyz ≠ 0): the neutral axis is inclined (see the drawing) and each fibre value is the largest along that fibre; the line between them is indicative."
          : null}
        {withShear
          ? ` Shear stress by the elementary formula V·Q(y)/(Iz·b(y)), drawn by magnitude; largest ${formatQuantity("stress", Math.abs(tauMax), units)} at ${formatQuantity("length", tauMaxY, units)} above the bottom.`
          : null}
      </figcaption>
    </figure>
  );
}

export default StressDiagram;

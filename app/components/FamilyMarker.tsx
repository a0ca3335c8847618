// A family's marker exactly as the trade-off chart draws its points, for the chart itself, its
// legend and the candidate table: one drawing, so a row and its point look alike. With rolled
// (catalogue) sections in a sweep, welded sections are drawn as outlines and rolled ones filled.
import { Symbols } from "recharts";
import { familyStyle, MARKER_AREA } from "~/components/family-style";

/** The flat bar's outline about its centre: a 2:1 rectangle of the marker's area. */
const BAR_W = Math.sqrt(2 * MARKER_AREA);
const BAR_PATH = `M${-BAR_W / 2},${-BAR_W / 4}h${BAR_W}v${BAR_W / 2}h${-BAR_W}z`;

/** The point's paint: filled in the family's colour, or an outline of it. */
export function markerPaint(family: string, outline = false): { fill: string; stroke?: string; strokeWidth?: number } {
  const { colour } = familyStyle(family);
  return outline ? { fill: "#ffffff", stroke: colour, strokeWidth: 1.5 } : { fill: colour };
}

/** One marker at (cx, cy): the chart's points (as its `shape`) and the small markers below. */
export function MarkerSymbol({ family, outline = false, cx = 0, cy = 0 }: { family: string; outline?: boolean; cx?: number; cy?: number }) {
  const { shape } = familyStyle(family);
  const paint = markerPaint(family, outline);
  return (
    <g data-marker={`${shape}${outline ? "-outline" : ""}`} data-family={family}>
      {shape === "bar" ? <path className="recharts-symbols" d={BAR_PATH} transform={`translate(${cx}, ${cy})`} {...paint} /> : <Symbols cx={cx} cy={cy} type={shape} size={MARKER_AREA} {...paint} />}
    </g>
  );
}

export function FamilyMarker({ family, outline = false, className = "" }: { family: string; outline?: boolean; className?: string }) {
  return (
    <svg width={14} height={14} viewBox="0 0 14 14" aria-hidden="true" focusable="false" className={`inline-block align-[-2px] ${className}`}>
      <MarkerSymbol family={family} outline={outline} cx={7} cy={7} />
    </svg>
  );
}

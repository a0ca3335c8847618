// A family's marker exactly as the trade-off chart draws its points, for the chart itself, its
// legend and the candidate table: one drawing, so a row and its point look alike. With rolled
// (catalogue) sections in a sweep, welded sections are drawn as outlines and rolled ones filled.
//
// The outlines are the chart library's own symbols (its Symbols component, after d3-shape's symbol
// types), written out here once per shape instead of being worked out by that component for every
// marker: a sweep page's table drew one per row on the server (issue 9, item 8).
// tests/unit/family-marker.test.ts checks each against the library's drawing.
import { familyStyle, MARKER_AREA, type MarkerShape } from "~/components/family-style";

/** The flat bar's outline about its centre: a 2:1 rectangle of the marker's area. */
const BAR_W = Math.sqrt(2 * MARKER_AREA);
const BAR_PATH = `M${-BAR_W / 2},${-BAR_W / 4}h${BAR_W}v${BAR_W / 2}h${-BAR_W}z`;

const path = (points: [number, number][]) => `M${points.map(([x, y]) => `${x},${y}`).join("L")}Z`;

/** Each shape's outline about its centre, of area `size` (px²), as the chart library draws it. */
export function markerPath(shape: MarkerShape, size = MARKER_AREA): string {
  switch (shape) {
    case "circle": {
      const r = Math.sqrt(size / Math.PI);
      return `M${r},0A${r},${r},0,1,1,${-r},0A${r},${r},0,1,1,${r},0`;
    }
    case "square": {
      const w = Math.sqrt(size),
        x = -w / 2;
      return `M${x},${x}h${w}v${w}h${-w}Z`;
    }
    case "triangle": {
      const sqrt3 = Math.sqrt(3),
        y = -Math.sqrt(size / (sqrt3 * 3));
      return path([
        [0, y * 2],
        [-sqrt3 * y, -y],
        [sqrt3 * y, -y],
      ]);
    }
    case "diamond": {
      const tan30 = Math.sqrt(1 / 3),
        y = Math.sqrt(size / (tan30 * 2)),
        x = y * tan30;
      return path([
        [0, -y],
        [x, 0],
        [0, y],
        [-x, 0],
      ]);
    }
    case "cross": {
      const r = Math.sqrt(size / 5) / 2;
      return path([
        [-3 * r, -r],
        [-r, -r],
        [-r, -3 * r],
        [r, -3 * r],
        [r, -r],
        [3 * r, -r],
        [3 * r, r],
        [r, r],
        [r, 3 * r],
        [-r, 3 * r],
        [-r, r],
        [-3 * r, r],
      ]);
    }
    case "star": {
      const ka = 0.8908130915292852,
        kr = Math.sin(Math.PI / 10) / Math.sin((7 * Math.PI) / 10),
        kx = Math.sin((2 * Math.PI) / 10) * kr,
        ky = -Math.cos((2 * Math.PI) / 10) * kr;
      const r = Math.sqrt(size * ka),
        x = kx * r,
        y = ky * r;
      const pts: [number, number][] = [
        [0, -r],
        [x, y],
      ];
      for (let i = 1; i < 5; ++i) {
        const a = (2 * Math.PI * i) / 5,
          c = Math.cos(a),
          s = Math.sin(a);
        pts.push([s * r, -c * r], [c * x - s * y, s * x + c * y]);
      }
      return path(pts);
    }
    case "wye": {
      const c = -0.5,
        s = Math.sqrt(3) / 2,
        k = 1 / Math.sqrt(12),
        a = (k / 2 + 1) * 3;
      const r = Math.sqrt(size / a),
        x0 = r / 2,
        y0 = r * k,
        x1 = x0,
        y1 = r * k + r,
        x2 = -x1,
        y2 = y1;
      return path([
        [x0, y0],
        [x1, y1],
        [x2, y2],
        [c * x0 - s * y0, s * x0 + c * y0],
        [c * x1 - s * y1, s * x1 + c * y1],
        [c * x2 - s * y2, s * x2 + c * y2],
        [c * x0 + s * y0, c * y0 - s * x0],
        [c * x1 + s * y1, c * y1 - s * x1],
        [c * x2 + s * y2, c * y2 - s * x2],
      ]);
    }
    case "bar":
      return BAR_PATH;
  }
}

const PATHS = new Map<MarkerShape, string>();
const pathOf = (shape: MarkerShape) => {
  let d = PATHS.get(shape);
  if (d === undefined) PATHS.set(shape, (d = markerPath(shape)));
  return d;
};

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
      <path className="recharts-symbols" d={pathOf(shape)} transform={`translate(${cx}, ${cy})`} {...paint} />
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

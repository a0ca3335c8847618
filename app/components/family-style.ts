// One colour and one marker per family: our own palette, and never colour alone, so a reader who
// cannot tell the colours apart still tells the families apart by the marker's shape.
import type { Family } from "~/optimizer/geometry";

/** The chart library's seven symbols, and our own flat bar (a rectangle section seen end on) for the eighth family. */
export type MarkerShape = "circle" | "square" | "triangle" | "diamond" | "cross" | "star" | "wye" | "bar";

export interface FamilyStyle {
  colour: string;
  shape: MarkerShape;
}

export const FAMILY_STYLE: Record<Family, FamilyStyle> = {
  channel: { colour: "#0f6e6e", shape: "circle" },
  i: { colour: "#b5542d", shape: "square" },
  "mono-i": { colour: "#3f4fa0", shape: "diamond" },
  tee: { colour: "#6b7a1f", shape: "triangle" },
  box: { colour: "#8a3b7a", shape: "cross" },
  "channel-down": { colour: "#4a5866", shape: "star" },
  angle: { colour: "#a87b12", shape: "wye" },
  rectangle: { colour: "#9c2f2f", shape: "bar" },
};

/** A family outside the table (a catalogue's own shape names): ink squares. */
export const OTHER_STYLE: FamilyStyle = { colour: "#1d2733", shape: "square" };

export function familyStyle(family: string): FamilyStyle {
  return FAMILY_STYLE[family as Family] ?? OTHER_STYLE;
}

/** The marker's area in px² (the chart library's default point size), shared by the chart, its legend and the table. */
export const MARKER_AREA = 64;

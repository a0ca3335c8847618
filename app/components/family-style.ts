// One colour and one marker shape per family: our own palette, and never colour alone, so a
// reader who cannot tell the colours apart still tells the families apart by shape.
import type { Family } from "~/optimizer/geometry";

export const FAMILY_STYLE: Record<Family, { colour: string; shape: "circle" | "square" | "triangle" | "diamond" | "cross" | "star" | "wye" }> = {
  channel: { colour: "#0f6e6e", shape: "circle" },
  i: { colour: "#b5542d", shape: "square" },
  "mono-i": { colour: "#3f4fa0", shape: "diamond" },
  tee: { colour: "#6b7a1f", shape: "triangle" },
  box: { colour: "#8a3b7a", shape: "cross" },
  "channel-down": { colour: "#4a5866", shape: "star" },
  angle: { colour: "#a87b12", shape: "wye" },
  rectangle: { colour: "#9c2f2f", shape: "circle" },
};

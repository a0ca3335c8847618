// The table's and chart's markers are written out once per shape (FamilyMarker.tsx) instead of being
// drawn by the chart library's Symbols component each time: each must be the library's own outline.
import { describe, expect, test } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { Symbols } from "recharts";
import { MarkerSymbol, markerPath } from "~/components/FamilyMarker";
import { FAMILY_STYLE, MARKER_AREA, type MarkerShape } from "~/components/family-style";

const numbers = (d: string) => (d.match(/-?\d+(\.\d+)?(e-?\d+)?/g) ?? []).map(Number);
const letters = (d: string) => d.replace(/[^A-Za-z]/g, "").toUpperCase();
const libraryPath = (shape: Exclude<MarkerShape, "bar">) => {
  const html = renderToStaticMarkup(createElement("svg", null, createElement(Symbols, { cx: 0, cy: 0, type: shape, size: MARKER_AREA })));
  return /\sd="([^"]+)"/.exec(html)![1]!;
};

describe("marker outlines", () => {
  for (const shape of ["circle", "square", "triangle", "diamond", "cross", "star", "wye"] as const) {
    test(`${shape}: the chart library's outline of the same area`, () => {
      const ours = markerPath(shape),
        theirs = libraryPath(shape);
      expect(letters(ours)).toBe(letters(theirs));
      const a = numbers(ours),
        b = numbers(theirs);
      expect(a.length).toBe(b.length);
      a.forEach((x, i) => expect(x).toBeCloseTo(b[i]!, 9));
    });
  }

  test("every family's marker draws its shape's outline, centred where asked", () => {
    for (const [family, { shape }] of Object.entries(FAMILY_STYLE)) {
      const html = renderToStaticMarkup(createElement("svg", null, createElement(MarkerSymbol, { family, cx: 7, cy: 7 })));
      expect(html).toContain(`d="${markerPath(shape)}"`);
      expect(html).toContain('transform="translate(7, 7)"');
      expect(html).toContain(`data-marker="${shape}"`);
    }
  });
});

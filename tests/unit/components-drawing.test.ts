// The bench's drawing, stress diagram and property table, rendered to HTML on the server
// (react-dom/server): cheap checks that they show what the engine computed, with units.
import { describe, expect, test } from "vitest";
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { SectionDrawing, sectionOutline } from "~/components/SectionDrawing";
import { StressDiagram } from "~/components/StressDiagram";
import { PROPERTY_ROWS, PropertyTable, formatNumber, formatStress } from "~/components/PropertyTable";
import { PROPERTY_QUANTITIES, sectionProperties, sectionStresses, type SectionInput } from "~/optimizer";

const I400: SectionInput = { family: "i", d: 400, b: 200, tf: 16, tw: 10 };
// Doubly symmetric I, closed form Iz = [b·d³ − (b − tw)(d − 2tf)³]/12 (Gere & Goodno, 7th ed., Mechanics
// of Materials, composite areas); fibre stress σ = M·c/I with c = d/2 (the flexure formula).
const IZ_I400 = (200 * 400 ** 3 - 190 * 368 ** 3) / 12;

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&amp;/g, "&").replace(/\s+/g, " ");

describe("SectionDrawing", () => {
  test("an I is drawn with its centroid marker at mid-depth and its overall dimensions in mm", () => {
    const p = sectionProperties(I400);
    const html = renderToString(createElement(SectionDrawing, { section: I400, properties: p, units: "si", width: 400, height: 400 }));
    expect(html).toContain('data-testid="centroid-marker"');
    expect(html).toContain('data-testid="axis-horizontal"');
    expect(html).not.toContain("axis-neutral-inclined");
    expect(text(html)).toContain("400 mm");
    expect(text(html)).toContain("200 mm");
    expect(text(html)).toContain("ȳ = 200 mm");
    // three plates, drawn as rects
    expect(html.match(/<rect /g)?.length).toBe(3);
    // marker centred between the flanges: translate(x y) with y halfway between top and bottom plate edges
    const m = /translate\(([\d.]+) ([\d.]+)\)/.exec(html)!;
    const ys = [...html.matchAll(/<rect x="[\d.]+" y="([\d.]+)" width="[\d.]+" height="([\d.]+)"/g)].map((r) => [Number(r[1]), Number(r[2])]);
    const top = Math.min(...ys.map(([y]) => y)), bottom = Math.max(...ys.map(([y, h]) => y + h));
    expect(Number(m[2])).toBeCloseTo((top + bottom) / 2, 6);
  });

  test("US customary labels convert the lengths (400 mm = 15.75 in, 25.4 mm per inch, NIST SP 811)", () => {
    const p = sectionProperties(I400);
    const html = text(renderToString(createElement(SectionDrawing, { section: I400, properties: p, units: "us" })));
    expect(html).toContain("15.75 in");
    expect(html).toContain("7.874 in");
    expect(html).not.toContain("mm");
  });

  test("an angle under a moment draws the inclined neutral axis; rolled fillets and polygon holes are drawn", () => {
    const angle: SectionInput = { family: "angle", d: 100, b: 75, t: 10 };
    const s = sectionStresses(angle, { Mz: 5 });
    const html = renderToString(
      createElement(SectionDrawing, { section: angle, properties: s.properties, neutralAxisAngleDeg: s.neutralAxis!.angleDeg }),
    );
    expect(html).toContain("axis-neutral-inclined");
    const rolled = sectionOutline({ family: "i", d: 300, b: 150, tf: 10.7, tw: 7.1, r: 15 });
    expect(rolled.fillets).toHaveLength(4);
    const tube: SectionInput = {
      polygons: [
        { points: [[10, 10], [110, 10], [110, 60], [10, 60]], hole: false },
        { points: [[20, 20], [100, 20], [100, 50], [20, 50]], hole: true },
      ],
    };
    const o = sectionOutline(tube);
    // shifted to the bounding box's corner, the frame the centroid is given in
    expect(o.rings[0]!.points[0]).toEqual([0, 0]);
    expect(o.width).toBe(100);
    expect(renderToString(createElement(SectionDrawing, { section: tube }))).toContain('fill-rule="evenodd"');
  });

  test("a hollow section's rounded corners go into the rings' even-odd path (cut from the outer ring, added back in the hole)", () => {
    const html = renderToString(createElement(SectionDrawing, { section: { family: "rhs", d: 200, b: 100, t: 10, ro: 15, ri: 10 } as SectionInput }));
    const paths = [...html.matchAll(/<path d="([^"]+)"[^>]*fill-rule="evenodd"/g)];
    expect(paths).toHaveLength(1);
    // two rings and eight spandrels, each its own closed sub-path
    expect(paths[0]![1]!.split("Z").filter(Boolean)).toHaveLength(10);
  });

  test("an angle's rounded toes are cut from its legs in one even-odd path; its root fillet is drawn on its own", () => {
    const html = renderToString(createElement(SectionDrawing, { section: { family: "angle", d: 100, b: 100, t: 10, r: 12, rt: 6 } as SectionInput }));
    const paths = [...html.matchAll(/<path d="([^"]+)"[^>]*fill-rule="evenodd"/g)];
    expect(paths).toHaveLength(1);
    // two leg rectangles and two toe spandrels
    expect(paths[0]![1]!.split("Z").filter(Boolean)).toHaveLength(4);
    expect(html).not.toContain("<rect x=");
  });

  test("the centroid's \"C\" never overlaps an axis label (N.A., z or the inclined N.A.), narrow or wide, symmetric or not", () => {
    // Text boxes from the SVG's own coordinates, generously sized: each character at most 0.7 of the
    // font size wide, the glyphs from a font size above the baseline to a quarter below it.
    type Box = { x0: number; x1: number; y0: number; y1: number };
    const box = (x: number, y: number, anchor: string, chars: number, font: number): Box => {
      const w = chars * 0.7 * font;
      const x0 = anchor === "end" ? x - w : anchor === "middle" ? x - w / 2 : x;
      return { x0, x1: x0 + w, y0: y - font, y1: y + 0.25 * font };
    };
    const overlap = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;
    const cases: { section: SectionInput; M?: number }[] = [
      { section: { family: "rectangle", b: 20, d: 200 } },
      { section: { family: "rectangle", b: 200, d: 20 } },
      { section: I400 },
      { section: { family: "tee", d: 200, b: 30, tf: 10, tw: 8 } },
      { section: { family: "channel", d: 300, b: 90, tf: 12, tw: 8 } },
      { section: { family: "angle", d: 100, b: 75, t: 10 }, M: 5 },
      { section: { family: "angle", d: 150, b: 20, t: 6 }, M: 5 },
    ];
    for (const { section, M } of cases) {
      for (const [width, height, showDimensions] of [[400, 400, true], [240, 240, true], [240, 160, false]] as const) {
        const s = M ? sectionStresses(section, { Mz: M }) : null;
        const properties = s ? s.properties : sectionProperties(section);
        const html = renderToString(
          createElement(SectionDrawing, { section, properties, width, height, showDimensions, neutralAxisAngleDeg: s?.neutralAxis?.angleDeg }),
        );
        const [, tx, ty] = /data-testid="centroid-marker" transform="translate\(([-\d.e]+) ([-\d.e]+)\)"/.exec(html)!.map(Number);
        const cm = /<text x="([-\d.e]+)" y="([-\d.e]+)" font-size="(\d+)"[^>]*data-testid="centroid-label"[^>]*>([^<]*)<\/text>/.exec(html)!;
        const cBox = box(tx + Number(cm[1]), ty + Number(cm[2]), "start", cm[4].trim().length, Number(cm[3]));
        const labels = [...html.matchAll(/<text x="([-\d.e]+)" y="([-\d.e]+)" font-size="(\d+)"[^>]*text-anchor="(\w+)"[^>]*data-testid="axis-label"[^>]*>([^<]*)<\/text>/g)];
        expect(labels.length, `${JSON.stringify(section)} ${width}×${height}`).toBe(M ? 2 : 1);
        for (const l of labels) {
          const aBox = box(Number(l[1]), Number(l[2]), l[4], l[5].trim().length, Number(l[3]));
          expect(overlap(cBox, aBox), `"C" and "${l[5]}" of ${JSON.stringify(section)} at ${width}×${height}`).toBe(false);
        }
      }
    }
  });

  test("an invalid section renders a message, not an exception", () => {
    const html = text(renderToString(createElement(SectionDrawing, { section: { family: "i", d: 10, b: 100, tf: 6, tw: 5 } })));
    expect(html).toContain("No drawing");
    expect(html).toContain("d must exceed 2·tf");
  });
});

describe("StressDiagram", () => {
  test("labels the fibre stresses of a sagging moment with sign and unit (σ = M·c/I)", () => {
    const s = sectionStresses(I400, { Mz: 150, V: 200 });
    const sigma = (150e6 * 200) / IZ_I400; // N·mm × mm / mm⁴ = MPa
    expect(s.fibre.top).toBeCloseTo(-sigma, 6);
    const html = text(renderToString(createElement(StressDiagram, { result: s, moment: 150, shearForce: 200, units: "si" })));
    expect(html).toContain(`top ${formatStress(-sigma, "si")}`);
    expect(html).toContain(`bottom +${formatNumber(sigma)} MPa (tension)`);
    expect(html).toContain("(compression)");
    expect(html).toContain("150 kN·m (sagging)");
    expect(html).toContain("τmax =");
    expect(html).toMatch(/N\.A\./);
  });

  test("in US units the stresses read in ksi (1 ksi = 6.894757 MPa, NIST SP 811)", () => {
    const s = sectionStresses(I400, { Mz: 150 });
    const html = text(renderToString(createElement(StressDiagram, { result: s, moment: 150, units: "us" })));
    const ksi = (150e6 * 200) / IZ_I400 / 6.894757293168361;
    expect(html).toContain(`−${formatNumber(ksi)} ksi (compression)`);
    expect(html).toContain("kip·ft");
    expect(html).not.toContain("τmax"); // no shear given
  });
});

describe("PropertyTable", () => {
  test("has a row for every SectionProperties quantity the units module knows, and no other", () => {
    expect(PROPERTY_ROWS.map((r) => r.key).sort()).toEqual(Object.keys(PROPERTY_QUANTITIES).sort());
  });

  test("shows values with units in SI and in US customary", () => {
    const p = sectionProperties(I400);
    const si = text(renderToString(createElement(PropertyTable, { properties: p, units: "si" })));
    expect(si).toContain(`${formatNumber(IZ_I400)} mm⁴`);
    expect(si).toContain("kg/m");
    expect(si).toContain("open thin-walled");
    const us = text(renderToString(createElement(PropertyTable, { properties: p, units: "us" })));
    expect(us).toContain(`${formatNumber(IZ_I400 / 25.4 ** 4)} in⁴`);
    expect(us).toContain("lb/ft");
    expect(us).not.toMatch(/\bmm/); // a unit, not the "mm" inside "symmetry"
  });

  test("formatNumber: four significant figures, true minus, powers of ten, never NaN", () => {
    expect(formatNumber(1234.567)).toBe("1,235");
    expect(formatNumber(-0.012345)).toBe("−0.01235");
    expect(formatNumber(2.3456e8)).toBe("2.346 × 10⁸");
    expect(formatNumber(9.99951e7)).toBe("1.000 × 10⁸");
    expect(formatNumber(Number.NaN)).toBe("—");
    expect(formatNumber(0)).toBe("0");
  });
});

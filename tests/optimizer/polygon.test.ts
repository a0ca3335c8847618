import { describe, expect, it } from "vitest";
import fc from "fast-check";
import Flatten from "@flatten-js/core";
import { sectionProperties } from "~/optimizer/index";
import { pointInRing, ringAbove, ringDefect, ringInside, ringsOverlap, ringWidth } from "~/optimizer/polygon";

const { Polygon, point, BooleanOperations, Box } = Flatten;

/** Star-shaped polygon about (cx, cy): evenly spread angles with jitter (gaps < 90°), radii in [r0, r1]. */
function star(n: number, jit: number[], rad: number[], cx: number, cy: number, r0: number, r1: number): [number, number][] {
  return Array.from({ length: n }, (_, k) => {
    const th = ((k + 0.4 * jit[k]) / n) * 2 * Math.PI;
    const r = r0 + (r1 - r0) * rad[k];
    return [cx + r * Math.cos(th), cy + r * Math.sin(th)] as [number, number];
  });
}

const arbPoly = fc
  .record({
    n: fc.integer({ min: 5, max: 50 }),
    seed: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 200, maxLength: 200 }),
    cx: fc.double({ min: -500, max: 500, noNaN: true }),
    cy: fc.double({ min: -500, max: 500, noNaN: true }),
    withHole: fc.boolean(),
    reverse: fc.boolean(),
  })
  .map(({ n, seed, cx, cy, withHole, reverse }) => {
    const outer = star(n, seed.slice(0, 50), seed.slice(50, 100), cx, cy, 100, 200);
    // hole radii ≤ 50: inside the outer star, which contains the disc of radius 100·cos(45°) about (cx, cy)
    const hole = star(6, seed.slice(100, 106), seed.slice(150, 156), cx, cy, 20, 50);
    if (reverse) outer.reverse();
    return { outer, hole: withHole ? hole : null };
  });

function flattenPolygon(outer: [number, number][], hole: [number, number][] | null) {
  // flatten-js's boolean operations want the outer face ORIENTATION.CCW and holes the reverse
  const p = new Polygon();
  const o = p.addFace(outer.map(([z, y]) => point(z, y)));
  if (o.orientation() !== Flatten.ORIENTATION.CCW) o.reverse();
  if (hole) {
    const f = p.addFace(hole.map(([z, y]) => point(z, y)));
    if (f.orientation() !== Flatten.ORIENTATION.CW) f.reverse();
  }
  return p;
}

describe("polygon area and centroid against @flatten-js/core (independent 2D geometry package)", () => {
  it("area: flatten-js Polygon.area() (its own shoelace over faces, holes by orientation)", () => {
    fc.assert(
      fc.property(arbPoly, ({ outer, hole }) => {
        const polygons = [{ points: outer, hole: false }, ...(hole ? [{ points: hole, hole: true }] : [])];
        const ours = sectionProperties({ polygons }).area;
        const theirs = flattenPolygon(outer, hole).area();
        expect(Math.abs(ours - theirs) / theirs).toBeLessThan(1e-12);
      }),
      { numRuns: 60 },
    );
  });

  it("centroid height: ȳ = y_min + (1/A)·∫ area(y ≥ c) dc, with the areas from flatten-js boolean intersection (Gauss–Legendre per band between vertex heights: exact for the quadratic area function)", () => {
    fc.assert(
      fc.property(arbPoly, ({ outer, hole }) => {
        const polygons = [{ points: outer, hole: false }, ...(hole ? [{ points: hole, hole: true }] : [])];
        const p = sectionProperties({ polygons });
        const fp = flattenPolygon(outer, hole);
        const ys = [...new Set([...outer, ...(hole ?? [])].map(([, y]) => y))].sort((a, b) => a - b);
        const zs = outer.map(([z]) => z);
        const zmin = Math.min(...zs) - 1, zmax = Math.max(...zs) + 1, ytop = ys[ys.length - 1] + 1;
        const above = (c: number) => BooleanOperations.intersect(fp, new Polygon(new Box(zmin, c, zmax, ytop))).area();
        let integral = 0;
        for (let i = 0; i + 1 < ys.length; i++) {
          const a = ys[i], b = ys[i + 1];
          // 2-point Gauss–Legendre: exact for cubics, and never cuts exactly through a vertex
          const m = (a + b) / 2, h = (b - a) / 2, g = h / Math.sqrt(3);
          integral += h * (above(m - g) + above(m + g));
        }
        const A = fp.area();
        // p.centroid.y is measured from the bounding box's bottom (contract)
        expect(Math.abs(p.centroid.y - integral / A)).toBeLessThan(1e-6 * (ys[ys.length - 1] - ys[0]));
      }),
      // each run does ~100 boolean intersections in flatten-js: few runs, no long shrinking
      { numRuns: 8, endOnFailure: true },
    );
  }, 60_000);
});

describe("ring helpers", () => {
  const sq = new Float64Array([0, 0, 10, 0, 10, 10, 0, 10]);
  const tri = new Float64Array([0, 0, 10, 0, 0, 10]);
  it("pointInRing: inside, boundary, outside", () => {
    expect(pointInRing(sq, 5, 5)).toBe(1);
    expect(pointInRing(sq, 10, 3)).toBe(0);
    expect(pointInRing(sq, 0, 0)).toBe(0);
    expect(pointInRing(sq, 11, 5)).toBe(-1);
  });
  it("ringWidth: just above / just below a vertex height (triangle apex and base)", () => {
    expect(ringWidth(tri, 0, 1, true)).toBe(10);
    expect(ringWidth(tri, 0, -1, true)).toBe(0);
    expect(ringWidth(tri, 10, -1, true)).toBeCloseTo(0, 12);
    expect(ringWidth(tri, 4, 1, true)).toBeCloseTo(6, 12);
    const sqCW = new Float64Array([0, 0, 0, 10, 10, 10, 10, 0]);
    expect(ringWidth(sqCW, 5, 1, false)).toBe(10);
  });
  it("ringAbove: half a square", () => {
    const o = new Float64Array(2);
    ringAbove(sq, 5, 0, o);
    expect(o[0]).toBeCloseTo(50, 12);
    expect(o[1]).toBeCloseTo(50 * 7.5, 10);
    ringAbove(sq, -3, 0, o);
    expect(o[0]).toBeCloseTo(100, 12);
    ringAbove(sq, 12, 0, o);
    expect(o[0]).toBe(0);
  });
  it("ringDefect: bow-tie, touching vertex, repeated point, too few points", () => {
    expect(ringDefect(new Float64Array([0, 0, 10, 10, 10, 0, 0, 10]))).toMatch(/self-intersects/);
    // a vertex touching a non-adjacent edge
    expect(ringDefect(new Float64Array([0, 0, 10, 0, 10, 10, 5, 0, 0, 10]))).toMatch(/self-intersects/);
    expect(ringDefect(new Float64Array([0, 0, 0, 0, 10, 0, 0, 10]))).toMatch(/repeats/);
    expect(ringDefect(new Float64Array([0, 0, 10, 0]))).toMatch(/at least 3/);
    expect(ringDefect(sq)).toBeNull();
  });
  it("ringInside / ringsOverlap", () => {
    const inner = new Float64Array([2, 2, 4, 2, 4, 4, 2, 4]);
    const touching = new Float64Array([0, 0, 4, 0, 4, 4]);
    const beside = new Float64Array([10, 0, 20, 0, 20, 10, 10, 10]);
    const crossing = new Float64Array([5, 5, 15, 5, 15, 15, 5, 15]);
    expect(ringInside(inner, sq)).toBe(true);
    expect(ringInside(touching, sq)).toBe(true);
    expect(ringInside(crossing, sq)).toBe(false);
    expect(ringsOverlap(beside, sq)).toBe(false);
    expect(ringsOverlap(crossing, sq)).toBe(true);
    expect(ringsOverlap(inner, sq)).toBe(true);
    expect(ringsOverlap(sq.slice(), sq)).toBe(true);
  });
  it("a polygon given closed (last point repeating the first) is accepted", () => {
    const p = sectionProperties({ polygons: [{ points: [[0, 0], [10, 0], [10, 10], [0, 10], [0, 0]] }] });
    expect(p.area).toBe(100);
  });
});

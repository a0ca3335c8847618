// The sweeps in polygon.ts (issue 9: an 8,000-point outline held the server for seconds) must
// answer exactly as the plain all-pairs loops they replaced. The loops are kept here as the
// reference, written the obvious way over the same exported predicates; random rings on a
// small integer lattice are full of the cases that matter (collinear edges, a vertex on an
// edge, folds, repeated outlines, shared corners).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { pointInRing, ringDefect, ringInside, ringSignedArea, ringsOverlap, segmentsCross, segmentsTouch } from "~/optimizer/polygon";
import { MAX_SECTION_POINTS, MAX_SECTION_POLYGONS, findInputViolation } from "~/optimizer/validate";
import { sectionInputSchema } from "~/optimizer/schema";

function orient(az: number, ay: number, bz: number, by: number, cz: number, cy: number): number {
  return (bz - az) * (cy - ay) - (by - ay) * (cz - az);
}

function refDefect(r: Float64Array): string | null {
  const n = r.length / 2;
  if (n < 3) return "needs at least 3 points";
  const nx = (i: number) => (i + 1 === n ? 0 : i + 1);
  for (let i = 0; i < n; i++) {
    const j = nx(i);
    if (r[2 * i] === r[2 * j] && r[2 * i + 1] === r[2 * j + 1]) return `points[${i}] repeats points[${j}]`;
  }
  for (let i = 0; i < n; i++) {
    const i1 = nx(i);
    const az = r[2 * i], ay = r[2 * i + 1], bz = r[2 * i1], by = r[2 * i1 + 1];
    for (let k = i + 1; k < n; k++) {
      const k1 = nx(k);
      const cz = r[2 * k], cy = r[2 * k + 1], dz = r[2 * k1], dy = r[2 * k1 + 1];
      if (k === i + 1 || (i === 0 && k === n - 1)) {
        const [sz, sy, pz, py, qz, qy] = k === i + 1 ? [bz, by, az, ay, dz, dy] : [az, ay, bz, by, cz, cy];
        if (orient(sz, sy, pz, py, qz, qy) === 0 && (pz - sz) * (qz - sz) + (py - sy) * (qy - sy) > 0) return `edges ${i} and ${k} fold back on each other`;
      } else if (segmentsTouch(az, ay, bz, by, cz, cy, dz, dy)) return `self-intersects (edges ${i} and ${k})`;
    }
  }
  if (ringSignedArea(r) === 0) return "has zero area";
  return null;
}

function refProbe(a: Float64Array, b: Float64Array): [boolean, boolean, boolean] {
  let inside = false, outside = false, allOn = true;
  for (let i = 0; i < a.length; i += 2) {
    const j = i + 2 === a.length ? 0 : i + 2;
    for (const [z, y] of [[a[i], a[i + 1]], [0.5 * (a[i] + a[j]), 0.5 * (a[i + 1] + a[j + 1])]]) {
      const w = pointInRing(b, z, y);
      if (w > 0) inside = true;
      if (w < 0) outside = true;
      if (w !== 0) allOn = false;
    }
  }
  return [inside, outside, allOn];
}

function refCrossing(a: Float64Array, b: Float64Array): boolean {
  for (let i = 0; i < a.length; i += 2) {
    const i1 = i + 2 === a.length ? 0 : i + 2;
    for (let k = 0; k < b.length; k += 2) {
      const k1 = k + 2 === b.length ? 0 : k + 2;
      if (segmentsCross(a[i], a[i + 1], a[i1], a[i1 + 1], b[k], b[k + 1], b[k1], b[k1 + 1])) return true;
    }
  }
  return false;
}

const refInside = (inner: Float64Array, outer: Float64Array) => !refCrossing(inner, outer) && !refProbe(inner, outer)[1];
const refOverlap = (a: Float64Array, b: Float64Array) => refCrossing(a, b) || refProbe(a, b)[0] || refProbe(b, a)[0] || refProbe(a, b)[2];

/** Rings on a small lattice (degenerate on purpose), optionally scaled off the lattice. */
const lattice = (maxN: number) =>
  fc
    .record({ pts: fc.array(fc.tuple(fc.integer({ min: 0, max: 6 }), fc.integer({ min: 0, max: 6 })), { minLength: 3, maxLength: maxN }), scale: fc.constantFrom(1, 0.1, 1e6) })
    .map(({ pts, scale }) => Float64Array.from(pts.flatMap(([z, y]) => [z * scale, y * scale])));

/** A star (simple when the radii stay positive), for rings that pass the defect test. */
const starRing = fc
  .record({ n: fc.integer({ min: 3, max: 40 }), rad: fc.array(fc.integer({ min: 1, max: 4 }), { minLength: 40, maxLength: 40 }), cz: fc.integer({ min: -4, max: 4 }), cy: fc.integer({ min: -4, max: 4 }) })
  .map(({ n, rad, cz, cy }) => Float64Array.from(Array.from({ length: n }, (_, k) => [cz + rad[k] * Math.cos((2 * Math.PI * k) / n), cy + rad[k] * Math.sin((2 * Math.PI * k) / n)]).flat()));

describe("polygon sweeps equal the all-pairs loops", () => {
  it("ringDefect: the same first defect, word for word", () => {
    fc.assert(fc.property(lattice(14), (r) => {
      expect(ringDefect(r)).toBe(refDefect(r));
    }), { numRuns: 3000 });
  });
  it("ringsOverlap and ringInside: the same answer for lattice rings and stars", () => {
    const ring = fc.oneof(lattice(10), starRing);
    fc.assert(
      fc.property(ring, ring, (a, b) => {
        expect(ringsOverlap(a, b)).toBe(refOverlap(a, b));
        expect(ringInside(a, b)).toBe(refInside(a, b));
        expect(ringsOverlap(a, a.slice())).toBe(refOverlap(a, a.slice()));
      }),
      { numRuns: 3000 },
    );
  });
});

describe("section caps (issue 9: a 185 kB section of 16,004 points froze the server)", () => {
  const circle = (n: number, cz: number) => Array.from({ length: n }, (_, k) => [cz + 100 * Math.cos((2 * Math.PI * k) / n), 100 * Math.sin((2 * Math.PI * k) / n)]);
  it(`more than ${MAX_SECTION_POINTS} points in all is refused, the message naming the field and the limit`, () => {
    const input = { polygons: [{ points: circle(8002, 0) }, { points: circle(8002, 300) }] };
    const v = findInputViolation(input);
    expect(v).toEqual({ path: ["polygons"], message: "polygons: 16,004 points in all; at most 2,000 per section (simplify the outline)" });
    const z = sectionInputSchema.safeParse(input);
    expect(z.success).toBe(false);
    expect(z.error!.issues[0]).toMatchObject({ path: ["polygons"], message: v!.message });
  });
  it("exactly the cap is accepted", () => {
    const input = { polygons: [{ points: circle(1000, 0) }, { points: circle(1000, 300) }] };
    expect(findInputViolation(input)).toBeNull();
    expect(sectionInputSchema.safeParse(input).success).toBe(true);
  });
  it(`more than ${MAX_SECTION_POLYGONS} polygons is refused`, () => {
    const squares = Array.from({ length: MAX_SECTION_POLYGONS + 1 }, (_, i) => ({ points: [[i * 20, 0], [i * 20 + 10, 0], [i * 20 + 10, 10], [i * 20, 10]] }));
    expect(findInputViolation({ polygons: squares })).toEqual({ path: ["polygons"], message: `polygons: 101 polygons; at most ${MAX_SECTION_POLYGONS} per section` });
    expect(findInputViolation({ polygons: squares.slice(1) })).toBeNull();
  });
});

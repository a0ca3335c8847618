// properties.stability (member-checks.md §1) against closed forms and against independent
// numerical integrations written here from first principles: the shear centre from the shear
// flow, the warping constant from the sectorial coordinate, betaX from a midpoint grid.
import { describe, expect, it } from "vitest";
import { sectionProperties, type SectionInput, type StabilityProperties } from "~/optimizer/index";

const rel = (a: number, b: number, tol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(Math.abs(b), 1e-300));
const stab = (s: SectionInput): StabilityProperties => {
  const p = sectionProperties(s).stability;
  if (!p) throw new Error("no stability properties");
  return p;
};

/** A thin-walled midline path: straight segments with a thickness. */
type Seg = { z0: number; y0: number; z1: number; y1: number; t: number };

/**
 * Shear centre (z) of a section symmetric about the horizontal axis, from the shear flow under a
 * vertical shear V = 1 (Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., 1961, ch. 5;
 * any mechanics-of-materials text's "shear centre of a channel"): walk the open midline from one
 * free edge, q(s) = (1/Iz)·∫ y·t ds, integrate the moment of q about the point (0, 0) by the
 * midpoint rule on n pieces per segment; the shear centre is where V's moment equals it.
 */
function shearCentreZ(segs: Seg[], n = 4000): number {
  // Iz of the midline about y = 0 (centroidal by symmetry)
  let Iz = 0;
  for (const s of segs) {
    const L = Math.hypot(s.z1 - s.z0, s.y1 - s.y0);
    for (let i = 0; i < n; i++) {
      const f = (i + 0.5) / n;
      const y = s.y0 + f * (s.y1 - s.y0);
      Iz += y * y * s.t * (L / n);
    }
  }
  let Q = 0,
    M = 0;
  for (const s of segs) {
    const L = Math.hypot(s.z1 - s.z0, s.y1 - s.y0);
    const tz = (s.z1 - s.z0) / L,
      ty = (s.y1 - s.y0) / L;
    for (let i = 0; i < n; i++) {
      const f = (i + 0.5) / n;
      const z = s.z0 + f * (s.z1 - s.z0),
        y = s.y0 + f * (s.y1 - s.y0);
      const ds = L / n;
      const qMid = (Q + (y * s.t * ds) / 2) / Iz;
      // moment about the origin of the force q·ds along the tangent: r × (q t̂)
      M += (z * ty - y * tz) * qMid * ds;
      Q += y * s.t * ds;
    }
  }
  // The flow resultant is V = 1 along −y (the walk runs down the web); a unit force along −y at
  // (z_sc, ·) has moment −z_sc about the origin, so z_sc = −M.
  return -M;
}

/**
 * Warping constant by the sectorial coordinate about the pole P (Timoshenko & Gere, 2nd ed.,
 * 1961, ch. 5): ω(s) = ∫ (r × t̂) ds from the walk's start, normalised to zero mean, and
 * Cw = ∫ ω_n²·t ds (midpoint rule).
 */
function warpingConstant(segs: Seg[], pz: number, py: number, n = 4000): number {
  const ws: number[] = [],
    ts: number[] = [],
    dss: number[] = [];
  let w = 0;
  for (const s of segs) {
    const L = Math.hypot(s.z1 - s.z0, s.y1 - s.y0);
    const tz = (s.z1 - s.z0) / L,
      ty = (s.y1 - s.y0) / L;
    const ds = L / n;
    // the lever arm is constant along a straight segment
    const arm = (s.z0 - pz) * ty - (s.y0 - py) * tz;
    for (let i = 0; i < n; i++) {
      ws.push(w + arm * ds * 0.5);
      ts.push(s.t);
      dss.push(ds);
      w += arm * ds;
    }
  }
  let A = 0,
    m = 0;
  for (let i = 0; i < ws.length; i++) {
    A += ts[i] * dss[i];
    m += ws[i] * ts[i] * dss[i];
  }
  m /= A;
  let Cw = 0;
  for (let i = 0; i < ws.length; i++) Cw += (ws[i] - m) ** 2 * ts[i] * dss[i];
  return Cw;
}

/** betaX by a midpoint grid over each plate (n × n cells), v down from the centroid. */
function betaXNumerical(plates: { b: number; h: number; z: number; y: number }[], ysc: number, n = 400): number {
  let A = 0,
    Ay = 0,
    Az = 0;
  for (const p of plates) {
    A += p.b * p.h;
    Ay += p.b * p.h * (p.y + p.h / 2);
    Az += p.b * p.h * (p.z + p.b / 2);
  }
  const yb = Ay / A,
    zb = Az / A;
  let Iz = 0,
    I3 = 0;
  for (const p of plates) {
    const dz = p.b / n,
      dy = p.h / n;
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++) {
        const w = p.z + (i + 0.5) * dz - zb;
        const v = yb - (p.y + (j + 0.5) * dy);
        const dA = dz * dy;
        Iz += v * v * dA;
        I3 += v * (w * w + v * v) * dA;
      }
  }
  return I3 / Iz - 2 * (yb - ysc);
}

describe("member-checks.md §1 check value", () => {
  // mono-i d 440, top flange 170 × 10, bottom 130 × 6, web 6: betaX = 224.58 mm, shear centre
  // 343.61 mm above the bottom edge (member-checks.md, an independent hand calculation)
  const mono = { family: "mono-i", d: 440, bt: 170, tft: 10, bb: 130, tfb: 6, tw: 6 } as const;
  it("betaX 224.58 mm, shear centre 343.61 mm above the bottom", () => {
    const s = stab(mono);
    expect(s.betaX).toBeCloseTo(224.58, 2);
    expect(s.shearCentre.y).toBeCloseTo(343.61, 2);
    expect(s.shearCentre.z).toBe(85);
    expect(s.h0).toBe(432);
  });
  it("betaX by a midpoint grid over the actual plates agrees with the exact integral", () => {
    const s = stab(mono);
    const plates = [
      { b: 130, h: 6, z: 20, y: 0 },
      { b: 6, h: 424, z: 82, y: 6 },
      { b: 170, h: 10, z: 0, y: 430 },
    ];
    rel(betaXNumerical(plates, s.shearCentre.y), s.betaX, 1e-5);
  });
  it("close to the published approximation 0.9·h0·(2ρ − 1)·(1 − (Iy/Iz)²), ρ = It/(It + Ib) (mem.)", () => {
    const p = sectionProperties(mono);
    const It = (10 * 170 ** 3) / 12,
      Ib = (6 * 130 ** 3) / 12;
    const rho = It / (It + Ib);
    const approx = 0.9 * 432 * (2 * rho - 1) * (1 - (p.Iy / p.Iz) ** 2);
    expect(Math.abs(p.stability!.betaX - approx) / approx).toBeLessThan(0.05);
  });
  it("flip changes betaX's sign and mirrors the shear centre", () => {
    const s = stab(mono),
      f = stab({ ...mono, flip: true });
    expect(f.betaX).toBe(-s.betaX);
    rel(f.shearCentre.y, 440 - s.shearCentre.y);
    expect(f.Cw).toBe(s.Cw);
  });
  it("mono-i Cw = h0²·It·Ib/(It + Ib) equals the sectorial integral about the shear centre", () => {
    const s = stab(mono);
    const h0 = 432;
    // midline: top flange tip → tip, web, bottom flange (web axis at z = 0, bottom flange midline y = 0)
    const ysc = s.shearCentre.y - 3;
    // the sectorial coordinate of a branched section: each flange half from the web, computed per branch
    const branch = (z1: number, y: number, t: number) => warpingBranch(0, y, z1, y, t, 0, ysc);
    const Cw = sectorialBranched([branch(-85, h0, 10), branch(85, h0, 10), branch(-65, 0, 6), branch(65, 0, 6), warpingBranch(0, 0, 0, h0, 6, 0, ysc, 0)]);
    rel(Cw, s.Cw, 1e-6);
  });
});

/** One straight branch starting at (z0, y0) with ω = ω0 there: samples of ω, t, ds. */
function warpingBranch(z0: number, y0: number, z1: number, y1: number, t: number, pz: number, py: number, w0 = NaN, n = 4000) {
  const L = Math.hypot(z1 - z0, y1 - y0);
  const tz = (z1 - z0) / L,
    ty = (y1 - y0) / L;
  const arm = (z0 - pz) * ty - (y0 - py) * tz;
  return { arm, L, t, n, start: w0 };
}

/**
 * Cw of branches radiating from the web (an I or mono-I): ω at the web–flange junctions from
 * the web branch (ω = 0 at the web's bottom end, rising along it), each flange branch starts
 * from its junction's ω. Normalised to zero mean, Cw = ∫ ω_n²·t ds.
 */
function sectorialBranched(br: ReturnType<typeof warpingBranch>[]): number {
  const web = br[br.length - 1];
  const samples: [number, number][] = []; // [ω, t·ds]
  const put = (b: typeof web, w0: number) => {
    const ds = b.L / b.n;
    for (let i = 0; i < b.n; i++) samples.push([w0 + b.arm * (i + 0.5) * ds, b.t * ds]);
    return w0 + b.arm * b.L;
  };
  const wTop = put(web, 0);
  // flanges: the bottom ones start at ω = 0 (web bottom), the top ones at the web's top value
  for (const b of br.slice(0, -1)) put(b, b === br[0] || b === br[1] ? wTop : 0);
  let A = 0,
    m = 0;
  for (const [w, a] of samples) {
    A += a;
    m += w * a;
  }
  m /= A;
  let Cw = 0;
  for (const [w, a] of samples) Cw += (w - m) ** 2 * a;
  return Cw;
}

describe("closed forms by family", () => {
  it("i: Cw = tf·b³·h0²/24 (Timoshenko & Gere, 2nd ed., 1961, ch. 5, mem.) equals the sectorial integral; shear centre at the centroid; betaX 0", () => {
    const s = stab({ family: "i", d: 450, b: 110, tf: 8, tw: 6 });
    const h0 = 442;
    expect(s.h0).toBe(h0);
    rel(s.Cw, (8 * 110 ** 3 * h0 ** 2) / 24);
    const branch = (z1: number, y: number) => warpingBranch(0, y, z1, y, 8, 0, h0 / 2);
    const Cw = sectorialBranched([branch(-55, h0), branch(55, h0), branch(-55, 0), branch(55, 0), warpingBranch(0, 0, 0, h0, 6, 0, h0 / 2)]);
    rel(Cw, s.Cw, 1e-6);
    expect(s.shearCentre).toEqual({ z: 55, y: 225 });
    expect(s.betaX).toBe(0);
    // J: the engine's open thin-walled Σ b·t³/3
    rel(s.J, (2 * 110 * 8 ** 3) / 3 + (434 * 6 ** 3) / 3);
  });

  it("channel: the shear centre from the shear flow (numerical) equals e0 = 3·b′²·tf/(6·b′·tf + h0·tw); Cw from the sectorial integral", () => {
    const d = 300,
      b = 90,
      tf = 12,
      tw = 8;
    const s = stab({ family: "channel", d, b, tf, tw });
    const h0 = d - tf,
      bp = b - tw / 2;
    // midline with the web on z = 0: top flange tip → web top → web bottom → bottom flange tip
    const segs: Seg[] = [
      { z0: bp, y0: h0 / 2, z1: 0, y1: h0 / 2, t: tf },
      { z0: 0, y0: h0 / 2, z1: 0, y1: -h0 / 2, t: tw },
      { z0: 0, y0: -h0 / 2, z1: bp, y1: -h0 / 2, t: tf },
    ];
    const zNum = shearCentreZ(segs);
    const e0 = (3 * bp * bp * tf) / (6 * bp * tf + h0 * tw);
    rel(-zNum, e0, 1e-6);
    // engine: from the web's midline (z = tw/2 in the family frame) away from the flanges
    rel(s.shearCentre.z, tw / 2 - e0);
    expect(s.shearCentre.y).toBe(d / 2);
    rel(warpingConstant(segs, zNum, 0), s.Cw, 1e-6);
    rel(s.Cw, (tf * bp ** 3 * h0 ** 2 * (3 * bp * tf + 2 * h0 * tw)) / (12 * (6 * bp * tf + h0 * tw)));
  });

  it("tee: shear centre at the flange's mid-thickness on the stem axis, Cw 0, betaX > 0 with the flange on top and by the midpoint grid", () => {
    const t = { family: "tee", d: 200, b: 150, tf: 12, tw: 8 } as const;
    const s = stab(t);
    expect(s.shearCentre).toEqual({ z: 75, y: 194 });
    expect(s.h0).toBe(194);
    expect(s.Cw).toBe(0);
    expect(s.betaX).toBeGreaterThan(0);
    rel(betaXNumerical([{ b: 150, h: 12, z: 0, y: 188 }, { b: 8, h: 188, z: 71, y: 0 }], 194), s.betaX, 1e-5);
    expect(stab({ ...t, flip: true }).betaX).toBe(-s.betaX);
    expect(stab({ ...t, flip: true }).shearCentre.y).toBe(6);
  });

  it("box: Bredt's J on the midline cell (Timoshenko & Goodier, Theory of Elasticity, 3rd ed., 1970, thin-walled tubes, mem.), Cw 0", () => {
    const s = stab({ family: "box", d: 300, b: 200, tf: 10, tw: 8 });
    const Am = 192 * 290;
    rel(s.J, (4 * Am * Am) / ((2 * 192) / 10 + (2 * 290) / 8));
    expect(s).toMatchObject({ h0: 290, Cw: 0, betaX: 0, shearCentre: { z: 100, y: 150 } });
    expect(sectionProperties({ family: "box", d: 300, b: 200, tf: 10, tw: 8 }).J).toBe(s.J);
  });

  it("rectangle: J = l·s³·(1/3 − 0.21·(s/l)·(1 − s⁴/(12·l⁴))) against the exact series (Timoshenko & Goodier, 3rd ed., 1970, §109 table: k = 0.141 square, 0.229 for 2:1, mem.)", () => {
    const sq = stab({ family: "rectangle", b: 50, d: 50 });
    expect(Math.abs(sq.J / (0.141 * 50 ** 4) - 1)).toBeLessThan(0.003);
    const r2 = stab({ family: "rectangle", b: 25, d: 50 });
    expect(Math.abs(r2.J / (0.229 * 50 * 25 ** 3) - 1)).toBeLessThan(0.003);
    expect(r2).toMatchObject({ h0: 50, Cw: 0, betaX: 0, shearCentre: { z: 12.5, y: 25 } });
  });

  it("null for angle, channel-down, plates and polygons", () => {
    expect(sectionProperties({ family: "angle", d: 100, b: 80, t: 8 }).stability).toBeNull();
    expect(sectionProperties({ family: "channel-down", d: 100, b: 80, tw: 8, tf: 8 }).stability).toBeNull();
    expect(sectionProperties({ plates: [{ b: 10, h: 100, z: 0, y: 0 }] }).stability).toBeNull();
    expect(sectionProperties({ polygons: [{ points: [[0, 0], [10, 0], [10, 100], [0, 100]] }] }).stability).toBeNull();
  });

  it("symmetric shapes: betaX exactly 0 (i, channel, box, rectangle, also flipped)", () => {
    for (const s of [
      { family: "i", d: 300, b: 150, tf: 10, tw: 7, flip: true },
      { family: "channel", d: 300, b: 90, tf: 12, tw: 8 },
      { family: "box", d: 300, b: 200, tf: 10, tw: 8, flip: true },
      { family: "rectangle", b: 20, d: 80 },
    ] as SectionInput[])
      expect(Object.is(stab(s).betaX, 0)).toBe(true);
  });
});

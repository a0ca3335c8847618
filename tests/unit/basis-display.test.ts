// What the results pages show for a design basis, rendered to HTML on the server: the property
// table's stability rows with units, the caution's wording per basis, the check table's clauses,
// the "stresses only" words under the allowable basis and the EN 1993 restraint study's C1 column.
import { describe, expect, test } from "vitest";
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { PropertyTable, STABILITY_ROWS, formatNumber } from "~/components/PropertyTable";
import { CheckTable } from "~/components/CheckTable";
import { Caution } from "~/components/Caution";
import { RestraintStudyChart } from "~/components/RestraintStudyChart";
import { En1993Checks, En1993Inputs } from "~/components/En1993Record";
import { cautionText } from "~/lib/caution";
import { clauseLabel } from "~/lib/labels";
import { STABILITY_QUANTITIES, candidateChecks, searchProblemSchema, sectionProperties, CONTRACT_EXAMPLE_PROBLEM, type SectionProperties } from "~/optimizer";

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&amp;/g, "&").replace(/&#x27;/g, "'").replace(/\s+/g, " ");

// Doubly symmetric I 400 × 200 × 16/10: member-checks.md §1 closed forms h0 = d − tf = 384 mm,
// Cw = tf·b³·h0²/24 = 16 × 200³ × 384² / 24 = 7.86432 × 10¹¹ mm⁶, shear centre at the centroid, βx = 0.
const base = sectionProperties({ family: "i", d: 400, b: 200, tf: 16, tw: 10 });
const withStability: SectionProperties = { ...base, stability: { h0: 384, shearCentre: { z: 100, y: 200 }, Cw: 7.86432e11, betaX: 0, J: base.J } };

describe("PropertyTable: stability constants", () => {
  test("a row for every field of properties.stability the units module knows, and no other", () => {
    expect(STABILITY_ROWS.map((r) => r.key).sort()).toEqual(Object.keys(STABILITY_QUANTITIES).sort());
  });

  test("shown with units in SI and US customary (1 in = 25.4 mm, NIST SP 811)", () => {
    const si = text(renderToString(createElement(PropertyTable, { properties: withStability, units: "si" })));
    expect(si).toContain(`${formatNumber(7.86432e11)} mm⁶`);
    expect(si).toContain("384 mm");
    const us = text(renderToString(createElement(PropertyTable, { properties: withStability, units: "us" })));
    expect(us).toContain(`${formatNumber(7.86432e11 / 25.4 ** 6)} in⁶`);
    expect(us).toContain(`${formatNumber(384 / 25.4)} in`);
  });

  test("says so when the section has none (plates, polygons, angle)", () => {
    const html = text(renderToString(createElement(PropertyTable, { properties: { ...base, stability: null }, units: "si" })));
    expect(html).toContain("Not defined for this section");
  });
});

describe("caution and check table follow the basis", () => {
  const allowable = searchProblemSchema.parse(CONTRACT_EXAMPLE_PROBLEM);
  const { allowable: _a, ...rest } = CONTRACT_EXAMPLE_PROBLEM;
  const en = searchProblemSchema.parse({ ...rest, families: ["i"], basis: "en1993", steel: { grade: "S355" }, restraint: { length: 6 } });

  test("allowable: stresses only, no stability checks at all", () => {
    const t = cautionText(allowable);
    expect(t).toContain("stresses only: no stability checks");
    expect(t).toMatch(/do not cover lateral-torsional buckling or any other stability check/);
    const html = text(renderToString(createElement(Caution, { problem: allowable })));
    expect(html).toContain("Caution.");
    expect(html).toContain("licensed engineer");
  });

  test("EN 1993: what it checks, and web crippling only when the supports are stiffened (so unchecked)", () => {
    const t = cautionText(en);
    expect(t).toMatch(/cover only cross-section class .*lateral-torsional buckling over the stated restraint length/);
    expect(t).toMatch(/do not cover web crippling or bearing at supports \(bearing stiffeners are assumed there and must be provided\), connections, fatigue, fire, load combinations/);
    const unstiffened = cautionText({ ...en, supports: { stiffened: false } });
    expect(unstiffened).toContain("web crippling (patch loading) at an end support");
    expect(unstiffened).not.toMatch(/do not cover web crippling/);
    const restrained = cautionText({ ...en, restraint: undefined });
    expect(restrained).toMatch(/do not cover lateral-torsional buckling \(the compression flange is taken as restrained throughout\)/);
  });

  test("the check table names each check's clause; under allowable it says stresses only", () => {
    const v = candidateChecks("i", { d: 300, b: 150, tf: 12, tw: 8 }, allowable);
    const html = text(renderToString(createElement(CheckTable, { verdict: v, units: "si" })));
    expect(html).toContain("stresses only: no stability checks");
    expect(html).toContain(clauseLabel(v.checks[0].clause));
  });

  test("the check table's names and clauses read as words: no field paths, camelCase keys or check ids", () => {
    const p = searchProblemSchema.parse({ ...CONTRACT_EXAMPLE_PROBLEM, slenderness: { outstand: 12, web: 60 }, deflection: { span: 4, serviceLoad: 6, limitRatio: 250, E: 205000 } });
    const v = candidateChecks("i", { d: 300, b: 150, tf: 12, tw: 8 }, p);
    expect(v.checks.map((c) => c.name)).toEqual(expect.arrayContaining(["bending-compression", "slenderness-outstand", "deflection"]));
    // the engine's clauses name the problem's fields by path (the API's words); the page must not
    expect(v.checks.map((c) => c.clause).join(" ")).toMatch(/allowable\.compression|slenderness\.outstand|limitRatio/);
    for (const compact of [false, true]) {
      const html = text(renderToString(createElement(CheckTable, { verdict: v, units: "si", compact })));
      expect(html).not.toMatch(/\b[a-z]+\.[a-z][A-Za-z]*\b/);
      expect(html).not.toMatch(/\b[a-z]+[A-Z][a-z]+/);
      for (const c of v.checks) if (c.name.includes("-")) expect(html).not.toContain(c.name);
      expect(html).toContain("the brief's flange outstand limit");
      expect(html).toContain("≤ L/limit ratio");
    }
  });
});

describe("the record's EN 1993 part sets out the engine's own numbers", () => {
  // The floor beam of issue 10 and the I the EN 1993 search picks for it on a 10 mm grid (360 × 230 × 10/6).
  const { allowable: _a, ...rest } = CONTRACT_EXAMPLE_PROBLEM;
  const problem = searchProblemSchema.parse({
    ...rest,
    moment: { sagging: 120, hogging: 0 },
    shear: 150,
    families: ["i"],
    basis: "en1993",
    steel: { grade: "S355" },
    restraint: { length: 6, C1: 1.132, C2: 0.459, C3: 0.525, loadAt: "top" },
  });
  const dims = { d: 360, b: 230, tf: 10, tw: 6 };
  const verdict = candidateChecks("i", dims, problem);
  const d = verdict.design!;
  const props = sectionProperties({ family: "i", ...dims });
  // Tags dropped without spaces (the record's numbers sit in <strong> inside sentences); entities decoded.
  const flat = (h: string) => h.replace(/<br\/?>/g, " ").replace(/<[^>]+>/g, "").replace(/&#x27;/g, "'").replace(/&gt;/g, ">").replace(/&amp;/g, "&").replace(/\s+/g, " ");
  const html = flat(
    renderToString(createElement("div", null, createElement(En1993Inputs, { problem, design: d, units: "si" }), createElement(En1993Checks, { problem, verdict, props, family: "i", dims, units: "si" }))),
  );

  test("fy from the band holding the thickest plate, ε, and the class per element with c/t", () => {
    expect(d.fyPlate).toBe(10);
    expect(html).toContain("the section's thickest plate is t = 10 mm, which the band t ≤ 16 mm holds, so fy = 355 MPa");
    expect(html).toContain(`ε = √(235/fy) = √(235/355) = ${formatNumber(d.epsilon, 4)}`);
    for (const e of d.elements) expect(html).toContain(`${formatNumber(e.c)}${formatNumber(e.t)}${formatNumber(e.ratio)}`); // c, t, c/t in adjacent cells
    expect(html).toContain(`class ${d.sectionClass}`);
  });

  test("each resistance is the design block's value, with its symbols and clause", () => {
    const l = d.ltb![0];
    expect(html).toContain(`Mc,Rd = W·fy/γM0 = ${formatNumber(d.W!)} mm³ × 355 MPa ÷ 1 = ${formatNumber(d.McRd!)} kN·m`);
    expect(html).toContain(`Mcr = 1.132 × π² × 210,000 × (${formatNumber(props.Iy)}) ÷ 6,000² × [√((${formatNumber(props.stability!.Cw)})/(${formatNumber(props.Iy)}) + 6,000² × 81,000 × 177,800/(π² × 210,000 × (${formatNumber(props.Iy)})) + (82.62)²) − (82.62)] = ${formatNumber(l.Mcr)} kN·m`);
    expect(html).toContain(`χLT = min(1, 1/(ΦLT + √(ΦLT² − λLT²))) = 1/(${formatNumber(l.phiLT, 4)} + √(${formatNumber(l.phiLT, 4)}² − ${formatNumber(l.lambdaLT, 4)}²)) = ${formatNumber(l.chiLT, 4)}`);
    expect(html).toContain(`Mb,Rd = χLT·W·fy/γM1 = ${formatNumber(l.chiLT, 4)} × ${formatNumber(d.W!)} mm³ × 355 MPa ÷ 1 = ${formatNumber(l.MbRd)} kN·m`);
    expect(html).toContain(`VRd = ${formatNumber(d.shear!.VRd)} kN`);
    expect(html).toContain(`a = ${d.weld!.a} mm`);
    expect(html).toContain("EN 1993-1-8 §4.5.3.3");
    expect(html).toContain("EN 1993-1-1 §6.3.2.2");
    // the restraint and the supports in words; the engine's stated simplifications listed
    expect(html).toContain("compression flange restrained at most L = 6 m apart");
    expect(html).toContain("“Simply supported, uniform load”");
    expect(html).toContain("bearing stiffeners are required at both supports");
    for (const n of d.notes) expect(html).toContain(n);
  });
});

// The restraint study under EN 1993 (engine restraint-study.ts): the brief's C1 at L and C1 = 1.0
// between intermediate restraints, the uniform-moment value (ENV 1993-1-1:1992 Annex F,
// Table F.1.1, ψ = +1, mem.); each point's C1 shown as AISC points show their Cb.
describe("the restraint study under EN 1993", () => {
  const best = { family: "i", dimensions: { d: 400, b: 200, tf: 12, tw: 8 }, massPerMetre: 50, utilisation: 0.9, governing: "ltb" };
  const study = (c1: number[]) => ({ lengthM: 6, elapsedMs: 10, points: c1.map((C1, k) => ({ restraints: k, lengthM: 6 / (k + 1), C1, best: { ...best, massPerMetre: 50 - 5 * k } })) });
  test("a C1 column by the field's label and the caption's choice: the brief's C1 at L, 1.0 between restraints", () => {
    const t = text(renderToString(createElement(RestraintStudyChart, { study: study([1.132, 1, 1]), units: "si" })));
    expect(t).toContain("Spacing Moment factor C1 Lightest section");
    expect(t).toMatch(/6 m 1\.132 I \(equal flanges\)/);
    expect(t).toMatch(/3 m 1 I \(equal flanges\)/);
    expect(t).toContain("EN 1993: C1 is the brief's at L (1.132) and 1.0 between intermediate restraints, the uniform-moment value");
    expect(t).toContain("C2 and C3 are the brief's");
    expect(t).not.toContain("Cb");
    expect(t).not.toContain("computed before");
  });
  test("a brief's C1 below 1.0 is kept throughout, and the caption says so", () => {
    const t = text(renderToString(createElement(RestraintStudyChart, { study: study([0.9, 0.9]), units: "si" })));
    expect(t).toContain("C1 is the brief's (0.9) at every spacing, already below 1.0");
  });
  test("a study stored before points carried C1 kept the brief's C1 throughout: the page says it is unconservative", () => {
    const old = study([1.132, 1]);
    const t = text(renderToString(createElement(RestraintStudyChart, { study: { ...old, points: old.points.map(({ C1: _c, ...p }) => p) }, units: "si" })));
    expect(t).toContain("kept the brief's C1, which over-estimates Mcr there (unconservative)");
    expect(t).not.toContain("Moment factor C1");
  });
});

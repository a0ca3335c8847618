// What the results pages show for a design basis, rendered to HTML on the server: the property
// table's stability rows with units, the caution's wording per basis, the check table's clauses
// and the "stresses only" words under the allowable basis.
import { describe, expect, test } from "vitest";
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { PropertyTable, STABILITY_ROWS, formatNumber } from "~/components/PropertyTable";
import { CheckTable } from "~/components/CheckTable";
import { Caution } from "~/components/Caution";
import { cautionText } from "~/lib/caution";
import { STABILITY_QUANTITIES, candidateChecks, searchProblemSchema, sectionProperties, CONTRACT_EXAMPLE_PROBLEM, type SectionProperties } from "~/optimizer";

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&amp;/g, "&").replace(/\s+/g, " ");

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
    expect(html).toContain(v.checks[0].clause);
  });
});

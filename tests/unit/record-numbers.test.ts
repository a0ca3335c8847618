// Issue 12: every number in the calculation record equals the engine's value. Each option below is
// rendered by the record page itself (server-side, react-dom/server) and its HTML audited against
// the engine's results for that option, computed here straight from the engine's entry points
// (sectionProperties, familyPlates, compositeTable, sectionStresses, candidateChecks,
// catalogueCandidateChecks) rather than through lib/record.ts, so a slip in gathering them shows.
// The audit (record-audit.ts) reads every number of sections 1–7, requires an engine counterpart
// for each in the unit written after it, and compares each labelled value with that label's value.
import { describe, expect, it, vi } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { MemoryRouter } from "react-router";

// the route module's server imports (session, database) are not used by the page component
vi.mock("~/lib/auth.server", () => ({}));
vi.mock("~/lib/record-document.server", () => ({}));

import RecordPage from "~/routes/options.$optionId.record";
import {
  FAMILIES,
  catalogueCandidateChecks,
  candidateChecks,
  compositeTable,
  familyPlates,
  parseSearchProblem,
  sectionProperties,
  sectionStresses,
  type CatalogueSection,
  type Family,
  type SearchProblem,
  type SectionInput,
} from "~/optimizer/index";
import type { UnitSystem } from "~/optimizer/units";
import { formatNumber, formatQuantity } from "~/lib/format";
import { htmlLines, labelledMismatches, unmatchedNumbers, type EngineFacts } from "./record-audit";

interface Case {
  name: string;
  problem: Record<string, unknown>;
  family: Family;
  dims: Record<string, number>;
  units: UnitSystem;
  rolled?: { designation: string; shape: CatalogueSection["shape"]; catalogue: string };
  /** parts of the sheet this option is meant to exercise (so a changed brief cannot quietly skip them) */
  shows: string[];
}

// Invented briefs; the rolled rows are the starter catalogue's (db/seeds/starter-catalogue.csv).
const GRID = { depth: { min: 100, max: 700, step: 10 }, width: { min: 50, max: 300, step: 10 }, thicknesses: [6, 8, 10, 12, 15, 20] };
const CASES: Case[] = [
  {
    name: "allowable, welded tee, SI, with shear, deflection and a member quantity",
    problem: { ...GRID, families: ["tee"], moment: { sagging: 20, hogging: 6 }, shear: 45, allowable: { tension: 200, compression: 165, shear: 110 }, deflection: { span: 4, serviceLoad: 6, limitRatio: 250, E: 205000 }, slenderness: { outstand: 12, stem: 20 } },
    family: "tee",
    dims: { d: 200, b: 150, tf: 20, tw: 10 },
    units: "si",
    shows: ["5·w·L⁴/(384·E·I) ≤ L/limit ratio", "τ = V·Q/(Iz·b)", "flange outstand: width b = (b − tw)/2", "stem: width b = d − tf", "data-testid=\"quantity\"", "data-testid=\"fibre-hogging\""],
  },
  {
    name: "allowable, welded angle (unsymmetric), US customary",
    problem: { ...GRID, families: ["angle"], moment: { sagging: 8, hogging: 0 }, shear: 10, allowable: { tension: 150, compression: 140, shear: 90 }, deflection: { span: 3, serviceLoad: 2, limitRatio: 200, E: 200000 }, slenderness: { outstand: 15 } },
    family: "angle",
    dims: { d: 150, b: 100, t: 12 },
    units: "us",
    shows: ["Unsymmetric section (Iyz =", "bends about an inclined axis", "horizontal leg: width b = b − t", "not the largest of its kind"],
  },
  {
    name: "allowable, rolled IPE 300 from a catalogue, US customary, with shear and deflection",
    problem: { ...GRID, families: ["i"], moment: { sagging: 60, hogging: 0 }, shear: 90, allowable: { tension: 160, compression: 160, shear: 95 }, deflection: { span: 6, serviceLoad: 8, limitRatio: 250, E: 210000 }, slenderness: { outstand: 9, web: 40 } },
    family: "i",
    dims: { d: 300, b: 150, tw: 7.1, tf: 10.7, r: 15 },
    units: "us",
    shows: ["IPE 300 (rolled, from Starter", "data-testid=\"record-shear\"", "data-testid=\"record-deflection\"", "web: width b = d − 2·tf", "b/t ÷ limit ="],
    rolled: { designation: "IPE 300", shape: "I", catalogue: "Starter" },
  },
  {
    name: "EN 1993, welded I, SI, restraint, bending with shear, unstiffened supports",
    problem: { ...GRID, families: ["i"], basis: "en1993", steel: { grade: "S355" }, moment: { sagging: 180, hogging: 60 }, shear: 520, restraint: { length: 4, C1: 1.13, C2: 0.45, C3: 0.525, loadAt: "top" }, supports: { stiffened: false, bearingLength: 100 } },
    family: "i",
    dims: { d: 500, b: 200, tf: 15, tw: 8 },
    units: "si",
    shows: ["data-testid=\"record-ltb-hogging\"", "ρ = (2·VEd/VRd − 1)²", "shear buckling applies", "6.7 Web at an unstiffened end support", "6.6 Flange-to-web welds"],
  },
  {
    name: "EN 1993, welded channel, US customary",
    problem: { ...GRID, families: ["channel"], basis: "en1993", steel: { grade: "S275" }, moment: { sagging: 40, hogging: 0 }, shear: 60, restraint: { length: 2.5 }, deflection: { span: 5, serviceLoad: 8, limitRatio: 300, E: 210000 } },
    family: "channel",
    dims: { d: 300, b: 90, tf: 12, tw: 8 },
    units: "us",
    shows: ["data-testid=\"record-ltb-sagging\"", "no reduction of the bending resistance", "(128.4 kip·ft)"],
  },
  {
    name: "EN 1993, rolled IPE 300 from a catalogue, SI",
    problem: { ...GRID, families: ["i"], basis: "en1993", steel: { grade: "S355" }, moment: { sagging: 90, hogging: 0 }, shear: 80, restraint: { length: 3, C1: 1.13, loadAt: "top" } },
    family: "i",
    dims: { d: 300, b: 150, tw: 7.1, tf: 10.7, r: 15 },
    units: "si",
    shows: ["IPE 300 (rolled, from Starter", "no shear buckling check needed", "Rolled section: properties include the root fillets"],
    rolled: { designation: "IPE 300", shape: "I", catalogue: "Starter" },
  },
  {
    name: "AISC 360 LRFD, welded I, SI, unbraced length, unstiffened supports",
    problem: { ...GRID, families: ["i"], basis: "aisc360", method: "LRFD", aisc: { grade: "A572 Gr 50" }, moment: { sagging: 250, hogging: 0 }, shear: 300, restraint: { length: 3, Cb: 1.14 }, supports: { stiffened: false, bearingLength: 100 } },
    family: "i",
    dims: { d: 450, b: 200, tf: 15, tw: 8 },
    units: "si",
    shows: ["AISC 360-16 §J10.2, §J10.3", "lateral-torsional buckling, Lb =", "AISC 360-16 §J2.4", "AISC 360-16 Eq. F2-2", "AISC 360-16 Eq. F2-5", "AISC 360-16 Eq. G2-3"],
  },
  {
    name: "AISC 360 LRFD, welded I with a noncompact flange and a thin web, SI, long unbraced length",
    problem: { ...GRID, families: ["i"], basis: "aisc360", method: "LRFD", aisc: { grade: "A572 Gr 50" }, moment: { sagging: 200, hogging: 0 }, shear: 400, restraint: { length: 8, Cb: 1 } },
    family: "i",
    dims: { d: 600, b: 300, tf: 10, tw: 8 },
    units: "si",
    shows: ["AISC 360-16 Eq. F3-1", "AISC 360-16 Eq. F2-4", "AISC 360-16 Eq. F2-3", "AISC 360-16 Eq. G2-4", "AISC 360-16 Eq. J2-3, J2-4"],
  },
  {
    name: "AISC 360 ASD, rolled IPE 300 from a catalogue, US customary, braced",
    problem: { ...GRID, families: ["i"], basis: "aisc360", method: "ASD", aisc: { grade: "A36" }, moment: { sagging: 60, hogging: 0 }, shear: 90 },
    family: "i",
    dims: { d: 300, b: 150, tw: 7.1, tf: 10.7, r: 15 },
    units: "us",
    shows: ["IPE 300 (rolled, from Starter", "AISC 360-16 §G2.1(a)", "AISC 360-16 Eq. F2-1"],
    rolled: { designation: "IPE 300", shape: "I", catalogue: "Starter" },
  },
  {
    name: "AISC 360 ASD, welded tee, US customary",
    problem: { ...GRID, families: ["tee"], basis: "aisc360", method: "ASD", aisc: { grade: "A36" }, moment: { sagging: 30, hogging: 0 }, shear: 40, restraint: { length: 2 } },
    family: "tee",
    dims: { d: 250, b: 200, tf: 15, tw: 10 },
    units: "us",
    shows: ["AISC 360-16 §F9", "AISC 360-16 §G3"],
  },
  {
    name: "AISC 360 ASD, rolled UPE 200 channel from a catalogue, US customary",
    problem: { ...GRID, families: ["channel"], basis: "aisc360", method: "ASD", aisc: { grade: "A36" }, moment: { sagging: 25, hogging: 0 }, shear: 50, restraint: { length: 2 }, deflection: { span: 4, serviceLoad: 5, limitRatio: 360, E: 200000 } },
    family: "channel",
    dims: { d: 200, b: 80, tw: 6, tf: 11, r: 13 },
    units: "us",
    shows: ["UPE 200 (rolled, from Starter", "AISC 360-16 §F2"],
    rolled: { designation: "UPE 200", shape: "channel", catalogue: "Starter" },
  },
];

function engineFacts(c: Case, problem: SearchProblem): EngineFacts {
  const section = { family: c.family, ...c.dims, density: problem.density } as SectionInput;
  const properties = sectionProperties(section);
  const plates = (FAMILIES as readonly string[]).includes(c.family) ? familyPlates(c.family, c.dims) : [];
  const verdict = c.rolled ? catalogueCandidateChecks({ designation: c.rolled.designation, shape: c.rolled.shape, dims: c.dims }, problem) : candidateChecks(c.family, c.dims, problem);
  const fibres = (
    [
      ["sagging", problem.moment.sagging],
      ["hogging", -problem.moment.hogging],
    ] as const
  )
    .filter(([, M]) => M !== 0)
    .map(([name, M]) => {
      const s = sectionStresses(section, { Mz: M });
      return { case: name, M: Math.abs(M), top: s.fibre.top, bottom: s.fibre.bottom };
    });
  return {
    units: c.units,
    problem,
    dims: c.dims,
    properties,
    plates,
    table: compositeTable(plates),
    fibres,
    verdict,
    quantity: { lengthM: 6, count: 4 },
    names: [c.rolled?.designation, c.rolled?.catalogue, (problem.steel as { grade?: string } | undefined)?.grade, problem.aisc?.grade, problem.aisc?.rolledGrade].filter((x): x is string => !!x),
  };
}

export function renderRecord(c: Case, problem: SearchProblem): string {
  const revision = { number: 1, letter: "A", problem, memberLengthM: 6, memberCount: 4, reason: "saved from the sweep", prepared: { who: "P. Preparer", at: "2026-11-02T10:00:00Z", comment: null }, approved: null, state: "draft", current: true };
  const option = {
    id: 7,
    projectId: 3,
    projectName: "Invented depot",
    teamId: 1,
    briefId: 5,
    briefName: "B1",
    sweepId: 11,
    recheckOf: null,
    approvalStale: false,
    candidate: { family: c.family, dimensions: c.dims, area: 0, massPerMetre: 0, utilisation: 0, governing: "", rank: 1, ...(c.rolled ? { source: "rolled", designation: c.rolled.designation, catalogue: c.rolled.catalogue, shape: c.rolled.shape } : {}) },
    problem,
    note: null,
    reviewState: "draft",
    createdBy: "P. Preparer",
    createdById: 1,
    createdAt: "2026-11-02T10:00:00Z",
    units: c.units,
    memberLengthM: 6,
    memberCount: 4,
    revision: 1,
  };
  const loaderData = { option, jobNumber: "J-1", mark: "B1", revision, revisions: [revision], reviews: [], signatures: { prepared: revision.prepared, checked: null, approved: null }, attachments: [], numbers: { sweep: { 11: 1 }, option: { 7: 1 } }, team: "Team", printedAt: "2026-12-03T12:00:00Z" };
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  return renderToStaticMarkup(createElement(MemoryRouter, null, createElement(RecordPage as any, { loaderData, params: { optionId: "7" }, matches: [] })));
}

describe("calculation record: every number is the engine's", () => {
  for (const c of CASES) {
    it(c.name, () => {
      const problem = parseSearchProblem(c.problem);
      const html = renderRecord(c, problem);
      const e = engineFacts(c, problem);
      const sheet = `${html}\n${htmlLines(html).join("\n")}`;
      for (const part of c.shows) expect(sheet, `the sheet shows ${part}`).toContain(part);
      const unmatched = unmatchedNumbers(html, e);
      const labelled = labelledMismatches(html, e);
      expect(unmatched, "numbers with no engine counterpart").toEqual([]);
      expect(labelled.failures, "labelled numbers that differ from the engine's").toEqual([]);
      expect(labelled.compared).toBeGreaterThan(40);
    });
  }
});

// The audit must be able to fail: the same sheets with one number wrong, or the same engine
// results with one value moved, are refused, naming the number.
describe("calculation record audit: a wrong number fails it", () => {
  const en = CASES.find((c) => c.name.startsWith("EN 1993, welded I"))!;
  const enProblem = parseSearchProblem(en.problem);
  const enHtml = renderRecord(en, enProblem);

  it("an engine value moved by 1 % (Mcr, sagging) no longer matches the sheet's", () => {
    const e = engineFacts(en, enProblem);
    const l = e.verdict.design!.ltb![0]!;
    const shown = formatNumber(l.Mcr);
    l.Mcr *= 1.01;
    expect(labelledMismatches(enHtml, e).failures).toContain(`sagging Mcr: the record shows “${shown}”, the engine's value is “${formatNumber(l.Mcr)}”`);
  });

  it("a number with no engine counterpart is listed with its line", () => {
    const html = enHtml.replace('<h2 id="stress-h"', "<p>Allowance for the weld: 12.34 mm</p>$&");
    expect(unmatchedNumbers(html, engineFacts(en, enProblem))).toEqual(["12.34 mm — no engine value; in: “Allowance for the weld: 12.34 mm”"]);
  });

  it("a fibre stress with the wrong sign is caught by its label", () => {
    const e = engineFacts(en, enProblem);
    const top = formatNumber(e.fibres[0]!.top, 5);
    expect(top.startsWith("−")).toBe(true);
    const html = enHtml.replace(`= <strong>${top} MPa`, `= <strong>${top.slice(1)} MPa`);
    expect(html).not.toBe(enHtml);
    expect(labelledMismatches(html, e).failures).toContain(`sagging σ_top: the record shows “${top.slice(1)}”, the engine's value is “${top}”`);
  });

  it("a slenderness line with a wrong thickness is caught, by its label and as a number of no engine value", () => {
    const tee = CASES.find((c) => c.name.startsWith("allowable, welded tee"))!;
    const problem = parseSearchProblem(tee.problem);
    const e = engineFacts(tee, problem);
    const html = renderRecord(tee, problem);
    const el = e.verdict.slendernessWorking!.find((x) => x.element === "stem")!;
    const right = `thickness t = ${el.thicknessSymbols} = ${formatNumber(el.t)} mm`;
    const bad = html.replace(right, `thickness t = ${el.thicknessSymbols} = 11.5 mm`);
    expect(bad).not.toBe(html);
    expect(labelledMismatches(bad, e).failures).toContain(`stem t: the record shows “11.5”, the engine's value is “${formatNumber(el.t)}”`);
    expect(unmatchedNumbers(bad, e).some((x) => x.startsWith("11.5 mm — no engine value"))).toBe(true);
  });

  it("an AISC worked result moved by 1 % (F2-4's Fcr, Lp) no longer matches the sheet's", () => {
    const us = CASES.find((c) => c.name.startsWith("AISC 360 LRFD, welded I with a noncompact flange"))!;
    const problem = parseSearchProblem(us.problem);
    const html = renderRecord(us, problem);
    const e = engineFacts(us, problem);
    const l = e.verdict.aisc!.flexure[0]!.ltb!;
    const shown = [formatNumber(l.Fcr!), formatNumber(l.Lp!)];
    l.Fcr! *= 1.01;
    l.Lp! *= 1.01;
    const failures = labelledMismatches(html, e).failures;
    expect(failures).toContain(`sagging F2-4 Fcr: the record shows “${shown[0]}”, the engine's value is “${formatNumber(l.Fcr!)}”`);
    expect(failures).toContain(`sagging worked Lp: the record shows “${shown[1]}”, the engine's value is “${formatNumber(l.Lp!)}”`);
  });

  it("a value shown without the unit conversion (SI number beside a US unit) is caught", () => {
    const us = CASES.find((c) => c.name.startsWith("EN 1993, welded channel"))!;
    const problem = parseSearchProblem(us.problem);
    const e = engineFacts(us, problem);
    const html = renderRecord(us, problem);
    const right = formatQuantity("area", e.properties.area, "us");
    const wrong = `${formatNumber(e.properties.area)} in²`; // the area in mm² labelled in²
    const bad = html.replace(`data-value="true">${right}`, `data-value="true">${wrong}`);
    expect(bad).not.toBe(html);
    expect(labelledMismatches(bad, e).failures).toContain(`property area: the record shows “${wrong}”, the engine's value is “${right}”`);
    expect(unmatchedNumbers(bad, e).some((x) => x.startsWith(`${formatNumber(e.properties.area)} in² — no engine value`))).toBe(true);
  });
});

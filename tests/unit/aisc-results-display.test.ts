// AISC 360-16 results in AISC terms (issue 14's gaps), rendered to HTML on the server: the
// candidate table's columns (Mn, Mn/Ωb or φbMn, LTB zone, Lp, Lr, Cb, Vn, the weld leg) with units
// in SI and US customary, the governing limit state with its equation, the comparison's design
// figures and the restraint study's Cb column.
//
// The section is the W18x50 of AISC Design Examples v15.0, Example F.1-2B (A992, Lb = 11.7 ft,
// Cb = 1.01: Lp = 5.83 ft, Lr = 16.9 ft, Mn = 338.5 kip·ft by F2-2, φbMn = 304.7 kip·ft; FROM
// MEMORY, as in tests/optimizer/aisc360.test.ts, matched within the fillet modelling's 3 %), and
// its plastic-zone counterpart (Lb = 5 ft < Lp: Mn = Mp by F2-1).
import { describe, expect, test } from "vitest";
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { CandidateTable } from "~/components/CandidateTable";
import { DesignFigures } from "~/components/BasisAssumptions";
import { RestraintStudyChart } from "~/components/RestraintStudyChart";
import { CheckTable } from "~/components/CheckTable";
import { Aisc360Checks } from "~/components/Aisc360Record";
import { cautionText } from "~/lib/caution";
import { aiscRow, designRow, isAiscRow } from "~/lib/design-summary";
import { catalogueCandidateChecks, parseSearchProblem, fromSI, toSI, type SearchProblemInput } from "~/optimizer/index";
import { formatNumber } from "~/lib/format";

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&amp;/g, "&").replace(/&#x27;/g, "'").replace(/\s+/g, " ").replace(/\( /g, "(").replace(/ \)/g, ")");
const close = (got: number, want: number, rel: number) => expect(Math.abs(got - want) / Math.abs(want), `got ${got}, want ${want}`).toBeLessThanOrEqual(rel);
const ftm = (ft: number) => toSI("span", ft, "us");
const kipft = (kNm: number) => fromSI("moment", kNm, "us");

// W18x50 (Manual Table 1-1, mem.): d 18.0, bf 7.50, tf 0.570, tw 0.355, kdes 0.972 in
const W18x50 = { designation: "W18x50", shape: "I" as const, dims: { d: toSI("length", 18.0, "us"), b: toSI("length", 7.5, "us"), tf: toSI("length", 0.57, "us"), tw: toSI("length", 0.355, "us"), r: toSI("length", 0.972 - 0.57, "us") } };

function problem(extra: Partial<SearchProblemInput>) {
  return parseSearchProblem({
    basis: "aisc360",
    method: "LRFD",
    aisc: { grade: "A572 Gr 50" },
    moment: { sagging: 1, hogging: 0 },
    shear: 100,
    depth: { min: 100, max: 100, step: 10 },
    width: { min: 100, max: 100, step: 10 },
    thicknesses: [10],
    families: ["i"],
    ...extra,
  });
}

// 300 kip·ft against φbMn ≈ 304.7: LTB governs (φbMp ≈ 379 kip·ft, Table 3-2, mem.)
const M300 = toSI("moment", 300, "us");
const inelastic = (method: "ASD" | "LRFD") => catalogueCandidateChecks(W18x50, problem({ method, moment: { sagging: method === "LRFD" ? M300 : M300 / 1.6 }, restraint: { length: ftm(35 / 3), Cb: 1.01 } }));

describe("the AISC row of a verdict (lib/design-summary.ts)", () => {
  test("inelastic zone: LTB governs by F2-2, Mn ≈ 338.5 kip·ft, φbMn ≈ 304.7, Lp ≈ 5.83 ft, Lr ≈ 16.9 ft, Cb 1.01 (F.1-2B)", () => {
    const v = inelastic("LRFD");
    expect(v.governing).toBe("ltb");
    const row = aiscRow(v)!;
    expect(row).toMatchObject({ basis: "aisc360", method: "LRFD", section: "F2", zone: "inelastic", Cb: 1.01, limitState: "lateral-torsional buckling", equation: "F2-2", governingClause: "AISC 360-16 §F2, Eq. F2-2" });
    close(kipft(row.Mn!), 338.5, 0.03);
    close(kipft(row.MnAvailable!), 304.7, 0.03);
    expect(row.MnAvailable! / row.Mn!).toBeCloseTo(0.9, 12); // φb = 0.90 (§F1)
    close(fromSI("span", row.Lp! / 1000, "us"), 5.83, 0.02);
    close(fromSI("span", row.Lr! / 1000, "us"), 16.9, 0.03);
    // G2.1(a), rolled web: φv = 1.00, Vn = 0.6·Fy·Aw = 0.6 × 50 × 18.0 × 0.355 = 191.7 kips (Table 3-2, mem.)
    close(fromSI("force", row.Vn!, "us"), 191.7, 0.01);
    expect(row.VnAvailable).toBeCloseTo(row.Vn!, 9);
    // a rolled section: no flange-to-web weld
    expect(row.weldLeg).toBeNull();
    expect(designRow(v)).toEqual(row);
  });

  test("ASD: Mn/Ωb with Ωb = 1.67 (§F1); Vn/Ωv with Ωv = 1.50 for the rolled web (G2.1(a))", () => {
    const row = aiscRow(inelastic("ASD"))!;
    expect(row.method).toBe("ASD");
    expect(row.Mn! / row.MnAvailable!).toBeCloseTo(1.67, 12);
    expect(row.Vn! / row.VnAvailable!).toBeCloseTo(1.5, 12);
    close(kipft(row.MnAvailable!), 202.7, 0.03);
  });

  test("plastic zone (Lb = 5 ft < Lp): yielding governs by F2-1; braced throughout: no zone, Lp, Lr or Cb", () => {
    const Mp = catalogueCandidateChecks(W18x50, problem({ restraint: { length: ftm(5), Cb: 1 } })).aisc!.flexure[0].availableLocal;
    const v = catalogueCandidateChecks(W18x50, problem({ moment: { sagging: Mp * 0.99 }, restraint: { length: ftm(5), Cb: 1 } }));
    expect(v.governing).toBe("bending-resistance");
    expect(aiscRow(v)).toMatchObject({ zone: "plastic", limitState: "yielding", equation: "F2-1", governingClause: "AISC 360-16 §F2, Eq. F2-1" });
    const braced = aiscRow(catalogueCandidateChecks(W18x50, problem({ moment: { sagging: Mp * 0.99 } })))!;
    expect(braced).toMatchObject({ zone: null, Lp: null, Lr: null, Cb: null, equation: "F2-1" });
  });

  test("shear governing names G2-1 with its Cv equation", () => {
    const v = catalogueCandidateChecks(W18x50, problem({ moment: { sagging: 1 }, shear: toSI("force", 190, "us") }));
    expect(v.governing).toBe("shear-resistance");
    expect(aiscRow(v)).toMatchObject({ limitState: "shear yielding", equation: "G2-1, G2-2", governingClause: "AISC 360-16 §G2.1, Eq. G2-1, G2-2" });
  });
});

describe("the candidate table and the comparison under AISC 360", () => {
  const v = inelastic("LRFD");
  const row = aiscRow(v)!;
  const item = { rank: 1, family: "i", dimensions: W18x50.dims, massPerMetre: 74.4, utilisation: v.utilisation, governing: v.governing, onFront: true, design: row, source: "rolled" as const, designation: "W18x50", catalogue: "test" };
  const table = (method: "ASD" | "LRFD", units: "si" | "us") =>
    text(
      renderToString(
        createElement(CandidateTable, {
          sweepId: 1,
          initial: { items: [item], total: 1, page: 1, pageSize: 50 },
          families: ["i"],
          withCost: false,
          basis: "aisc360",
          method,
          withRolled: true,
          units,
          selected: null,
          onSelect: () => {},
          compare: [],
          onCompare: () => {},
        }),
      ),
    );

  test("SI, LRFD: AISC heads with units, the row's figures, no EN 1993 column, the limit state and its equation", () => {
    const t = table("LRFD", "si");
    expect(t).toMatch(/Chapter F Mn \(kN·m\) φbMn \(kN·m\) LTB zone Lp \(m\) Lr \(m\) Cb Vn \(kN\) φvVn \(kN\) Weld w \(mm\)/);
    expect(t).not.toMatch(/Mcr|χLT|Mb,Rd|VRd|stresses only/);
    expect(t).toContain(`F2 ${formatNumber(row.Mn!)} ${formatNumber(row.MnAvailable!)} inelastic ${formatNumber(row.Lp! / 1000)} ${formatNumber(row.Lr! / 1000)} 1.01 ${formatNumber(row.Vn!)} ${formatNumber(row.VnAvailable!)} —`);
    expect(t).toContain("lateral-torsional buckling AISC 360-16 §F2, Eq. F2-2");
    expect(t).toContain("φbMn and φvVn are the design strengths");
  });

  test("US customary, ASD: kip·ft, kip, ft and Ω in the heads, figures converted", () => {
    const t = table("ASD", "us");
    expect(t).toMatch(/Mn \(kip·ft\) Mn\/Ωb \(kip·ft\) LTB zone Lp \(ft\) Lr \(ft\) Cb Vn \(kip\) Vn\/Ωv \(kip\) Weld w \(in\)/);
    expect(t).toContain(`${formatNumber(kipft(row.Mn!))} `);
    expect(t).toContain(` ${formatNumber(fromSI("span", row.Lp! / 1000, "us"))} `);
    expect(t).toContain("Mn/Ωb and Vn/Ωv are the allowable strengths");
  });

  test("the comparison's figures: method, §F2, φbMn, zone, Lp and Lr in ft, Cb, the governing equation", () => {
    const t = text(renderToString(createElement(DesignFigures, { verdict: v, units: "us" })));
    expect(t).toContain("Method LRFD Chapter F §F2");
    expect(t).toMatch(/φbMn [\d.,]+ kip·ft/);
    expect(t).toContain("LTB zone inelastic");
    expect(t).toMatch(/Lp, Lr 5\.\d+ ft, 1[67]\.\d+ ft/);
    expect(t).toContain("Cb 1.01");
    expect(t).toContain("Governs lateral-torsional buckling (AISC 360-16 §F2, Eq. F2-2)");
    expect(isAiscRow(row)).toBe(true);
  });
});

describe("the restraint study under AISC 360", () => {
  test("a Cb column and the caption's choice: the brief's Cb at L, 1.0 between braces", () => {
    const best = { family: "i", dimensions: { d: 400, b: 200, tf: 12, tw: 8 }, massPerMetre: 50, utilisation: 0.9, governing: "ltb" };
    const study = { lengthM: 6, elapsedMs: 10, points: [0, 1, 2].map((k) => ({ restraints: k, lengthM: 6 / (k + 1), Cb: k === 0 ? 1.136 : 1, best: { ...best, massPerMetre: 50 - 5 * k } })) };
    const t = text(renderToString(createElement(RestraintStudyChart, { study, units: "si" })));
    expect(t).toContain("Spacing Lb Cb");
    expect(t).toMatch(/6 m 1\.136 /);
    expect(t).toMatch(/3 m 1 /);
    expect(t).toContain("Cb is the brief's at L (1.136) and 1.0 between intermediate braces");
    // an EN 1993 study (no Cb on its points) keeps its own heads
    const en = text(renderToString(createElement(RestraintStudyChart, { study: { ...study, points: study.points.map(({ Cb: _c, ...p }) => p) }, units: "si" })));
    expect(en).not.toContain("Cb");
  });
});

describe("the check table, the caution and the record's lines name AISC 360's clauses (product.md, Safety)", () => {
  test("the check table: no 'stresses only' under AISC, AISC words with the method's symbols, the equation beside each check", () => {
    const v = inelastic("LRFD");
    const t = text(renderToString(createElement(CheckTable, { verdict: v, units: "si" })));
    expect(t).not.toContain("stresses only");
    expect(t).toContain("Lateral-torsional buckling over Lb Mu ≤ φbMn (governs)");
    expect(t).toContain("Flexure, yielding and local buckling Mu ≤ φbMn");
    expect(t).toContain("Shear Vu ≤ φvVn");
    // the clause column: the Chapter F section and equation that set each strength (F.1-2B: F2-2 in the inelastic zone)
    expect(t).toMatch(/Lateral-torsional buckling over Lb Mu ≤ φbMn \(governs\) [\d.,]+ [\d.,]+ kN·m [\d.]+ AISC 360-16 §F2, Eq\. F2-2/);
    expect(t).toMatch(/Flexure, yielding and local buckling Mu ≤ φbMn [\d.,]+ [\d.,]+ kN·m [\d.]+ AISC 360-16 §F2, Eq\. F2-1/);
    expect(t).toMatch(/Shear Vu ≤ φvVn [\d.,]+ [\d.,]+ kN [\d.]+ AISC 360-16 §G2\.1, Eq\. G2-1, G2-2/);
    expect(t).not.toMatch(/Mc,Rd|Mb,Rd|Vpl,Rd/);
    const asd = text(renderToString(createElement(CheckTable, { verdict: inelastic("ASD"), units: "si", compact: true })));
    expect(asd).toContain("Lateral-torsional buckling over Lb Ma ≤ Mn/Ωb");
    expect(asd).toContain("AISC 360-16 §F2, Eq. F2-2");
  });

  test("the caution on AISC results: what it covers, what it leaves out (product.md's list) and its stated choices", () => {
    const p = problem({ method: "ASD", restraint: { length: 6, Cb: 1.136 } });
    const t = cautionText(p);
    expect(t).toMatch(/^Sparwise is a sizing aid\. On the AISC 360-16 basis \(ASD: available strength Rn\/Ω\)/);
    expect(t).toMatch(/cover only width-to-thickness classification \(AISC 360-16 Table B4\.1b.*Chapter F flexure.*lateral-torsional buckling over the stated unbraced length Lb with Cb.*G2\.1/);
    expect(t).toMatch(/do not cover web local yielding or crippling at supports \(bearing stiffeners are assumed there and must be provided\), web local yielding or crippling under concentrated loads within the span, .*connections, fatigue, fire, load combinations, torsion/);
    expect(t).toMatch(/choices stated in the record \(equations marked "mem\." .*channels' flange local buckling by F3's expressions/);
    expect(t).toContain("approved by a licensed engineer before fabrication");
    const unstiffened = cautionText({ ...p, supports: { stiffened: false } });
    expect(unstiffened).toContain("web local yielding and web crippling at an end support (J10.2, J10.3)");
    expect(cautionText({ ...p, restraint: undefined })).toContain("do not cover lateral-torsional buckling (the compression flange is taken as braced throughout)");
    expect(cautionText({ ...p, method: "LRFD" })).toContain("LRFD: available strength φRn");
  });

  test("every line of the record's AISC part names its section, equation or table (or says it is an assumption)", () => {
    const v = inelastic("ASD");
    const p = problem({ method: "ASD", moment: { sagging: M300 / 1.6 }, restraint: { length: ftm(35 / 3), Cb: 1.01 } });
    const html = renderToString(createElement(Aisc360Checks, { problem: p, verdict: v }));
    const cells = [...html.matchAll(/<tr class="align-top"><td[^>]*>([^<]*)<\/td>/g)].map((m) => m[1]!.replace(/&amp;/g, "&"));
    expect(cells.length).toBeGreaterThan(6);
    for (const c of cells) expect(c).toMatch(/^(AISC 360-16 (§|Eq\. |Table )[A-Z]|assumption$)/);
    expect(cells).toContain("AISC 360-16 Eq. F2-2");
    expect(cells).toContain("AISC 360-16 §F2");
  });
});

// Issue 11, item 1: the SI / US switch never changes the brief. Stored values are SI and change
// only when the user edits that field; any number of unit switches and then a save leave the
// problem byte-identical. Over random briefs (fast-check), through the same pure functions the
// editor runs (switchShownUnits) and the same schema the server parses with (briefFormSchema).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { parseWithZod } from "@conform-to/zod/v4";
import { briefFormSchema, DEFAULT_PROBLEM, FIELD_QUANTITIES, pathQuantity, problemToFormDefaults, readSiMemo, switchShownUnits, type BriefParsed } from "~/lib/brief-form";
import { formFields } from "./form-data";
import { searchProblemSchema, type SearchProblem } from "~/optimizer/search-schema";
import type { UnitSystem } from "~/optimizer/units";

const NUMERIC = Object.keys(FIELD_QUANTITIES);

/** A number as a person types it: up to 9 significant figures, 0–4 decimals. */
const typed = (min: number, max: number) =>
  fc.tuple(fc.integer({ min: Math.round(min * 1e4), max: Math.round(max * 1e4) }), fc.integer({ min: 0, max: 4 })).map(([n, k]) => {
    const x = Math.round(n / 10 ** (4 - k)) / 10 ** k;
    return Number(x.toFixed(k));
  });

const arbProblem: fc.Arbitrary<SearchProblem> = fc
  .record({
    sagging: typed(1, 900),
    hogging: fc.oneof(fc.constant(0), typed(0.5, 400)),
    shear: fc.option(typed(1, 500), { nil: undefined }),
    tension: typed(50, 400),
    compression: typed(50, 400),
    aShear: typed(30, 250),
    dMin: typed(50, 500),
    dSpan: typed(0, 600),
    dStep: typed(1, 50),
    wMin: typed(20, 200),
    wSpan: typed(0, 400),
    wStep: typed(1, 50),
    // Close stock thicknesses too: 59.998 and 59.9981 mm print alike in inches and once merged on a
    // switch with no remembered values; one in three lists carries such a pair.
    thicknesses: fc.oneof(
      fc.uniqueArray(typed(3, 60), { minLength: 1, maxLength: 8 }),
      fc.uniqueArray(typed(3, 60), { minLength: 1, maxLength: 6 }).chain((ts) =>
        fc.integer({ min: 1, max: 9 }).map((k) => [...new Set([...ts, Math.round((ts[0] + k * 1e-4) * 1e4) / 1e4])]),
      ),
    ),
    families: fc.subarray(["i", "channel", "tee", "box", "channel-down", "mono-i", "angle"] as const, { minLength: 1 }),
    density: typed(2000, 9000),
    deflection: fc.option(fc.record({ span: typed(0.5, 30), serviceLoad: typed(0.1, 80), limitRatio: typed(100, 800), E: typed(50000, 220000) }), { nil: undefined }),
    // EN 1993 briefs too: their steel bands, fu, E, restraint and fabrication are numbers with units.
    en: fc.option(
      fc.record({
        band1: typed(8, 20),
        band2: typed(21, 80),
        fy1: typed(200, 460),
        fy2: typed(180, 440),
        fu: typed(300, 600),
        restraint: fc.option(typed(0.5, 12), { nil: undefined }),
        minThickness: fc.option(typed(2, 8), { nil: undefined }),
        minBoxClear: fc.option(typed(50, 150), { nil: undefined }),
      }),
      { nil: undefined },
    ),
  })
  .map((r) => ({
    moment: { sagging: r.sagging, hogging: r.hogging },
    ...(r.shear !== undefined ? { shear: r.shear } : {}),
    allowable: { tension: r.tension, compression: r.compression, shear: r.aShear },
    depth: { min: r.dMin, max: r.dMin + r.dSpan, step: r.dStep },
    width: { min: r.wMin, max: r.wMin + r.wSpan, step: r.wStep },
    thicknesses: r.thicknesses.filter((t) => t > 0),
    families: [...r.families],
    slenderness: { outstand: 15, web: 120 },
    density: r.density,
    ...(r.deflection ? { deflection: r.deflection } : {}),
    ...(r.en
      ? {
          basis: "en1993" as const,
          allowable: undefined,
          slenderness: undefined,
          families: r.families.filter((f) => f !== "angle" && f !== "channel-down"),
          thicknesses: r.thicknesses.filter((t) => t > 0 && t <= r.en!.band2),
          steel: { fy: [{ maxThickness: r.en.band1, fy: r.en.fy1 }, { maxThickness: r.en.band2, fy: r.en.fy2 }], fu: r.en.fu },
          ...(r.en.restraint !== undefined ? { restraint: { length: r.en.restraint } } : {}),
          ...(r.en.minThickness !== undefined || r.en.minBoxClear !== undefined
            ? { fabrication: { ...(r.en.minThickness !== undefined ? { minThickness: r.en.minThickness } : {}), ...(r.en.minBoxClear !== undefined ? { minBoxClear: r.en.minBoxClear } : {}) } }
            : {}),
        }
      : {}),
  }))
  .map((p) => searchProblemSchema.safeParse(p))
  .filter((r) => r.success)
  .map((r) => r.data!);

const arbSwitches = fc.array(fc.constantFrom<UnitSystem>("si", "us"), { maxLength: 7 });

/** The form as posted: every default by its posted name, the shown numbers replaced. */
function post(defaults: Record<string, unknown>, shown: Record<string, string>, memo: string, units: UnitSystem): FormData {
  const fields = formFields({ ...defaults, units, siValues: memo });
  for (const [k, v] of Object.entries(shown)) {
    delete fields[k];
    if (v !== "") fields[k] = v;
  }
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) for (const one of Array.isArray(v) ? v : [v]) fd.append(k, one);
  return fd;
}

/** The shown numbers of a form's defaults: every field with a quantity (the editor's data-quantity inputs) and the thickness list. */
function shownOf(defaults: Record<string, unknown>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(formFields(defaults))) if (pathQuantity(k)) out[k] = String(v);
  for (const f of NUMERIC) out[f] ??= "";
  out.thicknesses = String(defaults.thicknesses);
  return out;
}

function parse(fd: FormData): BriefParsed {
  const s = parseWithZod(fd, { schema: briefFormSchema });
  if (s.status !== "success") throw new Error(JSON.stringify(s.reply().error));
  return s.value;
}

/** Runs the switches in order from `start`; returns what is shown, the memo and the final units. */
function runSwitches(shown: Record<string, string>, memo: string, start: UnitSystem, switches: UnitSystem[]) {
  let units = start,
    m = readSiMemo(memo),
    s = shown;
  for (const next of switches) {
    const r = switchShownUnits(s, m, units, next);
    s = r.shown;
    m = r.memo;
    units = next;
  }
  return { shown: s, memo: JSON.stringify(m), units };
}

describe("unit switches never change the brief (property)", () => {
  it("a stored brief opened in either system, switched any number of times and saved, is byte-identical", () => {
    fc.assert(
      fc.property(arbProblem, fc.constantFrom<UnitSystem>("si", "us"), arbSwitches, typed(0.5, 40), (problem, start, switches, lengthM) => {
        const defaults = problemToFormDefaults(problem, { units: start, name: "P", memberLengthM: lengthM, memberCount: 3 });
        const r = runSwitches(shownOf(defaults), String(defaults.siValues), start, switches);
        const saved = parse(post(defaults, r.shown, r.memo, r.units));
        expect(JSON.stringify(saved.problem)).toBe(JSON.stringify(problem));
        expect(saved.meta.memberLengthM).toBe(lengthM);
      }),
      { numRuns: 300, seed: 20261203 },
    );
  }, 60_000);

  it("a brief typed in one system (no remembered values) saves the same problem after any number of switches", () => {
    fc.assert(
      fc.property(arbProblem, fc.constantFrom<UnitSystem>("si", "us"), arbSwitches, (problem, start, switches) => {
        // The values the person typed: the problem's numbers, read as typed in `start` units.
        const defaults = problemToFormDefaults(problem, { units: "si", name: "T" });
        const shown = shownOf(defaults);
        const first = parse(post(defaults, shown, "", start));
        const r = runSwitches(shown, "", start, switches);
        const saved = parse(post(defaults, r.shown, r.memo, r.units));
        expect(JSON.stringify(saved.problem)).toBe(JSON.stringify(first.problem));
      }),
      { numRuns: 300, seed: 20261203 },
    );
  }, 60_000);

  it("an edited field takes what was typed; the others keep their exact SI values", () => {
    const defaults = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "E" });
    const shown = { ...shownOf(defaults), "depth.max": "300", "width.min": "50", thicknesses: "6, 8" };
    const typedSi = parse(post(defaults, shown, String(defaults.siValues), "si"));
    // Typed in SI, switched to US and saved: the case the issue found stored 299.999 mm and "5.99999, 8.00001".
    const us = runSwitches(shown, String(defaults.siValues), "si", ["us"]);
    expect(us.shown["depth.max"]).toBe("11.811");
    const savedUs = parse(post(defaults, us.shown, us.memo, "us"));
    expect(savedUs.problem.depth.max).toBe(300);
    expect(savedUs.problem.width.min).toBe(50);
    expect(savedUs.problem.thicknesses).toEqual([6, 8]);
    expect(savedUs.problem.density).toBe(7850);
    expect(JSON.stringify(savedUs.problem)).toBe(JSON.stringify(typedSi.problem));
    // Then an edit in US: 12 in is 304.8 mm exactly (1 in = 25.4 mm, NIST SP 811 App. B); nothing else moves.
    const edited = parse(post(defaults, { ...us.shown, "depth.max": "12" }, us.memo, "us"));
    expect(edited.problem.depth.max).toBeCloseTo(304.8, 9);
    expect({ ...edited.problem, depth: savedUs.problem.depth }).toEqual(savedUs.problem);
  });

  it("thicknesses closer than the display's six figures stay apart through switches with no remembered values", () => {
    const defaults = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "C" });
    const shown = { ...shownOf(defaults), thicknesses: "59.998, 59.9981, 8" };
    const first = parse(post(defaults, shown, "", "si"));
    expect(first.problem.thicknesses).toEqual([59.998, 59.9981, 8]);
    const r = runSwitches(shown, "", "si", ["us", "si", "us"]);
    // both show as 2.36213 in, yet each keeps its own mm value
    expect(r.shown.thicknesses).toBe("2.36213, 2.36213, 0.314961");
    expect(parse(post(defaults, r.shown, r.memo, r.units)).problem.thicknesses).toEqual([59.998, 59.9981, 8]);
  });

  it("US thicknesses from a stock list keep the stock's own mm values", () => {
    const defaults = problemToFormDefaults(DEFAULT_PROBLEM, { units: "us", name: "S" });
    // 1/4 in and 3/8 in plate listed in mm as 6.35 and 9.525 (exact: 1 in = 25.4 mm).
    const shown = { ...shownOf(defaults), thicknesses: "0.25, 0.375" };
    const r = switchShownUnits(shown, { ...readSiMemo(String(defaults.siValues)), thicknesses: [6.35, 9.525] }, "us", "si");
    expect(r.shown.thicknesses).toBe("6.35, 9.525");
    const back = switchShownUnits(r.shown, r.memo, "si", "us");
    expect(back.shown.thicknesses).toBe("0.25, 0.375");
    expect(parse(post(defaults, back.shown, JSON.stringify(back.memo), "us")).problem.thicknesses).toEqual([6.35, 9.525]);
  });

  it("a preset's E alone asks for no deflection check, and the brief keeps it", () => {
    const defaults = problemToFormDefaults(DEFAULT_PROBLEM, { units: "si", name: "E" }) as Record<string, any>;
    const saved = parse(post({ ...defaults, deflection: { E: 210000 } }, {}, String(defaults.siValues), "si"));
    expect(saved.problem.deflection).toBeUndefined();
    expect(saved.meta.elasticModulus).toBe(210000);
    const reopened = problemToFormDefaults(saved.problem, { units: "us", name: "E", elasticModulus: saved.meta.elasticModulus }) as Record<string, any>;
    // 210 000 MPa = 30 457.9 ksi at six figures (1 ksi = 6.894757 MPa, NIST SP 811 App. B).
    expect(reopened.deflection.E).toBe(30457.9);
  });
});

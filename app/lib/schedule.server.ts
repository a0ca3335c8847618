// The project's member schedule: every saved option with its mark, section, mass and quantity,
// for the printable page and the CSV download.
//
// Choices (spec silent): briefs carry no member mark column, so the mark is the brief's name
// (else "Option N"); length and count are the ones the option's sweep ran for (a recheck may
// alter them), else the brief's — the same rule getOption uses, and a revised option's own; the weld throat is the engine's
// EN 1993 design.weld.a (null under the allowable-stress basis or with no welds). A rolled option
// (issue 13) is named by its designation, checked by the catalogue rules (no flange-to-web weld,
// so no throat) and marked rolled, which keeps it off the plate cutting list.
import Papa from "papaparse";
import { plainNumbers } from "~/lib/plain-numbers";
import { db, parseJson } from "~/lib/db.server";
import { familyLabel } from "~/lib/labels";
import { optionVerdict, type ReviewState, type SavedCandidate } from "~/lib/options.server";
import { DEFAULT_DENSITY } from "~/optimizer/schema";
import { memberMark } from "~/lib/record-document";
import { revisionLetter } from "~/lib/revisions";
import type { SearchProblem } from "~/optimizer/search-schema";

export interface ScheduleRow {
  optionId: number;
  mark: string;
  family: SavedCandidate["family"];
  dimensions: Record<string, number>;
  /** kg/m³, the problem's */
  density: number;
  section: string;
  massPerMetre: number;
  lengthM: number | null;
  count: number | null;
  /** kg; null when length or count is unknown */
  totalMass: number | null;
  /** EN 1993: the flange-to-web fillet's throat a, mm (EN 1993-1-8 §4.5.3.3) */
  weldThroat: number | null;
  /** AISC 360: the flange-to-web fillet's leg size w, mm (AISC 360-16 §J2.4); the basis sizes legs, not throats */
  weldLeg: number | null;
  reviewState: ReviewState;
  /** a catalogue (rolled) section, not cut from plate */
  rolled?: boolean;
  /** the current record revision's letter */
  revision: string;
}

export function sectionDescription(c: Pick<SavedCandidate, "family" | "dimensions" | "source" | "designation">): string {
  if (c.source === "rolled" && c.designation) return `${c.designation} (rolled ${familyLabel(c.family).toLowerCase()})`;
  const dims = Object.entries(c.dimensions).map(([k, v]) => `${k} ${v}`);
  return `${familyLabel(c.family)} ${dims.join(" × ")} mm`;
}

export async function projectSchedule(projectId: number): Promise<ScheduleRow[]> {
  const rows = await db("options as o")
    .leftJoin("briefs as b", "b.id", "o.brief_id")
    .leftJoin("sweeps as s", "s.id", "o.sweep_id")
    // the current record revision's basis and member, when the option has been revised
    .leftJoin("record_revisions as r", function () {
      this.on("r.option_id", "o.id").andOn("r.number", "o.revision");
    })
    .where("o.project_id", projectId)
    .orderBy("o.id")
    .select(
      "o.id",
      "o.candidate",
      "o.problem",
      "o.review_state",
      "o.revision",
      "r.problem as rev_problem",
      "r.member_length_m as rev_member_length_m",
      "r.member_count as rev_member_count",
      "b.name as brief_name",
      "b.member_length_m",
      "b.member_count",
      "s.member_length_m as sweep_member_length_m",
      "s.member_count as sweep_member_count",
    );
  return rows.map((r: Record<string, unknown>) => {
    const c = parseJson<SavedCandidate>(r.candidate);
    const revised = r.rev_problem != null;
    const problem = parseJson<SearchProblem>(revised ? r.rev_problem : r.problem);
    const lengthM = revised ? ((r.rev_member_length_m as number | null) ?? null) : ((r.sweep_member_length_m as number | null) ?? (r.member_length_m as number | null) ?? null);
    const count = revised ? ((r.rev_member_count as number | null) ?? null) : ((r.sweep_member_count as number | null) ?? (r.member_count as number | null) ?? null);
    let weldThroat: number | null = null;
    let weldLeg: number | null = null;
    try {
      const v = optionVerdict({ candidate: c }, problem);
      weldThroat = v.design?.weld?.a ?? null;
      weldLeg = v.aisc?.weld?.w ?? null;
    } catch {
      // a saved section the engine no longer accepts: the schedule still lists it, without a throat
    }
    return {
      optionId: r.id as number,
      mark: memberMark(r.brief_name as string | null, r.id as number),
      family: c.family,
      dimensions: c.dimensions,
      // a stored problem saved before the schema filled its default carries none: the engine's default then, as the properties used
      density: problem.density ?? DEFAULT_DENSITY,
      section: sectionDescription(c),
      massPerMetre: c.massPerMetre,
      lengthM,
      count,
      totalMass: lengthM != null && count != null ? c.massPerMetre * lengthM * count : null,
      weldThroat,
      weldLeg,
      reviewState: r.review_state as ReviewState,
      ...(c.source === "rolled" ? { rolled: true } : {}),
      revision: revisionLetter((r.revision as number | undefined) ?? 1),
    };
  });
}

export const SCHEDULE_CSV_FIELDS = ["option", "mark", "section", "mass_kg_per_m", "length_m", "count", "total_mass_kg", "weld_throat_mm", "weld_leg_mm", "review_state", "revision"] as const;

export function scheduleCsv(rows: ScheduleRow[]): string {
  const blank = (x: number | null) => (x == null ? "" : x);
  return (
    Papa.unparse({
      fields: [...SCHEDULE_CSV_FIELDS],
      data: plainNumbers(rows.map((r) => [r.optionId, r.mark, r.section, r.massPerMetre, blank(r.lengthM), blank(r.count), blank(r.totalMass), blank(r.weldThroat), blank(r.weldLeg), r.reviewState, r.revision])),
    }) + "\n"
  );
}

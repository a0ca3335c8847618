import type { Knex } from "knex";
import { recordFinishedSweep } from "../../app/lib/finished-sweep.server";
import type { SearchProblemInput } from "../../app/optimizer";

// Demo projects of the invented fabricator Tallowfield Plate & Beam (01_demo.ts): every client,
// site and number here is fictional demo data. The sweeps are real: the engine runs here and
// the results are written as the queue writes a finished sweep. Idempotent: skipped when the
// first demo project exists.
const MEZZANINE = "Harbour Street cold store: mezzanine";
const RUNWAY = "Copperbeck workshop: monorail and platform";

const base = {
  allowable: { tension: 165, compression: 165, shear: 100 },
  thicknesses: [6, 8, 10, 12, 15, 20, 25],
  slenderness: { outstand: 15, internal: 40, web: 120, stem: 20 },
};

const BRIEFS: { project: string; name: string; units: "si" | "us"; length: number; count: number; problem: SearchProblemInput }[] = [
  {
    project: MEZZANINE,
    name: "Primary beam, grid B",
    units: "si",
    length: 7.2,
    count: 6,
    problem: { ...base, moment: { sagging: 120, hogging: 0 }, shear: 80, depth: { min: 150, max: 400, step: 10 }, width: { min: 50, max: 250, step: 10 }, families: ["channel", "i", "tee", "box"] },
  },
  {
    project: MEZZANINE,
    name: "Edge channel, lightest",
    units: "si",
    length: 4.8,
    count: 14,
    problem: { ...base, moment: { sagging: 45, hogging: 0 }, shear: 40, depth: { min: 100, max: 300, step: 10 }, width: { min: 50, max: 150, step: 10 }, families: ["channel"] },
  },
  {
    project: RUNWAY,
    name: "Platform beam over hoist bay",
    units: "us",
    length: 6.096,
    count: 4,
    problem: {
      ...base,
      moment: { sagging: 95, hogging: 30 },
      shear: 70,
      depth: { min: 152.4, max: 406.4, step: 25.4 },
      width: { min: 76.2, max: 254, step: 25.4 },
      thicknesses: [6.35, 7.9375, 9.525, 12.7, 15.875, 19.05, 25.4],
      families: ["i", "box"],
      deflection: { span: 6.096, serviceLoad: 12, limitRatio: 360, E: 200000 },
    },
  },
];

export async function seed(knex: Knex): Promise<void> {
  const team = await knex("teams").where({ slug: "tallowfield" }).first("id");
  if (!team) return;
  if (await knex("projects").where({ team_id: team.id, name: MEZZANINE }).first("id")) return;
  const user = async (email: string) => (await knex("users").where({ email }).first("id", "name")) as { id: number; name: string };
  const engineer = await user("engineer@tallowfield.example");
  const engineer2 = await user("engineer2@tallowfield.example");
  const reviewer = await user("reviewer@tallowfield.example");
  if (!engineer || !reviewer || !engineer2) return;

  const projects = new Map<string, number>();
  for (const [name, client, description, owner, jobNumber] of [
    [MEZZANINE, "Kellsbury Fresh Foods (fictional)", "Two-bay storage mezzanine inside the cold store; built-up plate beams from our own stock.", engineer.id, "TPB-2611"],
    [RUNWAY, "Copperbeck Pumps (fictional)", "Access platform beside the 2 t monorail in the repair workshop.", engineer2.id, "TPB-2604"],
  ] as const) {
    const [id] = await knex("projects").insert({ team_id: team.id, name, client, description, job_number: jobNumber, created_by: owner });
    projects.set(name, Number(id));
    for (const m of [engineer.id, engineer2.id, reviewer.id]) await knex("project_members").insert({ project_id: id, user_id: m });
    await knex("activity_log").insert({ team_id: team.id, project_id: id, user_id: owner, action: "project_created", subject_type: "project", subject_id: id });
  }

  const [stockId] = await knex("stock_lists").insert({ team_id: team.id, name: "Tallowfield plate stock 2026", created_by: engineer.id });
  const prices: Record<number, number> = { 6: 1.18, 8: 1.15, 10: 1.12, 12: 1.1, 15: 1.1, 20: 1.08, 25: 1.08 };
  for (const t of base.thicknesses) await knex("stock_list_items").insert({ stock_list_id: stockId, thickness_mm: t, width_mm: 2000, price_per_kg: prices[t] });

  const sweeps: number[] = [];
  for (const b of BRIEFS) {
    const projectId = projects.get(b.project)!;
    const owner = b.project === MEZZANINE ? engineer.id : engineer2.id;
    const [briefId] = await knex("briefs").insert({ project_id: projectId, name: b.name, problem: JSON.stringify(b.problem), units: b.units, member_length_m: b.length, member_count: b.count, created_by: owner });
    await knex("activity_log").insert({ team_id: team.id, project_id: projectId, user_id: owner, action: "brief_created", subject_type: "brief", subject_id: briefId });
    const sweepId = await recordFinishedSweep(knex, { teamId: team.id, ownerId: owner, projectId, briefId: Number(briefId), problem: b.problem });
    await knex("activity_log").insert({ team_id: team.id, project_id: projectId, user_id: owner, action: "sweep_started", subject_type: "sweep", subject_id: sweepId });
    sweeps.push(sweepId);
  }

  // The primary beam's lightest section, saved and waiting for the reviewer.
  const mezzanine = projects.get(MEZZANINE)!;
  const sweep = await knex("sweeps").where({ id: sweeps[0] }).first("problem", "brief_id");
  const best = await knex("candidates").where({ sweep_id: sweeps[0], rank: 1 }).first();
  if (!best) return;
  const dims = typeof best.dimensions === "string" ? JSON.parse(best.dimensions) : best.dimensions;
  const [optionId] = await knex("options").insert({
    project_id: mezzanine,
    brief_id: sweep.brief_id,
    sweep_id: sweeps[0],
    candidate: JSON.stringify({ family: best.family, dimensions: dims, area: best.area, massPerMetre: best.mass_per_metre, utilisation: best.utilisation, governing: best.governing, rank: 1 }),
    problem: typeof sweep.problem === "string" ? sweep.problem : JSON.stringify(sweep.problem),
    note: "Lightest overall; fits under the duct run.",
    review_state: "in_review",
    created_by: engineer.id,
  });
  await knex("reviews").insert({ option_id: optionId, user_id: engineer.id, decision: "requested", comment: "Please check before we order plate." });
  await knex("activity_log").insert([
    { team_id: team.id, project_id: mezzanine, user_id: engineer.id, action: "option_saved", subject_type: "option", subject_id: optionId },
    { team_id: team.id, project_id: mezzanine, user_id: engineer.id, action: "review_requested", subject_type: "option", subject_id: optionId },
  ]);
  // the project's first option, so its number there is 1
  await knex("notifications").insert({ user_id: reviewer.id, title: `Review requested: option 1 in ${MEZZANINE}`, body: `${engineer.name}: primary beam, grid B`, link: `/options/${optionId}` });
}

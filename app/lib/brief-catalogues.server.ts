// The brief's catalogues and costs (issue 13), added on the server after the brief form parsed:
// the chosen catalogues' sections are copied into the problem (so the brief and every sweep of it
// keep what they searched), and with the cost objective the team's cost settings fill the price of
// rolled sections, the weld costs and, when the form brought none, the plate prices. The combined
// problem is checked again by the engine's schema, so a rule that spans both (cost with catalogues
// needs a rolled price) is named like any other.
import { z } from "zod";
import { catalogueSectionsFor, listCatalogues } from "~/lib/catalogues.server";
import { getTeamCosts } from "~/lib/team-costs.server";
import { CATALOGUE_SHAPES, MAX_CATALOGUES, searchProblemSchema, type CatalogueShape, type SearchProblem } from "~/optimizer";

/** What the brief editor offers: the team's catalogues and the shapes in each. */
export interface BriefCatalogueChoice {
  id: number;
  name: string;
  sections: number;
}

export async function listCatalogueChoices(teamId: number): Promise<BriefCatalogueChoice[]> {
  return (await listCatalogues(teamId)).map((c) => ({ id: c.id, name: c.name, sections: c.sections }));
}

const keepSchema = z.array(z.coerce.number({ error: "catalogueKeep: must be catalogue numbers" }).int("catalogueKeep: must be whole numbers").min(0, "catalogueKeep: no such catalogue in the original sweep").max(MAX_CATALOGUES - 1, "catalogueKeep: no such catalogue in the original sweep"));

const choiceSchema = z.object({
  catalogueIds: z
    .array(z.coerce.number({ error: "catalogueIds: must be catalogue ids" }).int("catalogueIds: must be whole numbers").positive("catalogueIds: must be catalogue ids").max(2 ** 31 - 1, "catalogueIds: must be catalogue ids"))
    .max(MAX_CATALOGUES, `catalogueIds: at most ${MAX_CATALOGUES} catalogues`),
  catalogueShapes: z.array(z.enum(CATALOGUE_SHAPES, { error: `catalogueShapes: one of ${CATALOGUE_SHAPES.join(", ")}` })),
});

export type BriefCataloguesResult = { ok: true; problem: SearchProblem } | { ok: false; message: string };

/**
 * The problem with the chosen catalogues and the team's costs. The editor marks that it showed
 * the choice (catalogueChoice=1); a form without it (an older page, the API) keeps the problem's
 * own catalogues as parsed, i.e. none.
 *
 * A recheck passes the original sweep's problem (`original`). Its catalogues are offered as they
 * were searched (catalogueKeep=index: the copied sections, not the team's catalogue as it is now,
 * so a recheck that alters only limits searches the same sections and its comparison is like for
 * like); the team's other catalogues can be added by id. Its costs are kept too when it had some
 * and the objective is still cost; only a recheck that newly asks for cost takes the team's.
 * A recheck form without the choice keeps the original's catalogues whole.
 */
export async function withBriefCatalogues(form: FormData, teamId: number, problem: SearchProblem, original?: SearchProblem): Promise<BriefCataloguesResult> {
  let next: Record<string, unknown> = { ...problem };
  if (original?.catalogues?.length) next.catalogues = original.catalogues;
  if (form.get("catalogueChoice") === "1") {
    const parsed = choiceSchema.safeParse({
      catalogueIds: form.getAll("catalogueIds").filter((v) => typeof v === "string" && v !== ""),
      catalogueShapes: form.getAll("catalogueShapes").filter((v) => typeof v === "string" && v !== ""),
    });
    if (!parsed.success) return { ok: false, message: parsed.error.issues[0]!.message };
    const keep = keepSchema.safeParse(form.getAll("catalogueKeep").filter((v) => typeof v === "string" && v !== ""));
    if (!keep.success) return { ok: false, message: keep.error.issues[0]!.message };
    const kept = [...new Set(keep.data)].map((i) => original?.catalogues?.[i]);
    if (kept.some((c) => !c)) return { ok: false, message: "catalogueKeep: no such catalogue in the original sweep" };
    const ids = [...new Set(parsed.data.catalogueIds)];
    const found = await catalogueSectionsFor(teamId, ids);
    if (found.length !== ids.length) return { ok: false, message: "catalogueIds: no such catalogue in your team" };
    const shapes = parsed.data.catalogueShapes as CatalogueShape[];
    const filter = shapes.length && shapes.length < CATALOGUE_SHAPES.length ? { shapes } : {};
    const keptNames = new Set(kept.map((c) => c!.name));
    const catalogues = [
      ...kept.map((c) => ({ name: c!.name, ...filter, sections: c!.sections })),
      // a team catalogue of the same name as a kept one would search the same name twice: the kept copy wins
      ...found.filter((c) => c.sections.length && !keptNames.has(c.name)).map((c) => ({ name: c.name, ...filter, sections: c.sections })),
    ];
    delete next.catalogues;
    if (catalogues.length) next.catalogues = catalogues;
  }
  if (problem.objective === "cost") {
    if (original?.objective === "cost" && original.costs) next.costs = original.costs;
    else {
      const costs = await getTeamCosts(teamId);
      next.costs = {
        ...(costs.rolledPricePerKg !== null ? { rolledPricePerKg: costs.rolledPricePerKg } : {}),
        ...(costs.weld.length ? { weld: costs.weld } : {}),
      };
      if (!problem.prices?.length && costs.platePrices.length) next.prices = costs.platePrices;
    }
  }
  const checked = searchProblemSchema.safeParse(next);
  if (!checked.success) {
    const i = checked.error.issues[0]!;
    const words = i.path[0] === "costs" ? " (set it on the team's Costs page)" : "";
    return { ok: false, message: `${i.message}${words}` };
  }
  return { ok: true, problem: checked.data };
}

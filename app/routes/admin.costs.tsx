// The team's cost settings: price per kg of rolled sections and of plate by thickness, and the
// fabrication cost per metre of fillet weld by throat size. A brief with the cost objective copies
// them, so a sweep compares rolled with welded sections on material plus fabrication.
import { Form } from "react-router";
import type { Route } from "./+types/admin.costs";
import { Button, Field, FormError, Notice } from "~/components/ui";
import { requirePermission } from "~/lib/auth.server";
import { badRequest, parseForm, readForm } from "~/lib/forms.server";
import { CURRENCY_MAX, pairsText, teamCostsFormSchema } from "~/lib/team-costs";
import { getTeamCosts, saveTeamCosts } from "~/lib/team-costs.server";
import { MIN_WELD_THROAT, WELD_RUNS } from "~/optimizer";

export function meta() {
  return [{ title: "Costs · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "manageTeam");
  return { teamName: user.teamName, costs: await getTeamCosts(user.teamId) };
}

export async function action({ request }: Route.ActionArgs) {
  const admin = await requirePermission(request, "manageTeam");
  const parsed = parseForm(await readForm(request), teamCostsFormSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  await saveTeamCosts(admin.teamId, admin.id, parsed.data);
  return { done: "Cost settings saved. Briefs pick them up when next edited; saved briefs and sweeps keep the prices they were run with." };
}

const textareaClass = "block w-full rounded-md border bg-white px-3 py-2 font-mono text-sm";

export default function AdminCosts({ loaderData, actionData }: Route.ComponentProps) {
  const { teamName, costs } = loaderData;
  const errors: Record<string, string> = (actionData && "errors" in actionData ? actionData.errors : undefined) ?? {};
  const done = actionData && "done" in actionData ? actionData.done : null;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-baseline justify-between gap-4">
        <h1 className="text-2xl font-bold">{teamName}: costs</h1>
        <nav aria-label="Team admin" className="flex gap-4 text-sm font-semibold">
          <a href="/admin" className="text-accent-strong underline">Members</a>
          <a href="/admin/materials" className="text-accent-strong underline">Materials</a>
          <a href="/admin/catalogues" className="text-accent-strong underline">Catalogues</a>
          <a href="/stock-lists" className="text-accent-strong underline">Stock lists</a>
        </nav>
      </div>
      <p className="max-w-3xl text-sm text-ink/80">
        With the cost objective a sweep ranks sections by cost per metre of beam: material (mass × the price per kg of its product) plus fabrication (metres of fillet weld per
        metre of beam × the cost per metre of the throat it needs). Welded plate sections carry {WELD_RUNS.i} runs of weld per metre (an I, a channel, a box) or{" "}
        {WELD_RUNS.tee} (a tee, an angle); rolled sections none. Under the EN 1993 basis each section's weld is priced at the throat its check requires; under the
        allowable-stress basis, which sizes no welds, at the {MIN_WELD_THROAT} mm minimum throat.
      </p>
      <Notice message={done} />
      <FormError message={errors.intent ?? errors.form} />
      <Form method="post" className="max-w-3xl space-y-4 rounded-lg border border-ink/15 bg-white p-4" noValidate>
        <input type="hidden" name="intent" value="save" />
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
          <Field id="costs-currency" label="Currency (shown beside costs)" name="currency" maxLength={CURRENCY_MAX} defaultValue={costs.currency} error={errors.currency} hint="e.g. EUR; optional." />
          <Field
            id="costs-rolled"
            label="Rolled sections: price per kg"
            name="rolledPricePerKg"
            inputMode="decimal"
            defaultValue={costs.rolledPricePerKg ?? ""}
            error={errors.rolledPricePerKg}
            hint="Applies to every catalogue section."
          />
        </div>
        <div className="space-y-1">
          <label htmlFor="costs-plates" className="block text-sm font-semibold">Plate: price per kg by thickness</label>
          <textarea
            id="costs-plates"
            name="platePrices"
            rows={8}
            className={`${textareaClass} ${errors.platePrices ? "border-red-700" : "border-ink/30"}`}
            defaultValue={pairsText(costs.platePrices.map((p) => ({ a: p.thickness, b: p.pricePerKg })))}
            aria-invalid={errors.platePrices ? true : undefined}
            aria-describedby="costs-plates-hint"
          />
          <p id="costs-plates-hint" className="text-xs text-ink/70">One thickness per line: thickness in mm, price per kg (e.g. “10, 1.12”).</p>
          {errors.platePrices ? <p className="text-sm font-semibold text-red-800">{errors.platePrices}</p> : null}
        </div>
        <div className="space-y-1">
          <label htmlFor="costs-weld" className="block text-sm font-semibold">Fabrication: cost per metre of fillet weld by throat size</label>
          <textarea
            id="costs-weld"
            name="weld"
            rows={6}
            className={`${textareaClass} ${errors.weld ? "border-red-700" : "border-ink/30"}`}
            defaultValue={pairsText(costs.weld.map((w) => ({ a: w.throat, b: w.perMetre })))}
            aria-invalid={errors.weld ? true : undefined}
            aria-describedby="costs-weld-hint"
          />
          <p id="costs-weld-hint" className="text-xs text-ink/70">
            One throat size per line: throat a in mm, cost per metre (e.g. “4, 6.50”). A weld is priced at the smallest listed throat at least as large as it needs;
            beyond the largest, that price × (a ÷ its throat)².
          </p>
          {errors.weld ? <p className="text-sm font-semibold text-red-800">{errors.weld}</p> : null}
        </div>
        <Button>Save cost settings</Button>
      </Form>
    </div>
  );
}

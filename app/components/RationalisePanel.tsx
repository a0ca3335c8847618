// The project page's "Rationalise plate thicknesses" panel: a GET form (k, m in the URL, so a
// result can be shared as a link) and the selection the server computed. Values are SI: the
// stored candidates are SI whatever units each brief was entered in.
import { familyLabel } from "~/lib/labels";
import { Form, Link } from "react-router";
import { formatNumber } from "~/components/PropertyTable";
import { Caution } from "~/components/Caution";
import type { ProjectRationalisation } from "~/lib/rationalise.server";
import { TableScroll } from "~/components/DataTable";

export interface RationalisePanelProps {
  /** what the form shows: the submitted values, or the defaults */
  form: { k: string; m: string };
  errors: Partial<Record<"k" | "m", string>> | null;
  result: ProjectRationalisation | null;
  /** most stored candidates per brief the program chooses from (fewer on a large project) */
  perBrief: number;
}

// Job masses to 0.1 kg with a fixed locale, so the server's and the browser's text match.
const kgNumber = (x: number) => x.toLocaleString("en-GB", { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const kg = (x: number) => `${kgNumber(x)} kg`;
const mmList = (xs: number[]) => (xs.length ? `${xs.join(", ")} mm` : "—");

export function RationalisePanel({ form, errors, result, perBrief }: RationalisePanelProps) {
  const inputCls = "w-20 rounded-md border border-ink/30 bg-white px-2 py-1 text-sm tabular-nums";
  return (
    <section aria-labelledby="rationalise-h" id="rationalise" className="space-y-3">
      <h2 id="rationalise-h" className="text-lg font-bold">
        Rationalise plate thicknesses
      </h2>
      <p className="max-w-2xl text-sm text-ink/80">
        Picks one section per brief from its latest finished sweep (its lightest {result ? result.perBrief : `up to ${perBrief}`} stored candidates) so the whole job uses at most k different plate
        thicknesses, and optionally at most m different depths, for the least total steel mass.
      </p>
      <Form method="get" preventScrollReset className="flex flex-wrap items-end gap-3" noValidate>
        <div>
          <label htmlFor="rat-k" className="block text-sm font-semibold">
            k, most plate thicknesses
          </label>
          <input
            id="rat-k"
            name="k"
            type="number"
            min={1}
            max={10}
            step={1}
            defaultValue={form.k}
            className={inputCls}
            aria-invalid={errors?.k ? true : undefined}
            aria-describedby={errors?.k ? "rat-k-err" : undefined}
          />
        </div>
        <div>
          <label htmlFor="rat-m" className="block text-sm font-semibold">
            m, most depths <span className="font-normal text-ink/70">(optional)</span>
          </label>
          <input
            id="rat-m"
            name="m"
            type="number"
            min={1}
            step={1}
            defaultValue={form.m}
            className={inputCls}
            aria-invalid={errors?.m ? true : undefined}
            aria-describedby={errors?.m ? "rat-m-err" : undefined}
          />
        </div>
        <button className="rounded-md border border-ink/30 bg-white px-3 py-1.5 text-sm font-semibold">Rationalise</button>
      </Form>
      {errors?.k ? (
        <p id="rat-k-err" role="alert" className="text-sm font-semibold text-red-900">
          {errors.k}
        </p>
      ) : null}
      {errors?.m ? (
        <p id="rat-m-err" role="alert" className="text-sm font-semibold text-red-900">
          {errors.m}
        </p>
      ) : null}
      {result ? <RationaliseResultView result={result} /> : null}
    </section>
  );
}

function RationaliseResultView({ result }: { result: ProjectRationalisation }) {
  const { outcome, skipped } = result;
  const anyDefaulted = outcome?.ok ? outcome.selection.some((s) => s.defaulted) : false;
  return (
    <div className="space-y-3" aria-live="polite">
      {outcome === null ? <p className="text-ink/70">No brief in this project has a finished sweep with a feasible section yet.</p> : null}
      {outcome && !outcome.ok ? (
        <p role="status" className="rounded-md border border-caution bg-caution/10 px-3 py-2 text-sm font-semibold">
          {outcome.reason}
        </p>
      ) : null}
      {outcome?.ok ? (
        <>
          <dl className="grid max-w-2xl grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="font-semibold">Total mass (k = {result.k}{result.m !== undefined ? `, m = ${result.m}` : ""})</dt>
            <dd className="tabular-nums">{kg(outcome.totalMass)}</dd>
            <dt className="font-semibold">Each brief's own lightest</dt>
            <dd className="tabular-nums">
              {kg(outcome.unconstrainedMass)}
              {outcome.totalMass > outcome.unconstrainedMass ? (
                <span className="text-ink/70">
                  {" "}
                  (limit costs {kg(outcome.totalMass - outcome.unconstrainedMass)}, {formatNumber((100 * (outcome.totalMass - outcome.unconstrainedMass)) / outcome.unconstrainedMass, 3)} %)
                </span>
              ) : (
                <span className="text-ink/70"> (the limit costs nothing)</span>
              )}
            </dd>
            <dt className="font-semibold">Plate thicknesses used</dt>
            <dd className="tabular-nums">
              {outcome.thicknesses.length}: {mmList(outcome.thicknesses)}
            </dd>
            <dt className="font-semibold">Depths used</dt>
            <dd className="tabular-nums">
              {outcome.depths.length}: {mmList(outcome.depths)}
            </dd>
          </dl>
          <TableScroll>
            <table className="w-full border-collapse bg-white text-sm">
              <thead>
                <tr className="border-b border-ink/30 text-left">
                  <th className="p-2">Brief</th>
                  <th className="p-2">Section (mm)</th>
                  <th className="p-2">Thicknesses (mm)</th>
                  <th className="p-2 text-right">Mass per metre (kg/m)</th>
                  <th className="p-2 text-right">Members × length (m)</th>
                  <th className="p-2 text-right">Mass (kg)</th>
                  <th className="p-2 text-right">Own lightest (kg)</th>
                </tr>
              </thead>
              <tbody>
                {outcome.selection.map((s) => (
                  <tr key={s.briefId} className="border-b border-ink/10">
                    <td className="p-2">
                      <Link to={`/briefs/${s.briefId}`} className="font-semibold text-accent underline">
                        {s.briefName}
                      </Link>{" "}
                      <Link to={`/sweeps/${s.sweepId}`} className="text-xs text-accent underline">
                        sweep {s.sweepId}, rank {s.rank}
                      </Link>
                    </td>
                    <td className="p-2">
                      {familyLabel(s.family)}{" "}
                      {Object.entries(s.dimensions)
                        .map(([k, v]) => `${k} ${v}`)
                        .join(", ")}
                    </td>
                    <td className="p-2 tabular-nums">{s.thicknesses.join(", ")}</td>
                    <td className="p-2 text-right tabular-nums">{formatNumber(s.massPerMetre, 4)}</td>
                    <td className="p-2 text-right tabular-nums">
                      {s.count} × {formatNumber(s.lengthM, 4)}
                      {s.defaulted ? <span title="member length or count not set on the brief: 1 m and 1 member assumed"> *</span> : null}
                    </td>
                    <td className="p-2 text-right tabular-nums">{kgNumber(s.mass)}</td>
                    <td className="p-2 text-right tabular-nums">{kgNumber(s.ownBestMass)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
          {anyDefaulted ? (
            <p className="text-sm text-ink/80">
              * The brief has no member length or member count: 1 m and 1 member are assumed for the missing value. Set them in the brief editor for a true job
              mass.
            </p>
          ) : null}
          <Caution scope="project" />
        </>
      ) : null}
      {skipped.length ? (
        <div className="text-sm">
          <p className="font-semibold">Briefs left out</p>
          <ul className="list-disc pl-5">
            {skipped.map((s) => (
              <li key={s.briefId}>
                <Link to={`/briefs/${s.briefId}`} className="text-accent underline">
                  {s.briefName}
                </Link>
                : {s.reason}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}

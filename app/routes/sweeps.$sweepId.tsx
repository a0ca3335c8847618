import { useEffect, useMemo, useState } from "react";
import { optionNo, sweepNo } from "~/lib/numbering";
import { checkLabel, familyLabel } from "~/lib/labels";
import { Form, Link, data, redirect, useRevalidator } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/sweeps.$sweepId";
import { requirePermission } from "~/lib/auth.server";
import { fieldErrorsFrom, readForm } from "~/lib/forms.server";
import { depthViewQuerySchema } from "~/lib/depth-bests";
import { loadSweepPage } from "~/lib/sweep-page.server";
import { saveOption, saveOptionSchema, WorkflowError } from "~/lib/options.server";
import { can } from "~/lib/roles";
import { cancelSweep } from "~/workers/queue.server";
import { queueErrorMessage } from "~/lib/brief-actions.server";
import { Caution } from "~/components/Caution";
import { WhatItWouldTake } from "~/components/WhatItWouldTake";
import { ProgressBar } from "~/components/ProgressBar";
import { TradeoffChart, candidateName, describeDimensions, tradeoffTitle, type ChartCandidate } from "~/components/TradeoffChart";
import { CandidateTable } from "~/components/CandidateTable";
import { DepthBests } from "~/components/DepthBests";
import { ChartFilter, type FilteredChart } from "~/components/ChartFilter";
import { CompareCandidates } from "~/components/CompareCandidates";
import { UnitSwitch } from "~/components/UnitSwitch";
import { ReviewBadge } from "~/components/ReviewBadge";
import { formatNumber, formatQuantity } from "~/components/PropertyTable";
import { Assumptions, BasisNote } from "~/components/BasisAssumptions";
import { RestraintStudyChart } from "~/components/RestraintStudyChart";
import { RolledAndWelded } from "~/components/RolledAndWelded";
import { isAiscRow, isEnRow } from "~/lib/design-summary";
import type { UnitSystem } from "~/optimizer/units";
import { idParam } from "~/lib/route-params";
import { sweepPollDelay } from "~/lib/sweep-poll";

export function meta({ data }: Route.MetaArgs) {
  return [{ title: `Sweep ${data ? sweepNo(data.numbers, data.sweep.id) : ""} · Sparwise` }];
}


export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  // the depth control's query (?depth=&family=): its errors are shown beside its fields, never thrown
  const q = depthViewQuerySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  const page = await loadSweepPage(user.teamId, idParam(params.sweepId), q.success ? q : { success: false, errors: fieldErrorsFrom(q.error) });
  return {
    ...page,
    may: {
      save: can(user.role, "saveOption") && page.project !== null,
      recheck: can(user.role, "recheck"),
      cancel: page.sweep.ownerId === user.id || can(user.role, "cancelAnySweep"),
    },
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requirePermission(request, "read");
  const id = idParam(params.sweepId);
  const form = await readForm(request);
  const intent = String(form.get("intent") ?? "");
  if (intent === "cancel") {
    try {
      await cancelSweep(id, user);
    } catch (e) {
      const msg = await queueErrorMessage(e);
      if (msg) return data({ errors: { form: msg } }, { status: (e as Response).status });
      throw e;
    }
    return { errors: null };
  }
  if (intent === "saveOption") {
    await requirePermission(request, "saveOption");
    const parsed = saveOptionSchema.safeParse({ rank: form.get("rank") ?? undefined, note: form.get("note") ?? undefined });
    if (!parsed.success) return data({ errors: { [String(parsed.error.issues[0].path[0] ?? "form")]: parsed.error.issues[0].message } }, { status: 400 });
    try {
      const optionId = await saveOption(user, id, parsed.data.rank, parsed.data.note);
      throw redirect(`/options/${optionId}`);
    } catch (e) {
      if (e instanceof WorkflowError) return data({ errors: { [e.field]: e.message } }, { status: 400 });
      throw e;
    }
  }
  return data({ errors: { intent: `intent: unknown action "${intent.slice(0, 30)}"` } }, { status: 400 });
}

export default function SweepPage({ loaderData, actionData }: Route.ComponentProps) {
  const { sweep, chart, families, frontCap, brief, project, rechecks, options, may, numbers } = loaderData;
  // The table's first page arrives as one JSON text (PageTable in sweep-page.server.ts): parsed here,
  // on the server for the markup and in the browser, once per loader answer.
  const table = useMemo(() => ({ ...loaderData.table, items: JSON.parse(loaderData.table.itemsJson) as ChartCandidate[] }), [loaderData.table]);
  const [units, setUnits] = useState<UnitSystem>(loaderData.units);
  // The chart's points: one JSON text in the document, parsed in the browser only, after hydration
  // (PageChart in sweep-page.server.ts says why); the server and the first render draw none.
  const [points, setPoints] = useState<ChartCandidate[]>([]);
  useEffect(() => setPoints(JSON.parse(chart.pointsJson) as ChartCandidate[]), [chart.pointsJson]);
  // the best (rank 1, first in the table's first page, as in the chart's sample)
  const [selected, setSelected] = useState<number | null>(table.items[0]?.rank ?? null);
  // Candidates the page has seen (the chart's sample, each table page fetched), by rank: what can be selected and compared.
  const [known, setKnown] = useState(() => new Map<number, ChartCandidate>(table.items.map((c) => [c.rank, c])));
  const learn = (rows: ChartCandidate[]) => setKnown((m) => new Map([...m, ...rows.map((c) => [c.rank, c] as const)]));
  const [compare, setCompare] = useState<number[]>([]);
  const [live, setLive] = useState(sweep);
  const revalidator = useRevalidator();
  const running = sweep.status === "queued" || sweep.status === "running";
  // timed_out: stopped at the time budget with the best found so far (results shown, never called the lightest)
  const timedOut = sweep.status === "timed_out";
  const hasResults = sweep.status === "succeeded" || timedOut;

  useEffect(() => setLive(sweep), [sweep]);
  // Results arrive in place when a running sweep ends: select its best then.
  useEffect(() => {
    learn([...points, ...table.items]);
    if (selected === null && points.length) setSelected(points[0].rank);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [points, table]);
  // Poll the API while the sweep runs (quickly at first: sweep-poll.ts); once it ends, reload this
  // route's data (results) in place.
  useEffect(() => {
    if (!running) return;
    let stop = false;
    const started = Date.now();
    const tick = async () => {
      let ok = false;
      try {
        const res = await fetch(`/api/v1/sweeps/${sweep.id}`, { headers: { Accept: "application/json" } });
        ok = res.ok;
        if (res.ok) {
          const s = await res.json();
          if (stop) return;
          setLive((prev) => ({ ...prev, status: s.status, progress: s.progress, elapsedMs: s.elapsedMs, etaMs: s.etaMs }));
          if (s.status !== "queued" && s.status !== "running") {
            revalidator.revalidate();
            return;
          }
        }
      } catch {
        // a dropped poll is retried on the next tick
      }
      if (!stop) timer = setTimeout(tick, sweepPollDelay(Date.now() - started, ok));
    };
    let timer = setTimeout(tick, sweepPollDelay(0));
    return () => {
      stop = true;
      clearTimeout(timer);
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [running, sweep.id]);

  // The chart's family and depth filter: each family's lightest at every depth that matches (ChartFilter)
  const [filtered, setFiltered] = useState<FilteredChart | null>(null);
  const filterChart = (f: FilteredChart | null) => {
    setFiltered(f);
    if (f) learn(f.points);
  };
  const select = (rank: number) => {
    setSelected(rank);
    document.querySelector(`tr[data-rank="${rank}"]`)?.scrollIntoView({ block: "nearest" });
  };
  const sel = selected === null ? null : (known.get(selected) ?? null);
  const bestDesign = loaderData.bestDesign;
  const compared = compare.map((r) => known.get(r)).filter((c): c is ChartCandidate => Boolean(c));
  const withCost = chart.withCost;
  // The chart plots what the sweep minimised: cost per metre when the brief asked for the cheapest.
  const chartObjective = sweep.problem.objective === "cost" && withCost ? "cost" : "mass";
  const errors = actionData?.errors as Record<string, string> | null | undefined;

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-sm">
            {project ? (
              <Link to={`/projects/${project.id}`} className="text-accent underline">
                {project.name}
              </Link>
            ) : null}
            {brief ? (
              <>
                {" › "}
                <Link to={`/briefs/${brief.id}`} className="text-accent underline">
                  {brief.name}
                </Link>
              </>
            ) : null}
          </p>
          <h1 className="text-2xl font-bold">
            Sweep {sweepNo(numbers, sweep.id)} <span className="text-base font-normal text-ink/70">({live.status})</span>
          </h1>
          {sweep.recheckOf ? (
            <p className="text-sm">
              Recheck of{" "}
              <Link to={`/sweeps/${sweep.recheckOf}`} className="text-accent underline">
                sweep {sweepNo(numbers, sweep.recheckOf)}
              </Link>{" "}
              ·{" "}
              <Link to={`/sweeps/${sweep.id}/comparison`} className="font-semibold text-accent underline">
                compare with the original
              </Link>
            </p>
          ) : null}
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <UnitSwitch value={units} onChange={setUnits} name="view-units" />
          {may.recheck && sweep.status === "succeeded" ? (
            <Link to={`/sweeps/${sweep.id}/recheck`} className="rounded-md border border-ink/30 bg-white px-3 py-1.5 text-sm font-semibold">
              Recheck with altered limits
            </Link>
          ) : null}
        </div>
      </div>
      {errors?.form || errors?.intent ? (
        <p role="alert" className="rounded-md border border-red-800 bg-red-50 px-3 py-2 text-sm font-semibold text-red-900">
          {errors.form ?? errors.intent}
        </p>
      ) : null}

      {running ? (
        <section className="space-y-2 rounded-lg border border-ink/15 bg-white p-4" aria-label="Progress">
          <ProgressBar progress={live.progress} elapsedMs={live.elapsedMs} etaMs={live.etaMs} status={live.status} />
          {may.cancel ? (
            <Form method="post">
              <input type="hidden" name="intent" value="cancel" />
              <button className="rounded-md border border-red-800 bg-white px-3 py-1 text-sm font-semibold text-red-800" disabled={sweep.cancelRequested}>
                {sweep.cancelRequested ? "Cancelling…" : "Cancel sweep"}
              </button>
            </Form>
          ) : null}
        </section>
      ) : null}
      {sweep.status === "failed" ? <p className="rounded-md border border-red-800 bg-red-50 p-3 text-sm">The sweep failed: {sweep.error}</p> : null}
      {sweep.status === "cancelled" ? <p className="rounded-md border border-ink/30 bg-white p-3 text-sm">The sweep was cancelled. {sweep.reason}</p> : null}

      {timedOut ? (
        <p role="status" data-testid="not-proven" className="rounded-md border border-amber-800 bg-amber-50 p-3 text-sm">
          <strong>Not proven lightest.</strong> {sweep.reason}
        </p>
      ) : null}

      {hasResults ? (
        <>
          <section aria-label="Summary" className="rounded-lg border border-ink/15 bg-white p-4 text-sm">
            {sweep.best ? (
              <p data-testid="best">
                <strong>{timedOut ? "Best found so far (not proven lightest):" : sweep.best.cost != null ? "Best section:" : "Lightest section:"}</strong> {familyLabel(sweep.best.family)} {describeDimensions(sweep.best.dimensions, units)}, {formatQuantity("massPerLength", sweep.best.massPerMetre, units)}, utilisation{" "}
                {sweep.best.utilisation.toFixed(3)} ({checkLabel(sweep.best.governing)}){sweep.best.cost != null ? `, cost ${sweep.best.cost.toFixed(2)} per m (the cheapest, as the brief asks)` : ""}.
                {isEnRow(bestDesign) ? (
                  <span data-testid="best-design">
                    {" "}
                    Class {bestDesign.sectionClass}
                    {bestDesign.Mcr !== null ? `, Mcr ${formatQuantity("moment", bestDesign.Mcr, units)}, χLT ${formatNumber(bestDesign.chiLT!, 3)}, Mb,Rd ${formatQuantity("moment", bestDesign.MbRd!, units)}` : bestDesign.McRd !== null ? `, Mc,Rd ${formatQuantity("moment", bestDesign.McRd, units)} (no lateral-torsional buckling check: restrained throughout)` : ""}
                    {bestDesign.VRd !== null ? `, VRd ${formatQuantity("force", bestDesign.VRd, units)}` : ""}
                    {bestDesign.weldThroat !== null ? `, weld throat a = ${formatQuantity("length", bestDesign.weldThroat, units)}` : ""}; governing clause {bestDesign.governingClause}.
                  </span>
                ) : isAiscRow(bestDesign) ? (
                  <span data-testid="best-design">
                    {" "}
                    {bestDesign.section ? `AISC 360-16 §${bestDesign.section}` : "AISC 360-16"}
                    {bestDesign.Mn !== null ? `, Mn ${formatQuantity("moment", bestDesign.Mn, units)}, ${bestDesign.method === "ASD" ? "Mn/Ωb" : "φbMn"} ${formatQuantity("moment", bestDesign.MnAvailable!, units)}` : ""}
                    {bestDesign.zone !== null
                      ? `, LTB zone ${bestDesign.zone} (${[
                          bestDesign.Lp !== null ? `Lp ${formatQuantity("span", bestDesign.Lp / 1000, units)}` : null,
                          bestDesign.Lr !== null ? `Lr ${formatQuantity("span", bestDesign.Lr / 1000, units)}` : null,
                          `Cb ${formatNumber(bestDesign.Cb ?? 1, 4)}`,
                        ]
                          .filter(Boolean)
                          .join(", ")})`
                      : bestDesign.Mn !== null
                        ? " (no lateral-torsional buckling check: braced throughout)"
                        : ""}
                    {bestDesign.VnAvailable !== null ? `, ${bestDesign.method === "ASD" ? "Vn/Ωv" : "φvVn"} ${formatQuantity("force", bestDesign.VnAvailable, units)}` : ""}
                    {bestDesign.weldLeg !== null ? `, weld leg w = ${formatQuantity("length", bestDesign.weldLeg, units)}` : ""}; governing limit state {bestDesign.limitState} ({bestDesign.governingClause}).
                  </span>
                ) : null}
              </p>
            ) : (
              <div className="space-y-3" data-testid="no-feasible">
                <p>
                  <strong>No feasible section{timedOut ? " found before the time budget" : ""}.</strong> {timedOut ? null : sweep.reason}
                </p>
                {timedOut ? null : <WhatItWouldTake advice={sweep.advice} units={units} problem={sweep.problem} />}
              </div>
            )}
            <BasisNote problem={sweep.problem} className="mt-1" />
            {sweep.counts ? (
              <p className="mt-1 text-ink/80 tabular-nums">
                Grid {sweep.counts.grid.toLocaleString("en")} shapes · evaluated {sweep.counts.evaluated.toLocaleString("en")} · feasible among them {sweep.counts.feasible.toLocaleString("en")}
                {sweep.counts.front !== undefined ? ` · front ${sweep.counts.front.toLocaleString("en")}` : ""} · stored {chart.stored.toLocaleString("en")} · time{" "}
                {sweep.elapsedMs !== null ? `${(sweep.elapsedMs / 1000).toFixed(1)} s` : "—"}
              </p>
            ) : null}
            {sweep.counts?.front !== undefined && sweep.counts.front > frontCap ? (
              <p className="mt-1 text-ink/80" data-testid="front-cut">
                The front has {sweep.counts.front.toLocaleString("en")} members; only its lightest {frontCap.toLocaleString("en")} were stored, so the chart, the table and the CSV stop there.
              </p>
            ) : null}
            <p className="mt-1">
              {/* Nothing feasible was stored: no empty file to download. */}
              {sweep.best ? (
                <a href={`/sweeps/${sweep.id}/candidates.csv`} className="text-accent underline" download>
                  Download candidates (CSV, SI units)
                </a>
              ) : null}
              {rechecks.length ? (
                <>
                  {" · Rechecks"}
                  {loaderData.rechecksTotal > rechecks.length ? ` (the latest ${rechecks.length} of ${loaderData.rechecksTotal})` : ""}
                  {": "}
                  {rechecks.map((r, i) => (
                    <span key={r.id}>
                      {i ? ", " : ""}
                      <Link to={`/sweeps/${r.id}/comparison`} className="text-accent underline">
                        sweep {sweepNo(numbers, r.id)}
                      </Link>{" "}
                      ({r.status})
                    </span>
                  ))}
                </>
              ) : null}
              {options.length ? (
                <>
                  {" · Options saved"}
                  {loaderData.optionsTotal > options.length ? ` (the first ${options.length} of ${loaderData.optionsTotal})` : ""}
                  {": "}
                  {options.map((o, i) => (
                    <span key={o.id}>
                      {i ? ", " : ""}
                      <Link to={`/options/${o.id}`} className="text-accent underline">
                        option {optionNo(numbers, o.id)} (#{o.rank})
                      </Link>{" "}
                      <ReviewBadge state={o.reviewState} />
                    </span>
                  ))}
                </>
              ) : null}
            </p>
          </section>
          {sweep.catalogueResult ? <RolledAndWelded summary={sweep.catalogueResult} units={units} cost={sweep.problem.objective === "cost"} /> : null}
          <Caution problem={sweep.problem} />
          <details className="rounded-lg border border-ink/15 bg-white p-4" open={sweep.problem.basis === "en1993" || sweep.problem.basis === "aisc360"}>
            <summary className="cursor-pointer font-semibold">Basis and assumptions</summary>
            <div className="mt-2">
              <Assumptions problem={sweep.problem} units={units} notes={sweep.best?.notes ?? undefined} heading="What this sweep assumed" />
            </div>
          </details>
          {chart.stored ? (
            <>
              <section aria-labelledby="chart-h" className="space-y-2">
                <h2 id="chart-h" className="text-lg font-bold">
                  {tradeoffTitle(chartObjective)}
                </h2>
                <ChartFilter sweepId={sweep.id} families={families} units={units} onChange={filterChart} />
                <TradeoffChart
                  candidates={filtered ? filtered.points : points}
                  frontLine={filtered ? points : undefined}
                  caption={filtered?.caption}
                  units={units}
                  selected={selected}
                  onSelect={select}
                  objective={chartObjective}
                  mixed={sweep.catalogueResult != null}
                />
                {!filtered && chart.drawn < chart.stored ? (
                  <p className="text-xs text-ink/70" data-testid="chart-sample">
                    The chart draws {chart.drawn.toLocaleString("en")} of the {chart.stored.toLocaleString("en")} stored candidates: the front ({chart.front.toLocaleString("en")} candidates) and each family's lightest at every depth, sampled evenly by rank, with both ends and every family's best. The filter above draws every lightest-per-depth point of a family or depth range; the table below pages through all of them.
                  </p>
                ) : null}
              </section>
              {sel ? (
                <section aria-label="Selected candidate" className="flex flex-wrap items-end gap-3 rounded-lg border border-accent bg-white p-3 text-sm" data-testid="selected">
                  <p className="flex-1">
                    Selected <strong>#{sel.rank}</strong> {sel.source === "rolled" ? `${candidateName(sel)} (rolled ${familyLabel(sel.family).toLowerCase()})` : familyLabel(sel.family)} {describeDimensions(sel.dimensions, units)} · {formatQuantity("massPerLength", sel.massPerMetre, units)} · utilisation {sel.utilisation.toFixed(3)} ({checkLabel(sel.governing)})
                  </p>
                  <button
                    type="button"
                    className="rounded-md border border-ink/30 bg-white px-3 py-1 font-semibold disabled:opacity-50"
                    disabled={compare.includes(sel.rank) || compare.length >= 4}
                    onClick={() => setCompare([...compare, sel.rank])}
                  >
                    Add to comparison
                  </button>
                  {may.save ? (
                    <Form method="post" className="flex flex-wrap items-end gap-2">
                      <input type="hidden" name="intent" value="saveOption" />
                      <input type="hidden" name="rank" value={sel.rank} />
                      <label className="block">
                        <span className="block font-semibold">Note</span>
                        <input name="note" maxLength={2000} className="w-64 rounded-md border border-ink/30 px-2 py-1" placeholder="why this one" />
                      </label>
                      <button className="rounded-md bg-accent px-3 py-1.5 font-semibold text-white">Save as option</button>
                    </Form>
                  ) : null}
                  {errors?.rank || errors?.note ? <p className="w-full font-semibold text-red-800">{errors.rank ?? errors.note}</p> : null}
                </section>
              ) : null}
              {sweep.restraintStudy ? (
                <section aria-labelledby="study-h" className="space-y-2">
                  <h2 id="study-h" className="text-lg font-bold">
                    Restraint study: bracing against steel
                  </h2>
                  <RestraintStudyChart study={sweep.restraintStudy} units={units} />
                </section>
              ) : null}
              <section aria-labelledby="table-h" className="space-y-2">
                <h2 id="table-h" className="text-lg font-bold">
                  Candidates
                </h2>
                <CandidateTable
                  sweepId={sweep.id}
                  initial={table}
                  families={families}
                  withCost={withCost}
                  basis={sweep.problem.basis}
                  method={sweep.problem.method}
                  withRolled={sweep.catalogueResult != null}
                  units={units}
                  selected={selected}
                  onSelect={select}
                  compare={compare}
                  onCompare={setCompare}
                  onRows={learn}
                />
              </section>
              {loaderData.depth ? (
                <DepthBests
                  view={loaderData.depth}
                  units={units}
                  selected={selected}
                  onSelect={(c) => {
                    learn([c]);
                    setSelected(c.rank);
                  }}
                />
              ) : null}
              <section aria-labelledby="compare-h" className="space-y-2">
                <h2 id="compare-h" className="text-lg font-bold">
                  Comparison
                </h2>
                <CompareCandidates candidates={compared} problem={sweep.problem} units={units} onRemove={(r) => setCompare(compare.filter((x) => x !== r))} />
              </section>
            </>
          ) : null}
        </>
      ) : null}
    </div>
  );
}

import { Form, Link } from "react-router";
import { cuttingListQuery } from "~/lib/cutting-list";
import type { Route } from "./+types/projects.$projectId.cutting-list";
import { requirePermission } from "~/lib/auth.server";
import { idParam } from "~/lib/route-params";
import { projectCuttingList } from "~/lib/cutting-list.server";
import { formatNumber } from "~/lib/format";
import { TableScroll } from "~/components/DataTable";

export function meta({ data }: Route.MetaArgs) {
  return [{ title: `Plate cutting list · ${data?.project.name ?? ""} · Sparwise` }];
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const q = cuttingListQuery.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!q.success) throw new Response(q.error.issues[0]!.message, { status: 400, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  return projectCuttingList(user.teamId, idParam(params.projectId), q.data.stock);
}

export default function CuttingList({ loaderData }: Route.ComponentProps) {
  const { project, list, stockList, stockLists, currency } = loaderData;
  const f = (x: number | null, sig = 5) => (x == null ? "—" : formatNumber(x, sig));
  const money = (x: number | null) => (x == null ? "—" : `${x.toFixed(2)}${currency ? ` ${currency}` : ""}`);
  return (
    <article className="space-y-4" data-testid="cutting-list">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <div>
          <p className="text-sm text-ink/70">
            {project.name}
            {project.jobNumber ? ` · job ${project.jobNumber}` : ""}
          </p>
          <h1 className="text-2xl font-bold">Plate cutting list and bill of materials</h1>
        </div>
        <div className="no-print flex flex-wrap gap-3 text-sm">
          <Link to={`/projects/${project.id}/schedule`} className="text-accent underline">
            Member schedule
          </Link>
          <a href={`/projects/${project.id}/cutting-list.csv${stockList ? `?stock=${stockList.id}` : ""}`} download className="text-accent underline">
            Download CSV
          </a>
          <button type="button" onClick={() => window.print()} className="rounded-md bg-accent px-3 py-1 font-semibold text-white">
            Print
          </button>
        </div>
      </div>
      <Form method="get" className="no-print flex flex-wrap items-end gap-2 text-sm">
        <label>
          <span className="block font-semibold">Widths and prices from stock list</span>
          <select name="stock" defaultValue={stockList?.id ?? ""} className="rounded-md border border-ink/30 px-2 py-1">
            <option value="">none (team plate prices only)</option>
            {stockLists.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        </label>
        <button className="rounded-md border border-ink/30 px-3 py-1">Show</button>
      </Form>
      <p className="text-sm">
        Plates of every saved option with a member length and count, as the engine lays out each section; one strip per plate per member.
        {stockList ? ` Widths ordered from the stock list “${stockList.name}”.` : " No stock list chosen, so no widths are ordered."} Prices: the stock list's where it gives one, else the team's plate prices (Admin → Costs). Kerf and nesting are not allowed for.
        {list.skipped ? ` ${list.skipped} option(s) without a length and count (or not made of plates) are left out.` : ""}
      </p>
      {list.groups.length === 0 ? (
        <p className="text-sm">Nothing to cut yet.</p>
      ) : (
        <TableScroll>
        <table className="w-full border-collapse text-sm tabular-nums" data-testid="cutting-table">
          <thead>
            <tr className="border-b border-ink/40 text-right">
              <th className="py-1 pr-2 text-left">Thickness (mm)</th>
              <th className="pr-2">Width (mm)</th>
              <th className="pr-2">Length (m)</th>
              <th className="pr-2">Count</th>
              <th className="pr-2">Mass (kg)</th>
              <th className="pr-2">Ordered width (mm) × count</th>
              <th className="pr-2">Ordered mass (kg)</th>
              <th className="pr-2">Price per kg</th>
              <th>Cost</th>
            </tr>
          </thead>
          {list.groups.map((g) => (
            <tbody key={g.thickness} className="break-inside-avoid">
              {g.plates.map((p, i) => (
                <tr key={i} className="border-b border-ink/15 text-right">
                  <td className="py-1 pr-2 text-left">{i === 0 ? g.thickness : ""}</td>
                  <td className="pr-2">{f(p.width)}</td>
                  <td className="pr-2">{f(p.lengthM)}</td>
                  <td className="pr-2">{p.count}</td>
                  <td className="pr-2">{f(p.mass)}</td>
                  <td className="pr-2">{p.orderWidth == null ? "—" : `${f(p.orderWidth)} × ${p.orderCount}`}</td>
                  <td className="pr-2">{f(p.orderMass)}</td>
                  <td className="pr-2">{p.pricePerKg == null ? "—" : p.pricePerKg}</td>
                  <td>{money(p.cost)}</td>
                </tr>
              ))}
              <tr className="border-b border-ink/40 text-right font-semibold">
                <td className="py-1 pr-2 text-left" colSpan={4}>
                  {g.thickness} mm in all
                </td>
                <td className="pr-2">{f(g.mass)}</td>
                <td />
                <td className="pr-2">{f(g.orderMass)}</td>
                <td />
                <td>{money(g.cost)}</td>
              </tr>
            </tbody>
          ))}
          <tfoot>
            <tr className="text-right font-bold">
              <td className="py-1 pr-2 text-left" colSpan={4}>
                Total
              </td>
              <td className="pr-2" data-testid="total-mass">
                {f(list.totalMass)}
              </td>
              <td />
              <td className="pr-2" data-testid="total-order-mass">
                {f(list.totalOrderMass)}
              </td>
              <td />
              <td data-testid="total-cost">{list.totalCost == null ? (list.unpriced ? `${list.unpriced} line(s) without a price` : "—") : money(list.totalCost)}</td>
            </tr>
          </tfoot>
        </table>
        </TableScroll>
      )}
    </article>
  );
}

// The printable cutting list: the project's schedule → plates (cutting-list.ts) → widths ordered
// from one of the team's stock lists and prices (the stock list's, else the team's /admin/costs).
import { getProject } from "~/lib/projects.server";
import { projectSchedule } from "~/lib/schedule.server";
import { cuttingList, orderCuttingList } from "~/lib/cutting-list";
import { listStockLists, stockListItems } from "~/lib/stock-lists.server";
import { getTeamCosts } from "~/lib/team-costs.server";
import { notFound } from "~/lib/projects.server";

export async function projectCuttingList(teamId: number, projectId: number, stockListId: number | undefined) {
  const project = await getProject(teamId, projectId);
  const stock = stockListId === undefined ? null : await stockListItems(teamId, stockListId);
  // another team's list id reads as no list at all
  if (stockListId !== undefined && !stock) throw notFound("No such stock list in your team.");
  const costs = await getTeamCosts(teamId);
  const list = orderCuttingList(cuttingList(await projectSchedule(project.id)), stock?.items ?? [], costs.platePrices);
  const choices = (await listStockLists(teamId)).map((l) => ({ id: l.id, name: l.name }));
  return { project: { id: project.id, name: project.name, jobNumber: project.job_number ?? null }, list, stockList: stock ? { id: stock.id, name: stock.name } : null, stockLists: choices, currency: costs.currency };
}

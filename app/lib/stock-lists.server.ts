// Stock lists kept for the team: saved only from a CSV that parsed without a single error,
// list and items in one transaction.
import { db } from "~/lib/db.server";
import { logActivity } from "~/lib/activity.server";
import { stockThicknesses, type StockRow } from "~/lib/stock-csv";
import type { StockListChoice } from "~/components/BriefEditor";
import { mayDeleteStockList, type Role } from "~/lib/roles";

export async function listStockLists(teamId: number): Promise<(StockListChoice & { items: number; withPrices: boolean; uploadedBy: number | null; uploadedByName: string | null })[]> {
  const lists = await db("stock_lists as l")
    .leftJoin("users as u", "u.id", "l.created_by")
    .where({ "l.team_id": teamId })
    .orderBy("l.name")
    .select("l.id", "l.name", "l.created_by", "u.name as uploader");
  if (!lists.length) return [];
  const items = await db("stock_list_items").whereIn("stock_list_id", lists.map((l) => l.id)).select("stock_list_id", "thickness_mm", "price_per_kg");
  return lists.map((l) => {
    const mine = items.filter((i) => i.stock_list_id === l.id);
    // One price per thickness for the cost objective: the lowest the list offers for it.
    const prices = new Map<number, number>();
    for (const i of mine) if (i.price_per_kg != null && !(prices.get(i.thickness_mm)! <= i.price_per_kg)) prices.set(i.thickness_mm, i.price_per_kg);
    return {
      id: l.id,
      name: l.name,
      thicknesses: stockThicknesses(mine.map((i) => ({ thickness: i.thickness_mm }))),
      prices: [...prices].sort((a, b) => a[0] - b[0]).map(([thickness, pricePerKg]) => ({ thickness, pricePerKg })),
      items: mine.length,
      withPrices: mine.some((i) => i.price_per_kg != null),
      uploadedBy: (l.created_by as number | null) ?? null,
      uploadedByName: (l.uploader as string | null) ?? null,
    };
  });
}

export async function saveStockList(teamId: number, userId: number, name: string, rows: StockRow[]): Promise<number> {
  return db.transaction(async (trx) => {
    const [id] = await trx("stock_lists").insert({ team_id: teamId, name, created_by: userId });
    await trx("stock_list_items").insert(rows.map((r) => ({ stock_list_id: id, thickness_mm: r.thickness, width_mm: r.width, price_per_kg: r.pricePerKg })));
    await logActivity({ teamId, userId, action: "stock_list_saved", subjectType: "stock_list", subjectId: Number(id), detail: { name, rows: rows.length } }, trx);
    return Number(id);
  });
}

/**
 * Deletes the team's stock list when this person may (mayDeleteStockList: an admin, or whoever
 * uploaded it), checked and deleted in one transaction with the row locked, and logged.
 */
export async function deleteStockList(user: { teamId: number; id: number; role: Role }, id: number): Promise<"deleted" | "missing" | "refused"> {
  return db.transaction(async (trx) => {
    const row = await trx("stock_lists").where({ id, team_id: user.teamId }).forUpdate().first("id", "name", "created_by");
    if (!row) return "missing";
    if (!mayDeleteStockList(user.role, user.id, row.created_by ?? null)) return "refused";
    await trx("stock_lists").where({ id }).delete();
    await logActivity({ teamId: user.teamId, userId: user.id, action: "stock_list_deleted", subjectType: "stock_list", subjectId: id, detail: { name: row.name } }, trx);
    return "deleted";
  });
}

/** One of the team's stock lists with its items, or null when the team has no such list. */
export async function stockListItems(teamId: number, id: number): Promise<{ id: number; name: string; items: { thickness: number; width: number | null; pricePerKg: number | null }[] } | null> {
  const list = Number.isSafeInteger(id) ? await db("stock_lists").where({ id, team_id: teamId }).first("id", "name") : undefined;
  if (!list) return null;
  const items = await db("stock_list_items").where({ stock_list_id: list.id }).select("thickness_mm", "width_mm", "price_per_kg");
  return { id: list.id, name: list.name, items: items.map((i) => ({ thickness: i.thickness_mm, width: i.width_mm ?? null, pricePerKg: i.price_per_kg ?? null })) };
}

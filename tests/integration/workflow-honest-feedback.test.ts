// Issue 11, item 8: a return without a comment is refused with the error tied to the review form
// (the page writes it beside the buttons); the team's shared stock list is deleted only by an
// admin or by whoever uploaded it.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { saveStockList } from "~/lib/stock-lists.server";
import { callRoute, demoUser, formPost, loadRouteModule, requestAs } from "./fixtures";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { CHANNEL_PROBLEM } from "./workflow-fixtures";

afterAll(() => closeDb());

describe("stock list delete: admin or uploader only", () => {
  test("another engineer is refused and the list stays; the uploader and an admin may delete", async () => {
    const mod = await loadRouteModule("routes/stock-lists.tsx");
    const eng = await demoUser("engineer");
    const rows = [{ thickness: 8, width: null, pricePerKg: null }];
    const mine = await saveStockList(eng.teamId, eng.id, "Delete test, uploader", rows);
    const other = await saveStockList(eng.teamId, eng.id, "Delete test, admin", rows);
    const del = async (as: "engineer" | "engineer2" | "admin", id: number) => callRoute(mod.action, await formPost(as, "/stock-lists", { intent: "delete", id: String(id) }));

    const refused = await del("engineer2", mine);
    expect(refused.status).toBe(403);
    expect((refused.data as { errors: Record<string, string> }).errors.id).toMatch(/only an admin or the person who uploaded it/);
    expect(await db("stock_lists").where({ id: mine }).first("id")).toBeTruthy();
    expect(await db("stock_list_items").where({ stock_list_id: mine }).count({ n: "*" }).first()).toEqual({ n: 1 });

    // the page offers Delete only where it would be allowed
    const page = await callRoute(mod.loader, await requestAs("engineer2", "/stock-lists"));
    const listed = (page.data as { lists: { id: number; mayDelete: boolean; uploadedByName: string | null }[] }).lists;
    expect(listed.find((l) => l.id === mine)).toMatchObject({ mayDelete: false });
    const own = await callRoute(mod.loader, await requestAs("engineer", "/stock-lists"));
    expect((own.data as { lists: { id: number; mayDelete: boolean }[] }).lists.find((l) => l.id === mine)).toMatchObject({ mayDelete: true });

    expect((await del("engineer", mine)).status).toBe(200);
    expect(await db("stock_lists").where({ id: mine }).first("id")).toBeUndefined();
    expect((await del("admin", other)).status).toBe(200);
    expect(await db("stock_lists").where({ id: other }).first("id")).toBeUndefined();
    expect(await db("activity_log").where({ action: "stock_list_deleted", subject_id: other }).first("id")).toBeTruthy();
    // deleting what is gone (or another team's) is a 404, not a 403: ids do not leak
    expect((await del("admin", other)).status).toBe(404);
  });
});

describe("return without a comment", () => {
  test("is refused, nothing is written, and the error belongs to the review form's comment", async () => {
    const eng = await demoUser("engineer");
    const [projectId] = await db("projects").insert({ team_id: eng.teamId, name: "Return comment test", created_by: eng.id });
    const sweepId = await recordFinishedSweep(db, { teamId: eng.teamId, ownerId: eng.id, projectId: Number(projectId), problem: CHANNEL_PROBLEM });
    const sweepMod = await loadRouteModule("routes/sweeps.$sweepId.tsx");
    const saved = await callRoute(sweepMod.action, await formPost("engineer", `/sweeps/${sweepId}`, { intent: "saveOption", rank: "1" }), { sweepId: String(sweepId) });
    const optionId = saved.location!.split("/").pop()!;
    const mod = await loadRouteModule("routes/options.$optionId.tsx");
    expect((await callRoute(mod.action, await formPost("engineer", `/options/${optionId}`, { intent: "requestReview" }), { optionId })).status).toBe(200);
    const reviews = await db("reviews").where({ option_id: optionId }).count({ n: "*" }).first();
    const r = await callRoute(mod.action, await formPost("reviewer", `/options/${optionId}`, { intent: "decide", decision: "returned", comment: "  " }), { optionId });
    expect(r.status).toBe(400);
    expect(r.data).toMatchObject({ intent: "decide", errors: { comment: expect.stringMatching(/^Comment: say why you return the option/) } });
    expect(await db("reviews").where({ option_id: optionId }).count({ n: "*" }).first()).toEqual(reviews);
    expect((await db("options").where({ id: optionId }).first("review_state")).review_state).toBe("in_review");
  });
});

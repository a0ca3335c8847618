// Team cost settings through the route (admin only): saved and read back sorted; a malformed list
// line is refused naming the field and its line, and nothing is written. The demo seed sets them.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { getTeamCosts } from "~/lib/team-costs.server";
import { DEMO_COSTS } from "../../db/seeds/03_starter_catalogue";
import { callRoute, demoUser, formPost, loadRouteModule, tableCounts, type As } from "./fixtures";

afterAll(() => closeDb());

async function save(fields: Record<string, string>, as: As = "admin") {
  const mod = await loadRouteModule("routes/admin.costs.tsx");
  const res = await callRoute(mod.action, await formPost(as, "/admin/costs", { intent: "save", ...fields }));
  if (res.error) throw res.error;
  return res as { status: number; data: { errors?: Record<string, string>; done?: string } };
}

describe("team cost settings", () => {
  test("the demo seed sets the demo team's prices", async () => {
    const admin = await demoUser("admin");
    expect(await getTeamCosts(admin.teamId)).toEqual(DEMO_COSTS);
  });

  test("saved and read back, lists sorted; an activity entry records it", async () => {
    const admin = await demoUser("admin");
    const res = await save({ currency: "GBP", rolledPricePerKg: "0.98", platePrices: "12, 1.10\n8; 1.15\n\n10 1.12", weld: "5, 6.3\n3, 4.2" });
    expect(res.status).toBe(200);
    const costs = await getTeamCosts(admin.teamId);
    expect(costs).toEqual({
      currency: "GBP",
      rolledPricePerKg: 0.98,
      platePrices: [
        { thickness: 8, pricePerKg: 1.15 },
        { thickness: 10, pricePerKg: 1.12 },
        { thickness: 12, pricePerKg: 1.1 },
      ],
      weld: [
        { throat: 3, perMetre: 4.2 },
        { throat: 5, perMetre: 6.3 },
      ],
    });
    expect(await db("activity_log").where({ action: "costs_saved", team_id: admin.teamId }).first()).toBeTruthy();
  });

  test.each([
    [{ platePrices: "10, 1.12\n12 cheap" }, "platePrices", /line 2: “12 cheap” is not two numbers/],
    [{ platePrices: "10, 1.12\n10, 1.15" }, "platePrices", /thickness 10 mm is listed twice/],
    [{ weld: "4, 5\n4, 6" }, "weld", /throat 4 mm is listed twice/],
    [{ weld: "0.5, 5" }, "weld", /between 1 and 50 mm/],
    [{ rolledPricePerKg: "-1" }, "rolledPricePerKg", /more than 0/],
  ])("%j → 400 naming %s, nothing written", async (fields, field, message) => {
    const before = await tableCounts();
    const res = await save(fields as Record<string, string>);
    expect(res.status).toBe(400);
    expect(res.data.errors?.[field]).toMatch(message);
    expect(await tableCounts()).toEqual(before);
  });

  test.each(["engineer", "reviewer", "viewer"] as const)("a %s may not change them (403)", async (role) => {
    const before = await tableCounts();
    expect((await save({ rolledPricePerKg: "5" }, role)).status).toBe(403);
    expect(await tableCounts()).toEqual(before);
  });
});

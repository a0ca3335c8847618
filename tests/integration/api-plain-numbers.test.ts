// Issue 11, item 13: the API's JSON and the CSV files carry plain numbers (no 13.624999999999998).
// The stored figures of a real sweep do carry such noise (area × density, steps of a grid), which
// this test first makes sure of, so it can fail.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { callRoute, demoUser, loadRouteModule, requestAs } from "./fixtures";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { CHANNEL_PROBLEM } from "./workflow-fixtures";

afterAll(() => closeDb());

// a decimal that runs into seven or more 0s or 9s and then goes on: float noise, not a figure
const NOISE = /\d\.\d*(?:0{7,}|9{7,})\d/;

describe("plain numbers in the API and the CSV", () => {
  test("candidates JSON, sweep JSON and the candidates CSV", async () => {
    const eng = await demoUser("engineer");
    const [projectId] = await db("projects").insert({ team_id: eng.teamId, name: "Plain numbers test", created_by: eng.id });
    const sweepId = await recordFinishedSweep(db, { teamId: eng.teamId, ownerId: eng.id, projectId: Number(projectId), problem: { ...CHANNEL_PROBLEM, density: 7849.99 } });
    const stored = await db("candidates").where({ sweep_id: sweepId }).select("mass_per_metre", "utilisation");
    expect(stored.some((c) => NOISE.test(String(c.mass_per_metre)) || NOISE.test(String(c.utilisation)))).toBe(true);

    const cands = await loadRouteModule("routes/api.v1.sweeps.$id.candidates.ts");
    const page = await callRoute(cands.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}/candidates?pageSize=100`), { id: String(sweepId) });
    expect(page.status).toBe(200);
    expect(JSON.stringify(page.data)).not.toMatch(NOISE);
    const one = await loadRouteModule("routes/api.v1.sweeps.$id.ts");
    const s = await callRoute(one.loader, await requestAs("viewer", `/api/v1/sweeps/${sweepId}`), { id: String(sweepId) });
    expect(JSON.stringify(s.data)).not.toMatch(NOISE);
    const csv = await loadRouteModule("routes/sweeps.$sweepId.candidates[.]csv.ts");
    const res = await callRoute(csv.loader, await requestAs("viewer", `/sweeps/${sweepId}/candidates.csv`), { sweepId: String(sweepId) });
    expect(String(res.data).split(/\r?\n/).length).toBeGreaterThan(2);
    expect(String(res.data)).not.toMatch(NOISE);
  });
});

// Project rationalisation through the project page's loader: a project of three briefs with real
// finished sweeps; the selection must equal a plain enumeration over the same stored candidates,
// computed here without the engine's integer program; a k no selection meets gives the clear
// message; bad k / m answer 400 naming the field; another team's project is 404; nothing is written.
import { afterAll, beforeAll, describe, expect, test, vi } from "vitest";
import { closeDb, db, parseJson } from "~/lib/db.server";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { candidatesPerBrief, RATIONALISE_CANDIDATES_PER_BRIEF, RATIONALISE_VARIABLE_BUDGET } from "~/lib/rationalise.server";
import { callRoute, FixtureContext, loadRouteModule, requestAs, tableCounts, type RouteResult } from "./fixtures";
import { CHANNEL_PROBLEM, foreignFixture } from "./workflow-fixtures";

// The integer program (up to ~2 s) must run on the engine thread, never on the event loop: this
// process's copy of the engine's rationalise only counts and refuses. The thread loads the engine
// itself (outside vitest's module graph), so only a solve sent there can answer.
const onEventLoop = vi.hoisted(() => ({ calls: 0 }));
vi.mock("~/optimizer", async (importOriginal) => ({
  ...(await importOriginal<typeof import("~/optimizer")>()),
  rationalise: () => {
    onEventLoop.calls++;
    throw new Error("rationalise ran on the event loop");
  },
}));

afterAll(() => closeDb());
const ctx = new FixtureContext();

interface Stored {
  family: string;
  dimensions: Record<string, number>;
  massPerMetre: number;
}
interface BriefSetUp {
  id: number;
  lengthM: number;
  count: number;
  candidates: Stored[];
}

let projectId = 0;
let disjointProjectId = 0;
let unsweptBriefId = 0;
let briefs: BriefSetUp[] = [];

// Channels and I sections: each uses two plates, the flanges (tf) and the web (tw), cut from stock
// plate of that thickness (common practice), so its thicknesses are {tf, tw}.
const plateThicknesses = (c: Stored) => {
  expect(["channel", "i"]).toContain(c.family);
  return new Set([c.dimensions.tf, c.dimensions.tw]);
};

/** The least total mass over every choice of one stored candidate per brief within the limits, or null. */
function bruteForce(set: BriefSetUp[], k: number, m?: number): { total: number; pick: Stored[] } | null {
  let best: { total: number; pick: Stored[] } | null = null;
  const pick: Stored[] = [];
  const walk = (i: number, total: number) => {
    if (i === set.length) {
      const ts = new Set(pick.flatMap((c) => [...plateThicknesses(c)]));
      const ds = new Set(pick.map((c) => c.dimensions.d));
      if (ts.size <= k && (m === undefined || ds.size <= m) && (!best || total < best.total)) best = { total, pick: [...pick] };
      return;
    }
    for (const c of set[i].candidates) {
      pick[i] = c;
      walk(i + 1, total + c.massPerMetre * set[i].lengthM * set[i].count);
    }
  };
  walk(0, 0);
  return best;
}

async function storedCandidates(sweepId: number): Promise<Stored[]> {
  const rows = await db("candidates").where({ sweep_id: sweepId }).orderBy([{ column: "area" }, { column: "rank" }]).limit(RATIONALISE_CANDIDATES_PER_BRIEF);
  return rows.map((r) => ({ family: r.family, dimensions: parseJson(r.dimensions), massPerMetre: Number(r.mass_per_metre) }));
}

async function addBrief(pid: number, name: string, problem: typeof CHANNEL_PROBLEM, lengthM: number | null, count: number | null): Promise<BriefSetUp> {
  const teamId = await ctx.teamId();
  const engineer = await ctx.user("engineer");
  const [id] = await db("briefs").insert({ project_id: pid, name, problem: JSON.stringify(problem), units: "si", created_by: engineer.id, member_length_m: lengthM, member_count: count });
  const sweepId = await recordFinishedSweep(db, { teamId, ownerId: engineer.id, projectId: pid, briefId: Number(id), problem });
  return { id: Number(id), lengthM: lengthM ?? 1, count: count ?? 1, candidates: await storedCandidates(sweepId) };
}

beforeAll(async () => {
  const teamId = await ctx.teamId();
  const engineer = await ctx.user("engineer");
  [projectId] = await db("projects").insert({ team_id: teamId, name: "Rationalise: loading bay", created_by: engineer.id });
  briefs = [
    await addBrief(projectId, "Main girder", { ...CHANNEL_PROBLEM, moment: { sagging: 220, hogging: 0 }, shear: 120 }, 7.5, 4),
    await addBrief(projectId, "Secondary beam", CHANNEL_PROBLEM, 5, 12),
    // No member length or count: weighed as one member 1 m long.
    await addBrief(projectId, "Trimmer", { ...CHANNEL_PROBLEM, moment: { sagging: 60, hogging: 0 }, shear: 40 }, null, null),
  ];
  // The latest succeeded sweep counts: a later run of the main girder replaces the first, and a
  // recheck of it (stricter allowables) is not the brief's answer and must be ignored.
  const later = { ...CHANNEL_PROBLEM, moment: { sagging: 200, hogging: 0 }, shear: 110 };
  const laterId = await recordFinishedSweep(db, { teamId, ownerId: engineer.id, projectId, briefId: briefs[0].id, problem: later });
  await recordFinishedSweep(db, { teamId, ownerId: engineer.id, projectId, briefId: briefs[0].id, recheckOf: laterId, problem: { ...later, allowable: { tension: 120, compression: 120, shear: 80 } } });
  await db("sweeps").insert({ team_id: teamId, owner_id: engineer.id, project_id: projectId, brief_id: briefs[0].id, problem: JSON.stringify(later), status: "failed" });
  briefs[0].candidates = await storedCandidates(laterId);
  // A brief with no sweep.
  [unsweptBriefId] = await db("briefs").insert({ project_id: projectId, name: "Not run yet", problem: JSON.stringify(CHANNEL_PROBLEM), units: "si", created_by: engineer.id });
  // Two briefs whose problems offer disjoint plate stocks: k = 1 can never be met.
  [disjointProjectId] = await db("projects").insert({ team_id: teamId, name: "Rationalise: disjoint stock", created_by: engineer.id });
  await addBrief(disjointProjectId, "Light stock", { ...CHANNEL_PROBLEM, thicknesses: [6, 8, 10] }, 3, 2);
  await addBrief(disjointProjectId, "Heavy stock", { ...CHANNEL_PROBLEM, thicknesses: [12, 15, 20, 25] }, 3, 2);
}, 120_000);

type Payload = {
  rationalisation: {
    errors: Record<string, string> | null;
    result: {
      k: number;
      m?: number;
      perBrief: number;
      skipped: { briefId: number; reason: string }[];
      outcome:
        | null
        | { ok: false; reason: string }
        | {
            ok: true;
            totalMass: number;
            unconstrainedMass: number;
            thicknesses: number[];
            depths: number[];
            selection: { briefId: number; family: string; dimensions: Record<string, number>; massPerMetre: number; mass: number; defaulted: boolean; thicknesses: number[] }[];
          };
    } | null;
  };
};

async function load(pid: number, query: string, as: "viewer" | "engineer" | "reviewer" | "admin" = "viewer"): Promise<RouteResult & { data: Payload }> {
  const mod = await loadRouteModule("routes/projects.$projectId.tsx");
  return (await callRoute(mod.loader, await requestAs(as, `/projects/${pid}${query}`), { projectId: String(pid) })) as RouteResult & { data: Payload };
}

describe("project rationalisation", () => {
  test("the fixtures give the program something to choose: several candidates and thicknesses per brief", () => {
    for (const b of briefs) {
      expect(b.candidates.length).toBeGreaterThan(5);
      expect(b.candidates.length).toBeLessThanOrEqual(RATIONALISE_CANDIDATES_PER_BRIEF);
    }
    const all = new Set(briefs.flatMap((b) => b.candidates.flatMap((c) => [...plateThicknesses(c)])));
    expect(all.size).toBeGreaterThan(3);
  });

  test("a large project gets fewer candidates per brief, so the program stays within its budget", () => {
    expect(candidatesPerBrief(3)).toBe(RATIONALISE_CANDIDATES_PER_BRIEF);
    expect(candidatesPerBrief(30) * 30).toBeLessThanOrEqual(RATIONALISE_VARIABLE_BUDGET);
    expect(candidatesPerBrief(60) * 60).toBeLessThanOrEqual(RATIONALISE_VARIABLE_BUDGET);
    expect(candidatesPerBrief(10_000)).toBeGreaterThanOrEqual(1);
  });

  test("the solve runs on the engine thread, not on the event loop (was: in the loader's thread)", async () => {
    const res = await load(projectId, "?k=3");
    expect(res.status).toBe(200);
    expect(res.data.rationalisation.result!.outcome?.ok).toBe(true);
    expect(onEventLoop.calls).toBe(0);
  });

  test("without ?k the page computes nothing and shows the default k = 3", async () => {
    const res = await load(projectId, "");
    expect(res.status).toBe(200);
    expect(res.data.rationalisation.result).toBeNull();
    expect(res.data.rationalisation.errors).toBeNull();
  });

  const cases: [number, number | undefined][] = [
    [1, undefined],
    [2, undefined],
    [3, undefined],
    [4, undefined],
    [10, undefined],
    [3, 1],
    [4, 2],
    [2, 2],
  ];
  test.each(cases)("k = %s, m = %s: the selection equals plain enumeration over the stored candidates", async (k, m) => {
    const res = await load(projectId, `?k=${k}${m === undefined ? "&m=" : `&m=${m}`}`);
    expect(res.status).toBe(200);
    const r = res.data.rationalisation.result!;
    expect(r.perBrief).toBe(RATIONALISE_CANDIDATES_PER_BRIEF);
    expect(r.k).toBe(k);
    expect(r.m).toBe(m);
    expect(r.skipped).toEqual([{ briefId: unsweptBriefId, briefName: "Not run yet", reason: expect.stringMatching(/no finished sweep/) }]);
    const ref = bruteForce(briefs, k, m);
    // Each brief's own lightest, times its quantity: the job with no limit.
    const free = briefs.reduce((s, b) => s + Math.min(...b.candidates.map((c) => c.massPerMetre)) * b.lengthM * b.count, 0);
    if (!ref) {
      expect(r.outcome).toMatchObject({ ok: false, reason: expect.stringMatching(/^No selection satisfies k = /) });
      return;
    }
    expect(r.outcome?.ok).toBe(true);
    if (!r.outcome?.ok) return;
    const o = r.outcome;
    expect(o.totalMass).toBeCloseTo(ref.total, 6);
    expect(o.unconstrainedMass).toBeCloseTo(free, 6);
    expect(o.totalMass).toBeGreaterThanOrEqual(o.unconstrainedMass - 1e-9);
    expect(o.selection.map((s) => s.briefId)).toEqual(briefs.map((b) => b.id));
    // Every chosen section is one of its brief's stored candidates, its mass is mass/m × length × count,
    // and the whole job keeps to the limits.
    o.selection.forEach((s, i) => {
      const b = briefs[i];
      expect(b.candidates).toContainEqual({ family: s.family, dimensions: s.dimensions, massPerMetre: s.massPerMetre });
      expect(s.mass).toBeCloseTo(s.massPerMetre * b.lengthM * b.count, 9);
      expect(s.defaulted).toBe(i === 2);
    });
    const used = new Set(o.selection.flatMap((s) => [...plateThicknesses(s)]));
    expect(o.thicknesses).toEqual([...used].sort((a, b) => a - b));
    expect(used.size).toBeLessThanOrEqual(k);
    const depths = new Set(o.selection.map((s) => s.dimensions.d));
    expect(o.depths).toEqual([...depths].sort((a, b) => a - b));
    if (m !== undefined) expect(depths.size).toBeLessThanOrEqual(m);
  }, 60_000);

  test("the limit binds somewhere: k = 1 costs more than k = 10 (else the test proves little)", async () => {
    const loose = bruteForce(briefs, 10)!;
    const tight = [1, 2, 3].map((k) => bruteForce(briefs, k)).find((x) => x !== null && x.total > loose.total + 1e-9);
    expect(tight, "some k ≤ 3 must force a heavier job").toBeDefined();
  });

  test("k no selection can meet: the clear message, 200, no table", async () => {
    const res = await load(disjointProjectId, "?k=1");
    expect(res.status).toBe(200);
    const o = res.data.rationalisation.result!.outcome!;
    expect(o.ok).toBe(false);
    if (o.ok) return;
    expect(o.reason).toMatch(/^No selection satisfies k = 1/);
    // With two thicknesses the light brief can use one and the heavy brief the other.
    const two = (await load(disjointProjectId, "?k=2")).data.rationalisation.result!.outcome!;
    if (two.ok) expect(two.thicknesses.length).toBe(2);
    else expect(two.reason).toMatch(/^No selection satisfies k = 2/);
  });

  test.each([
    ["?k=0", "k"],
    ["?k=11", "k"],
    ["?k=2.5", "k"],
    ["?k=abc", "k"],
    ["?k=NaN", "k"],
    ["?k=Infinity", "k"],
    ["?k=1e400", "k"],
    ["?k=3&m=0", "m"],
    ["?k=3&m=x", "m"],
    ["?k=3&m=-2", "m"],
    ["?k=3&m=1.5", "m"],
    ["?k=3&m=999", "m"],
  ])("%s answers 400 with a message naming %s, and the page still renders", async (query, field) => {
    const res = await load(projectId, query);
    expect(res.status).toBe(400);
    expect(res.error).toBeUndefined();
    const errs = res.data.rationalisation.errors!;
    expect(Object.keys(errs)).toEqual([field]);
    expect(errs[field]).toMatch(new RegExp(`^${field} `));
    expect(res.data.rationalisation.result).toBeNull();
  });

  test("blank k means the default 3", async () => {
    const res = await load(projectId, "?k=&m=");
    expect(res.status).toBe(200);
    expect(res.data.rationalisation.result!.k).toBe(3);
  });

  test("every role may read it, and it writes nothing", async () => {
    const before = await tableCounts();
    for (const as of ["viewer", "reviewer", "engineer", "admin"] as const) {
      const res = await load(projectId, "?k=3", as);
      expect(res.status).toBe(200);
      expect(res.data.rationalisation.result!.outcome).not.toBeNull();
    }
    expect(await tableCounts()).toEqual(before);
  });

  test("another team's project is 404, with or without ?k", async () => {
    const f = await foreignFixture(ctx);
    expect((await load(f.projectId, "?k=3", "admin")).status).toBe(404);
    expect((await load(f.projectId, "?k=0", "viewer")).status).toBe(404);
  });
});

// Issue 11, items 6 and 8 as a person sees them: a running sweep says what its progress counts and
// gives no blank estimate; Return without a comment shows its error beside the buttons, not far
// above them; the notices and outbox pages describe every kind of message they list; an engineer
// is not offered the delete of a stock list someone else uploaded.
import { afterAll, beforeAll, expect, test } from "vitest";
import type { Knex } from "knex";
import { browserForFile, screenshot } from "./browser";

let db: Knex;
const { signIn } = browserForFile();
const made: { sweeps: number[]; options: number[] } = { sweeps: [], options: [] };
beforeAll(async () => {
  process.env.DB_NAME = process.env.E2E_DB_NAME ?? "sparwise_e2e";
  const { knexConfig } = await import("../../knexfile");
  db = (await import("knex")).default(knexConfig());
});
afterAll(async () => {
  if (db) {
    if (made.options.length) await db("reviews").whereIn("option_id", made.options).delete();
    if (made.options.length) await db("options").whereIn("id", made.options).delete();
    if (made.sweeps.length) await db("sweeps").whereIn("id", made.sweeps).delete();
    await db.destroy();
  }
});

test("a running sweep's progress names what it counts and gives an estimate only when there is one (item 6)", async () => {
  const engineer = await db("users").where({ email: "engineer@tallowfield.example" }).first("id");
  const team = await db("memberships").where({ user_id: engineer.id }).first("team_id");
  const model = await db("sweeps").where({ team_id: team.team_id, status: "succeeded" }).whereNotNull("project_id").first("problem", "project_id", "brief_id");
  // A sweep held by a worker that is not there: the lease runs for an hour, so no runner takes it.
  const [id] = await db("sweeps").insert({
    team_id: team.team_id,
    owner_id: engineer.id,
    project_id: model.project_id,
    brief_id: model.brief_id,
    problem: typeof model.problem === "string" ? model.problem : JSON.stringify(model.problem),
    status: "running",
    attempts: 1,
    started_at: db.raw("NOW(3)"),
    lease_token: "e2e-progress",
    lease_expires_at: db.raw("NOW(3) + INTERVAL 1 HOUR"),
    claimed_at: db.raw("NOW(3)"),
    progress_done: 0,
    progress_total: 0,
  });
  made.sweeps.push(Number(id));
  const eng = await signIn("engineer@tallowfield.example", `/sweeps/${id}`);
  const words = eng.getByTestId("progress-words");
  await expect(words.textContent()).resolves.toContain("Starting the search: counting the shapes of the grid.");
  let text = (await words.textContent()) ?? "";
  expect(text).not.toMatch(/of \?|—|left/);

  // The search reports: shapes, families and candidates, each named; the page's poll picks it up.
  await db("sweeps")
    .where({ id })
    .update({ progress_done: 3, progress_total: 16, progress_unit: "shapes", progress_families_done: 1, progress_families_total: 4, progress_evaluated: 1234 });
  await eng.getByText("Families searched: 1 of 4 · Candidates evaluated: 1,234").waitFor();
  text = (await words.textContent()) ?? "";
  expect(text).toMatch(/3 of 16 shapes settled \(evaluated, or proven unable to change the answer\) \(18%\)/);
  // 18 % after a second or more is something to go by: the estimate shows, and only then
  await db("sweeps").where({ id }).update({ started_at: db.raw("NOW(3) - INTERVAL 5 SECOND") });
  await expect.poll(async () => (await words.textContent()) ?? "", { timeout: 5000 }).toMatch(/about \d+ s left/);
  await screenshot(eng, "progress-words");
});

test("Return without a comment says so beside the buttons (item 8)", async () => {
  const engineer = await db("users").where({ email: "engineer@tallowfield.example" }).first("id");
  const seeded = await db("options").whereNotNull("sweep_id").orderBy("id").first();
  const { id: _id, created_at: _c, updated_at: _u, ...copy } = seeded;
  const [optionId] = await db("options").insert({ ...copy, review_state: "in_review", created_by: engineer.id, note: "return-comment test" });
  made.options.push(Number(optionId));
  await db("reviews").insert({ option_id: optionId, user_id: engineer.id, decision: "requested" });

  const rev = await signIn("reviewer@tallowfield.example", `/options/${optionId}`);
  const button = rev.getByRole("button", { name: "Return" });
  await button.scrollIntoViewIfNeeded();
  await button.click();
  const error = rev.getByRole("alert").filter({ hasText: "Comment: say why you return the option" });
  await error.waitFor();
  const [e, b] = [await error.boundingBox(), await rev.getByRole("button", { name: "Return" }).boundingBox()];
  // beside the buttons: within a line or two of them, not the top of the page
  expect(Math.abs(e!.y - b!.y)).toBeLessThan(120);
  await expect(rev.getByRole("textbox", { name: /Comment/ }).getAttribute("aria-invalid")).resolves.toBe("true");
  await screenshot(rev, "return-comment-error");
});

test("notices and outbox describe every kind of message they list (item 8)", async () => {
  const rev = await signIn("reviewer@tallowfield.example", "/notices");
  const about = (await rev.getByTestId("notices-about").textContent()) ?? "";
  for (const kind of [/sweep you started has ended/, /review an option/, /approved or returned/]) expect(about).toMatch(kind);
  // every notice listed is one of the kinds described
  const titles = await rev.locator("main li > div > :first-child").allTextContents();
  for (const t of titles) expect(t).toMatch(/^(Sweep \d+ |Review requested: option \d+ in |Option \d+ in .+ (approved|returned) by )/);

  const admin = await signIn("admin@tallowfield.example", "/admin/outbox");
  const outbox = (await admin.getByTestId("outbox-about").textContent()) ?? "";
  for (const kind of [/invitations to join the team/, /not members yet/, /password-reset/, /sweep ended/, /review requests/, /review decisions/]) expect(outbox).toMatch(kind);
  await screenshot(admin, "outbox-about");
});

test("the team's stock list: no delete for an engineer who did not upload it (item 8)", async () => {
  const other = await signIn("engineer2@tallowfield.example", "/stock-lists");
  const row = other.locator("tr").filter({ hasText: "Tallowfield plate stock 2026" });
  await row.waitFor();
  await expect(row.getByRole("button", { name: /Delete/ }).count()).resolves.toBe(0);
  await expect(row.textContent()).resolves.toContain("admin or uploader deletes");
  const admin = await signIn("admin@tallowfield.example", "/stock-lists");
  const adminRow = admin.locator("tr").filter({ hasText: "Tallowfield plate stock 2026" });
  await adminRow.waitFor();
  await expect(adminRow.getByRole("button", { name: /Delete/ }).count()).resolves.toBe(1);
});

import { afterAll, expect, test } from "vitest";
import knex from "knex";
import { knexConfig } from "../../knexfile";

const db = knex(knexConfig(process.env.TEST_DB_NAME ?? "sparwise_test"));
afterAll(() => db.destroy());

test("the test database is migrated and seeded with the demo team", async () => {
  const team = await db("teams").where({ slug: "tallowfield" }).first();
  expect(team?.name).toBe("Tallowfield Plate & Beam");
  const roles = await db("memberships").where({ team_id: team.id }).pluck("role");
  expect(roles.sort()).toEqual(["admin", "engineer", "engineer", "reviewer", "viewer"]);
});

import type { Knex } from "knex";
import bcrypt from "bcryptjs";

// An invented fabricator; every name, address and number here is fictional demo data.
export const DEMO_PASSWORD = "sparwise-demo";
export const DEMO_USERS = [
  { email: "admin@tallowfield.example", name: "Ines Okafor", role: "admin" },
  { email: "engineer@tallowfield.example", name: "Marek Lindqvist", role: "engineer" },
  { email: "engineer2@tallowfield.example", name: "Priya Hallam", role: "engineer" },
  { email: "reviewer@tallowfield.example", name: "Tomasz Ferreira", role: "reviewer" },
  { email: "viewer@tallowfield.example", name: "Aoife Brandt", role: "viewer" },
] as const;

export async function seed(knex: Knex): Promise<void> {
  // Idempotent: the demo team is created once and left alone after that.
  const existing = await knex("teams").where({ slug: "tallowfield" }).first();
  if (existing) return;
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await knex.transaction(async (trx) => {
    const [teamId] = await trx("teams").insert({ name: "Tallowfield Plate & Beam", slug: "tallowfield" });
    for (const u of DEMO_USERS) {
      const [userId] = await trx("users").insert({ email: u.email, name: u.name, password_hash: hash });
      await trx("memberships").insert({ team_id: teamId, user_id: userId, role: u.role });
    }
  });
}

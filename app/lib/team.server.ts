import type { Knex } from "knex";
import { z } from "zod";
import { db } from "~/lib/db.server";
import { hashPassword, hashToken, newToken, normaliseEmail, type SessionUser } from "~/lib/auth.server";
import { passwordFields, passwordsMatch } from "~/lib/passwords.server";
import { appUrl } from "~/lib/app-url.server";
import { sendEmail } from "~/lib/email.server";
import { logActivity } from "~/lib/activity.server";
import { FieldError } from "~/lib/forms.server";
import { ROLES, type Role } from "~/lib/roles";

export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000; // seven days (issue 2)

const roleField = z.enum(ROLES, { error: "Choose a role: admin, engineer, reviewer or viewer." });
const emailField = z.string({ error: "Enter an e-mail address." }).trim().max(254, "E-mail address is too long.").pipe(z.email("Enter a valid e-mail address."));
const idField = (what: string) => z.coerce.number({ error: `${what} is required.` }).int(`${what} must be a whole number.`).positive(`${what} must be positive.`);

export const adminActionSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({ intent: z.literal("invite"), email: emailField, role: roleField }),
    z.object({ intent: z.literal("changeRole"), memberId: idField("Member"), role: roleField }),
    z.object({ intent: z.literal("remove"), memberId: idField("Member") }),
    z.object({ intent: z.literal("revokeInvitation"), invitationId: idField("Invitation") }),
    z.object({ intent: z.literal("revokeToken"), tokenId: idField("Token") }),
  ],
  { error: "Intent must be invite, changeRole, remove, revokeInvitation or revokeToken." },
);

/** A newcomer (no account at the invited address) chooses a name and password. */
export const acceptSchema = z
  .object({
    name: z.string({ error: "Enter your name." }).trim().min(1, "Enter your name.").max(120, "Name must be at most 120 characters."),
    ...passwordFields,
  })
  .refine(...passwordsMatch);

/** An existing account accepts with its own password (or, already signed in as that address, with none). */
export const joinSchema = z.object({
  intent: z.literal("join"),
  password: z.string({ error: "Enter your password." }).max(200, "Password is too long.").optional(),
});

// ---------------------------------------------------------------- members

export interface Member {
  membershipId: number;
  userId: number;
  name: string;
  email: string;
  role: Role;
  joinedAt: Date;
}

export async function listMembers(teamId: number): Promise<Member[]> {
  const rows = await db("memberships")
    .join("users", "users.id", "memberships.user_id")
    .where("memberships.team_id", teamId)
    .orderBy("users.name")
    .select("memberships.id as membershipId", "users.id as userId", "users.name", "users.email", "memberships.role", "memberships.created_at as joinedAt");
  return rows as Member[];
}

export async function listPendingInvitations(teamId: number) {
  return db("invitations")
    .where({ team_id: teamId })
    .whereNull("accepted_at")
    .where("expires_at", ">", new Date())
    .orderBy("created_at", "desc")
    .select("id", "email", "role", "expires_at as expiresAt", "created_at as createdAt");
}

/** The team must always keep an admin, or nobody could manage it again. */
async function assertAnotherAdmin(trx: typeof db, teamId: number, leavingMembershipId: number) {
  const others = await trx("memberships").where({ team_id: teamId, role: "admin" }).whereNot({ id: leavingMembershipId }).forUpdate().count({ n: "*" }).first();
  if (Number(others?.n ?? 0) === 0) throw new FieldError("memberId", "The team must keep at least one admin.", 409);
}

export async function changeRole(admin: SessionUser, membershipId: number, role: Role): Promise<void> {
  await db.transaction(async (trx) => {
    const m = await trx("memberships").where({ id: membershipId, team_id: admin.teamId }).forUpdate().first();
    if (!m) throw new FieldError("memberId", "No such member in your team.", 404);
    if (m.role === role) return;
    if (m.role === "admin") await assertAnotherAdmin(trx as unknown as typeof db, admin.teamId, membershipId);
    await trx("memberships").where({ id: membershipId }).update({ role, updated_at: trx.fn.now() });
    await logActivity({ teamId: admin.teamId, userId: admin.id, action: "member_role_changed", subjectType: "user", subjectId: m.user_id, detail: { from: m.role, to: role } }, trx);
  });
}

export async function removeMember(admin: SessionUser, membershipId: number): Promise<void> {
  await db.transaction(async (trx) => {
    const m = await trx("memberships").where({ id: membershipId, team_id: admin.teamId }).forUpdate().first();
    if (!m) throw new FieldError("memberId", "No such member in your team.", 404);
    if (m.role === "admin") await assertAnotherAdmin(trx as unknown as typeof db, admin.teamId, membershipId);
    await trx("memberships").where({ id: membershipId }).delete();
    // Their open sessions and API tokens stop working now, not at the next sign-in.
    await trx("users").where({ id: m.user_id }).increment("session_version", 1);
    await trx("api_tokens").where({ user_id: m.user_id, team_id: admin.teamId }).whereNull("revoked_at").update({ revoked_at: trx.fn.now() });
    await logActivity({ teamId: admin.teamId, userId: admin.id, action: "member_removed", subjectType: "user", subjectId: m.user_id, detail: { role: m.role } }, trx);
  });
}

// ---------------------------------------------------------------- invitations

/**
 * Records the invitation (hashed token, seven days) and e-mails the link. Returns the link too:
 * the inviting admin may copy it once, from this answer only (the outbox shows it masked).
 */
export async function inviteMember(admin: SessionUser, rawEmail: string, role: Role): Promise<{ outboxId: number; link: string }> {
  const email = normaliseEmail(rawEmail);
  const token = newToken();
  return db.transaction(async (trx) => {
    const member = await trx("memberships").join("users", "users.id", "memberships.user_id").where({ "memberships.team_id": admin.teamId, "users.email": email }).first("memberships.id");
    if (member) throw new FieldError("email", `${email} is already a member of ${admin.teamName}.`, 409);
    // A fresh invitation replaces any earlier unused one for the same address.
    await trx("invitations").where({ team_id: admin.teamId, email }).whereNull("accepted_at").delete();
    const [id] = await trx("invitations").insert({
      team_id: admin.teamId,
      email,
      role,
      token_hash: hashToken(token),
      invited_by: admin.id,
      expires_at: new Date(Date.now() + INVITATION_TTL_MS),
    });
    await logActivity({ teamId: admin.teamId, userId: admin.id, action: "member_invited", subjectType: "invitation", subjectId: Number(id), detail: { email, role } }, trx);
    const link = appUrl(`/invite/${token}`);
    const outboxId = await sendEmail(
      {
        teamId: admin.teamId,
        to: email,
        subject: `${admin.name} invites you to ${admin.teamName} on Sparwise`,
        text:
          `Hello,\n\n${admin.name} invites you to join ${admin.teamName} on Sparwise as ${role}.\n` +
          `Open this link within seven days. If you already have a Sparwise account, sign in there with your own\n` +
          `password to accept; otherwise choose your name and password:\n\n${link}\n\n` +
          `The link works once. If you were not expecting this, ignore this message.\n`,
      },
      trx,
    );
    return { outboxId, link };
  });
}

export async function revokeInvitation(admin: SessionUser, invitationId: number): Promise<void> {
  const n = await db("invitations").where({ id: invitationId, team_id: admin.teamId }).whereNull("accepted_at").delete();
  if (!n) throw new FieldError("invitationId", "No such pending invitation in your team.", 404);
}

interface InvitationRow {
  id: number;
  team_id: number;
  email: string;
  role: Role;
  expires_at: Date;
  accepted_at: Date | null;
}

export type InvitationState = "valid" | "unknown" | "used" | "expired";

function stateOf(row: InvitationRow | undefined): InvitationState {
  if (!row) return "unknown";
  if (row.accepted_at) return "used";
  if (new Date(row.expires_at).getTime() <= Date.now()) return "expired";
  return "valid";
}

export const INVITATION_MESSAGES: Record<Exclude<InvitationState, "valid">, string> = {
  unknown: "This invitation link is not valid. Ask your admin for a new one.",
  used: "This invitation has already been accepted. Sign in instead.",
  expired: "This invitation has expired. Ask your admin for a new one.",
};

export async function findInvitation(token: string) {
  if (!token || token.length > 200) return { state: "unknown" as const };
  const row = (await db("invitations").join("teams", "teams.id", "invitations.team_id").where({ token_hash: hashToken(token) }).first("invitations.*", "teams.name as team_name")) as
    | (InvitationRow & { team_name: string })
    | undefined;
  const state = stateOf(row);
  if (state !== "valid") return { state };
  const account = await db("users").where({ email: row!.email }).first("id");
  return { state, email: row!.email, role: row!.role, teamId: row!.team_id, teamName: row!.team_name, hasAccount: Boolean(account) };
}

async function claimInvitation(trx: Knex.Transaction, token: string): Promise<InvitationRow> {
  const row = (await trx("invitations").where({ token_hash: hashToken(token) }).forUpdate().first()) as InvitationRow | undefined;
  const state = stateOf(row);
  if (state !== "valid") throw new FieldError("token", INVITATION_MESSAGES[state], 400);
  return row!;
}

async function joinTeam(trx: Knex.Transaction, inv: InvitationRow, userId: number): Promise<void> {
  const existing = await trx("memberships").where({ team_id: inv.team_id, user_id: userId }).first("id");
  if (!existing) await trx("memberships").insert({ team_id: inv.team_id, user_id: userId, role: inv.role });
  await trx("invitations").where({ id: inv.id }).update({ accepted_at: trx.fn.now(), updated_at: trx.fn.now() });
  await logActivity({ teamId: inv.team_id, userId, action: "member_joined", subjectType: "user", subjectId: userId, detail: { role: inv.role } }, trx);
}

export const EXISTING_ACCOUNT_MESSAGE = "An account with this address already exists: sign in with its own password to accept.";

/**
 * A newcomer's account and membership, once per token. An invitation never changes an existing
 * account: holding the link proves the address, not that its holder is the account's owner (an
 * admin of the inviting team can read the link), so an existing account accepts through
 * acceptInvitationAsUser with its own password instead.
 */
export async function acceptInvitation(token: string, name: string, password: string): Promise<{ id: number; sessionVersion: number; teamId: number }> {
  const passwordHash = await hashPassword(password);
  return db.transaction(async (trx) => {
    const inv = await claimInvitation(trx, token);
    const user = await trx("users").where({ email: inv.email }).forUpdate().first("id");
    if (user) throw new FieldError("password", EXISTING_ACCOUNT_MESSAGE, 409);
    const [id] = await trx("users").insert({ email: inv.email, name, password_hash: passwordHash });
    await joinTeam(trx, inv, Number(id));
    return { id: Number(id), sessionVersion: 1, teamId: inv.team_id };
  });
}

/**
 * An existing, signed-in (or just password-checked) account joins the inviting team. The account
 * itself is untouched: no name, password or disabled_at change. Only the invited address may accept.
 */
export async function acceptInvitationAsUser(token: string, userId: number): Promise<{ teamId: number }> {
  return db.transaction(async (trx) => {
    const inv = await claimInvitation(trx, token);
    const user = await trx("users").where({ id: userId }).whereNull("disabled_at").first("email");
    if (!user || normaliseEmail(user.email) !== inv.email) {
      throw new FieldError("form", `This invitation is for ${inv.email}. Sign out and sign in with that address to accept it.`, 403);
    }
    await joinTeam(trx, inv, userId);
    return { teamId: inv.team_id };
  });
}

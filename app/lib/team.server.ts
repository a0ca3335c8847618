import { z } from "zod";
import { db } from "~/lib/db.server";
import { hashPassword, hashToken, newToken, normaliseEmail, type SessionUser } from "~/lib/auth.server";
import { passwordFields, passwordsMatch } from "~/lib/passwords.server";
import { appUrl, sendEmail } from "~/lib/email.server";
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

export const acceptSchema = z
  .object({
    name: z.string({ error: "Enter your name." }).trim().min(1, "Enter your name.").max(120, "Name must be at most 120 characters."),
    ...passwordFields,
  })
  .refine(...passwordsMatch);

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

/** Records the invitation (hashed token, seven days) and e-mails the link; returns the outbox id. */
export async function inviteMember(request: Request, admin: SessionUser, rawEmail: string, role: Role): Promise<number> {
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
    const link = appUrl(request, `/invite/${token}`);
    return sendEmail(
      {
        teamId: admin.teamId,
        to: email,
        subject: `${admin.name} invites you to ${admin.teamName} on Sparwise`,
        text:
          `Hello,\n\n${admin.name} invites you to join ${admin.teamName} on Sparwise as ${role}.\n` +
          `Open this link within seven days to choose your name and password:\n\n${link}\n\n` +
          `The link works once. If you were not expecting this, ignore this message.\n`,
      },
      trx,
    );
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
  return state === "valid" ? { state, email: row!.email, role: row!.role, teamName: row!.team_name } : { state };
}

/**
 * Creates (or completes) the account and the membership, once per token. An address that
 * already has an account gets the name and password it sets here: opening the e-mailed link
 * proves the address as a password reset would.
 */
export async function acceptInvitation(token: string, name: string, password: string): Promise<{ id: number; sessionVersion: number }> {
  const passwordHash = await hashPassword(password);
  return db.transaction(async (trx) => {
    const row = (await trx("invitations").where({ token_hash: hashToken(token) }).forUpdate().first()) as InvitationRow | undefined;
    const state = stateOf(row);
    if (state !== "valid") throw new FieldError("token", INVITATION_MESSAGES[state], 400);
    const inv = row!;
    let user = await trx("users").where({ email: inv.email }).forUpdate().first("id", "session_version");
    let sessionVersion: number;
    if (user) {
      sessionVersion = user.session_version + 1;
      await trx("users").where({ id: user.id }).update({ name, password_hash: passwordHash, session_version: sessionVersion, disabled_at: null, updated_at: trx.fn.now() });
    } else {
      const [id] = await trx("users").insert({ email: inv.email, name, password_hash: passwordHash });
      user = { id: Number(id) };
      sessionVersion = 1;
    }
    const existing = await trx("memberships").where({ team_id: inv.team_id, user_id: user.id }).first("id");
    if (!existing) await trx("memberships").insert({ team_id: inv.team_id, user_id: user.id, role: inv.role });
    await trx("invitations").where({ id: inv.id }).update({ accepted_at: trx.fn.now(), updated_at: trx.fn.now() });
    await logActivity({ teamId: inv.team_id, userId: user.id, action: "member_joined", subjectType: "user", subjectId: user.id, detail: { role: inv.role } }, trx);
    return { id: user.id as number, sessionVersion };
  });
}

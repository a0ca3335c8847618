import { db } from "~/lib/db.server";
import { hashToken, newToken, type SessionUser } from "~/lib/auth.server";
import { FieldError } from "~/lib/forms.server";
import { logActivity } from "~/lib/activity.server";

// Personal API tokens: shown once at creation, stored as sha256 only, used as "Authorization: Bearer".
export const TOKEN_PREFIX = "spw_";
export const MAX_ACTIVE_TOKENS = 20;

export async function listApiTokens(user: SessionUser) {
  return db("api_tokens")
    .where({ user_id: user.id, team_id: user.teamId })
    .orderBy("created_at", "desc")
    .select("id", "name", "created_at as createdAt", "last_used_at as lastUsedAt", "revoked_at as revokedAt");
}

/** Returns the token in clear text; this is the only time anyone sees it. */
export async function createApiToken(user: SessionUser, name: string): Promise<{ id: number; token: string }> {
  const active = await db("api_tokens").where({ user_id: user.id }).whereNull("revoked_at").count({ n: "*" }).first();
  if (Number(active?.n ?? 0) >= MAX_ACTIVE_TOKENS) throw new FieldError("name", `You already have ${MAX_ACTIVE_TOKENS} active tokens; revoke one first.`, 409);
  const token = newToken(TOKEN_PREFIX);
  const [id] = await db("api_tokens").insert({ user_id: user.id, team_id: user.teamId, name, token_hash: hashToken(token) });
  await logActivity({ teamId: user.teamId, userId: user.id, action: "api_token_created", subjectType: "api_token", subjectId: Number(id), detail: { name } });
  return { id: Number(id), token };
}

export async function revokeApiToken(user: SessionUser, tokenId: number): Promise<void> {
  const n = await db("api_tokens").where({ id: tokenId, user_id: user.id }).whereNull("revoked_at").update({ revoked_at: db.fn.now() });
  if (!n) throw new FieldError("tokenId", "No such active token of yours.", 404);
  await logActivity({ teamId: user.teamId, userId: user.id, action: "api_token_revoked", subjectType: "api_token", subjectId: tokenId });
}

/** Every active token in the admin's team, with its owner: an admin can cut off a leaked one. */
export async function listTeamApiTokens(admin: SessionUser) {
  return db("api_tokens")
    .join("users", "users.id", "api_tokens.user_id")
    .where({ "api_tokens.team_id": admin.teamId })
    .whereNull("api_tokens.revoked_at")
    .orderBy("api_tokens.created_at", "desc")
    .select("api_tokens.id", "api_tokens.name", "users.name as owner", "api_tokens.created_at as createdAt", "api_tokens.last_used_at as lastUsedAt");
}

export async function revokeTeamApiToken(admin: SessionUser, tokenId: number): Promise<void> {
  const row = await db("api_tokens").where({ id: tokenId, team_id: admin.teamId }).whereNull("revoked_at").first("user_id");
  if (!row) throw new FieldError("tokenId", "No such active token in your team.", 404);
  await db("api_tokens").where({ id: tokenId }).update({ revoked_at: db.fn.now() });
  await logActivity({ teamId: admin.teamId, userId: admin.id, action: "api_token_revoked", subjectType: "api_token", subjectId: tokenId, detail: { owner: row.user_id } });
}

import { z } from "zod";
import { db } from "~/lib/db.server";
import { checkPassword, hashPassword, SignInError, type SessionUser } from "~/lib/auth.server";
import { passwordFields, passwordsMatch, revokeCredentials } from "~/lib/passwords.server";
import { logActivity } from "~/lib/activity.server";
import { FieldError } from "~/lib/forms.server";

const idField = (what: string) => z.coerce.number({ error: `${what} is required.` }).int(`${what} must be a whole number.`).positive(`${what} must be positive.`);

// Everything the account page posts.
export const accountActionSchema = z.discriminatedUnion(
  "intent",
  [
    z.object({ intent: z.literal("createToken"), name: z.string({ error: "Token name is required." }).trim().min(1, "Token name is required.").max(80, "Token name must be at most 80 characters.") }),
    z.object({ intent: z.literal("revokeToken"), tokenId: idField("Token") }),
    z.object({ intent: z.literal("switchTeam"), teamId: idField("Team") }),
    z.object({ intent: z.literal("signOutEverywhere") }),
    z
      .object({
        intent: z.literal("changePassword"),
        current: z.string({ error: "Enter your current password." }).min(1, "Enter your current password.").max(200, "Password is too long."),
        ...passwordFields,
      })
      .refine(...passwordsMatch),
  ],
  { error: "Intent must be createToken, revokeToken, switchTeam, signOutEverywhere or changePassword." },
);

/**
 * Changes the signed-in user's password after checking the current one (with the sign-in
 * throttle, so this form cannot be used to guess it). Every session and API token dies, as after
 * a reset — whoever knew the old password is cut off; the caller re-issues its own cookie with
 * the returned session_version. `address` is the client's (clientAddress(context)).
 */
export async function changePassword(address: string, user: SessionUser, current: string, password: string): Promise<number> {
  try {
    await checkPassword(user.email, current, address);
  } catch (error) {
    if (error instanceof SignInError) {
      if (error.status === 429) throw new FieldError("form", error.message, 429);
      throw new FieldError("current", "Your current password is wrong.", 400);
    }
    throw error;
  }
  if (current === password) throw new FieldError("password", "The new password is the same as the current one.");
  const passwordHash = await hashPassword(password);
  return db.transaction(async (trx) => {
    await trx("users").where({ id: user.id }).update({ password_hash: passwordHash, updated_at: trx.fn.now() });
    // Links asked for before the change must not undo it.
    await trx("password_resets").where({ user_id: user.id }).whereNull("used_at").update({ used_at: trx.fn.now() });
    const sv = await revokeCredentials(trx, user.id);
    await logActivity({ teamId: user.teamId, userId: user.id, action: "password_changed", subjectType: "user", subjectId: user.id }, trx);
    return sv;
  });
}

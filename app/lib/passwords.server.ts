import type { Knex } from "knex";
import { z } from "zod";
import { db } from "~/lib/db.server";
import { hashPassword, hashToken, MIN_PASSWORD_LENGTH, newToken, normaliseEmail } from "~/lib/auth.server";
import { appUrl } from "~/lib/app-url.server";
import { sendEmail } from "~/lib/email.server";
import { logActivity } from "~/lib/activity.server";
import { FieldError } from "~/lib/forms.server";
import { resetMailAllowed } from "~/lib/rate-limit.server";

export const RESET_TTL_MS = 60 * 60 * 1000; // one hour (issue 2)

// Shared by the reset form and the invitation form (which adds a name).
export const passwordFields = {
  password: z
    .string({ error: "Choose a password." })
    .min(MIN_PASSWORD_LENGTH, `Password must be at least ${MIN_PASSWORD_LENGTH} characters.`)
    .max(200, "Password must be at most 200 characters."),
  confirm: z.string({ error: "Repeat the password." }),
};
export const passwordsMatch: [(v: { password: string; confirm: string }) => boolean, { path: string[]; message: string }] = [
  (v) => v.password === v.confirm,
  { path: ["confirm"], message: "The two passwords differ." },
];

export const newPasswordSchema = z.object(passwordFields).refine(...passwordsMatch);

export const forgotSchema = z.object({
  email: z.string({ error: "Enter your e-mail address." }).trim().max(254, "E-mail address is too long.").pipe(z.email("Enter a valid e-mail address.")),
});

// Reset e-mails are prepared off the request path: /forgot-password answers before the address
// is even looked up, so neither its timing nor its answer tells a member's address from an unknown
// one (issue 9, item 13), and a slow mail server cannot hold the request either. Every request,
// known address or not, queues the same job; jobs run one at a time in this process. Past
// MAX_PENDING_RESET_JOBS a flood is dropped (logged): the answer is the same, and per-address limits
// would refuse most of it anyway. A job still queued when the server stops is lost; the person asks again.
export const MAX_PENDING_RESET_JOBS = 500;
let resetChain: Promise<void> = Promise.resolve();
let resetPending = 0;
let resetQueued = 0;

/**
 * Queues the reset e-mail for this address; returns at once, for every address alike. `ip` is the
 * client's address from the load context (clientAddress(context)), for the per-client allowance.
 */
export function requestPasswordReset(rawEmail: string, ip: string): void {
  const email = normaliseEmail(rawEmail);
  if (resetPending >= MAX_PENDING_RESET_JOBS) {
    console.error(`requestPasswordReset: ${resetPending} reset e-mails already queued; dropping one`);
    return;
  }
  resetPending++;
  resetQueued++;
  resetChain = resetChain
    // setImmediate: the job starts only after the answer has been handed back.
    .then(() => new Promise<void>((resolve) => setImmediate(resolve)))
    .then(() => sendResetMail(email, ip))
    .catch((error) => console.error("requestPasswordReset: the reset e-mail failed", error))
    .finally(() => {
      resetPending--;
    });
}

/** The reset-mail queue's figures: jobs queued since start, and still waiting or running. */
export function resetMailQueue(): { queued: number; pending: number } {
  return { queued: resetQueued, pending: resetPending };
}

/** Resolves once every reset e-mail queued so far has been handled (tests; an orderly stop). */
export function resetMailSettled(): Promise<void> {
  return resetChain;
}

/**
 * Sends a reset link when the address belongs to an active member; silently does nothing
 * otherwise. Runs off the request path (requestPasswordReset).
 */
async function sendResetMail(email: string, ip: string): Promise<void> {
  const user = await db("users")
    .leftJoin("memberships", "memberships.user_id", "users.id")
    .where("users.email", email)
    .whereNull("users.disabled_at")
    .orderBy("memberships.id")
    .first("users.id", "users.name", "memberships.team_id");
  if (!user || !user.team_id) return;
  // Over the hourly allowance nothing is sent; the answer was the same anyway.
  if (!(await resetMailAllowed(email, ip))) return;
  const token = newToken();
  await db.transaction(async (trx) => {
    await trx("password_resets").insert({
      user_id: user.id,
      token_hash: hashToken(token),
      expires_at: new Date(Date.now() + RESET_TTL_MS),
    });
    const link = appUrl(`/reset-password/${token}`);
    await sendEmail(
      {
        teamId: user.team_id,
        to: email,
        subject: "Reset your Sparwise password",
        text:
          `Hello ${user.name},\n\nSomeone (we hope you) asked to reset the password of your Sparwise account.\n` +
          `Choose a new password here within one hour:\n\n${link}\n\n` +
          `The link works once. If you did not ask for it, ignore this message; your password stays as it is.\n`,
      },
      trx,
    );
  });
}

interface ResetRow {
  id: number;
  user_id: number;
  expires_at: Date;
  used_at: Date | null;
}

export type TokenState = "valid" | "unknown" | "used" | "expired";

function stateOf(row: ResetRow | undefined, now = Date.now()): TokenState {
  if (!row) return "unknown";
  if (row.used_at) return "used";
  if (new Date(row.expires_at).getTime() <= now) return "expired";
  return "valid";
}

export async function resetTokenState(token: string): Promise<TokenState> {
  if (!token || token.length > 200) return "unknown";
  const row = (await db("password_resets").where({ token_hash: hashToken(token) }).first()) as ResetRow | undefined;
  return stateOf(row);
}

export const TOKEN_MESSAGES: Record<Exclude<TokenState, "valid">, string> = {
  unknown: "This link is not valid. Ask for a new one.",
  used: "This link has already been used. Ask for a new one if you need to.",
  expired: "This link has expired. Ask for a new one.",
};

/**
 * Ends every session (bumps session_version) and revokes every API token of the user: after a
 * password reset or change, nothing made with the old password keeps working. Returns the new
 * session_version.
 */
export async function revokeCredentials(trx: Knex.Transaction, userId: number): Promise<number> {
  await trx("users").where({ id: userId }).increment("session_version", 1);
  await trx("api_tokens").where({ user_id: userId }).whereNull("revoked_at").update({ revoked_at: trx.fn.now() });
  const row = await trx("users").where({ id: userId }).first("session_version");
  return row.session_version as number;
}

/** Sets the new password once per token; every earlier session, API token and unused reset link of the user dies. */
export async function resetPassword(token: string, password: string): Promise<{ userId: number }> {
  const passwordHash = await hashPassword(password);
  return db.transaction(async (trx) => {
    // FOR UPDATE: two simultaneous posts of one link cannot both succeed.
    const row = (await trx("password_resets").where({ token_hash: hashToken(token) }).forUpdate().first()) as ResetRow | undefined;
    const state = stateOf(row);
    if (state !== "valid") throw new FieldError("token", TOKEN_MESSAGES[state], 400);
    await trx("password_resets").where({ user_id: row!.user_id }).whereNull("used_at").update({ used_at: trx.fn.now() });
    await trx("users").where({ id: row!.user_id }).update({ password_hash: passwordHash, updated_at: trx.fn.now() });
    await revokeCredentials(trx, row!.user_id);
    const team = await trx("memberships").where({ user_id: row!.user_id }).orderBy("id").first("team_id");
    if (team) {
      await logActivity({ teamId: team.team_id, userId: row!.user_id, action: "password_reset", subjectType: "user", subjectId: row!.user_id }, trx);
    }
    return { userId: row!.user_id };
  });
}

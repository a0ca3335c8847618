import { data, Form, redirect } from "react-router";
import type { Route } from "./+types/account";
import { Button, Field, FormError, Notice } from "~/components/ui";
import { createApiToken, listApiTokens, revokeApiToken } from "~/lib/api-tokens.server";
import { accountActionSchema, changePassword } from "~/lib/account.server";
import { clientAddress } from "~/lib/rate-limit.server";
import { chooseTeam, MIN_PASSWORD_LENGTH, requireUser, signOut } from "~/lib/auth.server";
import { commitSession, getSession } from "~/lib/session.server";
import { badRequest, parseForm, readForm, withFieldErrors } from "~/lib/forms.server";
import { ROLE_LABELS } from "~/lib/roles";
import { TableScroll } from "~/components/DataTable";

export function meta() {
  return [{ title: "Account · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  return { user, tokens: await listApiTokens(user), minPasswordLength: MIN_PASSWORD_LENGTH };
}

export async function action({ request, context }: Route.ActionArgs) {
  const user = await requireUser(request);
  const parsed = parseForm(await readForm(request), accountActionSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  const input = parsed.data;
  return withFieldErrors(async () => {
    if (input.intent === "switchTeam") {
      // To the dashboard, not back: the page the switch was made on may belong to the old team.
      const { setCookie } = await chooseTeam(request, input.teamId);
      return redirect("/", { headers: { "Set-Cookie": setCookie } });
    }
    if (input.intent === "signOutEverywhere") return signOut(request);
    if (input.intent === "changePassword") {
      const sv = await changePassword(clientAddress(context), user, input.current, input.password);
      // This browser stays signed in: its cookie is re-issued with the new session_version.
      const session = await getSession(request);
      session.set("sv", sv);
      return data(
        { changed: "Password changed. Every other session and all your API tokens have been ended; create new tokens for your scripts." },
        { headers: { "Set-Cookie": await commitSession(session) } },
      );
    }
    if (input.intent === "createToken") {
      const created = await createApiToken(user, input.name);
      return { created: { name: input.name, token: created.token } };
    }
    await revokeApiToken(user, input.tokenId);
    return { revoked: input.tokenId };
  });
}

const when = (d: Date | string | null) => (d ? new Date(d).toISOString().slice(0, 16).replace("T", " ") + " UTC" : "—");

export default function Account({ loaderData, actionData }: Route.ComponentProps) {
  const { user, tokens } = loaderData;
  const errors: Record<string, string> = (actionData && "errors" in actionData ? actionData.errors : undefined) ?? {};
  const created = actionData && "created" in actionData ? actionData.created : null;
  const changed = actionData && "changed" in actionData ? actionData.changed : null;
  return (
    <div className="space-y-8">
      <section>
        <h1 className="text-2xl font-bold">Account</h1>
        <dl className="mt-3 grid max-w-xl grid-cols-[8rem_1fr] gap-y-1 text-sm">
          <dt className="font-semibold">Name</dt>
          <dd>{user.name}</dd>
          <dt className="font-semibold">E-mail</dt>
          <dd>{user.email}</dd>
          <dt className="font-semibold">Team</dt>
          <dd>{user.teamName}</dd>
          <dt className="font-semibold">Role</dt>
          <dd>{ROLE_LABELS[user.role]}</dd>
        </dl>
        <p className="mt-3 text-sm">
          E-mails Sparwise sent you (invitations, password resets, reviews) are under <a className="text-accent-strong underline" href="/messages">My messages</a>.
        </p>
      </section>

      <section aria-labelledby="password-h" className="max-w-xl space-y-3">
        <h2 id="password-h" className="text-xl font-bold">Change your password</h2>
        <p className="text-sm text-ink/80">Changing it ends every other session and revokes all your API tokens.</p>
        {changed && <Notice message={changed} />}
        <Form method="post" className="space-y-3" noValidate>
          <input type="hidden" name="intent" value="changePassword" />
          <FormError message={errors.form} />
          <Field label="Current password" name="current" type="password" autoComplete="current-password" required error={errors.current} />
          <Field label="New password" name="password" type="password" autoComplete="new-password" required hint={`At least ${loaderData.minPasswordLength} characters.`} error={errors.password} />
          <Field label="Repeat the new password" name="confirm" type="password" autoComplete="new-password" required error={errors.confirm} />
          <Button>Change password</Button>
        </Form>
        <p className="text-sm">
          Forgot it? Use <a className="text-accent-strong underline" href="/forgot-password">the reset link by e-mail</a>.
        </p>
      </section>

      <section aria-labelledby="sessions-h" className="max-w-xl space-y-3">
        <h2 id="sessions-h" className="text-xl font-bold">Sessions</h2>
        <p className="text-sm text-ink/80">
          Signed in on a computer you no longer use? Sign out everywhere ends every session of yours, this one included. API tokens are not
          affected: revoke them below.
        </p>
        <Form method="post">
          <input type="hidden" name="intent" value="signOutEverywhere" />
          <Button variant="danger">Sign out everywhere</Button>
        </Form>
      </section>

      <section aria-labelledby="tokens-h" className="space-y-4">
        <h2 id="tokens-h" className="text-xl font-bold">API tokens</h2>
        <p className="max-w-2xl text-sm text-ink/80">
          Scripts call the Sparwise API with <code className="rounded bg-ink/10 px-1">Authorization: Bearer &lt;token&gt;</code>. A token acts
          with your role in {user.teamName}. It is shown once, when you create it; we keep only a hash.
        </p>
        {created && (
          <div role="status" className="rounded-md border border-accent bg-teal-50 p-3 text-sm">
            <p className="font-semibold">Token “{created.name}” created. Copy it now; it will not be shown again.</p>
            <label htmlFor="new-token" className="sr-only">New API token</label>
            <input id="new-token" readOnly value={created.token} className="mt-2 w-full rounded border border-ink/30 bg-white px-2 py-1 font-mono text-xs" onFocus={(e) => e.currentTarget.select()} />
          </div>
        )}
        <Form method="post" className="flex max-w-xl flex-wrap items-end gap-3" noValidate>
          <input type="hidden" name="intent" value="createToken" />
          <div className="min-w-56 flex-1">
            <Field label="Token name" name="name" placeholder="e.g. nightly recheck script" maxLength={80} required error={errors.name} />
          </div>
          <Button>Create token</Button>
        </Form>
        <FormError message={errors.tokenId ?? errors.intent ?? errors.form} />
        {tokens.length === 0 ? (
          <p className="text-sm text-ink/70">No tokens yet.</p>
        ) : (
          <TableScroll>
            <table className="min-w-full text-left text-sm">
              <caption className="sr-only">Your API tokens</caption>
              <thead className="border-b border-ink/20">
                <tr>
                  <th scope="col" className="py-2 pr-4">Name</th>
                  <th scope="col" className="py-2 pr-4">Created</th>
                  <th scope="col" className="py-2 pr-4">Last used</th>
                  <th scope="col" className="py-2 pr-4">State</th>
                  <th scope="col" className="py-2"><span className="sr-only">Actions</span></th>
                </tr>
              </thead>
              <tbody>
                {tokens.map((t) => (
                  <tr key={t.id} className="border-b border-ink/10">
                    <td className="py-2 pr-4">{t.name}</td>
                    <td className="py-2 pr-4">{when(t.createdAt)}</td>
                    <td className="py-2 pr-4">{when(t.lastUsedAt)}</td>
                    <td className="py-2 pr-4">{t.revokedAt ? `revoked ${when(t.revokedAt)}` : "active"}</td>
                    <td className="py-2">
                      {!t.revokedAt && (
                        <Form method="post">
                          <input type="hidden" name="intent" value="revokeToken" />
                          <input type="hidden" name="tokenId" value={t.id} />
                          <Button variant="danger" aria-label={`Revoke token ${t.name}`}>Revoke</Button>
                        </Form>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        )}
      </section>
    </div>
  );
}

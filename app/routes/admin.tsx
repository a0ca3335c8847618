import { Form } from "react-router";
import type { Route } from "./+types/admin";
import { Button, Field, FormError, Notice } from "~/components/ui";
import { listTeamApiTokens, revokeTeamApiToken } from "~/lib/api-tokens.server";
import { requirePermission } from "~/lib/auth.server";
import { badRequest, parseForm, readForm, withFieldErrors } from "~/lib/forms.server";
import { ROLE_LABELS, ROLES } from "~/lib/roles";
import { adminActionSchema, changeRole, inviteMember, listMembers, listPendingInvitations, removeMember, revokeInvitation } from "~/lib/team.server";
import { TableScroll } from "~/components/DataTable";

export function meta() {
  return [{ title: "Team admin · Sparwise" }];
}

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requirePermission(request, "manageTeam");
  const [members, invitations, tokens] = await Promise.all([listMembers(user.teamId), listPendingInvitations(user.teamId), listTeamApiTokens(user)]);
  return { user, members, invitations, tokens };
}

export async function action({ request }: Route.ActionArgs) {
  const admin = await requirePermission(request, "manageTeam");
  const parsed = parseForm(await readForm(request), adminActionSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  const input = parsed.data;
  return withFieldErrors(async () => {
    switch (input.intent) {
      case "invite": {
        const { link } = await inviteMember(admin, input.email, input.role);
        return { done: `Invitation sent to ${input.email}.`, inviteLink: { email: input.email, link } };
      }
      case "changeRole":
        await changeRole(admin, input.memberId, input.role);
        return { done: "Role changed." };
      case "remove":
        await removeMember(admin, input.memberId);
        return { done: "Member removed; their sessions and API tokens no longer work." };
      case "revokeInvitation":
        await revokeInvitation(admin, input.invitationId);
        return { done: "Invitation withdrawn." };
      case "revokeToken":
        await revokeTeamApiToken(admin, input.tokenId);
        return { done: "API token revoked." };
    }
  });
}

const day = (d: Date | string) => new Date(d).toISOString().slice(0, 10);

function RoleSelect({ id, value, label, showLabel = false }: { id: string; value?: string; label: string; showLabel?: boolean }) {
  return (
    <>
      <label htmlFor={id} className={showLabel ? "block text-sm font-semibold" : "sr-only"}>{label}</label>
      <select id={id} name="role" defaultValue={value ?? "engineer"} className="block rounded-md border border-ink/30 bg-white px-2 py-2 text-sm">
        {ROLES.map((r) => (
          <option key={r} value={r}>{ROLE_LABELS[r]}</option>
        ))}
      </select>
    </>
  );
}

export default function Admin({ loaderData, actionData }: Route.ComponentProps) {
  const { user, members, invitations, tokens } = loaderData;
  const errors: Record<string, string> = (actionData && "errors" in actionData ? actionData.errors : undefined) ?? {};
  const done = actionData && "done" in actionData ? actionData.done : null;
  const inviteLink = actionData && "inviteLink" in actionData ? actionData.inviteLink : null;
  return (
    <div className="space-y-8">
      <div className="flex flex-wrap items-baseline justify-between gap-4">
        <h1 className="text-2xl font-bold">{user.teamName}: members</h1>
        <nav aria-label="Team admin" className="flex gap-4 text-sm font-semibold">
          <a href="/admin/materials" className="text-accent-strong underline">Materials</a>
          <a href="/admin/catalogues" className="text-accent-strong underline">Catalogues</a>
          <a href="/admin/costs" className="text-accent-strong underline">Costs</a>
          <a href="/stock-lists" className="text-accent-strong underline">Stock lists</a>
          <a href="/admin/outbox" className="text-accent-strong underline">Outbox</a>
        </nav>
      </div>
      <Notice message={done} />
      <FormError message={errors.memberId ?? errors.invitationId ?? errors.tokenId ?? errors.intent ?? errors.role ?? errors.form} />

      <section aria-labelledby="members-h">
        <h2 id="members-h" className="sr-only">Members</h2>
        <TableScroll>
          <table className="min-w-full text-left text-sm">
            <thead className="border-b border-ink/20">
              <tr>
                <th scope="col" className="py-2 pr-4">Name</th>
                <th scope="col" className="py-2 pr-4">E-mail</th>
                <th scope="col" className="py-2 pr-4">Joined</th>
                <th scope="col" className="py-2 pr-4">Role</th>
                <th scope="col" className="py-2"><span className="sr-only">Remove</span></th>
              </tr>
            </thead>
            <tbody>
              {members.map((m) => (
                <tr key={m.membershipId} className="border-b border-ink/10">
                  <td className="py-2 pr-4 font-semibold">{m.name}{m.userId === user.id && <span className="font-normal text-ink/70"> (you)</span>}</td>
                  <td className="py-2 pr-4">{m.email}</td>
                  <td className="py-2 pr-4">{day(m.joinedAt)}</td>
                  <td className="py-2 pr-4">
                    <Form method="post" className="flex items-center gap-2">
                      <input type="hidden" name="intent" value="changeRole" />
                      <input type="hidden" name="memberId" value={m.membershipId} />
                      <RoleSelect id={`role-${m.membershipId}`} value={m.role} label={`Role of ${m.name}`} />
                      <Button variant="quiet" aria-label={`Change the role of ${m.name}`}>Change</Button>
                    </Form>
                  </td>
                  <td className="py-2">
                    <Form method="post">
                      <input type="hidden" name="intent" value="remove" />
                      <input type="hidden" name="memberId" value={m.membershipId} />
                      <Button variant="danger" aria-label={`Remove ${m.name} from the team`}>Remove</Button>
                    </Form>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
      </section>

      <section aria-labelledby="invite-h" className="max-w-xl space-y-3">
        <h2 id="invite-h" className="text-xl font-bold">Invite a member</h2>
        <Form method="post" className="flex flex-wrap items-end gap-3" noValidate>
          <input type="hidden" name="intent" value="invite" />
          <div className="min-w-56 flex-1">
            <Field label="E-mail address" name="email" type="email" required error={errors.email} />
          </div>
          <div className="space-y-1">
            <RoleSelect id="invite-role" label="Role" showLabel />
          </div>
          <Button>Send invitation</Button>
        </Form>
        {inviteLink && (
          <div role="status" className="rounded-md border border-accent bg-teal-50 p-3 text-sm">
            <p className="font-semibold">
              The invitation link for {inviteLink.email}, shown this once: copy it now if you want to pass it on yourself. The outbox shows it
              with the secret part hidden.
            </p>
            <label htmlFor="invite-link" className="sr-only">Invitation link</label>
            <input id="invite-link" readOnly value={inviteLink.link} className="mt-2 w-full rounded border border-ink/30 bg-white px-2 py-1 font-mono text-xs" onFocus={(e) => e.currentTarget.select()} />
          </div>
        )}
        {invitations.length > 0 && (
          <>
            <h3 className="pt-2 font-bold">Pending invitations</h3>
            <ul className="divide-y divide-ink/10 text-sm">
              {invitations.map((i) => (
                <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                  <span>
                    {i.email} · {ROLE_LABELS[i.role as keyof typeof ROLE_LABELS] ?? i.role} · expires {day(i.expiresAt)}
                  </span>
                  <Form method="post">
                    <input type="hidden" name="intent" value="revokeInvitation" />
                    <input type="hidden" name="invitationId" value={i.id} />
                    <Button variant="quiet" aria-label={`Withdraw the invitation to ${i.email}`}>Withdraw</Button>
                  </Form>
                </li>
              ))}
            </ul>
          </>
        )}
      </section>

      <section aria-labelledby="tokens-h" className="space-y-3">
        <h2 id="tokens-h" className="text-xl font-bold">Active API tokens</h2>
        {tokens.length === 0 ? (
          <p className="text-sm text-ink/70">No member has an active API token.</p>
        ) : (
          <ul className="divide-y divide-ink/10 text-sm">
            {tokens.map((t) => (
              <li key={t.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <span>
                  <strong>{t.name}</strong> · {t.owner} · created {day(t.createdAt)} · {t.lastUsedAt ? `last used ${day(t.lastUsedAt)}` : "never used"}
                </span>
                <Form method="post">
                  <input type="hidden" name="intent" value="revokeToken" />
                  <input type="hidden" name="tokenId" value={t.id} />
                  <Button variant="danger" aria-label={`Revoke the token ${t.name} of ${t.owner}`}>Revoke</Button>
                </Form>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

import { data, Form, redirect } from "react-router";
import type { Route } from "./+types/invite.$token";
import { Button, Field, FormError, PublicCard } from "~/components/ui";
import { ROLE_LABELS } from "~/lib/roles";
import { checkPassword, getUser, SignInError } from "~/lib/auth.server";
import { clientAddress } from "~/lib/rate-limit.server";
import { badRequest, FieldError, parseForm, readForm, withFieldErrors } from "~/lib/forms.server";
import { commitSession, createUserSession, getSession } from "~/lib/session.server";
import { acceptInvitation, acceptInvitationAsUser, acceptSchema, findInvitation, INVITATION_MESSAGES, joinSchema } from "~/lib/team.server";

export function meta() {
  return [{ title: "Join your team · Sparwise" }];
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const inv = await findInvitation(params.token);
  if (inv.state !== "valid") return data({ invalid: INVITATION_MESSAGES[inv.state], invitation: null, signedInAs: null }, { status: inv.state === "unknown" ? 404 : 410 });
  const me = await getUser(request);
  return {
    invalid: null,
    invitation: { email: inv.email, role: inv.role, teamName: inv.teamName, hasAccount: inv.hasAccount },
    signedInAs: me?.email ?? null,
  };
}

// Two ways in, chosen by the state of the account at the invited address at the moment of the post:
// a newcomer chooses a name and password; an existing account accepts with its own password (or
// signed in as that address, with a click) and is never changed by the invitation.
export async function action({ request, params, context }: Route.ActionArgs) {
  const form = await readForm(request);
  if (form.get("intent") === "join") {
    const parsed = parseForm(form, joinSchema);
    if (!parsed.ok) return badRequest(parsed.errors);
    const inv = await findInvitation(params.token);
    if (inv.state !== "valid") return badRequest({ token: INVITATION_MESSAGES[inv.state] });
    return withFieldErrors(async () => {
      const me = await getUser(request);
      if (me && me.email === inv.email) {
        const { teamId } = await acceptInvitationAsUser(params.token, me.id);
        const session = await getSession(request);
        session.set("teamId", teamId);
        return redirect("/", { headers: { "Set-Cookie": await commitSession(session) } });
      }
      if (!parsed.data.password) throw new FieldError("password", `Enter the password of ${inv.email}.`);
      let verified;
      try {
        verified = await checkPassword(inv.email, parsed.data.password, clientAddress(context));
      } catch (error) {
        if (error instanceof SignInError) throw new FieldError(error.field, error.message, error.status);
        throw error;
      }
      const { teamId } = await acceptInvitationAsUser(params.token, verified.id);
      return createUserSession(request, verified, "/", teamId);
    });
  }
  const parsed = parseForm(form, acceptSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  return withFieldErrors(async () => {
    const user = await acceptInvitation(params.token, parsed.data.name, parsed.data.password);
    return createUserSession(request, user, "/", user.teamId);
  });
}

export default function Invite({ loaderData, actionData }: Route.ComponentProps) {
  const errors: Record<string, string> = (actionData && "errors" in actionData ? actionData.errors : undefined) ?? {};
  if (!loaderData.invitation) {
    return (
      <PublicCard title="Invitation">
        <FormError message={loaderData.invalid ?? undefined} />
        <a href="/sign-in" className="mt-4 inline-block text-accent-strong underline">Go to sign-in</a>
      </PublicCard>
    );
  }
  const inv = loaderData.invitation;
  const intro = (
    <p className="mb-4 text-sm">
      You are invited as <strong>{ROLE_LABELS[inv.role]}</strong> with the address <strong>{inv.email}</strong>.
    </p>
  );
  if (inv.hasAccount) {
    const signedInAsInvitee = loaderData.signedInAs === inv.email;
    return (
      <PublicCard title={`Join ${inv.teamName}`}>
        {intro}
        <Form method="post" className="space-y-4" noValidate>
          <input type="hidden" name="intent" value="join" />
          <FormError message={errors.token ?? errors.form} />
          {signedInAsInvitee ? (
            <p className="text-sm">You are signed in as {inv.email}. Accept to become a member of {inv.teamName}; your other teams stay as they are.</p>
          ) : (
            <>
              <p className="text-sm">
                {inv.email} already has a Sparwise account. Sign in with its own password to accept; the invitation does not change the account.
                {loaderData.signedInAs && ` (You are signed in as ${loaderData.signedInAs}.)`}
              </p>
              <Field label="Password" name="password" type="password" autoComplete="current-password" required error={errors.password} />
              <a href="/forgot-password" className="text-sm text-accent-strong underline">Forgot your password?</a>
            </>
          )}
          <Button>{signedInAsInvitee ? `Join ${inv.teamName}` : "Sign in and join"}</Button>
        </Form>
      </PublicCard>
    );
  }
  return (
    <PublicCard title={`Join ${inv.teamName}`}>
      {intro}
      <p className="mb-4 text-sm">Choose the name your colleagues will see and a password.</p>
      <Form method="post" className="space-y-4" noValidate>
        <FormError message={errors.token ?? errors.form} />
        <Field label="Your name" name="name" autoComplete="name" required error={errors.name} />
        <Field label="Password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters." error={errors.password} />
        <Field label="Repeat the password" name="confirm" type="password" autoComplete="new-password" required error={errors.confirm} />
        <Button>Join the team</Button>
      </Form>
    </PublicCard>
  );
}

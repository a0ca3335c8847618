import { data, Form } from "react-router";
import type { Route } from "./+types/invite.$token";
import { Button, Field, FormError, PublicCard } from "~/components/ui";
import { ROLE_LABELS } from "~/lib/roles";
import { badRequest, parseForm, readForm, withFieldErrors } from "~/lib/forms.server";
import { createUserSession } from "~/lib/session.server";
import { acceptInvitation, acceptSchema, findInvitation, INVITATION_MESSAGES } from "~/lib/team.server";

export function meta() {
  return [{ title: "Join your team · Sparwise" }];
}

export async function loader({ params }: Route.LoaderArgs) {
  const inv = await findInvitation(params.token);
  if (inv.state !== "valid") return data({ invalid: INVITATION_MESSAGES[inv.state], invitation: null }, { status: inv.state === "unknown" ? 404 : 410 });
  return { invalid: null, invitation: { email: inv.email, role: inv.role, teamName: inv.teamName } };
}

export async function action({ request, params }: Route.ActionArgs) {
  const parsed = parseForm(await readForm(request), acceptSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  return withFieldErrors(async () => {
    const user = await acceptInvitation(params.token, parsed.data.name, parsed.data.password);
    return createUserSession(request, user, "/");
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
  return (
    <PublicCard title={`Join ${inv.teamName}`}>
      <p className="mb-4 text-sm">
        You are invited as <strong>{ROLE_LABELS[inv.role]}</strong> with the address <strong>{inv.email}</strong>. Choose the name your
        colleagues will see and a password.
      </p>
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

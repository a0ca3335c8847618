import { data, Form, redirect } from "react-router";
import type { Route } from "./+types/reset-password.$token";
import { Button, Field, FormError, PublicCard } from "~/components/ui";
import { badRequest, parseForm, readForm, withFieldErrors } from "~/lib/forms.server";
import { newPasswordSchema, resetPassword, resetTokenState, TOKEN_MESSAGES } from "~/lib/passwords.server";
import { flashNotice } from "~/lib/session.server";

export function meta() {
  return [{ title: "Choose a new password · Sparwise" }];
}

export async function loader({ params }: Route.LoaderArgs) {
  const state = await resetTokenState(params.token);
  if (state !== "valid") return data({ invalid: TOKEN_MESSAGES[state] }, { status: state === "unknown" ? 404 : 410 });
  return { invalid: null };
}

export async function action({ request, params }: Route.ActionArgs) {
  const parsed = parseForm(await readForm(request), newPasswordSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  return withFieldErrors(async () => {
    await resetPassword(params.token, parsed.data.password);
    return redirect("/sign-in", {
      headers: { "Set-Cookie": await flashNotice(request, "Your password has been changed. Sign in with the new one.") },
    });
  });
}

export default function ResetPassword({ loaderData, actionData }: Route.ComponentProps) {
  const errors: Record<string, string> = (actionData && "errors" in actionData ? actionData.errors : undefined) ?? {};
  if (loaderData.invalid) {
    return (
      <PublicCard title="Choose a new password">
        <FormError message={loaderData.invalid} />
        <a href="/forgot-password" className="mt-4 inline-block text-accent-strong underline">Ask for a new link</a>
      </PublicCard>
    );
  }
  return (
    <PublicCard title="Choose a new password">
      <Form method="post" className="space-y-4" noValidate>
        <FormError message={errors.token ?? errors.form} />
        <Field label="New password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters." error={errors.password} />
        <Field label="Repeat the password" name="confirm" type="password" autoComplete="new-password" required error={errors.confirm} />
        <Button>Change the password</Button>
      </Form>
    </PublicCard>
  );
}

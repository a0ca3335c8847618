import { Form } from "react-router";
import type { Route } from "./+types/forgot-password";
import { Button, Field, Notice, PublicCard } from "~/components/ui";
import { badRequest, parseForm, readForm } from "~/lib/forms.server";
import { forgotSchema, requestPasswordReset } from "~/lib/passwords.server";
import { clientAddress } from "~/lib/rate-limit.server";

export function meta() {
  return [{ title: "Forgot your password · Sparwise" }];
}

export const SENT_MESSAGE =
  "If an account exists for that address, we have sent it a link to choose a new password. The link works once, within one hour.";

export function loader() {
  return null;
}

export async function action({ request, context }: Route.ActionArgs) {
  const parsed = parseForm(await readForm(request), forgotSchema);
  if (!parsed.ok) return badRequest(parsed.errors);
  // The same answer whether or not the address is known, so the form cannot reveal who has an account.
  requestPasswordReset(parsed.data.email, clientAddress(context));
  return { sent: SENT_MESSAGE };
}

export default function ForgotPassword({ actionData }: Route.ComponentProps) {
  const errors: Record<string, string> = (actionData && "errors" in actionData ? actionData.errors : undefined) ?? {};
  const sent = actionData && "sent" in actionData ? actionData.sent : null;
  return (
    <PublicCard title="Forgot your password?">
      {sent ? (
        <Notice message={sent} />
      ) : (
        <Form method="post" className="space-y-4" noValidate>
          <p className="text-sm">Enter the address you sign in with; we will e-mail you a link to choose a new password.</p>
          <Field label="E-mail address" name="email" type="email" autoComplete="username" required error={errors.email} />
          <Button>Send the link</Button>
        </Form>
      )}
      <a href="/sign-in" className="mt-6 inline-block text-sm text-accent-strong underline">Back to sign-in</a>
    </PublicCard>
  );
}

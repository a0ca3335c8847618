import { data, Form, redirect, useNavigation } from "react-router";
import type { Route } from "./+types/sign-in";
import { Button, Field, FormError, Notice, PublicCard } from "~/components/ui";
import { authenticateSignIn, getUser, SignInError } from "~/lib/auth.server";
import { clientAddress } from "~/lib/rate-limit.server";
import { readForm } from "~/lib/forms.server";
import { commitSession, createUserSession, getSession, safeRedirect } from "~/lib/session.server";

export function meta() {
  return [{ title: "Sign in · Sparwise" }];
}

// A document request only carries an action's headers through this export: the 429's Retry-After.
export function headers({ actionHeaders }: Route.HeadersArgs) {
  const retryAfter = actionHeaders.get("Retry-After");
  return retryAfter ? { "Retry-After": retryAfter } : new Headers();
}

export async function loader({ request }: Route.LoaderArgs) {
  const next = safeRedirect(new URL(request.url).searchParams.get("next"));
  if (await getUser(request)) throw redirect(next);
  const session = await getSession(request);
  const notice = session.get("notice") ?? null;
  return data({ next, notice }, { headers: notice ? { "Set-Cookie": await commitSession(session) } : undefined });
}

export async function action({ request, context }: Route.ActionArgs) {
  const form = await readForm(request);
  try {
    const user = await authenticateSignIn(request, form, clientAddress(context));
    return await createUserSession(request, user, safeRedirect(form.get("next")));
  } catch (error) {
    if (error instanceof SignInError) {
      const headers = error.retryAfter ? { "Retry-After": String(error.retryAfter) } : undefined;
      return data({ errors: { [error.field]: error.message } as Record<string, string> }, { status: error.status, headers });
    }
    throw error;
  }
}

export default function SignIn({ loaderData, actionData }: Route.ComponentProps) {
  const errors = actionData?.errors ?? {};
  const busy = useNavigation().state === "submitting";
  return (
    <PublicCard title="Sign in to Sparwise">
      <Form method="post" className="space-y-4" noValidate>
        <Notice message={loaderData.notice} />
        <FormError message={errors.form} />
        <input type="hidden" name="next" value={loaderData.next} />
        <Field label="E-mail address" name="email" type="email" autoComplete="username" required error={errors.email} />
        <Field label="Password" name="password" type="password" autoComplete="current-password" required error={errors.password} />
        <div className="flex items-center justify-between gap-4">
          <Button disabled={busy}>{busy ? "Signing in…" : "Sign in"}</Button>
          <a href="/forgot-password" className="text-sm text-accent-strong underline">
            Forgot your password?
          </a>
        </div>
      </Form>
      <p className="mt-6 text-xs text-ink/70">New here? Ask your team's admin for an invitation.</p>
    </PublicCard>
  );
}

import { Form, redirect } from "react-router";
import type { Route } from "./+types/sign-out";
import { Button, PublicCard } from "~/components/ui";
import { getUser, signOut } from "~/lib/auth.server";

export function meta() {
  return [{ title: "Sign out · Sparwise" }];
}

// Signing out is a POST (the user menu's button); a GET only asks, so a link elsewhere cannot sign anyone out.
export async function loader({ request }: Route.LoaderArgs) {
  const user = await getUser(request);
  if (!user) throw redirect("/sign-in");
  return { name: user.name };
}

export async function action({ request }: Route.ActionArgs) {
  return signOut(request);
}

export default function SignOut({ loaderData }: Route.ComponentProps) {
  return (
    <PublicCard title="Sign out">
      <p className="mb-4">
        Sign {loaderData.name} out of Sparwise? This ends your sessions on every device.
      </p>
      <Form method="post" className="flex gap-3">
        <Button>Sign out</Button>
        <a href="/" className="rounded-md px-4 py-2 text-sm font-semibold underline">
          Stay signed in
        </a>
      </Form>
    </PublicCard>
  );
}

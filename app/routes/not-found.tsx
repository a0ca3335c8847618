// Any address no other route answers, for a signed-in person: a 404 drawn inside the app's frame
// (app-layout.tsx's error boundary), with the header and navigation to go on from. Signed out, the
// layout's guard sends them to sign-in first, as for every page of the frame.
import { data } from "react-router";
import type { Route } from "./+types/not-found";
import { requireUser } from "~/lib/auth.server";

export async function loader({ request }: Route.LoaderArgs) {
  await requireUser(request);
  throw data("There is no page at this address. Check the link, or start again from the dashboard.", { status: 404 });
}

export default function NotFound() {
  return null;
}

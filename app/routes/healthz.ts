import { db } from "~/lib/db.server";

// Liveness for `npm run up` and the browser tests: answers 200 only when MariaDB does.
export async function loader() {
  await db.raw("SELECT 1");
  return Response.json({ ok: true });
}

// The signed-in frame's loader: the user and their unread notices come from one query (the user's
// query carries the count, issue 9 item 8), so check the count is still each user's own and unread
// only; and the session cookie, whose signature each process checks once, still dies with the session.
import { afterAll, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import * as layout from "~/routes/app-layout";
import { getUser } from "~/lib/auth.server";
import { BASE, callRoute, cookieForUser, demoUser, requestAs } from "./fixtures";

afterAll(() => closeDb());

test("the header's unread count is the signed-in user's own unread notices; signed out, the frame sends to sign-in", async () => {
  const engineer = await demoUser("engineer");
  const viewer = await demoUser("viewer");
  const count = async () => ((await callRoute(layout.loader, await requestAs("engineer", "/"))).data as { unreadNotices: number; user: { id: number } });
  const before = await count();
  expect(before.user.id).toBe(engineer.id);
  await db("notifications").insert([
    { user_id: engineer.id, title: "unread one" },
    { user_id: engineer.id, title: "unread two" },
    { user_id: engineer.id, title: "read", read_at: db.fn.now() },
    { user_id: viewer.id, title: "someone else's" },
  ]);
  try {
    expect((await count()).unreadNotices).toBe(before.unreadNotices + 2);
  } finally {
    await db("notifications").whereIn("title", ["unread one", "unread two", "read", "someone else's"]).delete();
  }
  const out = await callRoute(layout.loader, await requestAs(null, "/sweeps/1"));
  expect(out.status).toBe(302);
  expect(out.location).toBe("/sign-in?next=%2Fsweeps%2F1");
});

test("a cookie whose signature was checked once is still only as good as the user's session: sign-out ends it, and an altered copy is refused", async () => {
  const viewer = await demoUser("viewer");
  const cookie = await cookieForUser(viewer.id);
  const as = (c: string) => getUser(new Request(`${BASE}/`, { headers: { Cookie: c } }));
  expect((await as(cookie))?.id).toBe(viewer.id);
  expect((await as(cookie))?.id).toBe(viewer.id); // the second time from the process's memory of checked cookies
  // the same payload with an altered signature
  const [name, value] = cookie.split("=", 2) as [string, string];
  const dot = value.lastIndexOf(".");
  const sig = value.slice(dot + 1);
  const altered = `${name}=${value.slice(0, dot + 1)}${sig[0] === "A" ? "B" : "A"}${sig.slice(1)}`;
  expect(await as(altered)).toBeNull();
  const { session_version } = await db("users").where({ id: viewer.id }).first("session_version");
  await db("users").where({ id: viewer.id }).increment("session_version", 1);
  try {
    expect(await as(cookie)).toBeNull();
  } finally {
    await db("users").where({ id: viewer.id }).update({ session_version });
  }
  expect((await as(cookie))?.id).toBe(viewer.id);
});

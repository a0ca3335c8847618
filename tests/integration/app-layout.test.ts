// The signed-in frame's loader: the user and their unread notices come from one query (the user's
// query carries the count, issue 9 item 8), so check the count is still each user's own and unread only.
import { afterAll, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import * as layout from "~/routes/app-layout";
import { callRoute, demoUser, requestAs } from "./fixtures";

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

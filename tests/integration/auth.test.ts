// Sign-in, rate limits, password reset, invitations, sign-out and API tokens against the real
// MariaDB test database, calling the route modules as the framework would.
import { afterAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { hashPassword, requireApiUser, getUser } from "~/lib/auth.server";
import * as signIn from "~/routes/sign-in";
import * as signOut from "~/routes/sign-out";
import * as dashboard from "~/routes/dashboard";
import * as forgot from "~/routes/forgot-password";
import { resetMailSettled } from "~/lib/passwords.server";
import * as reset from "~/routes/reset-password.$token";
import * as invite from "~/routes/invite.$token";
import * as admin from "~/routes/admin";
import * as account from "~/routes/account";
import { callRoute, cookieFor, cookieForUser, demoUser, DEMO_EMAIL, DEMO_PASSWORD, formPost, fromAddress, messageOf, requestAs } from "./fixtures";

// People this file creates are removed afterwards, so other files see the demo team as seeded.
const created = new Set<string>();
afterAll(async () => {
  await db("users").whereIn("email", [...created]).delete();
  await db("invitations").whereIn("email", [...created]).delete();
  await db("teams").where({ slug: "auth-fixture" }).delete();
  await closeDb();
});

let ipSeq = 0;
/** Each test signs in from its own address so the per-address counter of one cannot trip another. */
const freshIp = () => `198.51.100.${++ipSeq}`; // TEST-NET-2 (RFC 5737): never a real client

async function signInPost(email: string, password: string, ip = freshIp(), next?: string) {
  return fromAddress(await formPost(null, "/sign-in", { email, password, ...(next ? { next } : {}) }), ip);
}

function cookieFrom(result: { headers: Headers }): string {
  const set = result.headers.get("set-cookie");
  if (!set) throw new Error("no Set-Cookie in the answer");
  return set.split(";")[0]!;
}

/** A member of a fixture team of its own (not the demo team, whose make-up other files check). */
async function makeUser(email: string, password = "correct horse battery", role = "engineer", teamSlug = "auth-fixture"): Promise<number> {
  created.add(email);
  let team = await db("teams").where({ slug: teamSlug }).first("id");
  if (!team) {
    const [id] = await db("teams").insert({ name: "Auth fixture team", slug: teamSlug });
    team = { id };
  }
  const [id] = await db("users").insert({ email, name: "Test Person", password_hash: await hashPassword(password) });
  await db("memberships").insert({ team_id: team.id, user_id: id, role });
  return Number(id);
}

async function latestMailTo(email: string) {
  return db("outbox").where({ to_address: email }).orderBy("id", "desc").first();
}

function tokenFromMail(body: string, path: "invite" | "reset-password"): string {
  const m = new RegExp(`/${path}/([A-Za-z0-9_-]+)`).exec(body);
  if (!m) throw new Error(`no /${path}/ link in: ${body}`);
  return m[1]!;
}

describe("sign-in", () => {
  test("the demo engineer signs in and reaches the dashboard with the new cookie", async () => {
    const res = await callRoute(signIn.action, await signInPost(DEMO_EMAIL.engineer, DEMO_PASSWORD));
    expect(res.status).toBe(302);
    expect(res.location).toBe("/");
    const setCookie = res.headers.get("set-cookie")!;
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    const page = await callRoute(dashboard.loader, new Request("http://sparwise.test/", { headers: { Cookie: cookieFrom(res) } }));
    expect(page.status).toBe(200);
    expect((page.data as { user: { email: string; role: string } }).user).toMatchObject({ email: DEMO_EMAIL.engineer, role: "engineer" });
  });

  test("e-mail address is case- and space-insensitive; ?next= is honoured only for same-site paths", async () => {
    const ok = await callRoute(signIn.action, await signInPost("  Reviewer@Tallowfield.EXAMPLE ", DEMO_PASSWORD, freshIp(), "/projects"));
    expect(ok.status).toBe(302);
    expect(ok.location).toBe("/projects");
    const away = await callRoute(signIn.action, await signInPost(DEMO_EMAIL.reviewer, DEMO_PASSWORD, freshIp(), "//evil.example/x"));
    expect(away.location).toBe("/");
  });

  test("a wrong password and an unknown address fail alike, with no cookie", async () => {
    const wrong = await callRoute(signIn.action, await signInPost(DEMO_EMAIL.viewer, "not-the-password"));
    const unknown = await callRoute(signIn.action, await signInPost("nobody@tallowfield.example", "not-the-password"));
    for (const r of [wrong, unknown]) {
      expect(r.status).toBe(401);
      expect(r.headers.get("set-cookie")).toBeNull();
      expect(messageOf(r)).toContain("E-mail address or password is wrong");
    }
    expect(messageOf(wrong)).toBe(messageOf(unknown));
  });

  test("empty fields are named", async () => {
    const res = await callRoute(signIn.action, await signInPost("", ""));
    expect(res.status).toBe(400);
    expect(messageOf(res)).toMatch(/^email:/);
  });

  test("signed-in visitors to /sign-in go straight on", async () => {
    const res = await callRoute(signIn.loader, await requestAs("viewer", "/sign-in?next=/account"));
    expect(res.status).toBe(302);
    expect(res.location).toBe("/account");
  });
});

// Sign-in throttling is tested in security-server.test.ts.

describe("sign-out", () => {
  test("signing out kills the cookie it was sent with and every older one", async () => {
    const first = cookieFrom(await callRoute(signIn.action, await signInPost(DEMO_EMAIL.engineer2, DEMO_PASSWORD)));
    const second = cookieFrom(await callRoute(signIn.action, await signInPost(DEMO_EMAIL.engineer2, DEMO_PASSWORD)));
    const asCookie = (c: string) => new Request("http://sparwise.test/", { headers: { Cookie: c } });
    expect((await callRoute(dashboard.loader, asCookie(first))).status).toBe(200);

    const out = await callRoute(signOut.action, new Request("http://sparwise.test/sign-out", { method: "POST", headers: { Cookie: second } }));
    expect(out.status).toBe(302);
    expect(out.location).toBe("/sign-in");
    expect(out.headers.get("set-cookie")).toMatch(/Expires=Thu, 01 Jan 1970/);

    for (const old of [first, second]) {
      const res = await callRoute(dashboard.loader, asCookie(old));
      expect(res.status).toBe(302);
      expect(res.location).toBe("/sign-in");
      expect(await getUser(asCookie(old))).toBeNull();
    }
  });

  test("a tampered cookie is no cookie", async () => {
    const good = await cookieFor("viewer");
    const bad = good.slice(0, -3) + (good.endsWith("a") ? "bbb" : "aaa");
    expect(await getUser(new Request("http://sparwise.test/", { headers: { Cookie: bad } }))).toBeNull();
  });
});

describe("password reset", () => {
  test("the form answers the same for known and unknown addresses, and mails only the known one", async () => {
    const before = Number((await db("outbox").count({ n: "*" }).first())!.n);
    const known = await callRoute(forgot.action, await formPost(null, "/forgot-password", { email: DEMO_EMAIL.viewer }));
    const unknown = await callRoute(forgot.action, await formPost(null, "/forgot-password", { email: "stranger@nowhere.example" }));
    await resetMailSettled(); // the reset e-mail is written off the request path
    expect(known.status).toBe(200);
    expect(unknown.status).toBe(200);
    expect(known.data).toEqual(unknown.data);
    const after = Number((await db("outbox").count({ n: "*" }).first())!.n);
    expect(after - before).toBe(1);
    expect(await latestMailTo("stranger@nowhere.example")).toBeUndefined();
  });

  test("a reset link works once, changes the password and ends older sessions", async () => {
    const email = "resetme@tallowfield.example";
    const userId = await makeUser(email, "the old password");
    const oldCookie = cookieFrom(await callRoute(signIn.action, await signInPost(email, "the old password")));

    await callRoute(forgot.action, await formPost(null, "/forgot-password", { email }));
    await resetMailSettled(); // the reset e-mail is written off the request path
    const mail = await latestMailTo(email);
    expect(mail.subject).toMatch(/Reset your Sparwise password/);
    const token = tokenFromMail(mail.text_body, "reset-password");
    // Only the hash is stored.
    const stored = await db("password_resets").where({ user_id: userId }).pluck("token_hash");
    expect(stored).not.toContain(token);
    expect(stored[0]).toMatch(/^[0-9a-f]{64}$/);

    expect((await callRoute(reset.loader, await requestAs(null, `/reset-password/${token}`), { token })).status).toBe(200);
    const mismatch = await callRoute(reset.action, await formPost(null, `/reset-password/${token}`, { password: "a brand new password", confirm: "something else" }), { token });
    expect(mismatch.status).toBe(400);
    expect(messageOf(mismatch)).toMatch(/^confirm:/);

    const done = await callRoute(reset.action, await formPost(null, `/reset-password/${token}`, { password: "a brand new password", confirm: "a brand new password" }), { token });
    expect(done.status).toBe(302);
    expect(done.location).toBe("/sign-in");

    // Single use.
    const again = await callRoute(reset.action, await formPost(null, `/reset-password/${token}`, { password: "another new password", confirm: "another new password" }), { token });
    expect(again.status).toBe(400);
    expect(messageOf(again)).toMatch(/already been used/);
    expect((await callRoute(reset.loader, await requestAs(null, `/reset-password/${token}`), { token })).status).toBe(410);

    expect(await getUser(new Request("http://sparwise.test/", { headers: { Cookie: oldCookie } }))).toBeNull();
    expect((await callRoute(signIn.action, await signInPost(email, "the old password"))).status).toBe(401);
    expect((await callRoute(signIn.action, await signInPost(email, "a brand new password"))).status).toBe(302);
  });

  test("a reset link older than one hour is refused and changes nothing", async () => {
    const email = "slowreader@tallowfield.example";
    const userId = await makeUser(email, "the old password");
    await callRoute(forgot.action, await formPost(null, "/forgot-password", { email }));
    await resetMailSettled(); // the reset e-mail is written off the request path
    const token = tokenFromMail((await latestMailTo(email)).text_body, "reset-password");
    const row = await db("password_resets").where({ user_id: userId }).first();
    // Issued with a one-hour life (within a minute of slack for the test's own run time).
    const life = new Date(row.expires_at).getTime() - new Date(row.created_at).getTime();
    expect(Math.abs(life - 3600_000)).toBeLessThan(60_000);
    await db("password_resets").where({ id: row.id }).update({ expires_at: new Date(Date.now() - 1000) });

    expect((await callRoute(reset.loader, await requestAs(null, `/reset-password/${token}`), { token })).status).toBe(410);
    const res = await callRoute(reset.action, await formPost(null, `/reset-password/${token}`, { password: "a brand new password", confirm: "a brand new password" }), { token });
    expect(res.status).toBe(400);
    expect(messageOf(res)).toMatch(/expired/);
    expect((await callRoute(signIn.action, await signInPost(email, "the old password"))).status).toBe(302);
  });

  test("an unknown token is a 404 page", async () => {
    const res = await callRoute(reset.loader, await requestAs(null, "/reset-password/not-a-token"), { token: "not-a-token" });
    expect(res.status).toBe(404);
  });
});

describe("invitations", () => {
  test("an admin invites an address; the link sets name and password once; the newcomer signs in with the role given", async () => {
    const email = "newhire@example.org";
    created.add(email);
    const sent = await callRoute(admin.action, await formPost("admin", "/admin", { intent: "invite", email, role: "reviewer" }));
    expect(sent.status).toBe(200);
    const mail = await latestMailTo(email);
    expect(mail.subject).toMatch(/invites you to Tallowfield Plate & Beam/);
    const token = tokenFromMail(mail.text_body, "invite");
    const inv = await db("invitations").where({ email }).first();
    expect(inv.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(inv.token_hash).not.toBe(token);
    const life = new Date(inv.expires_at).getTime() - new Date(inv.created_at).getTime();
    expect(Math.abs(life - 7 * 24 * 3600_000)).toBeLessThan(60_000);

    const page = await callRoute(invite.loader, await requestAs(null, `/invite/${token}`), { token });
    expect(page.status).toBe(200);
    expect(page.data).toMatchObject({ invitation: { email, role: "reviewer", teamName: "Tallowfield Plate & Beam" } });

    const short = await callRoute(invite.action, await formPost(null, `/invite/${token}`, { name: "Noor Vasquez", password: "short", confirm: "short" }), { token });
    expect(short.status).toBe(400);
    expect(messageOf(short)).toMatch(/^password:/);

    const joined = await callRoute(invite.action, await formPost(null, `/invite/${token}`, { name: "Noor Vasquez", password: "a long new password", confirm: "a long new password" }), { token });
    expect(joined.status).toBe(302);
    expect(joined.location).toBe("/");
    const me = await getUser(new Request("http://sparwise.test/", { headers: { Cookie: cookieFrom(joined) } }));
    expect(me).toMatchObject({ email, name: "Noor Vasquez", role: "reviewer", teamName: "Tallowfield Plate & Beam" });

    const reuse = await callRoute(invite.action, await formPost(null, `/invite/${token}`, { name: "Someone Else", password: "another long password", confirm: "another long password" }), { token });
    expect(reuse.status).toBe(400);
    expect(messageOf(reuse)).toMatch(/already been accepted/);
    expect((await db("users").where({ email }).first()).name).toBe("Noor Vasquez");

    expect((await callRoute(signIn.action, await signInPost(email, "a long new password"))).status).toBe(302);
  });

  test("an expired invitation is refused; inviting an existing member is refused by name", async () => {
    const email = "latecomer@example.org";
    created.add(email);
    await callRoute(admin.action, await formPost("admin", "/admin", { intent: "invite", email, role: "viewer" }));
    const token = tokenFromMail((await latestMailTo(email)).text_body, "invite");
    await db("invitations").where({ email }).update({ expires_at: new Date(Date.now() - 1000) });
    expect((await callRoute(invite.loader, await requestAs(null, `/invite/${token}`), { token })).status).toBe(410);
    const late = await callRoute(invite.action, await formPost(null, `/invite/${token}`, { name: "Late", password: "a long new password", confirm: "a long new password" }), { token });
    expect(late.status).toBe(400);
    expect(await db("users").where({ email }).first()).toBeUndefined();

    const dup = await callRoute(admin.action, await formPost("admin", "/admin", { intent: "invite", email: DEMO_EMAIL.viewer, role: "viewer" }));
    expect(dup.status).toBe(409);
    expect(messageOf(dup)).toMatch(/^email:.*already a member/);
  });

  test("only admins may invite", async () => {
    const res = await callRoute(admin.action, await formPost("engineer", "/admin", { intent: "invite", email: "x@example.org", role: "admin" }));
    expect(res.status).toBe(403);
    expect(await db("invitations").where({ email: "x@example.org" }).first()).toBeUndefined();
  });
});

describe("team admin", () => {
  test("the last admin cannot demote or remove themself", async () => {
    const me = await demoUser("admin");
    const membership = await db("memberships").where({ user_id: me.id }).first("id");
    const demote = await callRoute(admin.action, await formPost("admin", "/admin", { intent: "changeRole", memberId: String(membership.id), role: "viewer" }));
    expect(demote.status).toBe(409);
    expect(messageOf(demote)).toMatch(/at least one admin/);
    expect((await db("memberships").where({ id: membership.id }).first()).role).toBe("admin");
  });

  test("a removed member's sessions and API tokens stop working at once", async () => {
    const email = "leaver@tallowfield.example";
    const userId = await makeUser(email, "leaver password 1", "engineer", "tallowfield");
    const cookie = cookieFrom(await callRoute(signIn.action, await signInPost(email, "leaver password 1")));
    const made = await callRoute(account.action, new Request("http://sparwise.test/account", {
      method: "POST",
      headers: { Cookie: cookie, "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ intent: "createToken", name: "script" }),
    }));
    const token = (made.data as { created: { token: string } }).created.token;
    const bearer = new Request("http://sparwise.test/api/v1/sweeps", { headers: { Authorization: `Bearer ${token}` } });
    expect((await requireApiUser(bearer)).id).toBe(userId);

    const membership = await db("memberships").where({ user_id: userId }).first("id");
    const removed = await callRoute(admin.action, await formPost("admin", "/admin", { intent: "remove", memberId: String(membership.id) }));
    expect(removed.status).toBe(200);
    expect(await getUser(new Request("http://sparwise.test/", { headers: { Cookie: cookie } }))).toBeNull();
    await expect(requireApiUser(new Request("http://sparwise.test/api/v1/sweeps", { headers: { Authorization: `Bearer ${token}` } }))).rejects.toMatchObject({ status: 401 });
  });
});

describe("API tokens", () => {
  test("a token is shown once, stored hashed, acts with the owner's role, and dies when revoked", async () => {
    const made = await callRoute(account.action, await formPost("reviewer", "/account", { intent: "createToken", name: "nightly recheck" }));
    expect(made.status).toBe(200);
    const token = (made.data as { created: { token: string } }).created.token;
    expect(token).toMatch(/^spw_[A-Za-z0-9_-]{43}$/);
    const row = await db("api_tokens").where({ name: "nightly recheck" }).first();
    expect(row.token_hash).not.toContain(token);

    const api = (t: string) => new Request("http://sparwise.test/api/v1/sweeps", { headers: { Authorization: `Bearer ${t}` } });
    const user = await requireApiUser(api(token), "recheck");
    expect(user.email).toBe(DEMO_EMAIL.reviewer);
    await expect(requireApiUser(api(token), "runSweep")).rejects.toMatchObject({ status: 403 });
    await expect(requireApiUser(api("spw_wrong"))).rejects.toMatchObject({ status: 401 });
    await expect(requireApiUser(new Request("http://sparwise.test/api/v1/sweeps"))).rejects.toMatchObject({ status: 401 });

    const listed = await callRoute(account.loader, await requestAs("reviewer", "/account"));
    expect(JSON.stringify(listed.data)).not.toContain(token);

    const revoked = await callRoute(account.action, await formPost("reviewer", "/account", { intent: "revokeToken", tokenId: String(row.id) }));
    expect(revoked.status).toBe(200);
    await expect(requireApiUser(api(token))).rejects.toMatchObject({ status: 401 });
  });

  test("nobody revokes another member's token", async () => {
    const made = await callRoute(account.action, await formPost("engineer", "/account", { intent: "createToken", name: "engineer's script" }));
    expect(made.status).toBe(200);
    const row = await db("api_tokens").where({ name: "engineer's script" }).first();
    const res = await callRoute(account.action, await formPost("viewer", "/account", { intent: "revokeToken", tokenId: String(row.id) }));
    expect(res.status).toBe(404);
    expect((await db("api_tokens").where({ id: row.id }).first()).revoked_at).toBeNull();
  });
});

describe("reset e-mails are rationed", () => {
  test("at most three reset e-mails per address per hour, with the same answer every time", async () => {
    const email = "impatient@tallowfield.example";
    await makeUser(email, "some password here");
    const answers = [];
    for (let i = 0; i < 5; i++) {
      const res = await callRoute(forgot.action, fromAddress(await formPost(null, "/forgot-password", { email }), freshIp()));
      await resetMailSettled(); // the reset e-mail is written off the request path
      answers.push(res.data);
    }
    expect(new Set(answers.map((a) => JSON.stringify(a))).size).toBe(1);
    expect(Number((await db("outbox").where({ to_address: email }).count({ n: "*" }).first())!.n)).toBe(3);
  });
});

describe("admin and team API tokens", () => {
  test("an admin revokes a member's token; another team's admin cannot", async () => {
    const made = await callRoute(account.action, await formPost("engineer2", "/account", { intent: "createToken", name: "leaky laptop" }));
    const token = (made.data as { created: { token: string } }).created.token;
    const row = await db("api_tokens").where({ name: "leaky laptop" }).first("id");
    const listed = await callRoute(admin.loader, await requestAs("admin", "/admin"));
    expect((listed.data as { tokens: { id: number; owner: string }[] }).tokens).toContainEqual(expect.objectContaining({ id: row.id, owner: "Priya Hallam" }));

    // An admin elsewhere gets "no such token", and the token keeps working.
    const otherTeam = await db("teams").insert({ name: "Elsewhere Fabrication", slug: "auth-elsewhere" });
    const outsider = "outsider-admin@elsewhere.example";
    created.add(outsider);
    const [outsiderId] = await db("users").insert({ email: outsider, name: "Outsider", password_hash: null });
    await db("memberships").insert({ team_id: otherTeam[0], user_id: outsiderId, role: "admin" });
    const foreign = await callRoute(admin.action, new Request("http://sparwise.test/admin", {
      method: "POST",
      headers: { Cookie: await cookieForUser(Number(outsiderId)), "Content-Type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ intent: "revokeToken", tokenId: String(row.id) }),
    }));
    expect(foreign.status).toBe(404);
    expect((await requireApiUser(new Request("http://sparwise.test/x", { headers: { Authorization: `Bearer ${token}` } }))).email).toBe(DEMO_EMAIL.engineer2);
    await db("teams").where({ slug: "auth-elsewhere" }).delete();

    const revoked = await callRoute(admin.action, await formPost("admin", "/admin", { intent: "revokeToken", tokenId: String(row.id) }));
    expect(revoked.status).toBe(200);
    await expect(requireApiUser(new Request("http://sparwise.test/x", { headers: { Authorization: `Bearer ${token}` } }))).rejects.toMatchObject({ status: 401 });
  });
});

describe("e-mail transport", () => {
  test("capture by default; with SMTP_URL set, a failed delivery is still kept in the outbox", async () => {
    const { sendEmail } = await import("~/lib/email.server");
    const captured = await sendEmail({ to: "capture@example.org", subject: "Captured", text: "hello" });
    expect((await db("outbox").where({ id: captured }).first()).transport).toBe("capture");
    const saved = process.env.SMTP_URL;
    process.env.SMTP_URL = "smtp://127.0.0.1:1"; // nothing listens on port 1: delivery must fail
    try {
      const id = await sendEmail({ to: "smtp@example.org", subject: "Via SMTP", text: "hello" });
      const row = await db("outbox").where({ id }).first();
      expect(row).toMatchObject({ to_address: "smtp@example.org", subject: "Via SMTP", transport: "smtp-failed" });
    } finally {
      if (saved === undefined) delete process.env.SMTP_URL;
      else process.env.SMTP_URL = saved;
    }
  });
});

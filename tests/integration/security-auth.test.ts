// Account and sign-in security (issue 9), against the real MariaDB with two teams: the demo team
// ("team A", seeded with projects) and a second team created here ("team B"). Each test was written
// to fail on the code before its fix.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "~/lib/db.server";
import { getUser, hashPassword } from "~/lib/auth.server";
import * as admin from "~/routes/admin";
import * as account from "~/routes/account";
import * as invite from "~/routes/invite.$token";
import * as project from "~/routes/projects.$projectId";
import * as signIn from "~/routes/sign-in";
import * as forgot from "~/routes/forgot-password";
import { resetMailQueue, resetMailSettled } from "~/lib/passwords.server";
import * as reset from "~/routes/reset-password.$token";
import { requireApiUser } from "~/lib/auth.server";
import * as adminOutbox from "~/routes/admin.outbox";
import * as messages from "~/routes/messages";
import { execFileSync } from "node:child_process";
import * as option from "~/routes/options.$optionId";
import * as sweepPage from "~/routes/sweeps.$sweepId";
import { recordFinishedSweep } from "~/lib/finished-sweep.server";
import { CHANNEL_PROBLEM } from "./workflow-fixtures";
import { appBaseUrl, DEV_APP_URL } from "~/lib/app-url.server";
import { endHeldSweep } from "~/workers/queue.server";
import { callRoute, cookieForUser, fromAddress, type RouteResult } from "./fixtures";

const BASE = "http://sparwise.test";
const SLUG_B = "security-auth-team-b";
const SLUG_C = "security-auth-team-c";
const created = new Set<string>();

let teamA: number;
let teamB: number;
let adminB: number;
let projectA: number;

async function makeUser(email: string, password: string | null, teamId: number, role: string): Promise<number> {
  created.add(email);
  const [id] = await db("users").insert({ email, name: email.split("@")[0], password_hash: password ? await hashPassword(password) : null });
  await db("memberships").insert({ team_id: teamId, user_id: id, role });
  return Number(id);
}

async function makeTeam(name: string, slug: string): Promise<number> {
  const [id] = await db("teams").insert({ name, slug });
  return Number(id);
}

beforeAll(async () => {
  teamA = (await db("teams").where({ slug: "tallowfield" }).first("id")).id;
  projectA = (await db("projects").where({ team_id: teamA }).orderBy("id").first("id")).id;
  teamB = await makeTeam("Sallowmere Structures (test)", SLUG_B);
  adminB = await makeUser("admin-b@sallowmere.example", "team b admin password", teamB, "admin");
});

afterAll(async () => {
  await db("teams").whereIn("slug", [SLUG_B, SLUG_C]).delete();
  await db("users").whereIn("email", [...created]).delete();
  await db("invitations").whereIn("email", [...created]).delete();
  await closeDb();
});

let ipSeq = 0;
const freshIp = () => `203.0.113.${++ipSeq}`; // TEST-NET-3 (RFC 5737)

async function post(cookie: string | null, path: string, fields: Record<string, string>): Promise<Request> {
  const headers = new Headers({ "Content-Type": "application/x-www-form-urlencoded" });
  if (cookie) headers.set("Cookie", cookie);
  // Each from its own client address (the server reads it off the socket, not from a header).
  return fromAddress(new Request(new URL(path, BASE), { method: "POST", headers, body: new URLSearchParams(fields) }), freshIp());
}

function get(cookie: string | null, path: string): Request {
  return new Request(new URL(path, BASE), { headers: cookie ? { Cookie: cookie } : {} });
}

function cookieFrom(result: RouteResult): string {
  const set = result.headers.get("set-cookie");
  if (!set) throw new Error(`no Set-Cookie in the answer (status ${result.status})`);
  return set.split(";")[0]!;
}

async function inviteToken(email: string): Promise<string> {
  const mail = await db("outbox").where({ to_address: email }).orderBy("id", "desc").first("text_body");
  const m = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text_body);
  if (!m) throw new Error(`no invitation link in: ${mail.text_body}`);
  return m[1]!;
}

const projectPage = (cookie: string) => callRoute(project.loader, get(cookie, `/projects/${projectA}`), { projectId: String(projectA) });

describe("1. an invitation never takes over an existing account", () => {
  test("team B's admin invites a member of team A: the link sets no password, signs nobody in, and team A stays out of reach", async () => {
    const email = "victim@tallowfield.example";
    const victimPassword = "the victim's own password";
    const victim = await makeUser(email, victimPassword, teamA, "engineer");
    const before = await db("users").where({ id: victim }).first();
    const adminBCookie = await cookieForUser(adminB);

    const sent = await callRoute(admin.action, await post(adminBCookie, "/admin", { intent: "invite", email, role: "viewer" }));
    expect(sent.status).toBe(200);
    // Whoever reads the link (here: team B's admin) tries to set a password through it.
    const token = await inviteToken(email);
    const page = await callRoute(invite.loader, get(null, `/invite/${token}`), { token });
    expect(page.data).toMatchObject({ invitation: { email, hasAccount: true } });
    const takeover = await callRoute(invite.action, await post(null, `/invite/${token}`, { name: "Mallory", password: "attacker's password", confirm: "attacker's password" }), { token });
    expect(takeover.status).toBe(409);
    expect(takeover.headers.get("set-cookie")).toBeNull();
    expect(JSON.stringify(takeover.data)).toMatch(/sign in with its own password/);
    // The join path wants the account's own password.
    const guess = await callRoute(invite.action, await post(null, `/invite/${token}`, { intent: "join", password: "attacker's password" }), { token });
    expect(guess.status).toBe(401);
    expect(guess.headers.get("set-cookie")).toBeNull();

    const after = await db("users").where({ id: victim }).first();
    expect(after.password_hash).toBe(before.password_hash);
    expect(after.name).toBe(before.name);
    expect(after.session_version).toBe(before.session_version);
    expect(await db("memberships").where({ user_id: victim, team_id: teamB }).first()).toBeUndefined();
    expect((await db("invitations").where({ email, team_id: teamB }).first()).accepted_at).toBeNull();
    expect((await callRoute(signIn.action, await post(null, "/sign-in", { email, password: "attacker's password" }))).status).toBe(401);
    expect((await callRoute(signIn.action, await post(null, "/sign-in", { email, password: victimPassword }))).status).toBe(302);

    // Team B's admin never reaches team A's projects.
    expect([403, 404]).toContain((await projectPage(adminBCookie)).status);
  });

  test("the invited user accepts with their own password, then acts in the team they choose and only those they belong to", async () => {
    const email = "twoteams@tallowfield.example";
    const password = "two teams password";
    const user = await makeUser(email, password, teamA, "engineer");
    await callRoute(admin.action, await post(await cookieForUser(adminB), "/admin", { intent: "invite", email, role: "viewer" }));
    const token = await inviteToken(email);
    const hashBefore = (await db("users").where({ id: user }).first()).password_hash;

    const joined = await callRoute(invite.action, await post(null, `/invite/${token}`, { intent: "join", password }), { token });
    expect(joined.status).toBe(302);
    expect((await db("users").where({ id: user }).first()).password_hash).toBe(hashBefore);
    expect(await db("memberships").where({ user_id: user, team_id: teamB }).first("role")).toEqual({ role: "viewer" });

    // Having just joined team B, the session acts in team B: team A's project is out of reach.
    let cookie = cookieFrom(joined);
    const me = await getUser(get(cookie, "/"));
    expect(me).toMatchObject({ teamId: teamB, role: "viewer" });
    expect(me!.teams.map((t) => t.id).sort()).toEqual([teamA, teamB].sort());
    expect((await projectPage(cookie)).status).toBe(404);

    // Switching to team A (a member) works and every guard follows it.
    const toA = await callRoute(account.action, await post(cookie, "/account", { intent: "switchTeam", teamId: String(teamA) }));
    expect(toA.status).toBe(302);
    cookie = cookieFrom(toA);
    expect(await getUser(get(cookie, "/"))).toMatchObject({ teamId: teamA, role: "engineer" });
    expect((await projectPage(cookie)).status).toBe(200);

    // A team they are not a member of cannot be chosen, and the session keeps its team.
    const teamC = await makeTeam("Foreign team (test)", SLUG_C);
    const toC = await callRoute(account.action, await post(cookie, "/account", { intent: "switchTeam", teamId: String(teamC) }));
    expect(toC.status).toBe(404);
    expect(toC.headers.get("set-cookie")).toBeNull();
    expect(await getUser(get(cookie, "/"))).toMatchObject({ teamId: teamA });
  });

  test("a signed-in invitee accepts with one click; someone else signed in cannot accept for them", async () => {
    const email = "oneclick@tallowfield.example";
    const user = await makeUser(email, "one click password", teamA, "reviewer");
    await callRoute(admin.action, await post(await cookieForUser(adminB), "/admin", { intent: "invite", email, role: "engineer" }));
    const token = await inviteToken(email);

    const other = await callRoute(invite.action, await post(await cookieForUser(adminB), `/invite/${token}`, { intent: "join" }), { token });
    expect(other.status).toBe(400);
    expect(await db("memberships").where({ user_id: user, team_id: teamB }).first()).toBeUndefined();

    const ok = await callRoute(invite.action, await post(await cookieForUser(user), `/invite/${token}`, { intent: "join" }), { token });
    expect(ok.status).toBe(302);
    expect(await getUser(get(cookieFrom(ok), "/"))).toMatchObject({ teamId: teamB, role: "engineer" });
  });

  test("accepting never re-enables a disabled account", async () => {
    const email = "disabled@tallowfield.example";
    const password = "disabled account password";
    const user = await makeUser(email, password, teamA, "engineer");
    await db("users").where({ id: user }).update({ disabled_at: new Date() });
    await callRoute(admin.action, await post(await cookieForUser(adminB), "/admin", { intent: "invite", email, role: "engineer" }));
    const token = await inviteToken(email);

    const create = await callRoute(invite.action, await post(null, `/invite/${token}`, { name: "Back Again", password: "a new long password", confirm: "a new long password" }), { token });
    expect(create.status).toBe(409);
    const join = await callRoute(invite.action, await post(null, `/invite/${token}`, { intent: "join", password }), { token });
    expect(join.status).toBe(401);
    const row = await db("users").where({ id: user }).first();
    expect(row.disabled_at).not.toBeNull();
    expect(await db("memberships").where({ user_id: user, team_id: teamB }).first()).toBeUndefined();
  });
});

/** Runs `fn` with environment variables set (undefined removes one), restoring them after. */
async function withEnv<T>(vars: Record<string, string | undefined>, fn: () => Promise<T> | T): Promise<T> {
  const saved = Object.fromEntries(Object.keys(vars).map((k) => [k, process.env[k]]));
  const set = (k: string, v: string | undefined) => (v === undefined ? delete process.env[k] : (process.env[k] = v));
  for (const [k, v] of Object.entries(vars)) set(k, v);
  try {
    return await fn();
  } finally {
    for (const [k, v] of Object.entries(saved)) set(k, v);
  }
}

describe("2. links in e-mail come from APP_URL only", () => {
  const hostile = { Host: "evil.example", "X-Forwarded-Host": "evil.example", "X-Forwarded-Proto": "https" };

  async function hostilePost(cookie: string | null, path: string, fields: Record<string, string>): Promise<Request> {
    const headers = new Headers({ "Content-Type": "application/x-www-form-urlencoded", ...hostile });
    if (cookie) headers.set("Cookie", cookie);
    return fromAddress(new Request(new URL(path, "http://evil.example"), { method: "POST", headers, body: new URLSearchParams(fields) }), freshIp());
  }

  test("a reset requested with a forged Host mails a link to APP_URL, not to the forged host", async () => {
    const email = "hostpoison@tallowfield.example";
    await makeUser(email, "host poison password", teamA, "viewer");
    await withEnv({ APP_URL: "https://sparwise.example.org/" }, async () => {
      const res = await callRoute(forgot.action, await hostilePost(null, "/forgot-password", { email }));
      await resetMailSettled(); // the reset e-mail is written off the request path
      expect(res.status).toBe(200);
    });
    const mail = await db("outbox").where({ to_address: email }).orderBy("id", "desc").first("text_body");
    expect(mail.text_body).toMatch(/https:\/\/sparwise\.example\.org\/reset-password\/[A-Za-z0-9_-]{20,}/);
    expect(mail.text_body).not.toMatch(/evil\.example/);
  });

  test("an invitation sent through a forged Host links to APP_URL; unset outside production it is the local address", async () => {
    const email = "hostpoison-invitee@example.org";
    created.add(email);
    await withEnv({ APP_URL: undefined }, async () => {
      const res = await callRoute(admin.action, await hostilePost(await cookieForUser(adminB), "/admin", { intent: "invite", email, role: "viewer" }));
      expect(res.status).toBe(200);
    });
    const mail = await db("outbox").where({ to_address: email }).orderBy("id", "desc").first("text_body");
    expect(mail.text_body).toContain(`${DEV_APP_URL}/invite/`);
    expect(mail.text_body).not.toMatch(/evil\.example/);
  });

  test("a sweep's end notice links to APP_URL too (was: the queue's own fallback, localhost and PORT)", async () => {
    const owner = await db("users").where({ email: "engineer@tallowfield.example" }).first("id", "email");
    const [id] = await db("sweeps").insert({ team_id: teamA, owner_id: owner.id, problem: JSON.stringify(CHANNEL_PROBLEM), status: "running", lease_token: "app-url-link-test", attempts: 1 });
    const claim = { id: Number(id), token: "app-url-link-test", attempt: 1, workerId: "app-url test", teamId: teamA, ownerId: owner.id, problem: CHANNEL_PROBLEM as never };
    await withEnv({ APP_URL: "https://sparwise.example.org/", PORT: "4999" }, async () => {
      expect(await endHeldSweep(claim, "failed", "stopped by the APP_URL test")).toBe(true);
    });
    const mail = await db("outbox").where({ to_address: owner.email }).orderBy("id", "desc").first("text_body");
    expect(mail.text_body).toContain(`https://sparwise.example.org/sweeps/${id}`);
    expect(mail.text_body).not.toMatch(/localhost/);
  });

  test("in production a missing or malformed APP_URL is refused with a message naming it", async () => {
    await withEnv({ NODE_ENV: "production", APP_URL: undefined }, () => expect(() => appBaseUrl()).toThrow(/APP_URL is not set/));
    await withEnv({ NODE_ENV: "production", APP_URL: "not a url" }, () => expect(() => appBaseUrl()).toThrow(/APP_URL is not a valid URL/));
    await withEnv({ NODE_ENV: "production", APP_URL: "ftp://x.example" }, () => expect(() => appBaseUrl()).toThrow(/APP_URL must start with http/));
    await withEnv({ NODE_ENV: "production", APP_URL: "https://steel.example.com/sparwise/" }, () => expect(appBaseUrl()).toBe("https://steel.example.com/sparwise"));
  });
});

describe("3. the outbox is each recipient's mailbox; admins see tokens masked", () => {
  type Listed = { messages: { to: string; subject: string; body: string }[] };

  test("an admin cannot read another person's reset token; the recipient reads it in full under /messages", async () => {
    const email = "outbox-reader@tallowfield.example";
    const other = "outbox-bystander@tallowfield.example";
    const user = await makeUser(email, "outbox reader password", teamA, "reviewer");
    const bystander = await makeUser(other, "outbox bystander password", teamA, "viewer");
    await callRoute(forgot.action, await post(null, "/forgot-password", { email }));
    await resetMailSettled(); // the reset e-mail is written off the request path
    const mail = await db("outbox").where({ to_address: email }).orderBy("id", "desc").first("text_body");
    const token = /\/reset-password\/([A-Za-z0-9_-]+)/.exec(mail.text_body)![1]!;

    const adminA = (await db("users").where({ email: "admin@tallowfield.example" }).first("id")).id;
    const listed = (await callRoute(adminOutbox.loader, get(await cookieForUser(adminA), "/admin/outbox"))).data as Listed;
    const seen = listed.messages.find((m) => m.to === email);
    expect(seen?.body).toMatch(/\/reset-password\/\[token hidden\]/);
    expect(JSON.stringify(listed)).not.toContain(token);

    const mine = (await callRoute(messages.loader, get(await cookieForUser(user), "/messages"))).data as Listed;
    expect(mine.messages.some((m) => m.body.includes(`/reset-password/${token}`))).toBe(true);
    expect(mine.messages.every((m) => m.to === email)).toBe(true);

    const theirs = (await callRoute(messages.loader, get(await cookieForUser(bystander), "/messages"))).data as Listed;
    expect(JSON.stringify(theirs)).not.toContain(token);
  });

  test("the inviting admin sees the invitation link once, in the answer to the invite; the outbox masks it", async () => {
    const email = "copied-link@example.org";
    created.add(email);
    const adminBCookie = await cookieForUser(adminB);
    const sent = await callRoute(admin.action, await post(adminBCookie, "/admin", { intent: "invite", email, role: "engineer" }));
    const token = await inviteToken(email);
    expect((sent.data as { inviteLink: { link: string } }).inviteLink.link).toMatch(new RegExp(`/invite/${token}$`));

    const adminPage = await callRoute(admin.loader, get(adminBCookie, "/admin"));
    expect(JSON.stringify(adminPage.data)).not.toContain(token);
    const outbox = await callRoute(adminOutbox.loader, get(adminBCookie, "/admin/outbox"));
    expect(JSON.stringify(outbox.data)).not.toContain(token);
    expect(JSON.stringify(outbox.data)).toContain("/invite/[token hidden]");
  });

  test("npm run outbox prints a message in full for the person running the server", async () => {
    const email = "terminal-reader@tallowfield.example";
    await makeUser(email, "terminal reader password", teamA, "viewer");
    await callRoute(forgot.action, await post(null, "/forgot-password", { email }));
    await resetMailSettled(); // the reset e-mail is written off the request path
    const mail = await db("outbox").where({ to_address: email }).orderBy("id", "desc").first("text_body");
    const token = /\/reset-password\/([A-Za-z0-9_-]+)/.exec(mail.text_body)![1]!;
    const out = execFileSync("npx", ["tsx", "db/outbox.ts", "--to", email], { env: { ...process.env }, encoding: "utf8" });
    expect(out).toContain(`To:      ${email}`);
    expect(out).toContain(`/reset-password/${token}`);
  });
});

describe("5. four-eyes review", () => {
  test("an admin cannot approve or return an option they saved and sent for review; another admin can, and the page says why", async () => {
    // Team B has two admins and no reviewer: the admins review.
    const other = await makeUser("second-admin-b@sallowmere.example", "second admin password", teamB, "admin");
    const [projectId] = await db("projects").insert({ team_id: teamB, name: "Four-eyes yard", created_by: adminB });
    const sweepId = await recordFinishedSweep(db, { teamId: teamB, ownerId: adminB, projectId: Number(projectId), problem: CHANNEL_PROBLEM });
    const me = await cookieForUser(adminB);
    const saved = await callRoute(sweepPage.action, await post(me, `/sweeps/${sweepId}`, { intent: "saveOption", rank: "1" }), { sweepId: String(sweepId) });
    expect(saved.status).toBeLessThan(400);
    const optionId = (await db("options").where({ sweep_id: sweepId }).orderBy("id", "desc").first("id")).id as number;
    const params = { optionId: String(optionId) };
    const requested = await callRoute(option.action, await post(me, `/options/${optionId}`, { intent: "requestReview" }), params);
    expect(requested.status).toBe(200);
    // Only the other admin is asked; the e-mail names the option as its pages do: the project's first.
    expect(await db("outbox").where({ subject: "Review requested: option 1 in Four-eyes yard" }).pluck("to_address")).toEqual(["second-admin-b@sallowmere.example"]);

    for (const decision of [{ decision: "approved" }, { decision: "returned", comment: "looks fine to me" }] as Record<string, string>[]) {
      const own = await callRoute(option.action, await post(me, `/options/${optionId}`, { intent: "decide", ...decision }), params);
      expect(own.status).toBe(403);
      expect(JSON.stringify(own.data)).toMatch(/You saved this option, so someone else must approve or return it/);
    }
    expect((await db("options").where({ id: optionId }).first("review_state")).review_state).toBe("in_review");
    const page = (await callRoute(option.loader, get(me, `/options/${optionId}`), params)).data as { may: { review: boolean }; reviewRefusal: string | null };
    expect(page.may.review).toBe(false);
    expect(page.reviewRefusal).toMatch(/four-eyes/);

    const theirs = await cookieForUser(other);
    const otherPage = (await callRoute(option.loader, get(theirs, `/options/${optionId}`), params)).data as { may: { review: boolean }; reviewRefusal: string | null };
    expect(otherPage).toMatchObject({ may: { review: true }, reviewRefusal: null });
    expect((await callRoute(option.action, await post(theirs, `/options/${optionId}`, { intent: "decide", decision: "approved" }), params)).status).toBe(200);
    const { name } = await db("users").where({ id: other }).first("name");
    expect(await db("notifications").where({ user_id: adminB, link: `/options/${optionId}` }).pluck("title")).toEqual([`Option 1 in Four-eyes yard approved by ${name}`]);
  });
});

describe("10. after sign-in, next= leads only to a path of this app", () => {
  // As they arrive in the query string (percent-encoded), so the loader decodes them as a browser sent them.
  const HOSTILE = ["/%09/evil.example", "//evil.example", "/%5Cevil.example", "/\\evil.example", "/%0a", "/%0d%0aSet-Cookie:%20x=1", "/%00", "/%E2%80%A8", "/..//evil.example", "https://evil.example/", "/%20/evil.example", "javascript:alert(1)"];

  test.each(HOSTILE)("next=%s sends a signed-in user to the dashboard, never away and never a 500", async (next) => {
    const user = (await db("users").where({ email: "viewer@tallowfield.example" }).first("id")).id;
    const res = await callRoute(signIn.loader, get(await cookieForUser(user), `/sign-in?next=${next}`));
    expect(res.error).toBeUndefined();
    expect(res.status).toBe(302);
    expect(res.location).toBe("/");
  });

  test.each(HOSTILE)("next=%s posted with the sign-in form lands on the dashboard", async (next) => {
    const decoded = (() => {
      try {
        return decodeURIComponent(next);
      } catch {
        return next;
      }
    })();
    const res = await callRoute(signIn.action, await post(null, "/sign-in", { email: "reviewer@tallowfield.example", password: "sparwise-demo", next: decoded }));
    expect(res.error).toBeUndefined();
    expect(res.status).toBe(302);
    expect(res.location).toBe("/");
  });

  test("an ordinary path keeps its query and hash", async () => {
    const res = await callRoute(signIn.action, await post(null, "/sign-in", { email: "reviewer@tallowfield.example", password: "sparwise-demo", next: "/projects?archived=1#list" }));
    expect(res.location).toBe("/projects?archived=1#list");
  });
});

describe("12. a password reset or change ends every session and API token", () => {
  const bearer = (token: string) => new Request(`${BASE}/api/v1/sweeps`, { headers: { Authorization: `Bearer ${token}` } });
  async function tokenFor(cookie: string, name: string): Promise<string> {
    const made = await callRoute(account.action, await post(cookie, "/account", { intent: "createToken", name }));
    return (made.data as { created: { token: string } }).created.token;
  }
  async function signedIn(email: string, password: string): Promise<string> {
    const res = await callRoute(signIn.action, await post(null, "/sign-in", { email, password }));
    expect(res.status).toBe(302);
    return cookieFrom(res);
  }

  test("after a reset, API tokens made before it are revoked and old sessions are dead", async () => {
    const email = "reset-revokes@tallowfield.example";
    await makeUser(email, "password before reset", teamA, "engineer");
    const cookie = await signedIn(email, "password before reset");
    const token = await tokenFor(cookie, "laptop script");
    expect((await requireApiUser(bearer(token))).email).toBe(email);

    await callRoute(forgot.action, await post(null, "/forgot-password", { email }));
    await resetMailSettled(); // the reset e-mail is written off the request path
    const mail = await db("outbox").where({ to_address: email }).orderBy("id", "desc").first("text_body");
    const resetToken = /\/reset-password\/([A-Za-z0-9_-]+)/.exec(mail.text_body)![1]!;
    const done = await callRoute(reset.action, await post(null, `/reset-password/${resetToken}`, { password: "password after reset", confirm: "password after reset" }), { token: resetToken });
    expect(done.status).toBe(302);

    await expect(requireApiUser(bearer(token))).rejects.toMatchObject({ status: 401 });
    expect(await getUser(get(cookie, "/"))).toBeNull();
  });

  test("changing the password needs the current one and the reset's rule; it ends other sessions and tokens and keeps this one", async () => {
    const email = "changer@tallowfield.example";
    await makeUser(email, "my current password", teamA, "engineer");
    const here = await signedIn(email, "my current password");
    const elsewhere = await signedIn(email, "my current password");
    const token = await tokenFor(here, "ci script");
    const change = (fields: Record<string, string>) => post(here, "/account", { intent: "changePassword", ...fields });

    const wrong = await callRoute(account.action, await change({ current: "not my password", password: "a new long password", confirm: "a new long password" }));
    expect(wrong.status).toBe(400);
    expect(JSON.stringify(wrong.data)).toMatch(/"current":"Your current password is wrong/);
    const short = await callRoute(account.action, await change({ current: "my current password", password: "short", confirm: "short" }));
    expect(short.status).toBe(400);
    expect(JSON.stringify(short.data)).toMatch(/"password":.*at least 10 characters/);
    const mismatch = await callRoute(account.action, await change({ current: "my current password", password: "a new long password", confirm: "a different one" }));
    expect(mismatch.status).toBe(400);
    expect(JSON.stringify(mismatch.data)).toMatch(/"confirm"/);
    expect((await requireApiUser(bearer(token))).email).toBe(email); // refusals changed nothing

    const ok = await callRoute(account.action, await change({ current: "my current password", password: "a new long password", confirm: "a new long password" }));
    expect(ok.status).toBe(200);
    expect(await getUser(get(cookieFrom(ok), "/"))).toMatchObject({ email });
    expect(await getUser(get(elsewhere, "/"))).toBeNull();
    expect(await getUser(get(here, "/"))).toBeNull(); // the cookie as it was before the change
    await expect(requireApiUser(bearer(token))).rejects.toMatchObject({ status: 401 });
    expect((await callRoute(signIn.action, await post(null, "/sign-in", { email, password: "my current password" }))).status).toBe(401);
    await signedIn(email, "a new long password");
  });

  test("sign out everywhere ends every session of the user, this one included", async () => {
    const email = "everywhere@tallowfield.example";
    await makeUser(email, "everywhere password", teamA, "viewer");
    const a = await signedIn(email, "everywhere password");
    const b = await signedIn(email, "everywhere password");
    const res = await callRoute(account.action, await post(a, "/account", { intent: "signOutEverywhere" }));
    expect(res.status).toBe(302);
    expect(res.location).toBe("/sign-in");
    expect(await getUser(get(a, "/"))).toBeNull();
    expect(await getUser(get(b, "/"))).toBeNull();
  });
});

describe("13. /forgot-password does the same work for a member's address and an unknown one", () => {
  // Not a timing assertion: the answer is handed back before any lookup, for every address, and
  // each request queues exactly one job of the same kind; the lookup and the mail happen after.
  test("each address, known or not, queues one reset job and gets its answer while the job is still waiting", async () => {
    const email = "timing-member@tallowfield.example";
    await makeUser(email, "timing member password", teamA, "viewer");
    await resetMailSettled();
    const answers = [];
    for (const address of [email, "timing-stranger@nowhere.example"]) {
      const before = resetMailQueue();
      const res = await callRoute(forgot.action, await post(null, "/forgot-password", { email: address }));
      const after = resetMailQueue();
      expect(res.status).toBe(200);
      expect(after.queued - before.queued).toBe(1);
      // Answered before the job ran: it has not even looked the address up yet.
      expect(after.pending).toBe(1);
      answers.push(res.data);
      await resetMailSettled();
      expect(resetMailQueue().pending).toBe(0);
    }
    expect(answers[0]).toEqual(answers[1]);
    expect(await db("outbox").where({ to_address: email }).count({ n: "*" }).first()).toEqual({ n: 1 });
    expect(await db("outbox").where({ to_address: "timing-stranger@nowhere.example" }).first()).toBeUndefined();
  });
});

// Pure parts of sign-in and form handling: no database needed.
import { describe, expect, test } from "vitest";
import { z } from "zod";
import { addressBucket, clientAddress, MAX_DELAY_MS, throttleDelay, tooManyMessage } from "~/lib/rate-limit.server";
import { formToObject, parseForm, readForm, readJson } from "~/lib/forms.server";
import { safeRedirect } from "~/lib/session.server";

describe("clientAddress", () => {
  test("comes from the load context the server fills from the socket, never from a request header", () => {
    expect(clientAddress({ clientAddress: "198.51.100.7" })).toBe("198.51.100.7");
    expect(clientAddress({})).toBe("unknown");
    expect(clientAddress(undefined)).toBe("unknown");
  });

  test("an IPv4-mapped address counts as its IPv4; IPv6 counts by its /64", () => {
    expect(addressBucket("::ffff:203.0.113.9")).toBe("203.0.113.9");
    expect(addressBucket("2001:db8:1:2:aaaa:bbbb:cccc:dddd")).toBe("2001:db8:1:2::/64");
    expect(addressBucket("2001:db8:1:2::1")).toBe("2001:db8:1:2::/64");
    expect(addressBucket("2001:db8::")).toBe("2001:db8:0:0::/64");
    expect(addressBucket("::1")).toBe("0:0:0:0::/64");
  });
});

test("the wait message counts seconds, then whole minutes", () => {
  expect(tooManyMessage(15 * 60_000)).toBe("Too many sign-in attempts; try again in 15 minutes.");
  expect(tooManyMessage(61_000)).toBe("Too many sign-in attempts; try again in 61 seconds.");
  expect(tooManyMessage(1_000)).toBe("Too many sign-in attempts; try again in 1 second.");
  expect(tooManyMessage(95_000)).toBe("Too many sign-in attempts; try again in 2 minutes.");
});

test("the hold doubles after the free failures and stops at the cap", () => {
  expect([1, 2, 3, 4, 5, 6, 7, 8].map((n) => throttleDelay(n, 5))).toEqual([0, 0, 0, 0, 0, 1000, 2000, 4000]);
  expect(throttleDelay(5 + 10, 5)).toBe(512_000);
  expect(throttleDelay(5 + 11, 5)).toBe(MAX_DELAY_MS);
  expect(throttleDelay(10_000, 5)).toBe(MAX_DELAY_MS);
});

test("safeRedirect keeps only same-site paths", () => {
  expect(safeRedirect("/projects/3?tab=briefs")).toBe("/projects/3?tab=briefs");
  for (const bad of ["//evil.example", "https://evil.example", "/\\evil.example", "", null, 42]) expect(safeRedirect(bad)).toBe("/");
});

describe("readForm", () => {
  const post = (body: BodyInit, type: string) => new Request("http://x.test/", { method: "POST", body, headers: { "Content-Type": type } });

  test("an oversized urlencoded body names the field being sent", async () => {
    const body = new URLSearchParams({ name: "ok", note: "x".repeat(70 * 1024) });
    const thrown = await readForm(post(body, "application/x-www-form-urlencoded")).catch((e: unknown) => e);
    expect(thrown).toBeInstanceOf(Response);
    expect((thrown as Response).status).toBe(413);
    expect(await (thrown as Response).text()).toMatch(/^note: too large; the form must stay under 64 kB/);
  });

  test("an oversized multipart body names the field too", async () => {
    const fd = new FormData();
    fd.set("title", "ok");
    fd.set("file", new Blob(["y".repeat(100 * 1024)]), "big.csv");
    const thrown = (await readForm(new Request("http://x.test/", { method: "POST", body: fd })).catch((e: unknown) => e)) as Response;
    expect(thrown.status).toBe(413);
    expect(await thrown.text()).toMatch(/^file: too large/);
  });

  test("a body that is not a form is refused; broken multipart is a 400", async () => {
    expect(((await readForm(post("{}", "application/json")).catch((e: unknown) => e)) as Response).status).toBe(415);
    expect(((await readForm(post("garbage", "multipart/form-data; boundary=zz")).catch((e: unknown) => e)) as Response).status).toBe(400);
  });

  test("readJson: empty, broken and oversized bodies", async () => {
    const j = (body: string, max?: number) => readJson(new Request("http://x.test/", { method: "POST", body }), max).catch((e: unknown) => e as Response);
    expect(((await j("")) as Response).status).toBe(400);
    expect(await ((await j("{nope")) as Response).json()).toEqual({ error: "body is not valid JSON" });
    expect(((await j("[1]".padEnd(3000, " "), 1024)) as Response).status).toBe(413);
    expect(await j('{"a":1}')).toEqual({ a: 1 });
  });
});

describe("parseForm", () => {
  const schema = z.object({ email: z.email(), count: z.coerce.number().int() });
  const fd = (entries: [string, string][]) => {
    const f = new FormData();
    for (const [k, v] of entries) f.append(k, v);
    return f;
  };

  test("blank fields read as missing and are named", () => {
    const r = parseForm(fd([["email", "  "], ["count", "3"]]), schema);
    expect(r).toEqual({ ok: false, errors: { email: "Email is required." } });
  });

  test("a wrong value is named with zod's reason", () => {
    const r = parseForm(fd([["email", "a@b.example"], ["count", "2.5"]]), schema);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.count).toMatch(/^Count: /);
  });

  test("repeated keys become arrays", () => {
    expect(formToObject(fd([["t", "8"], ["t", "10"], ["one", "x"]]))).toEqual({ t: ["8", "10"], one: "x" });
  });
});

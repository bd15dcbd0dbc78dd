// Sign-in limits, counted in the database so every app process shares them: failed password
// attempts per account (10 in 15 minutes) and, more loosely, per client address (50), sign-in
// link requests per e-mail (5 an hour) and per address (20), sign-ups per address (20 an hour).
// A refusal is 429 `rate_limited` with Retry-After; moving the clock on lifts it.
import { NextRequest } from "next/server";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser } from "../factories";
import { POST as signUp } from "@/app/api/users/route";
import { limitAuthRequest } from "@/lib/auth/auth-limits";
import { authOptions } from "@/lib/auth/options";
import { hashPassword } from "@/lib/auth/password";
import { LIMITS } from "@/lib/security/rate-limit";
import { hitCounter } from "@/db/rate-limits";

let ctx: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  ctx = await freshDb();
});
afterAll(() => ctx.close());
afterEach(() => vi.useRealTimers());

const PASSWORD = "lantern meadow cobblestone";
const authorize = (authOptions.providers.find((p) => p.id === "credentials") as unknown as { options: { authorize: (c: object, req: object) => Promise<unknown> } }).options.authorize;
const from = (address: string) => ({ headers: { "x-forwarded-for": address } });
let n = 0;
const address = () => `198.51.100.${++n}`;

/** What next-auth's browser client posts to sign in with a password, or to ask for a link. */
function authRequest(kind: "callback/credentials" | "signin/email", email: string, ip: string) {
  return new NextRequest(`http://localhost:3000/api/auth/${kind}`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", "x-forwarded-for": ip },
    body: new URLSearchParams({ email, password: "whatever it is", csrfToken: "x", json: "true" }),
  });
}
function moveClock(minutes: number) {
  vi.useFakeTimers({ toFake: ["Date"] });
  vi.setSystemTime(Date.now() + minutes * 60_000);
}

describe("failed password attempts per account", () => {
  it("refuses the 11th attempt in 15 minutes — the right password too — with a 429 saying when to try again, and lifts after the window", async () => {
    const user = await createUser({ password_hash: await hashPassword(PASSWORD) });
    const ip = address();
    for (let i = 0; i < LIMITS.signInAccount.max; i++) {
      expect(await limitAuthRequest(authRequest("callback/credentials", user.email, ip))).toBeNull();
      expect(await authorize({ email: user.email, password: `wrong guess ${i}` }, from(ip))).toBeNull();
    }
    const refused = (await limitAuthRequest(authRequest("callback/credentials", user.email, ip)))!;
    expect(refused.status).toBe(429);
    const body = await refused.json();
    expect(body.error.code).toBe("rate_limited");
    expect(body.error.message).toMatch(/Try again in \d+ minutes?/);
    expect(body.url).toMatch(/\/sign-in\?error=rate_limited&retry_after=\d+$/);
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(Number(refused.headers.get("retry-after"))).toBeLessThanOrEqual(15 * 60);
    // Reached anyway, sign-in refuses even the right password while the limit holds.
    await expect(authorize({ email: user.email, password: PASSWORD }, from(address()))).rejects.toThrow("rate_limited");
    // The e-mail's case and spaces do not make a new account to guess at.
    expect((await limitAuthRequest(authRequest("callback/credentials", ` ${user.email.toUpperCase()} `, ip)))!.status).toBe(429);

    moveClock(15);
    expect(await limitAuthRequest(authRequest("callback/credentials", user.email, ip))).toBeNull();
    expect(await authorize({ email: user.email, password: PASSWORD }, from(ip))).toMatchObject({ id: user.id });
  });

  it("wipes an account's failures when it signs in", async () => {
    const user = await createUser({ password_hash: await hashPassword(PASSWORD) });
    for (let i = 0; i < LIMITS.signInAccount.max - 1; i++) await authorize({ email: user.email, password: "nope nope nope" }, from(address()));
    expect(await authorize({ email: user.email, password: PASSWORD }, from(address()))).toMatchObject({ id: user.id });
    for (let i = 0; i < LIMITS.signInAccount.max - 1; i++) await authorize({ email: user.email, password: "nope nope nope" }, from(address()));
    expect(await limitAuthRequest(authRequest("callback/credentials", user.email, address()))).toBeNull();
  });

  it("counts unknown accounts too, so guessing who is registered costs the same", async () => {
    const ghost = "nobody-here@example.test";
    for (let i = 0; i < LIMITS.signInAccount.max; i++) await authorize({ email: ghost, password: "guess guess guess" }, from(address()));
    expect((await limitAuthRequest(authRequest("callback/credentials", ghost, address())))!.status).toBe(429);
  });
});

describe("failed password attempts per client address", () => {
  it("refuses a 51st failure from one address across many accounts, while another address goes on", async () => {
    const ip = address();
    for (let i = 0; i < LIMITS.signInAddress.max; i++) await authorize({ email: `spray-${i}@example.test`, password: "summer2024!!" }, from(ip));
    const refused = (await limitAuthRequest(authRequest("callback/credentials", "fresh-account@example.test", ip)))!;
    expect(refused.status).toBe(429);
    expect((await refused.json()).error.message).toMatch(/from your network/);
    expect(await limitAuthRequest(authRequest("callback/credentials", "fresh-account@example.test", address()))).toBeNull();
    moveClock(16);
    expect(await limitAuthRequest(authRequest("callback/credentials", "fresh-account@example.test", ip))).toBeNull();
  });
});

describe("sign-in links", () => {
  it("answers 5 requests an hour for one e-mail, refuses the 6th, and takes more an hour later", async () => {
    for (let i = 0; i < LIMITS.linkEmail.max; i++) expect(await limitAuthRequest(authRequest("signin/email", "linky@example.test", address()))).toBeNull();
    const refused = (await limitAuthRequest(authRequest("signin/email", "linky@example.test", address())))!;
    expect(refused.status).toBe(429);
    expect((await refused.json()).error.code).toBe("rate_limited");
    expect(await limitAuthRequest(authRequest("signin/email", "someone-else@example.test", address()))).toBeNull();
    moveClock(61);
    expect(await limitAuthRequest(authRequest("signin/email", "linky@example.test", address()))).toBeNull();
  });

  it("refuses more than 20 an hour from one address, whatever the e-mails", async () => {
    const ip = address();
    for (let i = 0; i < LIMITS.linkAddress.max; i++) expect(await limitAuthRequest(authRequest("signin/email", `many-${i}@example.test`, ip))).toBeNull();
    expect((await limitAuthRequest(authRequest("signin/email", "one-more@example.test", ip)))!.status).toBe(429);
  });
});

describe("sign-ups", () => {
  it("takes 20 an hour from one address, refuses the 21st with 429, and takes more after the hour", async () => {
    const ip = address();
    const join = async (i: string) => call(signUp as never, await request("/api/users", { body: { email: `joiner-${i}@example.test`, display_name: "Quill Marsh", password: "pebble harbour lighthouse" }, headers: { "x-forwarded-for": ip } }));
    for (let i = 0; i < LIMITS.signUpAddress.max; i++) expect((await join(`a${i}`)).status).toBe(202);
    const refused = await join("over");
    expect(refused.status).toBe(429);
    expect(refused.json.error.code).toBe("rate_limited");
    expect(await ctx.db("users").where({ email: "joiner-over@example.test" })).toHaveLength(0);
    moveClock(61);
    expect((await join("later")).status).toBe(202);
  });
});

describe("the counters are shared", () => {
  it("adds up hits from two connections to one database at once (as two app processes would)", async () => {
    // Two Knex instances with connections of their own on the test's database, either engine.
    const a = ctx.connect();
    const b = ctx.connect();
    try {
      const now = new Date().toISOString();
      const since = new Date(Date.now() - 60_000).toISOString();
      const hits = await Promise.all(Array.from({ length: 40 }, (_, i) => hitCounter("shared-key", now, since, i % 2 ? a : b)));
      expect(Math.max(...hits.map((h) => h.count))).toBe(40);
      expect((await a("rate_limits").first("count").where({ key: "shared-key" })).count).toBe(40);
    } finally {
      await a("rate_limits").where({ key: "shared-key" }).delete();
      await a.destroy();
      await b.destroy();
    }
  });

  it("keeps no e-mail address or IP address in the table", async () => {
    const keys = await ctx.db("rate_limits").pluck("key");
    expect(keys.length).toBeGreaterThan(5);
    for (const k of keys) {
      expect(k).not.toMatch(/@|198\.51/);
      expect(k).toMatch(/^[A-Za-z0-9_-]{43}$/);
    }
  });
});

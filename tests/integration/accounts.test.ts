// Joining and passwords: the answer never says whether an address is registered, the e-mail
// does; an address is confirmed before reserving or posting; passwords of 10–128 characters
// that zxcvbn-ts does not find easy to guess, hashed whole with scrypt, one cost for every
// answer, older hashes replaced at sign-in.
import { createHash } from "node:crypto";
import bcrypt from "bcryptjs";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createListing, createUser, listingBody } from "../factories";
import { POST as signUp } from "@/app/api/users/route";
import { POST as reserve } from "@/app/api/reservations/route";
import { POST as postListing } from "@/app/api/listings/route";
import { POST as resend } from "@/app/api/me/confirmation/route";
import { authOptions } from "@/lib/auth/options";
import { AUTH_SECRET } from "@/lib/auth/config";
import { knexAdapter } from "@/lib/auth/knex-adapter";
import { hashPassword, needsRehash, verifyPassword } from "@/lib/auth/password";
import { renderedRows } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  ctx = await freshDb({ materials: true });
});
afterAll(() => ctx.close());

const STRONG = "quarry thimble lavender";
let n = 0;
const ip = () => ({ "x-forwarded-for": `203.0.113.${++n}` });
const join = async (body: Record<string, unknown>) => call(signUp as never, await request("/api/users", { body: { display_name: "Wren Ashdown", password: STRONG, ...body }, headers: ip() }));
const mailTo = (email: string) => renderedRows(ctx.db("email_outbox").where({ to_address: email }).orderBy("created_at").select("template", "data"));
const authorize = (authOptions.providers.find((p) => p.id === "credentials") as unknown as { options: { authorize: (c: object, req?: object) => Promise<{ id: string } | null> } }).options.authorize;

describe("joining says the same for a known and an unknown address", () => {
  it("answers alike (status and body), and only the e-mail differs", async () => {
    const known = await createUser({ email: "already@example.test", password_hash: await hashPassword("an old garden password") });
    const fresh = await join({ email: "Newcomer@Example.test" });
    const again = await join({ email: "already@example.test", password: "lichen barrow pumpkin" });
    expect(fresh.status).toBe(202);
    expect(again.status).toBe(fresh.status);
    const shape = (json: { email: string; message: string }) => ({ ...json, email: "X", message: json.message.replace(json.email, "X") });
    expect(shape(again.json)).toEqual(shape(fresh.json));
    expect(Object.keys(fresh.json).sort()).toEqual(["email", "message", "status"]);

    // A new address: an unconfirmed account and a confirmation link; a known one: nothing changes, and it is told so.
    expect((await mailTo("newcomer@example.test")).map((m) => m.template)).toEqual(["account.confirm"]);
    expect((await mailTo("already@example.test")).map((m) => m.template)).toEqual(["account.already_joined"]);
    expect(await ctx.db("users").where({ email: "already@example.test" })).toHaveLength(1);
    expect(await verifyPassword("an old garden password", (await ctx.db("users").where({ id: known.id }).first()).password_hash)).toBe(true);
  });

  it("sends a link that next-auth's e-mail callback takes: one use, 24 hours, back to a safe callback", async () => {
    await join({ email: "linkfollower@example.test", callbackUrl: "/giveaways" });
    const [mail] = await mailTo("linkfollower@example.test");
    const link = new URL(mail.text_body.match(/https?:\/\/\S+/)![0]);
    expect(link.pathname).toBe("/api/auth/callback/email");
    expect(new URL(link.searchParams.get("callbackUrl")!).pathname).toBe("/giveaways");
    const token = link.searchParams.get("token")!;
    const hashed = createHash("sha256").update(`${token}${AUTH_SECRET}`).digest("hex"); // next-auth 4 hashToken
    const used = await knexAdapter().useVerificationToken!({ identifier: "linkfollower@example.test", token: hashed });
    expect(used).toMatchObject({ identifier: "linkfollower@example.test" });
    expect(used!.expires.getTime() - Date.now()).toBeGreaterThan(23 * 3_600_000);
    expect(await knexAdapter().useVerificationToken!({ identifier: "linkfollower@example.test", token: hashed })).toBeNull();

    await join({ email: "wanderer@example.test", callbackUrl: "//evil.example/x" });
    const [other] = await mailTo("wanderer@example.test");
    expect(new URL(new URL(other.text_body.match(/https?:\/\/\S+/)![0]).searchParams.get("callbackUrl")!).pathname).toBe("/");
  });
});

describe("password rules", () => {
  const weak: [string, Record<string, unknown>][] = [
    ["a common password", { password: "password1234" }],
    ["a keyboard walk", { password: "qwertyuiop" }],
    ["one letter repeated", { password: "aaaaaaaaaaaa" }],
    ["a word and a year", { password: "sunshine2024" }],
    ["built from the name", { display_name: "Tamsin Greaves", password: "TamsinGreaves1!" }],
    ["built from the e-mail", { email: "bramble.hollis@example.test", password: "bramble.hollis@example" }],
    ["the name backwards in case", { display_name: "Orrin Fairweather", password: "FAIRWEATHER-orrin" }],
    ["under 10 characters", { password: "nine char" }],
    ["over 128 characters", { password: `${STRONG} `.repeat(6).slice(0, 129) }],
  ];
  it.each(weak)("refuses %s with 422 and a message on the password field", async (_name, body) => {
    const res = await join({ email: `weak-${++n}@example.test`, ...body });
    expect(res.status).toBe(422);
    expect(res.json.error.code).toBe("invalid_input");
    expect(res.json.error.fields.password).toMatch(/\w{3,}/);
    expect(Object.keys(res.json.error.fields)).toEqual(["password"]);
  });

  it("takes exactly 10 and exactly 128 characters when they are hard to guess", async () => {
    expect((await join({ email: `ten-${++n}@example.test`, password: "vK7#qLm2!x" })).status).toBe(202);
    expect((await join({ email: `long-${++n}@example.test`, password: Array.from({ length: 16 }, (_, i) => `w${(i * 7919) % 97}x${i}q`).join("-").padEnd(128, "z").slice(0, 128) })).status).toBe(202);
  });

  it("counts the whole password: two that share their first 72 bytes are different passwords", async () => {
    const head = "a".repeat(36) + "hedge sparrow mossy gate path ";
    expect(Buffer.byteLength(head)).toBeGreaterThanOrEqual(66);
    const one = `${head.padEnd(72, "x")}first ending`;
    const two = `${head.padEnd(72, "x")}other ending`;
    const hash = await hashPassword(one);
    expect(await verifyPassword(one, hash)).toBe(true);
    expect(await verifyPassword(two, hash)).toBe(false);
    // bcrypt, for comparison, would have taken either.
    const old = await bcrypt.hash(one, 4);
    expect(await bcrypt.compare(two, old)).toBe(true);
  });
});

describe("one cost for every answer", () => {
  it("verifies an unknown account against a stand-in hash at today's cost, as long as a known one", async () => {
    vi.stubEnv("PASSWORD_HASH_COST", "14");
    try {
      const user = await createUser({ password_hash: await hashPassword(STRONG) });
      const time = async (email: string) => {
        const t = performance.now();
        await authorize({ email, password: "not the password at all" }, { headers: { "x-forwarded-for": `192.0.2.${++n}` } });
        return performance.now() - t;
      };
      await time("warm-up@example.test");
      const known: number[] = [];
      const unknown: number[] = [];
      for (let i = 0; i < 5; i++) {
        known.push(await time(user.email));
        unknown.push(await time(`ghost-${i}@example.test`));
      }
      const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[2];
      // scrypt at N = 2^14 costs tens of milliseconds; without the stand-in an unknown e-mail answers in about one.
      expect(median(unknown)).toBeGreaterThan(median(known) * 0.5);
      expect(median(unknown)).toBeLessThan(median(known) * 2);
    } finally {
      vi.unstubAllEnvs();
    }
  });

  it("replaces an older hash (bcrypt, or scrypt at another cost) at the next sign-in", async () => {
    const legacy = await createUser({ password_hash: await bcrypt.hash(STRONG, 4) });
    vi.stubEnv("PASSWORD_HASH_COST", "11");
    const cheaper = await createUser({ password_hash: await hashPassword(STRONG) });
    vi.unstubAllEnvs();
    for (const u of [legacy, cheaper]) {
      const before = (await ctx.db("users").where({ id: u.id }).first()).password_hash;
      expect(needsRehash(before)).toBe(true);
      expect(await authorize({ email: u.email, password: STRONG }, { headers: { "x-forwarded-for": `192.0.2.${++n}` } })).toMatchObject({ id: u.id });
      const after = (await ctx.db("users").where({ id: u.id }).first()).password_hash;
      expect(after).not.toBe(before);
      expect(needsRehash(after)).toBe(false);
      expect(await verifyPassword(STRONG, after)).toBe(true);
    }
  });
});

describe("an unconfirmed address cannot reserve or post", () => {
  it("answers 403 with the way forward, then lets the same person in once the address is confirmed", async () => {
    const gardener = await createUser({ roles: ["gardener", "supplier"], unconfirmed: true });
    const listing = await createListing({ quantity_total: 5 });
    const tryReserve = async () => call(reserve as never, await request("/api/reservations", { body: { listing_id: listing.id, quantity: 1 }, as: gardener.id }));
    const tryPost = async () => call(postListing as never, await request("/api/listings", { body: listingBody(), as: gardener.id }));
    for (const attempt of [tryReserve, tryPost]) {
      const res = await attempt();
      expect(res.status).toBe(403);
      expect(res.json.error.message).toMatch(/Confirm your e-mail address/);
    }
    expect((await call(resend as never, await request("/api/me/confirmation", { method: "POST", as: gardener.id }))).status).toBe(202);
    expect((await mailTo(gardener.email)).map((m) => m.template)).toContain("account.confirm");

    // Following a link (the one joining sends, or a sign-in link) confirms it, as next-auth's e-mail callback does through the adapter.
    await knexAdapter().updateUser!({ id: gardener.id, emailVerified: new Date() });
    expect((await tryReserve()).status).toBe(201);
    expect((await tryPost()).status).toBe(201);
    expect((await call(resend as never, await request("/api/me/confirmation", { method: "POST", as: gardener.id }))).status).toBe(409);
  });
});

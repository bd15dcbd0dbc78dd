// Sessions end on the server: a copied cookie is refused (401) after sign-out, a password
// change, "sign out everywhere" and a moderator's suspension, and when the session runs out.
import { encode } from "next-auth/jwt";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request, sessionCookie } from "../helpers/http";
import { createUser } from "../factories";
import * as me from "@/app/api/me/route";
import { POST as changePassword } from "@/app/api/me/password/route";
import { DELETE as endSessions } from "@/app/api/me/sessions/route";
import { POST as moderateUser } from "@/app/api/moderation/users/[id]/route";
import { authOptions } from "@/lib/auth/options";
import { AUTH_SECRET, SESSION_MAX_AGE_S } from "@/lib/auth/config";
import { hashPassword } from "@/lib/auth/password";
import { db } from "@/db/index";

let ctx: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  ctx = await freshDb();
});
afterAll(() => ctx.close());
afterEach(() => vi.useRealTimers());

const PASSWORD = "marigold trellis weathervane";

/** Signs in the way next-auth does: the jwt callback on sign-in, then the encoded cookie. */
async function signIn(user: { id: string; email: string }) {
  const token = await authOptions.callbacks!.jwt!({ token: { sub: user.id }, user: { id: user.id, email: user.email }, account: null } as never);
  const cookie = `next-auth.session-token=${await encode({ token, secret: AUTH_SECRET })}`;
  return { token, cookie };
}
const getMe = async (cookie: string) => (await call(me.GET as never, await request("/api/me", { headers: { cookie } }))).status;

describe("signing in and out", () => {
  it("gives each sign-in its own session, and signing out ends that one only", async () => {
    const user = await createUser();
    const laptop = await signIn(user);
    const phone = await signIn(user);
    expect(await db()("sessions").where({ id: laptop.token.sid as string })).toHaveLength(1);
    expect(laptop.token.sid).not.toBe(phone.token.sid);
    expect(await getMe(laptop.cookie)).toBe(200);

    await authOptions.events!.signOut!({ token: laptop.token, session: undefined as never });
    expect(await getMe(laptop.cookie)).toBe(401); // the copied cookie after sign-out
    expect(await getMe(phone.cookie)).toBe(200);
    // next-auth's own session endpoint shows no one behind the ended cookie.
    const shown = await authOptions.callbacks!.session!({ session: { user: { name: "x" }, expires: "2099-01-01" }, token: laptop.token } as never);
    expect(shown).not.toHaveProperty("user");
  });

  it("refuses a cookie with no session in it (signed before sessions were kept) and one for someone else's session", async () => {
    const a = await createUser();
    const b = await createUser();
    const bare = `next-auth.session-token=${await encode({ token: { uid: a.id, sub: a.id }, secret: AUTH_SECRET })}`;
    expect(await getMe(bare)).toBe(401);
    const bSession = (await signIn(b)).token.sid as string;
    const borrowed = await sessionCookie(a.id, bSession);
    expect(await getMe(borrowed)).toBe(401);
  });

  it("ends a session once it has run out", async () => {
    const user = await createUser();
    const { cookie } = await signIn(user);
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(Date.now() + (SESSION_MAX_AGE_S + 60) * 1000);
    expect(await getMe(cookie)).toBe(401);
  });
});

describe("ending every session of an account", () => {
  const ends: [string, (user: { id: string }, cookie: string) => Promise<number>][] = [
    [
      "a password change",
      async (_u, cookie) => (await call(changePassword as never, await request("/api/me/password", { body: { current_password: PASSWORD, new_password: "copper kettle orchard lane" }, headers: { cookie } }))).status,
    ],
    ["sign out everywhere", async (_u, cookie) => (await call(endSessions as never, await request("/api/me/sessions", { method: "DELETE", headers: { cookie } }))).status],
    [
      "a moderator's suspension",
      async (user) => {
        const mod = await createUser({ roles: ["moderator"] });
        return (await call(moderateUser as never, await request(`/api/moderation/users/${user.id}`, { body: { action: "suspend", note: "Selling contaminated manure." }, as: mod.id }), { id: user.id })).status;
      },
    ],
  ];
  it.each(ends)("%s ends them all, the one that asked included", async (_name, end) => {
    const user = await createUser({ password_hash: await hashPassword(PASSWORD) });
    const sessions = [await signIn(user), await signIn(user), await signIn(user)];
    for (const s of sessions) expect(await getMe(s.cookie)).toBe(200);
    expect(await end(user, sessions[0].cookie)).toBe(200);
    for (const s of sessions) expect(await getMe(s.cookie)).toBe(401);
    const rows = await db()("sessions").where({ user_id: user.id }).pluck("ended_reason");
    expect(new Set(rows).size).toBe(1);
    expect(rows[0]).toMatch(/password_changed|signed_out_everywhere|suspended/);
  });
});

describe("changing the password", () => {
  it.each([
    ["a wrong current password", { current_password: "not my password", new_password: "copper kettle orchard lane" }, "current_password"],
    ["a common new password", { current_password: PASSWORD, new_password: "password1234" }, "new_password"],
    ["a new password too short", { current_password: PASSWORD, new_password: "short" }, "new_password"],
    ["a new password too long", { current_password: PASSWORD, new_password: "x".repeat(129) }, "new_password"],
  ])("refuses %s with 422 and a message on the field, and keeps the sessions", async (_name, body, field) => {
    const user = await createUser({ password_hash: await hashPassword(PASSWORD) });
    const s = await signIn(user);
    const res = await call(changePassword as never, await request("/api/me/password", { body, headers: { cookie: s.cookie } }));
    expect(res.status).toBe(422);
    expect(res.json.error.fields[field]).toMatch(/\S/);
    expect(await getMe(s.cookie)).toBe(200);
  });

  it("takes the new password for signing in and tells the owner by e-mail", async () => {
    const user = await createUser({ password_hash: await hashPassword(PASSWORD) });
    const s = await signIn(user);
    expect((await call(changePassword as never, await request("/api/me/password", { body: { current_password: PASSWORD, new_password: "copper kettle orchard lane" }, headers: { cookie: s.cookie } }))).status).toBe(200);
    const authorize = (authOptions.providers.find((p) => p.id === "credentials") as unknown as { options: { authorize: (c: object) => Promise<unknown> } }).options.authorize;
    expect(await authorize({ email: user.email, password: PASSWORD })).toBeNull();
    expect(await authorize({ email: user.email, password: "copper kettle orchard lane" })).toMatchObject({ id: user.id });
    expect(await db()("email_outbox").where({ to_address: user.email, template: "account.password_changed" })).toHaveLength(1);
  });
});

describe("tidying up", () => {
  it("drops sessions a week after they ended or ran out, by the wall clock, and keeps the rest", async () => {
    const { jobs } = await import("@/lib/worker/jobs");
    const prune = jobs.find((j) => j.name === "prune-security-records")!;
    const user = await createUser();
    const going = await signIn(user);
    const ended = await signIn(user);
    const old = new Date(Date.now() - 8 * 86_400_000).toISOString();
    await db()("sessions").where({ id: ended.token.sid as string }).update({ ended_at: old, ended_reason: "sign_out" });
    // A worker clock moved far ahead (as the end-to-end run does) must not reach the sessions.
    const farAhead = () => new Date(Date.now() + 400 * 86_400_000);
    await prune.run({ clock: farAhead });
    expect(await db()("sessions").where({ id: ended.token.sid as string })).toHaveLength(0);
    expect(await getMe(going.cookie)).toBe(200);
  });
});

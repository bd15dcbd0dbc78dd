import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser } from "../factories";
import * as invites from "@/app/api/council/invites/route";
import * as invite from "@/app/api/council/invites/[id]/route";
import * as accept from "@/app/api/council/invites/accept/route";
import * as member from "@/app/api/council/members/[userId]/route";
import * as members from "@/app/api/council/members/route";
import { acceptInvite } from "@/lib/services/council/accept-invite";
import { describeInvite } from "@/lib/services/council/describe-invite";
import { rendered } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
const p: Record<string, string> = {};
let orgA: string;

beforeAll(async () => {
  ctx = await freshDb();
  const owner = await createUser({ roles: ["council"] });
  p.owner = owner.id;
  orgA = owner.organisation_id!;
  p.staff = (await createUser({ roles: ["council"], organisation_id: orgA })).id;
  p.ownerB = (await createUser({ roles: ["council"] })).id;
  p.gardener = (await createUser({ roles: ["gardener"] })).id;
  p.invitee = (await createUser({ roles: ["gardener"], email: "new.colleague@example.test" })).id;
});
afterAll(() => ctx.close());

const post = async (as: string | null, body: unknown) => call(invites.POST as never, await request("/api/council/invites", { body, as }));
const tokenFromOutbox = async (to: string) => {
  const mail = rendered(await ctx.db("email_outbox").where({ to_address: to, template: "council_invite" }).orderBy("created_at", "desc").first());
  return new URL(mail.text_body.match(/https?:\/\/\S+\/council\/join\?token=\S+/)![0]).searchParams.get("token")!;
};

describe("inviting staff", () => {
  it("lets the owner invite by e-mail: a link through the outbox and an audit row naming who did it", async () => {
    const res = await post(p.owner, { email: "New.Colleague@example.test" });
    expect(res.status).toBe(201);
    expect(res.json.invite).toMatchObject({ email: "new.colleague@example.test", status: "pending" });
    const mail = rendered(await ctx.db("email_outbox").where({ template: "council_invite" }).first());
    expect(mail.to_address).toBe("new.colleague@example.test");
    expect(mail.text_body).toContain("/council/join?token=");
    const audit = await ctx.db("audit_log").where({ action: "council.invite" }).first();
    expect(audit.actor_id).toBe(p.owner);
    expect(audit.subject_id).toBe(orgA);
    // The token is only in the e-mail, never in the log or the table.
    const token = await tokenFromOutbox("new.colleague@example.test");
    expect(audit.after).not.toContain(token);
    expect(await ctx.db("organisation_invites").where({ token_hash: token }).first()).toBeUndefined();
    const listed = await call(invites.GET as never, await request("/api/council/invites", { as: p.staff }));
    expect(listed.json.items.map((i: { email: string }) => i.email)).toEqual(["new.colleague@example.test"]);
  });
  const WHO: [string, () => string | null, number][] = [
    ["staff who are not the owner", () => p.staff, 403],
    ["a gardener", () => p.gardener, 403],
    ["a visitor", () => null, 401],
  ];
  for (const [who, as, status] of WHO) {
    it(`${status} for ${who}`, async () => {
      expect((await post(as(), { email: "someone@example.test" })).status).toBe(status);
    });
  }
  it("422 for an address that is not one, 409 for someone already on the staff", async () => {
    const bad = await post(p.owner, { email: "not an address" });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields.email).toMatch(/\S/);
    const staffEmail = (await ctx.db("users").where({ id: p.staff }).first()).email;
    const dup = await post(p.owner, { email: staffEmail });
    expect(dup.status).toBe(409);
    expect(dup.json.error.fields.email).toMatch(/\S/);
  });
});

describe("accepting an invitation", () => {
  it("tells the join page who the invitation is for, before anyone signs in", async () => {
    const token = await tokenFromOutbox("new.colleague@example.test");
    expect(await describeInvite(token)).toMatchObject({ email: "new.colleague@example.test", status: "pending", has_account: true });
    expect(await describeInvite("x".repeat(43))).toBeNull();
  });
  it("refuses an account with another address, and a made-up token", async () => {
    const token = await tokenFromOutbox("new.colleague@example.test");
    const wrong = await call(accept.POST as never, await request("/x", { body: { token }, as: p.gardener }));
    expect(wrong.status).toBe(403);
    const madeUp = await call(accept.POST as never, await request("/x", { body: { token: "y".repeat(43) }, as: p.invitee }));
    expect(madeUp.status).toBe(404);
    expect((await call(accept.POST as never, await request("/x", { body: { token }, as: null }))).status).toBe(401);
    expect((await call(accept.POST as never, await request("/x", { body: {}, as: p.invitee }))).status).toBe(422);
  });
  it("adds the invited account as staff with the council role, once", async () => {
    const token = await tokenFromOutbox("new.colleague@example.test");
    const res = await call(accept.POST as never, await request("/x", { body: { token }, as: p.invitee }));
    expect(res.status).toBe(200);
    expect(res.json).toMatchObject({ organisation_id: orgA, already: false });
    const m = await ctx.db("memberships").where({ organisation_id: orgA, user_id: p.invitee }).first();
    expect(m.org_role).toBe("staff");
    const role = await ctx.db("user_roles").where({ user_id: p.invitee, role: "council" }).first();
    expect(role.status).toBe("active");
    const list = await call(members.GET as never, await request("/x", { as: p.invitee }));
    expect(list.json.members.map((x: { id: string }) => x.id)).toContain(p.invitee);
    const again = await call(accept.POST as never, await request("/x", { body: { token }, as: p.invitee }));
    expect(again.json.already).toBe(true);
    const audit = await ctx.db("audit_log").where({ action: "council.member_add" }).first();
    expect(audit.actor_id).toBe(p.invitee);
    expect(JSON.parse(audit.after)).toMatchObject({ user_id: p.invitee, invited_by: p.owner });
  });
  it("refuses a withdrawn invitation and an expired one", async () => {
    const { id: late } = await createUser({ roles: ["gardener"], email: "late@example.test" });
    const created = await post(p.owner, { email: "late@example.test" });
    const token = await tokenFromOutbox("late@example.test");
    // A week and a day later the link no longer works.
    await expect(acceptInvite({ id: late, email: "late@example.test" }, token, { clock: () => new Date(Date.now() + 8 * 86_400_000) })).rejects.toMatchObject({ code: "invalid_state" });
    const revoke = await call(invite.DELETE as never, await request("/x", { method: "DELETE", as: p.owner }), { id: created.json.invite.id });
    expect(revoke.status).toBe(200);
    expect((await call(accept.POST as never, await request("/x", { body: { token }, as: late }))).status).toBe(409);
    expect((await call(invite.DELETE as never, await request("/x", { method: "DELETE", as: p.owner }), { id: created.json.invite.id })).status).toBe(409);
    expect((await call(invite.DELETE as never, await request("/x", { method: "DELETE", as: p.ownerB }), { id: created.json.invite.id })).status).toBe(404);
  });
});

describe("removing staff", () => {
  const del = async (as: string | null, userId: string) => call(member.DELETE as never, await request("/x", { method: "DELETE", as }), { userId });
  it("is for the owner only, within their own council", async () => {
    expect((await del(p.staff, p.invitee)).status).toBe(403);
    expect((await del(p.ownerB, p.invitee)).status).toBe(404);
    expect((await del(p.owner, p.ownerB)).status).toBe(404);
    expect((await del(p.owner, p.owner)).status).toBe(409);
    expect((await del(null, p.invitee)).status).toBe(401);
  });
  it("takes the membership and the council role away, and logs before and after", async () => {
    const res = await del(p.owner, p.invitee);
    expect(res.status).toBe(200);
    expect(await ctx.db("memberships").where({ organisation_id: orgA, user_id: p.invitee }).first()).toBeUndefined();
    expect(await ctx.db("user_roles").where({ user_id: p.invitee, role: "council" }).first()).toBeUndefined();
    const audit = await ctx.db("audit_log").where({ action: "council.member_remove" }).first();
    expect(audit.actor_id).toBe(p.owner);
    expect(JSON.parse(audit.before)).toMatchObject({ user_id: p.invitee, org_role: "staff" });
    expect(JSON.parse(audit.after)).toMatchObject({ removed: true });
    // Without the council role the desk's routes are closed to them at once.
    expect((await call(members.GET as never, await request("/x", { as: p.invitee }))).status).toBe(403);
  });
});

import { db } from "@/db/index";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser } from "../factories";
import * as me from "@/app/api/me/route";
import * as members from "@/app/api/council/members/route";
import * as roleRequests from "@/app/api/moderation/role-requests/route";
import * as decide from "@/app/api/moderation/role-requests/[userId]/route";
import { setRole } from "@/db/users";

let ctx: Awaited<ReturnType<typeof freshDb>>;
const people: Record<string, string> = {};

beforeAll(async () => {
  ctx = await freshDb();
  people.gardener = (await createUser({ roles: ["gardener"] })).id;
  people.supplier = (await createUser({ roles: ["gardener", "supplier"] })).id;
  people.council = (await createUser({ roles: ["council"] })).id;
  people.moderator = (await createUser({ roles: ["moderator"] })).id;
  people.suspended = (await createUser({ roles: ["gardener", "moderator"], suspended: true })).id;
});
afterAll(() => ctx.close());

// Each protected route, and who may call it.
const ROUTES = [
  { name: "GET /api/me", handler: me.GET, url: "/api/me", allowed: ["gardener", "supplier", "council", "moderator"] },
  { name: "GET /api/council/members", handler: members.GET, url: "/api/council/members", allowed: ["council"] },
  { name: "GET /api/moderation/role-requests", handler: roleRequests.GET, url: "/api/moderation/role-requests", allowed: ["moderator"] },
];

describe("the auth wrapper: 401 without a session, 403 for the wrong role", () => {
  for (const route of ROUTES) {
    it(`${route.name}: anonymous → 401 with the envelope`, async () => {
      const res = await call(route.handler as never, await request(route.url));
      expect(res.status).toBe(401);
      expect(res.json.error.code).toBe("unauthenticated");
      expect(typeof res.json.error.message).toBe("string");
    });
    for (const who of ["gardener", "supplier", "council", "moderator"]) {
      const ok = route.allowed.includes(who);
      it(`${route.name}: ${who} → ${ok ? 200 : 403}`, async () => {
        const res = await call(route.handler as never, await request(route.url, { as: people[who] }));
        expect(res.status).toBe(ok ? 200 : 403);
        if (!ok) expect(res.json.error.code).toBe("forbidden");
      });
    }
    it(`${route.name}: suspended account → 403 suspended`, async () => {
      const res = await call(route.handler as never, await request(route.url, { as: people.suspended }));
      expect(res.status).toBe(403);
      expect(res.json.error.code).toBe("suspended");
    });
  }

  it("a forged cookie is treated as no session", async () => {
    const req = await request("/api/me", { headers: { cookie: "next-auth.session-token=not-a-jwt" } });
    expect((await call(me.GET as never, req)).status).toBe(401);
  });

  it("a session for a deleted user is treated as no session", async () => {
    const gone = await createUser();
    const req = await request("/api/me", { as: gone.id });
    await db()("users").where({ id: gone.id }).delete();
    const res = await call(me.GET as never, req);
    expect(res.status).toBe(401);
  });
});

describe("PATCH /api/me", () => {
  const BAD: [string, unknown, string][] = [
    ["empty name", { display_name: "", unit_system: "metric" }, "display_name"],
    ["unknown unit system", { display_name: "Ada", unit_system: "cubits" }, "unit_system"],
    ["a role that cannot be asked for", { display_name: "Ada", unit_system: "metric", requested_roles: ["moderator"] }, "requested_roles.0"],
  ];
  for (const [label, body, field] of BAD) {
    it(`422 with a message for ${field}: ${label}`, async () => {
      const res = await call(me.PATCH as never, await request("/api/me", { method: "PATCH", body, as: people.gardener }));
      expect(res.status).toBe(422);
      expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }

  it("400 for malformed JSON", async () => {
    const res = await call(me.PATCH as never, await request("/api/me", { method: "PATCH", rawBody: "{nope", as: people.gardener }));
    expect(res.status).toBe(400);
    expect(res.json.error.code).toBe("bad_request");
  });

  it("grants the supplier role at once and queues a grower request for a moderator", async () => {
    const res = await call(
      me.PATCH as never,
      await request("/api/me", { method: "PATCH", body: { display_name: "Ada", unit_system: "imperial", requested_roles: ["supplier", "grower"] }, as: people.gardener }),
    );
    expect(res.status).toBe(200);
    expect(res.json.user.roles).toContain("supplier");
    expect(res.json.user.roles).not.toContain("grower");
    expect(res.json.user.requested_roles).toEqual(["grower"]);
    expect(res.json.user.unit_system).toBe("imperial");

    const queue = await call(roleRequests.GET as never, await request("/api/moderation/role-requests", { as: people.moderator }));
    expect(queue.json.items.map((i: { user_id: string }) => i.user_id)).toContain(people.gardener);

    const approve = await call(
      decide.POST as never,
      await request(`/api/moderation/role-requests/${people.gardener}`, { body: { role: "grower", decision: "approve" }, as: people.moderator }),
      { userId: people.gardener },
    );
    expect(approve.status).toBe(200);
    const again = await call(
      decide.POST as never,
      await request(`/api/moderation/role-requests/${people.gardener}`, { body: { role: "grower", decision: "approve" }, as: people.moderator }),
      { userId: people.gardener },
    );
    expect(again.status).toBe(409);
    const audit = await ctx.db("audit_log").where({ subject_id: people.gardener }).select("action");
    expect(audit.map((a: { action: string }) => a.action)).toEqual(["role.granted", "role.requested", "role.approve"]);
  });

  it("a moderator deciding an unknown request gets 404", async () => {
    await setRole(people.supplier, "supplier", "active");
    const res = await call(
      decide.POST as never,
      await request(`/api/moderation/role-requests/${people.supplier}`, { body: { role: "grower", decision: "approve" }, as: people.moderator }),
      { userId: people.supplier },
    );
    expect(res.status).toBe(404);
  });
});

import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import * as users from "@/app/api/users/route";
import * as health from "@/app/api/health/route";
import { authOptions } from "@/lib/auth/options";
import { verifyPassword } from "@/lib/auth/password";

let ctx: Awaited<ReturnType<typeof freshDb>>;
beforeAll(async () => {
  ctx = await freshDb();
});
afterAll(() => ctx.close());

describe("POST /api/users (sign-up)", () => {
  const good = { email: "Ada@Example.test ", display_name: "Ada", password: "hedgerow ladder compost" };

  it("creates an unconfirmed gardener with a scrypt hash and a normalised e-mail, and answers 202", async () => {
    const res = await call(users.POST as never, await request("/api/users", { body: good }));
    expect(res.status).toBe(202);
    expect(res.json).toMatchObject({ status: "check_email", email: "ada@example.test" });
    const row = await ctx.db("users").where({ email: "ada@example.test" }).first();
    expect(row.password_hash).toMatch(/^\$scrypt\$ln=\d+,r=8,p=3\$/);
    expect(row.password_hash).not.toContain(good.password);
    expect(row.email_verified_at).toBeNull();
    expect(await verifyPassword(good.password, row.password_hash)).toBe(true);
    expect(await ctx.db("user_roles").where({ user_id: row.id }).pluck("role")).toEqual(["gardener"]);
  });

  const BAD: [string, unknown, string][] = [
    ["bad e-mail", { ...good, email: "not-an-email" }, "email"],
    ["short password", { ...good, email: "b@example.test", password: "short" }, "password"],
    ["missing name", { email: "c@example.test", password: "hedgerow ladder compost" }, "display_name"],
    ["wrong unit system", { ...good, email: "d@example.test", unit_system: "furlongs" }, "unit_system"],
  ];
  for (const [label, body, field] of BAD) {
    it(`422 for ${label}, with a message on ${field}`, async () => {
      const res = await call(users.POST as never, await request("/api/users", { body }));
      expect(res.status).toBe(422);
      expect(res.json.error.code).toBe("invalid_input");
      expect(res.json.error.fields[field]).toMatch(/\S/);
    });
  }
  it("400 for a body that is not JSON, and for none at all", async () => {
    expect((await call(users.POST as never, await request("/api/users", { rawBody: "email=a" }))).status).toBe(400);
    expect((await call(users.POST as never, await request("/api/users", { method: "POST" }))).status).toBe(400);
  });
  it("400 for JSON that is not an object", async () => {
    const res = await call(users.POST as never, await request("/api/users", { rawBody: "[1,2]" }));
    expect(res.status).toBe(422);
  });
});

describe("credentials sign-in", () => {
  const provider = authOptions.providers.find((p) => p.id === "credentials") as unknown as {
    options: { authorize: (c: Record<string, string>) => Promise<unknown> };
  };
  it("accepts the right password and refuses a wrong one", async () => {
    const ok = await provider.options.authorize({ email: "ada@example.test", password: "hedgerow ladder compost" });
    expect(ok).toMatchObject({ email: "ada@example.test" });
    expect(await provider.options.authorize({ email: "ada@example.test", password: "wrong password!" })).toBeNull();
    expect(await provider.options.authorize({ email: "nobody@example.test", password: "hedgerow ladder compost" })).toBeNull();
  });
});

describe("GET /api/health", () => {
  it("answers ok after asking the database", async () => {
    const res = await call(health.GET as never, await request("/api/health"));
    expect(res).toEqual({ status: 200, json: { ok: true } });
  });
});

// What proxy.ts and the handler wrapper refuse before a handler runs: cross-site writes
// (403), bodies over 1 MB (413), non-JSON bodies where JSON is expected (415), unknown API
// paths (404) and wrong methods (405 with Allow) — each with the error envelope.
import { NextRequest } from "next/server";
import { afterEach, beforeAll, afterAll, beforeEach, describe, expect, it, vi } from "vitest";
import { proxy } from "@/proxy";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { createUser } from "../factories";
import * as estimateRoute from "@/app/api/estimate/route";
import * as usersRoute from "@/app/api/users/route";
import * as bedsRoute from "@/app/api/beds/route";
import * as meRoute from "@/app/api/me/route";
import * as listingsRoute from "@/app/api/listings/route";
import { POST as cancel } from "@/app/api/reservations/[id]/cancel/route";

const APP = "http://duffbank.example.test:8080";

beforeEach(() => {
  vi.stubEnv("APP_URL", APP);
  vi.stubEnv("NEXTAUTH_URL", APP);
});
afterEach(() => vi.unstubAllEnvs());

function proxied(path: string, opts: { method?: string; headers?: Record<string, string>; host?: string } = {}) {
  const headers = new Headers({ host: opts.host ?? "duffbank.example.test:8080", ...(opts.headers ?? {}) });
  return proxy(new NextRequest(new URL(path, "http://duffbank.example.test:8080"), { method: opts.method ?? "GET", headers }));
}
const passedOn = (res: Response) => res.headers.get("x-middleware-next") === "1";

describe("cross-site writes", () => {
  const cases: [string, Record<string, string>, "403" | "passes"][] = [
    ["a foreign Origin", { origin: "https://evil.example" }, "403"],
    ["a look-alike Origin on another port", { origin: "http://duffbank.example.test:9090" }, "403"],
    ["a look-alike Origin over https", { origin: "https://duffbank.example.test:8080" }, "403"],
    ["Origin: null (a sandboxed frame or a redirect)", { origin: "null" }, "403"],
    ["no Origin and a foreign Referer", { referer: "https://evil.example/page" }, "403"],
    ["no Origin and a Referer that is not a URL", { referer: "not a url" }, "403"],
    ["the app's own Origin", { origin: APP }, "passes"],
    ["the app's own Origin with a foreign Referer (Origin decides)", { origin: APP, referer: "https://evil.example/" }, "passes"],
    ["no Origin and the app's own Referer", { referer: `${APP}/plan` }, "passes"],
    ["neither header (a non-browser client)", {}, "passes"],
  ];
  for (const method of ["POST", "PUT", "PATCH", "DELETE"]) {
    it.each(cases)(`${method} with %s`, (_name, headers, expected) => {
      const res = proxied("/api/reservations", { method, headers });
      if (expected === "passes") {
        // Reaching the route table: POST passes on; other methods get the route's 405.
        expect([true, false]).toContain(passedOn(res));
        expect(res.status).not.toBe(403);
      } else {
        expect(res.status).toBe(403);
      }
    });
  }

  it("answers 403 with the envelope", async () => {
    const res = proxied("/api/beds", { method: "POST", headers: { origin: "https://evil.example" } });
    expect(res.status).toBe(403);
    expect(await res.json()).toEqual({ error: { code: "forbidden", message: expect.any(String) } });
  });

  it("takes the origin the request was addressed to (its Host), so the app works on each of its names", () => {
    const res = proxied("/api/beds", { method: "POST", host: "127.0.0.1:8080", headers: { origin: "http://127.0.0.1:8080" } });
    expect(passedOn(res)).toBe(true);
    const https = proxied("/api/beds", { method: "POST", host: "127.0.0.1:8080", headers: { origin: "https://127.0.0.1:8080", "x-forwarded-proto": "https" } });
    expect(passedOn(https)).toBe(true);
  });

  it("leaves reads alone, and leaves next-auth and the Stripe webhook to their own protection", () => {
    expect(passedOn(proxied("/api/listings", { headers: { origin: "https://evil.example" } }))).toBe(true);
    expect(passedOn(proxied("/api/auth/callback/credentials", { method: "POST", headers: { origin: "https://evil.example" } }))).toBe(true);
    expect(passedOn(proxied("/api/webhooks/stripe", { method: "POST", headers: { origin: "https://evil.example" } }))).toBe(true);
  });

  it("refuses a cross-site write to a page too", () => {
    expect(proxied("/profile", { method: "POST", headers: { origin: "https://evil.example" } }).status).toBe(403);
  });
});

describe("unknown paths and wrong methods", () => {
  it.each([
    ["GET", "/api/nothing-here"],
    ["POST", "/api/nothing-here"],
    ["GET", "/api/listings/abc/unknown"],
    ["GET", "/api"],
  ])("%s %s is a 404 envelope", async (method, path) => {
    const res = proxied(path, { method });
    expect(res.status).toBe(404);
    expect((await res.json()).error.code).toBe("not_found");
    expect(res.headers.get("content-type")).toMatch(/application\/json/);
  });

  it.each([
    ["DELETE", "/api/estimate", "OPTIONS, POST"],
    ["GET", "/api/users", "OPTIONS, POST"],
    ["PUT", "/api/listings/abc", "GET, HEAD, OPTIONS, PATCH"],
    ["POST", "/api/health", "GET, HEAD, OPTIONS"],
    ["DELETE", "/api/reports/diversion.csv", "GET, HEAD, OPTIONS"],
  ])("%s %s is a 405 envelope with Allow: %s", async (method, path, allow) => {
    const res = proxied(path, { method, headers: { origin: APP } });
    expect(res.status).toBe(405);
    expect(res.headers.get("allow")).toBe(allow);
    expect((await res.json()).error.code).toBe("method_not_allowed");
  });

  it("passes a known route and method on, literal segments before dynamic ones", () => {
    expect(passedOn(proxied("/api/listings/abc"))).toBe(true);
    expect(passedOn(proxied("/api/council/invites/accept", { method: "POST" }))).toBe(true);
    expect(passedOn(proxied("/api/reports/diversion.csv"))).toBe(true);
    expect(passedOn(proxied("/api/auth/session"))).toBe(true);
  });
});

describe("body size", () => {
  let ctx: Awaited<ReturnType<typeof freshDb>>;
  beforeAll(async () => {
    ctx = await freshDb();
  });
  afterAll(async () => ctx.close());

  const twoMb = JSON.stringify({ bed: { length_m: 3, width_m: 1 }, padding: "x".repeat(2 * 1024 * 1024) });

  it("refuses a declared body over 1 MB with 413 before any handler reads it", async () => {
    const res = proxied("/api/estimate", { method: "POST", headers: { "content-length": String(twoMb.length), "content-type": "application/json" } });
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe("payload_too_large");
  });

  it("refuses an undeclared (chunked) body over 1 MB with 413 while reading it, in every JSON route", async () => {
    for (const handler of [estimateRoute.POST, usersRoute.POST]) {
      const res = await call(handler as never, await request("/api/x", { rawBody: twoMb }));
      expect(res.status).toBe(413);
      expect(res.json.error.code).toBe("payload_too_large");
    }
  });

  it("takes a body just under the limit", async () => {
    const body = JSON.stringify({ bed: { length_m: 3, width_m: 1 } });
    const res = await call(estimateRoute.POST as never, await request("/api/x", { rawBody: body + " ".repeat(1024 * 1024 - body.length - 10) }));
    expect(res.status).toBe(200);
  });
});

describe("content type", () => {
  let ctx: Awaited<ReturnType<typeof freshDb>>;
  let user: { id: string };
  beforeAll(async () => {
    ctx = await freshDb();
    user = await createUser({ roles: ["gardener", "supplier"] });
  });
  afterAll(async () => ctx.close());

  const body = JSON.stringify({ bed: { length_m: 3, width_m: 1 } });
  const routes: [string, unknown, boolean][] = [
    ["POST /api/estimate", estimateRoute.POST, false],
    ["POST /api/users", usersRoute.POST, false],
    ["POST /api/beds", bedsRoute.POST, true],
    ["PATCH /api/me", meRoute.PATCH, true],
    ["POST /api/listings", listingsRoute.POST, true],
  ];
  for (const type of ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", ""]) {
    it.each(routes)(`%s refuses ${type || "no content type"} with 415`, async (_name, handler, signedIn) => {
      const res = await call(handler as never, await request("/api/x", { method: _name.split(" ")[0], rawBody: body, headers: { "content-type": type }, as: signedIn ? user.id : null }));
      expect(res.status).toBe(415);
      expect(res.json.error.code).toBe("unsupported_media_type");
    });
  }

  it("takes application/json with a charset, and JSON suffixes", async () => {
    for (const type of ["application/json; charset=utf-8", "application/merge-patch+json"]) {
      const res = await call(estimateRoute.POST as never, await request("/api/x", { rawBody: body, headers: { "content-type": type } }));
      expect(res.status).toBe(200);
    }
  });

  it("a step route whose body may be left out still refuses a text/plain body", async () => {
    const res = await call(cancel as never, await request("/api/reservations/x/cancel", { rawBody: "{}", headers: { "content-type": "text/plain" }, as: user.id }), { id: "x" });
    expect(res.status).toBe(415);
  });
});

describe("caching", () => {
  let ctx: Awaited<ReturnType<typeof freshDb>>;
  beforeAll(async () => {
    ctx = await freshDb();
  });
  afterAll(async () => ctx.close());

  it("marks API answers private, no-store (personal ones, and errors)", async () => {
    const user = await createUser();
    const me = await meRoute.GET(await request("/api/me", { as: user.id }), { params: Promise.resolve({}) });
    expect(me.headers.get("cache-control")).toBe("private, no-store");
    const anon = await meRoute.GET(await request("/api/me"), { params: Promise.resolve({}) });
    expect(anon.status).toBe(401);
    expect(anon.headers.get("cache-control")).toBe("private, no-store");
  });
});

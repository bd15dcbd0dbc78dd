// Pages answer on one public host name (APP_URL): a page asked for on another name of the
// same server is redirected there before anything is shown, so the session cookie set on the
// public name is always the one the browser sends. The API is never redirected.
import { NextRequest } from "next/server";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { proxy } from "@/proxy";
import { canonicalRedirect } from "@/lib/security/canonical";

const APP = "http://127.0.0.1:4123";

beforeEach(() => {
  vi.stubEnv("APP_URL", APP);
  vi.stubEnv("NEXTAUTH_URL", APP);
});
afterEach(() => vi.unstubAllEnvs());

function proxied(path: string, host: string, opts: { method?: string; headers?: Record<string, string> } = {}) {
  const headers = new Headers({ host, ...(opts.headers ?? {}) });
  return proxy(new NextRequest(new URL(path, `http://${host}`), { method: opts.method ?? "GET", headers }));
}
const passedOn = (res: Response) => res.headers.get("x-middleware-next") === "1";

describe("pages on another host name", () => {
  it("redirects a page on localhost to the public host, keeping the path and query", () => {
    const res = proxied("/reservations/paid?session_id=cs_test_1", "localhost:4123");
    expect(res.status).toBe(307);
    expect(res.headers.get("location")).toBe(`${APP}/reservations/paid?session_id=cs_test_1`);
  });

  it("redirects HEAD too, and any unknown host name", () => {
    expect(proxied("/", "evil.example", { method: "HEAD" }).headers.get("location")).toBe(`${APP}/`);
  });

  it("serves the page on the public host, with or without an explicit default port", () => {
    expect(passedOn(proxied("/reservations", "127.0.0.1:4123"))).toBe(true);
    vi.stubEnv("APP_URL", "https://duffbank.example.org");
    expect(passedOn(proxied("/reservations", "duffbank.example.org"))).toBe(true);
    expect(passedOn(proxied("/reservations", "DUFFBANK.example.org:443"))).toBe(true);
    expect(proxied("/reservations", "www.duffbank.example.org").headers.get("location")).toBe("https://duffbank.example.org/reservations");
  });

  it("trusts the host a proxy in front forwarded", () => {
    vi.stubEnv("APP_URL", "https://duffbank.example.org");
    expect(passedOn(proxied("/browse", "10.0.0.5:3000", { headers: { "x-forwarded-host": "duffbank.example.org" } }))).toBe(true);
    expect(proxied("/browse", "10.0.0.5:3000").status).toBe(307);
  });

  it("never redirects the API, webhooks or a write", () => {
    for (const path of ["/api/health", "/api/listings?lat=1&lng=2", "/api/auth/session"]) expect(passedOn(proxied(path, "localhost:4123"))).toBe(true);
    expect(proxied("/api/webhooks/stripe", "localhost:4123", { method: "POST" }).status).not.toBe(307);
    expect(canonicalRedirect("POST", "/profile", new Headers({ host: "localhost:4123" }))).toBeNull();
  });

  it("falls back to NEXTAUTH_URL, and can be switched off for a proxy that drops the Host", () => {
    vi.stubEnv("APP_URL", "");
    vi.stubEnv("NEXTAUTH_URL", "http://localhost:3000");
    expect(canonicalRedirect("GET", "/plan", new Headers({ host: "127.0.0.1:3000" }))).toBe("http://localhost:3000/plan");
    vi.stubEnv("CANONICAL_HOST_REDIRECT", "0");
    expect(canonicalRedirect("GET", "/plan", new Headers({ host: "127.0.0.1:3000" }))).toBeNull();
  });
});

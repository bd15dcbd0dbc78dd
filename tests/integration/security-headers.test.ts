// The headers proxy.ts puts on every page and API answer (lib/security/headers.ts).
import { NextRequest } from "next/server";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { proxy } from "@/proxy";

// The requests below are addressed to the app's own public host (pages on another host name
// are redirected first: tests/integration/canonical-host.test.ts).
beforeEach(() => vi.stubEnv("APP_URL", "http://127.0.0.1:3000"));
afterEach(() => vi.unstubAllEnvs());

function get(path: string, method = "GET") {
  return proxy(new NextRequest(new URL(path, "http://127.0.0.1:3000"), { method, headers: { host: "127.0.0.1:3000" } }));
}
const directives = (csp: string) => Object.fromEntries(csp.split(";").map((d) => d.trim().split(/\s+/)).map(([name, ...values]) => [name, values]));

describe("on every answer", () => {
  // A page, an API read, an API refusal (404) and a cross-site refusal (403).
  const answers: [string, () => Response][] = [
    ["a page", () => get("/plan")],
    ["an API read", () => get("/api/listings")],
    ["an API 404", () => get("/api/nowhere")],
    ["an API 405", () => get("/api/estimate", "DELETE")],
  ];
  it.each(answers)("%s carries the policy and the fixed headers", (_name, make) => {
    vi.stubEnv("NODE_ENV", "production");
    vi.stubEnv("APP_URL", "http://127.0.0.1:3000");
    const res = make();
    const csp = directives(res.headers.get("content-security-policy")!);
    expect(csp["default-src"]).toEqual(["'self'"]);
    expect(csp["frame-ancestors"]).toEqual(["'none'"]);
    expect(csp["object-src"]).toEqual(["'none'"]);
    expect(csp["script-src"]).toContain("'strict-dynamic'");
    expect(csp["script-src"].some((v: string) => /^'nonce-[A-Za-z0-9+/=]{16,}'$/.test(v))).toBe(true);
    expect(csp["script-src"]).not.toContain("'unsafe-eval'");
    expect(csp["script-src"]).not.toContain("'unsafe-inline'");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
    expect(res.headers.get("permissions-policy")).toMatch(/(^|, )geolocation=\(self\)/);
    expect(res.headers.get("strict-transport-security")).toBeNull();
  });

  it("gives each page a fresh nonce, and hands it to Next.js in the request's policy", () => {
    const a = get("/plan");
    const b = get("/plan");
    const nonce = (res: Response) => /'nonce-([^']+)'/.exec(res.headers.get("content-security-policy")!)![1];
    expect(nonce(a)).not.toBe(nonce(b));
    expect(a.headers.get("x-middleware-request-content-security-policy")).toContain(`'nonce-${nonce(a)}'`);
    expect(a.headers.get("x-middleware-request-x-nonce")).toBe(nonce(a));
  });

  it("sends HSTS (and upgrades requests) only when the public URL is https", () => {
    vi.stubEnv("APP_URL", "https://duffbank.example.org");
    const res = get("/plan");
    expect(res.headers.get("strict-transport-security")).toMatch(/^max-age=\d{8,}; includeSubDomains$/);
    expect(directives(res.headers.get("content-security-policy")!)).toHaveProperty("upgrade-insecure-requests");
  });

  it("allows 'unsafe-eval' only under next dev", () => {
    vi.stubEnv("NODE_ENV", "development");
    expect(directives(get("/plan").headers.get("content-security-policy")!)["script-src"]).toContain("'unsafe-eval'");
  });
});

describe("the hosts the browser may reach", () => {
  const cases: [string, Record<string, string>, { img: string[]; connect: string[] }][] = [
    ["the local photo fake (default)", {}, { img: ["http://127.0.0.1:12112"], connect: ["http://127.0.0.1:12112"] }],
    ["the photo fake on another port", { CLOUDINARY_URL: "cloudinary://k:s@c?upload_prefix=http://127.0.0.1:45123" }, { img: ["http://127.0.0.1:45123"], connect: ["http://127.0.0.1:45123"] }],
    ["Cloudinary itself", { CLOUDINARY_URL: "cloudinary://k:s@my-cloud" }, { img: ["https://res.cloudinary.com"], connect: ["https://api.cloudinary.com"] }],
    ["a map tile server with subdomains", { NEXT_PUBLIC_TILE_URL: "https://{s}.tiles.example.org/{z}/{x}/{y}.png" }, { img: ["https://*.tiles.example.org"], connect: [] }],
    ["a base map on another host", { NEXT_PUBLIC_BASEMAP_URL: "https://maps.example.org/town.geojson" }, { img: [], connect: ["https://maps.example.org"] }],
  ];
  it.each(cases)("%s", (_name, env, want) => {
    for (const [k, v] of Object.entries(env)) vi.stubEnv(k, v);
    const csp = directives(get("/plan").headers.get("content-security-policy")!);
    for (const host of want.img) expect(csp["img-src"]).toContain(host);
    for (const host of want.connect) expect(csp["connect-src"]).toContain(host);
    expect(csp["img-src"]).not.toContain("*");
  });
});

// The security layer against the production build (tests/e2e/serve.sh): where a callbackUrl
// may lead in the real sign-in page, a copied cookie after sign-out, the checks proxy.ts
// makes, the headers, the sign-in limits through next-auth's own routes, answers that do
// not reveal who has an account, and a production start that refuses to run without secrets.
import { spawn } from "node:child_process";
import { freePort } from "../helpers/free-ports.cjs";
import { expect, test, type Browser } from "./fixtures";
import { DEMO, DEMO_PASSWORD } from "./roles";
import { SECRETS } from "../../lib/env";

const own = () => `http://127.0.0.1:${process.env.E2E_PORT ?? 3100}`;

async function signInAt(browser: Browser, url: string, email: string = DEMO.gardener.email) {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto(url);
  await page.getByLabel("E-mail", { exact: true }).fill(email);
  await page.getByLabel("Password", { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("navigation", { name: "Main" }).first().getByRole("button", { name: "Sign out" })).toBeVisible();
  return { context, page };
}

test.describe("where the sign-in page sends you", () => {
  const variants = [
    "//evil.example/steal",
    "/\\evil.example",
    "\\\\evil.example",
    "https://evil.example/profile",
    "%2F%2Fevil.example",
    "%2F%5Cevil.example",
    "/%2Fevil.example",
    "%252F%252Fevil.example",
    "/\t/evil.example",
    "javascript:alert(document.cookie)",
  ];
  for (const variant of variants) {
    test(`callbackUrl ${JSON.stringify(variant)} stays on this site, at what is waiting`, async ({ browser }) => {
      const { context, page } = await signInAt(browser, `/sign-in?callbackUrl=${encodeURIComponent(variant)}`);
      await expect(page).toHaveURL(`${own()}/home`);
      await context.close();
    });
  }

  test("a path on this site is followed", async ({ browser }) => {
    const { context, page } = await signInAt(browser, `/sign-in?callbackUrl=${encodeURIComponent("/beds")}`);
    await expect(page).toHaveURL(`${own()}/beds`);
    await context.close();
  });
});

test("a cookie copied before signing out is refused afterwards (401)", async ({ browser, playwright }) => {
  const { context, page } = await signInAt(browser, "/sign-in");
  const cookie = (await context.cookies()).map((c) => `${c.name}=${c.value}`).join("; ");
  const copy = await playwright.request.newContext({ baseURL: own(), extraHTTPHeaders: { cookie } });
  expect((await copy.get("/api/me")).status()).toBe(200);
  await page.getByRole("navigation", { name: "Main" }).first().getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("navigation", { name: "Main" }).first().getByRole("link", { name: "Sign in" })).toBeVisible();
  const after = await copy.get("/api/me");
  expect(after.status()).toBe(401);
  expect((await after.json()).error.code).toBe("unauthenticated");
  await copy.dispose();
  await context.close();
});

test.describe("requests the proxy refuses, with the envelope", () => {
  const estimate = { bed: { length_m: 3, width_m: 1.2 } };
  test("the app's own Origin passes; another site's is 403", async ({ request }) => {
    expect((await request.post("/api/estimate", { data: estimate, headers: { Origin: own() } })).status()).toBe(200);
    const foreign = await request.post("/api/estimate", { data: estimate, headers: { Origin: "https://evil.example" } });
    expect(foreign.status()).toBe(403);
    expect((await foreign.json()).error.code).toBe("forbidden");
    const referred = await request.post("/api/estimate", { data: estimate, headers: { Referer: "https://evil.example/page" } });
    expect(referred.status()).toBe(403);
  });

  test("text/plain is 415, 2 MB is 413, an unknown path 404, a wrong method 405 with Allow", async ({ request }) => {
    const plain = await request.post("/api/estimate", { headers: { Origin: own(), "Content-Type": "text/plain" }, data: JSON.stringify(estimate) });
    expect(plain.status()).toBe(415);
    expect((await plain.json()).error.code).toBe("unsupported_media_type");
    const big = await request.post("/api/estimate", { headers: { Origin: own(), "Content-Type": "application/json" }, data: JSON.stringify({ ...estimate, pad: "x".repeat(2 * 1024 * 1024) }) });
    expect(big.status()).toBe(413);
    expect((await big.json()).error.code).toBe("payload_too_large");
    const missing = await request.get("/api/no-such-thing");
    expect(missing.status()).toBe(404);
    expect((await missing.json()).error.code).toBe("not_found");
    const wrong = await request.delete("/api/estimate", { headers: { Origin: own() } });
    expect(wrong.status()).toBe(405);
    expect(wrong.headers()["allow"]).toBe("OPTIONS, POST");
    expect((await wrong.json()).error.code).toBe("method_not_allowed");
    const polygon = await request.post("/api/estimate", { headers: { Origin: own() }, data: { bed: { polygon: { type: "Polygon", coordinates: [] } } } });
    expect(polygon.status()).toBe(422);
  });
});

test("pages and API answers carry the security headers, and the page's scripts carry its nonce", async ({ request }) => {
  const page = await request.get("/plan");
  const csp = page.headers()["content-security-policy"];
  const nonce = /'nonce-([^']+)'/.exec(csp)![1];
  expect(csp).toContain("frame-ancestors 'none'");
  expect(csp).not.toContain("unsafe-eval");
  const html = await page.text();
  const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
  expect(scripts.length).toBeGreaterThan(0);
  for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
  for (const res of [page, await request.get("/api/listings"), await request.get("/api/nowhere")]) {
    const h = res.headers();
    expect(h["content-security-policy"]).toMatch(/default-src 'self'/);
    expect(h["x-content-type-options"]).toBe("nosniff");
    expect(h["referrer-policy"]).toBe("strict-origin-when-cross-origin");
    expect(h["permissions-policy"]).toMatch(/geolocation=\(self\)/);
    expect(h["strict-transport-security"]).toBeUndefined(); // the public URL here is http
  }
  expect((await request.get("/api/me")).headers()["cache-control"]).toBe("private, no-store");
});

test.describe("answers that do not tell who has an account", () => {
  test("joining with a known and an unknown address answers alike", async ({ request }) => {
    const join = (email: string) => request.post("/api/users", { headers: { Origin: own() }, data: { email, display_name: "Linden Hart", password: "juniper kettle orchard" } });
    const known = await join(DEMO.gardener.email);
    const fresh = await join(`fresh-${Date.now()}@example.test`);
    expect(known.status()).toBe(202);
    expect(fresh.status()).toBe(known.status());
    const a = await known.json();
    const b = await fresh.json();
    expect({ ...a, email: "", message: a.message.replace(a.email, "") }).toEqual({ ...b, email: "", message: b.message.replace(b.email, "") });
  });

  test("asking for a sign-in link answers alike for a known and an unknown address", async ({ request }) => {
    const ask = async (email: string) => {
      const { csrfToken } = await (await request.get("/api/auth/csrf")).json();
      return request.post("/api/auth/signin/email", { form: { email, csrfToken, callbackUrl: "/", json: "true" } });
    };
    const known = await ask(DEMO.council.email);
    const unknown = await ask(`nobody-${Date.now()}@example.test`);
    expect(known.status()).toBe(200);
    expect(unknown.status()).toBe(known.status());
    expect(await unknown.json()).toEqual(await known.json());
  });
});

test("failed sign-ins to one account are limited: 429 from next-auth's route, and the page says when to try again", async ({ request, page }) => {
  const email = `locked-${Date.now()}@example.test`;
  const attempt = async () => {
    const { csrfToken } = await (await request.get("/api/auth/csrf")).json();
    return request.post("/api/auth/callback/credentials", { form: { email, password: "wrong guess here", csrfToken, json: "true" } });
  };
  for (let i = 0; i < 10; i++) expect((await attempt()).status()).not.toBe(429);
  const refused = await attempt();
  expect(refused.status()).toBe(429);
  expect(Number(refused.headers()["retry-after"])).toBeGreaterThan(0);
  expect((await refused.json()).error.code).toBe("rate_limited");

  await page.goto("/sign-in");
  await page.getByLabel("E-mail", { exact: true }).fill(email);
  await page.getByLabel("Password", { exact: true }).fill("any password at all");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.locator("main [role='alert']")).toContainText(/Too many failed sign-ins to this account\. Try again in \d+ minutes?\./);
});

test("a production start without secrets refuses to start and names each one to set", async () => {
  const port = await freePort();
  const child = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", String(port)], {
    env: { PATH: process.env.PATH ?? "", HOME: process.env.HOME ?? "/tmp", NODE_ENV: "production", NEXT_TELEMETRY_DISABLED: "1" },
  });
  let output = "";
  child.stdout.on("data", (d) => (output += d));
  child.stderr.on("data", (d) => (output += d));
  const code = await new Promise<number | null>((resolve) => {
    const timer = setTimeout(() => {
      child.kill("SIGKILL");
      resolve(null);
    }, 60_000);
    child.on("exit", (c) => {
      clearTimeout(timer);
      resolve(c);
    });
  });
  expect(code, output).toBe(1);
  for (const s of SECRETS) expect(output).toMatch(new RegExp(`\\[app\\] ${s.name} is not set\\..*openssl rand -base64 32`));
  expect(output).toMatch(/Refusing to start/);
});

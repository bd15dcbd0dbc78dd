// Several processes on one PostgreSQL database, as a region runs it: two app processes (the
// production build through `npm run start:app`, as behind a load balancer) and two workers
// (`npm run worker`). 200 gardeners ask for one unit each of a 50-unit listing at the same
// moment, split across both app processes: exactly 50 are held, the quantity never goes
// below zero, and each confirmation e-mail reaches its gardener exactly once although both
// workers deliver the outbox at once.
//
// PostgreSQL only (DATABASE_URL); tests/run-all.sh runs it after the end-to-end build.
import { spawn, type ChildProcess } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encode } from "next-auth/jwt";
import { freshDb, type TestDb } from "../helpers/db";
import { ensureBuild, freePorts, ROOT, stop, waitFor } from "../helpers/processes";
import { createListing, createUser, listingQuantities } from "../factories";
import { startSmtpFake, type SmtpFake } from "@/lib/fakes/smtp/server";
import { startSession } from "@/lib/auth/sessions";

const SECRET = "two-apps-two-workers-session-secret-not-the-demo-one";
const GARDENERS = 200;
const UNITS = 50;

let ctx: TestDb;
let smtp: SmtpFake;
const children: ChildProcess[] = [];
const apps: string[] = [];

function start(script: string, env: Record<string, string>): ChildProcess {
  const child = spawn("npm", ["run", script], { cwd: ROOT, detached: true, stdio: ["ignore", "ignore", "pipe"], env: { ...process.env, ...env } });
  let tail = "";
  child.stderr?.on("data", (d) => (tail = (tail + d).slice(-2000)));
  child.once("exit", (code) => {
    if (code) console.error(`[processes] ${script} exited with ${code}: ${tail}`);
  });
  children.push(child);
  return child;
}

describe.skipIf(!process.env.DATABASE_URL)("two app processes and two workers on one PostgreSQL database", () => {
  beforeAll(async () => {
    ensureBuild("processes");
    ctx = await freshDb({ materials: true });
    smtp = await startSmtpFake({ smtpPort: 0, httpPort: 0 });
    const [stripePort, ...appPorts] = await freePorts(3);
    const shared = {
      ...ctx.env,
      NODE_ENV: "production",
      NEXTAUTH_SECRET: SECRET,
      LOCATION_SECRET: "two-apps-two-workers-location-secret",
      STRIPE_WEBHOOK_SECRET: "whsec_two_apps_two_workers_not_the_demo_one",
      SMTP_PORT: String(smtp.smtpPort),
      STRIPE_FAKE_PORT: String(stripePort),
      WORKER_INTERVAL_MS: "300",
    };
    for (let i = 0; i < 2; i++) {
      const port = appPorts[i];
      const base = `http://127.0.0.1:${port}`;
      apps.push(base);
      start("start:app", { ...shared, PORT: String(port), NEXTAUTH_URL: base, APP_URL: base });
    }
    for (let i = 0; i < 2; i++) start("worker", shared);
    await Promise.all(apps.map((a) => waitFor(`${a}/api/health`, 120_000)));
  }, 600_000);

  afterAll(async () => {
    await Promise.all(children.map(stop));
    await smtp?.close();
    await ctx?.close();
  });

  it(`holds exactly ${UNITS} of ${GARDENERS} requests and sends each confirmation once`, async () => {
    const listing = await createListing({ quantity_total: UNITS, auto_accept: true });
    const gardeners = await Promise.all(Array.from({ length: GARDENERS }, () => createUser({ roles: ["gardener"] })));
    // Signed in as each would be: a session row, named in a cookie signed with the apps' secret.
    const cookies = await Promise.all(gardeners.map(async (g) => `next-auth.session-token=${await encode({ token: { uid: g.id, sub: g.id, sid: await startSession(g.id) }, secret: SECRET })}`));

    const answers = await Promise.all(
      gardeners.map(async (g, i) => {
        const app = apps[i % apps.length];
        const res = await fetch(`${app}/api/reservations`, {
          method: "POST",
          headers: { "content-type": "application/json", cookie: cookies[i], origin: app },
          body: JSON.stringify({ listing_id: listing.id, quantity: 1 }),
        });
        const body = await res.json();
        return { gardener: g, app, status: res.status, code: body?.error?.code as string | undefined };
      }),
    );
    const tally = (xs: (string | number | undefined)[]) => xs.reduce<Record<string, number>>((acc, x) => ({ ...acc, [String(x)]: (acc[String(x)] ?? 0) + 1 }), {});
    expect(tally(answers.map((a) => a.status))).toEqual({ 201: UNITS, 409: GARDENERS - UNITS });
    expect(tally(answers.filter((a) => a.status === 409).map((a) => a.code))).toEqual({ insufficient_quantity: GARDENERS - UNITS });
    // Both processes took part in the holding.
    for (const app of apps) expect(answers.filter((a) => a.app === app && a.status === 201).length).toBeGreaterThan(0);

    const q = await listingQuantities(listing.id);
    expect(q.quantity_held).toBe(UNITS);
    expect(q.quantity_total - q.quantity_held - q.quantity_collected).toBe(0);
    const held = await ctx.db("reservations").where({ listing_id: listing.id }).select("id", "gardener_id", "status", "pickup_code", "quantity");
    expect(held).toHaveLength(UNITS);
    expect(held.every((r) => r.status === "confirmed" && r.quantity === 1)).toBe(true);

    // The workers deliver the outbox; wait until nothing is left, then a little longer, so a
    // second sending of any message would have happened.
    const count = async (status: string) => Number((await ctx.db("email_outbox").where({ status }).count({ n: "*" }).first())?.n);
    const until = Date.now() + 120_000;
    while ((await count("pending")) > 0 && Date.now() < until) await new Promise((r) => setTimeout(r, 500));
    expect(await count("pending")).toBe(0);
    await new Promise((r) => setTimeout(r, 3_000));

    const winners = new Set(held.map((r) => r.gardener_id));
    for (const a of answers) {
      const confirmations = smtp.messages.filter((m) => m.to.includes(a.gardener.email) && m.subject.startsWith("Confirmed:"));
      expect(confirmations.length, a.gardener.email).toBe(winners.has(a.gardener.id) ? 1 : 0);
    }
    const codes = held.map((r) => r.pickup_code).sort();
    const mailedCodes = smtp.messages.filter((m) => m.subject.startsWith("Confirmed:")).map((m) => m.subject.split("pickup code ")[1]).sort();
    expect(mailedCodes).toEqual(codes);
    // Every message in the outbox went out once: as many deliveries as sent rows.
    expect(smtp.messages.length).toBe(await count("sent"));
  }, 300_000);
});

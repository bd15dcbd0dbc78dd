// Two workers at once (a second one started by mistake, a deploy overlap, or a region that
// runs several on purpose) on the same database: separate processes with their own
// connections, running the same job at the same moment over the same rows. Expiring due
// holds while Stripe is away, each hold is expired once and each gardener told once; once
// Stripe is back, retrying the owed releases, each deposit is released with one Stripe call.
import { execFile } from "node:child_process";
import { createServer, request as httpRequest, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb, type TestDb } from "../helpers/db";
import { engineName } from "../helpers/engine";
import { call, request } from "../helpers/http";
import { startPayments, type PaymentsHarness } from "../helpers/payments";
import { createListing, createUser, listingQuantities } from "../factories";
import { submitHostedPayment } from "@/lib/fakes/stripe/testing";
import { POST as reserve } from "@/app/api/reservations/route";
import { SUPPLIER_REPLY_HOURS } from "@/lib/reservations/policy";

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, "../..");
const WORKER = path.resolve(__dirname, "../helpers/worker-jobs-at.ts");
let ctx: TestDb;
let pay: PaymentsHarness;
let proxy: Server;
const stripeCalls: string[] = [];
let stripeAway = false;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  pay = await startPayments();
  // Between the workers and the Stripe fake: every API call they make, counted.
  proxy = createServer((req, res) => {
    if (stripeAway) {
      res.writeHead(503, { "content-type": "application/json", "stripe-should-retry": "false" }).end(JSON.stringify({ error: { type: "api_error", message: "Stripe is away for the test." } }));
      return;
    }
    if (req.method === "POST") stripeCalls.push(req.url ?? "");
    const out = httpRequest({ host: "127.0.0.1", port: pay.fake.port, path: req.url, method: req.method, headers: req.headers }, (answer) => {
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    req.pipe(out);
  });
  await new Promise<void>((r) => proxy.listen(0, "127.0.0.1", r));
});
afterAll(async () => {
  await new Promise<void>((r) => proxy.close(() => r()));
  await pay.close();
  await ctx.close();
});

describe(`two workers at once on ${engineName()}`, () => {
  it("expire each due hold once, and release each deposit with one Stripe call", async () => {
    const l = await createListing({ deposit_cents: 250, quantity_total: 20 });
    const gardener = await createUser({ roles: ["gardener"] });
    const ids: string[] = [];
    for (let i = 0; i < 8; i++) {
      const res = await call(reserve, await request("/api/reservations", { body: { listing_id: l.id, quantity: 1 }, as: gardener.id }));
      expect(res.status).toBe(201);
      await submitHostedPayment(res.json.checkout_url);
      ids.push(res.json.reservation.id);
    }
    await pay.fake.webhooksIdle();
    // Authorised, waiting on the supplier, who never answers.
    const rows = await ctx.db("reservations").whereIn("id", ids).select("status", "payment_state");
    expect(rows.every((r) => r.status === "held" && r.payment_state === "authorised")).toBe(true);

    const later = Date.now() + (SUPPLIER_REPLY_HOURS + 1) * 3_600_000;
    const workers = async (clock: number, jobNames: string[]) => {
      const startAt = Date.now() + 4000; // time for both processes to start and connect
      const env = { ...process.env, NODE_ENV: "test", ...ctx.env, START_AT: String(startAt), CLOCK: new Date(clock).toISOString(), STRIPE_FAKE_PORT: String((proxy.address() as AddressInfo).port) } as NodeJS.ProcessEnv;
      const outs = await Promise.all([0, 1].map(() => run(process.execPath, ["--conditions=react-server", "--import", "tsx", WORKER, ...jobNames], { env, cwd: ROOT, encoding: "utf8" })));
      return outs.map((o) => JSON.parse(o.stdout) as Record<string, any>);
    };

    // Stripe away: both expire the due holds at once; the releases they owe cannot be made yet.
    stripeAway = true;
    const expiring = await workers(later, ["expire-holds"]);
    stripeAway = false;
    expect(expiring.reduce((n, r) => n + r["expire-holds"].expired, 0)).toBe(ids.length);
    const expiries = await ctx.db("reservation_events").whereIn("reservation_id", ids).andWhere("to_status", "expired").select("reservation_id");
    expect(expiries.map((e) => e.reservation_id).sort()).toEqual([...ids].sort());
    expect((await listingQuantities(l.id)).quantity_held).toBe(0);
    const mails = await ctx.db("email_outbox").where("dedupe_key", "like", "res:%:expired:gardener").select("dedupe_key");
    expect(mails.filter((m) => ids.some((id) => m.dedupe_key.startsWith(`res:${id}:`)))).toHaveLength(ids.length);
    const owed = await ctx.db("payments").whereIn("reservation_id", ids).select("pending_action", "payment_intent_id");
    expect(owed.every((p) => p.pending_action === "release")).toBe(true);
    expect(stripeCalls).toEqual([]);

    // Stripe back: both retry the owed calls at once, a few minutes later.
    await workers(later + 10 * 60_000, ["settle-payments"]);
    await pay.fake.webhooksIdle();
    const settled = await ctx.db("payments").whereIn("reservation_id", ids).select("status", "pending_action");
    expect(settled.every((p) => p.status === "released" && p.pending_action === null)).toBe(true);
    const cancels = stripeCalls.filter((u) => /^\/v1\/payment_intents\/[^/]+\/cancel/.test(u));
    expect(cancels.sort()).toEqual(owed.map((p) => `/v1/payment_intents/${p.payment_intent_id}/cancel`).sort());
  }, 120_000);
});

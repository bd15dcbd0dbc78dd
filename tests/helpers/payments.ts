// The Stripe fake on a free port, with its webhooks delivered to the app's own route
// handler through a tiny HTTP server: the same path as in production, minus Next.js.
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { NextRequest } from "next/server";
import { startStripeFake, type StripeFake } from "@/lib/fakes/stripe/server";
import { resetStripe } from "@/lib/payments/stripe";
import { POST as webhookRoute } from "@/app/api/webhooks/stripe/route";
import { afterAll, beforeAll, beforeEach } from "vitest";
import { freshDb } from "./db";
import { createUser } from "../factories";

export const TEST_WEBHOOK_SECRET = "whsec_duffbank_local";

export interface PaymentsHarness {
  fake: StripeFake;
  /** Where the fake posts its webhooks (set it back after a test turned them off). */
  webhookUrl: string;
  /** Status codes the webhook route answered, in arrival order. */
  answers: number[];
  close(): Promise<void>;
}

export async function startPayments(): Promise<PaymentsHarness> {
  const answers: number[] = [];
  const receiver: Server = createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const c of req) chunks.push(c as Buffer);
    const headers = new Headers();
    for (const [k, v] of Object.entries(req.headers)) if (typeof v === "string") headers.set(k, v);
    const nextReq = new NextRequest("http://localhost:3000/api/webhooks/stripe", { method: "POST", headers, body: Buffer.concat(chunks).toString("utf8") });
    const out = await webhookRoute(nextReq);
    answers.push(out.status);
    res.writeHead(out.status, { "content-type": "application/json" }).end(await out.text());
  });
  await new Promise<void>((r) => receiver.listen(0, "127.0.0.1", r));
  const url = `http://127.0.0.1:${(receiver.address() as AddressInfo).port}/api/webhooks/stripe`;
  const fake = await startStripeFake({ port: 0, webhookUrl: url, webhookSecret: TEST_WEBHOOK_SECRET, retry: { baseMs: 50, maxAttempts: 4 } });
  process.env.STRIPE_FAKE_PORT = String(fake.port);
  process.env.STRIPE_WEBHOOK_SECRET = TEST_WEBHOOK_SECRET;
  delete process.env.STRIPE_SECRET_KEY;
  // The fake's port only: a developer's own endpoint overrides must not leak into tests.
  for (const k of ["STRIPE_API_HOST", "STRIPE_API_PORT", "STRIPE_API_PROTOCOL"]) delete process.env[k];
  resetStripe();
  return {
    fake,
    webhookUrl: url,
    answers,
    close: async () => {
      await fake.close();
      await new Promise<void>((r) => {
        receiver.close(() => r());
        receiver.closeAllConnections();
      });
      resetStripe();
    },
  };
}

/**
 * The world most payment test files start from: a fresh database, the Stripe fake wired to the
 * webhook route, and one gardener. Before each test the fake's webhooks are back on (a test
 * may have pointed them elsewhere) and the route's answers are cleared.
 */
export function paymentsWorld(): { pay: PaymentsHarness; gardener: { id: string } } {
  const world = {} as { pay: PaymentsHarness; gardener: { id: string } };
  let database: Awaited<ReturnType<typeof freshDb>> | undefined;
  beforeAll(async () => {
    database = await freshDb();
    world.pay = await startPayments();
    world.gardener = await createUser({ roles: ["gardener"] });
  });
  afterAll(async () => {
    await world.pay?.close();
    await database?.close();
  });
  beforeEach(() => {
    world.pay.answers.length = 0;
    world.pay.fake.setWebhookUrl(world.pay.webhookUrl);
  });
  return world;
}

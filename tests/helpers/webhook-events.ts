import Stripe from "stripe";
import { call, request } from "./http";
import { TEST_WEBHOOK_SECRET } from "./payments";
import { POST as webhookRoute } from "@/app/api/webhooks/stripe/route";

/** A request to the webhook route signed the way Stripe signs (the SDK's own test helper). */
export async function signedWebhook(event: unknown, opts: { timestamp?: number; secret?: string; payload?: string } = {}) {
  const payload = opts.payload ?? JSON.stringify(event);
  const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: opts.secret ?? TEST_WEBHOOK_SECRET, timestamp: opts.timestamp });
  return call(webhookRoute as any, await request("/api/webhooks/stripe", { rawBody: payload, headers: { "stripe-signature": header } }));
}

/** Delivers events (e.g. the fake's recorded ones) one after another, in the given order. */
export async function deliverEvents(events: unknown[]) {
  const answers = [];
  for (const e of events) answers.push(await signedWebhook(e));
  return answers;
}

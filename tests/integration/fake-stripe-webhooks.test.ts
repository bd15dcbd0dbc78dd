// Webhooks from the fake: every event must verify with the SDK's own constructEvent,
// arrive in order per object, be retried until the receiver says 2xx, and never hold up
// the API call that caused it.
import fs from "node:fs";
import { createServer, type Server } from "node:http";
import os from "node:os";
import path from "node:path";
import type { AddressInfo } from "node:net";
import { afterEach, describe, expect, it } from "vitest";
import Stripe from "stripe";
import { DEFAULT_RETRY, startStripeFake, type StripeFake, type StripeFakeOptions } from "@/lib/fakes/stripe/server";
import { stripeDataFile } from "@/lib/fakes/stripe/state";
import { TEST_CARDS, submitHostedPayment } from "@/lib/fakes/stripe/testing";
import { STRIPE_RETRY_WINDOW_MS, retryDelayMs, signatureHeader } from "@/lib/fakes/stripe/webhooks";

const SECRET = "whsec_test_receiver";

interface Arrival {
  eventId: string;
  type: string;
  objectId: string;
  answered: number;
  at: number;
}

/** A stand-in for the app's webhook route: verifies each request and answers as told. */
async function startReceiver(answer: (event: Stripe.Event, attempt: number) => number | Promise<number> = () => 200) {
  const arrivals: Arrival[] = [];
  const events: Stripe.Event[] = [];
  const rejected: string[] = [];
  const attempts = new Map<string, number>();
  const server: Server = createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const chunk of req) chunks.push(chunk as Buffer);
    const raw = Buffer.concat(chunks).toString("utf8");
    let event: Stripe.Event;
    try {
      event = Stripe.webhooks.constructEvent(raw, req.headers["stripe-signature"] as string, SECRET);
    } catch (err) {
      rejected.push((err as Error).message);
      res.writeHead(400).end();
      return;
    }
    const attempt = (attempts.get(event.id) ?? 0) + 1;
    attempts.set(event.id, attempt);
    const status = await answer(event, attempt);
    const objectId = (event.data.object as { id: string }).id;
    arrivals.push({ eventId: event.id, type: event.type, objectId, answered: status, at: Date.now() });
    if (status >= 200 && status < 300) events.push(event);
    res.writeHead(status).end();
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/webhooks/stripe`;
  return {
    url,
    arrivals,
    events,
    rejected,
    close: () => new Promise<void>((resolve) => { server.close(() => resolve()); server.closeAllConnections(); }),
  };
}

const cleanups: Array<() => Promise<void>> = [];
afterEach(async () => {
  while (cleanups.length) await cleanups.pop()!();
});

async function setup(answer?: Parameters<typeof startReceiver>[0], opts: StripeFakeOptions = {}) {
  const receiver = await startReceiver(answer);
  const fake = await startStripeFake({ port: 0, webhookUrl: receiver.url, webhookSecret: SECRET, retry: { baseMs: 20, maxAttempts: 5 }, ...opts });
  cleanups.push(() => receiver.close(), () => fake.close());
  const stripe = new Stripe("sk_test_duffbank_webhooks", { host: "127.0.0.1", port: fake.port, protocol: "http" });
  return { receiver, fake, stripe };
}

function checkout(stripe: Stripe, capture: "automatic" | "manual" = "automatic") {
  return stripe.checkout.sessions.create({
    mode: "payment",
    line_items: [{ price_data: { currency: "gbp", unit_amount: 1500, product_data: { name: "Worm culture, 250 g" } }, quantity: 1 }],
    success_url: "http://127.0.0.1:3000/ok?s={CHECKOUT_SESSION_ID}",
    metadata: { reservation_id: "r_7" },
    payment_intent_data: { capture_method: capture },
  });
}

const typesFor = (events: Stripe.Event[], id: string) =>
  events.filter((e) => (e.data.object as { id: string }).id === id).map((e) => e.type);

describe("signed events", () => {
  it("sends every state change of a paid checkout, each verifying with constructEvent", async () => {
    const { receiver, fake, stripe } = await setup();
    const session = await checkout(stripe);
    await submitHostedPayment(session.url!, { card_number: TEST_CARDS.declined });
    await submitHostedPayment(session.url!, { card_number: TEST_CARDS.approved });
    await fake.webhooksIdle();

    expect(receiver.rejected).toEqual([]);
    const paid = await stripe.checkout.sessions.retrieve(session.id);
    const piId = paid.payment_intent as string;
    expect(typesFor(receiver.events, piId)).toEqual([
      "payment_intent.created",
      "payment_intent.payment_failed",
      "payment_intent.succeeded",
    ]);
    expect(typesFor(receiver.events, session.id)).toEqual(["checkout.session.completed"]);
    expect(receiver.events.map((e) => e.type)).toEqual(expect.arrayContaining(["charge.failed", "charge.succeeded"]));

    const completed = receiver.events.find((e) => e.type === "checkout.session.completed")!;
    expect(completed).toMatchObject({
      object: "event",
      api_version: Stripe.API_VERSION,
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      data: { object: { id: session.id, status: "complete", payment_status: "paid", metadata: { reservation_id: "r_7" } } },
    });
    expect(completed.id).toMatch(/^evt_/);
    // The snapshot is of that moment: the failed attempt's event still shows the error.
    const failed = receiver.events.find((e) => e.type === "payment_intent.payment_failed")!;
    expect((failed.data.object as Stripe.PaymentIntent).last_payment_error?.decline_code).toBe("generic_decline");
    expect(await stripe.events.retrieve(completed.id)).toMatchObject({ id: completed.id, pending_webhooks: 0 });
  });

  it("signs with the configured secret only", async () => {
    const { fake, stripe } = await setup(undefined, { webhookUrl: null });
    await stripe.paymentIntents.create({ amount: 500, currency: "gbp" });
    const event = [...fake.state.events.values()][0];
    const payload = JSON.stringify(event);
    const header = signatureHeader(payload, SECRET, Math.floor(Date.now() / 1000));
    expect(Stripe.webhooks.constructEvent(payload, header, SECRET).id).toBe(event.id);
    expect(() => Stripe.webhooks.constructEvent(payload, header, "whsec_someone_else")).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });

  it("covers holds, captures, refunds and cancellations, naming the API request", async () => {
    const { receiver, fake, stripe } = await setup();
    const session = await checkout(stripe, "manual");
    await submitHostedPayment(session.url!);
    const piId = (await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string;
    await stripe.paymentIntents.capture(piId, {}, { idempotencyKey: "capture-r_7" });
    const refund = await stripe.refunds.create({ payment_intent: piId, amount: 500 });
    const hold = await stripe.paymentIntents.create({ amount: 900, currency: "gbp", capture_method: "manual" });
    await stripe.paymentIntents.cancel(hold.id);
    await fake.webhooksIdle();

    expect(receiver.rejected).toEqual([]);
    expect(typesFor(receiver.events, piId)).toEqual([
      "payment_intent.created",
      "payment_intent.amount_capturable_updated",
      "payment_intent.succeeded",
    ]);
    expect(typesFor(receiver.events, refund.id)).toEqual(["refund.created"]);
    expect(typesFor(receiver.events, hold.id)).toEqual(["payment_intent.created", "payment_intent.canceled"]);
    const chargeEvents = receiver.events.filter((e) => e.type.startsWith("charge.")).map((e) => e.type);
    expect(chargeEvents).toEqual(["charge.succeeded", "charge.captured", "charge.refunded"]);
    const captured = receiver.events.find((e) => e.type === "payment_intent.succeeded")!;
    expect(captured.request).toMatchObject({ id: expect.stringMatching(/^req_/), idempotency_key: "capture-r_7" });
  });
});

describe("delivery", () => {
  it("retries a receiver that fails twice and delivers on the third attempt", async () => {
    const { receiver, fake, stripe } = await setup((_event, attempt) => (attempt <= 2 ? 500 : 200));
    const pi = await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    await fake.webhooksIdle();

    const eventId = receiver.events[0].id;
    expect(receiver.arrivals.map((a) => [a.eventId, a.answered])).toEqual([
      [eventId, 500],
      [eventId, 500],
      [eventId, 200],
    ]);
    const attempts = fake.state.deliveries.filter((d) => d.eventId === eventId);
    expect(attempts.map((d) => [d.attempt, d.status, d.ok])).toEqual([
      [1, 500, false],
      [2, 500, false],
      [3, 200, true],
    ]);
    expect(attempts.every((d) => d.objectId === pi.id && d.url === receiver.url)).toBe(true);
    // Exponential backoff from a 20 ms base: about 20 ms, then about 40 ms.
    expect(attempts[1].at - attempts[0].at).toBeGreaterThanOrEqual(18);
    expect(attempts[2].at - attempts[1].at).toBeGreaterThanOrEqual(38);
    expect(fake.state.events.get(eventId)!.pending_webhooks).toBe(0);
  });

  it("gives up after maxAttempts and leaves the event pending", async () => {
    const { receiver, fake, stripe } = await setup(() => 500, { retry: { baseMs: 5, maxAttempts: 3 } });
    await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    await fake.webhooksIdle();
    expect(receiver.arrivals.map((a) => a.answered)).toEqual([500, 500, 500]);
    expect(fake.state.deliveries.map((d) => d.ok)).toEqual([false, false, false]);
    expect([...fake.state.events.values()][0].pending_webhooks).toBe(1);
  });

  it("keeps one object's events in order while retrying", async () => {
    // Every event's first attempt fails, so a later event could overtake an earlier one.
    const { receiver, fake, stripe } = await setup((_event, attempt) => (attempt === 1 ? 503 : 200));
    const pi = await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    await stripe.paymentIntents.cancel(pi.id);
    await fake.webhooksIdle();
    const forPi = receiver.arrivals.filter((a) => a.objectId === pi.id).map((a) => [a.type, a.answered]);
    expect(forPi).toEqual([
      ["payment_intent.created", 503],
      ["payment_intent.created", 200],
      ["payment_intent.canceled", 503],
      ["payment_intent.canceled", 200],
    ]);
  });

  it("answers the API without waiting for a slow receiver", async () => {
    const { receiver, fake, stripe } = await setup(() => new Promise((resolve) => setTimeout(() => resolve(200), 1500)));
    const started = Date.now();
    await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    expect(Date.now() - started).toBeLessThan(1000);
    expect(receiver.events).toHaveLength(0);
    await fake.webhooksIdle();
    expect(receiver.events).toHaveLength(1);
  });

  it("only records events while no URL is set, and delivers once one is", async () => {
    const { receiver, fake, stripe } = await setup(undefined, { webhookUrl: null });
    await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    await fake.webhooksIdle();
    expect(fake.state.events.size).toBe(1);
    expect([...fake.state.events.values()][0].pending_webhooks).toBe(0);
    expect(fake.state.deliveries).toEqual([]);

    fake.setWebhookUrl(receiver.url);
    const later = await stripe.paymentIntents.create({ amount: 800, currency: "gbp" });
    await fake.webhooksIdle();
    expect(receiver.events.map((e) => (e.data.object as { id: string }).id)).toEqual([later.id]);
  });
});

describe("retrying until a 2xx", () => {
  it("keeps trying well past a handful of attempts, with backoff that grows and then stays capped", async () => {
    const { receiver, fake, stripe } = await setup((_event, attempt) => (attempt <= 11 ? 503 : 200), { retry: { baseMs: 4, maxMs: 25 } });
    await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    await fake.webhooksIdle();
    expect(receiver.arrivals.map((a) => a.answered)).toEqual([...Array(11).fill(503), 200]);
    expect([...fake.state.events.values()][0].pending_webhooks).toBe(0);
    const at = fake.state.deliveries.map((d) => d.at);
    const gaps = at.slice(1).map((t, i) => t - at[i]);
    // 4, 8, 16 ms, then never more than the 25 ms cap (uncapped, the last would be 4 s).
    expect(gaps[2]).toBeGreaterThanOrEqual(15);
    expect(gaps.slice(3).every((g) => g >= 24 && g < 250)).toBe(true);
  });

  it("by default never gives up on a count, only after Stripe's three days", () => {
    expect(DEFAULT_RETRY.maxAttempts).toBeUndefined();
    expect(retryDelayMs(1, DEFAULT_RETRY)).toBe(1_000);
    expect(retryDelayMs(4, DEFAULT_RETRY)).toBe(8_000);
    expect(retryDelayMs(50, DEFAULT_RETRY)).toBe(DEFAULT_RETRY.maxMs);
    expect(STRIPE_RETRY_WINDOW_MS).toBe(3 * 24 * 3_600_000); // docs.stripe.com/webhooks#retries: "for up to three days"
  });

  it("stops once the event is older than the retry window", async () => {
    let now = Date.now();
    const { receiver, fake, stripe } = await setup(() => 500, { now: () => now, retry: { baseMs: 5, maxMs: 5 } });
    await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    while (receiver.arrivals.length < 3) await new Promise((r) => setTimeout(r, 5));
    now += STRIPE_RETRY_WINDOW_MS;
    await fake.webhooksIdle();
    const count = receiver.arrivals.length;
    await new Promise((r) => setTimeout(r, 50));
    expect(receiver.arrivals.length).toBe(count);
    expect([...fake.state.events.values()][0].pending_webhooks).toBe(1);
  });

  it("drops pending retries when the fake closes, without waiting on them", async () => {
    const { receiver, fake, stripe } = await setup(() => 500, { retry: { baseMs: 30, maxMs: 30 } });
    await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    while (receiver.arrivals.length < 2) await new Promise((r) => setTimeout(r, 5));
    const started = Date.now();
    await fake.close();
    await fake.webhooksIdle();
    expect(Date.now() - started).toBeLessThan(500);
    const count = receiver.arrivals.length;
    await new Promise((r) => setTimeout(r, 120));
    expect(receiver.arrivals.length).toBe(count);
  });

  it("carries on delivering after a restart with the same data file", async () => {
    const dataFile = path.join(os.tmpdir(), `stripe-fake-${process.pid}-${Date.now()}.json`);
    cleanups.push(async () => fs.rmSync(dataFile, { force: true }));
    const down = await startReceiver(() => 503);
    cleanups.push(() => down.close());
    const first = await startStripeFake({ port: 0, webhookUrl: down.url, webhookSecret: SECRET, dataFile, retry: { baseMs: 20, maxMs: 20 } });
    const stripe = new Stripe("sk_test_duffbank_webhooks", { host: "127.0.0.1", port: first.port, protocol: "http" });
    const pi = await stripe.paymentIntents.create({ amount: 700, currency: "gbp" });
    while (down.arrivals.length < 2) await new Promise((r) => setTimeout(r, 5));
    await first.close();

    const up = await startReceiver();
    cleanups.push(() => up.close());
    const second = await startStripeFake({ port: 0, webhookUrl: up.url, webhookSecret: SECRET, dataFile, retry: { baseMs: 20, maxMs: 20 } });
    cleanups.push(() => second.close());
    await second.webhooksIdle();
    expect(up.events.map((e) => [e.type, (e.data.object as { id: string }).id])).toEqual([["payment_intent.created", pi.id]]);
    expect(second.state.events.get(up.events[0].id)!.pending_webhooks).toBe(0);
    // Delivered is remembered too: a third start sends nothing again.
    await second.close();
    const third = await startStripeFake({ port: 0, webhookUrl: up.url, webhookSecret: SECRET, dataFile, retry: { baseMs: 20, maxMs: 20 } });
    cleanups.push(() => third.close());
    await third.webhooksIdle();
    expect(up.events).toHaveLength(1);
  });
});

describe("where npm run dev keeps the fake's records", () => {
  it("beside the database, or where STRIPE_FAKE_DATA says", () => {
    expect(stripeDataFile({})).toBe(path.resolve("db/duffbank.stripe-fake.json"));
    expect(stripeDataFile({ DATABASE_FILE: "/tmp/run-1/e2e.sqlite" })).toBe("/tmp/run-1/e2e.stripe-fake.json");
    expect(stripeDataFile({ DATABASE_FILE: "/tmp/run-1/e2e.sqlite", STRIPE_FAKE_DATA: "/var/tmp/stripe.json" })).toBe("/var/tmp/stripe.json");
  });
});

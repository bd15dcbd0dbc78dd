// Webhooks are trusted only as far as Stripe's own record: a verified event is a pointer, the
// object it names is read back through the SDK (from the Stripe fake here), and only what
// that record says is applied — its status, and only when its amount and currency are what
// Duffbank asked for. Refunds and released holds made on Stripe's side are applied too.
import Stripe from "stripe";
import { describe, expect, it } from "vitest";
import { call, request } from "../helpers/http";
import { paymentsWorld } from "../helpers/payments";
import { deliverEvents, signedWebhook } from "../helpers/webhook-events";
import { createListing, listingQuantities } from "../factories";
import { submitHostedPayment } from "@/lib/fakes/stripe/testing";
import { POST as reserve } from "@/app/api/reservations/route";
import { stripe } from "@/lib/payments/stripe";
import { reconcilePayments } from "@/lib/payments/reconcile";
import { db } from "@/db/index";

const world = paymentsWorld();

type Opts = { price_cents?: number; deposit_cents?: number; auto_accept?: boolean };
async function reserved(opts: Opts) {
  const l = await createListing({ unit: "bales", quantity_total: 10, ...opts });
  const res = await call(reserve, await request("/api/reservations", { body: { listing_id: l.id, quantity: 2 }, as: world.gardener.id }));
  expect(res.status).toBe(201);
  return { id: res.json.reservation.id as string, listing: l, checkoutUrl: res.json.checkout_url as string };
}
const state = (id: string) => db()("reservations").first("status", "payment_state").where({ id });
const charge = (id: string) => db()("payments").first("*").where({ reservation_id: id }).whereIn("kind", ["payment", "deposit"]);
const mails = async (id: string) => (await db()("email_outbox").where("dedupe_key", "like", `res:${id}:%`).pluck("template")).sort();
const now = () => Math.floor(Date.now() / 1000);
const event = (type: string, object: Record<string, unknown>) => ({ id: `evt_forged_${Math.random().toString(36).slice(2)}`, object: "event", type, created: now(), api_version: Stripe.API_VERSION, livemode: false, data: { object } });

describe("a correctly signed but false event changes nothing", () => {
  const forgeries: [string, Opts, (p: { id: string; provider_ref: string; payment_intent_id: string | null; amount_cents: number }) => ReturnType<typeof event>][] = [
    ["checkout.session.completed, paid, for an open checkout", { price_cents: 450 }, (p) => event("checkout.session.completed", { id: p.provider_ref, object: "checkout.session", status: "complete", payment_status: "paid", amount_total: p.amount_cents, currency: "eur", payment_intent: "pi_forged", metadata: { payment_id: p.id } })],
    ["payment_intent.succeeded for a made-up intent naming the payment", { price_cents: 450 }, (p) => event("payment_intent.succeeded", { id: "pi_forged", object: "payment_intent", status: "succeeded", amount: p.amount_cents, amount_received: p.amount_cents, currency: "eur", metadata: { payment_id: p.id } })],
    ["payment_intent.amount_capturable_updated for a deposit never put down", { deposit_cents: 200 }, (p) => event("payment_intent.amount_capturable_updated", { id: "pi_forged", object: "payment_intent", status: "requires_capture", amount: 200, amount_capturable: 200, currency: "eur", metadata: { payment_id: p.id } })],
    ["charge.succeeded naming the payment", { price_cents: 450 }, (p) => event("charge.succeeded", { id: "ch_forged", object: "charge", status: "succeeded", paid: true, captured: true, amount: p.amount_cents, amount_captured: p.amount_cents, payment_intent: "pi_forged", metadata: { payment_id: p.id } })],
  ];
  it.each(forgeries)("%s", async (_name, opts, forge) => {
    const r = await reserved(opts);
    const p = await charge(r.id);
    const res = await signedWebhook(forge(p));
    expect(res.status).toBe(200);
    expect(await state(r.id)).toEqual({ status: "held", payment_state: "awaiting" });
    expect((await charge(r.id)).status).toBe("open");
    expect(await mails(r.id)).toEqual([]);
  });

  it("a forged refund or release of real money changes nothing either", async () => {
    for (const opts of [{ price_cents: 450, auto_accept: true }, { deposit_cents: 200, auto_accept: true }]) {
      const r = await reserved(opts);
      await submitHostedPayment(r.checkoutUrl);
      await world.pay.fake.webhooksIdle();
      const before = { reservation: await state(r.id), payment: (await charge(r.id)).status };
      expect(before.reservation.status).toBe("confirmed");
      const p = await charge(r.id);
      const forged = opts.price_cents
        ? event("charge.refunded", { id: "ch_forged", object: "charge", captured: true, amount: 900, amount_captured: 900, amount_refunded: 900, payment_intent: p.payment_intent_id, metadata: { payment_id: p.id } })
        : event("payment_intent.canceled", { id: p.payment_intent_id, object: "payment_intent", status: "canceled", cancellation_reason: "requested_by_customer", metadata: { payment_id: p.id } });
      expect((await signedWebhook(forged)).status).toBe(200);
      expect({ reservation: await state(r.id), payment: (await charge(r.id)).status }).toEqual(before);
    }
  });

  it("a paid checkout whose amount or currency on Stripe is not what was asked is not credited", async () => {
    for (const tamper of [(s: { amount_total: number }) => void (s.amount_total = 1), (s: { currency: string }) => void (s.currency = "usd")]) {
      world.pay.fake.setWebhookUrl(null);
      const r = await reserved({ price_cents: 450 });
      await submitHostedPayment(r.checkoutUrl);
      const p = await charge(r.id);
      const session = world.pay.fake.state.checkoutSessions.get(p.provider_ref)!;
      tamper(session as never);
      const events = [...world.pay.fake.state.events.values()].filter((e) => (e.data.object as { id?: string }).id === session.id);
      await deliverEvents(events);
      expect(await state(r.id)).toEqual({ status: "held", payment_state: "awaiting" });
      expect((await charge(r.id)).status).toBe("open");
      expect((await charge(r.id)).last_error).toMatch(/does not match/);
      expect(await mails(r.id)).toEqual([]);
    }
  });
});

describe("signature timestamps", () => {
  it.each([
    ["10 minutes in the past", -600, 400],
    ["6 minutes in the future", 360, 400],
    ["a day in the future", 86_400, 400],
    ["4 minutes in the future (clock skew)", 240, 200],
    ["4 minutes in the past", -240, 200],
  ])("a signature dated %s: %s seconds off, answered %s", async (_name, offset, status) => {
    const res = await signedWebhook(event("customer.created", { id: "cus_x", object: "customer" }), { timestamp: now() + offset });
    expect(res.status).toBe(status);
    if (status === 400) expect(res.json.error.code).toBe("bad_request");
  });
});

describe("a refund or a release made on Stripe's side, outside Duffbank", () => {
  it.each([
    ["a payment refunded in full", { price_cents: 450, auto_accept: true }, "refunded"],
    ["a deposit hold released", { deposit_cents: 200, auto_accept: true }, "released"],
    ["a paid request the supplier has not answered yet, refunded", { price_cents: 450 }, "refunded"],
  ] as const)("%s: the reservation is cancelled, the quantity returns, both sides are told", async (_name, opts, end) => {
    const r = await reserved(opts);
    await submitHostedPayment(r.checkoutUrl);
    await world.pay.fake.webhooksIdle();
    const p = await charge(r.id);
    // What someone does in Stripe's dashboard: no metadata, no Duffbank row behind it.
    if (end === "refunded") await stripe().refunds.create({ payment_intent: p.payment_intent_id });
    else await stripe().paymentIntents.cancel(p.payment_intent_id, { cancellation_reason: "requested_by_customer" });
    await world.pay.fake.webhooksIdle();
    expect(await state(r.id)).toEqual({ status: "cancelled", payment_state: end });
    expect((await charge(r.id)).status).toBe(end);
    expect((await listingQuantities(r.listing.id)).quantity_held).toBe(0);
    const sent = await mails(r.id);
    expect(sent.filter((t) => t === "reservation.returned_outside")).toHaveLength(2);
    const history = await db()("reservation_events").where({ reservation_id: r.id }).orderBy("id").pluck("note");
    expect(history.at(-1)).toMatch(/on Stripe, outside Duffbank/);
    expect((await reconcilePayments()).filter((m) => m.payment_id === p.id)).toEqual([]);
  });

  it("a partial refund is recorded and the reservation goes on", async () => {
    const r = await reserved({ price_cents: 450, auto_accept: true });
    await submitHostedPayment(r.checkoutUrl);
    await world.pay.fake.webhooksIdle();
    await stripe().refunds.create({ payment_intent: (await charge(r.id)).payment_intent_id, amount: 100 });
    await world.pay.fake.webhooksIdle();
    expect(await state(r.id)).toEqual({ status: "confirmed", payment_state: "paid" });
    expect(await charge(r.id)).toMatchObject({ status: "paid", refunded_cents: 100 });
  });
});

describe("events in any order end in Stripe's state", () => {
  it("paid then refunded outside before any event arrived: one cancellation, no receipt or confirmation for steps Duffbank never saw", async () => {
    const orders: [string, <T>(xs: T[]) => T[]][] = [
      ["as sent", (xs) => xs],
      ["reversed", (xs) => [...xs].reverse()],
      ["refund first", (xs) => [...xs].sort((a: any, b: any) => Number(b.type.startsWith("charge.refunded")) - Number(a.type.startsWith("charge.refunded")))],
    ];
    const ends = [];
    for (const [name, order] of orders) {
      world.pay.fake.setWebhookUrl(null);
      const r = await reserved({ price_cents: 450, auto_accept: true });
      const before = new Set(world.pay.fake.state.events.keys());
      await submitHostedPayment(r.checkoutUrl);
      const p = await charge(r.id);
      const session = world.pay.fake.state.checkoutSessions.get(p.provider_ref)!;
      await stripe().refunds.create({ payment_intent: session.payment_intent! });
      const events = [...world.pay.fake.state.events.values()].filter((e) => !before.has(e.id));
      expect(events.map((e) => e.type)).toEqual(expect.arrayContaining(["checkout.session.completed", "payment_intent.succeeded", "charge.refunded"]));
      const answers = await deliverEvents(order(events));
      expect(answers.every((a) => a.status === 200), name).toBe(true);
      const end = { reservation: await state(r.id), payment: (await charge(r.id)).status, mails: await mails(r.id), held: (await listingQuantities(r.listing.id)).quantity_held };
      expect(end, name).toEqual({ reservation: { status: "cancelled", payment_state: "refunded" }, payment: "refunded", mails: ["reservation.returned_outside", "reservation.returned_outside"], held: 0 });
      ends.push(end);
    }
    expect(new Set(ends.map((e) => JSON.stringify(e))).size).toBe(1);
  });

  it("a checkout abandoned after a declined card ends expired, never 'released'", async () => {
    world.pay.fake.setWebhookUrl(null);
    const r = await reserved({ deposit_cents: 200 });
    const before = new Set(world.pay.fake.state.events.keys());
    expect((await submitHostedPayment(r.checkoutUrl, { card_number: "4000 0000 0000 0002" })).status).toBe(402);
    await stripe().checkout.sessions.expire((await charge(r.id)).provider_ref);
    const events = [...world.pay.fake.state.events.values()].filter((e) => !before.has(e.id));
    expect(events.map((e) => e.type)).toContain("payment_intent.canceled");
    await deliverEvents([...events].reverse());
    expect((await charge(r.id)).status).toBe("expired");
    expect(await mails(r.id)).toEqual([]);
  });
});

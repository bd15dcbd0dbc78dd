// PaymentIntents, refunds, API keys and idempotency on the fake, through the official SDK.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Stripe from "stripe";
import { startStripeFake, type StripeFake } from "@/lib/fakes/stripe/server";
import { submitHostedPayment } from "@/lib/fakes/stripe/testing";

let fake: StripeFake;
let stripe: Stripe;

beforeAll(async () => {
  fake = await startStripeFake({ port: 0 });
  stripe = new Stripe("sk_test_duffbank_payments", { host: "127.0.0.1", port: fake.port, protocol: "http" });
});
afterAll(() => fake.close());

/** A no-show deposit the way Duffbank takes one: Checkout with a manual-capture intent. */
async function heldDeposit(amount = 1000) {
  const session = await stripe.checkout.sessions.create({
    mode: "payment",
    line_items: [{ price_data: { currency: "gbp", unit_amount: amount, product_data: { name: "No-show deposit" } }, quantity: 1 }],
    success_url: "http://127.0.0.1:3000/ok",
    payment_intent_data: { capture_method: "manual", metadata: { reservation_id: "r_9" } },
  });
  expect((await submitHostedPayment(session.url!)).status).toBe(303);
  const after = await stripe.checkout.sessions.retrieve(session.id);
  return { session: after, pi: await stripe.paymentIntents.retrieve(after.payment_intent as string) };
}

async function paidIntent(amount = 2500) {
  const pi = await stripe.paymentIntents.create({ amount, currency: "gbp", payment_method: "pm_card_visa", confirm: true });
  expect(pi.status).toBe("succeeded");
  return pi;
}

describe("manual capture (deposits)", () => {
  it("puts a hold on payment, leaves the session unpaid, then captures", async () => {
    const { session, pi } = await heldDeposit();
    expect(session.status).toBe("complete");
    expect(session.payment_status).toBe("unpaid");
    expect(pi).toMatchObject({
      status: "requires_capture",
      capture_method: "manual",
      amount_capturable: 1000,
      amount_received: 0,
      metadata: { reservation_id: "r_9" },
    });

    const captured = await stripe.paymentIntents.capture(pi.id, { amount_to_capture: 600 });
    expect(captured).toMatchObject({ status: "succeeded", amount_received: 600, amount_capturable: 0 });
    const charge = await stripe.charges.retrieve(captured.latest_charge as string);
    expect(charge).toMatchObject({ captured: true, amount_captured: 600 });

    await expect(stripe.paymentIntents.capture(pi.id)).rejects.toMatchObject({
      type: "StripeInvalidRequestError",
      code: "payment_intent_unexpected_state",
    });
  });

  it("refuses to capture more than is held", async () => {
    const { pi } = await heldDeposit(1000);
    await expect(stripe.paymentIntents.capture(pi.id, { amount_to_capture: 1001 })).rejects.toMatchObject({
      param: "amount_to_capture",
    });
    expect((await stripe.paymentIntents.retrieve(pi.id)).status).toBe("requires_capture");
  });

  it("releases a hold on cancel", async () => {
    const { pi } = await heldDeposit();
    const canceled = await stripe.paymentIntents.cancel(pi.id, { cancellation_reason: "requested_by_customer" });
    expect(canceled).toMatchObject({ status: "canceled", amount_capturable: 0, cancellation_reason: "requested_by_customer" });
    expect(canceled.canceled_at).toEqual(expect.any(Number));
    expect(await stripe.charges.retrieve(canceled.latest_charge as string)).toMatchObject({ refunded: true, amount_refunded: 1000 });
    await expect(stripe.paymentIntents.capture(pi.id)).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
  });
});

describe("PaymentIntents through the API", () => {
  it("starts in requires_payment_method and can be cancelled there", async () => {
    const pi = await stripe.paymentIntents.create({ amount: 500, currency: "gbp", capture_method: "manual", metadata: { k: "v" } });
    expect(pi).toMatchObject({ object: "payment_intent", status: "requires_payment_method", livemode: false, metadata: { k: "v" } });
    expect(pi.client_secret).toMatch(new RegExp(`^${pi.id}_secret_`));
    expect((await stripe.paymentIntents.cancel(pi.id)).status).toBe("canceled");
  });

  it("cannot cancel a succeeded intent", async () => {
    const pi = await paidIntent();
    await expect(stripe.paymentIntents.cancel(pi.id)).rejects.toMatchObject({
      type: "StripeInvalidRequestError",
      statusCode: 400,
      code: "payment_intent_unexpected_state",
    });
  });

  it("throws a card error for a declining test payment method", async () => {
    const pi = await stripe.paymentIntents.create({ amount: 500, currency: "gbp" });
    const err = await stripe.paymentIntents.confirm(pi.id, { payment_method: "pm_card_visa_chargeDeclinedInsufficientFunds" }).catch((e) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(err).toMatchObject({ statusCode: 402, code: "card_declined", decline_code: "insufficient_funds" });
    expect((await stripe.paymentIntents.retrieve(pi.id)).status).toBe("requires_payment_method");
  });

  it("will not cancel a Checkout-made intent that is not on hold", async () => {
    const session = await stripe.checkout.sessions.create({
      mode: "payment",
      line_items: [{ price_data: { currency: "gbp", unit_amount: 800, product_data: { name: "Worms" } }, quantity: 1 }],
      success_url: "http://127.0.0.1:3000/ok",
    });
    await submitHostedPayment(session.url!, { card_number: "4000000000000002" });
    const piId = (await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string;
    await expect(stripe.paymentIntents.cancel(piId)).rejects.toMatchObject({ code: "payment_intent_unexpected_state" });
  });

  it("answers 404 in Stripe's shape for an unknown id", async () => {
    await expect(stripe.paymentIntents.retrieve("pi_missing")).rejects.toMatchObject({
      type: "StripeInvalidRequestError",
      statusCode: 404,
      code: "resource_missing",
      message: "No such payment_intent: 'pi_missing'",
    });
  });
});

describe("refunds", () => {
  it("refunds part, then the rest, then refuses more", async () => {
    const pi = await paidIntent(2500);
    const part = await stripe.refunds.create({ payment_intent: pi.id, amount: 1000, reason: "requested_by_customer" });
    expect(part.id).toMatch(/^re_/);
    expect(part).toMatchObject({ object: "refund", amount: 1000, status: "succeeded", payment_intent: pi.id });
    expect(await stripe.refunds.retrieve(part.id)).toMatchObject({ id: part.id, amount: 1000 });

    const overRefund = await stripe.refunds.create({ payment_intent: pi.id, amount: 1501 }).catch((e) => e);
    expect(overRefund).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(overRefund).toMatchObject({ code: "amount_too_large", statusCode: 400 });
    expect(overRefund.message).toBe("Refund amount (£15.01) is greater than unrefunded amount on charge (£15.00)");

    const rest = await stripe.refunds.create({ payment_intent: pi.id });
    expect(rest.amount).toBe(1500);
    const charge = await stripe.charges.retrieve(pi.latest_charge as string);
    expect(charge).toMatchObject({ amount_refunded: 2500, refunded: true });
    await expect(stripe.refunds.create({ payment_intent: pi.id })).rejects.toMatchObject({ code: "charge_already_refunded" });
  });

  it("refunds only what was captured, and not a hold", async () => {
    const { pi } = await heldDeposit(1000);
    await expect(stripe.refunds.create({ payment_intent: pi.id })).rejects.toMatchObject({ param: "payment_intent" });
    await stripe.paymentIntents.capture(pi.id, { amount_to_capture: 400 });
    await expect(stripe.refunds.create({ payment_intent: pi.id, amount: 401 })).rejects.toMatchObject({ code: "amount_too_large" });
    expect((await stripe.refunds.create({ payment_intent: pi.id })).amount).toBe(400);
  });
});

describe("API keys", () => {
  const client = (key: string) => new Stripe(key, { host: "127.0.0.1", port: fake.port, protocol: "http" });

  it("throws an authentication error for a key that is not a test secret key", async () => {
    for (const key of ["sk_live_123456789", "pk_test_123456789", "nonsense"]) {
      const err = await client(key).paymentIntents.retrieve("pi_x").catch((e) => e);
      expect(err).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
      expect(err.statusCode).toBe(401);
      expect(err.raw.type).toBe("invalid_request_error");
    }
  });

  it("answers a request with no key at all with 401", async () => {
    const res = await fetch(`${fake.url}/v1/payment_intents/pi_x`);
    expect(res.status).toBe(401);
    expect((await res.json()).error).toMatchObject({ type: "invalid_request_error", message: expect.stringMatching(/did not provide an API key/) });
  });
});

describe("idempotency", () => {
  it("replays the first answer for the same key and parameters", async () => {
    const before = fake.state.paymentIntents.size;
    const params = { amount: 1200, currency: "gbp", metadata: { reservation_id: "r_42" } };
    const first = await stripe.paymentIntents.create(params, { idempotencyKey: "reserve-r_42" });
    const second = await stripe.paymentIntents.create(params, { idempotencyKey: "reserve-r_42" });
    expect(second.id).toBe(first.id);
    expect(second.lastResponse.headers["idempotent-replayed"]).toBe("true");
    expect(fake.state.paymentIntents.size).toBe(before + 1);
  });

  it("refuses the same key with different parameters", async () => {
    await stripe.paymentIntents.create({ amount: 1200, currency: "gbp" }, { idempotencyKey: "reserve-r_43" });
    const err = await stripe.paymentIntents.create({ amount: 1300, currency: "gbp" }, { idempotencyKey: "reserve-r_43" }).catch((e) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(err.statusCode).toBe(400);
    expect(err.type).toBe("StripeIdempotencyError");
  });

  it("does not save a rejected request, so the key can be used once it is fixed", async () => {
    await expect(stripe.paymentIntents.create({ amount: 10, currency: "gbp" }, { idempotencyKey: "reserve-r_44" })).rejects.toMatchObject({
      code: "amount_too_small",
    });
    const ok = await stripe.paymentIntents.create({ amount: 100, currency: "gbp" }, { idempotencyKey: "reserve-r_44" });
    expect(ok.status).toBe("requires_payment_method");
  });
});

describe("STRIPE_FAKE_DATA persistence", () => {
  it("keeps records across a restart when given a data file", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "stripe-fake-"));
    const dataFile = path.join(dir, "stripe.json");
    try {
      const first = await startStripeFake({ port: 0, dataFile });
      const client = new Stripe("sk_test_restart", { host: "127.0.0.1", port: first.port, protocol: "http" });
      const pi = await client.paymentIntents.create({ amount: 900, currency: "gbp", metadata: { reservation_id: "r_p" } });
      await first.close();

      const second = await startStripeFake({ port: 0, dataFile });
      const again = new Stripe("sk_test_restart", { host: "127.0.0.1", port: second.port, protocol: "http" });
      expect(await again.paymentIntents.retrieve(pi.id)).toMatchObject({ id: pi.id, amount: 900, metadata: { reservation_id: "r_p" } });
      expect((await again.paymentIntents.cancel(pi.id)).status).toBe("canceled");
      await second.close();
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

// The fake's Checkout Sessions and hosted page, driven through the official Stripe SDK
// and plain form posts, the way the app and a browser use them.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Stripe from "stripe";
import { startStripeFake, type StripeFake } from "@/lib/fakes/stripe/server";
import { TEST_CARDS, submitHostedPayment } from "@/lib/fakes/stripe/testing";

let fake: StripeFake;
let stripe: Stripe;
let clockMs = Date.now();

beforeAll(async () => {
  // A movable clock so expiry can be tested without waiting half an hour.
  fake = await startStripeFake({ port: 0, now: () => clockMs });
  stripe = new Stripe("sk_test_duffbank_checkout", { host: "127.0.0.1", port: fake.port, protocol: "http" });
});
afterAll(() => fake.close());

function newSession(extra: Partial<Stripe.Checkout.SessionCreateParams> = {}) {
  return stripe.checkout.sessions.create({
    mode: "payment",
    line_items: [
      { price_data: { currency: "gbp", unit_amount: 650, product_data: { name: "Straw bale" } }, quantity: 2 },
      { price_data: { currency: "gbp", unit_amount: 300, product_data: { name: "Delivery to the plot" } }, quantity: 1 },
    ],
    success_url: "http://127.0.0.1:3000/reservations/r_1/paid?session={CHECKOUT_SESSION_ID}",
    cancel_url: "http://127.0.0.1:3000/reservations/r_1",
    client_reference_id: "r_1",
    customer_email: "gardener@example.test",
    metadata: { reservation_id: "r_1" },
    ...extra,
  });
}

describe("the hosted page's content security policy", () => {
  it("lets the pay form's redirect reach the success_url origin, and nothing else", async () => {
    const session = await newSession({ success_url: "http://127.0.0.1:43999/reservations/paid?session_id={CHECKOUT_SESSION_ID}" });
    const res = await fetch(session.url!);
    // Chromium applies form-action to the 303 after the POST; without the app's origin it blocks the return.
    expect(res.headers.get("content-security-policy")).toContain("form-action 'self' http://127.0.0.1:43999;");
    expect(res.headers.get("content-security-policy")).toContain("default-src 'none'");
  });
});

describe("creating a Checkout Session", () => {
  it("returns an open, unpaid session whose url is the fake's own page", async () => {
    const session = await newSession();
    expect(session.id).toMatch(/^cs_test_/);
    expect(session).toMatchObject({
      object: "checkout.session",
      mode: "payment",
      status: "open",
      payment_status: "unpaid",
      amount_total: 1600,
      currency: "gbp",
      payment_intent: null,
      livemode: false,
      client_reference_id: "r_1",
      metadata: { reservation_id: "r_1" },
      url: `${fake.url}/pay/${session.id}`,
    });
    expect(session.expires_at - session.created).toBe(24 * 60 * 60);
    const again = await stripe.checkout.sessions.retrieve(session.id, { expand: ["line_items"] });
    expect(again.line_items?.data.map((li) => [li.description, li.quantity, li.amount_total])).toEqual([
      ["Straw bale", 2, 1300],
      ["Delivery to the plot", 1, 300],
    ]);
  });

  it("rejects what Stripe would reject", async () => {
    await expect(newSession({ mode: "subscription" })).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(newSession({ line_items: [] })).rejects.toMatchObject({ param: "line_items" });
    // Stripe's minimum charge in GBP is £0.30.
    await expect(
      newSession({ line_items: [{ price_data: { currency: "gbp", unit_amount: 20, product_data: { name: "Leaves" } }, quantity: 1 }] }),
    ).rejects.toMatchObject({ code: "amount_too_small" });
    await expect(newSession({ expires_at: Math.floor(clockMs / 1000) + 60 })).rejects.toMatchObject({ param: "expires_at" });
    await expect(newSession({ customer_creation: "always" })).rejects.toMatchObject({ param: "customer_creation" });
  });
});

describe("the hosted page", () => {
  it("is plainly Duffbank's local test checkout: outcomes to click, a labelled form, nothing loaded from elsewhere", async () => {
    const session = await newSession();
    const res = await fetch(session.url!);
    const html = await res.text();
    expect(res.status).toBe(200);
    expect(html).toContain("<h1>Duffbank's local test checkout</h1>");
    expect(html).toContain("no real money");
    // Each public test card is an outcome button that posts its number.
    for (const number of [TEST_CARDS.approved, TEST_CARDS.declined]) {
      expect(html).toContain(`name="card_number" value="${number.replace(/\s/g, "")}"`);
    }
    for (const [id, label] of [
      ["field-card_number", "Card number"],
      ["field-expiry", "Expiry (MM/YY)"],
      ["field-cvc", "CVC"],
      ["field-name", "Name on card"],
    ]) {
      expect(html).toContain(`<label for="${id}">${label}</label>`);
      expect(html).toContain(`<input id="${id}"`);
    }
    expect(html).toContain("Pay £16.00</button>");
    expect(html).toContain('<a class="back" href="http://127.0.0.1:3000/reservations/r_1">Cancel and go back</a>');
    expect(html).not.toMatch(/(src|href)="https?:\/\/(?!127\.0\.0\.1:3000)/);
  });

  it("takes 4242… and redirects to the success URL with the session id filled in", async () => {
    const session = await newSession();
    const result = await submitHostedPayment(session.url!, { card_number: TEST_CARDS.approved });
    expect(result.status).toBe(303);
    expect(result.location).toBe(`http://127.0.0.1:3000/reservations/r_1/paid?session=${session.id}`);

    const paid = await stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent"] });
    expect(paid.status).toBe("complete");
    expect(paid.payment_status).toBe("paid");
    expect(paid.url).toBeNull();
    const pi = paid.payment_intent as Stripe.PaymentIntent;
    expect(pi.id).toMatch(/^pi_/);
    expect(pi).toMatchObject({ status: "succeeded", amount: 1600, amount_received: 1600, capture_method: "automatic" });
    const charge = await stripe.charges.retrieve(pi.latest_charge as string);
    expect(charge).toMatchObject({ status: "succeeded", captured: true, amount_captured: 1600 });
    expect(charge.payment_method_details?.card?.last4).toBe("4242");

    // A paid session cannot be paid twice.
    const again = await submitHostedPayment(session.url!);
    expect(again.status).toBe(409);
  });

  it("shows a decline for 4000…0002, keeps the session open, and lets another card pay", async () => {
    const session = await newSession();
    const declined = await submitHostedPayment(session.url!, { card_number: TEST_CARDS.declined });
    expect(declined.status).toBe(402);
    expect(declined.location).toBeNull();
    expect(declined.html).toMatch(/<div class="alert" role="alert">The card was declined\. Nothing was charged/);

    const open = await stripe.checkout.sessions.retrieve(session.id);
    expect(open.status).toBe("open");
    expect(open.payment_status).toBe("unpaid");
    const pi = await stripe.paymentIntents.retrieve(open.payment_intent as string);
    expect(pi.status).toBe("requires_payment_method");
    expect(pi.last_payment_error).toMatchObject({ type: "card_error", code: "card_declined", decline_code: "generic_decline" });

    const retry = await submitHostedPayment(session.url!, { card_number: TEST_CARDS.approved });
    expect(retry.status).toBe(303);
    const done = await stripe.paymentIntents.retrieve(pi.id);
    expect(done.status).toBe("succeeded");
    expect(done.last_payment_error).toBeNull();
  });

  it("reports insufficient funds for 4000…9995", async () => {
    const session = await newSession();
    const result = await submitHostedPayment(session.url!, { card_number: "4000000000009995" });
    expect(result.status).toBe(402);
    expect(result.html).toMatch(/role="alert">The card was declined for insufficient funds/);
    const pi = await stripe.paymentIntents.retrieve((await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string);
    expect(pi.last_payment_error?.decline_code).toBe("insufficient_funds");
  });

  it("checks the fields and never takes a number that is not a test card", async () => {
    const session = await newSession();
    const result = await submitHostedPayment(session.url!, { card_number: "5105 1051 0510 5100", expiry: "01/20", cvc: "12" });
    expect(result.status).toBe(422);
    expect(result.html).toContain("Use one of Stripe&#39;s test card numbers");
    expect(result.html).toContain("That expiry date has passed");
    expect(result.html).toContain("The CVC is 3 or 4 digits.");
    expect(result.html).toContain('aria-describedby="field-cvc-error" aria-invalid="true"');
    // Nothing was attempted, so no PaymentIntent exists yet.
    expect((await stripe.checkout.sessions.retrieve(session.id)).payment_intent).toBeNull();
  });
});

describe("expiry", () => {
  it("expires on request, after which the page refuses payment", async () => {
    const session = await newSession();
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired).toMatchObject({ status: "expired", url: null });
    expect((await fetch(session.url!)).status).toBe(410);
    expect((await submitHostedPayment(session.url!)).status).toBe(409);
    await expect(stripe.checkout.sessions.expire(session.id)).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
  });

  it("expires by itself once expires_at passes, cancelling a half-tried intent", async () => {
    const session = await newSession({ expires_at: Math.floor(clockMs / 1000) + 31 * 60 });
    await submitHostedPayment(session.url!, { card_number: TEST_CARDS.declined });
    clockMs += 32 * 60 * 1000;
    const later = await stripe.checkout.sessions.retrieve(session.id);
    expect(later.status).toBe("expired");
    const pi = await stripe.paymentIntents.retrieve(later.payment_intent as string);
    expect(pi.status).toBe("canceled");
    const types = [...fake.state.events.values()].filter((e) => e.data.object.id === session.id).map((e) => e.type);
    expect(types).toEqual(["checkout.session.expired"]);
  });

  it("answers 404 for a session it never made", async () => {
    await expect(stripe.checkout.sessions.retrieve("cs_test_nope")).rejects.toMatchObject({
      type: "StripeInvalidRequestError",
      code: "resource_missing",
      statusCode: 404,
    });
    expect((await fetch(`${fake.url}/pay/cs_test_nope`)).status).toBe(404);
  });
});

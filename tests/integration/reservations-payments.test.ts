// Payments end to end against the Stripe fake: the app's own SDK calls, the hosted page
// paid with Stripe's test cards, and the fake's signed webhooks delivered to the app's
// webhook route. Reservation state follows the webhooks, never the browser's redirect.
import { describe, expect, it } from "vitest";
import { call, request } from "../helpers/http";
import { paymentsWorld } from "../helpers/payments";
import { createListing, createUser, listingQuantities } from "../factories";
import { TEST_CARDS, submitHostedPayment, validCard } from "@/lib/fakes/stripe/testing";
import { POST as reserve } from "@/app/api/reservations/route";
import { POST as confirm } from "@/app/api/reservations/[id]/confirm/route";
import { POST as decline } from "@/app/api/reservations/[id]/decline/route";
import { POST as cancel } from "@/app/api/reservations/[id]/cancel/route";
import { POST as collect } from "@/app/api/reservations/[id]/collect/route";
import { POST as noShow } from "@/app/api/reservations/[id]/no-show/route";
import { POST as checkout } from "@/app/api/reservations/[id]/checkout/route";
import { expireHolds } from "@/lib/services/reservations/expire-holds";
import { reconcilePayments } from "@/lib/payments/reconcile";
import { db } from "@/db/index";
import { deliverEvents } from "../helpers/webhook-events";
import { rendered } from "../helpers/outbox";

const world = paymentsWorld();

async function reserveOne(listingId: string, quantity = 2) {
  const res = await call(reserve, await request("/api/reservations", { body: { listing_id: listingId, quantity }, as: world.gardener.id }));
  expect(res.status).toBe(201);
  return res.json as { reservation: { id: string; status: string; hold_expires_at: string }; checkout_url?: string };
}
const act = async (handler: any, id: string, as: string, body?: unknown) => call(handler, await request(`/api/reservations/${id}/x`, { as, body: body ?? {} }), { id });
const reservation = (id: string) => db()("reservations").first("*").where({ id });
const charge = (id: string) => db()("payments").first("*").where({ reservation_id: id }).whereIn("kind", ["payment", "deposit"]);
const settle = () => world.pay.fake.webhooksIdle();

describe("a priced listing", () => {
  it("takes payment on the hosted page; the webhook (not the redirect) moves the reservation", async () => {
    const l = await createListing({ material_code: "straw", unit: "bales", price_cents: 450, quantity_total: 10 });
    const { reservation: r, checkout_url } = await reserveOne(l.id, 3);
    expect(checkout_url).toMatch(new RegExp(`^${world.pay.fake.url}/pay/cs_test_`));
    expect((await charge(r.id)).status).toBe("open");

    const session = [...world.pay.fake.state.checkoutSessions.values()].find((s) => s.metadata.reservation_id === r.id)!;
    expect(session.amount_total).toBe(1350); // 3 × €4.50 in integer cents
    expect(session.success_url).toContain("/reservations/paid?session_id={CHECKOUT_SESSION_ID}");

    // Before any webhook arrives, nothing has moved, whatever the browser was told.
    world.pay.fake.setWebhookUrl(null);
    const paid = await submitHostedPayment(checkout_url!, validCard(TEST_CARDS.approved));
    expect(paid.status).toBe(303);
    expect(paid.location).toContain(`session_id=${session.id}`);
    expect((await reservation(r.id)).payment_state).toBe("awaiting");

    // Re-deliver what the fake recorded: the state follows.
    const events = [...world.pay.fake.state.events.values()].filter((e) => (e.data.object as any).metadata?.reservation_id === r.id || (e.data.object as any).id === session.id);
    expect(events.length).toBeGreaterThanOrEqual(4);
    const answers = await deliverEvents(events);
    expect(answers.every((a) => a.status === 200)).toBe(true);
    const after = await reservation(r.id);
    expect(after).toMatchObject({ status: "held", payment_state: "paid" });
    // Paid: the supplier gets SUPPLIER_REPLY_HOURS (48 h) to answer, not the 30-minute hold.
    expect(new Date(after.hold_expires_at).getTime() - Date.now()).toBeGreaterThan(47 * 3_600_000);
    expect((await charge(r.id)).status).toBe("paid");
    const mail = await db()("email_outbox").where("dedupe_key", "like", `res:${r.id}:%`).pluck("template");
    expect(mail.sort()).toEqual(["reservation.receipt", "reservation.requested", "reservation.requested"]);

    const ok = await act(confirm, r.id, l.owner_id);
    expect(ok.status).toBe(200);
    expect(ok.json.reservation.status).toBe("confirmed");
    const code = (await reservation(r.id)).pickup_code;
    const done = await act(collect, r.id, l.owner_id, { pickup_code: code.toLowerCase() });
    expect(done.status).toBe(200);
    expect(done.json.reservation.status).toBe("collected");
    expect(await listingQuantities(l.id)).toMatchObject({ quantity_held: 0, quantity_collected: 3 });
    expect((await charge(r.id)).status).toBe("paid"); // a sale: nothing refunded
    expect(await reconcilePayments()).toEqual([]);
  });

  it("a declined card leaves the reservation awaiting payment, and the hold's expiry returns everything", async () => {
    const l = await createListing({ material_code: "straw", unit: "bales", price_cents: 450, quantity_total: 10 });
    const { reservation: r, checkout_url } = await reserveOne(l.id, 2);
    const declined = await submitHostedPayment(checkout_url!, { card_number: TEST_CARDS.declined });
    expect(declined.status).toBe(402);
    expect(declined.html).toContain("declined");
    const poor = await submitHostedPayment(checkout_url!, { card_number: TEST_CARDS.insufficientFunds });
    expect(poor.status).toBe(402);
    expect(poor.html).toContain("insufficient funds");
    await settle();
    expect(await reservation(r.id)).toMatchObject({ status: "held", payment_state: "awaiting" });
    expect((await charge(r.id)).last_error).toMatch(/declined|insufficient/i);
    // The supplier cannot accept an unpaid reservation.
    expect((await act(confirm, r.id, l.owner_id)).status).toBe(409);

    const later = new Date(new Date(r.hold_expires_at).getTime() + 1000);
    expect(await expireHolds({ clock: () => later })).toEqual({ expired: 1 });
    await settle();
    expect((await reservation(r.id)).status).toBe("expired");
    expect((await listingQuantities(l.id)).quantity_held).toBe(0);
    const session = world.pay.fake.state.checkoutSessions.get((await charge(r.id)).provider_ref)!;
    expect(session.status).toBe("expired");
    expect((await charge(r.id)).status).toBe("expired");
    // The old link no longer takes money.
    expect((await submitHostedPayment(checkout_url!)).status).toBe(409);
    expect(await reconcilePayments()).toEqual([]);
  });

  it("a supplier's decline refunds the payment in full", async () => {
    const l = await createListing({ material_code: "worms", unit: "kg", price_cents: 3200, quantity_total: 5 });
    const { reservation: r, checkout_url } = await reserveOne(l.id, 0.5);
    await submitHostedPayment(checkout_url!);
    await settle();
    expect((await reservation(r.id)).payment_state).toBe("paid");
    const res = await act(decline, r.id, l.owner_id, { reason: "Sold out at the market" });
    expect(res.status).toBe(200);
    await settle();
    const refund = await db()("payments").first("*").where({ reservation_id: r.id, kind: "refund" });
    expect(refund).toMatchObject({ status: "succeeded", amount_cents: 1600, pending_action: null });
    expect(world.pay.fake.state.refunds.get(refund.provider_ref)!.amount).toBe(1600);
    expect(await reservation(r.id)).toMatchObject({ status: "declined", payment_state: "refunded" });
    expect((await charge(r.id)).status).toBe("refunded");
    const mail = rendered(await db()("email_outbox").first("*").where({ dedupe_key: `res:${r.id}:declined:gardener` }));
    expect(mail.text_body).toContain("refunded in full");
    expect(mail.text_body).toContain("Sold out at the market");
    expect(await reconcilePayments()).toEqual([]);
  });

  it("a late gardener cancellation keeps the payment; a timely one refunds it", async () => {
    const l = await createListing({ material_code: "straw", unit: "bales", price_cents: 450, quantity_total: 10, auto_accept: true });
    const early = await reserveOne(l.id, 1);
    await submitHostedPayment(early.checkout_url!);
    await settle();
    expect((await reservation(early.reservation.id)).status).toBe("confirmed"); // auto-accept after payment
    await db()("reservations").where({ id: early.reservation.id }).update({ pickup_at: new Date(Date.now() + 3 * 86_400_000).toISOString() });
    expect((await act(cancel, early.reservation.id, world.gardener.id)).status).toBe(200);
    await settle();
    expect((await reservation(early.reservation.id)).payment_state).toBe("refunded");

    const late = await reserveOne(l.id, 1);
    await submitHostedPayment(late.checkout_url!);
    await settle();
    await db()("reservations").where({ id: late.reservation.id }).update({ pickup_at: new Date(Date.now() + 3_600_000).toISOString() });
    expect((await act(cancel, late.reservation.id, world.gardener.id)).status).toBe(200);
    await settle();
    expect((await reservation(late.reservation.id)).payment_state).toBe("paid");
    expect(await db()("payments").where({ reservation_id: late.reservation.id, kind: "refund" })).toHaveLength(0);
    expect((await listingQuantities(l.id)).quantity_held).toBe(0);
  });
});

describe("a deposit on a free listing", () => {
  it("is an authorisation hold, released on collection", async () => {
    const l = await createListing({ deposit_cents: 200, quantity_total: 6 });
    const { reservation: r, checkout_url } = await reserveOne(l.id, 2);
    const session = world.pay.fake.state.checkoutSessions.get((await charge(r.id)).provider_ref)!;
    expect(world.pay.fake.state.sessionIntentTemplates.get(session.id)!.capture_method).toBe("manual");
    await submitHostedPayment(checkout_url!);
    await settle();
    expect(await reservation(r.id)).toMatchObject({ status: "held", payment_state: "authorised" });
    const intent = world.pay.fake.state.paymentIntents.get((await charge(r.id)).payment_intent_id)!;
    expect(intent).toMatchObject({ status: "requires_capture", amount_capturable: 200 });

    await act(confirm, r.id, l.owner_id);
    expect((await act(collect, r.id, l.owner_id, {})).status).toBe(200);
    await settle();
    expect(world.pay.fake.state.paymentIntents.get(intent.id)!.status).toBe("canceled");
    expect(await reservation(r.id)).toMatchObject({ status: "collected", payment_state: "released" });
    expect((await charge(r.id)).status).toBe("released");
    expect(await reconcilePayments()).toEqual([]);
  });

  it("is captured on a no-show, once the pickup time has passed", async () => {
    const l = await createListing({ deposit_cents: 300, quantity_total: 6 });
    const { reservation: r, checkout_url } = await reserveOne(l.id, 1);
    await submitHostedPayment(checkout_url!);
    await settle();
    await act(confirm, r.id, l.owner_id);
    // Too early: the pickup week has not ended.
    const early = await act(noShow, r.id, l.owner_id);
    expect(early.status).toBe(409);
    expect(early.json.error.code).toBe("invalid_state");
    await db()("reservations").where({ id: r.id }).update({ pickup_by: new Date(Date.now() - 60_000).toISOString() });
    const res = await act(noShow, r.id, l.owner_id);
    expect(res.status).toBe(200);
    await settle();
    const intent = world.pay.fake.state.paymentIntents.get((await charge(r.id)).payment_intent_id)!;
    expect(intent).toMatchObject({ status: "succeeded", amount_received: 300 });
    expect(await reservation(r.id)).toMatchObject({ status: "no_show", payment_state: "captured" });
    expect((await charge(r.id)).captured_cents).toBe(300);
    expect((await listingQuantities(l.id)).quantity_held).toBe(0);
    const mail = rendered(await db()("email_outbox").first("*").where({ dedupe_key: `res:${r.id}:no_show:gardener` }));
    expect(mail.text_body).toContain("deposit is kept");
    expect(await reconcilePayments()).toEqual([]);
  });

  it("is released on a timely cancellation and captured on a late one", async () => {
    const l = await createListing({ deposit_cents: 200, quantity_total: 6, auto_accept: true });
    const ids: string[] = [];
    for (const hoursAhead of [72, 2]) {
      const { reservation: r, checkout_url } = await reserveOne(l.id, 1);
      await submitHostedPayment(checkout_url!);
      await settle();
      await db()("reservations").where({ id: r.id }).update({ pickup_at: new Date(Date.now() + hoursAhead * 3_600_000).toISOString() });
      expect((await act(cancel, r.id, world.gardener.id)).status).toBe(200);
      ids.push(r.id);
    }
    await settle();
    expect((await reservation(ids[0])).payment_state).toBe("released");
    expect((await reservation(ids[1])).payment_state).toBe("captured");
    expect(await reconcilePayments()).toEqual([]);
  });
});

describe("resuming a checkout", () => {
  it("gives the same open session again, and nothing once paid", async () => {
    const l = await createListing({ price_cents: 150, quantity_total: 10 });
    const { reservation: r, checkout_url } = await reserveOne(l.id, 1);
    const again = await call(checkout, await request(`/api/reservations/${r.id}/checkout`, { as: world.gardener.id, body: {} }), { id: r.id });
    expect(again.json.checkout_url).toBe(checkout_url);
    const stranger = await createUser({ roles: ["gardener"] });
    expect((await call(checkout, await request(`/api/reservations/${r.id}/checkout`, { as: stranger.id, body: {} }), { id: r.id })).status).toBe(404);
    await submitHostedPayment(checkout_url!);
    await settle();
    expect((await call(checkout, await request(`/api/reservations/${r.id}/checkout`, { as: world.gardener.id, body: {} }), { id: r.id })).status).toBe(409);
  });
});

describe("reconciliation", () => {
  it("notices a payments row that disagrees with Stripe", async () => {
    const row = await db()("payments").first("id").where({ status: "paid" });
    await db()("payments").where({ id: row.id }).update({ amount_cents: 1 });
    const problems = await reconcilePayments();
    expect(problems.map((p) => p.payment_id)).toContain(row.id);
  });
});

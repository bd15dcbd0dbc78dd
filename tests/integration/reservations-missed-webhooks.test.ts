// When Stripe's webhooks never arrive: every delivery fails (the endpoint down, or
// misconfigured), and the app must still learn what happened from Stripe's own record.
// A checkout paid after its hold ended gets its money back; a paid checkout whose events
// were lost is picked up by the worker before the hold runs out; and a failure inside the
// webhook's transaction is never mistaken for a repeat of an event.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { startPayments, type PaymentsHarness } from "../helpers/payments";
import { deliverEvents, signedWebhook } from "../helpers/webhook-events";
import { createListing, createUser, listingQuantities } from "../factories";
import { submitHostedPayment } from "@/lib/fakes/stripe/testing";
import { POST as reserve } from "@/app/api/reservations/route";
import { expireHolds } from "@/lib/services/reservations/expire-holds";
import { applyStripeEvent } from "@/lib/services/payments/apply-stripe-event";
import { isUniqueViolation } from "@/db/dialect";
import { RECHECK_MINUTES, RECOVER_AFTER_MINUTES, reconcilePayments } from "@/lib/payments/reconcile";
import { SUPPLIER_REPLY_HOURS } from "@/lib/reservations/policy";
import { jobs } from "@/lib/worker/jobs";
import { db } from "@/db/index";
import { rendered } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let pay: PaymentsHarness;
let gardener: { id: string };

// Nothing listens here: every delivery is refused, retried and finally given up.
const DEAD_ENDPOINT = "http://127.0.0.1:9/api/webhooks/stripe";

beforeAll(async () => {
  ctx = await freshDb();
  pay = await startPayments();
  gardener = await createUser({ roles: ["gardener"] });
});
afterAll(async () => {
  await pay.close();
  await ctx.close();
});
beforeEach(() => pay.fake.setWebhookUrl(DEAD_ENDPOINT));

const minutes = (n: number) => n * 60_000;
const reservation = (id: string) => db()("reservations").first("*").where({ id });
const charge = (id: string) => db()("payments").first("*").where({ reservation_id: id }).whereIn("kind", ["payment", "deposit"]);
const mailKeys = async (id: string) => (await db()("email_outbox").where("dedupe_key", "like", `res:${id}:%`).pluck("dedupe_key")).map((k: string) => k.replace(id, "ID")).sort();
const eventsAbout = (reservationId: string, sessionId: string) =>
  [...pay.fake.state.events.values()].filter((e) => (e.data.object as any).metadata?.reservation_id === reservationId || (e.data.object as any).id === sessionId);

/** Reserves and pays on the hosted page while every webhook delivery fails. */
async function paidButUnheard(opts: { price_cents?: number; deposit_cents?: number }) {
  const l = await createListing({ unit: "bales", quantity_total: 10, ...opts });
  const res = await call(reserve, await request("/api/reservations", { body: { listing_id: l.id, quantity: 2 }, as: gardener.id }));
  expect(res.status).toBe(201);
  const r = res.json.reservation as { id: string; hold_expires_at: string; created_at: string };
  expect((await submitHostedPayment(res.json.checkout_url)).status).toBe(303);
  await pay.fake.webhooksIdle();
  const row = await charge(r.id);
  // Stripe has the money; every delivery failed, so Duffbank has heard nothing.
  expect(pay.fake.state.checkoutSessions.get(row.provider_ref)!.status).toBe("complete");
  expect(pay.fake.state.deliveries.filter((d) => d.url === DEAD_ENDPOINT && (d.type === "checkout.session.completed")).length).toBeGreaterThan(1);
  expect(row.status).toBe("open");
  expect((await reservation(r.id)).payment_state).toBe("awaiting");
  return { r, listing: l, sessionId: row.provider_ref as string };
}

describe("a checkout paid but never heard of, when its hold runs out", () => {
  it("refunds a payment in full and tells the gardener", async () => {
    const { r, listing, sessionId } = await paidButUnheard({ price_cents: 450 });
    expect(await expireHolds({ clock: () => new Date(new Date(r.hold_expires_at).getTime() + 1000) })).toEqual({ expired: 1 });
    await pay.fake.webhooksIdle();

    expect(await reservation(r.id)).toMatchObject({ status: "expired", payment_state: "refunded" });
    expect(await listingQuantities(listing.id)).toMatchObject({ quantity_held: 0 });
    const paid = await charge(r.id);
    expect(paid).toMatchObject({ status: "refunded", captured_cents: 900, refunded_cents: 900, pending_action: null });
    const refund = await db()("payments").first("*").where({ reservation_id: r.id, kind: "refund" });
    expect(refund).toMatchObject({ status: "succeeded", amount_cents: 900, pending_action: null });
    // The money really went back on Stripe's side, once.
    const stripeRefunds = [...pay.fake.state.refunds.values()].filter((x) => x.payment_intent === paid.payment_intent_id);
    expect(stripeRefunds.map((x) => x.amount)).toEqual([900]);
    expect(pay.fake.state.checkoutSessions.get(sessionId)!.status).toBe("complete");

    const returned = rendered(await db()("email_outbox").first("*").where({ dedupe_key: `res:${r.id}:returned:gardener` }));
    expect(returned.text_body).toContain("refunded in full");
    expect(await reconcilePayments()).toEqual([]);

    // The lost events turning up after all (Stripe retries for days) change nothing.
    const before = { r: await reservation(r.id), mail: await mailKeys(r.id) };
    const answers = await deliverEvents(eventsAbout(r.id, sessionId));
    expect(answers.every((a) => a.status === 200)).toBe(true);
    expect(await reservation(r.id)).toEqual(before.r);
    expect(await mailKeys(r.id)).toEqual(before.mail);
    expect(await db()("payments").where({ reservation_id: r.id, kind: "refund" })).toHaveLength(1);
  });

  it("releases a deposit hold and tells the gardener", async () => {
    const { r, sessionId } = await paidButUnheard({ deposit_cents: 200 });
    const intentId = pay.fake.state.checkoutSessions.get(sessionId)!.payment_intent!;
    expect(pay.fake.state.paymentIntents.get(intentId)!.status).toBe("requires_capture");

    expect(await expireHolds({ clock: () => new Date(new Date(r.hold_expires_at).getTime() + 1000) })).toEqual({ expired: 1 });
    await pay.fake.webhooksIdle();

    expect(pay.fake.state.paymentIntents.get(intentId)!).toMatchObject({ status: "canceled", amount_received: 0 });
    expect(await reservation(r.id)).toMatchObject({ status: "expired", payment_state: "released" });
    expect(await charge(r.id)).toMatchObject({ status: "released", payment_intent_id: intentId, pending_action: null });
    const returned = rendered(await db()("email_outbox").first("*").where({ dedupe_key: `res:${r.id}:returned:gardener` }));
    expect(returned.text_body).toContain("deposit hold on your card is released");
    expect(await reconcilePayments()).toEqual([]);
  });
});

describe("the worker's settle-payments job", () => {
  const settle = jobs.find((j) => j.name === "settle-payments")!;

  it("finds a paid checkout whose webhooks were lost, before the hold runs out", async () => {
    const { r, sessionId } = await paidButUnheard({ price_cents: 450 });
    const t0 = new Date(r.created_at).getTime();

    // Too soon to ask: Stripe is normally heard from within seconds.
    await settle.run({ clock: () => new Date(t0 + minutes(RECOVER_AFTER_MINUTES) - 30_000) });
    expect((await charge(r.id)).status).toBe("open");

    const at = new Date(t0 + minutes(RECOVER_AFTER_MINUTES) + 1000);
    expect(await settle.run({ clock: () => at })).toMatchObject({ checked: 1, changed: 1 });
    const after = await reservation(r.id);
    // Exactly what the webhook would have done: paid, and the supplier now has 48 hours.
    expect(after).toMatchObject({ status: "held", payment_state: "paid" });
    expect(new Date(after.hold_expires_at).getTime()).toBe(at.getTime() + SUPPLIER_REPLY_HOURS * 3_600_000);
    expect(await charge(r.id)).toMatchObject({ status: "paid", captured_cents: 900 });
    expect(await mailKeys(r.id)).toEqual(["res:ID:receipt:gardener", "res:ID:requested:gardener", "res:ID:requested:supplier"]);
    const history = await db()("reservation_events").where({ reservation_id: r.id }).pluck("note");
    expect(history.filter((n: string | null) => n === "Payment received")).toHaveLength(1);

    // The real events arriving late, and the job running again, are both no-ops.
    await deliverEvents(eventsAbout(r.id, sessionId));
    expect(await settle.run({ clock: () => new Date(at.getTime() + minutes(10)) })).toMatchObject({ checked: 0, changed: 0 });
    expect(await mailKeys(r.id)).toEqual(["res:ID:receipt:gardener", "res:ID:requested:gardener", "res:ID:requested:supplier"]);
    expect(await db()("payments").where({ reservation_id: r.id })).toHaveLength(1);
    expect(await reconcilePayments()).toEqual([]);
  });

  it("leaves an unpaid checkout open, and asks about it again only every few minutes", async () => {
    // Clear out open checkouts earlier tests left, so the counts below are this test's own.
    await db()("payments").where({ status: "open" }).update({ status: "expired" });
    const l = await createListing({ price_cents: 300, quantity_total: 5 });
    const res = await call(reserve, await request("/api/reservations", { body: { listing_id: l.id, quantity: 1 }, as: gardener.id }));
    const id = res.json.reservation.id as string;
    const t0 = new Date(res.json.reservation.created_at).getTime() + minutes(RECOVER_AFTER_MINUTES) + 1000;
    expect(await settle.run({ clock: () => new Date(t0) })).toMatchObject({ checked: 1, changed: 0 });
    expect(await settle.run({ clock: () => new Date(t0 + minutes(RECHECK_MINUTES) - 1000) })).toMatchObject({ checked: 0 });
    expect(await settle.run({ clock: () => new Date(t0 + minutes(RECHECK_MINUTES) + 1000) })).toMatchObject({ checked: 1, changed: 0 });
    expect(await charge(id)).toMatchObject({ status: "open" });
    expect(await reservation(id)).toMatchObject({ status: "held", payment_state: "awaiting" });
  });
});

describe("telling a repeated event from a failure", () => {
  it("does not call a different constraint failure a duplicate: the event is refused and kept for Stripe's retry", async () => {
    const { r, sessionId } = await paidButUnheard({ price_cents: 450 });
    const completed = eventsAbout(r.id, sessionId).find((e) => e.type === "checkout.session.completed")!;
    // A unique rule the event's own effects break: the history row it writes already exists.
    await db()("reservation_events").insert({ reservation_id: r.id, from_status: "held", to_status: "held", actor_id: null, note: "Payment received", created_at: new Date().toISOString() });
    await db().raw("CREATE UNIQUE INDEX test_one_note_each ON reservation_events (reservation_id, note)");
    try {
      await expect(applyStripeEvent(completed as any)).rejects.toSatisfy(isUniqueViolation);
      const answer = await signedWebhook(completed);
      expect(answer.status).toBe(500); // so Stripe delivers it again
      expect(await db()("webhook_events").where({ id: completed.id })).toHaveLength(0);
      expect(await reservation(r.id)).toMatchObject({ payment_state: "awaiting" });
    } finally {
      await db().raw("DROP INDEX test_one_note_each");
    }
    await db()("reservation_events").where({ reservation_id: r.id, note: "Payment received" }).del();

    // Stripe's retry, once the fault is gone, applies it; a true repeat is still a duplicate.
    expect((await signedWebhook(completed)).json.outcome).toBe("applied");
    expect((await signedWebhook(completed)).json.outcome).toBe("duplicate");
    expect(await reservation(r.id)).toMatchObject({ payment_state: "paid" });
  });
});

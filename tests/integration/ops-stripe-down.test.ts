// Reserving while Stripe is unreachable: the request answers in seconds, the reservation says
// plainly that it is held and the payment could not be opened, the supplier hears nothing,
// and the worker opens the checkout once Stripe is back and tells the gardener. Calls owed to
// Stripe go out as soon as it answers again, and a reservation that ends with its checkout
// never paid says "unpaid", not "awaiting".
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { startPayments, type PaymentsHarness } from "../helpers/payments";
import { closedPort, startSilentServer } from "../helpers/ports";
import { bookAs, createGiveaway, createListing, createUser, listingQuantities } from "../factories";
import { submitHostedPayment } from "@/lib/fakes/stripe/testing";
import { POST as reserve } from "@/app/api/reservations/route";
import { GET as getOne } from "@/app/api/reservations/[id]/route";
import { POST as checkout } from "@/app/api/reservations/[id]/checkout/route";
import { POST as cancel } from "@/app/api/reservations/[id]/cancel/route";
import { POST as decline } from "@/app/api/reservations/[id]/decline/route";
import { runPaymentActions } from "@/lib/services/payments/settle-payment";
import { settlePayments } from "@/lib/services/payments/settle-due-payments";
import { DEFAULT_STRIPE_TIMEOUT_MS, resetStripe } from "@/lib/payments/stripe";
import { expireHolds } from "@/lib/services/reservations/expire-holds";
import { rendered } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let pay: PaymentsHarness;
let gardener: string;
// A server that takes Stripe's connections and never answers.
let silent: Awaited<ReturnType<typeof startSilentServer>>;

beforeAll(async () => {
  ctx = await freshDb();
  pay = await startPayments();
  gardener = (await createUser({ roles: ["gardener"] })).id;
  silent = await startSilentServer();
});
afterAll(async () => {
  await silent.close();
  await pay.close();
  await ctx.close();
});

function stripeAt(port: number) {
  process.env.STRIPE_FAKE_PORT = String(port);
  resetStripe();
}
const stripeHangs = () => stripeAt(silent.port);
const stripeBack = () => stripeAt(pay.fake.port);

const reserveStraw = async (quantity = 2) => {
  const l = await createListing({ material_code: "straw", unit: "bales", price_cents: 450, quantity_total: 10 });
  const res = await call(reserve, await request("/api/reservations", { body: { listing_id: l.id, quantity }, as: gardener }));
  return { l, res };
};
const view = async (id: string, as = gardener) => (await call(getOne, await request(`/api/reservations/${id}`, { as }), { id })).json.reservation;
const mailFor = (reservationId: string) => ctx.db("email_outbox").where("dedupe_key", "like", `res:${reservationId}:%`).pluck("dedupe_key");
const charge = (reservationId: string) => ctx.db("payments").first("*").where({ reservation_id: reservationId }).whereIn("kind", ["payment", "deposit"]);

describe("reserving a priced listing while Stripe takes the connection and never answers", () => {
  it("answers in seconds: held, payment not opened, nothing told to the supplier", async () => {
    stripeHangs();
    const started = Date.now();
    const { l, res } = await reserveStraw();
    const took = Date.now() - started;
    expect(took).toBeLessThan(DEFAULT_STRIPE_TIMEOUT_MS + 3000);
    expect(res.status).toBe(201);
    expect(res.json.checkout_url).toBeUndefined();
    const r = res.json.reservation;
    expect(r).toMatchObject({ status: "held", can_pay: true, payment: { state: "awaiting", checkout: "not_opened", checkout_url: null } });
    expect(r.payment.notice).toMatch(/^Held for 30 min — payment could not be opened, try again\./);
    expect(await listingQuantities(l.id)).toMatchObject({ quantity_held: 2 });
    expect(await mailFor(r.id)).toEqual([]); // neither "requested" to the supplier nor anything else yet
    expect(await charge(r.id)).toMatchObject({ status: "creating", pending_action: "open", waiting_for: "stripe", action_attempts: 1 });
    // The supplier's side says what is going on too, and offers nothing to accept.
    expect((await view(r.id, l.owner_id)).actions).not.toContain("confirm");
  }, 30_000);

  it("waits out one timeout for a whole \"Reserve all\", not one per listing", async () => {
    stripeHangs();
    const listings = await Promise.all([0, 1, 2].map(() => createListing({ material_code: "straw", unit: "bales", price_cents: 450, quantity_total: 10 })));
    const started = Date.now();
    const res = await call(reserve, await request("/api/reservations", { body: { items: listings.map((l) => ({ listing_id: l.id, quantity: 1 })) }, as: gardener }));
    expect(Date.now() - started).toBeLessThan(DEFAULT_STRIPE_TIMEOUT_MS + 3000);
    expect(res.status).toBe(201);
    expect(res.json.reservations.map((r: { payment: { checkout: string } }) => r.payment.checkout)).toEqual(["not_opened", "not_opened", "not_opened"]);
    const rows = await ctx.db("payments").whereIn("reservation_id", res.json.reservations.map((r: { id: string }) => r.id));
    expect(rows.every((p: { pending_action: string; waiting_for: string }) => p.pending_action === "open" && p.waiting_for === "stripe")).toBe(true);
  }, 30_000);

  it("lets the gardener try again: refused plainly while Stripe is away, the payment page once it is back", async () => {
    stripeAt(await closedPort()); // refused at once this time
    const { res } = await reserveStraw(1);
    const id = res.json.reservation.id;
    const again = await call(checkout, await request(`/api/reservations/${id}/checkout`, { as: gardener, body: {} }), { id });
    expect(again.status).toBe(409);
    expect(again.json.error.message).toMatch(/could not be opened.*e-mail you/);
    stripeBack();
    const ok = await call(checkout, await request(`/api/reservations/${id}/checkout`, { as: gardener, body: {} }), { id });
    expect(ok.status).toBe(200);
    expect(ok.json.checkout_url).toMatch(/\/pay\/cs_test_/);
    expect((await charge(id)).pending_action).toBeNull();
    expect((await view(id)).payment).toMatchObject({ checkout: "open", notice: null });
  }, 30_000);

  it("is opened by the worker once Stripe answers, with the hold renewed and the gardener e-mailed", async () => {
    stripeHangs();
    const { l, res } = await reserveStraw();
    const id = res.json.reservation.id;
    const pending = await charge(id);
    stripeBack();
    // Before its backoff is over: Stripe answering again is what makes it due.
    const now = new Date();
    expect(new Date(pending.next_action_at).getTime()).toBeGreaterThan(now.getTime());
    const done = await settlePayments({ clock: () => now });
    expect(done.done).toBeGreaterThanOrEqual(1);
    expect(await charge(id)).toMatchObject({ status: "open", pending_action: null, waiting_for: null, last_error: null });
    const v = await view(id);
    expect(v.payment).toMatchObject({ checkout: "open", notice: null });
    expect(new Date(v.hold_expires_at).getTime()).toBeGreaterThanOrEqual(now.getTime() + 30 * 60_000); // a full hold from the opening
    expect(await mailFor(id)).toEqual([`res:${id}:payment_ready:gardener`]);
    const ready = rendered(await ctx.db("email_outbox").first().where({ dedupe_key: `res:${id}:payment_ready:gardener` }));
    expect(ready.subject).toMatch(/payment page is ready/);

    // Paying it goes on as usual: only now does the supplier hear of the request.
    const url = (await charge(id)).checkout_url;
    await submitHostedPayment(url);
    await pay.fake.webhooksIdle();
    expect((await mailFor(id)).sort()).toEqual([`res:${id}:payment_ready:gardener`, `res:${id}:receipt:gardener`, `res:${id}:requested:gardener`, `res:${id}:requested:supplier`]);
    expect((await view(id, l.owner_id)).actions).toContain("confirm");
  }, 30_000);
});

describe("calls owed to Stripe", () => {
  it("wait for Stripe rather than their backoff, and go out as soon as it answers", async () => {
    stripeBack();
    const { l, res } = await reserveStraw(1);
    const id = res.json.reservation.id;
    await submitHostedPayment((await charge(id)).checkout_url);
    await pay.fake.webhooksIdle();
    stripeAt(await closedPort());
    expect((await call(decline, await request(`/api/reservations/${id}/decline`, { as: l.owner_id, body: {} }), { id })).status).toBe(200);
    const refund = await ctx.db("payments").first("*").where({ reservation_id: id, kind: "refund" });
    expect(refund).toMatchObject({ pending_action: "refund", waiting_for: "stripe", action_attempts: 1 });
    stripeBack();
    expect(await settlePayments({ clock: () => new Date() })).toMatchObject({ done: 1, failed: 0 });
    expect(await ctx.db("payments").first("*").where({ id: refund.id })).toMatchObject({ pending_action: null, status: "succeeded" });
  }, 30_000);

  it("are not tried one timeout after another inside a request: after the first, the rest wait for Stripe", async () => {
    stripeBack();
    const ids: string[] = [];
    for (let i = 0; i < 3; i++) ids.push((await reserveStraw(1)).res.json.reservation.id);
    const charges = await Promise.all(ids.map(charge));
    // Three checkouts to close, as cancelling a batch would owe.
    for (const c of charges) await ctx.db("payments").where({ id: c.id }).update({ pending_action: "expire" });
    stripeHangs();
    const started = Date.now();
    await runPaymentActions(charges.map((c) => c.id));
    expect(Date.now() - started).toBeLessThan(DEFAULT_STRIPE_TIMEOUT_MS + 3000); // one timeout, not three
    const after = await ctx.db("payments").whereIn("id", charges.map((c) => c.id)).orderBy("action_attempts", "desc");
    expect(after.map((p: { action_attempts: number }) => p.action_attempts)).toEqual([1, 0, 0]);
    expect(after.every((p: { pending_action: string; waiting_for: string }) => p.pending_action === "expire" && p.waiting_for === "stripe")).toBe(true);
    stripeBack();
    expect(await settlePayments({ clock: () => new Date() })).toMatchObject({ done: 3, failed: 0 });
    for (const c of charges) expect((await ctx.db("payments").first("status", "pending_action").where({ id: c.id }))).toEqual({ status: "expired", pending_action: null });
  }, 30_000);

  it("are left alone by a worker that is stopping, and made by the next run", async () => {
    stripeAt(await closedPort());
    const { res } = await reserveStraw(1);
    const id = res.json.reservation.id;
    expect(await charge(id)).toMatchObject({ pending_action: "open", waiting_for: "stripe" });
    stripeBack();
    expect(await settlePayments({ signal: AbortSignal.abort() })).toEqual({ done: 0, failed: 0 });
    expect(await charge(id)).toMatchObject({ status: "creating", pending_action: "open" });
    expect(await settlePayments()).toMatchObject({ done: 1, failed: 0 });
    expect(await charge(id)).toMatchObject({ status: "open", pending_action: null });
  }, 30_000);
});

describe("a reservation that ends with its checkout unpaid", () => {
  it("says unpaid when cancelled, and the checkout is closed", async () => {
    stripeBack();
    const { res } = await reserveStraw(1);
    const id = res.json.reservation.id;
    expect((await call(cancel, await request(`/api/reservations/${id}/cancel`, { as: gardener, body: {} }), { id })).status).toBe(200);
    const v = await view(id);
    expect(v).toMatchObject({ status: "cancelled", payment: { state: "unpaid", checkout: "closed" } });
    expect(v.payment.notice).toMatch(/Nothing was paid/);
    expect((await charge(id)).status).toBe("expired");
  });

  it("says unpaid when the hold runs out, whether or not the checkout had opened", async () => {
    stripeBack();
    const opened = (await reserveStraw(1)).res.json.reservation.id;
    stripeAt(await closedPort());
    const neverOpened = (await reserveStraw(1)).res.json.reservation.id;
    stripeBack();
    await expireHolds({ clock: () => new Date(Date.now() + 31 * 60_000) });
    for (const id of [opened, neverOpened]) {
      expect(await ctx.db("reservations").first("status", "payment_state").where({ id })).toEqual({ status: "expired", payment_state: "unpaid" });
      expect((await charge(id)).status).toBe("expired");
    }
    // The worker no longer tries to open the one that never opened.
    expect((await charge(neverOpened)).pending_action).toBeNull();
  });
});

describe("a giveaway deposit while Stripe is away", () => {
  it("keeps the place, and the worker opens the card page and e-mails the household", async () => {
    const council = (await createUser({ roles: ["council"] })).id;
    const day = await createGiveaway(council, { deposit_cents: 500 });
    stripeAt(await closedPort());
    const booked = await bookAs(gardener, day.id, { slot_id: day.slots[0].id, quantity: 2 });
    expect(booked.status).toBe(201);
    expect(booked.json.checkout_url).toBeUndefined();
    expect(booked.json.booking).toMatchObject({ status: "booked", deposit_status: "awaiting" });
    stripeBack();
    await settlePayments({ clock: () => new Date() });
    const deposit = await ctx.db("payments").first("*").where({ giveaway_booking_id: booked.json.booking.id });
    expect(deposit).toMatchObject({ status: "open", pending_action: null });
    const mail = rendered(await ctx.db("email_outbox").first().where({ dedupe_key: `giveaway-deposit-ready:${booked.json.booking.id}` }));
    expect(mail.subject).toMatch(/Put your deposit down/);
  }, 30_000);
});

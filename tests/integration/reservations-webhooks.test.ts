// The webhook route: signatures checked with the SDK's constructEvent on the raw body,
// stale timestamps refused, each event applied exactly once, and any order of delivery
// ending in the same state.
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { startPayments, type PaymentsHarness } from "../helpers/payments";
import { deliverEvents, signedWebhook } from "../helpers/webhook-events";
import { createListing, createUser } from "../factories";
import { submitHostedPayment } from "@/lib/fakes/stripe/testing";
import { POST as reserve } from "@/app/api/reservations/route";
import { POST as decline } from "@/app/api/reservations/[id]/decline/route";
import { POST as confirm } from "@/app/api/reservations/[id]/confirm/route";
import { POST as noShow } from "@/app/api/reservations/[id]/no-show/route";
import { POST as webhookRoute } from "@/app/api/webhooks/stripe/route";
import { db } from "@/db/index";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let pay: PaymentsHarness;
let gardener: { id: string };

beforeAll(async () => {
  ctx = await freshDb();
  pay = await startPayments();
  pay.fake.setWebhookUrl(null); // events are recorded by the fake and delivered by hand below
  gardener = await createUser({ roles: ["gardener"] });
});
afterAll(async () => {
  await pay.close();
  await ctx.close();
});

/** Reserve and pay with webhooks off; returns the reservation and the events Stripe sent about it. */
async function paidWithoutWebhooks(opts: { price_cents?: number; deposit_cents?: number; auto_accept?: boolean } = { price_cents: 450 }) {
  const l = await createListing({ unit: "bales", quantity_total: 10, ...opts });
  const before = new Set(pay.fake.state.events.keys());
  const res = await call(reserve, await request("/api/reservations", { body: { listing_id: l.id, quantity: 2 }, as: gardener.id }));
  expect((await submitHostedPayment(res.json.checkout_url)).status).toBe(303);
  const events = [...pay.fake.state.events.values()].filter((e) => !before.has(e.id));
  return { id: res.json.reservation.id as string, listing: l, events };
}

async function endState(id: string) {
  const r = await db()("reservations").first("status", "payment_state", "hold_expires_at", "pickup_code").where({ id });
  const payments = await db()("payments").select("kind", "status", "amount_cents", "captured_cents", "refunded_cents", "pending_action").where({ reservation_id: id }).orderBy("kind");
  const mail = (await db()("email_outbox").where("dedupe_key", "like", `res:${id}:%`).pluck("dedupe_key")).map((k: string) => k.replace(id, "ID")).sort();
  const history = (await db()("reservation_events").where({ reservation_id: id }).orderBy("id").select("from_status", "to_status", "note")).map((h: any) => `${h.from_status}>${h.to_status}:${h.note}`);
  return { status: r.status, payment_state: r.payment_state, extended: r.hold_expires_at ? new Date(r.hold_expires_at).getTime() - Date.now() > 3_600_000 : null, has_code: !!r.pickup_code, payments, mail, history };
}

describe("signatures", () => {
  it("refuses a bad signature, a tampered body and a missing header with 400", async () => {
    const { events } = await paidWithoutWebhooks();
    const event = events[0];
    const wrongSecret = await signedWebhook(event, { secret: "whsec_not_ours" });
    expect(wrongSecret.status).toBe(400);
    expect(wrongSecret.json.error.code).toBe("bad_request");

    const payload = JSON.stringify(event);
    const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: "whsec_duffbank_local" });
    const tampered = await call(webhookRoute as any, await request("/api/webhooks/stripe", { rawBody: payload.replace('"livemode": false', '"livemode": true').replace(/"amount":\s*\d+/, '"amount": 1'), headers: { "stripe-signature": header } }));
    expect(tampered.status).toBe(400);

    const none = await call(webhookRoute as any, await request("/api/webhooks/stripe", { rawBody: payload }));
    expect(none.status).toBe(400);
    expect(await db()("webhook_events").where({ id: event.id })).toHaveLength(0);
  });

  it("refuses a timestamp older than the 5-minute tolerance with 400, and takes a fresh one", async () => {
    const { events } = await paidWithoutWebhooks();
    const stale = await signedWebhook(events[0], { timestamp: Math.floor(Date.now() / 1000) - 600 });
    expect(stale.status).toBe(400);
    expect(stale.json.error.message).toMatch(/tolerance/i);
    const fresh = await signedWebhook(events[0]);
    expect(fresh.status).toBe(200);
  });

  it("verifies the raw body byte for byte (the fake's pretty-printed JSON, not a re-serialised copy)", async () => {
    const { events } = await paidWithoutWebhooks();
    const pretty = JSON.stringify(events[0], null, 2);
    const res = await signedWebhook(events[0], { payload: pretty });
    expect(res.status).toBe(200);
  });
});

describe("exactly once", () => {
  it("applies the same event delivered twice only once", async () => {
    const { id, events } = await paidWithoutWebhooks();
    const completed = events.find((e) => e.type === "checkout.session.completed")!;
    const first = await signedWebhook(completed);
    const second = await signedWebhook(completed);
    expect([first.status, second.status]).toEqual([200, 200]);
    expect([first.json.outcome, second.json.outcome]).toEqual(["applied", "duplicate"]);
    expect(await db()("webhook_events").where({ id: completed.id })).toHaveLength(1);
    const state = await endState(id);
    expect(state.payment_state).toBe("paid");
    expect(state.mail.filter((k) => k.includes(":receipt:"))).toHaveLength(1);
    expect(state.history.filter((h) => h.includes("Payment received"))).toHaveLength(1);
  });

  it("does the same with every event of a payment delivered twice in a row", async () => {
    const { id, events } = await paidWithoutWebhooks();
    await deliverEvents(events.flatMap((e) => [e, e]));
    const once = await paidWithoutWebhooks();
    await deliverEvents(once.events);
    expect(await endState(id)).toEqual(await endState(once.id));
  });

  it("ignores events about objects it never made", async () => {
    const res = await signedWebhook({ id: "evt_foreign", object: "event", type: "payment_intent.succeeded", created: Math.floor(Date.now() / 1000), data: { object: { id: "pi_elsewhere", object: "payment_intent", metadata: {} } }, livemode: false, api_version: "x" });
    expect(res.status).toBe(200);
  });
});

// Seeded shuffle, so a failure names an order that can be replayed.
function shuffled<T>(xs: T[], seed: number): T[] {
  const out = [...xs];
  let s = seed;
  for (let i = out.length - 1; i > 0; i--) {
    s = (s * 1103515245 + 12345) % 2 ** 31;
    const j = s % (i + 1);
    [out[i], out[j]] = [out[j], out[i]];
  }
  return out;
}

describe("out of order", () => {
  const orders: [string, <T>(xs: T[]) => T[]][] = [
    ["reversed", (xs) => [...xs].reverse()],
    ["shuffled (seed 7)", (xs) => shuffled(xs, 7)],
    ["shuffled (seed 42)", (xs) => shuffled(xs, 42)],
  ];
  for (const [kind, opts] of [
    ["a payment", { price_cents: 450 }],
    ["a payment on an auto-accept listing", { price_cents: 450, auto_accept: true }],
    ["a deposit", { deposit_cents: 200 }],
  ] as const) {
    it(`ends ${kind} in the same state whatever the order`, async () => {
      const baseline = await paidWithoutWebhooks(opts);
      await deliverEvents(baseline.events);
      const expected = await endState(baseline.id);
      expect(expected.payment_state).not.toBe("awaiting");
      for (const [name, order] of orders) {
        const run = await paidWithoutWebhooks(opts);
        await deliverEvents(order(run.events));
        expect(await endState(run.id), name).toEqual(expected);
      }
    });
  }

  it("ends a refund in the same state whichever of its events comes first", async () => {
    const results = [];
    for (const reverse of [false, true]) {
      const run = await paidWithoutWebhooks({ price_cents: 450 });
      await deliverEvents(run.events);
      const before = new Set(pay.fake.state.events.keys());
      const res = await call(decline, await request(`/api/reservations/${run.id}/decline`, { as: run.listing.owner_id, body: {} }), { id: run.id });
      expect(res.status).toBe(200);
      const refundEvents = [...pay.fake.state.events.values()].filter((e) => !before.has(e.id));
      expect(refundEvents.map((e) => e.type).sort()).toEqual(["charge.refunded", "refund.created"]);
      await deliverEvents(reverse ? refundEvents.reverse() : refundEvents);
      results.push(await endState(run.id));
    }
    expect(results[1]).toEqual(results[0]);
    expect(results[0]).toMatchObject({ status: "declined", payment_state: "refunded" });
    expect(results[0].payments).toEqual([
      { kind: "payment", status: "refunded", amount_cents: 900, captured_cents: 900, refunded_cents: 900, pending_action: null },
      { kind: "refund", status: "succeeded", amount_cents: 900, captured_cents: 0, refunded_cents: 0, pending_action: null },
    ]);
  });

  // Stripe retries a failed delivery later, so an old event can arrive after newer ones.
  // Without "status only moves forward" these late events would undo a refund or a capture.
  const newEvents = (before: Set<string>) => [...pay.fake.state.events.values()].filter((e) => !before.has(e.id));
  const act = async (handler: any, id: string, as: string) => call(handler, await request(`/api/reservations/${id}/x`, { as, body: {} }), { id });

  it("keeps a refund when the payment's older events arrive after it", async () => {
    const states = [];
    for (const late of [false, true]) {
      const run = await paidWithoutWebhooks({ price_cents: 450 });
      const first = late ? run.events.filter((e) => e.type === "payment_intent.succeeded") : run.events;
      await deliverEvents(first);
      const before = new Set(pay.fake.state.events.keys());
      expect((await act(decline, run.id, run.listing.owner_id)).status).toBe(200);
      await deliverEvents(newEvents(before));
      if (late) await deliverEvents(run.events.filter((e) => !first.includes(e)));
      states.push(await endState(run.id));
    }
    expect(states[0]).toMatchObject({ status: "declined", payment_state: "refunded" });
    expect(states[1]).toEqual(states[0]);
  });

  it("keeps a captured deposit when the authorisation's events arrive after the capture", async () => {
    const states = [];
    for (const late of [false, true]) {
      const run = await paidWithoutWebhooks({ deposit_cents: 200 });
      const first = late ? run.events.filter((e) => e.type === "payment_intent.amount_capturable_updated") : run.events;
      await deliverEvents(first);
      expect((await act(confirm, run.id, run.listing.owner_id)).status).toBe(200);
      await db()("reservations").where({ id: run.id }).update({ pickup_by: new Date(Date.now() - 1000).toISOString() });
      const before = new Set(pay.fake.state.events.keys());
      expect((await act(noShow, run.id, run.listing.owner_id)).status).toBe(200);
      await deliverEvents(newEvents(before));
      if (late) await deliverEvents(run.events.filter((e) => !first.includes(e)));
      states.push(await endState(run.id));
    }
    expect(states[0]).toMatchObject({ status: "no_show", payment_state: "captured" });
    expect(states[1]).toEqual(states[0]);
  });
});

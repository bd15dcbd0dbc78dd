// How long a hold lasts follows what it waits for (lib/reservations/policy.ts): a checkout
// keeps the short hold; a request waiting for the supplier's answer gets up to 48 hours,
// always ending when the chosen pickup starts, with a reminder half-way; no request asks a
// supplier to answer after its own pickup time.
import { describe, expect, it } from "vitest";
import { call, request } from "../helpers/http";
import { paymentsWorld } from "../helpers/payments";
import { createListing } from "../factories";
import { TEST_CARDS, submitHostedPayment, validCard } from "@/lib/fakes/stripe/testing";
import { POST as reserve } from "@/app/api/reservations/route";
import { expireHolds } from "@/lib/services/reservations/expire-holds";
import { sendReservationReminders } from "@/lib/services/reservations/send-reservation-reminders";
import { PICKUP_TIME_ZONE } from "@/lib/reservations/pickup-times";
import { DEFAULT_HOLD_MINUTES, MIN_ANSWER_MINUTES, SUPPLIER_REPLY_HOURS } from "@/lib/reservations/policy";
import { db } from "@/db/index";
import { rendered } from "../helpers/outbox";

const world = paymentsWorld();

const HOUR = 3_600_000;
const MIN = 60_000;

/** The town's wall clock at `at`, the way dated windows store it (local time written as UTC). */
function wallClock(at: Date): string {
  const p = Object.fromEntries(
    new Intl.DateTimeFormat("en-GB", { timeZone: PICKUP_TIME_ZONE, year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit", hourCycle: "h23" })
      .formatToParts(at)
      .map((x) => [x.type, x.value]),
  );
  return `${p.year}-${p.month}-${p.day}T${p.hour}:${p.minute}:00.000Z`;
}
/** A dated window starting `fromNowMs` from now (to the minute), two hours long. */
const datedIn = (fromNowMs: number) => {
  const start = new Date(Math.ceil((Date.now() + fromNowMs) / MIN) * MIN);
  return { kind: "dated" as const, starts_at: wallClock(start), ends_at: wallClock(new Date(start.getTime() + 2 * HOUR)), start };
};
/** A weekly window whose opening today (or tomorrow) starts `fromNowMs` from now. */
function weeklyIn(fromNowMs: number) {
  const start = new Date(Math.ceil((Date.now() + fromNowMs) / MIN) * MIN);
  const local = wallClock(start);
  const weekday = new Date(local).getUTCDay();
  const hhmm = local.slice(11, 16);
  const end = wallClock(new Date(start.getTime() + HOUR)).slice(11, 16);
  return { window: { kind: "weekly" as const, weekday, start_time: hhmm, end_time: end > hhmm ? end : "23:59" }, start };
}

async function reserveWith(listingId: string, windowId: string | null) {
  return call(reserve, await request("/api/reservations", { body: { listing_id: listingId, quantity: 1, pickup_window_id: windowId }, as: world.gardener.id }));
}
const row = (id: string) => db()("reservations").first("*").where({ id });

describe("a free request waiting for the supplier", () => {
  it("gets 48 hours with no fixed pickup time, and a reminder half-way", async () => {
    const l = await createListing();
    const res = await reserveWith(l.id, null);
    expect(res.status).toBe(201);
    const r = await row(res.json.reservation.id);
    const t0 = new Date(r.created_at).getTime();
    expect(new Date(r.hold_expires_at).getTime() - t0).toBe(SUPPLIER_REPLY_HOURS * HOUR);
    expect(new Date(r.answer_remind_at).getTime() - t0).toBe((SUPPLIER_REPLY_HOURS / 2) * HOUR);
    // The answer deadline is shown on both sides: the gardener's answer and the supplier's e-mail.
    expect(res.json.reservation.hold_expires_at).toBe(r.hold_expires_at);
    const mail = rendered(await db()("email_outbox").first("template", "data").where({ dedupe_key: `res:${r.id}:requested:supplier` }));
    expect(mail.text_body).toMatch(/Accept or decline by /);
  });

  it("ends the answer window when the chosen pickup starts, well inside 48 hours", async () => {
    const w = datedIn(10 * HOUR);
    const l = await createListing({ windows: [w] });
    const res = await reserveWith(l.id, l.window_ids[0]);
    expect(res.status).toBe(201);
    const r = await row(res.json.reservation.id);
    expect(r.pickup_at).toBe(w.start.toISOString());
    expect(r.hold_expires_at).toBe(w.start.toISOString());
    const t0 = new Date(r.created_at).getTime();
    expect(Math.abs(new Date(r.answer_remind_at).getTime() - (t0 + (w.start.getTime() - t0) / 2))).toBeLessThanOrEqual(1);
    // Reminded once, half-way (five hours in), then expired at the pickup's start if still unanswered.
    expect((await sendReservationReminders({ clock: () => new Date(t0 + 4 * HOUR) })).warned).toBe(0);
    expect((await sendReservationReminders({ clock: () => new Date(t0 + 5.1 * HOUR) })).warned).toBe(1);
    expect((await expireHolds({ clock: () => new Date(w.start.getTime() - MIN) })).expired).toBe(0);
    expect((await expireHolds({ clock: () => new Date(w.start.getTime() + 1000) })).expired).toBe(1);
  });

  it("refuses a dated pickup that starts before the supplier could answer", async () => {
    const l = await createListing({ windows: [datedIn(MIN_ANSWER_MINUTES * MIN - 20 * MIN)] });
    const res = await reserveWith(l.id, l.window_ids[0]);
    expect(res.status).toBe(422);
    expect(res.json.error.fields.pickup_window_id).toMatch(/too soon for the supplier to answer/);
    expect(await db()("reservations").where({ listing_id: l.id }).count({ n: "*" })).toEqual([{ n: 0 }]);
  });

  it("takes a weekly window's next opening that leaves time to answer: next week's when today's is too close", async () => {
    const w = weeklyIn(20 * MIN);
    const l = await createListing({ windows: [w.window] });
    const res = await reserveWith(l.id, l.window_ids[0]);
    expect(res.status).toBe(201);
    const r = await row(res.json.reservation.id);
    const moved = new Date(r.pickup_at).getTime() - w.start.getTime();
    // A week on (give or take a clock change), and the supplier gets the full 48 hours.
    expect(Math.abs(moved - 7 * 24 * HOUR)).toBeLessThanOrEqual(HOUR);
    expect(new Date(r.hold_expires_at).getTime() - new Date(r.created_at).getTime()).toBe(SUPPLIER_REPLY_HOURS * HOUR);
  });

  it("lets an auto-accept listing be collected in an opening that starts soon: nobody has to answer", async () => {
    const w = datedIn(20 * MIN);
    const l = await createListing({ auto_accept: true, windows: [w] });
    const res = await reserveWith(l.id, l.window_ids[0]);
    expect(res.status).toBe(201);
    expect(res.json.reservation.status).toBe("confirmed");
    expect((await row(res.json.reservation.id)).pickup_at).toBe(w.start.toISOString());
  });
});

describe("a checkout", () => {
  it("keeps the short hold while the gardener pays; then the supplier answers before the pickup starts", async () => {
    const w = datedIn(6 * HOUR);
    const l = await createListing({ material_code: "straw", unit: "bales", price_cents: 450, windows: [w] });
    const res = await reserveWith(l.id, l.window_ids[0]);
    expect(res.status).toBe(201);
    const id = res.json.reservation.id;
    let r = await row(id);
    expect(new Date(r.hold_expires_at).getTime() - new Date(r.created_at).getTime()).toBe(DEFAULT_HOLD_MINUTES * MIN);
    expect(r.answer_remind_at).toBeNull();
    // The gardener is warned ten minutes before the checkout's hold ends; the supplier is not asked yet.
    const end = new Date(r.hold_expires_at).getTime();
    await sendReservationReminders({ clock: () => new Date(end - 9 * MIN) });
    const warned = await db()("email_outbox").where("dedupe_key", "like", `res:${id}:expiring:%`).pluck("dedupe_key");
    expect(warned).toEqual([`res:${id}:expiring:gardener:${r.hold_expires_at}`]);

    await submitHostedPayment(res.json.checkout_url, validCard(TEST_CARDS.approved));
    await world.pay.fake.webhooksIdle();
    r = await row(id);
    expect(r.payment_state).toBe("paid");
    expect(r.hold_expires_at).toBe(w.start.toISOString());
    expect(new Date(r.answer_remind_at).getTime()).toBeLessThan(w.start.getTime());
  });

  it("refuses a pickup that starts before the checkout's hold and an answer could both fit", async () => {
    const l = await createListing({ material_code: "straw", unit: "bales", price_cents: 450, windows: [datedIn((DEFAULT_HOLD_MINUTES + MIN_ANSWER_MINUTES - 10) * MIN)] });
    const res = await reserveWith(l.id, l.window_ids[0]);
    expect(res.status).toBe(422);
    expect(res.json.error.fields.pickup_window_id).toMatch(/too soon/);
  });
});

// A giveaway day's refundable no-show deposit, end to end against the Stripe fake: the hosted
// card page, its signed webhooks delivered to the app's webhook route, and the worker's expiry.
// The booking follows the webhooks (never the redirect) and the deposit is held, released or
// kept through the same payments rows and Stripe calls as a reservation's deposit.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { freshDb } from "../helpers/db";
import { call, request } from "../helpers/http";
import { startPayments, type PaymentsHarness } from "../helpers/payments";
import { bookAs, createGiveaway, createUser } from "../factories";
import { TEST_CARDS, submitHostedPayment, validCard } from "@/lib/fakes/stripe/testing";
import * as oneDay from "@/app/api/giveaways/[id]/route";
import * as myBooking from "@/app/api/giveaways/[id]/bookings/[bookingId]/route";
import * as cancelDay from "@/app/api/council/giveaways/[id]/cancel/route";
import * as attendance from "@/app/api/council/giveaways/[id]/bookings/[bookingId]/route";
import { expireGiveawayDepositHolds } from "@/lib/services/giveaways/expire-deposit-holds";
import { recordAttendance } from "@/lib/services/giveaways/record-attendance";
import { reconcilePayments } from "@/lib/payments/reconcile";
import { recoverOpenPayments } from "@/lib/services/payments/recover-open-payments";
import { holdMinutes } from "@/lib/reservations/policy";
import { db } from "@/db/index";
import { renderedRows } from "../helpers/outbox";

let ctx: Awaited<ReturnType<typeof freshDb>>;
let pay: PaymentsHarness;
const p: Record<string, string> = {};
let orgA: string;

beforeAll(async () => {
  ctx = await freshDb({ materials: true });
  pay = await startPayments();
  const owner = await createUser({ roles: ["council"] });
  orgA = owner.organisation_id!;
  p.owner = owner.id;
  p.staff = (await createUser({ roles: ["council"], organisation_id: orgA })).id;
  p.otherCouncil = (await createUser({ roles: ["council"] })).id;
  for (const k of ["ada", "bo", "cy"]) p[k] = (await createUser({ roles: ["gardener"] })).id;
});
afterAll(async () => {
  await pay.close();
  await ctx.close();
});
beforeEach(() => {
  pay.fake.setWebhookUrl(pay.webhookUrl);
});

const depositDay = (over: Record<string, unknown> = {}) => createGiveaway(p.owner, { deposit_cents: 500, ...over });
const booking = (id: string) => db()("giveaway_bookings").first("*").where({ id });
const deposit = (bookingId: string) => db()("payments").first("*").where({ giveaway_booking_id: bookingId, kind: "deposit" });
const slotRow = (id: string) => db()("giveaway_slots").first("*").where({ id });
/** The messages queued from one template (to one address), each with what it will say; `containing` picks by a word of its data. */
const mails = (template: string, to?: string, containing?: string) => {
  const q = db()("email_outbox").where({ template });
  if (to) q.andWhere({ to_address: to });
  if (containing) q.andWhere("data", "like", `%${containing}%`);
  return renderedRows(q);
};
const emailOf = async (userId: string) => (await db()("users").first("email").where({ id: userId })).email as string;
const intentOf = async (bookingId: string) => pay.fake.state.paymentIntents.get((await deposit(bookingId)).payment_intent_id)!;
const settle = () => pay.fake.webhooksIdle();

/** Books a slot of a deposit day and puts the deposit down on the hosted page. */
async function bookAndHold(userId: string, day: { id: string; slots: { id: string }[] }, slot = 0) {
  const res = await bookAs(userId, day.id, { slot_id: day.slots[slot].id, quantity: 2 });
  expect(res.status).toBe(201);
  const paid = await submitHostedPayment(res.json.checkout_url, validCard(TEST_CARDS.approved));
  expect(paid.status).toBe(303);
  await settle();
  return res.json.booking.id as string;
}

describe("booking a day that asks a deposit", () => {
  it("takes the place at once, answers with the card page, and confirms only when the webhook says the deposit is on hold", async () => {
    const day = await depositDay();
    const res = await bookAs(p.ada, day.id, { slot_id: day.slots[0].id, quantity: 3 });
    expect(res.status).toBe(201);
    expect(res.json.booking).toMatchObject({ slot_id: day.slots[0].id, quantity: 3, status: "booked", deposit_status: "awaiting", deposit_cents: 500 });
    expect(res.json.checkout_url).toMatch(new RegExp(`^${pay.fake.url}/pay/cs_test_`));
    const id = res.json.booking.id;
    expect((await slotRow(day.slots[0].id)).booked).toBe(1);
    expect((await deposit(id)).status).toBe("open");
    // The hold lasts HOLD_MINUTES.
    expect(Date.parse(res.json.booking.hold_expires_at) - Date.now()).toBeGreaterThan((holdMinutes() - 1) * 60_000);

    // A card-authorisation hold, worded as a refundable deposit.
    const session = [...pay.fake.state.checkoutSessions.values()].find((s) => s.metadata.giveaway_booking_id === id)!;
    expect(session.amount_total).toBe(500);
    expect(await (await fetch(res.json.checkout_url)).text()).toContain("Refundable no-show deposit: Leaf day at the depot");
    expect(session.success_url).toContain(`/giveaways/${day.id}`);
    // Nothing is confirmed yet: no confirmation e-mail, and the same household cannot book twice.
    expect(await mails("giveaway_booked", await emailOf(p.ada))).toHaveLength(0);
    expect((await bookAs(p.ada, day.id, { slot_id: day.slots[1].id, quantity: 1 })).status).toBe(409);

    // The booking page offers the same card page again while the deposit is awaited.
    const page = await call(oneDay.GET as never, await request(`/api/giveaways/${day.id}`, { as: p.ada }), { id: day.id });
    expect(page.json.my_booking).toMatchObject({ id, deposit_status: "awaiting", checkout_url: res.json.checkout_url });

    // The browser coming back proves nothing; the webhook does.
    pay.fake.setWebhookUrl(null);
    const paid = await submitHostedPayment(res.json.checkout_url, validCard(TEST_CARDS.approved));
    expect(paid.status).toBe(303);
    expect((await booking(id)).deposit_status).toBe("awaiting");
    // The worker's lost-webhook net brings it up to Stripe's record (intent authorised).
    await recoverOpenPayments({}, { clock: () => new Date(Date.now() + 10 * 60_000) });
    expect(await booking(id)).toMatchObject({ status: "booked", deposit_status: "held", hold_expires_at: null });
    expect(await deposit(id)).toMatchObject({ status: "authorised", kind: "deposit" });
    expect((await intentOf(id)).status).toBe("requires_capture");
    const mail = await mails("giveaway_booked", await emailOf(p.ada));
    expect(mail).toHaveLength(1);
    expect(mail[0].text_body).toContain("€5.00 is on hold on your card");
    expect(mail[0].text_body).toMatch(/calendar\.ics\?t=/);
    expect(await reconcilePayments()).toEqual([]);
  });

  it("with webhooks on, the completed checkout authorises and confirms the booking", async () => {
    const day = await depositDay();
    const id = await bookAndHold(p.bo, day);
    expect((await booking(id)).deposit_status).toBe("held");
    expect((await deposit(id)).status).toBe("authorised");
    expect(await mails("giveaway_booked", await emailOf(p.bo))).toHaveLength(1);
  });

  it("a booking whose deposit is not put down in time lapses: the place returns and the card page closes", async () => {
    const day = await depositDay();
    const res = await bookAs(p.cy, day.id, { slot_id: day.slots[1].id, quantity: 1 });
    const id = res.json.booking.id;
    expect((await slotRow(day.slots[1].id)).booked).toBe(1);
    // Not yet due: nothing happens.
    expect(await expireGiveawayDepositHolds({ clock: () => new Date(Date.parse(res.json.booking.hold_expires_at) - 1000) })).toEqual({ expired: 0 });
    const later = () => new Date(Date.parse(res.json.booking.hold_expires_at) + 1000);
    expect(await expireGiveawayDepositHolds({ clock: later })).toEqual({ expired: 1 });
    await settle();
    expect(await booking(id)).toMatchObject({ status: "cancelled", deposit_status: "unpaid" });
    expect((await slotRow(day.slots[1].id)).booked).toBe(0);
    expect((await deposit(id)).status).toBe("expired");
    expect(pay.fake.state.checkoutSessions.get((await deposit(id)).provider_ref)!.status).toBe("expired");
    expect((await submitHostedPayment(res.json.checkout_url)).status).toBe(409);
    expect(await mails("giveaway_booking_lapsed", await emailOf(p.cy))).toHaveLength(1);
    // Run again: nothing more to do. And the household may book again.
    expect(await expireGiveawayDepositHolds({ clock: later })).toEqual({ expired: 0 });
    expect((await bookAs(p.cy, day.id, { slot_id: day.slots[1].id, quantity: 1 })).status).toBe(201);
  });
});

describe("releasing the hold", () => {
  it("on check-in at the site", async () => {
    const day = await depositDay();
    const id = await bookAndHold(p.ada, day);
    const res = await call(attendance.PATCH as never, await request("/x", { method: "PATCH", body: { status: "checked_in" }, as: p.staff }), { id: day.id, bookingId: id });
    expect(res.status).toBe(200);
    expect(res.json.booking).toMatchObject({ status: "checked_in", deposit_status: "released" });
    await settle();
    expect((await deposit(id)).status).toBe("released");
    expect((await intentOf(id)).status).toBe("canceled");
    // Kept money cannot follow a released hold: undo and no-show leave it released.
    await call(attendance.PATCH as never, await request("/x", { method: "PATCH", body: { status: "booked" }, as: p.staff }), { id: day.id, bookingId: id });
    expect((await booking(id)).deposit_status).toBe("released");
    expect(await reconcilePayments()).toEqual([]);
  });

  it("when the household cancels before the cut-off", async () => {
    const day = await depositDay();
    const id = await bookAndHold(p.bo, day);
    const res = await call(myBooking.DELETE as never, await request("/x", { method: "DELETE", as: p.bo }), { id: day.id, bookingId: id });
    expect(res.status).toBe(200);
    expect(res.json.booking.status).toBe("cancelled");
    await settle();
    expect(await booking(id)).toMatchObject({ status: "cancelled", deposit_status: "released" });
    expect((await deposit(id)).status).toBe("released");
    expect((await intentOf(id)).status).toBe("canceled");
    expect((await slotRow(day.slots[0].id)).booked).toBe(0);
    const mail = await mails("giveaway_booking_cancelled", await emailOf(p.bo));
    expect(mail.at(-1).text_body).toContain("held on your card is released");
  });

  it("for everyone booked when staff call the day off, with an e-mail to each", async () => {
    const day = await depositDay();
    const held = await bookAndHold(p.ada, day);
    const waiting = (await bookAs(p.cy, day.id, { slot_id: day.slots[0].id, quantity: 1 })).json.booking.id;
    const res = await call(cancelDay.POST as never, await request("/x", { body: { reason: "The depot is flooded." }, as: p.staff }), { id: day.id });
    expect(res.status).toBe(200);
    expect(res.json.bookings_cancelled).toBe(2);
    await settle();
    expect(await booking(held)).toMatchObject({ status: "cancelled", deposit_status: "released" });
    expect((await deposit(held)).status).toBe("released");
    expect((await intentOf(held)).status).toBe("canceled");
    expect(await booking(waiting)).toMatchObject({ status: "cancelled", deposit_status: "unpaid" });
    expect((await deposit(waiting)).status).toBe("expired");
    const heldMail = await mails("giveaway_day_cancelled", await emailOf(p.ada), "The depot is flooded.");
    expect(heldMail).toHaveLength(1);
    expect(heldMail[0].text_body).toContain("deposit of €5.00 held on your card is released");
    const waitingMail = await mails("giveaway_day_cancelled", await emailOf(p.cy), "The depot is flooded.");
    expect(waitingMail[0].text_body).toContain("nothing was taken from your card");
    expect(await reconcilePayments()).toEqual([]);
  });
});

describe("a no-show keeps the deposit", () => {
  it("refuses before the slot has ended, captures after it, and the mark then stays", async () => {
    const day = await depositDay();
    const id = await bookAndHold(p.bo, day);
    const early = await call(attendance.PATCH as never, await request("/x", { method: "PATCH", body: { status: "no_show" }, as: p.staff }), { id: day.id, bookingId: id });
    expect(early.status).toBe(409);
    expect((await booking(id)).deposit_status).toBe("held");

    const staff = { userId: p.staff, organisationId: orgA, organisationName: "Council", isOwner: false };
    const afterSlot = () => new Date(Date.parse(day.slots[0].starts_at) + 60 * 60_000);
    const b = await recordAttendance(staff, day.id, id, "no_show", { clock: afterSlot });
    expect(b).toMatchObject({ status: "no_show", deposit_status: "kept" });
    await settle();
    expect(await deposit(id)).toMatchObject({ status: "captured", captured_cents: 500 });
    expect((await intentOf(id)).status).toBe("succeeded");
    await expect(recordAttendance(staff, day.id, id, "checked_in", { clock: afterSlot })).rejects.toMatchObject({ code: "invalid_state" });
    const audit = await db()("audit_log").where({ action: "giveaway.attendance_no_show", subject_id: id }).first();
    expect(audit.actor_id).toBe(p.staff);
    expect(await reconcilePayments()).toEqual([]);
  });

  it("staff of another council get 404 and a gardener 403, and the hold stays", async () => {
    const day = await depositDay();
    const id = await bookAndHold(p.cy, day);
    for (const status of ["no_show", "checked_in"]) {
      const other = await call(attendance.PATCH as never, await request("/x", { method: "PATCH", body: { status }, as: p.otherCouncil }), { id: day.id, bookingId: id });
      expect(other.status).toBe(404);
      const gardener = await call(attendance.PATCH as never, await request("/x", { method: "PATCH", body: { status }, as: p.cy }), { id: day.id, bookingId: id });
      expect(gardener.status).toBe(403);
    }
    const dayOff = await call(cancelDay.POST as never, await request("/x", { body: { reason: "Taken over" }, as: p.otherCouncil }), { id: day.id });
    expect(dayOff.status).toBe(404);
    await settle();
    expect(await booking(id)).toMatchObject({ status: "booked", deposit_status: "held" });
    expect((await deposit(id)).status).toBe("authorised");
    expect((await intentOf(id)).status).toBe("requires_capture");
  });
});

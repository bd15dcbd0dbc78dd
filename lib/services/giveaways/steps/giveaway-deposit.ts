import "server-only";
import type { Knex } from "knex";
import { findBooking, findDay, findSlot } from "@/db/giveaways";
import { findOrganisation } from "@/db/organisations";
import { findUserById } from "@/db/users";
import { enqueueEmail } from "@/db/outbox";
import { depositOfBooking } from "@/db/payments";
import type { DepositStatus, GiveawayBookingRow, PaymentRow } from "@/db/types";
import { appUrl } from "@/lib/env";
import { bookingParts } from "@/lib/mail/templates/giveaway";
import { settleCheckout } from "@/lib/payments/owner";
import { holdMinutes } from "@/lib/reservations/policy";
import { enqueueBookedEmail } from "@/lib/services/giveaways/steps/enqueue-booked-email";

// A giveaway day's refundable no-show deposit, held on the household's card through the same
// payments rows, Stripe calls, webhooks and worker as a reservation's deposit:
//   awaiting → (checkout completed, the card authorised) held → released (checked in, cancelled
//   before the cut-off, the day called off) or kept (captured: marked a no-show after the slot).
//   Not put down within the hold (HOLD_MINUTES): the booking lapses and its place returns.
// The booking keeps status "booked" throughout, so the one-per-household index and every
// count of places already treat it as taking its place.

type Trx = Knex.Transaction;

/** A booking's deposit once the booking ends without a no-show: a hold is let go, a card page closed. */
export function depositAfterReturn(s: DepositStatus): DepositStatus {
  return s === "held" ? "released" : s === "awaiting" ? "unpaid" : s;
}

/** Writes the Stripe call a booking's deposit owes (inside the caller's transaction); returns the payments to run after the commit. */
export async function settleBookingDeposit(trx: Knex | Trx, bookingId: string, rule: "return" | "keep", now: Date): Promise<string[]> {
  const charge = await depositOfBooking(bookingId, trx, { lock: true });
  if (!charge) return [];
  return (await settleCheckout(trx, charge, rule, now)) ?? [];
}

/**
 * The booking side of its deposit moving forward (registered for the owner kind
 * "giveaway_booking" in lib/services/payments/owners.ts; webhook or recovered). Authorised: the booking is confirmed and its e-mail with the .ics goes out;
 * if the booking ended meanwhile, the hold is let go at once.
 */
export async function bookingDepositFollows(trx: Trx, row: PaymentRow, status: string, now: Date): Promise<string[]> {
  const booking = await findBooking(row.giveaway_booking_id!, trx, { lock: true });
  if (!booking) return [];
  const set = (deposit_status: DepositStatus, extra: Partial<GiveawayBookingRow> = {}) =>
    trx("giveaway_bookings").where({ id: booking.id }).update({ deposit_status, ...extra, updated_at: now.toISOString() });
  if (status === "authorised") {
    if (booking.status === "booked" && booking.deposit_status === "awaiting") {
      await set("held", { hold_expires_at: null });
      const day = (await findDay(booking.day_id, trx))!;
      const slot = (await findSlot(booking.slot_id, booking.day_id, trx))!;
      await enqueueBookedEmail(day, slot, { ...booking, deposit_status: "held" }, trx);
      return [];
    }
    // Lapsed, cancelled or checked in before the card went through: nothing is to be held.
    const owed = await settleBookingDeposit(trx, booking.id, "return", now);
    if (booking.deposit_status !== "kept") await set("released");
    return owed;
  }
  // A hold let go: the normal end after a check-in or a cancellation, or one made on Stripe's
  // side. A deposit Duffbank never saw put down stays "awaiting" and lapses on its own.
  if (status === "released" && booking.deposit_status === "held") await set("released");
  if (status === "captured") await set("kept");
  return [];
}

/** Who a booking's e-mails go to, and the parts they are written from. */
export async function householdOf(b: GiveawayBookingRow, trx: Knex | Trx) {
  const day = (await findDay(b.day_id, trx))!;
  const slot = (await findSlot(b.slot_id, b.day_id, trx))!;
  const [user, org] = await Promise.all([findUserById(b.user_id, trx), findOrganisation(day.organisation_id, trx)]);
  if (!user) return null;
  return { email: user.email, parts: bookingParts({ name: user.display_name, organisation: org?.name ?? "The council", pageUrl: `${appUrl()}/giveaways/${day.id}`, day, slot, quantity: b.quantity }) };
}

/**
 * (Registered in lib/services/payments/owners.ts.) The deposit's card page could not be opened at booking and the worker has opened it now:
 * the household gets a fresh hold to put the deposit down, and an e-mail saying so.
 */
export async function depositPageReady(trx: Trx, bookingId: string, now: Date): Promise<void> {
  const until = new Date(now.getTime() + holdMinutes() * 60_000).toISOString();
  const n = await trx("giveaway_bookings")
    .where({ id: bookingId, status: "booked", deposit_status: "awaiting" })
    .update({ hold_expires_at: until, updated_at: now.toISOString() });
  if (n === 0) return;
  const to = await householdOf((await findBooking(bookingId, trx))!, trx);
  if (!to) return;
  const data = { ...to.parts, holdMinutes: holdMinutes() };
  await enqueueEmail({ to: to.email, template: "giveaway_deposit_ready", data, dedupe_key: `giveaway-deposit-ready:${bookingId}` }, trx);
}

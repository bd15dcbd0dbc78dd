import "server-only";
import { isUniqueViolation, lockRows } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { findDay, findSlot, insertBooking, liveBookingFor, takeSlotPlace } from "@/db/giveaways";
import { insertPayment } from "@/db/payments";
import type { GiveawayBookingRow, GiveawayDayRow } from "@/db/types";
import { ApiError, notFound } from "@/lib/api/errors";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";
import { openCheckout } from "@/lib/payments/checkout";
import { holdMinutes } from "@/lib/reservations/policy";
import { readableDateTime } from "@/lib/time/zoned";
import { giveawayQuantityIssue } from "@/lib/validation/giveaways";
import { bookingWindowState } from "@/lib/giveaways/view";
import { enqueueBookedEmail } from "@/lib/services/giveaways/steps/enqueue-booked-email";
import { resolveContext, type Context } from "@/lib/context";

// A household is one Duffbank account: one live booking per account per day, enforced by a
// unique index. That stops casual double-booking, not a person with two accounts. To tighten
// it, verify a postal address once per account (a letter with a code, or the council's own
// register of households) and key this rule on the verified address instead of the account.

// A day's no-show deposit is held on the household's card (lib/services/giveaways/steps/giveaway-deposit.ts):
// the booking takes its place at once and waits, deposit "awaiting", for the Stripe checkout;
// only the webhook confirms it, and the confirmation e-mail goes when the hold is on the card.

export interface BookInput {
  slot_id: string;
  quantity: number;
}

export type BookedGiveaway = GiveawayBookingRow & { checkout_url: string | null };

export async function bookGiveaway(userId: string, dayId: string, input: BookInput, ctx: Context = {}): Promise<BookedGiveaway> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  // Checks that need reading come first, outside the write: they give the clear message.
  // The write itself re-checks everything that a racing request could change.
  const day = await findDay(dayId, q);
  if (!day) throw notFound("That giveaway day");
  assertOpen(day, now);
  const slot = await findSlot(input.slot_id, dayId, q);
  if (!slot) throw new ApiError("invalid_input", "Choose one of this day's time slots.", { slot_id: "That slot is not part of this day." });
  const wholeIssue = giveawayQuantityIssue(input.quantity, day.unit);
  if (wholeIssue) throw new ApiError("invalid_input", wholeIssue, { quantity: wholeIssue });
  if (input.quantity > day.household_cap) {
    const cap = formatGiveawayQuantity(day.household_cap, day.unit);
    throw new ApiError("invalid_input", `Each household may take at most ${cap}.`, { quantity: `At most ${cap} a household.` });
  }
  if (await liveBookingFor(dayId, userId, q)) throw householdLimit();
  if (slot.booked >= slot.capacity) throw slotFull();

  const booking = await writeTransaction(q, async (trx) => {
    // The conditional UPDATE is the transaction's first statement on SQLite, so it takes the
    // write lock before anything is read. On PostgreSQL the day is held first (shared with
    // other bookings): staff calling the day off or changing it wait for this booking, and a
    // booking waits for them and then sees what they did. The UPDATE locks the slot row.
    // It also re-checks the day: called off or closed since the read above means no booking.
    await lockRows(trx, "giveaway_days", { id: dayId }, "share");
    if (!(await takeSlotPlace(slot.id, dayId, now.toISOString(), trx))) {
      const current = await findDay(dayId, trx);
      if (!current) throw notFound("That giveaway day");
      assertOpen(current, now);
      throw slotFull();
    }
    if (await liveBookingFor(dayId, userId, trx)) throw householdLimit();
    const deposit = day.deposit_cents > 0;
    let row: GiveawayBookingRow;
    try {
      row = await insertBooking(
        {
          day_id: dayId,
          slot_id: slot.id,
          user_id: userId,
          quantity: input.quantity,
          deposit_cents: day.deposit_cents,
          deposit_status: deposit ? "awaiting" : "none",
          currency: day.currency,
          hold_expires_at: deposit ? new Date(now.getTime() + holdMinutes() * 60_000).toISOString() : null,
        },
        trx,
      );
    } catch (err) {
      if (isUniqueViolation(err)) throw householdLimit();
      throw err;
    }
    if (!deposit) {
      await enqueueBookedEmail(day, slot, row, trx);
      return { row, paymentId: null };
    }
    const payment = await insertPayment(
      { giveaway_booking_id: row.id, kind: "deposit", status: "creating", amount_cents: day.deposit_cents, currency: day.currency, idempotency_key: `checkout:giveaway:${row.id}` },
      now.toISOString(),
      trx,
    );
    return { row, paymentId: payment.id };
  });
  // Stripe is called only after the place is committed, as for reservations; a checkout that
  // cannot start now is made by the worker (which e-mails the household) or from the booking page.
  const checkoutUrl = booking.paymentId ? await openCheckout(booking.paymentId, clock, q) : null;
  return { ...booking.row, checkout_url: checkoutUrl };
}

/** Refuses a booking unless the day is taking them at `now`, saying why. */
function assertOpen(day: GiveawayDayRow, now: Date) {
  const window = bookingWindowState(day, now);
  if (window === "cancelled") throw new ApiError("invalid_state", "This giveaway day has been called off.");
  if (window === "not_yet") throw new ApiError("invalid_state", `Booking opens ${readableDateTime(day.booking_opens_at, day.time_zone)}.`);
  if (window === "closed") throw new ApiError("invalid_state", "Booking for this day has closed.");
}

const slotFull = () => new ApiError("slot_full", "That slot is full. Choose another time.");
const householdLimit = () => new ApiError("household_limit", "Your household already has a booking for this day. Cancel it first to choose another slot.");

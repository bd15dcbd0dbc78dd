import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findBooking, findDay, findSlot, releaseSlotPlace, setBookingStatus } from "@/db/giveaways";
import { findOrganisation } from "@/db/organisations";
import { findUserById } from "@/db/users";
import { enqueueEmail } from "@/db/outbox";
import { ApiError, notFound } from "@/lib/api/errors";
import { appUrl } from "@/lib/env";
import { bookingParts } from "@/lib/mail/templates/giveaway";
import { readableDateTime } from "@/lib/time/zoned";
import { runPaymentActions } from "@/lib/services/payments/settle-payment";
import { cancelDeadline } from "@/lib/giveaways/view";
import { depositAfterReturn, settleBookingDeposit } from "@/lib/services/giveaways/steps/giveaway-deposit";
import { formatMoney } from "@/lib/format/money";
import { resolveContext, type Context } from "@/lib/context";

/** A household cancels its own booking, up to the day's cut-off before the slot; any deposit hold is released. */
export async function cancelGiveawayBooking(userId: string, dayId: string, bookingId: string, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const booking = await findBooking(bookingId, q);
  // Someone else's booking is not found, whatever its id.
  if (!booking || booking.user_id !== userId || booking.day_id !== dayId) throw notFound("That booking");
  const day = (await findDay(dayId, q))!;
  const slot = (await findSlot(booking.slot_id, dayId, q))!;
  if (booking.status !== "booked") throw new ApiError("invalid_state", `This booking is ${booking.status.replace("_", " ")} and cannot be cancelled.`);
  const deadline = cancelDeadline(slot.starts_at, day.cancel_cutoff_hours);
  if (now.getTime() > deadline.getTime()) {
    throw new ApiError("invalid_state", `Bookings for this day can be cancelled until ${day.cancel_cutoff_hours} hours before the slot (${readableDateTime(deadline.toISOString(), day.time_zone)}). Please tell the council if you cannot come.`);
  }
  const owed = await writeTransaction(q, async (trx) => {
    // Guarded on the deposit too: a hold landing meanwhile is released below, not left behind.
    const current = (await findBooking(bookingId, trx, { lock: true }))!;
    const changed = await setBookingStatus(
      { id: bookingId, user_id: userId },
      ["booked"],
      "cancelled",
      { cancelled_at: now.toISOString(), deposit_status: depositAfterReturn(current.deposit_status), hold_expires_at: null },
      trx,
    );
    if (!changed) throw new ApiError("invalid_state", "This booking has just changed; reload the page.");
    await releaseSlotPlace(slot.id, trx);
    // Cancelled before the cut-off: an open card page is closed, a deposit hold released.
    const ids = await settleBookingDeposit(trx, bookingId, "return", now);
    const [user, org] = await Promise.all([findUserById(userId, trx), findOrganisation(day.organisation_id, trx)]);
    if (user) {
      const depositNote =
        current.deposit_status === "held"
          ? `The no-show deposit of ${formatMoney(current.deposit_cents, current.currency)} held on your card is released; nothing is taken.`
          : current.deposit_status === "awaiting"
            ? "The deposit was not put down, so nothing was taken from your card."
            : null;
      const data = {
        ...bookingParts({ name: user.display_name, organisation: org?.name ?? "the council", pageUrl: `${appUrl()}/giveaways`, day, slot, quantity: booking.quantity }),
        depositNote,
      };
      await enqueueEmail({ to: user.email, template: "giveaway_booking_cancelled", data, dedupe_key: `giveaway-booking-cancelled:${bookingId}` }, trx);
    }
    return ids;
  });
  // The Stripe call after the commit; the worker retries it if Stripe is away.
  await runPaymentActions(owed, { db: q, clock });
  return (await findBooking(bookingId, q))!;
}

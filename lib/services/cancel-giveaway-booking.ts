import "server-only";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { findBooking, findDay, findSlot, releaseSlotPlace, setBookingStatus } from "@/db/giveaways";
import { findOrganisation } from "@/db/organisations";
import { findUserById } from "@/db/users";
import { enqueueEmail } from "@/db/outbox";
import { ApiError, notFound } from "@/lib/api/errors";
import { appUrl } from "@/lib/app-url";
import { bookingParts, giveawayBookingCancelledEmail } from "@/lib/mail/templates/giveaway";
import { readableDateTime } from "@/lib/time/zoned";
import { cancelDeadline } from "./giveaway-view";

/** A household cancels its own booking, up to the day's cut-off before the slot. */
export async function cancelGiveawayBooking(userId: string, dayId: string, bookingId: string, clock: () => Date = () => new Date()) {
  const booking = await findBooking(bookingId);
  // Someone else's booking is not found, whatever its id.
  if (!booking || booking.user_id !== userId || booking.day_id !== dayId) throw notFound("That booking");
  const day = (await findDay(dayId))!;
  const slot = (await findSlot(booking.slot_id, dayId))!;
  if (booking.status !== "booked") throw new ApiError("invalid_state", `This booking is ${booking.status.replace("_", " ")} and cannot be cancelled.`);
  const deadline = cancelDeadline(slot.starts_at, day.cancel_cutoff_hours);
  if (clock().getTime() > deadline.getTime()) {
    throw new ApiError("invalid_state", `Bookings for this day can be cancelled until ${day.cancel_cutoff_hours} hours before the slot (${readableDateTime(deadline.toISOString(), day.time_zone)}). Please tell the council if you cannot come.`);
  }
  return writeTransaction(db(), async (trx) => {
    const changed = await setBookingStatus(
      { id: bookingId, user_id: userId },
      ["booked"],
      "cancelled",
      { cancelled_at: clock().toISOString(), deposit_status: booking.deposit_status === "recorded" ? "released" : booking.deposit_status },
      trx,
    );
    if (!changed) throw new ApiError("invalid_state", "This booking has just changed; reload the page.");
    await releaseSlotPlace(slot.id, trx);
    const [user, org] = await Promise.all([findUserById(userId, trx), findOrganisation(day.organisation_id, trx)]);
    if (user) {
      const mail = giveawayBookingCancelledEmail(
        bookingParts({ name: user.display_name, organisation: org?.name ?? "the council", pageUrl: `${appUrl()}/giveaways`, day, slot, quantity: booking.quantity }),
      );
      await enqueueEmail({ to: user.email, ...mail, template: "giveaway_booking_cancelled", dedupe_key: `giveaway-booking-cancelled:${bookingId}` }, trx);
    }
    return (await findBooking(bookingId, trx))!;
  });
}

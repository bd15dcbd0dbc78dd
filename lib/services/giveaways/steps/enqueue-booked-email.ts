import "server-only";
import type { Db } from "@/db/index";
import { findOrganisation } from "@/db/organisations";
import { findUserById } from "@/db/users";
import { enqueueEmail } from "@/db/outbox";
import type { GiveawayBookingRow, GiveawayDayRow, GiveawaySlotRow } from "@/db/types";
import { appUrl } from "@/lib/env";
import { giveawayCautions } from "@/lib/calc/cautions";
import { bookingParts } from "@/lib/mail/templates/giveaway";
import { readableDateTime } from "@/lib/time/zoned";
import { cancelDeadline } from "@/lib/giveaways/view";
import { calendarToken } from "@/lib/giveaways/calendar";
import { formatMoney } from "@/lib/format/money";

export const DEPOSIT_HOLD_NOTE =
  "It is a hold on your card, not a charge: it is released when you are checked in, when you cancel before the cut-off, or if the day is called off, and it is taken only if you do not come.";

/** The confirmation with the exact place and the .ics: at booking, or once a deposit is on the card. */
export async function enqueueBookedEmail(day: GiveawayDayRow, slot: GiveawaySlotRow, booking: GiveawayBookingRow, trx: Db) {
  const [user, org] = await Promise.all([findUserById(booking.user_id, trx), findOrganisation(day.organisation_id, trx)]);
  if (!user) return;
  const base = appUrl();
  const data = {
    ...bookingParts({ name: user.display_name, organisation: org?.name ?? "The council", pageUrl: `${base}/giveaways/${day.id}`, day, slot, quantity: booking.quantity }),
    address: day.address,
    cancelBy: readableDateTime(cancelDeadline(slot.starts_at, day.cancel_cutoff_hours).toISOString(), day.time_zone),
    depositNote: booking.deposit_cents > 0 ? `A refundable no-show deposit of ${formatMoney(booking.deposit_cents, booking.currency)} is on hold on your card. ${DEPOSIT_HOLD_NOTE}` : null,
    calendarUrl: `${base}/api/giveaways/${day.id}/bookings/${booking.id}/calendar.ics?t=${calendarToken(booking.id)}`,
    cautions: giveawayCautions(day.material_code),
  };
  await enqueueEmail({ to: user.email, template: "giveaway_booked", data, dedupe_key: `giveaway-booked:${booking.id}` }, trx);
}

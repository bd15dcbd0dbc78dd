import "server-only";
import { findBooking, findDay, findSlot } from "@/db/giveaways";
import { findOrganisation } from "@/db/organisations";
import { ApiError, notFound } from "@/lib/api/errors";
import { appUrl } from "@/lib/env";
import { giveawayCalendar, validCalendarToken } from "@/lib/giveaways/calendar";
import { resolveContext, type Context } from "@/lib/context";

/** The .ics of one booking, for its household only (by session or by the e-mailed token). */
export async function bookingCalendar(dayId: string, bookingId: string, who: { token: string | null; userId: string | null }, ctx: Context = {}): Promise<string> {
  const { db: q } = resolveContext(ctx);
  const booking = await findBooking(bookingId, q);
  const allowed = booking && booking.day_id === dayId && (booking.user_id === who.userId || validCalendarToken(bookingId, who.token));
  if (!booking || !allowed) throw notFound("That booking");
  if (booking.status === "cancelled") throw new ApiError("invalid_state", "This booking was cancelled.");
  const day = (await findDay(dayId, q))!;
  const [slot, org] = await Promise.all([findSlot(booking.slot_id, dayId, q), findOrganisation(day.organisation_id, q)]);
  return giveawayCalendar({
    id: booking.id,
    quantity: booking.quantity,
    unit: day.unit,
    title: day.title,
    address: day.address,
    starts_at: slot!.starts_at,
    ends_at: slot!.ends_at,
    organisation: org?.name ?? "the council",
    url: `${appUrl()}/giveaways/${day.id}`,
  });
}

import "server-only";
import { findDay, liveBookingFor, slotsOf } from "@/db/giveaways";
import { findOrganisation } from "@/db/organisations";
import { notFound } from "@/lib/api/errors";
import { depositOfBooking } from "@/db/payments";
import { openCheckout } from "@/lib/payments/checkout";
import { cancelDeadline, publicDayView, type PublicDayView } from "@/lib/giveaways/view";
import { resolveContext, type Context } from "@/lib/context";

export interface VisitorBooking {
  id: string;
  slot_id: string;
  quantity: number;
  status: string;
  deposit_cents: number;
  deposit_status: string;
  /** While the deposit is awaited: the card page, and when the place is let go without it. */
  checkout_url: string | null;
  hold_expires_at: string | null;
  starts_at: string;
  ends_at: string;
  cancel_until: string;
  /** The exact place: only for the household that booked. */
  address: string;
  exact: { lat: number; lng: number };
}

/** A day as a visitor sees it, plus — for a household that has booked — its booking and the exact place. */
export async function giveawayForVisitor(dayId: string, userId: string | null, ctx: Context = {}): Promise<{ giveaway: PublicDayView; my_booking: VisitorBooking | null }> {
  const { db: q, clock } = resolveContext(ctx);
  const day = await findDay(dayId, q);
  if (!day) throw notFound("That giveaway day");
  const [slots, org] = await Promise.all([slotsOf([dayId], q), findOrganisation(day.organisation_id, q)]);
  const giveaway = publicDayView(day, slots, org?.name ?? "");
  const booking = userId ? await liveBookingFor(dayId, userId, q) : undefined;
  if (!booking) return { giveaway, my_booking: null };
  const slot = slots.find((s) => s.id === booking.slot_id)!;
  let checkoutUrl: string | null = null;
  if (booking.deposit_status === "awaiting") {
    const charge = await depositOfBooking(booking.id, q);
    // Open already, or started again when the first try at booking could not reach Stripe
    // (unless Stripe is known to be away: then the worker opens it and e-mails the household).
    checkoutUrl = charge && charge.waiting_for !== "stripe" ? await openCheckout(charge.id, clock, q) : null;
  }
  return {
    giveaway,
    my_booking: {
      id: booking.id,
      slot_id: booking.slot_id,
      quantity: booking.quantity,
      status: booking.status,
      deposit_cents: booking.deposit_cents,
      deposit_status: booking.deposit_status,
      checkout_url: checkoutUrl,
      hold_expires_at: booking.hold_expires_at,
      starts_at: slot.starts_at,
      ends_at: slot.ends_at,
      cancel_until: cancelDeadline(slot.starts_at, day.cancel_cutoff_hours).toISOString(),
      address: day.address,
      exact: { lat: day.lat, lng: day.lng },
    },
  };
}


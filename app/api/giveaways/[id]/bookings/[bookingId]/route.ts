import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { idempotent } from "@/lib/api/idempotency";
import { cancelGiveawayBooking } from "@/lib/services/giveaways/cancel-giveaway-booking";

// DELETE /api/giveaways/:id/bookings/:bookingId — cancel my booking, up to the day's cut-off
// (a deposit hold is released). Honours an Idempotency-Key.
export const DELETE = withAuth<{ id: string; bookingId: string }>(
  idempotent(async ({ params, user }) => {
    const b = await cancelGiveawayBooking(user.id, params.id, params.bookingId);
    return NextResponse.json({ booking: { id: b.id, slot_id: b.slot_id, quantity: b.quantity, status: b.status } });
  }),
);

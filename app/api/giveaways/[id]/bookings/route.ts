import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { idempotent } from "@/lib/api/idempotency";
import { parseInput } from "@/lib/api/errors";
import { bookingSchema } from "@/lib/validation/giveaways";
import { bookGiveaway } from "@/lib/services/giveaways/book-giveaway";
import { requireVerifiedEmail } from "@/lib/auth/current-user";

// POST /api/giveaways/:id/bookings — book a slot for my household (any signed-in account).
// With an Idempotency-Key, a retry gets the first answer and takes no second place.
export const POST = withAuth<{ id: string }>(idempotent(async ({ req, params, user }) => {
  requireVerifiedEmail(user);
  const input = parseInput(bookingSchema, await readJson(req));
  const b = await bookGiveaway(user.id, params.id, input);
  // A day with a no-show deposit: the place is taken, and checkout_url is the card page that
  // puts the deposit on hold (the booking is confirmed by Stripe's webhook, not the redirect).
  const checkout = b.checkout_url ? { checkout_url: b.checkout_url } : {};
  return NextResponse.json(
    {
      booking: { id: b.id, slot_id: b.slot_id, quantity: b.quantity, status: b.status, day_id: b.day_id, deposit_cents: b.deposit_cents, deposit_status: b.deposit_status, hold_expires_at: b.hold_expires_at },
      ...checkout,
    },
    { status: 201 },
  );
}));

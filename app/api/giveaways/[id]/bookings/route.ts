import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { bookingSchema } from "@/lib/validation/giveaways";
import { bookGiveaway } from "@/lib/services/book-giveaway";

// POST /api/giveaways/:id/bookings — book a slot for my household (any signed-in account).
export const POST = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const input = parseInput(bookingSchema, await readJson(req));
  const b = await bookGiveaway(user.id, params.id, input);
  return NextResponse.json(
    { booking: { id: b.id, slot_id: b.slot_id, quantity: b.quantity, status: b.status, day_id: b.day_id, deposit_cents: b.deposit_cents, deposit_status: b.deposit_status } },
    { status: 201 },
  );
});

import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { idempotent } from "@/lib/api/idempotency";
import { parseInput } from "@/lib/api/errors";
import { reserveListings } from "@/lib/services/reservations/reserve-listing";
import { listReservations } from "@/lib/services/reservations/list-reservations";
import { getReservations } from "@/lib/services/reservations/get-reservations";
import { reserveManySchema, reserveOneSchema } from "@/lib/validation/reservations";
import { requireVerifiedEmail } from "@/lib/auth/current-user";

// POST /api/reservations — hold a quantity of a listing (or, with "items", several at once,
// all or nothing) for the signed-in gardener. A priced or deposit listing answers with the
// checkout_url of the Stripe page that completes the reservation. A live culture takes
// "fulfilment" (pickup or post) and, for post, "ship_to". With an Idempotency-Key, a retry
// gets the first answer and holds nothing twice.
export const POST = withAuth(idempotent(async ({ req, user }) => {
  requireVerifiedEmail(user);
  const body = await readJson(req);
  const many = typeof body === "object" && body !== null && "items" in body;
  const input = many ? parseInput(reserveManySchema, body) : parseInput(reserveOneSchema, body);
  const items =
    "items" in input
      ? input.items
      : [{ listing_id: input.listing_id, quantity: input.quantity, pickup_window_id: input.pickup_window_id, fulfilment: input.fulfilment, ship_to: input.ship_to }];
  const result = await reserveListings({
    gardenerId: user.id,
    items,
    bed_id: input.bed_id,
    need_id: input.need_id,
    fieldPrefix: (i) => (many ? `items.${i}.` : ""),
  });
  const reservations = await getReservations(result.ids, user.id, "gardener");
  const checkout = result.checkoutUrl ? { checkout_url: result.checkoutUrl } : {};
  return NextResponse.json(many ? { reservations, ...checkout } : { reservation: reservations[0], ...checkout }, { status: 201 });
}), ["gardener"]);

// GET /api/reservations — the signed-in gardener's reservations, newest first.
export const GET = withAuth(async ({ user }) => {
  return NextResponse.json({ reservations: await listReservations(user.id, "gardener") });
});

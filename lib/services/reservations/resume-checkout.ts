import "server-only";
import { chargeOf } from "@/db/payments";
import { ApiError } from "@/lib/api/errors";
import { resolveContext, type Context } from "@/lib/context";
import { openCheckout } from "@/lib/payments/checkout";
import { owesPayment, type PaymentState, type ReservationStatus } from "@/lib/reservations/policy";

/** The checkout URL of a reservation that still owes its payment or deposit. */
export async function resumeCheckout(reservationId: string, gardenerId: string, ctx: Context = {}): Promise<string> {
  const { db: q, clock } = resolveContext(ctx);
  const r = (await q("reservations").first("id", "status", "payment_state").where({ id: reservationId, gardener_id: gardenerId })) as
    | { id: string; status: ReservationStatus; payment_state: PaymentState }
    | undefined;
  if (!r) throw new ApiError("not_found", "That reservation was not found.");
  const charge = await chargeOf(r.id, q);
  if (!charge || !owesPayment(r)) throw new ApiError("invalid_state", "Nothing is owed on this reservation.");
  const url = await openCheckout(charge.id, clock, q);
  if (!url) throw new ApiError("conflict", "The payment page could not be opened just now. Your hold stays; try again in a minute, and we will e-mail you as soon as it opens.");
  return url;
}

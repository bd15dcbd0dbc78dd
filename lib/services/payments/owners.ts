import "server-only";
import type { Knex } from "knex";
import type { PaymentRow } from "@/db/types";
import { ownerOf, type PaymentOwner } from "@/lib/payments/owner";
import { bookingDepositFollows, depositPageReady } from "@/lib/services/giveaways/steps/giveaway-deposit";
import { reservationCheckoutReady, reservationFollowsPayment } from "@/lib/services/reservations/steps/follow-payment";

// The one map of what follows a payment change, by the kind of owner it pays for (a
// reservation, its culture order included, or a giveaway booking's no-show deposit). The
// payment machinery (settle-payment.ts, apply-stripe-event.ts) asks here and never imports an
// owner's services itself; owners never call back into the payment machinery: they write the
// Stripe call they owe on the payment row and return its id, and the caller makes it.

export interface PaymentOwnerHooks {
  /**
   * What the owner does when its payment moves forward to `status` (`row` is the payment as
   * it was), inside the transaction that moves it. Returns the payments that now owe a Stripe call.
   */
  follows(trx: Knex.Transaction, row: PaymentRow, status: string, now: Date): Promise<string[]>;
  /** The worker made a checkout that could not be made at the time: a fresh hold to pay in, and an e-mail. */
  checkoutReady(trx: Knex.Transaction, ownerId: string, now: Date): Promise<void>;
}

export const paymentOwners: Record<PaymentOwner["type"], PaymentOwnerHooks> = {
  reservation: { follows: reservationFollowsPayment, checkoutReady: reservationCheckoutReady },
  giveaway_booking: { follows: bookingDepositFollows, checkoutReady: depositPageReady },
};

/** The hooks of the owner this payment pays for, with the owner's id. */
export function ownerHooks(row: Pick<PaymentRow, "reservation_id" | "giveaway_booking_id">): PaymentOwnerHooks & { ownerId: string } {
  const owner = ownerOf(row);
  return { ...paymentOwners[owner.type], ownerId: owner.id };
}

import "server-only";
import type { Knex } from "knex";
import { writeTransaction } from "@/db/write-transaction";
import { findPayment } from "@/db/payments";
import { reservationContext } from "@/db/reservation-context";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { ownerOf } from "@/lib/payments/owner";
import { holdMinutes } from "@/lib/reservations/policy";
import { depositPageReady } from "@/lib/services/giveaway-deposit";

/**
 * A checkout Stripe could not make when it was asked for has been made by the worker: whoever
 * owes the payment gets a full hold from now to pay, and an e-mail that the page is ready.
 * The supplier still hears nothing until the payment is through.
 */
export async function checkoutReadyLate(paymentId: string, now: Date, q: Knex): Promise<void> {
  const payment = await findPayment(paymentId, q);
  if (!payment) return;
  const owner = ownerOf(payment);
  await writeTransaction(q, async (trx) => {
    if (owner.type === "giveaway_booking") return depositPageReady(trx, owner.id, now);
    const until = new Date(now.getTime() + holdMinutes() * 60_000).toISOString();
    const r = await trx("reservations").first("status", "payment_state", "hold_expires_at").where({ id: owner.id });
    if (!r || r.status !== "held" || r.payment_state !== "awaiting") return;
    if (new Date(r.hold_expires_at) < new Date(until)) {
      await trx("reservations").where({ id: owner.id, status: "held" }).update({ hold_expires_at: until, expiry_warned_at: null, updated_at: now.toISOString() });
    }
    await mailReservation(trx, "payment_ready", (await reservationContext(owner.id, trx))!, ["gardener"]);
  });
}

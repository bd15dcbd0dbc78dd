import "server-only";
import type { Knex } from "knex";
import { reservationContext } from "@/db/reservation-context";
import type { PaymentRow } from "@/db/types";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { RANK } from "@/lib/payments/status";
import { holdMinutes } from "@/lib/reservations/policy";
import { gardenerStepDone, moneyReturnedOutside } from "@/lib/services/reservations/steps/reservation-steps";

// What a reservation does when its payment changes, registered for the owner kind
// "reservation" in lib/services/payments/owners.ts. Both run inside the caller's transaction.

type Trx = Knex.Transaction;

/**
 * The reservation side of a payment moving forward to `status` (`row` is the payment as it
 * was). Returns the payments that now owe a Stripe call.
 */
export async function reservationFollowsPayment(trx: Trx, row: PaymentRow, status: string, now: Date): Promise<string[]> {
  const reservationId = row.reservation_id!;
  const was = RANK[row.status];
  const owed: string[] = [];
  if (was < RANK.authorised && (status === "authorised" || status === "paid")) {
    owed.push(...(await gardenerStepDone(trx, reservationId, row.kind === "deposit" ? "authorised" : "paid", now)));
  }
  if (["released", "captured", "refunded"].includes(status)) {
    await trx("reservations").where({ id: reservationId }).update({ payment_state: status, updated_at: now.toISOString() });
    if (status !== "captured") owed.push(...(await moneyReturnedOutside(trx, reservationId, status as "released" | "refunded", now)));
  }
  return owed;
}

/**
 * A checkout Stripe could not make when it was asked for has been made by the worker: the
 * gardener gets a full hold from now to pay, and an e-mail that the page is ready. The
 * supplier still hears nothing until the payment is through.
 */
export async function reservationCheckoutReady(trx: Trx, reservationId: string, now: Date): Promise<void> {
  const until = new Date(now.getTime() + holdMinutes() * 60_000).toISOString();
  const r = await trx("reservations").first("status", "payment_state", "hold_expires_at").where({ id: reservationId });
  if (!r || r.status !== "held" || r.payment_state !== "awaiting") return;
  if (new Date(r.hold_expires_at) < new Date(until)) {
    await trx("reservations").where({ id: reservationId, status: "held" }).update({ hold_expires_at: until, expiry_warned_at: null, updated_at: now.toISOString() });
  }
  await mailReservation(trx, "payment_ready", (await reservationContext(reservationId, trx))!, ["gardener"]);
}

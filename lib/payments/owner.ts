import type { Knex } from "knex";
import { lockRows } from "@/db/dialect";
import type { Db } from "@/db/index";
import { updatePayment } from "@/db/payments";
import type { PaymentRow } from "@/db/types";

// A payments row belongs to exactly one owner (a database check says so): a reservation
// (its price or its deposit, and refunds of them) or a giveaway booking (its no-show
// deposit). The Stripe machinery is the same for both; only the few places that follow a
// payment back to what it pays for ask which owner it has, through ownerOf.

export type PaymentOwner = { type: "reservation"; id: string } | { type: "giveaway_booking"; id: string };

export function ownerOf(row: Pick<PaymentRow, "reservation_id" | "giveaway_booking_id">): PaymentOwner {
  if (row.reservation_id) return { type: "reservation", id: row.reservation_id };
  if (row.giveaway_booking_id) return { type: "giveaway_booking", id: row.giveaway_booking_id };
  throw new Error("a payment with no owner");
}

/**
 * Holds what the payment pays for until `trx` ends (nothing to do on SQLite): the first lock
 * of a transaction that decides on a payment, taken before the payment's own (db/payments.ts).
 */
export async function lockOwner(trx: Knex.Transaction, row: Pick<PaymentRow, "reservation_id" | "giveaway_booking_id">): Promise<void> {
  const owner = ownerOf(row);
  await lockRows(trx, owner.type === "reservation" ? "reservations" : "giveaway_bookings", { id: owner.id });
}

/** Stripe metadata naming the owner, so every event and object says what it is for. */
export function ownerMetadata(row: Pick<PaymentRow, "reservation_id" | "giveaway_booking_id">): Record<string, string> {
  const owner = ownerOf(row);
  return owner.type === "reservation" ? { reservation_id: owner.id } : { giveaway_booking_id: owner.id };
}

/**
 * What a checkout owes when what it pays for ends: an open checkout is closed; a deposit
 * hold is captured under "keep", otherwise released. Writes the owed call and returns the
 * row's id; null when the charge is in neither state (paid, or already settled).
 */
export async function settleCheckout(trx: Db, charge: PaymentRow, rule: "return" | "keep" | "complete", now: Date): Promise<string[] | null> {
  const at = now.toISOString();
  if (charge.status === "creating" || charge.status === "open") {
    await updatePayment(charge.id, { pending_action: "expire", next_action_at: null, updated_at: at }, trx);
    return [charge.id];
  }
  if (charge.status === "authorised") {
    await updatePayment(charge.id, { pending_action: rule === "keep" ? "capture" : "release", next_action_at: null, updated_at: at }, trx);
    return [charge.id];
  }
  return null;
}

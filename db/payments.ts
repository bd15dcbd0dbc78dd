import { lockForUpdate } from "./dialect";
import { db, newId, type Db } from "./index";
import type { PaymentRow } from "./types";

// One row per Stripe object Duffbank made: a checkout for a price or a deposit, and a
// refund. `pending_action` is a Stripe call still owed, retried by the worker until done.

export async function insertPayment(
  row: Pick<PaymentRow, "kind" | "status" | "amount_cents" | "currency" | "idempotency_key"> &
    ({ reservation_id: string } | { giveaway_booking_id: string }) &
    Partial<PaymentRow>,
  now: string,
  q: Db = db(),
): Promise<PaymentRow> {
  const full: PaymentRow = {
    id: newId(),
    reservation_id: null,
    giveaway_booking_id: null,
    parent_id: null,
    provider: "stripe",
    provider_ref: null,
    payment_intent_id: null,
    checkout_url: null,
    captured_cents: 0,
    refunded_cents: 0,
    last_error: null,
    pending_action: null,
    action_attempts: 0,
    next_action_at: null,
    waiting_for: null,
    created_at: now,
    updated_at: now,
    ...row,
  };
  await q("payments").insert(full);
  return full;
}

// `lock` holds the row until the transaction `q` ends (FOR UPDATE on PostgreSQL). Lock what a
// payment belongs to (the reservation or the booking) before the payment itself, in that
// order everywhere, so two transactions never wait on each other the other way round.

export async function findPayment(id: string, q: Db = db(), opts: { lock?: boolean } = {}): Promise<PaymentRow | undefined> {
  return lockForUpdate(q<PaymentRow>("payments").first("*").where({ id }), opts.lock);
}

/** The checkout (price or deposit) of a reservation; refunds are separate rows. */
export async function chargeOf(reservationId: string, q: Db = db(), opts: { lock?: boolean } = {}): Promise<PaymentRow | undefined> {
  return lockForUpdate(q<PaymentRow>("payments").first("*").where({ reservation_id: reservationId }).whereIn("kind", ["payment", "deposit"]), opts.lock);
}

/** The no-show deposit of a giveaway booking. */
export async function depositOfBooking(bookingId: string, q: Db = db(), opts: { lock?: boolean } = {}): Promise<PaymentRow | undefined> {
  return lockForUpdate(q<PaymentRow>("payments").first("*").where({ giveaway_booking_id: bookingId, kind: "deposit" }), opts.lock);
}

export async function paymentsOf(reservationIds: string[], q: Db = db()): Promise<PaymentRow[]> {
  if (reservationIds.length === 0) return [];
  return q<PaymentRow>("payments").select("*").whereIn("reservation_id", reservationIds).orderBy("created_at");
}

export async function paymentByStripeRef(ref: { payment_id?: string | null; session_id?: string | null; intent_id?: string | null }, q: Db = db()) {
  if (ref.payment_id) {
    const row = await findPayment(ref.payment_id, q);
    if (row) return row;
  }
  if (ref.session_id) {
    const row = await q<PaymentRow>("payments").first("*").where({ provider_ref: ref.session_id });
    if (row) return row;
  }
  if (ref.intent_id) {
    return q<PaymentRow>("payments").first("*").where({ payment_intent_id: ref.intent_id }).whereIn("kind", ["payment", "deposit"]);
  }
  return undefined;
}

export async function updatePayment(id: string, patch: Partial<PaymentRow>, q: Db = db()): Promise<void> {
  await q("payments").where({ id }).update(patch);
}

/**
 * A checkout could not be made when it was asked for: the worker makes it later (pending
 * action "open"), unless the payment has meanwhile been given another call to make.
 */
export async function noteCheckoutNotOpened(
  id: string,
  failure: { attempts: number; nextAt: string; error: string; waitingFor: "stripe" | null; at: string },
  q: Db = db(),
): Promise<void> {
  await q("payments")
    .where({ id, status: "creating" })
    .andWhere((w) => w.whereNull("pending_action").orWhere("pending_action", "open"))
    .update({ pending_action: "open", action_attempts: failure.attempts, next_action_at: failure.nextAt, last_error: failure.error.slice(0, 500), waiting_for: failure.waitingFor, updated_at: failure.at });
}

/** Whether any owed Stripe call is waiting for Stripe to answer again. */
export async function anyWaitingForStripe(q: Db = db()): Promise<boolean> {
  return !!(await q("payments").first("id").whereNotNull("pending_action").andWhere({ waiting_for: "stripe" }));
}

/** Stripe answers again: every call that waited for it is due now, whatever its backoff said. */
export async function wakeWaitingForStripe(now: string, q: Db = db()): Promise<number> {
  return q("payments").whereNotNull("pending_action").andWhere({ waiting_for: "stripe" }).update({ next_action_at: now, waiting_for: null });
}

export async function dueActions(now: string, limit = 20, q: Db = db()): Promise<PaymentRow[]> {
  return q<PaymentRow>("payments")
    .select("*")
    .whereNotNull("pending_action")
    .andWhere((qb) => qb.whereNull("next_action_at").orWhere("next_action_at", "<=", now))
    .orderBy("updated_at")
    .limit(limit);
}

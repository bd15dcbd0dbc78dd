import "server-only";
import type { Knex } from "knex";
import type { Db } from "@/db/index";
import { chargeOf, insertPayment } from "@/db/payments";
import { settleCheckout } from "@/lib/payments/owner";
import { reservationContext, type ReservationContext } from "@/db/reservation-context";
import { collectQuantity, findReservation, recordReservationEvent, releaseQuantity, updateReservationIf, type PickupWindowRow } from "@/db/reservations";
import type { ReservationRow } from "@/db/types";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { settleNeedsAfter } from "@/lib/services/needs/steps/settle-needs-after";
import { mailCultureOrder } from "@/lib/mail/culture-order-mail";
import { newPickupCode } from "@/lib/reservations/pickup-code";
import { nextOccurrence } from "@/lib/reservations/pickup-times";
import { MIN_ANSWER_MINUTES, NO_WINDOW_PICKUP_DAYS, holdFor, type ReservationStatus } from "@/lib/reservations/policy";

// The building blocks every reservation change is made of, each run inside the caller's
// transaction: a guarded status change, the quantity it moves, the money it settles, the
// history row and the e-mails. Stripe itself is only called after the commit.

export type Trx = Knex.Transaction;

export class StaleState extends Error {
  constructor() {
    super("the reservation changed meanwhile");
  }
}

/**
 * When the pickup is: the chosen window's next opening (the first to start at or after
 * `notBefore` when the supplier has to answer first), or a week to arrange one.
 */
export function pickupTimes(window: PickupWindowRow | null, now: Date, notBefore: Date | null = null): { pickup_at: string | null; pickup_by: string } {
  const occ = window ? nextOccurrence(window, now, undefined, notBefore) : null;
  if (occ) return { pickup_at: occ.start.toISOString(), pickup_by: occ.end.toISOString() };
  return { pickup_at: null, pickup_by: new Date(now.getTime() + NO_WINDOW_PICKUP_DAYS * 86_400_000).toISOString() };
}

async function move(trx: Db, r: ReservationRow, to: ReservationStatus, patch: Partial<ReservationRow>, actorId: string | null, note: string | null, now: Date) {
  const ok = await updateReservationIf(r.id, [r.status], { ...patch, status: to, updated_at: now.toISOString() }, trx);
  if (!ok) throw new StaleState();
  await recordReservationEvent({ reservation_id: r.id, from_status: r.status, to_status: to, actor_id: actorId, note, created_at: now.toISOString() }, trx);
  // A gardener's open need this reservation counts towards is met, or open again, with it.
  await settleNeedsAfter(trx, r, now);
}

/**
 * Accepts a held reservation: a pickup code, the pickup time, the e-mails with the address.
 * A live culture becomes an order at the "paid" stage; a posted one needs no pickup code or
 * address, and its e-mails say where it goes and when, with the care sheet for the buyer.
 */
export async function confirmReservation(trx: Trx, r: ReservationRow, actorId: string | null, now: Date, note: string | null): Promise<ReservationContext> {
  const ctx = (await reservationContext(r.id, trx))!;
  // A late answer can land after the chosen window's opening has passed: move to the next one.
  const times = r.pickup_by && new Date(r.pickup_by) > now ? { pickup_at: r.pickup_at, pickup_by: r.pickup_by } : pickupTimes(ctx.window, now);
  const order = r.fulfilment ? { order_stage: "paid" as const } : {};
  const code = r.fulfilment === "post" ? null : newPickupCode();
  await move(trx, r, "confirmed", { ...times, ...order, pickup_code: code, confirmed_at: now.toISOString(), hold_expires_at: null }, actorId, note, now);
  const after = (await reservationContext(r.id, trx))!;
  if (after.fulfilment === "post") await mailCultureOrder(trx, "order_confirmed", after, ["gardener", "supplier"], now);
  else await mailReservation(trx, "confirmed", after, ["gardener", "supplier"]);
  if (after.fulfilment) await mailCultureOrder(trx, "care_sheet", after, ["gardener"], now);
  return after;
}

/** return: give everything back; keep: the no-show rule; complete: the pickup happened. */
export type MoneyRule = "return" | "keep" | "complete";

/**
 * What happens to the gardener's money when a reservation ends: an open checkout is
 * closed; a payment is refunded or kept; a deposit hold is released or captured.
 * Returns the payment rows that now owe a Stripe call.
 */
export async function settleMoney(trx: Db, r: ReservationRow, rule: MoneyRule, now: Date): Promise<string[]> {
  const charge = await chargeOf(r.id, trx, { lock: true });
  if (!charge) return [];
  const at = now.toISOString();
  const owed = await settleCheckout(trx, charge, rule, now);
  if (owed) return owed;
  if (charge.status === "paid" && rule === "return") {
    const existing = await trx("payments").first("id").where({ idempotency_key: `refund:${charge.id}` });
    if (existing) return [];
    const refund = await insertPayment(
      {
        reservation_id: r.id,
        parent_id: charge.id,
        kind: "refund",
        status: "pending",
        amount_cents: charge.amount_cents - charge.refunded_cents,
        currency: charge.currency,
        idempotency_key: `refund:${charge.id}`,
        pending_action: "refund",
      },
      at,
      trx,
    );
    return [refund.id];
  }
  return [];
}

/** Ends a reservation (declined, cancelled, expired, no-show, collected) with its quantity and money. */
export async function closeReservation(
  trx: Trx,
  r: ReservationRow,
  to: Exclude<ReservationStatus, "held" | "confirmed">,
  opts: { actorId: string | null; note?: string | null; now: Date; money: MoneyRule; patch?: Partial<ReservationRow> },
): Promise<string[]> {
  // Ended before the gardener paid: the checkout closes and the payment state says so.
  const unpaid = r.payment_state === "awaiting" ? { payment_state: "unpaid" as const } : {};
  await move(trx, r, to, { closed_at: opts.now.toISOString(), ...unpaid, ...opts.patch }, opts.actorId, opts.note ?? null, opts.now);
  if (to === "collected") await collectQuantity(r.listing_id, r.quantity, trx);
  else await releaseQuantity(r.listing_id, r.quantity, trx);
  return settleMoney(trx, r, opts.money, opts.now);
}

/**
 * The gardener's payment or deposit is through (from a webhook). A held reservation is
 * confirmed on an auto-accept listing, or goes to the supplier with a longer hold; one
 * that ended meanwhile gets its money straight back.
 */
export async function gardenerStepDone(trx: Trx, reservationId: string, state: "paid" | "authorised", now: Date): Promise<string[]> {
  const r = (await findReservation(reservationId, trx, { lock: true }))!;
  if (r.status === "held" && r.payment_state === "awaiting") {
    await trx("reservations").where({ id: r.id }).update({ payment_state: state, updated_at: now.toISOString() });
    const paid = { ...r, payment_state: state };
    const ctx = (await reservationContext(r.id, trx))!;
    await mailReservation(trx, "receipt", ctx, ["gardener"]);
    // A live culture's care sheet goes out on purchase, so the bedding is ready before the worms are.
    if (ctx.fulfilment) await mailCultureOrder(trx, "care_sheet", ctx, ["gardener"], now);
    const note = state === "paid" ? "Payment received" : "Deposit authorised";
    if (ctx.listing.auto_accept) {
      await confirmReservation(trx, paid, null, now, `${note}; the listing accepts automatically`);
      return [];
    }
    // The supplier's answer window starts now and ends before the pickup does. A weekly
    // window whose opening is too close by now (a checkout paid late) moves to a later week.
    const soon = new Date(now.getTime() + MIN_ANSWER_MINUTES * 60_000);
    const later = r.pickup_at && ctx.window && new Date(r.pickup_at) < soon ? pickupTimes(ctx.window, now, soon) : null;
    const moved = later?.pickup_at ? later : null;
    const hold = holdFor("answer", now, moved?.pickup_at ?? r.pickup_at ?? r.pickup_by);
    await trx("reservations").where({ id: r.id }).update({ ...(moved ?? {}), ...hold, expiry_warned_at: null });
    await recordReservationEvent({ reservation_id: r.id, from_status: "held", to_status: "held", actor_id: null, note, created_at: now.toISOString() }, trx);
    await mailReservation(trx, "requested", (await reservationContext(r.id, trx))!, ["supplier", "gardener"]);
    return [];
  }
  await trx("reservations").where({ id: r.id }).update({ payment_state: state, updated_at: now.toISOString() });
  if (["expired", "cancelled", "declined"].includes(r.status)) {
    const ids = await settleMoney(trx, { ...r, payment_state: state }, "return", now);
    await mailReservation(trx, "returned", (await reservationContext(r.id, trx))!, ["gardener"]);
    return ids;
  }
  return [];
}

/**
 * The money came back on Stripe's side (a refund or a released hold made outside Duffbank,
 * in Stripe's dashboard): Duffbank returns money only when it ends a reservation, so one still
 * going was not ended here. It ends now — the quantity returns, and both sides are told why.
 */
export async function moneyReturnedOutside(trx: Trx, reservationId: string, how: "released" | "refunded", now: Date): Promise<string[]> {
  const r = (await trx<ReservationRow>("reservations").first("*").where({ id: reservationId }))!;
  if (r.status !== "held" && r.status !== "confirmed") return [];
  const note = how === "refunded" ? "The payment was refunded on Stripe, outside Duffbank" : "The deposit hold was released on Stripe, outside Duffbank";
  const owed = await closeReservation(trx, r, "cancelled", { actorId: null, note, now, money: "return" });
  await mailReservation(trx, "returned_outside", (await reservationContext(r.id, trx))!, ["gardener", "supplier"]);
  return owed;
}

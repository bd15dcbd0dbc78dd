import "server-only";
import type { Knex } from "knex";
import type Stripe from "stripe";
import { db, nowIso, type Db } from "@/db/index";
import { findPayment } from "@/db/payments";
import type { PaymentRow } from "@/db/types";
import { applyStripeEvent } from "@/lib/services/apply-stripe-event";
import { stripe } from "./stripe";

// Compares every payments row with the Stripe object it names (the checkout session and
// its payment intent, or the refund) and lists each disagreement. Rows still waiting on a
// Stripe call are skipped: they are in flight, not wrong.
//
// It also repairs what a lost webhook left behind. If every delivery of an event failed
// (the app was down longer than Stripe retries, or the endpoint was misconfigured), a row
// would otherwise stay "open" while the gardener has paid. syncPayment asks Stripe what
// happened and applies it as the events Stripe would have sent, through the webhook's own
// applyStripeEvent: the same forward-only statuses, the same e-mails, and money that came
// in after the hold ended goes straight back.

export interface Mismatch {
  payment_id: string;
  field: string;
  ours: unknown;
  stripe: unknown;
}

/** Stripe's current record of a checkout: the session, its payment intent and that intent's charge. */
interface CheckoutRecord {
  session: Stripe.Checkout.Session;
  intent: Stripe.PaymentIntent | null;
  charge: Stripe.Charge | null;
}

async function checkoutRecord(sessionId: string): Promise<CheckoutRecord> {
  const session = await stripe().checkout.sessions.retrieve(sessionId, { expand: ["payment_intent"] });
  const pi = session.payment_intent;
  const intent = pi === null ? null : typeof pi === "string" ? await stripe().paymentIntents.retrieve(pi) : pi;
  const chargeId = intent?.latest_charge;
  const charge = typeof chargeId === "string" ? await stripe().charges.retrieve(chargeId) : ((chargeId as Stripe.Charge | null | undefined) ?? null);
  return { session, intent, charge };
}

function expectedStatus(row: PaymentRow, { session, intent, charge }: CheckoutRecord): string {
  if (session.status === "open") return "open";
  if (session.status === "expired" || !intent) return "expired";
  if (intent.status === "requires_capture") return "authorised";
  if (intent.status === "canceled") return heldMoney(charge) ? "released" : "expired";
  if (intent.status === "succeeded") {
    if (row.kind === "deposit") return "captured";
    return charge && charge.amount_refunded >= charge.amount_captured && charge.amount_captured > 0 ? "refunded" : "paid";
  }
  return "open";
}

export async function reconcilePayments(q: Db = db()): Promise<Mismatch[]> {
  const rows = await q<PaymentRow>("payments").select("*").whereNotNull("provider_ref").whereNull("pending_action").orderBy("created_at");
  const out: Mismatch[] = [];
  const check = (row: PaymentRow, field: string, ours: unknown, theirs: unknown) => {
    if (ours !== theirs) out.push({ payment_id: row.id, field, ours, stripe: theirs });
  };
  for (const row of rows) {
    if (row.kind === "refund") {
      const refund = await stripe().refunds.retrieve(row.provider_ref!);
      check(row, "amount_cents", row.amount_cents, refund.amount);
      check(row, "status", row.status, refund.status);
      continue;
    }
    const record = await checkoutRecord(row.provider_ref!);
    const { session, intent, charge } = record;
    check(row, "amount_cents", row.amount_cents, session.amount_total);
    check(row, "currency", row.currency, session.currency);
    check(row, "payment_intent_id", row.payment_intent_id, intent?.id ?? null);
    check(row, "status", row.status, expectedStatus(row, record));
    if (intent?.status === "succeeded") check(row, "captured_cents", row.captured_cents, intent.amount_received);
    if (row.kind === "payment" && charge?.captured) check(row, "refunded_cents", row.refunded_cents, charge.amount_refunded);
  }
  return out;
}

/** True when the card was approved: money was paid or put on hold (a declined attempt leaves a failed charge). */
function heldMoney(charge: Stripe.Charge | null): boolean {
  return !!charge && charge.status === "succeeded";
}

/** Money that came back on Stripe's side in full: a hold let go, or a payment refunded. */
export function moneyReturned({ intent, charge }: CheckoutRecord): "released" | "refunded" | null {
  if (intent?.status === "canceled" && heldMoney(charge)) return "released";
  if (charge?.captured && charge.amount_captured > 0 && charge.amount_refunded >= charge.amount_captured) return "refunded";
  return null;
}

/**
 * Where Stripe's record disagrees with what Duffbank asked for (its amount and currency),
 * so applying it would credit a payment that was not made as asked. Empty when it agrees.
 */
export function recordMismatches(row: PaymentRow, { session, intent }: CheckoutRecord): string[] {
  const out: string[] = [];
  if (session.amount_total !== row.amount_cents) out.push(`the checkout is for ${session.amount_total}, not ${row.amount_cents}`);
  if (session.currency !== row.currency) out.push(`the checkout is in ${session.currency}, not ${row.currency}`);
  if (session.metadata?.payment_id && session.metadata.payment_id !== row.id) out.push(`the checkout belongs to payment ${session.metadata.payment_id}`);
  if (intent && intent.amount !== row.amount_cents) out.push(`the payment intent is for ${intent.amount}, not ${row.amount_cents}`);
  if (intent && intent.currency !== row.currency) out.push(`the payment intent is in ${intent.currency}, not ${row.currency}`);
  const pi = session.payment_intent;
  if (intent && pi && (typeof pi === "string" ? pi : pi.id) !== intent.id) out.push("the payment intent is not the checkout's");
  return out;
}

/**
 * The events Stripe's record implies, in the order they happen. Each id names what it
 * says (`recovered:<type>:<object>`), so recovering the same thing twice applies it once;
 * statuses only move forward. When the record shows the money already back in full and
 * Duffbank never saw it arrive (`seen` is false), only the return is implied: the steps in
 * between (a receipt, a confirmation with the pickup address) never happened for Duffbank
 * and are not mailed. The intent carries its charge, so a cancelled intent says whether it
 * ever held money.
 */
export function impliedEvents(record: CheckoutRecord, now: Date, seen = true): Stripe.Event[] {
  const { session, intent, charge } = record;
  const returned = moneyReturned(record);
  const steps = seen || !returned;
  const out: [string, { id: string }, string?][] = [];
  if (steps && session.status === "complete") out.push(["checkout.session.completed", session]);
  if (session.status === "expired") out.push(["checkout.session.expired", session]);
  if (steps && intent?.status === "requires_capture") out.push(["payment_intent.amount_capturable_updated", intent]);
  if (steps && intent?.status === "succeeded") out.push(["payment_intent.succeeded", intent]);
  if (intent?.status === "canceled") out.push(["payment_intent.canceled", { ...intent, latest_charge: charge } as unknown as { id: string }]);
  if (charge?.captured && charge.amount_refunded > 0) out.push(["charge.refunded", charge, `:${charge.amount_refunded}`]);
  return out.map(
    ([type, object, suffix = ""]) =>
      ({
        id: `recovered:${type}:${object.id}${suffix}`,
        object: "event",
        api_version: null,
        created: Math.floor(now.getTime() / 1000),
        data: { object },
        livemode: false,
        pending_webhooks: 0,
        request: { id: null, idempotency_key: null },
        type,
      }) as unknown as Stripe.Event,
  );
}

/**
 * Brings one checkout row (a payment or a deposit) up to what Stripe says happened to it.
 * Returns the row's status afterwards. Throws when Stripe cannot be asked, so a caller
 * that owes this (the expire action) is retried.
 */
export async function syncPayment(paymentId: string, clock: () => Date = () => new Date(), q: Knex = db()): Promise<string | null> {
  const row = await findPayment(paymentId, q);
  if (!row || row.kind === "refund" || !row.provider_ref) return row?.status ?? null;
  const record = await checkoutRecord(row.provider_ref);
  const mismatches = recordMismatches(row, record);
  if (mismatches.length) {
    // Never credit a payment that was not made as asked; people look at last_error.
    const message = `Stripe's record does not match this payment: ${mismatches.join("; ")}.`;
    console.error(`[payments] ${paymentId}: ${message}`);
    await q("payments").where({ id: paymentId }).update({ last_error: message.slice(0, 500), updated_at: clock().toISOString() });
    return row.status;
  }
  // What the record says beside the status: the intent's id, and why a card was declined.
  const { intent } = record;
  const declined = intent?.status === "requires_payment_method" ? intent.last_payment_error?.message : null;
  if (intent && (row.payment_intent_id !== intent.id || (declined && row.last_error !== declined.slice(0, 500)))) {
    await q("payments")
      .where({ id: paymentId })
      .update({ payment_intent_id: intent.id, ...(declined ? { last_error: declined.slice(0, 500) } : {}) });
  }
  const seen = !["creating", "open", "expired"].includes(row.status);
  for (const event of impliedEvents(record, clock(), seen)) {
    await applyStripeEvent(event, { db: q, clock });
  }
  return (await findPayment(paymentId, q))?.status ?? null;
}

// Stripe delivers within seconds when the endpoint answers; a checkout still "open" here
// this long after it was made is worth asking about (common practice, no source).
export const RECOVER_AFTER_MINUTES = 5;
// How often one open checkout is asked about again while nothing has changed.
export const RECHECK_MINUTES = 2;

/**
 * The worker's safety net for lost webhooks: asks Stripe about every checkout that is still
 * open a few minutes after it was made, at most every RECHECK_MINUTES each, and applies
 * what it finds. A payment whose webhook never came is found before its hold runs out.
 */
export async function recoverOpenPayments(clock: () => Date = () => new Date(), q: Knex = db(), limit = 20): Promise<{ checked: number; changed: number }> {
  const now = clock();
  const rows = await q<PaymentRow>("payments")
    .select("id", "status")
    .where({ status: "open" })
    .whereIn("kind", ["payment", "deposit"])
    .whereNotNull("provider_ref")
    .whereNull("pending_action")
    .andWhere("created_at", "<=", new Date(now.getTime() - RECOVER_AFTER_MINUTES * 60_000).toISOString())
    .andWhere("updated_at", "<=", new Date(now.getTime() - RECHECK_MINUTES * 60_000).toISOString())
    .orderBy("updated_at")
    .limit(limit);
  let changed = 0;
  for (const row of rows) {
    try {
      const status = await syncPayment(row.id, clock, q);
      if (status !== row.status) changed++;
      // Still open: note the look, so the next one waits RECHECK_MINUTES.
      else await q("payments").where({ id: row.id, status: "open" }).update({ updated_at: nowIso(clock) });
    } catch (err) {
      console.error(`[payments] could not ask Stripe about payment ${row.id}:`, (err as Error).message);
    }
  }
  return { checked: rows.length, changed };
}

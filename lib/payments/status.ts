import type Stripe from "stripe";
import type { PaymentRow } from "@/db/types";
import type { CheckoutRecord } from "./gateway";

// The pure rules of a payment's status: which status may follow which (a payment only moves
// forward, by RANK), what a Stripe event or Stripe's record of a checkout says the status is,
// and whether that record is of the payment Duffbank asked for. No I/O.

export const RANK: Record<string, number> = { creating: 0, open: 0, expired: 1, authorised: 2, paid: 3, released: 4, captured: 4, refunded: 5 };

export type Target = { status?: keyof typeof RANK; patch?: Partial<PaymentRow> };

export const str = (v: unknown) => (typeof v === "string" ? v : v && typeof v === "object" && "id" in v ? String((v as { id: string }).id) : null);

export function targetFor(event: Stripe.Event, row: PaymentRow): Target | null {
  const obj = event.data.object as unknown as Record<string, any>;
  switch (event.type) {
    case "checkout.session.completed": {
      const intent = str(obj.payment_intent);
      return { status: obj.payment_status === "paid" ? "paid" : "authorised", patch: intent ? { payment_intent_id: intent } : {} };
    }
    case "checkout.session.expired":
      return { status: "expired" };
    case "payment_intent.amount_capturable_updated":
      return obj.amount_capturable > 0 ? { status: "authorised", patch: { payment_intent_id: obj.id } } : null;
    case "payment_intent.succeeded":
      return row.kind === "deposit"
        ? { status: "captured", patch: { payment_intent_id: obj.id, captured_cents: obj.amount_received } }
        : { status: "paid", patch: { payment_intent_id: obj.id, captured_cents: obj.amount_received } };
    case "payment_intent.canceled": {
      // A hold let go (by Duffbank, or on Stripe's side) held money once; an abandoned or
      // declined checkout's intent never did. The record carries the charge to tell which.
      const charge = obj.latest_charge as { status?: string } | string | null;
      const held = !!charge && typeof charge === "object" && charge.status === "succeeded";
      return { status: held ? "released" : "expired", patch: { payment_intent_id: obj.id } };
    }
    case "payment_intent.payment_failed":
      return { patch: { payment_intent_id: obj.id, last_error: String(obj.last_payment_error?.message ?? "The card was declined.").slice(0, 500) } };
    case "charge.refunded": {
      if (!obj.captured || !(obj.amount_refunded > 0)) return null; // a released hold, handled by payment_intent.canceled
      const refunded = Math.max(row.refunded_cents, obj.amount_refunded);
      return { status: refunded >= obj.amount_captured ? "refunded" : undefined, patch: { refunded_cents: refunded } };
    }
    default:
      return null;
  }
}

/** True when `to` is a step forward from `from` (a status never moves back). */
export function movesForward(from: string, to: string | undefined): boolean {
  return to !== undefined && RANK[to] > RANK[from];
}

/** The status Stripe's record of a checkout implies for this row. */
export function expectedStatus(row: PaymentRow, { session, intent, charge }: CheckoutRecord): string {
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


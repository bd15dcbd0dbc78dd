import "server-only";
import type { Knex } from "knex";
import type Stripe from "stripe";
import { findPayment, paymentByStripeRef, updatePayment } from "@/db/payments";
import type { PaymentRow } from "@/db/types";
import { isUniqueViolation } from "@/db/dialect";
import { syncPayment } from "@/lib/services/payments/settle-payment";
import { retrieveRefund } from "@/lib/payments/gateway";
import { resolveContext, type Context } from "@/lib/context";

// What a verified webhook does: it names a Stripe object, and Duffbank reads that object's
// record back from Stripe through the SDK and applies what the record says (syncPayment).
// The event's own body is only a pointer. A correctly signed but false event — a payment
// that never happened, another amount, someone else's checkout — finds Stripe's record
// unchanged and so changes nothing; events in any order end in the state the record shows;
// a refund or a cancellation made in Stripe's dashboard is applied like Duffbank's own.

const str = (v: unknown) => (typeof v === "string" ? v : v && typeof v === "object" && "id" in v ? String((v as { id: string }).id) : null);

/** The checkout row (payment or deposit) an event is about, by what the event names. */
async function checkoutRowOf(event: Stripe.Event, q: Knex): Promise<PaymentRow | undefined> {
  const obj = event.data.object as unknown as Record<string, any>;
  const type = event.type;
  const row = await paymentByStripeRef(
    {
      payment_id: typeof obj.metadata?.payment_id === "string" ? obj.metadata.payment_id : null,
      session_id: type.startsWith("checkout.session.") ? str(obj.id) : null,
      intent_id: type.startsWith("payment_intent.") ? str(obj.id) : str(obj.payment_intent),
    },
    q,
  );
  if (row?.kind === "refund") return row.parent_id ? findPayment(row.parent_id, q) : undefined;
  return row;
}

/**
 * A refund Duffbank made: its status as Stripe's record of it says, once that record is
 * shown to be this refund (its metadata names the row, and it refunds the row's payment).
 */
async function syncRefunds(event: Stripe.Event, parent: PaymentRow, q: Knex, now: Date): Promise<void> {
  const obj = event.data.object as unknown as Record<string, any>;
  if (!event.type.startsWith("refund.") || typeof obj.id !== "string") return;
  const refund = await retrieveRefund(obj.id);
  const rowId = refund.metadata?.refund_id;
  if (!rowId || str(refund.payment_intent) !== parent.payment_intent_id) return;
  const row = await q<PaymentRow>("payments").first("*").where({ id: rowId, kind: "refund", parent_id: parent.id });
  if (!row || refund.amount !== row.amount_cents || refund.currency !== row.currency) return;
  // pending → succeeded/failed; never back to pending.
  const status = refund.status === "succeeded" || refund.status === "failed" ? refund.status : row.status;
  if (row.status !== "pending" && row.provider_ref) return;
  await updatePayment(row.id, { provider_ref: refund.id, status, updated_at: now.toISOString() }, q);
}

const ABOUT_PAYMENTS = /^(checkout\.session|payment_intent|charge|refund)\./;

export type Outcome = "applied" | "duplicate" | "ignored";

/**
 * Handles one verified webhook event once. Throws when Stripe cannot be asked or the change
 * fails, so the route answers 500 and Stripe delivers the event again.
 */
export async function receiveStripeEvent(event: Stripe.Event, ctx: Context = {}): Promise<Outcome> {
  const { db: q, clock } = resolveContext(ctx);
  if (await q("webhook_events").first("id").where({ id: event.id })) return "duplicate";
  let outcome: Outcome = "ignored";
  if (ABOUT_PAYMENTS.test(event.type)) {
    const row = await checkoutRowOf(event, q);
    if (row?.provider_ref) {
      await syncRefunds(event, row, q, clock());
      await syncPayment(row.id, { db: q, clock });
      outcome = "applied";
    }
  }
  try {
    await q("webhook_events").insert({ id: event.id, provider: "stripe", type: event.type, created_at: new Date(event.created * 1000).toISOString(), processed_at: clock().toISOString() });
  } catch (err) {
    // Delivered twice at once: both read the same record, and it was applied once.
    if (!isUniqueViolation(err)) throw err;
    return "duplicate";
  }
  return outcome;
}

import "server-only";
import type Stripe from "stripe";
import { db, type Db } from "@/db/index";
import type { PaymentRow } from "@/db/types";
import { stripe } from "./stripe";

// Compares every payments row with the Stripe object it names (the checkout session and
// its payment intent, or the refund) and lists each disagreement. Rows still waiting on a
// Stripe call are skipped: they are in flight, not wrong.

export interface Mismatch {
  payment_id: string;
  field: string;
  ours: unknown;
  stripe: unknown;
}

function expectedStatus(row: PaymentRow, session: Stripe.Checkout.Session, intent: Stripe.PaymentIntent | null, charge: Stripe.Charge | null): string {
  if (session.status === "open") return "open";
  if (session.status === "expired" || !intent) return "expired";
  if (intent.status === "requires_capture") return "authorised";
  if (intent.status === "canceled") return intent.cancellation_reason === "abandoned" ? "expired" : "released";
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
    const session = await stripe().checkout.sessions.retrieve(row.provider_ref!, { expand: ["payment_intent"] });
    const intent = (session.payment_intent && typeof session.payment_intent === "object" ? session.payment_intent : null) as Stripe.PaymentIntent | null;
    const chargeId = intent?.latest_charge;
    const charge = typeof chargeId === "string" ? await stripe().charges.retrieve(chargeId) : null;
    check(row, "amount_cents", row.amount_cents, session.amount_total);
    check(row, "currency", row.currency, session.currency);
    check(row, "payment_intent_id", row.payment_intent_id, intent?.id ?? null);
    check(row, "status", row.status, expectedStatus(row, session, intent, charge));
    if (intent?.status === "succeeded") check(row, "captured_cents", row.captured_cents, intent.amount_received);
    if (row.kind === "payment" && charge?.captured) check(row, "refunded_cents", row.refunded_cents, charge.amount_refunded);
  }
  return out;
}

import "server-only";
import { db, type Db } from "@/db/index";
import type { PaymentRow } from "@/db/types";
import { checkoutRecord, retrieveRefund } from "./gateway";
import { expectedStatus } from "./status";

// Compares every payments row with the Stripe object it names (the checkout session and
// its payment intent, or the refund) and lists each disagreement. Rows still waiting on a
// Stripe call are skipped: they are in flight, not wrong. It only reads: repairing what a
// lost webhook left behind is lib/services/payments/recover-open-payments.ts.

export interface Mismatch {
  payment_id: string;
  field: string;
  ours: unknown;
  stripe: unknown;
}

export async function reconcilePayments(q: Db = db()): Promise<Mismatch[]> {
  const rows = await q<PaymentRow>("payments").select("*").whereNotNull("provider_ref").whereNull("pending_action").orderBy("created_at");
  const out: Mismatch[] = [];
  const check = (row: PaymentRow, field: string, ours: unknown, theirs: unknown) => {
    if (ours !== theirs) out.push({ payment_id: row.id, field, ours, stripe: theirs });
  };
  for (const row of rows) {
    if (row.kind === "refund") {
      const refund = await retrieveRefund(row.provider_ref!);
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

// Stripe delivers within seconds when the endpoint answers; a checkout still "open" this long
// after it was made is worth asking about (common practice, no source).
export const RECOVER_AFTER_MINUTES = 5;
// How often one open checkout is asked about again while nothing has changed.
export const RECHECK_MINUTES = 2;

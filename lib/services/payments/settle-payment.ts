import "server-only";
import { nowIso, type Db } from "@/db/index";
import { findPayment, updatePayment } from "@/db/payments";
import type { PaymentRow } from "@/db/types";
import { writeTransaction } from "@/db/write-transaction";
import { startCheckout } from "@/lib/payments/checkout";
import { checkoutRecord, createRefund, expireCheckoutSession, intentOfSession, settleHold } from "@/lib/payments/gateway";
import { ownerMetadata } from "@/lib/payments/owner";
import { actionRetryDelayMs } from "@/lib/payments/retry";
import { impliedEvents, recordMismatches } from "@/lib/payments/status";
import { stripeUnreachable } from "@/lib/payments/stripe";
import { applyStripeEvent } from "@/lib/services/payments/apply-stripe-event";
import { ownerHooks } from "@/lib/services/payments/owners";
import { waitForStripe } from "@/lib/services/payments/steps/wait-for-stripe";
import { resolveContext, type Context } from "@/lib/context";

// The one place that settles a payment with Stripe: make the Stripe call the payment owes,
// read Stripe's record back, apply it. Both ways in go through here: a change that wrote
// `pending_action` (close a checkout, release or capture a deposit hold, refund a payment;
// runPaymentActions right after its commit, the worker for whatever failed), and a webhook or
// the worker's look for lost webhooks (syncPayment). So a Stripe outage delays the money but
// never forgets it, and the outcome never rests on a webhook that might not arrive.
// Each call carries an idempotency key, so running one twice (the request and the worker at
// once) changes nothing. What the owner of the payment does next comes from the owners map
// (owners.ts), through applyStripeEvent; the Stripe calls that leaves owing are made here too.

// How long one process may take over a call before another may try it again: far longer
// than a Stripe request with its retries, short enough that a crashed worker's call is soon
// picked up (the idempotency key then makes the second attempt a replay, not a new call).
const ACTION_CLAIM_MS = 5 * 60_000;

type Outcome = Partial<PaymentRow>;

async function perform(row: PaymentRow, clock: () => Date, q: Db): Promise<Outcome> {
  const key = `${row.pending_action}:${row.id}`;
  switch (row.pending_action) {
    case "open": {
      // The checkout Stripe could not make when it was asked for: made now, and the gardener
      // (or household) is told it is ready, with the hold renewed so there is time to pay.
      if (await startCheckout(row.id, clock, q)) {
        const owner = ownerHooks(row);
        const now = clock();
        await writeTransaction(q, (trx) => owner.checkoutReady(trx, owner.ownerId, now));
      }
      return {};
    }
    case "expire": {
      if (!row.provider_ref) return { status: "expired" };
      await expireCheckoutSession(row.provider_ref, key);
      // A checkout paid at the last moment: applying it to the ended reservation returns
      // the money (a refund, or the hold released) and e-mails the gardener, webhook or not.
      await syncPayment(row.id, { db: q, clock });
      return {};
    }
    case "release":
    case "capture": {
      const intent = row.payment_intent_id ?? (await intentOfSession(row.provider_ref));
      if (!intent) throw new Error("the deposit has no payment intent yet");
      // Settled another way (a hold Stripe let lapse, or a second request): nothing left to do
      // but read the record, and note what Stripe said.
      const elsewhere = await settleHold(intent, row.pending_action, key);
      await syncPayment(row.id, { db: q, clock });
      return elsewhere === null ? { payment_intent_id: intent } : { payment_intent_id: intent, last_error: elsewhere.slice(0, 500) };
    }
    case "refund": {
      const parent = row.parent_id ? await findPayment(row.parent_id, q) : undefined;
      const intent = parent?.payment_intent_id ?? (parent ? await intentOfSession(parent.provider_ref) : null);
      if (!intent) throw new Error("the payment to refund has no payment intent yet");
      const refund = await createRefund({ intentId: intent, amountCents: row.amount_cents, metadata: { refund_id: row.id, ...ownerMetadata(row) } }, row.idempotency_key);
      await syncPayment(parent!.id, { db: q, clock });
      return { provider_ref: refund.id, status: refund.status === "succeeded" ? "succeeded" : "pending" };
    }
    default:
      return {};
  }
}

/**
 * Takes the owed call for this process: one conditional UPDATE moves it out of everyone
 * else's reach until ACTION_CLAIM_MS from now, so of two processes that read it (the request
 * that wrote it and a worker, or two workers) exactly one calls Stripe.
 */
async function claimAction(row: PaymentRow, clock: () => Date, q: Db): Promise<boolean> {
  const now = clock();
  const changed = await q("payments")
    .where({ id: row.id, pending_action: row.pending_action })
    .andWhere((w) => w.whereNull("next_action_at").orWhere("next_action_at", "<=", now.toISOString()))
    .update({ next_action_at: new Date(now.getTime() + ACTION_CLAIM_MS).toISOString() });
  return changed === 1;
}

/** "elsewhere": another process claimed the call a moment ago and is making it. */
export type Attempt = "done" | "failed" | "unreachable" | "elsewhere";

/** Makes one payment's owed Stripe call, if it still owes one and no other process is making it. */
export async function attemptPaymentAction(id: string, ctx: Context = {}): Promise<Attempt> {
  const { db: q, clock } = resolveContext(ctx);
  const row = await findPayment(id, q);
  if (!row?.pending_action) return "done";
  if (!(await claimAction(row, clock, q))) return "elsewhere";
  try {
    const outcome = await perform(row, clock, q);
    // Only clear the action this run performed: a newer one written meanwhile stays.
    await q("payments")
      .where({ id, pending_action: row.pending_action })
      .update({ ...outcome, pending_action: null, next_action_at: null, waiting_for: null, updated_at: nowIso(clock) });
    return "done";
  } catch (err) {
    const attempts = row.action_attempts + 1;
    const unreachable = stripeUnreachable(err);
    await updatePayment(
      id,
      {
        action_attempts: attempts,
        next_action_at: new Date(clock().getTime() + actionRetryDelayMs(attempts)).toISOString(),
        last_error: (err as Error).message.slice(0, 500),
        waiting_for: unreachable ? "stripe" : null,
      },
      q,
    );
    return unreachable ? "unreachable" : "failed";
  }
}

/**
 * Runs the calls a change owes, right after it commits. Once Stripe proves unreachable the
 * rest are not tried one timeout after another inside the request: they wait for Stripe,
 * and the worker makes them as soon as it answers.
 */
export async function runPaymentActions(ids: Iterable<string>, ctx: Context = {}): Promise<void> {
  const { db: q, clock } = resolveContext(ctx);
  let unreachable = false;
  for (const id of new Set(ids)) {
    if (unreachable) await waitForStripe(id, { db: q, clock });
    else unreachable = (await attemptPaymentAction(id, { db: q, clock })) === "unreachable";
  }
}

/**
 * Brings one checkout row (a payment or a deposit) up to what Stripe says happened to it:
 * reads Stripe's record and applies it as the events Stripe would have sent (the same
 * forward-only statuses, the same e-mails), then makes the Stripe calls that leaves owing
 * (money that came in after the hold ended goes straight back). Returns the row's status
 * afterwards. Throws when Stripe cannot be asked, so a caller that owes this (the expire
 * action, a webhook) is retried.
 */
export async function syncPayment(paymentId: string, ctx: Context = {}): Promise<string | null> {
  const { db: q, clock } = resolveContext(ctx);
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
    const { owed } = await applyStripeEvent(event, { db: q, clock });
    await runPaymentActions(owed, { db: q, clock });
  }
  return (await findPayment(paymentId, q))?.status ?? null;
}

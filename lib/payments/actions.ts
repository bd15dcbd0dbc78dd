import "server-only";
import Stripe from "stripe";
import { db, nowIso, type Db } from "@/db/index";
import { anyWaitingForStripe, dueActions, findPayment, updatePayment, wakeWaitingForStripe } from "@/db/payments";
import type { PaymentRow } from "@/db/types";
import { ownerMetadata } from "./owner";
import { syncPayment } from "./reconcile";
import { checkoutReadyLate } from "@/lib/services/checkout-ready";
import { startCheckout } from "./checkout";
import { probeStripe, stripe, stripeUnreachable } from "./stripe";

// The Stripe calls a reservation change leaves owing: close a checkout, release or capture
// a deposit hold, refund a payment. The change writes `pending_action` in its own
// transaction; this runs it right after, and the worker retries whatever failed, so a
// Stripe outage delays the money but never forgets it. Each call carries an idempotency
// key, so running one twice (the request and the worker at once) changes nothing.
// After each call the row is brought up to Stripe's record (syncPayment), through the
// webhook's own code, so the outcome never rests on a webhook that might not arrive.

import { nextCooldownMs } from "@/lib/time/backoff";
import { actionRetryDelayMs, STRIPE_BACKOFF } from "./retry";

// How long one process may take over a call before another may try it again: far longer
// than a Stripe request with its retries, short enough that a crashed worker's call is soon
// picked up (the idempotency key then makes the second attempt a replay, not a new call).
export const ACTION_CLAIM_MS = 5 * 60_000;

export { actionRetryDelayMs };

type Outcome = Partial<PaymentRow>;

async function perform(row: PaymentRow, clock: () => Date, q: Db): Promise<Outcome> {
  const key = `${row.pending_action}:${row.id}`;
  switch (row.pending_action) {
    case "open": {
      // The checkout Stripe could not make when it was asked for: made now, and the gardener
      // (or household) is told it is ready, with the hold renewed so there is time to pay.
      if (await startCheckout(row.id, clock, q)) await checkoutReadyLate(row.id, clock(), q);
      return {};
    }
    case "expire": {
      if (!row.provider_ref) return { status: "expired" };
      try {
        await stripe().checkout.sessions.expire(row.provider_ref, {}, { idempotencyKey: key });
      } catch (err) {
        // Already complete or expired: Stripe's record (read next) says which.
        if (!(err instanceof Stripe.errors.StripeInvalidRequestError && err.code === "checkout_session_unexpected_state")) throw err;
      }
      // A checkout paid at the last moment: applying it to the ended reservation returns
      // the money (a refund, or the hold released) and e-mails the gardener, webhook or not.
      await syncPayment(row.id, clock, q);
      return {};
    }
    case "release":
    case "capture": {
      const intent = row.payment_intent_id ?? (await intentOfSession(row));
      if (!intent) throw new Error("the deposit has no payment intent yet");
      try {
        if (row.pending_action === "release") {
          await stripe().paymentIntents.cancel(intent, { cancellation_reason: "requested_by_customer" }, { idempotencyKey: key });
        } else {
          await stripe().paymentIntents.capture(intent, {}, { idempotencyKey: key });
        }
        await syncPayment(row.id, clock, q);
        return { payment_intent_id: intent };
      } catch (err) {
        if (err instanceof Stripe.errors.StripeInvalidRequestError && err.code === "payment_intent_unexpected_state") {
          // Settled another way (a hold Stripe let lapse, or a second request): nothing left to do.
          await syncPayment(row.id, clock, q);
          return { payment_intent_id: intent, last_error: err.message.slice(0, 500) };
        }
        throw err;
      }
    }
    case "refund": {
      const parent = row.parent_id ? await findPayment(row.parent_id, q) : undefined;
      const intent = parent?.payment_intent_id ?? (parent ? await intentOfSession(parent) : null);
      if (!intent) throw new Error("the payment to refund has no payment intent yet");
      const refund = await stripe().refunds.create(
        {
          payment_intent: intent,
          amount: row.amount_cents,
          reason: "requested_by_customer",
          metadata: { refund_id: row.id, ...ownerMetadata(row) },
        },
        { idempotencyKey: row.idempotency_key },
      );
      await syncPayment(parent!.id, clock, q);
      return { provider_ref: refund.id, status: refund.status === "succeeded" ? "succeeded" : "pending" };
    }
    default:
      return {};
  }
}

async function intentOfSession(row: PaymentRow): Promise<string | null> {
  if (!row.provider_ref) return null;
  const session = await stripe().checkout.sessions.retrieve(row.provider_ref);
  return typeof session.payment_intent === "string" ? session.payment_intent : (session.payment_intent?.id ?? null);
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
type Attempt = "done" | "failed" | "unreachable" | "elsewhere";

async function attempt(id: string, clock: () => Date, q: Db): Promise<Attempt> {
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

/** Runs one payment's owed Stripe call; true when it is done (or nothing was owed, or another process is making it). */
export async function runPaymentAction(id: string, clock: () => Date = () => new Date(), q: Db = db()): Promise<boolean> {
  const outcome = await attempt(id, clock, q);
  return outcome === "done" || outcome === "elsewhere";
}

/**
 * Runs the calls a change owes, right after it commits. Once Stripe proves unreachable the
 * rest are not tried one timeout after another inside the request: they wait for Stripe,
 * and the worker makes them as soon as it answers.
 */
export async function runPaymentActions(ids: Iterable<string>, clock: () => Date = () => new Date(), q: Db = db()): Promise<void> {
  let unreachable = false;
  for (const id of new Set(ids)) {
    if (unreachable) await waitForStripe(id, clock, q);
    else unreachable = (await attempt(id, clock, q)) === "unreachable";
  }
}

async function waitForStripe(id: string, clock: () => Date, q: Db) {
  await q("payments")
    .where({ id })
    .whereNotNull("pending_action")
    .update({ waiting_for: "stripe", next_action_at: new Date(clock().getTime() + actionRetryDelayMs(1)).toISOString() });
}

// When Stripe answering a question last woke the calls waiting for it, and how long the next
// such wake must wait (0 until a woken call fails again).
const wakes = { last: 0, cooldownMs: 0 };

/**
 * The worker's job: every owed call that is due. Calls that failed because Stripe could not
 * be reached wait for it rather than for their backoff: as soon as Stripe answers (asked at
 * most every few seconds, or shown by any call going through) they are all due at once.
 * The first call that finds Stripe unreachable ends the batch; the rest wait for it too.
 */
export async function settlePayments(clock: () => Date = () => new Date(), q: Db = db(), opts: { signal?: AbortSignal } = {}): Promise<{ done: number; failed: number }> {
  let done = 0;
  let failed = 0;
  let woke = false;
  if ((await anyWaitingForStripe(q)) && Date.now() - wakes.last >= wakes.cooldownMs && (await probeStripe()).ok) {
    wakes.last = Date.now();
    woke = true;
    await wakeWaitingForStripe(clock().toISOString(), q);
  }
  let unreachable = false;
  for (const row of await dueActions(clock().toISOString(), 20, q)) {
    if (opts.signal?.aborted) break;
    if (unreachable) {
      await waitForStripe(row.id, clock, q);
      continue;
    }
    const outcome = await attempt(row.id, clock, q);
    if (outcome === "elsewhere") continue; // another worker took it between the read and the claim
    if (outcome === "done") {
      done++;
      wakes.cooldownMs = 0;
      if (done === 1 && (await anyWaitingForStripe(q))) await wakeWaitingForStripe(clock().toISOString(), q);
    } else {
      failed++;
      unreachable = outcome === "unreachable";
      // Stripe answered the question but not the call: the next such wake waits longer.
      if (unreachable && woke) wakes.cooldownMs = nextCooldownMs(wakes.cooldownMs, STRIPE_BACKOFF);
    }
  }
  return { done, failed };
}

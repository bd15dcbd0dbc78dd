import "server-only";
import { db, nowIso, type Db } from "@/db/index";
import { findPayment, noteCheckoutNotOpened } from "@/db/payments";
import { reservationContext } from "@/db/reservation-context";
import { appUrl } from "@/lib/env";
import { whatLabel } from "@/lib/reservations/labels";
import type { PaymentRow } from "@/db/types";
import { ownerMetadata, ownerOf } from "./owner";
import { createCheckoutSession, expireCheckoutSessionQuietly } from "./gateway";
import { stripeUnreachable } from "./stripe";
import { actionRetryDelayMs } from "./retry";

// A Checkout Session (mode payment) for one reservation or giveaway booking: automatic
// capture for a price, manual capture for a deposit (an authorisation hold). Created after the
// hold commits, with the payment row's idempotency key, so the SDK resending one request
// returns the same session. Each later attempt (after one that failed) has a key of its own:
// Stripe refuses a key reused with other parameters, and expires_at moves with the clock.

// Stripe lets a session live from 30 minutes to 24 hours; Duffbank closes it itself when
// the hold ends, so the session only needs to outlast the hold.
const SESSION_MIN_S = 31 * 60;
const SESSION_MAX_S = 23 * 60 * 60;

/** What a checkout is for, as its owner describes it; null once its owner no longer waits for it. */
interface CheckoutSubject {
  holdExpiresAt: string | null;
  email: string;
  what: string;
  reference: string;
  description: string;
  successUrl: string;
  cancelUrl: string;
}

async function subjectOf(payment: PaymentRow, q: Db): Promise<CheckoutSubject | null> {
  const owner = ownerOf(payment);
  const deposit = payment.kind === "deposit";
  if (owner.type === "reservation") {
    const r = await reservationContext(owner.id, q);
    if (!r || r.status !== "held") return null;
    return {
      holdExpiresAt: r.hold_expires_at,
      email: r.gardener.email,
      what: whatLabel(r),
      reference: r.id,
      description: deposit ? `Duffbank deposit for reservation ${r.id}` : `Duffbank reservation ${r.id}`,
      successUrl: `${appUrl()}/reservations/paid?session_id={CHECKOUT_SESSION_ID}`,
      cancelUrl: `${appUrl()}/reservations/${r.id}?checkout=cancelled`,
    };
  }
  const b = await q("giveaway_bookings as b")
    .join("giveaway_days as d", "d.id", "b.day_id")
    .join("users as u", "u.id", "b.user_id")
    .first("b.id", "b.day_id", "b.status", "b.deposit_status", "b.hold_expires_at", "d.title", "d.date", "u.email")
    .where("b.id", owner.id);
  if (!b || b.status !== "booked" || b.deposit_status !== "awaiting") return null;
  return {
    holdExpiresAt: b.hold_expires_at,
    email: b.email,
    what: `${b.title}, ${b.date}`,
    reference: b.id,
    description: `Duffbank no-show deposit for giveaway booking ${b.id}`,
    successUrl: `${appUrl()}/giveaways/${b.day_id}?deposit=done`,
    cancelUrl: `${appUrl()}/giveaways/${b.day_id}?deposit=cancelled`,
  };
}

/** The key of this attempt: the row's own for the first, numbered after each failed one. */
export function checkoutAttemptKey(payment: Pick<PaymentRow, "idempotency_key" | "action_attempts">): string {
  return payment.action_attempts > 0 ? `${payment.idempotency_key}:${payment.action_attempts}` : payment.idempotency_key;
}

export async function startCheckout(paymentId: string, clock: () => Date = () => new Date(), q: Db = db()): Promise<string | null> {
  const payment = await findPayment(paymentId, q);
  if (!payment || payment.kind === "refund") return null;
  if (payment.status === "open") return payment.checkout_url;
  if (payment.status !== "creating") return null;
  const subject = await subjectOf(payment, q);
  if (!subject) return null;

  const nowS = Math.floor(clock().getTime() / 1000);
  const holdS = subject.holdExpiresAt ? Math.floor(new Date(subject.holdExpiresAt).getTime() / 1000) : 0;
  const expiresAt = Math.min(nowS + SESSION_MAX_S, Math.max(nowS + SESSION_MIN_S, holdS + 60));
  const deposit = payment.kind === "deposit";
  const metadata = { ...ownerMetadata(payment), payment_id: payment.id, kind: payment.kind };
  const session = await createCheckoutSession(
    {
      mode: "payment",
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: payment.currency,
            unit_amount: payment.amount_cents,
            product_data: { name: deposit ? `Refundable no-show deposit: ${subject.what}` : subject.what },
          },
        },
      ],
      success_url: subject.successUrl,
      cancel_url: subject.cancelUrl,
      client_reference_id: subject.reference,
      customer_email: subject.email,
      metadata,
      payment_intent_data: {
        capture_method: deposit ? "manual" : "automatic",
        metadata,
        description: subject.description,
      },
      expires_at: expiresAt,
    },
    checkoutAttemptKey(payment),
  );
  const at = nowIso(clock);
  const n = await q("payments")
    .where({ id: payment.id, status: "creating" })
    .update({ provider_ref: session.id, checkout_url: session.url, status: "open", last_error: null, waiting_for: null, updated_at: at });
  if (n === 0) {
    // The hold ended while the session was being made: close it again so nobody pays for nothing.
    await expireCheckoutSessionQuietly(session.id);
    return null;
  }
  // Made at last: the worker no longer needs to try (an "expire" written meanwhile stays).
  await q("payments").where({ id: payment.id, pending_action: "open" }).update({ pending_action: null, next_action_at: null });
  return session.url;
}

/**
 * startCheckout for a request: Stripe gets a few seconds (lib/payments/stripe.ts), and when
 * the checkout cannot be made the payment is left to the worker (pending action "open"),
 * which makes it and tells the gardener. Null when there is no checkout to show now.
 */
export async function openCheckout(paymentId: string, clock: () => Date = () => new Date(), q: Db = db()): Promise<string | null> {
  return (await openCheckouts([paymentId], clock, q)).get(paymentId) ?? null;
}

/**
 * openCheckout for several payments (a "Reserve all"): once Stripe proves unreachable the
 * rest are not tried one timeout after another; they are left to the worker straight away.
 */
export async function openCheckouts(paymentIds: string[], clock: () => Date = () => new Date(), q: Db = db()): Promise<Map<string, string | null>> {
  const urls = new Map<string, string | null>();
  let away: unknown = null;
  for (const id of paymentIds) {
    if (away) {
      await notOpened(id, away, clock, q);
      urls.set(id, null);
      continue;
    }
    try {
      urls.set(id, await startCheckout(id, clock, q));
    } catch (err) {
      console.error(`[checkout] could not open the checkout of payment ${id}:`, (err as Error).message);
      await notOpened(id, err, clock, q);
      urls.set(id, null);
      if (stripeUnreachable(err)) away = err;
    }
  }
  return urls;
}

async function notOpened(paymentId: string, err: unknown, clock: () => Date, q: Db) {
  const row = await findPayment(paymentId, q);
  if (!row) return;
  const now = clock();
  const attempts = row.action_attempts + 1;
  await noteCheckoutNotOpened(
    paymentId,
    { attempts, nextAt: new Date(now.getTime() + actionRetryDelayMs(attempts)).toISOString(), error: (err as Error).message, waitingFor: stripeUnreachable(err) ? "stripe" : null, at: now.toISOString() },
    q,
  );
}

import "server-only";
import Stripe from "stripe";
import { stripe } from "./stripe";

// The Stripe calls Duffbank makes about a payment, through the official SDK
// (lib/payments/stripe.ts): make or close a checkout, let go of or capture a deposit hold,
// refund a payment, and read back Stripe's record. Each write that may be repeated carries
// the caller's idempotency key, so making it twice (a request and the worker at once)
// changes nothing. Nothing here writes to the database or knows what a payment pays for:
// lib/payments/checkout.ts says what a checkout is for, and
// lib/services/payments/settle-payment.ts decides when to call and applies what Stripe's
// record says.

/** Stripe's current record of a checkout: the session, its payment intent and that intent's charge. */
export interface CheckoutRecord {
  session: Stripe.Checkout.Session;
  intent: Stripe.PaymentIntent | null;
  charge: Stripe.Charge | null;
}

export async function checkoutRecord(sessionId: string): Promise<CheckoutRecord> {
  const session = await stripe().checkout.sessions.retrieve(sessionId, { expand: ["payment_intent"] });
  const pi = session.payment_intent;
  const intent = pi === null ? null : typeof pi === "string" ? await stripe().paymentIntents.retrieve(pi) : pi;
  const chargeId = intent?.latest_charge;
  const charge = typeof chargeId === "string" ? await stripe().charges.retrieve(chargeId) : ((chargeId as Stripe.Charge | null | undefined) ?? null);
  return { session, intent, charge };
}

/** Makes a checkout session (lib/payments/checkout.ts says for what), with the attempt's idempotency key. */
export function createCheckoutSession(params: Stripe.Checkout.SessionCreateParams, idempotencyKey: string): Promise<Stripe.Checkout.Session> {
  return stripe().checkout.sessions.create(params, { idempotencyKey });
}

/** Closes a checkout nobody should pay any more, on a best-effort basis: whatever Stripe answers is ignored. */
export async function expireCheckoutSessionQuietly(sessionId: string): Promise<void> {
  await stripe()
    .checkout.sessions.expire(sessionId)
    .catch(() => undefined);
}

/** The payment intent a checkout session made, if it has made one yet. */
export async function intentOfSession(sessionId: string | null): Promise<string | null> {
  if (!sessionId) return null;
  const session = await stripe().checkout.sessions.retrieve(sessionId);
  return typeof session.payment_intent === "string" ? session.payment_intent : (session.payment_intent?.id ?? null);
}

export function retrieveRefund(refundId: string): Promise<Stripe.Refund> {
  return stripe().refunds.retrieve(refundId);
}

/** Closes a checkout. One already complete or expired is not an error: its record (read next) says which. */
export async function expireCheckoutSession(sessionId: string, idempotencyKey: string): Promise<void> {
  try {
    await stripe().checkout.sessions.expire(sessionId, {}, { idempotencyKey });
  } catch (err) {
    if (!(err instanceof Stripe.errors.StripeInvalidRequestError && err.code === "checkout_session_unexpected_state")) throw err;
  }
}

/**
 * Lets go of ("release") or captures ("capture") a deposit hold. Returns null when done, or
 * Stripe's message when the hold was already settled another way (a hold Stripe let lapse, or
 * a second request): then there is nothing left to do but read the record.
 */
export async function settleHold(intentId: string, how: "release" | "capture", idempotencyKey: string): Promise<string | null> {
  try {
    if (how === "release") {
      await stripe().paymentIntents.cancel(intentId, { cancellation_reason: "requested_by_customer" }, { idempotencyKey });
    } else {
      await stripe().paymentIntents.capture(intentId, {}, { idempotencyKey });
    }
    return null;
  } catch (err) {
    if (err instanceof Stripe.errors.StripeInvalidRequestError && err.code === "payment_intent_unexpected_state") return err.message;
    throw err;
  }
}

export function createRefund(
  args: { intentId: string; amountCents: number; metadata: Record<string, string> },
  idempotencyKey: string,
): Promise<Stripe.Refund> {
  return stripe().refunds.create(
    { payment_intent: args.intentId, amount: args.amountCents, reason: "requested_by_customer", metadata: args.metadata },
    { idempotencyKey },
  );
}

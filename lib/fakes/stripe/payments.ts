import { assertChargeable, formatAmount } from "./amounts";
import { FakeStripeError, invalidRequest, missingResource, newId, randomToken, unexpectedState } from "./errors";
import type { CardAttempt } from "./test-cards";
import type { Charge, FakeStripeState, Metadata, PaymentError, PaymentIntent, PaymentIntentStatus, Refund, StripeObject } from "./types";

/** What every operation needs: the records, the clock, and a way to announce a change. */
export interface Ops {
  state: FakeStripeState;
  nowSeconds(): number;
  emit(type: string, object: StripeObject): void;
}

export function getPaymentIntent(ops: Ops, id: string): PaymentIntent {
  const pi = ops.state.paymentIntents.get(id);
  if (!pi) throw missingResource("payment_intent", id, "intent");
  return pi;
}

export interface NewPaymentIntent {
  amount: number;
  currency: string;
  capture_method: "automatic" | "manual";
  metadata: Metadata;
  description: string | null;
  receipt_email: string | null;
}

export function createPaymentIntent(ops: Ops, input: NewPaymentIntent): PaymentIntent {
  assertChargeable(input.amount, input.currency);
  const id = newId("pi_");
  const pi: PaymentIntent = {
    id,
    object: "payment_intent",
    amount: input.amount,
    amount_capturable: 0,
    amount_received: 0,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: input.capture_method,
    client_secret: `${id}_secret_${randomToken(25)}`,
    confirmation_method: "automatic",
    created: ops.nowSeconds(),
    currency: input.currency,
    description: input.description,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    metadata: input.metadata,
    payment_method: null,
    payment_method_types: ["card"],
    receipt_email: input.receipt_email,
    status: "requires_payment_method",
  };
  ops.state.paymentIntents.set(id, pi);
  ops.emit("payment_intent.created", pi);
  return pi;
}

const CONFIRMABLE: PaymentIntentStatus[] = ["requires_payment_method", "requires_confirmation"];

/**
 * Charges a test card against an intent, following Stripe's lifecycle: approved →
 * succeeded (automatic capture) or requires_capture (manual, an authorisation hold);
 * declined → back to requires_payment_method with last_payment_error, so the buyer can
 * try another card. A charge records every attempt, failed ones included, as on Stripe.
 */
export function chargeCard(ops: Ops, pi: PaymentIntent, attempt: CardAttempt): PaymentError | null {
  if (!CONFIRMABLE.includes(pi.status)) {
    throw unexpectedState(
      `This PaymentIntent's payment_method could not be updated because it has a status of ${pi.status}. You may only update the payment_method of a PaymentIntent with one of the following statuses: ${CONFIRMABLE.join(", ")}.`,
    );
  }
  const paymentMethod = newId("pm_");
  const approved = attempt.decline === null;
  const automatic = pi.capture_method === "automatic";
  const charge: Charge = {
    id: newId("ch_"),
    object: "charge",
    amount: pi.amount,
    amount_captured: approved && automatic ? pi.amount : 0,
    amount_refunded: 0,
    billing_details: { name: attempt.name, email: pi.receipt_email },
    captured: approved && automatic,
    created: ops.nowSeconds(),
    currency: pi.currency,
    failure_code: approved ? null : "card_declined",
    failure_message: attempt.decline?.message ?? null,
    livemode: false,
    metadata: { ...pi.metadata },
    outcome: approved
      ? { type: "authorized", network_status: "approved_by_network", reason: null }
      : { type: "issuer_declined", network_status: "declined_by_network", reason: attempt.decline!.decline_code },
    paid: approved,
    payment_intent: pi.id,
    payment_method: paymentMethod,
    payment_method_details: { type: "card", card: attempt.card },
    refunded: false,
    status: approved ? "succeeded" : "failed",
  };
  ops.state.charges.set(charge.id, charge);
  pi.latest_charge = charge.id;

  if (!approved) {
    const error: PaymentError = {
      type: "card_error",
      code: "card_declined",
      decline_code: attempt.decline!.decline_code,
      message: attempt.decline!.message,
      charge: charge.id,
      payment_method: { id: paymentMethod, object: "payment_method", type: "card", card: attempt.card },
    };
    pi.status = "requires_payment_method";
    pi.payment_method = null;
    pi.last_payment_error = error;
    ops.emit("charge.failed", charge);
    ops.emit("payment_intent.payment_failed", pi);
    return error;
  }

  pi.payment_method = paymentMethod;
  pi.last_payment_error = null;
  ops.emit("charge.succeeded", charge);
  if (automatic) {
    pi.status = "succeeded";
    pi.amount_received = pi.amount;
    ops.emit("payment_intent.succeeded", pi);
  } else {
    pi.status = "requires_capture";
    pi.amount_capturable = pi.amount;
    ops.emit("payment_intent.amount_capturable_updated", pi);
  }
  return null;
}

/** Same as chargeCard, but answers the API the way Stripe does: a decline is a 402. */
export function confirmWithCard(ops: Ops, pi: PaymentIntent, attempt: CardAttempt): PaymentIntent {
  const error = chargeCard(ops, pi, attempt);
  if (error) {
    throw new FakeStripeError(402, {
      type: "card_error",
      code: error.code,
      decline_code: error.decline_code,
      message: error.message,
      charge: error.charge,
      payment_intent: structuredClone(pi),
    });
  }
  return pi;
}

export function capturePaymentIntent(ops: Ops, id: string, amountToCapture: number | null): PaymentIntent {
  const pi = getPaymentIntent(ops, id);
  if (pi.status !== "requires_capture") {
    throw unexpectedState(
      `This PaymentIntent could not be captured because it has a status of ${pi.status}. Only a PaymentIntent with one of the following statuses may be captured: requires_capture.`,
    );
  }
  const amount = amountToCapture ?? pi.amount_capturable;
  if (amount < 1 || amount > pi.amount_capturable) {
    throw invalidRequest(
      `The amount to capture (${formatAmount(amount, pi.currency)}) must be between 1 and the capturable amount (${formatAmount(pi.amount_capturable, pi.currency)}).`,
      { param: "amount_to_capture", code: "amount_too_large" },
    );
  }
  const charge = ops.state.charges.get(pi.latest_charge!)!;
  charge.captured = true;
  charge.amount_captured = amount;
  pi.amount_received = amount;
  pi.amount_capturable = 0;
  pi.status = "succeeded";
  ops.emit("charge.captured", charge);
  ops.emit("payment_intent.succeeded", pi);
  return pi;
}

// Stripe's list of cancelable statuses (docs.stripe.com/api/payment_intents/cancel).
const CANCELABLE: PaymentIntentStatus[] = [
  "requires_payment_method",
  "requires_capture",
  "requires_confirmation",
  "requires_action",
  "processing",
];
export const CANCELLATION_REASONS = ["duplicate", "fraudulent", "requested_by_customer", "abandoned"] as const;
export type CancellationReason = (typeof CANCELLATION_REASONS)[number];

/**
 * Cancels an intent; an authorisation hold is released, which Stripe shows as the
 * uncaptured charge being refunded in full. `fromCheckout` is true when a session is
 * expiring: Stripe only lets the API cancel a Checkout-made intent that is on hold.
 */
export function cancelPaymentIntent(
  ops: Ops,
  id: string,
  reason: CancellationReason | null,
  fromCheckout = false,
): PaymentIntent {
  const pi = getPaymentIntent(ops, id);
  if (!CANCELABLE.includes(pi.status)) {
    throw unexpectedState(
      `You cannot cancel this PaymentIntent because it has a status of ${pi.status}. Only a PaymentIntent with one of the following statuses may be canceled: ${CANCELABLE.join(", ")}.`,
    );
  }
  if (!fromCheckout && pi.status !== "requires_capture" && sessionFor(ops, pi.id)) {
    throw unexpectedState(
      "This PaymentIntent belongs to a Checkout Session and is not on hold, so it cannot be canceled directly. Expire the Checkout Session instead.",
    );
  }
  if (pi.status === "requires_capture" && pi.latest_charge) {
    const charge = ops.state.charges.get(pi.latest_charge)!;
    charge.amount_refunded = charge.amount;
    charge.refunded = true;
    ops.emit("charge.refunded", charge);
  }
  pi.status = "canceled";
  pi.amount_capturable = 0;
  pi.canceled_at = ops.nowSeconds();
  pi.cancellation_reason = reason;
  ops.emit("payment_intent.canceled", pi);
  return pi;
}

function sessionFor(ops: Ops, paymentIntentId: string) {
  for (const session of ops.state.checkoutSessions.values()) {
    if (session.payment_intent === paymentIntentId) return session;
  }
  return null;
}

export interface NewRefund {
  payment_intent: string | null;
  charge: string | null;
  amount: number | null;
  reason: "duplicate" | "fraudulent" | "requested_by_customer" | null;
  metadata: Metadata;
}

export function createRefund(ops: Ops, input: NewRefund): Refund {
  let pi: PaymentIntent;
  if (input.payment_intent) pi = getPaymentIntent(ops, input.payment_intent);
  else if (input.charge) {
    const byCharge = ops.state.charges.get(input.charge);
    if (!byCharge) throw missingResource("charge", input.charge, "charge");
    pi = getPaymentIntent(ops, byCharge.payment_intent);
  } else {
    throw invalidRequest("One of the following params should be provided for this request: payment_intent or charge.");
  }
  if (pi.status !== "succeeded") {
    const hint = pi.status === "requires_capture" ? " To release an uncaptured hold, cancel the PaymentIntent instead." : "";
    throw invalidRequest(`This PaymentIntent (${pi.id}) does not have a successful charge to refund.${hint}`, {
      param: input.payment_intent ? "payment_intent" : "charge",
    });
  }
  const charge = ops.state.charges.get(pi.latest_charge!)!;
  const remaining = charge.amount_captured - charge.amount_refunded;
  if (remaining <= 0) {
    throw invalidRequest(`Charge ${charge.id} has already been refunded.`, { code: "charge_already_refunded" });
  }
  const amount = input.amount ?? remaining;
  if (amount < 1) throw invalidRequest("The refund amount must be at least 1.", { param: "amount" });
  if (amount > remaining) {
    throw invalidRequest(
      `Refund amount (${formatAmount(amount, charge.currency)}) is greater than unrefunded amount on charge (${formatAmount(remaining, charge.currency)})`,
      { code: "amount_too_large", param: "amount" },
    );
  }
  const refund: Refund = {
    id: newId("re_"),
    object: "refund",
    amount,
    charge: charge.id,
    created: ops.nowSeconds(),
    currency: charge.currency,
    metadata: input.metadata,
    payment_intent: pi.id,
    reason: input.reason,
    status: "succeeded",
  };
  ops.state.refunds.set(refund.id, refund);
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded >= charge.amount_captured;
  ops.emit("refund.created", refund);
  ops.emit("charge.refunded", charge);
  return refund;
}

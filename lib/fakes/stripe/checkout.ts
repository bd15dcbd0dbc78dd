import { assertChargeable } from "./amounts";
import { FakeStripeError, invalidRequest, missingResource, newId } from "./errors";
import {
  asArray,
  asObject,
  currency,
  metadata,
  optEnum,
  optInteger,
  optString,
  reqInteger,
  reqString,
  rejectUnknown,
  type Params,
} from "./params";
import { cancelPaymentIntent, chargeCard, createPaymentIntent, type Ops } from "./payments";
import type { CardAttempt } from "./test-cards";
import type { CheckoutSession, LineItem, PaymentError } from "./types";

// Checkout Sessions, payment mode only. The PaymentIntent is created when the buyer first
// submits the hosted page (as Stripe has done since API version 2022-08-01), so
// `payment_intent` is null until then; a declined first attempt already leaves an intent
// behind carrying last_payment_error.

// Stripe allows expires_at from 30 minutes to 24 hours after creation
// (docs.stripe.com/api/checkout/sessions/create#create_checkout_session-expires_at).
const MIN_EXPIRY_SECONDS = 30 * 60;
const MAX_EXPIRY_SECONDS = 24 * 60 * 60;

const SESSION_PARAMS = [
  "mode",
  "line_items",
  "success_url",
  "cancel_url",
  "metadata",
  "client_reference_id",
  "customer_email",
  "payment_intent_data",
  "expires_at",
  // Accepted and ignored: they change Stripe's page, not the payment.
  "payment_method_types",
  "locale",
  "submit_type",
  "billing_address_collection",
];
const INTENT_DATA_PARAMS = ["capture_method", "metadata", "description", "receipt_email"];

export function getSession(ops: Ops, id: string): CheckoutSession {
  const session = ops.state.checkoutSessions.get(id);
  if (!session) throw missingResource("checkout.session", id, "session");
  return session;
}

function url(params: Params, name: string): string | null {
  const value = optString(params, name);
  if (value === null) return null;
  try {
    const parsed = new URL(value.replace("{CHECKOUT_SESSION_ID}", "placeholder"));
    if (parsed.protocol === "http:" || parsed.protocol === "https:") return value;
  } catch {
    // fall through to the error below
  }
  throw invalidRequest(`Not a valid URL`, { param: name });
}

function lineItems(params: Params): LineItem[] {
  const raw = asArray(params.line_items, "line_items");
  if (raw.length === 0) {
    throw invalidRequest("You must specify either `line_items` or `price` in `payment` mode.", { param: "line_items" });
  }
  return raw.map((entry, i) => {
    const path = `line_items[${i}]`;
    const item = asObject(entry, path);
    if (item.price !== undefined) {
      throw invalidRequest(
        `The local fake has no Prices API; pass ${path}[price_data] instead of ${path}[price].`,
        { param: `${path}[price]` },
      );
    }
    const priceData = asObject(item.price_data, `${path}[price_data]`);
    const productData = asObject(priceData.product_data, `${path}[price_data][product_data]`);
    const cur = currency(priceData, "currency", `${path}[price_data][currency]`);
    const unitAmount = reqInteger(priceData, "unit_amount", `${path}[price_data][unit_amount]`);
    const quantity = reqInteger(item, "quantity", `${path}[quantity]`, 1);
    const name = reqString(productData, "name", `${path}[price_data][product_data][name]`);
    return {
      id: newId("li_"),
      object: "item",
      amount_subtotal: unitAmount * quantity,
      amount_total: unitAmount * quantity,
      currency: cur,
      description: name,
      quantity,
      price: { object: "price", currency: cur, unit_amount: unitAmount, product_name: name },
    };
  });
}

export function createSession(ops: Ops, params: Params, publicBaseUrl: string): CheckoutSession {
  rejectUnknown(params, SESSION_PARAMS);
  const mode = reqString(params, "mode");
  if (mode !== "payment") {
    throw invalidRequest(`The local fake supports only mode=payment, not ${mode}.`, { param: "mode" });
  }
  const types = asArray(params.payment_method_types, "payment_method_types");
  if (types.some((t) => t !== "card")) {
    throw invalidRequest("The local fake takes cards only; payment_method_types may only contain card.", {
      param: "payment_method_types",
    });
  }
  const items = lineItems(params);
  const cur = items[0].currency;
  if (items.some((item) => item.currency !== cur)) {
    throw invalidRequest("All line items must use the same currency.", { param: "line_items" });
  }
  const total = items.reduce((sum, item) => sum + item.amount_total, 0);
  assertChargeable(total, cur, "line_items");

  const intentData = asObject(params.payment_intent_data, "payment_intent_data");
  rejectUnknown(intentData, INTENT_DATA_PARAMS);
  const capture =
    optEnum(intentData, "capture_method", ["automatic", "automatic_async", "manual"], "payment_intent_data[capture_method]") ??
    "automatic";

  const template = {
    // automatic_async differs from automatic only in when Stripe settles; same outcome here.
    capture_method: capture === "manual" ? ("manual" as const) : ("automatic" as const),
    metadata: metadata(intentData, "metadata", {}, "payment_intent_data[metadata]"),
    description: optString(intentData, "description", "payment_intent_data[description]"),
  };
  const receiptEmail = optString(intentData, "receipt_email", "payment_intent_data[receipt_email]");

  const created = ops.nowSeconds();
  const expiresAt = optInteger(params, "expires_at") ?? created + MAX_EXPIRY_SECONDS;
  if (expiresAt < created + MIN_EXPIRY_SECONDS || expiresAt > created + MAX_EXPIRY_SECONDS) {
    throw invalidRequest(
      "The `expires_at` timestamp must be between 30 minutes and 24 hours after the Checkout Session is created.",
      { param: "expires_at" },
    );
  }

  const id = newId("cs_test_");
  const session: CheckoutSession = {
    id,
    object: "checkout.session",
    amount_subtotal: total,
    amount_total: total,
    cancel_url: url(params, "cancel_url"),
    client_reference_id: optString(params, "client_reference_id"),
    created,
    currency: cur,
    customer_details: null,
    customer_email: optString(params, "customer_email"),
    expires_at: expiresAt,
    livemode: false,
    metadata: metadata(params, "metadata"),
    mode: "payment",
    payment_intent: null,
    payment_method_types: ["card"],
    payment_status: "unpaid",
    status: "open",
    success_url: url(params, "success_url"),
    url: `${publicBaseUrl}/pay/${id}`,
  };
  ops.state.checkoutSessions.set(id, session);
  ops.state.sessionLineItems.set(id, items);
  ops.state.sessionIntentTemplates.set(id, { ...template, receipt_email: receiptEmail ?? session.customer_email });
  return session;
}

/** Pays an open session from the hosted page; a decline leaves it open for another try. */
export function paySession(ops: Ops, id: string, attempt: CardAttempt): PaymentError | null {
  const session = getSession(ops, id);
  if (session.status !== "open") {
    throw invalidRequest(`This Checkout Session is ${session.status} and can no longer be paid.`);
  }
  let pi = session.payment_intent ? ops.state.paymentIntents.get(session.payment_intent)! : null;
  if (!pi) {
    const template = ops.state.sessionIntentTemplates.get(id)!;
    pi = createPaymentIntent(ops, {
      amount: session.amount_total,
      currency: session.currency,
      capture_method: template.capture_method,
      metadata: { ...template.metadata },
      description: template.description,
      receipt_email: template.receipt_email,
    });
    session.payment_intent = pi.id;
  }
  const error = chargeCard(ops, pi, attempt);
  if (error) return error;

  session.status = "complete";
  // With manual capture the money is only on hold, and Stripe reports the session unpaid.
  session.payment_status = pi.status === "succeeded" ? "paid" : "unpaid";
  session.customer_details = { email: session.customer_email, name: attempt.name };
  session.url = null;
  ops.emit("checkout.session.completed", session);
  return null;
}

export function expireSession(ops: Ops, id: string): CheckoutSession {
  const session = getSession(ops, id);
  if (session.status !== "open") {
    throw new FakeStripeError(400, {
      type: "invalid_request_error",
      code: "checkout_session_unexpected_state",
      message: `Only Checkout Sessions with a status of open can be expired; this one is ${session.status}.`,
    });
  }
  session.status = "expired";
  session.url = null;
  ops.emit("checkout.session.expired", session);
  const pi = session.payment_intent ? ops.state.paymentIntents.get(session.payment_intent) : undefined;
  if (pi && pi.status === "requires_payment_method") cancelPaymentIntent(ops, pi.id, "abandoned", true);
  return session;
}

/** Expires every open session whose expires_at has passed; returns how many changed. */
export function expireDueSessions(ops: Ops): number {
  const now = ops.nowSeconds();
  let count = 0;
  for (const session of ops.state.checkoutSessions.values()) {
    if (session.status === "open" && session.expires_at <= now) {
      expireSession(ops, session.id);
      count++;
    }
  }
  return count;
}

import { createSession, expireSession, getSession } from "./checkout";
import { invalidRequest, missingResource } from "./errors";
import {
  currency,
  expandList,
  metadata,
  optBoolean,
  optEnum,
  optInteger,
  optString,
  reqInteger,
  reqString,
  rejectUnknown,
  type Params,
} from "./params";
import {
  CANCELLATION_REASONS,
  cancelPaymentIntent,
  capturePaymentIntent,
  confirmWithCard,
  createPaymentIntent,
  createRefund,
  getPaymentIntent,
  type Ops,
} from "./payments";
import { TEST_PAYMENT_METHODS, attemptFor } from "./test-cards";

export interface ApiContext {
  ops: Ops;
  publicBaseUrl: string;
}

type Handler = (ctx: ApiContext, params: Params, ids: string[]) => object;

interface Route {
  method: "GET" | "POST";
  pattern: RegExp;
  handler: Handler;
}

const ID = "([A-Za-z0-9_]+)";
const routes: Route[] = [];
function route(method: Route["method"], path: string, handler: Handler) {
  routes.push({ method, pattern: new RegExp(`^${path.replaceAll(":id", ID)}$`), handler });
}

export function matchApiRoute(method: string, pathname: string): { handler: Handler; ids: string[] } | null {
  for (const r of routes) {
    const m = r.method === method ? r.pattern.exec(pathname) : null;
    if (m) return { handler: r.handler, ids: m.slice(1) };
  }
  return null;
}

// ---- Checkout Sessions -------------------------------------------------------------

route("POST", "/v1/checkout/sessions", (ctx, p) => present(ctx, createSession(ctx.ops, p, ctx.publicBaseUrl), p));
route("GET", "/v1/checkout/sessions/:id", (ctx, p, [id]) => present(ctx, getSession(ctx.ops, id), p));
route("GET", "/v1/checkout/sessions/:id/line_items", (ctx, _p, [id]) => lineItemList(ctx, id));
route("POST", "/v1/checkout/sessions/:id/expire", (ctx, p, [id]) => {
  rejectUnknown(p, []);
  return present(ctx, expireSession(ctx.ops, id), p);
});

// ---- PaymentIntents ----------------------------------------------------------------

const INTENT_PARAMS = [
  "amount",
  "currency",
  "capture_method",
  "metadata",
  "description",
  "receipt_email",
  "confirm",
  "payment_method",
  // Accepted and ignored: cards are the only method the fake has.
  "payment_method_types",
  "automatic_payment_methods",
];

route("POST", "/v1/payment_intents", (ctx, p) => {
  rejectUnknown(p, INTENT_PARAMS);
  const pi = createPaymentIntent(ctx.ops, {
    amount: reqInteger(p, "amount", "amount", 1),
    currency: currency(p, "currency"),
    capture_method: optEnum(p, "capture_method", ["automatic", "automatic_async", "manual"]) === "manual" ? "manual" : "automatic",
    metadata: metadata(p, "metadata"),
    description: optString(p, "description"),
    receipt_email: optString(p, "receipt_email"),
  });
  if (optBoolean(p, "confirm")) confirm(ctx, pi.id, p);
  return present(ctx, pi, p);
});
route("GET", "/v1/payment_intents/:id", (ctx, p, [id]) => present(ctx, getPaymentIntent(ctx.ops, id), p));
route("POST", "/v1/payment_intents/:id", (ctx, p, [id]) => {
  rejectUnknown(p, ["metadata", "description", "receipt_email"]);
  const pi = getPaymentIntent(ctx.ops, id);
  const meta = metadata(p, "metadata", pi.metadata);
  const description = p.description !== undefined ? optString(p, "description") : pi.description;
  const email = p.receipt_email !== undefined ? optString(p, "receipt_email") : pi.receipt_email;
  Object.assign(pi, { metadata: meta, description, receipt_email: email });
  return present(ctx, pi, p);
});
route("POST", "/v1/payment_intents/:id/confirm", (ctx, p, [id]) => {
  rejectUnknown(p, ["payment_method", "return_url"]);
  return present(ctx, confirm(ctx, id, p), p);
});
route("POST", "/v1/payment_intents/:id/capture", (ctx, p, [id]) => {
  rejectUnknown(p, ["amount_to_capture", "metadata"]);
  const amount = optInteger(p, "amount_to_capture", "amount_to_capture", 1);
  const meta = metadata(p, "metadata", getPaymentIntent(ctx.ops, id).metadata);
  const pi = capturePaymentIntent(ctx.ops, id, amount);
  pi.metadata = meta;
  return present(ctx, pi, p);
});
route("POST", "/v1/payment_intents/:id/cancel", (ctx, p, [id]) => {
  rejectUnknown(p, ["cancellation_reason"]);
  const reason = optEnum(p, "cancellation_reason", CANCELLATION_REASONS);
  return present(ctx, cancelPaymentIntent(ctx.ops, id, reason), p);
});

/** Server-side confirmation with one of Stripe's test PaymentMethod ids (pm_card_visa…). */
function confirm(ctx: ApiContext, id: string, p: Params) {
  const pi = getPaymentIntent(ctx.ops, id);
  const pm = optString(p, "payment_method");
  if (pm === null) {
    throw invalidRequest(
      "You cannot confirm this PaymentIntent because it's missing a payment method. Pass payment_method (for example pm_card_visa).",
      { code: "payment_intent_unexpected_state", param: "payment_method" },
    );
  }
  const number = TEST_PAYMENT_METHODS[pm];
  if (!number) throw missingResource("PaymentMethod", pm, "payment_method");
  const nextYear = new Date(ctx.ops.nowSeconds() * 1000).getUTCFullYear() + 1;
  return confirmWithCard(ctx.ops, pi, attemptFor(number, 12, nextYear, null)!);
}

// ---- Refunds, charges, events ------------------------------------------------------

route("POST", "/v1/refunds", (ctx, p) => {
  rejectUnknown(p, ["payment_intent", "charge", "amount", "reason", "metadata"]);
  const refund = createRefund(ctx.ops, {
    payment_intent: optString(p, "payment_intent"),
    charge: optString(p, "charge"),
    amount: optInteger(p, "amount", "amount", 1),
    reason: optEnum(p, "reason", ["duplicate", "fraudulent", "requested_by_customer"]),
    metadata: metadata(p, "metadata"),
  });
  return present(ctx, refund, p);
});
route("GET", "/v1/refunds/:id", (ctx, p, [id]) => present(ctx, found(ctx.ops.state.refunds.get(id), "refund", id), p));
route("GET", "/v1/charges/:id", (ctx, p, [id]) => present(ctx, found(ctx.ops.state.charges.get(id), "charge", id), p));
route("GET", "/v1/events/:id", (ctx, _p, [id]) => found(ctx.ops.state.events.get(id), "event", id));

// ---- Balance -----------------------------------------------------------------------

// Test-mode money never pays out, so it all sits in "pending": what was captured less what
// was refunded, per currency. The app reads it only to see that the API answers.
route("GET", "/v1/balance", (ctx) => {
  const pending = new Map<string, number>();
  for (const c of ctx.ops.state.charges.values()) pending.set(c.currency, (pending.get(c.currency) ?? 0) + c.amount_captured - c.amount_refunded);
  const funds = [...pending].map(([currency, amount]) => ({ amount, currency, source_types: { card: amount } }));
  return { object: "balance", available: funds.map((f) => ({ ...f, amount: 0, source_types: { card: 0 } })), pending: funds, livemode: false };
});

function found<T>(value: T | undefined, kind: string, id: string): T {
  if (value === undefined) throw missingResource(kind, id);
  return value;
}

// ---- Expansion ---------------------------------------------------------------------

function lineItemList(ctx: ApiContext, sessionId: string) {
  getSession(ctx.ops, sessionId);
  return {
    object: "list",
    data: ctx.ops.state.sessionLineItems.get(sessionId) ?? [],
    has_more: false,
    url: `/v1/checkout/sessions/${sessionId}/line_items`,
  };
}

/**
 * Answers with a copy (so later changes don't leak into a stored idempotent reply) and
 * swaps the requested ids for the objects they name, as `expand[]` does on Stripe.
 * Only top-level fields the fake has records for can be expanded.
 */
function present(ctx: ApiContext, object: { id: string; object: string }, params: Params): object {
  const out = structuredClone(object) as unknown as Record<string, unknown>;
  const { state } = ctx.ops;
  for (const path of expandList(params)) {
    const value = out[path];
    if (path === "line_items" && object.object === "checkout.session") {
      out.line_items = lineItemList(ctx, object.id);
    } else if (typeof value === "string") {
      const target =
        state.paymentIntents.get(value) ?? state.charges.get(value) ?? state.refunds.get(value) ?? state.checkoutSessions.get(value);
      if (target) out[path] = structuredClone(target);
    } else if (!(path in out)) {
      throw invalidRequest(`This property cannot be expanded (${path}).`, { param: "expand" });
    }
  }
  return out;
}

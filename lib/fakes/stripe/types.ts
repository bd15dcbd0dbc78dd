// Shapes of the objects the fake keeps and returns. They carry the subset of Stripe's
// fields that Duffbank reads, with Stripe's names and types, so code written against the
// fake reads the same fields on the real API. Fields the fake does not model are absent
// rather than invented.

export type Metadata = Record<string, string>;

export interface CardDetails {
  brand: string;
  last4: string;
  exp_month: number;
  exp_year: number;
  funding: "credit" | "debit";
}

export interface PaymentError {
  type: "card_error";
  code: string;
  decline_code?: string;
  message: string;
  charge?: string;
  payment_method?: { id: string; object: "payment_method"; type: "card"; card: CardDetails };
}

export type PaymentIntentStatus =
  | "requires_payment_method"
  | "requires_confirmation"
  | "requires_action"
  | "processing"
  | "requires_capture"
  | "succeeded"
  | "canceled";

export interface PaymentIntent {
  id: string;
  object: "payment_intent";
  amount: number;
  amount_capturable: number;
  amount_received: number;
  canceled_at: number | null;
  cancellation_reason: string | null;
  capture_method: "automatic" | "manual";
  client_secret: string;
  confirmation_method: "automatic";
  created: number;
  currency: string;
  description: string | null;
  last_payment_error: PaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  payment_method: string | null;
  payment_method_types: string[];
  receipt_email: string | null;
  status: PaymentIntentStatus;
}

export interface Charge {
  id: string;
  object: "charge";
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  billing_details: { name: string | null; email: string | null };
  captured: boolean;
  created: number;
  currency: string;
  failure_code: string | null;
  failure_message: string | null;
  livemode: false;
  metadata: Metadata;
  outcome: { type: "authorized" | "issuer_declined"; network_status: string; reason: string | null };
  paid: boolean;
  payment_intent: string;
  payment_method: string;
  payment_method_details: { type: "card"; card: CardDetails };
  refunded: boolean;
  status: "succeeded" | "failed";
}

export interface Refund {
  id: string;
  object: "refund";
  amount: number;
  charge: string;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: string | null;
  status: "succeeded";
}

export interface LineItem {
  id: string;
  object: "item";
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  description: string;
  quantity: number;
  price: { object: "price"; currency: string; unit_amount: number; product_name: string };
}

export interface CheckoutSession {
  id: string;
  object: "checkout.session";
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer_details: { email: string | null; name: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Metadata;
  mode: "payment";
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: "paid" | "unpaid";
  status: "open" | "complete" | "expired";
  success_url: string | null;
  url: string | null;
}

/** What a Checkout Session asks of the PaymentIntent it creates once the buyer pays. */
export interface SessionIntentTemplate {
  capture_method: "automatic" | "manual";
  metadata: Metadata;
  description: string | null;
  receipt_email: string | null;
}

export type StripeObject = PaymentIntent | Charge | Refund | CheckoutSession;

export interface StripeEvent {
  id: string;
  object: "event";
  api_version: string;
  created: number;
  data: { object: StripeObject };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface DeliveryAttempt {
  eventId: string;
  type: string;
  objectId: string;
  attempt: number;
  url: string;
  at: number;
  /** HTTP status the receiver answered, or null when the connection failed. */
  status: number | null;
  ok: boolean;
  error?: string;
}

export interface IdempotentEntry {
  method: string;
  path: string;
  paramsJson: string;
  status: number;
  body: unknown;
}

export interface FakeStripeState {
  checkoutSessions: Map<string, CheckoutSession>;
  /** Line items and the PaymentIntent template, kept beside the session as Stripe does. */
  sessionLineItems: Map<string, LineItem[]>;
  sessionIntentTemplates: Map<string, SessionIntentTemplate>;
  paymentIntents: Map<string, PaymentIntent>;
  charges: Map<string, Charge>;
  refunds: Map<string, Refund>;
  /** Every event in the order it was created. */
  events: Map<string, StripeEvent>;
  deliveries: DeliveryAttempt[];
  idempotency: Map<string, IdempotentEntry>;
}

/** Who caused a change: the API request (for an event's `request` field) or the hosted page. */
export interface RequestInfo {
  id: string | null;
  idempotencyKey: string | null;
}

// The reservation policy in one place: how long a hold lasts, who may move a reservation
// from which state, and what a cancellation costs. Pure (no I/O) so the pages, the route
// handlers and the tests all read the same rules.
//
// The rule for "confirmed":
//   1. Every new reservation is `held` for HOLD_MINUTES (hold_expires_at).
//   2. The gardener's step: nothing for a free listing without a deposit; paying for a
//      priced listing; authorising the deposit of a free listing with one. Only a Stripe
//      webhook completes this step, never the browser coming back from checkout.
//   3. Once the gardener's step is done, an auto-accept listing confirms at once. Otherwise
//      the supplier accepts (or declines); a gardener who has paid or put down a deposit
//      has committed, so the hold is extended to SUPPLIER_REPLY_HOURS for that answer.
//   4. A hold that runs out expires: the quantity returns, an open checkout is closed, and
//      any money taken is returned in full.
// A priced listing takes its price only; deposits apply to free listings.

export const DEFAULT_HOLD_MINUTES = 30;
/** An operator (or a demo) may shorten or lengthen the hold; tests use a moved clock instead. */
export function holdMinutes(env: Record<string, string | undefined> = process.env): number {
  const n = Number(env.HOLD_MINUTES);
  return Number.isFinite(n) && n > 0 ? n : DEFAULT_HOLD_MINUTES;
}
// How long a supplier has to answer once the gardener has paid (common practice, no source).
export const SUPPLIER_REPLY_HOURS = 48;
// Cancelling at least this long before the pickup window starts is "timely": a deposit is
// released and a payment refunded in full (common practice, no source).
export const CANCEL_NOTICE_HOURS = 24;
// With no pickup window chosen, the pickup is arranged by message within this time.
export const NO_WINDOW_PICKUP_DAYS = 7;
export const EXPIRY_WARNING_MINUTES = 10;
export const PICKUP_REMINDER_HOURS = 24;
// Messages: at most this many per person per reservation in the window (anti-spam).
export const MESSAGE_LIMIT = { count: 5, windowMinutes: 10 } as const;

export const RESERVATION_STATUSES = ["held", "confirmed", "collected", "declined", "cancelled", "expired", "no_show"] as const;
export type ReservationStatus = (typeof RESERVATION_STATUSES)[number];
// "unpaid": the reservation ended (cancelled, declined, expired) while its payment was still
// awaited; the checkout was closed and nothing was taken.
export type PaymentState = "none" | "awaiting" | "unpaid" | "paid" | "authorised" | "released" | "captured" | "refunded";
export type Side = "gardener" | "supplier";

export const ACTIONS = ["confirm", "decline", "cancel", "collect", "no_show"] as const;
export type ReservationAction = (typeof ACTIONS)[number];

export const TRANSITIONS: Record<ReservationAction, { from: ReservationStatus[]; by: Side[]; to: ReservationStatus }> = {
  confirm: { from: ["held"], by: ["supplier"], to: "confirmed" },
  decline: { from: ["held"], by: ["supplier"], to: "declined" },
  cancel: { from: ["held", "confirmed"], by: ["gardener", "supplier"], to: "cancelled" },
  collect: { from: ["confirmed"], by: ["supplier"], to: "collected" },
  no_show: { from: ["confirmed"], by: ["supplier"], to: "no_show" },
};

export interface TransitionSubject {
  status: ReservationStatus;
  payment_state: PaymentState;
  pickup_by: string | null;
  /** Live-culture orders (lib/reservations/culture-orders.ts); absent or null for other material. */
  fulfilment?: "pickup" | "post" | null;
  order_stage?: string | null;
}

/** Why an action cannot happen now, or null when it can. `side` is the party asking. */
export function blockedReason(r: TransitionSubject, action: ReservationAction, side: Side, now: Date): string | null {
  const t = TRANSITIONS[action];
  if (!t.by.includes(side)) return "wrong_party";
  if (!t.from.includes(r.status)) return `This reservation is ${r.status.replace("_", " ")}.`;
  if (action === "confirm" && r.payment_state === "awaiting") return "The gardener has not paid yet; you can accept once the payment is through.";
  if (action === "no_show" && (!r.pickup_by || new Date(r.pickup_by) > now)) return "A no-show can be recorded once the pickup time has passed.";
  // A posted culture is never collected at the gate, and a parcel in the post cannot be called back.
  if (r.fulfilment === "post" && (action === "collect" || action === "no_show")) return "This culture is posted: mark it packed, shipped and delivered instead.";
  if (action === "cancel" && r.order_stage === "shipped") return "The parcel is on its way and can no longer be cancelled; write to the other side in the messages.";
  if (action === "cancel" && side === "gardener" && r.order_stage === "packed") return "The grower has packed it already; ask them in the messages.";
  return null;
}

export function allowedActions(r: TransitionSubject, side: Side, now: Date): ReservationAction[] {
  return ACTIONS.filter((a) => blockedReason(r, a, side, now) === null);
}

/** Whether the gardener still owes the payment or deposit that completes their step. */
export const owesPayment = (r: { status: ReservationStatus; payment_state: PaymentState }) => r.status === "held" && r.payment_state === "awaiting";

/**
 * A gardener's cancellation is timely while the supplier has not confirmed, or at least
 * CANCEL_NOTICE_HOURS before the pickup starts. A supplier's cancellation always returns
 * everything: the gardener did nothing wrong.
 */
export function cancellationIsTimely(
  r: { status: ReservationStatus; pickup_at: string | null; pickup_by: string | null; fulfilment?: "pickup" | "post" | null },
  side: Side,
  now: Date,
): boolean {
  // A posted culture can only be cancelled before it is packed: nothing is lost yet.
  if (side === "supplier" || r.status === "held" || r.fulfilment === "post") return true;
  const start = r.pickup_at ?? r.pickup_by;
  if (!start) return true;
  return new Date(start).getTime() - now.getTime() >= CANCEL_NOTICE_HOURS * 3_600_000;
}

// In our own words, the way the two people would say it to each other.
export const STATUS_LABELS: Record<ReservationStatus, string> = {
  held: "Asked, waiting for a yes",
  confirmed: "Agreed",
  collected: "Passed on",
  declined: "Turned down",
  cancelled: "Called off",
  expired: "No answer in time",
  no_show: "Nobody came",
};

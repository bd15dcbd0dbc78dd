// The reservation policy in one place: how long a hold lasts, who may move a reservation
// from which state, and what a cancellation costs. Pure (no I/O) so the pages, the route
// handlers and the tests all read the same rules.
//
// The rule for "confirmed":
//   1. Every new reservation is `held` (hold_expires_at). How long follows what it waits for
//      (holdFor below): the gardener's checkout gets HOLD_MINUTES; a request waiting for the
//      supplier's answer gets SUPPLIER_REPLY_HOURS, cut short so it always ends when the
//      chosen pickup starts: no supplier is asked to answer after the pickup time.
//   2. The gardener's step: nothing for a free listing without a deposit; paying for a
//      priced listing; authorising the deposit of a free listing with one. Only a Stripe
//      webhook completes this step, never the browser coming back from checkout.
//   3. Once the gardener's step is done, an auto-accept listing confirms at once. Otherwise
//      the supplier accepts (or declines) within the answer window, which starts then; the
//      supplier is reminded half-way through it.
//   4. A hold that runs out expires: the quantity returns, an open checkout is closed, and
//      any money taken is returned in full.
// A priced listing takes its price only; deposits apply to free listings.

import { sharedEnv } from "@/lib/env-shared";

export const DEFAULT_HOLD_MINUTES = 30;
/** An operator (or a demo) may shorten or lengthen the hold; tests use a moved clock instead. */
export function holdMinutes(env?: Record<string, string | undefined>): number {
  return sharedEnv(env).HOLD_MINUTES ?? DEFAULT_HOLD_MINUTES;
}
// How long a supplier has to answer a request, at most (common practice, no source): two days
// covers a weekend away from e-mail without leaving a gardener waiting for a week.
export const SUPPLIER_REPLY_HOURS = 48;
// The least time a request leaves the supplier to answer before the pickup starts (common
// practice, no source): a pickup window that starts sooner is too soon to ask for.
export const MIN_ANSWER_MINUTES = 60;
// Cancelling at least this long before the pickup window starts is "timely": a deposit is
// released and a payment refunded in full (common practice, no source).
export const CANCEL_NOTICE_HOURS = 24;
// With no pickup window chosen, the pickup is arranged by message within this time.
export const NO_WINDOW_PICKUP_DAYS = 7;
export const EXPIRY_WARNING_MINUTES = 10;
export const PICKUP_REMINDER_HOURS = 24;
// Messages: at most this many per person per reservation in the window (anti-spam).
export const MESSAGE_LIMIT = { count: 5, windowMinutes: 10 } as const;

/** What a held reservation waits for: the gardener's checkout, or the supplier's answer. */
export type HoldWait = "checkout" | "answer";

/** What a new reservation waits for, or null when it is confirmed at once (nothing to pay, auto-accept). */
export function holdWaitFor(r: { owes: boolean; autoAccept: boolean }): HoldWait | null {
  if (r.owes) return "checkout";
  return r.autoAccept ? null : "answer";
}

const HOUR_MS = 3_600_000;

/**
 * When the supplier has to answer a request asked at `askedAt`: SUPPLIER_REPLY_HOURS later,
 * or when the pickup starts (`pickupStart`: the chosen window's start, or the last day to
 * collect when no time was fixed), whichever comes first.
 */
export function answerDeadline(askedAt: Date, pickupStart: Date | string | null): Date {
  const full = askedAt.getTime() + SUPPLIER_REPLY_HOURS * HOUR_MS;
  const start = pickupStart === null ? Infinity : new Date(pickupStart).getTime();
  return new Date(Math.max(askedAt.getTime(), Math.min(full, start)));
}

/** Half-way through the answer window: when the supplier is reminded. */
export function answerReminderAt(askedAt: Date, deadline: Date): Date {
  return new Date(askedAt.getTime() + (deadline.getTime() - askedAt.getTime()) / 2);
}

/**
 * The hold of a new reservation: until when, and when to remind the supplier (answer holds
 * only). `pickupStart` as for answerDeadline.
 */
export function holdFor(wait: HoldWait, now: Date, pickupStart: Date | string | null, minutes = holdMinutes()): { hold_expires_at: string; answer_remind_at: string | null } {
  if (wait === "checkout") return { hold_expires_at: new Date(now.getTime() + minutes * 60_000).toISOString(), answer_remind_at: null };
  const deadline = answerDeadline(now, pickupStart);
  return { hold_expires_at: deadline.toISOString(), answer_remind_at: answerReminderAt(now, deadline).toISOString() };
}

/**
 * The earliest a chosen pickup may start for a new reservation: a request the supplier must
 * answer leaves them MIN_ANSWER_MINUTES, after the checkout's hold when there is one to pay.
 * Null when any window that has not ended will do (nothing to answer).
 */
export function earliestPickupStart(now: Date, r: { owes: boolean; autoAccept: boolean }, minutes = holdMinutes()): Date | null {
  if (r.autoAccept) return null;
  return new Date(now.getTime() + (r.owes ? minutes * 60_000 : 0) + MIN_ANSWER_MINUTES * 60_000);
}

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

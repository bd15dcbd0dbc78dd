// Live-culture orders: a reservation of a worm listing that records how the worms reach the
// buyer, and, once confirmed, how far the parcel has got. Pure (no I/O), like policy.ts, so
// the pages show exactly the steps the routes accept.
//
//   posted:    paid → packed → shipped (carrier, tracking) → delivered
//   collected: paid → collected (the ordinary pickup, with the pickup code)
//
// "paid" is the stage a confirmed order starts in (a free culture is simply confirmed). The
// reservation's own status stays "confirmed" until the parcel is delivered or the culture
// collected; both close it as "collected", so stock, reviews and the diversion figures treat
// a delivered culture like any other material that left the grower's hands.
import { WORMS_PER_KG } from "@/lib/calc/facts";
import type { ReservationStatus, Side } from "./policy";
import { PICKUP_TIME_ZONE } from "./pickup-times";

export const FULFILMENTS = ["pickup", "post"] as const;
export type Fulfilment = (typeof FULFILMENTS)[number];

export const ORDER_STAGES = ["paid", "packed", "shipped", "delivered", "collected"] as const;
export type OrderStage = (typeof ORDER_STAGES)[number];

export const ORDER_ACTIONS = ["pack", "ship", "deliver"] as const;
export type OrderAction = (typeof ORDER_ACTIONS)[number];

export const ORDER_TRANSITIONS: Record<OrderAction, { from: OrderStage; by: Side[]; to: OrderStage }> = {
  pack: { from: "paid", by: ["supplier"], to: "packed" },
  ship: { from: "packed", by: ["supplier"], to: "shipped" },
  // The buyer says it arrived, or the grower records it from the carrier's tracking.
  deliver: { from: "shipped", by: ["gardener", "supplier"], to: "delivered" },
};

/** The stages each way of receiving goes through, in order: the progress line on a card. */
export const STAGES_OF: Record<Fulfilment, OrderStage[]> = {
  post: ["paid", "packed", "shipped", "delivered"],
  pickup: ["paid", "collected"],
};

export const ORDER_STAGE_LABELS: Record<OrderStage, string> = {
  paid: "Paid",
  packed: "Packed",
  shipped: "Shipped",
  delivered: "Delivered",
  collected: "Collected",
};

/** The same stages as the buyer and the grower follow them on screen, in the worm trade's words. */
export const JOURNEY_LABELS: Record<OrderStage, string> = {
  paid: "Paid for",
  packed: "Boxed in bedding",
  shipped: "In the post",
  delivered: "Arrived",
  collected: "Fetched from the grower",
};

/** "Paid" reads oddly for a free culture; it is simply confirmed. */
export const stageLabel = (stage: OrderStage, amountCents: number) => (stage === "paid" && amountCents === 0 ? "Agreed" : JOURNEY_LABELS[stage]);

export const FULFILMENT_LABELS: Record<Fulfilment, string> = { pickup: "Collected from the grower", post: "Posted" };

export interface OrderSubject {
  status: ReservationStatus;
  fulfilment: Fulfilment | null;
  order_stage: OrderStage | null;
}

/** Why a parcel step cannot happen now (null when it can); "wrong_party" for the wrong side. */
export function orderBlockedReason(r: OrderSubject, action: OrderAction, side: Side, opts: { postingPaused: boolean }): string | null {
  const t = ORDER_TRANSITIONS[action];
  if (!t.by.includes(side)) return "wrong_party";
  if (r.fulfilment !== "post") {
    return r.fulfilment === "pickup" ? "This culture is collected, not posted: record the pickup instead." : "Only posted live-culture orders are packed and shipped.";
  }
  if (r.status !== "confirmed") return r.status === "held" ? "This order is not confirmed yet." : `This reservation is ${r.status.replace("_", " ")}.`;
  if (r.order_stage !== t.from) return `This order is ${ORDER_STAGE_LABELS[r.order_stage ?? "paid"].toLowerCase()}; it cannot be ${ORDER_STAGE_LABELS[t.to].toLowerCase()} now.`;
  if (action === "ship" && opts.postingPaused) return "Posting is paused for the weather. Resume posting under Shipping days before you send it.";
  return null;
}

export function allowedOrderActions(r: OrderSubject, side: Side, opts: { postingPaused: boolean }): OrderAction[] {
  return ORDER_ACTIONS.filter((a) => orderBlockedReason(r, a, side, opts) === null);
}

/**
 * How a culture listing may reach a buyer, from its quality declarations. A key that was
 * never set means offered: that is what the grower's culture form starts from.
 */
export function cultureOptions(quality: Record<string, unknown>): { ships: boolean; pickup: boolean } {
  return { ships: quality.ships !== false, pickup: quality.pickup !== false };
}

/** The fulfilment an order gets when the buyer does not say: collection if offered. */
export const defaultFulfilment = (o: { ships: boolean; pickup: boolean }): Fulfilment => (o.pickup || !o.ships ? "pickup" : "post");

/** Roughly how many worms a weight is: about 1,000 a pound (common practice, no source), to the hundred. */
export function estimatedWorms(kg: number): number {
  return Math.round((kg * WORMS_PER_KG) / 100) * 100;
}

/**
 * The first posting day after `now` (a calendar date, YYYY-MM-DD, in the town's zone): a
 * parcel is packed on the day of the order at the earliest and goes out on the next one.
 */
export function nextPostingDay(weekdays: readonly number[], now: Date, tz = PICKUP_TIME_ZONE): string | null {
  if (weekdays.length === 0) return null;
  const [y, m, d] = new Intl.DateTimeFormat("en-CA", { timeZone: tz, year: "numeric", month: "2-digit", day: "2-digit" }).format(now).split("-").map(Number);
  for (let i = 1; i <= 7; i++) {
    const probe = new Date(Date.UTC(y, m - 1, d + i, 12));
    if (weekdays.includes(probe.getUTCDay())) return probe.toISOString().slice(0, 10);
  }
  return null;
}

/** "Monday 12 January" for a calendar date. */
export function dayLabel(date: string): string {
  return new Intl.DateTimeFormat("en-GB", { timeZone: "UTC", weekday: "long", day: "numeric", month: "long" }).format(new Date(`${date}T12:00:00Z`));
}

/**
 * Where a posted order stands against the grower's posting days: whether today (in the town's
 * zone) is one, and the next one after it, so a grower is warned before packing live worms
 * that would sit waiting for the post.
 */
export function postingState(weekdays: readonly number[], paused: boolean, now: Date, tz = PICKUP_TIME_ZONE): { today: boolean; next_day: string | null; paused: boolean } {
  const [y, m, d] = new Intl.DateTimeFormat("en-CA", { timeZone: tz, year: "numeric", month: "2-digit", day: "2-digit" }).format(now).split("-").map(Number);
  const weekday = new Date(Date.UTC(y, m - 1, d, 12)).getUTCDay();
  return { today: !paused && weekdays.includes(weekday), next_day: paused ? null : nextPostingDay(weekdays, now, tz), paused };
}

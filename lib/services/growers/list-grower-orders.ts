import "server-only";
import { nextPostingDay } from "@/lib/reservations/culture-orders";
import type { ReservationView } from "@/lib/reservations/view";
import type { ShippingView } from "@/lib/growers/view";
import { growerShipping } from "@/lib/services/growers/get-grower-shipping";
import { getReservations } from "@/lib/services/reservations/get-reservations";
import { resolveContext, type Context } from "@/lib/context";

// The grower's open orders: live-culture reservations on their own listings that still need
// something from them or the post. An unpaid hold is not an order yet, so it is left out.

export interface GrowerOrders {
  orders: ReservationView[];
  shipping: ShippingView;
  /** The next day parcels go out (YYYY-MM-DD), or null while posting is paused. */
  next_posting_day: string | null;
}

// Work first: requests to answer, parcels to pack, parcels to post; then what is on its way.
const RANK: Record<string, number> = { held: 0, paid: 1, packed: 2, shipped: 3 };
const rank = (v: ReservationView) => (v.status === "held" ? RANK.held : (RANK[v.order?.stage ?? "paid"] ?? 4));

export async function growerOrders(userId: string, ctx: Context = {}): Promise<GrowerOrders> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const ids: string[] = await q("reservations as r")
    .join("listings as l", "l.id", "r.listing_id")
    .where("l.owner_id", userId)
    .whereNotNull("r.fulfilment")
    .where((qb) => qb.where("r.status", "confirmed").orWhere((h) => h.where("r.status", "held").whereNot("r.payment_state", "awaiting")))
    .orderBy("r.created_at")
    .limit(200)
    .pluck("r.id");
  const [views, shipping] = await Promise.all([getReservations(ids, userId, "supplier", { db: q, clock: () => now }), growerShipping(userId, { db: q, clock })]);
  return {
    orders: views.sort((a, b) => rank(a) - rank(b)),
    shipping,
    next_posting_day: shipping.paused ? null : nextPostingDay(shipping.ship_weekdays, now),
  };
}

import "server-only";
import type { Knex } from "knex";
import { paymentsOf } from "@/db/payments";
import { reservationContexts } from "@/db/reservation-context";
import { historyOf } from "@/db/reservations";
import type { Side } from "@/lib/reservations/policy";
import { reservationView, type ReservationView } from "@/lib/reservations/view";
import { shippingView, type ShippingView } from "@/lib/growers/view";

/**
 * The reservations `ids` as `viewerId` sees them from one side, read with `q` at the instant
 * `now`: the shared step of getReservation, getReservations and listReservations, which have
 * already checked that the viewer is on that side of each.
 */
export async function views(ids: string[], viewerId: string, side: Side, q: Knex, now: Date): Promise<ReservationView[]> {
  const [contexts, payments, history, reviews] = await Promise.all([
    reservationContexts(ids, q),
    paymentsOf(ids, q),
    historyOf(ids, q),
    ids.length ? q("reviews").select("reservation_id", "author_id", "rating", "comment").whereIn("reservation_id", ids) : [],
  ]);
  // Growers' posting days and pauses: a paused grower's parcels cannot be marked shipped until
  // it resumes, and one packed off a posting day waits for the next.
  const growers = [...new Set(contexts.filter((r) => r.fulfilment === "post").map((r) => r.listing.owner_id))];
  // Their posting days too, so a buyer sees when the box goes out.
  const rows: { user_id: string; ship_weekdays: string; paused: boolean | 0 | 1; pause_reason: ShippingView["pause_reason"]; pause_note: string | null }[] = growers.length
    ? await q("grower_shipping").select("user_id", "ship_weekdays", "paused", "pause_reason", "pause_note").whereIn("user_id", growers)
    : [];
  const shippingOf = (owner: string) => {
    const s = shippingView(rows.find((x) => x.user_id === owner));
    return { paused: s.paused, weekdays: s.ship_weekdays, ship_days: s.ship_days };
  };
  return contexts.map((r) =>
    reservationView({
      r,
      side,
      viewerId,
      now,
      payments: payments.filter((p) => p.reservation_id === r.id),
      history: history.filter((h) => h.reservation_id === r.id),
      reviews: (reviews as { reservation_id: string; author_id: string; rating: number; comment: string }[]).filter((v) => v.reservation_id === r.id),
      shipping: shippingOf(r.listing.owner_id),
    }),
  );
}

import "server-only";
import { reservationIdsFor } from "@/db/reservations";
import type { Side } from "@/lib/reservations/policy";
import type { ReservationView } from "@/lib/reservations/view";
import { resolveContext, type Context } from "@/lib/context";
import { views } from "@/lib/services/reservations/steps/view-reservations";

// Reading reservations for one side: a gardener's own, or the requests on a supplier's
// (or their organisation's) listings. Other people's reservations are simply not found.

export async function listReservations(userId: string, side: Side, opts: { statuses?: string[] } = {}, ctx: Context = {}): Promise<ReservationView[]> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const ids = await reservationIdsFor(userId, side, q, opts.statuses);
  return views(ids, userId, side, q, now);
}

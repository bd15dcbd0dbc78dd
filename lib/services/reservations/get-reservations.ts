import "server-only";
import type { Side } from "@/lib/reservations/policy";
import type { ReservationView } from "@/lib/reservations/view";
import { resolveContext, type Context } from "@/lib/context";
import { views } from "@/lib/services/reservations/steps/view-reservations";

export async function getReservations(ids: string[], userId: string, side: Side, ctx: Context = {}): Promise<ReservationView[]> {
  const { db: q, clock } = resolveContext(ctx);
  return views(ids, userId, side, q, clock());
}

import "server-only";
import { sideOf } from "@/db/reservations";
import { ApiError } from "@/lib/api/errors";
import type { ReservationView } from "@/lib/reservations/view";
import { resolveContext, type Context } from "@/lib/context";
import { views } from "@/lib/services/reservations/steps/view-reservations";

export async function getReservation(id: string, userId: string, ctx: Context = {}): Promise<ReservationView> {
  const { db: q, clock } = resolveContext(ctx);
  const side = await sideOf(id, userId, q);
  if (!side) throw new ApiError("not_found", "That reservation was not found.");
  return (await views([id], userId, side, q, clock()))[0];
}

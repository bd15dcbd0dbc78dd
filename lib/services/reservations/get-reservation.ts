import "server-only";
import type { Knex } from "knex";
import { db } from "@/db/index";
import { sideOf } from "@/db/reservations";
import { ApiError } from "@/lib/api/errors";
import type { ReservationView } from "@/lib/reservations/view";
import { views } from "@/lib/services/reservations/list-reservations";

export async function getReservation(id: string, userId: string, opts: { db?: Knex; now?: Date } = {}): Promise<ReservationView> {
  const q = opts.db ?? db();
  const side = await sideOf(id, userId, q);
  if (!side) throw new ApiError("not_found", "That reservation was not found.");
  return (await views([id], userId, side, q, opts.now ?? new Date()))[0];
}

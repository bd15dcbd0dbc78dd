import "server-only";
import type { Knex } from "knex";
import { db } from "@/db/index";
import type { Side } from "@/lib/reservations/policy";
import type { ReservationView } from "@/lib/reservations/view";
import { views } from "@/lib/services/reservations/list-reservations";

export async function getReservations(ids: string[], userId: string, side: Side, opts: { db?: Knex; now?: Date } = {}): Promise<ReservationView[]> {
  return views(ids, userId, side, opts.db ?? db(), opts.now ?? new Date());
}

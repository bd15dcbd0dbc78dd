import "server-only";
import type { Knex } from "knex";
import { db } from "@/db/index";
import { messagesOf } from "@/db/reservation-messages";
import { sideOf } from "@/db/reservations";
import { ApiError } from "@/lib/api/errors";

export async function listReservationMessages(input: { reservationId: string; userId: string }, deps: { db?: Knex } = {}) {
  const q = deps.db ?? db();
  const side = await sideOf(input.reservationId, input.userId, q);
  if (!side) throw new ApiError("not_found", "That reservation was not found.");
  const r = (await q("reservations").first("gardener_id").where({ id: input.reservationId })) as { gardener_id: string };
  return (await messagesOf(input.reservationId, q)).map((m) => ({
    id: m.id,
    body: m.body,
    created_at: m.created_at,
    author: { id: m.author_id, name: m.author_name },
    side: m.author_id === r.gardener_id ? "gardener" : "supplier",
    mine: m.author_id === input.userId,
  }));
}

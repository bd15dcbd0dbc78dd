import "server-only";
import { messagesOf } from "@/db/reservation-messages";
import { sideOf } from "@/db/reservations";
import { ApiError } from "@/lib/api/errors";
import { resolveContext, type Context } from "@/lib/context";

export async function listReservationMessages(input: { reservationId: string; userId: string }, ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
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

import "server-only";
import { lockRows } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { countMessagesSince, insertMessage } from "@/db/reservation-messages";
import { reservationContext } from "@/db/reservation-context";
import { sideOf } from "@/db/reservations";
import { ApiError } from "@/lib/api/errors";
import { resolveContext, type Context } from "@/lib/context";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { MESSAGE_LIMIT } from "@/lib/reservations/policy";

// The thread between the two people on a reservation: plain text, limited per person so it
// cannot be used to flood someone's inbox, and each message e-mailed to the other side.

export async function postReservationMessage(input: { reservationId: string; userId: string; body: string }, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const side = await sideOf(input.reservationId, input.userId, q);
  if (!side) throw new ApiError("not_found", "That reservation was not found.");
  return writeTransaction(q, async (trx) => {
    // Messages on one reservation one at a time, so parallel posts cannot all pass the count.
    await lockRows(trx, "reservations", { id: input.reservationId });
    const since = new Date(now.getTime() - MESSAGE_LIMIT.windowMinutes * 60_000).toISOString();
    if ((await countMessagesSince(input.reservationId, input.userId, since, trx)) >= MESSAGE_LIMIT.count) {
      throw new ApiError("rate_limited", `That is ${MESSAGE_LIMIT.count} messages in ${MESSAGE_LIMIT.windowMinutes} minutes; wait a little before the next.`);
    }
    const r = (await reservationContext(input.reservationId, trx))!;
    if (r.status === "expired") throw new ApiError("invalid_state", "This hold ran out; the thread is closed.");
    const message = await insertMessage({ reservation_id: r.id, author_id: input.userId, body: input.body, created_at: now.toISOString() }, trx);
    const author = side === "gardener" ? r.gardener.name : r.supplier.name;
    await mailReservation(trx, "message", r, [side === "gardener" ? "supplier" : "gardener"], { message: { author, body: input.body } }, message.id);
    return { ...message, author_name: author, side };
  });
}


import "server-only";
import { newId } from "@/db/index";
import { isUniqueViolation } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { sideOf } from "@/db/reservations";
import { ApiError } from "@/lib/api/errors";
import { resolveContext, type Context } from "@/lib/context";
import type { ReviewInput } from "@/lib/validation/reservations";

// After a collection each side rates the other once: the gardener rates the listing's
// owner (their average shows on listings), the supplier rates the gardener.

export async function reviewReservation(input: ReviewInput & { reservationId: string; userId: string }, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const side = await sideOf(input.reservationId, input.userId, q);
  if (!side) throw new ApiError("not_found", "That reservation was not found.");
  const alreadyDone = () => new ApiError("conflict", "You have already reviewed this pickup.");
  try {
    return await writeTransaction(q, async (trx) => {
      const r = await trx("reservations as r")
        .join("listings as l", "l.id", "r.listing_id")
        .first("r.status", "r.gardener_id", "l.owner_id")
        .where("r.id", input.reservationId);
      if (r.status !== "collected") throw new ApiError("invalid_state", "Reviews open once the material has been collected.");
      const review = {
        id: newId(),
        reservation_id: input.reservationId,
        author_id: input.userId,
        subject_id: side === "gardener" ? r.owner_id : r.gardener_id,
        rating: input.rating,
        comment: input.comment,
        created_at: now.toISOString(),
      };
      const existing = await trx("reviews").first("id").where({ reservation_id: input.reservationId, author_id: input.userId });
      if (existing) throw alreadyDone();
      await trx("reviews").insert(review);
      return review;
    });
  } catch (err) {
    // Two presses at once: the table's unique (reservation, author) lets only one through.
    if (isUniqueViolation(err)) throw alreadyDone();
    throw err;
  }
}

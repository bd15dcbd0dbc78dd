import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findManagedListing } from "@/db/listings";
import { photosFor, setPhotoPositions } from "@/db/listing-photos";
import { ApiError, notFound } from "@/lib/api/errors";
import { resolveContext, type Context } from "@/lib/context";

/** Puts the listing's photos in the given order; the first is the one shown on cards. */
export async function reorderListingPhotos(userId: string, listingId: string, order: string[], ctx: Context = {}): Promise<void> {
  const { db: q } = resolveContext(ctx);
  await writeTransaction(q, async (trx) => {
    if (!(await findManagedListing(listingId, userId, trx))) throw notFound("That listing");
    const current = ((await photosFor([listingId], trx)).get(listingId) ?? []).map((p) => p.id);
    const same = order.length === current.length && new Set(order).size === order.length && order.every((id) => current.includes(id));
    if (!same) throw new ApiError("invalid_input", "Give every photo of this listing exactly once.", { order: "List each of this listing's photos once, in the new order." });
    await setPhotoPositions(listingId, order, trx);
  });
}

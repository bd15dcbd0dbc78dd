import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findManagedListing } from "@/db/listings";
import { deletePhoto, photosFor, publicIdInUse, setPhotoPositions } from "@/db/listing-photos";
import { notFound } from "@/lib/api/errors";
import { destroyUpload } from "@/lib/media/cloudinary";
import { resolveContext, type Context } from "@/lib/context";

/** Takes a photo off a listing, closes the gap in the order, then deletes the image itself. */
export async function removeListingPhoto(userId: string, listingId: string, photoId: string, ctx: Context = {}): Promise<void> {
  const { db: q } = resolveContext(ctx);
  const removed = await writeTransaction(q, async (trx) => {
    if (!(await findManagedListing(listingId, userId, trx))) throw notFound("That listing");
    const row = await deletePhoto(listingId, photoId, trx);
    if (!row) throw notFound("That photo");
    const rest = (await photosFor([listingId], trx)).get(listingId) ?? [];
    await setPhotoPositions(listingId, rest.map((p) => p.id), trx);
    return (await publicIdInUse(row.public_id, trx)) ? null : row.public_id;
  });
  // After the commit: a slow or failed call to the image service must not undo the removal.
  if (removed) await destroyUpload(removed);
}

import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findManagedListing } from "@/db/listings";
import { countPhotos, insertPhotos } from "@/db/listing-photos";
import { ApiError, notFound } from "@/lib/api/errors";
import { checkUploadedPhotos } from "@/lib/media/verify-upload";
import { MAX_PHOTOS, type UploadedPhoto } from "@/lib/validation/listings";
import { resolveContext, type Context } from "@/lib/context";

/** Attaches verified uploads after the listing's existing photos, up to MAX_PHOTOS in all. */
export async function addListingPhotos(userId: string, listingId: string, photos: UploadedPhoto[], ctx: Context = {}) {
  const { db: q } = resolveContext(ctx);
  return writeTransaction(q, async (trx) => {
    if (!(await findManagedListing(listingId, userId, trx))) throw notFound("That listing");
    checkUploadedPhotos(userId, photos);
    const have = await countPhotos(listingId, trx);
    if (have + photos.length > MAX_PHOTOS) {
      throw new ApiError("conflict", `A listing can show at most ${MAX_PHOTOS} photos; this one has ${have}. Remove one first.`);
    }
    return insertPhotos(listingId, photos, have, trx);
  });
}

import { db, groupBy, newId, nowIso, type Db } from "./index";
import type { ListingPhotoRow } from "./types";

const PHOTO_COLUMNS = ["id", "listing_id", "public_id", "width", "height", "format", "position", "created_at"];

/** Photos of each listing, in the order the owner set. */
export async function photosFor(listingIds: string[], q: Db = db()): Promise<Map<string, ListingPhotoRow[]>> {
  if (listingIds.length === 0) return new Map();
  const rows = (await q("listing_photos")
    .select(PHOTO_COLUMNS)
    .whereIn("listing_id", [...new Set(listingIds)])
    .orderBy([{ column: "listing_id" }, { column: "position" }, { column: "created_at" }])) as ListingPhotoRow[];
  return groupBy(rows, (r) => r.listing_id);
}

export async function countPhotos(listingId: string, q: Db = db()): Promise<number> {
  const [{ n }] = await q("listing_photos").where({ listing_id: listingId }).count({ n: "*" });
  return Number(n);
}

export async function insertPhotos(
  listingId: string,
  photos: { public_id: string; width: number; height: number; format: ListingPhotoRow["format"] }[],
  firstPosition: number,
  q: Db = db(),
): Promise<ListingPhotoRow[]> {
  const now = nowIso();
  const rows: ListingPhotoRow[] = photos.map((p, i) => ({
    id: newId(),
    listing_id: listingId,
    public_id: p.public_id,
    width: p.width,
    height: p.height,
    format: p.format,
    position: firstPosition + i,
    created_at: now,
  }));
  if (rows.length) await q("listing_photos").insert(rows);
  return rows;
}

export async function deletePhoto(listingId: string, photoId: string, q: Db = db()): Promise<ListingPhotoRow | undefined> {
  const row = (await q("listing_photos").first(PHOTO_COLUMNS).where({ id: photoId, listing_id: listingId })) as ListingPhotoRow | undefined;
  if (row) await q("listing_photos").where({ id: photoId, listing_id: listingId }).delete();
  return row;
}

export async function setPhotoPositions(listingId: string, orderedIds: string[], q: Db = db()): Promise<void> {
  for (const [position, id] of orderedIds.entries()) {
    await q("listing_photos").where({ id, listing_id: listingId }).update({ position });
  }
}

/** Whether any listing still shows this uploaded image (the same upload can be attached twice). */
export async function publicIdInUse(publicId: string, q: Db = db()): Promise<boolean> {
  return Boolean(await q("listing_photos").first("id").where({ public_id: publicId }));
}

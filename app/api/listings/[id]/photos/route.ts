import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { addPhotosSchema, removePhotoSchema, reorderPhotosSchema } from "@/lib/validation/listings";
import { addListingPhotos } from "@/lib/services/listings/add-listing-photos";
import { removeListingPhoto } from "@/lib/services/listings/remove-listing-photo";
import { reorderListingPhotos } from "@/lib/services/listings/reorder-listing-photos";
import { getListing } from "@/lib/services/listings/get-listing";
import type { ManagedListingDetail } from "@/lib/listings/view";

type P = { id: string };

async function photosOf(id: string, userId: string) {
  const listing = (await getListing(id, userId)) as ManagedListingDetail;
  return { photos: listing.photo_records };
}

// POST /api/listings/<id>/photos { photos: [upload results] } — attach verified uploads.
export const POST = withAuth<P>(async ({ req, params, user }) => {
  const { photos } = parseInput(addPhotosSchema, await readJson(req));
  await addListingPhotos(user.id, params.id, photos);
  return NextResponse.json(await photosOf(params.id, user.id), { status: 201 });
}, LISTING_ROLES);

// DELETE /api/listings/<id>/photos { photo_id } — take one off (and delete the image).
export const DELETE = withAuth<P>(async ({ req, params, user }) => {
  const { photo_id } = parseInput(removePhotoSchema, await readJson(req));
  await removeListingPhoto(user.id, params.id, photo_id);
  return NextResponse.json(await photosOf(params.id, user.id));
}, LISTING_ROLES);

// PATCH /api/listings/<id>/photos { order: [photo ids] } — the new order; the first is the cover.
export const PATCH = withAuth<P>(async ({ req, params, user }) => {
  const { order } = parseInput(reorderPhotosSchema, await readJson(req));
  await reorderListingPhotos(user.id, params.id, order);
  return NextResponse.json(await photosOf(params.id, user.id));
}, LISTING_ROLES);

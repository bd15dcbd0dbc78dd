import { NextResponse } from "next/server";
import { handle, readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { optionalRequestUser } from "@/lib/auth/current-user";
import { updateListingSchema } from "@/lib/validation/listings";
import { getListing } from "@/lib/services/listings/get-listing";
import { updateListing } from "@/lib/services/listings/update-listing";

type P = { id: string };

// GET /api/listings/<id> — one listing; its owner also gets the exact pickup point and address.
export const GET = handle<P>(async ({ req, params }) => {
  const viewer = await optionalRequestUser(req);
  return NextResponse.json({ listing: await getListing(params.id, viewer?.id ?? null) });
});

// PATCH /api/listings/<id> — edit a listing you manage (others get 404).
export const PATCH = withAuth<P>(async ({ req, params, user }) => {
  const patch = parseInput(updateListingSchema, await readJson(req));
  await updateListing(user.id, params.id, patch);
  return NextResponse.json({ listing: await getListing(params.id, user.id) });
}, LISTING_ROLES);

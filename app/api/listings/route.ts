import { NextResponse } from "next/server";
import { handle, readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { browseParams, browseQuerySchema, createListingSchema } from "@/lib/validation/listings";
import { browseListings } from "@/lib/services/listings/browse-listings";
import { createListing } from "@/lib/services/listings/create-listing";
import { getListing } from "@/lib/services/listings/get-listing";
import { requireVerifiedEmail } from "@/lib/auth/current-user";

// GET /api/listings?lat=&lng=&radius_km=&material=&free=&q=&limit=&cursor= — what is on offer (public).
export const GET = handle(async ({ req }) => {
  const query = parseInput(browseQuerySchema, browseParams(req.nextUrl.searchParams));
  return NextResponse.json(await browseListings(query));
});

// POST /api/listings — post a listing (suppliers, growers, council staff).
export const POST = withAuth(async ({ req, user }) => {
  requireVerifiedEmail(user);
  const input = parseInput(createListingSchema, await readJson(req));
  const { id } = await createListing(user, input);
  return NextResponse.json({ listing: await getListing(id, user.id) }, { status: 201 });
}, LISTING_ROLES);

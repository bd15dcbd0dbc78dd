import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { listingStatusSchema } from "@/lib/validation/listings";
import { changeListingStatus } from "@/lib/services/listings/change-listing-status";
import { getListing } from "@/lib/services/listings/get-listing";

// POST /api/listings/<id>/status { action: publish | pause | resume | archive }
export const POST = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const { action } = parseInput(listingStatusSchema, await readJson(req));
  await changeListingStatus(user.id, params.id, action);
  return NextResponse.json({ listing: await getListing(params.id, user.id) });
}, LISTING_ROLES);

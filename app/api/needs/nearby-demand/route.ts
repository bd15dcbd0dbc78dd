import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { browseParams } from "@/lib/validation/listings";
import { nearbyDemandQuerySchema } from "@/lib/validation/needs";
import { nearbyDemand } from "@/lib/services/needs/nearby-demand";

// GET /api/needs/nearby-demand?lat=&lng=&material= — how many open needs a listing there would
// serve within 5, 10 and 25 km, and what they add up to: rounded, anonymous aggregates only.
export const GET = withAuth(async ({ req, user }) => {
  const query = parseInput(nearbyDemandQuerySchema, browseParams(req.nextUrl.searchParams));
  return NextResponse.json(await nearbyDemand(user.id, { lat: query.lat, lng: query.lng }, query.material));
});

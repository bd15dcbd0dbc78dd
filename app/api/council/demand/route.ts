import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { browseParams } from "@/lib/validation/listings";
import { councilDemandQuerySchema } from "@/lib/validation/needs";
import { councilOf } from "@/lib/auth/council-access";
import { councilDemand } from "@/lib/services/needs/council-demand";

// GET /api/council/demand?material=&lat=&lng=&radius_km= — open needs by cell (at least 1 km²,
// only where at least 3 people are behind a figure) and a giveaway-day suggestion.
export const GET = withAuth(async ({ req, user }) => {
  const query = parseInput(councilDemandQuerySchema, browseParams(req.nextUrl.searchParams));
  return NextResponse.json(await councilDemand(councilOf(user), query));
}, ["council"]);

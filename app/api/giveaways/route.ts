import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { giveawaySearchSchema } from "@/lib/validation/giveaways";
import { searchGiveaways } from "@/lib/services/giveaways/search-giveaways";

// GET /api/giveaways?lat=&lng=&radius_km= — upcoming council giveaway days; public points only.
export const GET = handle(async ({ req }) => {
  const params = Object.fromEntries(req.nextUrl.searchParams);
  const query = parseInput(giveawaySearchSchema, params);
  return NextResponse.json({ items: await searchGiveaways(query) });
});

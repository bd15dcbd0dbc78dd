import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { placeSearchSchema, queryParams } from "@/lib/validation/places";
import { searchPlaces } from "@/lib/services/places/search-places";

// GET /api/places?q=mill&limit=8[&lat=&lng=] — towns, villages, streets and postcodes whose
// name starts with what was typed, each with its point (public: no one types coordinates).
export const GET = handle(async ({ req }) => {
  const input = parseInput(placeSearchSchema, queryParams(req.nextUrl.searchParams, ["q", "limit", "lat", "lng"]));
  return NextResponse.json({ places: await searchPlaces(input) });
});

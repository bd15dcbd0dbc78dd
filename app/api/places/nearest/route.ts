import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { nearestPlaceSchema, queryParams } from "@/lib/validation/places";
import { nameForPoint } from "@/lib/services/places/name-place-at-point";

// GET /api/places/nearest?lat=&lng= — a name for a point, for "use where I am" (public).
export const GET = handle(async ({ req }) => {
  const { lat, lng } = parseInput(nearestPlaceSchema, queryParams(req.nextUrl.searchParams, ["lat", "lng"]));
  return NextResponse.json({ place: await nameForPoint(lat, lng) });
});

import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { cultureSchema } from "@/lib/validation/grower";
import { saveCulture } from "@/lib/services/growers/save-culture";

// PUT /api/grower/listings/:id/culture — the species (required), posting and collection of a worm listing.
export const PUT = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const input = parseInput(cultureSchema, await readJson(req));
  return NextResponse.json({ culture: await saveCulture(user.id, params.id, input) });
}, ["grower"]);

import { NextResponse } from "next/server";
import { handle } from "@/lib/api/handler";
import { optionalRequestUser } from "@/lib/auth/current-user";
import { giveawayForVisitor } from "@/lib/services/giveaways/get-giveaway-for-visitor";

// GET /api/giveaways/:id — one day; a booked household also gets its booking and the exact place.
export const GET = handle<{ id: string }>(async ({ req, params }) => {
  const user = await optionalRequestUser(req);
  return NextResponse.json(await giveawayForVisitor(params.id, user?.id ?? null));
});

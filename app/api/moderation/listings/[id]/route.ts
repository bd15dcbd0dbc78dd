import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { listingModerationSchema } from "@/lib/validation/moderation";
import { moderateListing } from "@/lib/services/moderation/moderate-account";

// POST /api/moderation/listings/:id — hide a listing from browse and match, or show it again.
export const POST = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const input = parseInput(listingModerationSchema, await readJson(req));
  return NextResponse.json({ listing: await moderateListing(user.id, params.id, input.action, input.note, input.report_id) });
}, ["moderator"]);

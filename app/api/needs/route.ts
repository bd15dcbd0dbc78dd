import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { browseParams } from "@/lib/validation/listings";
import { listNeedsQuerySchema, openNeedSchema, parseNeedBody } from "@/lib/validation/needs";
import { listNeeds } from "@/lib/services/needs/list-needs";
import { openNeed } from "@/lib/services/needs/open-need";

// GET /api/needs?status=open|all&bed_id= — my needs (nobody else's, ever).
export const GET = withAuth(async ({ req, user }) => {
  const query = parseInput(listNeedsQuerySchema, browseParams(req.nextUrl.searchParams));
  return NextResponse.json({ needs: await listNeeds(user.id, { openOnly: query.status === "open", bedId: query.bed_id }) });
});

// POST /api/needs — open a need: a bed's unmet layer (bed_id) or a typed one (location).
export const POST = withAuth(async ({ req, user }) => {
  const input = parseNeedBody(openNeedSchema, await readJson(req));
  return NextResponse.json({ need: await openNeed(user.id, input) }, { status: 201 });
}, ["gardener"]);

import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { reportQueueQuerySchema } from "@/lib/validation/moderation";
import { listReports } from "@/lib/services/moderation/list-reports";

// GET /api/moderation/reports?status=open|closed|all — the queue, with each report's context.
export const GET = withAuth(async ({ req }) => {
  const { status } = parseInput(reportQueueQuerySchema, Object.fromEntries(req.nextUrl.searchParams));
  return NextResponse.json({ items: await listReports(status) });
}, ["moderator"]);

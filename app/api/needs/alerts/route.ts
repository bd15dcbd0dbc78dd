import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { browseParams } from "@/lib/validation/listings";
import { listAlertsQuerySchema } from "@/lib/validation/needs";
import { listAlerts } from "@/lib/services/needs/list-alerts";

// GET /api/needs/alerts?open=true|false — listings found for my needs (the in-app notices).
export const GET = withAuth(async ({ req, user }) => {
  const query = parseInput(listAlertsQuerySchema, browseParams(req.nextUrl.searchParams));
  return NextResponse.json({ alerts: await listAlerts(user.id, { openOnly: query.open === "true" }) });
});

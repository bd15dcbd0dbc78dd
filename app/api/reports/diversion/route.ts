import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { diversionQuerySchema } from "@/lib/validation/reports";
import { diversionReport } from "@/lib/services/figures/report-diversion";
import { diversionScopeOf } from "@/lib/figures/diversion-scope";

// GET /api/reports/diversion?from=YYYY-MM&to=YYYY-MM — kg and m³ that left my (or my organisation's) hands.
export const GET = withAuth(async ({ req, user }) => {
  const query = parseInput(diversionQuerySchema, Object.fromEntries(req.nextUrl.searchParams));
  return NextResponse.json(await diversionReport(diversionScopeOf(user), query));
}, LISTING_ROLES);

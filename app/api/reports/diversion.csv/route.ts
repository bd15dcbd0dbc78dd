import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { csvResponse } from "@/lib/format/csv";
import { diversionQuerySchema } from "@/lib/validation/reports";
import { diversionCsv, diversionReport } from "@/lib/services/diversion-report";
import { diversionScopeOf } from "@/lib/services/diversion-scope";

// GET /api/reports/diversion.csv — the same figures by month and material, for a spreadsheet.
export const GET = withAuth(async ({ req, user }) => {
  const query = parseInput(diversionQuerySchema, Object.fromEntries(req.nextUrl.searchParams));
  return csvResponse(diversionCsv(await diversionReport(diversionScopeOf(user), query)), "duffbank-diversion.csv");
}, LISTING_ROLES);

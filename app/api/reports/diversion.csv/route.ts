import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { LISTING_ROLES } from "@/lib/auth/roles";
import { csvResponse } from "@/lib/format/csv";
import { diversionQuerySchema } from "@/lib/validation/reports";
import { diversionReport } from "@/lib/services/figures/report-diversion";
import { diversionCsv } from "@/lib/figures/diversion-csv";
import { diversionScopeOf } from "@/lib/figures/diversion-scope";

// GET /api/reports/diversion.csv?by=month|day — the same figures by month and material, or by giveaway day.
export const GET = withAuth(async ({ req, user }) => {
  const query = parseInput(diversionQuerySchema, Object.fromEntries(req.nextUrl.searchParams));
  const report = await diversionReport(diversionScopeOf(user), query);
  return csvResponse(diversionCsv(report, query.by), `duffbank-diversion-by-${query.by}.csv`);
}, LISTING_ROLES);

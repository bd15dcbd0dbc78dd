import { withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { csvResponse } from "@/lib/format/csv";
import { browseParams } from "@/lib/validation/listings";
import { councilDemandQuerySchema } from "@/lib/validation/needs";
import { councilOf } from "@/lib/auth/council-access";
import { councilDemand } from "@/lib/services/needs/council-demand";
import { councilDemandCsv } from "@/lib/needs/demand-csv";

// GET /api/council/demand.csv — the demand map's cells for a spreadsheet or a GIS.
export const GET = withAuth(async ({ req, user }) => {
  const query = parseInput(councilDemandQuerySchema, browseParams(req.nextUrl.searchParams));
  const demand = await councilDemand(councilOf(user), query);
  return csvResponse(councilDemandCsv(demand), `demand-${demand.material}.csv`);
}, ["council"]);

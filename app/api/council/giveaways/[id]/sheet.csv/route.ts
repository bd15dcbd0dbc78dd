import { withAuth } from "@/lib/api/handler";
import { csvResponse } from "@/lib/format/csv";
import { councilOf } from "@/lib/auth/council-access";
import { daySheet } from "@/lib/services/giveaways/get-day-sheet";
import { daySheetCsv } from "@/lib/giveaways/sheet-csv";

// GET /api/council/giveaways/:id/sheet.csv — the day's sheet for a spreadsheet.
export const GET = withAuth<{ id: string }>(async ({ params, user }) => {
  const sheet = await daySheet(councilOf(user), params.id);
  return csvResponse(daySheetCsv(sheet), `giveaway-${sheet.day.date}-${sheet.day.material}.csv`);
}, ["council"]);

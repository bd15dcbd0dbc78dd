import "server-only";
import { findOrgDay, sheetFor, slotsOf } from "@/db/giveaways";
import { notFound } from "@/lib/api/errors";
import { staffDayView } from "@/lib/giveaways/view";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";
import { DaySheet } from "@/lib/giveaways/sheet-csv";

/** The day with everyone booked on it, for the printed sheet, the CSV and the check-in page. */
export async function daySheet(staff: CouncilStaff, dayId: string, ctx: Context = {}): Promise<DaySheet> {
  const { db: q } = resolveContext(ctx);
  const day = await findOrgDay(dayId, staff.organisationId, q);
  if (!day) throw notFound("That giveaway day");
  const [slots, bookings] = await Promise.all([slotsOf([dayId], q), sheetFor(dayId, {}, q)]);
  const checked = bookings.filter((b) => b.status === "checked_in");
  return {
    day: staffDayView(day, slots, staff.organisationName),
    bookings,
    totals: {
      households: bookings.length,
      checked_in: checked.length,
      quantity: bookings.reduce((n, b) => n + b.quantity, 0),
      quantity_checked_in: checked.reduce((n, b) => n + b.quantity, 0),
    },
  };
}


import "server-only";
import { findOrgDay, sheetFor, slotsOf, type SheetRow } from "@/db/giveaways";
import { notFound } from "@/lib/api/errors";
import { toCsv } from "@/lib/format/csv";
import { wallTime } from "@/lib/time/zoned";
import { staffDayView, type StaffDayView } from "@/lib/giveaways/view";
import type { CouncilContext } from "@/lib/auth/council-access";

export interface DaySheet {
  day: StaffDayView;
  bookings: SheetRow[];
  totals: { households: number; checked_in: number; quantity: number; quantity_checked_in: number };
}

/** The day with everyone booked on it, for the printed sheet, the CSV and the check-in page. */
export async function daySheet(ctx: CouncilContext, dayId: string): Promise<DaySheet> {
  const day = await findOrgDay(dayId, ctx.organisationId);
  if (!day) throw notFound("That giveaway day");
  const [slots, bookings] = await Promise.all([slotsOf([dayId]), sheetFor(dayId)]);
  const checked = bookings.filter((b) => b.status === "checked_in");
  return {
    day: staffDayView(day, slots, ctx.organisationName),
    bookings,
    totals: {
      households: bookings.length,
      checked_in: checked.length,
      quantity: bookings.reduce((n, b) => n + b.quantity, 0),
      quantity_checked_in: checked.reduce((n, b) => n + b.quantity, 0),
    },
  };
}

export function daySheetCsv(sheet: DaySheet): string {
  const tz = sheet.day.time_zone;
  return toCsv(
    ["slot_start", "slot_end", "household", "email", "quantity", "unit", "status", "checked_in_at", "deposit_cents", "deposit_status", "booking_id"],
    sheet.bookings.map((b) => [
      `${sheet.day.date} ${wallTime(b.starts_at, tz)}`,
      wallTime(b.ends_at, tz),
      b.name,
      b.email,
      b.quantity,
      sheet.day.unit,
      b.status,
      b.checked_in_at,
      b.deposit_cents,
      b.deposit_status,
      b.id,
    ]),
  );
}

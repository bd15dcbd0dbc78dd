import { toCsv } from "@/lib/format/csv";
import { wallTime } from "@/lib/time/zoned";
import type { SheetRow } from "@/db/giveaways";
import type { StaffDayView } from "@/lib/giveaways/view";

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

export interface DaySheet {
  day: StaffDayView;
  bookings: SheetRow[];
  totals: { households: number; checked_in: number; quantity: number; quantity_checked_in: number };
}

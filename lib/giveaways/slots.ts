import { addDays, zonedToUtc , localDate } from "@/lib/time/zoned";
import type { SlotInput } from "@/lib/validation/giveaways";
import { ApiError } from "@/lib/api/errors";

/** Booking closes at this hour the evening before, unless the day says otherwise (common practice, no source). */
export const DEFAULT_CLOSE_TIME = "18:00";

/**
 * When booking closes if the council does not say: 18:00 the evening before, or — for a day
 * made after that (today, or tomorrow late in the evening) — when the last slot starts, so
 * households can still book the slots to come. A day with no slots yet closes at its end.
 * Never earlier than `opens`; a day whose slots have all started gets the time it would have
 * had, and the caller refuses it.
 */
export function defaultBookingClose(date: string, tz: string, slots: SlotInput[], opens: string): string {
  const eveningBefore = zonedToUtc(addDays(date, -1), DEFAULT_CLOSE_TIME, tz).toISOString();
  if (Date.parse(eveningBefore) > Date.parse(opens)) return eveningBefore;
  const starts = slotInstants(date, tz, slots).map((s) => s.starts_at);
  return starts.length ? starts.reduce((a, b) => (b > a ? b : a)) : zonedToUtc(addDays(date, 1), "00:00", tz).toISOString();
}

/** Slot instants from the wall-clock times of the day's zone. */
export function slotInstants(date: string, tz: string, slots: SlotInput[]) {
  return slots.map((s) => ({ starts_at: zonedToUtc(date, s.start, tz).toISOString(), ends_at: zonedToUtc(date, s.end, tz).toISOString(), capacity: s.capacity }));
}

export function assertNotPast(date: string, tz: string, now: Date) {
  if (date < localDate(now, tz)) throw new ApiError("invalid_input", "That day is in the past.", { date: "Pick today or a later day." });
}

// Wall-clock times in a named zone (a giveaway day's "09:30 in Fernhollow") to and from
// UTC instants, with the zone database built into Intl: no date library needed.
import { zonedTime } from "@/lib/reservations/pickup-times";

/** Where the demo and a new council day default to (the invented town sits in England). */
export const DEFAULT_TIME_ZONE = "Europe/London";

export function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

/** The UTC instant of `time` (HH:MM) on `date` (YYYY-MM-DD) in `tz`; the reservations' converter does the work. */
export function zonedToUtc(date: string, time: string, tz: string): Date {
  const [y, m, d] = date.split("-").map(Number);
  return zonedTime(y, m, d, time, tz);
}

/** HH:MM of an instant on the zone's wall clock. */
export function wallTime(iso: string, tz: string): string {
  return new Intl.DateTimeFormat("en-GB", { timeZone: tz, hour: "2-digit", minute: "2-digit", hourCycle: "h23" }).format(new Date(iso));
}

/** "Saturday 16 January 2027" for a YYYY-MM-DD calendar day. */
export function longDate(date: string): string {
  return new Intl.DateTimeFormat("en-GB", { timeZone: "UTC", weekday: "long", day: "numeric", month: "long", year: "numeric" }).format(
    new Date(`${date}T12:00:00Z`),
  );
}

/** A date-time for a person to read, in the zone the event happens in. */
export function readableDateTime(iso: string, tz: string): string {
  return new Intl.DateTimeFormat("en-GB", { timeZone: tz, weekday: "short", day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", hourCycle: "h23" }).format(
    new Date(iso),
  );
}

/** The calendar day (YYYY-MM-DD) it is at `instant` in `tz`. */
export function localDate(instant: Date, tz: string): string {
  // en-CA formats dates as YYYY-MM-DD.
  return new Intl.DateTimeFormat("en-CA", { timeZone: tz, year: "numeric", month: "2-digit", day: "2-digit" }).format(instant);
}

/** `date` moved by whole days. */
export function addDays(date: string, days: number): string {
  const t = new Date(`${date}T12:00:00Z`);
  t.setUTCDate(t.getUTCDate() + days);
  return t.toISOString().slice(0, 10);
}

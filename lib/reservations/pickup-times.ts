// Pickup windows are written in the supplier's local wall-clock time: weekly ones as
// "Saturdays 09:00–12:00", dated ones as that wall clock written in UTC (the listings'
// convention, lib/listings/format.ts). Reservations store instants; this turns one into
// the other for the town's time zone.
import { formatWindow } from "@/lib/listings/format";
import { DEFAULT_PICKUP_TIME_ZONE, sharedEnv } from "@/lib/env-shared";

// Read where the code runs: PICKUP_TIME_ZONE on the server; in the browser, where only
// NEXT_PUBLIC_* values exist, the default.
export const PICKUP_TIME_ZONE = sharedEnv().PICKUP_TIME_ZONE ?? DEFAULT_PICKUP_TIME_ZONE;

export interface PickupWindow {
  id: string;
  kind: "weekly" | "dated";
  weekday: number | null; // 0 = Sunday
  start_time: string | null; // HH:MM
  end_time: string | null;
  starts_at: string | null;
  ends_at: string | null;
}

interface LocalParts {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  weekday: number;
}

const WEEKDAYS = ["Sun", "Mon", "Tue", "Wed", "Thu", "Fri", "Sat"];

function localParts(at: Date, tz: string): LocalParts {
  const parts = new Intl.DateTimeFormat("en-GB", {
    timeZone: tz,
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    weekday: "short",
    hourCycle: "h23",
  }).formatToParts(at);
  const get = (type: string) => parts.find((p) => p.type === type)!.value;
  return {
    year: Number(get("year")),
    month: Number(get("month")),
    day: Number(get("day")),
    hour: Number(get("hour")),
    minute: Number(get("minute")),
    weekday: WEEKDAYS.indexOf(get("weekday")),
  };
}

/** Offset of the zone from UTC at an instant, in milliseconds (positive east of Greenwich). */
function offsetMs(at: number, tz: string): number {
  const p = localParts(new Date(at), tz);
  const asUtc = Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute);
  return asUtc - Math.floor(at / 60_000) * 60_000;
}

/** The instant a local date and time names in `tz` (the later one across a DST change). */
export function zonedTime(year: number, month: number, day: number, hhmm: string, tz = PICKUP_TIME_ZONE): Date {
  const [h, m] = hhmm.split(":").map(Number);
  const guess = Date.UTC(year, month - 1, day, h, m);
  const first = guess - offsetMs(guess, tz);
  const second = guess - offsetMs(first, tz);
  return new Date(second);
}

/**
 * The next time the window is open that has not ended by `now`; null for a dated window in the
 * past. With `notBefore`, the first opening that starts at or after it instead (a request the
 * supplier must answer first): the next week's for a weekly window, null for a dated one.
 */
export function nextOccurrence(w: PickupWindow, now: Date, tz = PICKUP_TIME_ZONE, notBefore: Date | null = null): { start: Date; end: Date } | null {
  const fits = (start: Date, end: Date) => (notBefore ? start >= notBefore : end > now);
  if (w.kind === "dated") {
    if (!w.starts_at || !w.ends_at) return null;
    const start = wallClockToInstant(w.starts_at, tz);
    const end = wallClockToInstant(w.ends_at, tz);
    return fits(start, end) ? { start, end } : null;
  }
  if (w.weekday === null || !w.start_time || !w.end_time) return null;
  const today = localParts(now, tz);
  // A week and a day covers any opening at least as late as notBefore when that is within a day.
  const days = notBefore ? 7 + Math.ceil(Math.max(0, notBefore.getTime() - now.getTime()) / 86_400_000) : 7;
  for (let d = 0; d <= days; d++) {
    // Noon UTC of the local date d days on: safely inside that calendar day in any zone near Europe.
    const probe = new Date(Date.UTC(today.year, today.month - 1, today.day + d, 12));
    const day = { y: probe.getUTCFullYear(), m: probe.getUTCMonth() + 1, d: probe.getUTCDate() };
    if (probe.getUTCDay() !== w.weekday) continue;
    const start = zonedTime(day.y, day.m, day.d, w.start_time, tz);
    const end = zonedTime(day.y, day.m, day.d, w.end_time, tz);
    if (fits(start, end)) return { start, end };
  }
  return null;
}

/** A dated window's stored time is the local wall clock written as UTC; this is the real instant. */
function wallClockToInstant(stored: string, tz: string): Date {
  const d = new Date(stored);
  const hhmm = `${String(d.getUTCHours()).padStart(2, "0")}:${String(d.getUTCMinutes()).padStart(2, "0")}`;
  return zonedTime(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate(), hhmm, tz);
}

export function windowLabel(w: PickupWindow): string {
  return formatWindow(w);
}

/** "Sat 12 Dec, 09:00" in the town's time zone, the same on the server and in the browser. */
export function formatLocal(iso: string, tz = PICKUP_TIME_ZONE, opts: { timeOnly?: boolean } = {}): string {
  const at = new Date(iso);
  const time = new Intl.DateTimeFormat("en-GB", { timeZone: tz, hour: "2-digit", minute: "2-digit", hourCycle: "h23" }).format(at);
  if (opts.timeOnly) return time;
  const date = new Intl.DateTimeFormat("en-GB", { timeZone: tz, weekday: "short", day: "numeric", month: "short" }).format(at);
  return `${date}, ${time}`;
}

import { createHmac, timingSafeEqual } from "node:crypto";
import { createEvents, type DateArray } from "ics";
import { AUTH_SECRET } from "@/lib/auth/config";
import { ApiError } from "@/lib/api/errors";
import { formatGiveawayQuantity } from "@/lib/format/giveaway";

// The calendar link in a booking e-mail must open in a calendar app that has no Duffbank
// session, so it carries a token tied to the booking instead (keyed with the session secret).
export function calendarToken(bookingId: string): string {
  return createHmac("sha256", AUTH_SECRET).update(`giveaway-ics:${bookingId}`).digest("base64url").slice(0, 32);
}

export function validCalendarToken(bookingId: string, token: string | null): boolean {
  if (!token) return false;
  const want = Buffer.from(calendarToken(bookingId));
  const got = Buffer.from(token);
  return want.length === got.length && timingSafeEqual(want, got);
}

const utcParts = (iso: string): DateArray => {
  const d = new Date(iso);
  return [d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate(), d.getUTCHours(), d.getUTCMinutes()];
};

export interface CalendarBooking {
  id: string;
  quantity: number;
  unit: "bags" | "m3";
  title: string;
  address: string;
  starts_at: string;
  ends_at: string;
  organisation: string;
  url: string;
}

/** One timed event for a booked slot, with the exact place (only booked households get this file). */
export function giveawayCalendar(b: CalendarBooking): string {
  const { error, value } = createEvents([
    {
      uid: `giveaway-booking-${b.id}@duffbank`,
      start: utcParts(b.starts_at),
      startInputType: "utc",
      startOutputType: "utc",
      end: utcParts(b.ends_at),
      endInputType: "utc",
      endOutputType: "utc",
      title: `${b.title} (${formatGiveawayQuantity(b.quantity, b.unit)})`,
      description: `Your booked slot at ${b.organisation}'s giveaway day. Bring your own bags or a trailer, and gloves.\n${b.url}`,
      location: b.address,
      url: b.url,
      categories: ["Duffbank", "giveaway"],
      productId: "-//Duffbank//Giveaway booking//EN",
    },
  ]);
  if (error || !value) throw new ApiError("internal", "The calendar could not be made.");
  return value;
}

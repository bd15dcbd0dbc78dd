import type { GiveawayDayRow, GiveawaySlotRow } from "@/db/types";
import { BAG_M3, MATERIALS, type MaterialCode } from "@/lib/calc/facts";

export interface SlotView {
  id: string;
  starts_at: string;
  ends_at: string;
  capacity: number;
  remaining: number;
  booked: number;
}

/** What anyone may see of a day: the approximate point only. */
export interface PublicDayView {
  id: string;
  material: string;
  material_name: string;
  title: string;
  notes: string;
  date: string;
  time_zone: string;
  location: { lat: number; lng: number };
  location_is_approximate: true;
  household_cap: number;
  unit: "bags" | "m3";
  bag_m3: number | null;
  booking_opens_at: string;
  booking_closes_at: string;
  cancel_cutoff_hours: number;
  deposit_cents: number;
  currency: string;
  status: string;
  organisation: { id: string; name: string };
  slots: SlotView[];
  distance_km?: number;
}

/** Staff and booked households also see the exact place. */
export interface StaffDayView extends Omit<PublicDayView, "location_is_approximate"> {
  location_is_approximate: false;
  exact: { lat: number; lng: number; address: string };
  approximate: { lat: number; lng: number };
  cancel_reason: string | null;
}

export function slotView(s: GiveawaySlotRow): SlotView {
  return { id: s.id, starts_at: s.starts_at, ends_at: s.ends_at, capacity: s.capacity, booked: s.booked, remaining: Math.max(0, s.capacity - s.booked) };
}

export function publicDayView(day: GiveawayDayRow, slots: GiveawaySlotRow[], organisationName: string): PublicDayView {
  return {
    id: day.id,
    material: day.material_code,
    material_name: MATERIALS[day.material_code as MaterialCode]?.name ?? day.material_code,
    title: day.title,
    notes: day.notes,
    date: day.date,
    time_zone: day.time_zone,
    location: { lat: day.approx_lat, lng: day.approx_lng },
    location_is_approximate: true,
    household_cap: day.household_cap,
    unit: day.unit,
    bag_m3: day.unit === "bags" ? (day.unit_size ?? BAG_M3) : null,
    booking_opens_at: day.booking_opens_at,
    booking_closes_at: day.booking_closes_at,
    cancel_cutoff_hours: day.cancel_cutoff_hours,
    deposit_cents: day.deposit_cents,
    currency: day.currency,
    status: day.status,
    organisation: { id: day.organisation_id, name: organisationName },
    slots: slots.filter((s) => s.day_id === day.id).map(slotView),
  };
}

export function staffDayView(day: GiveawayDayRow, slots: GiveawaySlotRow[], organisationName: string): StaffDayView {
  return {
    ...publicDayView(day, slots, organisationName),
    location: { lat: day.lat, lng: day.lng },
    location_is_approximate: false,
    exact: { lat: day.lat, lng: day.lng, address: day.address },
    approximate: { lat: day.approx_lat, lng: day.approx_lng },
    cancel_reason: day.cancel_reason,
  };
}

/** The last moment a household may still cancel a booking in `slot` itself. */
export function cancelDeadline(slotStartsAt: string, cutoffHours: number): Date {
  return new Date(Date.parse(slotStartsAt) - cutoffHours * 3_600_000);
}

/** Booking state of a day at `now`, for the page and for the rule in the service. */
export function bookingWindowState(day: { booking_opens_at: string; booking_closes_at: string; status: string }, now: Date): "open" | "not_yet" | "closed" | "cancelled" {
  if (day.status === "cancelled") return "cancelled";
  if (now.getTime() < Date.parse(day.booking_opens_at)) return "not_yet";
  if (now.getTime() >= Date.parse(day.booking_closes_at)) return "closed";
  return "open";
}

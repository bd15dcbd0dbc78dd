import "server-only";
import type { ListingRow } from "@/db/types";
import { datesState, quantityLeft } from "@/lib/listings/status";
import type { ListingUnit } from "@/lib/match/types";
import type { AlertingListing } from "@/lib/needs/reaching";
import { dayOf } from "@/lib/services/needs/steps/day-of";

/** A listing as it stands for alerts: whether it can serve anyone now, and from which day. */
export function alertingListing(l: ListingRow, now: Date): AlertingListing | null {
  if (l.status !== "active" || quantityLeft(l) <= 0) return null;
  const dates = datesState(l, now);
  if (dates === "ended") return null;
  const from_day = dates === "not_yet" && l.available_from ? dayOf(new Date(l.available_from)) : dayOf(now);
  return {
    id: l.id,
    owner_id: l.owner_id,
    material: l.material_code,
    unit: l.unit as ListingUnit,
    unit_size: l.unit_size === null ? null : Number(l.unit_size),
    unit_mass_kg: l.unit_mass_kg === null ? null : Number(l.unit_mass_kg),
    location: { lat: Number(l.approx_lat), lng: Number(l.approx_lng) },
    from_day,
  };
}

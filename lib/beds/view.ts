import type { Polygon } from "geojson";
import type { BedRow } from "@/db/beds";
import { estimate, type EstimateResult } from "@/lib/calc/estimate";
import type { UnitSystem } from "@/lib/calc/units";
import type { EstimateLayers } from "@/lib/validation/estimate";

export type BedShape = { length_m: number; width_m: number } | { polygon: Polygon };

export interface BedView {
  id: string;
  name: string;
  shape: BedShape;
  area_m2: number;
  location: { lat: number; lng: number } | null;
  layers: EstimateLayers;
  start_date: string | null;
  created_at: string;
  updated_at: string;
}

export function toBedView(row: BedRow): BedView {
  return {
    id: row.id,
    name: row.name,
    shape: JSON.parse(row.shape),
    area_m2: row.area_m2,
    location: row.lat !== null && row.lng !== null ? { lat: row.lat, lng: row.lng } : null,
    layers: JSON.parse(row.recipe || "{}"),
    start_date: row.start_date,
    created_at: row.created_at,
    updated_at: row.updated_at,
  };
}

/**
 * The bed's estimate, as POST /api/estimate would give it for the same shape and recipe,
 * its words (advice, timeline) in the gardener's units.
 */
export function bedEstimate(bed: BedView, now = new Date(), units: UnitSystem = "metric"): EstimateResult {
  return estimate(
    { bed: bed.shape, layers: bed.layers, start_date: bed.start_date ?? undefined, latitude: bed.location?.lat, units },
    now,
  );
}

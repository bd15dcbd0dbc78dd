import "server-only";
import { db, type Db } from "@/db/index";
import { openNeedsInBand, type ReachingNeed } from "@/db/needs";
import type { MaterialCode } from "@/lib/calc/facts";
import { distanceKm } from "@/lib/match/geo";
import type { LatLng, ListingUnit } from "@/lib/match/types";
import { needPerListingUnit } from "@/lib/match/units";
import { REACH_BANDS_KM } from "./reach";

// The one query module of alerts: which open needs a listing could serve. It never reads
// every need: for each reach band it reads the needs filed under that band whose place lies
// within the band around the listing's public point (db/needs.ts openNeedsInBand: a box on
// SQLite's B-tree, a cube on PostgreSQL's GiST index), and Turf's exact distance against each
// need's own radius decides.

/** A listing as alerts see it: its public point, never the exact one. */
export interface AlertingListing {
  id: string;
  owner_id: string;
  material: MaterialCode;
  unit: ListingUnit;
  unit_size: number | null;
  unit_mass_kg: number | null;
  location: LatLng;
  /** The first day it can be reserved (today, or its start date): needs dated earlier are past helping. */
  from_day: string;
}

export interface ReachedNeed {
  need: ReachingNeed;
  /** From the need's place to the listing's public point. */
  distance_km: number;
}

/**
 * How far a listing is from a need it could serve (km), or null when it cannot: a unit the
 * need can be measured in, within the need's own radius, reservable on or before its date,
 * and not the need's owner's own listing. The material is the caller's query.
 */
export function servingDistance(l: AlertingListing, need: Pick<ReachingNeed, "owner_id" | "unit" | "lat" | "lng" | "radius_km" | "needed_by">): number | null {
  if (need.owner_id === l.owner_id || need.needed_by < l.from_day || needPerListingUnit(l, need.unit) === null) return null;
  const km = distanceKm({ lat: Number(need.lat), lng: Number(need.lng) }, l.location);
  return km <= Number(need.radius_km) ? km : null;
}

/** Every open need the listing could serve (servingDistance), read band by band through the index. */
export async function needsReaching(l: AlertingListing, q: Db = db(), stats?: { read: number }): Promise<ReachedNeed[]> {
  const out: ReachedNeed[] = [];
  for (const band of REACH_BANDS_KM) {
    const rows = await openNeedsInBand(l.material, band, l.location, l.from_day, l.owner_id, q);
    if (stats) stats.read += rows.length;
    for (const need of rows) {
      const km = servingDistance(l, need);
      if (km !== null) out.push({ need, distance_km: km });
    }
  }
  return out;
}

// The one latitude/longitude box around a search circle, used by every query that prefilters
// by position (listings, needs, giveaway days) before it measures real distances.
import { EARTH_MEAN_RADIUS_M } from "@/lib/calc/facts";

export interface Box {
  minLat: number;
  maxLat: number;
  minLng: number;
  maxLng: number;
}

const DEG = 180 / Math.PI;
// Rounding in the trigonometry below can shave a few ulps off the box; widening it by far
// less than a millimetre keeps a point right on the circle inside.
const WIDEN = 1 + 1e-9;

/**
 * The smallest latitude/longitude box holding every point within `km` of `origin` on the
 * same sphere Turf measures on (J. P. Matuschek, "Finding points within a distance of a
 * latitude/longitude using bounding coordinates"): latitude ± r/R, and longitude ± the
 * widest the circle gets, asin(sin(r/R) / cos(lat)). Near a pole, or across the
 * antimeridian, it falls back to every longitude, which is wasteful but never wrong.
 */
export function boundingBox(origin: { lat: number; lng: number }, km: number): Box {
  const angular = (km * 1000 * WIDEN) / EARTH_MEAN_RADIUS_M;
  const minLat = origin.lat - angular * DEG;
  const maxLat = origin.lat + angular * DEG;
  if (minLat <= -90 || maxLat >= 90 || angular >= Math.PI / 2) {
    return { minLat: Math.max(minLat, -90), maxLat: Math.min(maxLat, 90), minLng: -180, maxLng: 180 };
  }
  const ratio = Math.sin(angular) / Math.cos(origin.lat / DEG);
  if (ratio >= 1) return { minLat, maxLat, minLng: -180, maxLng: 180 };
  const dLng = Math.asin(ratio) * DEG * WIDEN;
  const minLng = origin.lng - dLng;
  const maxLng = origin.lng + dLng;
  if (minLng < -180 || maxLng > 180) return { minLat, maxLat, minLng: -180, maxLng: 180 };
  return { minLat, maxLat, minLng, maxLng };
}

export function inBox(p: { lat: number; lng: number }, b: Box): boolean {
  return p.lat >= b.minLat && p.lat <= b.maxLat && p.lng >= b.minLng && p.lng <= b.maxLng;
}

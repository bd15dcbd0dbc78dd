import { distance } from "@turf/turf";
import { EARTH_MEAN_RADIUS_M } from "@/lib/calc/facts";
import type { LatLng } from "./types";

/** Great-circle distance in km on Turf's sphere (haversine, radius 6,371,008.8 m). */
export function distanceKm(a: LatLng, b: LatLng): number {
  return distance([a.lng, a.lat], [b.lng, b.lat], { units: "kilometers" });
}

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
export function boundingBox(origin: LatLng, km: number): Box {
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

/**
 * The smallest circle around a box's middle that holds the whole box (its radius in km), for
 * an index that searches by distance; null when the box wraps every longitude. The farthest
 * point of a latitude/longitude box from its middle is one of its corners: along a parallel
 * the distance grows with the longitude difference, and along a meridian it grows away from
 * its nearest point, so the ends win.
 */
export function enclosingCircle(b: Box): { centre: LatLng; km: number } | null {
  if (b.maxLng - b.minLng >= 180) return null;
  const centre = { lat: (b.minLat + b.maxLat) / 2, lng: (b.minLng + b.maxLng) / 2 };
  const corners = [
    { lat: b.minLat, lng: b.minLng },
    { lat: b.minLat, lng: b.maxLng },
    { lat: b.maxLat, lng: b.minLng },
    { lat: b.maxLat, lng: b.maxLng },
  ];
  return { centre, km: Math.max(...corners.map((c) => distanceKm(centre, c))) };
}

export function inBox(p: LatLng, b: Box): boolean {
  return p.lat >= b.minLat && p.lat <= b.maxLat && p.lng >= b.minLng && p.lng <= b.maxLng;
}

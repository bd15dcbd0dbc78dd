import { distance } from "@turf/turf";
import type { Box } from "@/lib/geo/box";
import type { LatLng } from "./types";

/** Great-circle distance in km on Turf's sphere (haversine, radius 6,371,008.8 m). */
export function distanceKm(a: LatLng, b: LatLng): number {
  return distance([a.lng, a.lat], [b.lng, b.lat], { units: "kilometers" });
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

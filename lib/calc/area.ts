import { area as turfArea, centerOfMass, kinks, polygon as turfPolygon } from "@turf/turf";
import type { Polygon, Position } from "geojson";
import { assertPositiveFinite } from "./numbers";

export type { Polygon, Position };

export function rectangleArea(length_m: number, width_m: number): number {
  assertPositiveFinite("length_m", length_m);
  assertPositiveFinite("width_m", width_m);
  return length_m * width_m;
}

/** Area in m² of a GeoJSON polygon in lng/lat (holes subtracted), on Turf's spherical Earth. */
export function polygonArea(geometry: Polygon): number {
  return turfArea(geometry);
}

/** Centre of mass of the polygon's shape, for the bed's latitude and map pin. */
export function polygonCentroid(geometry: Polygon): { lat: number; lng: number } {
  const [lng, lat] = centerOfMass(geometry).geometry.coordinates;
  return { lat, lng };
}

function isLngLat(p: Position): boolean {
  return (
    Array.isArray(p) &&
    (p.length === 2 || p.length === 3) &&
    p.every((v) => typeof v === "number" && Number.isFinite(v)) &&
    Math.abs(p[0]) <= 180 &&
    Math.abs(p[1]) <= 90
  );
}

/**
 * A linear ring a bed outline can use: at least four positions, closed (first equals last),
 * every position a finite lng/lat in range, and no edge crossing another. Zero-area rings
 * (all points on one line) are rejected too, since no bed has no area.
 */
export function isValidRing(ring: readonly Position[]): boolean {
  if (!Array.isArray(ring) || ring.length < 4 || !ring.every(isLngLat)) return false;
  const first = ring[0];
  const last = ring[ring.length - 1];
  if (first[0] !== last[0] || first[1] !== last[1]) return false;
  const geometry = turfPolygon([ring as Position[]]).geometry;
  if (kinks(geometry).features.length > 0) return false;
  return turfArea(geometry) > 0;
}

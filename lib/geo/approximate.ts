import { createHmac } from "node:crypto";
import { destination, point } from "@turf/turf";

// The public point of a listing: the exact point moved a fixed, secret-keyed distance and
// bearing. Stable per listing, so repeating a query cannot average the offset away, and
// unpredictable without the key, so it cannot be subtracted back out.
export const APPROX_MIN_M = 250;
export const APPROX_MAX_M = 450;

const KEY = process.env.LOCATION_SECRET ?? "duffbank-local-location-key";

export function approximatePoint(listingId: string, lat: number, lng: number): { lat: number; lng: number } {
  const digest = createHmac("sha256", KEY).update(listingId).digest();
  const u1 = digest.readUInt32BE(0) / 0xffffffff;
  const u2 = digest.readUInt32BE(4) / 0xffffffff;
  const distanceM = APPROX_MIN_M + (APPROX_MAX_M - APPROX_MIN_M) * u1;
  const bearing = u2 * 360 - 180;
  const moved = destination(point([lng, lat]), distanceM / 1000, bearing, { units: "kilometers" });
  const [mLng, mLat] = moved.geometry.coordinates;
  return { lat: round6(mLat), lng: round6(mLng) };
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

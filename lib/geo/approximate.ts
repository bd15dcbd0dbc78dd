import { createHmac } from "node:crypto";
import { destination, point } from "@turf/turf";
import { DEMO_SECRETS, secret, type Env } from "@/lib/env";

// The public point of a pickup place: the exact point moved a fixed, secret-keyed distance and
// bearing. The offset is keyed by the place — who lists there and which ~100 m cell it is in —
// not by the listing: a shop that lists boxes every week from one address would otherwise
// scatter a fresh point around its door each week, and their average would close in on it.
// With one offset per place, every listing there shows the same point (or, for pins dropped a
// few metres apart, points the same few metres apart), so averaging them gains nothing.
// The owner is part of the key so that learning one place's exact address (a confirmed
// reservation shows it) says nothing about anybody else's offset in the same cell.
export const APPROX_MIN_M = 250;
export const APPROX_MAX_M = 450;

/** Cell size in degrees (about 110 m north–south, 70 m east–west in Fernhollow): pins dropped by hand for one address land in the same cell. */
const CELL_DEG = 0.001;

export const DEMO_LOCATION_SECRET = DEMO_SECRETS.LOCATION_SECRET;

/**
 * The key of the offsets. Anyone can compute the demo key's offsets and subtract them, so a
 * production start without a real LOCATION_SECRET is refused before anything is served
 * (lib/env.ts); the demo, development and tests use the demo key.
 */
export function locationKey(env?: Env): string {
  return secret("LOCATION_SECRET", env);
}

/** Whose place it is: an organisation's listings and days share one key, anyone else's are their own. */
export function placeOwner(row: { organisation_id?: string | null; owner_id?: string | null }): string {
  if (row.organisation_id) return `org:${row.organisation_id}`;
  if (row.owner_id) return `user:${row.owner_id}`;
  throw new Error("A place needs an owner or an organisation.");
}

export interface Place {
  /** From `placeOwner`. */
  owner: string;
  lat: number;
  lng: number;
}

/** The public point of `place`; `key` defaults to the configured one (passed in by bulk writers). */
export function approximatePoint(place: Place, key: string = locationKey()): { lat: number; lng: number } {
  const { owner, lat, lng } = place;
  const cell = `${Math.floor(lat / CELL_DEG)}:${Math.floor(lng / CELL_DEG)}`;
  const digest = createHmac("sha256", key).update(`${owner}|${cell}`).digest();
  const u1 = digest.readUInt32BE(0) / 0xffffffff;
  const u2 = digest.readUInt32BE(4) / 0xffffffff;
  const distanceM = APPROX_MIN_M + (APPROX_MAX_M - APPROX_MIN_M) * u1;
  const bearing = u2 * 360 - 180;
  const moved = destination(point([lng, lat]), distanceM / 1000, bearing, { units: "kilometers" });
  const [mLng, mLat] = moved.geometry.coordinates;
  return { lat: round6(mLat), lng: round6(mLng) };
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

import { createHmac } from "node:crypto";
import type { Knex } from "knex";
import { destination, point } from "@turf/turf";
import { secret } from "../lib/env";

// Public points used to be offset per listing, so many listings at one address scattered
// points around it whose average gave the address away. lib/geo/approximate now keys the
// offset by the place (its owner and ~100 m cell); this recomputes the points already stored
// for listings and giveaway days, so old rows stop scattering too.
//
// Frozen: the offset below is lib/geo/approximate.ts as it was when this migration was
// written, copied here so that a database built today gets exactly the points a database
// migrated then got, whatever lib/geo does later. A later change to the offset is a migration
// of its own.

const APPROX_MIN_M = 250;
const APPROX_MAX_M = 450;
const CELL_DEG = 0.001;
const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

function placeOwner(row: { organisation_id?: string | null; owner_id?: string | null }): string {
  if (row.organisation_id) return `org:${row.organisation_id}`;
  if (row.owner_id) return `user:${row.owner_id}`;
  throw new Error("A place needs an owner or an organisation.");
}

export function frozenApproximatePoint(place: { owner: string; lat: number; lng: number }, key: string): { lat: number; lng: number } {
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

async function recompute(knex: Knex, table: "listings" | "giveaway_days") {
  const hasOwner = table === "listings";
  const rows: { id: string; lat: number; lng: number; organisation_id: string | null; owner_id?: string }[] = await knex(table)
    .select(["id", "lat", "lng", "organisation_id", ...(hasOwner ? ["owner_id"] : [])])
    .orderBy("id");
  const key = secret("LOCATION_SECRET");
  for (const row of rows) {
    const approx = frozenApproximatePoint({ owner: placeOwner(row), lat: Number(row.lat), lng: Number(row.lng) }, key);
    await knex(table).where({ id: row.id }).update({ approx_lat: approx.lat, approx_lng: approx.lng });
  }
}

export async function up(knex: Knex): Promise<void> {
  await recompute(knex, "listings");
  await recompute(knex, "giveaway_days");
}

// Nothing to undo: the place-keyed points are as good a public point for the earlier code,
// and putting the per-listing scatter back would only undo the fix.
export async function down(): Promise<void> {}

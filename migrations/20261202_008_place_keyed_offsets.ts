import type { Knex } from "knex";
import { approximatePoint, placeOwner } from "../lib/geo/approximate";

// Public points used to be offset per listing, so many listings at one address scattered
// points around it whose average gave the address away. lib/geo/approximate now keys the
// offset by the place (its owner and ~100 m cell); this recomputes the points already stored
// for listings and giveaway days, so old rows stop scattering too.

async function recompute(knex: Knex, table: "listings" | "giveaway_days") {
  const hasOwner = table === "listings";
  const rows: { id: string; lat: number; lng: number; organisation_id: string | null; owner_id?: string }[] = await knex(table)
    .select(["id", "lat", "lng", "organisation_id", ...(hasOwner ? ["owner_id"] : [])])
    .orderBy("id");
  for (const row of rows) {
    const approx = approximatePoint({ owner: placeOwner(row), lat: Number(row.lat), lng: Number(row.lng) });
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

// The public browse query: active listings with something left, filtered by material,
// price and words, near a point or newest first, one keyset page at a time.
//
// It reads only public columns — the exact point and the address are never selected — and
// measures distance from the approximate point, so nothing derived from the exact one can
// leak through ordering either.
//
// Keyset pagination: a page starts strictly after the last row of the one before in a total
// order ((distance, id) near a point, (created_at desc, id desc) otherwise; ids compared as
// bytes on both engines). A row inserted
// meanwhile lands before or after the cursor but never shifts the rows that were already
// there, so paging through never repeats or skips one (offset paging would). Text relevance
// is not used as an order: it changes as other listings are added.
import type { Knex } from "knex";
import { EARTH_MEAN_RADIUS_M, type MaterialCode } from "@/lib/calc/facts";
import { byteOrder, matchWords, nearBox, type TextIndex } from "./dialect";
import { db, type Db } from "./index";
import { listingsInBox } from "./listing-points";
import { LISTING_COLUMNS } from "./listings";
import type { ListingRow } from "./types";

// What a browse card shows (lib/listings/view.ts) and the cursor needs: public columns only,
// never the exact point or the address, and not the long text a card leaves out.
const BROWSE_COLUMNS = [
  "id", "owner_id", "organisation_id", "material_code", "title", "unit", "unit_size", "unit_mass_kg",
  "quantity_total", "quantity_held", "quantity_collected", "price_cents", "currency", "deposit_cents", "pack_size", "pack_price_cents",
  "approx_lat", "approx_lng", "available_from", "available_until", "created_at",
] as const satisfies readonly Exclude<(typeof LISTING_COLUMNS)[number], "lat" | "lng" | "address">[];

export type PublicListingRow = Pick<ListingRow, (typeof BROWSE_COLUMNS)[number]> & { distance_km: number | null };

export interface SearchFilters {
  point?: { lat: number; lng: number };
  radiusKm: number;
  materials?: MaterialCode[];
  free?: boolean;
  /** Words to find, already reduced to letters and digits. */
  words?: string[];
  now: string;
}

export type SearchCursor = { by: "distance"; d: number; id: string } | { by: "newest"; t: string; id: string };

const R_KM = EARTH_MEAN_RADIUS_M / 1000;
const DEG = Math.PI / 180;

// Haversine on the same sphere Turf uses. Plain SQL functions that SQLite (built with its
// math functions, as better-sqlite3 is) and PostgreSQL both have.
const DISTANCE_SQL =
  `2 * ${R_KM} * asin(sqrt(power(sin(radians(approx_lat - ?) / 2), 2) + ` +
  "cos(radians(?)) * cos(radians(approx_lat)) * power(sin(radians(approx_lng - ?) / 2), 2)))";

/** A latitude/longitude box that holds every point within `radiusKm` (the index prefilter). */
export function boundingBox(lat: number, lng: number, radiusKm: number) {
  const angular = radiusKm / R_KM;
  const dLat = (angular / DEG) * 1.001;
  const s = Math.sin(angular) / Math.cos(lat * DEG);
  // Past a pole the circle wraps every longitude.
  const dLng = s >= 1 ? 180 : (Math.asin(s) / DEG) * 1.001;
  return { minLat: lat - dLat, maxLat: lat + dLat, minLng: lng - dLng, maxLng: lng + dLng, wrapsLng: lng - dLng < -180 || lng + dLng > 180 };
}

/** Titles and descriptions: the FTS5 table on SQLite, the GIN-indexed tsvector on PostgreSQL (migrations/20261201_003_listing_search). */
const LISTING_TEXT: TextIndex = {
  fts: { table: "listing_search", key: "listing_id", rowKey: "listings.id" },
  document: "to_tsvector('english', coalesce(title, '') || ' ' || coalesce(description, ''))",
  config: "english",
};

/** Active, with something left, not ended, matching the filters. */
function filtered(b: Knex.QueryBuilder, f: SearchFilters, q: Db): Knex.QueryBuilder {
  b.where("listings.status", "active")
    .andWhereRaw("quantity_total - quantity_held - quantity_collected > ?", [1e-9])
    .andWhere((w) => w.whereNull("available_until").orWhere("available_until", ">", f.now));
  if (f.materials?.length) b.whereIn("listings.material_code", f.materials);
  if (f.free) b.where("price_cents", 0);
  if (f.words?.length) matchWords(b, LISTING_TEXT, f.words);
  return b.select(BROWSE_COLUMNS.map((c) => `listings.${c}`));
}

export async function searchListings(f: SearchFilters, after: SearchCursor | null, limit: number, q: Db = db()): Promise<PublicListingRow[]> {
  if (!f.point) {
    const base = filtered(q("listings"), f, q).select(q.raw("NULL as distance_km"));
    if (after?.by === "newest") {
      base.andWhere((b) => b.where("created_at", "<", after.t).orWhere((b2) => b2.where("created_at", after.t).andWhere(byteOrder(q, "listings.id"), "<", after.id)));
    }
    const rows = await base.orderBy([{ column: "created_at", order: "desc" }, { column: byteOrder(q, "listings.id"), order: "desc" }]).limit(limit);
    return rows.map(normalise);
  }

  // Widen a ring around the point until it holds a page: every listing within the ring is
  // read, and every listing outside it is further away than all of them, so the page is the
  // same as one cut from the whole radius, without measuring thousands of far listings.
  const from = after?.by === "distance" ? after.d : 0;
  let ring = Math.min(f.radiusKm, from + FIRST_RING_KM);
  for (;;) {
    const rows = await nearPage(f, f.point, ring, after, limit, q);
    if (rows.length >= limit || ring >= f.radiusKm) return rows.map(normalise);
    ring = Math.min(f.radiusKm, from + (ring - from) * RING_GROWTH);
  }
}

/**
 * The first ring of a near search, and how many times as far past the cursor each next one
 * reaches (tuned on the benchmark's county, about 40 listings a km²: a 1 km ring holds a
 * page in town, and a village's empty surroundings take a few cheap index reads).
 */
const FIRST_RING_KM = 1;
const RING_GROWTH = 3;

async function nearPage(f: SearchFilters, point: { lat: number; lng: number }, radiusKm: number, after: SearchCursor | null, limit: number, q: Db) {
  const { lat, lng } = point;
  const box = boundingBox(lat, lng, radiusKm);
  const base = filtered(listingsInBox(q, box.wrapsLng ? { minLat: box.minLat, maxLat: box.maxLat } : box), f, q);
  base.select(q.raw(`${DISTANCE_SQL} as distance_km`, [lat, lat, lng]));
  // PostgreSQL: the spatial index (listings_near) finds the ring; SQLite: the R*Tree above does.
  nearBox(base, point, radiusKm * 1000);

  const outer = q.select("*").from(base.as("near")).where("distance_km", "<=", radiusKm);
  if (after?.by === "distance") {
    // The cursor carries the distance exactly as the database computed it, and the same
    // expression over the same numbers gives the same double, so ties compare equal.
    outer.andWhere((b) => b.where("distance_km", ">", after.d).orWhere((b2) => b2.where("distance_km", after.d).andWhere(byteOrder(q, "id"), ">", after.id)));
  }
  return outer.orderBy([{ column: "distance_km" }, { column: byteOrder(q, "id") }]).limit(limit);
}

function normalise(r: Record<string, unknown>): PublicListingRow {
  const row = r as unknown as PublicListingRow;
  row.distance_km = row.distance_km === null || row.distance_km === undefined ? null : Number(row.distance_km);
  return row;
}

// Listings whose public point lies in a latitude/longitude box, read through the spatial
// index (migrations/20261208_014_listing_points.ts) so the work grows with the box, not with
// the region the table covers.
import type { Knex } from "knex";
import { isPg } from "./dialect";
import type { Db } from "./index";

export interface PointBox {
  minLat: number;
  maxLat: number;
  /** Leave both out for every longitude (a box across the antimeridian or a pole). */
  minLng?: number;
  maxLng?: number;
}

/**
 * A query on `listings` holding only the listings whose public point is in `box`. On SQLite
 * the R*Tree is read first (CROSS JOIN keeps that order: the planner would otherwise prefer
 * a B-tree band of latitude) and the listing's own point is checked exactly, since the
 * R*Tree stores rounded floats; elsewhere the exact check alone, for the engine's own index.
 * With `materials`, listings of other materials are passed over inside the R*Tree.
 */
export function listingsInBox(q: Db, box: PointBox, materials?: readonly string[]): Knex.QueryBuilder {
  const lng: [number, number] | null = box.minLng !== undefined && box.maxLng !== undefined ? [box.minLng, box.maxLng] : null;
  let builder: Knex.QueryBuilder;
  if (!isPg(q)) {
    builder = q
      .from(q.raw("listing_points CROSS JOIN listings ON listings.id = listing_points.listing_id"))
      .where("listing_points.max_lat", ">=", box.minLat)
      .where("listing_points.min_lat", "<=", box.maxLat);
    if (lng) builder.where("listing_points.max_lng", ">=", lng[0]).where("listing_points.min_lng", "<=", lng[1]);
    if (materials) builder.whereIn("listing_points.material_code", [...materials]);
  } else {
    builder = q.from("listings");
  }
  if (materials) builder.whereIn("listings.material_code", [...materials]);
  builder.whereBetween("listings.approx_lat", [box.minLat, box.maxLat]);
  if (lng) builder.whereBetween("listings.approx_lng", lng);
  return builder;
}

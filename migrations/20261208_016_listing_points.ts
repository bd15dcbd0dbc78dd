import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// A two-dimensional index of listings' public points, so a search near a point reads the
// listings in its box and no others, however wide the region the table covers. A B-tree on
// (status, latitude) reads a whole band of latitude across the region and grows with it.
//
// SQLite: an R*Tree (built into better-sqlite3) kept in step by triggers. Its key must be an
// integer, and listings has a text primary key whose rowid VACUUM may renumber, so each
// listing gets a stable integer key of its own in listing_point_keys; the listing id rides in
// the R*Tree as an auxiliary column so a search joins straight to listings, and the material
// beside it so a search for some materials skips the others without reading them. The R*Tree keeps
// 32-bit floats rounded outwards, so it answers "maybe in the box": queries check the exact
// point on the listing row afterwards.
//
// PostgreSQL has its own spatial index, listings_near (migrations/20261207_015_spatial_index.ts).

export async function up(knex: Knex): Promise<void> {
  if (isPg(knex)) return;
  await knex.raw("CREATE TABLE listing_point_keys (key INTEGER PRIMARY KEY, listing_id TEXT NOT NULL UNIQUE REFERENCES listings (id) ON DELETE CASCADE)");
  await knex.raw("CREATE VIRTUAL TABLE listing_points USING rtree(key, min_lat, max_lat, min_lng, max_lng, +listing_id TEXT, +material_code TEXT)");
  await knex.raw("INSERT INTO listing_point_keys (listing_id) SELECT id FROM listings");
  await knex.raw(`INSERT INTO listing_points (key, min_lat, max_lat, min_lng, max_lng, listing_id, material_code)
    SELECT k.key, l.approx_lat, l.approx_lat, l.approx_lng, l.approx_lng, l.id, l.material_code FROM listings l JOIN listing_point_keys k ON k.listing_id = l.id`);
  await knex.raw(`CREATE TRIGGER listing_points_insert AFTER INSERT ON listings BEGIN
    INSERT INTO listing_point_keys (listing_id) VALUES (NEW.id);
    INSERT INTO listing_points (key, min_lat, max_lat, min_lng, max_lng, listing_id, material_code)
      VALUES ((SELECT key FROM listing_point_keys WHERE listing_id = NEW.id), NEW.approx_lat, NEW.approx_lat, NEW.approx_lng, NEW.approx_lng, NEW.id, NEW.material_code);
  END`);
  await knex.raw(`CREATE TRIGGER listing_points_update AFTER UPDATE OF approx_lat, approx_lng, material_code ON listings BEGIN
    UPDATE listing_points SET min_lat = NEW.approx_lat, max_lat = NEW.approx_lat, min_lng = NEW.approx_lng, max_lng = NEW.approx_lng, material_code = NEW.material_code
      WHERE key = (SELECT key FROM listing_point_keys WHERE listing_id = NEW.id);
  END`);
  // BEFORE, so the key is still there to find (the foreign key removes it with the listing).
  await knex.raw(`CREATE TRIGGER listing_points_delete BEFORE DELETE ON listings BEGIN
    DELETE FROM listing_points WHERE key = (SELECT key FROM listing_point_keys WHERE listing_id = OLD.id);
  END`);
}

export async function down(knex: Knex): Promise<void> {
  if (isPg(knex)) return;
  for (const name of ["listing_points_delete", "listing_points_update", "listing_points_insert"]) await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
  await knex.raw("DROP TABLE IF EXISTS listing_points");
  await knex.raw("DROP TABLE IF EXISTS listing_point_keys");
}

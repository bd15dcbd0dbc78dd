import type { Knex } from "knex";

// Finding places by name instead of typing coordinates:
// - places: a gazetteer of towns, villages, streets, postcodes and landmarks with a point
//   each (the demo seeds Fernhollow's; a region can load its own, or use a geocoding service
//   through GEOCODER_URL);
// - place_terms: the lower-case strings each place is found by the start of (lib/geo/
//   place-terms.ts), searched with a prefix LIKE on both engines;
// - users.home_*: the place a gardener plans from when a bed has none of its own. Private:
//   only its owner ever sees it.

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("places", (t) => {
    t.string("id", 36).primary();
    t.string("kind", 16).notNullable(); // town | village | postcode | street | landmark
    t.string("name", 200).notNullable();
    t.string("context", 200);
    t.double("lat").notNullable();
    t.double("lng").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.index(["lat", "lng"]);
  });
  await knex.schema.createTable("place_terms", (t) => {
    t.string("place_id", 36).notNullable().references("places.id").onDelete("CASCADE");
    t.string("term", 300).notNullable();
    t.primary(["term", "place_id"]);
  });
  await knex.schema.alterTable("users", (t) => {
    t.string("home_place", 300);
    t.double("home_lat");
    t.double("home_lng");
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const column of ["home_lng", "home_lat", "home_place"]) await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["users", column]);
  await knex.schema.dropTableIfExists("place_terms");
  await knex.schema.dropTableIfExists("places");
}

import type { Knex } from "knex";

// Matching needs the cheapest listings of a material near a point without reading them
// all: an index in order of price per unit size (a sheet's m², a bag's or bale's m³; the
// listing unit itself for m², m³ and kg), with the public point alongside so a bounding box
// is checked inside the index. Queries must spell the expression exactly as it is here,
// which is why it is exported.
export const UNIT_PRICE_SQL =
  "(price_cents * 1.0 / (CASE WHEN unit IN ('sheets', 'bags', 'bales') AND unit_size > 0 THEN unit_size ELSE 1 END))";

export const UNIT_PRICE_INDEX = "listings_unit_price";

export async function up(knex: Knex): Promise<void> {
  // The same statement on SQLite and PostgreSQL: both index expressions in parentheses.
  await knex.raw(`CREATE INDEX ${UNIT_PRICE_INDEX} ON listings (status, material_code, ${UNIT_PRICE_SQL}, approx_lat, approx_lng)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`DROP INDEX IF EXISTS ${UNIT_PRICE_INDEX}`);
}

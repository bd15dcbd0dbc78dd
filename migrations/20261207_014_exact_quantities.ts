import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// Quantities, sizes and masses as 8-byte doubles on PostgreSQL too. Knex's `float` is a
// 4-byte `real` there (SQLite's REAL is always 8 bytes), which cannot hold 0.7 or 3.3 closely
// enough: a 0.1 + 0.6 hold of a 0.7 listing was refused and held totals drifted to
// 0.90000004. New columns use `t.double`; tests/integration/engine.test.ts fails on any
// `real` column.

const REAL_COLUMNS: Record<string, string[]> = {
  materials: ["n_pct", "cn_ratio", "moisture_pct", "bulk_density_kg_m3"],
  listings: ["unit_size", "unit_mass_kg", "quantity_total", "quantity_held", "quantity_collected", "max_per_reservation"],
  beds: ["area_m2"],
  reservations: ["quantity"],
  giveaway_days: ["unit_size", "household_cap"],
  giveaway_bookings: ["quantity"],
};

// A trigger that names its columns (UPDATE OF …) holds on to their type: it has to go while
// the type changes, and comes back as migrations/20261201_003_listing_search made it.
const AUTO_GONE_TRIGGER = `CREATE TRIGGER listings_auto_gone BEFORE UPDATE OF quantity_total, quantity_held, quantity_collected ON listings
  FOR EACH ROW EXECUTE FUNCTION listings_auto_gone()`;

async function retype(knex: Knex, type: "double precision" | "real") {
  await knex.raw("DROP TRIGGER IF EXISTS listings_auto_gone ON listings");
  for (const [table, columns] of Object.entries(REAL_COLUMNS)) {
    // Through text: a real's shortest decimal form (0.7) becomes that double, not 0.699999988.
    const changes = columns.map((c) => `ALTER COLUMN "${c}" TYPE ${type} USING "${c}"::text::${type}`).join(", ");
    await knex.raw(`ALTER TABLE "${table}" ${changes}`);
  }
  await knex.raw(AUTO_GONE_TRIGGER);
}

export async function up(knex: Knex): Promise<void> {
  if (isPg(knex)) await retype(knex, "double precision");
}

export async function down(knex: Knex): Promise<void> {
  if (isPg(knex)) await retype(knex, "real");
}

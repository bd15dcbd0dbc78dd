import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// Live-culture orders ride on reservations: how the worms reach the buyer (collected or
// posted), the private address a parcel goes to, and the parcel's progress after payment
// (paid → packed → shipped → delivered, or collected), with the carrier and tracking text.

const COLUMNS = ["fulfilment", "ship_to", "order_stage", "carrier", "tracking", "shipped_at"];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("reservations", (t) => {
    t.string("fulfilment", 8); // pickup | post; null for material that is not a live culture
    t.string("ship_to", 400); // posted orders only; seen by the buyer and the grower alone
    t.string("order_stage", 10); // paid | packed | shipped | delivered | collected; null until confirmed
    t.string("carrier", 60);
    t.string("tracking", 120); // a tracking number or link, as the grower types it
    t.timestamp("shipped_at", { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  // Unindexed, unconstrained columns: PostgreSQL and SQLite 3.35+ drop them in place (a Knex
  // table rebuild on SQLite would trip over the foreign keys pointing at reservations).
  if (isPg(knex)) {
    await knex.schema.alterTable("reservations", (t) => t.dropColumns(...COLUMNS));
    return;
  }
  for (const c of COLUMNS) await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["reservations", c]);
}

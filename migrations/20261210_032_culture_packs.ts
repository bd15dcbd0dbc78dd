import type { Knex } from "knex";

// Starter cultures are sold by the pack as often as by the kg: a grower may price a listing
// per pack of a set weight (pack_size, in the listing's unit, kg for cultures) at
// pack_price_cents a pack. Reservations of such a listing are whole packs; price_cents keeps
// the price per kg the pack works out at, so browse, sorting and the free filter read one
// column for every listing (lib/listings/packs.ts).

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("listings", (t) => {
    t.double("pack_size");
    t.integer("pack_price_cents");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["listings", "pack_price_cents"]);
  await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["listings", "pack_size"]);
}

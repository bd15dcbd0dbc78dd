import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// A giveaway day's no-show deposit is held on a card through the same payments rows as a
// reservation's: a payment now belongs to a reservation or to a giveaway booking, exactly one
// of them. A booking waiting for its deposit has a time by which it must be put down.

const ONE_OWNER = "(reservation_id IS NULL) <> (giveaway_booking_id IS NULL)";

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("giveaway_bookings", (t) => {
    t.timestamp("hold_expires_at", { useTz: true }); // set while the deposit is awaited
    t.index(["deposit_status", "hold_expires_at"], "giveaway_bookings_deposit_due");
  });
  // On SQLite, .alter() rebuilds payments (nothing points at it), keeping its indexes.
  await knex.schema.alterTable("payments", (t) => {
    t.string("reservation_id", 36).nullable().alter();
    t.string("giveaway_booking_id", 36).references("giveaway_bookings.id");
    t.index(["giveaway_booking_id"]);
  });
  if (isPg(knex)) {
    await knex.raw(`ALTER TABLE payments ADD CONSTRAINT payments_one_owner CHECK (${ONE_OWNER})`);
  } else {
    const sqlite = ONE_OWNER.replace(/\b(reservation_id|giveaway_booking_id)\b/g, "NEW.$1");
    for (const event of ["insert", "update"]) {
      await knex.raw(`CREATE TRIGGER payments_one_owner_${event} BEFORE ${event.toUpperCase()} ON payments
        WHEN NOT (${sqlite})
        BEGIN SELECT RAISE(ABORT, 'a payment belongs to one reservation or one giveaway booking'); END`);
    }
  }
}

export async function down(knex: Knex): Promise<void> {
  if (isPg(knex)) await knex.raw("ALTER TABLE payments DROP CONSTRAINT payments_one_owner");
  else for (const event of ["insert", "update"]) await knex.raw(`DROP TRIGGER IF EXISTS payments_one_owner_${event}`);
  // Booking deposits cannot live without the column that names their booking.
  await knex("payments").whereNotNull("giveaway_booking_id").delete();
  await knex.schema.alterTable("payments", (t) => {
    t.dropIndex(["giveaway_booking_id"]);
    t.dropForeign(["giveaway_booking_id"]);
  });
  await knex.schema.alterTable("payments", (t) => {
    t.dropColumn("giveaway_booking_id");
    t.string("reservation_id", 36).notNullable().alter();
  });
  await knex.schema.alterTable("giveaway_bookings", (t) => t.dropIndex(["deposit_status", "hold_expires_at"], "giveaway_bookings_deposit_due"));
  // Unindexed and unconstrained now: dropped in place (a rebuild would trip over the
  // foreign keys pointing at giveaway_bookings).
  if (isPg(knex)) await knex.schema.alterTable("giveaway_bookings", (t) => t.dropColumn("hold_expires_at"));
  else await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["giveaway_bookings", "hold_expires_at"]);
}

import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// Councils' staff invitations and giveaway days, moderators' reports, and worm growers'
// shipping settings. Portable like the core: text UUIDs, ISO-8601 UTC timestamps, cents.


/** A CHECK on an existing table: a constraint on PostgreSQL, a pair of triggers on SQLite. */
async function addCheck(knex: Knex, table: string, name: string, condition: string, message: string, columns: string[]) {
  if (isPg(knex)) {
    await knex.raw(`ALTER TABLE ${table} ADD CONSTRAINT ${name} CHECK (${condition})`);
    return;
  }
  let sqliteCondition = condition;
  for (const c of columns) sqliteCondition = sqliteCondition.replace(new RegExp(`\\b${c}\\b`, "g"), `NEW.${c}`);
  for (const event of ["INSERT", "UPDATE"]) {
    await knex.raw(`CREATE TRIGGER ${name}_${event.toLowerCase()} BEFORE ${event} ON ${table}
      WHEN NOT (${sqliteCondition})
      BEGIN SELECT RAISE(ABORT, '${message}'); END`);
  }
}

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("organisation_invites", (t) => {
    t.string("id", 36).primary();
    t.string("organisation_id", 36).notNullable().references("organisations.id").onDelete("CASCADE");
    t.string("email", 320).notNullable();
    // sha256 of the token in the link; the token itself is only ever in the e-mail.
    t.string("token_hash", 64).notNullable().unique();
    t.string("invited_by", 36).notNullable().references("users.id");
    t.string("status", 12).notNullable().defaultTo("pending"); // pending accepted revoked
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.string("accepted_by", 36).references("users.id");
    t.timestamp("accepted_at", { useTz: true });
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.index(["organisation_id", "status"]);
  });

  await knex.schema.createTable("giveaway_days", (t) => {
    t.string("id", 36).primary();
    t.string("organisation_id", 36).notNullable().references("organisations.id");
    t.string("created_by", 36).notNullable().references("users.id");
    t.string("material_code", 32).notNullable().references("materials.code");
    t.string("title", 120).notNullable();
    t.text("notes").notNullable().defaultTo("");
    // The local calendar day, YYYY-MM-DD, kept as text so both databases hand back the same string.
    t.string("date", 10).notNullable();
    t.string("time_zone", 40).notNullable();
    // Exact place: staff and booked households only. The approximate point is public.
    t.double("lat").notNullable();
    t.double("lng").notNullable();
    t.string("address", 240).notNullable();
    t.double("approx_lat").notNullable();
    t.double("approx_lng").notNullable();
    t.string("unit", 8).notNullable(); // bags | m3
    t.float("unit_size"); // m³ per bag
    t.float("household_cap").notNullable();
    t.timestamp("booking_opens_at", { useTz: true }).notNullable();
    t.timestamp("booking_closes_at", { useTz: true }).notNullable();
    t.integer("cancel_cutoff_hours").notNullable().defaultTo(12);
    // Recorded only: taking it needs the payments work (see lib/services/giveaways/book-giveaway.ts).
    t.integer("deposit_cents").notNullable().defaultTo(0);
    t.string("currency", 3).notNullable().defaultTo("eur");
    t.string("status", 12).notNullable().defaultTo("scheduled"); // scheduled | cancelled
    t.text("cancel_reason");
    t.timestamp("cancelled_at", { useTz: true });
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable();
    t.index(["status", "date", "approx_lat", "approx_lng"], "giveaway_days_search");
    t.index(["organisation_id", "date"]);
  });

  await knex.schema.createTable("giveaway_slots", (t) => {
    t.string("id", 36).primary();
    t.string("day_id", 36).notNullable().references("giveaway_days.id").onDelete("CASCADE");
    t.timestamp("starts_at", { useTz: true }).notNullable();
    t.timestamp("ends_at", { useTz: true }).notNullable();
    t.integer("capacity").notNullable(); // households
    t.integer("booked").notNullable().defaultTo(0);
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.index(["day_id", "starts_at"]);
  });
  // However the app misbehaves, a slot never holds more households than it has room for.
  await addCheck(knex, "giveaway_slots", "giveaway_slots_booked_ok", "booked >= 0 AND booked <= capacity", "slot booked out of range", ["booked", "capacity"]);

  await knex.schema.createTable("giveaway_bookings", (t) => {
    t.string("id", 36).primary();
    t.string("day_id", 36).notNullable().references("giveaway_days.id");
    t.string("slot_id", 36).notNullable().references("giveaway_slots.id");
    t.string("user_id", 36).notNullable().references("users.id");
    t.float("quantity").notNullable(); // in the day's unit
    t.string("status", 12).notNullable(); // booked cancelled checked_in no_show
    t.integer("deposit_cents").notNullable().defaultTo(0);
    t.string("deposit_status", 12).notNullable().defaultTo("none"); // none recorded released forfeit
    t.string("currency", 3).notNullable().defaultTo("eur");
    t.timestamp("checked_in_at", { useTz: true });
    t.string("checked_in_by", 36).references("users.id");
    t.timestamp("cancelled_at", { useTz: true });
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable();
    t.index(["slot_id", "status"]);
    t.index(["user_id"]);
  });
  // One live booking per household (account) per day, enforced by the database so two
  // requests at once cannot both get in. Same partial-index syntax on SQLite and PostgreSQL.
  await knex.raw(
    "CREATE UNIQUE INDEX giveaway_bookings_one_per_household ON giveaway_bookings (day_id, user_id) WHERE status <> 'cancelled'",
  );

  await knex.schema.createTable("reports", (t) => {
    t.string("id", 36).primary();
    t.string("reporter_id", 36).notNullable().references("users.id");
    t.string("subject_type", 8).notNullable(); // listing | user
    t.string("listing_id", 36).references("listings.id");
    t.string("subject_user_id", 36).references("users.id"); // the reported person, or the listing's owner
    t.string("reason", 16).notNullable(); // contaminated misdescribed no_show unsafe other
    t.text("text").notNullable();
    t.string("status", 8).notNullable().defaultTo("open"); // open | closed
    t.text("outcome_note");
    t.string("closed_by", 36).references("users.id");
    t.timestamp("closed_at", { useTz: true });
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.index(["status", "created_at"]);
    t.index(["listing_id"]);
    t.index(["subject_user_id"]);
  });

  await knex.schema.createTable("grower_shipping", (t) => {
    t.string("user_id", 36).primary().references("users.id").onDelete("CASCADE");
    // Weekdays parcels go out, 0 = Sunday, as a comma list ("1,2"): no JSON type needed.
    t.string("ship_weekdays", 20).notNullable().defaultTo("1,2");
    t.boolean("paused").notNullable().defaultTo(false);
    t.string("pause_reason", 8); // heat | frost | other
    t.string("pause_note", 200);
    t.timestamp("updated_at", { useTz: true }).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ["grower_shipping", "reports", "giveaway_bookings", "giveaway_slots", "giveaway_days", "organisation_invites"]) {
    await knex.schema.dropTableIfExists(table);
  }
}

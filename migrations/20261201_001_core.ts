import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// The core of the domain. Portable between SQLite and PostgreSQL: ids are text UUIDs made
// by the app, times are ISO-8601 UTC strings in timestamp columns, money is integer cents.

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("users", (t) => {
    t.string("id", 36).primary();
    t.string("email", 320).notNullable().unique();
    t.timestamp("email_verified_at", { useTz: true });
    t.string("password_hash", 100);
    t.string("display_name", 80).notNullable();
    t.string("unit_system", 8).notNullable().defaultTo("metric");
    t.boolean("reminders_opt_out").notNullable().defaultTo(false);
    t.timestamp("suspended_at", { useTz: true });
    t.timestamp("verified_at", { useTz: true });
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable();
  });
  await knex.raw("CREATE INDEX users_email_lower ON users (lower(email))");

  await knex.schema.createTable("user_roles", (t) => {
    t.string("user_id", 36).notNullable().references("users.id").onDelete("CASCADE");
    t.string("role", 16).notNullable();
    t.string("status", 12).notNullable().defaultTo("active"); // active | requested | refused
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.primary(["user_id", "role"]);
  });

  await knex.schema.createTable("organisations", (t) => {
    t.string("id", 36).primary();
    t.string("name", 120).notNullable();
    t.string("kind", 16).notNullable(); // council | business
    t.timestamp("created_at", { useTz: true }).notNullable();
  });

  await knex.schema.createTable("memberships", (t) => {
    t.string("organisation_id", 36).notNullable().references("organisations.id").onDelete("CASCADE");
    t.string("user_id", 36).notNullable().references("users.id").onDelete("CASCADE");
    t.string("org_role", 12).notNullable().defaultTo("staff"); // owner | staff
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.primary(["organisation_id", "user_id"]);
    t.index(["user_id"]);
  });

  await knex.schema.createTable("verification_tokens", (t) => {
    t.string("identifier", 320).notNullable();
    t.string("token", 128).notNullable(); // stored hashed by next-auth
    t.timestamp("expires", { useTz: true }).notNullable();
    t.primary(["identifier", "token"]);
  });

  await knex.schema.createTable("materials", (t) => {
    t.string("code", 32).primary();
    t.string("name", 80).notNullable();
    t.float("n_pct");
    t.float("cn_ratio");
    t.float("moisture_pct").notNullable();
    t.float("bulk_density_kg_m3").notNullable();
    t.string("default_unit", 8).notNullable();
    t.text("source").notNullable();
  });

  await knex.schema.createTable("listings", (t) => {
    t.string("id", 36).primary();
    t.string("owner_id", 36).notNullable().references("users.id");
    t.string("organisation_id", 36).references("organisations.id");
    t.string("material_code", 32).notNullable().references("materials.code");
    t.string("title", 120).notNullable();
    t.text("description").notNullable().defaultTo("");
    t.string("status", 12).notNullable().defaultTo("draft"); // draft active paused archived gone expired hidden
    t.string("unit", 8).notNullable(); // sheets m2 bags m3 bales kg
    t.float("unit_size"); // m² a sheet, m³ a bag or bale, kg a bale
    t.float("unit_mass_kg");
    t.float("quantity_total").notNullable();
    t.float("quantity_held").notNullable().defaultTo(0);
    t.float("quantity_collected").notNullable().defaultTo(0);
    t.integer("price_cents").notNullable().defaultTo(0);
    t.string("currency", 3).notNullable().defaultTo("eur");
    t.integer("deposit_cents").notNullable().defaultTo(0);
    t.float("max_per_reservation");
    t.boolean("auto_accept").notNullable().defaultTo(false);
    // Exact point and address: owner and confirmed gardener only.
    t.double("lat").notNullable();
    t.double("lng").notNullable();
    t.string("address", 240).notNullable();
    // Public point: a stable offset of a few hundred metres from the exact one.
    t.double("approx_lat").notNullable();
    t.double("approx_lng").notNullable();
    t.timestamp("available_from", { useTz: true });
    t.timestamp("available_until", { useTz: true });
    t.text("quality").notNullable().defaultTo("{}"); // JSON declarations per material
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable();
    t.index(["status", "material_code", "approx_lat", "approx_lng"], "listings_search_box");
    t.index(["owner_id"]);
  });
  // Quantities can never go negative or past the total, whatever the app does.
  const quantityOk =
    "quantity_held >= 0 AND quantity_collected >= 0 AND quantity_held + quantity_collected <= quantity_total + 1e-9";
  if (isPg(knex)) {
    await knex.raw(`ALTER TABLE listings ADD CONSTRAINT listings_quantity_ok CHECK (${quantityOk})`);
  } else {
    // SQLite cannot add a CHECK to an existing table; triggers do the same job.
    for (const event of ["INSERT", "UPDATE"]) {
      await knex.raw(`CREATE TRIGGER listings_quantity_ok_${event.toLowerCase()} BEFORE ${event} ON listings
        WHEN NOT (${quantityOk.replace(/quantity_/g, "NEW.quantity_")})
        BEGIN SELECT RAISE(ABORT, 'listing quantity out of range'); END`);
    }
  }

  await knex.schema.createTable("pickup_windows", (t) => {
    t.string("id", 36).primary();
    t.string("listing_id", 36).notNullable().references("listings.id").onDelete("CASCADE");
    t.string("kind", 8).notNullable(); // weekly | dated
    t.integer("weekday"); // 0 = Sunday, weekly only
    t.string("start_time", 5); // HH:MM local, weekly only
    t.string("end_time", 5);
    t.timestamp("starts_at", { useTz: true }); // dated only
    t.timestamp("ends_at", { useTz: true });
    t.index(["listing_id"]);
  });

  await knex.schema.createTable("listing_photos", (t) => {
    t.string("id", 36).primary();
    t.string("listing_id", 36).notNullable().references("listings.id").onDelete("CASCADE");
    t.string("public_id", 200).notNullable();
    t.integer("width").notNullable();
    t.integer("height").notNullable();
    t.string("format", 8).notNullable();
    t.integer("position").notNullable().defaultTo(0);
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.index(["listing_id", "position"]);
  });

  await knex.schema.createTable("beds", (t) => {
    t.string("id", 36).primary();
    t.string("owner_id", 36).notNullable().references("users.id").onDelete("CASCADE");
    t.string("name", 80).notNullable();
    t.text("shape").notNullable(); // JSON: {length_m,width_m} or {polygon}
    t.float("area_m2").notNullable();
    t.double("lat");
    t.double("lng");
    t.text("recipe").notNullable().defaultTo("{}"); // JSON layer settings
    t.date("start_date");
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable();
    t.index(["owner_id"]);
  });

  await knex.schema.createTable("reservations", (t) => {
    t.string("id", 36).primary();
    t.string("listing_id", 36).notNullable().references("listings.id");
    t.string("gardener_id", 36).notNullable().references("users.id");
    t.string("bed_id", 36).references("beds.id").onDelete("SET NULL");
    t.string("pickup_window_id", 36).references("pickup_windows.id").onDelete("SET NULL");
    t.float("quantity").notNullable();
    t.string("status", 12).notNullable(); // held confirmed collected declined cancelled expired no_show
    t.timestamp("hold_expires_at", { useTz: true });
    t.string("pickup_code", 12);
    t.integer("amount_cents").notNullable().defaultTo(0);
    t.integer("deposit_cents").notNullable().defaultTo(0);
    t.string("currency", 3).notNullable().defaultTo("eur");
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable();
    t.index(["listing_id", "status"]);
    t.index(["gardener_id"]);
    t.index(["status", "hold_expires_at"]);
  });

  await knex.schema.createTable("payments", (t) => {
    t.string("id", 36).primary();
    t.string("reservation_id", 36).notNullable().references("reservations.id");
    t.string("kind", 10).notNullable(); // payment | deposit | refund
    t.string("provider", 16).notNullable().defaultTo("stripe");
    t.string("provider_ref", 120); // checkout session, payment intent or refund id
    t.string("status", 24).notNullable();
    t.integer("amount_cents").notNullable();
    t.string("currency", 3).notNullable();
    t.string("idempotency_key", 120).notNullable().unique();
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable();
    t.index(["reservation_id"]);
    t.index(["provider_ref"]);
  });

  await knex.schema.createTable("webhook_events", (t) => {
    t.string("id", 120).primary(); // the provider's event id: applying twice is impossible
    t.string("provider", 16).notNullable();
    t.string("type", 80).notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("processed_at", { useTz: true }).notNullable();
  });

  await knex.schema.createTable("email_outbox", (t) => {
    t.string("id", 36).primary();
    t.string("to_address", 320).notNullable();
    t.string("subject", 200).notNullable();
    t.text("text_body").notNullable();
    t.text("html_body");
    t.string("template", 40).notNullable();
    t.string("dedupe_key", 200).unique();
    t.string("status", 10).notNullable().defaultTo("pending"); // pending sent failed
    t.integer("attempts").notNullable().defaultTo(0);
    t.timestamp("next_attempt_at", { useTz: true }).notNullable();
    t.text("last_error");
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("sent_at", { useTz: true });
    t.index(["status", "next_attempt_at"]);
  });

  await knex.schema.createTable("audit_log", (t) => {
    t.increments("id");
    t.string("actor_id", 36).references("users.id");
    t.string("action", 60).notNullable();
    t.string("subject_type", 30).notNullable();
    t.string("subject_id", 120);
    t.text("before");
    t.text("after");
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.index(["subject_type", "subject_id"]);
  });
  // Append-only in the database itself, not only by convention in the app.
  if (isPg(knex)) {
    await knex.raw(`CREATE FUNCTION audit_log_append_only() RETURNS trigger AS $$
      BEGIN RAISE EXCEPTION 'audit_log is append-only'; END; $$ LANGUAGE plpgsql`);
    await knex.raw(`CREATE TRIGGER audit_log_no_change BEFORE UPDATE OR DELETE ON audit_log
      FOR EACH ROW EXECUTE FUNCTION audit_log_append_only()`);
  } else {
    await knex.raw(`CREATE TRIGGER audit_log_no_update BEFORE UPDATE ON audit_log
      BEGIN SELECT RAISE(ABORT, 'audit_log is append-only'); END`);
    await knex.raw(`CREATE TRIGGER audit_log_no_delete BEFORE DELETE ON audit_log
      BEGIN SELECT RAISE(ABORT, 'audit_log is append-only'); END`);
  }
}

export async function down(knex: Knex): Promise<void> {
  if (isPg(knex)) {
    await knex.raw("DROP TRIGGER IF EXISTS audit_log_no_change ON audit_log");
    await knex.raw("DROP FUNCTION IF EXISTS audit_log_append_only()");
  }
  for (const table of [
    "audit_log",
    "email_outbox",
    "webhook_events",
    "payments",
    "reservations",
    "beds",
    "listing_photos",
    "pickup_windows",
    "listings",
    "materials",
    "verification_tokens",
    "memberships",
    "organisations",
    "user_roles",
    "users",
  ]) {
    await knex.schema.dropTableIfExists(table);
  }
}

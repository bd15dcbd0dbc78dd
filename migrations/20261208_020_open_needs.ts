import type { Knex } from "knex";
import { EARTH_POINT_FUNCTION, isPg } from "../db/dialect";

// Open needs: what a gardener still wants (a bed's unmet layer, or something typed), where,
// within what radius and by when; the alerts each one got; and, on listings, when a listing
// is next due to be checked against them.
//
// Finding the needs a new listing could serve works like finding listings near a point, the
// other way round: each need is filed under the smallest reach band that holds its radius
// (lib/needs/reach.ts), and a listing looks, band by band, inside a latitude/longitude box
// as wide as that band around its own point, through the B-tree on
// (status, material_code, reach_km, lat, lng). Turf's exact distance to each need's own
// radius decides what the box let through. Without the band, a box as wide as the largest
// radius would read every need in a town for each listing. On PostgreSQL a GiST index holds
// the same columns with the place as a point in space (needs_near, like listings_near in
// 20261207_015_spatial_index), and the query asks it for a cube as wide as the band.
//
// needs_due_at on listings: the moment a listing should next be checked against open needs
// (null: nothing to do). A listing posted as active is due at once (the service sets it);
// afterwards the triggers below make it due whenever it becomes something a need might want
// that it was not before — more of it left (restocked, or a hold returned), back to active,
// new dates, a new place or unit — whatever code path changed the row. A listing shown ahead
// of its start date is due again on that date (the worker sets it), when it comes into its
// dates. Alerts are unique per need and listing, so checking again never sends twice.

/** "Due now": earlier than any clock, so the worker takes it on its next run whatever its clock says. */
export const DUE_NOW = "1970-01-01T00:00:00.000Z";

const LEFT = (row: "NEW" | "OLD") => `(${row}.quantity_total - ${row}.quantity_held - ${row}.quantity_collected)`;
const CHANGED_COLUMNS = ["status", "available_from", "available_until", "approx_lat", "approx_lng", "unit", "unit_size"];

export async function up(knex: Knex): Promise<void> {
  const pg = isPg(knex);

  await knex.schema.createTable("needs", (t) => {
    t.string("id", 36).primary();
    t.string("owner_id", 36).notNullable().references("users.id").onDelete("CASCADE");
    // A need opened from a bed's plan stays open (as a typed one) if the bed is deleted.
    t.string("bed_id", 36).references("beds.id").onDelete("SET NULL");
    t.string("material_code", 32).notNullable().references("materials.code");
    // SI, in the unit the need was given in (m2, m3 or kg, as lib/match's needs).
    t.double("quantity").notNullable();
    t.string("unit", 4).notNullable();
    t.double("radius_km").notNullable();
    // The smallest reach band (km) that holds radius_km: the index's third column.
    t.integer("reach_km").notNullable();
    // The exact place: its owner's alone. Aggregates use the demand grid's cell, never this.
    t.double("lat").notNullable();
    t.double("lng").notNullable();
    t.date("needed_by").notNullable();
    t.string("alerts", 10).notNullable().defaultTo("daily"); // daily | immediate
    t.string("status", 10).notNullable().defaultTo("open"); // open | met | expired | closed
    t.timestamp("closed_at", { useTz: true });
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("updated_at", { useTz: true }).notNullable();
    t.index(["status", "material_code", "reach_km", "lat", "lng"], "needs_reach_box");
    t.index(["owner_id", "status"]);
    t.index(["bed_id"]);
    t.index(["status", "needed_by"], "needs_status_date");
  });

  if (pg) await knex.raw(`CREATE INDEX needs_near ON needs USING gist (status, material_code, reach_km, ${EARTH_POINT_FUNCTION}(lat, lng))`);

  // One open need per bed and material, even when two requests race: both engines take a partial index.
  await knex.raw("CREATE UNIQUE INDEX needs_one_open_per_bed ON needs (bed_id, material_code) WHERE status = 'open' AND bed_id IS NOT NULL");

  await knex.schema.createTable("need_alerts", (t) => {
    t.string("id", 36).primary();
    t.string("need_id", 36).notNullable().references("needs.id").onDelete("CASCADE");
    t.string("listing_id", 36).notNullable().references("listings.id").onDelete("CASCADE");
    t.string("user_id", 36).notNullable().references("users.id").onDelete("CASCADE");
    // From the need's place to the listing's public point, km.
    t.double("distance_km").notNullable();
    t.string("delivery", 10).notNullable(); // immediate | daily: how the e-mail goes; in_app: no e-mail
    t.timestamp("emailed_at", { useTz: true });
    t.timestamp("seen_at", { useTz: true });
    t.timestamp("dismissed_at", { useTz: true });
    t.timestamp("created_at", { useTz: true }).notNullable();
    // One alert per need and listing, however often the listing is checked again.
    t.unique(["need_id", "listing_id"], { indexName: "need_alerts_once" });
    t.index(["user_id", "created_at"]);
    t.index(["listing_id"]);
    t.index(["delivery", "emailed_at"], "need_alerts_digest");
  });

  await knex.schema.alterTable("listings", (t) => {
    t.timestamp("needs_due_at", { useTz: true });
    t.index(["needs_due_at"], "listings_needs_due");
  });
  await knex.schema.alterTable("reservations", (t) => {
    // The open need a reservation was made for (from an alert), counted towards meeting it.
    // A foreign key on PostgreSQL only: SQLite cannot drop a constrained column in place, and
    // rebuilding reservations is refused while payments and events point at it; deleting a
    // need clears the column itself (db/needs.ts), so both engines behave the same.
    const col = t.string("need_id", 36);
    if (pg) col.references("needs.id").onDelete("SET NULL");
    t.index(["need_id"], "reservations_need");
  });

  if (pg) {
    const changed = CHANGED_COLUMNS.map((c) => `NEW.${c} IS DISTINCT FROM OLD.${c}`).join(" OR ");
    await knex.raw(`CREATE FUNCTION listings_needs_due() RETURNS trigger AS $$
      BEGIN
        IF NEW.status = 'active' AND (${LEFT("NEW")} > ${LEFT("OLD")} + 1e-9 OR ${changed}) THEN
          NEW.needs_due_at := '${DUE_NOW}';
        END IF;
        RETURN NEW;
      END; $$ LANGUAGE plpgsql`);
    // After listings_auto_gone (triggers fire in name order), so a listing it turns back to
    // active counts as changed.
    await knex.raw("CREATE TRIGGER listings_needs_due BEFORE UPDATE ON listings FOR EACH ROW EXECUTE FUNCTION listings_needs_due()");
  } else {
    // SQLite triggers cannot rewrite NEW; these set the column after the fact and touch
    // nothing they listen to, so nothing fires again.
    await knex.raw(`CREATE TRIGGER listings_needs_due_more AFTER UPDATE OF quantity_total, quantity_held, quantity_collected ON listings
      WHEN NEW.status = 'active' AND ${LEFT("NEW")} > ${LEFT("OLD")} + 1e-9
      BEGIN UPDATE listings SET needs_due_at = '${DUE_NOW}' WHERE id = NEW.id; END`);
    const changed = CHANGED_COLUMNS.map((c) => `NEW.${c} IS NOT OLD.${c}`).join(" OR ");
    await knex.raw(`CREATE TRIGGER listings_needs_due_change AFTER UPDATE OF ${CHANGED_COLUMNS.join(", ")} ON listings
      WHEN NEW.status = 'active' AND (${changed})
      BEGIN UPDATE listings SET needs_due_at = '${DUE_NOW}' WHERE id = NEW.id; END`);
  }
}

export async function down(knex: Knex): Promise<void> {
  const pg = isPg(knex);
  if (pg) {
    await knex.raw("DROP TRIGGER IF EXISTS listings_needs_due ON listings");
    await knex.raw("DROP FUNCTION IF EXISTS listings_needs_due()");
  } else {
    await knex.raw("DROP TRIGGER IF EXISTS listings_needs_due_change");
    await knex.raw("DROP TRIGGER IF EXISTS listings_needs_due_more");
  }
  await knex.schema.alterTable("reservations", (t) => t.dropIndex(["need_id"], "reservations_need"));
  await knex.schema.alterTable("listings", (t) => t.dropIndex(["needs_due_at"], "listings_needs_due"));
  // Dropped in place: a rebuild of either table would trip over the foreign keys pointing at it.
  for (const [table, column] of [["reservations", "need_id"], ["listings", "needs_due_at"]]) {
    await knex.raw("ALTER TABLE ?? DROP COLUMN ??", [table, column]);
  }
  await knex.schema.dropTableIfExists("need_alerts");
  await knex.schema.dropTableIfExists("needs");
}

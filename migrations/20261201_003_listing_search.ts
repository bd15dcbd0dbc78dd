import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// Text search over listings' titles and descriptions, and the automatic "gone" status.
//
// SQLite: an FTS5 table kept in step by triggers. It stores the listing id as an UNINDEXED
// column rather than sharing the listings table's rowid: listings has a text primary key, so
// its rowid is not stable (VACUUM may renumber it) and an external-content index keyed on it
// could silently point at the wrong rows. Deleting by an UNINDEXED column scans the FTS
// table, but that only happens when a title or description changes.
//
// PostgreSQL: a GIN index on the same tsvector expression db/listing-search.ts queries.
//
// Both: when a listing's quantities leave nothing available it turns "gone", and back to
// "active" if some comes back (a hold released) — whatever code path moved the numbers.

const LEFT = "NEW.quantity_total - NEW.quantity_held - NEW.quantity_collected";
const EPS = "1e-9";

export async function up(knex: Knex): Promise<void> {
  if (isPg(knex)) {
    await knex.raw(
      "CREATE INDEX listings_text_search ON listings USING GIN (to_tsvector('english', coalesce(title, '') || ' ' || coalesce(description, '')))",
    );
    await knex.raw(`CREATE FUNCTION listings_auto_gone() RETURNS trigger AS $$
      BEGIN
        IF NEW.status = 'active' AND ${LEFT} <= ${EPS} THEN NEW.status := 'gone';
        ELSIF NEW.status = 'gone' AND ${LEFT} > ${EPS} THEN NEW.status := 'active';
        END IF;
        RETURN NEW;
      END; $$ LANGUAGE plpgsql`);
    await knex.raw(`CREATE TRIGGER listings_auto_gone BEFORE UPDATE OF quantity_total, quantity_held, quantity_collected ON listings
      FOR EACH ROW EXECUTE FUNCTION listings_auto_gone()`);
  } else {
    await knex.raw(
      "CREATE VIRTUAL TABLE listing_search USING fts5(listing_id UNINDEXED, title, description, tokenize = 'porter unicode61 remove_diacritics 2')",
    );
    await knex.raw("INSERT INTO listing_search (listing_id, title, description) SELECT id, title, description FROM listings");
    await knex.raw(`CREATE TRIGGER listing_search_insert AFTER INSERT ON listings BEGIN
      INSERT INTO listing_search (listing_id, title, description) VALUES (NEW.id, NEW.title, NEW.description);
    END`);
    await knex.raw(`CREATE TRIGGER listing_search_update AFTER UPDATE OF title, description ON listings BEGIN
      DELETE FROM listing_search WHERE listing_id = OLD.id;
      INSERT INTO listing_search (listing_id, title, description) VALUES (NEW.id, NEW.title, NEW.description);
    END`);
    await knex.raw(`CREATE TRIGGER listing_search_delete AFTER DELETE ON listings BEGIN
      DELETE FROM listing_search WHERE listing_id = OLD.id;
    END`);
    // SQLite triggers cannot rewrite NEW, so these update the row after the fact; recursive
    // triggers are off by default and these touch only status, so nothing fires again.
    await knex.raw(`CREATE TRIGGER listings_auto_gone AFTER UPDATE OF quantity_total, quantity_held, quantity_collected ON listings
      WHEN NEW.status = 'active' AND ${LEFT} <= ${EPS}
      BEGIN UPDATE listings SET status = 'gone' WHERE id = NEW.id; END`);
    await knex.raw(`CREATE TRIGGER listings_auto_back AFTER UPDATE OF quantity_total, quantity_held, quantity_collected ON listings
      WHEN NEW.status = 'gone' AND ${LEFT} > ${EPS}
      BEGIN UPDATE listings SET status = 'active' WHERE id = NEW.id; END`);
  }
  // Browse without a material filter narrows by status and latitude first.
  await knex.schema.alterTable("listings", (t) => t.index(["status", "approx_lat"], "listings_status_lat"));
  await knex.schema.alterTable("listings", (t) => t.index(["status", "created_at"], "listings_status_created"));
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("listings", (t) => {
    t.dropIndex(["status", "created_at"], "listings_status_created");
    t.dropIndex(["status", "approx_lat"], "listings_status_lat");
  });
  if (isPg(knex)) {
    await knex.raw("DROP TRIGGER IF EXISTS listings_auto_gone ON listings");
    await knex.raw("DROP FUNCTION IF EXISTS listings_auto_gone()");
    await knex.raw("DROP INDEX IF EXISTS listings_text_search");
  } else {
    for (const name of ["listings_auto_back", "listings_auto_gone", "listing_search_delete", "listing_search_update", "listing_search_insert"]) {
      await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
    }
    await knex.raw("DROP TABLE IF EXISTS listing_search");
  }
}

import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// Reviews after a collection: each side of a reservation rates the other once.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("reviews", (t) => {
    t.string("id", 36).primary();
    t.string("reservation_id", 36).notNullable().references("reservations.id").onDelete("CASCADE");
    t.string("author_id", 36).notNullable().references("users.id");
    t.string("subject_id", 36).notNullable().references("users.id");
    t.integer("rating").notNullable();
    t.text("comment").notNullable().defaultTo("");
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.unique(["reservation_id", "author_id"]);
    t.index(["subject_id"]);
  });
  await knex.raw(
    isPg(knex)
      ? "ALTER TABLE reviews ADD CONSTRAINT reviews_rating_range CHECK (rating BETWEEN 1 AND 5)"
      : `CREATE TRIGGER reviews_rating_range BEFORE INSERT ON reviews WHEN NEW.rating NOT BETWEEN 1 AND 5
         BEGIN SELECT RAISE(ABORT, 'rating out of range'); END`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("reviews");
}

import type { Knex } from "knex";
import { isPg } from "../db/dialect";

// What the reservation flow needs beyond the core tables: when the pickup is due, how far
// the gardener's payment has got, the status history, the message thread, and the
// pending Stripe calls (so a refund or a release survives a crash or a Stripe outage).

const RESERVATION_COLUMNS = [
  "group_id",
  "payment_state",
  "pickup_at",
  "pickup_by",
  "confirmed_at",
  "closed_at",
  "cancelled_by",
  "expiry_warned_at",
  "pickup_reminded_at",
];

const PAYMENT_COLUMNS = [
  "parent_id",
  "payment_intent_id",
  "checkout_url",
  "captured_cents",
  "refunded_cents",
  "last_error",
  "pending_action",
  "action_attempts",
  "next_action_at",
];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("reservations", (t) => {
    // Reservations made together ("Reserve all") share a group: checkout walks through it.
    t.string("group_id", 36);
    // none | awaiting | paid | authorised | released | captured | refunded
    t.string("payment_state", 12).notNullable().defaultTo("none");
    t.timestamp("pickup_at", { useTz: true }); // start of the chosen pickup window
    t.timestamp("pickup_by", { useTz: true }); // after this the supplier may record a no-show
    t.timestamp("confirmed_at", { useTz: true });
    t.timestamp("closed_at", { useTz: true });
    t.string("cancelled_by", 10); // gardener | supplier
    t.timestamp("expiry_warned_at", { useTz: true });
    t.timestamp("pickup_reminded_at", { useTz: true });
    t.index(["group_id"]);
    t.index(["status", "pickup_at"]);
  });

  await knex.schema.alterTable("payments", (t) => {
    // A refund points at the payment it returns. No foreign key: SQLite can drop a plain
    // column in place, but not one inside a constraint, and the down migration needs that.
    t.string("parent_id", 36);
    t.string("payment_intent_id", 120);
    t.text("checkout_url");
    t.integer("captured_cents").notNullable().defaultTo(0);
    t.integer("refunded_cents").notNullable().defaultTo(0);
    t.text("last_error");
    // A Stripe call still owed: expire (the checkout), release, capture or refund.
    t.string("pending_action", 10);
    t.integer("action_attempts").notNullable().defaultTo(0);
    t.timestamp("next_action_at", { useTz: true });
    t.index(["payment_intent_id"]);
    t.index(["pending_action", "next_action_at"]);
  });

  await knex.schema.createTable("reservation_events", (t) => {
    t.increments("id");
    t.string("reservation_id", 36).notNullable().references("reservations.id").onDelete("CASCADE");
    t.string("from_status", 12);
    t.string("to_status", 12).notNullable();
    t.string("actor_id", 36).references("users.id"); // null: Duffbank itself (expiry, payment)
    t.string("note", 240);
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.index(["reservation_id", "id"]);
  });

  await knex.schema.createTable("reservation_messages", (t) => {
    t.string("id", 36).primary();
    t.string("reservation_id", 36).notNullable().references("reservations.id").onDelete("CASCADE");
    t.string("author_id", 36).notNullable().references("users.id");
    t.text("body").notNullable();
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.index(["reservation_id", "created_at"]);
    t.index(["author_id", "created_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("reservation_messages");
  await knex.schema.dropTableIfExists("reservation_events");
  await knex.schema.alterTable("payments", (t) => {
    t.dropIndex(["payment_intent_id"]);
    t.dropIndex(["pending_action", "next_action_at"]);
  });
  await knex.schema.alterTable("reservations", (t) => {
    t.dropIndex(["group_id"]);
    t.dropIndex(["status", "pickup_at"]);
  });
  await dropColumns(knex, "payments", PAYMENT_COLUMNS);
  await dropColumns(knex, "reservations", RESERVATION_COLUMNS);
}

// Knex rebuilds a SQLite table to drop a column, which other tables' foreign keys refuse;
// SQLite 3.35+ (and PostgreSQL) drop an unindexed, unconstrained column in place.
async function dropColumns(knex: Knex, table: string, columns: string[]) {
  if (isPg(knex)) {
    await knex.schema.alterTable(table, (t) => t.dropColumns(...columns));
    return;
  }
  for (const c of columns) await knex.raw("ALTER TABLE ?? DROP COLUMN ??", [table, c]);
}

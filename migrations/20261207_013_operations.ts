import type { Knex } from "knex";

// What running Duffbank through faults needs from the database:
// - heartbeats: each worker (and each app process, when asked whether it is ready) writes a
//   row, so readiness can say how long ago a worker was last alive and prove a write works;
// - the outbox remembers which worker holds a claim (so it can let go at shutdown), the id
//   the SMTP server gave a message it accepted (so a failed "mark sent" is retried as a mark,
//   never as a second send) and which service a retry is waiting for;
// - payments remember the same last point, so Stripe coming back sends its waiting calls;
// - idempotency_keys: the first answer to a money-moving request, replayed for a retry.
// Plain ALTER TABLE … DROP COLUMN on the way down runs on both engines (SQLite ≥ 3.35) and
// does not rebuild the tables.

const OUTBOX_COLUMNS = ["claimed_by", "smtp_message_id", "waiting_for"];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("heartbeats", (t) => {
    t.string("id", 200).primary(); // "worker:<host>:<pid>:<random>" or "app:<host>:<pid>"
    t.string("kind", 10).notNullable(); // worker | app
    t.string("host", 200).notNullable();
    t.integer("pid").notNullable();
    t.timestamp("started_at", { useTz: true }).notNullable();
    t.timestamp("beat_at", { useTz: true }).notNullable();
    t.index(["kind", "beat_at"]);
  });

  await knex.schema.alterTable("email_outbox", (t) => {
    t.string("claimed_by", 200);
    t.string("smtp_message_id", 300);
    t.string("waiting_for", 10);
  });

  await knex.schema.alterTable("payments", (t) => {
    t.string("waiting_for", 10);
  });

  await knex.schema.createTable("idempotency_keys", (t) => {
    t.string("user_id", 36).notNullable().references("users.id").onDelete("CASCADE");
    t.string("idem_key", 255).notNullable();
    t.string("method", 8).notNullable();
    t.string("path", 300).notNullable();
    t.string("request_hash", 64).notNullable();
    t.string("state", 10).notNullable(); // running | done
    t.integer("response_status");
    t.text("response_body");
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("completed_at", { useTz: true });
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.primary(["user_id", "idem_key"]);
    t.index(["expires_at"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists("idempotency_keys");
  await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["payments", "waiting_for"]);
  for (const column of OUTBOX_COLUMNS) await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["email_outbox", column]);
  await knex.schema.dropTableIfExists("heartbeats");
}

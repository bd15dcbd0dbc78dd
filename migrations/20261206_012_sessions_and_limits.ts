import type { Knex } from "knex";

// Server-side sessions and shared rate-limit counters, so several app processes agree on
// both. A session id rides in the signed session cookie and names a row here: ending the row
// (sign-out, a password change, "sign out everywhere", a suspension) ends the cookie, copies
// included. A counter is one row per limited thing (an account's failed sign-ins, a client
// address's sign-ups …), keyed by a keyed hash so no e-mail or address is stored; it counts
// within a fixed window and starts again once the window has passed.

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable("sessions", (t) => {
    t.string("id", 64).primary();
    t.string("user_id", 36).notNullable().references("users.id").onDelete("CASCADE");
    t.timestamp("created_at", { useTz: true }).notNullable();
    t.timestamp("expires_at", { useTz: true }).notNullable();
    t.timestamp("ended_at", { useTz: true });
    t.string("ended_reason", 24); // sign_out | password_changed | signed_out_everywhere | suspended
    t.index(["user_id"], "sessions_user");
  });

  await knex.schema.createTable("rate_limits", (t) => {
    t.string("key", 96).primary();
    t.timestamp("window_started_at", { useTz: true }).notNullable();
    t.integer("count").notNullable();
    t.index(["window_started_at"], "rate_limits_window");
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable("rate_limits");
  await knex.schema.dropTable("sessions");
}

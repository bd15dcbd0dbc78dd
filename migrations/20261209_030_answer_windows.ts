import type { Knex } from "knex";

// A request waiting for the supplier's answer has a window of its own (lib/reservations/
// policy.ts: up to two days, ending before the pickup starts) and a reminder half-way
// through it. answer_remind_at is when that reminder is due; the reminder job claims
// expiry_warned_at as its once-only marker, as the checkout warning does.

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("reservations", (t) => {
    t.timestamp("answer_remind_at", { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["reservations", "answer_remind_at"]);
}

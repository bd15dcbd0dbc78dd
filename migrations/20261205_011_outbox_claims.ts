import type { Knex } from "knex";

// An outbox message is claimed before it is sent: the sending worker sets claimed_until, and
// no other worker touches the row until that time has passed. Two workers running at once
// (a second worker started by mistake, or a deploy overlap) then never send the same message.

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("email_outbox", (t) => {
    t.timestamp("claimed_until", { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("email_outbox", (t) => {
    t.dropColumn("claimed_until");
  });
}

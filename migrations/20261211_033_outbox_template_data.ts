import type { Knex } from "knex";

// An outbox message is queued as its template's name and the data the template needs (JSON
// in `data`), and rendered when it is sent (lib/mail/templates/index.ts), so a transaction
// that queues mail does no rendering. subject and text_body are left empty on such rows and
// filled by the deliverer with what it sent; rows queued before this change hold their
// rendered text and no data, and are sent as they are.

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("email_outbox", (t) => {
    t.text("data");
  });
  await knex.schema.alterTable("email_outbox", (t) => {
    t.string("subject", 200).nullable().alter();
    t.text("text_body").nullable().alter();
  });
}

export async function down(knex: Knex): Promise<void> {
  // Text is required again. A message still waiting with only its data cannot be rendered
  // by the older code: it is given up on, saying why, rather than sent blank.
  await knex("email_outbox")
    .whereNull("text_body")
    .whereIn("status", ["pending"])
    .update({ status: "failed", last_error: "queued as template data; the outbox went back to rendered text before it was sent" });
  await knex("email_outbox").whereNull("subject").update({ subject: "" });
  await knex("email_outbox").whereNull("text_body").update({ text_body: "" });
  await knex.schema.alterTable("email_outbox", (t) => {
    t.string("subject", 200).notNullable().alter();
    t.text("text_body").notNullable().alter();
  });
  await knex.raw("ALTER TABLE ?? DROP COLUMN ??", ["email_outbox", "data"]);
}

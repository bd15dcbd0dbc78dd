// Outbox rows in tests. Services queue a template's name and data, rendered only when the
// message is sent; tests that check what a queued message will say render it the same way
// the deliverer does. Tests of the sending machinery queue rows already rendered, as rows
// queued before migration 033 are, so they can name each message by its subject.
import { db, newId, nowIso, type Db } from "@/db/index";
import { renderOutboxRow } from "@/lib/mail/deliver-outbox";

/** A queued row with what it will say when sent: subject, text_body and html_body rendered from its template and data. */
export function rendered<T extends { template: string; data: string | null; subject?: string | null; text_body?: string | null; html_body?: string | null }>(
  row: T,
): T & { subject: string; text_body: string; html_body: string | null } {
  const mail = renderOutboxRow({ template: row.template, data: row.data, subject: row.subject ?? null, text_body: row.text_body ?? null, html_body: row.html_body ?? null });
  return { ...row, subject: mail.subject, text_body: mail.text, html_body: mail.html };
}

/** Rows of a query on email_outbox, each with what it will say when sent. */
export async function renderedRows<T extends { template: string; data: string | null }>(rows: Promise<T[]> | T[]) {
  return (await rows).map(rendered);
}

/** Queues a message already rendered (no template data), the way rows were queued before migration 033. */
export async function queueRendered(
  mail: { to: string; subject: string; text: string; html?: string | null; template?: string; dedupe_key?: string | null },
  q: Db = db(),
): Promise<void> {
  const now = nowIso();
  await q("email_outbox")
    .insert({
      id: newId(),
      to_address: mail.to,
      subject: mail.subject,
      text_body: mail.text,
      html_body: mail.html ?? null,
      data: null,
      template: mail.template ?? "test",
      dedupe_key: mail.dedupe_key ?? null,
      status: "pending",
      attempts: 0,
      next_attempt_at: now,
      created_at: now,
    })
    .onConflict("dedupe_key")
    .ignore();
}

import { db, newId, nowIso, type Db } from "./index";
import type { OutboxRow } from "./types";
import type { TemplateData, TemplateName } from "@/lib/mail/templates";

/**
 * A message to queue: the name of its template and the data that template renders from
 * (lib/mail/templates/index.ts). Nothing is rendered here: the deliverer renders the message
 * when it sends it, so a transaction that queues mail only writes a row.
 */
export type NewEmail = {
  [N in TemplateName]: {
    to: string;
    template: N;
    data: TemplateData<N>;
    /** Writing the same key twice keeps one message: reminders and retries cannot double up. */
    dedupe_key?: string | null;
    send_after?: string;
  };
}[TemplateName];

const outboxRow = (mail: NewEmail, now: string) => ({
  id: newId(),
  to_address: mail.to,
  template: mail.template,
  data: JSON.stringify(mail.data),
  dedupe_key: mail.dedupe_key ?? null,
  status: "pending",
  attempts: 0,
  next_attempt_at: mail.send_after ?? now,
  created_at: now,
});

export async function enqueueEmail(mail: NewEmail, q: Db = db()): Promise<void> {
  await q("email_outbox").insert(outboxRow(mail, nowIso())).onConflict("dedupe_key").ignore();
}

/** Many messages at once (an alert fan-out), in a few statements; each dedupe key still keeps one. */
export async function enqueueEmails(mails: NewEmail[], q: Db = db()): Promise<void> {
  const now = nowIso();
  for (let i = 0; i < mails.length; i += 200) {
    await q("email_outbox").insert(mails.slice(i, i + 200).map((m) => outboxRow(m, now))).onConflict("dedupe_key").ignore();
  }
}

/** Pending messages whose time has come and that no live claim holds, oldest first. */
export async function dueEmails(now: string, limit = 20, q: Db = db()): Promise<OutboxRow[]> {
  return q<OutboxRow>("email_outbox")
    .select("*")
    .where("status", "pending")
    .andWhere("next_attempt_at", "<=", now)
    .andWhere((w) => w.whereNull("claimed_until").orWhere("claimed_until", "<=", now))
    // Accepted by the SMTP server already: only its mark is missing, and it is never sent again.
    .whereNull("smtp_message_id")
    .orderBy("next_attempt_at")
    .limit(limit);
}

/**
 * Claims one due message for this worker until `until`: a single conditional UPDATE, so of
 * two workers that read the same row only one changes it, and only that one may send it.
 * A claim that has run out (its worker died mid-send) can be taken over.
 */
export async function claimEmail(id: string, now: string, until: string, workerId: string, q: Db = db()): Promise<boolean> {
  const changed = await q("email_outbox")
    .where({ id, status: "pending" })
    .whereNull("smtp_message_id")
    .andWhere("next_attempt_at", "<=", now)
    .andWhere((w) => w.whereNull("claimed_until").orWhere("claimed_until", "<=", now))
    .update({ claimed_until: until, claimed_by: workerId });
  return changed === 1;
}

/** What was rendered from a row's template and data, kept on the row once it is sent. */
export interface SentText {
  subject: string;
  text: string;
  html: string | null;
}

/**
 * Records that the SMTP server accepted the message, under the id it gave; the claim ends.
 * A message queued as template data keeps the text it was sent with (`sent`).
 */
export async function markSent(id: string, now: string, smtpMessageId: string, sent?: SentText, q: Db = db()): Promise<void> {
  await q("email_outbox")
    .where({ id, status: "pending" })
    .update({
      status: "sent",
      sent_at: now,
      smtp_message_id: smtpMessageId.slice(0, 300),
      last_error: null,
      claimed_until: null,
      claimed_by: null,
      waiting_for: null,
      ...(sent ? { subject: sent.subject.slice(0, 200), text_body: sent.text, html_body: sent.html } : {}),
    });
}

export async function markFailedAttempt(
  id: string,
  failure: { attempts: number; nextAt: string; error: string; giveUp: boolean; waitingFor: "smtp" | null },
  q: Db = db(),
) {
  await q("email_outbox")
    .where({ id })
    .update({
      attempts: failure.attempts,
      next_attempt_at: failure.nextAt,
      last_error: failure.error.slice(0, 500),
      status: failure.giveUp ? "failed" : "pending",
      claimed_until: null,
      claimed_by: null,
      waiting_for: failure.waitingFor,
    });
}

/**
 * The mail server is not answering: every message due now waits until `until` (or until the
 * server answers again, whichever is first) without spending one of its own tries.
 */
export async function holdForMailServer(now: string, until: string, q: Db = db()): Promise<number> {
  return q("email_outbox")
    .where("status", "pending")
    .andWhere("next_attempt_at", "<=", now)
    .andWhere((w) => w.whereNull("claimed_until").orWhere("claimed_until", "<=", now))
    .whereNull("smtp_message_id")
    .update({ next_attempt_at: until, waiting_for: "smtp" });
}

/** Whether any message is waiting for the mail server to come back. */
export async function anyWaitingForMailServer(q: Db = db()): Promise<boolean> {
  return !!(await q("email_outbox").first("id").where({ status: "pending", waiting_for: "smtp" }));
}

/** The mail server answers again: what waited for it is due now, whatever its backoff said. */
export async function wakeWaitingForMailServer(now: string, q: Db = db()): Promise<number> {
  return q("email_outbox").where({ status: "pending", waiting_for: "smtp" }).update({ next_attempt_at: now, waiting_for: null });
}

/** A stopping worker lets go of the claims it holds, except on messages it is still sending. */
export async function releaseClaims(workerId: string, keep: string[] = [], q: Db = db()): Promise<number> {
  return q("email_outbox")
    .where({ claimed_by: workerId, status: "pending" })
    .whereNull("smtp_message_id")
    .whereNotIn("id", keep)
    .update({ claimed_until: null, claimed_by: null });
}

/** Figures for readiness: what waits to go out and how long the oldest has waited. */
export async function outboxFigures(now: string, q: Db = db()): Promise<{ pending: number; due: number; failed: number; oldest_due_at: string | null }> {
  const [pending, due, failed] = await Promise.all([
    q("email_outbox").where({ status: "pending" }).count<{ n: number | string }[]>({ n: "*" }),
    q("email_outbox").where({ status: "pending" }).andWhere((w) => w.where("next_attempt_at", "<=", now).orWhere("attempts", ">", 0).orWhereNotNull("waiting_for")).min<{ at: string | null }[]>({ at: "created_at" }).count({ n: "*" }),
    q("email_outbox").where({ status: "failed" }).count<{ n: number | string }[]>({ n: "*" }),
  ]);
  const row = due[0] as unknown as { at: string | null; n: number | string };
  return { pending: Number(pending[0].n), due: Number(row.n), failed: Number(failed[0].n), oldest_due_at: row.at ? new Date(row.at).toISOString() : null };
}

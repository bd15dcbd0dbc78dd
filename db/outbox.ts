import { db, newId, nowIso, type Db } from "./index";
import type { OutboxRow } from "./types";

export interface NewEmail {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  template: string;
  /** Writing the same key twice keeps one message: reminders and retries cannot double up. */
  dedupe_key?: string | null;
  send_after?: string;
}

export async function enqueueEmail(mail: NewEmail, q: Db = db()): Promise<void> {
  const now = nowIso();
  await q("email_outbox")
    .insert({
      id: newId(),
      to_address: mail.to,
      subject: mail.subject,
      text_body: mail.text,
      html_body: mail.html ?? null,
      template: mail.template,
      dedupe_key: mail.dedupe_key ?? null,
      status: "pending",
      attempts: 0,
      next_attempt_at: mail.send_after ?? now,
      created_at: now,
    })
    .onConflict("dedupe_key")
    .ignore();
}

export async function dueEmails(now: string, limit = 20, q: Db = db()): Promise<OutboxRow[]> {
  return q<OutboxRow>("email_outbox")
    .select("*")
    .where("status", "pending")
    .andWhere("next_attempt_at", "<=", now)
    .andWhere((w) => w.whereNull("claimed_until").orWhere("claimed_until", "<=", now))
    .orderBy("next_attempt_at")
    .limit(limit);
}

/**
 * Claims one due message for this worker until `until`: a single conditional UPDATE, so of
 * two workers that read the same row only one changes it, and only that one may send it.
 * A claim that has run out (its worker died mid-send) can be taken over.
 */
export async function claimEmail(id: string, now: string, until: string, q: Db = db()): Promise<boolean> {
  const changed = await q("email_outbox")
    .where({ id, status: "pending" })
    .andWhere("next_attempt_at", "<=", now)
    .andWhere((w) => w.whereNull("claimed_until").orWhere("claimed_until", "<=", now))
    .update({ claimed_until: until });
  return changed === 1;
}

export async function markSent(id: string, now: string, q: Db = db()): Promise<void> {
  await q("email_outbox").where({ id, status: "pending" }).update({ status: "sent", sent_at: now, last_error: null, claimed_until: null });
}

export async function markFailedAttempt(id: string, attempts: number, nextAt: string, error: string, giveUp: boolean, q: Db = db()) {
  await q("email_outbox")
    .where({ id })
    .update({ attempts, next_attempt_at: nextAt, last_error: error.slice(0, 500), status: giveUp ? "failed" : "pending", claimed_until: null });
}

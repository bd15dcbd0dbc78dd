import {
  anyWaitingForMailServer,
  claimEmail,
  dueEmails,
  holdForMailServer,
  markFailedAttempt,
  markSent,
  wakeWaitingForMailServer,
  type SentText,
} from "@/db/outbox";
import type { OutboxRow } from "@/db/types";
import { resolveContext, type Context } from "@/lib/context";
import { systemClock } from "@/lib/time/clock";
import { backoffDelayMs, nextCooldownMs, type Backoff } from "@/lib/time/backoff";
import { renderTemplate } from "./templates";
import { mailFailure, probeMail, sendMail } from "./transport";

// Backoff for a message the SMTP server would not take: 30 s, 1, 2, 4 … minutes, capped
// at an hour, for two days from when it was written, so an outage delays mail but does not
// lose it. (Counted in time, not tries: a mail server that answers the readiness question but
// fails every send can make tries come faster than the backoff.)
const MAIL_BACKOFF: Backoff = { baseMs: 30_000, maxMs: 60 * 60_000 };
export const GIVE_UP_AFTER_MS = 48 * 3_600_000;
// The mail server answering a question wakes everything that waited for it. If a send then
// fails all the same, the next such wake waits 30 s, then 1 min, 2 … up to an hour, so a
// server that answers but will not take mail is not tried every few seconds.
const WAKE_COOLDOWN: Backoff = { baseMs: 30_000, maxMs: 60 * 60_000 };
// How long a worker's claim on a message lasts. It only runs out if that worker died between
// claiming and recording the outcome (a worker that stops on purpose lets go of its claims):
// longer than one send can take with the transport's timeouts, short enough that a message
// a dead worker held goes out a couple of minutes later.
export const CLAIM_MS = 2 * 60_000;

export function retryDelayMs(attempts: number): number {
  return backoffDelayMs(attempts, MAIL_BACKOFF);
}

/** The job's context: the database, the clock, the signal set when the worker is stopping (no
 * new message is claimed then), and the worker's name, put on its claims so it can release them
 * at shutdown. */
export type DeliverContext = Context & { workerId?: string };

// Messages the SMTP server accepted whose "sent" mark could not be written (the database
// was busy or read-only for a moment). They are marked at the start of the next run, and
// never handed to SMTP again: the mark is retried, not the send.
const unmarked = new Map<string, { messageId: string; acceptedAt: string; sent?: SentText }>();
let lastWake = 0;
let wakeCooldownMs = 0;
// The message being handed to the SMTP server right now, if any.
let sending: string | null = null;

/**
 * Messages this process has handed to SMTP and not yet recorded as sent: a stopping worker
 * keeps their claims (its own mark, or the claim running out, settles them) rather than let
 * another worker send them a second time.
 */
export function messagesInFlight(): string[] {
  return [...unmarked.keys(), ...(sending ? [sending] : [])];
}

/** Writes the marks still owed; returns how many are still owed afterwards. */
export async function markAccepted(ctx: Pick<DeliverContext, "db"> = {}): Promise<number> {
  const { db: q } = resolveContext(ctx);
  for (const [id, { messageId, acceptedAt, sent }] of unmarked) {
    try {
      await markSent(id, acceptedAt, messageId, sent, q);
      unmarked.delete(id);
    } catch (err) {
      console.error(`[outbox] message ${id} was accepted by the mail server; marking it sent failed again:`, (err as Error).message);
      break; // the database is still not taking writes; the next run tries again
    }
  }
  return unmarked.size;
}

/**
 * The message a row holds: rendered now from its template and data, or, for a row queued
 * before messages were queued as data, the text it was queued with. Throws when the row
 * cannot be rendered (an unknown template, data that does not fit it).
 */
export function renderOutboxRow(row: Pick<OutboxRow, "template" | "data" | "subject" | "text_body" | "html_body">): SentText {
  if (row.data == null) {
    if (row.subject == null || row.text_body == null) throw new Error("the message has neither data nor text");
    return { subject: row.subject, text: row.text_body, html: row.html_body };
  }
  let data: unknown;
  try {
    data = JSON.parse(row.data);
  } catch {
    throw new Error("the message's data is not JSON");
  }
  return renderTemplate(row.template, data);
}

/**
 * Sends every due message once; returns how many went out. Each message is claimed first, so
 * two workers running at once never both send it: the one whose claim failed skips it.
 * When the mail server cannot be reached (or never answers), the rest of the batch is not
 * tried one slow timeout after another: everything due waits for the server, and the first
 * run that finds it answering again sends it all, whatever each message's backoff said.
 */
export async function deliverOutbox(ctx: DeliverContext = {}): Promise<{ sent: number; failed: number }> {
  const { db: q, clock, signal } = resolveContext(ctx);
  const workerId = ctx.workerId ?? `process:${process.pid}`;
  let sent = 0;
  let failed = 0;
  if ((await markAccepted({ db: q })) > 0) return { sent, failed };
  const start = clock();
  let woke = false;
  if (await anyWaitingForMailServer(q)) {
    // A throttle on probing a mail server that was down runs on the wall clock, not the job's.
    if (systemClock().getTime() - lastWake < wakeCooldownMs || !(await probeMail()).ok) return { sent, failed };
    lastWake = systemClock().getTime();
    woke = true;
    await wakeWaitingForMailServer(start.toISOString(), q);
  }
  for (const mail of await dueEmails(start.toISOString(), undefined, q)) {
    if (signal?.aborted) break;
    const at = clock();
    if (!(await claimEmail(mail.id, at.toISOString(), new Date(at.getTime() + CLAIM_MS).toISOString(), workerId, q))) continue; // another worker has it
    let rendered: SentText;
    try {
      rendered = renderOutboxRow(mail);
    } catch (err) {
      // Sending again would render the same way: the message fails for good, and says why.
      failed++;
      await markFailedAttempt(mail.id, { attempts: mail.attempts + 1, nextAt: at.toISOString(), error: `rendering failed: ${(err as Error).message}`, giveUp: true, waitingFor: null }, q);
      console.error(`[outbox] message ${mail.id} (${mail.template}) could not be rendered:`, (err as Error).message);
      continue;
    }
    let messageId: string;
    sending = mail.id;
    try {
      messageId = await sendMail({ to: mail.to_address, subject: rendered.subject, text: rendered.text, html: rendered.html });
    } catch (err) {
      sending = null;
      failed++;
      const attempts = mail.attempts + 1;
      const { service, permanent } = mailFailure(err);
      const nextAt = new Date(at.getTime() + retryDelayMs(attempts)).toISOString();
      const expired = at.getTime() - new Date(mail.created_at).getTime() >= GIVE_UP_AFTER_MS;
      await markFailedAttempt(mail.id, { attempts, nextAt, error: (err as Error).message, giveUp: permanent || expired, waitingFor: service ? "smtp" : null }, q);
      if (service) {
        if (woke) wakeCooldownMs = nextCooldownMs(wakeCooldownMs, WAKE_COOLDOWN);
        probeMail.reset();
        await holdForMailServer(at.toISOString(), nextAt, q);
        break;
      }
      continue;
    }
    sent++;
    wakeCooldownMs = 0;
    unmarked.set(mail.id, { messageId, acceptedAt: clock().toISOString(), sent: mail.data == null ? undefined : rendered });
    sending = null;
    // A message went through: anything still waiting for the server is due now.
    if (sent === 1 && (await anyWaitingForMailServer(q))) await wakeWaitingForMailServer(clock().toISOString(), q);
    if ((await markAccepted({ db: q })) > 0) break; // sent, but the database will not record it: stop here
  }
  return { sent, failed };
}

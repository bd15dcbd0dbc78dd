import { claimEmail, dueEmails, markFailedAttempt, markSent } from "@/db/outbox";
import { sendMail } from "./transport";

// Backoff for a message the SMTP server would not take: 30 s, 1, 2, 4 … minutes, capped
// at an hour, for up to two days of tries, so an outage delays mail but does not lose it.
const BASE_DELAY_MS = 30_000;
const MAX_DELAY_MS = 60 * 60_000;
export const MAX_ATTEMPTS = 60;
// How long a worker's claim on a message lasts. It only runs out if that worker died between
// claiming and recording the outcome; it is longer than nodemailer waits on a silent
// connection (10 minutes) before giving up, so a slow send is not taken over and sent twice.
export const CLAIM_MS = 15 * 60_000;

export function retryDelayMs(attempts: number): number {
  return Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** Math.max(0, attempts - 1));
}

/**
 * Sends every due message once; returns how many went out. Each message is claimed first, so
 * two workers running at once never both send it: the one whose claim failed skips it.
 */
export async function deliverOutbox(clock: () => Date = () => new Date()): Promise<{ sent: number; failed: number }> {
  const now = clock();
  const due = await dueEmails(now.toISOString());
  let sent = 0;
  let failed = 0;
  for (const mail of due) {
    const at = clock();
    if (!(await claimEmail(mail.id, at.toISOString(), new Date(at.getTime() + CLAIM_MS).toISOString()))) continue; // another worker has it
    try {
      await sendMail({ to: mail.to_address, subject: mail.subject, text: mail.text_body, html: mail.html_body });
      await markSent(mail.id, clock().toISOString());
      sent++;
    } catch (err) {
      const attempts = mail.attempts + 1;
      const next = new Date(now.getTime() + retryDelayMs(attempts)).toISOString();
      await markFailedAttempt(mail.id, attempts, next, (err as Error).message, attempts >= MAX_ATTEMPTS);
      failed++;
    }
  }
  return { sent, failed };
}

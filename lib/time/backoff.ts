// How long to wait before trying again something that failed (an e-mail the SMTP server would
// not take, a Stripe call): the base wait, doubled after each further failure, never more than
// the cap. The policies differ only in their numbers, which their owners keep.

export interface Backoff {
  baseMs: number;
  maxMs: number;
}

/** The wait after the `attempts`-th failure in a row: base, 2 × base, 4 × base … capped at maxMs. */
export function backoffDelayMs(attempts: number, b: Backoff): number {
  return Math.min(b.maxMs, b.baseMs * 2 ** Math.max(0, attempts - 1));
}

/** The cool-down after one more failure, from the current one (0 before any): base first, then doubled, capped. */
export function nextCooldownMs(currentMs: number, b: Backoff): number {
  return Math.min(b.maxMs, Math.max(b.baseMs, 2 * currentMs));
}

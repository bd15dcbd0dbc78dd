import { backoffDelayMs, type Backoff } from "@/lib/time/backoff";

// How long an owed Stripe call waits after failing: 15 s, 30 s, 1 min … capped at an hour.
// Stripe answering again cuts the wait short (settlePayments wakes what waited for it).
export const STRIPE_BACKOFF: Backoff = { baseMs: 15_000, maxMs: 60 * 60_000 };

export function actionRetryDelayMs(attempts: number): number {
  return backoffDelayMs(attempts, STRIPE_BACKOFF);
}

// How long an owed Stripe call waits after failing: 15 s, 30 s, 1 min … capped at an hour.
// Stripe answering again cuts the wait short (settlePayments wakes what waited for it).
const BASE_DELAY_MS = 15_000;
const MAX_DELAY_MS = 60 * 60_000;

export function actionRetryDelayMs(attempts: number): number {
  return Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** Math.max(0, attempts - 1));
}

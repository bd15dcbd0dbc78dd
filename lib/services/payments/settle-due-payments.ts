import "server-only";
import { anyWaitingForStripe, dueActions, wakeWaitingForStripe } from "@/db/payments";
import { STRIPE_BACKOFF } from "@/lib/payments/retry";
import { probeStripe } from "@/lib/payments/stripe";
import { nextCooldownMs } from "@/lib/time/backoff";
import { attemptPaymentAction } from "@/lib/services/payments/settle-payment";
import { waitForStripe } from "@/lib/services/payments/steps/wait-for-stripe";
import { resolveContext, type Context } from "@/lib/context";
import { systemClock } from "@/lib/time/clock";

// When Stripe answering a question last woke the calls waiting for it, and how long the next
// such wake must wait (0 until a woken call fails again).
const wakes = { last: 0, cooldownMs: 0 };

/**
 * The worker's job: every owed call that is due. Calls that failed because Stripe could not
 * be reached wait for it rather than for their backoff: as soon as Stripe answers (asked at
 * most every few seconds, or shown by any call going through) they are all due at once.
 * The first call that finds Stripe unreachable ends the batch; the rest wait for it too.
 */
export async function settlePayments(ctx: Context = {}): Promise<{ done: number; failed: number }> {
  const { db: q, clock, signal } = resolveContext(ctx);
  let done = 0;
  let failed = 0;
  let woke = false;
  // A throttle on probing a Stripe that was down runs on the wall clock, not the job's.
  if ((await anyWaitingForStripe(q)) && systemClock().getTime() - wakes.last >= wakes.cooldownMs && (await probeStripe()).ok) {
    wakes.last = systemClock().getTime();
    woke = true;
    await wakeWaitingForStripe(clock().toISOString(), q);
  }
  let unreachable = false;
  for (const row of await dueActions(clock().toISOString(), 20, q)) {
    if (signal?.aborted) break;
    if (unreachable) {
      await waitForStripe(row.id, { db: q, clock });
      continue;
    }
    const outcome = await attemptPaymentAction(row.id, { db: q, clock });
    if (outcome === "elsewhere") continue; // another worker took it between the read and the claim
    if (outcome === "done") {
      done++;
      wakes.cooldownMs = 0;
      if (done === 1 && (await anyWaitingForStripe(q))) await wakeWaitingForStripe(clock().toISOString(), q);
    } else {
      failed++;
      unreachable = outcome === "unreachable";
      // Stripe answered the question but not the call: the next such wake waits longer.
      if (unreachable && woke) wakes.cooldownMs = nextCooldownMs(wakes.cooldownMs, STRIPE_BACKOFF);
    }
  }
  return { done, failed };
}

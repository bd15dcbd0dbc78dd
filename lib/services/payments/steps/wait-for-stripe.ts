import "server-only";
import { actionRetryDelayMs } from "@/lib/payments/retry";
import { resolveContext, type Context } from "@/lib/context";

/** Leaves a payment's owed call to the worker, due as soon as Stripe answers again. */
export async function waitForStripe(id: string, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  await q("payments")
    .where({ id })
    .whereNotNull("pending_action")
    .update({ waiting_for: "stripe", next_action_at: new Date(clock().getTime() + actionRetryDelayMs(1)).toISOString() });
}

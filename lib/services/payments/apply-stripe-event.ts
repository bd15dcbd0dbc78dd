import "server-only";
import type Stripe from "stripe";
import { isUniqueViolation } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { findPayment, paymentByStripeRef, updatePayment } from "@/db/payments";
import { lockOwner } from "@/lib/payments/owner";
import { movesForward, str, targetFor } from "@/lib/payments/status";
import { ownerHooks } from "@/lib/services/payments/owners";
import { resolveContext, type Context } from "@/lib/context";

// Applies one event of Stripe's record, exactly once: the event id goes into webhook_events
// in the same transaction as its effects, so a repeat finds the id and changes nothing, and a
// failure rolls both back. A payment's status only moves forward (lib/payments/status.ts), and
// what it pays for follows it through the owners map (lib/services/payments/owners.ts).
// Only events built from Stripe's own record reach here: syncPayment
// (lib/services/payments/settle-payment.ts) reads the checkout back through the SDK and feeds
// what it shows through here as the events it implies, whether a webhook asked it to
// (receive-stripe-event.ts), a Stripe call Duffbank made, or the worker looking for lost
// webhooks. A webhook's own body is never applied, so a correctly signed but false event
// changes nothing. The Stripe calls the change leaves owing are returned, for the caller
// (syncPayment) to make after the commit.

class DuplicateEvent extends Error {
  constructor() {
    super("this event was applied before");
  }
}

export async function applyStripeEvent(event: Stripe.Event, ctx: Context = {}): Promise<{ outcome: "applied" | "duplicate"; owed: string[] }> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const at = now.toISOString();
  let owed: string[] = [];
  try {
    owed = await writeTransaction(q, async (trx) => {
      // First statement: the write that makes a second delivery of this event a no-op. Only
      // a conflict on this insert means "seen before"; any other failure below rolls back
      // and reaches Stripe as a 500, so the event is delivered again rather than dropped.
      try {
        await trx("webhook_events").insert({ id: event.id, provider: "stripe", type: event.type, created_at: new Date(event.created * 1000).toISOString(), processed_at: at });
      } catch (err) {
        if (isUniqueViolation(err)) throw new DuplicateEvent();
        throw err;
      }
      const obj = event.data.object as unknown as Record<string, any>;
      const isSession = event.type.startsWith("checkout.session.");
      const isIntent = event.type.startsWith("payment_intent.");
      const found = await paymentByStripeRef(
        {
          payment_id: obj.metadata?.payment_id,
          session_id: isSession ? obj.id : null,
          intent_id: isIntent ? obj.id : str(obj.payment_intent),
        },
        trx,
      );
      if (!found || found.kind === "refund") return [];
      // Two events about one payment can arrive at once (a completed checkout and its intent's
      // update). Lock what it pays for, then the payment, and decide on the row as it is now:
      // the second waits for the first and then sees its status, so it cannot undo it.
      await lockOwner(trx, found);
      const row = (await findPayment(found.id, trx, { lock: true }))!;
      const target = targetFor(event, row);
      if (!target) return [];
      const forward = movesForward(row.status, target.status);
      await updatePayment(row.id, { ...target.patch, ...(forward ? { status: target.status } : {}), updated_at: at }, trx);
      if (!forward) return [];
      return ownerHooks(row).follows(trx, row, target.status!, now);
    });
  } catch (err) {
    if (err instanceof DuplicateEvent) return { outcome: "duplicate", owed: [] };
    throw err;
  }
  return { outcome: "applied", owed };
}

import "server-only";
import { claimBatch } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { reservationContext } from "@/db/reservation-context";
import { heldDueToExpire } from "@/db/reservations";
import type { ReservationRow } from "@/db/types";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { runPaymentActions } from "@/lib/services/payments/settle-payment";
import { StaleState, closeReservation } from "@/lib/services/reservations/steps/reservation-steps";
import { resolveContext, type Context } from "@/lib/context";

// The worker's hold-expiry job (the reminders are send-reservation-reminders.ts). Everything
// it needs is in the database (hold_expires_at), so a restarted worker picks up exactly where
// it was, and the clock comes in the context so tests can move time.

/**
 * Ends every hold whose time is up: the quantity returns, and any money goes back. Each hold
 * is its own transaction: one that cannot be expired is logged and left for the next run,
 * and the rest of the batch still expires.
 */
export async function expireHolds(ctx: Context = {}): Promise<{ expired: number }> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  let expired = 0;
  for (const due of await heldDueToExpire(now.toISOString(), 100, q)) {
    let owed: string[];
    try {
      owed = await writeTransaction(q, async (trx) => {
        // A second worker on the same batch skips the row this one holds (PostgreSQL), and
        // finds it no longer held once this one commits.
        const r = await claimBatch(trx<ReservationRow>("reservations").first("*").where({ id: due.id, status: "held" }).andWhere("hold_expires_at", "<=", now.toISOString()));
        if (!r) throw new StaleState();
        const waitingOnSupplier = r.payment_state !== "awaiting";
        const ids = await closeReservation(trx, r, "expired", { actorId: null, note: waitingOnSupplier ? "The supplier did not answer in time" : "Not paid in time", now, money: "return" });
        const ctx = (await reservationContext(r.id, trx))!;
        await mailReservation(trx, "expired", ctx, waitingOnSupplier ? ["gardener", "supplier"] : ["gardener"], { money: "returned" });
        return ids;
      });
    } catch (err) {
      // Confirmed or cancelled a moment ago: nothing to expire, and nothing wrong.
      if (!(err instanceof StaleState)) console.error(`[expire-holds] skipped reservation ${due.id}:`, err instanceof Error ? err.message : err);
      continue;
    }
    expired++;
    await runOwedPayments("expire-holds", due.id, owed, { db: q, clock });
  }
  return { expired };
}

/**
 * Runs the Stripe calls an expiry owes, right away. They are written down in the same
 * transaction as the expiry, so if this fails the settle-payments job makes them later;
 * the error is logged and the batch goes on.
 */
async function runOwedPayments(job: string, id: string, owed: string[], ctx: Context): Promise<void> {
  try {
    await runPaymentActions(owed, ctx);
  } catch (err) {
    console.error(`[${job}] payments for ${id} left to settle-payments:`, err instanceof Error ? err.message : err);
  }
}

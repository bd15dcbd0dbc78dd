import "server-only";
import { nowIso } from "@/db/index";
import type { PaymentRow } from "@/db/types";
import { RECHECK_MINUTES, RECOVER_AFTER_MINUTES } from "@/lib/payments/reconcile";
import { syncPayment } from "@/lib/services/payments/settle-payment";
import { resolveContext, type Context } from "@/lib/context";

// Repairs what a lost webhook left behind. If every delivery of an event failed (the app was
// down longer than Stripe retries, or the endpoint was misconfigured), a row would otherwise
// stay "open" while the gardener has paid.

/**
 * The worker's safety net for lost webhooks: asks Stripe about every checkout that is still
 * open a few minutes after it was made, at most every RECHECK_MINUTES each, and applies
 * what it finds (syncPayment). A payment whose webhook never came is found before its hold runs out.
 */
export async function recoverOpenPayments(opts: { limit?: number } = {}, ctx: Context = {}): Promise<{ checked: number; changed: number }> {
  const { db: q, clock } = resolveContext(ctx);
  const limit = opts.limit ?? 20;
  const now = clock();
  const rows = await q<PaymentRow>("payments")
    .select("id", "status")
    .where({ status: "open" })
    .whereIn("kind", ["payment", "deposit"])
    .whereNotNull("provider_ref")
    .whereNull("pending_action")
    .andWhere("created_at", "<=", new Date(now.getTime() - RECOVER_AFTER_MINUTES * 60_000).toISOString())
    .andWhere("updated_at", "<=", new Date(now.getTime() - RECHECK_MINUTES * 60_000).toISOString())
    .orderBy("updated_at")
    .limit(limit);
  let changed = 0;
  for (const row of rows) {
    try {
      const status = await syncPayment(row.id, { db: q, clock });
      if (status !== row.status) changed++;
      // Still open: note the look, so the next one waits RECHECK_MINUTES.
      else await q("payments").where({ id: row.id, status: "open" }).update({ updated_at: nowIso(clock) });
    } catch (err) {
      console.error(`[payments] could not ask Stripe about payment ${row.id}:`, (err as Error).message);
    }
  }
  return { checked: rows.length, changed };
}

import "server-only";
import { lockRows } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { findShipping, saveShipping , waitingPostedOrderIds } from "@/db/grower-shipping";
import { recordAudit } from "@/db/audit";
import type { ShippingInput } from "@/lib/validation/grower";
import { shippingView, type ShippingView } from "@/lib/growers/view";
import type { Db } from "@/db/index";
import { reservationContexts } from "@/db/reservation-context";
import { mailCultureOrder } from "@/lib/mail/culture-order-mail";
import { resolveContext, type Context } from "@/lib/context";

export async function saveGrowerShipping(userId: string, input: ShippingInput, ctx: Context = {}): Promise<ShippingView> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  return writeTransaction(q, async (trx) => {
    // One save at a time per grower (the row may not exist yet, so the person's own row is
    // held): two saves at once cannot both see "not paused" and both mail the pause.
    await lockRows(trx, "users", { id: userId });
    const before = await findShipping(userId, trx);
    const row = {
      user_id: userId,
      ship_weekdays: [...input.ship_weekdays].sort().join(","),
      paused: input.paused,
      pause_reason: input.paused ? input.pause_reason : null,
      pause_note: input.paused ? input.pause_note : null,
    };
    await saveShipping(row, trx);
    await recordAudit({ actor_id: userId, action: "grower.shipping", subject_type: "user", subject_id: userId, before: before ?? null, after: row }, trx);
    await tellWaitingBuyers(userId, !!before?.paused, input.paused, trx, now);
    return shippingView(row);
  });
}

/**
 * Buyers whose parcel waits are told when posting stops and when it starts again, in the
 * transaction that changes it. Only a change tells anyone: saving the same pause again (a
 * new note, another day ticked) mails nobody. The dedupe key names the pause or the resume
 * by the moment it was saved, so one pause writes at most one e-mail per order.
 */
async function tellWaitingBuyers(userId: string, wasPaused: boolean, paused: boolean, trx: Db, now: Date): Promise<void> {
  if (wasPaused === paused) return;
  const ids = await waitingPostedOrderIds(userId, trx);
  if (ids.length === 0) return;
  const saved = await findShipping(userId, trx);
  for (const r of await reservationContexts(ids, trx)) {
    await mailCultureOrder(trx, paused ? "posting_paused" : "posting_resumed", r, ["gardener"], now, saved?.updated_at ?? now.toISOString());
  }
}

import "server-only";
import type { Knex } from "knex";
import { writeTransaction } from "@/db/write-transaction";
import { findBooking, releaseSlotPlace } from "@/db/giveaways";
import { enqueueEmail } from "@/db/outbox";
import type { GiveawayBookingRow } from "@/db/types";
import { holdMinutes } from "@/lib/reservations/policy";
import { householdOf, settleBookingDeposit } from "@/lib/services/giveaways/steps/giveaway-deposit";
import { runPaymentActions } from "@/lib/services/payments/settle-payment";
import { resolveContext, type Context } from "@/lib/context";

/**
 * The worker's job: bookings whose deposit was not put down in time lapse; the place returns
 * and the card page closes. Each booking is its own transaction: one that cannot be lapsed is
 * logged and left for the next run, and the rest of the batch still lapses.
 */
export async function expireGiveawayDepositHolds(ctx: Context = {}): Promise<{ expired: number }> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const at = now.toISOString();
  const due = await q<GiveawayBookingRow>("giveaway_bookings")
    .select("id")
    .where({ status: "booked", deposit_status: "awaiting" })
    .andWhere("hold_expires_at", "<=", at)
    .orderBy("hold_expires_at")
    .limit(100);
  let expired = 0;
  for (const { id } of due) {
    let owed: string[] | null;
    try {
      owed = await lapseBooking(q, id, now);
    } catch (err) {
      console.error(`[expire-giveaway-deposits] skipped booking ${id}:`, err instanceof Error ? err.message : err);
      continue;
    }
    if (owed === null) continue; // the deposit went through a moment ago: nothing to lapse
    expired++;
    try {
      await runPaymentActions(owed, { db: q, clock });
    } catch (err) {
      // Written down with the lapse, so the settle-payments job makes these calls later.
      console.error(`[expire-giveaway-deposits] payments for booking ${id} left to settle-payments:`, err instanceof Error ? err.message : err);
    }
  }
  return { expired };
}

/** Lapses one booking in its own transaction; null when it had moved on meanwhile. */
async function lapseBooking(q: Knex, id: string, now: Date): Promise<string[] | null> {
  const at = now.toISOString();
  return writeTransaction(q, async (trx) => {
    // Guarded: a deposit authorised a moment ago has moved the booking on, and it stays.
    const n = await trx("giveaway_bookings")
      .where({ id, status: "booked", deposit_status: "awaiting" })
      .andWhere("hold_expires_at", "<=", at)
      .update({ status: "cancelled", deposit_status: "unpaid", cancelled_at: at, hold_expires_at: null, updated_at: at });
    if (n === 0) return null;
    const b = (await findBooking(id, trx))!;
    await releaseSlotPlace(b.slot_id, trx);
    const ids = await settleBookingDeposit(trx, id, "return", now);
    const to = await householdOf(b, trx);
    if (to) {
      const data = { ...to.parts, holdMinutes: holdMinutes() };
      await enqueueEmail({ to: to.email, template: "giveaway_booking_lapsed", data, dedupe_key: `giveaway-booking-lapsed:${id}` }, trx);
    }
    return ids;
  });
}


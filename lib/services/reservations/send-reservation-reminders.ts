import "server-only";
import type { Knex } from "knex";
import { reservationContext } from "@/db/reservation-context";
import type { ReservationRow } from "@/db/types";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { EXPIRY_WARNING_MINUTES, PICKUP_REMINDER_HOURS } from "@/lib/reservations/policy";
import { resolveContext, type Context } from "@/lib/context";
import { sendNotices } from "@/lib/services/reservations/steps/send-notices";

/**
 * "Your hold ends soon" (the gardener, before a checkout's hold ends), "waiting for your
 * answer" (the supplier, half-way through a request's answer window) and "pickup tomorrow",
 * each sent once (marker column + dedupe key).
 */
export async function sendReservationReminders(ctx: Context = {}): Promise<{ warned: number; reminded: number }> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const expiring = (to: "gardener" | "supplier") => async (trx: Knex.Transaction, r: ReservationRow) => {
    await mailReservation(trx, "expiring", (await reservationContext(r.id, trx))!, [to], {}, r.hold_expires_at ?? "");
  };
  const warned =
    (await sendNotices(q, { status: "held", time: "hold_expires_at", marker: "expiry_warned_at", aheadMs: EXPIRY_WARNING_MINUTES * 60_000 }, now, expiring("gardener"))) +
    // Reminders whose half-way point has passed are still sent (a worker that was down catches up).
    (await sendNotices(q, { status: "held", time: "answer_remind_at", marker: "expiry_warned_at", aheadMs: 0, since: "any" }, now, expiring("supplier")));
  const remind = async (trx: Knex.Transaction, r: ReservationRow) => {
    const ctx = (await reservationContext(r.id, trx))!;
    await mailReservation(trx, "reminder", ctx, ctx.gardener.reminders_opt_out ? ["supplier"] : ["gardener", "supplier"]);
  };
  // A chosen window is reminded the day before it starts; "no fixed time" the day before the
  // last day to collect (dueForNotice only looks at pickup_by where no window start is set,
  // and never at a posted culture, which is not collected).
  const reminded =
    (await sendNotices(q, { status: "confirmed", time: "pickup_at", marker: "pickup_reminded_at", aheadMs: PICKUP_REMINDER_HOURS * 3_600_000 }, now, remind)) +
    (await sendNotices(q, { status: "confirmed", time: "pickup_by", marker: "pickup_reminded_at", aheadMs: PICKUP_REMINDER_HOURS * 3_600_000 }, now, remind));
  return { warned, reminded };
}

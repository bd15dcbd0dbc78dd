import "server-only";
import type { Knex } from "knex";
import { writeTransaction } from "@/db/write-transaction";
import { db } from "@/db/index";
import { reservationContext } from "@/db/reservation-context";
import { confirmedDueForReminder, heldDueForWarning, heldDueToExpire } from "@/db/reservations";
import type { ReservationRow } from "@/db/types";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { runPaymentActions } from "@/lib/payments/actions";
import { EXPIRY_WARNING_MINUTES, PICKUP_REMINDER_HOURS } from "@/lib/reservations/policy";
import { StaleState, closeReservation } from "./reservation-steps";

// The worker's reservation jobs. Everything they need is in the database (hold_expires_at,
// pickup_at and the *_at markers), so a restarted worker picks up exactly where it was,
// and the clock is a parameter so tests can move time.

type Clock = () => Date;

/** Ends every hold whose time is up: the quantity returns, and any money goes back. */
export async function expireHolds(clock: Clock = () => new Date(), q: Knex = db()): Promise<{ expired: number }> {
  const now = clock();
  let expired = 0;
  for (const due of await heldDueToExpire(now.toISOString(), 100, q)) {
    let owed: string[] = [];
    try {
      owed = await writeTransaction(q, async (trx) => {
        const r = await trx<ReservationRow>("reservations").first("*").where({ id: due.id, status: "held" }).andWhere("hold_expires_at", "<=", now.toISOString());
        if (!r) throw new StaleState();
        const waitingOnSupplier = r.payment_state !== "awaiting";
        const ids = await closeReservation(trx, r, "expired", { actorId: null, note: waitingOnSupplier ? "The supplier did not answer in time" : "Not paid in time", now, money: "return" });
        const ctx = (await reservationContext(r.id, trx))!;
        await mailReservation(trx, "expired", ctx, waitingOnSupplier ? ["gardener", "supplier"] : ["gardener"], { money: "returned" });
        return ids;
      });
      expired++;
    } catch (err) {
      if (!(err instanceof StaleState)) throw err; // confirmed or cancelled a moment ago: nothing to expire
    }
    await runPaymentActions(owed, clock, q);
  }
  return { expired };
}

/** "Your hold ends soon" and "pickup tomorrow", each sent once (marker column + dedupe key). */
export async function sendReservationReminders(clock: Clock = () => new Date(), q: Knex = db()): Promise<{ warned: number; reminded: number }> {
  const now = clock();
  const at = now.toISOString();
  let warned = 0;
  let reminded = 0;
  const warnBefore = new Date(now.getTime() + EXPIRY_WARNING_MINUTES * 60_000).toISOString();
  for (const r of await heldDueForWarning(at, warnBefore, 100, q)) {
    await writeTransaction(q, async (trx) => {
      const n = await trx("reservations").where({ id: r.id, status: "held" }).whereNull("expiry_warned_at").update({ expiry_warned_at: at });
      if (n !== 1) return;
      const ctx = (await reservationContext(r.id, trx))!;
      // Whoever has the next move hears about it: the gardener to pay, or the supplier to answer.
      await mailReservation(trx, "expiring", ctx, [r.payment_state === "awaiting" ? "gardener" : "supplier"], {}, r.hold_expires_at ?? "");
      warned++;
    });
  }
  const remindBefore = new Date(now.getTime() + PICKUP_REMINDER_HOURS * 3_600_000).toISOString();
  for (const r of await confirmedDueForReminder(at, remindBefore, 100, q)) {
    await writeTransaction(q, async (trx) => {
      const n = await trx("reservations").where({ id: r.id, status: "confirmed" }).whereNull("pickup_reminded_at").update({ pickup_reminded_at: at });
      if (n !== 1) return;
      const ctx = (await reservationContext(r.id, trx))!;
      await mailReservation(trx, "reminder", ctx, ctx.gardener.reminders_opt_out ? ["supplier"] : ["gardener", "supplier"]);
      reminded++;
    });
  }
  return { warned, reminded };
}

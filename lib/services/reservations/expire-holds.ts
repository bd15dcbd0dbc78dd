import "server-only";
import type { Knex } from "knex";
import { claimBatch } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { db } from "@/db/index";
import { reservationContext } from "@/db/reservation-context";
import { dueForNotice, heldDueToExpire } from "@/db/reservations";
import type { ReservationRow } from "@/db/types";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { runPaymentActions } from "@/lib/services/payments/settle-payment";
import { EXPIRY_WARNING_MINUTES, PICKUP_REMINDER_HOURS } from "@/lib/reservations/policy";
import { StaleState, closeReservation } from "@/lib/services/reservations/reservation-steps";

// The worker's reservation jobs. Everything they need is in the database (hold_expires_at,
// pickup_at and the *_at markers), so a restarted worker picks up exactly where it was,
// and the clock is a parameter so tests can move time.

type Clock = () => Date;

/**
 * Ends every hold whose time is up: the quantity returns, and any money goes back. Each hold
 * is its own transaction: one that cannot be expired is logged and left for the next run,
 * and the rest of the batch still expires.
 */
export async function expireHolds(clock: Clock = () => new Date(), q: Knex = db()): Promise<{ expired: number }> {
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
    await runOwedPayments("expire-holds", due.id, owed, clock, q);
  }
  return { expired };
}

/**
 * Runs the Stripe calls an expiry owes, right away. They are written down in the same
 * transaction as the expiry, so if this fails the settle-payments job makes them later;
 * the error is logged and the batch goes on.
 */
async function runOwedPayments(job: string, id: string, owed: string[], clock: Clock, q: Knex): Promise<void> {
  try {
    await runPaymentActions(owed, clock, q);
  } catch (err) {
    console.error(`[${job}] payments for ${id} left to settle-payments:`, err instanceof Error ? err.message : err);
  }
}

type Notice = { status: "held" | "confirmed"; time: "hold_expires_at" | "answer_remind_at" | "pickup_at" | "pickup_by"; marker: "expiry_warned_at" | "pickup_reminded_at"; aheadMs: number; since?: "now" | "any" };

/** Sends one kind of notice to every reservation due for it, each once: the marker column is claimed first. */
async function sendNotices(q: Knex, n: Notice, now: Date, send: (trx: Knex.Transaction, r: ReservationRow) => Promise<void>): Promise<number> {
  const at = now.toISOString();
  let sent = 0;
  const after = n.since === "any" ? new Date(0).toISOString() : at;
  for (const r of await dueForNotice(n.status, n.time, n.marker, after, new Date(now.getTime() + n.aheadMs).toISOString(), 100, q)) {
    try {
      const claimed = await writeTransaction(q, async (trx) => {
        const won = await trx("reservations").where({ id: r.id, status: n.status }).whereNull(n.marker).update({ [n.marker]: at });
        if (won === 1) await send(trx, r);
        return won === 1;
      });
      if (claimed) sent++;
    } catch (err) {
      // Rolled back whole (marker too), so the next run tries it again; the others still go out.
      console.error(`[reservation-reminders] skipped reservation ${r.id}:`, err instanceof Error ? err.message : err);
    }
  }
  return sent;
}

/**
 * "Your hold ends soon" (the gardener, before a checkout's hold ends), "waiting for your
 * answer" (the supplier, half-way through a request's answer window) and "pickup tomorrow",
 * each sent once (marker column + dedupe key).
 */
export async function sendReservationReminders(clock: Clock = () => new Date(), q: Knex = db()): Promise<{ warned: number; reminded: number }> {
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

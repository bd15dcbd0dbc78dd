import "server-only";
import type { Knex } from "knex";
import { writeTransaction } from "@/db/write-transaction";
import { dueForNotice } from "@/db/reservations";
import type { ReservationRow } from "@/db/types";

// A step of the reminder job (send-reservation-reminders.ts): one kind of notice to every
// reservation due for it, each in its own transaction so one that fails does not hold up the rest.

export type Notice = { status: "held" | "confirmed"; time: "hold_expires_at" | "answer_remind_at" | "pickup_at" | "pickup_by"; marker: "expiry_warned_at" | "pickup_reminded_at"; aheadMs: number; since?: "now" | "any" };

/** Sends one kind of notice to every reservation due for it, each once: the marker column is claimed first. */
export async function sendNotices(q: Knex, n: Notice, now: Date, send: (trx: Knex.Transaction, r: ReservationRow) => Promise<void>): Promise<number> {
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


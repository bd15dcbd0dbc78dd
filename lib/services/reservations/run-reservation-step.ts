import "server-only";
import type { Knex } from "knex";
import { resolveContext, type Context } from "@/lib/context";
import { findReservation, sideOf } from "@/db/reservations";
import type { ReservationRow } from "@/db/types";
import { writeTransaction } from "@/db/write-transaction";
import { ApiError } from "@/lib/api/errors";
import { runPaymentActions } from "@/lib/services/payments/settle-payment";
import type { Side } from "@/lib/reservations/policy";
import { StaleState } from "@/lib/services/reservations/steps/reservation-steps";

export interface StepRun {
  reservationId: string;
  userId: string;
  /** What the person calls it, for the "changed meanwhile" message. */
  noun: "reservation" | "order";
}

/**
 * One person's step on a reservation, the frame every transition shares: 404 for anyone not
 * on it; then one write transaction, holding the reservation's row, in which `step` checks its rules (403 wrong side, 409
 * wrong state) and makes the change; a guarded update that lost a race is a 409; the Stripe
 * calls the change owes run after the commit, and the worker retries any that fail.
 */
export async function runReservationStep(
  run: StepRun,
  step: (trx: Knex.Transaction, r: ReservationRow, side: Side, now: Date) => Promise<string[]>,
  ctx: Context = {},
): Promise<{ side: Side }> {
  const { db: q, clock } = resolveContext(ctx);
  const now = clock();
  const side = await sideOf(run.reservationId, run.userId, q);
  if (!side) throw new ApiError("not_found", "That reservation was not found.");
  let paymentIds: string[] = [];
  try {
    paymentIds = await writeTransaction(q, async (trx) => step(trx, (await findReservation(run.reservationId, trx, { lock: true }))!, side, now));
  } catch (err) {
    if (err instanceof StaleState) throw new ApiError("invalid_state", `Someone changed this ${run.noun} a moment ago; reload to see it.`);
    throw err;
  }
  await runPaymentActions(paymentIds, { db: q, clock });
  return { side };
}

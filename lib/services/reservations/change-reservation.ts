import "server-only";
import type { Knex } from "knex";
import { reservationContext } from "@/db/reservation-context";
import type { ReservationRow } from "@/db/types";
import { ApiError } from "@/lib/api/errors";
import { mailReservation } from "@/lib/mail/reservation-mail";
import { pickupCodeMatches } from "@/lib/reservations/pickup-code";
import { blockedReason, cancellationIsTimely, type ReservationAction, type Side } from "@/lib/reservations/policy";
import { closeReservation, confirmReservation } from "@/lib/services/reservations/steps/reservation-steps";
import { runReservationStep } from "@/lib/services/reservations/run-reservation-step";
import { resolveContext, type Context } from "@/lib/context";

// One use-case for the five transitions a person can make (confirm, decline, cancel,
// collect, no-show): who may, from which state, and what each does. The rules themselves
// are in lib/reservations/policy.ts so pages show exactly the buttons that will work.

export interface ChangeInput {
  reservationId: string;
  userId: string;
  reason?: string | null;
  pickupCode?: string | null;
}

export async function changeReservation(action: ReservationAction, input: ChangeInput, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  return runReservationStep(
    { reservationId: input.reservationId, userId: input.userId, noun: "reservation" },
    async (trx, r, side, now) => {
      const blocked = blockedReason(r, action, side, now);
      if (blocked === "wrong_party") throw new ApiError("forbidden", side === "gardener" ? "Only the supplier can do that." : "Only the gardener can do that.");
      if (blocked) throw new ApiError("invalid_state", blocked);
      return apply(trx, action, r, side, input, now);
    },
    { db: q, clock },
  );
}

async function apply(trx: Knex.Transaction, action: ReservationAction, r: ReservationRow, side: Side, input: ChangeInput, now: Date): Promise<string[]> {
  const actorId = input.userId;
  const note = input.reason?.trim() || null;
  const ctxAfter = async () => (await reservationContext(r.id, trx))!;
  switch (action) {
    case "confirm":
      await confirmReservation(trx, r, actorId, now, null);
      return [];
    case "decline": {
      const ids = await closeReservation(trx, r, "declined", { actorId, note, now, money: "return" });
      await mailReservation(trx, "declined", await ctxAfter(), ["gardener"], { reason: note, money: "returned" });
      return ids;
    }
    case "cancel": {
      const timely = cancellationIsTimely(r, side, now);
      const ids = await closeReservation(trx, r, "cancelled", {
        actorId,
        note: note ?? (timely ? null : "Late cancellation"),
        now,
        money: timely ? "return" : "keep",
        patch: { cancelled_by: side },
      });
      await mailReservation(trx, "cancelled", await ctxAfter(), ["gardener", "supplier"], { reason: note, money: timely ? "returned" : "kept", cancelledBy: side });
      return ids;
    }
    case "collect": {
      if (input.pickupCode && !pickupCodeMatches(r.pickup_code ?? "", input.pickupCode)) {
        throw new ApiError("invalid_input", "That pickup code does not match.", { pickup_code: "That is not the code on this reservation. Check it with the gardener, or mark it collected without a code." });
      }
      const ids = await closeReservation(trx, r, "collected", {
        actorId,
        note: input.pickupCode ? "Pickup code checked" : "Marked collected",
        now,
        money: "complete",
        patch: r.fulfilment ? { order_stage: "collected" } : undefined,
      });
      await mailReservation(trx, "review_request", await ctxAfter(), ["gardener", "supplier"]);
      return ids;
    }
    case "no_show": {
      const ids = await closeReservation(trx, r, "no_show", { actorId, note, now, money: "keep" });
      await mailReservation(trx, "no_show", await ctxAfter(), ["gardener", "supplier"], { money: "kept" });
      return ids;
    }
  }
}

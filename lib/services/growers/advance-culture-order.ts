import "server-only";
import type { Knex } from "knex";
import { findShipping } from "@/db/grower-shipping";
import { reservationContext } from "@/db/reservation-context";
import { recordReservationEvent, updateReservationIf } from "@/db/reservations";
import type { ReservationRow } from "@/db/types";
import { ApiError } from "@/lib/api/errors";
import { mailCultureOrder } from "@/lib/mail/culture-order-mail";
import { ORDER_TRANSITIONS, orderBlockedReason, type OrderAction } from "@/lib/reservations/culture-orders";
import type { Side } from "@/lib/reservations/policy";
import { shippingView } from "@/lib/growers/view";
import { StaleState, closeReservation } from "@/lib/services/reservations/steps/reservation-steps";
import { runReservationStep } from "@/lib/services/reservations/run-reservation-step";
import { resolveContext, type Context } from "@/lib/context";

// The parcel steps of a posted live-culture order: packed, shipped (carrier and tracking),
// delivered. Each is one transaction: the guarded update (status and stage in the WHERE, so
// two clicks cannot both win), the history row, and the buyer's e-mail in the outbox. The
// rules are in lib/reservations/culture-orders.ts; 403 for the wrong side, 409 for the wrong
// state, 404 for anyone who is not a party to the order.

export interface OrderStepInput {
  reservationId: string;
  userId: string;
  carrier?: string;
  tracking?: string;
}

export async function advanceCultureOrder(action: OrderAction, input: OrderStepInput, ctx: Context = {}): Promise<{ side: Side }> {
  const { db: q, clock } = resolveContext(ctx);
  return runReservationStep(
    { reservationId: input.reservationId, userId: input.userId, noun: "order" },
    async (trx, r, side, now) => {
      const order = (await reservationContext(r.id, trx))!;
      const shipping = shippingView(await findShipping(order.listing.owner_id, trx));
      const blocked = orderBlockedReason(r, action, side, { postingPaused: shipping.paused });
      if (blocked === "wrong_party") throw new ApiError("forbidden", side === "gardener" ? "Only the grower can do that." : "Only the buyer can do that.");
      if (blocked) throw new ApiError("invalid_state", blocked);
      return apply(trx, action, r, side, input, now);
    },
    { db: q, clock },
  );
}

/** Moves the parcel one stage on while the reservation stays confirmed. */
async function step(trx: Knex.Transaction, r: ReservationRow, action: "pack" | "ship", patch: Partial<ReservationRow>, actorId: string, note: string, now: Date) {
  const t = ORDER_TRANSITIONS[action];
  const at = now.toISOString();
  const ok = await updateReservationIf(r.id, ["confirmed"], { ...patch, order_stage: t.to, updated_at: at }, trx, (qb) => qb.where("order_stage", t.from));
  if (!ok) throw new StaleState();
  await recordReservationEvent({ reservation_id: r.id, from_status: r.status, to_status: r.status, actor_id: actorId, note, created_at: at }, trx);
}

async function apply(trx: Knex.Transaction, action: OrderAction, r: ReservationRow, side: Side, input: OrderStepInput, now: Date): Promise<string[]> {
  const after = async () => (await reservationContext(r.id, trx))!;
  switch (action) {
    case "pack":
      await step(trx, r, "pack", {}, input.userId, "Packed", now);
      await mailCultureOrder(trx, "packed", await after(), ["gardener"], now);
      return [];
    case "ship": {
      const carrier = input.carrier!.trim();
      const tracking = input.tracking!.trim();
      await step(trx, r, "ship", { carrier, tracking, shipped_at: now.toISOString() }, input.userId, `Shipped with ${carrier}, tracking ${tracking}`, now);
      await mailCultureOrder(trx, "shipped", await after(), ["gardener"], now);
      return [];
    }
    case "deliver": {
      // Delivered closes the reservation as collected: the stock leaves "held", the payment
      // is complete, reviews open, and the diversion figures count it.
      const ids = await closeReservation(trx, r, "collected", {
        actorId: input.userId,
        note: side === "gardener" ? "Delivered: the buyer says it arrived" : "Delivered: recorded by the grower",
        now,
        money: "complete",
        patch: { order_stage: "delivered" },
      });
      await mailCultureOrder(trx, "delivered", await after(), ["gardener", "supplier"], now);
      return ids;
    }
  }
}

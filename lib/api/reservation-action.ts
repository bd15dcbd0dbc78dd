import "server-only";
import { NextResponse } from "next/server";
import { z } from "zod";
import { readOptionalJson, withAuth } from "./handler";
import { idempotent } from "./idempotency";
import { parseInput } from "./errors";
import type { Role } from "@/lib/auth/roles";
import type { ReservationAction } from "@/lib/reservations/policy";
import type { OrderAction } from "@/lib/reservations/culture-orders";
import { advanceCultureOrder } from "@/lib/services/growers/advance-culture-order";
import { changeReservation } from "@/lib/services/reservations/change-reservation";
import { getReservation } from "@/lib/services/reservations/get-reservation";

type StepBody = { reason?: string; pickup_code?: string; carrier?: string; tracking?: string };

/**
 * A POST /api/reservations/:id/<step> handler: an empty body is allowed; answers with the
 * reservation as the caller sees it. Steps move money (refunds, deposit holds released or
 * kept), so each honours an Idempotency-Key.
 */
function stepRoute(schema: z.ZodObject, roles: readonly Role[] | undefined, run: (input: StepBody, reservationId: string, userId: string) => Promise<unknown>) {
  return withAuth<{ id: string }>(
    idempotent(async ({ req, params, user }) => {
      const raw = await readOptionalJson(req);
      await run(parseInput(schema, raw) as StepBody, params.id, user.id);
      return NextResponse.json({ reservation: await getReservation(params.id, user.id) });
    }),
    roles,
  );
}

/** confirm, decline, cancel, collect, no_show. */
export function reservationActionRoute(action: ReservationAction, schema: z.ZodObject, roles?: readonly Role[]) {
  return stepRoute(schema, roles, (input, reservationId, userId) => changeReservation(action, { reservationId, userId, reason: input.reason, pickupCode: input.pickup_code }));
}

/** A posted culture order's parcel steps: pack, ship (carrier and tracking), deliver. */
export function orderActionRoute(action: OrderAction, schema: z.ZodObject, roles?: readonly Role[]) {
  return stepRoute(schema, roles, (input, reservationId, userId) => advanceCultureOrder(action, { reservationId, userId, carrier: input.carrier, tracking: input.tracking }));
}

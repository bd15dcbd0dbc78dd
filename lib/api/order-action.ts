import "server-only";
import { NextResponse } from "next/server";
import { z } from "zod";
import { readJson, withAuth } from "./handler";
import { parseInput } from "./errors";
import type { Role } from "@/lib/auth/roles";
import type { OrderAction } from "@/lib/reservations/culture-orders";
import { advanceCultureOrder } from "@/lib/services/advance-culture-order";
import { getReservation } from "@/lib/services/list-reservations";

/** The handler behind POST /api/reservations/:id/<pack|ship|deliver>; an empty body is allowed. */
export function orderActionRoute(action: OrderAction, schema: z.ZodObject, roles?: readonly Role[]) {
  return withAuth<{ id: string }>(async ({ req, params, user }) => {
    const raw = (await req.clone().text()).trim() ? await readJson(req) : {};
    const input = parseInput(schema, raw) as { carrier?: string; tracking?: string };
    await advanceCultureOrder(action, { reservationId: params.id, userId: user.id, carrier: input.carrier, tracking: input.tracking });
    return NextResponse.json({ reservation: await getReservation(params.id, user.id) });
  }, roles);
}

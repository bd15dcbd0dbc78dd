import "server-only";
import { NextResponse } from "next/server";
import { z } from "zod";
import { readJson, withAuth } from "./handler";
import { parseInput } from "./errors";
import type { Role } from "@/lib/auth/roles";
import type { ReservationAction } from "@/lib/reservations/policy";
import { changeReservation } from "@/lib/services/change-reservation";
import { getReservation } from "@/lib/services/list-reservations";

/** The handler behind POST /api/reservations/:id/<action>; an empty body is allowed. */
export function reservationActionRoute(action: ReservationAction, schema: z.ZodObject, roles?: readonly Role[]) {
  return withAuth<{ id: string }>(async ({ req, params, user }) => {
    const raw = (await req.clone().text()).trim() ? await readJson(req) : {};
    const input = parseInput(schema, raw) as { reason?: string; pickup_code?: string };
    await changeReservation(action, { reservationId: params.id, userId: user.id, reason: input.reason, pickupCode: input.pickup_code });
    return NextResponse.json({ reservation: await getReservation(params.id, user.id) });
  }, roles);
}

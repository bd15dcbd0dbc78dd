import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { postReservationMessage } from "@/lib/services/reservations/post-reservation-message";
import { listReservationMessages } from "@/lib/services/reservations/list-reservation-messages";
import { messageSchema } from "@/lib/validation/reservations";

// GET /api/reservations/:id/messages — the thread between gardener and supplier.
export const GET = withAuth<{ id: string }>(async ({ params, user }) => {
  return NextResponse.json({ messages: await listReservationMessages({ reservationId: params.id, userId: user.id }) });
});

// POST /api/reservations/:id/messages — add a plain-text message; the other side gets it by e-mail.
export const POST = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const input = parseInput(messageSchema, await readJson(req));
  const message = await postReservationMessage({ reservationId: params.id, userId: user.id, body: input.body });
  return NextResponse.json({ message }, { status: 201 });
});

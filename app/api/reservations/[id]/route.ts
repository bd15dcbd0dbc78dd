import { NextResponse } from "next/server";
import { withAuth } from "@/lib/api/handler";
import { getReservation } from "@/lib/services/reservations/get-reservation";

// GET /api/reservations/:id — one reservation as its gardener or supplier sees it.
export const GET = withAuth<{ id: string }>(async ({ params, user }) => {
  return NextResponse.json({ reservation: await getReservation(params.id, user.id) });
});

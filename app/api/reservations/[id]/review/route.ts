import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { parseInput } from "@/lib/api/errors";
import { reviewReservation } from "@/lib/services/reservations/review-reservation";
import { reviewSchema } from "@/lib/validation/reservations";

// POST /api/reservations/:id/review — after collection, rate the other side once (1–5 and a comment).
export const POST = withAuth<{ id: string }>(async ({ req, params, user }) => {
  const input = parseInput(reviewSchema, await readJson(req));
  const review = await reviewReservation({ ...input, reservationId: params.id, userId: user.id });
  return NextResponse.json({ review }, { status: 201 });
});

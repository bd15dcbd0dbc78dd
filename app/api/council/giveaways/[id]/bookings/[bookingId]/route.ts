import { NextResponse } from "next/server";
import { readJson, withAuth } from "@/lib/api/handler";
import { idempotent } from "@/lib/api/idempotency";
import { parseInput } from "@/lib/api/errors";
import { attendanceSchema } from "@/lib/validation/giveaways";
import { councilOf } from "@/lib/auth/council-access";
import { recordAttendance } from "@/lib/services/giveaways/record-attendance";

// PATCH /api/council/giveaways/:id/bookings/:bookingId — check a household in (or undo, or mark a no-show).
// A deposit is released or kept by it, so it honours an Idempotency-Key.
export const PATCH = withAuth<{ id: string; bookingId: string }>(idempotent(async ({ req, params, user }) => {
  const staff = councilOf(user);
  const input = parseInput(attendanceSchema, await readJson(req));
  const b = await recordAttendance(staff, params.id, params.bookingId, input.status);
  return NextResponse.json({ booking: { id: b.id, slot_id: b.slot_id, quantity: b.quantity, status: b.status, checked_in_at: b.checked_in_at, deposit_status: b.deposit_status } });
}), ["council"]);

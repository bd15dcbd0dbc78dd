import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { findBooking, findOrgDay, findSlot, setBookingStatus } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import type { DepositStatus, GiveawayBookingRow } from "@/db/types";
import { ApiError, notFound } from "@/lib/api/errors";
import { runPaymentActions } from "@/lib/services/payments/settle-payment";
import { readableDateTime } from "@/lib/time/zoned";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";
import { depositAfterReturn, settleBookingDeposit } from "@/lib/services/giveaways/steps/giveaway-deposit";

type Attendance = "checked_in" | "booked" | "no_show";

/**
 * Staff at the site mark a household as arrived (or undo it, or mark a no-show). A slot's
 * count does not change: the place was used either way. The no-show deposit follows: a hold
 * is released on arrival; after the slot has ended, a no-show's hold is captured (kept).
 * Kept money is not handed back by undoing the mark.
 */
export async function recordAttendance(staff: CouncilStaff, dayId: string, bookingId: string, status: Attendance, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const at = clock();
  const result = await writeTransaction(q, async (trx) => {
    const day = await findOrgDay(dayId, staff.organisationId, trx);
    if (!day) throw notFound("That giveaway day");
    const before = await findBooking(bookingId, trx, { lock: true });
    if (!before || before.day_id !== dayId) throw notFound("That booking");
    if (day.status !== "scheduled") throw new ApiError("invalid_state", "That day has been cancelled.");
    if (before.status === "cancelled") throw new ApiError("invalid_state", "That booking was cancelled.");
    if (before.status === status) return { after: before, owed: [] as string[] };
    if (before.deposit_status === "kept") throw new ApiError("invalid_state", "This household's deposit was kept for the no-show, so the mark stays.");
    let deposit: DepositStatus = before.deposit_status;
    let owed: string[] = [];
    if (status === "checked_in") {
      owed = await settleBookingDeposit(trx, bookingId, "return", at);
      deposit = depositAfterReturn(before.deposit_status);
    } else if (status === "no_show" && before.deposit_status === "held") {
      const slot = (await findSlot(before.slot_id, dayId, trx))!;
      if (at.getTime() < Date.parse(slot.ends_at)) {
        throw new ApiError("invalid_state", `A no-show keeps the deposit, so it can be marked once the slot has ended (${readableDateTime(slot.ends_at, day.time_zone)}).`);
      }
      owed = await settleBookingDeposit(trx, bookingId, "keep", at);
      deposit = "kept";
    } else if (status === "no_show" && before.deposit_status === "awaiting") {
      owed = await settleBookingDeposit(trx, bookingId, "return", at);
      deposit = "unpaid";
    }
    const now = at.toISOString();
    const patch: Partial<GiveawayBookingRow> = {
      checked_in_at: status === "checked_in" ? now : null,
      checked_in_by: status === "checked_in" ? staff.userId : null,
      deposit_status: deposit,
      ...(deposit !== "awaiting" ? { hold_expires_at: null } : {}),
    };
    const changed = await setBookingStatus({ id: bookingId, day_id: dayId }, [before.status], status, patch, trx);
    if (!changed) throw new ApiError("invalid_state", "This booking has just changed; reload the sheet.");
    const after = (await findBooking(bookingId, trx))!;
    await recordAudit({ actor_id: staff.userId, action: `giveaway.attendance_${status}`, subject_type: "giveaway_booking", subject_id: bookingId, before, after }, trx);
    return { after, owed };
  });
  if (!result.owed.length) return result.after;
  // The release or capture is owed to Stripe after the commit; the worker retries a failure.
  await runPaymentActions(result.owed, { db: q, clock });
  return (await findBooking(bookingId, q))!;
}

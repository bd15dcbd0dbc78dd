import "server-only";
import { db } from "@/db/index";
import { writeTransaction } from "@/db/write-transaction";
import { findBooking, findOrgDay, setBookingStatus } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import type { GiveawayBookingRow } from "@/db/types";
import { ApiError, notFound } from "@/lib/api/errors";
import type { CouncilContext } from "./council-access";

type Attendance = "checked_in" | "booked" | "no_show";

/**
 * Staff at the site mark a household as arrived (or undo it, or mark a no-show). A slot's
 * count does not change: the place was used either way. Deposits follow the state — released
 * on arrival, "forfeit" on a no-show — as a record only, since none is taken yet.
 */
export async function recordAttendance(ctx: CouncilContext, dayId: string, bookingId: string, status: Attendance, clock: () => Date = () => new Date()) {
  return writeTransaction(db(), async (trx) => {
    const day = await findOrgDay(dayId, ctx.organisationId, trx);
    if (!day) throw notFound("That giveaway day");
    const before = await findBooking(bookingId, trx);
    if (!before || before.day_id !== dayId) throw notFound("That booking");
    if (day.status !== "scheduled") throw new ApiError("invalid_state", "That day has been cancelled.");
    if (before.status === "cancelled") throw new ApiError("invalid_state", "That booking was cancelled.");
    if (before.status === status) return before;
    const now = clock().toISOString();
    const patch: Partial<GiveawayBookingRow> = {
      checked_in_at: status === "checked_in" ? now : null,
      checked_in_by: status === "checked_in" ? ctx.userId : null,
      deposit_status: before.deposit_cents > 0 ? (status === "checked_in" ? "released" : status === "no_show" ? "forfeit" : "recorded") : "none",
    };
    const changed = await setBookingStatus({ id: bookingId, day_id: dayId }, [before.status], status, patch, trx);
    if (!changed) throw new ApiError("invalid_state", "This booking has just changed; reload the sheet.");
    const after = (await findBooking(bookingId, trx))!;
    await recordAudit({ actor_id: ctx.userId, action: `giveaway.attendance_${status}`, subject_type: "giveaway_booking", subject_id: bookingId, before, after }, trx);
    return after;
  });
}

import "server-only";
import { lockRows } from "@/db/dialect";
import { writeTransaction } from "@/db/write-transaction";
import { cancelOrgDay, findOrgDay, recountSlots, setBookingStatus, sheetFor, slotsOf } from "@/db/giveaways";
import { enqueueEmail } from "@/db/outbox";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { appUrl } from "@/lib/env";
import { bookingParts } from "@/lib/mail/templates/giveaway";
import { staffDayView } from "@/lib/giveaways/view";
import { runPaymentActions } from "@/lib/services/payments/settle-payment";
import type { DepositStatus } from "@/db/types";
import { depositAfterReturn, settleBookingDeposit } from "@/lib/services/giveaways/steps/giveaway-deposit";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";
import { formatMoney } from "@/lib/format/money";

/** Calls a day off: every live booking is cancelled, its deposit released, its household e-mailed — all or nothing. */
export async function cancelGiveaway(staff: CouncilStaff, dayId: string, reason: string, ctx: Context = {}) {
  const { db: q, clock } = resolveContext(ctx);
  const at = clock();
  const result = await writeTransaction(q, async (trx) => {
    if (!(await cancelOrgDay(dayId, staff.organisationId, reason, trx))) {
      if (!(await findOrgDay(dayId, staff.organisationId, trx))) throw notFound("That giveaway day");
      throw new ApiError("invalid_state", "That day is already cancelled.");
    }
    const day = (await findOrgDay(dayId, staff.organisationId, trx))!;
    // Hold the live bookings before reading them: a deposit landing or a household cancelling
    // at this moment finishes first, and the sheet below shows what it left.
    await lockRows(trx, "giveaway_bookings", { day_id: dayId, status: "booked" });
    const booked = (await sheetFor(dayId, {}, trx)).filter((b) => b.status === "booked");
    const now = at.toISOString();
    const owed: string[] = [];
    for (const b of booked) {
      const status = b.deposit_status as DepositStatus;
      await setBookingStatus({ id: b.id, day_id: dayId }, ["booked"], "cancelled", { cancelled_at: now, deposit_status: depositAfterReturn(status), hold_expires_at: null }, trx);
      // Every deposit hold is released and every open card page closed (Stripe after the commit).
      owed.push(...(await settleBookingDeposit(trx, b.id, "return", at)));
      const depositNote =
        status === "held"
          ? `The no-show deposit of ${formatMoney(b.deposit_cents, day.currency)} held on your card is released; nothing is taken.`
          : status === "awaiting"
            ? "The deposit was not put down, so nothing was taken from your card, and its payment page is closed."
            : "There was no deposit on this booking, so there is nothing to release or refund.";
      const data = {
        ...bookingParts({ name: b.name, organisation: staff.organisationName, pageUrl: `${appUrl()}/giveaways`, day, slot: b, quantity: b.quantity }),
        reason,
        depositNote,
      };
      await enqueueEmail({ to: b.email, template: "giveaway_day_cancelled", data, dedupe_key: `giveaway-day-cancelled:${b.id}` }, trx);
    }
    await recountSlots(dayId, trx);
    await recordAudit(
      { actor_id: staff.userId, action: "giveaway.cancel", subject_type: "giveaway_day", subject_id: dayId, before: { status: "scheduled" }, after: { status: "cancelled", reason, bookings_cancelled: booked.length } },
      trx,
    );
    return { view: { day: staffDayView(day, await slotsOf([dayId], trx), staff.organisationName), bookings_cancelled: booked.length }, owed };
  });
  await runPaymentActions(result.owed, { db: q, clock });
  return result.view;
}

import "server-only";
import { writeTransaction } from "@/db/write-transaction";
import { deleteEmptySlot, findSlot } from "@/db/giveaways";
import { recordAudit } from "@/db/audit";
import { ApiError, notFound } from "@/lib/api/errors";
import { scheduledOrgDay } from "@/lib/services/giveaways/steps/scheduled-org-day";
import type { CouncilStaff } from "@/lib/auth/council-access";
import { resolveContext, type Context } from "@/lib/context";

export async function removeGiveawaySlot(staff: CouncilStaff, dayId: string, slotId: string, ctx: Context = {}): Promise<void> {
  const { db: q } = resolveContext(ctx);
  await writeTransaction(q, async (trx) => {
    await scheduledOrgDay(staff, dayId, trx);
    const before = await findSlot(slotId, dayId, trx);
    if (!before) throw notFound("That slot");
    if ((await deleteEmptySlot(slotId, dayId, trx)) === 0) {
      throw new ApiError("invalid_state", "Households have booked this slot; make it smaller or cancel the day instead.");
    }
    await recordAudit({ actor_id: staff.userId, action: "giveaway.slot_remove", subject_type: "giveaway_slot", subject_id: slotId, before }, trx);
  });
}
